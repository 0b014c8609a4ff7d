/* The run's shared context: the curve's covariates, the SWC, the database path, units. */
#include "ctx.h"

#include <math.h>
#include <stdio.h>
#include <stdlib.h>

#include "../store/db.h"

struct sd_covars app_covars(const struct sd_ctx *ctx, int program_weeks)
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

double app_swc(const struct sd_ctx *ctx)
{
	return ctx->opt.swc_set ? log1p(ctx->opt.swc_pct / 100.0) : ctx->profile.swc;
}

int app_lb(const struct sd_ctx *ctx, const struct db_athlete *a)
{
	return ctx->opt.units_set ? ctx->opt.units_lb : a->units_lb;
}

int app_db_path(const struct sd_ctx *ctx, char *buf, size_t n, struct sd_err *e)
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
