/* curve: the dose-response curve as a table and a terminal plot, optionally with a program's
 * muscles marked on it. */
#include <stddef.h>
#include <langinfo.h>
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include <cjson/cJSON.h>

#include "../core/audit.h"
#include "../io/audit_out.h"
#include "../io/jsonout.h"
#include "../io/program_io.h"
#include "../io/table.h"
#include "../plot/textplot.h"
#include "cmd.h"
#include "../io/jsonout.h"

extern const struct sd_cmd cmd_curve;

static int unicode_ok(void)
{
	const char *cs;

	tbl_locale();
	cs = nl_langinfo(CODESET);
	return cs && !strcmp(cs, "UTF-8");
}

static int print_table(struct sd_ctx *ctx, double step, struct sd_covars *cov, struct sd_err *e)
{
	static const char *const heads[] = { "sets", "gain%", "curve_lo", "curve_hi", "group_lo",
					     "group_hi", "athlete_lo", "athlete_hi", "+1set%",
					     "+1set_lo", "+1set_hi", "<zone" };
	const struct sd_profile *p = &ctx->profile;
	struct sd_table *t = tbl_new(12, heads);
	double plateau = curve_plateau(p, cov, 1.0);
	cJSON *arr = NULL;
	char note[240];
	int csv = ctx->opt.format == SD_FMT_CSV;

	if (!t)
		return sd_fail(e, "out of memory");
	if (ctx->opt.format == SD_FMT_JSON && !(arr = cJSON_CreateArray())) {
		tbl_free(t);
		return sd_fail(e, "out of memory");
	}
	curve_context_note(p, cov, note, sizeof note);
	/* The range is at most SD_DOSE_LIMIT wide and step at least 0.1: at most 2,001 rows. */
	int n = (int)((p->dose_max - p->dose_min) / step + 1e-9);
	for (int i = 0; i <= n; i++) {
		double x = p->dose_min + i * step;
		struct sd_point pt;
		struct sd_plus1 mg;
		curve_eval(p, cov, x, ctx->opt.level, &pt);
		curve_plus1(p, cov, x, ctx->opt.level, &mg);
		if (arr) {
			cJSON *o = cJSON_CreateObject();
			cJSON_AddNumberToObject(o, "sets", x);
			json_num(o, "lnrr", pt.y, 6);
			json_num(o, "gain_pct", curve_pct(pt.y), 4);
			json_bands(o, &pt, 4);
			json_num(o, "plus1_pct", mg.pct, 4);
			json_num(o, "plus1_low", mg.lo, 4);
			json_num(o, "plus1_high", mg.hi, 4);
			cJSON_AddStringToObject(o, "zone", zone_name(curve_zone(p, plateau, x)));
			cJSON_AddItemToArray(arr, o);
			continue;
		}
		tbl_row(t);
		tbl_set(t, 0, "%g", x);
		tbl_set(t, 1, csv ? "%.3f" : "%.1f", curve_pct(pt.y));
		tbl_set(t, 2, csv ? "%.3f" : "%.1f", curve_pct(pt.ci_lo));
		tbl_set(t, 3, csv ? "%.3f" : "%.1f", curve_pct(pt.ci_hi));
		tbl_set(t, 4, csv ? "%.3f" : "%.1f", curve_pct(pt.group_lo));
		tbl_set(t, 5, csv ? "%.3f" : "%.1f", curve_pct(pt.group_hi));
		tbl_set(t, 6, csv ? "%.3f" : "%.1f", curve_pct(pt.ath_lo));
		tbl_set(t, 7, csv ? "%.3f" : "%.1f", curve_pct(pt.ath_hi));
		tbl_set(t, 8, csv ? "%.4f" : "%.2f", mg.pct);
		tbl_set(t, 9, csv ? "%.4f" : "%.2f", mg.lo);
		tbl_set(t, 10, csv ? "%.4f" : "%.2f", mg.hi);
		tbl_set(t, 11, "%s", zone_name(curve_zone(p, plateau, x)));
	}
	if (arr) {
		cJSON *root = cJSON_CreateObject();
		json_profile(root, p);
		cJSON_AddStringToObject(root, "status", cov->trained >= 0.5 ? "trained" : "untrained");
		cJSON_AddNumberToObject(root, "weeks", cov->weeks);
		json_evidence(root, p, cov);
		cJSON_AddNumberToObject(root, "level", ctx->opt.level);
		cJSON_AddNumberToObject(root, "plateau", plateau);
		cJSON_AddStringToObject(root, "bands", aout_bands_legend);
		if (note[0])
			cJSON_AddStringToObject(root, "warning", note);
		cJSON_AddItemToObject(root, "points", arr);
		cJSON_AddStringToObject(root, "caution", aout_caution);
		char *s = json_print(root, 1);
		if (s)
			fprintf(ctx->out, "%s\n", s);
		free(s);
		cJSON_Delete(root);
	} else {
		if (ctx->opt.format == SD_FMT_TABLE)
			fprintf(ctx->out, "%s; %s, %g-week block; %.0f%% intervals; plateau at %g weekly "
				"fractional sets\n%s%s%s\n", p->name, cov->trained >= 0.5 ? "trained" :
				"untrained", cov->weeks, ctx->opt.level * 100, plateau,
				note[0] ? "warning: " : "", note, note[0] ? "\n" : "");
		tbl_print(t, ctx->out, csv);
		if (ctx->opt.format == SD_FMT_TABLE) {
			fputc('\n', ctx->out);
			aout_bands_text(ctx->out, (int)lround(ctx->opt.level * 100));
			fprintf(ctx->out, "+1set: percentage points one more weekly set adds on the "
				"average curve, with its interval.\n");
		}
	}
	tbl_free(t);
	return 0;
}

static int print_plot(struct sd_ctx *ctx, const struct sd_covars *cov, const char *program,
		      struct sd_err *e)
{
	struct sd_tplot *tp = tplot_new(61, 17);
	struct sd_program prog;
	int rc = 0, unicode = unicode_ok();

	if (!tp)
		return sd_fail(e, "out of memory");
	tplot_curve(tp, &ctx->profile, cov, ctx->opt.level, ctx->profile.dose_max);
	if (program) {
		struct sd_audit au;
		struct sd_audit_opts o = { ctx->opt.level, ctx->opt.max_rir, SD_SESSION_CAP };
		if (program_load(program, &ctx->lib, &prog, e)) {
			tplot_free(tp);
			return -1;
		}
		rc = audit_run(&prog, &ctx->lib, &ctx->profile, cov, &o, &au, e);
		if (!rc) {
			char letter = 'a';
			fprintf(ctx->out, "\nmarks (%s):", prog.name);
			for (int m = 0; m < SD_NMUSCLES; m++) {
				if (au.row[m].dose.fractional <= 0)
					continue;
				double x = au.row[m].dose.fractional;
				tplot_mark(tp, x > tp->x1 ? tp->x1 : x, curve_pct(au.row[m].pt.y), letter);
				fprintf(ctx->out, " %c=%s %.1f", letter, muscle_name(m), x);
				letter = letter == 'z' ? 'A' : (char)(letter + 1);
			}
			fputc('\n', ctx->out);
			audit_free(&au);
		}
		prog_free(&prog);
	}
	if (!rc) {
		fputc('\n', ctx->out);
		tplot_print(ctx->out, tp, unicode);
		fprintf(ctx->out, "%s mean   %s %.0f%% the average curve   %s %.0f%% a new group or "
			"study   %s %.0f%% one athlete\n", unicode ? "\u2588" : "#",
			unicode ? "\u2593" : "=", ctx->opt.level * 100, unicode ? "\u2592" : ":",
			ctx->opt.level * 100, unicode ? "\u2591" : ".", ctx->opt.level * 100);
	}
	tplot_free(tp);
	return rc;
}

struct curve_opts {
	const char *program;
	double step;
	int no_plot;
};

static const struct sd_optdef opts[] = {
	{ "program", OPT_STR, 0, 0, offsetof(struct curve_opts, program), NULL, "FILE",
	  "mark the program's muscles on the plot" },
	{ "step", OPT_NUM, 0.1, 10, offsetof(struct curve_opts, step), NULL, "SETS",
	  "table step in weekly fractional sets (default 1)" },
	{ "no-plot", OPT_FLAG, 0, 0, offsetof(struct curve_opts, no_plot), NULL, NULL, "the table only" },
};

static int exec_curve(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	struct curve_opts o = { NULL, 1, 0 };
	const char *program;
	double step;
	int plot;
	struct sd_covars cov;

	if ((argc = opt_parse("curve", opts, OPT_N(opts), &o, argc, argv, e)) < 0)
		return -1;
	if (argc > 1)
		return sd_usage(e, "curve takes no arguments besides options, got '%s'", argv[1]);
	program = o.program;
	step = o.step;
	plot = !o.no_plot;
	cov = app_covars(ctx, 0);
	if (program) {
		/* The program's own block length applies when --weeks is not given. */
		struct sd_program prog;
		if (program_load(program, &ctx->lib, &prog, e))
			return -1;
		cov = app_covars(ctx, prog.weeks);
		prog_free(&prog);
	}
	if (print_table(ctx, step, &cov, e))
		return -1;
	if (plot && ctx->opt.format == SD_FMT_TABLE && print_plot(ctx, &cov, program, e))
		return -1;
	cmd_print_caution(ctx);
	return 0;
}

const struct sd_cmd cmd_curve = {
	.name = "curve",
	.summary = "the dose-response curve with its three bands (curve, group, athlete)",
	.usage = "curve [--program FILE] [--step SETS] [--no-plot]",
	.flags = CMD_PROFILE | CMD_LIBRARY,
	.exec = exec_curve,
	.opts = opts,
	.nopts = OPT_N(opts),
};
