/* The stored templates: open one's dose or curve, mark one and compare it with another, or
 * edit one's text. */
#include <curses.h>
#include <stdio.h>
#include <string.h>

#include "app.h"

enum { K_UP = 1, K_DOWN, K_PGUP, K_PGDN, K_HOME, K_END, K_OPEN, K_CURVE, K_MARK, K_COMPARE,
       K_EDIT, K_ROSTER, K_ADD };

static const struct tui_bind keys[] = {
	{ { KEY_UP }, K_UP, "Up", "previous template" },
	{ { KEY_DOWN }, K_DOWN, "Down", "next template" },
	{ { KEY_PPAGE }, K_PGUP, "PgUp", "a screenful up" },
	{ { KEY_NPAGE }, K_PGDN, "PgDn", "a screenful down" },
	{ { KEY_HOME }, K_HOME, "Home", "first template" },
	{ { KEY_END }, K_END, "End", "last template" },
	{ { '\r', '\n', KEY_ENTER }, K_OPEN, "Enter", "the template's weekly dose per muscle (Right too)" },
	{ { KEY_RIGHT }, K_OPEN, "Right", "the template's weekly dose per muscle" },
	{ { 'k' }, K_CURVE, "k", "the curve with the template's muscles on it" },
	{ { ' ' }, K_MARK, "Space", "mark as A, the first of a comparison (again: unmark)" },
	{ { 'c' }, K_COMPARE, "c", "compare the marked template A with this one, B" },
	{ { 'e' }, K_EDIT, "e", "edit the text in $VISUAL or $EDITOR; stored only once valid" },
	{ { '+' }, K_ADD, "+", "add a template from a program file (its path)" },
	{ { '\t' }, K_ROSTER, "Tab", "back to the roster" },
	{ { 0 }, 0, NULL, NULL },
};

static void init(struct tui_app *a)
{
	struct sd_err e;
	sd_err_clear(&e);
	if (tui_load_programs(a, &e))
		tui_say(a, 1, "%s", e.msg);
}

static void draw(struct tui_app *a)
{
	int top = 3, rows = LINES - 2 - top - 1, wn = COLS - 40;

	if (wn > 60)
		wn = 60;
	tui_putf(1, 1, COLS - 2, TR_PLAIN, "%d stored template%s", a->nprogs, a->nprogs == 1 ? "" : "s");
	if (a->st.mark)
		for (int i = 0; i < a->nprogs; i++)
			if (a->progs[i].id == a->st.mark)
				tui_putf(1, 24, COLS - 25, TR_KEY, "A = '%s' (c compares it with the selection)",
					 a->progs[i].name);
	tui_put(top - 1, 5, wn, TR_HEAD, "template");
	tui_put(top - 1, 6 + wn, 6, TR_HEAD, "format");
	tui_put(top - 1, 13 + wn, 20, TR_HEAD, "stored (UTC)");
	tui_list_fit(&a->st.shelf, rows > 1 ? rows : 1);
	for (int r = 0; r < a->st.shelf.rows && a->st.shelf.top + r < a->nprogs; r++) {
		int i = a->st.shelf.top + r, sel = i == a->st.shelf.sel, y = top + r;
		const struct db_program *p = &a->progs[i];
		enum tui_role role = sel ? TR_SEL : TR_PLAIN;
		if (sel)
			tui_fill(y, 1, COLS - 2, TR_SEL);
		tui_put(y, 1, 2, role, sel ? (a->unicode ? "\u25b8" : ">") : " ");
		if (p->id == a->st.mark)
			tui_put(y, 3, 2, sel ? TR_SEL : TR_KEY, "A");
		tui_put(y, 5, wn, role, p->name);
		tui_put(y, 6 + wn, 6, role, p->is_csv ? "csv" : "ini");
		tui_put(y, 13 + wn, 20, sel ? TR_SEL : TR_DIM, p->created);
	}
	if (!a->nprogs)
		tui_put(top, 3, COLS - 4, TR_DIM, "no templates stored yet: + adds one from a program "
			"file");
	tui_putf(LINES - 2, 1, COLS - 2, TR_DIM, "Enter dose %s k curve %s Space mark A %s c compare "
		 "%s e edit %s + add %s Esc back", a->unicode ? "\u00b7" : "|", a->unicode ? "\u00b7" : "|",
		 a->unicode ? "\u00b7" : "|", a->unicode ? "\u00b7" : "|", a->unicode ? "\u00b7" : "|",
		 a->unicode ? "\u00b7" : "|");
}

static const struct db_program *selected(const struct tui_app *a)
{
	return a->nprogs ? &a->progs[a->st.shelf.sel] : NULL;
}

static void open_view(struct tui_app *a, enum tui_view v)
{
	const struct db_program *p = selected(a);
	struct sd_err e;

	if (!p) {
		tui_say(a, 1, "no template to show: + adds one from a program file");
		return;
	}
	sd_err_clear(&e);
	if (tui_subject_template(a, &a->a, p->id, 1, &e)) {
		tui_say(a, 1, "%s", e.msg);
		return;
	}
	tui_open(a, v);
}

static void compare(struct tui_app *a)
{
	const struct db_program *p = selected(a);
	struct sd_err e;

	if (!p)
		return;
	if (!a->st.mark) {
		tui_say(a, 1, "mark the first template with Space, then select the second and press c");
		return;
	}
	if (a->st.mark == p->id) {
		tui_say(a, 1, "select a different template than A to compare");
		return;
	}
	sd_err_clear(&e);
	if (tui_subject_template(a, &a->a, a->st.mark, 1, &e) ||
	    tui_subject_template(a, &a->b, p->id, 0, &e)) {
		tui_say(a, 1, "%s", e.msg);
		return;
	}
	tui_open(a, TUI_COMPARE);
}

static int key(struct tui_app *a, int ch)
{
	switch (tui_action(keys, ch)) {
	case K_UP:
		tui_list_move(&a->st.shelf, -1);
		return 1;
	case K_DOWN:
		tui_list_move(&a->st.shelf, 1);
		return 1;
	case K_PGUP:
		tui_list_page(&a->st.shelf, -1);
		return 1;
	case K_PGDN:
		tui_list_page(&a->st.shelf, 1);
		return 1;
	case K_HOME:
		tui_list_select(&a->st.shelf, 0);
		return 1;
	case K_END:
		tui_list_select(&a->st.shelf, a->nprogs - 1);
		return 1;
	case K_OPEN:
		open_view(a, TUI_DOSE);
		return 1;
	case K_CURVE:
		open_view(a, TUI_CURVE);
		return 1;
	case K_MARK:
		if (selected(a))
			tui_say(a, 0, tui_mark_toggle(&a->st, selected(a)->id) ?
				"marked as A: select another template and press c" : "mark cleared");
		else
			tui_say(a, 1, "no template to mark: + adds one from a program file");
		return 1;
	case K_ADD:
		tui_form_open_add_template(a);
		return 1;
	case K_COMPARE:
		compare(a);
		return 1;
	case K_EDIT:
		if (selected(a))
			tui_edit_template(a, selected(a)->id);
		else
			tui_say(a, 1, "no template to edit: + adds one from a program file");
		return 1;
	case K_ROSTER:
		tui_nav_reset(&a->st.nav, TUI_ROSTER);
		return 1;
	default:
		return 0;
	}
}

const struct tui_screen tui_shelf_screen = { "templates", init, draw, key, keys };
