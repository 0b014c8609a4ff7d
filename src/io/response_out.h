/* The JSON of `response`: the athlete, the model's variances and the personal response, with
 * the observations of the listing nested (cJSON stays in src/io). */
#ifndef SD_RESPONSE_OUT_H
#define SD_RESPONSE_OUT_H

#include <stdio.h>

#include "../core/profile.h"
#include "../core/response.h"
#include "recout.h"

struct resp_json {
	const char *athlete;
	int trained;
	const struct sd_profile *prof;
	double test_sd, est_sd, level;
	long long window;
	const struct resp_vars *vars;
	const struct resp_personal *personal;
	int nblocks;
};

/* 0, or -1 when out of memory. */
int resp_out_json(FILE *f, const struct resp_json *in, const struct sd_rec *obs);

#endif
