/* Screen state of the full-screen interface as plain structs: list selection and scrolling,
 * the roster's search text, the view stack, the curve cursor, the context toggles and the
 * entry forms. No terminal is involved, so all of it is unit-tested (tests/test_tui_state.c).
 *
 * Contract: these functions are the only code that writes these structs; screens read the
 * fields and change them only through the functions below. Nothing here allocates. */
#ifndef SD_TUI_STATE_H
#define SD_TUI_STATE_H

#include "../core/limits.h"

/* A selectable, scrollable list of n rows of which `rows` fit on screen. */
struct tui_list {
	int n;          /* rows in the list */
	int sel;        /* selected row, 0..n-1; 0 when n == 0 */
	int top;        /* first visible row */
	int rows;       /* visible rows (at least 1) */
};

/* Empties the list (n rows, selection and scroll at the top). */
void tui_list_reset(struct tui_list *l, int n);
/* Changes the row count, keeping the selection where it can. */
void tui_list_count(struct tui_list *l, int n);
/* Sets how many rows fit and scrolls so the selection stays visible. */
void tui_list_fit(struct tui_list *l, int rows);
/* Moves the selection by delta rows (clamped). */
void tui_list_move(struct tui_list *l, int delta);
/* Moves by one screenful: dir > 0 down, dir < 0 up. */
void tui_list_page(struct tui_list *l, int dir);
/* Selects row i (clamped). */
void tui_list_select(struct tui_list *l, int i);
/* Moves by delta rows, then on in the same direction past rows whose ok[] is 0 (headings);
 * stays put when no selectable row lies that way. ok has n entries. */
void tui_list_move_skip(struct tui_list *l, int delta, const unsigned char *ok);
/* 1 when row i is on screen. */
int tui_list_visible(const struct tui_list *l, int i);

/* The roster's search text. Typing goes into it only while it is active ('/' starts it), so
 * letters such as q keep their meaning on the list. */
#define TUI_FILTER_MAX 48
struct tui_filter {
	char text[TUI_FILTER_MAX];
	int len;
	int active;
};

/* Starts typing into the search, or stops (the text stays and keeps filtering). */
void tui_filter_start(struct tui_filter *f);
void tui_filter_stop(struct tui_filter *f);

/* Adds a printable ASCII character; returns 1 when the text changed. */
int tui_filter_add(struct tui_filter *f, int ch);
/* Removes the last character; returns 1 when the text changed. */
int tui_filter_back(struct tui_filter *f);
void tui_filter_clear(struct tui_filter *f);
/* 1 when name contains the text, ignoring ASCII case (an empty text matches everything). */
int tui_filter_match(const struct tui_filter *f, const char *name);

/* The views, in a stack: Esc goes back to the one below. */
enum tui_view {
	TUI_ROSTER, TUI_ATHLETE, TUI_SHELF, TUI_DOSE, TUI_CURVE, TUI_COMPARE, TUI_NVIEWS
};
#define TUI_NAV_MAX 8
struct tui_nav {
	enum tui_view stack[TUI_NAV_MAX];
	int depth;      /* entries in stack; the top is the current view */
};

/* Starts with one view. */
void tui_nav_reset(struct tui_nav *n, enum tui_view v);
/* Opens v over the current view (the deepest view is replaced when the stack is full). */
void tui_nav_push(struct tui_nav *n, enum tui_view v);
/* Goes back; returns 0, or -1 at the bottom view (nothing popped). */
int tui_nav_pop(struct tui_nav *n);
/* Replaces the current view. */
void tui_nav_swap(struct tui_nav *n, enum tui_view v);
enum tui_view tui_nav_top(const struct tui_nav *n);

/* A cursor on the dose axis of the curve: a dose in weekly fractional sets inside [lo, hi]. */
struct tui_cursor {
	double x, lo, hi;
};

/* Sets the range and puts the cursor at x (clamped). */
void tui_cursor_reset(struct tui_cursor *c, double lo, double hi, double x);
/* Moves by dx, clamped to the range, and rounded to tenths so repeated steps do not drift. */
void tui_cursor_move(struct tui_cursor *c, double dx);
void tui_cursor_set(struct tui_cursor *c, double x);
/* Moves to the nearest of the k doses strictly right of the cursor (wrapping to the
 * smallest); returns the index chosen, -1 when k == 0. */
int tui_cursor_next(struct tui_cursor *c, const double *doses, int k);

/* The athlete context the curve is drawn for: training status and block length. */
#define TUI_WEEKS_MIN SD_WEEKS_MIN
#define TUI_WEEKS_MAX SD_WEEKS_MAX
struct tui_context {
	int trained;    /* 0 untrained, 1 trained */
	double weeks;   /* block length (an ended block's actual length may be fractional) */
	int base_trained;
	double base_weeks;  /* the block's or template's own values */
};

void tui_context_reset(struct tui_context *c, int trained, double weeks);
void tui_context_toggle_status(struct tui_context *c);
/* Changes the block length by delta weeks within TUI_WEEKS_MIN..TUI_WEEKS_MAX. */
void tui_context_weeks(struct tui_context *c, double delta);
/* 1 when status or weeks differ from the base values. */
int tui_context_changed(const struct tui_context *c);

/* An entry form: labelled fields, text or a choice among options. */
#define TUI_FORM_FIELDS 8
#define TUI_FIELD_MAX 256   /* a file path fits */
#define TUI_CHOICES_MAX 256
enum tui_field_kind { TUI_TEXT, TUI_CHOICE };
struct tui_field {
	char label[24];
	enum tui_field_kind kind;
	char text[TUI_FIELD_MAX];   /* TEXT: the typed text */
	int len;
	int choice;                 /* CHOICE: selected option */
	int nchoices;
	const char *const *choices; /* CHOICE: option names, not owned */
};
struct tui_form {
	char title[64];
	int kind;                   /* what the form does; the caller's code */
	int nfields;
	int cur;                    /* field with the focus */
	struct tui_field field[TUI_FORM_FIELDS];
};

void tui_form_reset(struct tui_form *f, const char *title, int kind);
/* Adds a text field with an initial value; returns its index, -1 when the form is full. */
int tui_form_text(struct tui_form *f, const char *label, const char *value);
/* Adds a choice field over n options (the array must outlive the form); returns its index. */
int tui_form_choice(struct tui_form *f, const char *label, const char *const *choices, int n,
		    int selected);
/* Moves the focus to the next (dir > 0) or previous field, wrapping. */
void tui_form_focus(struct tui_form *f, int dir);
void tui_form_focus_on(struct tui_form *f, int i);
/* Types a printable character into the focused field: text fields append it, choice fields
 * jump to the next option starting with it (ignoring case). Returns 1 when something changed. */
int tui_form_type(struct tui_form *f, int ch);
/* Backspace in the focused text field; returns 1 when something changed. */
int tui_form_back(struct tui_form *f);
/* Steps the focused choice field by dir options, wrapping; returns 1 when it changed. */
int tui_form_cycle(struct tui_form *f, int dir);
/* The text of field i, or the name of its chosen option. */
const char *tui_form_value(const struct tui_form *f, int i);

/* A vertical scroll offset over `total` lines of which `rows` fit (the help overlay, panes). */
struct tui_scroll {
	int off, total, rows;
};
void tui_scroll_reset(struct tui_scroll *s, int total);
/* Sets the visible rows (clamping the offset). */
void tui_scroll_fit(struct tui_scroll *s, int rows);
void tui_scroll_by(struct tui_scroll *s, int delta);
/* Sets the line count, keeping the offset where it can. */
void tui_scroll_total(struct tui_scroll *s, int total);

/* What covers the current view, if anything. */
enum tui_overlay { TUI_OV_NONE, TUI_OV_HELP, TUI_OV_FORM, TUI_OV_CONFIRM };

/* The whole screen state of one run. */
struct tui_state {
	struct tui_nav nav;
	enum tui_overlay overlay;
	struct tui_filter search;       /* roster */
	struct tui_list roster;         /* rows: athletes matching the search */
	struct tui_list athlete;        /* rows: blocks then tests of the open athlete */
	struct tui_list shelf;          /* rows: stored templates */
	long long mark;                 /* template marked as the first of a comparison; 0 none */
	struct tui_list muscles;        /* dose view rows */
	int warn_pane;                  /* dose view shows its warnings instead of the muscles */
	struct tui_scroll warn;
	struct tui_list pairs;          /* compare view rows */
	struct tui_cursor cursor;       /* curve view */
	struct tui_context context;     /* status and weeks of the dose, curve and compare views */
	struct tui_scroll help;
	struct tui_form form;
	char confirm[160];              /* the question of the confirmation overlay */
	int confirm_kind;               /* the caller's code for what a yes does */
};

/* Everything empty, the roster showing, no overlay. */
void tui_state_init(struct tui_state *s);
/* Opens an overlay over the current view (the help scroll restarts at the top). */
void tui_overlay_open(struct tui_state *s, enum tui_overlay o);
void tui_overlay_close(struct tui_state *s);
/* Opens the confirmation overlay asking q; kind says what a yes does. */
void tui_confirm_open(struct tui_state *s, const char *q, int kind);
/* Marks template id as the first of a comparison, or clears the mark when it is already
 * marked; returns 1 when id is marked afterwards. */
int tui_mark_toggle(struct tui_state *s, long long id);
/* Shows the warnings instead of the muscle rows in the dose view, or back. */
void tui_warn_pane_toggle(struct tui_state *s);

#endif
