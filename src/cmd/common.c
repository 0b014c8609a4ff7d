/* Small pieces every command shares. */
#include <math.h>

#include "../io/audit_out.h"
#include "cmd.h"

struct sd_covars cmd_covars(const struct sd_ctx *ctx, int program_weeks)
{
	struct sd_covars c;
	int k = profile_term(&ctx->profile, "weeks");

	/* Block length: the option wins, then the program's own, then the profile's reference
	 * length (its centring value), else 10 weeks. */
	if (ctx->opt.weeks_set)
		c.weeks = ctx->opt.weeks;
	else if (program_weeks > 0)
		c.weeks = program_weeks;
	else
		c.weeks = k >= 0 && ctx->profile.centre[k] > 0 ? ctx->profile.centre[k] : 10;
	c.trained = ctx->opt.status_set ? ctx->opt.trained : 0;
	return c;
}

double cmd_swc(const struct sd_ctx *ctx)
{
	return ctx->opt.swc_set ? log1p(ctx->opt.swc_pct / 100.0) : ctx->profile.swc;
}

void cmd_print_caution(struct sd_ctx *ctx)
{
	if (ctx->opt.format != SD_FMT_TABLE)
		return;
	fputc('\n', ctx->out);
	if (ctx->profile.name[0])   /* loaded: the numbers above come from it */
		aout_profile_line(ctx->out, &ctx->profile);
	aout_caution_text(ctx->out);
}
