/* A block's weeks for the curve and its audit: shared by block show, audit --all, response
 * and the interface. */
#include "blocks.h"

#include <math.h>
#include <string.h>

#include "../core/date.h"
#include "../io/program_io.h"

double app_block_weeks(const struct db_block *b)
{
	long s, t;
	double w;

	if (!b->end[0] || date_parse(b->start, &s, NULL) || date_parse(b->end, &t, NULL))
		return b->weeks;
	/* To a tenth of a week: the curve's weeks term is not that precise, and it reads well. */
	w = round((double)(t - s) / 0.7) / 10.0;
	return w < 1 ? 1 : w;
}

int app_block_audit(const struct sd_ctx *ctx, const struct db_block *b,
		    const struct db_program *src, double session_cap, struct sd_program *prog,
		    struct sd_audit *au, struct sd_err *e)
{
	struct sd_audit_opts o = { ctx->opt.level, ctx->opt.max_rir, session_cap };
	struct sd_covars cov = { app_block_weeks(b), b->trained };

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

int app_block_overdue(const struct db_block *b, const char *today)
{
	long s, t;

	if (b->end[0] || date_parse(b->start, &s, NULL) || date_parse(today, &t, NULL))
		return 0;
	return t - (s + 7L * b->weeks) > 0 ? (int)(t - (s + 7L * b->weeks)) : 0;
}
