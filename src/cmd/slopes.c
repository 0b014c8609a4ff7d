/* slopes: each study's raw within-study dose slope beside its shrunken (empirical-Bayes)
 * slope from the random-slope model, with a terminal picture of both sets of lines. */
#include <stddef.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>


#include "../io/table.h"
#include "../io/fit_out.h"
#include "mrmodel.h"

extern const struct sd_cmd cmd_slopes;

#define PW 60   /* plot width and height in cells */
#define PH 14

/* What the picture needs per study besides the BLUPs: its dose range and the fixed part of
 * its line apart from the dose term (its own moderator values). */
struct line {
	double lo, hi, base;
};

static int study_lines(const struct ef_model *mod, const struct mr_fit *f, struct line *ln,
		       double *pooled_base)
{
	int p = mod->d.p;
	for (int s = 0; s < mod->nstudy; s++)
		ln[s].lo = INFINITY, ln[s].hi = -INFINITY, ln[s].base = NAN;
	*pooled_base = f->beta[0];
	for (int k = 2; k < p; k++) {
		double mean = 0;
		for (int i = 0; i < mod->d.n; i++)
			mean += mod->X[(size_t)i * p + k];
		*pooled_base += f->beta[k] * mean / mod->d.n;
	}
	for (int i = 0; i < mod->d.n; i++) {
		struct line *l = &ln[mod->study[i]];
		l->lo = fmin(l->lo, mod->dose[i]);
		l->hi = fmax(l->hi, mod->dose[i]);
		if (isnan(l->base)) {
			l->base = f->beta[0];
			for (int k = 2; k < p; k++)
				l->base += f->beta[k] * mod->X[(size_t)i * p + k];
		}
	}
	return 0;
}

/* The x range rounded up to a multiple of 6, so the 6 axis ticks fall on whole sets. */
static double plot_xmax(const struct ef_model *mod)
{
	return 6 * ceil(mod->dose_max / 6);
}

static double pct(double y)
{
	return 100 * expm1(y);
}

/* One panel: every study's line (raw or shrunken) over its own dose range, the pooled curve
 * over the whole range. Cells count how many study lines cross them. */
static void panel(FILE *out, const char *title, const struct ef_model *mod,
		  const struct mr_fit *f, const struct mr_study *st, const struct line *ln,
		  double pooled_base, int raw, double y0, double y1)
{
	unsigned char cnt[PH][PW];
	char pooled[PH][PW];
	double x1 = plot_xmax(mod);

	memset(cnt, 0, sizeof cnt);
	memset(pooled, 0, sizeof pooled);
	for (int c = 0; c < PW; c++) {
		double x = x1 * (c + 0.5) / PW, fx = form_f(mod->form, x);
		for (int s = 0; s < mod->nstudy; s++) {
			double y;
			if (x < ln[s].lo - x1 / PW / 2 || x > ln[s].hi + x1 / PW / 2)
				continue;
			if (raw) {
				if (!st[s].raw_ok)
					continue;
				y = st[s].raw_a + st[s].raw_b * fx;
			} else
				y = ln[s].base + st[s].u0 + (f->beta[1] + st[s].u1) * fx;
			int r = (int)((y1 - pct(y)) / (y1 - y0) * PH);
			if (r >= 0 && r < PH && cnt[r][c] < 255)
				cnt[r][c]++;
		}
		int r = (int)((y1 - pct(pooled_base + f->beta[1] * fx)) / (y1 - y0) * PH);
		if (r >= 0 && r < PH)
			pooled[r][c] = 1;
	}
	fprintf(out, "\n%s\n", title);
	for (int r = 0; r < PH; r++) {
		double yv = y1 - (r + 0.5) * (y1 - y0) / PH;
		if (r == 0 || r == PH - 1 || r == PH / 2)
			fprintf(out, "%7.1f%% |", yv);
		else
			fprintf(out, "%9s|", "");
		for (int c = 0; c < PW; c++)
			fputc(pooled[r][c] ? '#' : cnt[r][c] >= 4 ? '*' : cnt[r][c] >= 2 ? ':' :
			      cnt[r][c] ? '.' : ' ', out);
		fputc('\n', out);
	}
	fprintf(out, "%9s+", "");
	for (int c = 0; c < PW; c++)
		fputc(c % 10 == 0 ? '+' : '-', out);
	fprintf(out, "\n%9s", "");
	for (int c = 0; c < PW; c += 10)
		fprintf(out, "%-10g", x1 * c / PW);
	fprintf(out, "weekly sets\n");
}

static void picture(FILE *out, const struct ef_model *mod, const struct mr_fit *f,
		    const struct mr_study *st)
{
	struct line *ln = calloc(mod->nstudy, sizeof *ln);
	double pb, y0 = INFINITY, y1 = -INFINITY;

	if (!ln)
		return;
	study_lines(mod, f, ln, &pb);
	/* The y range covers the shrunken lines, the pooled curve and the raw lines, trimmed to
	 * the effects' own range so one wild two-dose study does not flatten the rest. */
	double elo = INFINITY, ehi = -INFINITY;
	for (int i = 0; i < mod->d.n; i++) {
		elo = fmin(elo, pct(mod->y[i]));
		ehi = fmax(ehi, pct(mod->y[i]));
	}
	for (int c = 0; c <= PW; c++) {
		double x = plot_xmax(mod) * c / PW, fx = form_f(mod->form, x);
		double yp = pct(pb + f->beta[1] * fx);
		y0 = fmin(y0, yp);
		y1 = fmax(y1, yp);
		for (int s = 0; s < mod->nstudy; s++) {
			if (x < ln[s].lo || x > ln[s].hi)
				continue;
			double y = pct(ln[s].base + st[s].u0 + (f->beta[1] + st[s].u1) * fx);
			y0 = fmin(y0, y);
			y1 = fmax(y1, y);
		}
	}
	y0 = fmin(y0, elo);
	y1 = fmax(y1, ehi);
	if (!(y1 > y0))
		y1 = y0 + 1;
	panel(out, "raw within-study lines (weighted fit inside each study with >= 2 doses)", mod,
	      f, st, ln, pb, 1, y0, y1);
	panel(out, "shrunken study lines (empirical Bayes, random-slope model)", mod, f, st, ln,
	      pb, 0, y0, y1);
	fprintf(out, "\n# pooled curve (moderators at their means)   . one study line   : 2-3   "
		"* 4 or more\n");
	free(ln);
}

static void print_table(struct sd_ctx *ctx, const struct ef_model *mod, const struct mr_fit *f,
			const struct mr_study *st)
{
	static const char *const heads[] = { "<study", "effects", "doses", "weight%", "raw_slope",
					     "raw_se", "shrunk_slope", "blup_slope", "blup_se",
					     "blup_intercept" };
	struct sd_table *t = tbl_new(10, heads);
	int csv = ctx->opt.format == SD_FMT_CSV;
	const char *g = csv ? "%.10g" : "%.4f";

	if (!t)
		return;
	for (int s = 0; s < f->nstudy; s++) {
		tbl_row(t);
		tbl_set(t, 0, "%s", mod->study_name[st[s].id]);
		tbl_set(t, 1, "%d", st[s].k);
		tbl_set(t, 2, "%d", st[s].ndose);
		tbl_set(t, 3, csv ? "%.10g" : "%.1f", st[s].weight);
		if (st[s].raw_ok) {
			tbl_set(t, 4, g, st[s].raw_b);
			tbl_set(t, 5, g, st[s].raw_se_b);
		} else if (!csv) {
			tbl_set(t, 4, "-");
			tbl_set(t, 5, "-");
		}
		tbl_set(t, 6, g, f->beta[1] + st[s].u1);
		tbl_set(t, 7, g, st[s].u1);
		tbl_set(t, 8, g, st[s].se_u1);
		tbl_set(t, 9, g, st[s].u0);
	}
	tbl_print(t, ctx->out, csv);
	tbl_free(t);
}

struct slopes_opts {
	struct mrm m;            /* first: the shared model options fill it (mrmodel.h) */
	int no_plot;
};

static const struct sd_optdef opts[] = {
	MRM_OPTDEFS,
	{ "no-plot", OPT_FLAG, 0, 0, offsetof(struct slopes_opts, no_plot), NULL, NULL,
	  "the table only" },
};

static int exec_slopes(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	struct slopes_opts o;
	struct mrm m;
	struct ef_table t;
	struct ef_model mod;
	struct mr_fit f;
	struct mr_study *st = NULL;
	int plot, rc = -1, firstarg = 1;
	char desc[768];

	memset(&o, 0, sizeof o);
	mrm_init(&o.m);
	if ((argc = opt_parse("slopes", opts, OPT_N(opts), &o, argc, argv, e)) < 0)
		return -1;
	if (argc != 2)
		return sd_usage(e, "usage: setdose %s", cmd_slopes.usage);
	m = o.m;
	plot = !o.no_plot;
	m.spec.slopes = 1;
	if (mrm_load(&m, argv[firstarg], &t, &mod, e))
		return -1;
	struct mr_opts fo = mrm_fit_opts(&m, ctx);
	if (mr_fit(&mod.d, &fo, &f, e))
		goto done;
	if (!(st = calloc(f.nstudy, sizeof *st))) {
		sd_fail(e, "out of memory");
		goto done;
	}
	if (mr_studies(&mod.d, &f, st, e))
		goto done;
	if (ctx->opt.format == SD_FMT_JSON) {
		slopes_json(ctx->out, &mod, &f, st);
	} else if (ctx->opt.format == SD_FMT_CSV) {
		print_table(ctx, &mod, &f, st);
	} else {
		char rho[32] = "undefined";
		if (!isnan(f.rho))
			snprintf(rho, sizeof rho, "%.3f", f.rho);
		mrm_describe(&m, desc, sizeof desc);
		fprintf(ctx->out, "study dose slopes in '%s': %d effects in %d studies\nmodel: %s\n"
			"pooled dose slope %.4f (SE %.4f); slope sd %.4f; intercept-slope correlation "
			"%s\nslopes are per unit of the dose term f(sets) (%s form); weight = share of "
			"1'V^-1 1\n\n", argv[firstarg], f.n, f.nstudy, desc, f.beta[1], f.se[1],
			sqrt(f.tau2_slope), rho, form_name(mod.form));
		print_table(ctx, &mod, &f, st);
		if (plot)
			picture(ctx->out, &mod, &f, st);
	}
	rc = 0;
done:
	free(st);
	ef_model_free(&mod);
	eft_free(&t);
	return rc;
}

const struct sd_cmd cmd_slopes = {
	.name = "slopes",
	.summary = "raw and shrunken study dose slopes from the random-slope model",
	.usage = "slopes [options] EFFECTS.csv\n"
		 "  (the random-slope model is always fitted: --slopes is implied; global --level\n"
		 "  sets the interval level)",
	.flags = 0,
	.exec = exec_slopes,
	.opts = opts,
	.nopts = OPT_N(opts),
};
