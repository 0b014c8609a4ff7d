/* returns: what moving from a to b weekly fractional sets buys, for a grid of doses, and the
 * practical plateau. */
#include <stddef.h>
#include <stdlib.h>
#include <string.h>

#include "../io/returns_out.h"
#include "cmd.h"

extern const struct sd_cmd cmd_returns;

#define MAX_DOSES RET_MAX_DOSES

_Static_assert((int)RET_TABLE == (int)SD_FMT_TABLE && (int)RET_CSV == (int)SD_FMT_CSV &&
	       (int)RET_JSON == (int)SD_FMT_JSON, "returns formats follow SD_FMT_*");

static int parse_doses(const char *s, double *d, int *n, double max, struct sd_err *e)
{
	char buf[512], *end;
	*n = 0;
	snprintf(buf, sizeof buf, "%s", s);
	for (char *tok = strtok(buf, ","); tok; tok = strtok(NULL, ",")) {
		if (*n == MAX_DOSES)
			return sd_usage(e, "--doses takes at most %d values", MAX_DOSES);
		double v = strtod(tok, &end);
		if (end == tok || *end || !(v >= 0 && v <= 2 * max))
			return sd_usage(e, "--doses wants numbers from 0 to %g, not '%s'", 2 * max, tok);
		if (*n && v <= d[*n - 1])
			return sd_usage(e, "--doses must increase ('%s')", tok);
		d[(*n)++] = v;
	}
	if (*n < 2)
		return sd_usage(e, "--doses needs at least two values");
	return 0;
}

struct returns_opts {
	const char *doses;
	int wide;
};

static const struct sd_optdef opts[] = {
	{ "doses", OPT_STR, 0, 0, offsetof(struct returns_opts, doses), NULL, "LIST",
	  "weekly fractional sets to compare, A,B,... (default 0,1,...,30 in steps)" },
	{ "wide", OPT_FLAG, 0, 0, offsetof(struct returns_opts, wide), NULL, NULL,
	  "the grid in one piece (by default, panels of at most the\n"
	  "terminal's width, 80 columns when not a terminal)" },
};

static int exec_returns(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	static const double dflt[] = { 0, 1, 2, 3, 4, 5, 6, 8, 10, 12, 15, 20, 25, 30 };
	double d[MAX_DOSES];
	int n = 0;
	struct returns_opts o = { NULL, 0 };
	const struct sd_profile *p = &ctx->profile;
	struct sd_covars cov = app_covars(ctx, 0);
	double plateau = curve_plateau(p, &cov, 1.0);

	if ((argc = opt_parse("returns", opts, OPT_N(opts), &o, argc, argv, e)) < 0)
		return -1;
	if (argc > 1)
		return sd_usage(e, "returns takes no arguments besides options, got '%s'", argv[1]);
	if (o.doses && parse_doses(o.doses, d, &n, p->dose_max, e))
		return -1;
	if (!n)
		for (size_t i = 0; i < sizeof dflt / sizeof *dflt && dflt[i] <= p->dose_max; i++)
			d[n++] = dflt[i];

	/* Every pair's difference, once, for whichever format prints it. */
	struct sd_delta dl[MAX_DOSES * MAX_DOSES];
	char note[240];
	for (int i = 0; i < n; i++)
		for (int j = i + 1; j < n; j++)
			curve_delta(p, &cov, d[i], d[j], ctx->opt.level, 0, &dl[i * n + j]);
	curve_context_note(p, &cov, note, sizeof note);
	struct returns_view v = { p, cov, ctx->opt.level, plateau, d, n, dl, note, o.wide };
	if (returns_out_print(ctx->out, &v, ctx->opt.format))
		return sd_fail(e, "out of memory");
	cmd_print_caution(ctx);
	return 0;
}

const struct sd_cmd cmd_returns = {
	.name = "returns",
	.summary = "what more or fewer weekly sets buy, and the practical plateau",
	.usage = "returns [--doses A,B,...] [--wide]",
	.flags = CMD_PROFILE,
	.exec = exec_returns,
	.opts = opts,
	.nopts = OPT_N(opts),
};
