/* Tables: the narrow default leaves out the '~' columns, the wide table and CSV keep every
 * column, and a grid wider than the line prints in panels that repeat the key column. */
#include "testutil.h"

#include <stdlib.h>
#include <string.h>

#include "io/table.h"

static char *printed(const struct sd_table *t, int mode, int width, int keep)
{
	char *buf = NULL;
	size_t n = 0;
	FILE *f = open_memstream(&buf, &n);
	assert_non_null(f);
	tbl_print_panels(t, f, mode, width, keep);
	fclose(f);
	return buf;
}

static void expect(const struct sd_table *t, int mode, int width, int keep, const char *want)
{
	char *got = printed(t, mode, width, keep);
	if (strcmp(got, want))
		fail_msg("mode %d width %d:\n--- got\n%s--- wanted\n%s", mode, width, got, want);
	free(got);
}

static struct sd_table *sample(void)
{
	static const char *const heads[] = { "<muscle", "gain%", "~group_lo", "~<note" };
	struct sd_table *t = tbl_new(4, heads);
	assert_non_null(t);
	tbl_row(t);
	tbl_set(t, 0, "chest");
	tbl_set(t, 1, "%.1f", 24.44);
	tbl_set(t, 2, "%.1f", 10.5);
	tbl_set(t, 3, "held, at the edge");
	tbl_row(t);
	tbl_set(t, 0, "side-delts");
	tbl_set(t, 1, "%.1f", 3.0);
	tbl_set(t, 2, "%.1f", -1.25);
	return t;
}

static void narrow_wide_csv(void **state)
{
	(void)state;
	struct sd_table *t = sample();
	expect(t, TBL_TEXT, 0, 0,
	       "muscle      gain%\n"
	       "chest        24.4\n"
	       "side-delts    3.0\n");
	expect(t, TBL_WIDE, 0, 0,
	       "muscle      gain%  group_lo  note\n"
	       "chest        24.4      10.5  held, at the edge\n"
	       "side-delts    3.0      -1.2\n");
	expect(t, TBL_CSV, 0, 0,
	       "muscle,gain%,group_lo,note\n"
	       "chest,24.4,10.5,\"held, at the edge\"\n"
	       "side-delts,3.0,-1.2,\n");
	assert_int_equal(tbl_mode(1, 1), TBL_CSV);
	assert_int_equal(tbl_mode(0, 1), TBL_WIDE);
	assert_int_equal(tbl_mode(0, 0), TBL_TEXT);
	tbl_free(t);
}

/* A triangular grid as `returns` prints it: from in rows, to in columns. */
static void panels(void **state)
{
	static const char *const heads[] = { "from\\to", "1", "2", "3" };
	struct sd_table *t = tbl_new(4, heads);
	(void)state;
	assert_non_null(t);
	for (int i = 0; i < 3; i++) {
		tbl_row(t);
		tbl_set(t, 0, "%d", i);
		for (int j = i + 1; j <= 3; j++)
			tbl_set(t, j, "%d.5*", 10 * i + j);
	}
	/* Wide enough: one panel, every row (the last one empty too). */
	expect(t, TBL_TEXT, 80, 1,
	       "from\\to     1      2      3\n"
	       "      0  1.5*   2.5*   3.5*\n"
	       "      1        12.5*  13.5*\n"
	       "      2               23.5*\n");
	/* 21 columns: the key and two grid columns, then the rest; rows with nothing in a
	 * panel are left out of it. */
	expect(t, TBL_TEXT, 21, 1,
	       "from\\to     1      2\n"
	       "      0  1.5*   2.5*\n"
	       "      1        12.5*\n"
	       "\n"
	       "from\\to      3\n"
	       "      0   3.5*\n"
	       "      1  13.5*\n"
	       "      2  23.5*\n");
	tbl_free(t);
}

int main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(narrow_wide_csv),
		cmocka_unit_test(panels),
	};
	return cmocka_run_group_tests(tests, NULL, NULL);
}
