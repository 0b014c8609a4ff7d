/* Multilevel meta-regression with known sampling variances (prefix mr_).
 *
 * Model: y = X b + Z u + w + e with e ~ N(0, diag(v)) known, u the study-level random effects
 * (an intercept, optionally with a slope on one column of X: covariance G, 2x2 unstructured),
 * w an effect-level random intercept (variance sigma2, groups nested in studies, optional).
 * V = blockdiag over studies of Z_i G Z_i' + sigma2 A_i + diag(v_i), never formed whole.
 * Variance parameters are estimated by REML (default) or ML: Newton steps on the exact Hessian
 * in square-root (Cholesky) parameters from method-of-moments starting values (a quasi-Newton
 * search first only when they do not converge), where a variance of 0 or a correlation of +-1
 * is an ordinary point; such boundary estimates are reported exactly (see mr_opt.c).
 * The restricted log-likelihood includes metafor's constant +1/2 log|X'X| (Viechtbauer 2010),
 * and AIC/BIC count the fixed effects plus the variance parameters (BIC with log(n - p) under
 * REML), so the figures are comparable with that package.
 *
 * Ownership: the caller owns every array in struct mr_data; results are plain structs. */
#ifndef SD_METAREG_H
#define SD_METAREG_H

#include "err.h"
#include "profile.h"

#define MR_MAXP SD_MAX_TERMS   /* fixed-effect columns */
#define MR_MAXK 4              /* variance parameters */

enum mr_method { MR_REML, MR_ML };

struct mr_data {
	int n, p;                  /* effects, columns of X */
	const double *y, *v;       /* n effects and their known sampling variances (> 0) */
	const double *X;           /* n x p, row-major, full column rank */
	const int *study;          /* n study ids (any ints): the clusters of V */
	const int *effect;         /* n effect-level ids (nested in study), or NULL: no such level */
	int slope_col;             /* column of X with random study slopes, or -1 */
	const char *const *names;  /* p column names for messages, or NULL */
};

struct mr_opts {
	enum mr_method method;
	double level;              /* confidence level, e.g. 0.95 */
	int t_test;                /* 1: t quantiles with df = number of studies - p */
	int max_iter;              /* iteration cap per stage; 0 for the default */
	const double *start;       /* variance parameters (natural scale, fit order) to take Newton
	                            * steps from (no other starts), or NULL for a full search */
};

struct mr_fit {
	int n, p, nstudy;
	enum mr_method method;
	int slopes, effect_level, slope_col;
	int nvc;                   /* variance parameters: tau2 [, cov, tau2_slope] [, sigma2] */
	double theta[MR_MAXK];     /* those parameters in that order */
	double beta[MR_MAXP], se[MR_MAXP], vcov[MR_MAXP * MR_MAXP];
	double stat[MR_MAXP], pval[MR_MAXP], lo[MR_MAXP], hi[MR_MAXP];
	double level, crit;        /* confidence level and its two-sided quantile */
	int df;                    /* 0: z; > 0: t with df = nstudy - p */
	double tau2, sigma2;       /* study intercept and effect-level variances */
	double tau2_slope, cov_slope, rho;  /* random-slope model; rho NAN when undefined */
	int rho_bound;             /* 1: rho is exactly +-1 (G of rank 1, a boundary) */
	int tau2_zero, slope_zero, sigma2_zero;  /* 1: estimate on the boundary (exactly 0) */
	double loglik, aic, bic;
	int npar;                  /* p + nvc */
	int converged, iter_bfgs, iter_newton;
	int starts;                /* extra Newton starts compared (boundaries, grid of scales) */
	double decrement;          /* final Newton decrement g'(-H)^-1 g, log-likelihood units */
	double qe, qe_p;           /* test for residual heterogeneity (Cochran's Q_E), df n - p */
	int qe_df;
	double v_typical;          /* (n - p) / tr(P0), the typical sampling variance */
	double i2_study, i2_effect;/* multilevel I^2 shares, percent */
};

struct mr_pred {
	double pred, se, ci_lo, ci_hi, pi_lo, pi_hi;
};

/* One study's random effects and within-study fit. */
struct mr_study {
	int id;                    /* study id as given */
	int k, ndose;              /* effects; distinct values of the slope column */
	double weight;             /* share of 1'V^-1 1 over all studies, percent */
	double u0, u1;             /* BLUPs of the intercept and slope deviations (u1 0 w/o slopes) */
	double se_u0, se_u1;       /* their prediction SEs, sqrt(diag(G - G Z'PZ G)) */
	int raw_ok;                /* 1 when the study has >= 2 distinct doses */
	double raw_a, raw_b, raw_se_b;  /* weighted fit y = a + b f inside the study */
};

/* Leave-one-study-out prediction of each study's effects from the others. */
struct mr_cv {
	int folds, skipped, neff;  /* studies predicted, studies that could not be, effects */
	double rmse;               /* sqrt(mean squared error) of held-out effects */
	double mlpd;               /* mean log predictive density per held-out effect (joint within
	                            * a study: N(X b, V_i + X C X')) */
};

typedef void (*mr_progress)(void *arg, int done, int total);

/* Fits the model. Fails on unusable data (one study, rank-deficient X, v <= 0, unidentifiable
 * levels) and on non-convergence (then f holds the last iterate and f->converged is 0). */
int mr_fit(const struct mr_data *d, const struct mr_opts *o, struct mr_fit *f, struct sd_err *e);
/* Mean, confidence and prediction interval at design row z (length p). */
void mr_predict(const struct mr_fit *f, const double *z, struct mr_pred *out);
/* Per study (sorted by id; out has f->nstudy entries): BLUPs, weights, within-study slopes. */
int mr_studies(const struct mr_data *d, const struct mr_fit *f, struct mr_study *out,
	       struct sd_err *e);
/* Leave-one-study-out cross-validation, refitting with o (warm-started from full). */
int mr_loso(const struct mr_data *d, const struct mr_opts *o, const struct mr_fit *full,
	    struct mr_cv *out, mr_progress cb, void *arg, struct sd_err *e);
/* Fills a profile from a fit: terms intercept, dose, moderators (term names given, p of them),
 * centres 0, the covariance, heterogeneity, and the rest as documented in profile.h. */
int mr_to_profile(const struct mr_fit *f, enum sd_form form, const char *const *terms,
		  struct sd_profile *p, struct sd_err *e);

#endif
