/* Did-you-mean for stored names (core/suggest.c) and the overdue count of a block
 * (app/blocks.c). The names are invented. */
#include "testutil.h"

#include <string.h>

#include "app/blocks.h"
#include "core/suggest.h"

struct rec {
	long long id;
	char name[24];
};

static const struct rec names[] = {
	{ 1, "Ida Fernhollow" }, { 2, "Ivo Fernhall" }, { 3, "Maren Oakhollow" },
	{ 4, "Tobin Reedmere" }, { 5, "Ida Quill" },
};

static int suggest(const char *q, int *out)
{
	return sd_suggest(q, names[0].name, sizeof names[0], 5, out, SD_SUGGEST_MAX);
}

static void ranks_by_words_then_spelling(void **state)
{
	int out[SD_SUGGEST_MAX];
	(void)state;
	/* One letter dropped. "Ida Fernhollow" and "Ida Quill" share the word "ida"; of the two
	 * the nearer spelling (1 edit) ranks first. "Ivo Fernhall" shares no word but is 5 edits
	 * away, within 13 / 3 + 2 = 6. */
	assert_int_equal(suggest("Ida Fernholow", out), 3);
	assert_int_equal(out[0], 0);
	assert_int_equal(out[1], 4);
	assert_int_equal(out[2], 1);
	/* No word shared: only names within a third of the length plus 2 edits. */
	assert_int_equal(suggest("tobin reedmeer", out), 1);
	assert_int_equal(out[0], 3);
	/* Case is ignored. */
	assert_int_equal(suggest("MAREN OAKHOLLOW", out), 1);
	assert_int_equal(out[0], 2);
	/* Nothing close. */
	assert_int_equal(suggest("Zed", out), 0);
}

static void overdue_days(void **state)
{
	struct db_block b;
	(void)state;
	memset(&b, 0, sizeof b);
	strcpy(b.start, "2026-01-05");
	b.weeks = 12;   /* planned end: 2026-01-05 + 84 days = 2026-03-30 */
	assert_int_equal(app_block_overdue(&b, "2026-03-30"), 0);
	assert_int_equal(app_block_overdue(&b, "2026-03-31"), 1);
	assert_int_equal(app_block_overdue(&b, "2026-07-01"), 93);   /* 1 + 30 + 31 + 30 + 1 */
	strcpy(b.end, "2026-03-29");
	assert_int_equal(app_block_overdue(&b, "2026-07-01"), 0);     /* ended: never overdue */
}

int main(void)
{
	const struct CMUnitTest t[] = {
		cmocka_unit_test(ranks_by_words_then_spelling),
		cmocka_unit_test(overdue_days),
	};
	return cmocka_run_group_tests(t, NULL, NULL);
}
