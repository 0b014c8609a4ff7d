/* Small pieces every command shares. */
#include <math.h>

#include "../io/audit_out.h"
#include "cmd.h"

void cmd_print_caution(struct sd_ctx *ctx)
{
	if (ctx->opt.format != SD_FMT_TABLE)
		return;
	fputc('\n', ctx->out);
	if (ctx->profile.name[0])   /* loaded: the numbers above come from it */
		aout_profile_line(ctx->out, &ctx->profile);
	aout_caution_text(ctx->out);
}
