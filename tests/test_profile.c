/* Profile files: the bundled calibration loads as documented, a written profile loads back
 * equal, and broken profiles are refused with a message naming the problem. */
#include "testutil.h"

#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "io/profile_io.h"

static char *write_temp(const char *text)
{
	static char path[64];
	snprintf(path, sizeof path, "/tmp/sdprofXXXXXX");
	int fd = mkstemp(path);
	assert_true(fd >= 0);
	assert_int_equal(write(fd, text, strlen(text)), (ssize_t)strlen(text));
	close(fd);
	return path;
}

/* The calibration values: SEs 0.012, 0.020 (corr -0.6), 0.002, 0.012; tau2 0.0025,
 * sigma2 0.001; range 0-30; SWC ln 1.03 (values from memory, as the profile says). */
static void test_bundled(void **state)
{
	struct sd_profile p;
	struct sd_err e;
	(void)state;
	assert_int_equal(profile_load("profiles/strength.ini", &p, &e), 0);
	assert_int_equal(p.form, SD_FORM_RECIPROCAL);
	assert_int_equal(p.nterms, 4);
	assert_string_equal(p.term[2], "weeks");
	assert_near(p.beta[0], 0.25, 0);
	assert_near(p.beta[1], -0.20, 0);
	assert_near(sqrt(p.vcov[0]), 0.012, 1e-12);
	assert_near(sqrt(p.vcov[5]), 0.020, 1e-12);
	assert_near(p.vcov[1] / (0.012 * 0.020), -0.6, 1e-12);
	assert_near(sqrt(p.vcov[10]), 0.002, 1e-12);
	assert_near(sqrt(p.vcov[15]), 0.012, 1e-12);
	assert_near(p.centre[2], 10, 0);
	assert_near(p.tau2, 0.0025, 0);
	assert_near(p.sigma2, 0.001, 0);
	assert_near(p.swc, log(1.03), 1e-12);
	assert_near(p.dose_max, 30, 0);
	assert_near(p.w_indirect, 0.5, 0);
	assert_non_null(strstr(p.provenance, "not fitted to study data"));
}

static void test_roundtrip(void **state)
{
	struct sd_profile p, q;
	struct sd_err e;
	char path[] = "/tmp/sdrtXXXXXX";
	(void)state;
	assert_int_equal(profile_load("profiles/strength.ini", &p, &e), 0);
	p.slopes = 1;
	p.tau2_slope = 0.0004;
	p.cov_slope = 0.0002;
	snprintf(p.provenance, sizeof p.provenance, "line one; with \"quotes\"\nline two");
	int fd = mkstemp(path);
	FILE *f = fdopen(fd, "w");
	assert_int_equal(profile_write(f, &p, &e), 0);
	fclose(f);
	assert_int_equal(profile_load(path, &q, &e), 0);
	unlink(path);
	assert_int_equal(q.nterms, p.nterms);
	for (int i = 0; i < p.nterms; i++) {
		assert_string_equal(q.term[i], p.term[i]);
		assert_near(q.beta[i], p.beta[i], 1e-12);
		assert_near(q.centre[i], p.centre[i], 1e-12);
	}
	for (int i = 0; i < p.nterms * p.nterms; i++)
		assert_near(q.vcov[i], p.vcov[i], 1e-15);
	assert_int_equal(q.slopes, 1);
	assert_near(q.tau2_slope, 0.0004, 1e-15);
	assert_near(q.cov_slope, 0.0002, 1e-15);
	assert_near(q.swc, p.swc, 1e-13);
	assert_string_equal(q.provenance, "line one; with 'quotes'\nline two");
}

static const char base[] =
	"[profile]\nname = t\nform = reciprocal\ndose_min = 0\ndose_max = 30\n"
	"[terms]\nnames = intercept, dose\nbeta = 0.25, -0.2\n"
	"[covariance]\nintercept = 0.000144, -0.000144\ndose = -0.000144, 0.0004\n"
	"[heterogeneity]\ntau2 = 0.0025\n";

static void expect_bad(const char *from, const char *to, const char *needle)
{
	struct sd_profile p;
	struct sd_err e;
	char text[2048];
	const char *at = strstr(base, from);
	assert_non_null(at);
	snprintf(text, sizeof text, "%.*s%s%s", (int)(at - base), base, to, at + strlen(from));
	char *path = write_temp(text);
	int rc = profile_load(path, &p, &e);
	unlink(path);
	if (rc == 0)
		fail_msg("accepted with '%s' -> '%s'", from, to);
	if (!strstr(e.msg, needle))
		fail_msg("message '%s' lacks '%s'", e.msg, needle);
}

static void test_bad(void **state)
{
	struct sd_profile p;
	struct sd_err e;
	(void)state;
	char *path = write_temp(base);
	assert_int_equal(profile_load(path, &p, &e), 0);
	unlink(path);
	expect_bad("dose = -0.000144, 0.0004", "dose = -0.000144, 0.0001", "not positive definite");
	expect_bad("dose = -0.000144, 0.0004", "dose = -0.000100, 0.0004", "not symmetric");
	expect_bad("beta = 0.25, -0.2", "beta = 0.25", "missing coefficient");
	expect_bad("beta = 0.25, -0.2", "beta = 0.25, abc", "beta needs 2 numbers");
	expect_bad("form = reciprocal", "form = cubic", "form must be");
	expect_bad("tau2 = 0.0025", "tau2 = -1", "non-negative");
	expect_bad("tau2 = 0.0025", "", "missing 'heterogeneity:tau2'");
	expect_bad("dose_max = 30", "dose_max = x", "not a number");
	expect_bad("dose = -0.000144, 0.0004\n", "", "missing covariance row 'dose'");
	expect_bad("names = intercept, dose", "names = dose, intercept", "first two terms");
	assert_int_equal(profile_load("/nonexistent/p.ini", &p, &e), -1);
	assert_non_null(strstr(e.msg, "cannot read profile '/nonexistent/p.ini'"));
}

int main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(test_bundled),
		cmocka_unit_test(test_roundtrip),
		cmocka_unit_test(test_bad),
	};
	return cmocka_run_group_tests_name("profile", tests, NULL, NULL);
}
