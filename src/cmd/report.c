/* report: the printable PDF a coach hands to a client. From program files or stored templates,
 * from a stored block (--block), an athlete's latest block (--athlete alone), or every
 * athlete's latest block (--roster, with a contents page). */
#include <stddef.h>
#include <stdlib.h>
#include <string.h>
#include <strings.h>
#include <unistd.h>

#include "../app/progarg.h"
#include "chartcmd.h"
#include "dbutil.h"

extern const struct sd_cmd cmd_report;

#define REPORT_MAX 1000   /* sections in one report: 2,000 pages or more is no longer a report */

struct report_opts {
	const char *out, *athlete;
	long long block;
	int force, roster;
};

#define RO(f) offsetof(struct report_opts, f)
static const struct sd_optdef report_opts[] = {
	{ "out", OPT_STR, 0, 0, RO(out), NULL, "FILE.pdf", "the report (PDF)" },
	{ "athlete", OPT_STR, 0, 0, RO(athlete), NULL, "NAME",
	  "whose report: names the header; alone, reports the athlete's latest stored block" },
	{ "block", OPT_INT, 1, 1e15, RO(block), NULL, "ID", "report a stored block" },
	{ "roster", OPT_FLAG, 0, 0, RO(roster), NULL, NULL,
	  "every athlete's latest block, one section each, after a contents page" },
	{ "force", OPT_FLAG, 0, 0, RO(force), NULL, NULL, "replace an existing FILE.pdf" },
};
#undef RO

struct job {
	struct sd_program *prog;
	struct sd_audit *au;
	struct sd_report_item *item;
	char (*block)[120];
	char (*who)[DB_NAME_MAX];
	int n, cap;
};

static int job_alloc(struct job *j, int cap, struct sd_err *e)
{
	j->cap = cap;
	j->prog = calloc((size_t)cap, sizeof *j->prog);
	j->au = calloc((size_t)cap, sizeof *j->au);
	j->item = calloc((size_t)cap, sizeof *j->item);
	j->block = calloc((size_t)cap, sizeof *j->block);
	j->who = calloc((size_t)cap, sizeof *j->who);
	if (!j->prog || !j->au || !j->item || !j->block || !j->who)
		return sd_fail(e, "out of memory");
	return 0;
}

static void job_free(struct job *j)
{
	for (int i = 0; i < j->n; i++) {
		audit_free(&j->au[i]);
		prog_free(&j->prog[i]);
	}
	free(j->prog);
	free(j->au);
	free(j->item);
	free(j->block);
	free(j->who);
}

/* Adds the section of stored block b (its template audited as block show does). */
static int add_block(struct sd_ctx *ctx, struct job *j, const struct db_block *b, const char *today,
		     struct sd_err *e)
{
	struct db_program p;
	int i = j->n, rc;

	if (db_program_get_id(ctx->db, b->program_id, &p, e))
		return -1;
	rc = app_block_audit(ctx, b, &p, SD_SESSION_CAP, &j->prog[i], &j->au[i], e);
	db_program_free(&p);
	if (rc)
		return -1;
	snprintf(j->who[i], sizeof j->who[i], "%s", b->athlete);
	if (b->end[0])
		snprintf(j->block[i], sizeof j->block[i], "block %lld, %s to %s", b->id, b->start, b->end);
	else
		snprintf(j->block[i], sizeof j->block[i], "block %lld, from %s, %d weeks planned (open)",
			 b->id, b->start, b->weeks);
	j->item[i] = (struct sd_report_item){ { .label = j->prog[i].name, .prog = &j->prog[i],
						.prof = &ctx->profile, .audit = &j->au[i],
						.athlete = j->who[i],
						.overdue_days = app_block_overdue(b, today) },
					      &ctx->lib, j->block[i] };
	j->n++;
	return 0;
}

/* The athlete's block a report shows: the open one, else the latest started. 0 and *found. */
static int latest_block(struct sd_ctx *ctx, long long athlete_id, struct db_block *out, int *found,
			struct sd_err *e)
{
	struct db_block *b = NULL;
	int n = 0, best = -1;

	if (db_block_list(ctx->db, athlete_id, &b, &n, e))
		return -1;
	for (int i = 0; i < n; i++)
		if (best < 0 || (!b[i].end[0] && b[best].end[0]) ||
		    ((!b[i].end[0]) == (!b[best].end[0]) && strcmp(b[i].start, b[best].start) >= 0))
			best = i;
	if ((*found = best >= 0))
		*out = b[best];
	free(b);
	return 0;
}

static int open_store(struct sd_ctx *ctx, struct sd_err *e)
{
	char path[1200];
	if (app_db_path(ctx, path, sizeof path, e))
		return -1;
	if (access(path, F_OK) != 0)
		return sd_fail(e, "no database at '%s': stored blocks and athletes live there", path);
	return db_open(path, &ctx->db, e);
}

static int from_store(struct sd_ctx *ctx, const struct report_opts *o, struct job *j,
		      const char *today, struct sd_err *e)
{
	struct db_athlete *all = NULL, one;
	struct db_block b;
	int n = 0, found, rc = -1;

	if (open_store(ctx, e))
		return -1;
	if (o->block) {
		if (job_alloc(j, 1, e) || db_block_get(ctx->db, o->block, &b, e))
			return -1;
		return add_block(ctx, j, &b, today, e);
	}
	if (!o->roster) {
		if (app_athlete_get(ctx->db, o->athlete, &one, e) ||
		    latest_block(ctx, one.id, &b, &found, e) || job_alloc(j, 1, e))
			return -1;
		if (!found)
			return sd_fail(e, "athlete '%s' has no training block to report (add one with "
				       "'setdose block add')", one.name);
		return add_block(ctx, j, &b, today, e);
	}
	if (db_athlete_list(ctx->db, &all, &n, e))
		return -1;
	if (job_alloc(j, n ? n : 1, e))
		goto out;
	for (int i = 0; i < n; i++) {
		if (latest_block(ctx, all[i].id, &b, &found, e))
			goto out;
		if (!found)
			continue;
		if (j->n == REPORT_MAX) {
			sd_fail(e, "the roster has more than %d athletes with blocks: report them in "
				"parts with --athlete or --block", REPORT_MAX);
			goto out;
		}
		if (add_block(ctx, j, &b, today, e))
			goto out;
	}
	if (!j->n) {
		sd_fail(e, "no athlete in the roster has a training block to report");
		goto out;
	}
	rc = 0;
out:
	free(all);
	return rc;
}

static int from_programs(struct sd_ctx *ctx, const struct report_opts *o, int argc, char **argv,
			 struct job *j, struct sd_err *e)
{
	struct progarg pa = { NULL };
	struct sd_audit_opts ao = { ctx->opt.level, ctx->opt.max_rir, SD_SESSION_CAP };
	int rc = -1;

	if (job_alloc(j, argc - 1, e))
		return -1;
	for (int i = 0; i < argc - 1; i++) {
		if (progarg_load(ctx, &pa, argv[1 + i], &j->prog[i], e))
			goto out;
		struct sd_covars cov = app_covars(ctx, j->prog[i].weeks);
		if (audit_run(&j->prog[i], &ctx->lib, &ctx->profile, &cov, &ao, &j->au[i], e)) {
			prog_free(&j->prog[i]);
			goto out;
		}
		/* The header shows the template's name, never the file's path. */
		j->item[i] = (struct sd_report_item){ { .label = j->prog[i].name, .prog = &j->prog[i],
							.prof = &ctx->profile, .audit = &j->au[i],
							.athlete = o->athlete }, &ctx->lib, NULL };
		j->n++;
	}
	rc = 0;
out:
	progarg_close(&pa);
	return rc;
}

static int exec_report(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	struct report_opts o;
	struct job j;
	char today[DATE_LEN];
	int rc = -1, stored;

	memset(&o, 0, sizeof o);
	memset(&j, 0, sizeof j);
	if ((argc = opt_parse("report", report_opts, OPT_N(report_opts), &o, argc, argv, e)) < 0)
		return -1;
	if (!o.out)
		return sd_usage(e, "report needs --out FILE (usage: setdose %s)", cmd_report.usage);
	stored = o.block || o.roster || (o.athlete && argc < 2);
	if (o.roster + !!o.block + !!o.athlete > 1 && !(o.athlete && !o.roster && !o.block))
		return sd_usage(e, "report takes one of --roster, --block ID and --athlete NAME");
	if (stored && argc > 1)
		return sd_usage(e, "report --%s takes no PROGRAM arguments", o.roster ? "roster" : "block");
	if (!stored && argc < 2)
		return sd_usage(e, "report needs PROGRAM files or templates, --block, --athlete or "
				"--roster (usage: setdose %s)", cmd_report.usage);
	if (argc - 1 > 200)
		return sd_usage(e, "report takes at most 200 programs, got %d", argc - 1);
	size_t len = strlen(o.out);
	if (len < 4 || strcasecmp(o.out + len - 4, ".pdf"))
		return sd_usage(e, "the report is a PDF: name it .pdf, not '%s'", o.out);
	if (app_today(today, e))
		return -1;
	if (stored ? from_store(ctx, &o, &j, today, e) : from_programs(ctx, &o, argc, argv, &j, e))
		goto out;
	struct sd_report r = { today, o.roster ? "Roster report" : NULL, j.item, j.n, o.roster,
			       chartcmd_layout() };
	rc = chartcmd_draw(o.out, o.force, NULL, &r, e);
	chartcmd_layout_done(r.layout, rc);
	if (!rc)
		fprintf(ctx->out, "wrote %s (%d section%s)\n", o.out, j.n, j.n == 1 ? "" : "s");
out:
	job_free(&j);
	return rc;
}

const struct sd_cmd cmd_report = {
	.name = "report",
	.summary = "a printable PDF report for a client, or a whole roster",
	.usage = "report --out FILE.pdf [--force] [--athlete NAME] (PROGRAM... | --block ID | "
		 "--roster)",
	.flags = CMD_PROFILE | CMD_LIBRARY,
	.exec = exec_report,
	.opts = report_opts,
	.nopts = OPT_N(report_opts),
};
