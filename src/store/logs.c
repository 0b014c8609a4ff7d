/* The logs table: the training log, one row per logged line (db/002_logs.sql). */
#include "db_int.h"

#include <string.h>

#include "../core/text.h"

/* ON CONFLICT DO NOTHING skips only a row that meets its twin in the unique index; unlike
 * INSERT OR IGNORE it would not silently drop a row that breaks a CHECK. */
#define LOG_INSERT "INSERT INTO logs (athlete_id, log_date, exercise, sets, reps, timed, rir, " \
	"effort, load, unit, ordinal, source) VALUES (?1, ?2, ?3, ?4, ?5, ?6, ?7, ?8, ?9, ?10, " \
	"?11, ?12) ON CONFLICT DO NOTHING"

static int check_row(const struct db_log *r, struct sd_err *e)
{
	if (text_check("exercise name", r->exercise, strlen(r->exercise), e) ||
	    text_check("effort", r->effort, strlen(r->effort), e) ||
	    text_check("log source", r->source, strlen(r->source), e))
		return -1;
	return 0;
}

int db_log_add(struct sd_db *db, db_log_next_fn next, void *arg, long long *added,
	       struct sd_err *e)
{
	sqlite3_stmt *st = NULL;
	struct db_log r;
	long long n = 0;
	int ret = -1, rc;

	if (dbi_prepare(db, LOG_INSERT, &st, e))
		goto done;
	while ((rc = next(arg, &r, e)) == 1) {
		if (check_row(&r, e))
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
		n += sqlite3_changes(db->h);
		/* Every parameter is bound again for the next row. */
		sqlite3_reset(st);
	}
	if (rc < 0)
		goto done;
	*added = n;
	ret = 0;
done:
	sqlite3_finalize(st);
	return ret;
}

static void bind_span(sqlite3_stmt *st, int col, const char *from, const char *to)
{
	if (from)
		sqlite3_bind_text(st, col, from, -1, SQLITE_TRANSIENT);
	if (to)
		sqlite3_bind_text(st, col + 1, to, -1, SQLITE_TRANSIENT);
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
			    "WHERE (?1 = 0 OR l.athlete_id = ?1) AND (?2 IS NULL OR l.log_date >= ?2) "
			    "AND (?3 IS NULL OR l.log_date <= ?3) "
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
			    "FROM logs WHERE athlete_id = ?1 AND (?2 IS NULL OR log_date >= ?2) "
			    "AND (?3 IS NULL OR log_date <= ?3) GROUP BY log_date, exercise "
			    "ORDER BY log_date, exercise", &st, e))
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
