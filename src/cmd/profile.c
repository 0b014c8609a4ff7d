/* profile: show or check a dose-response profile. */
#include <math.h>
#include <string.h>

#include "../io/profile_io.h"
#include "cmd.h"

extern const struct sd_cmd cmd_profile;

static void show(struct sd_ctx *ctx, const struct sd_profile *p, const char *path)
{
	FILE *f = ctx->out;
	int n = p->nterms;

	fprintf(f, "profile     %s (%s)\nbasis       %s: %s\noutcome     %s, %s scale\ndose form   "
		"%s; evidence %g to %g weekly fractional sets\n", p->name, path, basis_name(p->basis),
		p->summary, p->outcome, p->scale, form_name(p->form), p->dose_min, p->dose_max);
	for (int i = 0; i < p->nranges; i++)
		fprintf(f, "%-11s %g to %g (evidence range; outside it the value is held at the edge "
			"and flagged)\n", p->range[i].var, p->range[i].lo, p->range[i].hi);
	fprintf(f, "SWC         %.2f%% (lnRR %.6f)\nset weights direct %g, indirect %g\nquantiles   "
		"%s\n\n", curve_pct(p->swc), p->swc, p->w_direct, p->w_indirect,
		p->df ? "t" : "normal");
	fprintf(f, "%-12s %12s %10s %10s\n", "term", "estimate", "SE", "centre");
	for (int i = 0; i < n; i++)
		fprintf(f, "%-12s %12.6f %10.6f %10g\n", p->term[i], p->beta[i],
			sqrt(p->vcov[i * n + i]), p->centre[i]);
	fprintf(f, "\ncorrelation of estimates:\n%-12s", "");
	for (int j = 0; j < n; j++)
		fprintf(f, " %9s", p->term[j]);
	fputc('\n', f);
	for (int i = 0; i < n; i++) {
		fprintf(f, "%-12s", p->term[i]);
		for (int j = 0; j < n; j++)
			fprintf(f, " %9.3f", p->vcov[i * n + j] /
				sqrt(p->vcov[i * n + i] * p->vcov[j * n + j]));
		fputc('\n', f);
	}
	fprintf(f, "\nthree levels of uncertainty:\n  the average curve    the covariance above\n"
		"  a new group/study    + tau2 %.6g (between studies) + sigma2 %.6g (within)\n",
		p->tau2, p->sigma2);
	if (p->slopes)
		fprintf(f, "                       + random slopes: tau2_slope %.6g, correlation %.3f\n",
			p->tau2_slope, p->tau2 > 0 && p->tau2_slope > 0 ?
			p->cov_slope / sqrt(p->tau2 * p->tau2_slope) : 0);
	fprintf(f, "  one athlete          + between-athlete variance %.6g (SD %.3f)\n"
		"                       source: %s\n", p->athlete_var, sqrt(p->athlete_var),
		p->athlete_source);
	fprintf(f, "\nprovenance:\n%s\n", p->provenance);
}

static int exec_profile(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	char path[1200];
	struct sd_profile p;

	if (argc < 2 || argc > 3 || (strcmp(argv[1], "show") && strcmp(argv[1], "check")))
		return sd_usage(e, "usage: setdose %s", cmd_profile.usage);
	if (argc == 3)
		snprintf(path, sizeof path, "%s", argv[2]);
	else if (ctx->opt.profile_path)
		snprintf(path, sizeof path, "%s", ctx->opt.profile_path);
	else
		snprintf(path, sizeof path, "%s/strength.ini", ctx->datadir);
	if (profile_load(path, &p, e))
		return -1;
	if (!strcmp(argv[1], "check")) {
		fprintf(ctx->out, "ok: %s (%s form, %d terms, covariance positive definite)\n", path,
			form_name(p.form), p.nterms);
		return 0;
	}
	show(ctx, &p, path);
	return 0;
}

const struct sd_cmd cmd_profile = {
	.name = "profile",
	.summary = "show or check a dose-response profile",
	.usage = "profile show|check [FILE]\n"
		 "  show   coefficients, standard errors, correlations, evidence ranges, the three\n"
		 "         levels of uncertainty, provenance\n"
		 "  check  validate FILE (default: the active profile); exit 1 with the problem",
	.flags = 0,
	.exec = exec_profile,
};
