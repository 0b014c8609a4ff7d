/* Tests of the lnRR effect sizes (core/effects) and of reading effect-size tables
 * (io/effects_io).
 *
 * Outside check values: tests/data/ref/curtis1998_rom.csv (metafor 3.8-1 escalc "ROM" on
 * Curtis & Wang 1998; formula of Hedges, Gurevitch & Curtis 1999) and romc_prepost.csv
 * (escalc "ROMC" on invented rows; formula of Lajeunesse 2011). Both files round yi and vi
 * to 10-14 decimals, so agreement is checked to that rounding. */
#include "testutil.h"

#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "core/effects.h"
#include "io/effects_io.h"

#define REF "tests/data/ref/"

static double num(const struct ef_table *t, int row, const char *col)
{
	struct sd_err e = { 0 };
	double x = 0;   /* fail_msg does not return; clang cannot tell */
	int c = eft_col(t, col);
	if (c < 0 || eft_number(t, row, c, &x, &e))
		fail_msg("column %s row %d: %s", col, row, e.msg);
	return x;
}

static void test_rom_curtis(void **state)
{
	struct ef_table t;
	struct sd_err e = { 0 };
	struct sd_effect ef;
	(void)state;
	assert_int_equal(eft_read(REF "curtis1998_rom.csv", &t, &e), 0);
	assert_int_equal(t.nrow, 102);
	for (int i = 0; i < t.nrow; i++) {
		assert_int_equal(eff_rom(num(&t, i, "m1i"), num(&t, i, "sd1i"), num(&t, i, "n1i"),
					 num(&t, i, "m2i"), num(&t, i, "sd2i"), num(&t, i, "n2i"), &ef,
					 &e), 0);
		assert_near(ef.yi, num(&t, i, "yi"), 1e-9);     /* yi rounded to 10 decimals */
		assert_near(ef.vi, num(&t, i, "vi"), 1e-11);    /* vi rounded to 12 decimals */
	}
	eft_free(&t);
}

static void test_romc(void **state)
{
	struct ef_table t;
	struct sd_err e = { 0 };
	struct sd_effect ef;
	(void)state;
	assert_int_equal(eft_read(REF "romc_prepost.csv", &t, &e), 0);
	assert_int_equal(t.nrow, 5);
	for (int i = 0; i < t.nrow; i++) {
		assert_int_equal(eff_romc(num(&t, i, "m_pre"), num(&t, i, "m_post"),
					  num(&t, i, "sd_pre"), num(&t, i, "sd_post"), num(&t, i, "n"),
					  num(&t, i, "r"), &ef, &e), 0);
		assert_near(ef.yi, num(&t, i, "yi"), 1e-11);    /* 12 decimals */
		assert_near(ef.vi, num(&t, i, "vi"), 1e-13);    /* 14 decimals */
	}
	eft_free(&t);
}

/* Worked by hand from the formula: ln(120/100) and (16^2/120^2 + 15^2/100^2)/10 at r = 0. */
static void test_romc_hand(void **state)
{
	struct sd_effect ef;
	struct sd_err e = { 0 };
	(void)state;
	assert_int_equal(eff_romc(100, 120, 15, 16, 10, 0, &ef, &e), 0);
	assert_near(ef.yi, log(1.2), 1e-15);
	assert_near(ef.vi, (256.0 / 14400 + 225.0 / 10000) / 10, 1e-15);
}

static void test_impossible(void **state)
{
	struct sd_effect ef;
	struct sd_err e = { 0 };
	(void)state;
	assert_int_equal(eff_rom(0, 1, 5, 2, 1, 5, &ef, &e), -1);
	assert_non_null(strstr(e.msg, "non-positive mean m1"));
	assert_int_equal(eff_rom(2, 1, 5, -2, 1, 5, &ef, &e), -1);
	assert_non_null(strstr(e.msg, "non-positive mean m2"));
	assert_int_equal(eff_rom(2, 1, 1, 2, 1, 5, &ef, &e), -1);
	assert_non_null(strstr(e.msg, "needs at least 2"));
	assert_int_equal(eff_rom(2, -1, 5, 2, 1, 5, &ef, &e), -1);
	assert_non_null(strstr(e.msg, "negative standard deviation sd1"));
	assert_int_equal(eff_rom(2, 0, 5, 2, 0, 5, &ef, &e), -1);
	assert_non_null(strstr(e.msg, "sampling variance"));
	assert_int_equal(eff_romc(100, 110, 10, 11, 10, 1.2, &ef, &e), -1);
	assert_non_null(strstr(e.msg, "outside [-1, 1]"));
	assert_int_equal(eff_romc(100, 110, 10, 11, 10, -1.01, &ef, &e), -1);
	assert_int_equal(eff_romc(100, 110, 10, 11, 1, 0.5, &ef, &e), -1);
	/* r = 1 with equal coefficients of variation: zero variance, refused */
	assert_int_equal(eff_romc(100, 110, 10, 11, 10, 1, &ef, &e), -1);
	assert_non_null(strstr(e.msg, "sampling variance"));
}

static int build(const char *text, struct ef_spec *s, struct ef_model *m, struct sd_err *e)
{
	struct ef_table t;
	char *p = tu_write_temp(text);
	int rc = eft_read(p, &t, e);
	if (!rc) {
		rc = ef_model_build(&t, s, m, e);
		if (!rc)
			ef_model_free(m);
		eft_free(&t);
	}
	unlink(p);
	return rc;
}

/* Bad rows are named by line and column. */
static void test_model_errors(void **state)
{
	struct ef_spec s = { .form = SD_FORM_LOG };
	struct ef_model m;
	struct sd_err e = { 0 };
	(void)state;
	assert_int_equal(build("study,sets,yi,vi\na,1,0.1,0.01\na,2,0.1,0\n", &s, &m, &e), -1);
	assert_non_null(strstr(e.msg, "line 3: sampling variance vi = 0"));
	assert_int_equal(build("study,sets,yi,vi\na,1,0.1,0.01\n\nb,2,x,0.01\n", &s, &m, &e), -1);
	assert_non_null(strstr(e.msg, "line 4: column 'yi' is not a number ('x')"));
	assert_int_equal(build("study,sets,yi,vi\na,1,0.1,0.01\nb,-2,0.1,0.01\n", &s, &m, &e), -1);
	assert_non_null(strstr(e.msg, "line 3: dose sets = -2"));
	assert_int_equal(build("study,sets,yi,vi\na,4,0.1,0.01\nb,4,0.2,0.01\n", &s, &m, &e), -1);
	assert_non_null(strstr(e.msg, "every effect is at one dose (4 weekly sets)"));
	assert_int_equal(build("study,sets,yi\na,4,0.1\n", &s, &m, &e), -1);
	assert_non_null(strstr(e.msg, "no variance column 'vi'"));
	s.nmods = 1;
	s.mods[0] = "weeks";
	assert_int_equal(build("study,sets,yi,vi,weeks\na,1,0.1,0.01,\n", &s, &m, &e), -1);
	assert_non_null(strstr(e.msg, "line 2: column 'weeks' is empty"));
	s.mods[0] = "dose";
	assert_int_equal(build("study,sets,yi,vi,dose\na,1,0.1,0.01,1\n", &s, &m, &e), -1);
	assert_int_equal(e.code, SD_EXIT_USAGE);
	assert_int_equal(build("study,sets,yi,study\na,1,0.1,2\n", &s, &m, &e), -1);
	assert_non_null(strstr(e.msg, "column 'study' appears twice"));
	assert_int_equal(build("", &s, &m, &e), -1);
	assert_non_null(strstr(e.msg, "is empty"));
}

/* Study and effect labels become 0.. in order of first appearance; names are kept. */
static void test_model_labels(void **state)
{
	struct ef_spec s = { .form = SD_FORM_RECIPROCAL, .effect = "arm", .nmods = 1,
			     .mods = { "trained" } };
	struct ef_table t;
	struct ef_model m;
	struct sd_err e = { 0 };
	char *p = tu_write_temp("study,arm,sets,yi,vi,trained\nzeta,1,0,0.1,0.01,1\nalpha,1,3,0.2,0.02,0\n"
			    "zeta,2,9,0.3,0.01,1\nalpha,\"2\",1,0.1,0.01,0\n");
	(void)state;
	assert_int_equal(eft_read(p, &t, &e), 0);
	assert_int_equal(ef_model_build(&t, &s, &m, &e), 0);
	assert_int_equal(m.nstudy, 2);
	assert_string_equal(m.study_name[0], "zeta");
	assert_string_equal(m.study_name[1], "alpha");
	assert_int_equal(m.study[0], 0);
	assert_int_equal(m.study[1], 1);
	assert_int_equal(m.study[2], 0);
	assert_int_equal(m.effect[0], 0);
	assert_int_equal(m.effect[1], 0);  /* label "1" in both studies: nested ids separate them */
	assert_int_equal(m.effect[2], 1);
	assert_int_equal(m.effect[3], 1);
	assert_near(m.X[1 * 3 + 1], 0.25, 1e-15);    /* 1/(3+1) */
	assert_near(m.X[2 * 3 + 2], 1, 0);
	assert_near(m.dose_min, 0, 0);
	assert_near(m.dose_max, 9, 0);
	ef_model_set_form(&m, SD_FORM_SQRT);
	assert_near(m.X[2 * 3 + 1], 3, 1e-15);
	assert_int_equal(m.line[3], 5);
	ef_model_free(&m);
	eft_free(&t);
	unlink(p);
}

int main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(test_rom_curtis),
		cmocka_unit_test(test_romc),
		cmocka_unit_test(test_romc_hand),
		cmocka_unit_test(test_impossible),
		cmocka_unit_test(test_model_errors),
		cmocka_unit_test(test_model_labels),
	};
	return cmocka_run_group_tests(tests, NULL, NULL);
}
