/* The model options shared by `fit` and `slopes` (columns, dose form, moderators, random
 * structure, method, test) and loading an effect-size table into model data with them. */
#ifndef SD_MRMODEL_H
#define SD_MRMODEL_H

#include "../io/effects_io.h"
#include "cmd.h"

struct mrm {
	struct ef_spec spec;
	char mods[512];              /* storage for spec.mods */
	enum mr_method method;
	int t_test, max_iter;
};

void mrm_init(struct mrm *m);

/* The shared options, to splice into a command's option table (opt.h). */
#define MRM_OPT(n, a, h) { n, OPT_CALL, 0, 0, 0, mrm_optcall, a, h }
#define MRM_OPTDEFS \
	MRM_OPT("study", "COL", "study (cluster) column (default study)"), \
	MRM_OPT("effect", "COL", "effect-level column: a second random level nested in studies"), \
	MRM_OPT("dose", "COL", "weekly fractional sets column (default sets)"), \
	MRM_OPT("yi", "COL", "effect size column (default yi)"), \
	MRM_OPT("vi", "COL", "sampling variance column (default vi)"), \
	MRM_OPT("form", "F", "dose form: linear, log, sqrt or reciprocal (default reciprocal)"), \
	MRM_OPT("mods", "A,B", "numeric or 0/1 moderator columns, entered raw"), \
	MRM_OPT("slopes", NULL, "random study slopes on the dose term (2x2 unstructured)"), \
	MRM_OPT("method", "M", "reml (default) or ml"), \
	MRM_OPT("test", "T", "z (default) or t with df = studies - coefficients"), \
	MRM_OPT("max-iter", "N", "iteration cap of each optimiser stage")
/* Applies one shared option (opt.h OPT_CALL); dst is the command's options struct, whose
 * first member is its struct mrm. */
int mrm_optcall(void *dst, const struct sd_optdef *d, const char *arg, struct sd_err *e);
/* Reads the table at path and builds the model data. */
int mrm_load(const struct mrm *m, const char *path, struct ef_table *t, struct ef_model *mod,
	     struct sd_err *e);
/* Fitting options from the model options and the global ones. */
struct mr_opts mrm_fit_opts(const struct mrm *m, const struct sd_ctx *ctx);
/* One line describing the model, e.g. "REML; reciprocal dose form; moderators weeks, trained;
 * random intercepts for study and effect". */
void mrm_describe(const struct mrm *m, char *buf, size_t len);

#endif
