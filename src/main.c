/* setdose: entry point. Parses the global options, finds the command, does the shared setup
 * its flags ask for (profile, exercise library, database) once, runs it, and is the only place
 * that prints errors and chooses the exit status. */
#include <errno.h>
#include <limits.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "app/parse.h"
#include "cmd/cmd.h"
#include "cmd/dbutil.h"
#include "core/limits.h"
#include "io/defaults_io.h"
#include "io/library_io.h"
#include "io/profile_io.h"
#include "store/db.h"

#ifndef SD_VERSION
#define SD_VERSION "0.1.0"
#endif

/* The option table of the command, or of its subcommand named by the first argument; 1 when
 * that subcommand exists. */
static int cmd_table(const struct sd_cmd *cmd, const char *sub, const struct sd_optdef **defs,
		     int *n, const char **label)
{
	*defs = cmd->opts;
	*n = cmd->nopts;
	*label = cmd->name;
	for (const struct sd_sub *s = cmd->subs; s && s->name && sub; s++)
		if (!strcmp(s->name, sub)) {
			*defs = s->opts;
			*n = s->nopts;
			*label = s->label;
			return 1;
		}
	return 0;
}

/* Takes the global options out of argv wherever they stand (before a "--"), so that both
 * `setdose --format json audit x.ini` and `setdose audit x.ini --format json` work. Before the
 * command name only global options may stand. After it, the command's own table (opt.h) says
 * which words are its options and which of those take the next word as their value: such a
 * value is never read as a global option, so `athlete add Ann --notes --no-color` stores the
 * note "--no-color". What is left, in order, is the command and its own arguments. */
static int extract_globals(int *argc, char **argv, struct gvals *g, struct sd_err *e)
{
	const struct sd_optdef *cdefs = NULL;
	const struct sd_cmd *cmd = NULL;
	const char *label = "setdose";
	int out = 1, i, ncdefs = 0, npos = 0;

	for (i = 1; i < *argc; i++) {
		const char *a = argv[i], *val = NULL;
		int kg, kc = -1;
		if (!strcmp(a, "--"))
			break;
		if (!strcmp(a, "-h"))
			a = "--help";
		if (a[0] != '-' || !a[1]) {
			/* The command name, then (for commands with subcommands) the subcommand's. */
			if (npos == 0 && (cmd = cmd_find(a, NULL)))
				cmd_table(cmd, NULL, &cdefs, &ncdefs, &label);
			else if (npos == 1 && cmd && cmd->subs)
				cmd_table(cmd, a, &cdefs, &ncdefs, &label);
			npos++;
			argv[out++] = argv[i];
			continue;
		}
		if (cmd && (kc = opt_find(label, cdefs, ncdefs, a, &val, e)) == -2)
			return -1;
		kg = opt_find("setdose", sd_global_opts, sd_nglobal_opts, a, &val, e);
		if (kg == -2 && kc < 0)
			return -1;
		/* A name both tables know: the exact one wins; two prefixes are ambiguous. */
		if (kc >= 0 && kg >= 0) {
			size_t len = strcspn(a + 2, "=");
			int cexact = strlen(cdefs[kc].name) == len, gexact = strlen(sd_global_opts[kg].name) == len;
			if (cexact == gexact)
				return sd_usage(e, "option '%s' is ambiguous: --%s or --%s (see 'setdose help "
						"%s')", a, cdefs[kc].name, sd_global_opts[kg].name, label);
			if (cexact)
				kg = -1;
		}
		if (kg < 0) {
			/* The command's own (it parses it), or unknown (it says so). */
			argv[out++] = argv[i];
			if (kc >= 0 && cdefs[kc].arg && !strchr(a, '=') && i + 1 < *argc)
				argv[out++] = argv[++i];
			continue;
		}
		if (sd_global_opts[kg].arg && !val) {
			if (i + 1 >= *argc)
				return sd_usage(e, "option '--%s' needs a value (see 'setdose --help')",
						sd_global_opts[kg].name);
			val = argv[++i];
		} else if (!sd_global_opts[kg].arg && val)
			return sd_usage(e, "option '--%s' takes no value (see 'setdose --help')",
					sd_global_opts[kg].name);
		if (opt_apply("setdose", &sd_global_opts[kg], g, val, e))
			return -1;
	}
	for (; i < *argc; i++)
		argv[out++] = argv[i];
	argv[out] = NULL;
	*argc = out;
	return 0;
}

static int dir_has(const char *dir, const char *file)
{
	char path[PATH_MAX + 64];
	snprintf(path, sizeof path, "%s/%s", dir, file);
	return access(path, R_OK) == 0;
}

/* Bundled data: $SETDOSE_DATADIR, else profiles/ beside the build folder (running from a
 * checkout), else the installed share/setdose. */
static void find_datadir(char *buf, size_t n)
{
	const char *env = getenv("SETDOSE_DATADIR");
	char exe[PATH_MAX];
	ssize_t len;

	if (env && *env) {
		snprintf(buf, n, "%s", env);
		return;
	}
	len = readlink("/proc/self/exe", exe, sizeof exe - 1);
	if (len > 0) {
		exe[len] = '\0';
		for (int up = 0; up < 4; up++) {
			char *slash = strrchr(exe, '/');
			if (!slash)
				break;
			*slash = '\0';
			snprintf(buf, n, "%s/profiles", exe);
			if (dir_has(buf, "strength.ini"))
				return;
		}
	}
	snprintf(buf, n, "%s", SD_DATADIR);
}

static void print_help(FILE *f)
{
	fprintf(f, "usage: setdose [global options] COMMAND [ARGS]\n\n"
		"Weekly fractional sets per muscle, placed on a dose-response curve of strength gain.\n\n"
		"commands:\n");
	for (int i = 0; sd_commands[i]; i++)
		fprintf(f, "  %-10s %s\n", sd_commands[i]->name, sd_commands[i]->summary);
	fprintf(f, "\nglobal options (anywhere on the line, before \"--\"):\n");
	opt_help(f, sd_global_opts, sd_nglobal_opts);
	fprintf(f, "\n'setdose help COMMAND' shows a command's options; 'man setdose' has everything.\n"
		"Population-average model: individual responses vary. Not medical advice.\n");
}

/* One setting of the defaults file: a global option that takes a value, by its name (an
 * underscore may stand for the dash). SETDOSE_DB, when set, wins over the file's db. */
static int apply_default(const char *key, const char *value, int line, void *arg,
			 struct sd_err *e)
{
	struct gvals *g = arg;
	char name[32];
	const char *env = getenv("SETDOSE_DB");

	snprintf(name, sizeof name, "%s", key);
	for (char *c = name; *c; c++)
		if (*c == '_')
			*c = '-';
	for (int i = 0; i < sd_nglobal_opts; i++) {
		const struct sd_optdef *d = &sd_global_opts[i];
		if (strcmp(d->name, name) || !d->arg)
			continue;
		if (!strcmp(name, "db") && env && *env)
			return 0;
		if (opt_apply("setdose", d, g, value, e))
			return sd_wrap(e, "defaults file '%s' line %d", g->defaults_path, line);
		return 0;
	}
	return sd_usage(e, "defaults file '%s' line %d: unknown setting '%s' (one of units, max-rir, "
			"status, weeks, db, profile, exercises, level, swc, format)",
			g->defaults_path, line, key);
}

/* Every option of the command line is checked against the command's table before anything is
 * loaded or opened, so a mistyped option changes nothing. A command without options gets its
 * arguments with any option word refused here. */
static int check_options(const struct sd_cmd *cmd, int *argc, char **argv, struct sd_err *e)
{
	const struct sd_optdef *defs;
	const char *label;
	char *copy[*argc + 1];
	int n;

	if (!cmd->opts && !cmd->subs) {
		if ((n = opt_parse(cmd->name, NULL, 0, NULL, *argc - 1, argv + 1, e)) < 0)
			return -1;
		*argc = n + 1;
		return 0;
	}
	if (!cmd_table(cmd, *argc > 2 ? argv[2] : NULL, &defs, &n, &label) && cmd->subs)
		return 0;   /* no such subcommand: the command says so with its usage */
	memcpy(copy, argv + (cmd->subs ? 2 : 1), sizeof *copy * (size_t)(*argc - (cmd->subs ? 2 : 1)));
	return opt_parse(label, defs, n, NULL, *argc - (cmd->subs ? 2 : 1), copy, e) < 0 ? -1 : 0;
}

static int setup(struct sd_ctx *ctx, const struct sd_cmd *cmd, struct sd_err *e)
{
	if (cmd->flags & CMD_PROFILE) {
		char path[1200];
		if (ctx->opt.profile_path)
			snprintf(path, sizeof path, "%s", ctx->opt.profile_path);
		else
			snprintf(path, sizeof path, "%s/strength.ini", ctx->datadir);
		if (profile_load(path, &ctx->profile, e))
			return -1;
		if (ctx->opt.swc_set)
			ctx->profile.swc = log1p(ctx->opt.swc_pct / 100.0);
	}
	if (cmd->flags & CMD_LIBRARY &&
	    library_load_all(ctx->datadir, ctx->opt.exercises_path, &ctx->lib, e))
		return -1;
	if (cmd->flags & CMD_DB) {
		char path[1200];
		const char *env = getenv("SETDOSE_DB");
		if (ctx->opt.db_path)
			snprintf(path, sizeof path, "%s", ctx->opt.db_path);
		else if (env && *env)
			snprintf(path, sizeof path, "%s", env);
		else if (!db_default_path(path, sizeof path))
			return sd_fail(e, "no database location: set --db, SETDOSE_DB or HOME");
		if (db_open(path, &ctx->db, e))
			return -1;
	}
	return 0;
}

int main(int argc, char **argv)
{
	struct sd_ctx ctx;
	struct sd_err err;
	const struct sd_cmd *cmd;
	struct gvals g;
	char dpath[SD_PATH_MAX], *dtext = NULL;
	int rc = SD_EXIT_OK;
	const char *nc = getenv("NO_COLOR");

	/* LC_CTYPE is set only where non-ASCII text is measured or drawn (tbl_locale); numbers
	 * stay in the C locale so files read and write the same everywhere. */
	memset(&ctx, 0, sizeof ctx);
	sd_err_clear(&err);
	ctx.out = stdout;
	ctx.opt.level = 0.95;
	ctx.opt.max_rir = 4;
	ctx.opt.color = isatty(STDOUT_FILENO) && !(nc && *nc);
	find_datadir(ctx.datadir, sizeof ctx.datadir);

	memset(&g, 0, sizeof g);
	g.o = ctx.opt;
	/* The user's defaults first, then the command line over them. */
	if ((g.defaults_path = defaults_path(dpath, sizeof dpath)) &&
	    defaults_read(dpath, apply_default, &g, &dtext, &err))
		goto fail;
	if (extract_globals(&argc, argv, &g, &err))
		goto fail;
	ctx.opt = g.o;
	if (g.version) {
		printf("setdose %s (database schema %d)\n", SD_VERSION, db_schema_latest());
		goto done;
	}
	if (argc < 2) {
		if (!g.help && isatty(STDIN_FILENO) && isatty(STDOUT_FILENO) &&
		    (cmd = cmd_find("browse", &err)) && !strcmp(cmd->name, "browse")) {
			argv[1] = "browse";
			argc = 2;
		} else {
			print_help(stdout);
			goto done;
		}
	}
	if (g.help) {
		/* "setdose audit --help" is "setdose help audit". */
		char *hargv[] = { "help", argv[1], NULL };
		cmd = cmd_find("help", &err);
		if (!cmd)
			goto fail;
		if (cmd->exec(&ctx, 2, hargv, &err))
			goto fail;
		goto done;
	}
	cmd = cmd_find(argv[1], &err);
	if (!cmd)
		goto fail;
	if (check_options(cmd, &argc, argv, &err) || setup(&ctx, cmd, &err))
		goto fail;
	/* A command made of subcommands runs the one its first argument names. */
	if (cmd->exec ? cmd->exec(&ctx, argc - 1, argv + 1, &err) :
	    dbu_subcommand(&ctx, cmd, argc - 1, argv + 1, &err))
		goto fail;
	goto done;
fail:
	rc = err.code ? err.code : SD_EXIT_FAIL;
	fflush(stdout);
	fprintf(stderr, "setdose: %s\n", err.msg);
	for (const char *s = err.more, *nl; (nl = strchr(s, '\n')); s = nl + 1)
		fprintf(stderr, "setdose: %.*s\n", (int)(nl - s), s);
	if (err.nmore > sd_more_shown(&err))
		fprintf(stderr, "setdose: %d more errors not shown\n", err.nmore - sd_more_shown(&err));
done:
	if (ctx.db)
		db_close(ctx.db);
	lib_free(&ctx.lib);
	free(dtext);
	if (fflush(stdout) || ferror(stdout)) {
		fprintf(stderr, "setdose: cannot write output: %s\n", strerror(errno));
		rc = SD_EXIT_FAIL;
	}
	return rc;
}
