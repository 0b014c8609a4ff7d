/* block: training blocks, one athlete following one stored template from a start date. */
#include <getopt.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "../io/audit_out.h"
#include "../io/program_io.h"
#include "../io/recout.h"
#include "dbutil.h"

extern const struct sd_cmd cmd_block;

static int usage(struct sd_err *e)
{
	return sd_usage(e, "usage: setdose %s", cmd_block.usage);
}

static int block_id(const char *s, long long *id, struct sd_err *e)
{
	return dbu_int("block ID", s, 1, 0x7fffffffffffffffLL, id, e);
}

/* Options of add and end: --start / --date. (--weeks is a global option.) */
static int date_opt(int argc, char **argv, const char *name, char *buf, int *given,
		    struct sd_err *e)
{
	const struct option longopts[] = {
		{ name, required_argument, NULL, 'd' },
		{ NULL, 0, NULL, 0 },
	};
	char what[32];
	int c;

	*given = 0;
	optind = 0;
	opterr = 0;
	while ((c = getopt_long(argc, argv, "", longopts, NULL)) != -1) {
		if (c != 'd')
			return dbu_badopt(&cmd_block, argc, argv, e);
		snprintf(what, sizeof what, "--%s", name);
		if (dbu_date(what, optarg, buf, e))
			return -1;
		*given = 1;
	}
	return 0;
}

static int do_add(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	char start[DATE_LEN];
	struct db_athlete a;
	struct db_program p;
	struct sd_program prog;
	long long id;
	int given, weeks, rc = -1;

	if (date_opt(argc, argv, "start", start, &given, e))
		return -1;
	if (optind != argc - 2)
		return usage(e);
	if (!given)
		return sd_usage(e, "block add needs --start DATE (YYYY-MM-DD)");
	if (db_begin(ctx->db, e) || db_athlete_get(ctx->db, argv[optind], &a, e) ||
	    db_program_get(ctx->db, argv[optind + 1], &p, e))
		return -1;
	/* The template must still read with today's exercise library. */
	memset(&prog, 0, sizeof prog);
	if (program_parse(p.name, p.source, p.len, p.is_csv, &ctx->lib, &prog, e))
		goto done;
	weeks = ctx->opt.weeks_set ? (int)ctx->opt.weeks : prog.weeks;
	if (ctx->opt.weeks_set && ctx->opt.weeks != weeks) {
		sd_usage(e, "--weeks wants a whole number of weeks for a block");
		goto done;
	}
	if (weeks < 1 || weeks > 104) {
		sd_usage(e, "program '%s' does not give its length; add --weeks N", p.name);
		goto done;
	}
	if (db_block_add(ctx->db, a.id, p.id, start, weeks, &id, e) || db_commit(ctx->db, e))
		goto done;
	fprintf(ctx->out, "added block %lld: '%s' follows '%s' from %s for %d weeks\n", id, a.name,
		p.name, start, weeks);
	rc = 0;
done:
	prog_free(&prog);
	db_program_free(&p);
	return rc;
}

static int do_list(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	static const char *const heads[] = { "id", "<athlete", "<program", "<start", "weeks",
		"<end", "<state" };
	struct db_athlete a = { 0 };
	struct db_block *v = NULL;
	struct sd_rec *r = NULL;
	int n = 0, rc = -1;

	if (argc > 2)
		return usage(e);
	if (argc == 2 && db_athlete_get(ctx->db, argv[1], &a, e))
		return -1;
	if (db_block_list(ctx->db, a.id, &v, &n, e))
		return -1;
	if (!(r = rec_new(7, heads, ctx->opt.format))) {
		sd_fail(e, "out of memory");
		goto done;
	}
	for (int i = 0; i < n; i++) {
		if (rec_row(r)) {
			sd_fail(e, "out of memory");
			goto done;
		}
		rec_set(r, 0, "%lld", v[i].id);
		rec_set(r, 1, "%s", v[i].athlete);
		rec_set(r, 2, "%s", v[i].program);
		rec_set(r, 3, "%s", v[i].start);
		rec_set(r, 4, "%d", v[i].weeks);
		rec_set(r, 5, "%s", v[i].end);
		rec_set(r, 6, "%s", v[i].end[0] ? "ended" : "open");
	}
	if (!n && ctx->opt.format == SD_FMT_TABLE)
		fprintf(ctx->out, "no blocks yet (start one with 'setdose block add ATHLETE PROGRAM "
			"--start DATE')\n");
	else
		rec_print(r, ctx->out);
	rc = 0;
done:
	rec_free(r);
	free(v);
	return rc;
}

static int do_show(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	struct db_block b;
	struct db_program p;
	struct sd_program prog;
	struct sd_audit au;
	struct sd_table *t = NULL;
	char label[DB_PROGNAME_MAX + 32], who[DB_NAME_MAX + 64];
	long long id;
	int rc = -1;

	if (argc != 2)
		return usage(e);
	if (block_id(argv[1], &id, e) || db_block_get(ctx->db, id, &b, e) ||
	    db_program_get_id(ctx->db, b.program_id, &p, e))
		return -1;
	if (dbu_block_audit(ctx, &b, &p, SD_SESSION_CAP, &prog, &au, e))
		goto out;
	snprintf(label, sizeof label, "block %lld, template '%s'", b.id, p.name);
	snprintf(who, sizeof who, "%s (%s)", b.athlete, b.trained ? "trained" : "untrained");
	struct sd_audit_info in = { label, &prog, &ctx->profile, &au, who, 0, NULL, 0 };
	if (ctx->opt.format == SD_FMT_JSON) {
		aout_json_begin(ctx->out);
		rc = aout_json_item(ctx->out, &in, 1);
		aout_json_end(ctx->out);
	} else if (ctx->opt.format == SD_FMT_CSV) {
		rc = (t = aout_muscle_table(1)) && !aout_muscle_rows(t, &in, 1) ? 0 : -1;
		if (!rc)
			tbl_print(t, ctx->out, 1);
	} else {
		fprintf(ctx->out, "block %lld: %s to %s (%d weeks planned%s)\n", b.id, b.start,
			b.end[0] ? b.end : "now, open", b.weeks, b.end[0] ? ", ended" : "");
		aout_report(ctx->out, &in, ctx->opt.color);
		cmd_print_caution(ctx);
		rc = 0;
	}
	if (rc)
		sd_fail(e, "out of memory");
	tbl_free(t);
	audit_free(&au);
	prog_free(&prog);
out:
	db_program_free(&p);
	return rc;
}

static int do_end(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	char end[DATE_LEN];
	long long id;
	int given;

	if (date_opt(argc, argv, "date", end, &given, e))
		return -1;
	if (optind != argc - 1)
		return usage(e);
	if (block_id(argv[optind], &id, e))
		return -1;
	if (!given && dbu_today(end, e))
		return -1;
	if (db_begin(ctx->db, e) || db_block_end(ctx->db, id, end, e) || db_commit(ctx->db, e))
		return -1;
	fprintf(ctx->out, "ended block %lld on %s\n", id, end);
	return 0;
}

static const struct dbu_sub subs[] = {
	{ "add", do_add },
	{ "list", do_list },
	{ "show", do_show },
	{ "end", do_end },
	{ NULL, NULL },
};

static int exec_block(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	return dbu_subcommand(ctx, subs, &cmd_block, argc, argv, e);
}

const struct sd_cmd cmd_block = {
	.name = "block",
	.summary = "training blocks: an athlete following a stored template from a date",
	.usage = "block add ATHLETE PROGRAM --start DATE [--weeks N]\n"
		 "       setdose block list [ATHLETE]\n"
		 "       setdose block show ID\n"
		 "       setdose block end ID [--date DATE]\n"
		 "  --start    first day of the block (YYYY-MM-DD)\n"
		 "  --weeks    planned length (default: the template's weeks)\n"
		 "  show       the block's audit for the athlete's status and the block's length\n"
		 "             (planned weeks while open, start to end once ended)\n"
		 "  end        closes the block (default date: today)",
	.flags = CMD_DB | CMD_LIBRARY | CMD_PROFILE,
	.exec = exec_block,
};
