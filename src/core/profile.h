/* A dose-response profile: the fitted (or calibrated) meta-regression the curve comes from.
 *
 * Model, on the lnRR scale: y = b0 + b1 f(x) + sum_k b_k (m_k - centre_k), with x the weekly
 * fractional sets and f the dose form. Terms 0 and 1 are always "intercept" and "dose".
 * Heterogeneity: tau2 (between studies) + sigma2 (within studies); with random slopes the
 * between-study part is tau2 + 2 f(x) cov_slope + f(x)^2 tau2_slope. */
#ifndef SD_PROFILE_H
#define SD_PROFILE_H

#include "err.h"

#define SD_MAX_TERMS 12

enum sd_form { SD_FORM_LINEAR, SD_FORM_LOG, SD_FORM_SQRT, SD_FORM_RECIPROCAL, SD_NFORMS };

struct sd_profile {
	char name[64];
	char outcome[64];
	char scale[16];            /* "lnRR" */
	enum sd_form form;
	int nterms;
	char term[SD_MAX_TERMS][32];
	double beta[SD_MAX_TERMS];
	double centre[SD_MAX_TERMS];
	double vcov[SD_MAX_TERMS * SD_MAX_TERMS];  /* row-major nterms x nterms */
	double tau2;               /* between-study variance (intercept) */
	double sigma2;             /* within-study (effect-level) variance */
	int slopes;                /* 1 when random study slopes on f(x) were fitted */
	double tau2_slope, cov_slope;
	double dose_min, dose_max; /* the evidence range, weekly fractional sets */
	double swc;                /* smallest worthwhile change, lnRR scale */
	double w_direct, w_indirect;
	int df;                    /* 0: normal quantiles; > 0: t quantiles with df */
	char provenance[2048];
};

const char *form_name(enum sd_form f);
/* Form by name ("linear", "log", "sqrt", "reciprocal"); -1 if unknown. */
int form_find(const char *name);
/* f(x) and f'(x). */
double form_f(enum sd_form f, double x);
double form_df(enum sd_form f, double x);

/* Index of a term by name, -1 if absent. */
int profile_term(const struct sd_profile *p, const char *name);
/* Checks the profile is usable: terms, finite numbers, symmetric positive-definite
 * covariance, non-negative variances, a sane range and weights. */
int profile_validate(const struct sd_profile *p, struct sd_err *e);

#endif
