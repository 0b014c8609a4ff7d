/* Shared model options of `fit` and `slopes`. */
#include "mrmodel.h"

#include "../app/parse.h"


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

int mrm_optcall(void *dst, const struct sd_optdef *d, const char *arg, struct sd_err *e)
{
	struct mrm *m = dst;
	const char *n = d->name;
	long long v;
	int f;

	if (!strcmp(n, "study"))
		m->spec.study = arg;
	else if (!strcmp(n, "effect"))
		m->spec.effect = arg;
	else if (!strcmp(n, "dose"))
		m->spec.dose = arg;
	else if (!strcmp(n, "yi"))
		m->spec.yi = arg;
	else if (!strcmp(n, "vi"))
		m->spec.vi = arg;
	else if (!strcmp(n, "slopes"))
		m->spec.slopes = 1;
	else if (!strcmp(n, "mods"))
		return split_mods(m, arg, e);
	else if (!strcmp(n, "form")) {
		if ((f = form_find(arg)) < 0)
			return sd_usage(e, "--form wants linear, log, sqrt or reciprocal, not '%s'", arg);
		m->spec.form = (enum sd_form)f;
	} else if (!strcmp(n, "method")) {
		if (!strcmp(arg, "reml"))
			m->method = MR_REML;
		else if (!strcmp(arg, "ml"))
			m->method = MR_ML;
		else
			return sd_usage(e, "--method wants reml or ml, not '%s'", arg);
	} else if (!strcmp(n, "test")) {
		if (strcmp(arg, "z") && strcmp(arg, "t"))
			return sd_usage(e, "--test wants z or t, not '%s'", arg);
		m->t_test = !strcmp(arg, "t");
	} else if (!strcmp(n, "max-iter")) {
		if (app_int("--max-iter", arg, 1, 100000, &v, e))
			return -1;
		m->max_iter = (int)v;
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
