#include "profile.h"

#include <math.h>
#include <stdio.h>
#include <string.h>

#include <gsl/gsl_errno.h>
#include <gsl/gsl_linalg.h>
#include <gsl/gsl_matrix.h>

static const char *const forms[SD_NFORMS] = { "linear", "log", "sqrt", "reciprocal" };
static const char *const bases[SD_NBASES] = { "calibrated", "fitted" };

static int find_word(const char *const *words, int n, const char *name)
{
	for (int i = 0; i < n; i++)
		if (!strcmp(name, words[i]))
			return i;
	return -1;
}

const char *form_name(enum sd_form f)
{
	return f < SD_NFORMS ? forms[f] : "?";
}

int form_find(const char *name)
{
	return find_word(forms, SD_NFORMS, name);
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

const char *basis_name(enum sd_basis b)
{
	return b < SD_NBASES ? bases[b] : "?";
}

int basis_find(const char *name)
{
	return find_word(bases, SD_NBASES, name);
}

int profile_term(const struct sd_profile *p, const char *name)
{
	for (int i = 0; i < p->nterms; i++)
		if (!strcmp(p->term[i], name))
			return i;
	return -1;
}

int profile_term_var(const char *term, char *var, size_t n)
{
	const char *colon = strchr(term, ':');
	size_t all = strlen(term), len = colon && !strcmp(colon, ":dose") ? (size_t)(colon - term) : all;
	size_t cut = len < n ? len : n - 1;

	/* Called for every term of every curve point: a copy, not a formatted print. */
	memcpy(var, term, cut);
	var[cut] = '\0';
	return len < all;
}

const struct sd_range *profile_range(const struct sd_profile *p, const char *var)
{
	for (int i = 0; i < p->nranges; i++)
		if (!strcmp(p->range[i].var, var))
			return &p->range[i];
	return NULL;
}

/* The documented range of every numeric field (setdose(1), PROFILE FILES). The bounds are
 * generous: they exist so that no value can overflow a conversion, make a loop run for long
 * or turn a band into infinities, not to judge the evidence. On the lnRR scale 1 is a factor
 * of e (+172 %), so no variance or SWC above it describes 1RM changes; 200 weekly sets is
 * several times any trial's highest dose. */
struct limit {
	const char *key;
	double lo, hi;
	int lo_open, whole;
	const char *unit;
};

static const struct limit limits[] = {
	{ "dose_min", 0, SD_DOSE_LIMIT, 0, 0, "weekly fractional sets" },
	{ "dose_max", 0, SD_DOSE_LIMIT, 1, 0, "weekly fractional sets" },
	{ "swc", 0, 0.5, 1, 0, "lnRR" },
	{ "w_direct", 0, 1, 1, 0, NULL },
	{ "w_indirect", 0, 1, 0, 0, NULL },
	{ "df", 0, 1000000, 0, 1, NULL },
	{ "tau2", 0, 1, 0, 0, "lnRR^2" },
	{ "sigma2", 0, 1, 0, 0, "lnRR^2" },
	{ "tau2_slope", 0, 1, 0, 0, "lnRR^2" },
	{ "cov_slope", -1, 1, 0, 0, "lnRR^2" },
	{ "athlete", 0, 1, 0, 0, "lnRR^2" },
	{ "beta", -10, 10, 0, 0, "lnRR" },
	{ "centre", -1000, 1000, 0, 0, NULL },
	{ "variance", 0, 1, 1, 0, NULL },
	{ "covariance", -1, 1, 0, 0, NULL },
	{ "range:weeks", 1, 520, 0, 0, "weeks" },
	{ "range:trained", 0, 1, 0, 0, NULL },
	{ "range", -1e6, 1e6, 0, 0, NULL },
};

static const struct limit *limit_of(const char *key)
{
	const struct limit *generic = NULL;
	for (size_t i = 0; i < sizeof limits / sizeof *limits; i++) {
		if (!strcmp(limits[i].key, key))
			return &limits[i];
		if (!strcmp(limits[i].key, "range"))
			generic = &limits[i];
	}
	return !strncmp(key, "range:", 6) ? generic : NULL;
}

int profile_check_named(const char *key, const char *what, double v, struct sd_err *e)
{
	const struct limit *l = limit_of(key);

	if (!l)
		return sd_fail(e, "no documented range for '%s'", key);
	if (!isfinite(v))
		return sd_fail(e, "%s is not a finite number", what);
	if (l->whole && (v != floor(v) || v > l->hi || v < l->lo))
		return sd_fail(e, "%s must be a whole number from %.10g to %.10g, not %.10g", what,
			       l->lo, l->hi, v);
	if (v > l->hi || v < l->lo || (l->lo_open && v == l->lo))
		return sd_fail(e, "%s must be %s %.10g %s %.10g%s%s, not %.10g", what,
			       l->lo_open ? "above" : "from", l->lo, l->lo_open ? "and at most" : "to",
			       l->hi, l->unit ? " " : "", l->unit ? l->unit : "", v);
	return 0;
}

int profile_check_value(const char *key, double v, struct sd_err *e)
{
	char what[64];
	snprintf(what, sizeof what, "'%s'", strncmp(key, "range:", 6) ? key : key + 6);
	return profile_check_named(key, what, v, e);
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
			if (profile_check_value(i == j ? "variance" : "covariance", x, e))
				return sd_wrap(e, "covariance entry (%d,%d)", i + 1, j + 1);
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

static int check_terms(const struct sd_profile *p, struct sd_err *e)
{
	if (p->nterms < 2 || p->nterms > SD_MAX_TERMS)
		return sd_fail(e, "a profile needs the terms intercept and dose (and at most %d terms)",
			       SD_MAX_TERMS);
	if (strcmp(p->term[0], "intercept") || strcmp(p->term[1], "dose"))
		return sd_fail(e, "the first two terms must be 'intercept' and 'dose'");
	for (int i = 0; i < p->nterms; i++) {
		char var[32];
		if (profile_check_value("beta", p->beta[i], e) ||
		    profile_check_value("centre", p->centre[i], e))
			return sd_wrap(e, "term '%s'", p->term[i]);
		for (int j = 0; j < i; j++)
			if (!strcmp(p->term[i], p->term[j]))
				return sd_fail(e, "term '%s' appears twice", p->term[i]);
		if (i < 2)
			continue;
		profile_term_var(p->term[i], var, sizeof var);
		if (!*var || strchr(var, ':') || !strcmp(var, "dose") || !strcmp(var, "intercept"))
			return sd_fail(e, "term '%s' is neither a moderator nor a moderator times "
				       "the dose ('NAME:dose')", p->term[i]);
		if (!profile_range(p, var))
			return sd_fail(e, "moderator '%s' has no evidence range (add '%s = LOW, HIGH' "
				       "to [ranges])", var, var);
	}
	return 0;
}

static int check_ranges(const struct sd_profile *p, struct sd_err *e)
{
	if (profile_check_value("dose_min", p->dose_min, e) ||
	    profile_check_value("dose_max", p->dose_max, e))
		return -1;
	if (!(p->dose_max > p->dose_min))
		return sd_fail(e, "evidence range must satisfy dose_min < dose_max (%g, %g)",
			       p->dose_min, p->dose_max);
	for (int i = 0; i < p->nranges; i++) {
		const struct sd_range *r = &p->range[i];
		char key[48];
		snprintf(key, sizeof key, "range:%s", r->var);
		if (profile_check_value(key, r->lo, e) || profile_check_value(key, r->hi, e))
			return -1;
		if (r->lo > r->hi)
			return sd_fail(e, "range of '%s' runs backwards (%g to %g)", r->var, r->lo, r->hi);
		for (int j = 0; j < i; j++)
			if (!strcmp(r->var, p->range[j].var))
				return sd_fail(e, "range of '%s' given twice", r->var);
	}
	return 0;
}

int profile_validate(const struct sd_profile *p, struct sd_err *e)
{
	if (check_ranges(p, e) || check_terms(p, e))
		return -1;
	if ((int)p->form < 0 || p->form >= SD_NFORMS)
		return sd_fail(e, "unknown dose form");
	if ((int)p->basis < 0 || p->basis >= SD_NBASES)
		return sd_fail(e, "basis must be calibrated or fitted");
	if (check_vcov(p, e))
		return -1;
	if (profile_check_value("tau2", p->tau2, e) || profile_check_value("sigma2", p->sigma2, e) ||
	    profile_check_value("athlete", p->athlete_var, e))
		return -1;
	if (p->slopes) {
		if (profile_check_value("tau2_slope", p->tau2_slope, e) ||
		    profile_check_value("cov_slope", p->cov_slope, e))
			return -1;
		if (p->cov_slope * p->cov_slope > p->tau2 * p->tau2_slope * (1 + 1e-9))
			return sd_fail(e, "random-slope variances do not form a valid covariance matrix");
	}
	if (profile_check_value("swc", p->swc, e) || profile_check_value("w_direct", p->w_direct, e) ||
	    profile_check_value("w_indirect", p->w_indirect, e) ||
	    profile_check_value("df", p->df, e))
		return -1;
	if (p->w_indirect > p->w_direct)
		return sd_fail(e, "set weights must satisfy indirect <= direct (%g, %g)", p->w_indirect,
			       p->w_direct);
	return 0;
}

void profile_oneline(const struct sd_profile *p, char *buf, size_t n)
{
	snprintf(buf, n, "profile '%s' (%s): %s", p->name, basis_name(p->basis),
		 p->summary[0] ? p->summary : "no summary given");
}

void profile_index(struct sd_profile *p)
{
	for (int k = 0; k < p->nterms; k++) {
		const struct sd_range *r;
		p->tdose[k] = (unsigned char)profile_term_var(p->term[k], p->tvar[k], sizeof p->tvar[k]);
		p->tcov[k] = !strcmp(p->tvar[k], "weeks") ? 0 : !strcmp(p->tvar[k], "trained") ? 1 : -1;
		r = profile_range(p, p->tvar[k]);
		p->trange[k] = r ? (signed char)(r - p->range) : -1;
	}
	p->indexed = 1;
}
