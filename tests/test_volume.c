/* Fractional set counting and program parsing, worked by hand on small programs. Counting rule:
 * a direct set counts 1 for each prime mover, an indirect set 0.5 for each synergist (the
 * fractional method of the strength-volume meta-regression literature). */
#include "testutil.h"

#include <stdlib.h>
#include <string.h>

#include "core/volume.h"
#include "io/program_io.h"

static struct sd_library lib;

static void put(const char *name, const char *alias, sd_mset direct, sd_mset indirect)
{
	struct sd_exercise x;
	struct sd_err e;
	memset(&x, 0, sizeof x);
	snprintf(x.name, sizeof x.name, "%s", name);
	if (alias) {
		x.aliases = malloc(sizeof *x.aliases);
		x.aliases[0] = strdup(alias);
		x.naliases = 1;
	}
	x.direct = direct;
	x.indirect = indirect;
	assert_int_equal(lib_put(&lib, &x, &e), 0);
}

#define M(m) ((sd_mset)1 << (m))

static int setup(void **state)
{
	struct sd_err e;
	(void)state;
	memset(&lib, 0, sizeof lib);
	put("bench press", "flat bench", M(SD_CHEST), M(SD_TRICEPS) | M(SD_FRONT_DELTS));
	put("triceps pushdown", NULL, M(SD_TRICEPS), 0);
	put("back squat", NULL, M(SD_QUADS) | M(SD_GLUTES), M(SD_ADDUCTORS));
	put("barbell row", NULL, M(SD_UPPER_BACK) | M(SD_LATS), M(SD_BICEPS) | M(SD_REAR_DELTS));
	return lib_index(&lib, &e);
}

static int teardown(void **state)
{
	(void)state;
	lib_free(&lib);
	return 0;
}

static int parse(const char *text, struct sd_program *p, struct sd_err *e)
{
	return program_parse("t.ini", text, strlen(text), 0, &lib, p, e);
}

/* Day 1: bench 3 sets @2, pushdown 2 sets; day 2: bench 4 @1, squat 5, row 3 @5 (easy).
 * chest: 3 + 4 = 7 direct -> 7. triceps: 2 direct + 7 indirect -> 2 + 3.5 = 5.5.
 * front-delts: 7 indirect -> 3.5. quads, glutes: 5. adductors: 2.5. Row not counted (RIR 5 > 4). */
static void test_count(void **state)
{
	const char *text =
		"[program]\nname = hand\nweeks = 8\n"
		"[day one]\nbench press = 3x5 @2\ntriceps pushdown = 2\n"
		"[day two]\nFlat-Bench = 4x3 @1 ; alias, odd case\nback squat = 5x5\nbarbell row = 3x10 @5\n";
	struct sd_program p;
	struct sd_volume v;
	struct sd_err e;
	(void)state;
	assert_int_equal(parse(text, &p, &e), 0);
	assert_string_equal(p.name, "hand");
	assert_int_equal(p.weeks, 8);
	assert_int_equal(p.ndays, 2);
	assert_int_equal(vol_count(&p, &lib, 1.0, 0.5, 4, &v, &e), 0);
	assert_near(v.m[SD_CHEST].fractional, 7, 1e-12);
	assert_near(v.m[SD_CHEST].direct, 7, 1e-12);
	assert_near(v.m[SD_TRICEPS].direct, 2, 1e-12);
	assert_near(v.m[SD_TRICEPS].indirect, 7, 1e-12);
	assert_near(v.m[SD_TRICEPS].fractional, 5.5, 1e-12);
	assert_near(v.m[SD_FRONT_DELTS].fractional, 3.5, 1e-12);
	assert_near(v.m[SD_QUADS].fractional, 5, 1e-12);
	assert_near(v.m[SD_ADDUCTORS].fractional, 2.5, 1e-12);
	assert_near(v.m[SD_LATS].fractional, 0, 0);
	assert_near(v.m[SD_LATS].easy, 3, 0);
	/* per session: triceps 2 + 1.5 on day one, 2 on day two */
	assert_near(vol_day(&v, 0, SD_TRICEPS), 3.5, 1e-12);
	assert_near(vol_day(&v, 1, SD_TRICEPS), 2.0, 1e-12);
	assert_near(v.m[SD_TRICEPS].max_session, 3.5, 1e-12);
	assert_int_equal(v.m[SD_TRICEPS].sessions, 2);
	assert_int_equal(v.m[SD_QUADS].sessions, 1);
	assert_int_equal(v.hard_sets, 3 + 2 + 4 + 5);
	assert_int_equal(v.easy_sets, 3);
	assert_int_equal(v.unknown_rir, 2 + 5);
	/* A stricter limit (RIR <= 1) drops the @2 bench sets: chest 4. */
	vol_free(&v);
	assert_int_equal(vol_count(&p, &lib, 1.0, 0.5, 1, &v, &e), 0);
	assert_near(v.m[SD_CHEST].fractional, 4, 1e-12);
	vol_free(&v);
	prog_free(&p);
}

static void test_sets_syntax(void **state)
{
	struct sd_err e;
	int s, r, rir;
	(void)state;
	assert_int_equal(prog_parse_sets("4", &s, &r, &rir, &e), 0);
	assert_int_equal(s, 4); assert_int_equal(r, 0); assert_int_equal(rir, -1);
	assert_int_equal(prog_parse_sets("3x8", &s, &r, &rir, &e), 0);
	assert_int_equal(s, 3); assert_int_equal(r, 8);
	assert_int_equal(prog_parse_sets(" 3 x 8 @2 ", &s, &r, &rir, &e), 0);
	assert_int_equal(rir, 2);
	assert_int_equal(prog_parse_sets("5@0", &s, &r, &rir, &e), 0);
	assert_int_equal(rir, 0);
	const char *bad[] = { "", "x8", "3x", "3x8@", "3x8 @11", "-2", "0", "10000", "101",
			      "3x8 @-1", "3.5", "3x8 @2 extra", "99999999999999" };
	for (size_t i = 0; i < sizeof bad / sizeof *bad; i++)
		if (prog_parse_sets(bad[i], &s, &r, &rir, &e) == 0)
			fail_msg("'%s' accepted", bad[i]);
}

static void expect_error(const char *text, const char *needle)
{
	struct sd_program p;
	struct sd_err e;
	sd_err_clear(&e);
	if (parse(text, &p, &e) == 0)
		fail_msg("accepted: %s", text);
	if (!strstr(e.msg, needle))
		fail_msg("message '%s' lacks '%s'", e.msg, needle);
}

static void test_errors(void **state)
{
	(void)state;
	expect_error("[a]\nbench pres = 3\n", "line 2: unknown exercise 'bench pres' (did you mean 'bench press'");
	expect_error("[a]\nbench press = 3\nbench press = 2\n", "line 3: 'bench press' appears twice in 'a' (first on line 2)");
	expect_error("[a]\nbench press = 3\nflat bench = 2\n", "appears twice");
	expect_error("[a]\nbench press = 10000\n", "line 2: absurd set count");
	expect_error("[a]\nbench press = -3\n", "negative set count");
	expect_error("[a]\nbench press = 3x8 @12\n", "RIR out of range");
	expect_error("[a]\nbench press = three\n", "bad set syntax");
	expect_error("; nothing\n", "no exercises (empty program)");
	expect_error("bench press = 3\n", "line 1: 'bench press' comes before any [day] section");
	expect_error("[program]\nweeks = 0\n[a]\nbench press = 3\n", "line 2: weeks must be");
	expect_error("[program]\ncolour = red\n[a]\nbench press = 3\n", "unknown key 'colour'");
	expect_error("[a]\nbench press = 3\n[A]\nback squat = 3\n", "day 'A' appears twice");
	expect_error("[a\nbench press = 3\n", "line 1: bad section header");
	expect_error("[a]\nbench press 3\n", "line 2: expected 'name = value'");
}

/* The same exercise on two different days is fine; the same day twice is not. */
static void test_same_exercise_two_days(void **state)
{
	struct sd_program p;
	struct sd_err e;
	(void)state;
	assert_int_equal(parse("[a]\nbench press = 3\n[b]\nbench press = 2\n", &p, &e), 0);
	assert_int_equal(p.nentries, 2);
	prog_free(&p);
}

static void test_csv(void **state)
{
	const char *text = "day,exercise,sets,reps,rir\r\n"
			   "mon,bench press,3,5,2\r\nmon,\"triceps pushdown\",2,,\r\n"
			   "thu,flat bench,4,3,1\r\nthu,back squat,5,5,\r\n";
	struct sd_program p;
	struct sd_volume v;
	struct sd_err e;
	(void)state;
	assert_int_equal(program_parse("t.csv", text, strlen(text), 1, &lib, &p, &e), 0);
	assert_int_equal(p.ndays, 2);
	assert_int_equal(p.nentries, 4);
	assert_int_equal(vol_count(&p, &lib, 1.0, 0.5, 4, &v, &e), 0);
	assert_near(v.m[SD_CHEST].fractional, 7, 1e-12);
	assert_near(v.m[SD_TRICEPS].fractional, 5.5, 1e-12);
	vol_free(&v);
	prog_free(&p);
	const char *bad = "day,exercise,sets\nmon,bench press,3\nmon,bench press,2\n";
	assert_int_equal(program_parse("b.csv", bad, strlen(bad), 1, &lib, &p, &e), -1);
	assert_non_null(strstr(e.msg, "line 3"));
	const char *bad2 = "day,exercise,sets\nmon,bench press,abc\n";
	assert_int_equal(program_parse("b.csv", bad2, strlen(bad2), 1, &lib, &p, &e), -1);
	assert_non_null(strstr(e.msg, "'b.csv' line 2: sets must be"));
	/* A UTF-8 byte-order mark (spreadsheet export) is not part of the header. */
	const char *bom = "\xEF\xBB\xBF" "day,exercise,sets\nmon,bench press,3\n";
	assert_int_equal(program_parse("bom.csv", bom, strlen(bom), 1, &lib, &p, &e), 0);
	assert_int_equal(p.nentries, 1);
	prog_free(&p);
	const char *bad3 = "exercise,sets\nbench press,3\n";
	assert_int_equal(program_parse("b.csv", bad3, strlen(bad3), 1, &lib, &p, &e), -1);
	assert_non_null(strstr(e.msg, "header"));
}

static void test_suggest(void **state)
{
	int idx[3];
	(void)state;
	int n = lib_suggest(&lib, "bench pres", idx, 3);
	assert_true(n >= 1);
	assert_string_equal(lib.ex[idx[0]].name, "bench press");
	assert_int_equal(lib_suggest(&lib, "zzzzzzzzzzzzzz", idx, 3), 0);
	assert_int_equal(lib_find(&lib, "BACK_SQUAT"), 2);
	assert_int_equal(lib_find(&lib, "back-squat"), 2);
	assert_int_equal(lib_find(&lib, "squat"), -1);
}

int main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(test_count),
		cmocka_unit_test(test_sets_syntax),
		cmocka_unit_test(test_errors),
		cmocka_unit_test(test_same_exercise_two_days),
		cmocka_unit_test(test_csv),
		cmocka_unit_test(test_suggest),
	};
	return cmocka_run_group_tests_name("volume", tests, setup, teardown);
}
