/* The programs table: templates kept as their source text, byte for byte. */
#include "db_int.h"

#include <stdlib.h>
#include <string.h>

#include "../core/text.h"

int db_program_add(struct sd_db *db, const char *name, const char *src, size_t len, int is_csv,
		   long long *id, struct sd_err *e)
{
	sqlite3_stmt *st = NULL;
	long long taken;

	if (text_check("program name", name, strlen(name), e))
		return -1;
	if (len > 0x7fffffff)
		return sd_fail(e, "program '%s' is too large", name);
	if (dbi_prepare(db, "SELECT count(*) FROM programs WHERE name = ?1", &st, e))
		goto done;
	sqlite3_bind_text(st, 1, name, -1, SQLITE_TRANSIENT);
	if (sqlite3_step(st) != SQLITE_ROW) {
		dbi_fail(db, e, "read programs");
		goto done;
	}
	taken = sqlite3_column_int64(st, 0);
	sqlite3_finalize(st);
	st = NULL;
	if (taken) {
		sd_fail(e, "program '%s' already exists", name);
		goto done;
	}
	if (dbi_prepare(db, "INSERT INTO programs (name, format, source) VALUES (?1, ?2, ?3)",
			&st, e))
		goto done;
	sqlite3_bind_text(st, 1, name, -1, SQLITE_TRANSIENT);
	sqlite3_bind_text(st, 2, is_csv ? "csv" : "ini", -1, SQLITE_STATIC);
	/* A zero-length blob must still be a blob, not NULL. */
	sqlite3_bind_blob(st, 3, len ? src : "", (int)len, SQLITE_TRANSIENT);
	return dbi_insert(db, st, "add the program", id, e);
done:
	sqlite3_finalize(st);   /* NULL, or a statement that failed before the insert */
	return -1;
}

static int row_program(sqlite3_stmt *st, struct db_program *p, int with_source, struct sd_err *e)
{
	char fmt[8];

	memset(p, 0, sizeof *p);
	p->id = sqlite3_column_int64(st, 0);
	dbi_text(st, 1, p->name, sizeof p->name);
	dbi_text(st, 2, fmt, sizeof fmt);
	dbi_text(st, 3, p->created, sizeof p->created);
	p->is_csv = !strcmp(fmt, "csv");
	if (!with_source) {
		p->len = (size_t)sqlite3_column_int64(st, 4);
		return 0;
	}
	p->len = (size_t)sqlite3_column_bytes(st, 4);
	p->source = malloc(p->len + 1);
	if (!p->source)
		return sd_fail(e, "out of memory");
	if (p->len)
		memcpy(p->source, sqlite3_column_blob(st, 4), p->len);
	p->source[p->len] = '\0';
	return 0;
}

static int with_source(sqlite3_stmt *st, void *rec, struct sd_err *e)
{
	return row_program(st, rec, 1, e);
}

static int get_by(struct sd_db *db, const char *sql, const char *name, long long id,
		  struct db_program *out, struct sd_err *e)
{
	sqlite3_stmt *st = NULL;
	int rc;

	if (dbi_prepare(db, sql, &st, e))
		return -1;
	if (name)
		sqlite3_bind_text(st, 1, name, -1, SQLITE_TRANSIENT);
	else
		sqlite3_bind_int64(st, 1, id);
	rc = dbi_one(db, st, "read programs", with_source, out, e);
	if (rc == 0 && name)
		sd_fail(e, "unknown program '%s' (see 'setdose program list')", name);
	else if (rc == 0)
		sd_fail(e, "unknown program id %lld", id);
	return rc > 0 ? 0 : -1;
}

int db_program_get(struct sd_db *db, const char *name, struct db_program *out, struct sd_err *e)
{
	return get_by(db, "SELECT id, name, format, created, source FROM programs WHERE name = ?1",
		      name, 0, out, e);
}

int db_program_get_id(struct sd_db *db, long long id, struct db_program *out, struct sd_err *e)
{
	return get_by(db, "SELECT id, name, format, created, source FROM programs WHERE id = ?1",
		      NULL, id, out, e);
}

static int collect_program(sqlite3_stmt *st, void *rec, struct sd_err *e)
{
	return row_program(st, rec, 0, e);
}

int db_program_list(struct sd_db *db, struct db_program **out, int *n, struct sd_err *e)
{
	sqlite3_stmt *st = NULL;
	int ret = -1;

	if (dbi_prepare(db, "SELECT id, name, format, created, length(source) FROM programs "
			    "ORDER BY name COLLATE NOCASE", &st, e))
		goto done;
	ret = dbi_collect(db, st, sizeof(struct db_program), collect_program, (void **)out, n,
			  "read programs", e);
done:
	sqlite3_finalize(st);
	return ret;
}

int db_program_refs(struct sd_db *db, long long id, int *nblocks, struct sd_err *e)
{
	long long b;

	if (dbi_count(db, "SELECT count(*) FROM blocks WHERE program_id = ?1", id, &b, e))
		return -1;
	*nblocks = (int)b;
	return 0;
}

int db_program_rm(struct sd_db *db, long long id, struct sd_err *e)
{
	sqlite3_stmt *st = NULL;
	int nb, ret = -1;

	if (db_program_refs(db, id, &nb, e))
		return -1;
	if (nb)
		return sd_fail(e, "program is used by %d block%s and cannot be removed", nb,
			       nb == 1 ? "" : "s");
	if (dbi_prepare(db, "DELETE FROM programs WHERE id = ?1", &st, e))
		goto done;
	sqlite3_bind_int64(st, 1, id);
	ret = dbi_exec_step(db, st, "remove the program", e);
done:
	sqlite3_finalize(st);
	return ret;
}

void db_program_free(struct db_program *p)
{
	if (p) {
		free(p->source);
		p->source = NULL;
	}
}

void db_program_list_free(struct db_program *p, int n)
{
	for (int i = 0; p && i < n; i++)
		free(p[i].source);
	free(p);
}
