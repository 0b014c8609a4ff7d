/* An athlete's page: blocks (the current one first), strength tests (newest first), the
 * training log of the current block (weeks done against planned per muscle, the logged
 * average dose, each lift's e1RM trend) when it has logged sets, and the personal response
 * estimate. */
#include <curses.h>
#include <stdio.h>
#include <string.h>

#include "../app/blocks.h"
#include "../app/parse.h"
#include "../core/curve.h"
#include "../core/units.h"
#include "app.h"

enum { K_UP = 1, K_DOWN, K_PGUP, K_PGDN, K_HOME, K_END, K_OPEN, K_CURVE, K_BLOCK, K_TEST,
       K_END_BLOCK, K_EDIT };

static const struct tui_bind keys[] = {
	{ { KEY_UP }, K_UP, "Up", "previous block or test" },
	{ { KEY_DOWN }, K_DOWN, "Down", "next block or test" },
	{ { KEY_PPAGE }, K_PGUP, "PgUp", "a screenful up" },
	{ { KEY_NPAGE }, K_PGDN, "PgDn", "a screenful down" },
	{ { KEY_HOME }, K_HOME, "Home", "first row" },
	{ { KEY_END }, K_END, "End", "last row" },
	{ { '\r', '\n', KEY_ENTER }, K_OPEN, "Enter", "the block's weekly dose per muscle (Right too)" },
	{ { KEY_RIGHT }, K_OPEN, "Right", "the block's weekly dose per muscle" },
	{ { 'k' }, K_CURVE, "k", "the curve with the block's muscles on it" },
	{ { 'b' }, K_BLOCK, "b", "start a block (athlete, template, start date)" },
	{ { 't' }, K_TEST, "t", "log a strength test" },
	{ { 'f' }, K_END_BLOCK, "f", "finish the selected open block: asks the end date (today)" },
	{ { '=' }, K_EDIT, "=", "edit the athlete: status, units, notes, name" },
	{ { 0 }, 0, NULL, NULL },
};

static void init(struct tui_app *a)
{
	tui_list_reset(&a->st.athlete, a->nrows);
	/* Room for the headings above the first block; the draw fits the real height. */
	tui_list_fit(&a->st.athlete, LINES > 2 ? LINES : 2);
	/* Start on the first selectable row: the current block, else the newest test. */
	tui_list_move_skip(&a->st.athlete, 0, a->row_ok);
}

static void draw_block(struct tui_app *a, int y, int i, int sel)
{
	const struct db_block *b = &a->blocks[i];
	enum tui_role role = sel ? TR_SEL : TR_PLAIN;
	int cur = i == tui_current_block(a);
	char when[48], today[DB_DATE_LEN];
	int overdue;

	tui_today(today);
	overdue = app_block_overdue(b, today);
	if (b->end[0])
		snprintf(when, sizeof when, "%s to %s", b->start, b->end);
	else
		snprintf(when, sizeof when, "%s, open", b->start);
	tui_putf(y, 3, 7, role, "#%lld", b->id);
	tui_put(y, 10, 26, role, when);
	tui_putf(y, 36, 6, role, "%3d wk", b->weeks);
	tui_put(y, 43, COLS - 43 - 12, role, b->program);
	/* An open block past its planned end is flagged before "current": it was likely never
	 * ended (app_block_overdue). */
	if (overdue)
		tui_putf(y, COLS - 10, 9, sel ? TR_SEL : TR_WARN, "%dd over", overdue);
	else if (cur)
		tui_put(y, COLS - 10, 9, sel ? TR_SEL : TR_OK, "current");
	else if (!b->end[0])
		tui_put(y, COLS - 10, 9, sel ? TR_SEL : TR_DIM, "open");
}

static void draw_test(struct tui_app *a, int y, int i, int sel)
{
	const struct db_test *t = &a->tests[i];
	enum tui_role role = sel ? TR_SEL : TR_PLAIN;
	int lb = app_lb(a->ctx, &a->cur);
	const char *u = units_name(lb);

	tui_put(y, 3, 11, role, t->date);
	tui_put(y, 15, 24, role, t->lift);
	tui_putf(y, 40, 18, role, "%7.1f %s x %d", units_show(t->load_kg, lb), u, t->reps);
	tui_putf(y, 59, 18, role, "1RM %.1f %s", units_show(t->e1rm_kg, lb), u);
	if (COLS > 90)
		tui_put(y, 78, COLS - 79, sel ? TR_SEL : TR_DIM, t->formula);
}

/* The personal response's two paragraphs: the estimate, and where it comes from. */
static void response_text(struct tui_app *a, char *l1, char *l2, size_t n)
{
	const struct tui_resp *r = &a->resp;
	int lvl = (int)(a->ctx->opt.level * 100 + 0.5);

	if (!r->ok) {
		snprintf(l1, n, "cannot compute it: %s", r->err);
		l2[0] = '\0';
		return;
	}
	snprintf(l1, n, "%+.1f%% against the curve, %d%% interval %+.1f%% to %+.1f%%; data weight %.2f",
		 r->pct, lvl, r->lo, r->hi, r->weight);
	if (!r->n) {
		snprintf(l2, n, "no completed block tested at its start and end yet: this is the prior");
		return;
	}
	snprintf(l2, n, "%s; from %d observation%s in %d completed block%s; latest: block %lld %s "
		 "%+.1f%% (predicted %+.1f%%, percentile %.0f)",
		 r->estimated ? "roster variances (REML)" : "prior variances", r->n, r->n == 1 ? "" : "s",
		 r->nblocks, r->nblocks == 1 ? "" : "s", r->obs[r->nobs - 1].block,
		 r->obs[r->nobs - 1].lift, r->obs[r->nobs - 1].change, r->obs[r->nobs - 1].predicted,
		 r->obs[r->nobs - 1].pctile);
}

/* Log panel cells: a muscle's strip (name, a cell per week, average done/planned) and a
 * lift's trend take about this many columns; as many as fit go side by side. */
#define LOG_CELL_W 38

static int log_percol(void)
{
	int n = (COLS - 2) / LOG_CELL_W;
	return n < 1 ? 1 : n;
}

static int log_lift_rows(const struct tui_app *a)
{
	int n = (a->log.nlift + log_percol() - 1) / log_percol();
	return n > 2 ? 2 : n;
}

/* Rows the log panel takes: a title, the strips, the lifts; at most a third of the screen. */
static int log_rows(const struct tui_app *a)
{
	int avail = LINES / 3, strips;

	if (!a->log.ok && !a->log.err[0])
		return 0;
	if (!a->log.ok)
		return 2;
	strips = (a->log.nmus + log_percol() - 1) / log_percol();
	if (strips > avail - 1 - log_lift_rows(a))
		strips = avail - 1 - log_lift_rows(a);
	return 1 + (strips > 0 ? strips : 0) + log_lift_rows(a);
}

/* A week's cell: how much of the planned dose was done, in eight steps (ASCII: five). */
static void week_cell(struct tui_app *a, int y, int x, double r)
{
	static const char *const bars[] = { "\u2581", "\u2582", "\u2583", "\u2584", "\u2585",
					    "\u2586", "\u2587", "\u2588" };
	static const char *const ascii[] = { "_", "-", "=", "+", "#" };
	enum tui_role role = r >= 0.9 ? TR_OK : r >= 0.5 ? TR_PLAIN : TR_WARN;
	const char *g;

	if (r < 0) {
		tui_put(y, x, 1, TR_DIM, " ");
		return;
	}
	if (r == 0)
		g = a->unicode ? "\u00b7" : ".";
	else if (a->unicode)
		g = bars[r >= 1 ? 7 : (int)(r * 8)];
	else
		g = ascii[r >= 1 ? 4 : (int)(r * 5)];
	tui_put(y, x, 1, role, g);
}

/* A lift's weekly bests as a line of bars between its lowest and highest week. */
static void sparkline(struct tui_app *a, int y, int x, const struct tui_liftrend *l)
{
	double lo = l->v[0], hi = l->v[0];

	for (int i = 1; i < l->n; i++) {
		lo = l->v[i] < lo ? l->v[i] : lo;
		hi = l->v[i] > hi ? l->v[i] : hi;
	}
	for (int i = 0; i < l->n; i++)
		week_cell(a, y, x + i, hi > lo ? 0.125 + 0.875 * (l->v[i] - lo) / (hi - lo) : 1);
}

static void draw_log(struct tui_app *a, int y, int nrows)
{
	const struct tui_logview *lv = &a->log;
	int percol = log_percol(), lifts = log_lift_rows(a), strips = nrows - 1 - lifts;
	int lb = app_lb(a->ctx, &a->cur), nw = lv->nweeks;
	char title[160];

	tui_hline(y, 0, COLS);
	if (!lv->ok) {
		tui_put(y, 2, 16, TR_HEAD, " training log ");
		tui_putf(y + 1, 2, COLS - 3, TR_ERR, "cannot show it: %s", lv->err);
		return;
	}
	snprintf(title, sizeof title, " training log, block #%lld, %s to %s: weeks done/planned, "
		 "average ", lv->block, lv->first, lv->last);
	tui_put(y, 2, COLS - 4, TR_HEAD, title);
	for (int k = 0; k < strips * percol && k < lv->nmus; k++) {
		int m = lv->order[k], row = y + 1 + k / percol, x = 1 + (k % percol) * LOG_CELL_W;
		tui_putf(row, x, 12, TR_PLAIN, "%-11s", muscle_name(m));
		for (int i = 0; i < nw; i++)
			week_cell(a, row, x + 12 + i, lv->ratio[i][m]);
		tui_putf(row, x + 13 + nw, LOG_CELL_W - 14 - nw, TR_PLAIN, "%4.1f/%.1f", lv->done[m],
			 lv->planned[m]);
	}
	for (int k = 0; k < lifts * percol && k < lv->nlift; k++) {
		const struct tui_liftrend *l = &lv->lift[k];
		int row = y + 1 + strips + k / percol, x = 1 + (k % percol) * LOG_CELL_W;
		int w = tui_putf(row, x, 17, TR_PLAIN, "%.16s", l->lift);
		sparkline(a, row, x + w + 1, l);
		tui_putf(row, x + w + 2 + l->n, LOG_CELL_W - w - 3 - l->n, TR_PLAIN, "e1RM %.1f %s",
			 units_show(l->v[l->n - 1], lb), units_name(lb));
	}
}

/* The panel under the lists, its text broken between words; n1 and n2 lines of it. */
static void draw_response(struct tui_app *a, int y, const char *l1, int n1, const char *l2, int n2)
{
	tui_hline(y, 0, COLS);
	tui_put(y, 2, 20, TR_HEAD, " personal response ");
	tui_put_wrapped(y + 1, 2, COLS - 3, n1, 2, a->resp.ok ? TR_PLAIN : TR_ERR, l1);
	tui_put_wrapped(y + 1 + n1, 2, COLS - 3, n2, 2, TR_DIM, l2);
}

static void draw(struct tui_app *a)
{
	const struct db_athlete *at = &a->cur;
	char head[1200], l1[300], l2[400];
	int top = 3, panel, rows, n1, n2, logrows = log_rows(a);

	/* The name and what is known of the athlete on the two lines above the lists, broken
	 * between words; the name drawn again over its own words, in the heading's role. */
	snprintf(head, sizeof head, "%s  %s, loads in %s%s%s", at->name,
		 at->trained ? "trained" : "untrained", at->units_lb ? "lb" : "kg",
		 at->notes[0] ? "; " : "", at->notes);
	tui_put_wrapped(1, 1, COLS - 2, 2, 2, TR_PLAIN, head);
	if (tui_width(at->name) <= COLS - 2)
		tui_put(1, 1, COLS - 2, TR_HEAD, at->name);
	response_text(a, l1, l2, sizeof l1);
	n1 = tui_wrapped_lines(COLS - 3, 2, l1);
	n2 = tui_wrapped_lines(COLS - 3, 2, l2);
	/* The panel takes what its text needs, keeping at least 4 list rows (then it is cut). */
	while (n1 + n2 > 2 && LINES - 1 - top - (1 + n1 + n2) - 1 - logrows < 4)
		n2 > 1 ? n2-- : n1--;
	panel = 1 + n1 + n2;
	rows = LINES - 1 - top - panel - 1 - logrows;
	tui_list_fit(&a->st.athlete, rows > 1 ? rows : 1);
	for (int r = 0; r < a->st.athlete.rows && a->st.athlete.top + r < a->nrows; r++) {
		int i = a->st.athlete.top + r, idx, y = top + r;
		int kind = tui_athlete_row(a, i, &idx), sel = i == a->st.athlete.sel;
		if (sel)
			tui_fill(y, 1, COLS - 2, TR_SEL);
		switch (kind) {
		case TUI_ROW_HEAD:
			tui_put(y, 1, COLS - 2, TR_HEAD, idx < 0 && i == 0 ?
				"blocks (current first)" : "strength tests (newest first)");
			break;
		case TUI_ROW_BLOCK:
			draw_block(a, y, idx, sel);
			break;
		case TUI_ROW_TEST:
			draw_test(a, y, idx, sel);
			break;
		default:
			tui_put(y, 3, COLS - 4, TR_DIM, i == 1 ? "no blocks yet: b starts one"
							 : "no tests yet: t logs one");
			break;
		}
	}
	if (logrows)
		draw_log(a, LINES - 1 - panel - 1 - logrows, logrows);
	draw_response(a, LINES - 1 - panel - 1, l1, n1, l2, n2);
	tui_putf(LINES - 2, 1, COLS - 2, TR_DIM, "Enter dose %s k curve %s b block %s t test %s "
		 "f finish %s Esc back", a->unicode ? "\u00b7" : "|", a->unicode ? "\u00b7" : "|",
		 a->unicode ? "\u00b7" : "|", a->unicode ? "\u00b7" : "|", a->unicode ? "\u00b7" : "|");
}

/* The block the selection is on; with a test selected, the current block. */
static const struct db_block *chosen_block(const struct tui_app *a)
{
	int idx, kind = tui_athlete_row(a, a->st.athlete.sel, &idx);
	if (kind == TUI_ROW_BLOCK)
		return &a->blocks[idx];
	idx = tui_current_block(a);
	return idx >= 0 ? &a->blocks[idx] : NULL;
}

static void open_block(struct tui_app *a, int curve)
{
	const struct db_block *b = chosen_block(a);
	struct sd_err e;

	if (!b) {
		tui_say(a, 1, "no block to show: b starts one");
		return;
	}
	sd_err_clear(&e);
	if (tui_subject_block(a, &a->a, b, 1, &e)) {
		tui_say(a, 1, "%s", e.msg);
		return;
	}
	tui_open(a, curve ? TUI_CURVE : TUI_DOSE);
}

static void ask_end(struct tui_app *a)
{
	int idx, kind = tui_athlete_row(a, a->st.athlete.sel, &idx);

	if (kind == TUI_ROW_TEST)
		tui_say(a, 1, "f finishes a block; this row is a strength test: select an open block");
	else if (kind != TUI_ROW_BLOCK)
		tui_say(a, 1, "f finishes a block; %s", a->nblocks ? "select an open block" :
			"this athlete has no blocks yet (b starts one)");
	else if (a->blocks[idx].end[0])
		tui_say(a, 1, "block %lld already finished on %s", a->blocks[idx].id, a->blocks[idx].end);
	else
		tui_form_open_end(a, &a->blocks[idx]);
}

static int key(struct tui_app *a, int ch)
{
	switch (tui_action(keys, ch)) {
	case K_UP:
		tui_list_move_skip(&a->st.athlete, -1, a->row_ok);
		return 1;
	case K_DOWN:
		tui_list_move_skip(&a->st.athlete, 1, a->row_ok);
		return 1;
	case K_PGUP:
		tui_list_move_skip(&a->st.athlete, -a->st.athlete.rows, a->row_ok);
		return 1;
	case K_PGDN:
		tui_list_move_skip(&a->st.athlete, a->st.athlete.rows, a->row_ok);
		return 1;
	case K_HOME:
		tui_list_move_skip(&a->st.athlete, -a->nrows, a->row_ok);
		return 1;
	case K_END:
		tui_list_move_skip(&a->st.athlete, a->nrows, a->row_ok);
		return 1;
	case K_OPEN: {
		int idx;
		if (tui_athlete_row(a, a->st.athlete.sel, &idx) == TUI_ROW_TEST) {
			tui_say(a, 0, "a test: k shows the curve of the current block");
			return 1;
		}
		open_block(a, 0);
		return 1;
	}
	case K_CURVE:
		open_block(a, 1);
		return 1;
	case K_BLOCK:
		tui_form_open_block(a, a->cur.id);
		return 1;
	case K_TEST:
		tui_form_open_test(a);
		return 1;
	case K_END_BLOCK:
		ask_end(a);
		return 1;
	case K_EDIT:
		tui_form_open_athlete(a, &a->cur);
		return 1;
	default:
		return 0;
	}
}

const struct tui_screen tui_athlete_screen = { "athlete", init, draw, key, keys };
