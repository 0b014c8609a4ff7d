/* curve: the dose-response curve as a table and a terminal plot, optionally with a program's
 * muscles marked on it. */
#include <getopt.h>
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
#include "../io/wrap.h"
#include "cmd.h"

extern const struct sd_cmd cmd_curve;

static int unicode_ok(void)
{
	const char *cs;

	tbl_locale();
	cs = nl_langinfo(CODESET);
	return cs && !strcmp(cs, "UTF-8");
}

static int print_table(struct sd_ctx *ctx, double step, struct sd_covars *cov, int wide,
		       struct sd_err *e)
{
	const struct sd_profile *p = &ctx->profile;
	struct sd_table *t = aout_gain_table("sets", 1);
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
		int c = aout_gain_cells(t, 1, &pt, &mg, csv);
		tbl_set(t, c, "%s", zone_name(curve_zone(p, plateau, x)));
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
		if (ctx->opt.format == SD_FMT_TABLE) {
			wrap_printf(ctx->out, 2, "%s; %s, %g-week block; %.0f%% intervals; plateau at "
				    "%g weekly fractional sets", p->name, cov->trained >= 0.5 ?
				    "trained" : "untrained", cov->weeks, ctx->opt.level * 100, plateau);
			if (note[0])
				wrap_printf(ctx->out, 9, "warning: %s", note);
			fputc('\n', ctx->out);
		}
		tbl_print(t, ctx->out, tbl_mode(csv, wide));
		if (ctx->opt.format == SD_FMT_TABLE) {
			fputc('\n', ctx->out);
			aout_bands_text(ctx->out, (int)lround(ctx->opt.level * 100));
			aout_plus1_text(ctx->out);
			if (!wide)
				wrap_printf(ctx->out, 2, "--wide adds the group interval and the +1set "
					    "interval.");
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
			char letter = 'a', marks[SD_NMUSCLES * 40];
			size_t len = 0;
			for (int m = 0; m < SD_NMUSCLES; m++) {
				if (au.row[m].dose.fractional <= 0)
					continue;
				double x = au.row[m].dose.fractional;
				tplot_mark(tp, x > tp->x1 ? tp->x1 : x, curve_pct(au.row[m].pt.y), letter);
				len += (size_t)snprintf(marks + len, sizeof marks - len, " %c=%s %.1f",
							letter, muscle_name(m), x);
				letter = letter == 'z' ? 'A' : (char)(letter + 1);
			}
			fputc('\n', ctx->out);
			wrap_printf(ctx->out, 2, "marks (%s):%s", prog.name, marks);
			audit_free(&au);
		}
		prog_free(&prog);
	}
	if (!rc) {
		fputc('\n', ctx->out);
		tplot_print(ctx->out, tp, unicode);
		wrap_printf(ctx->out, 2, "%s mean  %s %.0f%% the average curve  %s %.0f%% a new "
			    "group or study  %s %.0f%% one athlete", unicode ? "\u2588" : "#",
			unicode ? "\u2593" : "=", ctx->opt.level * 100, unicode ? "\u2592" : ":",
			ctx->opt.level * 100, unicode ? "\u2591" : ".", ctx->opt.level * 100);
	}
	tplot_free(tp);
	return rc;
}

static int exec_curve(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	static const struct option longopts[] = {
		{ "program", required_argument, NULL, 'p' },
		{ "step", required_argument, NULL, 's' },
		{ "no-plot", no_argument, NULL, 'n' },
		{ "wide", no_argument, NULL, 'w' },
		{ NULL, 0, NULL, 0 },
	};
	const char *program = NULL;
	double step = 1;
	int c, plot = 1, wide = 0;
	char *end;
	struct sd_covars cov;

	optind = 0;
	while ((c = getopt_long(argc, argv, "+", longopts, NULL)) != -1) {
		switch (c) {
		case 'p':
			program = optarg;
			break;
		case 's':
			step = strtod(optarg, &end);
			if (end == optarg || *end || !(step >= 0.1 && step <= 10))
				return sd_usage(e, "--step wants a number from 0.1 to 10, not '%s'", optarg);
			break;
		case 'n':
			plot = 0;
			break;
		case 'w':
			wide = 1;
			break;
		default:
			return sd_usage(e, "usage: setdose %s", cmd_curve.usage);
		}
	}
	if (optind < argc)
		return sd_usage(e, "curve takes no arguments besides options, got '%s'", argv[optind]);
	cov = cmd_covars(ctx, 0);
	if (program) {
		/* The program's own block length applies when --weeks is not given. */
		struct sd_program prog;
		if (program_load(program, &ctx->lib, &prog, e))
			return -1;
		cov = cmd_covars(ctx, prog.weeks);
		prog_free(&prog);
	}
	if (print_table(ctx, step, &cov, wide, e))
		return -1;
	if (plot && ctx->opt.format == SD_FMT_TABLE && print_plot(ctx, &cov, program, e))
		return -1;
	cmd_print_caution(ctx);
	return 0;
}

const struct sd_cmd cmd_curve = {
	.name = "curve",
	.summary = "the dose-response curve with its three bands (curve, group, athlete)",
	.usage = "curve [--program FILE] [--step SETS] [--no-plot] [--wide]\n"
		 "  --program FILE  mark the program's muscles on the plot\n"
		 "  --step SETS     table step in weekly fractional sets (default 1)\n"
		 "  --no-plot       the table only\n"
		 "  --wide          every column: adds the group and +1set intervals (the default\n"
		 "                  table fits 80 columns)",
	.flags = CMD_PROFILE | CMD_LIBRARY,
	.exec = exec_curve,
};
