/* The full-screen interface's screen state without a terminal: list selection and scrolling,
 * the roster search, the view stack, the curve cursor, the context toggles, forms and scroll
 * panes. */
#include "testutil.h"

#include <string.h>

#include "tui/state.h"

static void list_moves_and_clamps(void **state)
{
	struct tui_list l = { 0 };
	(void)state;
	tui_list_reset(&l, 10);
	tui_list_fit(&l, 4);
	assert_int_equal(l.sel, 0);
	assert_int_equal(l.top, 0);
	tui_list_move(&l, -1);
	assert_int_equal(l.sel, 0);
	tui_list_move(&l, 3);
	assert_int_equal(l.sel, 3);
	assert_int_equal(l.top, 0);
	tui_list_move(&l, 1);             /* row 4 is below the window: scroll one */
	assert_int_equal(l.sel, 4);
	assert_int_equal(l.top, 1);
	tui_list_move(&l, 100);
	assert_int_equal(l.sel, 9);
	assert_int_equal(l.top, 6);
	assert_true(tui_list_visible(&l, 9));
	assert_false(tui_list_visible(&l, 5));
	tui_list_select(&l, -5);
	assert_int_equal(l.sel, 0);
	assert_int_equal(l.top, 0);
}

static void list_pages(void **state)
{
	struct tui_list l = { 0 };
	(void)state;
	tui_list_reset(&l, 30);
	tui_list_fit(&l, 10);
	tui_list_page(&l, 1);             /* a screenful keeps one row of context */
	assert_int_equal(l.sel, 9);
	assert_int_equal(l.top, 9);
	tui_list_page(&l, 1);
	tui_list_page(&l, 1);
	assert_int_equal(l.sel, 27);
	assert_int_equal(l.top, 20);      /* never empty space below the last row */
	tui_list_page(&l, -1);
	assert_int_equal(l.sel, 18);
	assert_int_equal(l.top, 11);
}

static void list_resize_and_shrink(void **state)
{
	struct tui_list l = { 0 };
	(void)state;
	tui_list_reset(&l, 20);
	tui_list_fit(&l, 5);
	tui_list_select(&l, 12);
	assert_int_equal(l.top, 8);
	tui_list_fit(&l, 15);             /* the window grows: no gap below the end */
	assert_int_equal(l.top, 5);
	assert_int_equal(l.sel, 12);
	tui_list_fit(&l, 2);              /* and shrinks: the selection stays in sight */
	assert_true(tui_list_visible(&l, 12));
	tui_list_count(&l, 3);            /* rows removed under the selection */
	assert_int_equal(l.sel, 2);
	assert_int_equal(l.top, 1);
	tui_list_count(&l, 0);
	assert_int_equal(l.sel, 0);
	assert_int_equal(l.top, 0);
	tui_list_move(&l, 1);
	assert_int_equal(l.sel, 0);
	tui_list_fit(&l, 0);              /* at least one row */
	assert_int_equal(l.rows, 1);
}

static void list_skips_headings(void **state)
{
	/* heading, block, block, heading, test */
	const unsigned char ok[] = { 0, 1, 1, 0, 1 };
	const unsigned char none[] = { 0, 0, 0 };
	struct tui_list l = { 0 };
	(void)state;
	tui_list_reset(&l, 5);
	tui_list_fit(&l, 5);
	tui_list_move_skip(&l, 0, ok);
	assert_int_equal(l.sel, 1);
	tui_list_move_skip(&l, 1, ok);
	assert_int_equal(l.sel, 2);
	tui_list_move_skip(&l, 1, ok);    /* over the heading */
	assert_int_equal(l.sel, 4);
	tui_list_move_skip(&l, 1, ok);    /* nothing below: stays */
	assert_int_equal(l.sel, 4);
	tui_list_move_skip(&l, -1, ok);
	assert_int_equal(l.sel, 2);
	tui_list_move_skip(&l, -10, ok);  /* past the top heading: the first selectable row */
	assert_int_equal(l.sel, 1);
	tui_list_move_skip(&l, 10, ok);
	assert_int_equal(l.sel, 4);
	tui_list_reset(&l, 3);
	tui_list_move_skip(&l, 1, none);  /* nothing selectable at all: unchanged */
	assert_int_equal(l.sel, 0);
}

static void filter_types_and_matches(void **state)
{
	struct tui_filter f = { 0 };
	(void)state;
	assert_true(tui_filter_match(&f, "anyone"));
	assert_true(tui_filter_add(&f, 'O'));
	assert_true(tui_filter_add(&f, 'a'));
	assert_false(tui_filter_add(&f, '\n'));
	assert_false(tui_filter_add(&f, 200));
	assert_string_equal(f.text, "Oa");
	assert_true(tui_filter_match(&f, "Maren Oakhollow"));
	assert_true(tui_filter_match(&f, "KOALA"));
	assert_false(tui_filter_match(&f, "Tobin"));
	assert_false(tui_filter_match(&f, "o"));
	assert_true(tui_filter_back(&f));
	assert_string_equal(f.text, "O");
	tui_filter_clear(&f);
	assert_int_equal(f.len, 0);
	assert_false(tui_filter_back(&f));
	for (int i = 0; i < 100; i++)
		tui_filter_add(&f, 'x');
	assert_int_equal(f.len, TUI_FILTER_MAX - 1);
	assert_int_equal((int)strlen(f.text), TUI_FILTER_MAX - 1);
}

static void nav_stack(void **state)
{
	struct tui_nav n;
	(void)state;
	tui_nav_reset(&n, TUI_ROSTER);
	assert_int_equal(tui_nav_pop(&n), -1);
	assert_int_equal(tui_nav_top(&n), TUI_ROSTER);
	tui_nav_push(&n, TUI_ATHLETE);
	tui_nav_push(&n, TUI_DOSE);
	tui_nav_push(&n, TUI_CURVE);
	assert_int_equal(tui_nav_top(&n), TUI_CURVE);
	assert_int_equal(tui_nav_pop(&n), 0);
	assert_int_equal(tui_nav_top(&n), TUI_DOSE);
	tui_nav_swap(&n, TUI_COMPARE);
	assert_int_equal(tui_nav_top(&n), TUI_COMPARE);
	assert_int_equal(n.depth, 3);
	/* A full stack forgets the second-deepest view; the way back still ends at the first. */
	for (int i = 0; i < 20; i++)
		tui_nav_push(&n, i % 2 ? TUI_DOSE : TUI_CURVE);
	assert_int_equal(n.depth, TUI_NAV_MAX);
	while (tui_nav_pop(&n) == 0)
		;
	assert_int_equal(tui_nav_top(&n), TUI_ROSTER);
}

static void cursor_steps(void **state)
{
	struct tui_cursor c;
	const double doses[] = { 12.5, 3.0, 7.5 };
	(void)state;
	tui_cursor_reset(&c, 0, 30, 8);
	for (int i = 0; i < 3; i++)
		tui_cursor_move(&c, 0.1);
	assert_true(c.x == 8.3);          /* rounded to tenths: no drift after repeated steps */
	tui_cursor_move(&c, 100);
	assert_near(c.x, 30, 0);
	tui_cursor_move(&c, -0.5);
	assert_near(c.x, 29.5, 1e-12);
	tui_cursor_set(&c, -4);
	assert_near(c.x, 0, 0);
	assert_int_equal(tui_cursor_next(&c, doses, 3), 1);
	assert_near(c.x, 3.0, 0);
	assert_int_equal(tui_cursor_next(&c, doses, 3), 2);
	assert_int_equal(tui_cursor_next(&c, doses, 3), 0);
	assert_near(c.x, 12.5, 0);
	assert_int_equal(tui_cursor_next(&c, doses, 3), 1);   /* wraps to the smallest */
	assert_int_equal(tui_cursor_next(&c, doses, 0), -1);
	tui_cursor_reset(&c, 0, 20, 25);
	assert_near(c.x, 20, 0);
	tui_cursor_reset(&c, 5, 1, 3);    /* an empty range collapses to its start */
	assert_near(c.x, 5, 0);
}

static void context_toggles(void **state)
{
	struct tui_context c;
	(void)state;
	tui_context_reset(&c, 1, 10.3);
	assert_false(tui_context_changed(&c));
	tui_context_toggle_status(&c);
	assert_int_equal(c.trained, 0);
	assert_true(tui_context_changed(&c));
	tui_context_toggle_status(&c);
	tui_context_weeks(&c, 1);
	assert_near(c.weeks, 11.3, 1e-12);
	assert_true(tui_context_changed(&c));
	tui_context_weeks(&c, -1);
	assert_false(tui_context_changed(&c));
	tui_context_weeks(&c, -50);
	assert_near(c.weeks, TUI_WEEKS_MIN, 0);
	tui_context_weeks(&c, 500);
	assert_near(c.weeks, TUI_WEEKS_MAX, 0);
	tui_context_reset(&c, 7, 0);      /* clamped */
	assert_int_equal(c.trained, 1);
	assert_near(c.weeks, TUI_WEEKS_MIN, 0);
}

static void form_fields(void **state)
{
	static const char *const opts[] = { "untrained", "trained", "tested" };
	struct tui_form f;
	(void)state;
	tui_form_reset(&f, "new athlete", 7);
	assert_int_equal(tui_form_text(&f, "name", "Ann"), 0);
	assert_int_equal(tui_form_choice(&f, "status", opts, 3, 1), 1);
	assert_int_equal(tui_form_text(&f, "notes", NULL), 2);
	assert_int_equal(f.kind, 7);
	assert_int_equal(f.cur, 0);
	assert_true(tui_form_type(&f, 'e'));
	assert_string_equal(tui_form_value(&f, 0), "Anne");
	assert_true(tui_form_back(&f));
	assert_string_equal(tui_form_value(&f, 0), "Ann");
	assert_false(tui_form_cycle(&f, 1));     /* not a choice field */
	tui_form_focus(&f, 1);
	assert_string_equal(tui_form_value(&f, 1), "trained");
	assert_true(tui_form_cycle(&f, 1));
	assert_string_equal(tui_form_value(&f, 1), "tested");
	assert_true(tui_form_cycle(&f, 1));      /* wraps */
	assert_string_equal(tui_form_value(&f, 1), "untrained");
	assert_true(tui_form_cycle(&f, -1));
	assert_string_equal(tui_form_value(&f, 1), "tested");
	assert_true(tui_form_type(&f, 'T'));     /* next option starting with t: wraps to trained */
	assert_string_equal(tui_form_value(&f, 1), "trained");
	assert_false(tui_form_type(&f, 'x'));
	assert_false(tui_form_back(&f));
	tui_form_focus(&f, 1);
	tui_form_focus(&f, 1);                   /* wraps to the first field */
	assert_int_equal(f.cur, 0);
	tui_form_focus(&f, -1);
	assert_int_equal(f.cur, 2);
	tui_form_focus_on(&f, 99);
	assert_int_equal(f.cur, 2);
	assert_string_equal(tui_form_value(&f, 9), "");
	for (int i = 0; i < 2 * TUI_FIELD_MAX; i++)
		tui_form_type(&f, 'z');
	assert_int_equal((int)strlen(tui_form_value(&f, 2)), TUI_FIELD_MAX - 1);
	for (int i = 3; i < TUI_FORM_FIELDS; i++)
		assert_int_equal(tui_form_text(&f, "more", ""), i);
	assert_int_equal(tui_form_text(&f, "one too many", ""), -1);
}

static void scroll_pane(void **state)
{
	struct tui_scroll s = { 0 };
	(void)state;
	tui_scroll_reset(&s, 50);
	tui_scroll_fit(&s, 20);
	tui_scroll_by(&s, 100);
	assert_int_equal(s.off, 30);
	tui_scroll_fit(&s, 45);           /* a taller pane pulls the offset back */
	assert_int_equal(s.off, 5);
	tui_scroll_total(&s, 10);
	assert_int_equal(s.off, 0);
	tui_scroll_by(&s, -3);
	assert_int_equal(s.off, 0);
}

static void whole_state(void **state)
{
	struct tui_state s;
	(void)state;
	tui_state_init(&s);
	assert_int_equal(tui_nav_top(&s.nav), TUI_ROSTER);
	assert_int_equal(s.overlay, TUI_OV_NONE);
	tui_overlay_open(&s, TUI_OV_HELP);
	assert_int_equal(s.overlay, TUI_OV_HELP);
	tui_overlay_close(&s);
	tui_confirm_open(&s, "remove 'Ann'?", 42);
	assert_int_equal(s.overlay, TUI_OV_CONFIRM);
	assert_string_equal(s.confirm, "remove 'Ann'?");
	assert_int_equal(s.confirm_kind, 42);
	assert_true(tui_mark_toggle(&s, 5));
	assert_int_equal(s.mark, 5);
	assert_true(tui_mark_toggle(&s, 6));  /* marking another moves the mark */
	assert_int_equal(s.mark, 6);
	assert_false(tui_mark_toggle(&s, 6));
	assert_int_equal(s.mark, 0);
	assert_false(s.warn_pane);
	tui_warn_pane_toggle(&s);
	assert_true(s.warn_pane);
}

int main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(list_moves_and_clamps),
		cmocka_unit_test(list_pages),
		cmocka_unit_test(list_resize_and_shrink),
		cmocka_unit_test(list_skips_headings),
		cmocka_unit_test(filter_types_and_matches),
		cmocka_unit_test(nav_stack),
		cmocka_unit_test(cursor_steps),
		cmocka_unit_test(context_toggles),
		cmocka_unit_test(form_fields),
		cmocka_unit_test(scroll_pane),
		cmocka_unit_test(whole_state),
	};
	return cmocka_run_group_tests(tests, NULL, NULL);
}
