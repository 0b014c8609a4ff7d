/* returns: what moving from a to b weekly fractional sets buys, for a grid of doses, and the
 * practical plateau. */
#include <getopt.h>
#include <stdlib.h>
#include <string.h>

#include "../io/jsonout.h"
#include "../io/table.h"
#include "../io/wrap.h"
#include "cmd.h"

extern const struct sd_cmd cmd_returns;

#define MAX_DOSES 32

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

static void long_rows(struct sd_ctx *ctx, const double *d, int n, const struct sd_covars *cov,
		      struct sd_table *t)
{
	for (int i = 0; i < n; i++)
		for (int j = i + 1; j < n; j++) {
			struct sd_delta dl;
			curve_delta(&ctx->profile, cov, d[i], d[j], ctx->opt.level, 0, &dl);
			tbl_row(t);
			tbl_set(t, 0, "%g", d[i]);
			tbl_set(t, 1, "%g", d[j]);
			tbl_set(t, 2, "%.3f", curve_pct(dl.d));
			tbl_set(t, 3, "%.3f", curve_pct(dl.lo));
			tbl_set(t, 4, "%.3f", curve_pct(dl.hi));
			tbl_set(t, 5, "%s", dl.practical ? "yes" : "no");
			tbl_set(t, 6, "%s", dl.statistical ? "yes" : "no");
		}
}

/* The grid as a table: in panels of at most the output's width, or in one piece (--wide). */
static int grid(struct sd_ctx *ctx, const double *d, int n, const struct sd_covars *cov, int wide)
{
	const char *heads[MAX_DOSES];
	char lab[MAX_DOSES][24];
	struct sd_table *t;

	heads[0] = "from\\to";
	for (int j = 1; j < n; j++) {
		snprintf(lab[j], sizeof lab[j], "%g", d[j]);
		heads[j] = lab[j];
	}
	if (!(t = tbl_new(n, heads)))
		return -1;
	for (int i = 0; i < n - 1; i++) {
		if (tbl_row(t))
			break;
		tbl_set(t, 0, "%g", d[i]);
		for (int j = i + 1; j < n; j++) {
			struct sd_delta dl;
			curve_delta(&ctx->profile, cov, d[i], d[j], ctx->opt.level, 0, &dl);
			tbl_set(t, j, "%.1f%c", curve_pct(dl.d),
				dl.practical ? '*' : dl.statistical ? '+' : '.');
		}
	}
	tbl_print_panels(t, ctx->out, tbl_mode(0, wide), wide ? 0 : wrap_width(ctx->out), 1);
	tbl_free(t);
	return 0;
}

static int exec_returns(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	static const struct option longopts[] = {
		{ "doses", required_argument, NULL, 'd' },
		{ "wide", no_argument, NULL, 'w' },
		{ NULL, 0, NULL, 0 },
	};
	static const double dflt[] = { 0, 1, 2, 3, 4, 5, 6, 8, 10, 12, 15, 20, 25, 30 };
	double d[MAX_DOSES];
	int n = 0, c, wide = 0;
	const struct sd_profile *p = &ctx->profile;
	struct sd_covars cov = cmd_covars(ctx, 0);
	double plateau = curve_plateau(p, &cov, 1.0);

	optind = 0;
	while ((c = getopt_long(argc, argv, "+", longopts, NULL)) != -1) {
		if (c == 'w') {
			wide = 1;
			continue;
		}
		if (c != 'd')
			return sd_usage(e, "usage: setdose %s", cmd_returns.usage);
		if (parse_doses(optarg, d, &n, p->dose_max, e))
			return -1;
	}
	if (optind < argc)
		return sd_usage(e, "returns takes no arguments besides options, got '%s'", argv[optind]);
	if (!n)
		for (size_t i = 0; i < sizeof dflt / sizeof *dflt && dflt[i] <= p->dose_max; i++)
			d[n++] = dflt[i];

	if (ctx->opt.format != SD_FMT_TABLE) {
		static const char *const heads[] = { "from", "to", "delta_pct", "ci_low", "ci_high",
						     "practical", "statistical" };
		struct sd_table *t = tbl_new(7, heads);
		if (!t)
			return sd_fail(e, "out of memory");
		long_rows(ctx, d, n, &cov, t);
		if (ctx->opt.format == SD_FMT_CSV)
			tbl_print(t, ctx->out, 1);
		else {
			/* JSON: the same rows as objects, plus the plateau. */
			char *prof = json_profile_text(p);
			fprintf(ctx->out, "{\"profile\": %s, \"plateau\": %g, \"swc_pct\": %.4f, \"level\": %g, "
				"\"weeks\": %g, \"weeks_beyond_evidence\": %s, \"returns\": [", prof ? prof : "null",
				plateau, curve_pct(p->swc), ctx->opt.level, cov.weeks,
				curve_beyond(p, &cov, p->dose_min) & SD_BEYOND_WEEKS ? "true" : "false");
			free(prof);
			for (int i = 0, k = 0; i < n; i++)
				for (int j = i + 1; j < n; j++, k++) {
					struct sd_delta dl;
					curve_delta(p, &cov, d[i], d[j], ctx->opt.level, 0, &dl);
					fprintf(ctx->out, "%s\n  {\"from\": %g, \"to\": %g, \"delta_pct\": %.4f, "
						"\"ci_low\": %.4f, \"ci_high\": %.4f, \"practical\": %s, "
						"\"statistical\": %s}", k ? "," : "", d[i], d[j], curve_pct(dl.d),
						curve_pct(dl.lo), curve_pct(dl.hi), dl.practical ? "true" : "false",
						dl.statistical ? "true" : "false");
				}
			fprintf(ctx->out, "\n]}\n");
		}
		tbl_free(t);
		return 0;
	}

	/* The grid: row = from, column = to; each cell the extra gain in percent, marked '*' when
	 * it exceeds the SWC and '+' when only its interval excludes zero. */
	char note[240];
	curve_context_note(p, &cov, note, sizeof note);
	wrap_printf(ctx->out, 0, "Extra gain (%%, as a ratio of gains) from moving FROM -> TO weekly "
		    "fractional sets");
	wrap_printf(ctx->out, 0, "%s, %g-week block; the average curve. '*' beyond the SWC (%.1f%%), "
		    "'+' interval excludes 0 only, '.' neither.", cov.trained >= 0.5 ? "trained" :
		    "untrained", cov.weeks, curve_pct(p->swc));
	if (note[0])
		wrap_printf(ctx->out, 9, "warning: %s", note);
	fputc('\n', ctx->out);
	if (grid(ctx, d, n, &cov, wide))
		return sd_fail(e, "out of memory");
	fputc('\n', ctx->out);
	wrap_printf(ctx->out, 0, "Practical plateau: %g weekly fractional sets (from there, no dose up "
		    "to %g adds more than the SWC).", plateau, p->dose_max);
	cmd_print_caution(ctx);
	return 0;
}

const struct sd_cmd cmd_returns = {
	.name = "returns",
	.summary = "what more or fewer weekly sets buy, and the practical plateau",
	.usage = "returns [--doses A,B,...] [--wide]\n"
		 "  --doses LIST  weekly fractional sets to compare (default 0,1,...,30 in steps)\n"
		 "  --wide        the grid in one piece (by default, panels of at most the\n"
		 "                terminal's width, 80 columns when not a terminal)",
	.flags = CMD_PROFILE,
	.exec = exec_returns,
};
