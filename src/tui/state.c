#include "state.h"

#include <ctype.h>
#include <math.h>
#include <stdio.h>
#include <string.h>

static int clampi(int v, int lo, int hi)
{
	return v < lo ? lo : v > hi ? hi : v;
}

/* Keeps sel inside the list and the window [top, top + rows) around it. */
static void list_settle(struct tui_list *l)
{
	if (l->rows < 1)
		l->rows = 1;
	if (l->n <= 0) {
		l->n = 0;
		l->sel = l->top = 0;
		return;
	}
	l->sel = clampi(l->sel, 0, l->n - 1);
	if (l->sel < l->top)
		l->top = l->sel;
	if (l->sel >= l->top + l->rows)
		l->top = l->sel - l->rows + 1;
	/* No empty space below the last row while there are rows above the window. */
	l->top = clampi(l->top, 0, l->n > l->rows ? l->n - l->rows : 0);
}

void tui_list_reset(struct tui_list *l, int n)
{
	int rows = l->rows;
	memset(l, 0, sizeof *l);
	l->n = n;
	l->rows = rows;
	list_settle(l);
}

void tui_list_count(struct tui_list *l, int n)
{
	l->n = n;
	list_settle(l);
}

void tui_list_fit(struct tui_list *l, int rows)
{
	l->rows = rows;
	list_settle(l);
}

void tui_list_move(struct tui_list *l, int delta)
{
	l->sel += delta;
	list_settle(l);
}

void tui_list_page(struct tui_list *l, int dir)
{
	int step = l->rows > 1 ? l->rows - 1 : 1;
	l->sel += dir > 0 ? step : -step;
	l->top += dir > 0 ? step : -step;
	if (l->top < 0)
		l->top = 0;
	list_settle(l);
}

void tui_list_select(struct tui_list *l, int i)
{
	l->sel = i;
	list_settle(l);
}

void tui_list_move_skip(struct tui_list *l, int delta, const unsigned char *ok)
{
	int dir = delta < 0 ? -1 : 1, i = l->sel + delta;

	if (l->n <= 0)
		return;
	i = clampi(i, 0, l->n - 1);
	while (i >= 0 && i < l->n && !ok[i])
		i += dir;
	if (i < 0 || i >= l->n) {
		/* Nothing selectable that way: try the nearest selectable row back toward sel. */
		for (i = clampi(l->sel + delta, 0, l->n - 1); i >= 0 && i < l->n && !ok[i]; i -= dir)
			;
		if (i < 0 || i >= l->n)
			return;
	}
	l->sel = i;
	list_settle(l);
}

int tui_list_visible(const struct tui_list *l, int i)
{
	return i >= l->top && i < l->top + l->rows && i < l->n;
}

int tui_filter_add(struct tui_filter *f, int ch)
{
	if (ch < 32 || ch > 126 || f->len >= TUI_FILTER_MAX - 1)
		return 0;
	f->text[f->len++] = (char)ch;
	f->text[f->len] = '\0';
	return 1;
}

int tui_filter_back(struct tui_filter *f)
{
	if (!f->len)
		return 0;
	f->text[--f->len] = '\0';
	return 1;
}

void tui_filter_clear(struct tui_filter *f)
{
	f->len = 0;
	f->text[0] = '\0';
}

void tui_filter_start(struct tui_filter *f)
{
	f->active = 1;
}

void tui_filter_stop(struct tui_filter *f)
{
	f->active = 0;
}

int tui_filter_match(const struct tui_filter *f, const char *name)
{
	size_t n = strlen(name);
	if (!f->len)
		return 1;
	for (size_t i = 0; i + (size_t)f->len <= n; i++) {
		int k = 0;
		while (k < f->len && tolower((unsigned char)name[i + (size_t)k]) ==
					     tolower((unsigned char)f->text[k]))
			k++;
		if (k == f->len)
			return 1;
	}
	return 0;
}

void tui_nav_reset(struct tui_nav *n, enum tui_view v)
{
	n->stack[0] = v;
	n->depth = 1;
}

void tui_nav_push(struct tui_nav *n, enum tui_view v)
{
	if (n->depth >= TUI_NAV_MAX) {
		/* Forget the deepest-but-one view so the way back still ends at the first one. */
		memmove(&n->stack[1], &n->stack[2], (TUI_NAV_MAX - 2) * sizeof n->stack[0]);
		n->depth = TUI_NAV_MAX - 1;
	}
	n->stack[n->depth++] = v;
}

int tui_nav_pop(struct tui_nav *n)
{
	if (n->depth <= 1)
		return -1;
	n->depth--;
	return 0;
}

void tui_nav_swap(struct tui_nav *n, enum tui_view v)
{
	if (n->depth < 1)
		n->depth = 1;
	n->stack[n->depth - 1] = v;
}

enum tui_view tui_nav_top(const struct tui_nav *n)
{
	return n->depth > 0 ? n->stack[n->depth - 1] : TUI_ROSTER;
}

static double clampd(double v, double lo, double hi)
{
	return v < lo ? lo : v > hi ? hi : v;
}

void tui_cursor_reset(struct tui_cursor *c, double lo, double hi, double x)
{
	c->lo = lo;
	c->hi = hi > lo ? hi : lo;
	c->x = clampd(x, c->lo, c->hi);
}

void tui_cursor_move(struct tui_cursor *c, double dx)
{
	c->x = clampd(round((c->x + dx) * 10.0) / 10.0, c->lo, c->hi);
}

void tui_cursor_set(struct tui_cursor *c, double x)
{
	c->x = clampd(x, c->lo, c->hi);
}

int tui_cursor_next(struct tui_cursor *c, const double *doses, int k)
{
	int best = -1, low = -1;
	for (int i = 0; i < k; i++) {
		if (doses[i] > c->x + 1e-9 && (best < 0 || doses[i] < doses[best]))
			best = i;
		if (low < 0 || doses[i] < doses[low])
			low = i;
	}
	if (best < 0)
		best = low;
	if (best >= 0)
		tui_cursor_set(c, doses[best]);
	return best;
}

void tui_context_reset(struct tui_context *c, int trained, double weeks)
{
	c->trained = c->base_trained = trained ? 1 : 0;
	c->weeks = c->base_weeks = clampd(weeks, TUI_WEEKS_MIN, TUI_WEEKS_MAX);
}

void tui_context_toggle_status(struct tui_context *c)
{
	c->trained = !c->trained;
}

void tui_context_weeks(struct tui_context *c, double delta)
{
	c->weeks = clampd(c->weeks + delta, TUI_WEEKS_MIN, TUI_WEEKS_MAX);
}

int tui_context_changed(const struct tui_context *c)
{
	return c->trained != c->base_trained || fabs(c->weeks - c->base_weeks) > 1e-9;
}

void tui_form_reset(struct tui_form *f, const char *title, int kind)
{
	memset(f, 0, sizeof *f);
	snprintf(f->title, sizeof f->title, "%s", title);
	f->kind = kind;
}

static struct tui_field *form_new_field(struct tui_form *f, const char *label)
{
	struct tui_field *d;
	if (f->nfields >= TUI_FORM_FIELDS)
		return NULL;
	d = &f->field[f->nfields++];
	memset(d, 0, sizeof *d);
	snprintf(d->label, sizeof d->label, "%s", label);
	return d;
}

int tui_form_text(struct tui_form *f, const char *label, const char *value)
{
	struct tui_field *d = form_new_field(f, label);
	if (!d)
		return -1;
	d->kind = TUI_TEXT;
	snprintf(d->text, sizeof d->text, "%s", value ? value : "");
	d->len = (int)strlen(d->text);
	return f->nfields - 1;
}

int tui_form_choice(struct tui_form *f, const char *label, const char *const *choices, int n,
		    int selected)
{
	struct tui_field *d = form_new_field(f, label);
	if (!d)
		return -1;
	d->kind = TUI_CHOICE;
	d->choices = choices;
	d->nchoices = n < 0 ? 0 : n > TUI_CHOICES_MAX ? TUI_CHOICES_MAX : n;
	d->choice = d->nchoices ? clampi(selected, 0, d->nchoices - 1) : 0;
	return f->nfields - 1;
}

void tui_form_focus(struct tui_form *f, int dir)
{
	if (f->nfields <= 0)
		return;
	f->cur = ((f->cur + (dir > 0 ? 1 : -1)) % f->nfields + f->nfields) % f->nfields;
}

void tui_form_focus_on(struct tui_form *f, int i)
{
	if (f->nfields > 0)
		f->cur = clampi(i, 0, f->nfields - 1);
}

int tui_form_type(struct tui_form *f, int ch)
{
	struct tui_field *d;
	if (f->nfields <= 0 || ch < 32 || ch > 126)
		return 0;
	d = &f->field[f->cur];
	if (d->kind == TUI_TEXT) {
		if (d->len >= TUI_FIELD_MAX - 1)
			return 0;
		d->text[d->len++] = (char)ch;
		d->text[d->len] = '\0';
		return 1;
	}
	for (int k = 1; k <= d->nchoices; k++) {
		int i = (d->choice + k) % d->nchoices;
		if (tolower((unsigned char)d->choices[i][0]) == tolower(ch)) {
			int changed = i != d->choice;
			d->choice = i;
			return changed;
		}
	}
	return 0;
}

int tui_form_back(struct tui_form *f)
{
	struct tui_field *d;
	if (f->nfields <= 0)
		return 0;
	d = &f->field[f->cur];
	if (d->kind != TUI_TEXT || !d->len)
		return 0;
	d->text[--d->len] = '\0';
	return 1;
}

int tui_form_cycle(struct tui_form *f, int dir)
{
	struct tui_field *d;
	if (f->nfields <= 0)
		return 0;
	d = &f->field[f->cur];
	if (d->kind != TUI_CHOICE || d->nchoices < 2)
		return 0;
	d->choice = ((d->choice + (dir > 0 ? 1 : -1)) % d->nchoices + d->nchoices) % d->nchoices;
	return 1;
}

const char *tui_form_value(const struct tui_form *f, int i)
{
	const struct tui_field *d;
	if (i < 0 || i >= f->nfields)
		return "";
	d = &f->field[i];
	if (d->kind == TUI_TEXT)
		return d->text;
	return d->nchoices ? d->choices[d->choice] : "";
}

void tui_scroll_reset(struct tui_scroll *s, int total)
{
	s->off = 0;
	s->total = total < 0 ? 0 : total;
	if (s->rows < 1)
		s->rows = 1;
}

void tui_scroll_fit(struct tui_scroll *s, int rows)
{
	s->rows = rows < 1 ? 1 : rows;
	tui_scroll_by(s, 0);
}

void tui_scroll_by(struct tui_scroll *s, int delta)
{
	int max = s->total > s->rows ? s->total - s->rows : 0;
	s->off = clampi(s->off + delta, 0, max);
}

void tui_scroll_total(struct tui_scroll *s, int total)
{
	s->total = total < 0 ? 0 : total;
	tui_scroll_by(s, 0);
}

void tui_state_init(struct tui_state *s)
{
	memset(s, 0, sizeof *s);
	tui_nav_reset(&s->nav, TUI_ROSTER);
	s->roster.rows = s->athlete.rows = s->shelf.rows = s->muscles.rows = s->pairs.rows = 1;
	s->warn.rows = s->help.rows = 1;
	tui_context_reset(&s->context, 0, 10);
}

void tui_overlay_open(struct tui_state *s, enum tui_overlay o)
{
	s->overlay = o;
	if (o == TUI_OV_HELP)
		s->help.off = 0;
}

void tui_overlay_close(struct tui_state *s)
{
	s->overlay = TUI_OV_NONE;
}

void tui_confirm_open(struct tui_state *s, const char *q, int kind)
{
	snprintf(s->confirm, sizeof s->confirm, "%s", q);
	s->confirm_kind = kind;
	s->overlay = TUI_OV_CONFIRM;
}

int tui_mark_toggle(struct tui_state *s, long long id)
{
	s->mark = s->mark == id ? 0 : id;
	return s->mark != 0;
}

void tui_warn_pane_toggle(struct tui_state *s)
{
	s->warn_pane = !s->warn_pane;
	s->warn.off = 0;
}
