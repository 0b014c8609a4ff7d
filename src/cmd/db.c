/* db: where the database is, whether it is sound, and an online backup of it. */
#include <getopt.h>
#include <stdio.h>
#include <string.h>

#include "dbutil.h"

extern const struct sd_cmd cmd_db;

static int usage(struct sd_err *e)
{
	return sd_usage(e, "usage: setdose %s", cmd_db.usage);
}

static int do_check(struct sd_ctx *ctx, struct sd_db *db, struct sd_err *e)
{
	if (db_check(db, NULL, e))
		return -1;
	fprintf(ctx->out, "ok: %s (schema version %d, integrity and foreign keys checked)\n",
		db_path(db), db_schema_version(db));
	return 0;
}

static int do_backup(struct sd_ctx *ctx, struct sd_db *db, int argc, char **argv,
		     struct sd_err *e)
{
	static const struct option longopts[] = {
		{ "force", no_argument, NULL, 'f' },
		{ NULL, 0, NULL, 0 },
	};
	int c, force = 0;

	optind = 0;
	opterr = 0;
	while ((c = getopt_long(argc, argv, "", longopts, NULL)) != -1) {
		if (c != 'f')
			return dbu_badopt(&cmd_db, argc, argv, e);
		force = 1;
	}
	if (optind != argc - 1)
		return usage(e);
	if (db_backup(db, argv[optind], force, e))
		return -1;
	fprintf(ctx->out, "backed up %s to %s\n", db_path(db), argv[optind]);
	return 0;
}

static int exec_db(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	const char *sub = argc > 1 ? argv[1] : "";
	char path[4096];
	struct sd_db *db = NULL;
	int rc;

	if (dbu_path(ctx, path, sizeof path, e))
		return -1;
	/* 'path' does not open (nor create) the database. */
	if (!strcmp(sub, "path")) {
		if (argc != 2)
			return usage(e);
		fprintf(ctx->out, "%s\n", path);
		return 0;
	}
	if (strcmp(sub, "check") && strcmp(sub, "backup"))
		return usage(e);
	if (!strcmp(sub, "check") && argc != 2)
		return usage(e);
	if (db_open(path, &db, e))
		return -1;
	rc = !strcmp(sub, "check") ? do_check(ctx, db, e) : do_backup(ctx, db, argc - 1, argv + 1, e);
	db_close(db);
	return rc;
}

const struct sd_cmd cmd_db = {
	.name = "db",
	.summary = "the database: its path, an integrity check, an online backup",
	.usage = "db path | db check | db backup FILE [--force]\n"
		 "  path     prints the database path (--db, SETDOSE_DB, else the default)\n"
		 "  check    PRAGMA integrity_check and foreign_key_check; exit 1 unless both pass\n"
		 "  backup   copies the database while it is in use (SQLite online backup);\n"
		 "           refuses an existing FILE unless --force",
	.flags = 0,
	.exec = exec_db,
};
