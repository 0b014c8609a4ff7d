/* Profile files: the bundled calibration loads as documented, a written profile loads back
 * equal, and broken profiles are refused with a message naming the line and the problem:
 * values outside their documented range, repeated sections and keys, over-long text. */
#include "testutil.h"

#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "io/profile_io.h"

/* The calibration values (from memory, as the profile says): SEs 0.012, 0.020 (corr -0.6),
 * 0.002, 0.012; tau2 0.0025, sigma2 0.001; between-athlete variance 0.0064; ranges 0-30 sets,
 * 4-24 weeks; SWC ln 1.03. */
static void test_bundled(void **state)
{
	struct sd_profile p;
	struct sd_err e;
	(void)state;
	assert_int_equal(profile_load("profiles/strength.ini", &p, &e), 0);
	assert_int_equal(p.form, SD_FORM_RECIPROCAL);
	assert_int_equal(p.nterms, 6);
	assert_string_equal(p.term[2], "weeks");
	assert_string_equal(p.term[5], "trained:dose");
	assert_near(p.beta[0], 0.25, 0);
	assert_near(p.beta[1], -0.20, 0);
	assert_near(p.beta[4], -0.125, 0);
	assert_near(sqrt(p.vcov[0]), 0.012, 1e-12);
	assert_near(sqrt(p.vcov[7]), 0.020, 1e-12);
	assert_near(p.vcov[1] / (0.012 * 0.020), -0.6, 1e-12);
	assert_near(sqrt(p.vcov[14]), 0.002, 1e-12);
	assert_near(p.centre[2], 10, 0);
	assert_near(p.centre[3], 10, 0);
	assert_near(p.tau2, 0.0025, 0);
	assert_near(p.sigma2, 0.001, 0);
	assert_near(p.athlete_var, 0.0064, 0);
	assert_non_null(strstr(p.athlete_source, "from memory"));
	assert_near(p.swc, log(1.03), 1e-12);
	assert_near(p.dose_max, 30, 0);
	assert_near(p.w_indirect, 0.5, 0);
	assert_int_equal(p.nranges, 2);
	assert_near(profile_range(&p, "weeks")->lo, 4, 0);
	assert_near(profile_range(&p, "weeks")->hi, 24, 0);
	assert_int_equal(p.basis, SD_BASIS_CALIBRATED);
	assert_non_null(strstr(p.provenance, "not fitted to study data"));
	char line[300];
	profile_oneline(&p, line, sizeof line);
	assert_string_equal(line, "profile 'strength-default' (calibrated): calibrated from memory of "
			    "the strength-volume literature, not fitted to study data");
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
	p.basis = SD_BASIS_FITTED;
	snprintf(p.provenance, sizeof p.provenance, "line one; with \"quotes\"\nline two");
	int fd = mkstemp(path);
	FILE *f = fdopen(fd, "w");
	assert_int_equal(profile_write(f, &p, &e), 0);
	fclose(f);
	if (profile_load(path, &q, &e))
		fail_msg("%s", e.msg);
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
	assert_near(q.athlete_var, p.athlete_var, 0);
	assert_string_equal(q.athlete_source, p.athlete_source);
	assert_int_equal(q.basis, SD_BASIS_FITTED);
	assert_string_equal(q.summary, p.summary);
	assert_int_equal(q.nranges, 2);
	assert_string_equal(q.range[1].var, "trained");
	assert_string_equal(q.provenance, "line one; with 'quotes'\nline two");
}

static const char base[] =
	"[profile]\nname = t\nform = reciprocal\ndose_min = 0\ndose_max = 30\n"      /* 1-5 */
	"[terms]\nnames = intercept, dose\nbeta = 0.25, -0.2\n"                       /* 6-8 */
	"[covariance]\nintercept = 0.000144, -0.000144\ndose = -0.000144, 0.0004\n"   /* 9-11 */
	"[heterogeneity]\ntau2 = 0.0025\nathlete = 0.0064\nathlete_source = x\n"      /* 12-15 */
	"[provenance]\nbasis = calibrated\nsummary = s\n";                            /* 16-18 */

static void expect_bad(const char *from, const char *to, const char *needle)
{
	struct sd_profile p;
	struct sd_err e;
	char text[2048];
	const char *at = strstr(base, from);
	assert_non_null(at);
	snprintf(text, sizeof text, "%.*s%s%s", (int)(at - base), base, to, at + strlen(from));
	char *path = tu_write_temp(text);
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
	char *path = tu_write_temp(base);
	if (profile_load(path, &p, &e))
		fail_msg("%s", e.msg);
	unlink(path);
	expect_bad("dose = -0.000144, 0.0004", "dose = -0.000144, 0.0001", "not positive definite");
	expect_bad("dose = -0.000144, 0.0004", "dose = -0.000100, 0.0004", "not symmetric");
	expect_bad("beta = 0.25, -0.2", "beta = 0.25", "line 8: 'beta' needs 2 numbers, one per term "
		   "(missing coefficient?), got 1");
	expect_bad("beta = 0.25, -0.2", "beta = 0.25, abc", "line 8: 'beta' needs 2 numbers");
	expect_bad("form = reciprocal", "form = cubic", "line 3: form must be");
	expect_bad("tau2 = 0.0025", "tau2 = -1", "line 13: 'tau2' must be from 0 to 1 lnRR^2, not -1");
	expect_bad("tau2 = 0.0025\n", "", "missing 'tau2' in [heterogeneity]");
	expect_bad("dose_max = 30", "dose_max = x", "line 5: 'dose_max' is not a number ('x')");
	expect_bad("dose = -0.000144, 0.0004\n", "", "line 9: missing covariance row 'dose'");
	expect_bad("names = intercept, dose", "names = dose, intercept", "first two terms");
	expect_bad("athlete = 0.0064\n", "", "missing 'athlete' in [heterogeneity]");
	expect_bad("basis = calibrated", "basis = guessed", "line 17: basis must be calibrated or fitted");
	expect_bad("names = intercept, dose", "names = intercept, dose, weeks",
		   "line 8: 'beta' needs 3 numbers");
	assert_int_equal(profile_load("/nonexistent/p.ini", &p, &e), -1);
	assert_non_null(strstr(e.msg, "cannot read profile '/nonexistent/p.ini'"));
}

/* Every numeric field has a documented range, checked with its line: values that once
 * overflowed an int conversion, slowed every command, or turned bands into infinities. */
static void test_ranges(void **state)
{
	(void)state;
	expect_bad("dose_max = 30", "dose_max = 3088022415", "line 5: 'dose_max' must be above 0 "
		   "and at most 200 weekly fractional sets, not 3088022415");
	expect_bad("dose_max = 30", "dose_max = 1e9", "line 5: 'dose_max' must be above 0");
	expect_bad("dose_max = 30", "dose_max = 0", "line 5: 'dose_max' must be above 0");
	expect_bad("dose_min = 0", "dose_min = 40", "line 5: dose_max 30 must be above dose_min 40 (line 4)");
	expect_bad("tau2 = 0.0025", "tau2 = 1e308", "line 13: 'tau2' must be from 0 to 1 lnRR^2, not 1e+308");
	expect_bad("tau2 = 0.0025", "tau2 = 1e999", "line 13: 'tau2' is not a number");
	expect_bad("tau2 = 0.0025", "tau2 = nan", "line 13: 'tau2' is not a finite number");
	expect_bad("form = reciprocal", "form = reciprocal\nswc = 1e300", "line 4: 'swc' must be above 0 "
		   "and at most 0.5 lnRR, not 1e+300");
	expect_bad("form = reciprocal", "form = reciprocal\ndf = 1e12", "line 4: 'df' must be a whole "
		   "number from 0 to 1000000, not 1e+12");
	expect_bad("form = reciprocal", "form = reciprocal\ndf = 2.5", "line 4: 'df' must be a whole "
		   "number from 0 to 1000000, not 2.5");
	expect_bad("athlete = 0.0064", "athlete = 2", "line 14: 'athlete' must be from 0 to 1");
	expect_bad("beta = 0.25, -0.2", "beta = 0.25, -20", "line 8: 'beta' number 2 must be from -10 to "
		   "10 lnRR, not -20");
	expect_bad("intercept = 0.000144, -0.000144", "intercept = 5, -0.000144",
		   "line 10: 'intercept' number 1 must be from -1 to 1, not 5");
	expect_bad("form = reciprocal", "form = reciprocal\nw_indirect = 2", "line 4: 'w_indirect' must "
		   "be from 0 to 1, not 2");
	/* A moderator needs an evidence range, within its documented bounds. */
	expect_bad("names = intercept, dose\nbeta = 0.25, -0.2\n",
		   "names = intercept, dose, weeks\nbeta = 0.25, -0.2, 0.01\ncentre = 0, 0, 10\n",
		   "line 11: 'intercept' needs 3 numbers, one per term");
	const char *mod = "names = intercept, dose, weeks\nbeta = 0.25, -0.2, 0.01\n"
			  "[covariance]\nintercept = 0.000144, -0.000144, 0\n"
			  "dose = -0.000144, 0.0004, 0\nweeks = 0, 0, 0.000004\n";
	expect_bad("names = intercept, dose\nbeta = 0.25, -0.2\n[covariance]\n"
		   "intercept = 0.000144, -0.000144\ndose = -0.000144, 0.0004\n", mod,
		   "moderator 'weeks' has no evidence range");
	char with_range[512];
	snprintf(with_range, sizeof with_range, "%s[ranges]\nweeks = 4, 1000\n", mod);
	expect_bad("names = intercept, dose\nbeta = 0.25, -0.2\n[covariance]\n"
		   "intercept = 0.000144, -0.000144\ndose = -0.000144, 0.0004\n", with_range,
		   "line 14: 'weeks' number 2 must be from 1 to 520 weeks, not 1000");
	snprintf(with_range, sizeof with_range, "%s[ranges]\nweeks = 24, 4\n", mod);
	expect_bad("names = intercept, dose\nbeta = 0.25, -0.2\n[covariance]\n"
		   "intercept = 0.000144, -0.000144\ndose = -0.000144, 0.0004\n", with_range,
		   "line 14: range of 'weeks' runs backwards (24 to 4)");
	expect_bad("[heterogeneity]", "[ranges]\nweek = 4, 24\n[heterogeneity]",
		   "line 13: range of 'week', but no term uses it");
}

/* A repeated section or key is an error naming both lines (iniparser let the second win). */
static void test_duplicates(void **state)
{
	(void)state;
	expect_bad("[provenance]", "[profile]\nform = linear\n[provenance]",
		   "line 16: section [profile] appears twice (lines 1 and 16)");
	expect_bad("dose_max = 30", "dose_max = 30\nform = linear", "line 6: key 'form' appears twice "
		   "in [profile] (lines 3 and 6)");
	expect_bad("tau2 = 0.0025", "tau2 = 0.0025\nTAU2 = 0.5", "key 'TAU2' appears twice in "
		   "[heterogeneity] (lines 13 and 14)");
	expect_bad("dose = -0.000144, 0.0004", "dose = -0.000144, 0.0004\ndose = -0.000144, 0.0004",
		   "line 12: key 'dose' appears twice in [covariance] (lines 11 and 12)");
	expect_bad("name = t", "name = t\ncolour = red", "line 3: unknown key 'colour' in [profile]");
	expect_bad("[provenance]", "[extras]\n[provenance]", "line 16: unknown section [extras]");
	expect_bad("[provenance]", "[provenance]\nline100 = x", "unknown key 'line100'");
}

/* Text fields are never cut: too long is an error; a NUL byte is an error with its line. */
static void test_text(void **state)
{
	struct sd_profile p;
	struct sd_err e;
	char longname[128], text[2048];
	(void)state;
	memset(longname, 'n', 80);
	snprintf(longname + 80, sizeof longname - 80, "\n");
	snprintf(text, sizeof text, "name = %s", longname);
	expect_bad("name = t\n", text, "line 2: 'name' is longer than 63 bytes");
	memcpy(text, base, sizeof base);
	text[strstr(base, "[terms]") - base + 2] = '\0';
	char path[] = "/tmp/sdnulXXXXXX";
	int fd = mkstemp(path);
	assert_int_equal(write(fd, text, sizeof base - 1), (ssize_t)(sizeof base - 1));
	close(fd);
	assert_int_equal(profile_load(path, &p, &e), -1);
	unlink(path);
	assert_non_null(strstr(e.msg, "line 6: a NUL byte"));
}

int main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(test_bundled),
		cmocka_unit_test(test_roundtrip),
		cmocka_unit_test(test_bad),
		cmocka_unit_test(test_ranges),
		cmocka_unit_test(test_duplicates),
		cmocka_unit_test(test_text),
	};
	return cmocka_run_group_tests_name("profile", tests, NULL, NULL);
}
