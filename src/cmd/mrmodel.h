/* The model options shared by `fit` and `slopes` (columns, dose form, moderators, random
 * structure, method, test) and loading an effect-size table into model data with them. */
#ifndef SD_MRMODEL_H
#define SD_MRMODEL_H

#include "../io/effects_io.h"
#include "cmd.h"

enum {
	MRM_STUDY = 300, MRM_EFFECT, MRM_DOSE, MRM_YI, MRM_VI, MRM_FORM, MRM_MODS, MRM_SLOPES,
	MRM_METHOD, MRM_TEST, MRM_MAXITER,
};

/* getopt_long entries for the shared options, to splice into a command's own table. */
#define MRM_LONGOPTS \
	{ "study", required_argument, NULL, MRM_STUDY }, \
	{ "effect", required_argument, NULL, MRM_EFFECT }, \
	{ "dose", required_argument, NULL, MRM_DOSE }, \
	{ "yi", required_argument, NULL, MRM_YI }, \
	{ "vi", required_argument, NULL, MRM_VI }, \
	{ "form", required_argument, NULL, MRM_FORM }, \
	{ "mods", required_argument, NULL, MRM_MODS }, \
	{ "slopes", no_argument, NULL, MRM_SLOPES }, \
	{ "method", required_argument, NULL, MRM_METHOD }, \
	{ "test", required_argument, NULL, MRM_TEST }, \
	{ "max-iter", required_argument, NULL, MRM_MAXITER }

/* Usage lines for those options. */
#define MRM_USAGE \
	"  --study COL        study (cluster) column (default study)\n" \
	"  --effect COL       effect-level column: a second random level nested in studies\n" \
	"  --dose COL         weekly fractional sets column (default sets)\n" \
	"  --yi COL, --vi COL effect size and sampling variance columns (default yi, vi)\n" \
	"  --form F           dose form: linear, log, sqrt or reciprocal (default reciprocal)\n" \
	"  --mods A,B         numeric or 0/1 moderator columns, entered raw\n" \
	"  --slopes           random study slopes on the dose term (2x2 unstructured)\n" \
	"  --method M         reml (default) or ml\n" \
	"  --test T           z (default) or t with df = studies - coefficients\n" \
	"  --max-iter N       iteration cap of each optimiser stage\n" \
	"  (global --level sets the interval level)"

struct mrm {
	struct ef_spec spec;
	char mods[512];              /* storage for spec.mods */
	enum mr_method method;
	int t_test, max_iter;
};

void mrm_init(struct mrm *m);
/* Applies one shared option: 1 when c was one, 0 when it is not, -1 on a bad value. */
int mrm_option(struct mrm *m, int c, const char *arg, struct sd_err *e);
/* Reads the table at path and builds the model data. */
int mrm_load(const struct mrm *m, const char *path, struct ef_table *t, struct ef_model *mod,
	     struct sd_err *e);
/* Fitting options from the model options and the global ones. */
struct mr_opts mrm_fit_opts(const struct mrm *m, const struct sd_ctx *ctx);
/* One line describing the model, e.g. "REML; reciprocal dose form; moderators weeks, trained;
 * random intercepts for study and effect". */
void mrm_describe(const struct mrm *m, char *buf, size_t len);

#endif
