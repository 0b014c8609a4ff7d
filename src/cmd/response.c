/* response: did the athlete respond as predicted? For each completed block and each tested
 * lift with a test near the block's start and one near its end, the observed change against
 * the curve's prediction for the dose of the lift's prime movers, and the athlete's personal
 * response (core/response.h has the model). */
#include <stddef.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "../core/e1rm.h"
#include "../core/response.h"
#include "../core/tlog.h"
#include "../core/units.h"
#include "../io/audit_out.h"
#include "../io/recout.h"
#include "../io/response_out.h"
#include "../app/respdata.h"
#include "dbutil.h"
#include "../io/wrap.h"

extern const struct sd_cmd cmd_response;

struct rargs {
	long long block;        /* 0: all */
	long long window;
	int wide;               /* --wide: every column in the table */
	struct resp_opts ro;
};

#define RA(f) offsetof(struct rargs, f)
static const struct sd_optdef opts[] = {
	{ "block", OPT_INT, 1, SD_ID_MAX, RA(block), NULL, "ID",
	  "show only this block's rows (the personal estimate uses all)" },
	{ "priors", OPT_FLAG, 0, 0, RA(ro.priors_only), NULL, NULL,
	  "use the stated priors even when the roster could estimate" },
	{ "prior-sd", OPT_NUM, 1e-4, 2, RA(ro.prior_sd), NULL, "SD",
	  "prior SD of the athlete's deviation, log scale (default: the\n"
	  "square root of the profile's between-athlete variance)" },
	{ "test-error", OPT_NUM, 0, 1, RA(ro.test_sd), NULL, "SD",
	  "1RM test-retest error per test, log scale (default 0.03)" },
	{ "window", OPT_INT, 0, 365, RA(window), NULL, "DAYS",
	  "how near a test must be to a block's start or end (default 14)" },
	{ "estimate-error", OPT_NUM, 0, 1, RA(ro.est_sd), NULL, "SD",
	  "test error of a 1RM estimated from logged sets, log scale\n"
	  "(default: the model's RESP_ESTIMATE_SD, larger than a test's)" },
	{ "wide", OPT_FLAG, 0, 0, RA(wide), NULL, NULL,
	  "every column: the tests (dates, e1RM, reps), lnRR, weeks and\n"
	  "the percentile (the default table fits 80 columns)" },
};
#undef RA

/* The options; the athlete is left in argv[1]. */
static int parse(struct sd_ctx *ctx, int argc, char **argv, struct rargs *ra, struct sd_err *e)
{
	ra->block = 0;
	ra->window = RESPD_WINDOW_DAYS;
	ra->ro.test_sd = RESP_TEST_SD;
	ra->ro.prior_sd = RESPD_PRIOR_PROFILE;
	ra->ro.level = ctx->opt.level;
	ra->ro.priors_only = 0;
	ra->wide = 0;
	ra->ro.est_sd = RESP_ESTIMATE_SD;
	if ((argc = opt_parse("response", opts, OPT_N(opts), ra, argc, argv, e)) < 0)
		return -1;
	if (argc != 2)
		return sd_usage(e, "usage: setdose %s", cmd_response.usage);
	return respd_check_opts(&ra->ro, e);
}

/* Table cells are rounded for reading; CSV and JSON keep enough digits to recompute. */
static void set_row(struct sd_rec *r, const struct resp_row *w, int lb, int precise)
{
	const char *pct = precise ? "%.4f" : "%.1f";
	char beyond[32];
	int c = 0;

	rec_set(r, c++, "%lld", w->block);
	rec_set(r, c++, "%s", w->lift);
	rec_set(r, c++, "%s", w->pre.date);
	rec_set(r, c++, "%s", w->post.date);
	rec_set(r, c++, precise ? "%.3f" : "%.1f", units_show(w->pre.e1rm_kg, lb));
	rec_set(r, c++, precise ? "%.3f" : "%.1f", units_show(w->post.e1rm_kg, lb));
	rec_set(r, c++, "%g", w->pre_reps);
	rec_set(r, c++, "%g", w->post_reps);
	rec_set(r, c++, pct, curve_pct(w->ob.obs));
	rec_set(r, c++, precise ? "%.6f" : "%.4f", w->ob.obs);
	rec_set(r, c++, precise ? "%.3f" : "%.1f", w->dose);
	rec_set(r, c++, "%g", w->weeks);
	rec_set(r, c++, pct, curve_pct(w->ob.yhat));
	rec_set(r, c++, pct, curve_pct(w->fit.lo));
	rec_set(r, c++, pct, curve_pct(w->fit.hi));
	rec_set(r, c++, precise ? "%.3f" : "%.0f", w->fit.pctile);
	rec_set(r, c++, "%s", curve_beyond_names(w->beyond, beyond, sizeof beyond));
	/* Where the dose and each 1RM came from: new columns go last, so the older ones keep
	 * their places for scripts. */
	rec_set(r, c++, "%s", w->dose_logged ? "logged" : "planned");
	rec_set(r, c++, precise ? "%.3f" : "%.1f", w->planned);
	rec_set(r, c++, "%s", w->pre_est ? "training" : "test");
	rec_set(r, c++, "%s", w->post_est ? "training" : "test");
}

/* The narrow table keeps what a coach reads first: the lift, its dose, the observed change
 * against the prediction's interval, and the evidence flags; '~' columns (the tests
 * themselves, lnRR, weeks, percentile, the evidence flags, where the dose and each 1RM come
 * from, the planned dose) are --wide, CSV and JSON only; lines under the narrow table name the
 * logged doses and the values beyond the evidence. */
#define NCOLS 21
static const char *const heads[NCOLS] = { "block", "<lift", "~<pre", "~<post", "~e1rm_pre",
	"~e1rm_post", "~reps_pre", "~reps_post", "change%", "~lnRR", "dose", "~weeks",
	"predicted%", "obs_lo%", "obs_hi%", "~percentile", "~<beyond", "~<dose_from", "~planned",
	"~<pre_from", "~<post_from" };

static void print_vars(FILE *f, const struct sd_profile *p, const struct resp_data *rs,
		       int from_profile)
{
	const struct resp_vars *v = &rs->vars;

	if (v->estimated) {
		wrap_printf(f, 2, "variances: estimated from the roster by REML (%d athletes with "
			    "observations, %d with two or more blocks, %d observations):",
			    v->roster_athletes, v->roster_repeated, v->roster_obs);
		wrap_printf(f, 4, "  between athletes %.5f (SD %.3f), between blocks %.5f (SD %.3f); "
			    "the roster's mean deviation from the curve %+.1f%% (SE %.4f lnRR)",
			    v->athlete, sqrt(v->athlete), v->block, sqrt(v->block),
			    curve_pct(v->mean_dev), v->mean_dev_se);
	} else {
		wrap_printf(f, 2, "variances: the stated priors (%s):", v->why);
		wrap_printf(f, 4, "  between athletes %.5f (SD %.3f%s), between blocks %.5f (SD %.3f: "
			    "tau2 + sigma2 of profile '%s'%s)", v->athlete, sqrt(v->athlete),
			    from_profile ? ", the profile's one-athlete variance" : ", --prior-sd",
			    v->block, sqrt(v->block), p->name,
			    v->block_slope > 0 ? ", with its random slopes" : "");
	}
}

/* Which blocks' doses come from the log (the narrow table has no dose_from column). */
static void logged_line(FILE *f, const struct resp_data *rs, long long only)
{
	char list[400] = "";
	long long last = 0;
	int n = 0, est = 0;

	for (int i = 0; i < rs->n; i++) {
		const struct resp_row *w = &rs->v[i];
		if (only && w->block != only)
			continue;
		est += w->pre_est + w->post_est;
		if (!w->dose_logged || w->block == last)
			continue;
		last = w->block;
		if (strlen(list) + 24 < sizeof list)
			snprintf(list + strlen(list), sizeof list - strlen(list), "%s%lld", n++ ? ", " : "",
				 w->block);
	}
	if (n)
		wrap_printf(f, 2, "dose from the log (the logged average) in block%s %s; planned in "
			    "the others", n == 1 ? "" : "s", list);
	else
		wrap_printf(f, 2, "dose: planned (no block here has logged sets)");
	if (est)
		wrap_printf(f, 2, "%d 1RM%s estimated from logged sets (pre_from/post_from in --wide)",
			    est, est == 1 ? "" : "s");
	for (int i = 0; i < rs->n; i++) {
		const struct resp_row *w = &rs->v[i];
		char names[32];
		if ((only && w->block != only) || !w->beyond)
			continue;
		wrap_printf(f, 2, "beyond the evidence: block %lld, %s (%s; held at the edge)", w->block,
			    w->lift, curve_beyond_names(w->beyond, names, sizeof names));
	}
}

static void print_table(struct sd_ctx *ctx, const struct db_athlete *a, const struct rargs *ra,
			const struct resp_data *rs, struct sd_rec *r, const struct resp_personal *pr,
			int lb)
{
	int lvl = (int)lround(ra->ro.level * 100);
	FILE *f = ctx->out;

	wrap_printf(f, 2, "athlete %s (%s); profile %s; loads in %s", a->name,
		    a->trained ? "trained" : "untrained", ctx->profile.name, units_name(lb));
	wrap_printf(f, 2, "test error %.3f per 1RM test (log scale, --test-error), more when pre and "
		    "post come from different rep counts; tests within %lld days of a block's start "
		    "and end (--window)", ra->ro.test_sd, ra->window);
	wrap_printf(f, 2, "without a test there, the weekly best e1RM from logged sets nearest to it "
		    "(pre_from/post_from training: reps + RIR as reps to failure, at most %d; %s), "
		    "test error %.3f (--estimate-error)", TLOG_E1RM_MAX_RTF,
		    e1rm_source(E1RM_DEFAULT), ra->ro.est_sd);
	print_vars(f, &ctx->profile, rs, ra->ro.prior_sd == RESPD_PRIOR_PROFILE);
	fputc('\n', f);
	rec_wide(r, ra->wide);
	if (rec_rows(r)) {
		rec_print(r, f);
		if (!ra->wide)
			logged_line(f, rs, ra->block);
	} else
		wrap_printf(f, 2, "no completed block%s with a test of the same lift near its start "
			    "and its end", ra->block ? " (of those asked)" : "");
	fputc('\n', f);
	wrap_printf(f, 0, "dose: weekly fractional sets of the lift's prime movers: the logged "
		    "average over the block when it has logged sets (dose_from logged), else the "
		    "template's (planned); predicted: the curve for that dose, the athlete's status "
		    "and the block's length; obs_lo..obs_hi: the %d%% interval where the change was "
		    "expected (the curve's error, the athlete's and the block's deviations, test "
		    "error); %sbeyond: values outside the profile's evidence (held at its edge).%s",
		    lvl, ra->wide ? "percentile: where it fell; " : "", ra->wide ? "" : " --wide "
		    "adds the tests (dates, e1RM, reps, where each came from), lnRR, weeks, the "
		    "planned dose and the percentile where the change fell.");
	fputc('\n', f);
	wrap_printf(f, 2, "personal response: %+.1f%% (lnRR %+.4f), %d%% interval %+.1f%% to %+.1f%%",
		    curve_pct(pr->mean), pr->mean, lvl, curve_pct(pr->lo), curve_pct(pr->hi));
	if (pr->n)
		wrap_printf(f, 2, "  the athlete's own deviation from the curve, from %d observation%s "
			    "in %d completed block%s (all of the athlete's); unshrunk %+.1f%% (SE "
			    "%.4f lnRR); weight of the data %.2f, of the prior %.2f", pr->n,
			    pr->n == 1 ? "" : "s", rs->nblocks, rs->nblocks == 1 ? "" : "s",
			    curve_pct(pr->raw), pr->raw_se, pr->weight, 1 - pr->weight);
	else
		wrap_printf(f, 2, "  no observations yet: this is the prior, centred on the curve");
	cmd_print_caution(ctx);
}

static int print_json(struct sd_ctx *ctx, const struct db_athlete *a, const struct rargs *ra,
		      const struct resp_data *rs, const struct sd_rec *r, const struct resp_personal *pr,
		      struct sd_err *e)
{
	struct resp_json in = { a->name, a->trained, &ctx->profile, ra->ro.test_sd, ra->ro.est_sd,
				ra->ro.level, ra->window, &rs->vars, pr, rs->nblocks };

	return resp_out_json(ctx->out, &in, r) ? sd_fail(e, "out of memory") : 0;
}

static int print_csv(struct sd_ctx *ctx, const struct rargs *ra, const struct resp_data *rs,
		     const struct sd_rec *r, const struct resp_personal *pr)
{
	const struct resp_vars *v = &rs->vars;

	rec_print(r, ctx->out);
	/* The personal estimate as a second table after a blank line. */
	fprintf(ctx->out, "\nobservations,blocks,lnrr,sd,low,high,pct,pct_low,pct_high,unshrunk_lnrr,"
		"unshrunk_se,data_weight,variances,var_athlete,var_block,test_error,level,"
		"estimate_error\n");
	fprintf(ctx->out, "%d,%d,%.6f,%.6f,%.6f,%.6f,%.3f,%.3f,%.3f,%.6f,%.6f,%.4f,%s,%.8f,%.8f,%g,%g,%g\n",
		pr->n, rs->nblocks, pr->mean, pr->sd, pr->lo, pr->hi, curve_pct(pr->mean),
		curve_pct(pr->lo), curve_pct(pr->hi), pr->raw, pr->raw_se, pr->weight,
		v->estimated ? "roster-reml" : "priors", v->athlete, v->block, ra->ro.test_sd,
		ra->ro.level, ra->ro.est_sd);
	return 0;
}

static int exec_response(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	struct rargs ra;
	struct resp_data rs;
	struct sd_rec *r = NULL;
	int rc = -1, lb;

	if (parse(ctx, argc, argv, &ra, e))
		return -1;
	if (respd_load(ctx, argv[1], ra.block, (int)ra.window, &ra.ro, &rs, e))
		return -1;
	lb = app_lb(ctx, &rs.athlete);
	if (!(r = rec_new(NCOLS, heads, ctx->opt.format))) {
		sd_fail(e, "out of memory");
		goto done;
	}
	/* The personal estimate uses every completed block; --block only limits the rows shown. */
	for (int i = 0; i < rs.n; i++) {
		if (ra.block && rs.v[i].block != ra.block)
			continue;
		if (rec_row(r)) {
			sd_fail(e, "out of memory");
			goto done;
		}
		set_row(r, &rs.v[i], lb, ctx->opt.format != SD_FMT_TABLE);
	}
	if (ctx->opt.format == SD_FMT_JSON)
		rc = print_json(ctx, &rs.athlete, &ra, &rs, r, &rs.personal, e);
	else if (ctx->opt.format == SD_FMT_CSV)
		rc = print_csv(ctx, &ra, &rs, r, &rs.personal);
	else {
		print_table(ctx, &rs.athlete, &ra, &rs, r, &rs.personal, lb);
		rc = 0;
	}
done:
	rec_free(r);
	respd_free(&rs);
	return rc;
}

const struct sd_cmd cmd_response = {
	.name = "response",
	.summary = "did the athlete respond as predicted? observed vs predicted gains per block",
	.usage = "response ATHLETE [--block ID] [--priors] [--prior-sd SD]\n"
		 "                 [--test-error SD] [--estimate-error SD] [--window DAYS]\n"
		 "                 [--wide]\n"
		 "  for each completed block and tested lift with a test near the block's start\n"
		 "  and one near its end: observed change, the curve's prediction for the dose of\n"
		 "  the lift's prime movers, and the observation's percentile; then the athlete's\n"
		 "  personal response: the posterior of their own deviation from the curve in a\n"
		 "  hierarchical model (athlete, block, test error; the curve's error shared by\n"
		 "  all) whose athlete and block variances are estimated by REML from every\n"
		 "  athlete's observations once at least 10 athletes have them and 5 have two or\n"
		 "  more blocks, else the stated priors (the output says which); the dose is the\n"
		 "  logged average when the block has logged sets, and a lift without a test near\n"
		 "  a block's start or end may be judged by its weekly best e1RM from logged sets",
	.flags = CMD_DB | CMD_LIBRARY | CMD_PROFILE,
	.exec = exec_response,
	.opts = opts,
	.nopts = OPT_N(opts),
};
