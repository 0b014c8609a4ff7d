/* compare: programs side by side per muscle for one athlete, with the difference between them,
 * its interval and an interval-based decision against the SWC; totals per program. */
#include <stddef.h>
#include <stdlib.h>
#include <string.h>

#include "../core/compare.h"
#include "../io/compare_out.h"
#include "dbutil.h"
#include "../app/progarg.h"
#include "cmd.h"

extern const struct sd_cmd cmd_compare;

#define MAX_PROGRAMS 26   /* keyed A to Z */

/* Programs that state different block lengths are all compared at one length (the option,
 * else the first program's): the difference between them is then the dose's alone. */
static const char *weeks_note(const struct sd_ctx *ctx, const struct sd_program *p, int n,
			      double weeks, char *buf, size_t size)
{
	int differ = 0;
	if (ctx->opt.weeks_set)
		return NULL;
	for (int i = 1; i < n; i++)
		differ |= p[i].weeks != p[0].weeks;
	if (!differ)
		return NULL;
	snprintf(buf, size, "the programs state different block lengths; all are compared at %g "
		 "weeks (the first's; set --weeks to choose)", weeks);
	return buf;
}

struct compare_opts {
	int against_first;
	double cap;
};

static const struct sd_optdef opts[] = {
	{ "against-first", OPT_FLAG, 0, 0, offsetof(struct compare_opts, against_first), NULL, NULL,
	  "compare each program with the first only (default: every pair)" },
	{ "session-cap", OPT_NUM, SD_SESSION_CAP_MIN, SD_SESSION_CAP_MAX,
	  offsetof(struct compare_opts, cap), NULL, "N",
	  "warn when a muscle gets more than N fractional sets in one session\n"
	  "(default 10; common practice, no source)" },
};

static int exec_compare(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	struct compare_opts o = { 0, SD_SESSION_CAP };
	struct progarg pa = { NULL };
	struct sd_program *prog = NULL;
	struct sd_audit *au = NULL;
	struct cmp_totals *tot = NULL;
	struct cmp_diff *diff = NULL;
	int (*pairs)[2] = NULL;
	int n, against_first, loaded = 0, audited = 0, npairs, rc = -1, firstarg = 1;
	double cap;
	char note[200];

	if ((argc = opt_parse("compare", opts, OPT_N(opts), &o, argc, argv, e)) < 0)
		return -1;
	against_first = o.against_first;
	cap = o.cap;
	n = argc - firstarg;
	if (n < 2)
		return sd_usage(e, "compare needs at least two programs, got %d (see 'setdose help "
				"compare')", n);
	if (n > MAX_PROGRAMS)
		return sd_usage(e, "compare takes at most %d programs, got %d", MAX_PROGRAMS, n);
	prog = calloc((size_t)n, sizeof *prog);
	au = calloc((size_t)n, sizeof *au);
	tot = calloc((size_t)n, sizeof *tot);
	pairs = calloc((size_t)(n * (n - 1) / 2), sizeof *pairs);
	diff = calloc((size_t)(n * (n - 1) / 2) * SD_NMUSCLES, sizeof *diff);
	if (!prog || !au || !tot || !pairs || !diff) {
		sd_fail(e, "out of memory");
		goto done;
	}
	for (; loaded < n; loaded++)
		if (progarg_load(ctx, &pa, argv[firstarg + loaded], &prog[loaded], e))
			goto done;

	/* One athlete context for every program, so heterogeneity and moderators cancel. */
	struct sd_covars cov = app_covars(ctx, prog[0].weeks);
	struct sd_audit_opts ao = { ctx->opt.level, ctx->opt.max_rir, cap };
	for (; audited < n; audited++) {
		if (audit_run(&prog[audited], &ctx->lib, &ctx->profile, &cov, &ao, &au[audited], e))
			goto done;
		cmp_totals(&au[audited], cap, &tot[audited]);
	}
	npairs = cmp_pairs(n, against_first, pairs);
	for (int k = 0; k < npairs; k++)
		for (int m = 0; m < SD_NMUSCLES; m++)
			cmp_muscle(&ctx->profile, &cov, ctx->opt.level,
				   au[pairs[k][0]].row[m].dose.fractional,
				   au[pairs[k][1]].row[m].dose.fractional, &diff[k * SD_NMUSCLES + m]);

	struct cmp_view v = { n, (const char *const *)(argv + firstarg), prog, au, tot, npairs,
			      (const int (*)[2])pairs, diff, &ctx->profile, ctx->opt.level, cap,
			      weeks_note(ctx, prog, n, cov.weeks, note, sizeof note) };
	if (ctx->opt.format == SD_FMT_JSON)
		rc = cmp_out_json(ctx->out, &v);
	else if (ctx->opt.format == SD_FMT_CSV)
		rc = cmp_out_csv(ctx->out, &v);
	else {
		cmp_out_table(ctx->out, &v, ctx->opt.color);
		cmd_print_caution(ctx);
		rc = 0;
	}
	if (rc)
		sd_fail(e, "out of memory");
done:
	for (int i = 0; au && i < audited; i++)
		audit_free(&au[i]);
	for (int i = 0; prog && i < loaded; i++)
		prog_free(&prog[i]);
	free(prog);
	free(au);
	free(tot);
	free(pairs);
	free(diff);
	progarg_close(&pa);
	return rc;
}

const struct sd_cmd cmd_compare = {
	.name = "compare",
	.summary = "programs side by side per muscle: sets, gain, and whether the difference matters",
	.usage = "compare [--against-first] [--session-cap N] PROGRAM PROGRAM [PROGRAM...]\n"
		 "  PROGRAM          a program file, or the name of a stored template\n"

		 "Per muscle: each program's weekly fractional sets and predicted gain; per pair the\n"
		 "difference (second minus first, percent as a ratio of gains) with its interval (at\n"
		 "--level) and a decision read from the 1 - 2 alpha interval (90% for the usual 95%),\n"
		 "each a one-sided test at alpha = 1 - level:\n"
		 "  clear-gain   wholly above +SWC        clear-loss   wholly below -SWC\n"
		 "  equivalent   wholly inside +-SWC (two one-sided tests; Schuirmann 1987)\n"
		 "  some-gain    above 0, reaching inside the SWC (some-loss: below 0)\n"
		 "  unclear      includes 0 and reaches past the SWC\n"
		 "All programs are taken for one athlete at one block length and status, so the\n"
		 "athlete's level cancels in a difference. With a profile that has random slopes the\n"
		 "athlete's own dose slope does not: the interval adds (f(x2) - f(x1))^2 tau2_slope to\n"
		 "the coefficient covariance. With a profile without random slopes (the bundled one)\n"
		 "the interval assumes every athlete shares the curve's slope.",
	.flags = CMD_PROFILE | CMD_LIBRARY,
	.exec = exec_compare,
	.opts = opts,
	.nopts = OPT_N(opts),
};
