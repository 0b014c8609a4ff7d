#include "curve.h"

#include <math.h>
#include <string.h>

#include "stats.h"

double curve_pct(double y)
{
	return 100.0 * expm1(y);
}

int curve_design(const struct sd_profile *p, const struct sd_covars *c, double x, double *z)
{
	z[0] = 1.0;
	z[1] = form_f(p->form, x);
	for (int k = 2; k < p->nterms; k++) {
		double v = p->centre[k];  /* unknown moderators sit at their centre */
		if (!strcmp(p->term[k], "weeks"))
			v = c->weeks;
		else if (!strcmp(p->term[k], "trained"))
			v = c->trained;
		z[k] = v - p->centre[k];
	}
	return p->nterms;
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

/* Variance of a new study's true effect around the mean at f = f(x). */
static double heterogeneity(const struct sd_profile *p, double f)
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
	out->sp = sqrt(out->se * out->se + heterogeneity(p, z[1]));
	out->ci_lo = out->y - q * out->se;
	out->ci_hi = out->y + q * out->se;
	out->pi_lo = out->y - q * out->sp;
	out->pi_hi = out->y + q * out->sp;
}

void curve_delta(const struct sd_profile *p, const struct sd_covars *c, double a, double b,
		 double level, struct sd_delta *out)
{
	double za[SD_MAX_TERMS], zb[SD_MAX_TERMS], dz[SD_MAX_TERMS];
	double q = st_crit(level, p->df);

	curve_design(p, c, a, za);
	curve_design(p, c, b, zb);
	for (int i = 0; i < p->nterms; i++)
		dz[i] = zb[i] - za[i];
	out->a = a;
	out->b = b;
	out->d = dot(dz, p->beta, p->nterms);
	out->se = sqrt(quad(p, dz));
	out->lo = out->d - q * out->se;
	out->hi = out->d + q * out->se;
	out->practical = out->d > p->swc;
	out->statistical = out->lo > 0 || out->hi < 0;
}

void curve_marginal(const struct sd_profile *p, const struct sd_covars *c, double x, double level,
		    struct sd_marginal *out)
{
	double z[SD_MAX_TERMS], g[SD_MAX_TERMS];
	double q = st_crit(level, p->df);
	double fp = form_df(p->form, x);
	double ey, se;

	curve_design(p, c, x, z);
	ey = exp(dot(z, p->beta, p->nterms));
	/* pct(x) = 100 (exp(z'b) - 1); its slope in x is 100 exp(z'b) b_dose f'(x). The gradient
	 * of that slope with respect to b gives the delta-method variance. */
	out->pct = 100.0 * ey * p->beta[1] * fp;
	for (int j = 0; j < p->nterms; j++)
		g[j] = out->pct * z[j];
	g[1] += 100.0 * ey * fp;
	se = sqrt(quad(p, g));
	out->lo = out->pct - q * se;
	out->hi = out->pct + q * se;
}

double curve_plateau(const struct sd_profile *p, const struct sd_covars *c, double step)
{
	int n = (int)floor((p->dose_max - p->dose_min) / step + 1e-9) + 1;

	(void)c;  /* moderators enter additively: they shift the curve but cancel in differences */
	for (int i = 0; i < n; i++) {
		double a = p->dose_min + i * step, ya = p->beta[1] * form_f(p->form, a);
		int worthwhile = 0;
		for (int j = i + 1; j < n && !worthwhile; j++)
			worthwhile = p->beta[1] * form_f(p->form, p->dose_min + j * step) - ya > p->swc;
		if (!worthwhile)
			return a;
	}
	return p->dose_max;
}

enum sd_zone curve_zone(const struct sd_profile *p, double plateau, double x)
{
	if (x > p->dose_max)
		return SD_ZONE_BEYOND;
	if (x <= 0)
		return SD_ZONE_NONE;
	return x < plateau ? SD_ZONE_CLIMB : SD_ZONE_PLATEAU;
}

const char *zone_name(enum sd_zone z)
{
	static const char *const names[] = { "none", "building", "plateau", "beyond-evidence" };
	return z <= SD_ZONE_BEYOND ? names[z] : "?";
}
