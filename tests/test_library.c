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
	struct sd_err e;
	(void)state;
	memset(&lib, 0, sizeof lib);
	if (library_load_file("profiles/exercises.ini", &lib, &e) || lib_index(&lib, &e)) {
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

int main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(test_fatigue),
	};
	return cmocka_run_group_tests_name("library", tests, setup, teardown);
}
