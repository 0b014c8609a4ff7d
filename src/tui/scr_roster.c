/* The roster: every athlete, narrowed by typing part of a name. */
#include <curses.h>
#include <stdio.h>
#include <string.h>

#include "app.h"

enum { K_UP = 1, K_DOWN, K_PGUP, K_PGDN, K_HOME, K_END, K_OPEN, K_NEW, K_EDIT, K_REMOVE,
       K_SHELF, K_ERASE, K_CLEAR, K_SEARCH };

static const struct tui_bind keys[] = {
	{ { '/' }, K_SEARCH, "/", "search: then type any part of a name (Enter opens, Esc clears)" },
	{ { KEY_BACKSPACE, 127, 8 }, K_ERASE, "Backspace", "take back a search letter" },
	{ { 27 }, K_CLEAR, "Esc", "clear the search (with none, leave setdose)" },
	{ { KEY_UP }, K_UP, "Up", "previous athlete" },
	{ { KEY_DOWN }, K_DOWN, "Down", "next athlete" },
	{ { KEY_PPAGE }, K_PGUP, "PgUp", "a screenful up" },
	{ { KEY_NPAGE }, K_PGDN, "PgDn", "a screenful down" },
	{ { KEY_HOME }, K_HOME, "Home", "first athlete" },
	{ { KEY_END }, K_END, "End", "last athlete" },
	{ { '\r', '\n', KEY_ENTER }, K_OPEN, "Enter", "open the athlete's page (Right too)" },
	{ { KEY_RIGHT }, K_OPEN, "Right", "open the athlete's page" },
	{ { '+' }, K_NEW, "+", "new athlete" },
	{ { '=' }, K_EDIT, "=", "edit the athlete: status, units, notes, name" },
	{ { KEY_DC }, K_REMOVE, "Delete", "remove the athlete (asks first)" },
	{ { '\t' }, K_SHELF, "Tab", "the stored templates" },
	{ { 0 }, 0, NULL, NULL },
};

static const struct db_roster_row *selected(const struct tui_app *a)
{
	if (!a->nmatch)
		return NULL;
	return &a->athletes[a->match[a->st.roster.sel]];
}

static void init(struct tui_app *a)
{
	struct sd_err e;
	sd_err_clear(&e);
	/* Read once at start and after each write (tui_reload), not on every visit. */
	if (!a->athletes && tui_load_athletes(a, &e))
		tui_say(a, 1, "%s", e.msg);
}

static void draw(struct tui_app *a)
{
	int y = 1, top = 4, rows = LINES - 2 - top - 1, wn = COLS / 3;
	char buf[96];

	if (wn < 24)
		wn = 24;
	if (wn > 40)
		wn = 40;
	tui_put(y + 1, 1, 8, TR_HEAD, "search");
	tui_putf(y + 1, 9, COLS / 2, a->st.search.len || a->st.search.active ? TR_PLAIN : TR_DIM,
		 "%s%s", a->st.search.len || a->st.search.active ? a->st.search.text :
		 "/ to search by name", a->st.search.active ? (a->unicode ? "\u258f" : "_") : "");
	snprintf(buf, sizeof buf, "%d of %d athlete%s", a->nmatch, a->nathletes,
		 a->nathletes == 1 ? "" : "s");
	tui_put(y + 1, COLS - (int)strlen(buf) - 1, (int)strlen(buf), TR_DIM, buf);
	tui_put(top - 1, 3, wn, TR_HEAD, "athlete");
	tui_put(top - 1, 3 + wn + 1, 10, TR_HEAD, "status");
	tui_put(top - 1, 3 + wn + 12, 5, TR_HEAD, "units");
	tui_put(top - 1, 3 + wn + 18, COLS, TR_HEAD, "notes");
	tui_list_fit(&a->st.roster, rows > 1 ? rows : 1);
	for (int r = 0; r < a->st.roster.rows && a->st.roster.top + r < a->nmatch; r++) {
		int i = a->st.roster.top + r;
		const struct db_roster_row *at = &a->athletes[a->match[i]];
		int sel = i == a->st.roster.sel;
		enum tui_role role = sel ? TR_SEL : TR_PLAIN;
		if (sel)
			tui_fill(top + r, 1, COLS - 2, TR_SEL);
		tui_put(top + r, 1, 2, role, sel ? (a->unicode ? "\u25b8" : ">") : " ");
		tui_put(top + r, 3, wn, role, at->name);
		tui_put(top + r, 3 + wn + 1, 10, role, at->trained ? "trained" : "untrained");
		tui_put(top + r, 3 + wn + 12, 5, role, at->units_lb ? "lb" : "kg");
		tui_put(top + r, 3 + wn + 18, COLS - (3 + wn + 18) - 1, sel ? TR_SEL : TR_DIM, at->notes);
	}
	if (!a->nmatch)
		tui_put(top, 3, COLS - 4, TR_DIM, a->nathletes ? "no athlete matches the search"
							 : "no athletes yet: + adds one; Tab, then + adds a template");
	tui_putf(LINES - 2, 1, COLS - 2, TR_DIM, "/ search %s Enter open %s + new %s = edit %s Delete "
		 "remove %s Tab templates %s q leave", a->unicode ? "\u00b7" : "|", a->unicode ? "\u00b7" : "|",
		 a->unicode ? "\u00b7" : "|", a->unicode ? "\u00b7" : "|", a->unicode ? "\u00b7" : "|",
		 a->unicode ? "\u00b7" : "|");
}

static void open_selected(struct tui_app *a)
{
	const struct db_roster_row *at = selected(a);
	struct sd_err e;

	if (!at)
		return;
	sd_err_clear(&e);
	if (tui_load_athlete(a, at->id, &e)) {
		tui_say(a, 1, "%s", e.msg);
		return;
	}
	tui_open(a, TUI_ATHLETE);
}

/* The edit form needs the whole record (notes in full). */
static void edit_selected(struct tui_app *a)
{
	struct db_athlete full;
	struct sd_err e;

	sd_err_clear(&e);
	if (db_athlete_get_id(a->ctx->db, selected(a)->id, &full, &e))
		tui_say(a, 1, "%s", e.msg);
	else
		tui_form_open_athlete(a, &full);
}

static void ask_remove(struct tui_app *a)
{
	const struct db_roster_row *at = selected(a);
	struct sd_err e;
	char q[160];
	int nb = 0, nt = 0;

	if (!at)
		return;
	sd_err_clear(&e);
	if (db_athlete_refs(a->ctx->db, at->id, &nb, &nt, &e)) {
		tui_say(a, 1, "%s", e.msg);
		return;
	}
	snprintf(q, sizeof q, "remove '%s' with %d block%s and %d test%s?", at->name, nb,
		 nb == 1 ? "" : "s", nt, nt == 1 ? "" : "s");
	a->remove_id = at->id;
	tui_confirm_open(&a->st, q, TUI_ASK_REMOVE_ATHLETE);
}

/* While the search is active, letters (q too) type into it; Enter, Esc and moving end it. */
static int search_key(struct tui_app *a, int ch)
{
	if (ch >= 32 && ch < 127) {
		if (tui_filter_add(&a->st.search, ch)) {
			tui_filter_roster(a);
			tui_list_select(&a->st.roster, 0);
		} else
			tui_say(a, 1, "the search takes at most %d characters", TUI_FILTER_MAX - 1);
		return 1;
	}
	if (tui_action(keys, ch) == K_ERASE) {
		if (tui_filter_back(&a->st.search))
			tui_filter_roster(a);
		return 1;
	}
	tui_filter_stop(&a->st.search);
	if (ch == 27) {      /* Esc ends the search and clears it; it never leaves from here */
		tui_filter_clear(&a->st.search);
		tui_filter_roster(a);
		return 1;
	}
	return 0;
}

static int key(struct tui_app *a, int ch)
{
	int act;

	if (a->st.search.active && search_key(a, ch))
		return 1;
	act = tui_action(keys, ch);
	switch (act) {
	case K_SEARCH:
		tui_filter_start(&a->st.search);
		return 1;
	case K_UP:
		tui_list_move(&a->st.roster, -1);
		return 1;
	case K_DOWN:
		tui_list_move(&a->st.roster, 1);
		return 1;
	case K_PGUP:
		tui_list_page(&a->st.roster, -1);
		return 1;
	case K_PGDN:
		tui_list_page(&a->st.roster, 1);
		return 1;
	case K_HOME:
		tui_list_select(&a->st.roster, 0);
		return 1;
	case K_END:
		tui_list_select(&a->st.roster, a->nmatch - 1);
		return 1;
	case K_OPEN:
		if (!selected(a)) {
			tui_say(a, 1, a->nathletes ? "no athlete matches the search: Esc clears it"
				: "no athletes yet: + adds one");
			return 1;
		}
		open_selected(a);
		return 1;
	case K_NEW:
		tui_form_open_athlete(a, NULL);
		return 1;
	case K_EDIT:
	case K_REMOVE:
		if (!selected(a))
			tui_say(a, 1, "no athlete selected to %s", act == K_EDIT ? "edit" : "remove");
		else if (act == K_EDIT)
			edit_selected(a);
		else
			ask_remove(a);
		return 1;
	case K_SHELF:
		tui_open(a, TUI_SHELF);
		return 1;
	case K_ERASE:
		if (!a->st.search.len)
			return 0;   /* Backspace with no search: the global key goes back */
		if (tui_filter_back(&a->st.search))
			tui_filter_roster(a);
		return 1;
	case K_CLEAR:
		if (!a->st.search.len)
			return 0;   /* Esc with no search: the global key leaves */
		tui_filter_clear(&a->st.search);
		tui_filter_roster(a);
		return 1;
	default:
		return 0;
	}
}

const struct tui_screen tui_roster_screen = { "roster", init, draw, key, keys };
