/* response: did the athlete respond as predicted? For each completed block and each tested
 * lift with a test near the block's start and one near its end, the observed change against
 * the curve's prediction for the dose of the lift's prime movers, and the athlete's personal
 * response (core/response.h has the model). */
#include <getopt.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "../core/e1rm.h"
#include "../core/response.h"
#include "../core/tlog.h"
#include "../core/units.h"
#include "../io/audit_out.h"
#include "../io/jsonout.h"
#include "../io/recout.h"
#include "respdata.h"

extern const struct sd_cmd cmd_response;

struct rargs {
	long long block;        /* 0: all */
	int window;
	struct resp_opts ro;
};

static int parse(struct sd_ctx *ctx, int argc, char **argv, struct rargs *ra, struct sd_err *e)
{
	static const struct option longopts[] = {
		{ "block", required_argument, NULL, 'b' },
		{ "priors", no_argument, NULL, 'P' },
		{ "prior-sd", required_argument, NULL, 'p' },
		{ "test-error", required_argument, NULL, 't' },
		{ "window", required_argument, NULL, 'w' },
		{ "estimate-error", required_argument, NULL, 'E' },
		{ NULL, 0, NULL, 0 },
	};
	long long v;
	int c;

	ra->block = 0;
	ra->window = RESPD_WINDOW_DAYS;
	ra->ro.test_sd = RESP_TEST_SD;
	ra->ro.prior_sd = RESPD_PRIOR_PROFILE;
	ra->ro.level = ctx->opt.level;
	ra->ro.priors_only = 0;
	ra->ro.est_sd = RESP_ESTIMATE_SD;
	optind = 0;
	opterr = 0;
	while ((c = getopt_long(argc, argv, "", longopts, NULL)) != -1) {
		switch (c) {
		case 'b':
			if (dbu_int("--block", optarg, 1, 0x7fffffffffffffffLL, &ra->block, e))
				return -1;
			break;
		case 'p':
			if (dbu_num("--prior-sd", optarg, 1e-4, 2, &ra->ro.prior_sd, e))
				return -1;
			break;
		case 'P':
			ra->ro.priors_only = 1;
			break;
		case 't':
			if (dbu_num("--test-error", optarg, 0, 1, &ra->ro.test_sd, e))
				return -1;
			break;
		case 'E':
			if (dbu_num("--estimate-error", optarg, 0, 1, &ra->ro.est_sd, e))
				return -1;
			break;
		case 'w':
			if (dbu_int("--window", optarg, 0, 365, &v, e))
				return -1;
			ra->window = (int)v;
			break;
		default:
			return dbu_badopt(&cmd_response, argc, argv, e);
		}
	}
	if (optind != argc - 1)
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

#define NCOLS 21
static const char *const heads[NCOLS] = { "block", "<lift", "<pre", "<post", "e1rm_pre",
	"e1rm_post", "reps_pre", "reps_post", "change%", "lnRR", "dose", "weeks", "predicted%",
	"obs_lo%", "obs_hi%", "percentile", "<beyond", "<dose_from", "planned", "<pre_from",
	"<post_from" };

static void print_vars(FILE *f, const struct sd_profile *p, const struct resp_data *rs,
		       int from_profile)
{
	const struct resp_vars *v = &rs->vars;

	if (v->estimated)
		fprintf(f, "variances: estimated from the roster by REML (%d athletes with "
			"observations, %d with two or more blocks, %d observations):\n  between "
			"athletes %.5f (SD %.3f), between blocks %.5f (SD %.3f); the roster's mean "
			"deviation from the curve %+.1f%% (SE %.4f lnRR)\n", v->roster_athletes,
			v->roster_repeated, v->roster_obs, v->athlete, sqrt(v->athlete), v->block,
			sqrt(v->block), curve_pct(v->mean_dev), v->mean_dev_se);
	else
		fprintf(f, "variances: the stated priors (%s):\n  between athletes %.5f (SD %.3f%s), "
			"between blocks %.5f (SD %.3f: tau2 + sigma2 of profile '%s'%s)\n", v->why,
			v->athlete, sqrt(v->athlete), from_profile ? ", the profile's one-athlete "
			"variance" : ", --prior-sd", v->block, sqrt(v->block), p->name,
			v->block_slope > 0 ? ", with its random slopes" : "");
}

static void print_table(struct sd_ctx *ctx, const struct db_athlete *a, const struct rargs *ra,
			const struct resp_data *rs, const struct sd_rec *r, const struct resp_personal *pr,
			int lb)
{
	int lvl = (int)lround(ra->ro.level * 100);

	fprintf(ctx->out, "athlete %s (%s); profile %s; loads in %s\n", a->name,
		a->trained ? "trained" : "untrained", ctx->profile.name, units_name(lb));
	fprintf(ctx->out, "test error %.3f per 1RM test (log scale, --test-error), more when pre and "
		"post come from different rep counts;\ntests within %d days of a block's start and end "
		"(--window)\n", ra->ro.test_sd, ra->window);
	fprintf(ctx->out, "without a test there, the weekly best e1RM from logged sets nearest to it "
		"(pre_from/post_from training:\nreps + RIR as reps to failure, at most %d; %s), test "
		"error %.3f (--estimate-error)\n", TLOG_E1RM_MAX_RTF, e1rm_source(E1RM_DEFAULT),
		ra->ro.est_sd);
	print_vars(ctx->out, &ctx->profile, rs, ra->ro.prior_sd == RESPD_PRIOR_PROFILE);
	fputc('\n', ctx->out);
	if (rec_rows(r))
		rec_print(r, ctx->out);
	else
		fprintf(ctx->out, "no completed block%s with a test of the same lift near its start "
			"and its end\n", ra->block ? " (of those asked)" : "");
	fprintf(ctx->out, "\ndose: weekly fractional sets of the lift's prime movers: the logged "
		"average over the block when\nit has logged sets (dose_from logged), else the "
		"template's (planned, shown as planned too);\npredicted: the curve for that dose, the "
		"athlete's status and the block's length; obs_lo..obs_hi:\nthe %d%% interval where the "
		"change was expected (the curve's error, the athlete's and the block's\ndeviations, "
		"test error); percentile: where it fell; beyond: values outside the profile's "
		"evidence\n(held at its edge).\n\n", lvl);
	fprintf(ctx->out, "personal response: %+.1f%% (lnRR %+.4f), %d%% interval %+.1f%% to %+.1f%%\n",
		curve_pct(pr->mean), pr->mean, lvl, curve_pct(pr->lo), curve_pct(pr->hi));
	if (pr->n)
		fprintf(ctx->out, "  the athlete's own deviation from the curve, from %d observation%s "
			"in %d completed block%s\n  (all of the athlete's); unshrunk %+.1f%% (SE %.4f "
			"lnRR); weight of the data %.2f, of the prior %.2f\n", pr->n,
			pr->n == 1 ? "" : "s", rs->nblocks, rs->nblocks == 1 ? "" : "s",
			curve_pct(pr->raw), pr->raw_se, pr->weight, 1 - pr->weight);
	else
		fprintf(ctx->out, "  no observations yet: this is the prior, centred on the curve\n");
	cmd_print_caution(ctx);
}

static int print_json(struct sd_ctx *ctx, const struct db_athlete *a, const struct rargs *ra,
		      const struct resp_data *rs, const struct sd_rec *r, const struct resp_personal *pr,
		      struct sd_err *e)
{
	const struct resp_vars *v = &rs->vars;
	char *name = rec_json_string(a->name), *prof = json_profile_text(&ctx->profile);
	char *why = rec_json_string(v->why);
	char test[32], est[32], level[32], window[16], personal[640], vars[512];
	const char *extra[] = { "athlete", name, "status", a->trained ? "\"trained\"" : "\"untrained\"",
		"profile", prof, "test_error", test, "estimate_error", est, "level", level,
		"window_days", window, "variances", vars, "personal", personal, "caution", NULL, NULL };
	char *caution = rec_json_string(aout_caution);
	int rc = 0;

	extra[19] = caution;
	if (!name || !prof || !why || !caution) {
		rc = sd_fail(e, "out of memory");
		goto done;
	}
	snprintf(test, sizeof test, "%.6g", ra->ro.test_sd);
	snprintf(est, sizeof est, "%.6g", ra->ro.est_sd);
	snprintf(level, sizeof level, "%.6g", ra->ro.level);
	snprintf(window, sizeof window, "%d", ra->window);
	snprintf(vars, sizeof vars,
		 "{\"source\": \"%s\", \"athlete\": %.8f, \"block\": %.8f, \"block_cov_slope\": %.8f, "
		 "\"block_slope\": %.8f, \"roster_athletes\": %d, \"roster_repeated\": %d, "
		 "\"roster_observations\": %d, \"mean_deviation\": %.8f, \"mean_deviation_se\": %.8f, "
		 "\"why_priors\": %s}", v->estimated ? "roster-reml" : "priors", v->athlete, v->block,
		 v->block_cov, v->block_slope, v->roster_athletes, v->roster_repeated, v->roster_obs,
		 v->mean_dev, v->mean_dev_se, v->estimated ? "null" : why);
	snprintf(personal, sizeof personal,
		 "{\"observations\": %d, \"blocks\": %d, \"lnrr\": %.6f, \"sd\": %.6f, "
		 "\"low\": %.6f, \"high\": %.6f, \"pct\": %.3f, \"pct_low\": %.3f, \"pct_high\": %.3f, "
		 "\"unshrunk_lnrr\": %.6f, \"unshrunk_se\": %.6f, \"data_weight\": %.4f}",
		 pr->n, rs->nblocks, pr->mean, pr->sd, pr->lo, pr->hi, curve_pct(pr->mean),
		 curve_pct(pr->lo), curve_pct(pr->hi), pr->raw, pr->raw_se, pr->weight);
	rec_print_json_object(r, "observations", ctx->out, extra);
done:
	free(name);
	free(prof);
	free(why);
	free(caution);
	return rc;
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
	if (respd_load(ctx, argv[optind], ra.block, ra.window, &ra.ro, &rs, e))
		return -1;
	lb = dbu_lb(ctx, &rs.athlete);
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
	.usage = "response ATHLETE [--block ID] [--priors] [--prior-sd SD] [--test-error SD]\n"
		 "                  [--window DAYS] [--estimate-error SD]\n"
		 "  for each completed block and tested lift with a test near the block's start and\n"
		 "  one near its end: observed change, the curve's prediction for the dose of the\n"
		 "  lift's prime movers, and the observation's percentile; then the athlete's\n"
		 "  personal response: the posterior of their own deviation from the curve in a\n"
		 "  hierarchical model (athlete, block, test error; the curve's error shared by all)\n"
		 "  whose athlete and block variances are estimated by REML from every athlete's\n"
		 "  observations once at least 10 athletes have them and 5 have two or more blocks,\n"
		 "  else the stated priors (the output says which)\n"
		 "  --block ID       show only this block's rows (the personal estimate uses all)\n"
		 "  --priors         use the stated priors even when the roster could estimate\n"
		 "  --prior-sd SD    prior SD of the athlete's deviation, log scale (default: the\n"
		 "                   square root of the profile's between-athlete variance)\n"
		 "  --test-error SD  1RM test-retest error per test, log scale (default 0.03)\n"
		 "  --window DAYS    how near a test must be to a block's start or end (default 14)\n"
		 "  dose: the logged average weekly dose when the block has logged sets, else the\n"
		 "  template's (dose_from says which); a lift with no test near the start or end is\n"
		 "  judged by its best e1RM from logged sets there (pre_from/post_from 'training')\n"
		 "  --estimate-error SD  error of such an estimate, log scale (default 0.06)",
	.flags = CMD_DB | CMD_LIBRARY | CMD_PROFILE,
	.exec = exec_response,
};
