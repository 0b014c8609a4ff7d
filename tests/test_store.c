/* The store on :memory: and on temporary files: schema versions, each table's round trip,
 * constraints, transactions, checks and backups. */
#include "testutil.h"

#include <sqlite3.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "store/db.h"

static char tmpdir[256];

static int setup_dir(void **state)
{
	(void)state;
	strcpy(tmpdir, "/tmp/sdstoreXXXXXX");
	return mkdtemp(tmpdir) ? 0 : -1;
}

static int remove_dir(void **state)
{
	char cmd[300];
	(void)state;
	snprintf(cmd, sizeof cmd, "rm -rf '%s'", tmpdir);
	return system(cmd) ? -1 : 0;
}

static struct sd_db *mem(void)
{
	struct sd_db *db = NULL;
	struct sd_err e = { 0 };
	if (db_open(":memory:", &db, &e))
		fail_msg("%s", e.msg);
	return db;
}

static long long add_athlete(struct sd_db *db, const char *name, int trained)
{
	struct db_athlete a = { 0 };
	struct sd_err e = { 0 };
	long long id = 0;
	snprintf(a.name, sizeof a.name, "%s", name);
	a.trained = trained;
	if (db_athlete_add(db, &a, &id, &e))
		fail_msg("%s", e.msg);
	return id;
}

static void opens_and_migrates(void **state)
{
	struct sd_db *db = mem();
	(void)state;
	assert_int_equal(db_schema_version(db), db_schema_latest());
	assert_true(db_schema_latest() >= 1);
	assert_int_equal(db_check(db, NULL, NULL), 0);
	db_close(db);
	db_close(NULL);
}

static void athletes(void **state)
{
	struct sd_db *db = mem();
	struct db_athlete a = { 0 }, b, *list = NULL;
	struct sd_err e = { 0 };
	int n = 0, nb, nt;
	(void)state;
	snprintf(a.name, sizeof a.name, "Mara Quell");
	a.trained = 1;
	a.units_lb = 1;
	snprintf(a.notes, sizeof a.notes, "knee; no deep squats");
	assert_int_equal(db_athlete_add(db, &a, &a.id, &e), 0);
	add_athlete(db, "Ash Brenner", 0);
	/* Names are unique ignoring case. */
	snprintf(a.name, sizeof a.name, "mara QUELL");
	assert_int_equal(db_athlete_add(db, &a, NULL, &e), -1);
	assert_string_equal(e.msg, "athlete 'mara QUELL' already exists");
	assert_int_equal(db_athlete_get(db, "MARA quell", &b, &e), 0);
	assert_string_equal(b.name, "Mara Quell");
	assert_int_equal(b.trained, 1);
	assert_int_equal(b.units_lb, 1);
	assert_string_equal(b.notes, "knee; no deep squats");
	assert_int_equal(strlen(b.created), 19);
	assert_int_equal(db_athlete_get(db, "Nobody", &b, &e), -1);
	assert_non_null(strstr(e.msg, "unknown athlete 'Nobody'"));
	/* Text that looks like SQL is only ever a value. */
	add_athlete(db, "x'); DROP TABLE athletes; --", 0);
	assert_int_equal(db_athlete_list(db, &list, &n, &e), 0);
	assert_int_equal(n, 3);
	assert_string_equal(list[0].name, "Ash Brenner");
	assert_string_equal(list[1].name, "Mara Quell");
	free(list);
	/* Edit: renaming onto another athlete's name is refused. */
	assert_int_equal(db_athlete_get(db, "Ash Brenner", &b, &e), 0);
	snprintf(b.name, sizeof b.name, "Mara Quell");
	assert_int_equal(db_athlete_update(db, &b, &e), -1);
	snprintf(b.name, sizeof b.name, "Ash B.");
	b.trained = 1;
	assert_int_equal(db_athlete_update(db, &b, &e), 0);
	assert_int_equal(db_athlete_get(db, "ash b.", &b, &e), 0);
	assert_int_equal(b.trained, 1);
	assert_int_equal(db_athlete_refs(db, b.id, &nb, &nt, &e), 0);
	assert_int_equal(nb + nt, 0);
	assert_int_equal(db_athlete_rm(db, b.id, 0, &e), 0);
	assert_int_equal(db_athlete_get(db, "ash b.", &b, &e), -1);
	db_close(db);
}

static const char ini[] = "[program]\r\nname = x\r\n[day a]\nbench press = 3x8 @2\n\tno newline";

static void programs(void **state)
{
	struct sd_db *db = mem();
	struct db_program p, *list = NULL;
	struct sd_err e = { 0 };
	long long id;
	int n, nb;
	(void)state;
	assert_int_equal(db_program_add(db, "Upper Lower", ini, sizeof ini - 1, 0, &id, &e), 0);
	assert_int_equal(db_program_add(db, "empty", "", 0, 1, NULL, &e), 0);
	assert_int_equal(db_program_add(db, "upper lower", "x", 1, 0, NULL, &e), -1);
	assert_string_equal(e.msg, "program 'upper lower' already exists");
	/* Byte for byte, CR LF and tab and missing final newline included. */
	assert_int_equal(db_program_get(db, "UPPER lower", &p, &e), 0);
	assert_int_equal(p.len, sizeof ini - 1);
	assert_memory_equal(p.source, ini, sizeof ini - 1);
	assert_int_equal(p.source[p.len], '\0');
	assert_int_equal(p.is_csv, 0);
	assert_int_equal(p.id, id);
	db_program_free(&p);
	assert_int_equal(db_program_get(db, "empty", &p, &e), 0);
	assert_int_equal(p.len, 0);
	assert_int_equal(p.is_csv, 1);
	db_program_free(&p);
	assert_int_equal(db_program_get_id(db, id, &p, &e), 0);
	assert_string_equal(p.name, "Upper Lower");
	db_program_free(&p);
	assert_int_equal(db_program_get(db, "nope", &p, &e), -1);
	assert_non_null(strstr(e.msg, "unknown program 'nope'"));
	assert_int_equal(db_program_list(db, &list, &n, &e), 0);
	assert_int_equal(n, 2);
	assert_string_equal(list[0].name, "empty");
	assert_null(list[0].source);
	db_program_list_free(list, n);
	/* In use: refused. */
	assert_int_equal(db_block_add(db, add_athlete(db, "A", 1), id, "2024-01-08", 8, NULL, &e), 0);
	assert_int_equal(db_program_refs(db, id, &nb, &e), 0);
	assert_int_equal(nb, 1);
	assert_int_equal(db_program_rm(db, id, &e), -1);
	assert_non_null(strstr(e.msg, "used by 1 block"));
	db_close(db);
}

static int count_open(const struct db_block *b, void *arg)
{
	assert_string_equal(b->end, "");
	(*(int *)arg)++;
	return 0;
}

static int stop_at_first(const struct db_block *b, void *arg)
{
	(void)b;
	(void)arg;
	return 7;
}

static void blocks_and_tests(void **state)
{
	struct sd_db *db = mem();
	struct sd_err e = { 0 };
	struct db_block b, *list = NULL;
	struct db_test t = { 0 }, *tl = NULL;
	long long a1, a2, pid, b1, b2;
	int n, nopen = 0, nb, nt;
	(void)state;
	a1 = add_athlete(db, "Zed", 1);
	a2 = add_athlete(db, "Bea", 0);
	assert_int_equal(db_program_add(db, "P", "[d]\nsquat = 3\n", 13, 0, &pid, &e), 0);
	assert_int_equal(db_block_add(db, a1, pid, "2024-01-08", 8, &b1, &e), 0);
	assert_int_equal(db_block_add(db, a2, pid, "2024-02-05", 6, &b2, &e), 0);
	assert_int_equal(db_block_add(db, a2, pid, "2023-09-04", 10, NULL, &e), 0);
	/* Constraints the store relies on: real foreign keys, real dates, sane weeks. */
	assert_int_equal(db_block_add(db, 999, pid, "2024-01-08", 8, NULL, &e), -1);
	assert_int_equal(db_block_add(db, a1, pid, "2024-02-30", 8, NULL, &e), -1);
	assert_int_equal(db_block_add(db, a1, pid, "2024-01-08", 0, NULL, &e), -1);
	assert_int_equal(db_block_get(db, b1, &b, &e), 0);
	assert_string_equal(b.athlete, "Zed");
	assert_string_equal(b.program, "P");
	assert_string_equal(b.start, "2024-01-08");
	assert_string_equal(b.end, "");
	assert_int_equal(b.weeks, 8);
	assert_int_equal(db_block_end(db, b1, "2024-01-01", &e), -1);
	assert_non_null(strstr(e.msg, "before"));
	assert_int_equal(db_block_end(db, b1, "2024-03-04", &e), 0);
	assert_int_equal(db_block_end(db, b1, "2024-03-05", &e), -1);
	assert_non_null(strstr(e.msg, "already ended on 2024-03-04"));
	assert_int_equal(db_block_get(db, 12345, &b, &e), -1);
	assert_non_null(strstr(e.msg, "unknown block 12345"));
	assert_int_equal(db_block_list(db, 0, &list, &n, &e), 0);
	assert_int_equal(n, 3);
	assert_string_equal(list[0].athlete, "Bea");
	assert_string_equal(list[0].start, "2023-09-04");
	assert_string_equal(list[2].end, "2024-03-04");
	free(list);
	assert_int_equal(db_block_list(db, a1, &list, &n, &e), 0);
	assert_int_equal(n, 1);
	free(list);
	assert_int_equal(db_block_each_open(db, count_open, &nopen, &e), 0);
	assert_int_equal(nopen, 2);
	assert_int_equal(db_block_each_open(db, stop_at_first, NULL, &e), 7);

	t.athlete_id = a1;
	snprintf(t.lift, sizeof t.lift, "back squat");
	snprintf(t.date, sizeof t.date, "2024-01-06");
	t.load_kg = 140;
	t.reps = 5;
	t.e1rm_kg = 157.5;
	snprintf(t.formula, sizeof t.formula, "brzycki");
	assert_int_equal(db_test_add(db, &t, NULL, &e), 0);
	snprintf(t.lift, sizeof t.lift, "bench press");
	assert_int_equal(db_test_add(db, &t, NULL, &e), 0);
	t.reps = 25;   /* refused by the schema too */
	assert_int_equal(db_test_add(db, &t, NULL, &e), -1);
	t.reps = 5;
	t.load_kg = -1;
	assert_int_equal(db_test_add(db, &t, NULL, &e), -1);
	assert_int_equal(db_test_list(db, a1, NULL, &tl, &n, &e), 0);
	assert_int_equal(n, 2);
	assert_string_equal(tl[0].lift, "back squat");
	assert_near(tl[1].e1rm_kg, 157.5, 0);
	free(tl);
	assert_int_equal(db_test_list(db, a1, "BACK SQUAT", &tl, &n, &e), 0);
	assert_int_equal(n, 1);
	free(tl);

	/* Removing an athlete with data needs cascade, and cascade takes all of it. */
	assert_int_equal(db_athlete_rm(db, a1, 0, &e), -1);
	assert_non_null(strstr(e.msg, "1 block and 2 tests"));
	assert_int_equal(db_athlete_rm(db, a1, 1, &e), 0);
	assert_int_equal(db_athlete_refs(db, a1, &nb, &nt, &e), 0);
	assert_int_equal(nb + nt, 0);
	assert_int_equal(db_check(db, NULL, &e), 0);
	db_close(db);
}

/* The compact roster: sorted by name ignoring case, names folded for search, notes cut at
 * note_max bytes, and the per-athlete counts from one query. */
static void roster(void **state)
{
	struct sd_db *db = mem();
	struct sd_err e = { 0 };
	struct db_roster r;
	struct db_athlete a = { 0 };
	long long zed, bea, pid;
	(void)state;
	zed = add_athlete(db, "Zed Quill", 1);
	snprintf(a.name, sizeof a.name, "bea Ostler");
	snprintf(a.notes, sizeof a.notes, "left knee: no deep flexion");
	a.units_lb = 1;
	assert_int_equal(db_athlete_add(db, &a, &bea, &e), 0);
	assert_int_equal(db_program_add(db, "P", "[d]\nsquat = 3\n", 13, 0, &pid, &e), 0);
	assert_int_equal(db_block_add(db, zed, pid, "2024-01-08", 8, NULL, &e), 0);
	assert_int_equal(db_block_add(db, zed, pid, "2024-03-04", 8, NULL, &e), 0);
	assert_int_equal(db_roster_load(db, 9, 1, &r, &e), 0);
	assert_int_equal(r.n, 2);
	assert_string_equal(r.v[0].name, "bea Ostler");     /* b before Z: case ignored */
	assert_string_equal(r.v[0].key, "bea ostler");
	assert_string_equal(r.v[0].notes, "left knee");      /* first 9 bytes */
	assert_int_equal(r.v[0].units_lb, 1);
	assert_int_equal(r.v[0].nblocks, 0);
	assert_string_equal(r.v[1].key, "zed quill");
	assert_int_equal(r.v[1].trained, 1);
	assert_int_equal(r.v[1].nblocks, 2);
	assert_int_equal(r.v[1].ntests, 0);
	assert_int_equal((int)strlen(r.v[1].created), 10);
	db_roster_free(&r);
	assert_int_equal(db_roster_load(db, 0, 0, &r, &e), 0);
	assert_string_equal(r.v[0].notes, "left knee: no deep flexion");
	assert_int_equal(r.v[1].nblocks, 0);                 /* not asked for */
	db_roster_free(&r);
	assert_int_equal(db_athlete_get_id(db, bea, &a, &e), 0);
	assert_string_equal(a.name, "bea Ostler");
	assert_int_equal(db_athlete_get_id(db, 999, &a, &e), -1);
	db_close(db);
}

static void transactions(void **state)
{
	struct sd_db *db = mem();
	struct sd_err e = { 0 };
	struct db_athlete *list;
	int n;
	(void)state;
	assert_int_equal(db_begin(db, &e), 0);
	add_athlete(db, "Gone", 1);
	db_rollback(db);
	assert_int_equal(db_begin(db, &e), 0);
	add_athlete(db, "Kept", 1);
	assert_int_equal(db_commit(db, &e), 0);
	/* Left open: closing rolls it back (checked on a file below). */
	assert_int_equal(db_athlete_list(db, &list, &n, &e), 0);
	assert_int_equal(n, 1);
	assert_string_equal(list[0].name, "Kept");
	free(list);
	db_rollback(db);   /* no transaction open: harmless */
	db_close(db);
}

static void files_backup_and_versions(void **state)
{
	char path[400], bak[400], other[400];
	struct sd_db *db = NULL, *db2 = NULL;
	struct sd_err e = { 0 };
	struct db_athlete *list;
	sqlite3 *h;
	FILE *f;
	int n, problems = -1;
	(void)state;
	/* The folder is created on first use. */
	snprintf(path, sizeof path, "%s/deep/er/setdose.db", tmpdir);
	assert_int_equal(db_open(path, &db, &e), 0);
	assert_string_equal(db_path(db), path);
	add_athlete(db, "Ola", 1);
	assert_int_equal(db_begin(db, &e), 0);
	add_athlete(db, "Half", 1);
	db_close(db);   /* unfinished transaction: rolled back */
	assert_int_equal(db_open(path, &db, &e), 0);
	assert_int_equal(db_athlete_list(db, &list, &n, &e), 0);
	assert_int_equal(n, 1);
	free(list);
	assert_int_equal(db_check(db, &problems, &e), 0);
	assert_int_equal(problems, 0);
	/* The backup goes into an empty file the caller made (io/safefile.h's temporary file);
	 * refusing an existing target is the safe writer's job (test_safefile.c). */
	snprintf(bak, sizeof bak, "%s/backup.db", tmpdir);
	assert_non_null(f = fopen(bak, "w"));
	fclose(f);
	assert_int_equal(db_backup(db, bak, "backup.db", &e), 0);
	db_close(db);
	assert_int_equal(db_open(bak, &db2, &e), 0);
	assert_int_equal(db_athlete_list(db2, &list, &n, &e), 0);
	assert_int_equal(n, 1);
	assert_string_equal(list[0].name, "Ola");
	free(list);
	assert_int_equal(db_check(db2, NULL, &e), 0);
	db_close(db2);

	/* A database from a newer setdose is refused, untouched. */
	assert_int_equal(sqlite3_open(path, &h), SQLITE_OK);
	assert_int_equal(sqlite3_exec(h, "PRAGMA user_version = 99", NULL, NULL, NULL), SQLITE_OK);
	sqlite3_close(h);
	assert_int_equal(db_open(path, &db, &e), -1);
	assert_non_null(strstr(e.msg, "schema version 99, newer than this setdose"));
	/* Another program's SQLite file, and a file that is no database at all. */
	snprintf(other, sizeof other, "%s/other.db", tmpdir);
	assert_int_equal(sqlite3_open(other, &h), SQLITE_OK);
	assert_int_equal(sqlite3_exec(h, "CREATE TABLE t (x)", NULL, NULL, NULL), SQLITE_OK);
	sqlite3_close(h);
	assert_int_equal(db_open(other, &db, &e), -1);
	assert_non_null(strstr(e.msg, "not a setdose database"));
	snprintf(other, sizeof other, "%s/notes.txt", tmpdir);
	f = fopen(other, "w");
	assert_non_null(f);
	for (int i = 0; i < 200; i++)
		fputs("these are plain notes, not a database\n", f);
	fclose(f);
	assert_int_equal(db_open(other, &db, &e), -1);
	assert_non_null(strstr(e.msg, "not"));
}

static void default_path(void **state)
{
	char buf[512];
	(void)state;
	setenv("XDG_DATA_HOME", "/x/data", 1);
	assert_string_equal(db_default_path(buf, sizeof buf), "/x/data/setdose/setdose.db");
	unsetenv("XDG_DATA_HOME");
	setenv("HOME", "/home/u", 1);
	assert_string_equal(db_default_path(buf, sizeof buf), "/home/u/.local/share/setdose/setdose.db");
	assert_null(db_default_path(buf, 10));
	unsetenv("HOME");
	assert_null(db_default_path(buf, sizeof buf));
}

/* Hands out rows from an array, for db_log_add. */
struct rows {
	const struct db_log *v;
	int n, i;
};

static int next_row(void *arg, struct db_log *out, struct sd_err *e)
{
	struct rows *r = arg;
	(void)e;
	if (r->i == r->n)
		return 0;
	*out = r->v[r->i++];
	return 1;
}

static int count_row(const struct db_log *r, const char *athlete, void *arg)
{
	(void)r;
	(void)athlete;
	(*(int *)arg)++;
	return 0;
}

static int sum_row(const struct db_log_sum *s, void *arg)
{
	int *v = arg;
	v[0] += s->within;
	v[1] += s->above;
	v[2] += s->unrecorded;
	v[3]++;
	return 0;
}

static int week_row(const struct db_log_week *w, void *arg)
{
	char *buf = arg;
	size_t used = strlen(buf);
	snprintf(buf + used, 512 - used, "%s %s %g %d %u; ", w->monday, w->exercise, w->rir,
		 w->sets, w->days);
	return 0;
}

static struct db_log log_row(long long athlete, const char *date, const char *ex, int sets,
			     int reps, double rir, double load, const char *unit, int ordinal)
{
	struct db_log r;
	memset(&r, 0, sizeof r);
	r.athlete_id = athlete;
	snprintf(r.date, sizeof r.date, "%s", date);
	snprintf(r.exercise, sizeof r.exercise, "%s", ex);
	r.sets = sets;
	r.reps = reps;
	r.rir = rir;
	r.load = load;
	snprintf(r.unit, sizeof r.unit, "%s", unit);
	r.ordinal = ordinal;
	snprintf(r.source, sizeof r.source, "test line %d", ordinal);
	return r;
}

/* The log: identical rows meet their twin in the unique index (the ordinal tells apart
 * identical sets logged twice on one day); a CHECK failure is an error, never skipped. */
static void logs(void **state)
{
	struct sd_db *db = mem();
	struct sd_err e = { 0 };
	long long a = add_athlete(db, "Ada", 1), b = add_athlete(db, "Bo", 0), added = -1, n;
	struct db_log v[4];
	struct rows r;
	int seen = 0, sums[4] = { 0 };
	(void)state;

	v[0] = log_row(a, "2026-12-31", "back squat", 3, 5, 2, 100, "kg", 1);
	v[1] = log_row(a, "2026-12-31", "back squat", 3, 5, 2, 100, "kg", 2);
	v[2] = log_row(a, "2027-01-04", "bench press", 1, 8, -1, 0, "", 1);
	v[3] = log_row(b, "2027-01-04", "bench press", 2, 8, 6, 225, "lb", 1);
	r = (struct rows){ v, 4, 0 };
	assert_int_equal(db_begin(db, &e), 0);
	assert_int_equal(db_log_add(db, next_row, &r, &added, &e), 0);
	assert_int_equal(db_commit(db, &e), 0);
	assert_int_equal(added, 4);
	/* The same rows again: nothing new. */
	r = (struct rows){ v, 4, 0 };
	assert_int_equal(db_begin(db, &e), 0);
	assert_int_equal(db_log_add(db, next_row, &r, &added, &e), 0);
	assert_int_equal(db_commit(db, &e), 0);
	assert_int_equal(added, 0);
	assert_int_equal(db_log_count(db, 0, &n, &e), 0);
	assert_int_equal(n, 4);
	assert_int_equal(db_log_count(db, a, &n, &e), 0);
	assert_int_equal(n, 3);
	/* A third identical set that day is new. */
	v[0].ordinal = 3;
	r = (struct rows){ v, 1, 0 };
	assert_int_equal(db_begin(db, &e), 0);
	assert_int_equal(db_log_add(db, next_row, &r, &added, &e), 0);
	assert_int_equal(db_commit(db, &e), 0);
	assert_int_equal(added, 1);
	/* A load with no unit breaks a CHECK: an error, not a skipped row. */
	v[0] = log_row(a, "2027-01-05", "back squat", 3, 5, 2, 100, "", 1);
	r = (struct rows){ v, 1, 0 };
	assert_int_equal(db_begin(db, &e), 0);
	assert_int_equal(db_log_add(db, next_row, &r, &added, &e), -1);
	assert_non_null(strstr(e.msg, "cannot add log rows"));
	db_rollback(db);

	assert_int_equal(db_log_each(db, a, "2027-01-01", NULL, count_row, &seen, &e), 0);
	assert_int_equal(seen, 1);
	seen = 0;
	assert_int_equal(db_log_each(db, 0, NULL, NULL, count_row, &seen, &e), 0);
	assert_int_equal(seen, 5);
	/* Sums per day and exercise: 9 sets at RIR 2 on one day, 1 without an effort. */
	assert_int_equal(db_log_sums(db, a, NULL, NULL, 4, sum_row, sums, &e), 0);
	assert_int_equal(sums[0], 9);
	assert_int_equal(sums[1], 0);
	assert_int_equal(sums[2], 1);
	assert_int_equal(sums[3], 2);
	memset(sums, 0, sizeof sums);
	assert_int_equal(db_log_sums(db, b, NULL, NULL, 4, sum_row, sums, &e), 0);
	assert_int_equal(sums[1], 2);   /* RIR 6 is above the limit */
	/* The weekly sums grew with the new rows only: the three squat rows of Thursday
	 * 2026-12-31 (day bit 3) are 9 sets in the week of Monday 2026-12-28. */
	char weeks[512] = "";
	assert_int_equal(db_log_weeks(db, a, NULL, NULL, week_row, weeks, &e), 0);
	assert_string_equal(weeks, "2026-12-28 back squat 2 9 8; 2027-01-04 bench press -1 1 1; ");
	weeks[0] = '\0';
	assert_int_equal(db_log_weeks(db, a, "2027-01-01", NULL, week_row, weeks, &e), 0);
	assert_string_equal(weeks, "2027-01-04 bench press -1 1 1; ");
	/* The athlete cannot go while logged rows remain, unless asked. */
	assert_int_equal(db_begin(db, &e), 0);
	assert_int_equal(db_athlete_rm(db, b, 0, &e), -1);
	assert_non_null(strstr(e.msg, "1 logged row"));
	assert_int_equal(db_athlete_rm(db, b, 1, &e), 0);
	assert_int_equal(db_commit(db, &e), 0);
	assert_int_equal(db_log_count(db, 0, &n, &e), 0);
	assert_int_equal(n, 4);
	assert_int_equal(db_check(db, NULL, &e), 0);
	db_close(db);
}

/* A version-1 database (before the log) is migrated to the latest, its rows kept. */
static void migrates_version_1(void **state)
{
	char path[320], *sql;
	struct sd_db *db = NULL;
	struct sd_err e = { 0 };
	struct db_athlete *list = NULL;
	sqlite3 *h;
	FILE *f;
	long size;
	int n = 0;
	long long rows = -1;
	(void)state;

	assert_non_null(f = fopen("db/001_init.sql", "rb"));
	fseek(f, 0, SEEK_END);
	size = ftell(f);
	rewind(f);
	assert_non_null(sql = calloc(1, (size_t)size + 1));
	assert_int_equal(fread(sql, 1, (size_t)size, f), (size_t)size);
	fclose(f);
	snprintf(path, sizeof path, "%s/v1.db", tmpdir);
	assert_int_equal(sqlite3_open(path, &h), SQLITE_OK);
	assert_int_equal(sqlite3_exec(h, sql, NULL, NULL, NULL), SQLITE_OK);
	assert_int_equal(sqlite3_exec(h, "PRAGMA user_version = 1; PRAGMA application_id = "
				      "1396993907; INSERT INTO athletes (name, status) VALUES "
				      "('Old', 'trained')", NULL, NULL, NULL), SQLITE_OK);
	sqlite3_close(h);
	free(sql);
	assert_int_equal(db_open(path, &db, &e), 0);
	assert_int_equal(db_schema_version(db), db_schema_latest());
	assert_int_equal(db_athlete_list(db, &list, &n, &e), 0);
	assert_int_equal(n, 1);
	assert_string_equal(list[0].name, "Old");
	free(list);
	assert_int_equal(db_log_count(db, 0, &rows, &e), 0);
	assert_int_equal(rows, 0);
	assert_int_equal(db_check(db, NULL, &e), 0);
	db_close(db);
}

int main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(opens_and_migrates),
		cmocka_unit_test(athletes),
		cmocka_unit_test(programs),
		cmocka_unit_test(blocks_and_tests),
		cmocka_unit_test(roster),
		cmocka_unit_test(transactions),
		cmocka_unit_test(files_backup_and_versions),
		cmocka_unit_test(default_path),
		cmocka_unit_test(logs),
		cmocka_unit_test(migrates_version_1),
	};
	return cmocka_run_group_tests(tests, setup_dir, remove_dir);
}
