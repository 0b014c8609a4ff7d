/* Shared includes and helpers for the cmocka unit tests. */
#ifndef SD_TESTUTIL_H
#define SD_TESTUTIL_H

#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>
#include <stdint.h>
#include <cmocka.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "io/library_io.h"

/* Asserts |a - b| <= tol, printing both values when it fails. */
#define assert_near(a, b, tol) do { \
	double a_ = (a), b_ = (b), t_ = (tol); \
	if (!(fabs(a_ - b_) <= t_)) \
		fail_msg("%s = %.10g, expected %.10g (tolerance %g)", #a, a_, b_, t_); \
} while (0)

/* Loads and indexes the bundled exercise library into lib (tests run from the top folder);
 * 0, or -1 after printing why. */
static inline int tu_bundled_library(struct sd_library *lib)
{
	struct sd_err e;
	if (library_load_file("profiles/exercises.ini", lib, &e) || lib_index(lib, &e)) {
		fprintf(stderr, "%s\n", e.msg);
		return -1;
	}
	return 0;
}

/* Writes text to a new temporary file and returns its path (static storage: one at a time;
 * the caller unlinks it). */
static inline char *tu_write_temp(const char *text)
{
	static char path[64];
	int fd;

	snprintf(path, sizeof path, "/tmp/sd_test_XXXXXX");
	fd = mkstemp(path);
	assert_true(fd >= 0);
	assert_int_equal(write(fd, text, strlen(text)), (ssize_t)strlen(text));
	close(fd);
	return path;
}

#endif
