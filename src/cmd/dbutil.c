#include "dbutil.h"

#include <errno.h>
#include <getopt.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>
#include <unistd.h>

#include "../core/text.h"
#include "../io/program_io.h"
#include "../io/recout.h"

_Static_assert((int)REC_TABLE == (int)SD_FMT_TABLE && (int)REC_CSV == (int)SD_FMT_CSV &&
	       (int)REC_JSON == (int)SD_FMT_JSON,
	       "recout formats follow SD_FMT_*");

int dbu_today(char *buf, struct sd_err *e)
{
	const char *env = getenv("SETDOSE_TODAY");
	time_t now = time(NULL);
	struct tm tm;

	if (env && *env)
		return dbu_date("SETDOSE_TODAY", env, buf, e);
	if (!localtime_r(&now, &tm))
		return sd_fail(e, "cannot read today's date");
	snprintf(buf, DATE_LEN, "%04d-%02d-%02d", (tm.tm_year + 1900) % 10000, tm.tm_mon + 1,
		 tm.tm_mday);
	return 0;
}

int dbu_date(const char *what, const char *s, char *buf, struct sd_err *e)
{
	long d;

	if (date_parse(s, &d, e))
		return sd_wrap(e, "%s", what);
	date_format(d, buf);
	return 0;
}

int dbu_int(const char *what, const char *s, long long lo, long long hi, long long *out,
	    struct sd_err *e)
{
	char *end;
	long long v;

	errno = 0;
	v = strtoll(s, &end, 10);
	if (end == s || *end || errno || v < lo || v > hi)
		return sd_usage(e, "%s wants a whole number from %lld to %lld, not '%s'", what, lo,
				hi, s);
	*out = v;
	return 0;
}

int dbu_num(const char *what, const char *s, double lo, double hi, double *out,
	    struct sd_err *e)
{
	char *end;
	double v;

	errno = 0;
	v = strtod(s, &end);
	if (end == s || *end || errno || !(v >= lo && v <= hi))
		return sd_usage(e, "%s wants a number from %g to %g, not '%s'", what, lo, hi, s);
	*out = v;
	return 0;
}

int dbu_name(const char *what, const char *s, size_t max, struct sd_err *e)
{
	size_t n = strlen(s);
	char label[64];

	if (!n)
		return sd_usage(e, "%s name is empty", what);
	if (n >= max)
		return sd_usage(e, "%s name '%.20s...' is too long (at most %zu bytes)", what, s,
				max - 1);
	if (s[0] == ' ' || s[n - 1] == ' ')
		return sd_usage(e, "%s name '%s' starts or ends with a space", what, s);
	snprintf(label, sizeof label, "%s name", what);
	if (text_check(label, s, n, e)) {
		e->code = SD_EXIT_USAGE;
		return -1;
	}
	return 0;
}

int dbu_confirm(const char *question, struct sd_err *e)
{
	char line[32];

	if (!isatty(STDIN_FILENO))
		return sd_usage(e, "%s: not asking without a terminal (use --yes)", question);
	fprintf(stderr, "%s [y/N] ", question);
	fflush(stderr);
	if (!fgets(line, sizeof line, stdin))
		return 0;
	return line[0] == 'y' || line[0] == 'Y';
}

int dbu_lb(const struct sd_ctx *ctx, const struct db_athlete *a)
{
	return ctx->opt.units_set ? ctx->opt.units_lb : a->units_lb;
}

int dbu_path(const struct sd_ctx *ctx, char *buf, size_t n, struct sd_err *e)
{
	const char *env = getenv("SETDOSE_DB");
	int len;

	if (ctx->opt.db_path)
		len = snprintf(buf, n, "%s", ctx->opt.db_path);
	else if (env && *env)
		len = snprintf(buf, n, "%s", env);
	else if (db_default_path(buf, n))
		return 0;
	else
		return sd_fail(e, "no database location: set --db, SETDOSE_DB or HOME");
	if (len < 0 || (size_t)len >= n)
		return sd_fail(e, "database path too long");
	return 0;
}

double dbu_block_weeks(const struct db_block *b)
{
	long s, t;
	double w;

	if (!b->end[0] || date_parse(b->start, &s, NULL) || date_parse(b->end, &t, NULL))
		return b->weeks;
	/* To a tenth of a week: the curve's weeks term is not that precise, and it reads well. */
	w = round((double)(t - s) / 0.7) / 10.0;
	return w < 1 ? 1 : w;
}

int dbu_block_audit(const struct sd_ctx *ctx, const struct db_block *b,
		    const struct db_program *src, double session_cap, struct sd_program *prog,
		    struct sd_audit *au, struct sd_err *e)
{
	struct sd_audit_opts o = { ctx->opt.level, ctx->opt.max_rir, session_cap };
	struct sd_covars cov = { dbu_block_weeks(b), b->trained };

	memset(prog, 0, sizeof *prog);
	memset(au, 0, sizeof *au);
	if (program_parse(src->name, src->source, src->len, src->is_csv, &ctx->lib, prog, e))
		return sd_wrap(e, "block %lld", b->id);
	if (audit_run(prog, &ctx->lib, &ctx->profile, &cov, &o, au, e)) {
		prog_free(prog);
		return -1;
	}
	return 0;
}

int dbu_badopt(const struct sd_cmd *cmd, int argc, char **argv, struct sd_err *e)
{
	const char *bad = optind > 0 && optind <= argc ? argv[optind - 1] : NULL;

	if (bad && bad[0] == '-')
		return sd_usage(e, "unknown option '%s'; usage: setdose %s", bad, cmd->usage);
	return sd_usage(e, "usage: setdose %s", cmd->usage);
}

int dbu_no_negatives(int argc, char **argv, struct sd_err *e)
{
	for (int i = 1; i < argc && strcmp(argv[i], "--"); i++) {
		char *end;
		if (argv[i][0] != '-' || !argv[i][1])
			continue;
		strtod(argv[i], &end);
		if (end != argv[i] && (!*end || !strcmp(end, "kg") || !strcmp(end, "lb")))
			return sd_usage(e, "bad value '%s': must be positive", argv[i]);
	}
	return 0;
}

/* The library's name for a lift, or an error suggesting the closest names. */
int dbu_lift(const struct sd_library *lib, const char *lift, char *buf, size_t n, struct sd_err *e)
{
	int k = lib_find(lib, lift), near[3], nn;
	char hint[200] = "";

	if (!lift[0])
		return sd_fail(e, "the lift is empty");
	if (k >= 0) {
		snprintf(buf, n, "%s", lib->ex[k].name);
		return 0;
	}
	nn = lib_suggest(lib, lift, near, 3);
	for (int i = 0; i < nn; i++)
		snprintf(hint + strlen(hint), sizeof hint - strlen(hint), "%s'%s'",
			 i ? ", " : " (did you mean ", lib->ex[near[i]].name);
	return sd_fail(e, "unknown lift '%s'%s%s", lift, hint, nn ? ")" : "");
}

int dbu_subcommand(struct sd_ctx *ctx, const struct dbu_sub *subs, const struct sd_cmd *cmd,
		   int argc, char **argv, struct sd_err *e)
{
	const char *sub = argc > 1 ? argv[1] : "";

	for (; subs->name; subs++)
		if (!strcmp(sub, subs->name))
			return subs->fn(ctx, argc - 1, argv + 1, e);
	return sd_usage(e, "usage: setdose %s", cmd->usage);
}
