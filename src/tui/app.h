/* Inside the full-screen interface only: the running application, its views and the drawing
 * routines they share. Each view is a struct tui_screen {init, draw, key}; the state module
 * (state.h) holds selection and scrolling, the app holds the data read from the store and the
 * audits computed from it. ncurses stays inside src/tui/. */
#ifndef SD_TUI_APP_H
#define SD_TUI_APP_H

#include <stddef.h>

#include "../app/ctx.h"
#include "../core/audit.h"
#include "../store/db.h"
#include "state.h"

/* What a drawn cell means; draw.c maps each to a colour pair or, without colour, to plain
 * attributes (bold, reverse, underline, dim). */
enum tui_role {
	TR_PLAIN, TR_TITLE, TR_HEAD, TR_SEL, TR_DIM, TR_ERR, TR_OK, TR_KEY, TR_WARN,
	TR_NONE, TR_CLIMB, TR_PLATEAU, TR_BEYOND,
	TR_ATHB, TR_PI, TR_CI, TR_MEAN, TR_MARK, TR_CURSOR, TR_AXIS, TR_NROLES
};

/* A key binding: up to three key codes, the action code the view switches on, and the text
 * the key card shows. Tables end with an entry whose keys is NULL. */
struct tui_bind {
	int code[3];
	int action;
	const char *keys;
	const char *what;
};

/* Bytes of an athlete's notes the roster reads: enough for a 250-column terminal. */
#define TUI_NOTE_SHOWN 200

struct tui_app;

struct tui_screen {
	const char *name;                        /* shown in the title bar */
	void (*init)(struct tui_app *a);         /* on opening the view */
	void (*draw)(struct tui_app *a);         /* the body, rows 1 .. LINES-2 */
	int (*key)(struct tui_app *a, int ch);   /* 1 when the view used the key */
	const struct tui_bind *keys;             /* for dispatch and for the key card */
};

extern const struct tui_screen tui_roster_screen, tui_athlete_screen, tui_shelf_screen,
	tui_dose_screen, tui_curve_screen, tui_compare_screen;
extern const struct tui_bind tui_global_keys[], tui_form_keys[], tui_confirm_keys[];

enum { TUI_SUBJ_NONE, TUI_SUBJ_BLOCK, TUI_SUBJ_TEMPLATE };

/* What the dose, curve and compare views show: a stored template, or a block's template. */
struct tui_subject {
	int kind;
	struct db_block block;           /* kind BLOCK */
	struct db_program rec;           /* the template with its source; owned */
	struct sd_program prog;
	struct sd_audit audit;           /* for the current context */
	int ready;                       /* prog parsed and audit run */
	char label[192];
	char err[512];                   /* why it is not ready */
};

/* One observed block-and-lift change, as the response command reports it. */
struct tui_obs {
	long long block;
	char lift[DB_NAME_MAX];
	double change, predicted, lo, hi, pctile, dose;
};

/* The open athlete's personal response, from the response command's own computation. */
struct tui_resp {
	int ok;
	int estimated;                   /* variances from the roster (REML), else the priors */
	int n, nblocks;
	double pct, lo, hi, weight;
	struct tui_obs *obs;
	int nobs;
	char err[512];
};

/* The athlete page's training log panel: the current block's weeks done against planned per
 * muscle, its logged average dose, and each lift's weekly best e1RM, from the same code as
 * `log weeks` and `log e1rm` (app/logdata.h). */
#define TUI_LOG_WEEKS 12                 /* most recent weeks of the block kept */
#define TUI_LOG_LIFTS 4

struct tui_liftrend {
	char lift[DB_NAME_MAX];
	int n;                           /* weeks with an estimate, up to TUI_LOG_WEEKS (latest) */
	double v[TUI_LOG_WEEKS];         /* weekly best e1RM, kg, oldest first */
};

struct tui_logview {
	int ok;                          /* the block has logged sets */
	long long block;
	int nweeks;                      /* weeks kept (the block's latest) */
	char first[12], last[12];        /* ISO week labels of the first and last kept */
	double planned[SD_NMUSCLES];     /* the block's planned weekly dose */
	double done[SD_NMUSCLES];        /* its logged average weekly dose */
	double ratio[TUI_LOG_WEEKS][SD_NMUSCLES];  /* done / planned per week; -1: none planned */
	int order[SD_NMUSCLES], nmus;    /* planned muscles, largest planned dose first */
	struct tui_liftrend lift[TUI_LOG_LIFTS];
	int nlift;
	char err[256];
};

/* Forms and confirmations: what saving or a yes does. */
enum {
	TUI_FORM_ATHLETE_NEW = 1, TUI_FORM_ATHLETE_EDIT, TUI_FORM_BLOCK, TUI_FORM_TEST,
	TUI_FORM_SAVE_TEMPLATE, TUI_FORM_END_BLOCK, TUI_FORM_ADD_TEMPLATE,
	TUI_ASK_REMOVE_ATHLETE, TUI_ASK_EDIT_AGAIN
};

struct tui_app {
	struct sd_ctx *ctx;
	struct tui_state st;

	struct db_roster roster;         /* every athlete, compact (store/db.h), read once */
	const struct db_roster_row *athletes;  /* roster.v: all, by name */
	int nathletes;
	int *match;                      /* roster row -> index into athletes */
	int nmatch;
	char matched[TUI_FILTER_MAX];    /* the search `match` was computed for */
	const char **athlete_names;      /* choices for the block form */

	struct db_program *progs;        /* stored templates, without source */
	int nprogs;
	const char **prog_names;

	int have_athlete;                /* the athlete page's athlete */
	struct db_athlete cur;
	struct db_block *blocks;         /* current (open, latest) first, then newest first */
	int nblocks;
	struct db_test *tests;           /* newest first */
	int ntests;
	unsigned char *row_ok;           /* athlete page: selectable rows */
	int nrows;
	struct tui_resp resp;
	struct tui_logview log;

	struct tui_subject a, b;         /* dose and curve views use a; compare uses a and b */
	long long remove_id;             /* athlete a confirmed removal applies to */
	long long end_block;             /* block the finish form ends */

	char *edit_text;                 /* a template being edited, kept across retries */
	size_t edit_len;
	int edit_csv;
	long long edit_id;
	char edit_name[DB_PROGNAME_MAX];

	char status[512];
	int status_err;
	/* The view's own line for the status line's left side while no message shows (the dose
	 * view's warnings and scale marks); each draw sets it anew. */
	char note[160];
	int note_role;
	int unicode, color;
	int quit;
};

/* app.c */
/* Sets the status line (err != 0: shown as an error). */
void tui_say(struct tui_app *a, int err, const char *fmt, ...) __attribute__((format(printf, 3, 4)));
/* Reloads the roster, the templates and the athlete page from the database (after a write
 * here, or Ctrl-L for changes made by another program), keeping the athlete page's athlete
 * when it still exists. */
void tui_reload(struct tui_app *a);
/* Opens a view over the current one, running its init. */
void tui_open(struct tui_app *a, enum tui_view v);
/* The view currently showing. */
const struct tui_screen *tui_screen_of(enum tui_view v);
/* The action bound to key ch in table b, or 0. */
int tui_action(const struct tui_bind *b, int ch);
/* Full redraw of the current view, overlays and status line. */
void tui_draw_all(struct tui_app *a);

/* data.c: reading the store and computing what the views show */
int tui_load_athletes(struct tui_app *a, struct sd_err *e);
/* Rebuilds the roster rows from the search text. */
void tui_filter_roster(struct tui_app *a);
int tui_load_programs(struct tui_app *a, struct sd_err *e);
/* Loads the athlete (by id) with blocks, tests and personal response. */
int tui_load_athlete(struct tui_app *a, long long id, struct sd_err *e);
/* Makes s show a block / a stored template, for the context in a->st (reset to the subject's
 * own status and length when reset_context). A parse failure leaves s not ready, with err. */
int tui_subject_block(struct tui_app *a, struct tui_subject *s, const struct db_block *b,
		      int reset_context, struct sd_err *e);
int tui_subject_template(struct tui_app *a, struct tui_subject *s, long long program_id,
			 int reset_context, struct sd_err *e);
/* Re-runs the audit of a ready subject for the current context. */
void tui_subject_refresh(struct tui_app *a, struct tui_subject *s);
void tui_subject_free(struct tui_subject *s);
/* The context keys every analysis view shares (status, block length, back to own): their
 * bindings, and the action they take (refreshing the subjects). */
enum { TUI_ACT_STATUS = 100, TUI_ACT_WEEKS_DOWN, TUI_ACT_WEEKS_UP, TUI_ACT_OWN };
#define TUI_CONTEXT_BINDS \
	{ { 's' }, TUI_ACT_STATUS, "s", "switch training status (trained / untrained)" }, \
	{ { '[' }, TUI_ACT_WEEKS_DOWN, "[", "block one week shorter" }, \
	{ { ']' }, TUI_ACT_WEEKS_UP, "]", "block one week longer" }, \
	{ { 'o' }, TUI_ACT_OWN, "o", "back to the block's or template's own status and length" }
/* Applies a TUI_ACT_* context action; returns 1 when it was one. */
int tui_context_act(struct tui_app *a, int action);
/* "untrained, 10-week block" (and "(own: ...)" when changed) for headers. */
void tui_context_text(const struct tui_app *a, char *buf, size_t n);
/* The covariates of the current context. */
struct sd_covars tui_covars(const struct tui_app *a);
/* Today's date (SETDOSE_TODAY honoured, as the commands do). */
void tui_today(char *buf);
void tui_resp_free(struct tui_resp *r);
/* What row i of the athlete page is; *idx gets the block or test index. */
enum { TUI_ROW_HEAD, TUI_ROW_BLOCK, TUI_ROW_TEST, TUI_ROW_EMPTY };
int tui_athlete_row(const struct tui_app *a, int i, int *idx);
/* Index of the athlete's current block (open, latest start), -1 when none is open. */
int tui_current_block(const struct tui_app *a);
/* Frees everything the app loaded. */
void tui_data_free(struct tui_app *a);

/* forms.c: the entry forms, the confirmations and the template editor */
void tui_form_open_athlete(struct tui_app *a, const struct db_athlete *edit);
void tui_form_open_block(struct tui_app *a, long long athlete_id);
void tui_form_open_test(struct tui_app *a);
/* Finishing block b (of the athlete page): the end date, today unless changed. */
void tui_form_open_end(struct tui_app *a, const struct db_block *b);
/* Storing a template from a program file: its path and, optionally, a name. */
void tui_form_open_add_template(struct tui_app *a);
/* Handles a key while a form or confirmation is open. */
void tui_form_key(struct tui_app *a, int ch);
void tui_confirm_key(struct tui_app *a, int ch);
void tui_form_draw(struct tui_app *a);
void tui_confirm_draw(struct tui_app *a);
/* Opens $VISUAL/$EDITOR on a stored template's text; stores it only once it is valid. */
void tui_edit_template(struct tui_app *a, long long program_id);
void tui_edit_free(struct tui_app *a);

/* draw.c */
void tui_colors_init(struct tui_app *a);
/* Attributes for a role. */
unsigned tui_attr(enum tui_role r);
/* Writes s at (y, x), at most w columns (display width), in role r; returns columns used. */
int tui_put(int y, int x, int w, enum tui_role r, const char *s);
int tui_putf(int y, int x, int w, enum tui_role r, const char *fmt, ...)
	__attribute__((format(printf, 5, 6)));
/* Text wrapped at word boundaries (io/wrap.h) into lines of w columns from row y, continuation
 * lines indented by indent; at most maxl lines, the last ending in an ellipsis after a whole
 * word when the text needs more. Returns the lines drawn. */
int tui_put_wrapped(int y, int x, int w, int maxl, int indent, enum tui_role r, const char *text);
/* The lines tui_put_wrapped needs for text in w columns. */
int tui_wrapped_lines(int w, int indent, const char *text);
/* Fills w columns at (y, x) with spaces in role r. */
void tui_fill(int y, int x, int w, enum tui_role r);
/* Display width of a UTF-8 string (bytes count 1 each when the locale is not UTF-8). */
int tui_width(const char *s);
/* A dose placed on the curve: w cells over [0, smax], each as tall as the curve is there
 * (lev[i], 0..7, rising and flattening as returns diminish); the climbed part in role r, the
 * dose as a dot, the rest of the curve dim with the plateau and the evidence's end marked. */
void tui_dose_strip(struct tui_app *a, int y, int x, int w, const unsigned char *lev,
		    double smax, double dose, double plateau, double dose_max, enum tui_role r);
/* The scale line above gauges: numbers, and the plateau and evidence-end marks. */
void tui_gauge_scale(struct tui_app *a, int y, int x, int w, double smax, double plateau,
		     double dose_max);
/* Role of a zone. */
enum tui_role tui_zone_role(enum sd_zone z);
/* A horizontal rule of w cells. */
void tui_hline(int y, int x, int w);
/* A frame with a title; clears its inside. */
void tui_frame(int y, int x, int h, int w, const char *title);
/* The key card (help overlay). */
void tui_help_draw(struct tui_app *a);
/* The gauge's scale end for doses up to dmax: past the evidence, rounded up to fives. */
double tui_gauge_max(double dose_max, double dmax);

#endif
