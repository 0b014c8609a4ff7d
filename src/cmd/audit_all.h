/* `audit --all`: every open block in the database audited for its athlete's status and its
 * planned length, one summary row per athlete and muscle (table, CSV) or one object per block
 * (JSON). Streams the blocks, so memory stays flat however many there are. */
#ifndef SD_AUDIT_ALL_H
#define SD_AUDIT_ALL_H

#include "cmd.h"

/* Opens the database itself when ctx->db is not open (audit has no CMD_DB flag). */
int cmd_audit_all(struct sd_ctx *ctx, double session_cap, struct sd_err *e);

#endif
