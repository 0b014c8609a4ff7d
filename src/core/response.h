/* Did the athlete respond as predicted? A hierarchical model of observed strength changes
 * around the curve, the place of each observation in its predictive distribution, and the
 * athlete's own deviation from the curve.
 *
 * Model, on the log scale: the observed change of lift j, obs_j = ln(post/pre), is
 *   obs_j = yhat_j + c_j + a + b_k(j) + e_j
 *   yhat_j  the curve at the lift's dose and its block's length and status (design z_j)
 *   c_j     the curve's own error z_j'(beta - b): shared by every observation,
 *           Cov(c_j, c_l) = z_j' V z_l with V the profile's coefficient covariance
 *   a       the athlete's persistent deviation, variance A
 *   b_k     the deviation of block k, shared by the block's lifts, variance B (with a
 *           random-slope prior: B + (f_j + f_l) cov + f_j f_l slope between lifts j, l of k)
 *   e_j     test error of the change, variance v_j (resp_change_var)
 * so d = obs - yhat ~ N(0, Sigma), Sigma = Z V Z' + A 11' + blocks + diag(v). With
 * Sigma0 = Sigma - A 11', s = 1'Sigma0^-1 1 and t = 1'Sigma0^-1 d, the athlete's deviation
 * has the closed-form posterior
 *   a | d ~ N(A t / (1 + A s), A / (1 + A s)),
 * shrinking toward 0 (the curve) with little data; t/s (SE 1/sqrt(s)) is the unshrunk
 * estimate and A s / (1 + A s) the data's weight.
 *
 * Variances A and B: estimated by REML from the whole roster (resp_roster_vars: athletes as
 * studies, blocks as effects, v as sampling variances, an intercept absorbing the roster's
 * common shift from the curve) when at least RESP_EB_MIN_ATHLETES athletes have observations
 * and RESP_EB_MIN_REPEATED of them have two or more blocks; otherwise the stated priors
 * (resp_prior_vars): A = the profile's between-athlete variance, B = tau2 + sigma2 (a block's
 * programme and conditions vary like a new group's), so one observation's predictive variance
 * is the "one athlete" band's plus test error. */
#ifndef SD_RESPONSE_H
#define SD_RESPONSE_H

#include "curve.h"
#include "err.h"

/* The 1RM test-retest error per test on the log scale; about 3 % is from memory (typical
 * values reported for trained lifters are 2-4 %), settable (--test-error). */
#define RESP_TEST_SD 0.03
/* The error of a 1RM estimated from training (a logged set's reps plus RIR as reps to failure,
 * core/tlog.h) on the same scale: larger than a test's, as the RIR it rests on is the lifter's
 * own guess; twice the test error (common practice, no source), settable (--estimate-error). */
#define RESP_ESTIMATE_SD 0.06
/* The roster sizes that switch the variances from priors to REML estimates: ten clusters is
 * about the fewest from which a variance is estimated with any precision, and athlete and
 * block variance are only told apart by athletes with several blocks (common practice, no
 * source). */
#define RESP_EB_MIN_ATHLETES 10
#define RESP_EB_MIN_REPEATED 5

/* Variance over the 1RM equations (e1rm.h) of ln(estimate / load) at reps: how much the
 * equations disagree about the conversion (0 at 1 rep). */
double resp_equation_var(double reps);
/* Test-error variance of a change: 2 t^2 when pre and post come from the same rep count (the
 * conversion's error is then common to both and cancels in the ratio); when the counts
 * differ it does not cancel, and each test adds resp_equation_var of its reps. */
double resp_change_var(double test_sd, int reps_pre, int reps_post);
/* The same when pre and post have errors of their own (a test and a training estimate):
 * sd_pre^2 + sd_post^2, plus the equations' disagreement when the reps to failure differ. */
double resp_change_var2(double sd_pre, double sd_post, double reps_pre, double reps_post);

struct resp_obs {
	long long block;             /* lifts of one block share its deviation */
	double obs;                  /* observed ln(post/pre) */
	double yhat;                 /* the curve: z'b */
	double z[SD_MAX_TERMS];      /* the curve's design for this observation */
	double v;                    /* test-error variance of the change */
};

struct resp_vars {
	double athlete;              /* A */
	double block;                /* B */
	double block_cov, block_slope;  /* random-slope parts of a block's deviation (priors) */
	int estimated;               /* 1: REML estimates from the roster; 0: the priors */
	int roster_athletes;         /* athletes with observations */
	int roster_repeated;         /* of them, with two or more blocks */
	int roster_obs;
	double mean_dev, mean_dev_se;/* the roster's mean deviation from the curve (REML) */
	char why[200];               /* when the priors are used: why */
};

struct resp_roster {
	int n;
	const int *athlete;          /* n athlete ids */
	const long long *block;      /* n block ids (unique over the roster) */
	const double *dev;           /* n deviations obs - yhat */
	const double *v;             /* n test-error variances */
};

struct resp_fit {
	double dev;       /* obs - yhat */
	double sd;        /* SD of the predictive distribution of obs */
	double z;         /* dev / sd */
	double pctile;    /* 100 Phi(z) */
	double lo, hi;    /* prediction interval for obs (lnRR) */
};

struct resp_personal {
	int n;            /* observations used */
	double mean;      /* posterior mean of the athlete's deviation a, lnRR */
	double sd;        /* its posterior SD */
	double lo, hi;    /* its interval at the level asked */
	double raw;       /* unshrunk estimate t/s (0 when n = 0) */
	double raw_se;    /* 1/sqrt(s) (0 when n = 0) */
	double weight;    /* A s / (1 + A s): the data's share, 0..1 */
};

/* The stated priors: A = athlete_var (the profile's, or --prior-sd squared), B and its slope
 * parts from the profile's heterogeneity. */
void resp_prior_vars(const struct sd_profile *p, double athlete_var, struct resp_vars *out);
/* Replaces the variances in *out by REML estimates from the roster when it is large enough
 * (counts filled either way; why says so when it is not, or when the fit fails). Returns -1
 * only on an error that is not about the data (out of memory). */
int resp_roster_vars(const struct resp_roster *r, struct resp_vars *out, struct sd_err *e);
/* An observation's design, mean and test-error variance from its context. */
void resp_obs_set(const struct sd_profile *p, const struct sd_covars *c, double dose,
		  double obs, double v, long long block, struct resp_obs *out);
/* Where one observation falls in its predictive distribution N(yhat, z'Vz + A + B_jj + v). */
void resp_observe(const struct sd_profile *p, const struct resp_obs *o,
		  const struct resp_vars *v, double level, struct resp_fit *out);
/* The athlete's deviation from n observations (n = 0 gives the prior). */
int resp_personal(const struct sd_profile *p, const struct resp_obs *o, int n,
		  const struct resp_vars *v, double level, struct resp_personal *out,
		  struct sd_err *e);

#endif
