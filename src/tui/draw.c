/* Drawing routines shared by the views: roles to attributes, clipped text, gauges, frames and
 * the key card. */
#include <curses.h>
#include <math.h>
#include <stdarg.h>
#include <stdio.h>
#include <string.h>
#include <wchar.h>

#include "../io/wrap.h"
#include "../plot/palette.h"
#include "app.h"

static attr_t role_attr[TR_NROLES];
static int utf8;

/* The colour scheme: foreground (and background) per role; -1 is the terminal's default. */
static const struct { short fg, bg; attr_t extra; } scheme[TR_NROLES] = {
	[TR_PLAIN] = { -1, -1, 0 },
	[TR_TITLE] = { COLOR_BLACK, COLOR_GREEN, A_BOLD },
	[TR_HEAD] = { COLOR_GREEN, -1, A_BOLD },
	[TR_SEL] = { -1, -1, A_REVERSE },
	[TR_DIM] = { -1, -1, A_DIM },
	[TR_ERR] = { COLOR_WHITE, COLOR_RED, A_BOLD },
	[TR_OK] = { COLOR_GREEN, -1, A_BOLD },
	[TR_KEY] = { COLOR_YELLOW, -1, A_BOLD },
	[TR_WARN] = { COLOR_YELLOW, -1, 0 },
	[TR_NONE] = { -1, -1, A_DIM },
	[TR_CLIMB] = { COLOR_YELLOW, -1, 0 },
	[TR_PLATEAU] = { COLOR_GREEN, -1, 0 },
	[TR_BEYOND] = { COLOR_MAGENTA, -1, A_BOLD },
	[TR_ATHB] = { COLOR_BLUE, -1, A_DIM },
	[TR_PI] = { COLOR_BLUE, -1, 0 },
	[TR_CI] = { COLOR_CYAN, -1, 0 },
	[TR_MEAN] = { -1, -1, A_BOLD },
	[TR_MARK] = { COLOR_YELLOW, -1, A_BOLD },
	[TR_CURSOR] = { -1, -1, A_REVERSE },
	[TR_AXIS] = { -1, -1, A_DIM },
};

/* Without colour every role still reads apart: bold, reverse, underline and dim. */
static const attr_t mono[TR_NROLES] = {
	[TR_PLAIN] = 0,
	[TR_TITLE] = A_REVERSE | A_BOLD,
	[TR_HEAD] = A_BOLD | A_UNDERLINE,
	[TR_SEL] = A_REVERSE,
	[TR_DIM] = A_DIM,
	[TR_ERR] = A_REVERSE | A_BOLD,
	[TR_OK] = A_BOLD,
	[TR_KEY] = A_BOLD,
	[TR_WARN] = A_BOLD,
	[TR_NONE] = A_DIM,
	[TR_CLIMB] = 0,
	[TR_PLATEAU] = A_BOLD,
	[TR_BEYOND] = A_BOLD | A_UNDERLINE,
	[TR_ATHB] = A_DIM,
	[TR_PI] = A_DIM,
	[TR_CI] = 0,
	[TR_MEAN] = A_BOLD,
	[TR_MARK] = A_BOLD | A_UNDERLINE,
	[TR_CURSOR] = A_REVERSE,
	[TR_AXIS] = A_DIM,
};

/* On a 256-colour terminal the roles take the charts' palette (plot/palette.h), so the screen,
 * the PNG and the PDF share one set of colours; with 8 colours, the nearest basic ones above. */
static const short pal256[TR_NROLES][2] = {
	[TR_PLAIN] = { -1, -1 },
	[TR_TITLE] = { 231, PAL_CURVE + 1000 },
	[TR_HEAD] = { PAL_CURVE + 1000, -1 },
	[TR_SEL] = { -1, -1 },
	[TR_DIM] = { -1, -1 },
	[TR_ERR] = { 231, PAL_MARK + 1000 },
	[TR_OK] = { PAL_CURVE + 1000, -1 },
	[TR_KEY] = { PAL_MARK + 1000, -1 },
	[TR_WARN] = { PAL_MARK + 1000, -1 },
	[TR_NONE] = { -1, -1 },
	[TR_CLIMB] = { PAL_CURVE + 1000, -1 },
	[TR_PLATEAU] = { 137, -1 },        /* the plateau shading, darkened to read as text */
	[TR_BEYOND] = { PAL_MUTED + 1000, -1 },
	[TR_ATHB] = { PAL_BAND_ATH + 1000, -1 },
	[TR_PI] = { PAL_BAND_GROUP + 1000, -1 },
	[TR_CI] = { PAL_BAND_CI + 1000, -1 },
	[TR_MEAN] = { PAL_CURVE + 1000, -1 },
	[TR_MARK] = { PAL_MARK + 1000, -1 },
	[TR_CURSOR] = { -1, -1 },
	[TR_AXIS] = { -1, -1 },
};

/* A palette colour (entries above 1000 name one) as an xterm index; others pass through. */
static short xterm_of(short c)
{
	return c >= 1000 ? sd_palette[c - 1000].xterm : c;
}

void tui_colors_init(struct tui_app *a)
{
	utf8 = a->unicode;
	if (a->color && has_colors() && start_color() == OK) {
		int dflt = use_default_colors() == OK;
		int full = COLORS >= 256;
		for (int r = 0; r < TR_NROLES; r++) {
			short fg = full ? xterm_of(pal256[r][0]) : scheme[r].fg;
			short bg = full ? xterm_of(pal256[r][1]) : scheme[r].bg;
			if (!dflt) {
				fg = fg < 0 ? COLOR_WHITE : fg;
				bg = bg < 0 ? COLOR_BLACK : bg;
			}
			init_pair((short)(r + 1), fg, bg);
			role_attr[r] = COLOR_PAIR(r + 1) | scheme[r].extra;
		}
		return;
	}
	a->color = 0;
	memcpy(role_attr, mono, sizeof role_attr);
}

unsigned tui_attr(enum tui_role r)
{
	return (unsigned)role_attr[r];
}

/* Copies s into buf, replacing what the terminal cannot show in one cell (control
 * characters, and any non-ASCII byte outside a UTF-8 locale) by '?', and stops at w columns.
 * Returns the columns used; *cut is set when some of s (other than trailing blanks) did not
 * fit. */
static int fit(const char *s, int w, char *buf, size_t n, int *cut)
{
	size_t o = 0;
	int cols = 0;
	mbstate_t ms;

	memset(&ms, 0, sizeof ms);
	while (*s && cols < w && o + 8 < n) {
		unsigned char c = (unsigned char)*s;
		if (c < 0x80 || !utf8) {
			buf[o++] = c >= 0x20 && c < 0x7f ? (char)c : '?';
			s++;
			cols++;
			continue;
		}
		wchar_t wc;
		size_t k = mbrtowc(&wc, s, strlen(s), &ms);
		int cw;
		if (k == (size_t)-1 || k == (size_t)-2 || k == 0) {
			memset(&ms, 0, sizeof ms);
			buf[o++] = '?';
			s++;
			cols++;
			continue;
		}
		cw = wcwidth(wc);
		if (cw < 0)
			cw = 1;
		if (cols + cw > w)
			break;
		memcpy(buf + o, s, k);
		o += k;
		s += k;
		cols += cw;
	}
	buf[o] = '\0';
	/* Padding that does not fit is not text cut short. */
	*cut = s[strspn(s, " ")] != '\0';
	return cols;
}

int tui_width(const char *s)
{
	char buf[1024];
	int cut;
	return fit(s, 1 << 20, buf, sizeof buf, &cut);
}

int tui_put(int y, int x, int w, enum tui_role r, const char *s)
{
	char buf[2048];
	int cols, cut;

	if (y < 0 || y >= LINES || x < 0 || x >= COLS || w <= 0)
		return 0;
	if (x + w > COLS)
		w = COLS - x;
	cols = fit(s, w, buf, sizeof buf, &cut);
	/* Text cut short ends in an ellipsis, so two long names that share a beginning do not
	 * look the same. */
	if (cut && w >= 2) {
		cols = fit(s, w - 1, buf, sizeof buf - 4, &cut);
		strcat(buf, utf8 ? "\u2026" : "~");
		cols++;
	}
	attrset(role_attr[r]);
	mvaddstr(y, x, buf);
	attrset(A_NORMAL);
	return cols;
}

int tui_putf(int y, int x, int w, enum tui_role r, const char *fmt, ...)
{
	char buf[1024];
	va_list ap;
	va_start(ap, fmt);
	vsnprintf(buf, sizeof buf, fmt, ap);
	va_end(ap);
	return tui_put(y, x, w, r, buf);
}

#define MAX_WRAP 64

int tui_wrapped_lines(int w, int indent, const char *text)
{
	struct wrap_line l[1];
	return w > 0 ? wrap_lines(text, w, indent, l, 0) : 0;
}

int tui_put_wrapped(int y, int x, int w, int maxl, int indent, enum tui_role r, const char *text)
{
	struct wrap_line l[MAX_WRAP];
	int n;

	if (w <= 0 || maxl <= 0)
		return 0;
	n = wrap_lines(text, w, indent, l, MAX_WRAP);
	if (n > MAX_WRAP)
		n = MAX_WRAP;
	for (int i = 0; i < n && i < maxl; i++) {
		char buf[1024];
		int more = i == maxl - 1 && n > maxl;
		int len = l[i].len;
		/* Cut short: whole words that leave room for the ellipsis, then the ellipsis. */
		while (more && len > 0) {
			snprintf(buf, sizeof buf, "%*s%.*s", l[i].lead, "", len, l[i].s);
			if (tui_width(buf) + 2 <= w)
				break;
			while (len > 0 && l[i].s[len - 1] != ' ')
				len--;
			while (len > 0 && l[i].s[len - 1] == ' ')
				len--;
		}
		snprintf(buf, sizeof buf, "%*s%.*s%s", l[i].lead, "", len, l[i].s,
			 more ? (utf8 ? " \u2026" : " ~") : "");
		tui_put(y + i, x, w, r, buf);
	}
	return n < maxl ? n : maxl;
}

void tui_fill(int y, int x, int w, enum tui_role r)
{
	if (y < 0 || y >= LINES || x < 0 || x >= COLS || w <= 0)
		return;
	if (x + w > COLS)
		w = COLS - x;
	attrset(role_attr[r]);
	mvhline(y, x, ' ', w);
	attrset(A_NORMAL);
}

enum tui_role tui_zone_role(enum sd_zone z)
{
	switch (z) {
	case SD_ZONE_CLIMB:
		return TR_CLIMB;
	case SD_ZONE_PLATEAU:
		return TR_PLATEAU;
	case SD_ZONE_BEYOND:
		return TR_BEYOND;
	default:
		return TR_NONE;
	}
}

double tui_gauge_max(double dose_max, double dmax)
{
	double m = dose_max * 1.1;
	if (dmax * 1.05 > m)
		m = dmax * 1.05;
	return m > 0 ? ceil(m / 5.0) * 5.0 : 5.0;
}

static int cell_of(double v, double smax, int w)
{
	int c = (int)floor(v / smax * w);
	return c < 0 ? 0 : c >= w ? w - 1 : c;
}

void tui_dose_strip(struct tui_app *a, int y, int x, int w, const unsigned char *lev,
		    double smax, double dose, double plateau, double dose_max, enum tui_role r)
{
	/* The curve's height in eighths of a cell (UTF-8), or eight ASCII steps. */
	static const char *const blk[] = { "\u2581", "\u2582", "\u2583", "\u2584", "\u2585",
					   "\u2586", "\u2587", "\u2588" };
	static const char *const asc[] = { "_", ".", "-", "~", "=", "+", "*", "#" };
	int dc = dose > 0 ? cell_of(dose, smax, w) : -1;
	int pc = cell_of(plateau, smax, w), ec = cell_of(dose_max, smax, w);

	if (w <= 0 || y >= LINES)
		return;
	for (int i = 0; i < w && x + i < COLS; i++) {
		const char *g = a->unicode ? blk[lev[i] & 7] : asc[lev[i] & 7];
		enum tui_role gr = i < dc ? r : TR_AXIS;
		if (i == dc) {
			g = a->unicode ? "\u25cf" : "@";
			gr = TR_MARK;
		} else if (i > dc && i == ec) {
			g = a->unicode ? "\u2503" : "|";
			gr = TR_BEYOND;
		} else if (i > dc && i == pc) {
			g = a->unicode ? "\u250a" : ":";
			gr = TR_PLATEAU;
		}
		attrset(role_attr[gr]);
		mvaddstr(y, x + i, g);
	}
	attrset(A_NORMAL);
}

void tui_gauge_scale(struct tui_app *a, int y, int x, int w, double smax, double plateau,
		     double dose_max)
{
	static const double steps[] = { 1, 2, 5, 10, 20, 50 };
	double step = 50;
	int last = -1;

	(void)a;
	for (size_t i = 0; i < sizeof steps / sizeof steps[0]; i++)
		if (steps[i] / smax * w >= 5) {
			step = steps[i];
			break;
		}
	for (double v = 0; v <= smax + 1e-9; v += step) {
		char lab[16];
		int c = (int)floor(v / smax * w), n = snprintf(lab, sizeof lab, "%g", v);
		if (c + n > w)
			c = w - n;
		if (c <= last)
			continue;
		tui_put(y, x + c, n, TR_AXIS, lab);
		last = c + n;
	}
	(void)plateau;
	(void)dose_max;
}

/* Box lines are drawn as UTF-8 text (or ASCII), not through the terminal's alternate
 * character set, which some terminals and multiplexers show as letters. */
void tui_hline(int y, int x, int w)
{
	attrset(role_attr[TR_AXIS]);
	for (int i = 0; i < w && x + i < COLS; i++)
		mvaddstr(y, x + i, utf8 ? "\u2500" : "-");
	attrset(A_NORMAL);
}

void tui_frame(int y, int x, int h, int w, const char *title)
{
	const char *hl = utf8 ? "\u2500" : "-", *vl = utf8 ? "\u2502" : "|";

	if (h < 2 || w < 2)
		return;
	attrset(role_attr[TR_PLAIN]);
	for (int r = y + 1; r < y + h - 1; r++)
		mvhline(r, x + 1, ' ', w - 2);
	for (int i = 1; i < w - 1; i++) {
		mvaddstr(y, x + i, hl);
		mvaddstr(y + h - 1, x + i, hl);
	}
	for (int r = y + 1; r < y + h - 1; r++) {
		mvaddstr(r, x, vl);
		mvaddstr(r, x + w - 1, vl);
	}
	mvaddstr(y, x, utf8 ? "\u256d" : "+");
	mvaddstr(y, x + w - 1, utf8 ? "\u256e" : "+");
	mvaddstr(y + h - 1, x, utf8 ? "\u2570" : "+");
	mvaddstr(y + h - 1, x + w - 1, utf8 ? "\u256f" : "+");
	if (title)
		tui_putf(y, x + 2, w - 4, TR_HEAD, " %s ", title);
}

/* The key card: every table, the current view's first. A description longer than its column
 * goes on under itself, broken between words. */
static int help_lines(struct tui_app *a, int draw, int y0, int x, int w, int off, int rows)
{
	const struct tui_screen *cur = tui_screen_of(tui_nav_top(&a->st.nav));
	const struct {
		const char *title;
		const struct tui_bind *b;
	} parts[] = {
		{ cur->name, cur->keys },
		{ "everywhere", tui_global_keys },
		{ tui_roster_screen.name, tui_roster_screen.keys },
		{ tui_athlete_screen.name, tui_athlete_screen.keys },
		{ tui_shelf_screen.name, tui_shelf_screen.keys },
		{ tui_dose_screen.name, tui_dose_screen.keys },
		{ tui_curve_screen.name, tui_curve_screen.keys },
		{ tui_compare_screen.name, tui_compare_screen.keys },
		{ "forms", tui_form_keys },
		{ "questions", tui_confirm_keys },
	};
	int line = 0, dw = w - 17;

	for (size_t p = 0; p < sizeof parts / sizeof parts[0]; p++) {
		if (p > 0 && parts[p].b == cur->keys)
			continue;   /* the current view is listed first already */
		if (draw && line >= off && line < off + rows)
			tui_putf(y0 + line - off, x, w, TR_HEAD, "%s%s", parts[p].title,
				 p == 0 ? " (this view)" : "");
		line++;
		for (const struct tui_bind *b = parts[p].b; b->keys; b++) {
			struct wrap_line l[8];
			int n = dw > 0 ? wrap_lines(b->what, dw, 0, l, 8) : 1;
			for (int i = 0; i < n && i < 8; i++, line++) {
				char buf[256];
				if (!draw || line < off || line >= off + rows)
					continue;
				if (!i)
					tui_put(y0 + line - off, x + 2, 14, TR_KEY, b->keys);
				snprintf(buf, sizeof buf, "%.*s", l[i].len, l[i].s);
				tui_put(y0 + line - off, x + 17, dw, TR_PLAIN, buf);
			}
		}
		line++;
	}
	return line;
}

void tui_help_draw(struct tui_app *a)
{
	int w = COLS - 4 > 76 ? 76 : COLS - 4, h = LINES - 2, x = (COLS - w) / 2, y = 1;
	int total = help_lines(a, 0, 0, 0, w - 4, 0, 0);

	if (w < 20 || h < 4)
		return;
	tui_frame(y, x, h, w, "keys");
	/* The line count is known only here, where the lines are counted. */
	tui_scroll_total(&a->st.help, total);
	tui_scroll_fit(&a->st.help, h - 2);
	help_lines(a, 1, y + 1, x + 2, w - 4, a->st.help.off, h - 2);
	if (total > h - 2)
		tui_putf(y + h - 1, x + w - 22, 20, TR_DIM, " %d-%d of %d ", a->st.help.off + 1,
			 a->st.help.off + h - 2 > total ? total : a->st.help.off + h - 2, total);
}
