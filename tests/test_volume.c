/* Fractional set counting and program parsing, worked by hand on small programs. Counting rule:
 * a direct set counts 1 for each prime mover, an indirect set 0.5 for each synergist (the
 * fractional method of the strength-volume meta-regression literature). */
#include "testutil.h"

#include <stdlib.h>
#include <string.h>

#include "core/volume.h"
#include "io/program_io.h"
#include "io/program_write.h"

static struct sd_library lib;

static void put(const char *name, const char *alias, sd_mset direct, sd_mset indirect)
{
	struct sd_exercise x;
	struct sd_err e;
	memset(&x, 0, sizeof x);
	snprintf(x.name, sizeof x.name, "%s", name);
	if (alias) {
		x.aliases = malloc(sizeof *x.aliases);
		x.aliases[0] = strdup(alias);
		x.naliases = 1;
	}
	x.direct = direct;
	x.indirect = indirect;
	assert_int_equal(lib_put(&lib, &x, &e), 0);
}

#define M(m) ((sd_mset)1 << (m))

static int setup(void **state)
{
	struct sd_err e;
	(void)state;
	memset(&lib, 0, sizeof lib);
	put("bench press", "flat bench", M(SD_CHEST), M(SD_TRICEPS) | M(SD_FRONT_DELTS));
	put("triceps pushdown", NULL, M(SD_TRICEPS), 0);
	put("back squat", NULL, M(SD_QUADS) | M(SD_GLUTES), M(SD_ADDUCTORS));
	put("barbell row", NULL, M(SD_UPPER_BACK) | M(SD_LATS), M(SD_BICEPS) | M(SD_REAR_DELTS));
	return lib_index(&lib, &e);
}

static int teardown(void **state)
{
	(void)state;
	lib_free(&lib);
	return 0;
}

static int parse(const char *text, struct sd_program *p, struct sd_err *e)
{
	return program_parse("t.ini", text, strlen(text), 0, &lib, p, e);
}

/* Day 1: bench 3 sets @2, pushdown 2 sets; day 2: bench 4 @1, squat 5, row 3 @5 (easy).
 * chest: 3 + 4 = 7 direct -> 7. triceps: 2 direct + 7 indirect -> 2 + 3.5 = 5.5.
 * front-delts: 7 indirect -> 3.5. quads, glutes: 5. adductors: 2.5. Row not counted (RIR 5 > 4). */
static void test_count(void **state)
{
	const char *text =
		"[program]\nname = hand\nweeks = 8\n"
		"[day one]\nbench press = 3x5 RIR 2\ntriceps pushdown = 2\n"
		"[day two]\nFlat-Bench = 4x3 @9 ; alias, odd case; RPE 9 = RIR 1\nback squat = 5x5\n"
		"barbell row = 3x10 @5 RIR\n";
	struct sd_program p;
	struct sd_volume v;
	struct sd_err e;
	(void)state;
	assert_int_equal(parse(text, &p, &e), 0);
	assert_string_equal(p.name, "hand");
	assert_int_equal(p.weeks, 8);
	assert_int_equal(p.ndays, 2);
	assert_int_equal(vol_count(&p, &lib, 1.0, 0.5, 4, &v, &e), 0);
	assert_near(v.m[SD_CHEST].fractional, 7, 1e-12);
	assert_near(v.m[SD_CHEST].direct, 7, 1e-12);
	assert_near(v.m[SD_TRICEPS].direct, 2, 1e-12);
	assert_near(v.m[SD_TRICEPS].indirect, 7, 1e-12);
	assert_near(v.m[SD_TRICEPS].fractional, 5.5, 1e-12);
	assert_near(v.m[SD_FRONT_DELTS].fractional, 3.5, 1e-12);
	assert_near(v.m[SD_QUADS].fractional, 5, 1e-12);
	assert_near(v.m[SD_ADDUCTORS].fractional, 2.5, 1e-12);
	assert_near(v.m[SD_LATS].fractional, 0, 0);
	assert_near(v.m[SD_LATS].easy, 3, 0);
	/* per session: triceps 2 + 1.5 on day one, 2 on day two */
	assert_near(vol_day(&v, 0, SD_TRICEPS), 3.5, 1e-12);
	assert_near(vol_day(&v, 1, SD_TRICEPS), 2.0, 1e-12);
	assert_near(v.m[SD_TRICEPS].max_session, 3.5, 1e-12);
	assert_int_equal(v.m[SD_TRICEPS].sessions, 2);
	assert_int_equal(v.m[SD_QUADS].sessions, 1);
	assert_int_equal(v.hard_sets, 3 + 2 + 4 + 5);
	assert_int_equal(v.easy_sets, 3);
	assert_int_equal(v.unknown_rir, 2 + 5);
	/* A stricter limit (RIR <= 1) drops the @2 bench sets: chest 4. */
	vol_free(&v);
	assert_int_equal(vol_count(&p, &lib, 1.0, 0.5, 1, &v, &e), 0);
	assert_near(v.m[SD_CHEST].fractional, 4, 1e-12);
	vol_free(&v);
	prog_free(&p);
}

/* One group: sets, reps, RIR and flags as parsed. */
static struct sd_entry one(const char *text)
{
	struct sd_entry g[4];
	struct sd_err e;
	int n = prog_parse_sets(text, 0, g, 4, NULL, &e);
	if (n != 1)
		fail_msg("'%s': %d groups (%s)", text, n, n < 0 ? e.msg : "");
	return g[0];
}

static void test_sets_syntax(void **state)
{
	struct sd_entry g[4], en;
	struct sd_setinfo info;
	struct sd_err e;
	(void)state;
	en = one("4");
	assert_int_equal(en.sets, 4); assert_int_equal(en.reps, 0); assert_near(en.rir, -1, 0);
	en = one("3x8");
	assert_int_equal(en.sets, 3); assert_int_equal(en.reps, 8); assert_int_equal(en.reps_hi, 8);
	/* RIR = 10 - RPE on the RIR-based RPE scale (common practice, no source). */
	assert_near(one(" 3 x 8 @8 ").rir, 2, 0);
	assert_near(one("3x8 RPE 8.5").rir, 1.5, 0);
	assert_near(one("3x8 @2 RIR").rir, 2, 0);
	assert_near(one("3x8 rir2").rir, 2, 0);
	assert_near(one("3x8 @rpe8").rir, 2, 0);
	assert_near(one("3x8 @RPE9.5").rir, 0.5, 0);
	assert_near(one("3x8 @8 RPE").rir, 2, 0);
	assert_near(one("3x8 RIR 1-2").rir, 1.5, 0);       /* a range counts at its midpoint */
	assert_near(one("3x8 @7-8").rir, 2.5, 0);
	en = one("3x8-12 @8");
	assert_int_equal(en.reps, 8); assert_int_equal(en.reps_hi, 12);
	en = one("3x8\xe2\x80\x93" "12 @8");                  /* en dash */
	assert_int_equal(en.reps_hi, 12);
	en = one("3xAMRAP");
	assert_true(en.flags & SD_SET_AMRAP); assert_near(en.rir, 0, 0);   /* to failure */
	en = one("3x8/side");
	assert_int_equal(en.sets, 3); assert_true(en.flags & SD_SET_SIDE);
	assert_true(one("3x8 each").flags & SD_SET_SIDE);
	en = one("3x30s");
	assert_true(en.flags & SD_SET_TIMED); assert_int_equal(en.reps, 30);
	assert_int_equal(one("2x1min").reps, 60);
	assert_true(one("2x5 warm-up").flags & SD_SET_WARMUP);
	assert_true(one("w2x5").flags & SD_SET_WARMUP);
	assert_int_equal(one("5x3 @80%").load_pct, 80);
	assert_near(one("5x3 @80%").rir, -1, 0);
	assert_int_equal(prog_parse_sets("1x3 @9, 3x5 @7", 0, g, 4, NULL, &e), 2);
	assert_int_equal(g[0].sets, 1); assert_near(g[0].rir, 1, 0);
	assert_int_equal(g[1].sets, 3); assert_near(g[1].rir, 3, 0);
	/* A bare @N below 5 is still RPE, and remembered for the warning; 'effort = rir' reads RIR. */
	assert_int_equal(prog_parse_sets("3x5 @3", 0, g, 4, &info, &e), 1);
	assert_near(g[0].rir, 7, 0); assert_near(info.bare_low, 3, 0);
	assert_int_equal(prog_parse_sets("3x5 @3", 1, g, 4, &info, &e), 1);
	assert_near(g[0].rir, 3, 0); assert_near(info.bare_low, -1, 0);
	assert_int_equal(prog_parse_sets("3x5 RPE 3", 0, g, 4, &info, &e), 1);
	assert_near(info.bare_low, -1, 0);   /* written out: no warning */
	const char *bad[] = { "", "x8", "3x", "3x8@", "3x8 @11", "-2", "0", "10000", "101",
			      "3x8 @-1", "3.5", "3x8 @2 extra", "99999999999999", "3x8 RIR 11",
			      "3x8 @8.3", "3x12-8", "3x8 RPE 8 RIR 2", "3x12,10,8", "3x5 @8,5", "3x5,",
			      "3x101", "3x4000s", "3x8 @0", "3x8 RPE 0.5", "3x8 @200%", "3xamrapx" };
	for (size_t i = 0; i < sizeof bad / sizeof *bad; i++)
		if (prog_parse_sets(bad[i], 0, g, 4, NULL, &e) >= 0)
			fail_msg("'%s' accepted", bad[i]);
}

/* Field by field (padding bytes of a copied struct need not match). */
static int same_entry(const struct sd_entry *a, const struct sd_entry *b)
{
	return a->ex == b->ex && a->sets == b->sets && a->reps == b->reps && a->rir == b->rir &&
	       a->day == b->day && a->reps_hi == b->reps_hi && a->flags == b->flags &&
	       a->effort == b->effort && a->eff_lo == b->eff_lo && a->eff_hi == b->eff_hi &&
	       a->load_pct == b->load_pct;
}

/* Written back, every notation reads the same. */
static void test_format_roundtrip(void **state)
{
	const char *in[] = { "4", "3x8", "3x8-12 @8", "3xAMRAP", "3x8/side RIR 2", "3x30s @7",
			     "2x5 warm-up", "5x3 @80% RIR 3", "3x5 RPE 3", "3x8 RIR 1-2", "3x8 @7.5-8.5" };
	(void)state;
	for (size_t i = 0; i < sizeof in / sizeof *in; i++) {
		struct sd_entry a = one(in[i]), b;
		char buf[96];
		prog_format_group(&a, buf, sizeof buf);
		b = one(buf);
		if (!same_entry(&a, &b))
			fail_msg("'%s' written as '%s' reads differently", in[i], buf);
	}
}

static void expect_error(const char *text, const char *needle)
{
	struct sd_program p;
	struct sd_err e;
	sd_err_clear(&e);
	if (parse(text, &p, &e) == 0)
		fail_msg("accepted: %s", text);
	if (!strstr(e.msg, needle))
		fail_msg("message '%s' lacks '%s'", e.msg, needle);
}

static void test_errors(void **state)
{
	(void)state;
	expect_error("[a]\nbench pres = 3\n", "line 2: unknown exercise 'bench pres' (did you mean 'bench press'");
	expect_error("[a]\nbench press = 10000\n", "line 2: absurd set count");
	expect_error("[a]\nbench press = -3\n", "negative set count");
	expect_error("[a]\nbench press = 3x8 RIR 12\n", "RIR out of range");
	expect_error("[a]\nbench press = 3x8 @12\n", "RPE out of range");
	expect_error("[a]\nbench press = three\n", "bad set syntax");
	expect_error("; nothing\n", "no exercises (empty program)");
	expect_error("bench press = 3\n", "line 1: 'bench press' comes before any [day] section");
	expect_error("[program]\nweeks = 0\n[a]\nbench press = 3\n", "line 2: weeks must be");
	expect_error("[program]\ncolour = red\n[a]\nbench press = 3\n", "unknown key 'colour'");
	expect_error("[a]\nbench press = 3\n[A]\nback squat = 3\n", "line 3: day 'A' appears twice (first on line 1)");
	expect_error("[program]\nname = a\n[program]\nweeks = 4\n[a]\nbench press = 3\n",
		     "line 3: second [program] section (the first is on line 1)");
	expect_error("[program]\nweeks = 4\nweeks = 6\n[a]\nbench press = 3\n",
		     "line 3: 'weeks' given twice (first on line 2)");
	expect_error("[program]\neffort = rpx\n[a]\nbench press = 3\n", "line 2: effort must be");
	expect_error("[a\nbench press = 3\n", "line 1: bad section header");
	expect_error("[a]\nbench press 3\n", "line 2: expected 'name = value'");
}

/* The same exercise twice in a day adds up, with a note naming both lines; on two days it is
 * simply two days. */
static void test_same_exercise(void **state)
{
	struct sd_program p;
	struct sd_volume v;
	struct sd_err e;
	(void)state;
	assert_int_equal(parse("[a]\nbench press = 3\n[b]\nbench press = 2\n", &p, &e), 0);
	assert_int_equal(p.nentries, 2);
	assert_int_equal(p.nnotes, 0);
	prog_free(&p);
	assert_int_equal(parse("[a]\nbench press = 1x3 @9, 3x5 @7\nflat bench = 2x10 @8\n", &p, &e), 0);
	assert_int_equal(p.nentries, 3);
	assert_int_equal(p.nnotes, 1);
	assert_string_equal(p.notes[0].text, "line 3: 'flat bench' again in 'a' (first on line 2): "
			    "the sets add up");
	assert_int_equal(vol_count(&p, &lib, 1.0, 0.5, 4, &v, &e), 0);
	assert_near(v.m[SD_CHEST].fractional, 6, 1e-12);
	vol_free(&v);
	prog_free(&p);
}

/* Every problem of a file in one run, each with its line, and nothing read. */
static void test_all_errors(void **state)
{
	struct sd_program p;
	struct sd_err e;
	(void)state;
	sd_err_clear(&e);
	assert_int_equal(parse("[program]\nweeks = 0\n[a]\nbench pres = 3\nback squat = 3y8\n"
			       "barbell row = 3x8\ntriceps pushdwn = 2\n[a]\n", &p, &e), -1);
	assert_non_null(strstr(e.msg, "'t.ini' line 2: weeks must be"));
	assert_non_null(strstr(e.msg, "(first of 5 errors)"));
	assert_int_equal(e.nmore, 4);
	assert_int_equal(sd_more_shown(&e), 4);
	assert_non_null(strstr(e.more, "'t.ini' line 4: unknown exercise 'bench pres'"));
	assert_non_null(strstr(e.more, "'t.ini' line 5: bad set syntax '3y8'"));
	assert_non_null(strstr(e.more, "'t.ini' line 7: unknown exercise 'triceps pushdwn'"));
	assert_non_null(strstr(e.more, "'t.ini' line 8: day 'a' appears twice (first on line 3)\n"));
	assert_null(p.entries);   /* nothing kept */
}

/* How coaches write old programs: a bare @N below 5 is read as RPE and flagged once. */
static void test_old_meaning(void **state)
{
	struct sd_program p;
	struct sd_volume v;
	struct sd_err e;
	(void)state;
	assert_int_equal(parse("[a]\nbench press = 3x5 @2\nback squat = 3x5 @1\n", &p, &e), 0);
	assert_int_equal(p.nnotes, 1);
	assert_string_equal(p.notes[0].text, "lines 2, 3: RPE 2 is far from hard; did you mean RIR 2? "
			    "(a bare @N is RPE: write 'RIR 2', or 'effort = rir' under [program])");
	assert_int_equal(vol_count(&p, &lib, 1.0, 0.5, 4, &v, &e), 0);
	assert_int_equal(v.hard_sets, 0);
	assert_int_equal(v.easy_sets, 6);
	vol_free(&v);
	prog_free(&p);
	/* The same file with 'effort = rir' keeps its old reading. */
	assert_int_equal(parse("[program]\neffort = rir\n[a]\nbench press = 3x5 @2\n"
			       "back squat = 3x5 @1\n", &p, &e), 0);
	assert_int_equal(p.nnotes, 0);
	assert_int_equal(vol_count(&p, &lib, 1.0, 0.5, 4, &v, &e), 0);
	assert_int_equal(v.hard_sets, 6);
	vol_free(&v);
	prog_free(&p);
}

/* A program written back reads to the same days, groups and efforts (the writer spells out
 * what the reader would otherwise take for RPE), and to the same counts. */
static void test_write_roundtrip(void **state)
{
	const char *text = "[program]\nname = rt\nweeks = 5\neffort = rir\n[a]\n"
			   "bench press = 2x5 warm-up, 1x3 @1, 3x5 @3\nback squat = 3x8-12 RPE 7.5\n"
			   "barbell row = 3xAMRAP, 2x8/side @80% RIR 1-2\ntriceps pushdown = 3x30s\n"
			   "[b]\nbench press = 4\nbench press = 2x10 RPE 4\n";
	struct sd_program p, q;
	struct sd_volume v, w;
	struct sd_err e;
	char *buf = NULL;
	size_t len = 0;
	(void)state;
	assert_int_equal(parse(text, &p, &e), 0);
	FILE *f = open_memstream(&buf, &len);
	assert_int_equal(pwrite_ini(f, &p, &lib, NULL, &e), 0);
	fclose(f);
	if (program_parse("w.ini", buf, len, 0, &lib, &q, &e))
		fail_msg("%s\n%s", e.msg, buf);
	assert_string_equal(q.name, "rt");
	assert_int_equal(q.weeks, 5);
	assert_int_equal(q.nentries, p.nentries);
	for (int i = 0; i < p.nentries; i++) {
		if (!same_entry(&p.entries[i], &q.entries[i]))
			fail_msg("entry %d differs after writing:\n%s", i, buf);
	}
	assert_int_equal(q.nnotes, 1);   /* the second bench press on [b] adds up, with its note */
	assert_int_equal(vol_count(&p, &lib, 1.0, 0.5, 4, &v, &e), 0);
	assert_int_equal(vol_count(&q, &lib, 1.0, 0.5, 4, &w, &e), 0);
	for (int m = 0; m < SD_NMUSCLES; m++)
		assert_near(v.m[m].fractional, w.m[m].fractional, 0);
	assert_int_equal(v.warmup_sets, 2);
	assert_int_equal(v.easy_sets, 2);   /* RPE 4 = RIR 6 */
	vol_free(&v);
	vol_free(&w);
	prog_free(&p);
	prog_free(&q);
	free(buf);
}

/* Where each muscle's sets come from: per exercise, largest share first, summing to the total. */
static void test_sources(void **state)
{
	struct sd_program p;
	struct sd_volume v;
	struct sd_err e;
	int n;
	(void)state;
	assert_int_equal(parse("[a]\nbench press = 3\ntriceps pushdown = 2\n[b]\nbench press = 4\n"
			       "triceps pushdown = 2x10 warm-up\n", &p, &e), 0);
	assert_int_equal(vol_count(&p, &lib, 1.0, 0.5, 4, &v, &e), 0);
	const struct sd_source *s = vol_sources(&v, SD_TRICEPS, &n);
	assert_int_equal(n, 2);
	assert_string_equal(lib.ex[s[0].ex].name, "bench press");   /* 7 x 0.5 = 3.5 */
	assert_near(s[0].indirect, 7, 0);
	assert_near(s[0].fractional, 3.5, 0);
	assert_string_equal(lib.ex[s[1].ex].name, "triceps pushdown");   /* 2 direct; the warm-up not */
	assert_near(s[1].direct, 2, 0);
	assert_near(s[1].fractional, 2, 0);
	assert_near(s[0].fractional + s[1].fractional, v.m[SD_TRICEPS].fractional, 1e-12);
	s = vol_sources(&v, SD_CHEST, &n);
	assert_int_equal(n, 1);
	assert_near(s[0].direct, 7, 0);
	assert_null(vol_sources(&v, SD_CALVES, &n));
	assert_int_equal(n, 0);
	vol_free(&v);
	prog_free(&p);
}

static void test_csv(void **state)
{
	const char *text = "day,exercise,sets,reps,rir\r\n"
			   "mon,bench press,3,5,2\r\nmon,\"triceps pushdown\",2,,\r\n"
			   "thu,flat bench,4,3,1\r\nthu,back squat,5,5,\r\n";
	struct sd_program p;
	struct sd_volume v;
	struct sd_err e;
	(void)state;
	assert_int_equal(program_parse("t.csv", text, strlen(text), 1, &lib, &p, &e), 0);
	assert_int_equal(p.ndays, 2);
	assert_int_equal(p.nentries, 4);
	assert_int_equal(vol_count(&p, &lib, 1.0, 0.5, 4, &v, &e), 0);
	assert_near(v.m[SD_CHEST].fractional, 7, 1e-12);
	assert_near(v.m[SD_TRICEPS].fractional, 5.5, 1e-12);
	vol_free(&v);
	prog_free(&p);
	/* The same exercise twice in one day adds up, with a note. */
	const char *twice = "day,exercise,sets\nmon,bench press,3\nmon,bench press,2\n";
	assert_int_equal(program_parse("b.csv", twice, strlen(twice), 1, &lib, &p, &e), 0);
	assert_int_equal(p.nnotes, 1);
	assert_non_null(strstr(p.notes[0].text, "line 3: 'bench press' again in 'mon' (first on line 2)"));
	prog_free(&p);
	const char *bad2 = "day,exercise,sets\nmon,bench press,abc\nmon,back squat,-1\n";
	assert_int_equal(program_parse("b.csv", bad2, strlen(bad2), 1, &lib, &p, &e), -1);
	assert_non_null(strstr(e.msg, "'b.csv' line 2: bad set syntax 'abc'"));
	assert_non_null(strstr(e.more, "'b.csv' line 3: negative set count '-1'"));
	/* A UTF-8 byte-order mark (spreadsheet export) is not part of the header. */
	const char *bom = "\xEF\xBB\xBF" "day,exercise,sets\nmon,bench press,3\n";
	assert_int_equal(program_parse("bom.csv", bom, strlen(bom), 1, &lib, &p, &e), 0);
	assert_int_equal(p.nentries, 1);
	prog_free(&p);
	const char *bad3 = "exercise,sets\nbench press,3\n";
	assert_int_equal(program_parse("b.csv", bad3, strlen(bad3), 1, &lib, &p, &e), -1);
	assert_non_null(strstr(e.msg, "header"));
	const char *both = "day,exercise,sets,rir,rpe\nmon,bench press,3,2,8\n";
	assert_int_equal(program_parse("b.csv", both, strlen(both), 1, &lib, &p, &e), -1);
	assert_non_null(strstr(e.msg, "line 1: header names both rir and rpe"));
	const char *twice_eff = "day,exercise,sets,rpe\nmon,bench press,3x5 @8,8\n";
	assert_int_equal(program_parse("b.csv", twice_eff, strlen(twice_eff), 1, &lib, &p, &e), -1);
	assert_non_null(strstr(e.msg, "line 2: effort given in both the sets and rpe columns"));
}

/* Spreadsheet exports: semicolons with decimal commas, tabs, name and weeks in comment lines,
 * an rpe column, rep ranges, AMRAP and blank rows; the same program as INI audits alike. */
static void test_csv_spreadsheets(void **state)
{
	const char *ini = "[program]\nname = split\nweeks = 6\n[mon]\nbench press = 3x8-10 @8.5\n"
			  "back squat = 2xAMRAP\n[thu]\nbarbell row = 4x10 RIR 1-2\n"
			  "triceps pushdown = 2x12 @5.5\n";
	const char *semi = "# name: split\n# weeks: 6\n# a plain comment\n"
			   "day;exercise;sets;reps;rpe\nmon;bench press;3;8-10;8,5\nmon;back squat;2;AMRAP;\n"
			   ";;;;\nthu;barbell row;4;10;8-8,5\nthu;triceps pushdown;2;12;5,5\n";
	const char *tab = "#name=split\n#weeks=6\nday\texercise\tsets\treps\trir\n"
			  "mon\tbench press\t3\t8-10\t1.5\nmon\tback squat\t2xAMRAP\t\t\n"
			  "thu\tbarbell row\t4x10 RIR 1-2\t\t\nthu\ttriceps pushdown\t2\t12\t4.5\n";
	const char *texts[3] = { ini, semi, tab };
	struct sd_volume v[3];
	struct sd_program p;
	struct sd_err e;
	(void)state;
	for (int i = 0; i < 3; i++) {
		if (program_parse(i ? "t.csv" : "t.ini", texts[i], strlen(texts[i]), i > 0, &lib, &p, &e))
			fail_msg("text %d: %s", i, e.msg);
		assert_string_equal(p.name, "split");
		assert_int_equal(p.named, 1);
		assert_int_equal(p.weeks, 6);
		assert_int_equal(p.ndays, 2);
		assert_int_equal(vol_count(&p, &lib, 1.0, 0.5, 4, &v[i], &e), 0);
		prog_free(&p);
	}
	/* bench 3 + squat 2 (AMRAP: RIR 0) + row 4 (RIR 1.5) hard; pushdown RPE 5.5 = RIR 4.5 is not */
	assert_int_equal(v[0].hard_sets, 9);
	assert_int_equal(v[0].easy_sets, 2);
	assert_near(v[0].m[SD_CHEST].fractional, 3, 1e-12);
	assert_near(v[0].m[SD_TRICEPS].fractional, 1.5, 1e-12);
	for (int i = 1; i < 3; i++) {
		assert_int_equal(v[i].hard_sets, v[0].hard_sets);
		assert_int_equal(v[i].easy_sets, v[0].easy_sets);
		for (int m = 0; m < SD_NMUSCLES; m++)
			assert_near(v[i].m[m].fractional, v[0].m[m].fractional, 0);
	}
	for (int i = 0; i < 3; i++)
		vol_free(&v[i]);
}

static void test_suggest(void **state)
{
	int idx[3];
	(void)state;
	int n = lib_suggest(&lib, "bench pres", idx, 3);
	assert_true(n >= 1);
	assert_string_equal(lib.ex[idx[0]].name, "bench press");
	assert_int_equal(lib_suggest(&lib, "zzzzzzzzzzzzzz", idx, 3), 0);
	assert_int_equal(lib_find(&lib, "BACK_SQUAT"), 2);
	assert_int_equal(lib_find(&lib, "back-squat"), 2);
	assert_int_equal(lib_find(&lib, "squat"), -1);
}

int main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(test_count),
		cmocka_unit_test(test_sets_syntax),
		cmocka_unit_test(test_errors),
		cmocka_unit_test(test_format_roundtrip),
		cmocka_unit_test(test_same_exercise),
		cmocka_unit_test(test_all_errors),
		cmocka_unit_test(test_old_meaning),
		cmocka_unit_test(test_write_roundtrip),
		cmocka_unit_test(test_sources),
		cmocka_unit_test(test_csv),
		cmocka_unit_test(test_csv_spreadsheets),
		cmocka_unit_test(test_suggest),
	};
	return cmocka_run_group_tests_name("volume", tests, setup, teardown);
}
