/* Response to training: observed percentile and the shrunken personal response, checked on a
 * worked example computed by hand (the arithmetic is in the comments) and again by a second
 * method (sequential conjugate updating, one observation at a time). */
#include "testutil.h"

#include <string.h>

#include "core/response.h"

/* Two blocks of one athlete, test error t = 0.03, prior SD tau = 0.05, 95 % intervals.
 *   block 1: obs 0.10, predicted 0.05, sp 0.04: s1^2 = 0.04^2 + 2 (0.03)^2 = 0.0034
 *            d1 = 0.05, z1 = 0.05 / sqrt(0.0034) = 0.05 / 0.0583095 = 0.857493
 *            Phi(0.857493) = 0.804414 (normal table: Phi(0.85) = 0.8023, Phi(0.86) = 0.8051,
 *            interpolated 0.8044; Abramowitz & Stegun 1964, table 26.1)
 *   block 2: obs 0.02, predicted 0.06, sp 0.05: s2^2 = 0.0025 + 0.0018 = 0.0043
 *            d2 = -0.04, z2 = -0.04 / 0.0655744 = -0.609994
 *            Phi(-0.609994) = 0.270933 (table: Phi(-0.61) = 0.2709)
 *   prior precision 1/tau^2 = 400
 *   sum 1/s^2   = 1/0.0034 + 1/0.0043 = 294.117647 + 232.558140 = 526.675787
 *   sum d/s^2   = 0.05/0.0034 - 0.04/0.0043 = 14.705882 - 9.302326 = 5.403557
 *   mean        = 5.403557 / (400 + 526.675787) = 5.403557 / 926.675787 = 0.00583112
 *   sd          = 1 / sqrt(926.675787) = 0.0328501
 *   interval    = 0.00583112 -+ 1.959964 x 0.0328501 = [-0.0585538, 0.0702160]
 *   unshrunken  = 5.403557 / 526.675787 = 0.0102597, se 1/sqrt(526.675787) = 0.0435741
 *   weight      = 526.675787 / 926.675787 = 0.568350 */
static const struct resp_obs ex[2] = { { 0.10, 0.05, 0.04 }, { 0.02, 0.06, 0.05 } };
static const struct resp_opts opt = { 0.03, 0.05, 0.95 };

static void worked_percentiles(void **state)
{
	struct resp_fit f;
	(void)state;
	resp_observe(&ex[0], &opt, &f);
	assert_near(f.dev, 0.05, 1e-15);
	assert_near(f.sd, 0.0583095189, 1e-9);
	assert_near(f.z, 0.857493, 1e-6);
	assert_near(f.pctile, 80.4414, 1e-3);
	assert_near(f.pctile, 80.44, 0.01);   /* normal table value, interpolated */
	assert_near(f.lo, 0.05 - 1.959964 * 0.0583095, 1e-6);
	assert_near(f.hi, 0.164285, 1e-6);
	resp_observe(&ex[1], &opt, &f);
	assert_near(f.z, -0.609994, 1e-6);
	assert_near(f.pctile, 27.0933, 1e-3);
}

static void worked_personal(void **state)
{
	struct resp_personal p;
	(void)state;
	assert_int_equal(resp_personal(ex, 2, &opt, &p, NULL), 0);
	assert_int_equal(p.n, 2);
	assert_near(p.mean, 0.00583112, 1e-8);
	assert_near(p.sd, 0.0328501, 1e-7);
	assert_near(p.lo, -0.0585538, 1e-7);
	assert_near(p.hi, 0.0702160, 1e-7);
	assert_near(p.raw, 0.0102597, 1e-7);
	assert_near(p.raw_se, 0.0435741, 1e-7);
	assert_near(p.weight, 0.568350, 1e-6);
}

/* Second method: start from the prior N(0, tau^2) and fold in one observation at a time with
 * the one-observation normal update; the result must equal the closed form. */
static void sequential_update_agrees(void **state)
{
	struct resp_obs o[5] = { { 0.12, 0.05, 0.03 }, { 0.01, 0.07, 0.06 }, { 0.09, 0.04, 0.02 },
				 { 0.15, 0.08, 0.05 }, { -0.02, 0.03, 0.04 } };
	struct resp_opts op = { 0.025, 0.07, 0.90 };
	struct resp_personal p;
	double m = 0, v = 0.07 * 0.07;
	(void)state;
	for (int k = 0; k < 5; k++) {
		double s2 = o[k].sp * o[k].sp + 2 * 0.025 * 0.025;
		double d = o[k].obs - o[k].yhat;
		double gain = v / (v + s2);         /* Kalman gain of one scalar observation */
		m += gain * (d - m);
		v *= 1 - gain;
	}
	assert_int_equal(resp_personal(o, 5, &op, &p, NULL), 0);
	assert_near(p.mean, m, 1e-12);
	assert_near(p.sd, sqrt(v), 1e-12);
	assert_near(p.hi - p.mean, 1.644854 * sqrt(v), 1e-6);
}

static void shrinks_with_little_data(void **state)
{
	struct resp_personal p;
	struct resp_obs noisy = { 0.30, 0.05, 0.50 };
	struct resp_obs many[200];
	(void)state;
	/* No data: the prior itself. */
	assert_int_equal(resp_personal(NULL, 0, &opt, &p, NULL), 0);
	assert_near(p.mean, 0, 0);
	assert_near(p.sd, 0.05, 1e-15);
	assert_near(p.weight, 0, 0);
	/* One very noisy observation of a large deviation barely moves it. */
	assert_int_equal(resp_personal(&noisy, 1, &opt, &p, NULL), 0);
	assert_true(p.mean > 0 && p.mean < 0.01 * 0.25 + 0.0025);
	assert_near(p.raw, 0.25, 1e-12);
	/* Many precise observations of +0.04: the estimate approaches the raw mean. */
	for (int k = 0; k < 200; k++)
		many[k] = (struct resp_obs){ 0.09, 0.05, 0.01 };
	assert_int_equal(resp_personal(many, 200, &opt, &p, NULL), 0);
	assert_near(p.mean, 0.04, 0.001);
	assert_true(p.weight > 0.97);
}

static void bad_options(void **state)
{
	struct resp_personal p;
	struct sd_err e = { 0 };
	struct resp_opts o = opt;
	(void)state;
	o.prior_sd = 0;
	assert_int_equal(resp_personal(ex, 2, &o, &p, &e), -1);
	assert_non_null(strstr(e.msg, "prior"));
	o = opt;
	o.test_sd = -0.01;
	assert_int_equal(resp_check_opts(&o, &e), -1);
	o = opt;
	o.level = 1;
	assert_int_equal(resp_check_opts(&o, &e), -1);
	o = opt;
	o.test_sd = 0;   /* no test error is allowed */
	assert_int_equal(resp_check_opts(&o, &e), 0);
}

int main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(worked_percentiles),
		cmocka_unit_test(worked_personal),
		cmocka_unit_test(sequential_update_agrees),
		cmocka_unit_test(shrinks_with_little_data),
		cmocka_unit_test(bad_options),
	};
	return cmocka_run_group_tests(tests, NULL, NULL);
}
