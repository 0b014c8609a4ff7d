/* Helpers of the commands that work on the store: subcommands, confirmation, option errors.
 * The rules they share with the interface are in src/app. */
#ifndef SD_DBUTIL_H
#define SD_DBUTIL_H

#include "../app/blocks.h"
#include "../app/parse.h"
#include "../app/records.h"
#include "../store/db.h"
#include "cmd.h"

/* Asks QUESTION on the terminal; 1 when answered yes. Without a terminal it fails, naming
 * the option (--yes) that skips the question. */
int dbu_confirm(const char *question, struct sd_err *e);
/* One subcommand: its name and the function given argv from the subcommand's name on. */
struct dbu_sub {
	const char *name;
	int (*fn)(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e);
};
/* Runs the subcommand named by argv[1] from the NULL-terminated table, or fails with the
 * command's usage. */
int dbu_subcommand(struct sd_ctx *ctx, const struct dbu_sub *subs, const struct sd_cmd *cmd,
		   int argc, char **argv, struct sd_err *e);

/* The usage error for an unknown option (call with getopt's optind as left after '?'). */
int dbu_badopt(const struct sd_cmd *cmd, int argc, char **argv, struct sd_err *e);
/* Refuses a negative number among the arguments before getopt could take it for an option. */
int dbu_no_negatives(int argc, char **argv, struct sd_err *e);
#endif
