/* Prints an allotment (core/allot.h) as an aligned report, as CSV (the exercise table, a
 * blank line, the muscle table) or as JSON (cJSON stays inside io/), and the --explain text. */
#ifndef SD_ALLOT_OUT_H
#define SD_ALLOT_OUT_H

#include <stdio.h>

#include "../core/allot.h"
#include "../core/audit.h"
#include "../core/library.h"
#include "../core/profile.h"

/* Output formats, in the order of the command layer's SD_FMT_* (cmd/allot.c checks it). */
enum allot_fmt { ALLOT_TABLE, ALLOT_CSV, ALLOT_JSON };

#define ALLOT_NOTES 8

struct allot_view {
	const struct allot_problem *prob;
	const struct allot_result *res;
	const struct allot_layout *lay;
	const int *ex;                  /* library index of each candidate */
	const int *multi;               /* 1 per multi-joint candidate */
	const int *order;               /* candidates in session order: multi-joint, costlier first */
	const struct sd_library *lib;
	const struct sd_profile *prof;
	const struct sd_program *prog;  /* the laid-out program (days = non-empty sessions) */
	const struct sd_audit *audit;   /* its audit: the doses and gains shown */
	const int *day_of;              /* session -> day of prog, -1 when the session is empty */
	int per_session;                /* sets a session at most (0: no limit) */
	double cap;                     /* fractional sets per muscle per session */
	const char *limit_note;         /* where the budget and per-session limit came from */
	const char *effort;             /* the effort written on every set, "RIR 2" */
	const char *notes[ALLOT_NOTES]; /* extra lines for the reader, NULL-terminated */
};

/* Prints the allotment in the format asked (the table with its caution); -1 on no memory. */
int allot_out_print(FILE *f, const struct allot_view *v, enum allot_fmt fmt, int color);

/* What --explain prints: the objective, the defaults in use and the guarantee. */
struct allot_explain {
	const struct allot_problem *prob;   /* weights, limits and rules (no candidates needed) */
	const struct sd_profile *prof;
	double plateau;                     /* the profile's practical threshold */
	int sessions_default;               /* the --sessions default */
	double cap;
	const char *effort;
	int per_session;
	const char *const *cand;            /* candidate names, NULL-terminated */
	const double *cost;                 /* per candidate */
	const int *multi;                   /* per candidate */
	const char *cost_source;            /* where the costs came from */
};
void allot_out_explain(FILE *f, const struct allot_explain *x);

#endif
