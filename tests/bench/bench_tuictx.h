/* The run context of the interface benchmarks: the C.UTF-8 locale, colours on, the bundled
 * profile and exercise library of datadir. */
#ifndef SD_BENCH_TUICTX_H
#define SD_BENCH_TUICTX_H

#include <locale.h>
#include <stdio.h>
#include <string.h>
#include <time.h>

#include "io/library_io.h"
#include "io/profile_io.h"

static inline double now_ms(void)
{
	struct timespec t;
	clock_gettime(CLOCK_MONOTONIC, &t);
	return t.tv_sec * 1e3 + t.tv_nsec / 1e6;
}

static inline int bench_ctx(struct sd_ctx *ctx, const char *datadir, struct sd_err *e)
{
	char path[1200];

	if (!setlocale(LC_CTYPE, "C.UTF-8"))
		setlocale(LC_CTYPE, "");
	memset(ctx, 0, sizeof *ctx);
	sd_err_clear(e);
	ctx->out = stdout;
	ctx->opt.level = 0.95;
	ctx->opt.max_rir = 4;
	ctx->opt.color = 1;
	snprintf(ctx->datadir, sizeof ctx->datadir, "%s", datadir);
	snprintf(path, sizeof path, "%s/strength.ini", datadir);
	return profile_load(path, &ctx->profile, e) || library_load_all(datadir, NULL, &ctx->lib, e)
		       ? -1 : 0;
}

#endif
