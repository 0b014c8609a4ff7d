/* Opening and closing the database, transactions, checks and backups. */
#include "db_int.h"

#include <errno.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/stat.h>
#include <unistd.h>

/* Long enough for another command's transaction to finish (they are short); a writer that
 * still finds the database locked after this reports it instead of hanging. */
#define BUSY_MS 10000

const char *db_default_path(char *buf, size_t n)
{
	const char *x = getenv("XDG_DATA_HOME"), *home = getenv("HOME");
	int len;

	if (x && *x)
		len = snprintf(buf, n, "%s/setdose/setdose.db", x);
	else if (home && *home)
		len = snprintf(buf, n, "%s/.local/share/setdose/setdose.db", home);
	else
		return NULL;
	return len > 0 && (size_t)len < n ? buf : NULL;
}

/* mkdir -p of the folder holding path. */
static int make_parent(const char *path, struct sd_err *e)
{
	char dir[4096];
	char *slash;

	if (strlen(path) >= sizeof dir)
		return sd_fail(e, "database path too long: '%.60s...'", path);
	strcpy(dir, path);
	slash = strrchr(dir, '/');
	if (!slash || slash == dir)
		return 0;
	*slash = '\0';
	for (char *p = dir + 1; *p; p++) {
		if (*p != '/')
			continue;
		*p = '\0';
		if (mkdir(dir, 0700) && errno != EEXIST)
			return sd_fail(e, "cannot create folder '%s': %s", dir, strerror(errno));
		*p = '/';
	}
	if (mkdir(dir, 0700) && errno != EEXIST)
		return sd_fail(e, "cannot create folder '%s': %s", dir, strerror(errno));
	return 0;
}

static int pragma_text(struct sd_db *db, const char *sql, char *buf, size_t n, struct sd_err *e)
{
	sqlite3_stmt *st = NULL;
	int ret = -1;

	if (dbi_prepare(db, sql, &st, e))
		goto done;
	if (sqlite3_step(st) != SQLITE_ROW) {
		dbi_fail(db, e, "set up the database");
		goto done;
	}
	dbi_text(st, 0, buf, n);
	ret = 0;
done:
	sqlite3_finalize(st);
	return ret;
}

int db_open(const char *path, struct sd_db **out, struct sd_err *e)
{
	struct sd_db *db = NULL;
	char mode[32];
	int memory = !strcmp(path, ":memory:");

	*out = NULL;
	if (!*path)
		return sd_usage(e, "empty database path");
	if (strlen(path) >= sizeof db->path)
		return sd_fail(e, "database path too long: '%.60s...'", path);
	if (!memory && make_parent(path, e))
		return -1;
	db = calloc(1, sizeof *db);
	if (!db)
		return sd_fail(e, "out of memory");
	strcpy(db->path, path);
	if (sqlite3_open_v2(path, &db->h, SQLITE_OPEN_READWRITE | SQLITE_OPEN_CREATE, NULL)
	    != SQLITE_OK) {
		if (!db->h) {
			sd_fail(e, "cannot open database '%s': out of memory", path);
			goto fail;
		}
		dbi_fail(db, e, "open the database");
		goto fail;
	}
	sqlite3_extended_result_codes(db->h, 1);
	sqlite3_busy_timeout(db->h, BUSY_MS);
	if (sqlite3_exec(db->h, "PRAGMA foreign_keys = ON", NULL, NULL, NULL) != SQLITE_OK) {
		dbi_fail(db, e, "open the database");
		goto fail;
	}
	/* WAL lets readers go on while one command writes; ":memory:" answers "memory". */
	if (pragma_text(db, "PRAGMA journal_mode = WAL", mode, sizeof mode, e))
		goto fail;
	if (!memory && strcmp(mode, "wal")) {
		sd_fail(e, "cannot switch database '%s' to WAL journal (got '%s')", path, mode);
		goto fail;
	}
	if (dbi_migrate(db, e))
		goto fail;
	*out = db;
	return 0;
fail:
	sqlite3_close_v2(db->h);
	free(db);
	return -1;
}

void db_close(struct sd_db *db)
{
	if (!db)
		return;
	db_rollback(db);
	sqlite3_close_v2(db->h);
	free(db);
}

const char *db_path(const struct sd_db *db)
{
	return db->path;
}

int db_begin(struct sd_db *db, struct sd_err *e)
{
	/* IMMEDIATE takes the write lock now, so a second writer waits in the busy handler here
	 * rather than failing later when its read lock cannot be upgraded. */
	if (sqlite3_exec(db->h, "BEGIN IMMEDIATE", NULL, NULL, NULL) != SQLITE_OK)
		return dbi_fail(db, e, "start a transaction");
	return 0;
}

int db_commit(struct sd_db *db, struct sd_err *e)
{
	if (sqlite3_exec(db->h, "COMMIT", NULL, NULL, NULL) != SQLITE_OK) {
		dbi_fail(db, e, "commit");
		db_rollback(db);
		return -1;
	}
	return 0;
}

void db_rollback(struct sd_db *db)
{
	if (!sqlite3_get_autocommit(db->h))
		sqlite3_exec(db->h, "ROLLBACK", NULL, NULL, NULL);
}

/* Runs a check pragma, appending its first findings to msg; returns the rows that are not
 * "ok", or -1 on error. */
static int check_rows(struct sd_db *db, const char *sql, int fk, char *msg, size_t n,
		      struct sd_err *e)
{
	sqlite3_stmt *st = NULL;
	int bad = 0, rc;

	if (dbi_prepare(db, sql, &st, e))
		return -1;
	while ((rc = sqlite3_step(st)) == SQLITE_ROW) {
		char row[200];
		if (fk)
			snprintf(row, sizeof row, "%s row %lld references missing %s",
				 (const char *)sqlite3_column_text(st, 0),
				 (long long)sqlite3_column_int64(st, 1),
				 (const char *)sqlite3_column_text(st, 2));
		else
			dbi_text(st, 0, row, sizeof row);
		if (!fk && !strcmp(row, "ok"))
			continue;
		if (bad++ < 3 && strlen(msg) + strlen(row) + 3 < n)
			strcat(strcat(msg, *msg ? "; " : ""), row);
	}
	if (rc != SQLITE_DONE) {
		sqlite3_finalize(st);
		return dbi_fail(db, e, "check the database");
	}
	sqlite3_finalize(st);
	return bad;
}

int db_check(struct sd_db *db, int *problems, struct sd_err *e)
{
	char msg[400] = "";
	int a, b;

	if (problems)
		*problems = 0;
	a = check_rows(db, "PRAGMA integrity_check", 0, msg, sizeof msg, e);
	if (a < 0)
		return -1;
	b = check_rows(db, "PRAGMA foreign_key_check", 1, msg, sizeof msg, e);
	if (b < 0)
		return -1;
	if (problems)
		*problems = a + b;
	if (a + b)
		return sd_fail(e, "database '%s' failed its check (%d problem%s): %s", db->path,
			       a + b, a + b == 1 ? "" : "s", msg);
	return 0;
}

int db_backup(struct sd_db *db, const char *dest, int overwrite, struct sd_err *e)
{
	sqlite3 *d = NULL;
	sqlite3_backup *bk;
	struct stat sb;
	int created = 0, ret = -1, rc;

	if (!*dest)
		return sd_usage(e, "empty backup file name");
	if (!stat(dest, &sb)) {
		if (!overwrite)
			return sd_fail(e, "backup file '%s' already exists (use --force to replace it)",
				       dest);
	} else {
		created = 1;
	}
	if (sqlite3_open_v2(dest, &d, SQLITE_OPEN_READWRITE | SQLITE_OPEN_CREATE, NULL)
	    != SQLITE_OK) {
		sd_fail(e, "cannot create backup '%s': %s", dest, d ? sqlite3_errmsg(d) : "out of memory");
		goto done;
	}
	sqlite3_busy_timeout(d, BUSY_MS);
	bk = sqlite3_backup_init(d, "main", db->h, "main");
	if (!bk) {
		sd_fail(e, "cannot back up to '%s': %s", dest, sqlite3_errmsg(d));
		goto done;
	}
	/* Copy in steps, so a writer elsewhere is not held off for the whole copy. */
	do {
		rc = sqlite3_backup_step(bk, 256);
		if (rc == SQLITE_BUSY || rc == SQLITE_LOCKED)
			sqlite3_sleep(20);
	} while (rc == SQLITE_OK || rc == SQLITE_BUSY || rc == SQLITE_LOCKED);
	sqlite3_backup_finish(bk);
	if (rc != SQLITE_DONE) {
		sd_fail(e, "cannot back up to '%s': %s", dest, sqlite3_errstr(rc));
		goto done;
	}
	ret = 0;
done:
	sqlite3_close_v2(d);
	if (ret && created)
		unlink(dest);
	return ret;
}
