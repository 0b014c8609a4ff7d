/* The full-screen interface's frame: the terminal (set up, and restored on every way out),
 * the key loop, the title and status lines, the key card, and the off-screen mode the
 * benchmark draws with. */
#include <curses.h>
#include <langinfo.h>
#include <signal.h>
#include <termios.h>
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>
#include <unistd.h>

#include "../io/table.h"
#include "app.h"
#include "tui.h"

enum { G_HELP = 1, G_QUIT, G_BACK, G_REDRAW, G_MOVE };

const struct tui_bind tui_global_keys[] = {
	{ { '?', KEY_F(1) }, G_HELP, "? F1", "this key card (Esc closes it)" },
	{ { 27, KEY_BACKSPACE, 127 }, G_BACK, "Esc Backspace", "back to the view before; Esc on the "
	  "roster leaves" },
	{ { 'q', KEY_F(10) }, G_QUIT, "q F10", "leave setdose (Ctrl-C too); in a text field q types" },
	{ { 12 }, G_REDRAW, "Ctrl-L", "reload what other programs changed; repaint" },
	{ { 0 }, G_MOVE, "Up Down", "move in lists; PgUp PgDn Home End go further" },
	{ { 0 }, 0, NULL, NULL },
};

static const struct tui_screen *const screens[TUI_NVIEWS] = {
	[TUI_ROSTER] = &tui_roster_screen,
	[TUI_ATHLETE] = &tui_athlete_screen,
	[TUI_SHELF] = &tui_shelf_screen,
	[TUI_DOSE] = &tui_dose_screen,
	[TUI_CURVE] = &tui_curve_screen,
	[TUI_COMPARE] = &tui_compare_screen,
};

/* The terminal is restored from three places: the normal end, atexit (an exit() somewhere
 * below), and after a terminating signal. The handler itself only records the signal;
 * the loop wakes within TICK_MS and leaves through the normal end. */
#define TICK_MS 200
static volatile sig_atomic_t got_signal;
static SCREEN *screen;
static FILE *screen_out, *screen_in;
static int atexit_set;

static void on_signal(int sig)
{
	got_signal = sig;
}

/* A crash (or SIGQUIT) cannot go through the normal end: the handler puts back the terminal
 * settings saved before curses started and writes the terminal's own strings for leaving the
 * full-screen mode (both async-signal-safe), then hands the signal to whatever handled it
 * before (the default, or a sanitizer's report). */
static const int fatal_sigs[] = { SIGSEGV, SIGBUS, SIGFPE, SIGILL, SIGABRT, SIGQUIT };
#define NFATAL ((int)(sizeof fatal_sigs / sizeof fatal_sigs[0]))
static struct sigaction fatal_old[NFATAL];
static struct termios saved_tio;
static int have_tio, fatal_set;
static char reset_seq[256];
static size_t reset_len;

static void on_fatal(int sig)
{
	if (have_tio)
		tcsetattr(STDIN_FILENO, TCSANOW, &saved_tio);
	if (reset_len && write(STDOUT_FILENO, reset_seq, reset_len) < 0)
		reset_len = 0;
	for (int i = 0; i < NFATAL; i++)
		if (fatal_sigs[i] == sig)
			sigaction(sig, &fatal_old[i], NULL);
	raise(sig);
}

/* The terminal's strings for leaving full-screen mode, read once curses knows the terminal. */
static void reset_prepare(void)
{
	static const char *const caps[] = { "sgr0", "cnorm", "rmkx", "rmcup" };
	reset_len = 0;
	for (size_t i = 0; i < sizeof caps / sizeof caps[0]; i++) {
		const char *v = tigetstr((char *)caps[i]);
		size_t n;
		if (!v || v == (char *)-1)
			continue;
		n = strlen(v);
		if (reset_len + n >= sizeof reset_seq)
			break;
		memcpy(reset_seq + reset_len, v, n);
		reset_len += n;
	}
}

static void fatal_install(void)
{
	struct sigaction sa;
	memset(&sa, 0, sizeof sa);
	sa.sa_handler = on_fatal;
	sigemptyset(&sa.sa_mask);
	for (int i = 0; i < NFATAL; i++)
		sigaction(fatal_sigs[i], &sa, &fatal_old[i]);
	fatal_set = 1;
}

static void fatal_remove(void)
{
	if (!fatal_set)
		return;
	for (int i = 0; i < NFATAL; i++)
		sigaction(fatal_sigs[i], &fatal_old[i], NULL);
	fatal_set = 0;
}

static void term_restore(void)
{
	if (screen) {
		if (!isendwin())
			endwin();
		delscreen(screen);
		screen = NULL;
	}
	if (screen_out)
		fclose(screen_out);
	if (screen_in)
		fclose(screen_in);
	screen_out = screen_in = NULL;
}

const struct tui_screen *tui_screen_of(enum tui_view v)
{
	return v < TUI_NVIEWS ? screens[v] : screens[TUI_ROSTER];
}

int tui_action(const struct tui_bind *b, int ch)
{
	for (; b->keys; b++)
		for (int i = 0; i < 3; i++)
			if (b->code[i] && b->code[i] == ch)
				return b->action;
	return 0;
}

void tui_say(struct tui_app *a, int err, const char *fmt, ...)
{
	va_list ap;
	va_start(ap, fmt);
	vsnprintf(a->status, sizeof a->status, fmt, ap);
	va_end(ap);
	a->status_err = err;
}

void tui_open(struct tui_app *a, enum tui_view v)
{
	tui_nav_push(&a->st.nav, v);
	if (screens[v]->init)
		screens[v]->init(a);
}

static void draw_title(struct tui_app *a)
{
	char crumbs[256] = "";
	int right;

	tui_fill(0, 0, COLS, TR_TITLE);
	for (int i = 0; i < a->st.nav.depth; i++) {
		enum tui_view v = a->st.nav.stack[i];
		const char *name = screens[v]->name;
		if (v == TUI_ATHLETE && a->have_athlete)
			name = a->cur.name;
		snprintf(crumbs + strlen(crumbs), sizeof crumbs - strlen(crumbs), "%s%s",
			 i ? (a->unicode ? " \u203a " : " > ") : "", name);
	}
	/* The profile's name on the right when there is room for it beside the way here; the
	 * way here ends (with an ellipsis when cut) two columns before it. */
	right = tui_width(a->ctx->profile.name) + 10;
	if (COLS < right + 40)
		right = 0;
	tui_putf(0, 0, COLS - right - (right ? 2 : 0), TR_TITLE, " setdose %s %s",
		 a->unicode ? "\u2502" : "|", crumbs);
	if (right)
		tui_putf(0, COLS - right, right, TR_TITLE, "profile %s ", a->ctx->profile.name);
}

/* The status line; a message longer than the line takes the lines above too (up to three),
 * broken between words. */
static void draw_status(struct tui_app *a)
{
	int y = LINES - 1, n;
	const char *hint = "? keys  q leave";
	int hw = (int)strlen(hint) + 1;
	enum tui_role r = a->status_err ? TR_ERR : TR_OK;

	tui_fill(y, 0, COLS, TR_PLAIN);
	if (!a->status[0]) {
		tui_put(y, COLS - hw + 1, hw, TR_DIM, hint);
		/* The view's note when it fits beside the hint (a view keeps it short). */
		if (a->note[0] && tui_width(a->note) + 1 <= COLS - hw - 1)
			tui_put(y, 1, COLS - hw - 2, (enum tui_role)a->note_role, a->note);
		return;
	}
	n = tui_wrapped_lines(COLS, 2, a->status);
	if (n > 3)
		n = 3;
	for (int i = 1; i < n; i++)
		tui_fill(y - i, 0, COLS, TR_PLAIN);
	tui_put_wrapped(y - n + 1, 0, COLS, n, 2, r, a->status);
}

void tui_draw_all(struct tui_app *a)
{
	const struct tui_screen *s = screens[tui_nav_top(&a->st.nav)];

	erase();
	if (COLS < 40 || LINES < 12) {
		tui_put(0, 0, COLS, TR_ERR, "terminal too small");
		tui_putf(1, 0, COLS, TR_PLAIN, "%dx%d; setdose needs 40x12", COLS, LINES);
		refresh();
		return;
	}
	draw_title(a);
	a->note[0] = '\0';
	s->draw(a);
	if (a->st.overlay == TUI_OV_HELP)
		tui_help_draw(a);
	else if (a->st.overlay == TUI_OV_FORM)
		tui_form_draw(a);
	else if (a->st.overlay == TUI_OV_CONFIRM)
		tui_confirm_draw(a);
	draw_status(a);
	if (a->st.overlay != TUI_OV_FORM)
		curs_set(0);
	refresh();
}

static void help_key(struct tui_app *a, int ch)
{
	switch (ch) {
	case KEY_UP:
		tui_scroll_by(&a->st.help, -1);
		break;
	case KEY_DOWN:
		tui_scroll_by(&a->st.help, 1);
		break;
	case KEY_PPAGE:
		tui_scroll_by(&a->st.help, -a->st.help.rows);
		break;
	case KEY_NPAGE:
	case ' ':
		tui_scroll_by(&a->st.help, a->st.help.rows);
		break;
	case KEY_HOME:
		tui_scroll_by(&a->st.help, -a->st.help.total);
		break;
	case KEY_END:
		tui_scroll_by(&a->st.help, a->st.help.total);
		break;
	case 27:
	case '?':
	case '\n':
	case KEY_ENTER:
	case KEY_F(1):
		tui_overlay_close(&a->st);
		break;
	case KEY_F(10):
	case 'q':
		a->quit = 1;
		break;
	default:
		break;
	}
}

/* A key nothing here acts on says so, rather than being ignored in silence. */
static void say_unbound(struct tui_app *a, int ch)
{
	const char *name = keyname(ch);
	if (ch == ERR || ch == KEY_RESIZE || ch == KEY_MOUSE)
		return;
	tui_say(a, 1, "%s does nothing in the %s view; ? lists its keys", name ? name : "that key",
		tui_screen_of(tui_nav_top(&a->st.nav))->name);
}

static void handle_key(struct tui_app *a, int ch)
{
	if (ch == KEY_RESIZE)
		return;   /* ncurses has resized stdscr; the next draw lays out for the new size */
	if (ch != ERR && a->st.overlay != TUI_OV_FORM)
		a->status[0] = '\0';
	switch (a->st.overlay) {
	case TUI_OV_HELP:
		help_key(a, ch);
		return;
	case TUI_OV_FORM:
		tui_form_key(a, ch);
		return;
	case TUI_OV_CONFIRM:
		tui_confirm_key(a, ch);
		return;
	default:
		break;
	}
	if (screens[tui_nav_top(&a->st.nav)]->key(a, ch))
		return;
	switch (tui_action(tui_global_keys, ch)) {
	case G_HELP:
		tui_overlay_open(&a->st, TUI_OV_HELP);
		break;
	case G_QUIT:
		a->quit = 1;
		break;
	case G_REDRAW:
		tui_reload(a);
		clearok(curscr, TRUE);
		break;
	case G_BACK:
		if (tui_nav_pop(&a->st.nav) && ch == 27)
			a->quit = 1;
		break;
	default:
		say_unbound(a, ch);
		break;
	}
}

static int app_new(struct sd_ctx *ctx, struct tui_app **out, struct sd_err *e)
{
	struct tui_app *a = calloc(1, sizeof *a);
	const char *cs;

	*out = NULL;
	if (!a)
		return sd_fail(e, "out of memory");
	a->ctx = ctx;
	tui_state_init(&a->st);
	tbl_locale();
	cs = nl_langinfo(CODESET);
	a->unicode = cs && !strcmp(cs, "UTF-8");
	a->color = ctx->opt.color;
	if (tui_load_athletes(a, e) || tui_load_programs(a, e)) {
		tui_data_free(a);
		free(a);
		return -1;
	}
	*out = a;
	return 0;
}

static void app_free(struct tui_app *a)
{
	if (!a)
		return;
	tui_data_free(a);
	free(a);
}

/* Sets up curses on the given streams; keypad, no echo, short Esc delay. */
static int term_open(struct tui_app *a, const char *term, FILE *out, FILE *in, struct sd_err *e)
{
	screen = newterm(term, out, in);
	if (!screen)
		return sd_fail(e, "cannot start the full-screen interface: terminal type '%s' unknown",
			       term ? term : getenv("TERM") ? getenv("TERM") : "");
	set_term(screen);
	cbreak();
	noecho();
	nonl();
	keypad(stdscr, TRUE);
	set_escdelay(40);
	curs_set(0);
	tui_colors_init(a);
	return 0;
}

int tui_run(struct sd_ctx *ctx, struct sd_err *e)
{
	static const int sigs[] = { SIGINT, SIGTERM, SIGHUP };
	struct sigaction sa, old[3];
	struct tui_app *a = NULL;
	int rc = -1;

	if (!isatty(STDIN_FILENO) || !isatty(STDOUT_FILENO))
		return sd_usage(e, "browse needs a terminal (for scripts use the other commands)");
	if (app_new(ctx, &a, e))
		return -1;
	/* Installed before curses starts, so that curses leaves these signals to us. No
	 * SA_RESTART: a blocked read returns at once and the loop sees the signal. */
	memset(&sa, 0, sizeof sa);
	sa.sa_handler = on_signal;
	sigemptyset(&sa.sa_mask);
	got_signal = 0;
	for (int i = 0; i < 3; i++)
		sigaction(sigs[i], &sa, &old[i]);
	if (!atexit_set) {
		atexit(term_restore);
		atexit_set = 1;
	}
	have_tio = tcgetattr(STDIN_FILENO, &saved_tio) == 0;
	if (term_open(a, NULL, stdout, stdin, e))
		goto done;
	reset_prepare();
	fatal_install();
	timeout(TICK_MS);
	screens[TUI_ROSTER]->init(a);
	while (!a->quit && !got_signal) {
		tui_draw_all(a);
		int ch;
		do
			ch = getch();
		while (ch == ERR && !got_signal);
		if (!got_signal)
			handle_key(a, ch);
	}
	rc = 0;
	if (got_signal)
		rc = sd_fail(e, "interrupted by %s", got_signal == SIGINT ? "Ctrl-C" :
			     got_signal == SIGHUP ? "a hangup" : "a termination signal");
done:
	term_restore();
	fatal_remove();
	for (int i = 0; i < 3; i++)
		sigaction(sigs[i], &old[i], NULL);
	app_free(a);
	return rc;
}

int tui_bench_open(struct sd_ctx *ctx, const char *term, int w, int h, struct tui_app **out,
		   struct sd_err *e)
{
	struct tui_app *a;

	*out = NULL;
	if (app_new(ctx, &a, e))
		return -1;
	screen_out = fopen("/dev/null", "w");
	screen_in = fopen("/dev/null", "r");
	if (!screen_out || !screen_in) {
		term_restore();
		app_free(a);
		return sd_fail(e, "cannot open /dev/null");
	}
	if (term_open(a, term, screen_out, screen_in, e)) {
		term_restore();
		app_free(a);
		return -1;
	}
	resizeterm(h, w);
	*out = a;
	return 0;
}

void tui_bench_roster(struct tui_app *a)
{
	tui_nav_reset(&a->st.nav, TUI_ROSTER);
	screens[TUI_ROSTER]->init(a);
}

void tui_bench_key(struct tui_app *a, int ch)
{
	handle_key(a, ch);
}

int tui_bench_show(struct tui_app *a, int curve, const char *template_name, struct sd_err *e)
{
	long long id = 0;
	for (int i = 0; i < a->nprogs; i++)
		if (!strcmp(a->progs[i].name, template_name))
			id = a->progs[i].id;
	if (!id)
		return sd_fail(e, "unknown template '%s'", template_name);
	if (tui_subject_template(a, &a->a, id, 1, e))
		return -1;
	if (!a->a.ready)
		return sd_fail(e, "%s", a->a.err);
	tui_nav_reset(&a->st.nav, TUI_SHELF);
	tui_open(a, curve ? TUI_CURVE : TUI_DOSE);
	return 0;
}

void tui_bench_draw(struct tui_app *a)
{
	clearok(curscr, TRUE);
	tui_draw_all(a);
}

void tui_bench_close(struct tui_app *a)
{
	term_restore();
	app_free(a);
}
