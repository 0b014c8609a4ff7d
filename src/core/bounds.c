#include "bounds.h"

#include <math.h>

const struct sd_bound bound_yi = { "an lnRR effect", -5, 5, 0 };
const struct sd_bound bound_vi = { "a sampling variance", 1e-8, 100, 0 };
const struct sd_bound bound_dose = { "a dose", 0, 1e4, 0 };
const struct sd_bound bound_moderator = { "a moderator", -1e6, 1e6, 0 };
const struct sd_bound bound_mean = { "a group mean", 1e-9, 1e12, 0 };
const struct sd_bound bound_sd = { "a standard deviation", 0, 1e12, 0 };
const struct sd_bound bound_n = { "a sample size", 2, 1e7, 0 };
const struct sd_bound bound_r = { "a correlation", -1, 1, 0 };
/* The program notation's set limit (core/program.h), and the heaviest load `test add` takes
 * (core/units.h); the smallest is a 10 g plate's worth, above a load of 0 (none). */
const struct sd_bound bound_log_sets = { "a set count", 1, 100, 1 };
const struct sd_bound bound_log_load = { "a load in kg", 0.01, 1000, 0 };

int bound_check(const struct sd_bound *b, const char *name, double x, struct sd_err *e)
{
	if (!isfinite(x) || x < b->lo || x > b->hi)
		return sd_fail(e, "%s = %g is outside %g to %g (%s)", name, x, b->lo, b->hi, b->what);
	if (b->whole && x != floor(x))
		return sd_fail(e, "%s = %g is not a whole number (%s)", name, x, b->what);
	return 0;
}
