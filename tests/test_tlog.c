/* The training log's numbers, counted by hand: ISO 8601 weeks across a year boundary, the
 * weekly fractional sets of a small log spanning a week boundary and a year boundary, the
 * planned dose of two blocks sharing a week, adherence, sessions missed, a block's logged
 * average, the e1RM of a set with stated RIR, weekly bests and the identity ordinals. */
#include "testutil.h"

#include <stdlib.h>
#include <string.h>

#include "core/bounds.h"
#include "core/date.h"
#include "core/e1rm.h"
#include "core/program.h"
#include "core/tlog.h"

static struct sd_library lib;
enum { BENCH, SQUAT, CLEAN };

#define M(m) ((sd_mset)1 << (m))

static void put(const char *name, sd_mset direct, sd_mset indirect, int ungraded)
{
	struct sd_exercise x;
	struct sd_err e;
	memset(&x, 0, sizeof x);
	snprintf(x.name, sizeof x.name, "%s", name);
	x.direct = direct;
	x.indirect = indirect;
	x.ungraded = ungraded;
	assert_int_equal(lib_put(&lib, &x, &e), 0);
}

static int setup(void **state)
{
	struct sd_err e;
	(void)state;
	memset(&lib, 0, sizeof lib);
	put("bench press", M(SD_CHEST), M(SD_TRICEPS) | M(SD_FRONT_DELTS), 0);
	put("back squat", M(SD_QUADS) | M(SD_GLUTES), M(SD_LOWER_BACK), 0);
	/* Not graded by RIR, like the library's Olympic lifts: every working set counts. */
	put("power clean", M(SD_QUADS), M(SD_UPPER_BACK), 1);
	return lib_index(&lib, &e);
}

static int teardown(void **state)
{
	(void)state;
	lib_free(&lib);
	return 0;
}

static long day(const char *s)
{
	long d = 0;
	assert_int_equal(date_parse(s, &d, NULL), 0);
	return d;
}

static void check_week(const char *date, int year, int week, int weekday)
{
	int y = 0, w = 0;
	assert_int_equal(tlog_iso_week(day(date), &y, &w), weekday);
	if (y != year || w != week)
		fail_msg("%s: got %d-W%02d, expected %d-W%02d", date, y, w, year, week);
}

/* ISO 8601: week 1 holds the year's first Thursday, and a week belongs to the year of its
 * Thursday. 2026 begins on a Thursday, so it has 53 weeks; 2027-01-04 is the Monday of
 * 2027-W01. Counted by hand from those two rules. */
static void iso_weeks(void **state)
{
	(void)state;
	check_week("2026-12-28", 2026, 53, 1);
	check_week("2026-12-31", 2026, 53, 4);
	check_week("2027-01-01", 2026, 53, 5);
	check_week("2027-01-03", 2026, 53, 7);
	check_week("2027-01-04", 2027, 1, 1);
	check_week("2026-01-01", 2026, 1, 4);
	check_week("2025-12-29", 2026, 1, 1);   /* Monday of the week of 2026-01-01 */
	check_week("2024-12-30", 2025, 1, 1);   /* its Thursday is 2025-01-02 */
	check_week("2021-01-03", 2020, 53, 7);  /* 2020 began on a Wednesday, a leap year */
	check_week("1970-01-01", 1970, 1, 4);
	check_week("1900-01-01", 1900, 1, 1);   /* before day 0: the weekday stays right */
	assert_int_equal(tlog_monday(day("2027-01-03")), day("2026-12-28"));
	assert_int_equal(tlog_monday(day("2027-01-04")), day("2027-01-04"));
}

static struct tlog_daysets ds(const char *date, int ex, int within, int above, int unrecorded)
{
	struct tlog_daysets d = { day(date), ex, within, above, unrecorded };
	return d;
}

/* The small log, weights 1 (prime mover) and 0.5 (synergist), RIR limit 4:
 *   2026-12-24 Thu (2026-W52)  bench 3 @ RIR 2              before the weeks: ignored
 *   2026-12-29 Tue (2026-W53)  bench 3 @ RIR 2, squat 4 @ RIR 1
 *   2026-12-31 Thu (2026-W53)  bench 2 @ RIR 6 (easy), bench 1 without an effort (counts)
 *   2027-01-03 Sun (2026-W53)  power clean 3 @ RIR 6 (not graded: counts)
 *   2027-01-04 Mon (2027-W01)  squat 5 @ RIR 0
 *   2027-01-05 Tue (2027-W01)  bench 4 @ RIR 3, and an exercise the library lost (1 set)
 * 2026-W53: chest 3 + 1 = 4; triceps and front delts 0.5 x 4 = 2; quads 4 + 3 = 7; glutes 4;
 *           lower back 0.5 x 4 = 2; upper back 0.5 x 3 = 1.5; hard sets 3 + 4 + 1 + 3 = 11,
 *           easy 2; sessions Tue, Thu, Sun = 3.
 * 2027-W01: chest 4; triceps 2; quads 5; glutes 5; lower back 2.5; sessions 2.
 * As the store sums it per week, exercise and RIR (days: bit 0 Monday ... bit 6 Sunday), and
 * per day and exercise (for a block's span). */
static const struct tlog_weekrow *small_weeks(int *n)
{
	static struct tlog_weekrow v[9];
	long w52 = day("2026-12-21"), w53 = day("2026-12-28"), w01 = day("2027-01-04");
	int k = 0;
	v[k++] = (struct tlog_weekrow){ w52, BENCH, 2, 3, 1u << 3 };
	v[k++] = (struct tlog_weekrow){ w53, BENCH, -1, 1, 1u << 3 };
	v[k++] = (struct tlog_weekrow){ w53, BENCH, 2, 3, 1u << 1 };
	v[k++] = (struct tlog_weekrow){ w53, BENCH, 6, 2, 1u << 3 };
	v[k++] = (struct tlog_weekrow){ w53, SQUAT, 1, 4, 1u << 1 };
	v[k++] = (struct tlog_weekrow){ w53, CLEAN, 6, 3, 1u << 6 };
	v[k++] = (struct tlog_weekrow){ w01, SQUAT, 0, 5, 1u << 0 };
	v[k++] = (struct tlog_weekrow){ w01, BENCH, 3, 4, 1u << 1 };
	v[k++] = (struct tlog_weekrow){ w01, -1, 2, 1, 1u << 1 };
	*n = k;
	return v;
}

static const struct tlog_daysets *small_log(int *n)
{
	static struct tlog_daysets v[8];
	int k = 0;
	v[k++] = ds("2026-12-24", BENCH, 3, 0, 0);
	v[k++] = ds("2026-12-29", BENCH, 3, 0, 0);
	v[k++] = ds("2026-12-29", SQUAT, 4, 0, 0);
	v[k++] = ds("2026-12-31", BENCH, 0, 2, 1);
	v[k++] = ds("2027-01-03", CLEAN, 0, 3, 0);
	v[k++] = ds("2027-01-04", SQUAT, 5, 0, 0);
	v[k++] = ds("2027-01-05", BENCH, 4, 0, 0);
	v[k++] = ds("2027-01-05", -1, 1, 0, 0);
	*n = k;
	return v;
}

static void weekly_sets(void **state)
{
	struct tlog_weeks ws;
	struct sd_err e;
	int n;
	const struct tlog_weekrow *v = small_weeks(&n);
	(void)state;

	assert_int_equal(tlog_weeks_init(&ws, day("2026-12-31"), day("2027-01-05"), &e), 0);
	assert_int_equal(ws.n, 2);
	assert_int_equal(ws.w[0].monday, day("2026-12-28"));
	assert_int_equal(ws.w[0].year, 2026);
	assert_int_equal(ws.w[0].week, 53);
	assert_int_equal(ws.w[1].year, 2027);
	assert_int_equal(ws.w[1].week, 1);
	for (int i = 0; i < n; i++)
		tlog_weeks_add(&ws, &lib, 1.0, 0.5, 4, &v[i]);

	assert_near(ws.w[0].done[SD_CHEST], 4, 1e-12);
	assert_near(ws.w[0].done[SD_TRICEPS], 2, 1e-12);
	assert_near(ws.w[0].done[SD_FRONT_DELTS], 2, 1e-12);
	assert_near(ws.w[0].done[SD_QUADS], 7, 1e-12);
	assert_near(ws.w[0].done[SD_GLUTES], 4, 1e-12);
	assert_near(ws.w[0].done[SD_LOWER_BACK], 2, 1e-12);
	assert_near(ws.w[0].done[SD_UPPER_BACK], 1.5, 1e-12);
	assert_near(ws.w[0].done[SD_LATS], 0, 0);
	assert_int_equal(ws.w[0].hard_sets, 11);
	assert_int_equal(ws.w[0].easy_sets, 2);
	assert_int_equal(ws.w[0].sessions, 3);

	assert_near(ws.w[1].done[SD_CHEST], 4, 1e-12);
	assert_near(ws.w[1].done[SD_TRICEPS], 2, 1e-12);
	assert_near(ws.w[1].done[SD_QUADS], 5, 1e-12);
	assert_near(ws.w[1].done[SD_GLUTES], 5, 1e-12);
	assert_near(ws.w[1].done[SD_LOWER_BACK], 2.5, 1e-12);
	assert_int_equal(ws.w[1].hard_sets, 10);
	assert_int_equal(ws.w[1].sessions, 2);
	assert_int_equal(ws.unknown_sets, 1);
	assert_int_equal(tlog_weeks_find(&ws, day("2027-01-10")), 1);
	assert_int_equal(tlog_weeks_find(&ws, day("2027-01-11")), -1);
	assert_int_equal(tlog_weeks_find(&ws, day("2026-12-27")), -1);
	tlog_weeks_free(&ws);

	/* A stricter limit (RIR 1): bench at RIR 2 and 3 and the unknown exercise's set at RIR 2
	 * no longer count, so 2027-W01 keeps one session (Monday) and 5 easy sets. */
	assert_int_equal(tlog_weeks_init(&ws, day("2026-12-28"), day("2027-01-04"), &e), 0);
	for (int i = 0; i < n; i++)
		tlog_weeks_add(&ws, &lib, 1.0, 0.5, 1, &v[i]);
	assert_near(ws.w[0].done[SD_CHEST], 1, 1e-12);
	assert_int_equal(ws.w[0].sessions, 3);
	assert_int_equal(ws.w[1].sessions, 1);
	assert_int_equal(ws.w[1].easy_sets, 5);
	tlog_weeks_free(&ws);
}

/* Two blocks share 2026-W53: A (chest 8 a week, 3 days) runs Wed 2026-12-23 to Thu
 * 2026-12-31, B (chest 10, 4 days) from Fri 2027-01-01 to 2027-01-28.
 * 2026-W53: A has Mon-Thu (4 days), B Fri-Sun (3): chest 8 x 4/7 + 10 x 3/7 = 62/7 = 8.857...;
 *   sessions 3 x 4/7 + 4 x 3/7 = 24/7 = 3.43, planned 3, trained 3, missed 0; the week is A's.
 *   Adherence of chest 4 / (62/7) = 28/62 = 45.16 %.
 * 2027-W01: all B: chest 10, 4 sessions, 2 trained, missed 2; chest 4 / 10 = 40 %;
 *   quads: nothing planned, so no adherence. */
static void plan_and_adherence(void **state)
{
	struct tlog_weeks ws;
	struct sd_err e;
	double a[SD_NMUSCLES] = { 0 }, b[SD_NMUSCLES] = { 0 };
	int n;
	const struct tlog_weekrow *v = small_weeks(&n);
	(void)state;

	a[SD_CHEST] = 8;
	b[SD_CHEST] = 10;
	assert_int_equal(tlog_weeks_init(&ws, day("2026-12-28"), day("2027-01-10"), &e), 0);
	for (int i = 0; i < n; i++)
		tlog_weeks_add(&ws, &lib, 1.0, 0.5, 4, &v[i]);
	tlog_weeks_plan(&ws, 1, day("2026-12-23"), day("2026-12-31"), a, 3);
	tlog_weeks_plan(&ws, 2, day("2027-01-01"), day("2027-01-28"), b, 4);

	assert_near(ws.w[0].planned[SD_CHEST], 62.0 / 7, 1e-12);
	assert_near(ws.w[0].planned_sessions, 24.0 / 7, 1e-12);
	assert_int_equal(ws.w[0].block, 1);
	assert_int_equal(ws.w[0].block_days, 4);
	assert_int_equal(tlog_missed(&ws.w[0]), 0);
	assert_near(tlog_adherence(ws.w[0].done[SD_CHEST], ws.w[0].planned[SD_CHEST]),
		    100.0 * 28 / 62, 1e-9);
	assert_near(tlog_adherence(ws.w[0].done[SD_CHEST], ws.w[0].planned[SD_CHEST]), 45.16129,
		    1e-5);

	assert_near(ws.w[1].planned[SD_CHEST], 10, 1e-12);
	assert_near(ws.w[1].planned_sessions, 4, 1e-12);
	assert_int_equal(ws.w[1].block, 2);
	assert_int_equal(ws.w[1].block_days, 7);
	assert_int_equal(tlog_missed(&ws.w[1]), 2);
	assert_near(tlog_adherence(ws.w[1].done[SD_CHEST], ws.w[1].planned[SD_CHEST]), 40, 1e-12);
	assert_true(isnan(tlog_adherence(ws.w[1].done[SD_QUADS], ws.w[1].planned[SD_QUADS])));
	/* More done than planned reads above 100 %. */
	assert_near(tlog_adherence(12, 10), 120, 1e-12);
	tlog_weeks_free(&ws);
}

/* Block B's logged average: 2027-01-01 to 2027-01-28 is 28 days, 4 weeks. In it: the clean
 * (quads 3, upper back 1.5), squat 5 (quads 5, glutes 5, lower back 2.5), bench 4 (chest 4,
 * triceps 2). Per week: quads 8 / 4 = 2, chest 1, upper back 0.375; 3 days trained. */
static void block_average(void **state)
{
	struct tlog_span s;
	double dose[SD_NMUSCLES];
	int n;
	const struct tlog_daysets *v = small_log(&n);
	(void)state;

	tlog_span_init(&s, day("2027-01-01"), day("2027-01-28"));
	for (int i = 0; i < n; i++)
		tlog_span_add(&s, &lib, 1.0, 0.5, &v[i]);
	assert_near(tlog_span_weeks(&s), 4, 1e-12);
	tlog_span_dose(&s, dose);
	assert_near(dose[SD_QUADS], 2, 1e-12);
	assert_near(dose[SD_CHEST], 1, 1e-12);
	assert_near(dose[SD_UPPER_BACK], 0.375, 1e-12);
	assert_near(dose[SD_GLUTES], 1.25, 1e-12);
	assert_int_equal(s.days, 3);
	assert_int_equal(s.rows, 4);   /* the unknown exercise is seen but adds no dose */
}

/* The e1RM of a logged set: 100 kg x 5 at RIR 2 is 7 reps to failure. Brzycki (1993):
 * 1RM = w 36 / (37 - r) = 100 x 36 / 30 = 120 kg exactly. Epley (1985): w (1 + r / 30) =
 * 100 x 37 / 30 = 123.33 kg. Half-step RIR: 5 reps at RIR 1.5 (RPE 8.5) is 6.5 reps, 3600 / 30.5
 * = 118.03 kg. */
static void e1rm_from_rir(void **state)
{
	double out = 0, rtf = 0;
	(void)state;

	assert_int_equal(tlog_e1rm(E1RM_BRZYCKI, 100, 5, 2, 0, &out, &rtf), 0);
	assert_near(rtf, 7, 0);
	assert_near(out, 120, 1e-12);
	assert_int_equal(tlog_e1rm(E1RM_EPLEY, 100, 5, 2, 0, &out, &rtf), 0);
	assert_near(out, 123.0 + 1.0 / 3, 1e-12);
	assert_int_equal(tlog_e1rm(E1RM_BRZYCKI, 100, 5, 1.5, 0, &out, &rtf), 0);
	assert_near(out, 3600 / 30.5, 1e-12);
	/* A single to failure is the load; 10 reps to failure is the last inside the range. */
	assert_int_equal(tlog_e1rm(E1RM_EPLEY, 140, 1, 0, 0, &out, &rtf), 0);
	assert_near(out, 140, 0);
	assert_int_equal(tlog_e1rm(E1RM_BRZYCKI, 60, 8, 2, 0, &out, &rtf), 0);
	assert_near(out, 60 * 36.0 / 27, 1e-12);
	/* Outside the equations' range (8 + 3 = 11 reps), no effort, no load, a timed set. */
	assert_int_equal(tlog_e1rm(E1RM_BRZYCKI, 60, 8, 3, 0, &out, &rtf), -1);
	assert_int_equal(tlog_e1rm(E1RM_BRZYCKI, 60, 5, -1, 0, &out, &rtf), -1);
	assert_int_equal(tlog_e1rm(E1RM_BRZYCKI, 0, 5, 2, 0, &out, &rtf), -1);
	assert_int_equal(tlog_e1rm(E1RM_BRZYCKI, 20, 5, 2, 1, &out, &rtf), -1);
}

/* Weekly bests: per lift and week the set with the highest e1RM. */
static void weekly_best(void **state)
{
	struct tlog_trend t = { 0 };
	struct sd_err e;
	struct tlog_best b = { 0 };
	(void)state;

	b = (struct tlog_best){ BENCH, day("2026-12-28"), day("2026-12-29"), 120, 100, 2, 7, 5 };
	assert_int_equal(tlog_trend_add(&t, &b, &e), 0);
	b = (struct tlog_best){ SQUAT, day("2026-12-28"), day("2026-12-29"), 150, 140, 1, 3, 2 };
	assert_int_equal(tlog_trend_add(&t, &b, &e), 0);
	b = (struct tlog_best){ BENCH, day("2026-12-28"), day("2026-12-31"), 118, 100, 1.5, 6.5, 5 };
	assert_int_equal(tlog_trend_add(&t, &b, &e), 0);   /* lower: kept out */
	b = (struct tlog_best){ BENCH, day("2027-01-04"), day("2027-01-05"), 124, 105, 2, 7, 5 };
	assert_int_equal(tlog_trend_add(&t, &b, &e), 0);
	b = (struct tlog_best){ BENCH, day("2027-01-04"), day("2027-01-06"), 126, 105, 1, 6, 5 };
	assert_int_equal(tlog_trend_add(&t, &b, &e), 0);   /* higher: replaces */
	tlog_trend_sort(&t);
	assert_int_equal(t.n, 3);
	assert_int_equal(t.v[0].ex, BENCH);
	assert_near(t.v[0].e1rm_kg, 120, 0);
	assert_int_equal(t.v[1].ex, BENCH);
	assert_near(t.v[1].e1rm_kg, 126, 0);
	assert_int_equal(t.v[1].day, day("2027-01-06"));
	assert_int_equal(t.v[2].ex, SQUAT);
	tlog_trend_free(&t);
}

/* Identical rows of one athlete and day are numbered in line order; anything different (the
 * athlete, the load, the day) starts its own count. */
static void ordinals(void **state)
{
	struct tlog_entry v[5];
	struct sd_err e;
	(void)state;

	memset(v, 0, sizeof v);
	for (int i = 0; i < 5; i++) {
		v[i].athlete_id = 1;
		v[i].day = day("2026-12-31");
		v[i].ex = SQUAT;
		v[i].sets = 1;
		v[i].reps = 5;
		v[i].rir = 2;
		v[i].load = 100;
		v[i].unit = TLOG_UNIT_KG;
		v[i].line = 2 + i;
	}
	v[1].load = 102.5;
	v[3].athlete_id = 2;
	assert_int_equal(tlog_ordinals(v, 5, &e), 0);
	assert_int_equal(v[0].ordinal, 1);
	assert_int_equal(v[1].ordinal, 1);
	assert_int_equal(v[2].ordinal, 2);
	assert_int_equal(v[3].ordinal, 1);
	assert_int_equal(v[4].ordinal, 3);
	assert_int_equal(tlog_ordinals(v, 0, &e), 0);
}

/* The log's ranges (core/bounds.h, man setdose LIMITS). */
static void log_bounds(void **state)
{
	struct sd_err e;
	(void)state;
	assert_int_equal(bound_check(&bound_log_sets, "sets", 1, &e), 0);
	assert_int_equal(bound_check(&bound_log_sets, "sets", 100, &e), 0);
	assert_int_equal(bound_check(&bound_log_sets, "sets", 0, &e), -1);
	assert_string_equal(e.msg, "sets = 0 is outside 1 to 100 (a set count)");
	assert_int_equal(bound_check(&bound_log_sets, "sets", 2.5, &e), -1);
	assert_string_equal(e.msg, "sets = 2.5 is not a whole number (a set count)");
	assert_int_equal(bound_check(&bound_log_load, "load", 1000, &e), 0);
	assert_int_equal(bound_check(&bound_log_load, "load", 1000.5, &e), -1);
	assert_int_equal(bound_check(&bound_log_load, "load", 0.005, &e), -1);
}

static void effort_text(void **state)
{
	char buf[16];
	(void)state;
	tlog_effort_text(SD_EFFORT_RIR, 2, 2, buf, sizeof buf);
	assert_string_equal(buf, "RIR 2");
	tlog_effort_text(SD_EFFORT_RPE, 8.5, 8.5, buf, sizeof buf);
	assert_string_equal(buf, "RPE 8.5");
	tlog_effort_text(SD_EFFORT_RPE, 7, 8, buf, sizeof buf);
	assert_string_equal(buf, "RPE 7-8");
	tlog_effort_text(SD_EFFORT_NONE, 0, 0, buf, sizeof buf);
	assert_string_equal(buf, "");
}

int main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(iso_weeks),
		cmocka_unit_test(weekly_sets),
		cmocka_unit_test(plan_and_adherence),
		cmocka_unit_test(block_average),
		cmocka_unit_test(e1rm_from_rir),
		cmocka_unit_test(weekly_best),
		cmocka_unit_test(ordinals),
		cmocka_unit_test(effort_text),
		cmocka_unit_test(log_bounds),
	};
	return cmocka_run_group_tests(tests, setup, teardown);
}
