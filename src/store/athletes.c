/* The athletes table. */
#include "db_int.h"

#include <stdlib.h>
#include <string.h>

#include "../core/text.h"

#define ATHLETE_COLS "id, name, status, units, notes, created"

static void row_athlete(sqlite3_stmt *st, struct db_athlete *a)
{
	char status[16], units[8];

	a->id = sqlite3_column_int64(st, 0);
	dbi_text(st, 1, a->name, sizeof a->name);
	dbi_text(st, 2, status, sizeof status);
	dbi_text(st, 3, units, sizeof units);
	dbi_text(st, 4, a->notes, sizeof a->notes);
	dbi_text(st, 5, a->created, sizeof a->created);
	a->trained = !strcmp(status, "trained");
	a->units_lb = !strcmp(units, "lb");
}

static int bind_athlete(sqlite3_stmt *st, const struct db_athlete *a)
{
	sqlite3_bind_text(st, 1, a->name, -1, SQLITE_TRANSIENT);
	sqlite3_bind_text(st, 2, a->trained ? "trained" : "untrained", -1, SQLITE_STATIC);
	sqlite3_bind_text(st, 3, a->units_lb ? "lb" : "kg", -1, SQLITE_STATIC);
	return sqlite3_bind_text(st, 4, a->notes, -1, SQLITE_TRANSIENT);
}

/* Name and notes are text setdose can store and show (core/text.h). */
static int check_texts(const struct db_athlete *a, struct sd_err *e)
{
	if (text_check("athlete name", a->name, strlen(a->name), e) ||
	    text_check("athlete notes", a->notes, strlen(a->notes), e))
		return -1;
	return 0;
}

/* Name taken by an athlete other than `self`? */
static int name_taken(struct sd_db *db, const char *name, long long self, struct sd_err *e)
{
	sqlite3_stmt *st = NULL;
	int ret = -1, rc;

	if (dbi_prepare(db, "SELECT id FROM athletes WHERE name = ?1 AND id <> ?2", &st, e))
		goto done;
	sqlite3_bind_text(st, 1, name, -1, SQLITE_TRANSIENT);
	sqlite3_bind_int64(st, 2, self);
	rc = sqlite3_step(st);
	if (rc != SQLITE_ROW && rc != SQLITE_DONE) {
		dbi_fail(db, e, "read athletes");
		goto done;
	}
	ret = rc == SQLITE_ROW;
	if (ret)
		sd_fail(e, "athlete '%s' already exists", name);
done:
	sqlite3_finalize(st);
	return ret;
}

int db_athlete_add(struct sd_db *db, const struct db_athlete *a, long long *id, struct sd_err *e)
{
	sqlite3_stmt *st = NULL;
	int ret = -1;

	if (check_texts(a, e) || name_taken(db, a->name, -1, e))
		return -1;
	if (dbi_prepare(db, "INSERT INTO athletes (name, status, units, notes) "
			    "VALUES (?1, ?2, ?3, ?4)", &st, e))
		goto done;
	bind_athlete(st, a);
	if (dbi_exec_step(db, st, "add the athlete", e))
		goto done;
	if (id)
		*id = sqlite3_last_insert_rowid(db->h);
	ret = 0;
done:
	sqlite3_finalize(st);
	return ret;
}

int db_athlete_get(struct sd_db *db, const char *name, struct db_athlete *out, struct sd_err *e)
{
	sqlite3_stmt *st = NULL;
	int ret = -1, rc;

	if (dbi_prepare(db, "SELECT " ATHLETE_COLS " FROM athletes WHERE name = ?1", &st, e))
		goto done;
	sqlite3_bind_text(st, 1, name, -1, SQLITE_TRANSIENT);
	rc = dbi_step_row(db, st, "read athletes", e);
	if (rc == 0) {
		sd_fail(e, "unknown athlete '%s' (see 'setdose athlete list')", name);
		goto done;
	}
	if (rc < 0)
		goto done;
	row_athlete(st, out);
	ret = 0;
done:
	sqlite3_finalize(st);
	return ret;
}

int db_athlete_update(struct sd_db *db, const struct db_athlete *a, struct sd_err *e)
{
	sqlite3_stmt *st = NULL;
	int ret = -1;

	if (check_texts(a, e) || name_taken(db, a->name, a->id, e))
		return -1;
	if (dbi_prepare(db, "UPDATE athletes SET name = ?1, status = ?2, units = ?3, notes = ?4 "
			    "WHERE id = ?5", &st, e))
		goto done;
	bind_athlete(st, a);
	sqlite3_bind_int64(st, 5, a->id);
	if (dbi_exec_step(db, st, "change the athlete", e))
		goto done;
	ret = 0;
done:
	sqlite3_finalize(st);
	return ret;
}

static int collect_athlete(sqlite3_stmt *st, void *rec, struct sd_err *e)
{
	(void)e;
	row_athlete(st, rec);
	return 0;
}

int db_athlete_list(struct sd_db *db, struct db_athlete **out, int *n, struct sd_err *e)
{
	sqlite3_stmt *st = NULL;
	int ret = -1;

	if (dbi_prepare(db, "SELECT " ATHLETE_COLS " FROM athletes ORDER BY name COLLATE NOCASE",
			&st, e))
		goto done;
	ret = dbi_collect(db, st, sizeof(struct db_athlete), collect_athlete, (void **)out, n,
			  "read athletes", e);
done:
	sqlite3_finalize(st);
	return ret;
}

int db_athlete_refs(struct sd_db *db, long long id, int *nblocks, int *ntests, struct sd_err *e)
{
	long long b, t;

	if (dbi_count(db, "SELECT count(*) FROM blocks WHERE athlete_id = ?1", id, &b, e) ||
	    dbi_count(db, "SELECT count(*) FROM tests WHERE athlete_id = ?1", id, &t, e))
		return -1;
	*nblocks = (int)b;
	*ntests = (int)t;
	return 0;
}

static int delete_where(struct sd_db *db, const char *sql, long long id, struct sd_err *e)
{
	sqlite3_stmt *st = NULL;
	int ret = -1;

	if (dbi_prepare(db, sql, &st, e))
		goto done;
	sqlite3_bind_int64(st, 1, id);
	ret = dbi_exec_step(db, st, "remove the athlete", e);
done:
	sqlite3_finalize(st);
	return ret;
}

int db_athlete_rm(struct sd_db *db, long long id, int cascade, struct sd_err *e)
{
	long long nl;
	int nb, nt;

	if (db_athlete_refs(db, id, &nb, &nt, e) || db_log_count(db, id, &nl, e))
		return -1;
	if ((nb || nt) && !nl && !cascade)
		return sd_fail(e, "athlete has %d block%s and %d test%s (use --cascade to remove them too)",
			       nb, nb == 1 ? "" : "s", nt, nt == 1 ? "" : "s");
	if (nl && !cascade)
		return sd_fail(e, "athlete has %d block%s, %d test%s and %lld logged row%s (use "
			       "--cascade to remove them too)", nb, nb == 1 ? "" : "s", nt,
			       nt == 1 ? "" : "s", nl, nl == 1 ? "" : "s");
	if (delete_where(db, "DELETE FROM log_weeks WHERE athlete_id = ?1", id, e) ||
	    delete_where(db, "DELETE FROM logs WHERE athlete_id = ?1", id, e) ||
	    delete_where(db, "DELETE FROM tests WHERE athlete_id = ?1", id, e) ||
	    delete_where(db, "DELETE FROM blocks WHERE athlete_id = ?1", id, e) ||
	    delete_where(db, "DELETE FROM athletes WHERE id = ?1", id, e))
		return -1;
	return 0;
}
