/* The compare view: two templates side by side per muscle, for the same athlete context. The
 * difference B - A of the predicted gains, its interval and the decision against the smallest
 * worthwhile change all come from core/compare.h (cmp_muscle), as in the compare command. */
#include <curses.h>
#include <stdlib.h>
#include <math.h>
#include <stdio.h>
#include <string.h>

#include "../core/compare.h"
#include "app.h"

enum { K_UP = 1, K_DOWN, K_PGUP, K_PGDN, K_HOME, K_END, K_SWAP };

static const struct tui_bind keys[] = {
	{ { KEY_UP }, K_UP, "Up", "previous muscle" },
	{ { KEY_DOWN }, K_DOWN, "Down", "next muscle" },
	{ { KEY_PPAGE }, K_PGUP, "PgUp", "a screenful up" },
	{ { KEY_NPAGE }, K_PGDN, "PgDn", "a screenful down" },
	{ { KEY_HOME }, K_HOME, "Home", "first muscle" },
	{ { KEY_END }, K_END, "End", "last muscle" },
	{ { 'x' }, K_SWAP, "x", "swap A and B" },
	TUI_CONTEXT_BINDS,
	{ { 0 }, 0, NULL, NULL },
};

static void pair_of(const struct tui_app *a, int m, struct cmp_diff *out)
{
	struct sd_covars cov = tui_covars(a);
	cmp_muscle(&a->ctx->profile, &cov, a->ctx->opt.level, a->a.audit.row[m].dose.fractional,
		   a->b.audit.row[m].dose.fractional, out);
}

static void init(struct tui_app *a)
{
	tui_list_reset(&a->st.pairs, SD_NMUSCLES);
}

/* The difference in predicted gain as an arrow from a centre line: right when B gains more,
 * its length proportional to the difference (span is the largest one shown), the +-SWC region
 * dotted on the track. */
static void diff_gauge(struct tui_app *a, int y, int x, int w, double diff, double span, double swc)
{
	int half = w / 2, n = (int)lround(fabs(diff) / span * half);
	int sw = (int)lround(swc / span * half);

	if (n > half)
		n = half;
	for (int i = 0; i < w; i++) {
		int off = i - half;
		attrset(tui_attr(off == 0 ? TR_AXIS : abs(off) <= sw ? TR_DIM : TR_AXIS));
		mvaddstr(y, x + i, off == 0 ? (a->unicode ? "\u2502" : "|") :
			 abs(off) <= sw ? (a->unicode ? "\u00b7" : ".") : " ");
	}
	attrset(tui_attr(diff > 0 ? TR_CI : TR_WARN));
	for (int i = 1; i <= n; i++)
		mvaddstr(y, diff > 0 ? x + half + i : x + half - i,
			 i == n ? (diff > 0 ? (a->unicode ? "\u25b6" : ">") : (a->unicode ? "\u25c0" : "<"))
				: (a->unicode ? "\u2501" : "="));
	attrset(A_NORMAL);
}

/* The selected muscle: both doses and gains, then B over A with its decision. */
static void selected_text(struct tui_app *a, const struct cmp_diff *pr, int lvl, char *l1,
			  size_t n1, char *l2, size_t n2)
{
	int m = a->st.pairs.sel;
	const struct cmp_diff *q = &pr[m];
	const struct sd_audit_row *ra = &a->a.audit.row[m], *rb = &a->b.audit.row[m];

	snprintf(l1, n1, "%s: A %.1f sets, gain %+.1f%% (%s); B %.1f sets, gain %+.1f%% (%s)",
		 muscle_name(m), q->xa, curve_pct(ra->pt.y), zone_name(ra->zone), q->xb,
		 curve_pct(rb->pt.y), zone_name(rb->zone));
	snprintf(l2, n2, "B over A %+.1f%% (%d%% CI %.1f to %.1f): %s, the %.0f%% interval %.1f to "
		 "%.1f is %s", curve_pct(q->d), lvl, curve_pct(q->lo), curve_pct(q->hi),
		 cmp_decision_name(q->decision), 100 * cmp_decision_level(a->ctx->opt.level),
		 curve_pct(q->dlo), curve_pct(q->dhi), cmp_decision_meaning(q->decision));
}

static void draw(struct tui_app *a)
{
	const struct sd_profile *p = &a->ctx->profile;
	int top, rows, gx = 26, gw, lvl = (int)lround(a->ctx->opt.level * 100), cl, b1, b2;
	double span = curve_pct(p->swc) * 1.5, swc = curve_pct(p->swc);
	struct cmp_diff pr[SD_NMUSCLES];
	char ctx[160], head[400], l1[300], l2[400];

	tui_putf(1, 1, COLS - 2, TR_HEAD, "A: '%s'", a->a.rec.name);
	tui_putf(2, 1, COLS - 2, TR_HEAD, "B: '%s'", a->b.rec.name);
	if (!a->a.ready || !a->b.ready) {
		tui_putf(4, 1, COLS - 2, TR_ERR, "cannot compare: %s", !a->a.ready ? a->a.err : a->b.err);
		return;
	}
	tui_putf(1, COLS / 2, COLS - COLS / 2 - 1, TR_PLAIN, "%d hard sets a week", a->a.audit.vol.hard_sets);
	tui_putf(2, COLS / 2, COLS - COLS / 2 - 1, TR_PLAIN, "%d hard sets a week", a->b.audit.vol.hard_sets);
	tui_context_text(a, ctx, sizeof ctx);
	snprintf(head, sizeof head, "%s; arrows: how much more (or less) 1RM gain B predicts than "
		 "A, %d%% CI; dotted: within the SWC; decision: the %.0f%% interval against +/- the "
		 "SWC %.1f%%", ctx, lvl,
		 100 * cmp_decision_level(a->ctx->opt.level), curve_pct(p->swc));
	for (int m = 0; m < SD_NMUSCLES; m++) {
		pair_of(a, m, &pr[m]);
		if (fabs(curve_pct(pr[m].d)) > span)
			span = fabs(curve_pct(pr[m].d));
	}
	/* The lines above and under the table are broken between words; the table gets the rows
	 * left and scrolls. */
	selected_text(a, pr, lvl, l1, sizeof l1, l2, sizeof l2);
	cl = tui_put_wrapped(3, 1, COLS - 2, 3, 2, TR_DIM, head);
	b1 = tui_wrapped_lines(COLS - 2, 2, l1);
	b2 = tui_wrapped_lines(COLS - 2, 2, l2);
	b1 = b1 > 2 ? 2 : b1;
	b2 = b2 > 2 ? 2 : b2;
	top = 4 + cl;
	rows = LINES - top - b1 - b2 - 2;
	gw = COLS - gx - 1 - 37;
	if (gw < 7)
		gw = 7;
	tui_put(top - 1, 1, 12, TR_HEAD, "muscle");
	tui_put(top - 1, 14, 5, TR_HEAD, "    A");
	tui_put(top - 1, 20, 5, TR_HEAD, "    B");
	{
		/* The arrows' heading in words, split at the centre line. */
		int half = gw / 2;
		/* Narrow gauges (80 columns) keep the short words rather than cut ones. */
		const char *l = half >= 13 ? "less with B" : "less", *r = half >= 13 ? "more with B" :
			"more";
		tui_putf(top - 1, gx + half - (int)strlen(l) - 1 > gx ? gx + half - (int)strlen(l) - 1 : gx,
			 half, TR_HEAD, "%s", l);
		tui_put(top - 1, gx + half + 2, gw - half - 2, TR_HEAD, r);
	}
	tui_put(top - 1, gx + gw + 1, 6, TR_HEAD, " diff%");
	tui_putf(top - 1, gx + gw + 8, 15, TR_HEAD, "    %d%% CI", lvl);
	tui_put(top - 1, gx + gw + 24, 12, TR_HEAD, "decision");
	tui_list_fit(&a->st.pairs, rows);
	for (int r = 0; r < a->st.pairs.rows && a->st.pairs.top + r < SD_NMUSCLES; r++) {
		int m = a->st.pairs.top + r, y = top + r, sel = m == a->st.pairs.sel;
		enum tui_role role = sel ? TR_SEL : TR_PLAIN;
		const struct cmp_diff *q = &pr[m];
		if (sel)
			tui_fill(y, 0, COLS, TR_SEL);
		tui_put(y, 1, 12, role, muscle_name(m));
		tui_putf(y, 14, 5, role, "%5.1f", q->xa);
		tui_putf(y, 20, 5, role, "%5.1f", q->xb);
		diff_gauge(a, y, gx, gw, curve_pct(q->d), span, swc);
		tui_putf(y, gx + gw + 1, 6, role, "%+6.1f", curve_pct(q->d));
		tui_putf(y, gx + gw + 8, 15, role, "%6.1f to %-6.1f", curve_pct(q->lo), curve_pct(q->hi));
		tui_put(y, gx + gw + 24, 12, sel ? role : q->decision == CMP_CLEAR_GAIN ? TR_OK :
			q->decision == CMP_CLEAR_LOSS ? TR_WARN : role, cmp_decision_name(q->decision));
	}
	tui_put_wrapped(LINES - 2 - b2 - b1, 1, COLS - 2, b1, 2, TR_PLAIN, l1);
	tui_put_wrapped(LINES - 2 - b2, 1, COLS - 2, b2, 2, TR_PLAIN, l2);
	tui_putf(LINES - 2, 1, COLS - 2, TR_DIM, "x swap A and B %s s status %s [ ] weeks %s Esc back",
		 a->unicode ? "\u00b7" : "|", a->unicode ? "\u00b7" : "|", a->unicode ? "\u00b7" : "|");
}

static void swap(struct tui_app *a)
{
	struct tui_subject t = a->a;
	a->a = a->b;
	a->b = t;
}

static int key(struct tui_app *a, int ch)
{
	int act = tui_action(keys, ch);

	if (tui_context_act(a, act))
		return 1;
	switch (act) {
	case K_UP:
		tui_list_move(&a->st.pairs, -1);
		return 1;
	case K_DOWN:
		tui_list_move(&a->st.pairs, 1);
		return 1;
	case K_PGUP:
		tui_list_page(&a->st.pairs, -1);
		return 1;
	case K_PGDN:
		tui_list_page(&a->st.pairs, 1);
		return 1;
	case K_HOME:
		tui_list_select(&a->st.pairs, 0);
		return 1;
	case K_END:
		tui_list_select(&a->st.pairs, SD_NMUSCLES - 1);
		return 1;
	case K_SWAP:
		swap(a);
		return 1;
	default:
		return 0;
	}
}

const struct tui_screen tui_compare_screen = { "compare", init, draw, key, keys };
