/* Did the athlete respond as predicted? Observed strength changes over completed blocks set
 * against the curve's prediction for each block's dose, and an empirical-Bayes estimate of how
 * far this athlete runs above or below the curve.
 *
 * Model, on the log scale (lnRR): a block's observed change obs_k = ln(post/pre) is
 *   obs_k = yhat_k + u + e_k,   e_k ~ N(0, s_k^2),   s_k^2 = sp_k^2 + 2 t^2,
 * where yhat_k and sp_k are the curve's mean and predictive SD at the block's dose, t is the
 * SD of one 1RM test on the log scale (test-retest error; pre and post each carry it, hence
 * 2 t^2) and u is the athlete's personal deviation, with prior u ~ N(0, tau^2).
 * Observed percentile: 100 Phi((obs_k - yhat_k) / s_k), the place of the observation in its
 * predictive distribution (normal approximation).
 * Personal response: the normal-normal posterior of u given d_k = obs_k - yhat_k,
 *   mean = (sum d_k / s_k^2) / (1/tau^2 + sum 1/s_k^2),  var = 1 / (1/tau^2 + sum 1/s_k^2),
 * which shrinks toward 0 when data are few or noisy.
 * Simplifications (documented in man/setdose.1): the d_k are treated as independent, although
 * the curve's own uncertainty and a block's shared conditions make them correlate a little,
 * so with many observations the interval is somewhat too narrow; tau and t are stated, not
 * estimated. */
#ifndef SD_RESPONSE_H
#define SD_RESPONSE_H

#include "err.h"

/* Chosen defaults, settable (--test-error, --prior-sd). The 1RM test-retest error of about
 * 3 % is from memory (typical values reported for trained lifters are 2-4 %); the prior SD of
 * personal deviations, 0.05 (about 5 percentage points of gain), is common practice, no source. */
#define RESP_TEST_SD 0.03
#define RESP_PRIOR_SD 0.05

struct resp_obs {
	double obs;    /* observed ln(post/pre) */
	double yhat;   /* predicted lnRR at the block's dose */
	double sp;     /* curve's predictive SD there: sqrt(z'Vz + heterogeneity) */
};

struct resp_opts {
	double test_sd;   /* t: SD of one 1RM test, log scale, >= 0 */
	double prior_sd;  /* tau: SD of true personal deviations, log scale, > 0 */
	double level;     /* interval level, e.g. 0.95 */
};

struct resp_fit {
	double dev;       /* obs - yhat */
	double sd;        /* s: SD of the predictive distribution of obs */
	double z;         /* dev / sd */
	double pctile;    /* 100 Phi(z) */
	double lo, hi;    /* prediction interval for obs, test error included (lnRR) */
};

struct resp_personal {
	int n;            /* observations used */
	double mean;      /* posterior (shrunken) mean deviation u, lnRR */
	double sd;        /* its posterior SD */
	double lo, hi;    /* its interval at the level asked */
	double raw;       /* unshrunken precision-weighted mean deviation (0 when n = 0) */
	double raw_se;    /* its standard error (0 when n = 0) */
	double weight;    /* share of the data in the posterior mean: 1 - shrinkage, 0..1 */
};

/* Checks options: finite, test_sd >= 0, prior_sd > 0, 0 < level < 1. */
int resp_check_opts(const struct resp_opts *opt, struct sd_err *e);
/* Where one observation falls in its predictive distribution. */
void resp_observe(const struct resp_obs *o, const struct resp_opts *opt, struct resp_fit *out);
/* The personal response from n observations (n = 0 gives the prior). */
int resp_personal(const struct resp_obs *o, int n, const struct resp_opts *opt,
		  struct resp_personal *out, struct sd_err *e);

#endif
