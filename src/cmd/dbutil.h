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
/* Runs the subcommand of cmd->subs named by argv[1], or fails with the command's usage. */
int dbu_subcommand(struct sd_ctx *ctx, const struct sd_cmd *cmd, int argc, char **argv,
		   struct sd_err *e);

/* Refuses a negative number among the arguments ("bad value: must be positive"). */
int dbu_no_negatives(int argc, char **argv, struct sd_err *e);
#endif
