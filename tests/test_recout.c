/* Record listings: the same cells as an aligned table, as CSV and as JSON. */
#include "testutil.h"

#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "io/recout.h"

static const char *const heads[] = { "<name", "blocks", "<notes" };

static char *render(int fmt)
{
	struct sd_rec *r = rec_new(3, heads, fmt);
	char *buf = NULL;
	size_t len = 0;
	FILE *f = open_memstream(&buf, &len);

	assert_non_null(r);
	assert_non_null(f);
	assert_int_equal(rec_row(r), 0);
	rec_set(r, 0, "%s", "Ann \"A\", B");
	rec_set(r, 1, "%d", 12);
	rec_set(r, 2, "%s", "x");
	assert_int_equal(rec_row(r), 0);
	rec_set(r, 0, "%s", "Bo");
	rec_set(r, 1, "%s", "");
	rec_set(r, 2, "%s", "3");
	assert_int_equal(rec_rows(r), 2);
	rec_print(r, f);
	fclose(f);
	rec_free(r);
	return buf;
}

static void table_csv_json(void **state)
{
	char *t = render(REC_TABLE), *c = render(REC_CSV), *j = render(REC_JSON);
	(void)state;
	assert_string_equal(t, "name        blocks  notes\n"
			       "Ann \"A\", B      12  x\n"
			       "Bo                  3\n");
	assert_string_equal(c, "name,blocks,notes\n\"Ann \"\"A\"\", B\",12,x\nBo,,3\n");
	/* Numeric columns are numbers (null when empty); text columns stay strings. */
	assert_non_null(strstr(j, "\"name\":\t\"Ann \\\"A\\\", B\""));
	assert_non_null(strstr(j, "\"blocks\":\t12"));
	assert_non_null(strstr(j, "\"blocks\":\tnull"));
	assert_non_null(strstr(j, "\"notes\":\t\"3\""));
	free(t);
	free(c);
	free(j);
}

static void json_string(void **state)
{
	char *s = rec_json_string("a\"b\n");
	(void)state;
	assert_string_equal(s, "\"a\\\"b\\n\"");
	free(s);
}

int main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(table_csv_json),
		cmocka_unit_test(json_string),
	};
	return cmocka_run_group_tests(tests, NULL, NULL);
}
