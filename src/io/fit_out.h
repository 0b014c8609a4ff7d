/* JSON of the meta-regression commands (fit, fit --forms all, slopes): cJSON stays in src/io.
 * Statistics are written to 10 significant digits (json_sig); a value that is not finite is
 * null. */
#ifndef SD_FIT_OUT_H
#define SD_FIT_OUT_H

#include <stdio.h>

#include "../core/metareg.h"
#include "effects_io.h"

/* One fit: input, method, form, counts, coefficients, variance components, fit statistics. */
void fit_json(FILE *out, const char *path, const char *form, const struct ef_model *mod,
	      const struct mr_fit *f);

/* One row of `fit --forms all`, already in the order to print. */
struct fit_form {
	const char *form;
	const struct mr_fit *fit;
	const struct mr_cv *cv;
	const int *rank;             /* by AIC, BIC, RMSE, MLPD */
};
void fit_forms_json(FILE *out, const struct fit_form *r, int n);

/* The random-slope fit with each study's raw, shrunken and BLUP slopes. */
void slopes_json(FILE *out, const struct ef_model *mod, const struct mr_fit *f,
		 const struct mr_study *st);

#endif
