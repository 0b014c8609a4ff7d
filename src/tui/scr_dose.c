/* The dose view: per muscle its weekly fractional sets placed on the curve of diminishing
 * returns (a strip of cells as tall as the curve, climbed up to the dose, on a scale marking the
 * practical plateau and the end of the evidence), the predicted gain with its bands (the average
 * curve; one athlete when the window is wide; all three in the detail line), what one more
 * weekly set buys, the zone, the audit's warnings and the profile's provenance line. All from
 * audit_run. */
#include <curses.h>
#include <math.h>
#include <stdio.h>
#include <string.h>

#include "../io/wrap.h"
#include "app.h"

enum { K_UP = 1, K_DOWN, K_PGUP, K_PGDN, K_HOME, K_END, K_CURVE, K_WARN };

static const struct tui_bind keys[] = {
	{ { KEY_UP }, K_UP, "Up", "previous muscle (or scroll the warnings)" },
	{ { KEY_DOWN }, K_DOWN, "Down", "next muscle (or scroll the warnings)" },
	{ { KEY_PPAGE }, K_PGUP, "PgUp", "a screenful up" },
	{ { KEY_NPAGE }, K_PGDN, "PgDn", "a screenful down" },
	{ { KEY_HOME }, K_HOME, "Home", "first muscle" },
	{ { KEY_END }, K_END, "End", "last muscle" },
	{ { '\r', '\n', KEY_ENTER }, K_CURVE, "Enter", "the curve, its cursor at this muscle's dose" },
	{ { 'k', KEY_RIGHT }, K_CURVE, "k Right", "the curve, its cursor at this muscle's dose" },
	{ { 'w' }, K_WARN, "w", "the warnings in full, or back to the muscles" },
	TUI_CONTEXT_BINDS,
	{ { 0 }, 0, NULL, NULL },
};

static void init(struct tui_app *a)
{
	tui_list_reset(&a->st.muscles, SD_NMUSCLES);
	if (a->st.warn_pane)
		tui_warn_pane_toggle(&a->st);
}

static void draw_row(struct tui_app *a, const struct sd_audit *au, int m, int y, int sel,
		     int gx, int gw, double smax, int wide, const unsigned char *lev)
{
	const struct sd_audit_row *r = &au->row[m];
	const struct sd_profile *p = &a->ctx->profile;
	enum tui_role role = sel ? TR_SEL : TR_PLAIN, zr = tui_zone_role(r->zone);
	int x = gx + gw + 1;
	char zone[24];

	if (sel)
		tui_fill(y, 0, COLS, TR_SEL);
	tui_put(y, 1, 12, role, muscle_name(m));
	tui_putf(y, 13, 5, r->dose.fractional > 0 ? role : (sel ? TR_SEL : TR_DIM), "%5.1f",
		 r->dose.fractional);
	tui_dose_strip(a, y, gx, gw, lev, smax, r->dose.fractional, au->plateau, p->dose_max, zr);
	tui_putf(y, x, 6, role, "%+6.1f", curve_pct(r->pt.y));
	tui_putf(y, x + 7, 13, role, "%5.1f to %-5.1f", curve_pct(r->pt.ci_lo), curve_pct(r->pt.ci_hi));
	x += 21;
	if (wide) {
		tui_putf(y, x, 13, role, "%5.1f to %-5.1f", curve_pct(r->pt.ath_lo),
			 curve_pct(r->pt.ath_hi));
		x += 14;
	}
	tui_putf(y, x, 6, role, "%+6.2f", r->plus1.pct);
	snprintf(zone, sizeof zone, "%s", zone_name(r->zone));
	if (!wide && r->zone == SD_ZONE_BEYOND)
		snprintf(zone, sizeof zone, "beyond");
	tui_put(y, x + 7, COLS - x - 7, sel ? TR_SEL : zr, zone);
}

/* The selected muscle: its dose and what one more set buys (when there is room) and its gain
 * with the three bands, as paragraphs for tui_put_wrapped. */
static void detail_text(const struct sd_audit *au, int m, int dose_line, char *buf, size_t n)
{
	const struct sd_audit_row *r = &au->row[m];
	int lvl = (int)lround(au->level * 100), k = 0;

	if (dose_line)
		k = snprintf(buf, n, "%s %.1f sets: %g direct, %g indirect; %d session%s, at most %.1f "
			     "in one%s; %s; +1 set %+.2f%% (%.2f to %.2f)\n", muscle_name(m),
			     r->dose.fractional, r->dose.direct, r->dose.indirect, r->dose.sessions,
			     r->dose.sessions == 1 ? "" : "s", r->dose.max_session,
			     r->dose.easy > 0 ? "; easy sets not counted" : "", zone_name(r->zone),
			     r->plus1.pct, r->plus1.lo, r->plus1.hi);
	if (k < 0 || (size_t)k >= n)
		k = 0;
	snprintf(buf + k, n - (size_t)k, "gain %+.1f%%, %d%%: curve %.1f to %.1f, group %.1f to %.1f, "
		 "athlete %.1f to %.1f", curve_pct(r->pt.y), lvl, curve_pct(r->pt.ci_lo),
		 curve_pct(r->pt.ci_hi), curve_pct(r->pt.group_lo), curve_pct(r->pt.group_hi),
		 curve_pct(r->pt.ath_lo), curve_pct(r->pt.ath_hi));
}

/* The warnings in full, each broken between words under its bullet; the pane scrolls by
 * lines. */
static void draw_warnings(struct tui_app *a, const struct sd_audit *au, int top, int rows)
{
	int w = COLS - 4, total = 0, line = 0;

	for (int i = 0; i < au->nwarn; i++)
		total += tui_wrapped_lines(w, 0, au->warn[i].text);
	tui_scroll_total(&a->st.warn, total);
	tui_scroll_fit(&a->st.warn, rows);
	tui_putf(top - 1, 1, COLS - 2, TR_HEAD, "warnings (%d)", au->nwarn);
	for (int i = 0; i < au->nwarn && line < a->st.warn.off + rows; i++) {
		struct wrap_line l[16];
		int n = wrap_lines(au->warn[i].text, w, 0, l, 16);
		for (int j = 0; j < n && j < 16; j++, line++) {
			char buf[300];
			int y = top + line - a->st.warn.off;
			if (line < a->st.warn.off || line >= a->st.warn.off + rows)
				continue;
			if (!j)
				tui_put(y, 1, 1, TR_WARN, a->unicode ? "\u25aa" : "*");
			snprintf(buf, sizeof buf, "%.*s", l[j].len, l[j].s);
			tui_put(y, 3, w, TR_WARN, buf);
		}
	}
	if (!au->nwarn)
		tui_put(top, 1, COLS - 2, TR_DIM, "no warnings");
}

static void draw(struct tui_app *a)
{
	const struct tui_subject *s = &a->a;
	const struct sd_audit *au = &s->audit;
	const struct sd_profile *p = &a->ctx->profile;
	/* A short window keeps every muscle on screen and the provenance line, and drops the
	 * detail's dose line (the row above shows the dose). The detail and the provenance are
	 * wrapped between words; the muscles get the rows left (and scroll when too few). The
	 * warnings and the scale's marks go on the status line. */
	int tall = LINES >= 25, wide = COLS >= 110, gx = 19, gw, top = 4, rows, dl, pl;
	int lvl;
	double dmax = 0, smax;
	char ctx[200], prov[300], detail[400];

	tui_context_text(a, ctx, sizeof ctx);
	tui_putf(1, 1, COLS - 2, TR_HEAD, "%s", s->label);
	if (!s->ready) {
		tui_putf(3, 1, COLS - 2, TR_ERR, "cannot show it: %s", s->err);
		return;
	}
	lvl = (int)lround(au->level * 100);
	detail_text(au, a->st.muscles.sel, tall, detail, sizeof detail);
	profile_oneline(p, prov, sizeof prov);
	dl = tui_wrapped_lines(COLS - 2, 2, detail);
	pl = tui_wrapped_lines(COLS - 2, 2, prov);
	rows = LINES - top - dl - pl - 1;
	if (rows < 3) {   /* a low window: the muscles first, the text cut short */
		dl = dl > 1 ? 1 : dl;
		pl = pl > 1 ? 1 : pl;
		rows = LINES - top - dl - pl - 1;
	}
	tui_putf(2, 1, COLS - 2, TR_PLAIN, "%s; %d day%s, %d hard sets a week", ctx, s->prog.ndays,
		 s->prog.ndays == 1 ? "" : "s", au->vol.hard_sets);
	for (int m = 0; m < SD_NMUSCLES; m++)
		if (au->row[m].dose.fractional > dmax)
			dmax = au->row[m].dose.fractional;
	smax = tui_gauge_max(p->dose_max, dmax);
	gw = COLS - gx - 1 - 21 - (wide ? 14 : 0) - 7 - (wide ? 16 : 9);
	if (gw < 8)
		gw = 8;
	tui_put(top - 1, 1, 12, TR_HEAD, "muscle");
	tui_put(top - 1, 14, 4, TR_HEAD, "sets");
	tui_gauge_scale(a, top - 1, gx, gw, smax, au->plateau, p->dose_max);
	{
		int x = gx + gw + 1;
		tui_put(top - 1, x, 6, TR_HEAD, " gain%");
		tui_putf(top - 1, x + 7, 13, TR_HEAD, " %d%% curve", lvl);
		x += 21;
		if (wide) {
			tui_putf(top - 1, x, 13, TR_HEAD, " %d%% athlete", lvl);
			x += 14;
		}
		tui_put(top - 1, x, 6, TR_HEAD, "+1 set");
		tui_put(top - 1, x + 7, 10, TR_HEAD, "zone");
	}
	/* The curve's shape over the scale, once: each cell as tall as the mean gain there,
	 * from no sets (lowest) to the scale's end (highest). */
	unsigned char lev[512];
	{
		struct sd_covars cov = tui_covars(a);
		struct sd_point p0, p1, pt;
		int n = gw < (int)sizeof lev ? gw : (int)sizeof lev;
		curve_eval(p, &cov, 0, au->level, &p0);
		curve_eval(p, &cov, smax, au->level, &p1);
		for (int i = 0; i < n; i++) {
			curve_eval(p, &cov, smax * (i + 0.5) / gw, au->level, &pt);
			double t = p1.y > p0.y ? (pt.y - p0.y) / (p1.y - p0.y) : 0;
			lev[i] = (unsigned char)lround(fmin(fmax(t, 0), 1) * 7);
		}
		if (gw > n)
			gw = n;
	}
	if (a->st.warn_pane) {
		draw_warnings(a, au, top + 1, rows - 1);
	} else {
		tui_list_fit(&a->st.muscles, rows);
		for (int r = 0; r < a->st.muscles.rows && a->st.muscles.top + r < SD_NMUSCLES; r++) {
			int m = a->st.muscles.top + r;
			draw_row(a, au, m, top + r, m == a->st.muscles.sel, gx, gw, smax, wide, lev);
		}
		/* A tall window has room for the warnings under the muscles. */
		if (au->nwarn && rows - SD_NMUSCLES >= 3)
			draw_warnings(a, au, top + SD_NMUSCLES + 2, rows - SD_NMUSCLES - 2);
	}
	tui_put_wrapped(LINES - 1 - pl - dl, 1, COLS - 2, dl, 2, TR_PLAIN, detail);
	tui_put_wrapped(LINES - 1 - pl, 1, COLS - 2, pl, 2, TR_DIM, prov);
	if (au->nwarn)
		snprintf(a->note, sizeof a->note, "%d warning%s%s  %s plateau %g  %s end of evidence %g",
			 au->nwarn, au->nwarn == 1 ? "" : "s", a->st.warn_pane ? "" : " (w lists)",
			 a->unicode ? "\u250a" : ":", au->plateau, a->unicode ? "\u2503" : "|",
			 p->dose_max);
	else
		snprintf(a->note, sizeof a->note, "no warnings  %s plateau %g  %s end of evidence %g",
			 a->unicode ? "\u250a" : ":", au->plateau, a->unicode ? "\u2503" : "|",
			 p->dose_max);
	a->note_role = au->nwarn ? TR_WARN : TR_DIM;
}

static int key(struct tui_app *a, int ch)
{
	int act = tui_action(keys, ch);

	if (tui_context_act(a, act))
		return 1;
	if (a->st.warn_pane && (act == K_UP || act == K_DOWN || act == K_PGUP || act == K_PGDN)) {
		int d = act == K_UP ? -1 : act == K_DOWN ? 1 : act == K_PGUP ? -a->st.warn.rows
									   : a->st.warn.rows;
		tui_scroll_by(&a->st.warn, d);
		return 1;
	}
	switch (act) {
	case K_UP:
		tui_list_move(&a->st.muscles, -1);
		return 1;
	case K_DOWN:
		tui_list_move(&a->st.muscles, 1);
		return 1;
	case K_PGUP:
		tui_list_page(&a->st.muscles, -1);
		return 1;
	case K_PGDN:
		tui_list_page(&a->st.muscles, 1);
		return 1;
	case K_HOME:
		tui_list_select(&a->st.muscles, 0);
		return 1;
	case K_END:
		tui_list_select(&a->st.muscles, SD_NMUSCLES - 1);
		return 1;
	case K_CURVE:
		if (a->a.ready)
			tui_open(a, TUI_CURVE);
		else
			tui_say(a, 1, "no curve to show: %s", a->a.err);
		return 1;
	case K_WARN:
		tui_warn_pane_toggle(&a->st);
		return 1;
	default:
		return 0;
	}
}

const struct tui_screen tui_dose_screen = { "dose", init, draw, key, keys };
