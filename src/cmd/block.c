/* block: training blocks, one athlete following one stored template from a start date. */
#include <stddef.h>
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
	return app_int("block ID", s, 1, SD_ID_MAX, id, e);
}

/* Options of add and end. (--weeks is a global option.) */
struct block_opts {
	const char *date;   /* --start or --date */
	int overlap;
};

static const struct sd_optdef add_opts[] = {
	{ "start", OPT_STR, 0, 0, offsetof(struct block_opts, date), NULL, "DATE",
	  "first day of the block (YYYY-MM-DD)" },
	{ "overlap", OPT_FLAG, 0, 0, offsetof(struct block_opts, overlap), NULL, NULL,
	  "add it although another block of the athlete runs in those weeks" },
};
static const struct sd_optdef end_opts[] = {
	{ "date", OPT_STR, 0, 0, offsetof(struct block_opts, date), NULL, "DATE",
	  "the last day (default today; not after today)" },
};

static int do_add(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	char start[DATE_LEN];
	struct block_opts o = { NULL, 0 };
	struct db_athlete a;
	struct db_program p;
	long long id;
	int weeks = 0, rc = -1;

	if ((argc = opt_parse("block add", add_opts, OPT_N(add_opts), &o, argc, argv, e)) < 0)
		return -1;
	if (argc != 3)
		return usage(e);
	if (!o.date)
		return sd_usage(e, "block add needs --start DATE (YYYY-MM-DD)");
	if (app_date("--start", o.date, start, e))
		return -1;
	if (ctx->opt.weeks_set && ctx->opt.weeks != (int)ctx->opt.weeks)
		return sd_usage(e, "--weeks wants a whole number of weeks for a block");
	if (db_begin(ctx->db, e) || app_athlete_get(ctx->db, argv[1], &a, e) ||
	    app_program_get(ctx->db, argv[2], &p, e))
		return -1;
	if (!app_block_add(ctx, &a, &p, start, ctx->opt.weeks_set ? (int)ctx->opt.weeks : 0, o.overlap,
			   &id, &weeks, e) && !db_commit(ctx->db, e)) {
		fprintf(ctx->out, "added block %lld: '%s' follows '%s' from %s for %d weeks\n", id,
			a.name, p.name, start, weeks);
		rc = 0;
	}
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
	char today[DATE_LEN];
	int n = 0, rc = -1, od;

	if (argc > 2)
		return usage(e);
	if (app_today(today, e))
		return -1;
	if (argc == 2 && app_athlete_get(ctx->db, argv[1], &a, e))
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
		od = app_block_overdue(&v[i], today);
		if (od)
			rec_set(r, 6, "open, %d days past its planned end", od);
		else
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
	char label[DB_PROGNAME_MAX + 32], who[DB_NAME_MAX + 64], today[DATE_LEN];
	long long id;
	int rc = -1;

	if (argc != 2)
		return usage(e);
	if (app_today(today, e) || block_id(argv[1], &id, e) || db_block_get(ctx->db, id, &b, e) ||
	    db_program_get_id(ctx->db, b.program_id, &p, e))
		return -1;
	if (app_block_audit(ctx, &b, &p, SD_SESSION_CAP, &prog, &au, e))
		goto out;
	snprintf(label, sizeof label, "block %lld, template '%s'", b.id, p.name);
	snprintf(who, sizeof who, "%s (%s)", b.athlete, b.trained ? "trained" : "untrained");
	struct sd_audit_info in = { .label = label, .prog = &prog, .prof = &ctx->profile,
				    .audit = &au, .athlete = who,
				    .overdue_days = app_block_overdue(&b, today) };
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
		if (in.overdue_days)
			fprintf(ctx->out, "note: open %d days past its planned end; end it with 'setdose "
				"block end %lld'\n", in.overdue_days, b.id);
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
	struct block_opts o = { NULL, 0 };
	long long id;

	if ((argc = opt_parse("block end", end_opts, OPT_N(end_opts), &o, argc, argv, e)) < 0)
		return -1;
	if (argc != 2)
		return usage(e);
	if (block_id(argv[1], &id, e))
		return -1;
	if (o.date && app_date("--date", o.date, end, e))
		return -1;
	if (db_begin(ctx->db, e) || app_block_end(ctx->db, id, o.date ? end : NULL, end, e) ||
	    db_commit(ctx->db, e))
		return -1;
	fprintf(ctx->out, "ended block %lld on %s\n", id, end);
	return 0;
}

static const struct sd_sub subs[] = {
	{ "add", "block add", do_add, add_opts, OPT_N(add_opts) },
	{ "list", "block list", do_list, NULL, 0 },
	{ "show", "block show", do_show, NULL, 0 },
	{ "end", "block end", do_end, end_opts, OPT_N(end_opts) },
	{ NULL, NULL, NULL, NULL, 0 },
};

const struct sd_cmd cmd_block = {
	.name = "block",
	.summary = "training blocks: an athlete following a stored template from a date",
	.usage = "block add ATHLETE PROGRAM --start DATE [--weeks N] [--overlap]\n"
		 "       setdose block list [ATHLETE]\n"
		 "       setdose block show ID\n"
		 "       setdose block end ID [--date DATE]\n"
		 "  --weeks    (global) planned length (default: the template's weeks)\n"
		 "  show       the block's audit for the athlete's status and the block's length\n"
		 "             (planned weeks while open, start to end once ended)\n"
		 "  end        closes the block (default date: today; not after today)",
	.flags = CMD_DB | CMD_LIBRARY | CMD_PROFILE,
	.subs = subs,
};
