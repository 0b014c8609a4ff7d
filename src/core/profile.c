#include "profile.h"

#include <math.h>
#include <string.h>

#include <gsl/gsl_errno.h>
#include <gsl/gsl_linalg.h>
#include <gsl/gsl_matrix.h>

static const char *const forms[SD_NFORMS] = { "linear", "log", "sqrt", "reciprocal" };

const char *form_name(enum sd_form f)
{
	return f < SD_NFORMS ? forms[f] : "?";
}

int form_find(const char *name)
{
	for (int i = 0; i < SD_NFORMS; i++)
		if (!strcmp(name, forms[i]))
			return i;
	return -1;
}

double form_f(enum sd_form f, double x)
{
	switch (f) {
	case SD_FORM_LINEAR: return x;
	case SD_FORM_LOG: return log1p(x);
	case SD_FORM_SQRT: return sqrt(x);
	case SD_FORM_RECIPROCAL: return 1.0 / (x + 1.0);
	default: return NAN;
	}
}

double form_df(enum sd_form f, double x)
{
	switch (f) {
	case SD_FORM_LINEAR: return 1.0;
	case SD_FORM_LOG: return 1.0 / (x + 1.0);
	/* sqrt has no finite slope at 0; use the slope just above it so marginal gains stay finite. */
	case SD_FORM_SQRT: return 0.5 / sqrt(x > 1e-6 ? x : 1e-6);
	case SD_FORM_RECIPROCAL: return -1.0 / ((x + 1.0) * (x + 1.0));
	default: return NAN;
	}
}

int profile_term(const struct sd_profile *p, const char *name)
{
	for (int i = 0; i < p->nterms; i++)
		if (!strcmp(p->term[i], name))
			return i;
	return -1;
}

/* A covariance matrix must be symmetric and positive definite: its Cholesky factor exists. */
static int check_vcov(const struct sd_profile *p, struct sd_err *e)
{
	int n = p->nterms, rc;
	double a[SD_MAX_TERMS * SD_MAX_TERMS];
	gsl_error_handler_t *old;

	for (int i = 0; i < n; i++)
		for (int j = 0; j < n; j++) {
			double x = p->vcov[i * n + j], y = p->vcov[j * n + i];
			if (!isfinite(x))
				return sd_fail(e, "covariance entry (%d,%d) is not a finite number", i + 1, j + 1);
			if (fabs(x - y) > 1e-12 * (fabs(x) + fabs(y)) + 1e-15)
				return sd_fail(e, "covariance matrix is not symmetric at (%d,%d)", i + 1, j + 1);
			a[i * n + j] = x;
		}
	gsl_matrix_view m = gsl_matrix_view_array(a, (size_t)n, (size_t)n);
	old = gsl_set_error_handler_off();
	rc = gsl_linalg_cholesky_decomp1(&m.matrix);
	gsl_set_error_handler(old);
	if (rc)
		return sd_fail(e, "covariance matrix is not positive definite");
	return 0;
}

int profile_validate(const struct sd_profile *p, struct sd_err *e)
{
	if (p->nterms < 2 || p->nterms > SD_MAX_TERMS)
		return sd_fail(e, "a profile needs the terms intercept and dose (and at most %d terms)",
			       SD_MAX_TERMS);
	if (strcmp(p->term[0], "intercept") || strcmp(p->term[1], "dose"))
		return sd_fail(e, "the first two terms must be 'intercept' and 'dose'");
	for (int i = 0; i < p->nterms; i++) {
		if (!isfinite(p->beta[i]))
			return sd_fail(e, "coefficient '%s' is missing or not a number", p->term[i]);
		if (!isfinite(p->centre[i]))
			return sd_fail(e, "centre of '%s' is not a number", p->term[i]);
		for (int j = 0; j < i; j++)
			if (!strcmp(p->term[i], p->term[j]))
				return sd_fail(e, "term '%s' appears twice", p->term[i]);
	}
	if ((int)p->form < 0 || p->form >= SD_NFORMS)
		return sd_fail(e, "unknown dose form");
	if (check_vcov(p, e))
		return -1;
	if (!(p->tau2 >= 0) || !(p->sigma2 >= 0) || !isfinite(p->tau2) || !isfinite(p->sigma2))
		return sd_fail(e, "heterogeneity variances must be finite and non-negative");
	if (p->slopes) {
		if (!(p->tau2_slope >= 0) || !isfinite(p->cov_slope) ||
		    p->cov_slope * p->cov_slope > p->tau2 * p->tau2_slope * (1 + 1e-9))
			return sd_fail(e, "random-slope variances do not form a valid covariance matrix");
	}
	if (!(p->dose_min >= 0) || !(p->dose_max > p->dose_min) || !isfinite(p->dose_max))
		return sd_fail(e, "evidence range must satisfy 0 <= dose_min < dose_max");
	if (!(p->swc > 0) || !isfinite(p->swc))
		return sd_fail(e, "smallest worthwhile change must be positive");
	if (!(p->w_direct > 0) || !(p->w_indirect >= 0) || p->w_indirect > p->w_direct ||
	    !isfinite(p->w_direct))
		return sd_fail(e, "set weights must satisfy 0 <= indirect <= direct, direct > 0");
	if (p->df < 0)
		return sd_fail(e, "degrees of freedom must be 0 (normal) or positive");
	return 0;
}
