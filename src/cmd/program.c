/* program: program templates stored in the database, kept as their source text. */
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <strings.h>

#include "../io/program_io.h"
#include "../io/recout.h"
#include "dbutil.h"

extern const struct sd_cmd cmd_program;

static int usage(struct sd_err *e)
{
	return sd_usage(e, "usage: setdose %s", cmd_program.usage);
}

/* Validates one file and stores it, inside the caller's transaction; `said` gets the line to
 * print once the transaction has committed. */
static int add_one(struct sd_ctx *ctx, const char *path, const char *name_opt, char *said,
		   size_t n, struct sd_err *e)
{
	struct sd_program prog;
	char name[DB_PROGNAME_MAX + 64];

	if (app_program_add_file(ctx, path, name_opt, &prog, name, sizeof name, e))
		return -1;
	snprintf(said, n, "added program '%s' from %s (%d day%s, %d exercise entr%s)\n", name,
		 path, prog.ndays, prog.ndays == 1 ? "" : "s", prog.nentries,
		 prog.nentries == 1 ? "y" : "ies");
	/* How it was read (an old-style @N, a repeated exercise) matters before it is used. */
	for (int i = 0; i < prog.nnotes; i++)
		fprintf(stderr, "setdose: warning: '%s' %s\n", path, prog.notes[i].text);
	prog_free(&prog);
	return 0;
}

static const struct sd_optdef add_opts[] = {
	{ "name", OPT_STR, 0, 0, 0, NULL, "NAME", "store the template under NAME (one FILE only)" },
};

static int do_add(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	const char *name = NULL;
	char (*said)[600] = NULL;
	int rc = -1, firstarg = 1;   /* the files: argv[1..] once the options are read */

	if ((argc = opt_parse("program add", add_opts, OPT_N(add_opts), &name, argc, argv, e)) < 0)
		return -1;
	if (firstarg >= argc)
		return usage(e);
	if (name && argc - firstarg > 1)
		return sd_usage(e, "--name names one program; give one FILE with it");
	/* All files in one transaction: either every template is stored or none is, and
	 * "added" is said only after the commit. */
	if (!(said = calloc((size_t)(argc - firstarg), sizeof *said)))
		return sd_fail(e, "out of memory");
	if (db_begin(ctx->db, e))
		goto done;
	for (int i = firstarg; i < argc; i++)
		if (add_one(ctx, argv[i], name, said[i - firstarg], sizeof said[0], e))
			goto done;
	if (db_commit(ctx->db, e))
		goto done;
	if (ctx->opt.format == SD_FMT_TABLE) {
		for (int i = 0; i < argc - firstarg; i++)
			fputs(said[i], ctx->out);
		if (argc - firstarg > 1)
			fprintf(ctx->out, "added %d programs\n", argc - firstarg);
	}
	rc = 0;
done:
	free(said);
	return rc;
}

static int do_list(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	static const char *const heads[] = { "<name", "<format", "bytes", "blocks", "<created" };
	struct db_program *v = NULL;
	struct sd_rec *r = NULL;
	int n = 0, rc = -1;

	(void)argv;   /* takes no arguments; the signature is the subcommand table's */
	if (argc != 1)
		return usage(e);
	if (db_program_list(ctx->db, &v, &n, e))
		return -1;
	if (!(r = rec_new(5, heads, ctx->opt.format))) {
		sd_fail(e, "out of memory");
		goto done;
	}
	for (int i = 0; i < n; i++) {
		int nb;
		if (db_program_refs(ctx->db, v[i].id, &nb, e))
			goto done;
		if (rec_row(r)) {
			sd_fail(e, "out of memory");
			goto done;
		}
		rec_set(r, 0, "%s", v[i].name);
		rec_set(r, 1, "%s", v[i].is_csv ? "csv" : "ini");
		rec_set(r, 2, "%zu", v[i].len);
		rec_set(r, 3, "%d", nb);
		rec_set(r, 4, "%.10s", v[i].created);
	}
	if (!n && ctx->opt.format == SD_FMT_TABLE)
		fprintf(ctx->out, "no programs yet (store one with 'setdose program add FILE')\n");
	else
		rec_print(r, ctx->out);
	rc = 0;
done:
	rec_free(r);
	db_program_list_free(v, n);
	return rc;
}

static int do_show(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	struct db_program p;

	if (argc != 2)
		return usage(e);
	if (app_program_get(ctx->db, argv[1], &p, e))
		return -1;
	/* Byte for byte: no newline added, no re-encoding. */
	if (p.len && fwrite(p.source, 1, p.len, ctx->out) != p.len) {
		db_program_free(&p);
		return sd_fail(e, "cannot write output");
	}
	db_program_free(&p);
	return 0;
}

static int do_rm(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	struct db_program p;
	int rc, nb;

	if (argc != 2)
		return usage(e);
	if (db_begin(ctx->db, e) || app_program_get(ctx->db, argv[1], &p, e))
		return -1;
	rc = db_program_refs(ctx->db, p.id, &nb, e);
	if (!rc && nb)
		rc = sd_fail(e, "program '%s' is used by %d block%s; not removed", p.name, nb,
			     nb == 1 ? "" : "s");
	if (!rc)
		rc = db_program_rm(ctx->db, p.id, e);
	if (!rc)
		rc = db_commit(ctx->db, e);
	if (!rc)
		fprintf(ctx->out, "removed program '%s'\n", p.name);
	db_program_free(&p);
	return rc;
}

static const struct sd_sub subs[] = {
	{ "add", "program add", do_add, add_opts, OPT_N(add_opts) },
	{ "list", "program list", do_list, NULL, 0 },
	{ "show", "program show", do_show, NULL, 0 },
	{ "rm", "program rm", do_rm, NULL, 0 },
	{ NULL, NULL, NULL, NULL, 0 },
};

const struct sd_cmd cmd_program = {
	.name = "program",
	.summary = "store program templates in the database, list, show or remove them",
	.usage = "program add FILE... [--name NAME]\n"
		 "       setdose program list\n"
		 "       setdose program show NAME\n"
		 "       setdose program rm NAME\n"
		 "  add      checks each file like 'audit' does, then stores its text verbatim\n"
		 "           (all files or none); the name is --name, else the file's [program]\n"
		 "           name, else the file name\n"
		 "  show     prints the stored text back byte for byte\n"
		 "  rm       refuses while a block uses the template",
	.flags = CMD_DB | CMD_LIBRARY,
	.subs = subs,
};
