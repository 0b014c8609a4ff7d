/* e1rm: a plain 1RM calculator over the published equations. */
#include <stdio.h>
#include <string.h>

#include "../core/e1rm.h"
#include "../io/recout.h"
#include "dbutil.h"

extern const struct sd_cmd cmd_e1rm;

/* LOAD is unit-free here ("100", or "100kg"/"225lb", whose unit is kept for the output). */
static int parse_load(const char *s, double *load, const char **unit, struct sd_err *e)
{
	char num[64];
	size_t n = strlen(s);

	*unit = "";
	if (n > 2 && (!strcmp(s + n - 2, "kg") || !strcmp(s + n - 2, "lb"))) {
		*unit = s[n - 2] == 'k' ? " kg" : " lb";
		n -= 2;
	}
	if (n >= sizeof num)
		return sd_usage(e, "bad load '%s'", s);
	memcpy(num, s, n);
	num[n] = '\0';
	return app_num("LOAD", num, 1e-9, 1e6, load, e);
}

/* --formula NAME, or all (stored as E1RM_NFORMULAS). */
static int opt_formula(void *dst, const struct sd_optdef *d, const char *v, struct sd_err *e)
{
	int *f = dst;
	(void)d;
	if (!strcmp(v, "all"))
		*f = E1RM_NFORMULAS;
	else if ((*f = e1rm_find(v)) < 0)
		return sd_usage(e, "unknown formula '%s' (one of epley, brzycki, lander, lombardi, "
				"mayhew, oconner, wathan, all)", v);
	return 0;
}

static const struct sd_optdef opts[] = {
	{ "formula", OPT_CALL, 0, 0, 0, opt_formula, "NAME|all",
	  "brzycki (default), epley, lander, lombardi, mayhew, oconner, wathan,\n"
	  "or all for a table of every equation with its source" },
};

static int exec_e1rm(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	static const char *const heads[] = { "<formula", "e1rm", "<source", "<equation" };
	struct sd_rec *r;
	const char *unit;
	double load, est;
	long long reps;
	int f = E1RM_DEFAULT, all, warn = 0;

	if (dbu_no_negatives(argc, argv, e))
		return -1;
	if ((argc = opt_parse("e1rm", opts, OPT_N(opts), &f, argc, argv, e)) < 0)
		return -1;
	all = f == E1RM_NFORMULAS;
	if (all)
		f = E1RM_DEFAULT;
	if (argc != 3)
		return sd_usage(e, "usage: setdose %s", cmd_e1rm.usage);
	if (parse_load(argv[1], &load, &unit, e) ||
	    app_int("REPS", argv[2], 1, E1RM_MAX_REPS, &reps, e))
		return -1;
	if (!all && ctx->opt.format == SD_FMT_TABLE) {
		if (e1rm_estimate(f, load, (int)reps, &est, &warn, e))
			return -1;
		fprintf(ctx->out, "%.2f%s  (%s)\n", est, unit, e1rm_source(f));
	} else {
		if (!(r = rec_new(4, heads, ctx->opt.format)))
			return sd_fail(e, "out of memory");
		for (int k = all ? 0 : f; k < (all ? E1RM_NFORMULAS : f + 1); k++) {
			if (e1rm_estimate(k, load, (int)reps, &est, &warn, e) || rec_row(r)) {
				rec_free(r);
				return -1;
			}
			rec_set(r, 0, "%s", e1rm_name(k));
			rec_set(r, 1, "%.2f", est);
			rec_set(r, 2, "%s", e1rm_source(k));
			rec_set(r, 3, "%s", e1rm_equation(k));
		}
		rec_print(r, ctx->out);
		rec_free(r);
	}
	if (warn)
		fprintf(stderr, "setdose: warning: %lld reps: 1RM estimates lose accuracy above %d reps "
			"(Reynolds, Gordon & Robergs 2006)\n", reps, E1RM_WARN_REPS);
	return 0;
}

const struct sd_cmd cmd_e1rm = {
	.name = "e1rm",
	.summary = "estimate a one-repetition maximum from a rep set",
	.usage = "e1rm LOAD REPS [--formula NAME|all]\n"
		 "  LOAD       any unit (100, 100kg, 225lb); the estimate is in the same unit\n"
		 "  REPS       reps to failure, 1 to 20 (1 gives the load; above 10 a warning)",
	.flags = 0,
	.exec = exec_e1rm,
	.opts = opts,
	.nopts = OPT_N(opts),
};
