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

static int collect_athlete(sqlite3_stmt *st, void *rec, struct sd_err *e)
{
	(void)e;
	row_athlete(st, rec);
	return 0;
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

	if (check_texts(a, e) || name_taken(db, a->name, -1, e))
		return -1;
	if (dbi_prepare(db, "INSERT INTO athletes (name, status, units, notes) "
			    "VALUES (?1, ?2, ?3, ?4)", &st, e))
		goto done;
	bind_athlete(st, a);
	return dbi_insert(db, st, "add the athlete", id, e);
done:
	sqlite3_finalize(st);   /* NULL, or a statement that failed before the insert */
	return -1;
}

int db_athlete_get(struct sd_db *db, const char *name, struct db_athlete *out, struct sd_err *e)
{
	sqlite3_stmt *st = NULL;
	int rc;

	if (dbi_prepare(db, "SELECT " ATHLETE_COLS " FROM athletes WHERE name = ?1", &st, e))
		return -1;
	sqlite3_bind_text(st, 1, name, -1, SQLITE_TRANSIENT);
	rc = dbi_one(db, st, "read athletes", collect_athlete, out, e);
	if (rc == 0)
		sd_fail(e, "unknown athlete '%s' (see 'setdose athlete list')", name);
	return rc > 0 ? 0 : -1;
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

/* Appends the n bytes at s (and a NUL) to the pool; the offset, or -1 when out of memory.
 * Offsets, not pointers: the pool moves as it grows. */
static long long pool_add(struct db_roster *r, const char *s, size_t n, int fold)
{
	size_t at = r->used;

	if (r->used + n + 1 > r->cap) {
		size_t cap = r->cap ? r->cap : 1 << 16;
		char *p;
		while (r->used + n + 1 > cap)
			cap *= 2;
		if (!(p = realloc(r->pool, cap)))
			return -1;
		r->pool = p;
		r->cap = cap;
	}
	for (size_t i = 0; i < n; i++)
		r->pool[at + i] = fold && s[i] >= 'A' && s[i] <= 'Z' ? (char)(s[i] + 32) : s[i];
	r->pool[at + n] = '\0';
	r->used += n + 1;
	return (long long)at;
}

/* The counts come from two grouped scans joined once, not two queries per athlete. */
#define ROSTER_SELECT "SELECT a.id, a.name, a.status = 'trained', a.units = 'lb', "
#define ROSTER_COUNTS ", coalesce(b.n, 0), coalesce(t.n, 0), substr(a.created, 1, 10) " \
	"FROM athletes a LEFT JOIN (SELECT athlete_id, count(*) AS n FROM blocks GROUP BY " \
	"athlete_id) b ON b.athlete_id = a.id LEFT JOIN (SELECT athlete_id, count(*) AS n FROM " \
	"tests GROUP BY athlete_id) t ON t.athlete_id = a.id ORDER BY a.name COLLATE NOCASE"
#define ROSTER_PLAIN ", 0, 0, substr(a.created, 1, 10) FROM athletes a ORDER BY a.name COLLATE NOCASE"

int db_roster_load(struct sd_db *db, int note_max, int with_counts, struct db_roster *r,
		   struct sd_err *e)
{
	sqlite3_stmt *st = NULL;
	long long (*off)[3] = NULL;
	int cap = 0, rc;

	static const char *const sql[2][2] = {
		{ ROSTER_SELECT "a.notes" ROSTER_PLAIN, ROSTER_SELECT "a.notes" ROSTER_COUNTS },
		{ ROSTER_SELECT "substr(a.notes, 1, ?1)" ROSTER_PLAIN,
		  ROSTER_SELECT "substr(a.notes, 1, ?1)" ROSTER_COUNTS },
	};

	memset(r, 0, sizeof *r);
	if (dbi_prepare(db, sql[note_max > 0][with_counts != 0], &st, e))
		return -1;
	if (note_max > 0)
		sqlite3_bind_int(st, 1, note_max);
	while ((rc = dbi_step_row(db, st, "read athletes", e)) > 0) {
		const char *name = (const char *)sqlite3_column_text(st, 1);
		const char *notes = (const char *)sqlite3_column_text(st, 4);
		size_t ln = (size_t)sqlite3_column_bytes(st, 1), lt = (size_t)sqlite3_column_bytes(st, 4);
		if (r->n == cap) {
			int ncap = cap ? 2 * cap : 1024;
			struct db_roster_row *v = realloc(r->v, (size_t)ncap * sizeof *v);
			long long (*o)[3] = realloc(off, (size_t)ncap * sizeof *o);
			if (v)
				r->v = v;
			if (o)
				off = o;
			if (!v || !o)
				goto oom;
			cap = ncap;
		}
		r->v[r->n].id = sqlite3_column_int64(st, 0);
		r->v[r->n].trained = (unsigned char)sqlite3_column_int(st, 2);
		r->v[r->n].units_lb = (unsigned char)sqlite3_column_int(st, 3);
		r->v[r->n].nblocks = sqlite3_column_int(st, 5);
		r->v[r->n].ntests = sqlite3_column_int(st, 6);
		dbi_text(st, 7, r->v[r->n].created, sizeof r->v[r->n].created);
		if ((off[r->n][0] = pool_add(r, name ? name : "", name ? ln : 0, 0)) < 0 ||
		    (off[r->n][1] = pool_add(r, name ? name : "", name ? ln : 0, 1)) < 0 ||
		    (off[r->n][2] = pool_add(r, notes ? notes : "", notes ? lt : 0, 0)) < 0)
			goto oom;
		r->n++;
	}
	sqlite3_finalize(st);
	st = NULL;
	if (rc < 0)
		goto fail;
	for (int i = 0; i < r->n; i++) {
		r->v[i].name = r->pool + off[i][0];
		r->v[i].key = r->pool + off[i][1];
		r->v[i].notes = r->pool + off[i][2];
	}
	free(off);
	return 0;
oom:
	sd_fail(e, "out of memory");
fail:
	sqlite3_finalize(st);
	free(off);
	db_roster_free(r);
	return -1;
}

void db_roster_free(struct db_roster *r)
{
	free(r->v);
	free(r->pool);
	memset(r, 0, sizeof *r);
}

int db_athlete_get_id(struct sd_db *db, long long id, struct db_athlete *out, struct sd_err *e)
{
	sqlite3_stmt *st = NULL;
	int rc;

	if (dbi_prepare(db, "SELECT " ATHLETE_COLS " FROM athletes WHERE id = ?1", &st, e))
		return -1;
	sqlite3_bind_int64(st, 1, id);
	rc = dbi_one(db, st, "read athletes", collect_athlete, out, e);
	if (rc == 0)
		sd_fail(e, "the athlete is no longer in the database");
	return rc > 0 ? 0 : -1;
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
