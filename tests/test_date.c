/* Calendar dates: only real days, and day numbers that agree with known date arithmetic. */
#include "testutil.h"

#include <string.h>

#include "core/date.h"

static void parse_and_format(void **state)
{
	struct sd_err e = { 0 };
	char buf[DATE_LEN];
	long d;
	(void)state;
	assert_int_equal(date_parse("1970-01-01", &d, &e), 0);
	assert_int_equal(d, 0);
	/* 2000-03-01 is day 11017 of the Unix epoch (POSIX time 951868800 / 86400). */
	assert_int_equal(date_parse("2000-03-01", &d, &e), 0);
	assert_int_equal(d, 11017);
	assert_int_equal(date_parse("2024-02-29", &d, &e), 0);
	date_format(d, buf);
	assert_string_equal(buf, "2024-02-29");
	date_format(d + 1, buf);
	assert_string_equal(buf, "2024-03-01");
	assert_int_equal(date_parse("1900-01-01", &d, &e), 0);
	date_format(d - 1, buf);
	assert_string_equal(buf, "1899-12-31");
	/* Every day from 1900 to 2100 formats back to itself. */
	for (long k = date_days(1900, 1, 1); k < date_days(2100, 1, 1); k++) {
		long back;
		date_format(k, buf);
		assert_int_equal(date_parse(buf, &back, &e), 0);
		assert_int_equal(back, k);
	}
}

static void rejects(void **state)
{
	static const char *bad[] = { "2023-02-29", "1900-02-29", "2024-13-01", "2024-04-31",
		"2024-00-10", "2024-01-00", "24-01-01", "2024/01/01", "2024-1-1", "2024-01-01x",
		"", "yesterday", "3000-01-01", "1899-12-31" };
	struct sd_err e = { 0 };
	long d;
	(void)state;
	for (size_t i = 0; i < sizeof bad / sizeof bad[0]; i++) {
		assert_int_equal(date_parse(bad[i], &d, &e), -1);
		assert_int_equal(e.code, SD_EXIT_USAGE);
		assert_non_null(strstr(e.msg, "bad date"));
	}
	assert_true(date_valid(2000, 2, 29));
	assert_false(date_valid(2100, 2, 29));
}

int main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(parse_and_format),
		cmocka_unit_test(rejects),
	};
	return cmocka_run_group_tests(tests, NULL, NULL);
}
