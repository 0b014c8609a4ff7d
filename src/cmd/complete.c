/* complete: the candidates for the word being typed, for the shell completion scripts in
 * completions/ (bash, zsh, fish), which pass the words typed after "setdose". Commands,
 * subcommands and options come from the same tables the commands parse with (opt.h), athlete
 * and template names from the database when it exists (it is never created here). One
 * candidate per line; none means "complete a file name". */
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "../store/db.h"
#include "cmd.h"

extern const struct sd_cmd cmd_complete;

enum name_kind { NONE, ATHLETE, TEMPLATE };

/* Which arguments name an athlete or a stored template: command, subcommand, position. */
static const struct {
	const char *cmd, *sub;
	int pos;
	enum name_kind kind;
} name_args[] = {
	{ "athlete", "show", 0, ATHLETE }, { "athlete", "edit", 0, ATHLETE },
	{ "athlete", "rm", 0, ATHLETE }, { "block", "add", 0, ATHLETE },
	{ "block", "add", 1, TEMPLATE }, { "block", "list", 0, ATHLETE },
	{ "test", "add", 0, ATHLETE }, { "test", "list", 0, ATHLETE },
	{ "response", NULL, 0, ATHLETE }, { "program", "show", 0, TEMPLATE },
	{ "program", "rm", 0, TEMPLATE }, { "compare", NULL, -1, TEMPLATE },
};

/* The word as the shell passed it, without the backslashes and quotes of its escaping. */
static void unquote(const char *w, char *out, size_t n)
{
	size_t k = 0;
	for (; *w && k + 1 < n; w++) {
		if (*w == '\\' && w[1])
			w++;
		else if (*w == '\'' || *w == '"')
			continue;
		out[k++] = *w;
	}
	out[k] = '\0';
}

static int starts(const char *s, const char *prefix)
{
	return !strncmp(s, prefix, strlen(prefix));
}

static void options(FILE *f, const struct sd_optdef *d, int n, const char *prefix)
{
	for (int i = 0; i < n; i++) {
		char w[64];
		snprintf(w, sizeof w, "--%s", d[i].name);
		if (starts(w, prefix))
			fprintf(f, "%s\n", w);
	}
}

static void names(struct sd_ctx *ctx, enum name_kind kind, const char *prefix)
{
	char path[SD_PATH_MAX];
	struct sd_db *db = NULL;
	struct db_athlete *a = NULL;
	struct db_program *p = NULL;
	int n = 0;

	if (app_db_path(ctx, path, sizeof path, NULL) || access(path, R_OK) ||
	    db_open(path, &db, NULL))
		return;
	if (kind == ATHLETE && !db_athlete_list(db, &a, &n, NULL))
		for (int i = 0; i < n; i++)
			if (starts(a[i].name, prefix))
				fprintf(ctx->out, "%s\n", a[i].name);
	if (kind == TEMPLATE && !db_program_list(db, &p, &n, NULL)) {
		for (int i = 0; i < n; i++)
			if (starts(p[i].name, prefix))
				fprintf(ctx->out, "%s\n", p[i].name);
		db_program_list_free(p, n);
	}
	free(a);
	db_close(db);
}

/* The definition a typed "--name" stands for in the global or the command's table. */
static const struct sd_optdef *lookup(const char *w, const struct sd_optdef *defs, int n)
{
	const char *v;
	int k = opt_find("", defs, n, w, &v, NULL);
	if (k < 0)
		k = -1;
	if (k >= 0)
		return v ? NULL : &defs[k];   /* "--x=v" carries its value */
	k = opt_find("", sd_global_opts, sd_nglobal_opts, w, &v, NULL);
	return k >= 0 && !v ? &sd_global_opts[k] : NULL;
}

static int exec_complete(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	const struct sd_cmd *cmd = NULL;
	const struct sd_sub *sub = NULL;
	const struct sd_optdef *defs = NULL, *pending = NULL;
	int ndefs = 0, pos = 0, rest = 0;
	char cur[256];

	(void)e;
	/* argv: "complete", [--,] the words typed so far, the last one being completed. */
	argc--, argv++;
	if (argc && !strcmp(argv[0], "--"))
		argc--, argv++;
	if (argc < 1)
		return 0;
	for (int i = 0; i < argc - 1; i++) {
		const char *w = argv[i];
		const struct sd_optdef *d;
		if (pending) {
			/* The names come from the database the line names. */
			if (!strcmp(pending->name, "db"))
				ctx->opt.db_path = w;
			pending = NULL;
			continue;
		}
		if (!rest && !strcmp(w, "--")) {
			rest = 1;
			continue;
		}
		if (!rest && w[0] == '-' && w[1]) {
			if ((d = lookup(w, defs, ndefs)) && d->arg)
				pending = d;
			else if (starts(w, "--db="))
				ctx->opt.db_path = w + 5;
			continue;
		}
		if (!cmd) {
			if ((cmd = cmd_find(w, NULL))) {
				defs = cmd->opts;
				ndefs = cmd->nopts;
			}
		} else if (cmd->subs && !sub) {
			for (const struct sd_sub *s = cmd->subs; s->name; s++)
				if (!strcmp(s->name, w))
					sub = s;
			if (sub) {
				defs = sub->opts;
				ndefs = sub->nopts;
			}
		} else {
			pos++;
		}
	}
	unquote(argv[argc - 1], cur, sizeof cur);
	if (pending) {
		/* allot --from names a file or a stored template; other values: files. */
		if (!strcmp(pending->name, "from"))
			names(ctx, TEMPLATE, cur);
		return 0;
	}
	if (!rest && cur[0] == '-') {
		options(ctx->out, defs, ndefs, cur);
		options(ctx->out, sd_global_opts, sd_nglobal_opts, cur);
		return 0;
	}
	if (!cmd) {
		for (int i = 0; sd_commands[i]; i++)
			if (starts(sd_commands[i]->name, cur) && sd_commands[i] != &cmd_complete)
				fprintf(ctx->out, "%s\n", sd_commands[i]->name);
		return 0;
	}
	if (cmd->subs && !sub) {
		for (const struct sd_sub *s = cmd->subs; s->name; s++)
			if (starts(s->name, cur))
				fprintf(ctx->out, "%s\n", s->name);
		return 0;
	}
	for (size_t i = 0; i < sizeof name_args / sizeof name_args[0]; i++)
		if (!strcmp(name_args[i].cmd, cmd->name) &&
		    (!name_args[i].sub || (sub && !strcmp(name_args[i].sub, sub->name))) &&
		    (name_args[i].pos < 0 || name_args[i].pos == pos))
			names(ctx, name_args[i].kind, cur);
	return 0;
}

const struct sd_cmd cmd_complete = {
	.name = "complete",
	.summary = "candidates for shell completion (used by the bash, zsh and fish scripts)",
	.usage = "complete [--] WORD...\n"
		 "  the words typed after 'setdose', the last one being completed; prints one\n"
		 "  candidate per line (none: complete a file name)",
	.flags = 0,
	.exec = exec_complete,
	.opts = NULL,
	.nopts = 0,
};
