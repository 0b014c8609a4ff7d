/* Shared model options of `fit` and `slopes`. */
#include "mrmodel.h"

#include <getopt.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

void mrm_init(struct mrm *m)
{
	memset(m, 0, sizeof *m);
	m->spec.form = SD_FORM_RECIPROCAL;   /* the bundled profile's form */
	m->method = MR_REML;
}

static int split_mods(struct mrm *m, const char *arg, struct sd_err *e)
{
	char *s;
	if (strlen(arg) >= sizeof m->mods)
		return sd_usage(e, "--mods list is too long");
	strcpy(m->mods, arg);
	m->spec.nmods = 0;
	for (s = strtok(m->mods, ","); s; s = strtok(NULL, ",")) {
		while (*s == ' ')
			s++;
		char *end = s + strlen(s);
		while (end > s && end[-1] == ' ')
			*--end = '\0';
		if (!*s)
			continue;
		if (m->spec.nmods == MR_MAXP - 2)
			return sd_usage(e, "--mods: at most %d moderators", MR_MAXP - 2);
		m->spec.mods[m->spec.nmods++] = s;
	}
	return 0;
}

int mrm_option(struct mrm *m, int c, const char *arg, struct sd_err *e)
{
	char *end;
	int f;

	switch (c) {
	case MRM_STUDY: m->spec.study = arg; return 1;
	case MRM_EFFECT: m->spec.effect = arg; return 1;
	case MRM_DOSE: m->spec.dose = arg; return 1;
	case MRM_YI: m->spec.yi = arg; return 1;
	case MRM_VI: m->spec.vi = arg; return 1;
	case MRM_SLOPES: m->spec.slopes = 1; return 1;
	case MRM_MODS: return split_mods(m, arg, e) ? -1 : 1;
	case MRM_FORM:
		if ((f = form_find(arg)) < 0)
			return sd_usage(e, "--form wants linear, log, sqrt or reciprocal, not '%s'", arg);
		m->spec.form = (enum sd_form)f;
		return 1;
	case MRM_METHOD:
		if (!strcmp(arg, "reml"))
			m->method = MR_REML;
		else if (!strcmp(arg, "ml"))
			m->method = MR_ML;
		else
			return sd_usage(e, "--method wants reml or ml, not '%s'", arg);
		return 1;
	case MRM_TEST:
		if (strcmp(arg, "z") && strcmp(arg, "t"))
			return sd_usage(e, "--test wants z or t, not '%s'", arg);
		m->t_test = !strcmp(arg, "t");
		return 1;
	case MRM_MAXITER:
		m->max_iter = (int)strtol(arg, &end, 10);
		if (end == arg || *end || m->max_iter < 1 || m->max_iter > 100000)
			return sd_usage(e, "--max-iter wants a whole number from 1 to 100000, not '%s'",
					arg);
		return 1;
	}
	return 0;
}

int mrm_load(const struct mrm *m, const char *path, struct ef_table *t, struct ef_model *mod,
	     struct sd_err *e)
{
	if (eft_read(path, t, e))
		return -1;
	if (ef_model_build(t, &m->spec, mod, e)) {
		eft_free(t);
		return -1;
	}
	return 0;
}

struct mr_opts mrm_fit_opts(const struct mrm *m, const struct sd_ctx *ctx)
{
	struct mr_opts o = { m->method, ctx->opt.level, m->t_test, m->max_iter, NULL };
	return o;
}

void mrm_describe(const struct mrm *m, char *buf, size_t len)
{
	char mods[600] = "";
	for (int k = 0; k < m->spec.nmods; k++)
		snprintf(mods + strlen(mods), sizeof mods - strlen(mods), "%s%s", k ? ", " : "",
			 m->spec.mods[k]);
	snprintf(buf, len, "%s; %s dose form; %s%s; random %s by '%s'%s%s%s",
		 m->method == MR_REML ? "REML" : "ML", form_name(m->spec.form),
		 m->spec.nmods ? "moderators " : "no moderators", mods,
		 m->spec.slopes ? "intercepts and dose slopes" : "intercepts",
		 m->spec.study ? m->spec.study : "study",
		 m->spec.effect ? ", random intercepts by '" : "", m->spec.effect ? m->spec.effect : "",
		 m->spec.effect ? "'" : "");
}
