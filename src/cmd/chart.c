/* chart and report: the curve as a picture, and a printable per-program report (cairo). */
#include <getopt.h>
#include <stdlib.h>
#include <string.h>

#include "../core/audit.h"
#include "../io/program_io.h"
#include "../io/safefile.h"
#include "../plot/chart.h"
#include "cmd.h"

extern const struct sd_cmd cmd_chart, cmd_report;

static int parse(int argc, char **argv, const char **out, const char **program, int *force,
		 const struct sd_cmd *self, struct sd_err *e)
{
	static const struct option longopts[] = {
		{ "out", required_argument, NULL, 'o' },
		{ "program", required_argument, NULL, 'p' },
		{ "force", no_argument, NULL, 'f' },
		{ NULL, 0, NULL, 0 },
	};
	int c;
	optind = 0;
	while ((c = getopt_long(argc, argv, "+o:", longopts, NULL)) != -1) {
		if (c == 'o')
			*out = optarg;
		else if (c == 'f')
			*force = 1;
		else if (c == 'p' && program)
			*program = optarg;
		else
			return sd_usage(e, "usage: setdose %s", self->usage);
	}
	if (!*out)
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
	struct sd_chart c = { &ctx->profile, cmd_covars(ctx, 0), ctx->opt.level, NULL, NULL };
	int rc, force = 0;

	if (parse(argc, argv, &out, &program, &force, &cmd_chart, e))
		return -1;
	if (optind < argc)
		return sd_usage(e, "chart takes no arguments besides options, got '%s'", argv[optind]);
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
	c.cov = cmd_covars(ctx, prog.weeks);
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
	int n, done = 0, rc = -1, force = 0;

	if (parse(argc, argv, &out, NULL, &force, &cmd_report, e))
		return -1;
	n = argc - optind;
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
		const char *path = argv[optind + done];
		if (program_load(path, &ctx->lib, &progs[done], e))
			goto out;
		struct sd_covars cov = cmd_covars(ctx, progs[done].weeks);
		if (audit_run(&progs[done], &ctx->lib, &ctx->profile, &cov, &o, &audits[done], e)) {
			prog_free(&progs[done]);
			goto out;
		}
		info[done] = (struct sd_audit_info){ path, &progs[done], &ctx->profile, &audits[done], NULL, 0, NULL, 0 };
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
	.usage = "chart --out FILE.png|svg|pdf [--program FILE] [--force]\n"
		 "  --out FILE      the picture; its extension picks the format\n"
		 "  --program FILE  mark the program's muscles at their weekly doses\n"
		 "  --force         replace an existing FILE",
	.flags = CMD_PROFILE | CMD_LIBRARY,
	.exec = exec_chart,
};

const struct sd_cmd cmd_report = {
	.name = "report",
	.summary = "a printable PDF report: one page per program with table and chart",
	.usage = "report --out FILE.pdf [--force] PROGRAM...\n"
		 "  --out FILE.pdf  the report; one A4 page per program\n"
		 "  --force         replace an existing FILE.pdf",
	.flags = CMD_PROFILE | CMD_LIBRARY,
	.exec = exec_report,
};
