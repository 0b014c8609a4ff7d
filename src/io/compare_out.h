/* Prints a comparison of programs (core/compare.h) as an aligned report, as CSV (three
 * tables separated by blank lines: muscles, differences, totals) or as JSON. */
#ifndef SD_COMPARE_OUT_H
#define SD_COMPARE_OUT_H

#include <stdio.h>

#include "../core/compare.h"

struct cmp_view {
	int n;                          /* programs, keyed A, B, C ... in order */
	const char *const *label;       /* each program's argument (file or stored name) */
	const struct sd_program *prog;  /* n */
	const struct sd_audit *audit;   /* n, all for the same athlete context */
	const struct cmp_totals *tot;   /* n */
	int npairs;
	const int (*pair)[2];           /* (first, second): differences are second - first */
	const struct cmp_diff *diff;    /* npairs x SD_NMUSCLES */
	const struct sd_profile *prof;
	double level, cap;
	const char *note;               /* or NULL */
};

/* The report: programs side by side, one difference table per pair, totals, warnings. */
void cmp_out_table(FILE *f, const struct cmp_view *v, int color);
/* Three CSV tables (muscles, differences, totals) separated by blank lines. */
int cmp_out_csv(FILE *f, const struct cmp_view *v);
/* One JSON object (see man/setdose.1, JSON OUTPUT); -1 on no memory. */
int cmp_out_json(FILE *f, const struct cmp_view *v);

#endif
