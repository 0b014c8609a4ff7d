/* The documented range of every numeric field setdose reads from an effect-size table (the
 * input of `effects` and of `fit`/`slopes`), in one place; man/setdose.1 (LIMITS) lists the
 * same table. A value outside its range is refused with its file and line rather than
 * carried into a computation that would overflow or print nonsense.
 *
 * The ranges are wide: they exclude only values no strength study reports (a ratio of means
 * beyond e^5 = 148-fold, a sampling variance below 1e-8 that would dominate every weight) and
 * values that break the arithmetic. Common practice, no source.
 *
 * The training log's numeric fields (io/log_io.c) are here too; its reps and efforts follow the
 * program notation's own limits (core/program.h). */
#ifndef SD_BOUNDS_H
#define SD_BOUNDS_H

#include "err.h"

struct sd_bound {
	const char *what;   /* what the field is, for the message */
	double lo, hi;      /* inclusive */
	int whole;          /* 1: a whole number */
};

/* Effect-size tables read by fit and slopes. */
extern const struct sd_bound bound_yi;        /* lnRR effect */
extern const struct sd_bound bound_vi;        /* its sampling variance */
extern const struct sd_bound bound_dose;      /* the dose column (weekly sets here; days or years in other uses) */
extern const struct sd_bound bound_moderator; /* any moderator column */
/* Group summaries read by effects. */
extern const struct sd_bound bound_mean;      /* a group mean (any unit; positive) */
extern const struct sd_bound bound_sd;        /* a standard deviation */
extern const struct sd_bound bound_n;         /* a group's sample size */
extern const struct sd_bound bound_r;         /* the pre-post correlation */
/* Training logs read by log import. */
extern const struct sd_bound bound_log_sets;  /* identical sets one row stands for */
extern const struct sd_bound bound_log_load;  /* a load, in kg once its unit is known */

/* 0 when x is finite, inside b's range and whole where it must be; else -1 with e reading
 * "NAME = X is outside LO to HI (WHAT)" or "... is not a whole number". */
int bound_check(const struct sd_bound *b, const char *name, double x, struct sd_err *e);

#endif
