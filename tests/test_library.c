/* The exercise library: the bundled file's contents and the loader's checks. Run from the top
 * folder (reads profiles/exercises.ini). */
#include "testutil.h"

#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "core/library.h"
#include "io/library_io.h"

static struct sd_library lib;

static int setup(void **state)
{
	(void)state;
	memset(&lib, 0, sizeof lib);
	return tu_bundled_library(&lib);
}

static int teardown(void **state)
{
	(void)state;
	lib_free(&lib);
	return 0;
}

static const struct sd_exercise *ex(const char *name)
{
	int i = lib_find(&lib, name);
	if (i < 0)
		fail_msg("'%s' is not in the library", name);
	return &lib.ex[i];
}

/* Writes text to a temporary file and loads it on top of a copy-free scratch library. */
static int load_text(const char *text, struct sd_library *l, struct sd_err *e)
{
	char path[] = "/tmp/sd_libtest_XXXXXX";
	int fd = mkstemp(path), rc;
	assert_true(fd >= 0);
	assert_int_equal(write(fd, text, strlen(text)), (long)strlen(text));
	close(fd);
	rc = library_load_file(path, l, e);
	unlink(path);
	return rc;
}

/* Every bundled exercise states its fatigue inside the documented range; the scale's anchors
 * (common practice, no source): heavy hinges and squats 2-2.5, barbell multi-joint 1.5,
 * small-muscle isolation below 1. */
static void test_fatigue(void **state)
{
	(void)state;
	for (int i = 0; i < lib.n; i++)
		if (!(lib.ex[i].fatigue >= SD_FATIGUE_MIN && lib.ex[i].fatigue <= SD_FATIGUE_MAX))
			fail_msg("'%s' fatigue %g", lib.ex[i].name, lib.ex[i].fatigue);
	assert_near(ex("deadlift")->fatigue, 2.5, 0);
	assert_near(ex("back squat")->fatigue, 2.25, 0);
	assert_near(ex("bench press")->fatigue, 1.5, 0);
	assert_near(ex("leg extension")->fatigue, 1.0, 0);
	assert_near(ex("lateral raise")->fatigue, 0.75, 0);
	assert_true(ex("front squat")->fatigue > ex("leg press")->fatigue);

	struct sd_library u;
	struct sd_err e;
	memset(&u, 0, sizeof u);
	assert_int_equal(load_text("[sled drag]\ndirect = quads\n[band row]\ndirect = lats\nfatigue = 0.5\n",
				   &u, &e), 0);
	assert_near(u.ex[0].fatigue, 1.0, 0);    /* left out: 1.0 */
	assert_near(u.ex[1].fatigue, 0.5, 0);
	lib_free(&u);
	const char *bad[] = { "0.2", "5.5", "-1", "abc", "1.0x", "nan", "inf", "" };
	for (size_t i = 0; i < sizeof bad / sizeof *bad; i++) {
		char text[128];
		memset(&u, 0, sizeof u);
		snprintf(text, sizeof text, "[x]\ndirect = quads\nfatigue = %s\n", bad[i]);
		if (load_text(text, &u, &e) == 0)
			fail_msg("fatigue '%s' accepted", bad[i]);
		if (!strstr(e.msg, "line 3: fatigue must be a number from 0.25 to 5"))
			fail_msg("message: %s", e.msg);
		lib_free(&u);
	}
}

/* The names a new user types (every one of these was refused before plurals, hyphens and
 * abbreviations folded). */
static void test_everyday_names(void **state)
{
	static const char *const pairs[][2] = {
		{ "pull-ups", "pull-up" }, { "pullups", "pull-up" }, { "Pull Ups", "pull-up" },
		{ "chin-ups", "chin-up" }, { "skull crushers", "skull crusher" },
		{ "lateral raises", "lateral raise" }, { "leg curls", "lying leg curl" },
		{ "calf raises", "standing calf raise" }, { "squats", "back squat" },
		{ "push ups", "push-up" }, { "rdls", "romanian deadlift" },
		{ "romanian deadlifts", "romanian deadlift" }, { "side raises", "lateral raise" },
		{ "hip thrusts", "hip thrust" }, { "face pulls", "face pull" }, { "dips", "dip" },
		{ "RDL", "romanian deadlift" }, { "SLDL", "stiff-leg deadlift" },
		{ "OHP", "overhead press" }, { "DB bench press", "dumbbell bench press" },
		{ "BB row", "barbell row" }, { "BOR", "barbell row" },
		{ "BSS", "bulgarian split squat" }, { "CGBP", "close-grip bench press" },
		{ "SL RDL", "single-leg romanian deadlift" }, { "KB swings", "kettlebell swing" },
		{ "one-arm DB row", "dumbbell row" }, { "farmers walks", "farmer's carry" },
		{ "dumbbell flyes", "dumbbell fly" }, { "bench presses", "bench press" },
		{ "cable crunches", "cable crunch" }, { "inc DB press", "incline dumbbell press" },
		{ "tricep pushdowns", "triceps pushdown" }, { "OHS", "overhead squat" },
		{ "C&J", "clean and jerk" }, { "toes to bar", "hanging leg raise" },
	};
	(void)state;
	for (size_t i = 0; i < sizeof pairs / sizeof *pairs; i++) {
		int k = lib_find(&lib, pairs[i][0]);
		if (k < 0 || strcmp(lib.ex[k].name, pairs[i][1]))
			fail_msg("'%s' -> %s, expected '%s'", pairs[i][0], k < 0 ? "nothing" : lib.ex[k].name,
				 pairs[i][1]);
	}
}

/* Parenthesised variants and ambiguous names. */
static void test_match(void **state)
{
	struct sd_match m;
	(void)state;
	assert_int_equal(lib_match(&lib, "squat (high bar)", &m), SD_MATCH_VARIANT);
	assert_string_equal(lib.ex[m.ex].name, "back squat");
	assert_int_equal(lib_match(&lib, "squat (pause)", &m), SD_MATCH_VARIANT);
	assert_string_equal(lib.ex[m.ex].name, "pause squat");   /* the qualifier names a lift */
	assert_int_equal(lib_match(&lib, "bench press (competition grip)", &m), SD_MATCH_VARIANT);
	assert_string_equal(lib.ex[m.ex].name, "bench press");
	assert_int_equal(lib_match(&lib, "Bench Press", &m), SD_MATCH_EXACT);
	assert_int_equal(lib_match(&lib, "clean", &m), SD_MATCH_AMBIGUOUS);
	assert_int_equal(m.nchoices, 2);
	assert_string_equal(lib.ex[m.choice[0]].name, "power clean");
	assert_string_equal(lib.ex[m.choice[1]].name, "squat clean");
	assert_int_equal(lib_find(&lib, "clean"), -1);
	assert_int_equal(lib_match(&lib, "french press", &m), SD_MATCH_AMBIGUOUS);
	assert_int_equal(lib_match(&lib, "snatch", &m), SD_MATCH_AMBIGUOUS);
	assert_int_equal(lib_match(&lib, "no such lift (at all)", &m), SD_MATCH_NONE);
}

/* Suggestions rank shared words first, then spelling. */
static void test_suggest(void **state)
{
	int idx[3], n;
	(void)state;
	n = lib_suggest(&lib, "squatz", idx, 3);
	assert_int_equal(n, 3);
	for (int i = 0; i < n; i++)
		assert_non_null(strstr(lib.ex[idx[i]].name, "squat"));
	assert_string_equal(lib.ex[idx[0]].name, "back squat");
	n = lib_suggest(&lib, "side raisez", idx, 3);
	assert_string_equal(lib.ex[idx[0]].name, "lateral raise");
	n = lib_suggest(&lib, "cable side raisez", idx, 3);
	assert_string_equal(lib.ex[idx[0]].name, "cable lateral raise");
	n = lib_suggest(&lib, "hammer curlz", idx, 3);
	assert_string_equal(lib.ex[idx[0]].name, "hammer curl");
	assert_int_equal(lib_suggest(&lib, "zzzzzzzzzzzzzz", idx, 3), 0);
}

/* A user library: [aliases] without copying sections, ambiguity resolved by a later file,
 * and the loader's checks, each with its line. */
static void test_user_library(void **state)
{
	struct sd_library u;
	struct sd_err e;
	(void)state;
	memset(&u, 0, sizeof u);
	assert_int_equal(library_load_file("profiles/exercises.ini", &u, &e), 0);
	assert_int_equal(load_text("[aliases]\nthe big three = deadlift\nfrench press = skull crusher\n"
				   "[sled drag]\ngraded = no\ndirect = quads\n", &u, &e), 0);
	assert_int_equal(lib_index(&u, &e), 0);
	assert_string_equal(u.ex[lib_find(&u, "The Big Three")].name, "deadlift");
	assert_string_equal(u.ex[lib_find(&u, "french press")].name, "skull crusher");
	assert_int_equal(u.ex[lib_find(&u, "sled drag")].ungraded, 1);
	assert_int_equal(u.ex[lib_find(&u, "deadlift")].ungraded, 0);
	lib_free(&u);

	static const char *const bad[][2] = {
		{ "[aliases]\nx = no such lift\n", "line 2: alias 'x' names unknown exercise 'no such lift'" },
		{ "[aliases]\nsquat = front squat\n", "line 2: alias 'squat' is already a name of 'back squat'" },
		{ "[aliases]\nx = deadlift\nX = deadlift\n", "line 3: alias 'X' appears twice (first on line 2)" },
		{ "[a b]\ndirect = quads\n[A-B]\ndirect = quads\n", "line 3: section 'A-B' appears twice (first on line 1)" },
		{ "[a]\ndirect = quads\nDirect = glutes\n", "line 3: 'direct' given twice in [a] (first on line 2)" },
		{ "[a]\ndirect = quads\nkind = spaceship\n", "line 3: kind must be barbell" },
		{ "[a]\ndirect = quads\ngraded = maybe\n", "line 3: graded must be yes or no" },
		{ "[a]\ndirect = quads, wings\n", "line 2: unknown muscle 'wings' in direct" },
	};
	for (size_t i = 0; i < sizeof bad / sizeof *bad; i++) {
		memset(&u, 0, sizeof u);
		assert_int_equal(library_load_file("profiles/exercises.ini", &u, &e), 0);
		int rc = load_text(bad[i][0], &u, &e);
		if (!rc)
			rc = lib_index(&u, &e);
		if (!rc || !strstr(e.msg, bad[i][1]))
			fail_msg("case %zu: rc %d, message '%s'", i, rc, rc ? e.msg : "");
		lib_free(&u);
	}
}

/* No fixed buffers: an alias list of any length keeps every alias; a NUL byte is an error with
 * its line, not the silent end of the file. */
static void test_loader_limits(void **state)
{
	struct sd_library u;
	struct sd_err e;
	size_t cap = 64 * 1024, n = 0;
	char *text = malloc(cap);
	(void)state;
	n += (size_t)snprintf(text + n, cap - n, "[long list]\naliases = ");
	for (int i = 0; i < 1000; i++)
		n += (size_t)snprintf(text + n, cap - n, "%sname number %d", i ? ", " : "", i);
	n += (size_t)snprintf(text + n, cap - n, "\ndirect = quads, glutes, hamstrings, adductors, "
			      "calves, abs, lower-back, upper-back, lats, chest, biceps, triceps, "
			      "forearms, front-delts, side-delts, rear-delts\n");
	memset(&u, 0, sizeof u);
	assert_int_equal(load_text(text, &u, &e), 0);
	assert_int_equal(lib_index(&u, &e), 0);
	assert_int_equal(u.ex[0].naliases, 1000);
	assert_int_equal(lib_find(&u, "name number 999"), 0);
	assert_int_equal(u.ex[0].direct, (sd_mset)((1u << SD_NMUSCLES) - 1));
	lib_free(&u);
	free(text);

	char path[] = "/tmp/sd_libnul_XXXXXX";
	static const char nul[] = "[a]\ndirect = quads\n[b]\ndirect = gl\0utes\n[c]\ndirect = abs\n";
	int fd = mkstemp(path);
	assert_int_equal(write(fd, nul, sizeof nul - 1), (long)sizeof nul - 1);
	close(fd);
	memset(&u, 0, sizeof u);
	assert_int_equal(library_load_file(path, &u, &e), -1);
	unlink(path);
	assert_non_null(strstr(e.msg, "line 4: binary data (NUL byte)"));
	lib_free(&u);

	char longname[200];
	memset(longname, 'a', sizeof longname - 1);
	longname[sizeof longname - 1] = '\0';
	char t2[400];
	snprintf(t2, sizeof t2, "[x]\naliases = ok, %s\ndirect = quads\n", longname);
	memset(&u, 0, sizeof u);
	assert_int_equal(load_text(t2, &u, &e), -1);
	assert_non_null(strstr(e.msg, "line 2: alias 'aaaa"));
	assert_non_null(strstr(e.msg, "is longer than 63 bytes"));
	lib_free(&u);
}

/* Coaches' anatomy (see the comments beside each change in profiles/exercises.ini). */
static void test_anatomy(void **state)
{
	(void)state;
#define DIRECT(name, m) assert_true(ex(name)->direct >> (m) & 1)
#define INDIRECT(name, m) assert_true(ex(name)->indirect >> (m) & 1)
#define NEITHER(name, m) assert_false((ex(name)->direct | ex(name)->indirect) >> (m) & 1)
	DIRECT("back squat", SD_ADDUCTORS);
	DIRECT("front squat", SD_ADDUCTORS);
	DIRECT("hack squat", SD_GLUTES);
	DIRECT("good morning", SD_GLUTES);
	DIRECT("rack pull", SD_GLUTES);
	DIRECT("romanian deadlift", SD_GLUTES);
	DIRECT("dumbbell pullover", SD_CHEST);
	NEITHER("chest-supported row", SD_LOWER_BACK);
	NEITHER("chest-supported t-bar row", SD_LOWER_BACK);
	NEITHER("seal row", SD_LOWER_BACK);
	INDIRECT("t-bar row", SD_LOWER_BACK);
	assert_int_equal(ex("power clean")->ungraded, 1);
	assert_int_equal(ex("farmer's carry")->ungraded, 1);
	assert_int_equal(ex("sled push")->ungraded, 1);
	assert_int_equal(ex("back squat")->ungraded, 0);
	static const char *const added[] = { "push jerk", "split jerk", "clean and jerk",
		"squat clean", "overhead squat", "deficit deadlift", "snatch-grip deadlift",
		"pause squat", "pin press", "board press", "meadows row", "kroc row",
		"single-leg hip thrust", "reverse nordic", "smith machine overhead press",
		"seated overhead press", "high pull", "hip extension machine", "bayesian curl",
		"drag curl", "zottman curl", "cable hammer curl", "squat snatch" };
	for (size_t i = 0; i < sizeof added / sizeof *added; i++)
		ex(added[i]);
}

int main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(test_fatigue),
		cmocka_unit_test(test_everyday_names),
		cmocka_unit_test(test_match),
		cmocka_unit_test(test_suggest),
		cmocka_unit_test(test_user_library),
		cmocka_unit_test(test_loader_limits),
		cmocka_unit_test(test_anatomy),
	};
	return cmocka_run_group_tests_name("library", tests, setup, teardown);
}
