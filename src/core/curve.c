#include "curve.h"

#include <math.h>
#include <stdio.h>
#include <string.h>

#include "stats.h"

double curve_pct(double y)
{
	double p = 100.0 * expm1(y);
	/* Sums of rounded coefficients that cancel leave noise like -3e-17, which would print as
	 * "-0.0"; anything below 1e-9 percent is that noise. */
	return fabs(p) < 1e-9 ? 0.0 : p;
}

/* The athlete's value of a moderator variable, and whether the curve knows it at all. */
static int var_value(const struct sd_covars *c, const char *var, double *v)
{
	if (!strcmp(var, "weeks"))
		*v = c->weeks;
	else if (!strcmp(var, "trained"))
		*v = c->trained;
	else
		return 0;
	return 1;
}

static unsigned var_bit(const char *var)
{
	return !strcmp(var, "weeks") ? SD_BEYOND_WEEKS : !strcmp(var, "trained") ? SD_BEYOND_TRAINED : 0;
}

/* The value used for the curve: inside the range, else its nearest edge. */
static double held(const struct sd_profile *p, const char *var, double v)
{
	const struct sd_range *r = profile_range(p, var);
	if (!r)
		return v;
	return v < r->lo ? r->lo : v > r->hi ? r->hi : v;
}

/* Term k's moderator (into buf when the profile is not indexed) and whether it multiplies the
 * dose. */
static const char *term_var(const struct sd_profile *p, int k, char *buf, int *by_dose)
{
	if (p->indexed) {
		*by_dose = p->tdose[k];
		return p->tvar[k];
	}
	*by_dose = profile_term_var(p->term[k], buf, 32);
	return buf;
}

int curve_design(const struct sd_profile *p, const struct sd_covars *c, double x, double *z)
{
	double f = form_f(p->form, x);

	z[0] = 1.0;
	z[1] = f;
	for (int k = 2; k < p->nterms && p->indexed; k++) {
		/* The indexed profile: no names looked up per point. */
		const struct sd_range *r = p->trange[k] >= 0 ? &p->range[(int)p->trange[k]] : NULL;
		double v;
		if (p->tcov[k] < 0) {
			z[k] = 0;
			continue;
		}
		v = p->tcov[k] == 0 ? c->weeks : c->trained;
		if (r)
			v = v < r->lo ? r->lo : v > r->hi ? r->hi : v;
		z[k] = (v - p->centre[k]) * (p->tdose[k] ? f : 1.0);
	}
	for (int k = 2; k < p->nterms && !p->indexed; k++) {
		char buf[32];
		int by_dose;
		const char *var = term_var(p, k, buf, &by_dose);
		double v;
		if (!var_value(c, var, &v)) {
			z[k] = 0;   /* a moderator the athlete context does not carry sits at its centre */
			continue;
		}
		z[k] = held(p, var, v) - p->centre[k];
		if (by_dose)
			z[k] *= f;
	}
	return p->nterms;
}

unsigned curve_beyond(const struct sd_profile *p, const struct sd_covars *c, double x)
{
	unsigned bits = 0;

	if (x > p->dose_max || x < p->dose_min)
		bits |= SD_BEYOND_DOSE;
	for (int i = 0; i < p->nranges; i++) {
		double v;
		if (var_value(c, p->range[i].var, &v) && (v < p->range[i].lo || v > p->range[i].hi))
			bits |= var_bit(p->range[i].var);
	}
	return bits;
}

unsigned curve_context_note(const struct sd_profile *p, const struct sd_covars *c, char *buf,
			    size_t n)
{
	unsigned bits = 0;
	size_t used = 0;

	buf[0] = '\0';
	for (int i = 0; i < p->nranges; i++) {
		const struct sd_range *r = &p->range[i];
		double v;
		if (!var_value(c, r->var, &v) || (v >= r->lo && v <= r->hi))
			continue;
		bits |= var_bit(r->var);
		if (used < n)
			used += (size_t)snprintf(buf + used, n - used, "%s%s %g is beyond the evidence "
						 "(%g to %g): the curve uses %g", used ? "; " : "",
						 !strcmp(r->var, "weeks") ? "block length (weeks)" : r->var,
						 v, r->lo, r->hi, held(p, r->var, v));
	}
	return bits;
}

const char *curve_beyond_names(unsigned bits, char *buf, size_t n)
{
	static const char *const names[] = { "dose", "weeks", "trained" };
	size_t used = 0;

	buf[0] = '\0';
	for (int i = 0; i < 3; i++)
		if (bits & (1u << i) && used < n)
			used += (size_t)snprintf(buf + used, n - used, "%s%s", used ? "," : "", names[i]);
	return buf;
}

double curve_dose_coef(const struct sd_profile *p, const struct sd_covars *c)
{
	double z[SD_MAX_TERMS], b = p->beta[1];

	/* The "m:dose" terms are (m - centre) f(x): their coefficient times (m - centre) adds to
	 * the dose slope. Read (m - centre) off the design at x = 1, where every form has f != 0. */
	double x = 1.0, f = form_f(p->form, x);
	curve_design(p, c, x, z);
	for (int k = 2; k < p->nterms; k++) {
		char buf[32];
		int by_dose;
		term_var(p, k, buf, &by_dose);
		if (by_dose)
			b += p->beta[k] * z[k] / f;
	}
	return b;
}

static double dot(const double *a, const double *b, int n)
{
	double s = 0;
	for (int i = 0; i < n; i++)
		s += a[i] * b[i];
	return s;
}

/* a' V a with V the profile's coefficient covariance. */
static double quad(const struct sd_profile *p, const double *a)
{
	int n = p->nterms;
	double s = 0;
	for (int i = 0; i < n; i++)
		for (int j = 0; j < n; j++)
			s += a[i] * p->vcov[i * n + j] * a[j];
	return s > 0 ? s : 0;
}

double curve_heterogeneity(const struct sd_profile *p, double f)
{
	double h = p->tau2 + p->sigma2;
	if (p->slopes)
		h += 2.0 * f * p->cov_slope + f * f * p->tau2_slope;
	return h > 0 ? h : 0;
}

void curve_eval(const struct sd_profile *p, const struct sd_covars *c, double x, double level,
		struct sd_point *out)
{
	double z[SD_MAX_TERMS];
	double q = st_crit(level, p->df);

	curve_design(p, c, x, z);
	out->x = x;
	out->y = dot(z, p->beta, p->nterms);
	out->se = sqrt(quad(p, z));
	out->sd_group = sqrt(out->se * out->se + curve_heterogeneity(p, z[1]));
	out->sd_athlete = sqrt(out->sd_group * out->sd_group + p->athlete_var);
	out->ci_lo = out->y - q * out->se;
	out->ci_hi = out->y + q * out->se;
	out->group_lo = out->y - q * out->sd_group;
	out->group_hi = out->y + q * out->sd_group;
	out->ath_lo = out->y - q * out->sd_athlete;
	out->ath_hi = out->y + q * out->sd_athlete;
	out->beyond = curve_beyond(p, c, x);
}

void curve_delta(const struct sd_profile *p, const struct sd_covars *c, double a, double b,
		 double level, int same_athlete, struct sd_delta *out)
{
	double za[SD_MAX_TERMS], zb[SD_MAX_TERMS], dz[SD_MAX_TERMS];
	double q = st_crit(level, p->df), var;

	curve_design(p, c, a, za);
	curve_design(p, c, b, zb);
	for (int i = 0; i < p->nterms; i++)
		dz[i] = zb[i] - za[i];
	out->a = a;
	out->b = b;
	out->d = dot(dz, p->beta, p->nterms);
	var = quad(p, dz);
	/* One athlete at two doses: d = dz'b + u1 (f(b) - f(a)); u0 cancels, u1 does not. */
	if (same_athlete && p->slopes)
		var += dz[1] * dz[1] * p->tau2_slope;
	out->se = sqrt(var);
	out->lo = out->d - q * out->se;
	out->hi = out->d + q * out->se;
	out->practical = out->d > p->swc;
	out->statistical = out->lo > 0 || out->hi < 0;
}

void curve_plus1(const struct sd_profile *p, const struct sd_covars *c, double x, double level,
		 struct sd_plus1 *out)
{
	double z0[SD_MAX_TERMS], z1[SD_MAX_TERMS], g[SD_MAX_TERMS];
	double q = st_crit(level, p->df), e0, e1, se;

	curve_design(p, c, x, z0);
	curve_design(p, c, x + 1.0, z1);
	e0 = exp(dot(z0, p->beta, p->nterms));
	e1 = exp(dot(z1, p->beta, p->nterms));
	/* pct(x+1) - pct(x) = 100 (e^{z1'b} - e^{z0'b}); its gradient in b is
	 * 100 (e^{z1'b} z1 - e^{z0'b} z0), which gives the delta-method variance. */
	out->pct = 100.0 * (e1 - e0);
	for (int j = 0; j < p->nterms; j++)
		g[j] = 100.0 * (e1 * z1[j] - e0 * z0[j]);
	se = sqrt(quad(p, g));
	out->lo = out->pct - q * se;
	out->hi = out->pct + q * se;
}

double curve_plateau(const struct sd_profile *p, const struct sd_covars *c, double step)
{
	double span = p->dose_max - p->dose_min, best = -INFINITY, plateau = p->dose_max;
	double z[SD_MAX_TERMS];
	int n;

	if (!(step >= 0.01))
		step = 0.01;
	/* dose_max - dose_min <= SD_DOSE_LIMIT (profile_validate), so n <= 20,001. */
	n = (int)floor(span / step + 1e-9) + 1;
	/* Scan from the top, so the best gain still to come above a is a running maximum: one
	 * pass, and the last dose that qualifies is the smallest. */
	for (int i = n - 1; i >= 0; i--) {
		double a = p->dose_min + i * step, ya;
		curve_design(p, c, a, z);
		ya = dot(z, p->beta, p->nterms);
		if (!(best - ya > p->swc))
			plateau = a;
		if (ya > best)
			best = ya;
	}
	return plateau;
}

enum sd_zone curve_zone(const struct sd_profile *p, double plateau, double x)
{
	if (x <= 0)
		return SD_ZONE_NONE;
	if (x > p->dose_max || x < p->dose_min)
		return SD_ZONE_BEYOND;
	return x < plateau ? SD_ZONE_CLIMB : SD_ZONE_PLATEAU;
}

const char *zone_name(enum sd_zone z)
{
	static const char *const names[] = { "none", "building", "plateau", "beyond-evidence" };
	return z <= SD_ZONE_BEYOND ? names[z] : "?";
}
