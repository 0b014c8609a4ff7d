/* The full-screen interface (`setdose browse`, or `setdose` alone on a terminal). Every
 * number it shows comes from the same core functions the commands use. No ncurses type
 * appears here.
 *
 * Contract: tui_run owns the terminal from start to end and restores it on every way out
 * (normal exit, error, SIGINT, SIGTERM, SIGHUP). The ctx must carry the profile, the exercise
 * library and an open database. */
#ifndef SD_TUI_H
#define SD_TUI_H

#include "../app/ctx.h"

struct tui_app;

/* Runs the interface on the terminal until the user leaves; 0, or -1 with e filled (a
 * terminating signal ends it that way too, with the terminal restored). */
int tui_run(struct sd_ctx *ctx, struct sd_err *e);

/* For benchmarks: an interface drawing into a w x h screen of terminal type term whose output
 * goes to /dev/null (no terminal needed). */
int tui_bench_open(struct sd_ctx *ctx, const char *term, int w, int h, struct tui_app **out,
		   struct sd_err *e);
/* Shows the dose view (curve == 0) or the curve view (curve != 0) of a stored template. */
int tui_bench_show(struct tui_app *a, int curve, const char *template_name, struct sd_err *e);
/* Shows the roster, as at start-up. */
void tui_bench_roster(struct tui_app *a);
/* Handles one key as if typed. */
void tui_bench_key(struct tui_app *a, int ch);
/* One full redraw: every cell repainted and written out, not only the changes. */
void tui_bench_draw(struct tui_app *a);
void tui_bench_close(struct tui_app *a);

#endif
