/* lnRR effect sizes; see effects.h for the sources of the formulas. */
#include "effects.h"

#include <math.h>

#include "bounds.h"

/* Checks shared by both designs; the messages name the offending quantity so the reader of an
 * error line knows which column to look at. */
static int check_group(const char *m_name, double m, const char *sd_name, double sd,
		       const char *n_name, double n, struct sd_err *e)
{
	if (!isfinite(m) || m <= 0)
		return sd_fail(e, "non-positive mean %s = %g (lnRR needs positive means)", m_name, m);
	if (!isfinite(sd) || sd < 0)
		return sd_fail(e, "negative standard deviation %s = %g", sd_name, sd);
	if (!isfinite(n) || n < 2)
		return sd_fail(e, "sample size %s = %g (needs at least 2)", n_name, n);
	return bound_check(&bound_mean, m_name, m, e) || bound_check(&bound_sd, sd_name, sd, e) ||
	       bound_check(&bound_n, n_name, n, e) ? -1 : 0;
}

/* The effect and its variance must be ones the fit accepts back (core/bounds.h). */
static int check_result(const struct sd_effect *out, struct sd_err *e)
{
	return bound_check(&bound_yi, "lnRR", out->yi, e) ||
	       bound_check(&bound_vi, "sampling variance", out->vi, e) ? -1 : 0;
}

int eff_rom(double m1, double sd1, double n1, double m2, double sd2, double n2,
	    struct sd_effect *out, struct sd_err *e)
{
	if (check_group("m1", m1, "sd1", sd1, "n1", n1, e) ||
	    check_group("m2", m2, "sd2", sd2, "n2", n2, e))
		return -1;
	out->yi = log(m1 / m2);
	out->vi = sd1 * sd1 / (n1 * m1 * m1) + sd2 * sd2 / (n2 * m2 * m2);
	if (!(out->vi > 0))
		return sd_fail(e, "sampling variance is %g (both sds are 0?)", out->vi);
	return check_result(out, e);
}

int eff_romc(double m_pre, double m_post, double sd_pre, double sd_post, double n, double r,
	     struct sd_effect *out, struct sd_err *e)
{
	if (check_group("m_pre", m_pre, "sd_pre", sd_pre, "n", n, e) ||
	    check_group("m_post", m_post, "sd_post", sd_post, "n", n, e))
		return -1;
	if (!isfinite(r) || fabs(r) > 1)
		return sd_fail(e, "correlation r = %g is outside [-1, 1]", r);
	double cpre = sd_pre / m_pre, cpost = sd_post / m_post;
	out->yi = log(m_post / m_pre);
	out->vi = (cpost * cpost + cpre * cpre - 2 * r * cpost * cpre) / n;
	/* With r near 1 and equal coefficients of variation the variance vanishes: such a row
	 * would get infinite weight, so it is refused rather than passed on. */
	if (!(out->vi > 0))
		return sd_fail(e, "sampling variance is %g (r = %g with equal relative sds)", out->vi, r);
	return check_result(out, e);
}
