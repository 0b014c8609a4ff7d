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

#include "cmd/cmd.h"
#include "core/limits.h"
#include "io/library_io.h"
#include "io/profile_io.h"
#include "store/db.h"

#ifndef SD_VERSION
#define SD_VERSION "0.1.0"
#endif

struct gopt {
	const char *name;
	int takes_value;
};

static const struct gopt gopts[] = {
	{ "db", 1 }, { "profile", 1 }, { "exercises", 1 }, { "format", 1 }, { "status", 1 },
	{ "weeks", 1 }, { "level", 1 }, { "swc", 1 }, { "units", 1 }, { "max-rir", 1 },
	{ "no-color", 0 }, { "version", 0 }, { "help", 0 }, { NULL, 0 },
};

static int parse_number(const char *opt, const char *v, double lo, double hi, double *out,
			struct sd_err *e)
{
	char *end;
	errno = 0;
	double x = strtod(v, &end);
	if (end == v || *end || errno || !(x >= lo && x <= hi))
		return sd_usage(e, "--%s wants a number from %g to %g, not '%s'", opt, lo, hi, v);
	*out = x;
	return 0;
}

static int apply(struct sd_opts *o, const char *name, const char *v, int *want_version,
		 int *want_help, struct sd_err *e)
{
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
		*want_version = 1;
	else if (!strcmp(name, "help"))
		*want_help = 1;
	return 0;
}

/* Takes the global options out of argv wherever they stand (before a "--"), so that both
 * `setdose --format json audit x.ini` and `setdose audit x.ini --format json` work. What is
 * left, in order, is the command and its own arguments. */
static int extract_globals(int *argc, char **argv, struct sd_opts *o, int *want_version,
			   int *want_help, struct sd_err *e)
{
	int out = 1, i;
	for (i = 1; i < *argc; i++) {
		char *a = argv[i];
		const struct gopt *g = NULL;
		const char *val = NULL;
		if (!strcmp(a, "--"))
			break;
		if (!strcmp(a, "-h"))
			a = "--help";
		if (!strncmp(a, "--", 2)) {
			size_t len = strcspn(a + 2, "=");
			for (const struct gopt *c = gopts; c->name; c++)
				if (strlen(c->name) == len && !strncmp(a + 2, c->name, len))
					g = c;
			if (g && a[2 + len] == '=')
				val = a + 3 + len;
		}
		if (!g) {
			argv[out++] = argv[i];
			continue;
		}
		if (g->takes_value && !val) {
			if (i + 1 >= *argc)
				return sd_usage(e, "option --%s needs a value", g->name);
			val = argv[++i];
		} else if (!g->takes_value && val)
			return sd_usage(e, "option --%s takes no value", g->name);
		if (apply(o, g->name, val, want_version, want_help, e))
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
	fprintf(f, "\nglobal options:\n"
		"  --db PATH           database (default $XDG_DATA_HOME/setdose/setdose.db, or SETDOSE_DB)\n"
		"  --profile PATH      dose-response profile (default: bundled strength.ini)\n"
		"  --exercises FILE    one more exercise library file for this run\n"
		"  --format FMT        table, csv or json\n"
		"  --status S          trained or untrained (default untrained)\n"
		"  --weeks N           block length in weeks (default: the program's, else 10)\n"
		"  --level L           confidence level (default 0.95)\n"
		"  --swc PCT           smallest worthwhile change in percent (default: the profile's)\n"
		"  --max-rir N         sets with RIR above N are not hard sets (default 4)\n"
		"  --units kg|lb       load units\n"
		"  --no-color          no colour (NO_COLOR is honoured too)\n"
		"  --version           print the version\n\n"
		"'setdose help COMMAND' shows a command's options; 'man setdose' has everything.\n"
		"Population-average model: individual responses vary. Not medical advice.\n");
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
	int want_version = 0, want_help = 0, rc = SD_EXIT_OK;
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

	if (extract_globals(&argc, argv, &ctx.opt, &want_version, &want_help, &err))
		goto fail;
	if (want_version) {
		printf("setdose %s (database schema %d)\n", SD_VERSION, db_schema_latest());
		goto done;
	}
	if (argc < 2) {
		if (!want_help && isatty(STDIN_FILENO) && isatty(STDOUT_FILENO) &&
		    (cmd = cmd_find("browse", &err)) && !strcmp(cmd->name, "browse")) {
			argv[1] = "browse";
			argc = 2;
		} else {
			print_help(stdout);
			goto done;
		}
	}
	if (want_help) {
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
	if (setup(&ctx, cmd, &err))
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
