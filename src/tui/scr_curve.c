/* The curve view: the dose-response curve with its confidence and prediction bands (the same
 * cell grid `setdose curve` prints), the subject's muscles marked on it, and a cursor that
 * reads off the values at any dose. */
#include <curses.h>
#include <math.h>
#include <stdio.h>
#include <string.h>

#include "../plot/textplot.h"
#include "app.h"

enum { K_LEFT = 1, K_RIGHT, K_FINE_LEFT, K_FINE_RIGHT, K_PGUP, K_PGDN, K_HOME, K_END, K_NEXT };

static const struct tui_bind keys[] = {
	{ { KEY_LEFT }, K_LEFT, "Left", "cursor half a weekly set lower" },
	{ { KEY_RIGHT }, K_RIGHT, "Right", "cursor half a weekly set higher" },
	{ { '<', ',' }, K_FINE_LEFT, "< ,", "cursor a tenth of a set lower" },
	{ { '>', '.' }, K_FINE_RIGHT, "> .", "cursor a tenth of a set higher" },
	{ { KEY_PPAGE }, K_PGUP, "PgUp", "cursor five sets lower" },
	{ { KEY_NPAGE }, K_PGDN, "PgDn", "cursor five sets higher" },
	{ { KEY_HOME }, K_HOME, "Home", "cursor to 0 sets" },
	{ { KEY_END }, K_END, "End", "cursor to the right edge" },
	{ { '\t' }, K_NEXT, "Tab", "cursor to the next marked muscle" },
	TUI_CONTEXT_BINDS,
	{ { 0 }, 0, NULL, NULL },
};

/* The doses of the marked muscles (dose > 0), in muscle order, with their letters. */
static int marked(const struct tui_app *a, double *dose, int *muscle)
{
	int k = 0;
	if (!a->a.ready)
		return 0;
	for (int m = 0; m < SD_NMUSCLES; m++)
		if (a->a.audit.row[m].dose.fractional > 0) {
			dose[k] = a->a.audit.row[m].dose.fractional;
			muscle[k++] = m;
		}
	return k;
}

static char letter(int i)
{
	return (char)(i < 26 ? 'a' + i : 'A' + i - 26);
}

static double x_max(const struct tui_app *a)
{
	double dose[SD_NMUSCLES], hi = a->ctx->profile.dose_max;
	int mus[SD_NMUSCLES], k = marked(a, dose, mus);
	for (int i = 0; i < k; i++)
		if (dose[i] > hi)
			hi = ceil(dose[i] / 5.0) * 5.0;
	return hi;
}

static void init(struct tui_app *a)
{
	const struct sd_profile *p = &a->ctx->profile;
	struct sd_covars cov = tui_covars(a);
	double x = curve_plateau(p, &cov, 1.0);
	int below = a->st.nav.depth >= 2 ? a->st.nav.stack[a->st.nav.depth - 2] : TUI_ROSTER;

	/* From the dose view the cursor starts at the muscle that was selected there. */
	if (below == TUI_DOSE && a->a.ready)
		x = a->a.audit.row[a->st.muscles.sel].dose.fractional;
	tui_cursor_reset(&a->st.cursor, 0, x_max(a), x);
}

static enum tui_role cell_role(int kind)
{
	switch (kind) {
	case TP_ATHLETE:
		return TR_ATHB;
	case TP_GROUP:
		return TR_PI;
	case TP_CI:
		return TR_CI;
	case TP_MEAN:
		return TR_MEAN;
	case TP_MARK:
		return TR_MARK;
	default:
		return TR_PLAIN;
	}
}

/* The dose axis with ticks at round numbers of sets, at least eight columns apart. */
static void draw_axis(struct tui_app *a, const struct sd_tplot *tp, int y, int x0)
{
	static const double steps[] = { 1, 2, 5, 10, 20, 50, 100 };
	double step = 100, span = tp->x1 - tp->x0;
	int last = -1;

	for (size_t i = 0; i < sizeof steps / sizeof steps[0]; i++)
		if (steps[i] / span * (tp->w - 1) >= 8) {
			step = steps[i];
			break;
		}
	attrset(tui_attr(TR_AXIS));
	mvaddstr(y, x0 - 1, a->unicode ? "\u2514" : "+");
	for (int c = 0; c < tp->w; c++)
		mvaddstr(y, x0 + c, a->unicode ? "\u2500" : "-");
	for (double v = tp->x0; v <= tp->x1 + 1e-9; v += step) {
		char lab[16];
		int c = tplot_col(tp, v), n = snprintf(lab, sizeof lab, "%g", v), lc = c;
		attrset(tui_attr(TR_AXIS));
		mvaddstr(y, x0 + c, a->unicode ? "\u252c" : "+");
		if (lc + n > tp->w)
			lc = tp->w - n;
		if (lc > last)
			tui_put(y + 1, x0 + lc, n, TR_AXIS, lab);
		last = lc + n;
	}
	attrset(A_NORMAL);
}

static void draw_plot(struct tui_app *a, const struct sd_tplot *tp, int y0, int x0, double plateau)
{
	int cc = tplot_col(tp, a->st.cursor.x), pc = tplot_col(tp, plateau);
	int ec = tp->x1 > a->ctx->profile.dose_max ? tplot_col(tp, a->ctx->profile.dose_max) : -1;
	char buf[8];

	for (int r = 0; r < tp->h; r++) {
		double y = tp->y1 - (tp->y1 - tp->y0) * r / (tp->h - 1);
		if (r == 0 || r == tp->h - 1 || r % 3 == 0)
			tui_putf(y0 + r, 0, x0 - 1, TR_AXIS, "%6.0f%%", y);
		attrset(tui_attr(TR_AXIS));
		mvaddstr(y0 + r, x0 - 1, a->unicode ? "\u2502" : "|");
		for (int c = 0; c < tp->w; c++) {
			int kind = tp->kind[(size_t)r * (size_t)tp->w + (size_t)c];
			const char *g = tplot_glyph(tp, c, r, a->unicode, buf);
			unsigned attr = tui_attr(cell_role(kind));
			if (kind == TP_EMPTY && c == cc) {
				g = a->unicode ? "\u2502" : "|";
				attr = tui_attr(TR_KEY);
			} else if (kind == TP_EMPTY && c == ec) {
				g = a->unicode ? "\u2503" : "|";
				attr = tui_attr(TR_BEYOND);
			} else if (kind == TP_EMPTY && c == pc) {
				g = a->unicode ? "\u250a" : ":";
				attr = tui_attr(TR_PLATEAU);
			} else if (c == cc) {
				attr |= A_REVERSE;
			}
			attrset(attr);
			mvaddstr(y0 + r, x0 + c, g);
		}
	}
	attrset(A_NORMAL);
	draw_axis(a, tp, y0 + tp->h, x0);
}

/* The readout under the plot: the curve at the cursor (one line), then the one-athlete band,
 * +1 set, the zone and the marked muscles at this dose, broken between words. */
static void readout_text(struct tui_app *a, const struct sd_covars *cov, double plateau,
			 const struct sd_tplot *tp, const double *dose, const int *mus, int k,
			 char *l1, size_t n1, char *l2, size_t n2)
{
	const struct sd_profile *p = &a->ctx->profile;
	double x = a->st.cursor.x, level = a->ctx->opt.level;
	int lvl = (int)lround(level * 100), cc = tplot_col(tp, x), m = 0;
	struct sd_point pt;
	struct sd_plus1 mg;
	char here[256] = "";

	curve_eval(p, cov, x, level, &pt);
	curve_plus1(p, cov, x, level, &mg);
	for (int i = 0; i < k; i++)
		if (tplot_col(tp, dose[i]) == cc)
			m += snprintf(here + m, sizeof here - (size_t)m, "%s%c %s", m ? ", " : "; here: ",
				      letter(i), muscle_name(mus[i]));
	snprintf(l1, n1, "at %.1f sets: gain %+.1f%%  %d%%: curve %.1f to %.1f  group %.1f to %.1f", x,
		 curve_pct(pt.y), lvl, curve_pct(pt.ci_lo), curve_pct(pt.ci_hi),
		 curve_pct(pt.group_lo), curve_pct(pt.group_hi));
	snprintf(l2, n2, "athlete %.1f to %.1f; +1 set %+.2f%% (%.2f to %.2f); %s%s",
		 curve_pct(pt.ath_lo), curve_pct(pt.ath_hi), mg.pct, mg.lo, mg.hi,
		 zone_name(curve_zone(p, plateau, x)), here);
}

/* The marked muscles' names flow along the lines under the axis; returns the lines used
 * (draw != 0 draws them, at most maxl lines). */
static int draw_marks(int y, int maxl, const double *dose, const int *mus, int k,
		      int draw)
{
	int line = 0, col = 1;
	for (int i = 0; i < k; i++) {
		char item[48];
		int n = snprintf(item, sizeof item, "%c %s %.1f", letter(i), muscle_name(mus[i]), dose[i]);
		if (col > 1 && col + n > COLS - 1) {
			line++;
			col = 1;
		}
		if (line >= maxl)
			return maxl;
		if (draw) {
			tui_putf(y + line, col, 1, TR_MARK, "%c", letter(i));
			tui_put(y + line, col + 2, n - 2, TR_PLAIN, item + 2);
		}
		col += n + 2;
	}
	return k ? line + 1 : 1;
}

static void draw(struct tui_app *a)
{
	const struct sd_profile *p = &a->ctx->profile;
	struct sd_covars cov = tui_covars(a);
	double dose[SD_NMUSCLES], plateau = curve_plateau(p, &cov, 1.0);
	int mus[SD_NMUSCLES], k = marked(a, dose, mus), x0 = 9, w = COLS - x0 - 1;
	int mlines = draw_marks(0, 4, dose, mus, k, 0), h, lvl, cw, n1, top = 3;
	struct sd_tplot *tp;
	char ctx[160], l1[300], l2[600], legend[96];

	lvl = (int)lround(a->ctx->opt.level * 100);
	tui_context_text(a, ctx, sizeof ctx);
	tui_putf(1, 1, COLS - 2, TR_HEAD, "%s", a->a.kind ? a->a.label : "the curve");
	cw = tui_put(2, 1, COLS - 2, TR_PLAIN, ctx);
	snprintf(legend, sizeof legend, "%s mean  %s %d%% curve  %s group  %s athlete",
		 a->unicode ? "\u2588" : "#", a->unicode ? "\u2593" : "=", lvl,
		 a->unicode ? "\u2592" : ":", a->unicode ? "\u2591" : ".");
	/* The legend beside the context when both fit, else on a line of its own. */
	if (cw + 3 + tui_width(legend) <= COLS - 2)
		tui_put(2, cw + 4, COLS - cw - 5, TR_DIM, legend);
	else
		tui_put(top++, 1, COLS - 2, TR_DIM, legend);
	if (a->a.kind && !a->a.ready)
		tui_putf(top, 1, COLS - 2, TR_ERR, "no marks: %s", a->a.err);
	/* The readout under the marks takes three lines: which muscles sit at the cursor is known
	 * only once the plot has its columns, and their names may need a line of their own. */
	h = LINES - 6 - top - mlines;
	if (h < 4 || w < 20 || !(tp = tplot_new(w, h))) {
		tui_put(4, 1, COLS - 2, TR_ERR, "the window is too small for the plot");
		return;
	}
	tplot_curve(tp, p, &cov, a->ctx->opt.level, x_max(a));
	tui_cursor_reset(&a->st.cursor, 0, tp->x1, a->st.cursor.x);
	for (int i = 0; i < k; i++)
		tplot_mark(tp, dose[i], curve_pct(a->a.audit.row[mus[i]].pt.y), letter(i));
	draw_plot(a, tp, top, x0, plateau);
	tui_put(top + h + 1, 0, x0 - 1, TR_AXIS, " sets:");
	if (k)
		draw_marks(top + h + 2, mlines, dose, mus, k, 1);
	else
		tui_put(top + h + 2, 1, COLS - 2, TR_DIM, a->a.kind ? "no muscle has a dose" :
			"no muscles marked: open the curve from a block or a template");
	readout_text(a, &cov, plateau, tp, dose, mus, k, l1, sizeof l1, l2, sizeof l2);
	n1 = tui_put_wrapped(LINES - 4, 1, COLS - 2, 2, 2, TR_MEAN, l1);
	tui_put_wrapped(LINES - 4 + n1, 1, COLS - 2, 3 - n1, 2, TR_PLAIN, l2);
	tplot_free(tp);
}

static int key(struct tui_app *a, int ch)
{
	int act = tui_action(keys, ch);
	double dose[SD_NMUSCLES];
	int mus[SD_NMUSCLES], k;

	if (tui_context_act(a, act)) {
		tui_cursor_reset(&a->st.cursor, 0, x_max(a), a->st.cursor.x);
		return 1;
	}
	switch (act) {
	case K_LEFT:
		tui_cursor_move(&a->st.cursor, -0.5);
		return 1;
	case K_RIGHT:
		tui_cursor_move(&a->st.cursor, 0.5);
		return 1;
	case K_FINE_LEFT:
		tui_cursor_move(&a->st.cursor, -0.1);
		return 1;
	case K_FINE_RIGHT:
		tui_cursor_move(&a->st.cursor, 0.1);
		return 1;
	case K_PGUP:
		tui_cursor_move(&a->st.cursor, -5);
		return 1;
	case K_PGDN:
		tui_cursor_move(&a->st.cursor, 5);
		return 1;
	case K_HOME:
		tui_cursor_set(&a->st.cursor, a->st.cursor.lo);
		return 1;
	case K_END:
		tui_cursor_set(&a->st.cursor, a->st.cursor.hi);
		return 1;
	case K_NEXT:
		k = marked(a, dose, mus);
		if (tui_cursor_next(&a->st.cursor, dose, k) < 0)
			tui_say(a, 0, "no marked muscles");
		return 1;
	default:
		return 0;
	}
}

const struct tui_screen tui_curve_screen = { "curve", init, draw, key, keys };
