/* curve: the dose-response curve as a table and a terminal plot, optionally with a program's
 * muscles marked on it. */
#include <stddef.h>
#include <langinfo.h>
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "../core/audit.h"
#include "../io/audit_out.h"
#include "../io/program_io.h"
#include "../io/curve_out.h"
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

_Static_assert((int)CURVE_TABLE == (int)SD_FMT_TABLE && (int)CURVE_CSV == (int)SD_FMT_CSV &&
	       (int)CURVE_JSON == (int)SD_FMT_JSON, "curve formats follow SD_FMT_*");

struct curve_opts {
	const char *program;
	double step;
	int no_plot, wide;
};

static const struct sd_optdef opts[] = {
	{ "program", OPT_STR, 0, 0, offsetof(struct curve_opts, program), NULL, "FILE",
	  "mark the program's muscles on the plot" },
	{ "step", OPT_NUM, 0.1, 10, offsetof(struct curve_opts, step), NULL, "SETS",
	  "table step in weekly fractional sets (default 1)" },
	{ "no-plot", OPT_FLAG, 0, 0, offsetof(struct curve_opts, no_plot), NULL, NULL, "the table only" },
	{ "wide", OPT_FLAG, 0, 0, offsetof(struct curve_opts, wide), NULL, NULL,
	  "every column: adds the group and +1set intervals (the default\n"
	  "table fits 80 columns)" },
};

static int exec_curve(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	struct curve_opts o = { NULL, 1, 0, 0 };
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
	if (curve_out_print(ctx->out, &ctx->profile, &cov, ctx->opt.level, step, o.wide,
			    ctx->opt.format))
		return sd_fail(e, "out of memory");
	if (plot && ctx->opt.format == SD_FMT_TABLE && print_plot(ctx, &cov, program, e))
		return -1;
	cmd_print_caution(ctx);
	return 0;
}

const struct sd_cmd cmd_curve = {
	.name = "curve",
	.summary = "the dose-response curve with its three bands (curve, group, athlete)",
	.usage = "curve [--program FILE] [--step SETS] [--no-plot] [--wide]",
	.flags = CMD_PROFILE | CMD_LIBRARY,
	.exec = exec_curve,
	.opts = opts,
	.nopts = OPT_N(opts),
};
