/* Small helpers shared by the store's files. */
#include "db_int.h"

#include <stdlib.h>

#include <string.h>

int dbi_prepare(struct sd_db *db, const char *sql, sqlite3_stmt **st, struct sd_err *e)
{
	if (sqlite3_prepare_v2(db->h, sql, -1, st, NULL) != SQLITE_OK) {
		*st = NULL;
		return dbi_fail(db, e, "prepare a query");
	}
	return 0;
}

int dbi_fail(struct sd_db *db, struct sd_err *e, const char *what)
{
	return sd_fail(e, "cannot %s in '%s': %s", what, db->path, sqlite3_errmsg(db->h));
}

void dbi_text(sqlite3_stmt *st, int col, char *buf, size_t n)
{
	const unsigned char *t = sqlite3_column_text(st, col);
	size_t len = t ? (size_t)sqlite3_column_bytes(st, col) : 0;

	if (len >= n)
		len = n - 1;
	if (len)
		memcpy(buf, t, len);
	buf[len] = '\0';
}

int dbi_exec_step(struct sd_db *db, sqlite3_stmt *st, const char *what, struct sd_err *e)
{
	int rc = sqlite3_step(st);

	if (rc != SQLITE_DONE && rc != SQLITE_ROW)
		return dbi_fail(db, e, what);
	return 0;
}

int dbi_count(struct sd_db *db, const char *sql, long long id, long long *out, struct sd_err *e)
{
	sqlite3_stmt *st = NULL;
	int ret = -1, rc;

	if (dbi_prepare(db, sql, &st, e))
		goto done;
	if (id >= 0)
		sqlite3_bind_int64(st, 1, id);
	rc = sqlite3_step(st);
	if (rc != SQLITE_ROW) {
		dbi_fail(db, e, "read the database");
		goto done;
	}
	*out = sqlite3_column_int64(st, 0);
	ret = 0;
done:
	sqlite3_finalize(st);
	return ret;
}

int dbi_collect(struct sd_db *db, sqlite3_stmt *st, size_t size, dbi_row_fn fn, void **out,
		int *n, const char *what, struct sd_err *e)
{
	char *v = NULL;
	int cap = 0, k = 0, rc;

	while ((rc = sqlite3_step(st)) == SQLITE_ROW) {
		if (k == cap) {
			char *nv;
			cap = cap ? 2 * cap : 16;
			nv = realloc(v, (size_t)cap * size);
			if (!nv) {
				sd_fail(e, "out of memory");
				goto fail;
			}
			v = nv;
		}
		if (fn(st, v + (size_t)k * size, e))
			goto fail;
		k++;
	}
	if (rc != SQLITE_DONE) {
		dbi_fail(db, e, what);
		goto fail;
	}
	*out = v;
	*n = k;
	return 0;
fail:
	free(v);
	return -1;
}

int dbi_insert(struct sd_db *db, sqlite3_stmt *st, const char *what, long long *id,
	       struct sd_err *e)
{
	int ret = dbi_exec_step(db, st, what, e);

	if (!ret && id)
		*id = sqlite3_last_insert_rowid(db->h);
	sqlite3_finalize(st);
	return ret;
}

int dbi_one(struct sd_db *db, sqlite3_stmt *st, const char *what, dbi_row_fn fn, void *rec,
	    struct sd_err *e)
{
	int rc = dbi_step_row(db, st, what, e);

	if (rc > 0 && fn(st, rec, e))
		rc = -1;
	sqlite3_finalize(st);
	return rc;
}

int dbi_step_row(struct sd_db *db, sqlite3_stmt *st, const char *what, struct sd_err *e)
{
	int rc = sqlite3_step(st);
	if (rc == SQLITE_ROW)
		return 1;
	if (rc == SQLITE_DONE)
		return 0;
	return dbi_fail(db, e, what);
}
