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

/* Asserts |a - b| <= tol, printing both values when it fails. */
#define assert_near(a, b, tol) do { \
	double a_ = (a), b_ = (b), t_ = (tol); \
	if (!(fabs(a_ - b_) <= t_)) \
		fail_msg("%s = %.10g, expected %.10g (tolerance %g)", #a, a_, b_, t_); \
} while (0)

#endif
