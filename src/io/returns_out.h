/* The output of `returns`: what moving from one weekly dose to another buys, as a grid (table)
 * or one row per pair (CSV and JSON, from the same cells). */
#ifndef SD_RETURNS_OUT_H
#define SD_RETURNS_OUT_H

#include <stdio.h>

#include "../core/curve.h"

struct returns_view {
	const struct sd_profile *prof;
	struct sd_covars cov;
	double level, plateau;
	const double *dose;          /* n increasing doses */
	int n;
	const struct sd_delta *delta;/* n x n; [i * n + j] for i < j: from dose[i] to dose[j] */
	const char *note;            /* the covariates' evidence warning, or "" */
	int wide;                    /* the grid in one piece, not in panels of the output's width */
};

enum { RET_TABLE, RET_CSV, RET_JSON };
#define RET_MAX_DOSES 32             /* doses at most */

/* 0, or -1 when out of memory. */
int returns_out_print(FILE *f, const struct returns_view *v, int fmt);

#endif
