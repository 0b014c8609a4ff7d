/* test: strength tests (a load lifted for some reps) and the 1RM they estimate. */
#include <stddef.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "../core/e1rm.h"
#include "../core/units.h"
#include "../io/recout.h"
#include "dbutil.h"

extern const struct sd_cmd cmd_test;

static int usage(struct sd_err *e)
{
	return sd_usage(e, "usage: setdose %s", cmd_test.usage);
}

struct test_opts {
	const char *date;
	int formula;
};

static int opt_formula(void *dst, const struct sd_optdef *d, const char *v, struct sd_err *e)
{
	(void)d;
	if ((((struct test_opts *)dst)->formula = e1rm_find(v)) < 0)
		return sd_usage(e, "unknown formula '%s' (see 'setdose e1rm --formula all')", v);
	return 0;
}

static const struct sd_optdef add_opts[] = {
	{ "date", OPT_STR, 0, 0, offsetof(struct test_opts, date), NULL, "DATE",
	  "day of the test (default today; not after today)" },
	{ "formula", OPT_CALL, 0, 0, 0, opt_formula, "NAME",
	  "1RM equation (default brzycki; see 'setdose e1rm --formula all')" },
};

static int do_add(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	struct test_opts o = { NULL, E1RM_DEFAULT };
	struct db_athlete a;
	struct db_test t;
	int warn = 0, field, lb;

	if (dbu_no_negatives(argc, argv, e) ||
	    (argc = opt_parse("test add", add_opts, OPT_N(add_opts), &o, argc, argv, e)) < 0)
		return -1;
	if (argc < 4 || argc > 5)
		return usage(e);
	if (db_begin(ctx->db, e) || app_athlete_get(ctx->db, argv[1], &a, e))
		return -1;
	if (app_test_build(ctx, &a, argv[2], o.date, argv[3], argc == 5 ? argv[4] : NULL, o.formula,
			   &t, &warn, &field, e)) {
		/* A bad number typed on the command line is a usage error, as the other options. */
		if (field == APP_T_REPS || field == APP_T_DATE)
			e->code = SD_EXIT_USAGE;
		return -1;
	}
	if (app_test_add(ctx->db, &t, e) || db_commit(ctx->db, e))
		return -1;
	lb = app_lb(ctx, &a);
	if (warn)
		fprintf(stderr, "setdose: warning: %d reps: 1RM estimates lose accuracy above %d reps "
			"(Reynolds, Gordon & Robergs 2006)\n", t.reps, E1RM_WARN_REPS);
	fprintf(ctx->out, "added test %lld: %s, %s %.1f %s x %d on %s; 1RM %.1f %s (%s)\n", t.id,
		a.name, t.lift, units_show(t.load_kg, lb), units_name(lb), t.reps, t.date,
		units_show(t.e1rm_kg, lb), units_name(lb), t.formula);
	return 0;
}

static int do_list(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	static const char *const heads[] = { "id", "<date", "<lift", "load", "reps", "e1rm",
		"<unit", "<formula" };
	struct db_athlete a;
	struct db_test *v = NULL;
	struct sd_rec *r = NULL;
	char lift[DB_NAME_MAX];
	int n = 0, rc = -1, lb;

	if (argc < 2 || argc > 3)
		return usage(e);
	if (app_athlete_get(ctx->db, argv[1], &a, e))
		return -1;
	if (argc == 3 && app_lift(&ctx->lib, argv[2], lift, sizeof lift, e))
		return -1;
	if (db_test_list(ctx->db, a.id, argc == 3 ? lift : NULL, &v, &n, e))
		return -1;
	lb = app_lb(ctx, &a);
	if (!(r = rec_new(8, heads, ctx->opt.format))) {
		sd_fail(e, "out of memory");
		goto done;
	}
	for (int i = 0; i < n; i++) {
		if (rec_row(r)) {
			sd_fail(e, "out of memory");
			goto done;
		}
		rec_set(r, 0, "%lld", v[i].id);
		rec_set(r, 1, "%s", v[i].date);
		rec_set(r, 2, "%s", v[i].lift);
		rec_set(r, 3, "%.1f", units_show(v[i].load_kg, lb));
		rec_set(r, 4, "%d", v[i].reps);
		rec_set(r, 5, "%.1f", units_show(v[i].e1rm_kg, lb));
		rec_set(r, 6, "%s", units_name(lb));
		rec_set(r, 7, "%s", v[i].formula);
	}
	if (!n && ctx->opt.format == SD_FMT_TABLE)
		fprintf(ctx->out, "no tests for '%s' yet\n", a.name);
	else
		rec_print(r, ctx->out);
	rc = 0;
done:
	rec_free(r);
	free(v);
	return rc;
}

static const struct sd_sub subs[] = {
	{ "add", "test add", do_add, add_opts, OPT_N(add_opts) },
	{ "list", "test list", do_list, NULL, 0 },
	{ NULL, NULL, NULL, NULL, 0 },
};

const struct sd_cmd cmd_test = {
	.name = "test",
	.summary = "record strength tests (1RM, or estimated from a rep set) and list them",
	.usage = "test add ATHLETE LIFT LOAD [REPS] [--date DATE] [--formula NAME]\n"
		 "       setdose test list ATHLETE [LIFT]\n"
		 "  LIFT       an exercise of the library (see 'setdose exercises')\n"
		 "  LOAD       in the athlete's units, or with a unit: 100kg, 225lb\n"
		 "  REPS       reps to failure with LOAD (default 1: a tested 1RM); above 1 the 1RM\n"
		 "             is estimated, with a warning above 10 reps; more than 20 is refused\n"
		 "  The same test (athlete, lift, date, load, reps) is not recorded twice.",
	.flags = CMD_DB | CMD_LIBRARY,
	.subs = subs,
};
