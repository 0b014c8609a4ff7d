/* fit: multilevel meta-regression of an effect-size table; the dose-form comparison; writing
 * the fit as a dose-response profile. */
#include <errno.h>
#include <stddef.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>
#include <unistd.h>


#include "../io/profile_io.h"
#include "../io/safefile.h"
#include "../io/table.h"
#include "../io/fit_out.h"
#include "../io/wrap.h"
#include "mrmodel.h"

extern const struct sd_cmd cmd_fit;

static const char *pval(double p, char *buf, size_t n)
{
	if (p < 0.001)
		return "<0.001";
	snprintf(buf, n, "%.3f", p);
	return buf;
}

static const char *basename_of(const char *path)
{
	const char *s = strrchr(path, '/');
	return s ? s + 1 : path;
}

/* ---- one fit: table, CSV and JSON ---- */

static void print_coefs(FILE *out, const struct ef_model *mod, const struct mr_fit *f, int csv)
{
	const char *heads[] = { "<term", "estimate", "se", f->df ? "t" : "z", "p", "ci_low",
				"ci_high" };
	struct sd_table *t = tbl_new(7, heads);
	char b[16];

	if (!t)
		return;
	for (int j = 0; j < f->p; j++) {
		tbl_row(t);
		tbl_set(t, 0, "%s", mod->names[j]);
		tbl_set(t, 1, csv ? "%.10g" : "%.6g", f->beta[j]);
		tbl_set(t, 2, csv ? "%.10g" : "%.4g", f->se[j]);
		tbl_set(t, 3, "%.2f", f->stat[j]);
		if (csv)
			tbl_set(t, 4, "%.4g", f->pval[j]);
		else
			tbl_set(t, 4, "%s", pval(f->pval[j], b, sizeof b));
		tbl_set(t, 5, csv ? "%.10g" : "%.6g", f->lo[j]);
		tbl_set(t, 6, csv ? "%.10g" : "%.6g", f->hi[j]);
	}
	tbl_print(t, out, csv);
	tbl_free(t);
}

static void print_variances(FILE *out, const struct mrm *m, const struct mr_fit *f)
{
	const char *study = m->spec.study ? m->spec.study : "study";
	const char *zero = "  (0 at the boundary: no detectable variance)";

	fprintf(out, "\nvariance components\n");
	fprintf(out, "  tau2        %-12.6g sd %-10.4g study intercepts (%s)%s\n", f->tau2,
		sqrt(f->tau2), study, f->tau2_zero ? zero : "");
	if (f->slopes) {
		fprintf(out, "  tau2_slope  %-12.6g sd %-10.4g study dose slopes (%s)%s\n",
			f->tau2_slope, sqrt(f->tau2_slope), study, f->slope_zero ? zero : "");
		fprintf(out, "  cov_slope   %-12.6g", f->cov_slope);
		if (isnan(f->rho))
			fprintf(out, "    correlation undefined (a variance is 0)\n");
		else
			fprintf(out, "    correlation rho %.4f%s\n", f->rho,
				f->rho_bound ? "  (at the boundary +-1: G has rank 1)" : "");
	}
	if (f->effect_level)
		fprintf(out, "  sigma2      %-12.6g sd %-10.4g effects within studies (%s)%s\n",
			f->sigma2, sqrt(f->sigma2), m->spec.effect, f->sigma2_zero ? zero : "");
}

static void print_stats(FILE *out, const struct mr_fit *f)
{
	char b[16];
	fprintf(out, "\nfit statistics\n  logLik (%s) %.6f   AIC %.4f   BIC %.4f   parameters %d "
		"(%d fixed, %d variance)\n", f->method == MR_REML ? "REML" : "ML", f->loglik, f->aic,
		f->bic, f->npar, f->p, f->nvc);
	fprintf(out, "  %d effects in %d studies; %s intervals at %.0f%%", f->n, f->nstudy,
		f->df ? "t" : "normal (z)", f->level * 100);
	if (f->df)
		fprintf(out, "; t with df = %d (studies - coefficients)", f->df);
	fprintf(out, "\n\nheterogeneity\n  Q_E(%d) = %.2f, p %s%s: residual heterogeneity test "
		"(Cochran)\n", f->qe_df, f->qe, f->qe_p < 0.001 ? "< " : "= ",
		f->qe_p < 0.001 ? "0.001" : pval(f->qe_p, b, sizeof b));
	fprintf(out, "  I2 between studies %.1f%%%s", f->i2_study,
		f->slopes ? " (at the mean dose term)" : "");
	if (f->effect_level)
		fprintf(out, ", within studies %.1f%%", f->i2_effect);
	fprintf(out, "; typical sampling variance %.4g\n", f->v_typical);
	fprintf(out, "\nconvergence: %s after %d quasi-Newton (GSL BFGS2) and %d Newton "
		"iterations; final Newton decrement %.2g", f->converged ? "converged" :
		"NOT converged", f->iter_bfgs, f->iter_newton, f->decrement);
	if (f->starts)
		fprintf(out, "; best of %d starts", f->starts + 1);
	fputc('\n', out);
}

static void csv_row(struct sd_table *t, const char *name, double est, double se, double st,
		    double p, double lo, double hi)
{
	double v[6] = { est, se, st, p, lo, hi };
	tbl_row(t);
	tbl_set(t, 0, "%s", name);
	for (int i = 0; i < 6; i++)
		if (!isnan(v[i]))
			tbl_set(t, i + 1, "%.10g", v[i]);
}

static void print_csv(FILE *out, const struct ef_model *mod, const struct mr_fit *f)
{
	static const char *const heads[] = { "<quantity", "estimate", "se", "stat", "p", "ci_low",
					     "ci_high" };
	struct sd_table *t = tbl_new(7, heads);
	if (!t)
		return;
	for (int j = 0; j < f->p; j++)
		csv_row(t, mod->names[j], f->beta[j], f->se[j], f->stat[j], f->pval[j], f->lo[j],
			f->hi[j]);
	csv_row(t, "tau2", f->tau2, NAN, NAN, NAN, NAN, NAN);
	if (f->slopes) {
		csv_row(t, "tau2_slope", f->tau2_slope, NAN, NAN, NAN, NAN, NAN);
		csv_row(t, "cov_slope", f->cov_slope, NAN, NAN, NAN, NAN, NAN);
		csv_row(t, "rho", f->rho, NAN, NAN, NAN, NAN, NAN);
	}
	if (f->effect_level)
		csv_row(t, "sigma2", f->sigma2, NAN, NAN, NAN, NAN, NAN);
	csv_row(t, "loglik", f->loglik, NAN, NAN, NAN, NAN, NAN);
	csv_row(t, "aic", f->aic, NAN, NAN, NAN, NAN, NAN);
	csv_row(t, "bic", f->bic, NAN, NAN, NAN, NAN, NAN);
	csv_row(t, "qe", f->qe, NAN, f->qe_df, f->qe_p, NAN, NAN);
	csv_row(t, "effects", f->n, NAN, NAN, NAN, NAN, NAN);
	csv_row(t, "studies", f->nstudy, NAN, NAN, NAN, NAN, NAN);
	csv_row(t, "converged", f->converged, NAN, NAN, NAN, NAN, NAN);
	tbl_print(t, out, 1);
	tbl_free(t);
}

static void print_fit(struct sd_ctx *ctx, const char *path, const struct mrm *m,
		      const struct ef_model *mod, const struct mr_fit *f)
{
	char desc[768];
	FILE *out = ctx->out;

	if (ctx->opt.format == SD_FMT_CSV) {
		print_csv(out, mod, f);
		return;
	}
	if (ctx->opt.format == SD_FMT_JSON) {
		fit_json(out, path, form_name(m->spec.form), mod, f);
		return;
	}
	mrm_describe(m, desc, sizeof desc);
	fprintf(out, "fit of '%s': %d effects in %d studies, doses %g to %g weekly sets\nmodel: "
		"%s\n\n", path, f->n, f->nstudy, mod->dose_min, mod->dose_max, desc);
	print_coefs(out, mod, f, 0);
	print_variances(out, m, f);
	print_stats(out, f);
}

/* ---- the dose-form comparison ---- */

struct progress {
	int on;
	const char *form;
};

static void show_progress(void *arg, int done, int total)
{
	struct progress *p = arg;
	if (!p->on)
		return;
	if (done < total)
		fprintf(stderr, "\rleave-one-study-out, %s form: study %d of %d ", p->form, done + 1,
			total);
	else
		fprintf(stderr, "\r%60s\r", "");
	fflush(stderr);
}

struct form_row {
	enum sd_form form;
	struct mr_fit fit;
	struct mr_cv cv;
	int rank[4];         /* by AIC, BIC, RMSE, MLPD */
};

static void rank_rows(struct form_row *r, int n)
{
	for (int i = 0; i < n; i++)
		for (int c = 0; c < 4; c++) {
			int k = 1;
			for (int j = 0; j < n; j++) {
				double a, b;
				switch (c) {
				case 0: a = r[j].fit.aic; b = r[i].fit.aic; break;
				case 1: a = r[j].fit.bic; b = r[i].fit.bic; break;
				case 2: a = r[j].cv.rmse; b = r[i].cv.rmse; break;
				default: a = -r[j].cv.mlpd; b = -r[i].cv.mlpd; break;
				}
				k += a < b;
			}
			r[i].rank[c] = k;
		}
}

static void print_forms(struct sd_ctx *ctx, const char *path, const struct mrm *m,
			struct form_row *r, int n)
{
	static const char *const heads[] = { "<form", "logLik", "AIC", "dAIC", "BIC", "dBIC",
					     "loso_rmse", "loso_mlpd", "rank_aic", "rank_bic",
					     "rank_rmse", "rank_mlpd" };
	struct sd_table *t = tbl_new(12, heads);
	double amin = INFINITY, bmin = INFINITY;
	int csv = ctx->opt.format == SD_FMT_CSV, order[SD_NFORMS];
	char desc[768];

	if (!t)
		return;
	for (int i = 0; i < n; i++) {
		amin = fmin(amin, r[i].fit.aic);
		bmin = fmin(bmin, r[i].fit.bic);
		order[r[i].rank[0] - 1] = i;   /* rows by AIC */
	}
	if (ctx->opt.format == SD_FMT_JSON) {
		struct fit_form ff[SD_NFORMS];
		for (int k = 0; k < n; k++) {
			const struct form_row *x = &r[order[k]];
			ff[k] = (struct fit_form){ form_name(x->form), &x->fit, &x->cv, x->rank };
		}
		fit_forms_json(ctx->out, ff, n);
		tbl_free(t);
		return;
	}
	for (int k = 0; k < n; k++) {
		const struct form_row *x = &r[order[k]];
		const char *g = csv ? "%.10g" : "%.3f";
		tbl_row(t);
		tbl_set(t, 0, "%s", form_name(x->form));
		tbl_set(t, 1, g, x->fit.loglik);
		tbl_set(t, 2, g, x->fit.aic);
		tbl_set(t, 3, g, x->fit.aic - amin);
		tbl_set(t, 4, g, x->fit.bic);
		tbl_set(t, 5, g, x->fit.bic - bmin);
		tbl_set(t, 6, csv ? "%.10g" : "%.5f", x->cv.rmse);
		tbl_set(t, 7, csv ? "%.10g" : "%.4f", x->cv.mlpd);
		for (int c = 0; c < 4; c++)
			tbl_set(t, 8 + c, "%d", x->rank[c]);
	}
	if (!csv) {
		mrm_describe(m, desc, sizeof desc);
		fprintf(ctx->out, "dose forms compared on '%s' (%d effects, %d studies)\nmodel: %s; "
			"every form fitted by ML\n\n", path, r[0].fit.n, r[0].fit.nstudy, desc);
	}
	tbl_print(t, ctx->out, csv);
	if (!csv) {
		fprintf(ctx->out, "\nlower AIC, BIC and RMSE and higher MLPD are better. loso: each "
			"study's effects predicted by the ML refit without it (RMSE of the effects; "
			"mean log predictive density per effect, joint within a study).\n");
		for (int i = 0; i < n; i++)
			if (r[i].cv.skipped)
				wrap_printf(ctx->out, 6, "note: %s form: %d studies could not be left out "
					    "(the rest could not carry the model)", form_name(r[i].form),
					r[i].cv.skipped);
	}
	tbl_free(t);
}

static int compare_forms(struct sd_ctx *ctx, const char *path, struct mrm *m,
			 struct ef_model *mod, struct sd_err *e)
{
	struct form_row r[SD_NFORMS];
	struct progress pr = { isatty(STDERR_FILENO), NULL };
	struct mr_opts o = mrm_fit_opts(m, ctx);
	enum sd_form keep = m->spec.form;

	o.method = MR_ML;
	for (int f = 0; f < SD_NFORMS; f++) {
		r[f].form = (enum sd_form)f;
		ef_model_set_form(mod, r[f].form);
		pr.form = form_name(r[f].form);
		if (mr_fit(&mod->d, &o, &r[f].fit, e) ||
		    mr_loso(&mod->d, &o, &r[f].fit, &r[f].cv, show_progress, &pr, e)) {
			show_progress(&pr, 1, 1);
			return sd_wrap(e, "%s form", form_name(r[f].form));
		}
	}
	rank_rows(r, SD_NFORMS);
	m->method = MR_ML;
	m->spec.form = keep;
	print_forms(ctx, path, m, r, SD_NFORMS);
	return 0;
}

/* ---- writing a profile ---- */

static void today(char *buf, size_t n)
{
	/* SOURCE_DATE_EPOCH makes written profiles reproducible (reproducible-builds.org). */
	const char *sde = getenv("SOURCE_DATE_EPOCH");
	time_t t = sde && *sde ? (time_t)strtoll(sde, NULL, 10) : time(NULL);
	struct tm tm;
	gmtime_r(&t, &tm);
	strftime(buf, n, "%Y-%m-%d", &tm);
}

/* The evidence range of each moderator: the values the data hold. */
static int data_ranges(const struct ef_model *mod, struct sd_profile *p, struct sd_err *e)
{
	int n = mod->d.n, np = mod->d.p;

	p->nranges = 0;
	for (int j = 2; j < np; j++) {
		struct sd_range *r = &p->range[p->nranges++];
		if (strchr(mod->names[j], ':') || strlen(mod->names[j]) >= sizeof r->var)
			return sd_fail(e, "cannot write a profile with moderator '%s': a name has at most "
				       "%zu characters and no ':' (which marks a term times the dose)",
				       mod->names[j], sizeof r->var - 1);
		snprintf(r->var, sizeof r->var, "%s", mod->names[j]);
		r->lo = INFINITY;
		r->hi = -INFINITY;
		for (int i = 0; i < n; i++) {
			double x = mod->d.X[(size_t)i * (size_t)np + (size_t)j];
			r->lo = fmin(r->lo, x);
			r->hi = fmax(r->hi, x);
		}
	}
	return 0;
}

/* Study-level effect sizes say nothing about how athletes under one programme differ, so the
 * between-athlete variance is copied from the active profile (the bundled one by default), and
 * the written profile says so. */
static int athlete_from_default(const struct sd_ctx *ctx, struct sd_profile *p, struct sd_err *e)
{
	struct sd_profile d;
	char path[1200];

	if (ctx->opt.profile_path)
		snprintf(path, sizeof path, "%s", ctx->opt.profile_path);
	else
		snprintf(path, sizeof path, "%s/strength.ini", ctx->datadir);
	if (profile_load(path, &d, e))
		return sd_wrap(e, "the between-athlete variance is copied from the active profile");
	p->athlete_var = d.athlete_var;
	snprintf(p->athlete_source, sizeof p->athlete_source, "Copied from profile '%s', not "
		 "estimated: study-level effect sizes cannot estimate the spread between athletes "
		 "under one programme (see that profile's athlete_source).", d.name);
	return 0;
}

static int write_profile(struct sd_ctx *ctx, const char *path, const char *out, int force,
			 const char *name, const struct mrm *m, const struct ef_model *mod,
			 const struct mr_fit *f, double *avar, struct sd_err *e)
{
	struct sd_profile p;
	struct sf_file sf;
	char date[32], desc[768];

	if (mr_to_profile(f, m->spec.form, mod->names, &p, e) || data_ranges(mod, &p, e) ||
	    athlete_from_default(ctx, &p, e))
		return -1;
	snprintf(p.name, sizeof p.name, "%s", name);
	snprintf(p.outcome, sizeof p.outcome, "1RM strength");
	p.dose_min = mod->dose_min;
	p.dose_max = mod->dose_max;
	if (ctx->opt.swc_set)
		p.swc = log1p(ctx->opt.swc_pct / 100.0);
	p.basis = SD_BASIS_FITTED;
	today(date, sizeof date);
	snprintf(p.summary, sizeof p.summary, "fitted by setdose fit to '%.60s' (%d effects, %d "
		 "studies) on %s", basename_of(path), f->n, f->nstudy, date);
	mrm_describe(m, desc, sizeof desc);
	snprintf(p.provenance, sizeof p.provenance,
		 "Fitted by setdose fit from '%s' on %s: %d effects in %d studies, doses %g to %g "
		 "weekly fractional sets.\nModel: multilevel meta-regression on lnRR, %s.\n"
		 "logLik %.6f, AIC %.4f, BIC %.4f; tau2 %.6g, sigma2 %.6g%s; %s.\n"
		 "Coefficients are raw (centre 0); intervals use %s quantiles. Each moderator's "
		 "evidence range is the values in the data.\n"
		 "Not estimable from these data: the between-athlete variance (copied, see "
		 "athlete_source) and any dependence of the slope on a moderator (no 'NAME:dose' "
		 "terms are fitted).",
		 basename_of(path), date, f->n, f->nstudy, mod->dose_min, mod->dose_max, desc,
		 f->loglik, f->aic, f->bic, f->tau2, f->sigma2, f->slopes ? ", random slopes" : "",
		 f->converged ? "converged" : "not converged", f->df ? "t" : "normal");
	if (profile_validate(&p, e))
		return sd_wrap(e, "the fitted profile is not usable");
	/* A temporary file put in place only once complete (io/safefile.h). */
	if (sf_open(&sf, out, force, e))
		return -1;
	*avar = p.athlete_var;
	return sf_finish(&sf, profile_write(sf.fp, &p, e), e);
}

/* Said only once the profile is in place. */
static void wrote_profile(struct sd_ctx *ctx, const char *out, const struct mrm *m,
			  const struct ef_model *mod, const struct mr_fit *f, double avar)
{
	if (ctx->opt.format != SD_FMT_TABLE)
		return;
	fprintf(ctx->out, "\nwrote profile '%s' (%s form, %d terms); use it with --profile %s\n",
		out, form_name(m->spec.form), f->p, out);
	fprintf(ctx->out, "not estimable from study-level effects: the between-athlete variance "
		"(%.6g copied from the active profile, so the one-athlete band is that profile's "
		"assumption)\n", avar);
	for (int j = 2; j < f->p; j++)
		if (strcmp(mod->names[j], "weeks") && strcmp(mod->names[j], "trained"))
			wrap_printf(ctx->out, 6, "note: moderator '%s' is not an athlete covariate "
				    "(weeks, trained); the curve holds it at 0", mod->names[j]);
}

/* Every number the fit prints is finite; otherwise nothing of it is shown. */
static int fit_finite(const char *path, const struct ef_model *mod, const struct mr_fit *f,
		      struct sd_err *e)
{
	for (int j = 0; j < f->p; j++)
		if (!isfinite(f->beta[j]) || !isfinite(f->se[j]))
			return sd_fail(e, "the fit of '%s' gave a non-finite estimate for '%s'; check "
				       "the effect sizes and variances", path, mod->names[j]);
	if (!isfinite(f->tau2) || !isfinite(f->sigma2) || !isfinite(f->loglik))
		return sd_fail(e, "the fit of '%s' gave non-finite variance components; check the "
			       "effect sizes and variances", path);
	return 0;
}

struct fit_opts {
	struct mrm m;            /* first: the shared model options fill it (mrmodel.h) */
	const char *forms, *write, *name;
	int force;
};

#define FO(f) offsetof(struct fit_opts, f)
static const struct sd_optdef opts[] = {
	MRM_OPTDEFS,
	{ "forms", OPT_STR, 0, 0, FO(forms), NULL, "all",
	  "fit every dose form by ML; rank by AIC, BIC and\n"
	  "leave-one-study-out prediction error" },
	{ "write", OPT_STR, 0, 0, FO(write), NULL, "FILE",
	  "write the fit as a dose-response profile (moderator ranges\n"
	  "from the data; the between-athlete variance, which\n"
	  "study-level effects cannot estimate, copied from the active\n"
	  "profile and marked so)" },
	{ "force", OPT_FLAG, 0, 0, FO(force), NULL, NULL, "replace an existing --write FILE" },
	{ "name", OPT_STR, 0, 0, FO(name), NULL, "NAME", "the written profile's name (default fitted)" },
};
#undef FO

static int exec_fit(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	struct fit_opts o;
	struct mrm m;
	struct ef_table t;
	struct ef_model mod;
	struct mr_fit f;
	const char *write, *name;
	double avar = 0;
	int forms, force, rc = -1, firstarg = 1;

	memset(&o, 0, sizeof o);
	mrm_init(&o.m);
	o.name = "fitted";
	if ((argc = opt_parse("fit", opts, OPT_N(opts), &o, argc, argv, e)) < 0)
		return -1;
	if (argc != 2)
		return sd_usage(e, "usage: setdose %s", cmd_fit.usage);
	if (o.forms && strcmp(o.forms, "all"))
		return sd_usage(e, "--forms wants 'all', not '%s'", o.forms);
	if (!*o.name || strlen(o.name) >= sizeof ((struct sd_profile *)0)->name)
		return sd_usage(e, "--name wants 1 to 63 characters");
	m = o.m;
	write = o.write;
	name = o.name;
	forms = o.forms != NULL;
	force = o.force;
	if (forms && write)
		return sd_usage(e, "--write needs one dose form; drop --forms all");
	if (mrm_load(&m, argv[firstarg], &t, &mod, e))
		return -1;
	if (forms) {
		rc = compare_forms(ctx, argv[firstarg], &m, &mod, e);
		goto done;
	}
	struct mr_opts fo = mrm_fit_opts(&m, ctx);
	if (mr_fit(&mod.d, &fo, &f, e)) {
		/* A fit that ran but did not converge is shown, then reported as a failure. */
		struct sd_err ignore;
		if (f.nstudy && !f.converged && ctx->opt.format == SD_FMT_TABLE &&
		    !fit_finite(argv[firstarg], &mod, &f, &ignore))
			print_fit(ctx, argv[firstarg], &m, &mod, &f);
		goto done;
	}
	/* The profile is written before anything is printed, so no result is shown for a
	 * write that then fails. */
	if (fit_finite(argv[firstarg], &mod, &f, e) ||
	    (write && write_profile(ctx, argv[firstarg], write, force, name, &m, &mod, &f, &avar, e)))
		goto done;
	print_fit(ctx, argv[firstarg], &m, &mod, &f);
	if (write)
		wrote_profile(ctx, write, &m, &mod, &f, avar);
	rc = 0;
done:
	ef_model_free(&mod);
	eft_free(&t);
	return rc;
}

const struct sd_cmd cmd_fit = {
	.name = "fit",
	.summary = "multilevel meta-regression of an effect-size table; compare dose forms",
	.usage = "fit [options] EFFECTS.csv\n"
		 "  (global --level sets the interval level; global --swc PCT the written\n"
		 "  profile's SWC, default 3%)",
	.flags = 0,
	.exec = exec_fit,
	.opts = opts,
	.nopts = OPT_N(opts),
};
