/* An athlete's responses: pairs each completed block with the tests of each lift nearest its
 * start and its end (where a block has no test of a lift near its start or end, the best e1RM
 * from the logged sets near it, flagged as estimated from training, with its own larger test
 * error), predicts the change from the curve for the dose of the lift's prime movers (the
 * logged average weekly dose when the block has logged sets, else the template's), and
 * estimates the personal response (core/response.h has the model), with the
 * athlete and block variances estimated from every athlete's observations when the roster is
 * large enough. Shared by the `response` command and the full-screen interface, so both show
 * the same numbers.
 *
 * Ownership: respd_load fills a struct resp_data that owns its arrays; respd_free releases
 * them. Rows point into the data's own test list. */
#ifndef SD_RESPDATA_H
#define SD_RESPDATA_H

#include "../core/response.h"
#include "blocks.h"
#include "parse.h"
#include "records.h"

#define RESPD_WINDOW_DAYS 14   /* "near" a block's start or end; common practice, no source */
#define RESPD_PRIOR_PROFILE -1.0  /* prior_sd: the profile's between-athlete variance */

struct resp_opts {
	double test_sd;              /* SD of one 1RM test, log scale, 0..1 */
	double prior_sd;             /* prior SD of the athlete's deviation, or RESPD_PRIOR_PROFILE */
	double level;                /* interval level */
	int priors_only;             /* 1: the stated priors even when the roster could estimate */
	double est_sd;               /* SD of a 1RM estimated from training, log scale, 0..1 */
};

struct resp_row {
	long long block;
	char lift[DB_NAME_MAX];
	struct db_test pre, post;    /* a training estimate has formula "training" */
	int pre_est, post_est;       /* 1: estimated from logged sets, not tested */
	double pre_reps, post_reps;  /* reps to failure behind each 1RM */
	double dose, weeks;
	int dose_logged;             /* dose is the logged average; else the template's */
	double planned;              /* the template's dose for the lift */
	struct sd_point pt;          /* the curve at the lift's dose for this block */
	struct resp_obs ob;
	struct resp_fit fit;
	unsigned beyond;             /* SD_BEYOND_* of the lift's dose and the block's context */
};

struct resp_data {
	struct db_athlete athlete;
	struct db_block *b;
	int nb;
	struct db_test *t;
	long *day;                   /* nt day numbers of the tests' dates */
	int nt;
	int logged;                  /* the athlete has logged sets */
	struct resp_row *v;          /* observations of every completed block */
	int n, cap, nblocks;         /* nblocks: completed blocks with at least one observation */
	struct resp_vars vars;       /* the variances used: roster estimates or priors */
	struct resp_personal personal;
};

/* Checks options: finite, test_sd and est_sd 0..1, prior_sd above 0 and at most 2 (or the profile's),
 * 0 < level < 1. */
int respd_check_opts(const struct resp_opts *o, struct sd_err *e);
/* Loads the athlete's blocks and tests and computes every observation and the personal
 * estimate; the variances come from the whole roster (every athlete's observations) when it
 * is large enough, else the priors. With only_block > 0, fails unless that block is the
 * athlete's and completed (the estimate still uses every completed block). */
int respd_load(struct sd_ctx *ctx, const char *athlete, long long only_block, int window,
	       const struct resp_opts *ro, struct resp_data *d, struct sd_err *e);
void respd_free(struct resp_data *d);

#endif
