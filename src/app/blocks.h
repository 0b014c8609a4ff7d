/* A training block as the curve sees it: shared by block show, audit --all, response and the
 * interface, so all of them audit a block alike. */
#ifndef SD_APP_BLOCKS_H
#define SD_APP_BLOCKS_H

#include "../core/audit.h"
#include "../store/db.h"
#include "ctx.h"

/* A block's length in weeks for the curve: the planned weeks while open; once ended, the
 * weeks from start to end (at least 1). */
double app_block_weeks(const struct db_block *b);
/* Parses a stored template (label: its name) and audits it for the block's athlete status and
 * length, with the global --level and --max-rir. Free prog and au with prog_free and
 * audit_free (both are left empty on failure). */
int app_block_audit(const struct sd_ctx *ctx, const struct db_block *b,
		    const struct db_program *src, double session_cap, struct sd_program *prog,
		    struct sd_audit *au, struct sd_err *e);
/* Days an open block has run past its planned end (start + weeks x 7) by `today`; 0 for an
 * ended block or one still within its plan. */
int app_block_overdue(const struct db_block *b, const char *today);

#endif
