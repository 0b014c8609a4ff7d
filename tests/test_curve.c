/* Curve, quantiles and the percent transform, checked against outside values and hand
 * calculation with the bundled calibrated profile. */
#include "testutil.h"

#include <string.h>

#include "core/curve.h"
#include "core/stats.h"
#include "io/profile_io.h"

static struct sd_profile prof;
static const struct sd_covars untrained10 = { 10, 0 };

static int load(void **state)
{
	struct sd_err e;
	(void)state;
	if (profile_load("profiles/strength.ini", &prof, &e)) {
		fprintf(stderr, "%s\n", e.msg);
		return -1;
	}
	return 0;
}

/* Standard normal and Student t quantiles: values as printed in standard statistical tables
 * (Abramowitz & Stegun 1964, Table 26.1 and Table 26.10; Fisher & Yates 1963). */
static void test_quantiles(void **state)
{
	(void)state;
	assert_near(st_crit(0.95, 0), 1.959964, 1e-6);
	assert_near(st_crit(0.90, 0), 1.644854, 1e-6);
	assert_near(st_crit(0.99, 0), 2.575829, 1e-6);
	assert_near(st_crit(0.95, 10), 2.228139, 1e-6);
	assert_near(st_crit(0.95, 30), 2.042272, 1e-6);
	assert_near(st_crit(0.90, 5), 2.015048, 1e-6);
	assert_near(st_cdf(1.959964, 0), 0.975, 1e-6);
}

/* Percent change from a log ratio: 100 (e^y - 1) (definition of lnRR; Hedges et al. 1999). */
static void test_pct(void **state)
{
	(void)state;
	assert_near(curve_pct(0), 0, 1e-12);
	assert_near(curve_pct(log(1.25)), 25, 1e-9);
	assert_near(curve_pct(log(0.8)), -20, 1e-9);
	assert_near(curve_pct(0.05), 5.127109637602, 1e-9);
}

/* The calibration of the bundled profile (issue values, rounded, from memory of the
 * literature): untrained, 10 weeks, y(x) = 0.25 - 0.20/(x+1); +5.1% at 0 and +26.1% at 10. */
static void test_calibration(void **state)
{
	struct sd_point p;
	(void)state;
	curve_eval(&prof, &untrained10, 0, 0.95, &p);
	assert_near(p.y, 0.05, 1e-12);
	assert_near(curve_pct(p.y), 5.1, 0.05);
	curve_eval(&prof, &untrained10, 10, 0.95, &p);
	assert_near(p.y, 0.25 - 0.20 / 11, 1e-12);
	assert_near(curve_pct(p.y), 26.1, 0.05);
	/* Moderators: +0.01 per week over 10, -0.05 trained. */
	struct sd_covars c = { 12, 1 };
	curve_eval(&prof, &c, 10, 0.95, &p);
	assert_near(p.y, 0.25 - 0.20 / 11 + 0.02 - 0.05, 1e-12);
}

/* Bands by hand: z = (1, f), Var = V00 + 2 f V01 + f^2 V11; at x = 0, f = 1:
 * 0.000144 - 0.000288 + 0.0004 = 0.000256, SE 0.016. Prediction adds tau2 + sigma2 = 0.0035. */
static void test_bands(void **state)
{
	struct sd_point p;
	double q = 1.959963985;
	(void)state;
	curve_eval(&prof, &untrained10, 0, 0.95, &p);
	assert_near(p.se, 0.016, 1e-12);
	assert_near(p.ci_lo, 0.05 - q * 0.016, 1e-8);
	assert_near(p.ci_hi, 0.05 + q * 0.016, 1e-8);
	assert_near(p.sp, sqrt(0.000256 + 0.0035), 1e-12);
	assert_near(p.pi_lo, 0.05 - q * sqrt(0.003756), 1e-8);
	/* x = 4: f = 0.2: 0.000144 - 2*0.2*0.000144 + 0.04*0.0004 = 0.0001024 */
	curve_eval(&prof, &untrained10, 4, 0.95, &p);
	assert_near(p.se * p.se, 0.000144 - 0.4 * 0.000144 + 0.04 * 0.0004, 1e-15);
	/* Weeks away from the centre add their own variance: (2)^2 * 0.000004. */
	struct sd_covars c = { 12, 0 };
	curve_eval(&prof, &c, 4, 0.95, &p);
	assert_near(p.se * p.se, 0.0001024 + 4 * 0.000004, 1e-15);
}

/* Marginal gain at 10 sets: d/dx 100 (e^y - 1) = 100 e^y b f'(x), f'(10) = -1/121, so
 * 100 e^0.231818 * 0.2/121 = 0.20842 % per set; positive with its interval above 0
 * (common practice, no source, for "more sets still help a little at 10"). */
static void test_marginal(void **state)
{
	struct sd_marginal m;
	(void)state;
	curve_marginal(&prof, &untrained10, 10, 0.95, &m);
	double y = 0.25 - 0.2 / 11;
	assert_near(m.pct, 100 * exp(y) * 0.2 / 121, 1e-10);
	assert_true(m.pct > 0);
	assert_true(m.lo > 0);
	assert_true(m.hi > m.pct);
	/* Delta-method variance by hand: g = (pct, pct f + 100 e^y f', 0, 0) with f = 1/11. */
	double f = 1.0 / 11, fp = -1.0 / 121, pct = m.pct;
	double g0 = pct, g1 = pct * f + 100 * exp(y) * fp;
	double var = g0 * g0 * 0.000144 + 2 * g0 * g1 * -0.000144 + g1 * g1 * 0.0004;
	assert_near(m.hi - m.pct, 1.959963985 * sqrt(var), 1e-8);
	/* Finite-difference check of the slope itself. */
	struct sd_point a, b;
	curve_eval(&prof, &untrained10, 10 - 1e-4, 0.95, &a);
	curve_eval(&prof, &untrained10, 10 + 1e-4, 0.95, &b);
	assert_near(m.pct, (curve_pct(b.y) - curve_pct(a.y)) / 2e-4, 1e-6);
}

/* Practical plateau: smallest whole a with no b <= 30 giving 0.2 (1/(a+1) - 1/(b+1)) > ln 1.03;
 * by hand a + 1 > 1 / (0.029559/0.2 + 1/31) = 5.554, so a = 5 (common practice, no source). */
static void test_plateau(void **state)
{
	(void)state;
	assert_near(curve_plateau(&prof, &untrained10, 1.0), 5, 0);
	assert_int_equal(curve_zone(&prof, 5, 0), SD_ZONE_NONE);
	assert_int_equal(curve_zone(&prof, 5, 4.5), SD_ZONE_CLIMB);
	assert_int_equal(curve_zone(&prof, 5, 5), SD_ZONE_PLATEAU);
	assert_int_equal(curve_zone(&prof, 5, 30), SD_ZONE_PLATEAU);
	assert_int_equal(curve_zone(&prof, 5, 30.5), SD_ZONE_BEYOND);
}

/* Returns grid cell: y(b) - y(a) = -0.2 (1/(b+1) - 1/(a+1)), SE = |f(b) - f(a)| * 0.02. */
static void test_delta(void **state)
{
	struct sd_delta d;
	(void)state;
	curve_delta(&prof, &untrained10, 2, 6, 0.95, &d);
	double df = 1.0 / 7 - 1.0 / 3;
	assert_near(d.d, -0.2 * df, 1e-12);
	assert_near(d.se, fabs(df) * 0.02, 1e-12);
	assert_true(d.practical);    /* 0.0381 > 0.0296 */
	assert_true(d.statistical);
	curve_delta(&prof, &untrained10, 10, 12, 0.95, &d);
	assert_false(d.practical);
	assert_true(d.statistical);
}

int main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(test_quantiles),
		cmocka_unit_test(test_pct),
		cmocka_unit_test(test_calibration),
		cmocka_unit_test(test_bands),
		cmocka_unit_test(test_marginal),
		cmocka_unit_test(test_plateau),
		cmocka_unit_test(test_delta),
	};
	return cmocka_run_group_tests_name("curve", tests, load, NULL);
}
