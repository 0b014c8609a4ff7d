/* A dose-response profile: the fitted (or calibrated) meta-regression the curve comes from.
 *
 * Model, on the lnRR scale: y = b0 + b1 f(x) + sum_k b_k z_k, with x the weekly fractional
 * sets and f the dose form. Terms 0 and 1 are always "intercept" and "dose". A moderator term
 * is either a variable (z = m - centre, e.g. "weeks") or a variable times the dose form
 * (z = m f(x) - centre, named "m:dose", e.g. "trained:dose"), so a moderator may change the
 * curve's slope as well as its level.
 *
 * Every variable has an evidence range (ranges[]); the dose has dose_min..dose_max. Outside
 * its range a result is flagged beyond the evidence (curve.h says how each is then used).
 *
 * Three levels of uncertainty (the same words in every output):
 *   the average curve   z'Vz
 *   a new group/study   + tau2 + sigma2 (with random slopes: + 2 f cov_slope + f^2 tau2_slope)
 *   one athlete         + athlete_var, the between-athlete variance of the response. */
#ifndef SD_PROFILE_H
#define SD_PROFILE_H

#include <stddef.h>

#include "err.h"

#define SD_MAX_TERMS 12
#define SD_MAX_VARS SD_MAX_TERMS
#define SD_DOSE_LIMIT 200.0   /* the most weekly fractional sets a profile's range may reach */

enum sd_form { SD_FORM_LINEAR, SD_FORM_LOG, SD_FORM_SQRT, SD_FORM_RECIPROCAL, SD_NFORMS };

/* How the profile's numbers were made. */
enum sd_basis { SD_BASIS_CALIBRATED, SD_BASIS_FITTED, SD_NBASES };

struct sd_range {
	char var[32];              /* moderator variable, e.g. "weeks" */
	double lo, hi;             /* the evidence covers lo..hi */
};

struct sd_profile {
	char name[64];
	char outcome[64];
	char scale[16];            /* "lnRR" */
	enum sd_basis basis;
	char summary[160];         /* one line: where the numbers come from */
	enum sd_form form;
	int nterms;
	char term[SD_MAX_TERMS][32];
	double beta[SD_MAX_TERMS];
	double centre[SD_MAX_TERMS];
	double vcov[SD_MAX_TERMS * SD_MAX_TERMS];  /* row-major nterms x nterms */
	/* Filled by profile_index: each term's moderator and whether it multiplies the dose, so
	 * the curve does not take term names apart at every point it evaluates. */
	char tvar[SD_MAX_TERMS][32];
	unsigned char tdose[SD_MAX_TERMS];
	signed char tcov[SD_MAX_TERMS];      /* the covariate: 0 weeks, 1 trained, -1 neither */
	signed char trange[SD_MAX_TERMS];    /* its evidence range in range[], or -1 */
	int indexed;
	int nranges;
	struct sd_range range[SD_MAX_VARS];
	double tau2;               /* between-study variance (intercept) */
	double sigma2;             /* within-study (effect-level) variance */
	int slopes;                /* 1 when random study slopes on f(x) were fitted */
	double tau2_slope, cov_slope;
	double athlete_var;        /* between-athlete variance of the response, lnRR^2 */
	char athlete_source[320];  /* where that value comes from, one line */
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

/* "calibrated" or "fitted"; basis_find returns -1 for another word. */
const char *basis_name(enum sd_basis b);
int basis_find(const char *name);

/* Index of a term by name, -1 if absent. */
int profile_term(const struct sd_profile *p, const char *name);
/* The variable a moderator term uses ("trained" for "trained:dose") into var; returns 1 when
 * the term is that variable times the dose form, 0 when it is the variable alone. */
int profile_term_var(const char *term, char *var, size_t n);
/* The evidence range of a variable, or NULL when the profile gives none. */
const struct sd_range *profile_range(const struct sd_profile *p, const char *var);
/* Checks one numeric field against its documented range (the table in profile.c, listed in
 * setdose(1), PROFILE FILES). key is the file's key: "dose_max", "tau2", "beta", "range:weeks"
 * ...; the message names the value and the range, without a location. */
int profile_check_value(const char *key, double v, struct sd_err *e);
/* The same with the subject of the message given (e.g. "covariance row 'dose', number 2"). */
int profile_check_named(const char *key, const char *what, double v, struct sd_err *e);
/* Checks the profile is usable: every field in its range, terms, symmetric positive-definite
 * covariance, valid random-slope variances, a range for every moderator variable. */
int profile_validate(const struct sd_profile *p, struct sd_err *e);
/* Fills tvar, tdose and indexed from the terms (after the last change to them). */
void profile_index(struct sd_profile *p);
/* One line saying what the profile is: "profile 'NAME' (calibrated): SUMMARY". */
void profile_oneline(const struct sd_profile *p, char *buf, size_t n);

#endif
