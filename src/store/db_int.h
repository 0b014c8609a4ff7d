/* Inside the store only: the connection struct and helpers shared by its files. */
#ifndef SD_DB_INT_H
#define SD_DB_INT_H

#include <sqlite3.h>

#include "db.h"

struct sd_db {
	sqlite3 *h;
	char path[4096];
	int rw;          /* opened read-write; a read-only connection is reopened by db_begin */
	int snapshot;    /* an in-memory copy of a database whose folder cannot be written */
};

/* Prepares sql (a constant; values are always bound, never pasted in). */
int dbi_prepare(struct sd_db *db, const char *sql, sqlite3_stmt **st, struct sd_err *e);
/* Fills e with "cannot WHAT: <sqlite message>" and returns -1. */
int dbi_fail(struct sd_db *db, struct sd_err *e, const char *what);
/* Copies a text column into buf ("" for NULL), truncating to n - 1 bytes. */
void dbi_text(sqlite3_stmt *st, int col, char *buf, size_t n);
/* Steps a statement that returns no rows (INSERT/UPDATE/DELETE); 0 on SQLITE_DONE. */
int dbi_exec_step(struct sd_db *db, sqlite3_stmt *st, const char *what, struct sd_err *e);
/* Runs a one-row, one-integer query with one optional bound id (id < 0: none). */
int dbi_count(struct sd_db *db, const char *sql, long long id, long long *out, struct sd_err *e);
/* Steps a query expected to return at most one row: 1 with a row, 0 with none, -1 on an error
 * (e filled with "cannot WHAT: ..."). */
int dbi_step_row(struct sd_db *db, sqlite3_stmt *st, const char *what, struct sd_err *e);
/* Fills one record from the current row of a query. */
typedef int (*dbi_row_fn)(sqlite3_stmt *st, void *rec, struct sd_err *e);
/* Steps st to the end, filling a malloc'd array of records of `size` bytes with fn; on success
 * *out (free it) and *n are set. `what` names the read in an error ("read athletes"). */
/* Steps an INSERT prepared and bound by the caller, stores the new row's id in *id (may be
 * NULL) and finalizes st, also on failure. */
int dbi_insert(struct sd_db *db, sqlite3_stmt *st, const char *what, long long *id,
	       struct sd_err *e);
/* Reads at most one row of a bound SELECT into rec with fn and finalizes st: 1 read, 0 no row
 * (the caller names what was not found), -1 failed. */
int dbi_one(struct sd_db *db, sqlite3_stmt *st, const char *what, dbi_row_fn fn, void *rec,
	    struct sd_err *e);
int dbi_collect(struct sd_db *db, sqlite3_stmt *st, size_t size, dbi_row_fn fn, void **out,
		int *n, const char *what, struct sd_err *e);
/* Opens db->path read-only (a snapshot where the folder cannot hold the WAL index). */
int dbi_open_ro(struct sd_db *db, struct sd_err *e);
/* Checks a finished copy at path (integrity_check, foreign_key_check) without creating
 * files beside it: 0 when it passes, else -1 with the first problems in msg. */
int dbi_check_copy(const char *path, char *msg, size_t n);
/* Recomputes the weekly sums of the log (log_weeks) from its rows (logs.c). */
int dbi_log_rebuild_weeks(struct sd_db *db, struct sd_err *e);
/* Applies the embedded migrations (migrate.c). */
int dbi_migrate(struct sd_db *db, struct sd_err *e);

#endif
