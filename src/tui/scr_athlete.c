/* An athlete's page: blocks (the current one first), strength tests (newest first) and the
 * personal response estimate. */
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

static void draw_response(struct tui_app *a, int y)
{
	const struct tui_resp *r = &a->resp;
	int lvl = (int)(a->ctx->opt.level * 100 + 0.5);

	tui_hline(y, 0, COLS);
	tui_put(y, 2, 20, TR_HEAD, " personal response ");
	if (!r->ok) {
		tui_putf(y + 1, 2, COLS - 3, TR_ERR, "cannot compute it: %s", r->err);
		return;
	}
	tui_putf(y + 1, 2, COLS - 3, TR_PLAIN, "%+.1f%% against the curve, %d%% interval %+.1f%% to "
		 "%+.1f%%; data weight %.2f", r->pct, lvl, r->lo, r->hi, r->weight);
	if (!r->n) {
		tui_put(y + 2, 2, COLS - 3, TR_DIM, "no completed block tested at its start and end yet: "
			"this is the prior");
		return;
	}
	tui_putf(y + 2, 2, COLS - 3, TR_DIM, "%s; from %d observation%s in %d completed block%s; "
		 "latest: block %lld %s %+.1f%% (predicted %+.1f%%, percentile %.0f)",
		 r->estimated ? "roster variances (REML)" : "prior variances", r->n, r->n == 1 ? "" : "s",
		 r->nblocks, r->nblocks == 1 ? "" : "s", r->obs[r->nobs - 1].block,
		 r->obs[r->nobs - 1].lift, r->obs[r->nobs - 1].change, r->obs[r->nobs - 1].predicted,
		 r->obs[r->nobs - 1].pctile);
}

static void draw(struct tui_app *a)
{
	const struct db_athlete *at = &a->cur;
	int top = 3, panel = 3, rows = LINES - 1 - top - panel - 1;

	tui_putf(1, 1, COLS - 2, TR_HEAD, "%s", at->name);
	tui_putf(1, 2 + tui_width(at->name), COLS - 3 - tui_width(at->name), TR_PLAIN, " %s, loads in %s%s%s",
		 at->trained ? "trained" : "untrained", at->units_lb ? "lb" : "kg",
		 at->notes[0] ? "; " : "", at->notes);
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
	draw_response(a, LINES - 1 - panel - 1);
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
