/* The logs table: the training log, one row per logged line (db/002_logs.sql). */
#include "db_int.h"

#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "../core/date.h"
#include "../core/text.h"

/* ON CONFLICT DO NOTHING skips only a row that meets its twin in the unique index; unlike
 * INSERT OR IGNORE it would not silently drop a row that breaks a CHECK. */
#define LOG_INSERT "INSERT INTO logs (athlete_id, log_date, exercise, sets, reps, timed, rir, " \
	"effort, load, unit, ordinal, source) VALUES (?1, ?2, ?3, ?4, ?5, ?6, ?7, ?8, ?9, ?10, " \
	"?11, ?12) ON CONFLICT DO NOTHING"

/* The texts a row stores are checked as every name the store writes; a text equal to the
 * previous row's was checked then. */
static int check_text(const char *what, const char *s, char *prev, size_t n, struct sd_err *e)
{
	if (!strcmp(s, prev))
		return 0;
	if (text_check(what, s, strlen(s), e))
		return -1;
	snprintf(prev, n, "%s", s);
	return 0;
}

struct checked {
	char exercise[DB_NAME_MAX], effort[DB_EFFORT_MAX], source[DB_SOURCE_MAX];
};

static int check_row(const struct db_log *r, struct checked *c, struct sd_err *e)
{
	/* The source differs on every row only by its line number, written by setdose. */
	const char *line = strstr(r->source, " line ");
	char path[DB_SOURCE_MAX];

	snprintf(path, sizeof path, "%.*s", line ? (int)(line - r->source) : (int)strlen(r->source),
		 r->source);
	if (check_text("exercise name", r->exercise, c->exercise, sizeof c->exercise, e) ||
	    check_text("effort", r->effort, c->effort, sizeof c->effort, e) ||
	    check_text("log source", path, c->source, sizeof c->source, e) ||
	    (line && text_check("log source", line, strlen(line), e)))
		return -1;
	return 0;
}

/* ------------------------------------------------------------ log_weeks
 * The new rows of one write summed per athlete, week, exercise and RIR in a hash table, then
 * added to log_weeks with one upsert per key: a 100,000-row import touches a few thousand. */

struct wkey {
	long long athlete;
	long monday;
	double rir;
	char exercise[DB_NAME_MAX];
	long long sets;
	unsigned days;
	int used;
};

struct wsum {
	struct wkey *v;
	size_t cap, n;
	char date[DB_DATE_LEN];     /* the last date parsed, and its day */
	long day;
};

static size_t whash(const struct wkey *k)
{
	size_t h = (size_t)k->athlete * 1000003u ^ (size_t)k->monday * 10007u ^
		   (size_t)(long long)(k->rir * 4) * 131u;
	for (const unsigned char *s = (const unsigned char *)k->exercise; *s; s++)
		h = h * 31 + *s;
	return h;
}

static int wsum_grow(struct wsum *w);

/* Adds sets logged on `date` to the key's sums. */
static int wsum_add(struct wsum *w, long long athlete, const char *date, const char *ex,
		    double rir, int sets)
{
	struct wkey k;
	long day;
	size_t i;

	/* Rows come day by day: parse a date once. */
	if (strcmp(date, w->date)) {
		if (date_parse(date, &w->day, NULL))
			return -1;
		snprintf(w->date, sizeof w->date, "%s", date);
	}
	day = w->day;
	memset(&k, 0, sizeof k);
	k.athlete = athlete;
	/* Day 0 (1970-01-01) was a Thursday: Monday is 3 days before. */
	int dow = (int)(((day + 3) % 7 + 7) % 7);
	k.monday = day - dow;
	k.rir = rir;
	snprintf(k.exercise, sizeof k.exercise, "%s", ex);
	if ((w->n + 1) * 2 > w->cap && wsum_grow(w))
		return -1;
	for (i = whash(&k) & (w->cap - 1); w->v[i].used; i = (i + 1) & (w->cap - 1))
		if (w->v[i].athlete == k.athlete && w->v[i].monday == k.monday &&
		    w->v[i].rir == k.rir && !strcmp(w->v[i].exercise, k.exercise))
			break;
	if (!w->v[i].used) {
		w->v[i] = k;
		w->v[i].used = 1;
		w->n++;
	}
	w->v[i].sets += sets;
	w->v[i].days |= 1u << dow;
	return 0;
}

static int wsum_grow(struct wsum *w)
{
	struct wsum bigger = { NULL, w->cap ? 2 * w->cap : 1024, 0, "", 0 };

	if (!(bigger.v = calloc(bigger.cap, sizeof *bigger.v)))
		return -1;
	for (size_t i = 0; i < w->cap; i++) {
		struct wkey *k = &w->v[i];
		size_t j;
		if (!k->used)
			continue;
		for (j = whash(k) & (bigger.cap - 1); bigger.v[j].used; j = (j + 1) & (bigger.cap - 1))
			;
		bigger.v[j] = *k;
		bigger.n++;
	}
	free(w->v);
	memcpy(bigger.date, w->date, sizeof bigger.date);
	bigger.day = w->day;
	*w = bigger;
	return 0;
}

/* Adds the sums to log_weeks: a new key is inserted, a known one grows. */
static int wsum_store(struct sd_db *db, const struct wsum *w, struct sd_err *e)
{
	sqlite3_stmt *st = NULL;
	char monday[DATE_LEN];
	int ret = -1;

	if (dbi_prepare(db, "INSERT INTO log_weeks (athlete_id, monday, exercise, rir, sets, days) "
			    "VALUES (?1, ?2, ?3, ?4, ?5, ?6) ON CONFLICT (athlete_id, monday, exercise, "
			    "rir) DO UPDATE SET sets = sets + excluded.sets, days = days | excluded.days",
			&st, e))
		return -1;
	for (size_t i = 0; i < w->cap; i++) {
		const struct wkey *k = &w->v[i];
		if (!k->used)
			continue;
		date_format(k->monday, monday);
		sqlite3_bind_int64(st, 1, k->athlete);
		sqlite3_bind_text(st, 2, monday, -1, SQLITE_STATIC);
		sqlite3_bind_text(st, 3, k->exercise, -1, SQLITE_STATIC);
		sqlite3_bind_double(st, 4, k->rir);
		sqlite3_bind_int64(st, 5, k->sets);
		sqlite3_bind_int(st, 6, (int)k->days);
		if (sqlite3_step(st) != SQLITE_DONE) {
			dbi_fail(db, e, "add the weekly sums of the log");
			goto done;
		}
		sqlite3_reset(st);
	}
	ret = 0;
done:
	sqlite3_finalize(st);
	return ret;
}

int dbi_log_rebuild_weeks(struct sd_db *db, struct sd_err *e)
{
	sqlite3_stmt *st = NULL;
	struct wsum w = { 0 };
	int ret = -1, rc;

	if (sqlite3_exec(db->h, "DELETE FROM log_weeks", NULL, NULL, NULL) != SQLITE_OK) {
		dbi_fail(db, e, "clear the weekly sums of the log");
		goto done;
	}
	if (dbi_prepare(db, "SELECT athlete_id, log_date, exercise, rir, sets FROM logs", &st, e))
		goto done;
	while ((rc = sqlite3_step(st)) == SQLITE_ROW)
		if (wsum_add(&w, sqlite3_column_int64(st, 0), (const char *)sqlite3_column_text(st, 1),
			     (const char *)sqlite3_column_text(st, 2), sqlite3_column_double(st, 3),
			     sqlite3_column_int(st, 4))) {
			sd_fail(e, "out of memory");
			goto done;
		}
	if (rc != SQLITE_DONE) {
		dbi_fail(db, e, "read the log");
		goto done;
	}
	ret = wsum_store(db, &w, e);
done:
	sqlite3_finalize(st);
	free(w.v);
	return ret;
}

/* ------------------------------------------------------------ rows */

int db_log_add(struct sd_db *db, db_log_next_fn next, void *arg, long long *added,
	       struct sd_err *e)
{
	sqlite3_stmt *st = NULL;
	struct wsum w = { 0 };
	struct checked seen = { "", "", "" };
	struct db_log r;
	long long n = 0;
	int ret = -1, rc;

	/* A page cache to hold what a large import writes until its commit, rather than spilling
	 * pages to the write-ahead log as it goes (SQLite's default is 2 MB). */
	sqlite3_exec(db->h, "PRAGMA cache_size = -65536", NULL, NULL, NULL);
	if (dbi_prepare(db, LOG_INSERT, &st, e))
		goto done;
	while ((rc = next(arg, &r, e)) == 1) {
		if (check_row(&r, &seen, e))
			goto done;
		sqlite3_bind_int64(st, 1, r.athlete_id);
		sqlite3_bind_text(st, 2, r.date, -1, SQLITE_STATIC);
		sqlite3_bind_text(st, 3, r.exercise, -1, SQLITE_STATIC);
		sqlite3_bind_int(st, 4, r.sets);
		sqlite3_bind_int(st, 5, r.reps);
		sqlite3_bind_int(st, 6, r.timed);
		sqlite3_bind_double(st, 7, r.rir);
		sqlite3_bind_text(st, 8, r.effort, -1, SQLITE_STATIC);
		sqlite3_bind_double(st, 9, r.load);
		sqlite3_bind_text(st, 10, r.unit, -1, SQLITE_STATIC);
		sqlite3_bind_int(st, 11, r.ordinal);
		sqlite3_bind_text(st, 12, r.source, -1, SQLITE_STATIC);
		if (sqlite3_step(st) != SQLITE_DONE) {
			dbi_fail(db, e, "add log rows");
			goto done;
		}
		/* Only a row the index did not already hold adds to the weekly sums. */
		if (sqlite3_changes(db->h)) {
			n++;
			if (wsum_add(&w, r.athlete_id, r.date, r.exercise, r.rir, r.sets)) {
				sd_fail(e, "out of memory");
				goto done;
			}
		}
		/* Every parameter is bound again for the next row. */
		sqlite3_reset(st);
	}
	if (rc < 0 || wsum_store(db, &w, e))
		goto done;
	*added = n;
	ret = 0;
done:
	sqlite3_finalize(st);
	free(w.v);
	return ret;
}

/* An open end is bound as a date before or after every date, so the condition stays a
 * plain range the index answers ("?2 IS NULL OR ..." would scan every row of the athlete). */
static void bind_span(sqlite3_stmt *st, int col, const char *from, const char *to)
{
	sqlite3_bind_text(st, col, from ? from : "0000-00-00", -1, SQLITE_TRANSIENT);
	sqlite3_bind_text(st, col + 1, to ? to : "9999-99-99", -1, SQLITE_TRANSIENT);
}

int db_log_each(struct sd_db *db, long long athlete_id, const char *from, const char *to,
		db_log_fn fn, void *arg, struct sd_err *e)
{
	sqlite3_stmt *st = NULL;
	struct db_log r;
	char name[DB_NAME_MAX];
	int ret = -1, rc;

	if (dbi_prepare(db, "SELECT l.athlete_id, a.name, l.log_date, l.exercise, l.sets, l.reps, "
			    "l.timed, l.rir, l.effort, l.load, l.unit, l.ordinal, l.source "
			    "FROM logs l JOIN athletes a ON a.id = l.athlete_id "
			    "WHERE (?1 = 0 OR l.athlete_id = ?1) AND l.log_date BETWEEN ?2 AND ?3 "
			    "ORDER BY a.name COLLATE NOCASE, l.log_date, l.id", &st, e))
		goto done;
	sqlite3_bind_int64(st, 1, athlete_id > 0 ? athlete_id : 0);
	bind_span(st, 2, from, to);
	while ((rc = sqlite3_step(st)) == SQLITE_ROW) {
		r.athlete_id = sqlite3_column_int64(st, 0);
		dbi_text(st, 1, name, sizeof name);
		dbi_text(st, 2, r.date, sizeof r.date);
		dbi_text(st, 3, r.exercise, sizeof r.exercise);
		r.sets = sqlite3_column_int(st, 4);
		r.reps = sqlite3_column_int(st, 5);
		r.timed = sqlite3_column_int(st, 6);
		r.rir = sqlite3_column_double(st, 7);
		dbi_text(st, 8, r.effort, sizeof r.effort);
		r.load = sqlite3_column_double(st, 9);
		dbi_text(st, 10, r.unit, sizeof r.unit);
		r.ordinal = sqlite3_column_int(st, 11);
		dbi_text(st, 12, r.source, sizeof r.source);
		if ((ret = fn(&r, name, arg)))
			goto done;
	}
	if (rc != SQLITE_DONE) {
		dbi_fail(db, e, "read the log");
		goto done;
	}
	ret = 0;
done:
	sqlite3_finalize(st);
	return ret;
}

int db_log_sums(struct sd_db *db, long long athlete_id, const char *from, const char *to,
		double max_rir, db_log_sum_fn fn, void *arg, struct sd_err *e)
{
	sqlite3_stmt *st = NULL;
	struct db_log_sum s;
	int ret = -1, rc;

	/* Grouped in the order of the index (athlete, date, exercise): no sort, no table read. */
	if (dbi_prepare(db, "SELECT log_date, exercise, "
			    "total(CASE WHEN rir >= 0 AND rir <= ?4 THEN sets END), "
			    "total(CASE WHEN rir > ?4 THEN sets END), "
			    "total(CASE WHEN rir < 0 THEN sets END) "
			    "FROM logs WHERE athlete_id = ?1 AND log_date BETWEEN ?2 AND ?3 "
			    "GROUP BY log_date, exercise ORDER BY log_date, exercise", &st, e))
		goto done;
	sqlite3_bind_int64(st, 1, athlete_id);
	bind_span(st, 2, from, to);
	sqlite3_bind_double(st, 4, max_rir);
	while ((rc = sqlite3_step(st)) == SQLITE_ROW) {
		dbi_text(st, 0, s.date, sizeof s.date);
		dbi_text(st, 1, s.exercise, sizeof s.exercise);
		s.within = (int)sqlite3_column_double(st, 2);
		s.above = (int)sqlite3_column_double(st, 3);
		s.unrecorded = (int)sqlite3_column_double(st, 4);
		if ((ret = fn(&s, arg)))
			goto done;
	}
	if (rc != SQLITE_DONE) {
		dbi_fail(db, e, "read the log");
		goto done;
	}
	ret = 0;
done:
	sqlite3_finalize(st);
	return ret;
}

int db_log_weeks(struct sd_db *db, long long athlete_id, const char *from, const char *to,
		 db_log_week_fn fn, void *arg, struct sd_err *e)
{
	sqlite3_stmt *st = NULL;
	struct db_log_week w;
	int ret = -1, rc;

	if (dbi_prepare(db, "SELECT monday, exercise, rir, sets, days FROM log_weeks "
			    "WHERE athlete_id = ?1 AND monday BETWEEN ?2 AND ?3 "
			    "ORDER BY monday, exercise, rir", &st, e))
		goto done;
	sqlite3_bind_int64(st, 1, athlete_id);
	bind_span(st, 2, from, to);
	while ((rc = sqlite3_step(st)) == SQLITE_ROW) {
		dbi_text(st, 0, w.monday, sizeof w.monday);
		dbi_text(st, 1, w.exercise, sizeof w.exercise);
		w.rir = sqlite3_column_double(st, 2);
		w.sets = sqlite3_column_int(st, 3);
		w.days = (unsigned)sqlite3_column_int(st, 4);
		if ((ret = fn(&w, arg)))
			goto done;
	}
	if (rc != SQLITE_DONE) {
		dbi_fail(db, e, "read the log");
		goto done;
	}
	ret = 0;
done:
	sqlite3_finalize(st);
	return ret;
}

int db_log_count(struct sd_db *db, long long athlete_id, long long *n, struct sd_err *e)
{
	if (athlete_id > 0)
		return dbi_count(db, "SELECT count(*) FROM logs WHERE athlete_id = ?1", athlete_id, n,
				 e);
	return dbi_count(db, "SELECT count(*) FROM logs", -1, n, e);
}

int db_log_any(struct sd_db *db, long long athlete_id, const char *from, const char *to,
	       int *any, struct sd_err *e)
{
	sqlite3_stmt *st = NULL;
	int ret = -1, rc;

	if (dbi_prepare(db, "SELECT EXISTS (SELECT 1 FROM logs WHERE athlete_id = ?1 AND "
			    "log_date BETWEEN ?2 AND ?3)", &st, e))
		goto done;
	sqlite3_bind_int64(st, 1, athlete_id);
	sqlite3_bind_text(st, 2, from, -1, SQLITE_TRANSIENT);
	sqlite3_bind_text(st, 3, to, -1, SQLITE_TRANSIENT);
	rc = sqlite3_step(st);
	if (rc != SQLITE_ROW) {
		dbi_fail(db, e, "read the log");
		goto done;
	}
	*any = sqlite3_column_int(st, 0);
	ret = 0;
done:
	sqlite3_finalize(st);
	return ret;
}
