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
#include "core/limits.h"
#include "io/library_io.h"
#include "io/profile_io.h"
#include "store/db.h"

#ifndef SD_VERSION
#define SD_VERSION "0.1.0"
#endif

/* What the global options fill: the run's options, and the two that stop the run early. */
struct gvals {
	struct sd_opts o;
	int version, help;
};

static int parse_number(const char *opt, const char *v, double lo, double hi, double *out,
			struct sd_err *e)
{
	char what[32];
	snprintf(what, sizeof what, "--%s", opt);
	return app_num(what, v, lo, hi, out, e);
}

/* Each global option by name (the table below), with its own checks. */
static int gapply(void *dst, const struct sd_optdef *d, const char *v, struct sd_err *e)
{
	struct gvals *g = dst;
	struct sd_opts *o = &g->o;
	const char *name = d->name;
	double x;

	if (!strcmp(name, "db"))
		o->db_path = v;
	else if (!strcmp(name, "profile"))
		o->profile_path = v;
	else if (!strcmp(name, "exercises"))
		o->exercises_path = v;
	else if (!strcmp(name, "format")) {
		if (!strcmp(v, "table"))
			o->format = SD_FMT_TABLE;
		else if (!strcmp(v, "csv"))
			o->format = SD_FMT_CSV;
		else if (!strcmp(v, "json"))
			o->format = SD_FMT_JSON;
		else
			return sd_usage(e, "--format wants table, csv or json, not '%s'", v);
	} else if (!strcmp(name, "status")) {
		if (strcmp(v, "trained") && strcmp(v, "untrained"))
			return sd_usage(e, "--status wants trained or untrained, not '%s'", v);
		o->status_set = 1;
		o->trained = !strcmp(v, "trained");
	} else if (!strcmp(name, "weeks")) {
		if (parse_number(name, v, SD_WEEKS_MIN, SD_WEEKS_MAX, &o->weeks, e))
			return -1;
		o->weeks_set = 1;
	} else if (!strcmp(name, "level")) {
		if (parse_number(name, v, 0.5, 0.999, &o->level, e))
			return -1;
	} else if (!strcmp(name, "swc")) {
		if (parse_number(name, v, 0.1, 50, &o->swc_pct, e))
			return -1;
		o->swc_set = 1;
	} else if (!strcmp(name, "units")) {
		if (strcmp(v, "kg") && strcmp(v, "lb"))
			return sd_usage(e, "--units wants kg or lb, not '%s'", v);
		o->units_lb = !strcmp(v, "lb");
		o->units_set = 1;
	} else if (!strcmp(name, "max-rir")) {
		if (parse_number(name, v, 0, 10, &x, e))
			return -1;
		o->max_rir = (int)x;
		if (x != o->max_rir)
			return sd_usage(e, "--max-rir wants a whole number, not '%s'", v);
	} else if (!strcmp(name, "no-color"))
		o->color = 0;
	else if (!strcmp(name, "version"))
		g->version = 1;
	else if (!strcmp(name, "help"))
		g->help = 1;
	return 0;
}

#define G(n, a, h) { n, OPT_CALL, 0, 0, 0, gapply, a, h }
static const struct sd_optdef gdefs[] = {
	G("db", "PATH", "database (default $XDG_DATA_HOME/setdose/setdose.db, or SETDOSE_DB)"),
	G("profile", "PATH", "dose-response profile (default: bundled strength.ini)"),
	G("exercises", "FILE", "one more exercise library file for this run"),
	G("format", "FMT", "table, csv or json"),
	G("status", "S", "trained or untrained (default untrained)"),
	G("weeks", "N", "block length in weeks (default: the program's, else 10)"),
	G("level", "L", "confidence level (default 0.95)"),
	G("swc", "PCT", "smallest worthwhile change in percent (default: the profile's)"),
	G("max-rir", "N", "sets with RIR above N are not hard sets (default 4)"),
	G("units", "U", "load units, kg or lb"),
	G("no-color", NULL, "no colour (NO_COLOR is honoured too)"),
	G("version", NULL, "print the version and the database schema version"),
	G("help", NULL, "this text; after a command, that command's help"),
};
#undef G

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
		kg = opt_find("setdose", gdefs, OPT_N(gdefs), a, &val, e);
		if (kg == -2 && kc < 0)
			return -1;
		/* A name both tables know: the exact one wins; two prefixes are ambiguous. */
		if (kc >= 0 && kg >= 0) {
			size_t len = strcspn(a + 2, "=");
			int cexact = strlen(cdefs[kc].name) == len, gexact = strlen(gdefs[kg].name) == len;
			if (cexact == gexact)
				return sd_usage(e, "option '%s' is ambiguous: --%s or --%s (see 'setdose help "
						"%s')", a, cdefs[kc].name, gdefs[kg].name, label);
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
		if (gdefs[kg].arg && !val) {
			if (i + 1 >= *argc)
				return sd_usage(e, "option '--%s' needs a value (see 'setdose --help')",
						gdefs[kg].name);
			val = argv[++i];
		} else if (!gdefs[kg].arg && val)
			return sd_usage(e, "option '--%s' takes no value (see 'setdose --help')",
					gdefs[kg].name);
		if (opt_apply("setdose", &gdefs[kg], g, val, e))
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
		for (int up = 0; up < 3; up++) {
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
	opt_help(f, gdefs, OPT_N(gdefs));
	fprintf(f, "\n'setdose help COMMAND' shows a command's options; 'man setdose' has everything.\n"
		"Population-average model: individual responses vary. Not medical advice.\n");
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
	if (cmd->exec(&ctx, argc - 1, argv + 1, &err))
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
	if (fflush(stdout) || ferror(stdout)) {
		fprintf(stderr, "setdose: cannot write output: %s\n", strerror(errno));
		rc = SD_EXIT_FAIL;
	}
	return rc;
}
