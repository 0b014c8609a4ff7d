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

#include "../core/curve.h"
#include "../core/err.h"
#include "../core/library.h"
#include "../core/profile.h"

enum { SD_FMT_TABLE, SD_FMT_CSV, SD_FMT_JSON };

enum {
	CMD_PROFILE = 1 << 0,
	CMD_LIBRARY = 1 << 1,
	CMD_DB = 1 << 2,
};

struct sd_db;  /* store/db.h */

struct sd_opts {
	const char *db_path;       /* --db or SETDOSE_DB; NULL: default location */
	const char *profile_path;  /* --profile; NULL: bundled strength.ini */
	const char *exercises_path;/* --exercises: one more library file for this run */
	int format;                /* SD_FMT_* */
	int status_set;            /* --status given */
	double trained;            /* 0 or 1 */
	int weeks_set;
	double weeks;              /* --weeks */
	double level;              /* --level, default 0.95 */
	int swc_set;
	double swc_pct;            /* --swc in percent */
	int max_rir;               /* --max-rir, default 4 */
	int units_lb;              /* --units lb */
	int units_set;             /* --units given */
	int color;                 /* 0 with --no-color, NO_COLOR or a non-terminal */
};

struct sd_ctx {
	struct sd_opts opt;
	struct sd_profile profile;
	struct sd_library lib;
	struct sd_db *db;
	FILE *out;
	char datadir[1024];        /* where the bundled profiles live */
};

struct sd_cmd {
	const char *name;
	const char *alias;         /* or NULL */
	const char *summary;       /* one line for `setdose help` */
	const char *usage;         /* "audit [--summary] PROGRAM..." plus option lines */
	int flags;
	int (*exec)(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e);
};

extern const struct sd_cmd *const sd_commands[];  /* NULL-terminated */

/* Finds a command by exact name, alias or unique prefix; on ambiguity fills e listing the
 * candidates. */
const struct sd_cmd *cmd_find(const char *name, struct sd_err *e);
/* The athlete context for the curve from the global options and a program's weeks. */
struct sd_covars cmd_covars(const struct sd_ctx *ctx, int program_weeks);
/* The smallest worthwhile change on the lnRR scale (profile's, or --swc). */
double cmd_swc(const struct sd_ctx *ctx);
/* Under advice in table output: the profile's provenance line (when one is loaded) and the
 * standard cautions. */
void cmd_print_caution(struct sd_ctx *ctx);

#endif
