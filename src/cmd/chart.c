/* chart and report: the curve as a picture, and a printable per-program report (cairo). */
#include <stddef.h>
#include <stdlib.h>
#include <string.h>

#include "../core/audit.h"
#include "../io/program_io.h"
#include "../io/safefile.h"
#include "../plot/chart.h"
#include "cmd.h"

extern const struct sd_cmd cmd_chart, cmd_report;

struct chart_opts {
	const char *out, *program;
	int force;
};

#define CO(f) offsetof(struct chart_opts, f)
static const struct sd_optdef chart_opts[] = {
	{ "out", OPT_STR, 0, 0, CO(out), NULL, "FILE",
	  "the picture; its extension (.png, .svg, .pdf) picks the format" },
	{ "program", OPT_STR, 0, 0, CO(program), NULL, "FILE",
	  "mark the program's muscles at their weekly doses" },
	{ "force", OPT_FLAG, 0, 0, CO(force), NULL, NULL, "replace an existing FILE" },
};
static const struct sd_optdef report_opts[] = {
	{ "out", OPT_STR, 0, 0, CO(out), NULL, "FILE.pdf", "the report; one A4 page per program" },
	{ "force", OPT_FLAG, 0, 0, CO(force), NULL, NULL, "replace an existing FILE.pdf" },
};
#undef CO

/* The options of chart or report; the arguments are left in argv[1..], *argc their count + 1. */
static int parse(int *argc, char **argv, struct chart_opts *o, const struct sd_cmd *self,
		 struct sd_err *e)
{
	memset(o, 0, sizeof *o);
	if ((*argc = opt_parse(self->name, self->opts, self->nopts, o, *argc, argv, e)) < 0)
		return -1;
	if (!o->out)
		return sd_usage(e, "%s needs --out FILE (usage: setdose %s)", self->name, self->usage);
	return 0;
}

/* Draws into a temporary file put in place only once complete (io/safefile.h). */
static int draw_to(const char *out, int force, const struct sd_chart *c,
		   const struct sd_audit_info *info, int n, struct sd_err *e)
{
	struct sf_file sf;

	if (sf_open(&sf, out, force, e))
		return -1;
	return sf_finish(&sf, c ? chart_write(out, c, sf_sink, &sf, e) :
			 report_write(out, info, n, sf_sink, &sf, e), e);
}

static int exec_chart(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	const char *out = NULL, *program = NULL;
	struct sd_program prog;
	struct sd_audit au;
	struct sd_audit_opts o = { ctx->opt.level, ctx->opt.max_rir, SD_SESSION_CAP };
	struct sd_chart c = { &ctx->profile, app_covars(ctx, 0), ctx->opt.level, NULL, NULL };
	struct chart_opts co;
	int rc, force;

	if (parse(&argc, argv, &co, &cmd_chart, e))
		return -1;
	if (argc > 1)
		return sd_usage(e, "chart takes no arguments besides options, got '%s'", argv[1]);
	out = co.out;
	program = co.program;
	force = co.force;
	if (!chart_format_ok(out))
		return sd_usage(e, "cannot tell the chart format of '%s': name it .png, .svg or .pdf", out);
	if (!program) {
		if (draw_to(out, force, &c, NULL, 0, e))
			return -1;
		fprintf(ctx->out, "wrote %s\n", out);
		return 0;
	}
	if (program_load(program, &ctx->lib, &prog, e))
		return -1;
	c.cov = app_covars(ctx, prog.weeks);
	rc = audit_run(&prog, &ctx->lib, &ctx->profile, &c.cov, &o, &au, e);
	if (!rc) {
		c.audit = &au;
		c.title = prog.name;
		rc = draw_to(out, force, &c, NULL, 0, e);
		audit_free(&au);
	}
	prog_free(&prog);
	if (!rc)
		fprintf(ctx->out, "wrote %s\n", out);
	return rc;
}

static int exec_report(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	const char *out = NULL;
	struct sd_audit_opts o = { ctx->opt.level, ctx->opt.max_rir, SD_SESSION_CAP };
	struct sd_program *progs;
	struct sd_audit *audits;
	struct sd_audit_info *info;
	struct chart_opts co;
	int n, done = 0, rc = -1, force;

	if (parse(&argc, argv, &co, &cmd_report, e))
		return -1;
	out = co.out;
	force = co.force;
	n = argc - 1;
	if (n < 1)
		return sd_usage(e, "report needs at least one PROGRAM file (usage: setdose %s)",
				cmd_report.usage);
	if (n > 200)
		return sd_usage(e, "report takes at most 200 programs, got %d", n);
	progs = calloc((size_t)n, sizeof *progs);
	audits = calloc((size_t)n, sizeof *audits);
	info = calloc((size_t)n, sizeof *info);
	if (!progs || !audits || !info) {
		sd_fail(e, "out of memory");
		goto out;
	}
	for (; done < n; done++) {
		const char *path = argv[1 + done];
		if (program_load(path, &ctx->lib, &progs[done], e))
			goto out;
		struct sd_covars cov = app_covars(ctx, progs[done].weeks);
		if (audit_run(&progs[done], &ctx->lib, &ctx->profile, &cov, &o, &audits[done], e)) {
			prog_free(&progs[done]);
			goto out;
		}
		info[done] = (struct sd_audit_info){ .label = path, .prog = &progs[done],
						     .prof = &ctx->profile, .audit = &audits[done] };
	}
	rc = draw_to(out, force, NULL, info, n, e);
	if (!rc)
		fprintf(ctx->out, "wrote %s (%d page%s)\n", out, n, n == 1 ? "" : "s");
out:
	for (int i = 0; i < done; i++) {
		audit_free(&audits[i]);
		prog_free(&progs[i]);
	}
	free(progs);
	free(audits);
	free(info);
	return rc;
}

const struct sd_cmd cmd_chart = {
	.name = "chart",
	.summary = "draw the curve (and a program's muscles) to PNG, SVG or PDF",
	.usage = "chart --out FILE.png|svg|pdf [--program FILE] [--force]",
	.flags = CMD_PROFILE | CMD_LIBRARY,
	.exec = exec_chart,
	.opts = chart_opts,
	.nopts = OPT_N(chart_opts),
};

const struct sd_cmd cmd_report = {
	.name = "report",
	.summary = "a printable PDF report: one page per program with table and chart",
	.usage = "report --out FILE.pdf [--force] PROGRAM...",
	.flags = CMD_PROFILE | CMD_LIBRARY,
	.exec = exec_report,
	.opts = report_opts,
	.nopts = OPT_N(report_opts),
};
