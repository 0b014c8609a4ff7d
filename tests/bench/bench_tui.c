/* Full redraws of the full-screen interface's dose view and curve view on a 200x60 screen
 * (terminal type xterm-256color, colours on, UTF-8 glyphs), drawn by the real views into a
 * curses screen whose output goes to /dev/null. Each redraw repaints every cell (not only the
 * changes) and writes it out, so the time is the worst case of a keypress or a resize.
 * usage: bench_tui N DATADIR   (target: <= 16 ms per redraw, one frame at 60 Hz) */
#include <locale.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>

#include "io/library_io.h"
#include "io/profile_io.h"
#include "io/program_io.h"
#include "store/db.h"
#include "tui/tui.h"
#include "bench_tuictx.h"

#define W 200
#define H 60
#define TEMPLATE "bench template (invented demo upper/lower)"

static int cmp(const void *a, const void *b)
{
	double x = *(const double *)a, y = *(const double *)b;
	return x < y ? -1 : x > y;
}

/* Times n full redraws of one view; prints median, mean and slowest. */
static int bench_view(struct tui_app *app, int curve, int n, double *t, struct sd_err *e)
{
	double sum = 0;

	if (tui_bench_show(app, curve, TEMPLATE, e))
		return -1;
	for (int i = 0; i < 5; i++)
		tui_bench_draw(app);   /* warm-up: first-touch allocations in curses */
	for (int i = 0; i < n; i++) {
		double a = now_ms();
		tui_bench_draw(app);
		t[i] = now_ms() - a;
		sum += t[i];
	}
	qsort(t, (size_t)n, sizeof *t, cmp);
	printf("%-44s runs %3d  median %6.2f ms  mean %6.2f ms  max %6.2f ms  (target 16 ms)\n",
	       curve ? "tui redraw, curve view 200x60" : "tui redraw, dose view 200x60", n,
	       n % 2 ? t[n / 2] : (t[n / 2 - 1] + t[n / 2]) / 2, sum / n, t[n - 1]);
	return 0;
}

int main(int argc, char **argv)
{
	struct sd_ctx ctx;
	struct sd_err e;
	struct tui_app *app = NULL;
	char path[1200], *text = NULL;
	size_t len = 0;
	double *t;
	int n, rc = 1;

	if (argc != 3 || (n = atoi(argv[1])) < 1) {
		fprintf(stderr, "usage: bench_tui N DATADIR\n");
		return 2;
	}
	if (!(t = calloc((size_t)n, sizeof *t)) || bench_ctx(&ctx, argv[2], &e) ||
	    db_open(":memory:", &ctx.db, &e))
		goto done;
	snprintf(path, sizeof path, "%s/demo-upperlower4.ini", argv[2]);
	if (program_slurp(path, &text, &len, &e) ||
	    db_program_add(ctx.db, TEMPLATE, text, len, 0, NULL, &e) ||
	    tui_bench_open(&ctx, "xterm-256color", W, H, &app, &e))
		goto done;
	if (bench_view(app, 0, n, t, &e) || bench_view(app, 1, n, t, &e))
		goto done;
	rc = 0;
done:
	if (app)
		tui_bench_close(app);
	if (rc)
		fprintf(stderr, "bench_tui: %s\n", e.msg);
	free(text);
	free(t);
	db_close(ctx.db);
	lib_free(&ctx.lib);
	return rc;
}
