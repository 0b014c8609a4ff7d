/* The command table: each src/cmd/<name>.c exports one struct sd_cmd; table.c lists them.
 *
 * main.c parses the global options (anywhere on the line, before "--"), finds the command by
 * exact name, alias or unique prefix, then does the shared setup its flags ask for, once:
 * CMD_PROFILE loads the dose-response profile, CMD_LIBRARY the exercise library, CMD_DB opens
 * (and migrates) the database. The command gets what is left of argv: argv[0] is its name.
 *
 * exec returns 0 or -1 with e filled; it prints results to ctx->out only. */
#ifndef SD_CMD_H
#define SD_CMD_H

#include <stdio.h>

#include "../app/ctx.h"
#include "opt.h"

enum {
	CMD_PROFILE = 1 << 0,
	CMD_LIBRARY = 1 << 1,
	CMD_DB = 1 << 2,
};

/* A subcommand ("block add"): its options (opt.h) and the function given argv from the
 * subcommand's name on. */
struct sd_sub {
	const char *name;
	const char *label;         /* "block add", for messages and help */
	int (*fn)(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e);
	const struct sd_optdef *opts;
	int nopts;
};

struct sd_cmd {
	const char *name;
	const char *alias;         /* or NULL */
	const char *summary;       /* one line for `setdose help` */
	const char *usage;         /* "audit [--summary] PROGRAM..." plus option lines */
	int flags;
	int (*exec)(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e);  /* NULL: subs */
	const struct sd_optdef *opts;   /* the command's options, or NULL */
	int nopts;
	const struct sd_sub *subs;      /* subcommands (ended by a NULL name), or NULL */
};

extern const struct sd_cmd *const sd_commands[];  /* NULL-terminated */

/* What the global options fill: the run's options, and the two that stop the run early. */
struct gvals {
	struct sd_opts o;
	int version, help;
	const char *defaults_path;   /* the defaults file being read, for its messages */
};
/* The global options (globals.c); opt_apply with a struct gvals. */
extern const struct sd_optdef sd_global_opts[];
extern const int sd_nglobal_opts;

/* Finds a command by exact name, alias or unique prefix; on ambiguity fills e listing the
 * candidates. */
const struct sd_cmd *cmd_find(const char *name, struct sd_err *e);
/* Under advice in table output: the profile's provenance line (when one is loaded) and the
 * standard cautions. */
void cmd_print_caution(struct sd_ctx *ctx);

#endif
