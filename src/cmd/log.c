/* log: the training log, what athletes actually did. Import a log file (all rows or none;
 * rows already stored are recognised and skipped), export it back, and set the weeks done
 * against the weeks planned; each lift's weekly best e1RM from the logged sets. */
#include <stddef.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "../core/e1rm.h"
#include "../core/program.h"
#include "../core/units.h"
#include "../io/audit_out.h"
#include "../io/log_io.h"
#include "../io/recout.h"
#include "../io/safefile.h"
#include "../app/logdata.h"
#include "dbutil.h"

extern const struct sd_cmd cmd_log;

static int usage(struct sd_err *e)
{
	return sd_usage(e, "usage: setdose %s", cmd_log.usage);
}

/* ------------------------------------------------------------ import */

static int find_athlete(void *arg, const char *name, long long *id, int *lb, struct sd_err *e)
{
	struct sd_ctx *ctx = arg;
	struct db_athlete a;

	if (app_athlete_get(ctx->db, name, &a, e))
		return -1;
	*id = a.id;
	*lb = app_lb(ctx, &a);
	return 0;
}

/* Hands the rows read to the store one by one, as db_log rows. Neighbouring rows mostly
 * share their day, exercise, effort and unit, so those texts are made only when they change:
 * formatting them for every row cost as much as storing it. */
struct feed {
	const struct sd_library *lib;
	const struct logio_rows *rows;
	const char *path;
	int i;
	struct db_log last;            /* the texts of the previous row */
	long day;
	int ex, scale;
	double lo, hi;
};

static int next_row(void *arg, struct db_log *out, struct sd_err *e)
{
	struct feed *f = arg;
	const struct tlog_entry *en;
	struct db_log *r = &f->last;

	(void)e;
	if (f->i == f->rows->n)
		return 0;
	en = &f->rows->v[f->i++];
	if (f->i == 1 || en->day != f->day) {
		date_format(en->day, r->date);
		f->day = en->day;
	}
	if (f->i == 1 || en->ex != f->ex) {
		snprintf(r->exercise, sizeof r->exercise, "%s", f->lib->ex[en->ex].name);
		f->ex = en->ex;
	}
	if (f->i == 1 || en->scale != f->scale || en->eff_lo != f->lo || en->eff_hi != f->hi) {
		tlog_effort_text(en->scale, en->eff_lo, en->eff_hi, r->effort, sizeof r->effort);
		f->scale = en->scale;
		f->lo = en->eff_lo;
		f->hi = en->eff_hi;
	}
	r->athlete_id = en->athlete_id;
	r->sets = en->sets;
	r->reps = en->reps;
	r->timed = en->timed;
	r->rir = en->rir;
	r->load = en->load;
	strcpy(r->unit, en->unit == TLOG_UNIT_LB ? "lb" : en->unit == TLOG_UNIT_KG ? "kg" : "");
	r->ordinal = en->ordinal;
	snprintf(r->source, sizeof r->source, "%.80s line %d", f->path, en->line);
	*out = *r;
	return 1;
}

/* The options of the log subcommands (opt.h). */
struct log_opts {
	const char *athlete, *out;
	int force, formula;
	long long block;
};

static int opt_formula(void *dst, const struct sd_optdef *d, const char *v, struct sd_err *e)
{
	(void)d;
	if ((((struct log_opts *)dst)->formula = e1rm_find(v)) < 0)
		return sd_usage(e, "unknown formula '%s' (see 'setdose e1rm --formula all')", v);
	return 0;
}

#define LO(f) offsetof(struct log_opts, f)
static const struct sd_optdef import_opts[] = {
	{ "athlete", OPT_STR, 0, 0, LO(athlete), NULL, "NAME", "the athlete of rows that name none" },
};
static const struct sd_optdef export_opts[] = {
	{ "athlete", OPT_STR, 0, 0, LO(athlete), NULL, "NAME", "only this athlete's rows" },
	{ "out", OPT_STR, 0, 0, LO(out), NULL, "FILE",
	  "export into FILE (refuses an existing file without --force)" },
	{ "force", OPT_FLAG, 0, 0, LO(force), NULL, NULL, "with --out: replace an existing FILE" },
};
static const struct sd_optdef weeks_opts[] = {
	{ "block", OPT_INT, 1, SD_ID_MAX, LO(block), NULL, "ID", "only this block and its weeks" },
};
static const struct sd_optdef e1rm_opts[] = {
	{ "formula", OPT_CALL, 0, 0, 0, opt_formula, "NAME",
	  "1RM equation (default brzycki; see 'setdose e1rm --formula all')" },
};
#undef LO

static int do_import(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	struct log_opts o = { 0 };
	struct logio_src src = { &ctx->lib, 0, find_athlete, ctx, 0, 0, 0 };
	struct logio_rows rows = { 0 };
	struct db_athlete a;
	const char *who;
	char today[DATE_LEN];
	long long added = 0;
	int rc = -1, firstarg = 1;   /* the file: argv[1] once the options are read */

	if ((argc = opt_parse("log import", import_opts, OPT_N(import_opts), &o, argc, argv, e)) < 0)
		return -1;
	who = o.athlete;
	if (argc != 2)
		return usage(e);
	if (app_today(today, e) || date_parse(today, &src.today, e))
		return -1;
	if (who) {
		if (app_athlete_get(ctx->db, who, &a, e))
			return -1;
		src.have_default = 1;
		src.default_id = a.id;
		src.default_lb = app_lb(ctx, &a);
	}
	if (logio_read(argv[firstarg], &src, &rows, e) || tlog_ordinals(rows.v, rows.n, e))
		goto done;
	/* Every row is checked before the first write; the rows then go in as one transaction. */
	struct feed f;
	memset(&f, 0, sizeof f);
	f.lib = &ctx->lib;
	f.rows = &rows;
	f.path = argv[firstarg];
	if (db_begin(ctx->db, e) || db_log_add(ctx->db, next_row, &f, &added, e) ||
	    db_commit(ctx->db, e))
		goto done;
	fprintf(ctx->out, "imported '%s': %d row%s read, %lld new, %lld already stored\n",
		argv[firstarg], rows.n, rows.n == 1 ? "" : "s", added, rows.n - added);
	rc = 0;
done:
	logio_free(&rows);
	return rc;
}

/* ------------------------------------------------------------ export */

struct export {
	FILE *f;
	long long n;
};

static int export_row(const struct db_log *r, const char *athlete, void *arg)
{
	struct export *x = arg;
	logio_row(x->f, r->date, athlete, r->exercise, r->sets, r->reps, r->timed, r->load, r->unit,
		  r->effort);
	x->n++;
	return 0;
}

static int write_log(struct sd_ctx *ctx, long long athlete_id, FILE *f, long long *n,
		     struct sd_err *e)
{
	struct export x = { f, 0 };
	logio_head(f);
	if (db_log_each(ctx->db, athlete_id, NULL, NULL, export_row, &x, e))
		return -1;
	*n = x.n;
	return ferror(f) ? sd_fail(e, "cannot write the log") : 0;
}

static int do_export(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	struct log_opts o = { 0 };
	struct db_athlete a = { 0 };
	const char *who, *out;
	struct sf_file sf;
	long long n = 0;
	int force;

	if ((argc = opt_parse("log export", export_opts, OPT_N(export_opts), &o, argc, argv, e)) < 0)
		return -1;
	who = o.athlete;
	out = o.out;
	force = o.force;
	if (argc != 1)
		return usage(e);
	if (force && !out)
		return sd_usage(e, "--force needs --out FILE");
	if (who && app_athlete_get(ctx->db, who, &a, e))
		return -1;
	if (!out)
		return write_log(ctx, a.id, ctx->out, &n, e);
	if (sf_open(&sf, out, force, e))
		return -1;
	if (sf_finish(&sf, write_log(ctx, a.id, sf.fp, &n, e), e))
		return -1;
	fprintf(ctx->out, "wrote %s (%lld row%s)\n", out, n, n == 1 ? "" : "s");
	return 0;
}

/* ------------------------------------------------------------ weeks */

static const char *const week_heads[] = { "<week", "<monday", "block", "sessions", "planned_s",
	"missed", "<muscle", "done", "planned", "adherence%" };
static const char *const block_heads[] = { "block", "<program", "<from", "<to", "weeks",
	"days", "<muscle", "planned", "done", "adherence%" };

static void set_pct(struct sd_rec *r, int col, double pct, int precise)
{
	if (isfinite(pct))
		rec_set(r, col, precise ? "%.2f" : "%.0f", pct);
	else
		rec_set(r, col, "%s", "");
}

static int week_rows(const struct tlog_weeks *ws, struct sd_rec *r, int precise)
{
	for (int i = 0; i < ws->n; i++) {
		const struct tlog_week *w = &ws->w[i];
		char monday[DATE_LEN];
		date_format(w->monday, monday);
		for (int m = 0; m < SD_NMUSCLES; m++) {
			if (!(w->planned[m] > 0) && !(w->done[m] > 0))
				continue;
			if (rec_row(r))
				return -1;
			rec_set(r, 0, "%04d-W%02d", w->year, w->week);
			rec_set(r, 1, "%s", monday);
			if (w->block)
				rec_set(r, 2, "%lld", w->block);
			rec_set(r, 3, "%d", w->sessions);
			rec_set(r, 4, "%.1f", w->planned_sessions);
			rec_set(r, 5, "%d", tlog_missed(w));
			rec_set(r, 6, "%s", muscle_name(m));
			rec_set(r, 7, precise ? "%.3f" : "%.1f", w->done[m]);
			rec_set(r, 8, precise ? "%.3f" : "%.1f", w->planned[m]);
			set_pct(r, 9, tlog_adherence(w->done[m], w->planned[m]), precise);
		}
	}
	return 0;
}

/* Per block: the planned weekly dose against the logged average over its span. */
static int block_rows(struct sd_ctx *ctx, const struct db_block *b, int nb, long long only,
		      struct sd_rec *r, int precise, struct sd_err *e)
{
	for (int i = 0; i < nb; i++) {
		double plan[SD_NMUSCLES], done[SD_NMUSCLES];
		struct tlog_span span;
		char from[DATE_LEN], to[DATE_LEN];
		int sessions;

		if (only && b[i].id != only)
			continue;
		if (logd_block_done(ctx, &b[i], done, &span, e))
			return -1;
		if (span.to < span.from)
			continue;   /* not begun */
		if (logd_block_plan(ctx, &b[i], plan, &sessions, e))
			return -1;
		date_format(span.from, from);
		date_format(span.to, to);
		for (int m = 0; m < SD_NMUSCLES; m++) {
			if (!(plan[m] > 0) && !(done[m] > 0))
				continue;
			if (rec_row(r))
				return sd_fail(e, "out of memory");
			rec_set(r, 0, "%lld", b[i].id);
			rec_set(r, 1, "%s", b[i].program);
			rec_set(r, 2, "%s", from);
			rec_set(r, 3, "%s", to);
			rec_set(r, 4, "%.1f", tlog_span_weeks(&span));
			rec_set(r, 5, "%d", span.days);
			rec_set(r, 6, "%s", muscle_name(m));
			rec_set(r, 7, precise ? "%.3f" : "%.1f", plan[m]);
			if (span.rows) {
				rec_set(r, 8, precise ? "%.3f" : "%.1f", done[m]);
				set_pct(r, 9, tlog_adherence(done[m], plan[m]), precise);
			}
		}
	}
	return 0;
}

/* A listing as JSON text, for an extra member of another listing's object. */
static char *rec_json_text(const struct sd_rec *r)
{
	char *buf = NULL;
	size_t len = 0;
	FILE *f = open_memstream(&buf, &len);

	if (!f)
		return NULL;
	rec_print(r, f);
	if (fclose(f)) {
		free(buf);
		return NULL;
	}
	while (len && (buf[len - 1] == '\n'))
		buf[--len] = '\0';
	return buf;
}

static int print_weeks(struct sd_ctx *ctx, const struct db_athlete *a, const struct sd_rec *wr,
		       const struct sd_rec *br, const struct tlog_weeks *ws, struct sd_err *e)
{
	if (ctx->opt.format == SD_FMT_JSON) {
		char *name = rec_json_string(a->name), *blocks = rec_json_text(br);
		char *caution = rec_json_string(aout_caution), limit[16], unknown[16];
		const char *extra[] = { "athlete", name, "rir_limit", limit, "unknown_sets", unknown,
			"blocks", blocks, "caution", caution, NULL };
		int rc = 0;
		if (!name || !blocks || !caution)
			rc = sd_fail(e, "out of memory");
		else {
			snprintf(limit, sizeof limit, "%d", ctx->opt.max_rir);
			snprintf(unknown, sizeof unknown, "%d", ws->unknown_sets);
			rec_print_json_object(wr, "weeks", ctx->out, extra);
		}
		free(name);
		free(blocks);
		free(caution);
		return rc;
	}
	if (ctx->opt.format == SD_FMT_CSV) {
		rec_print(wr, ctx->out);
		fputc('\n', ctx->out);
		rec_print(br, ctx->out);
		return 0;
	}
	fprintf(ctx->out, "athlete %s: weekly fractional sets logged (done) against the plan of the "
		"blocks covering each ISO week;\nhard sets only (RIR %d or less, --max-rir); a week "
		"partly inside a block is planned in proportion\nto its days inside\n\n", a->name,
		ctx->opt.max_rir);
	if (rec_rows(wr))
		rec_print(wr, ctx->out);
	else
		fprintf(ctx->out, "no blocks and no logged sets yet\n");
	if (ws->unknown_sets)
		fprintf(ctx->out, "(%d logged hard set%s of exercises the library no longer knows are "
			"not counted)\n", ws->unknown_sets, ws->unknown_sets == 1 ? "" : "s");
	if (rec_rows(br)) {
		fprintf(ctx->out, "\nper block: the planned weekly dose against the logged average "
			"(sets logged in the block / its weeks)\n\n");
		rec_print(br, ctx->out);
	}
	fprintf(ctx->out, "\nsessions: days with a logged hard set; planned_s: the blocks' training "
		"days for the week; missed:\nplanned_s rounded, less sessions; adherence: done / "
		"planned\n");
	cmd_print_caution(ctx);
	return 0;
}

static int do_weeks(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	struct log_opts o = { 0 };
	struct db_athlete a;
	struct db_block *b = NULL;
	struct tlog_weeks ws = { 0 };
	struct sd_rec *wr = NULL, *br = NULL;
	long long only;
	int nb = 0, rc = -1, found = 0, precise = ctx->opt.format != SD_FMT_TABLE, firstarg = 1;

	if ((argc = opt_parse("log weeks", weeks_opts, OPT_N(weeks_opts), &o, argc, argv, e)) < 0)
		return -1;
	only = o.block;
	if (argc != 2)
		return usage(e);
	if (app_athlete_get(ctx->db, argv[firstarg], &a, e) ||
	    db_block_list(ctx->db, a.id, &b, &nb, e))
		return -1;
	for (int i = 0; i < nb; i++)
		found |= b[i].id == only;
	if (only && !found) {
		sd_fail(e, "block %lld is not one of athlete '%s''s blocks", only, a.name);
		goto done;
	}
	if (logd_weeks(ctx, a.id, b, nb, only, &ws, e))
		goto done;
	if (!(wr = rec_new(10, week_heads, ctx->opt.format)) ||
	    !(br = rec_new(10, block_heads, ctx->opt.format)) || week_rows(&ws, wr, precise)) {
		sd_fail(e, "out of memory");
		goto done;
	}
	if (block_rows(ctx, b, nb, only, br, precise, e))
		goto done;
	rc = print_weeks(ctx, &a, wr, br, &ws, e);
done:
	rec_free(wr);
	rec_free(br);
	tlog_weeks_free(&ws);
	free(b);
	return rc;
}

/* ------------------------------------------------------------ e1rm */

static int do_e1rm(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	static const char *const heads[] = { "<lift", "<week", "<date", "load", "reps", "rir",
		"to_failure", "e1rm", "<unit" };
	struct db_athlete a;
	struct tlog_trend t = { 0 };
	struct sd_rec *r = NULL;
	char lift[DB_NAME_MAX];
	struct log_opts o = { .formula = E1RM_DEFAULT };
	int f, rc = -1, lb, one = -1, firstarg = 1;

	if ((argc = opt_parse("log e1rm", e1rm_opts, OPT_N(e1rm_opts), &o, argc, argv, e)) < 0)
		return -1;
	f = o.formula;
	if (argc - firstarg < 1 || argc - firstarg > 2)
		return usage(e);
	if (argc - firstarg == 2) {
		if (app_lift(&ctx->lib, argv[firstarg + 1], lift, sizeof lift, e))
			return -1;
		one = lib_find(&ctx->lib, lift);
	}
	if (app_athlete_get(ctx->db, argv[firstarg], &a, e) ||
	    logd_trend(ctx, a.id, f, NULL, NULL, &t, e))
		return -1;
	lb = app_lb(ctx, &a);
	if (!(r = rec_new(9, heads, ctx->opt.format))) {
		sd_fail(e, "out of memory");
		goto done;
	}
	for (int i = 0; i < t.n; i++) {
		const struct tlog_best *w = &t.v[i];
		char date[DATE_LEN];
		int y, wk;
		if (one >= 0 && w->ex != one)
			continue;
		if (rec_row(r)) {
			sd_fail(e, "out of memory");
			goto done;
		}
		tlog_iso_week(w->day, &y, &wk);
		date_format(w->day, date);
		rec_set(r, 0, "%s", ctx->lib.ex[w->ex].name);
		rec_set(r, 1, "%04d-W%02d", y, wk);
		rec_set(r, 2, "%s", date);
		rec_set(r, 3, "%.1f", units_show(w->load_kg, lb));
		rec_set(r, 4, "%d", w->reps);
		rec_set(r, 5, "%g", w->rir);
		rec_set(r, 6, "%g", w->rtf);
		rec_set(r, 7, ctx->opt.format == SD_FMT_TABLE ? "%.1f" : "%.3f",
			units_show(w->e1rm_kg, lb));
		rec_set(r, 8, "%s", units_name(lb));
	}
	if (ctx->opt.format == SD_FMT_TABLE) {
		fprintf(ctx->out, "athlete %s: each lift's best e1RM per ISO week from logged sets, "
			"reps + RIR taken as reps to failure\n(common practice, no source); %s, sets of "
			"at most %d reps to failure\n\n", a.name, e1rm_source(f), TLOG_E1RM_MAX_RTF);
		if (rec_rows(r))
			rec_print(r, ctx->out);
		else
			fprintf(ctx->out, "no logged set with a load and a recorded effort yet\n");
	} else {
		rec_print(r, ctx->out);
	}
	rc = 0;
done:
	rec_free(r);
	tlog_trend_free(&t);
	return rc;
}

static const struct sd_sub subs[] = {
	{ "import", "log import", do_import, import_opts, OPT_N(import_opts) },
	{ "export", "log export", do_export, export_opts, OPT_N(export_opts) },
	{ "weeks", "log weeks", do_weeks, weeks_opts, OPT_N(weeks_opts) },
	{ "e1rm", "log e1rm", do_e1rm, e1rm_opts, OPT_N(e1rm_opts) },
	{ NULL, NULL, NULL, NULL, 0 },
};

const struct sd_cmd cmd_log = {
	.name = "log",
	.summary = "the training log: import and export logged sets, weeks done against planned",
	.usage = "log import FILE [--athlete NAME]\n"
		 "       setdose log export [--athlete NAME] [--out FILE [--force]]\n"
		 "       setdose log weeks ATHLETE [--block ID]\n"
		 "       setdose log e1rm ATHLETE [LIFT] [--formula NAME]\n"
		 "  FILE       a log file (CSV: date, exercise, sets, reps, load, effort, athlete;\n"
		 "             see 'man setdose', LOG FILES); all rows are stored or none, and\n"
		 "             rows already stored are recognised and not stored twice\n"

		 "  weeks      per ISO week: fractional sets from the logged hard sets per muscle,\n"
		 "             the block's planned dose, adherence, sessions missed; then each\n"
		 "             block's planned dose against its logged average\n"
		 "  e1rm       each lift's best e1RM per week from logged sets (reps + RIR as reps\n"
		 "             to failure, at most 10; --formula as for 'setdose e1rm')",
	.flags = CMD_DB | CMD_LIBRARY | CMD_PROFILE,
	.subs = subs,
};
