/* Entry forms (new or edited athlete, new block, strength test, name of an edited template),
 * yes/no questions, and editing a template's text in the user's editor. Every write goes
 * through the store in one transaction; bad input is shown on the status line and nothing is
 * stored. */
#include <curses.h>
#include <errno.h>
#include <signal.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <strings.h>
#include <sys/wait.h>
#include <unistd.h>

#include "../app/parse.h"
#include "../app/records.h"
#include "../core/e1rm.h"
#include "../core/units.h"
#include "../io/program_io.h"
#include "app.h"

enum { F_SAVE = 1, F_CANCEL, F_NEXT, F_PREV, F_LEFT, F_RIGHT, F_ERASE };

const struct tui_bind tui_form_keys[] = {
	{ { '\r', '\n', KEY_ENTER }, F_SAVE, "Enter", "check and store (nothing is stored while a "
	  "field is wrong)" },
	{ { 27 }, F_CANCEL, "Esc", "close the form, storing nothing" },
	{ { '\t', KEY_DOWN }, F_NEXT, "Tab Down", "next field" },
	{ { KEY_BTAB, KEY_UP }, F_PREV, "S-Tab Up", "previous field" },
	{ { KEY_LEFT }, F_LEFT, "Left", "previous choice (fields shown with < >)" },
	{ { KEY_RIGHT }, F_RIGHT, "Right", "next choice; typing a letter jumps to a choice" },
	{ { KEY_BACKSPACE, 127, 8 }, F_ERASE, "Backspace", "delete the last character" },
	{ { 0 }, 0, NULL, NULL },
};

enum { Q_YES = 1, Q_NO };

const struct tui_bind tui_confirm_keys[] = {
	{ { 'y', 'Y' }, Q_YES, "y", "yes" },
	{ { 'n', 'N', 27 }, Q_NO, "n Esc", "no" },
	{ { 0 }, 0, NULL, NULL },
};

static const char *const statuses[] = { "untrained", "trained" };
static const char *const units[] = { "kg", "lb" };
static const char *const overlap_choices[] = { "refuse", "allow" };
static const char *formulas[E1RM_NFORMULAS];

/* Field order of each form. */
enum { FA_NAME, FA_STATUS, FA_UNITS, FA_NOTES };
enum { FB_ATHLETE, FB_TEMPLATE, FB_START, FB_WEEKS, FB_OVERLAP };
enum { FT_LIFT, FT_DATE, FT_LOAD, FT_REPS, FT_FORMULA };
enum { FS_NAME };
enum { FE_DATE };
enum { FP_PATH, FP_NAME };

static long long form_athlete;   /* the athlete an edit or a test form is about */

void tui_form_open_athlete(struct tui_app *a, const struct db_athlete *edit)
{
	struct tui_form *f = &a->st.form;

	tui_form_reset(f, edit ? "edit athlete" : "new athlete",
		       edit ? TUI_FORM_ATHLETE_EDIT : TUI_FORM_ATHLETE_NEW);
	tui_form_text(f, "name", edit ? edit->name : "");
	tui_form_choice(f, "status", statuses, 2, edit ? edit->trained : 0);
	tui_form_choice(f, "units", units, 2, edit ? edit->units_lb : a->ctx->opt.units_lb);
	tui_form_text(f, "notes", edit ? edit->notes : "");
	form_athlete = edit ? edit->id : 0;
	tui_overlay_open(&a->st, TUI_OV_FORM);
}

void tui_form_open_block(struct tui_app *a, long long athlete_id)
{
	struct tui_form *f = &a->st.form;
	char today[DB_DATE_LEN];
	int who = 0;

	if (!a->nprogs) {
		tui_say(a, 1, "no templates stored yet: 'setdose program add FILE' stores one");
		return;
	}
	for (int i = 0; i < a->nathletes; i++)
		if (a->athletes[i].id == athlete_id)
			who = i;
	tui_today(today);
	tui_form_reset(f, "new block", TUI_FORM_BLOCK);
	tui_form_choice(f, "athlete", a->athlete_names, a->nathletes, who);
	tui_form_choice(f, "template", a->prog_names, a->nprogs, 0);
	tui_form_text(f, "start date", today);
	tui_form_text(f, "weeks", "");
	tui_form_choice(f, "overlap", overlap_choices, 2, 0);
	tui_overlay_open(&a->st, TUI_OV_FORM);
}

void tui_form_open_test(struct tui_app *a)
{
	struct tui_form *f = &a->st.form;
	char today[DB_DATE_LEN];
	int lb = app_lb(a->ctx, &a->cur);

	for (int i = 0; i < E1RM_NFORMULAS; i++)
		formulas[i] = e1rm_name(i);
	tui_today(today);
	tui_form_reset(f, lb ? "strength test (loads in lb)" : "strength test (loads in kg)",
		       TUI_FORM_TEST);
	tui_form_text(f, "lift", "");
	tui_form_text(f, "date", today);
	tui_form_text(f, "load", "");
	tui_form_text(f, "reps", "1");
	tui_form_choice(f, "1RM formula", formulas, E1RM_NFORMULAS, E1RM_DEFAULT);
	form_athlete = a->cur.id;
	tui_overlay_open(&a->st, TUI_OV_FORM);
}

void tui_form_open_end(struct tui_app *a, const struct db_block *b)
{
	struct tui_form *f = &a->st.form;
	char today[DB_DATE_LEN], title[64];

	tui_today(today);
	snprintf(title, sizeof title, "finish block %lld (from %s)", b->id, b->start);
	tui_form_reset(f, title, TUI_FORM_END_BLOCK);
	tui_form_text(f, "end date", today);
	a->end_block = b->id;
	tui_overlay_open(&a->st, TUI_OV_FORM);
}

void tui_form_open_add_template(struct tui_app *a)
{
	struct tui_form *f = &a->st.form;

	tui_form_reset(f, "add a template from a program file", TUI_FORM_ADD_TEMPLATE);
	tui_form_text(f, "file", "");
	tui_form_text(f, "name (optional)", "");
	tui_overlay_open(&a->st, TUI_OV_FORM);
}

void tui_reload(struct tui_app *a)
{
	struct sd_err e;
	sd_err_clear(&e);
	/* A database read through a snapshot (a read-only folder) takes a new one. */
	if (db_refresh(a->ctx->db, &e) || tui_load_athletes(a, &e) || tui_load_programs(a, &e)) {
		tui_say(a, 1, "%s", e.msg);
		return;
	}
	if (a->have_athlete) {
		int still = 0;
		for (int i = 0; i < a->nathletes; i++)
			still |= a->athletes[i].id == a->cur.id;
		if (!still)
			a->have_athlete = 0;
		else if (tui_load_athlete(a, a->cur.id, &e))
			tui_say(a, 1, "%s", e.msg);
	}
}

/* Runs a write: begin, the store calls, commit; rolls back on failure. */
#define WRITE(a, e, calls) \
	(db_begin((a)->ctx->db, (e)) ? -1 : (calls) || db_commit((a)->ctx->db, (e)) \
						? (db_rollback((a)->ctx->db), -1) : 0)

static int save_athlete(struct tui_app *a, struct sd_err *e)
{
	const struct tui_form *f = &a->st.form;
	struct db_athlete at;
	long long id = form_athlete;

	memset(&at, 0, sizeof at);
	if (app_name("athlete", tui_form_value(f, FA_NAME), DB_NAME_MAX, e))
		return FA_NAME;
	if (strlen(tui_form_value(f, FA_NOTES)) >= DB_NOTES_MAX) {
		sd_fail(e, "notes are too long");
		return FA_NOTES;
	}
	snprintf(at.name, sizeof at.name, "%s", tui_form_value(f, FA_NAME));
	snprintf(at.notes, sizeof at.notes, "%s", tui_form_value(f, FA_NOTES));
	at.trained = f->field[FA_STATUS].choice;
	at.units_lb = f->field[FA_UNITS].choice;
	at.id = id;
	if (f->kind == TUI_FORM_ATHLETE_EDIT ? WRITE(a, e, db_athlete_update(a->ctx->db, &at, e))
					      : WRITE(a, e, db_athlete_add(a->ctx->db, &at, &id, e)))
		return FA_NAME;
	tui_reload(a);
	/* Show the athlete on the roster: clear a search that would hide it. */
	if (!tui_filter_match(&a->st.search, at.name)) {
		tui_filter_clear(&a->st.search);
		tui_filter_roster(a);
	}
	for (int i = 0; i < a->nmatch; i++)
		if (a->athletes[a->match[i]].id == id)
			tui_list_select(&a->st.roster, i);
	tui_say(a, 0, "%s athlete '%s' (%s, %s)", f->kind == TUI_FORM_ATHLETE_EDIT ? "updated" : "added",
		at.name, statuses[at.trained], units[at.units_lb]);
	return -1;
}

static int save_block(struct tui_app *a, struct sd_err *e)
{
	const struct tui_form *f = &a->st.form;
	struct db_athlete athlete, *at = &athlete;
	struct db_program p;
	char start[DB_DATE_LEN];
	long long weeks = 0, id;
	int stored = 0, bad = -1;

	if (!a->nathletes)
		return sd_fail(e, "no athletes: add one on the roster first"), FB_ATHLETE;
	if (db_athlete_get_id(a->ctx->db, a->athletes[f->field[FB_ATHLETE].choice].id, at, e))
		return FB_ATHLETE;
	if (app_date("start date", tui_form_value(f, FB_START), start, e))
		return FB_START;
	if (tui_form_value(f, FB_WEEKS)[0] &&
	    app_int("weeks", tui_form_value(f, FB_WEEKS), SD_WEEKS_MIN, SD_WEEKS_MAX, &weeks, e))
		return FB_WEEKS;
	if (db_program_get_id(a->ctx->db, a->progs[f->field[FB_TEMPLATE].choice].id, &p, e))
		return FB_TEMPLATE;
	/* The rules of `block add` (app_block_add): the template reads, it states its length when
	 * the weeks are left empty, and blocks of one athlete do not overlap unless meant to. */
	if (WRITE(a, e, app_block_add(a->ctx, at, &p, start, (int)weeks,
				      f->field[FB_OVERLAP].choice, &id, &stored, e)))
		bad = strstr(e->msg, "overlaps") ? FB_OVERLAP : strstr(e->msg, "length") ? FB_WEEKS :
		      strstr(e->msg, "template") || strstr(e->msg, "program") ? FB_TEMPLATE : FB_START;
	else
		tui_say(a, 0, "added block %lld: '%s' follows '%s' from %s for %d weeks", id, at->name,
			p.name, start, stored);
	db_program_free(&p);
	if (bad < 0)
		tui_reload(a);
	return bad;
}

/* Reads the test form into t through app_test_build (the rules of `test add`); returns -1 when
 * it is complete and valid, else the field at fault with e filled. */
static int read_test(struct tui_app *a, struct db_test *t, int *warn, struct sd_err *e)
{
	static const int field_of[] = { [APP_T_LIFT] = FT_LIFT, [APP_T_DATE] = FT_DATE,
					[APP_T_LOAD] = FT_LOAD, [APP_T_REPS] = FT_REPS };
	const struct tui_form *f = &a->st.form;
	int field;

	if (app_test_build(a->ctx, &a->cur, tui_form_value(f, FT_LIFT), tui_form_value(f, FT_DATE),
			   tui_form_value(f, FT_LOAD), tui_form_value(f, FT_REPS),
			   f->field[FT_FORMULA].choice, t, warn, &field, e))
		return field_of[field];
	return -1;
}

static int save_test(struct tui_app *a, struct sd_err *e)
{
	struct db_test t;
	int warn = 0, bad = read_test(a, &t, &warn, e), lb = app_lb(a->ctx, &a->cur);

	if (bad >= 0)
		return bad;
	if (WRITE(a, e, app_test_add(a->ctx->db, &t, e)))
		return FT_DATE;
	tui_reload(a);
	tui_say(a, 0, "logged test %lld: %s %.1f %s x %d on %s; 1RM %.1f %s (%s)%s", t.id, t.lift,
		units_show(t.load_kg, lb), units_name(lb), t.reps, t.date, units_show(t.e1rm_kg, lb),
		units_name(lb), t.formula, warn ? "; above 10 reps the estimate loses accuracy" : "");
	return -1;
}

static int save_template(struct tui_app *a, struct sd_err *e);

/* The rule of `block end` (app_block_end): no date after today, none before the start. */
static int save_end(struct tui_app *a, struct sd_err *e)
{
	char end[DB_DATE_LEN];

	if (app_date("end date", tui_form_value(&a->st.form, FE_DATE), end, e))
		return FE_DATE;
	if (WRITE(a, e, app_block_end(a->ctx->db, a->end_block, end, end, e)))
		return FE_DATE;
	tui_reload(a);
	tui_say(a, 0, "block %lld finished on %s", a->end_block, end);
	return -1;
}

/* The rules of `program add` (app_program_add_file): the file reads with the exercise library
 * and the name is free. */
static int save_add_template(struct tui_app *a, struct sd_err *e)
{
	const struct tui_form *f = &a->st.form;
	const char *path = tui_form_value(f, FP_PATH);
	struct sd_program prog;
	char name[DB_PROGNAME_MAX + 64];

	if (!path[0])
		return sd_fail(e, "give the program file's path"), FP_PATH;
	if (WRITE(a, e, app_program_add_file(a->ctx, path, tui_form_value(f, FP_NAME), &prog, name,
					     sizeof name, e)))
		return strstr(e->msg, "name") && !strstr(e->msg, "cannot read") ? FP_NAME : FP_PATH;
	tui_reload(a);
	tui_say(a, 0, "added template '%s' (%d day%s, %d exercise entr%s)%s", name, prog.ndays,
		prog.ndays == 1 ? "" : "s", prog.nentries, prog.nentries == 1 ? "y" : "ies",
		prog.nnotes ? "; it has notes: open it to see them" : "");
	prog_free(&prog);
	return -1;
}

static void submit(struct tui_app *a)
{
	struct sd_err e;
	int bad = -1;

	sd_err_clear(&e);
	switch (a->st.form.kind) {
	case TUI_FORM_ATHLETE_NEW:
	case TUI_FORM_ATHLETE_EDIT:
		bad = save_athlete(a, &e);
		break;
	case TUI_FORM_BLOCK:
		bad = save_block(a, &e);
		break;
	case TUI_FORM_TEST:
		bad = save_test(a, &e);
		break;
	case TUI_FORM_SAVE_TEMPLATE:
		bad = save_template(a, &e);
		break;
	case TUI_FORM_END_BLOCK:
		bad = save_end(a, &e);
		break;
	case TUI_FORM_ADD_TEMPLATE:
		bad = save_add_template(a, &e);
		break;
	default:
		break;
	}
	if (bad >= 0) {
		tui_form_focus_on(&a->st.form, bad);
		tui_say(a, 1, "%s; nothing stored", e.msg);
		return;
	}
	tui_overlay_close(&a->st);
}

void tui_form_key(struct tui_app *a, int ch)
{
	struct tui_form *f = &a->st.form;

	switch (tui_action(tui_form_keys, ch)) {
	case F_SAVE:
		submit(a);
		return;
	case F_CANCEL:
		tui_overlay_close(&a->st);
		if (f->kind == TUI_FORM_SAVE_TEMPLATE)
			tui_edit_free(a);
		tui_say(a, 0, "closed: nothing stored");
		return;
	case F_NEXT:
		tui_form_focus(f, 1);
		return;
	case F_PREV:
		tui_form_focus(f, -1);
		return;
	case F_LEFT:
		tui_form_cycle(f, -1);
		return;
	case F_RIGHT:
		tui_form_cycle(f, 1);
		return;
	case F_ERASE:
		tui_form_back(f);
		return;
	default:
		if (ch == KEY_F(10))
			a->quit = 1;
		else
			tui_form_type(f, ch);
		return;
	}
}

/* What the test form would store, as the user types. */
static void test_preview(struct tui_app *a, int y, int x, int w)
{
	struct db_test t;
	struct sd_err e;
	int warn = 0, lb = app_lb(a->ctx, &a->cur);

	sd_err_clear(&e);
	if (read_test(a, &t, &warn, &e) >= 0) {
		tui_putf(y, x, w, TR_DIM, "(%s)", e.msg);
		return;
	}
	tui_putf(y, x, w, warn ? TR_WARN : TR_OK, "1RM %.1f %s (%s)%s", units_show(t.e1rm_kg, lb),
		 units_name(lb), t.formula, warn ? ", less accurate above 10 reps" : "");
}

void tui_form_draw(struct tui_app *a)
{
	const struct tui_form *f = &a->st.form;
	int w = COLS - 4 < 70 ? COLS - 4 : 70, h = f->nfields + 6, x = (COLS - w) / 2;
	int y = (LINES - h) / 2, lw = 14, cy = -1, cx = 0;

	if (y < 1)
		y = 1;
	tui_frame(y, x, h, w, f->title);
	for (int i = 0; i < f->nfields; i++) {
		const struct tui_field *d = &f->field[i];
		int fy = y + 2 + i, vx = x + 3 + lw, vw = w - lw - 6, focus = i == f->cur;
		tui_put(fy, x + 2, lw, focus ? TR_KEY : TR_PLAIN, d->label);
		tui_fill(fy, vx, vw, focus ? TR_SEL : TR_DIM);
		if (d->kind == TUI_CHOICE) {
			tui_putf(fy, vx, vw, focus ? TR_SEL : TR_PLAIN, "%s %s %s", a->unicode ? "\u25c2" : "<",
				 d->nchoices ? d->choices[d->choice] : "(none)", a->unicode ? "\u25b8" : ">");
		} else {
			/* The end of a long text stays in sight. */
			int tw = tui_width(d->text);
			const char *s = d->text;
			while (tw > vw - 1 && *s) {
				s++;
				tw = tui_width(s);
			}
			tui_put(fy, vx, vw, focus ? TR_SEL : TR_PLAIN, s);
			if (focus) {
				cy = fy;
				cx = vx + tw;
			}
		}
	}
	if (f->kind == TUI_FORM_TEST)
		test_preview(a, y + h - 3, x + 2, w - 4);
	else if (f->kind == TUI_FORM_BLOCK)
		tui_put(y + h - 3, x + 2, w - 4, TR_DIM, "weeks: empty takes the template's own length");
	else if (f->kind == TUI_FORM_SAVE_TEMPLATE)
		tui_put(y + h - 3, x + 2, w - 4, TR_DIM, "the same name replaces it (only while no block "
			"uses it)");
	tui_put(y + h - 2, x + 2, w - 4, TR_DIM, "Enter store  Esc cancel  Tab next  Left/Right choose");
	if (cy >= 0) {
		curs_set(1);
		move(cy, cx);
	} else {
		curs_set(0);
	}
}

void tui_confirm_draw(struct tui_app *a)
{
	int w = tui_width(a->st.confirm) + 6, h = 5, x, y = (LINES - h) / 2;

	if (w < 30)
		w = 30;
	if (w > COLS - 2)
		w = COLS - 2;
	x = (COLS - w) / 2;
	tui_frame(y, x, h, w, "question");
	tui_put(y + 1, x + 2, w - 4, TR_PLAIN, a->st.confirm);
	tui_put(y + 3, x + 2, w - 4, TR_KEY, "y yes   n no");
}

static void run_editor(struct tui_app *a);

void tui_confirm_key(struct tui_app *a, int ch)
{
	struct sd_err e;
	int act = tui_action(tui_confirm_keys, ch), kind = a->st.confirm_kind;

	if (act != Q_YES && act != Q_NO) {
		if (ch != ERR && ch != KEY_RESIZE)
			tui_say(a, 1, "answer y (yes) or n (no); Esc is no");
		return;
	}
	tui_overlay_close(&a->st);
	sd_err_clear(&e);
	if (act == Q_NO) {
		if (kind == TUI_ASK_EDIT_AGAIN)
			tui_edit_free(a);
		tui_say(a, 0, "nothing changed");
		return;
	}
	switch (kind) {
	case TUI_ASK_REMOVE_ATHLETE:
		if (WRITE(a, &e, db_athlete_rm(a->ctx->db, a->remove_id, 1, &e))) {
			tui_say(a, 1, "%s; nothing removed", e.msg);
			return;
		}
		if (a->have_athlete && a->cur.id == a->remove_id) {
			a->have_athlete = 0;
			tui_nav_reset(&a->st.nav, TUI_ROSTER);
		}
		tui_reload(a);
		tui_say(a, 0, "removed the athlete with their blocks and tests");
		break;
	case TUI_ASK_EDIT_AGAIN:
		run_editor(a);
		break;
	default:
		break;
	}
}

void tui_edit_free(struct tui_app *a)
{
	free(a->edit_text);
	a->edit_text = NULL;
	a->edit_len = 0;
	a->edit_id = 0;
}

/* Writes text to a new temporary file named like a program file, so editors pick the right
 * syntax. */
static int temp_write(const char *text, size_t len, int csv, char *path, size_t n,
		      struct sd_err *e)
{
	const char *dir = getenv("TMPDIR");
	int fd;
	FILE *f;

	snprintf(path, n, "%s/setdose-edit-XXXXXX%s", dir && *dir ? dir : "/tmp", csv ? ".csv" : ".ini");
	if ((fd = mkstemps(path, 4)) < 0)
		return sd_fail(e, "cannot create a temporary file in '%s': %s",
			       dir && *dir ? dir : "/tmp", strerror(errno));
	if (!(f = fdopen(fd, "w"))) {
		close(fd);
		unlink(path);
		return sd_fail(e, "cannot write '%s': %s", path, strerror(errno));
	}
	if (fwrite(text, 1, len, f) != len || fclose(f)) {
		unlink(path);
		return sd_fail(e, "cannot write '%s'", path);
	}
	return 0;
}

/* Runs $VISUAL, else $EDITOR, else vi on path with the terminal handed over; returns its exit
 * status, or -1 with e filled. */
static int spawn_editor(const char *path, struct sd_err *e)
{
	const char *v = getenv("VISUAL"), *ed = getenv("EDITOR");
	/* The setting may carry arguments ("code --wait"): the shell splits it. */
	const char *cmd = v && *v ? "$VISUAL \"$1\"" : ed && *ed ? "$EDITOR \"$1\"" : "vi \"$1\"";
	struct sigaction ign, old_int, old_quit;
	pid_t pid;
	int status = 0;

	/* The editor gets Ctrl-C; we wait through it, as system() does. */
	memset(&ign, 0, sizeof ign);
	ign.sa_handler = SIG_IGN;
	sigemptyset(&ign.sa_mask);
	sigaction(SIGINT, &ign, &old_int);
	sigaction(SIGQUIT, &ign, &old_quit);
	def_prog_mode();
	endwin();
	pid = fork();
	if (pid == 0) {
		signal(SIGINT, SIG_DFL);
		signal(SIGQUIT, SIG_DFL);
		execl("/bin/sh", "sh", "-c", cmd, "sh", path, (char *)NULL);
		_exit(127);
	}
	if (pid > 0)
		while (waitpid(pid, &status, 0) < 0 && errno == EINTR)
			;
	reset_prog_mode();
	clearok(curscr, TRUE);
	refresh();
	sigaction(SIGINT, &old_int, NULL);
	sigaction(SIGQUIT, &old_quit, NULL);
	if (pid < 0)
		return sd_fail(e, "cannot start the editor: %s", strerror(errno));
	if (WIFEXITED(status))
		return WEXITSTATUS(status);
	return 128 + (WIFSIGNALED(status) ? WTERMSIG(status) : 0);
}

/* 1 when text is the template's stored text, byte for byte. */
static int unchanged(struct tui_app *a, const char *text, size_t len)
{
	struct db_program p;
	int same;

	if (db_program_get_id(a->ctx->db, a->edit_id, &p, NULL))
		return 0;
	same = p.len == len && !memcmp(p.source, text, len);
	db_program_free(&p);
	return same;
}

/* One round of editing a->edit_text: edit, read back, validate. */
static void run_editor(struct tui_app *a)
{
	char path[4200];
	char *text = NULL;
	size_t len = 0;
	struct sd_program prog;
	struct sd_err e;
	int rc;

	sd_err_clear(&e);
	if (temp_write(a->edit_text, a->edit_len, a->edit_csv, path, sizeof path, &e)) {
		tui_say(a, 1, "%s; nothing stored", e.msg);
		tui_edit_free(a);
		return;
	}
	rc = spawn_editor(path, &e);
	if (rc != 0) {
		unlink(path);
		if (rc < 0)
			tui_say(a, 1, "%s; nothing stored", e.msg);
		else
			tui_say(a, 1, "the editor ended with status %d; nothing stored", rc);
		tui_edit_free(a);
		return;
	}
	rc = program_slurp(path, &text, &len, &e);
	unlink(path);
	if (rc) {
		tui_say(a, 1, "%s; nothing stored", e.msg);
		tui_edit_free(a);
		return;
	}
	if (unchanged(a, text, len)) {
		free(text);
		tui_say(a, 0, "no change to '%s': nothing stored", a->edit_name);
		tui_edit_free(a);
		return;
	}
	free(a->edit_text);
	a->edit_text = text;
	a->edit_len = len;
	if (program_parse(a->edit_name, text, len, a->edit_csv, &a->ctx->lib, &prog, &e)) {
		char q[160];
		tui_say(a, 1, "%s", e.msg);
		snprintf(q, sizeof q, "the edit does not read (see below); edit it again?");
		tui_confirm_open(&a->st, q, TUI_ASK_EDIT_AGAIN);
		return;
	}
	tui_form_reset(&a->st.form, "store the edited template as", TUI_FORM_SAVE_TEMPLATE);
	tui_form_text(&a->st.form, "name", a->edit_name);
	tui_overlay_open(&a->st, TUI_OV_FORM);
	tui_say(a, 0, "the edit reads: %d day%s, %d entr%s; name it and press Enter to store",
		prog.ndays, prog.ndays == 1 ? "" : "s", prog.nentries, prog.nentries == 1 ? "y" : "ies");
	prog_free(&prog);
}

void tui_edit_template(struct tui_app *a, long long program_id)
{
	struct db_program p;
	struct sd_err e;

	sd_err_clear(&e);
	tui_edit_free(a);
	if (db_program_get_id(a->ctx->db, program_id, &p, &e)) {
		tui_say(a, 1, "%s", e.msg);
		return;
	}
	a->edit_text = p.source;
	a->edit_len = p.len;
	a->edit_csv = p.is_csv;
	a->edit_id = p.id;
	snprintf(a->edit_name, sizeof a->edit_name, "%s", p.name);
	p.source = NULL;
	run_editor(a);
}

static int save_template(struct tui_app *a, struct sd_err *e)
{
	const char *name = tui_form_value(&a->st.form, FS_NAME);
	long long id;
	int nb = 0;

	if (app_name("template", name, DB_PROGNAME_MAX, e))
		return FS_NAME;
	if (!a->edit_text)
		return sd_fail(e, "the edited text is gone"), FS_NAME;
	if (!strcasecmp(name, a->edit_name)) {
		/* The same name replaces the template, which only an unused one may be: blocks keep
		 * pointing at the text they were planned with. */
		if (db_program_refs(a->ctx->db, a->edit_id, &nb, e))
			return FS_NAME;
		if (nb)
			return sd_fail(e, "template '%s' is used by %d block%s: store the edit under a new "
				       "name", a->edit_name, nb, nb == 1 ? "" : "s"), FS_NAME;
		if (WRITE(a, e, db_program_rm(a->ctx->db, a->edit_id, e) ||
				db_program_add(a->ctx->db, name, a->edit_text, a->edit_len,
					       a->edit_csv, &id, e)))
			return FS_NAME;
	} else if (WRITE(a, e, db_program_add(a->ctx->db, name, a->edit_text, a->edit_len,
					       a->edit_csv, &id, e))) {
		return FS_NAME;
	}
	tui_say(a, 0, "stored template '%s'", name);
	tui_edit_free(a);
	tui_reload(a);
	return -1;
}
