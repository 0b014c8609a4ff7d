/* The training log as the commands and the interface use it, so both show the same numbers:
 * an athlete's logged sets per day and exercise, their ISO weeks next to the plan of the
 * blocks they fall in (`log weeks`), a block's logged average weekly dose (`response`,
 * `audit --all`, the athlete page) and each lift's weekly best e1RM from logged sets.
 * The numbers themselves come from core/tlog.h.
 *
 * Ownership: every struct filled here owns its arrays; free them with the matching _free. */
#ifndef SD_LOGDATA_H
#define SD_LOGDATA_H

#include "../core/tlog.h"
#include "blocks.h"
#include "parse.h"
#include "records.h"

/* One athlete's logged sets summed per day and exercise, in date order. */
struct logd_days {
	struct tlog_daysets *v;
	int n, cap;
};

/* The logged sets of athlete_id between from and to (YYYY-MM-DD, NULL: open), counted
 * against --max-rir. Exercises the library no longer knows get ex -1. */
int logd_days(struct sd_ctx *ctx, long long athlete_id, const char *from, const char *to,
	      struct logd_days *out, struct sd_err *e);
void logd_days_free(struct logd_days *d);

/* The days a block's plan covers: start to end once ended; while open, start to its planned
 * end (start + 7 x weeks - 1), cut at today. *to < *from when it has not begun. */
void logd_block_span(const struct db_block *b, long today, long *from, long *to);
/* A block's planned weekly dose per muscle and training days a week, from its template's
 * audit (the block's status and length, --max-rir). */
int logd_block_plan(struct sd_ctx *ctx, const struct db_block *b, double dose[SD_NMUSCLES],
		    int *sessions, struct sd_err *e);

/* The logged average weekly dose of a block over its span (logd_block_span): span->rows is 0
 * when nothing was logged in it, and then dose is all 0. */
int logd_block_done(struct sd_ctx *ctx, const struct db_block *b, double dose[SD_NMUSCLES],
		    struct tlog_span *span, struct sd_err *e);

/* An athlete's weeks: from the earlier of the first block's start and the first logged day
 * to the later of the last logged day and the last block's span end, each week with what was
 * logged and the plan of every block covering it. With only > 0 only that block's span. The
 * blocks (by start) are the caller's. */
int logd_weeks(struct sd_ctx *ctx, long long athlete_id, const struct db_block *b, int nb,
	       long long only, struct tlog_weeks *ws, struct sd_err *e);

/* Each lift's weekly best e1RM (formula f) from the athlete's logged sets between from and to
 * (NULL: open), by lift then week. */
int logd_trend(struct sd_ctx *ctx, long long athlete_id, int f, const char *from, const char *to,
	       struct tlog_trend *t, struct sd_err *e);

#endif
