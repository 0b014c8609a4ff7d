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

/* Foreign keys, the busy timeout and the WAL journal on a read-write connection. */
static int setup_rw(struct sd_db *db, int memory, struct sd_err *e)
{
	char mode[32];

	sqlite3_extended_result_codes(db->h, 1);
	sqlite3_busy_timeout(db->h, BUSY_MS);
	if (sqlite3_db_readonly(db->h, "main") == 1)
		return sd_fail(e, "database '%s' cannot be written (the file is read-only); nothing "
			       "was written", db->path);
	if (sqlite3_exec(db->h, "PRAGMA foreign_keys = ON", NULL, NULL, NULL) != SQLITE_OK)
		return dbi_fail(db, e, "open the database");
	/* WAL lets readers go on while one command writes; ":memory:" answers "memory". */
	if (pragma_text(db, "PRAGMA journal_mode = WAL", mode, sizeof mode, e))
		return sd_wrap(e, "database '%s' cannot be written here", db->path);
	if (!memory && strcmp(mode, "wal"))
		return sd_fail(e, "cannot switch database '%s' to WAL journal (got '%s')", db->path,
			       mode);
	db->rw = 1;
	return 0;
}

static int open_rw(struct sd_db *db, int create, struct sd_err *e)
{
	int flags = SQLITE_OPEN_READWRITE | SQLITE_OPEN_NOMUTEX | (create ? SQLITE_OPEN_CREATE : 0);

	if (sqlite3_open_v2(db->path, &db->h, flags, NULL) != SQLITE_OK) {
		if (!db->h)
			return sd_fail(e, "cannot open database '%s': out of memory", db->path);
		return dbi_fail(db, e, "open the database");
	}
	return setup_rw(db, !strcmp(db->path, ":memory:"), e);
}

/* A file: URI naming path, every byte outside the unreserved set percent-encoded. */
static char *file_uri(const char *path, const char *query)
{
	static const char hex[] = "0123456789ABCDEF";
	size_t n = strlen(path);
	char *u = malloc(3 * n + strlen(query) + 8), *o = u;

	if (!u)
		return NULL;
	o += sprintf(o, "file:");
	for (const unsigned char *c = (const unsigned char *)path; *c; c++) {
		if ((*c >= 'a' && *c <= 'z') || (*c >= 'A' && *c <= 'Z') || (*c >= '0' && *c <= '9') ||
		    strchr("/._-~", *c)) {
			*o++ = (char)*c;
		} else {
			*o++ = '%';
			*o++ = hex[*c >> 4];
			*o++ = hex[*c & 15];
		}
	}
	strcpy(o, query);
	return u;
}

static int same_file(const struct stat *a, const struct stat *b)
{
	return a->st_dev == b->st_dev && a->st_ino == b->st_ino && a->st_size == b->st_size &&
	       a->st_mtim.tv_sec == b->st_mtim.tv_sec && a->st_mtim.tv_nsec == b->st_mtim.tv_nsec;
}

/* 1 when PATH-wal holds changes not yet in the database file. */
static int wal_pending(const char *path)
{
	char wal[4200];
	struct stat st;
	snprintf(wal, sizeof wal, "%s-wal", path);
	return !stat(wal, &st) && st.st_size > 0;
}

/* One try at copying an immutable view of the file into memory; 1 when the file changed
 * meanwhile (the copy is then dropped). */
static int snapshot_once(struct sd_db *db, sqlite3 **mem, struct sd_err *e)
{
	struct stat before, after;
	sqlite3 *src = NULL;
	sqlite3_backup *bk = NULL;
	char *uri = file_uri(db->path, "?immutable=1");
	int rc = -1, step;

	*mem = NULL;
	if (!uri)
		return sd_fail(e, "out of memory");
	if (stat(db->path, &before)) {
		sd_fail(e, "cannot open database '%s': %s", db->path, strerror(errno));
		goto done;
	}
	if (sqlite3_open_v2(uri, &src, SQLITE_OPEN_READONLY | SQLITE_OPEN_URI, NULL) != SQLITE_OK ||
	    sqlite3_open_v2(":memory:", mem, SQLITE_OPEN_READWRITE, NULL) != SQLITE_OK ||
	    !(bk = sqlite3_backup_init(*mem, "main", src, "main"))) {
		sd_fail(e, "cannot read database '%s': %s", db->path,
			src ? sqlite3_errmsg(*mem && !bk ? *mem : src) : "out of memory");
		goto done;
	}
	step = sqlite3_backup_step(bk, -1);
	sqlite3_backup_finish(bk);
	if (step != SQLITE_DONE) {
		sd_fail(e, "cannot read database '%s': %s", db->path, sqlite3_errstr(step));
		goto done;
	}
	rc = stat(db->path, &after) || !same_file(&before, &after) || wal_pending(db->path);
done:
	sqlite3_close_v2(src);
	free(uri);
	if (rc) {
		sqlite3_close_v2(*mem);
		*mem = NULL;
	}
	return rc;
}

/* A database in a folder this process cannot write cannot be opened read-only in WAL mode
 * when its -shm file does not exist (SQLite needs to create it). It is then read through
 * SQLite's immutable=1 view into a private in-memory copy: safe because the file is checked
 * unchanged (same inode, size and modification time, no pending -wal) before and after the
 * copy, so a writer elsewhere cannot leave it half-read; the copy is as current as the moment
 * it was taken, and db_refresh takes a new one. */
static int open_snapshot(struct sd_db *db, struct sd_err *e)
{
	if (wal_pending(db->path))
		return sd_fail(e, "database '%s' has changes in its -wal file that only a process "
			       "allowed to write its folder can merge; open it once there", db->path);
	for (int tries = 0; tries < 5; tries++) {
		sqlite3 *mem;
		int rc = snapshot_once(db, &mem, e);
		if (rc < 0)
			return -1;
		if (!rc) {
			db->h = mem;
			db->snapshot = 1;
			sqlite3_extended_result_codes(db->h, 1);
			return 0;
		}
		sqlite3_sleep(50);
	}
	return sd_fail(e, "database '%s' kept changing while being read; try again", db->path);
}

/* Read-only; falls back to a snapshot where the folder cannot hold the WAL index. */
int dbi_open_ro(struct sd_db *db, struct sd_err *e)
{
	long long v;
	int rc;

	/* One thread per process: a connection without SQLite's mutex (at 10,000 athletes its
	 * calls were a quarter of the roster's instructions). */
	rc = sqlite3_open_v2(db->path, &db->h, SQLITE_OPEN_READONLY | SQLITE_OPEN_NOMUTEX, NULL);
	if (rc == SQLITE_OK) {
		sqlite3_extended_result_codes(db->h, 1);
		sqlite3_busy_timeout(db->h, BUSY_MS);
		/* The first read is where a WAL database without its -shm fails. */
		if (!dbi_count(db, "PRAGMA user_version", -1, &v, e))
			return 0;
		rc = sqlite3_errcode(db->h);
	} else if (!db->h) {
		return sd_fail(e, "cannot open database '%s': out of memory", db->path);
	} else {
		dbi_fail(db, e, "open the database");
	}
	if ((rc & 0xff) != SQLITE_READONLY && (rc & 0xff) != SQLITE_CANTOPEN)
		return -1;
	sqlite3_close_v2(db->h);
	db->h = NULL;
	return open_snapshot(db, e);
}

int db_open(const char *path, struct sd_db **out, struct sd_err *e)
{
	struct sd_db *db = NULL;
	int memory = !strcmp(path, ":memory:"), create;

	*out = NULL;
	if (!*path)
		return sd_usage(e, "empty database path");
	if (strlen(path) >= sizeof db->path)
		return sd_fail(e, "database path too long: '%.60s...'", path);
	/* The file is created (with its folder) on first use; an existing one is opened
	 * read-only until a command writes (db_begin). */
	create = memory || (access(path, F_OK) && errno == ENOENT);
	if (create && !memory && make_parent(path, e))
		return -1;
	db = calloc(1, sizeof *db);
	if (!db)
		return sd_fail(e, "out of memory");
	strcpy(db->path, path);
	if (create ? open_rw(db, 1, e) : dbi_open_ro(db, e))
		goto fail;
	if (dbi_migrate(db, e))
		goto fail;
	*out = db;
	return 0;
fail:
	sqlite3_close_v2(db->h);
	free(db);
	return -1;
}

int db_refresh(struct sd_db *db, struct sd_err *e)
{
	sqlite3 *old = db->h;

	/* A live connection sees other processes' commits at its next read. */
	if (!db->snapshot)
		return 0;
	db->h = NULL;
	db->snapshot = 0;
	if (open_snapshot(db, e)) {
		db->h = old;
		db->snapshot = 1;
		return -1;
	}
	sqlite3_close_v2(old);
	return 0;
}

static int check_rows(struct sd_db *db, const char *sql, int fk, char *msg, size_t n,
		      struct sd_err *e);

/* PRAGMA quick_check before a write: a damaged database takes no more writes. */
static int quick_check(struct sd_db *db, struct sd_err *e)
{
	char msg[160] = "";
	struct sd_err ce = { 0 };
	int bad = check_rows(db, "PRAGMA quick_check", 0, msg, sizeof msg, &ce);

	if (!bad)
		return 0;
	if (bad < 0)
		snprintf(msg, sizeof msg, "%s", sqlite3_errmsg(db->h));
	return sd_fail(e, "database '%s' is damaged (%s); nothing was written: 'setdose db check' "
		       "shows the damage, 'setdose db recover NEW.db' copies out what can be read",
		       db->path, msg);
}

/* From read-only to read-write, for the first write of this connection. */
static int reopen_rw(struct sd_db *db, struct sd_err *e)
{
	if (db->snapshot)
		return sd_fail(e, "database '%s' can only be read here (its folder cannot be "
			       "written); nothing was written", db->path);
	sqlite3 *ro = db->h;

	db->h = NULL;
	if (open_rw(db, 0, e)) {
		/* The read-only connection stays, for the rest of the command. */
		sqlite3_close_v2(db->h);
		db->h = ro;
		return -1;
	}
	sqlite3_close_v2(ro);
	return 0;
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
	if (!db->rw && reopen_rw(db, e))
		return -1;
	if (quick_check(db, e))
		return -1;
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
	if (db->h && !sqlite3_get_autocommit(db->h))
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

/* Removes the journal files SQLite may have made beside a file we are building. */
static void drop_sidecars(const char *path)
{
	static const char *const ext[] = { "-journal", "-wal", "-shm" };
	char side[4200];
	for (int i = 0; i < 3; i++) {
		snprintf(side, sizeof side, "%s%s", path, ext[i]);
		unlink(side);
	}
}

int dbi_check_copy(const char *path, char *msg, size_t n)
{
	struct sd_db *c = calloc(1, sizeof *c);
	char *uri = file_uri(path, "?immutable=1");
	struct sd_err ce = { 0 };
	int a = -1, b = -1;

	msg[0] = '\0';
	/* immutable: reading the copy must not create -wal or -shm files beside it. */
	if (c && uri && (snprintf(c->path, sizeof c->path, "%s", path),
			 sqlite3_open_v2(uri, &c->h, SQLITE_OPEN_READONLY | SQLITE_OPEN_URI, NULL)
			 == SQLITE_OK)) {
		a = check_rows(c, "PRAGMA integrity_check", 0, msg, n, &ce);
		if (a >= 0)
			b = check_rows(c, "PRAGMA foreign_key_check", 1, msg, n, &ce);
	}
	if (a < 0 || b < 0)
		snprintf(msg, n, "%s", c && c->h ? sqlite3_errmsg(c->h) : "out of memory");
	if (c)
		sqlite3_close_v2(c->h);
	free(c);
	free(uri);
	drop_sidecars(path);
	return a || b ? -1 : 0;
}

int db_backup(struct sd_db *db, const char *dest, const char *label, struct sd_err *e)
{
	sqlite3 *d = NULL;
	sqlite3_backup *bk;
	int ret = -1, rc;

	if (sqlite3_open_v2(dest, &d, SQLITE_OPEN_READWRITE, NULL) != SQLITE_OK) {
		sd_fail(e, "cannot write '%s': %s", label, d ? sqlite3_errmsg(d) : "out of memory");
		goto done;
	}
	sqlite3_busy_timeout(d, BUSY_MS);
	/* The copy is a new file checked and renamed into place by the caller: it needs no
	 * journal of its own, and is fsync'ed once at the end. */
	sqlite3_exec(d, "PRAGMA journal_mode = OFF; PRAGMA synchronous = OFF", NULL, NULL, NULL);
	bk = sqlite3_backup_init(d, "main", db->h, "main");
	if (!bk) {
		sd_fail(e, "cannot back up to '%s': %s", label, sqlite3_errmsg(d));
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
		sd_fail(e, "cannot back up to '%s': %s", label, sqlite3_errstr(rc));
		goto done;
	}
	ret = 0;
done:
	sqlite3_close_v2(d);
	drop_sidecars(dest);
	if (!ret) {
		char msg[200];
		if (dbi_check_copy(dest, msg, sizeof msg))
			return sd_fail(e, "database '%s' is damaged: its copy fails the check (%s); "
				       "nothing was written to '%s'. 'setdose db check' shows the damage, "
				       "'setdose db recover NEW.db' copies out what can be read",
				       db->path, msg, label);
	}
	return ret;
}
