#include "logdata.h"

#include <stdlib.h>
#include <string.h>

#include "../core/units.h"

/* Stored exercise names to library indices. A log names few exercises many times, so each
 * name is folded and looked up once (a hash table of the names seen); the lookup per row is
 * a hash and one compare. */
#define NAMES_SLOTS 1024

struct names {
	const struct sd_library *lib;
	struct {
		char name[DB_NAME_MAX];
		int ex;
		int used;
	} slot[NAMES_SLOTS];
};

static int name_index(struct names *nm, const char *name)
{
	unsigned h = lib_hash(name) & (NAMES_SLOTS - 1);

	for (int probe = 0; probe < NAMES_SLOTS; probe++, h = (h + 1) & (NAMES_SLOTS - 1)) {
		if (!nm->slot[h].used) {
			nm->slot[h].used = 1;
			snprintf(nm->slot[h].name, sizeof nm->slot[h].name, "%s", name);
			nm->slot[h].ex = lib_find(nm->lib, name);
			return nm->slot[h].ex;
		}
		if (!strcmp(nm->slot[h].name, name))
			return nm->slot[h].ex;
	}
	return lib_find(nm->lib, name);   /* a full table: look it up the slow way */
}

static struct names *names_new(const struct sd_library *lib, struct sd_err *e)
{
	struct names *nm = calloc(1, sizeof *nm);
	if (!nm)
		sd_fail(e, "out of memory");
	else
		nm->lib = lib;
	return nm;
}

static long day_of(const char *date)
{
	long d = 0;
	date_parse(date, &d, NULL);
	return d;
}

struct days_walk {
	struct logd_days *out;
	struct names *nm;
	struct sd_err *e;
};

static int one_sum(const struct db_log_sum *s, void *arg)
{
	struct days_walk *w = arg;
	struct logd_days *d = w->out;

	if (d->n == d->cap) {
		int ncap = d->cap ? 2 * d->cap : 256;
		struct tlog_daysets *nv = realloc(d->v, (size_t)ncap * sizeof *nv);
		if (!nv)
			return sd_fail(w->e, "out of memory");
		d->v = nv;
		d->cap = ncap;
	}
	d->v[d->n++] = (struct tlog_daysets){ day_of(s->date), name_index(w->nm, s->exercise),
					      s->within, s->above, s->unrecorded };
	return 0;
}

int logd_days(struct sd_ctx *ctx, long long athlete_id, const char *from, const char *to,
	      struct logd_days *out, struct sd_err *e)
{
	struct days_walk w = { out, NULL, e };
	int rc;

	memset(out, 0, sizeof *out);
	if (!(w.nm = names_new(&ctx->lib, e)))
		return -1;
	rc = db_log_sums(ctx->db, athlete_id, from, to, ctx->opt.max_rir, one_sum, &w, e);
	free(w.nm);
	if (rc)
		logd_days_free(out);
	return rc ? -1 : 0;
}

void logd_days_free(struct logd_days *d)
{
	free(d->v);
	memset(d, 0, sizeof *d);
}

void logd_block_span(const struct db_block *b, long today, long *from, long *to)
{
	*from = day_of(b->start);
	if (b->end[0]) {
		*to = day_of(b->end);
		return;
	}
	*to = *from + 7L * b->weeks - 1;
	if (*to > today)
		*to = today;
}

int logd_block_plan(struct sd_ctx *ctx, const struct db_block *b, double dose[SD_NMUSCLES],
		    int *sessions, struct sd_err *e)
{
	struct db_program p = { 0 };
	struct sd_program prog;
	struct sd_audit au;

	if (db_program_get_id(ctx->db, b->program_id, &p, e) ||
	    app_block_audit(ctx, b, &p, SD_SESSION_CAP, &prog, &au, e)) {
		db_program_free(&p);
		return -1;
	}
	for (int m = 0; m < SD_NMUSCLES; m++)
		dose[m] = au.row[m].dose.fractional;
	*sessions = prog.ndays;
	audit_free(&au);
	prog_free(&prog);
	db_program_free(&p);
	return 0;
}

static int today_day(long *today, struct sd_err *e)
{
	char t[DATE_LEN];
	if (app_today(t, e))
		return -1;
	*today = day_of(t);
	return 0;
}

int logd_block_done(struct sd_ctx *ctx, const struct db_block *b, double dose[SD_NMUSCLES],
		    struct tlog_span *span, struct sd_err *e)
{
	struct logd_days d;
	char from[DATE_LEN], to[DATE_LEN];
	long s, t, today;

	if (today_day(&today, e))
		return -1;
	logd_block_span(b, today, &s, &t);
	tlog_span_init(span, s, t);
	memset(dose, 0, SD_NMUSCLES * sizeof *dose);
	if (t < s)
		return 0;
	date_format(s, from);
	date_format(t, to);
	if (logd_days(ctx, b->athlete_id, from, to, &d, e))
		return -1;
	for (int i = 0; i < d.n; i++)
		tlog_span_add(span, &ctx->lib, ctx->profile.w_direct, ctx->profile.w_indirect, &d.v[i]);
	tlog_span_dose(span, dose);
	logd_days_free(&d);
	return 0;
}

struct weeks_walk {
	struct tlog_weekrow *v;
	int n, cap;
	struct names *nm;
	struct sd_err *e;
};

static int one_week(const struct db_log_week *w, void *arg)
{
	struct weeks_walk *x = arg;

	if (x->n == x->cap) {
		int ncap = x->cap ? 2 * x->cap : 256;
		struct tlog_weekrow *nv = realloc(x->v, (size_t)ncap * sizeof *nv);
		if (!nv)
			return sd_fail(x->e, "out of memory");
		x->v = nv;
		x->cap = ncap;
	}
	x->v[x->n++] = (struct tlog_weekrow){ day_of(w->monday), name_index(x->nm, w->exercise),
					      w->rir, w->sets, w->days };
	return 0;
}

int logd_weeks(struct sd_ctx *ctx, long long athlete_id, const struct db_block *b, int nb,
	       long long only, struct tlog_weeks *ws, struct sd_err *e)
{
	struct weeks_walk x = { NULL, 0, 0, NULL, e };
	long today, lo = 0, hi = -1, s, t;
	char from[DATE_LEN], to[DATE_LEN];
	int rc = -1, have = 0;

	memset(ws, 0, sizeof *ws);
	if (today_day(&today, e))
		return -1;
	for (int i = 0; i < nb; i++) {
		if (only && b[i].id != only)
			continue;
		logd_block_span(&b[i], today, &s, &t);
		if (t < s)
			continue;
		lo = have && lo < s ? lo : s;
		hi = have && hi > t ? hi : t;
		have = 1;
	}
	if (only && !have)
		return 0;
	/* A block's weeks are whole weeks: everything logged in them shows. */
	date_format(tlog_monday(lo), from);
	date_format(tlog_monday(hi), to);
	if (!(x.nm = names_new(&ctx->lib, e)) ||
	    db_log_weeks(ctx->db, athlete_id, only ? from : NULL, only ? to : NULL, one_week, &x, e))
		goto done;
	if (x.n) {
		lo = have && lo < x.v[0].monday ? lo : x.v[0].monday;
		hi = have && hi > x.v[x.n - 1].monday ? hi : x.v[x.n - 1].monday;
		have = 1;
	}
	if (!have) {
		rc = 0;
		goto done;
	}
	if (tlog_weeks_init(ws, lo, hi, e))
		goto done;
	for (int i = 0; i < x.n; i++)
		tlog_weeks_add(ws, &ctx->lib, ctx->profile.w_direct, ctx->profile.w_indirect,
			       ctx->opt.max_rir, &x.v[i]);
	for (int i = 0; i < nb; i++) {
		double dose[SD_NMUSCLES];
		int sessions;
		if (only && b[i].id != only)
			continue;
		logd_block_span(&b[i], today, &s, &t);
		if (t < s)
			continue;
		if (logd_block_plan(ctx, &b[i], dose, &sessions, e))
			goto done;
		tlog_weeks_plan(ws, b[i].id, s, t, dose, sessions);
	}
	rc = 0;
done:
	if (rc)
		tlog_weeks_free(ws);
	free(x.v);
	free(x.nm);
	return rc;
}

struct trend_walk {
	struct tlog_trend *t;
	struct names *nm;
	int f;
	struct sd_err *e;
};

static int one_set(const struct db_log *r, const char *athlete, void *arg)
{
	struct trend_walk *w = arg;
	struct tlog_best b;
	double kg = !strcmp(r->unit, "lb") ? units_lb_to_kg(r->load) : r->load;

	(void)athlete;
	memset(&b, 0, sizeof b);
	if (tlog_e1rm(w->f, kg, r->reps, r->rir, r->timed, &b.e1rm_kg, &b.rtf))
		return 0;
	if ((b.ex = name_index(w->nm, r->exercise)) < 0)
		return 0;
	b.day = day_of(r->date);
	b.monday = tlog_monday(b.day);
	b.load_kg = kg;
	b.reps = r->reps;
	b.rir = r->rir;
	return tlog_trend_add(w->t, &b, w->e);
}

int logd_trend(struct sd_ctx *ctx, long long athlete_id, int f, const char *from, const char *to,
	       struct tlog_trend *t, struct sd_err *e)
{
	struct trend_walk w = { t, NULL, f, e };
	int rc;

	memset(t, 0, sizeof *t);
	if (!(w.nm = names_new(&ctx->lib, e)))
		return -1;
	rc = db_log_each(ctx->db, athlete_id, from, to, one_set, &w, e);
	free(w.nm);
	if (rc) {
		tlog_trend_free(t);
		return -1;
	}
	tlog_trend_sort(t);
	return 0;
}
