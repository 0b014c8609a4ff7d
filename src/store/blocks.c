/* The blocks table: one athlete following one template from a start date. */
#include "db_int.h"

#include <stdlib.h>
#include <string.h>

#define BLOCK_SELECT "SELECT b.id, b.athlete_id, b.program_id, a.name, p.name, b.start_date, " \
	"b.weeks, b.end_date, a.status FROM blocks b JOIN athletes a ON a.id = b.athlete_id " \
	"JOIN programs p ON p.id = b.program_id "

static void row_block(sqlite3_stmt *st, struct db_block *b)
{
	b->id = sqlite3_column_int64(st, 0);
	b->athlete_id = sqlite3_column_int64(st, 1);
	b->program_id = sqlite3_column_int64(st, 2);
	dbi_text(st, 3, b->athlete, sizeof b->athlete);
	dbi_text(st, 4, b->program, sizeof b->program);
	dbi_text(st, 5, b->start, sizeof b->start);
	b->weeks = sqlite3_column_int(st, 6);
	dbi_text(st, 7, b->end, sizeof b->end);
	b->trained = !strcmp((const char *)sqlite3_column_text(st, 8), "trained");
}

static int collect_block(sqlite3_stmt *st, void *rec, struct sd_err *e)
{
	(void)e;
	row_block(st, rec);
	return 0;
}

int db_block_add(struct sd_db *db, long long athlete_id, long long program_id, const char *start,
		 int weeks, long long *id, struct sd_err *e)
{
	sqlite3_stmt *st = NULL;

	if (dbi_prepare(db, "INSERT INTO blocks (athlete_id, program_id, start_date, weeks) "
			    "VALUES (?1, ?2, ?3, ?4)", &st, e))
		goto done;
	sqlite3_bind_int64(st, 1, athlete_id);
	sqlite3_bind_int64(st, 2, program_id);
	sqlite3_bind_text(st, 3, start, -1, SQLITE_TRANSIENT);
	sqlite3_bind_int(st, 4, weeks);
	return dbi_insert(db, st, "add the block", id, e);
done:
	sqlite3_finalize(st);   /* NULL, or a statement that failed before the insert */
	return -1;
}

int db_block_get(struct sd_db *db, long long id, struct db_block *out, struct sd_err *e)
{
	sqlite3_stmt *st = NULL;
	int rc;

	if (dbi_prepare(db, BLOCK_SELECT "WHERE b.id = ?1", &st, e))
		return -1;
	sqlite3_bind_int64(st, 1, id);
	rc = dbi_one(db, st, "read blocks", collect_block, out, e);
	if (rc == 0)
		sd_fail(e, "unknown block %lld (see 'setdose block list')", id);
	return rc > 0 ? 0 : -1;
}

int db_block_end(struct sd_db *db, long long id, const char *end, struct sd_err *e)
{
	sqlite3_stmt *st = NULL;
	struct db_block b;
	int ret = -1;

	if (db_block_get(db, id, &b, e))
		return -1;
	if (b.end[0])
		return sd_fail(e, "block %lld already ended on %s", id, b.end);
	if (strcmp(end, b.start) < 0)
		return sd_fail(e, "end date %s is before block %lld's start %s", end, id, b.start);
	if (dbi_prepare(db, "UPDATE blocks SET end_date = ?1 WHERE id = ?2 AND end_date IS NULL",
			&st, e))
		goto done;
	sqlite3_bind_text(st, 1, end, -1, SQLITE_TRANSIENT);
	sqlite3_bind_int64(st, 2, id);
	ret = dbi_exec_step(db, st, "end the block", e);
done:
	sqlite3_finalize(st);
	return ret;
}

int db_block_list(struct sd_db *db, long long athlete_id, struct db_block **out, int *n,
		  struct sd_err *e)
{
	sqlite3_stmt *st = NULL;
	int ret = -1;

	if (dbi_prepare(db, BLOCK_SELECT "WHERE ?1 <= 0 OR b.athlete_id = ?1 "
			    "ORDER BY a.name COLLATE NOCASE, b.start_date, b.id", &st, e))
		goto done;
	sqlite3_bind_int64(st, 1, athlete_id);
	ret = dbi_collect(db, st, sizeof(struct db_block), collect_block, (void **)out, n,
			  "read blocks", e);
done:
	sqlite3_finalize(st);
	return ret;
}

int db_block_each_open(struct sd_db *db, db_block_fn fn, void *arg, struct sd_err *e)
{
	sqlite3_stmt *st = NULL;
	struct db_block b;
	int ret = -1, rc;

	if (dbi_prepare(db, BLOCK_SELECT "WHERE b.end_date IS NULL "
			    "ORDER BY a.name COLLATE NOCASE, b.start_date, b.id", &st, e))
		goto done;
	while ((rc = sqlite3_step(st)) == SQLITE_ROW) {
		row_block(st, &b);
		ret = fn(&b, arg);
		if (ret)
			goto done;
	}
	if (rc != SQLITE_DONE) {
		ret = dbi_fail(db, e, "read blocks");
		goto done;
	}
	ret = 0;
done:
	sqlite3_finalize(st);
	return ret;
}

int db_block_open_widths(struct sd_db *db, int *athlete, int *program, long long *n,
			 struct sd_err *e)
{
	sqlite3_stmt *st = NULL;
	int ret = -1;

	if (dbi_prepare(db, "SELECT coalesce(max(length(a.name)), 0), "
			    "coalesce(max(length(p.name)), 0), count(*) FROM blocks b "
			    "JOIN athletes a ON a.id = b.athlete_id JOIN programs p ON p.id = b.program_id "
			    "WHERE b.end_date IS NULL", &st, e))
		goto done;
	if (sqlite3_step(st) != SQLITE_ROW) {
		dbi_fail(db, e, "read blocks");
		goto done;
	}
	*athlete = sqlite3_column_int(st, 0);
	*program = sqlite3_column_int(st, 1);
	*n = sqlite3_column_int64(st, 2);
	ret = 0;
done:
	sqlite3_finalize(st);
	return ret;
}
