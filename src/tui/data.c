/* What the views show, read from the store and computed by the same functions the commands
 * use: audit_run for doses, app/respdata.c (as `setdose response`) for the personal response. */
#include <ctype.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "../app/logdata.h"
#include "../app/respdata.h"
#include "../core/e1rm.h"
#include "../io/program_io.h"
#include "app.h"

void tui_today(char *buf)
{
	if (app_today(buf, NULL))
		snprintf(buf, DATE_LEN, "2000-01-01");
}

struct sd_covars tui_covars(const struct tui_app *a)
{
	struct sd_covars c = { a->st.context.weeks, a->st.context.trained };
	return c;
}

int tui_context_act(struct tui_app *a, int action)
{
	switch (action) {
	case TUI_ACT_STATUS:
		tui_context_toggle_status(&a->st.context);
		break;
	case TUI_ACT_WEEKS_DOWN:
		tui_context_weeks(&a->st.context, -1);
		break;
	case TUI_ACT_WEEKS_UP:
		tui_context_weeks(&a->st.context, 1);
		break;
	case TUI_ACT_OWN:
		tui_context_reset(&a->st.context, a->st.context.base_trained, a->st.context.base_weeks);
		break;
	default:
		return 0;
	}
	tui_subject_refresh(a, &a->a);
	tui_subject_refresh(a, &a->b);
	return 1;
}

void tui_context_text(const struct tui_app *a, char *buf, size_t n)
{
	const struct tui_context *c = &a->st.context;
	int len = snprintf(buf, n, "%s, %.3g-week block", c->trained ? "trained" : "untrained",
			   c->weeks);
	struct sd_covars cov = tui_covars(a);
	char names[32];
	unsigned beyond = curve_beyond(&a->ctx->profile, &cov, a->ctx->profile.dose_min);

	if (tui_context_changed(c) && len > 0 && (size_t)len < n)
		len += snprintf(buf + len, n - (size_t)len, " (own: %s, %.3g wk)",
				c->base_trained ? "trained" : "untrained", c->base_weeks);
	/* A block length or status outside the profile's evidence is flagged in every view. */
	if ((beyond &= ~(unsigned)SD_BEYOND_DOSE) && len > 0 && (size_t)len < n)
		snprintf(buf + len, n - (size_t)len, "; %s beyond the evidence",
			 curve_beyond_names(beyond, names, sizeof names));
}

/* The search runs over the roster's folded names (a lowercase copy made once at load). When
 * the text only grew, the names that matched before are the only candidates, so each further
 * keystroke looks at fewer names. */
void tui_filter_roster(struct tui_app *a)
{
	char q[TUI_FILTER_MAX];
	int k = 0, narrow;

	for (int i = 0; i <= a->st.search.len; i++)
		q[i] = (char)tolower((unsigned char)a->st.search.text[i]);
	narrow = a->matched[0] && a->nmatch >= 0 && !strncmp(q, a->matched, strlen(a->matched));
	if (narrow) {
		for (int i = 0; i < a->nmatch; i++)
			if (strstr(a->athletes[a->match[i]].key, q))
				a->match[k++] = a->match[i];
	} else {
		for (int i = 0; i < a->nathletes; i++)
			if (!q[0] || strstr(a->athletes[i].key, q))
				a->match[k++] = i;
	}
	a->nmatch = k;
	snprintf(a->matched, sizeof a->matched, "%s", q);
	tui_list_count(&a->st.roster, k);
}

int tui_load_athletes(struct tui_app *a, struct sd_err *e)
{
	struct db_roster r;
	int n;

	/* Notes only as far as the roster shows them; the athlete page reads the whole record. */
	if (db_roster_load(a->ctx->db, TUI_NOTE_SHOWN, 0, &r, e))
		return -1;
	db_roster_free(&a->roster);
	free(a->match);
	free(a->athlete_names);
	a->roster = r;
	a->athletes = r.v;
	a->nathletes = n = r.n;
	a->matched[0] = '\0';
	a->match = malloc((size_t)(n ? n : 1) * sizeof *a->match);
	a->athlete_names = malloc((size_t)(n ? n : 1) * sizeof *a->athlete_names);
	if (!a->match || !a->athlete_names) {
		a->nathletes = 0;
		return sd_fail(e, "out of memory");
	}
	for (int i = 0; i < n; i++)
		a->athlete_names[i] = r.v[i].name;
	tui_filter_roster(a);
	return 0;
}

int tui_load_programs(struct tui_app *a, struct sd_err *e)
{
	struct db_program *v = NULL;
	int n = 0;

	if (db_program_list(a->ctx->db, &v, &n, e))
		return -1;
	db_program_list_free(a->progs, a->nprogs);
	free(a->prog_names);
	a->progs = v;
	a->nprogs = n;
	a->prog_names = malloc((size_t)(n ? n : 1) * sizeof *a->prog_names);
	if (!a->prog_names) {
		a->nprogs = 0;
		return sd_fail(e, "out of memory");
	}
	for (int i = 0; i < n; i++)
		a->prog_names[i] = v[i].name;
	tui_list_count(&a->st.shelf, n);
	return 0;
}

/* Open blocks first (the latest start is the current one), then ended ones, newest first. */
static int block_order(const void *x, const void *y)
{
	const struct db_block *p = x, *q = y;
	int c;
	if (!p->end[0] != !q->end[0])
		return p->end[0] ? 1 : -1;
	if ((c = strcmp(q->start, p->start)))
		return c;
	return q->id > p->id ? 1 : q->id < p->id ? -1 : 0;
}

static int test_order(const void *x, const void *y)
{
	const struct db_test *p = x, *q = y;
	int c;
	if ((c = strcmp(q->date, p->date)))
		return c;
	return q->id > p->id ? 1 : q->id < p->id ? -1 : 0;
}

void tui_resp_free(struct tui_resp *r)
{
	free(r->obs);
	memset(r, 0, sizeof *r);
}

/* The same computation as `setdose response ATHLETE` (app/respdata.c), with its defaults. */
static void load_response(struct tui_app *a)
{
	struct resp_opts ro = { RESP_TEST_SD, RESPD_PRIOR_PROFILE, a->ctx->opt.level, 0,
				RESP_ESTIMATE_SD };
	struct resp_data d;
	struct sd_err e;
	struct tui_resp *r = &a->resp;

	tui_resp_free(r);
	sd_err_clear(&e);
	if (respd_load(a->ctx, a->cur.name, 0, RESPD_WINDOW_DAYS, &ro, &d, &e)) {
		snprintf(r->err, sizeof r->err, "%s", e.msg);
		return;
	}
	if (d.n && !(r->obs = calloc((size_t)d.n, sizeof *r->obs))) {
		snprintf(r->err, sizeof r->err, "out of memory");
		respd_free(&d);
		return;
	}
	for (int i = 0; i < d.n; i++) {
		const struct resp_row *w = &d.v[i];
		struct tui_obs *o = &r->obs[i];
		o->block = w->block;
		snprintf(o->lift, sizeof o->lift, "%s", w->lift);
		o->change = curve_pct(w->ob.obs);
		o->dose = w->dose;
		o->predicted = curve_pct(w->pt.y);
		o->lo = curve_pct(w->fit.lo);
		o->hi = curve_pct(w->fit.hi);
		o->pctile = w->fit.pctile;
	}
	r->nobs = d.n;
	r->n = d.personal.n;
	r->nblocks = d.nblocks;
	r->pct = curve_pct(d.personal.mean);
	r->lo = curve_pct(d.personal.lo);
	r->hi = curve_pct(d.personal.hi);
	r->weight = d.personal.weight;
	r->estimated = d.vars.estimated;
	r->ok = 1;
	respd_free(&d);
}

/* The block the log panel shows: the current one, else the latest (blocks are in that
 * order, block_order). */
static const struct db_block *log_block(const struct tui_app *a)
{
	return a->nblocks ? &a->blocks[0] : NULL;
}

/* The planned muscles, largest planned dose first (then in the fixed muscle order). */
static void muscle_order(struct tui_logview *lv)
{
	for (int m = 0; m < SD_NMUSCLES; m++) {
		int k;
		if (!(lv->planned[m] > 0 || lv->done[m] > 0))
			continue;
		for (k = lv->nmus; k > 0 && lv->planned[lv->order[k - 1]] < lv->planned[m]; k--)
			lv->order[k] = lv->order[k - 1];
		lv->order[k] = m;
		lv->nmus++;
	}
}

/* Each lift's weekly bests in the block, the lifts with the most weeks first. */
static void log_lifts(struct tui_app *a, const struct tlog_trend *t)
{
	struct tui_logview *lv = &a->log;

	for (int i = 0; i < t->n;) {
		int j = i;
		while (j < t->n && t->v[j].ex == t->v[i].ex)
			j++;
		int k = lv->nlift;
		if (k == TUI_LOG_LIFTS) {
			/* Full: replace the lift with the fewest weeks if this one has more. */
			k = 0;
			for (int q = 1; q < TUI_LOG_LIFTS; q++)
				if (lv->lift[q].n < lv->lift[k].n)
					k = q;
			if (lv->lift[k].n >= (j - i < TUI_LOG_WEEKS ? j - i : TUI_LOG_WEEKS)) {
				i = j;
				continue;
			}
		} else {
			lv->nlift++;
		}
		struct tui_liftrend *l = &lv->lift[k];
		int from = j - i > TUI_LOG_WEEKS ? j - TUI_LOG_WEEKS : i;
		snprintf(l->lift, sizeof l->lift, "%s", a->ctx->lib.ex[t->v[i].ex].name);
		l->n = j - from;
		for (int q = from; q < j; q++)
			l->v[q - from] = t->v[q].e1rm_kg;
		i = j;
	}
}

/* The log panel of the athlete page, from the code behind `log weeks` and `log e1rm`. */
static void load_log(struct tui_app *a)
{
	struct tui_logview *lv = &a->log;
	const struct db_block *b = log_block(a);
	struct tlog_weeks ws = { 0 };
	struct tlog_trend t = { 0 };
	struct tlog_span span;
	struct sd_err e;
	char from[DATE_LEN], to[DATE_LEN];
	int sessions;

	memset(lv, 0, sizeof *lv);
	sd_err_clear(&e);
	if (!b)
		return;
	if (logd_block_done(a->ctx, b, lv->done, &span, &e))
		goto fail;
	if (!span.rows)
		return;
	if (logd_block_plan(a->ctx, b, lv->planned, &sessions, &e) ||
	    logd_weeks(a->ctx, a->cur.id, b, 1, b->id, &ws, &e))
		goto fail;
	date_format(span.from, from);
	date_format(span.to, to);
	if (logd_trend(a->ctx, a->cur.id, E1RM_DEFAULT, from, to, &t, &e))
		goto fail;
	lv->block = b->id;
	lv->nweeks = ws.n < TUI_LOG_WEEKS ? ws.n : TUI_LOG_WEEKS;
	for (int i = 0; i < lv->nweeks; i++) {
		const struct tlog_week *w = &ws.w[ws.n - lv->nweeks + i];
		for (int m = 0; m < SD_NMUSCLES; m++)
			lv->ratio[i][m] = w->planned[m] > 0 ? w->done[m] / w->planned[m] : -1;
		if (i == 0)
			snprintf(lv->first, sizeof lv->first, "%04d-W%02d", w->year, w->week);
		snprintf(lv->last, sizeof lv->last, "%04d-W%02d", w->year, w->week);
	}
	muscle_order(lv);
	log_lifts(a, &t);
	lv->ok = 1;
	goto done;
fail:
	snprintf(lv->err, sizeof lv->err, "%s", e.msg);
done:
	tlog_weeks_free(&ws);
	tlog_trend_free(&t);
}

int tui_athlete_row(const struct tui_app *a, int i, int *idx)
{
	int nb = a->nblocks ? a->nblocks : 1;
	*idx = -1;
	if (i == 0)
		return TUI_ROW_HEAD;
	if (i <= nb) {
		*idx = i - 1;
		return a->nblocks ? TUI_ROW_BLOCK : TUI_ROW_EMPTY;
	}
	if (i == nb + 1)
		return TUI_ROW_HEAD;
	*idx = i - nb - 2;
	return a->ntests ? TUI_ROW_TEST : TUI_ROW_EMPTY;
}

int tui_current_block(const struct tui_app *a)
{
	return a->nblocks && !a->blocks[0].end[0] ? 0 : -1;
}

int tui_load_athlete(struct tui_app *a, long long id, struct sd_err *e)
{
	struct db_block *b = NULL;
	struct db_test *t = NULL;
	unsigned char *ok = NULL;
	int nb = 0, nt = 0, found = -1, nrows;

	for (int i = 0; i < a->nathletes; i++)
		if (a->athletes[i].id == id)
			found = i;
	if (found < 0)
		return sd_fail(e, "the athlete is no longer in the database");
	if (db_block_list(a->ctx->db, id, &b, &nb, e) || db_test_list(a->ctx->db, id, NULL, &t, &nt, e))
		goto fail;
	nrows = 2 + (nb ? nb : 1) + (nt ? nt : 1);
	if (!(ok = malloc((size_t)nrows))) {
		sd_fail(e, "out of memory");
		goto fail;
	}
	if (nb)
		qsort(b, (size_t)nb, sizeof *b, block_order);
	if (nt)
		qsort(t, (size_t)nt, sizeof *t, test_order);
	free(a->blocks);
	free(a->tests);
	free(a->row_ok);
	if (db_athlete_get_id(a->ctx->db, id, &a->cur, e))
		goto fail;
	a->have_athlete = 1;
	a->blocks = b;
	a->nblocks = nb;
	a->tests = t;
	a->ntests = nt;
	a->row_ok = ok;
	a->nrows = nrows;
	for (int i = 0; i < nrows; i++) {
		int idx, k = tui_athlete_row(a, i, &idx);
		ok[i] = k == TUI_ROW_BLOCK || k == TUI_ROW_TEST;
	}
	tui_list_count(&a->st.athlete, nrows);
	/* Rows move when a block or test is added: stay off the headings. */
	tui_list_move_skip(&a->st.athlete, 0, a->row_ok);
	load_response(a);
	load_log(a);
	return 0;
fail:
	free(b);
	free(t);
	return -1;
}

void tui_subject_free(struct tui_subject *s)
{
	if (s->ready)
		audit_free(&s->audit);
	prog_free(&s->prog);
	db_program_free(&s->rec);
	memset(s, 0, sizeof *s);
}

void tui_subject_refresh(struct tui_app *a, struct tui_subject *s)
{
	struct sd_audit_opts o = { a->ctx->opt.level, a->ctx->opt.max_rir, SD_SESSION_CAP };
	struct sd_covars cov = tui_covars(a);
	struct sd_err e;

	if (s->ready) {
		audit_free(&s->audit);
		s->ready = 0;
	}
	if (s->err[0] || !s->rec.source)
		return;
	sd_err_clear(&e);
	if (audit_run(&s->prog, &a->ctx->lib, &a->ctx->profile, &cov, &o, &s->audit, &e)) {
		snprintf(s->err, sizeof s->err, "%s", e.msg);
		return;
	}
	s->ready = 1;
}

/* Parses the subject's template; a template that no longer reads (the library changed) is
 * shown with its error rather than refused. */
static void subject_parse(struct tui_app *a, struct tui_subject *s)
{
	struct sd_err e;
	sd_err_clear(&e);
	if (program_parse(s->rec.name, s->rec.source, s->rec.len, s->rec.is_csv, &a->ctx->lib,
			  &s->prog, &e)) {
		memset(&s->prog, 0, sizeof s->prog);
		snprintf(s->err, sizeof s->err, "%s", e.msg);
	}
}

int tui_subject_block(struct tui_app *a, struct tui_subject *s, const struct db_block *b,
		      int reset_context, struct sd_err *e)
{
	struct db_block copy = *b;

	tui_subject_free(s);
	if (db_program_get_id(a->ctx->db, copy.program_id, &s->rec, e))
		return -1;
	s->kind = TUI_SUBJ_BLOCK;
	s->block = copy;
	snprintf(s->label, sizeof s->label, "block %lld '%s'", copy.id, s->rec.name);
	subject_parse(a, s);
	/* The same context `block show` uses: the athlete's status and the block's length
	 * (the actual one once ended). */
	if (reset_context)
		tui_context_reset(&a->st.context, copy.trained, app_block_weeks(&copy));
	tui_subject_refresh(a, s);
	return 0;
}

int tui_subject_template(struct tui_app *a, struct tui_subject *s, long long program_id,
			 int reset_context, struct sd_err *e)
{
	tui_subject_free(s);
	if (db_program_get_id(a->ctx->db, program_id, &s->rec, e))
		return -1;
	s->kind = TUI_SUBJ_TEMPLATE;
	snprintf(s->label, sizeof s->label, "template '%s'", s->rec.name);
	subject_parse(a, s);
	if (reset_context) {
		/* The same context `audit` uses for a program file. */
		struct sd_covars c = app_covars(a->ctx, s->err[0] ? 0 : s->prog.weeks);
		tui_context_reset(&a->st.context, c.trained >= 0.5, c.weeks);
	}
	tui_subject_refresh(a, s);
	return 0;
}

void tui_data_free(struct tui_app *a)
{
	db_roster_free(&a->roster);
	free(a->match);
	free(a->athlete_names);
	db_program_list_free(a->progs, a->nprogs);
	free(a->prog_names);
	free(a->blocks);
	free(a->tests);
	free(a->row_ok);
	tui_resp_free(&a->resp);
	tui_subject_free(&a->a);
	tui_subject_free(&a->b);
	tui_edit_free(a);
	a->athletes = NULL;
	a->match = NULL;
	a->athlete_names = NULL;
	a->progs = NULL;
	a->prog_names = NULL;
	a->blocks = NULL;
	a->tests = NULL;
	a->row_ok = NULL;
	a->nathletes = a->nprogs = a->nblocks = a->ntests = a->nrows = a->nmatch = 0;
}
