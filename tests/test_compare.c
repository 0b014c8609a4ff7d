/* Program comparison: the difference between two small programs per muscle, its interval, the
 * probability it exceeds the SWC and the verdict, worked by hand with the bundled profile
 * (y = 0.25 - 0.20/(x+1) + ..., SE of the dose coefficient 0.020, SWC ln 1.03). */
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
 * 0.5 each) 1.5 -> 4. By hand, with f(x) = 1/(x+1):
 *   chest    d = -0.20 (1/9 - 1/4) = 1/36 = 0.0277778,  se = 0.020 (1/4 - 1/9) = 1/360
 *            95% CI d -+ 1.959964/360 = [0.0223334, 0.0332221]; as percent 100(e^d - 1):
 *            2.81672%, CI [2.25847%, 3.37801%]
 *            z = (ln 1.03 - 1/36) / (1/360) = 0.641169; P(d > SWC) = 1 - Phi(0.641169).
 *            Normal table (Abramowitz & Stegun 1964, Table 26.1, 4 digits): Phi(0.64) = 0.7389,
 *            Phi(0.65) = 0.7422; interpolated Phi(0.6412) = 0.7393, so P = 0.2607.
 *   triceps  d = -0.20 (1/5 - 1/2.5) = 0.04, se = 0.004, CI [0.03216, 0.04784]: beyond the
 *            SWC (0.029559) and excluding 0. */
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
	assert_near(d.p_gain, 0.2607, 5e-4);
	assert_true(d.p_loss < 1e-12);
	assert_int_equal(d.verdict, CMP_TRIVIAL_GAIN);

	cmp_muscle(&prof, &untrained10, 0.95, aa.row[SD_TRICEPS].dose.fractional,
		   ab.row[SD_TRICEPS].dose.fractional, &d);
	assert_near(d.xa, 1.5, 0);
	assert_near(d.xb, 4, 0);
	assert_near(d.d, 0.04, 1e-12);
	assert_near(d.se, 0.004, 1e-12);
	assert_near(d.lo, 0.04 - 1.959964 * 0.004, 1e-7);
	assert_int_equal(d.verdict, CMP_WORTHWHILE_GAIN);

	/* The other way round: a loss of the same size, and the probabilities swap. */
	cmp_muscle(&prof, &untrained10, 0.95, 8, 3, &d);
	assert_near(d.d, -1.0 / 36, 1e-12);
	assert_near(d.p_loss, 0.2607, 5e-4);
	assert_true(d.p_gain < 1e-12);
	assert_int_equal(d.verdict, CMP_TRIVIAL_LOSS);

	/* Untrained muscles in both: nothing to tell apart. */
	cmp_muscle(&prof, &untrained10, 0.95, aa.row[SD_CALVES].dose.fractional,
		   ab.row[SD_CALVES].dose.fractional, &d);
	assert_near(d.d, 0, 0);
	assert_near(d.p_gain, 0, 0);
	assert_int_equal(d.verdict, CMP_NO_DIFFERENCE);

	audit_free(&aa);
	audit_free(&ab);
	prog_free(&pa);
	prog_free(&pb);
}

/* The heterogeneity cancels and so do the moderators: a trained athlete on a 6-week block
 * gets the same difference as an untrained one on 10 weeks. */
static void context_cancels(void **state)
{
	struct sd_covars other = { 6, 1 };
	struct cmp_diff a, b;
	(void)state;
	cmp_muscle(&prof, &untrained10, 0.95, 3, 8, &a);
	cmp_muscle(&prof, &other, 0.95, 3, 8, &b);
	assert_near(a.d, b.d, 1e-15);
	assert_near(a.se, b.se, 1e-15);
}

/* A vaguer dose coefficient (SE 0.2): the triceps difference of 0.04 is beyond the SWC but
 * its interval includes 0. P(d > SWC) = Phi((0.04 - 0.0295588)/0.04) = Phi(0.26103); table
 * (Abramowitz & Stegun 1964, Table 26.1, 4 digits): Phi(0.26) = 0.6026, Phi(0.27) = 0.6064,
 * interpolated 0.6030. */
static void unsure(void **state)
{
	struct sd_profile vague = prof;
	struct cmp_diff d;
	int n = vague.nterms;
	(void)state;
	vague.vcov[1 * n + 1] = 0.04;
	vague.vcov[0 * n + 1] = vague.vcov[1 * n + 0] = 0;
	cmp_muscle(&vague, &untrained10, 0.95, 1.5, 4, &d);
	assert_near(d.se, 0.04, 1e-12);
	assert_true(d.lo < 0 && d.hi > 0);
	assert_near(d.p_gain, 0.6030, 5e-4);
	assert_int_equal(d.verdict, CMP_UNSURE_GAIN);
}

/* The verdict table, and P(d > t) under Student's t: with d = 0, se = 1 and t = -2.228139,
 * P = 0.975 for 10 degrees of freedom (t table: Fisher & Yates 1963). */
static void verdicts_and_t(void **state)
{
	double swc = 0.03;
	(void)state;
	assert_int_equal(cmp_classify(0.05, 0.01, 0.09, swc), CMP_WORTHWHILE_GAIN);
	assert_int_equal(cmp_classify(0.05, -0.01, 0.11, swc), CMP_UNSURE_GAIN);
	assert_int_equal(cmp_classify(0.02, 0.01, 0.03, swc), CMP_TRIVIAL_GAIN);
	assert_int_equal(cmp_classify(0.01, -0.01, 0.03, swc), CMP_NO_DIFFERENCE);
	assert_int_equal(cmp_classify(-0.02, -0.03, -0.01, swc), CMP_TRIVIAL_LOSS);
	assert_int_equal(cmp_classify(-0.05, -0.11, 0.01, swc), CMP_UNSURE_LOSS);
	assert_int_equal(cmp_classify(-0.05, -0.09, -0.01, swc), CMP_WORTHWHILE_LOSS);
	assert_string_equal(cmp_verdict_name(CMP_WORTHWHILE_GAIN), "worthwhile-gain");
	assert_string_equal(cmp_verdict_text(CMP_NO_DIFFERENCE), "no clear difference");
	assert_near(cmp_prob_above(0, 1, -2.228139, 10), 0.975, 1e-6);
	assert_near(cmp_prob_above(0, 1, -1.959964, 0), 0.975, 1e-6);
	assert_near(cmp_prob_above(0.5, 0, 0.4, 0), 1, 0);
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
		cmocka_unit_test(context_cancels),
		cmocka_unit_test(unsure),
		cmocka_unit_test(verdicts_and_t),
		cmocka_unit_test(pairs_and_totals),
	};
	return cmocka_run_group_tests(tests, setup, teardown);
}
