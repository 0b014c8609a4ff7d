/* db: where the database is, whether it is sound, and an online backup of it. */
#include <stdio.h>
#include <string.h>

#include "../io/safefile.h"
#include "../io/wrap.h"
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

static const struct sd_optdef target_opts[] = {
	{ "force", OPT_FLAG, 0, 0, 0, NULL, NULL, "replace an existing FILE" },
};

/* FILE [--force] after the subcommand's name. */
static int target_args(const char *label, int argc, char **argv, const char **file, int *force,
		       struct sd_err *e)
{
	*force = 0;
	if ((argc = opt_parse(label, target_opts, OPT_N(target_opts), force, argc, argv, e)) < 0)
		return -1;
	if (argc != 2)
		return usage(e);
	*file = argv[1];
	return 0;
}

/* The copy is made in a temporary file beside FILE, checked, and only then renamed into
 * place (io/safefile.h): "backed up" is said of a copy that passed its check. */
static int do_backup(struct sd_ctx *ctx, struct sd_db *db, int argc, char **argv,
		     struct sd_err *e)
{
	struct sf_file sf;
	const char *file = NULL;
	int force;

	if (target_args("db backup", argc, argv, &file, &force, e) || sf_open(&sf, file, force, e))
		return -1;
	if (sf_finish(&sf, db_backup(db, sf.tmp, file, e), e))
		return -1;
	fprintf(ctx->out, "backed up %s to %s (copy checked)\n", db_path(db), file);
	return 0;
}

/* Never in place: the damaged file is only read. */
static int do_recover(struct sd_ctx *ctx, const char *path, int argc, char **argv,
		      struct sd_err *e)
{
	struct db_recovery r;
	struct sf_file sf;
	const char *file = NULL;
	int force;

	if (target_args("db recover", argc, argv, &file, &force, e) || sf_open(&sf, file, force, e))
		return -1;
	if (sf_finish(&sf, db_recover(path, sf.tmp, file, &r, e), e))
		return -1;
	fprintf(ctx->out, "recovered %lld rows of %s into %s: %s\n", r.rows, path, file, r.detail);
	if (r.dropped || r.damaged)
		wrap_printf(ctx->out, 6, "note: %lld row%s left out (a broken constraint or a lost "
			    "parent row), %d damaged region%s skipped; look the copy over before using it "
			    "with --db %s", r.dropped, r.dropped == 1 ? "" : "s", r.damaged,
			r.damaged == 1 ? "" : "s", file);
	return 0;
}

static int exec_db(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	const char *sub = argc > 1 ? argv[1] : "";
	char path[4096];
	struct sd_db *db = NULL;
	int rc;

	if (app_db_path(ctx, path, sizeof path, e))
		return -1;
	if ((!strcmp(sub, "path") || !strcmp(sub, "check")) &&
	    (argc = opt_parse(!strcmp(sub, "path") ? "db path" : "db check", NULL, 0, NULL, argc - 1,
			      argv + 1, e) + 1) < 1)
		return -1;
	/* 'path' does not open (nor create) the database. */
	if (!strcmp(sub, "path")) {
		if (argc != 2)
			return usage(e);
		fprintf(ctx->out, "%s\n", path);
		return 0;
	}
	/* 'recover' reads the damaged file itself, without opening it as a database. */
	if (!strcmp(sub, "recover"))
		return do_recover(ctx, path, argc - 1, argv + 1, e);
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

/* For the option layer and help; exec_db dispatches itself ('path' and 'recover' open no
 * database). */
static const struct sd_sub subs[] = {
	{ "path", "db path", NULL, NULL, 0 },
	{ "check", "db check", NULL, NULL, 0 },
	{ "backup", "db backup", NULL, target_opts, OPT_N(target_opts) },
	{ "recover", "db recover", NULL, target_opts, OPT_N(target_opts) },
	{ NULL, NULL, NULL, NULL, 0 },
};

const struct sd_cmd cmd_db = {
	.name = "db",
	.summary = "the database: its path, an integrity check, a checked backup, recovery",
	.usage = "db path | db check | db backup FILE [--force] | db recover FILE [--force]\n"
		 "  path     prints the database path (--db, SETDOSE_DB, else the default)\n"
		 "  check    PRAGMA integrity_check and foreign_key_check; exit 1 unless both pass\n"
		 "  backup   copies the database while it is in use (SQLite online backup) and\n"
		 "           checks the copy before putting it in place\n"
		 "  recover  copies every row that can still be read from a damaged database\n"
		 "           into the new FILE; the damaged file is never written\n"
		 "  FILE     an existing FILE is replaced only with --force",
	.flags = 0,
	.exec = exec_db,
	.subs = subs,
};
