/* chart: the curve, the per-muscle chart, the compare chart or the returns heat map, as PNG,
 * SVG or PDF (cairo, in the chart module). */
#include <stddef.h>
#include <stdlib.h>
#include <string.h>

#include "../app/progarg.h"
#include "../core/audit.h"
#include "../io/safefile.h"
#include "chartcmd.h"
#include "cmd.h"

extern const struct sd_cmd cmd_chart;

struct chart_opts {
	const char *out, *program, *against, *kind;
	int force;
};

#define CO(f) offsetof(struct chart_opts, f)
static const struct sd_optdef chart_opts[] = {
	{ "out", OPT_STR, 0, 0, CO(out), NULL, "FILE",
	  "the picture; its extension (.png, .svg, .pdf) picks the format" },
	{ "kind", OPT_STR, 0, 0, CO(kind), NULL, "KIND",
	  "curve (default), muscles, compare or returns" },
	{ "program", OPT_STR, 0, 0, CO(program), NULL, "PROGRAM",
	  "a program file or stored template: its muscles at their weekly doses" },
	{ "against", OPT_STR, 0, 0, CO(against), NULL, "PROGRAM",
	  "compare: the program (B) set against --program (A)" },
	{ "force", OPT_FLAG, 0, 0, CO(force), NULL, NULL, "replace an existing FILE" },
};
#undef CO

struct chart_layout *chartcmd_layout(void)
{
	const char *on = getenv("SETDOSE_TEST_LAYOUT");
	struct chart_layout *l;
	if (!on || !*on || !(l = calloc(1, sizeof *l)))
		return NULL;
	l->cap = 20000;
	if (!(l->box = calloc((size_t)l->cap, sizeof *l->box))) {
		free(l);
		return NULL;
	}
	return l;
}

void chartcmd_layout_done(struct chart_layout *l, int rc)
{
	static const char *const kinds[BOX_NKINDS] = { "label", "mark", "obstacle", "text", "content" };
	if (!l)
		return;
	if (!rc) {
		fprintf(stderr, "layout %.2f %.2f %d %d\n", l->page_w, l->page_h, l->pages, l->dropped);
		for (int i = 0; i < l->n; i++) {
			const struct chart_box *b = &l->box[i];
			fprintf(stderr, "box %d %d %s %.2f %.2f %.2f %.2f %.2f %s\n", b->page, b->group,
				kinds[b->kind], b->x, b->y, b->w, b->h, b->size, b->text);
		}
	}
	free(l->box);
	free(l);
}

int chartcmd_draw(const char *out, int force, const struct sd_chart *c, const struct sd_report *r,
		  struct sd_err *e)
{
	struct sf_file sf;

	if (sf_open(&sf, out, force, e))
		return -1;
	return sf_finish(&sf, c ? chart_write(out, c, sf_sink, &sf, e) :
			 report_write(out, r, sf_sink, &sf, e), e);
}

static int exec_chart(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	struct progarg pa = { NULL };
	struct sd_program prog[2];
	struct sd_audit au[2];
	struct sd_audit_opts o = { ctx->opt.level, ctx->opt.max_rir, SD_SESSION_CAP };
	struct sd_chart c = { CHART_CURVE, &ctx->profile, app_covars(ctx, 0), ctx->opt.level, NULL,
			      NULL, NULL, NULL, NULL, NULL, 0, NULL, 0 };
	struct chart_opts co;
	int rc = -1, loaded = 0, audited = 0, kind;

	memset(&co, 0, sizeof co);
	if ((argc = opt_parse("chart", chart_opts, OPT_N(chart_opts), &co, argc, argv, e)) < 0)
		return -1;
	if (argc > 1)
		return sd_usage(e, "chart takes no arguments besides options, got '%s'", argv[1]);
	if (!co.out)
		return sd_usage(e, "chart needs --out FILE (usage: setdose %s)", cmd_chart.usage);
	if (!chart_format_ok(co.out))
		return sd_usage(e, "cannot tell the chart format of '%s': name it .png, .svg or .pdf",
				co.out);
	if ((kind = co.kind ? chart_kind_find(co.kind) : CHART_CURVE) < 0)
		return sd_usage(e, "unknown chart kind '%s': use curve, muscles, compare or returns",
				co.kind);
	c.kind = (enum chart_kind)kind;
	if ((c.kind == CHART_MUSCLES || c.kind == CHART_COMPARE) && !co.program)
		return sd_usage(e, "chart --kind %s needs --program PROGRAM", co.kind);
	if (c.kind == CHART_COMPARE && !co.against)
		return sd_usage(e, "chart --kind compare needs --against PROGRAM (B, set against A)");
	if (co.against && c.kind != CHART_COMPARE)
		return sd_usage(e, "--against belongs to chart --kind compare");
	if (co.program && c.kind == CHART_RETURNS)
		return sd_usage(e, "the returns chart is the curve's alone: it takes no --program");

	const char *args[2] = { co.program, co.against };
	for (; loaded < 2 && args[loaded]; loaded++)
		if (progarg_load(ctx, &pa, args[loaded], &prog[loaded], e))
			goto out;
	if (loaded)
		c.cov = app_covars(ctx, prog[0].weeks);
	/* Both programs of a compare are audited in one athlete context, as compare does. */
	for (; audited < loaded; audited++)
		if (audit_run(&prog[audited], &ctx->lib, &ctx->profile, &c.cov, &o, &au[audited], e))
			goto out;
	if (loaded) {
		c.audit = &au[0];
		c.title = prog[0].name;
		c.name_a = prog[0].name;
	}
	if (loaded > 1) {
		c.other = &au[1];
		c.name_b = prog[1].name;
	}
	c.layout = chartcmd_layout();
	rc = chartcmd_draw(co.out, co.force, &c, NULL, e);
	chartcmd_layout_done(c.layout, rc);
	if (!rc)
		fprintf(ctx->out, "wrote %s (%s chart)\n", co.out, chart_kind_name(c.kind));
out:
	for (int i = 0; i < audited; i++)
		audit_free(&au[i]);
	for (int i = 0; i < loaded; i++)
		prog_free(&prog[i]);
	progarg_close(&pa);
	return rc;
}

const struct sd_cmd cmd_chart = {
	.name = "chart",
	.summary = "draw the curve, a program's muscles, a comparison or the returns grid",
	.usage = "chart --out FILE.png|svg|pdf [--kind curve|muscles|compare|returns] "
		 "[--program PROGRAM [--against PROGRAM]] [--force]",
	.flags = CMD_PROFILE | CMD_LIBRARY,
	.exec = exec_chart,
	.opts = chart_opts,
	.nopts = OPT_N(chart_opts),
};
