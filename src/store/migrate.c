/* Schema versions: db/NNN_*.sql embedded at build time (db/embed.sh), applied in order inside
 * one transaction; PRAGMA user_version records the version reached. */
#include "db_int.h"

#include <stdio.h>

#include "schema.h"

/* Marks a file as a setdose database ("SDos"), so another program's SQLite file is refused
 * rather than migrated. */
#define APP_ID 0x53446f73

int db_schema_latest(void)
{
	return SCHEMA_LATEST;
}

static int read_int(struct sd_db *db, const char *sql, long long *v, struct sd_err *e)
{
	return dbi_count(db, sql, -1, v, e);
}

int db_schema_version(struct sd_db *db)
{
	long long v = -1;

	if (read_int(db, "PRAGMA user_version", &v, NULL))
		return -1;
	return (int)v;
}

/* Refuses files this binary must not touch: another program's database, or a newer schema. */
static int vet(struct sd_db *db, long long ver, struct sd_err *e)
{
	long long app, tables;

	if (read_int(db, "PRAGMA application_id", &app, e) ||
	    read_int(db, "SELECT count(*) FROM sqlite_master", &tables, e))
		return -1;
	if ((ver > 0 || app != 0) && app != APP_ID)
		return sd_fail(e, "'%s' is not a setdose database (application id %lld)", db->path,
			       app);
	if (ver == 0 && tables > 0)
		return sd_fail(e, "'%s' is not a setdose database (it has tables but no version)",
			       db->path);
	if (ver > SCHEMA_LATEST)
		return sd_fail(e, "database '%s' has schema version %lld, newer than this setdose "
			       "understands (%d); use a newer setdose", db->path, ver, SCHEMA_LATEST);
	return 0;
}

int dbi_migrate(struct sd_db *db, struct sd_err *e)
{
	long long ver;
	char sql[64], app[64];

	if (read_int(db, "PRAGMA user_version", &ver, e)) {
		sd_wrap(e, "not a usable database");
		return -1;
	}
	if (vet(db, ver, e))
		return -1;
	if (ver == SCHEMA_LATEST)
		return 0;
	if (db_begin(db, e))
		return -1;
	/* Read again under the write lock: another process may have migrated meanwhile. */
	if (read_int(db, "PRAGMA user_version", &ver, e) || vet(db, ver, e))
		goto fail;
	for (long long v = ver + 1; v <= SCHEMA_LATEST; v++) {
		if (sqlite3_exec(db->h, (const char *)schema_sql[v - 1], NULL, NULL, NULL)
		    != SQLITE_OK) {
			sd_fail(e, "cannot migrate database '%s' to version %lld: %s", db->path, v,
				sqlite3_errmsg(db->h));
			goto fail;
		}
	}
	/* Pragmas take no bound values; both numbers are this file's constants. */
	snprintf(sql, sizeof sql, "PRAGMA user_version = %d", SCHEMA_LATEST);
	snprintf(app, sizeof app, "PRAGMA application_id = %d", APP_ID);
	if (sqlite3_exec(db->h, sql, NULL, NULL, NULL) != SQLITE_OK ||
	    sqlite3_exec(db->h, app, NULL, NULL, NULL) != SQLITE_OK) {
		dbi_fail(db, e, "record the schema version");
		goto fail;
	}
	return db_commit(db, e);
fail:
	db_rollback(db);
	return -1;
}
