/* Program comparison: the difference between two small programs per muscle, its interval and
 * the decision against the SWC, worked by hand with the bundled profile (y = 0.25 - 0.20/(x+1)
 * + ..., SE of the dose coefficient 0.020, SWC ln 1.03). */
#include "testutil.h"

#include <string.h>

#include "core/compare.h"
#include "core/stats.h"
#include "io/library_io.h"
#include "io/profile_io.h"
#include "io/program_io.h"

static struct sd_profile prof;
static struct sd_library lib;
static const struct sd_covars untrained10 = { 10, 0 };

static int setup(void **state)
{
	struct sd_err e;
	(void)state;
	if (profile_load("profiles/strength.ini", &prof, &e) ||
	    library_load_file("profiles/exercises.ini", &lib, &e) || lib_index(&lib, &e)) {
		fprintf(stderr, "%s\n", e.msg);
		return -1;
	}
	return 0;
}

static int teardown(void **state)
{
	(void)state;
	lib_free(&lib);
	return 0;
}

static void audit_text(const char *text, struct sd_program *p, struct sd_audit *a)
{
	struct sd_err e;
	struct sd_audit_opts o = { 0.95, 4, SD_SESSION_CAP };
	assert_int_equal(program_parse("test", text, strlen(text), 0, &lib, p, &e), 0);
	assert_int_equal(audit_run(p, &lib, &prof, &untrained10, &o, a, &e), 0);
}

/* Program A: 3 sets of bench press a week; B: 8. Chest (direct) 3 -> 8, triceps (indirect,
 * 0.5 each) 1.5 -> 4. By hand, untrained 10 weeks (the weeks:dose and trained terms are 0),
 * with f(x) = 1/(x+1):
 *   chest    d = -0.20 (1/9 - 1/4) = 1/36 = 0.0277778,  se = 0.020 (1/4 - 1/9) = 1/360
 *            95% CI d -+ 1.959964/360 = [0.0223334, 0.0332221]; as percent 100(e^d - 1):
 *            2.81672%, CI [2.25847%, 3.37801%]
 *            decision interval (90%): d -+ 1.644854/360 = [0.0232088, 0.0323468]: above 0,
 *            reaching inside the SWC (0.0295588): some-gain
 *   triceps  d = -0.20 (1/5 - 1/2.5) = 0.04, se = 0.004, 90% [0.0334206, 0.0465794]: wholly
 *            above the SWC: clear-gain.
 * Normal quantiles 1.959964 and 1.644854: Abramowitz & Stegun 1964, Table 26.1. */
static void two_programs(void **state)
{
	struct sd_program pa, pb;
	struct sd_audit aa, ab;
	struct cmp_diff d;
	(void)state;

	audit_text("[program]\nname = A\n[day 1]\nbench press = 3\n", &pa, &aa);
	audit_text("[program]\nname = B\n[day 1]\nbench press = 4\n[day 2]\nbench press = 4\n", &pb, &ab);

	cmp_muscle(&prof, &untrained10, 0.95, aa.row[SD_CHEST].dose.fractional,
		   ab.row[SD_CHEST].dose.fractional, &d);
	assert_near(d.xa, 3, 0);
	assert_near(d.xb, 8, 0);
	assert_near(d.d, 1.0 / 36, 1e-12);
	assert_near(d.se, 1.0 / 360, 1e-12);
	assert_near(d.lo, 0.0223334, 1e-7);
	assert_near(d.hi, 0.0332221, 1e-7);
	assert_near(curve_pct(d.d), 2.81672, 1e-5);
	assert_near(curve_pct(d.lo), 2.25847, 1e-5);
	assert_near(curve_pct(d.hi), 3.37801, 1e-5);
	assert_near(d.dlo, 0.0232088, 1e-7);
	assert_near(d.dhi, 0.0323468, 1e-7);
	assert_int_equal(d.decision, CMP_SOME_GAIN);

	cmp_muscle(&prof, &untrained10, 0.95, aa.row[SD_TRICEPS].dose.fractional,
		   ab.row[SD_TRICEPS].dose.fractional, &d);
	assert_near(d.xa, 1.5, 0);
	assert_near(d.xb, 4, 0);
	assert_near(d.d, 0.04, 1e-12);
	assert_near(d.se, 0.004, 1e-12);
	assert_near(d.lo, 0.04 - 1.959964 * 0.004, 1e-7);
	assert_near(d.dlo, 0.0334206, 1e-7);
	assert_int_equal(d.decision, CMP_CLEAR_GAIN);

	/* The other way round: a loss of the same size. */
	cmp_muscle(&prof, &untrained10, 0.95, 8, 3, &d);
	assert_near(d.d, -1.0 / 36, 1e-12);
	assert_int_equal(d.decision, CMP_SOME_LOSS);

	/* Untrained muscles in both: a difference of exactly 0, so equivalent. */
	cmp_muscle(&prof, &untrained10, 0.95, aa.row[SD_CALVES].dose.fractional,
		   ab.row[SD_CALVES].dose.fractional, &d);
	assert_near(d.d, 0, 0);
	assert_int_equal(d.decision, CMP_EQUIVALENT);

	audit_free(&aa);
	audit_free(&ab);
	prog_free(&pa);
	prog_free(&pb);
}

/* Block length and status change the dose slope (the weeks:dose and trained:dose terms), so
 * they no longer cancel in a difference: trained at 8 weeks the slope is -0.105, not -0.2. */
static void context_matters(void **state)
{
	struct sd_covars other = { 8, 1 };
	struct cmp_diff a, b;
	(void)state;
	cmp_muscle(&prof, &untrained10, 0.95, 3, 8, &a);
	cmp_muscle(&prof, &other, 0.95, 3, 8, &b);
	assert_near(a.d, 1.0 / 36, 1e-12);
	assert_near(b.d, -0.105 * (1.0 / 9 - 1.0 / 4), 1e-12);
	/* Its variance: dz = df (0, 1, 0, -2, 0, 1) with df = 1/9 - 1/4 = -5/36 (terms intercept,
	 * dose, weeks, weeks:dose, trained, trained:dose); the dose, weeks:dose and trained:dose
	 * entries are uncorrelated, so df^2 (0.0004 + 4 (0.000004) + 0.0004) by hand. */
	double df = 1.0 / 9 - 1.0 / 4;
	assert_near(b.se * b.se, df * df * (0.0004 + 4 * 0.000004 + 0.0004), 1e-15);
}

/* One athlete at two doses under a profile with random slopes: d = dz'b + u1 (f_B - f_A), so
 * Var(d) = dz'V dz + (f_B - f_A)^2 tau2_slope. Hand computation for chest 3 -> 8, untrained,
 * 10 weeks, tau2_slope = 0.0009: f_B - f_A = 1/9 - 1/4 = -5/36,
 *   dz'V dz = (25/1296) 0.0004 = 0.00000771605,  slope part (25/1296) 0.0009 = 0.0000173611,
 *   se = sqrt(0.0000250772) = 0.00500771, 1.80 times the 1/360 = 0.00277778 without slopes.
 * The intercept variance tau2 and its covariance with the slope cancel (same athlete). */
static void slopes_same_athlete(void **state)
{
	struct sd_profile s = prof;
	struct cmp_diff d;
	(void)state;
	s.slopes = 1;
	s.tau2_slope = 0.0009;
	s.cov_slope = -0.0012;
	cmp_muscle(&s, &untrained10, 0.95, 3, 8, &d);
	assert_near(d.d, 1.0 / 36, 1e-12);
	assert_near(d.se * d.se, 25.0 / 1296 * (0.0004 + 0.0009), 1e-15);
	assert_near(d.se, 0.00500771, 1e-8);
	assert_near(d.lo, 1.0 / 36 - 1.959963985 * 0.00500771, 1e-7);
	/* 90% decision interval [0.0195408, 0.0360148]: above 0, past the SWC: some-gain still,
	 * but the interval is 1.8 times as wide as without slopes. */
	assert_near(d.dlo, 1.0 / 36 - 1.644853627 * 0.00500771, 1e-7);
	assert_int_equal(d.decision, CMP_SOME_GAIN);
}

/* The decision table on constructed decision intervals, SWC 0.03 (Schuirmann 1987; Lakens
 * 2017: equivalence when the 1 - 2 alpha interval lies wholly inside the bounds). */
static void decisions(void **state)
{
	double swc = 0.03;
	(void)state;
	assert_int_equal(cmp_decide(0.04, 0.06, swc), CMP_CLEAR_GAIN);
	assert_int_equal(cmp_decide(-0.06, -0.04, swc), CMP_CLEAR_LOSS);
	assert_int_equal(cmp_decide(-0.01, 0.02, swc), CMP_EQUIVALENT);
	assert_int_equal(cmp_decide(0.005, 0.02, swc), CMP_EQUIVALENT);   /* not 0, but trivial */
	assert_int_equal(cmp_decide(0.01, 0.05, swc), CMP_SOME_GAIN);
	assert_int_equal(cmp_decide(-0.05, -0.01, swc), CMP_SOME_LOSS);
	assert_int_equal(cmp_decide(-0.01, 0.05, swc), CMP_UNCLEAR);
	assert_int_equal(cmp_decide(-0.05, 0.05, swc), CMP_UNCLEAR);
	/* The bounds themselves are outside "inside": equivalence needs both one-sided tests. */
	assert_int_equal(cmp_decide(-0.03, 0.02, swc), CMP_UNCLEAR);
	assert_int_equal(cmp_decide(0.03, 0.05, swc), CMP_SOME_GAIN);
	assert_string_equal(cmp_decision_name(CMP_CLEAR_GAIN), "clear-gain");
	assert_string_equal(cmp_decision_name(CMP_EQUIVALENT), "equivalent");
	assert_near(cmp_decision_level(0.95), 0.90, 1e-12);
	assert_near(cmp_decision_level(0.99), 0.98, 1e-12);
}

/* Equivalence is read from the 90 % interval, not the 95 % one: a linear profile with dose
 * slope 0.01 and SE 0.0025, doses 0 -> 2: d = 0.02, se = 0.005.
 *   95 %: 0.02 -+ 1.959964 (0.005) = [0.0102, 0.0298]: reaches past the SWC 0.0295588
 *   90 %: 0.02 -+ 1.644854 (0.005) = [0.011776, 0.028224]: wholly inside: equivalent.
 * With SE 0.006 the 90 % interval [0.010131, 0.029869] reaches past it: some-gain. */
static void tost_uses_90(void **state)
{
	struct sd_profile s = prof;
	struct cmp_diff d;
	int n = s.nterms;
	(void)state;
	s.form = SD_FORM_LINEAR;
	s.beta[1] = 0.01;
	s.vcov[1 * n + 1] = 0.0025 * 0.0025;
	cmp_muscle(&s, &untrained10, 0.95, 0, 2, &d);
	assert_near(d.d, 0.02, 1e-15);
	assert_near(d.se, 0.005, 1e-15);
	assert_true(d.hi > s.swc);
	assert_near(d.dlo, 0.011776, 1e-6);
	assert_near(d.dhi, 0.028224, 1e-6);
	assert_int_equal(d.decision, CMP_EQUIVALENT);
	s.vcov[1 * n + 1] = 0.003 * 0.003;
	cmp_muscle(&s, &untrained10, 0.95, 0, 2, &d);
	assert_near(d.dhi, 0.029869, 1e-6);
	assert_int_equal(d.decision, CMP_SOME_GAIN);
}

static void pairs_and_totals(void **state)
{
	int pairs[6][2];
	struct sd_program p;
	struct sd_audit a;
	struct cmp_totals t;
	(void)state;

	assert_int_equal(cmp_pairs(4, 0, pairs), 6);
	assert_int_equal(pairs[5][0], 2);
	assert_int_equal(pairs[5][1], 3);
	assert_int_equal(cmp_pairs(4, 1, pairs), 3);
	assert_int_equal(pairs[2][0], 0);
	assert_int_equal(pairs[2][1], 3);
	assert_int_equal(cmp_pairs(2, 0, pairs), 1);

	/* 12 sets of bench press in one day: chest 12 (over a cap of 10), triceps and front
	 * delts 6; the plateau of the bundled profile is 5, so 3 muscles are past it and 13 under
	 * (those at 0 included). */
	audit_text("[day 1]\nbench press = 12\n[day 2]\nlateral raise = 2\n", &p, &a);
	cmp_totals(&a, 10, &t);
	assert_int_equal(t.hard_sets, 14);
	assert_int_equal(t.sessions, 2);
	assert_near(t.sets_per_session, 7, 0);
	assert_int_equal(t.past_plateau, 3);
	assert_int_equal(t.under_plateau, 13);
	assert_int_equal(t.beyond_evidence, 0);
	assert_int_equal(t.over_cap, 1);
	cmp_totals(&a, 12, &t);
	assert_int_equal(t.over_cap, 0);
	audit_free(&a);
	prog_free(&p);
}

int main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(two_programs),
		cmocka_unit_test(context_matters),
		cmocka_unit_test(slopes_same_athlete),
		cmocka_unit_test(decisions),
		cmocka_unit_test(tost_uses_90),
		cmocka_unit_test(pairs_and_totals),
	};
	return cmocka_run_group_tests(tests, setup, teardown);
}
