/* The table of `curve`: the curve, its three bands and what one more set buys, every STEP
 * weekly fractional sets over the profile's dose range, as aligned text, CSV or JSON. */
#ifndef SD_CURVE_OUT_H
#define SD_CURVE_OUT_H

#include <stdio.h>

#include "../core/curve.h"

enum { CURVE_TABLE, CURVE_CSV, CURVE_JSON };

/* 0, or -1 when out of memory. wide: every column in the table (the default fits 80). */
int curve_out_print(FILE *f, const struct sd_profile *p, const struct sd_covars *cov, double level,
		    double step, int wide, int fmt);

#endif
