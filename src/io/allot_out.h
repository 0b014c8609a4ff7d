/* Prints an allotment (core/allot.h) as an aligned report, as CSV (the exercise table, a
 * blank line, the muscle table) or as JSON (cJSON stays inside io/). */
#ifndef SD_ALLOT_OUT_H
#define SD_ALLOT_OUT_H

#include <stdio.h>

#include "../core/allot.h"
#include "../core/audit.h"
#include "../core/library.h"
#include "../core/profile.h"

struct allot_view {
	const struct allot_problem *prob;
	const struct allot_result *res;
	const struct allot_layout *lay;
	const int *ex;                  /* library index of each candidate */
	const struct sd_library *lib;
	const struct sd_profile *prof;
	const struct sd_program *prog;  /* the laid-out program (days = non-empty sessions) */
	const struct sd_audit *audit;   /* its audit: the doses and gains shown */
	const int *day_of;              /* session -> day of prog, -1 when the session is empty */
	int per_session;                /* sets a session at most (0: no limit) */
	double cap;                     /* fractional sets per muscle per session */
	const char *limit_note;         /* where the budget and per-session limit came from */
	const char *notes[8];           /* extra lines for the reader, NULL-terminated */
};

/* The report: header, method line, sets per exercise and session, per-muscle table, notes. */
void allot_out_table(FILE *f, const struct allot_view *v, int color);
/* The exercise table and the muscle table as CSV, a blank line between; -1 on no memory. */
int allot_out_csv(FILE *f, const struct allot_view *v);
/* One JSON object (see man/setdose.1, JSON OUTPUT); -1 on no memory. */
int allot_out_json(FILE *f, const struct allot_view *v);

#endif
