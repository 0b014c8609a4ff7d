/* db recover: every row that can still be read from a damaged database, copied into a new
 * file under the current schema.
 *
 * Debian 12's SQLite (3.40) ships neither the sqlite3_recover API (an extension outside the
 * library) nor the sqlite_dbpage table it needs, so this is a dump and reload of the readable
 * rows: each table is walked in rowid order through its b-tree; where a page cannot be read,
 * the walk seeks past it (doubling the step until a seek succeeds, then narrowing back) and
 * goes on. Indexes are not read (they are rebuilt by the inserts), so a damaged index loses
 * nothing. Rows that break a constraint or whose parent row was lost are left out and
 * counted, so the copy passes `db check`. */
#include "db_int.h"

#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#define MAXCOLS 64

struct table_copy {
	const char *name;
	char cols[MAXCOLS][64];
	int ncols;
	sqlite3_stmt *read, *probe, *ins;
	long long rows, dropped;
	int damaged;
	int derived;     /* rebuilt from other tables rather than copied */
};

/* Column names of table t on connection h ("main" schema); -1 when unreadable. */
static int columns(sqlite3 *h, const char *t, char cols[][64], int *n)
{
	sqlite3_stmt *st = NULL;
	int rc;

	*n = 0;
	if (sqlite3_prepare_v2(h, "SELECT name FROM pragma_table_info(?1)", -1, &st, NULL))
		return -1;
	sqlite3_bind_text(st, 1, t, -1, SQLITE_STATIC);
	while ((rc = sqlite3_step(st)) == SQLITE_ROW && *n < MAXCOLS) {
		const unsigned char *c = sqlite3_column_text(st, 0);
		snprintf(cols[(*n)++], 64, "%s", c ? (const char *)c : "");
	}
	sqlite3_finalize(st);
	return rc == SQLITE_ROW || rc == SQLITE_DONE ? 0 : -1;
}

static int has(char cols[][64], int n, const char *c)
{
	for (int i = 0; i < n; i++)
		if (!strcmp(cols[i], c))
			return 1;
	return 0;
}

/* The columns both sides have, and the three statements over them. */
static int prepare(sqlite3 *src, sqlite3 *dst, struct table_copy *t)
{
	char scols[MAXCOLS][64], dcols[MAXCOLS][64], list[4096] = "", marks[512] = "";
	char sql[4600];
	int ns, nd;

	if (columns(src, t->name, scols, &ns) || columns(dst, t->name, dcols, &nd) || !ns)
		return -1;
	t->ncols = 0;
	for (int i = 0; i < nd; i++)
		if (has(scols, ns, dcols[i])) {
			size_t used = strlen(list);
			snprintf(list + used, sizeof list - used, "%s\"%s\"", t->ncols ? ", " : "",
				 dcols[i]);
			used = strlen(marks);
			snprintf(marks + used, sizeof marks - used, "%s?", t->ncols ? ", " : "");
			snprintf(t->cols[t->ncols++], 64, "%s", dcols[i]);
		}
	if (!t->ncols)
		return -1;
	/* Names come from the schema (no user input), quoted as identifiers. */
	snprintf(sql, sizeof sql, "SELECT rowid, %s FROM \"%s\" WHERE rowid > ?1 ORDER BY rowid",
		 list, t->name);
	if (sqlite3_prepare_v2(src, sql, -1, &t->read, NULL))
		return -1;
	snprintf(sql, sizeof sql, "SELECT rowid FROM \"%s\" WHERE rowid > ?1 ORDER BY rowid LIMIT 1",
		 t->name);
	if (sqlite3_prepare_v2(src, sql, -1, &t->probe, NULL))
		return -1;
	snprintf(sql, sizeof sql, "INSERT INTO \"%s\" (%s) VALUES (%s)", t->name, list, marks);
	return sqlite3_prepare_v2(dst, sql, -1, &t->ins, NULL) ? -1 : 0;
}

/* 1 when a seek past `from` reads (a row or the end), 0 when it hits damage. */
static int readable_after(struct table_copy *t, long long from)
{
	int rc;
	sqlite3_reset(t->probe);
	sqlite3_bind_int64(t->probe, 1, from);
	rc = sqlite3_step(t->probe);
	return rc == SQLITE_ROW || rc == SQLITE_DONE;
}

/* After damage following rowid `last`: the smallest readable restart point found, or 0 when
 * no seek past the damage succeeds. */
static int skip_damage(struct table_copy *t, long long last, long long *restart)
{
	long long step = 1, good = -1;

	/* Damage before the first row read: rowids here are positive, so seek from 0. */
	if (last < -1)
		last = -1;
	for (int i = 0; i < 63; i++, step *= 2) {
		if (last > INT64_MAX - step)
			break;
		if (readable_after(t, last + step)) {
			good = step;
			break;
		}
	}
	if (good < 0)
		return 0;
	/* Narrow back: the first readable seek between the last failing and the good step. */
	long long lo = good / 2, hi = good;
	while (hi - lo > 1) {
		long long mid = lo + (hi - lo) / 2;
		if (readable_after(t, last + mid))
			hi = mid;
		else
			lo = mid;
	}
	*restart = last + hi;
	return 1;
}

/* Inserts the current row of t->read; a constraint failure leaves it out. -1 on any other
 * failure of the new file (a full disk). */
static int insert_row(struct table_copy *t)
{
	int rc;
	sqlite3_reset(t->ins);
	for (int c = 0; c < t->ncols; c++)
		sqlite3_bind_value(t->ins, c + 1, sqlite3_column_value(t->read, c + 1));
	rc = sqlite3_step(t->ins);
	if (rc == SQLITE_DONE) {
		t->rows++;
		return 0;
	}
	if ((rc & 0xff) == SQLITE_CONSTRAINT || (rc & 0xff) == SQLITE_MISMATCH ||
	    (rc & 0xff) == SQLITE_TOOBIG) {
		t->dropped++;
		return 0;
	}
	return -1;
}

static int copy_rows(sqlite3 *dst, struct table_copy *t, struct sd_err *e, const char *label)
{
	long long last = INT64_MIN;

	for (;;) {
		int rc;
		sqlite3_reset(t->read);
		sqlite3_bind_int64(t->read, 1, last);
		while ((rc = sqlite3_step(t->read)) == SQLITE_ROW) {
			long long id = sqlite3_column_int64(t->read, 0);
			if (id <= last) {        /* a damaged page out of order */
				rc = SQLITE_CORRUPT;
				break;
			}
			last = id;
			if (insert_row(t))
				return sd_fail(e, "cannot write '%s': %s", label, sqlite3_errmsg(dst));
		}
		if (rc == SQLITE_DONE)
			return 0;
		t->damaged++;
		/* The walk goes on past the restart point, where a seek succeeded. */
		if (t->damaged > 10000 || !skip_damage(t, last, &last))
			return 0;
	}
}

/* Rows whose parent was lost: left out, so the copy passes foreign_key_check. */
static long long drop_orphans(sqlite3 *dst, struct table_copy *tabs, int n)
{
	long long total = 0;
	for (int round = 0; round < 8; round++) {
		sqlite3_stmt *st = NULL;
		long long k = 0;
		if (sqlite3_prepare_v2(dst, "SELECT \"table\", rowid FROM pragma_foreign_key_check",
				       -1, &st, NULL))
			return total;
		while (sqlite3_step(st) == SQLITE_ROW) {
			const char *t = (const char *)sqlite3_column_text(st, 0);
			char sql[200];
			snprintf(sql, sizeof sql, "DELETE FROM \"%s\" WHERE rowid = %lld", t,
				 (long long)sqlite3_column_int64(st, 1));
			if (sqlite3_exec(dst, sql, NULL, NULL, NULL) == SQLITE_OK) {
				k++;
				for (int i = 0; i < n; i++)
					if (!strcmp(tabs[i].name, t)) {
						tabs[i].rows--;
						tabs[i].dropped++;
					}
			}
		}
		sqlite3_finalize(st);
		total += k;
		if (!k)
			break;
	}
	return total;
}

/* The new file's tables in creation order (parents before children). */
static int table_names(sqlite3 *dst, char names[][64], int max)
{
	sqlite3_stmt *st = NULL;
	int n = 0;
	if (sqlite3_prepare_v2(dst, "SELECT name FROM sqlite_master WHERE type = 'table' AND "
			       "name NOT LIKE 'sqlite_%' ORDER BY rowid", -1, &st, NULL))
		return -1;
	while (sqlite3_step(st) == SQLITE_ROW && n < max)
		snprintf(names[n++], 64, "%s", (const char *)sqlite3_column_text(st, 0));
	sqlite3_finalize(st);
	return n;
}

static void describe(const struct table_copy *tabs, int n, struct db_recovery *r)
{
	size_t used = 0;
	r->detail[0] = '\0';
	for (int i = 0; i < n && used < sizeof r->detail; i++) {
		const struct table_copy *t = &tabs[i];
		if (t->derived)
			continue;
		used += (size_t)snprintf(r->detail + used, sizeof r->detail - used, "%s%s %lld",
					 i ? ", " : "", t->name, t->rows);
		if (used < sizeof r->detail && (t->dropped || t->damaged))
			used += (size_t)snprintf(r->detail + used, sizeof r->detail - used,
						 " (%lld left out, %d damaged region%s skipped)",
						 t->dropped, t->damaged, t->damaged == 1 ? "" : "s");
		r->rows += t->rows;
		r->dropped += t->dropped;
		r->damaged += t->damaged;
	}
}

int db_recover(const char *src, const char *dest, const char *label, struct db_recovery *r,
	       struct sd_err *e)
{
	struct sd_db *in = calloc(1, sizeof *in), *out = calloc(1, sizeof *out);
	struct table_copy tabs[16];
	char names[16][64], msg[200];
	struct sd_err ve = { 0 };
	long long ver;
	int n = 0, readable = 0, ret = -1;

	memset(r, 0, sizeof *r);
	memset(tabs, 0, sizeof tabs);
	if (!in || !out) {
		sd_fail(e, "out of memory");
		goto done;
	}
	snprintf(in->path, sizeof in->path, "%s", src);
	snprintf(out->path, sizeof out->path, "%s", label);
	if (access(src, F_OK)) {
		sd_fail(e, "database '%s' does not exist", src);
		goto done;
	}
	if (dbi_open_ro(in, e))
		goto done;
	/* Columns a newer setdose added would be lost: a newer file needs a newer setdose. */
	if (!dbi_count(in, "PRAGMA user_version", -1, &ver, &ve) && ver > db_schema_latest()) {
		sd_fail(e, "database '%s' has schema version %lld, newer than this setdose "
			"understands (%d); recover it with a newer setdose", src, ver, db_schema_latest());
		goto done;
	}
	if (sqlite3_open_v2(dest, &out->h, SQLITE_OPEN_READWRITE, NULL) != SQLITE_OK) {
		sd_fail(e, "cannot write '%s': %s", label, out->h ? sqlite3_errmsg(out->h) : "out of memory");
		goto done;
	}
	sqlite3_extended_result_codes(out->h, 1);
	/* A new file, checked and renamed into place by the caller: no journal, one fsync. */
	sqlite3_exec(out->h, "PRAGMA journal_mode = OFF; PRAGMA synchronous = OFF", NULL, NULL, NULL);
	out->rw = 1;
	if (dbi_migrate(out, e))
		goto done;
	if ((n = table_names(out->h, names, 16)) < 0) {
		dbi_fail(out, e, "read the new schema");
		goto done;
	}
	if (db_begin(out, e))
		goto done;
	for (int i = 0; i < n; i++) {
		tabs[i].name = names[i];
		/* Derived from logs: rebuilt below from the rows that were saved. */
		if (!strcmp(names[i], "log_weeks")) {
			tabs[i].derived = 1;
			continue;
		}
		if (prepare(in->h, out->h, &tabs[i])) {
			tabs[i].damaged++;   /* its schema or first page cannot be read */
			continue;
		}
		readable++;
		if (copy_rows(out->h, &tabs[i], e, label))
			goto done;
	}
	if (!readable) {
		sd_fail(e, "nothing can be read from database '%s': %s", src, sqlite3_errmsg(in->h));
		goto done;
	}
	drop_orphans(out->h, tabs, n);
	if (dbi_log_rebuild_weeks(out, e) || db_commit(out, e))
		goto done;
	r->tables = readable;
	describe(tabs, n, r);
	ret = 0;
done:
	for (int i = 0; i < n; i++) {
		sqlite3_finalize(tabs[i].read);
		sqlite3_finalize(tabs[i].probe);
		sqlite3_finalize(tabs[i].ins);
	}
	if (out)
		db_close(out);
	if (in)
		db_close(in);
	if (!ret && dbi_check_copy(dest, msg, sizeof msg))
		ret = sd_fail(e, "the recovered copy for '%s' fails its check (%s); nothing was written",
			      label, msg);
	return ret;
}
