#include "respdata.h"

#include "../core/e1rm.h"
#include "logdata.h"

#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

static long day(const char *date)
{
	long d = 0;
	date_parse(date, &d, NULL);
	return d;
}

/* The test nearest to `target` within the window among t[lo..hi), one lift's tests in date
 * order with their day numbers in days[] (parsed once per athlete); on a tie the one farther
 * outside the block (earlier for the start, later for the end), so the pair spans the whole
 * block. A binary search finds the window's first test. */
static const struct db_test *nearest(const struct db_test *t, const long *days, int lo, int hi,
				     long target, int window, int later)
{
	const struct db_test *best = NULL;
	long bestd = 0;
	int a = lo, b = hi;

	while (a < b) {
		int mid = a + (b - a) / 2;
		if (days[mid] < target - window)
			a = mid + 1;
		else
			b = mid;
	}
	for (int i = a; i < hi && days[i] <= target + window; i++) {
		long d = labs(days[i] - target);
		if (!best || d < bestd || (d == bestd && (later ? strcmp(t[i].date, best->date) > 0
							     : strcmp(t[i].date, best->date) < 0))) {
			best = &t[i];
			bestd = d;
		}
	}
	return best;
}

/* Weekly fractional sets of the lift's prime movers in dose (per muscle), averaged over them;
 * -1 without any. */
static double lift_dose(const struct sd_ctx *ctx, const double *dose, const char *lift)
{
	int k = lib_find(&ctx->lib, lift), nm = 0;
	double sum = 0;

	if (k < 0)
		return -1;
	for (int m = 0; m < SD_NMUSCLES; m++)
		if (ctx->lib.ex[k].direct & ((sd_mset)1 << m)) {
			sum += dose[m];
			nm++;
		}
	return nm ? sum / nm : -1;
}

/* Blocks share few templates, statuses and lengths: each (template, status, weeks) is parsed
 * and audited once for the whole roster, not once per block. */
#define AUDITS_MAX 64

struct audits {
	struct {
		long long program_id;
		int trained;
		double weeks;
		struct sd_program prog;
		struct sd_audit au;
	} *x;
	int n;
};

static void audits_clear(struct audits *c)
{
	for (int i = 0; i < c->n; i++) {
		audit_free(&c->x[i].au);
		prog_free(&c->x[i].prog);
	}
	c->n = 0;
}

static const struct sd_audit *audit_of(struct sd_ctx *ctx, struct audits *c,
				       const struct db_block *b, double weeks, struct sd_err *e)
{
	struct db_program p;
	int k;

	for (int i = 0; i < c->n; i++)
		if (c->x[i].program_id == b->program_id && c->x[i].trained == b->trained &&
		    c->x[i].weeks == weeks)
			return &c->x[i].au;
	if (!c->x && !(c->x = calloc(AUDITS_MAX, sizeof *c->x))) {
		sd_fail(e, "out of memory");
		return NULL;
	}
	if (c->n == AUDITS_MAX)
		audits_clear(c);
	k = c->n;
	if (db_program_get_id(ctx->db, b->program_id, &p, e))
		return NULL;
	if (app_block_audit(ctx, b, &p, SD_SESSION_CAP, &c->x[k].prog, &c->x[k].au, e)) {
		db_program_free(&p);
		return NULL;
	}
	db_program_free(&p);
	c->x[k].program_id = b->program_id;
	c->x[k].trained = b->trained;
	c->x[k].weeks = weeks;
	c->n++;
	return &c->x[k].au;
}

static void audits_free(struct audits *c)
{
	audits_clear(c);
	free(c->x);
	c->x = NULL;
}

/* The lift's tests: rs->t[*lo..*hi), the list being ordered by lift, then date (an empty
 * range when the lift has none). */
static void lift_tests(const struct resp_data *rs, const char *lift, int *lo, int *hi)
{
	*lo = *hi = 0;
	for (int i = 0; i < rs->nt; i++)
		if (!strcmp(rs->t[i].lift, lift)) {
			*lo = i;
			for (*hi = i; *hi < rs->nt && !strcmp(rs->t[*hi].lift, lift); (*hi)++)
				;
			return;
		}
}

/* The lift's weekly best e1RM (from logged sets in the window around `target`) whose set is
 * nearest to target, as a test record; on a tie the one farther outside the block, as for
 * tests. 0 when the window has none. */
static int best_estimate(const struct sd_ctx *ctx, const struct tlog_trend *t, const char *lift,
			 long target, int later, struct db_test *out, double *rtf)
{
	const struct tlog_best *best = NULL;
	int k = lib_find(&ctx->lib, lift);
	long bestd = 0;

	for (int i = 0; i < t->n; i++) {
		long d = labs(t->v[i].day - target);
		if (t->v[i].ex != k)
			continue;
		if (!best || d < bestd || (d == bestd && (later ? t->v[i].day > best->day
							     : t->v[i].day < best->day))) {
			best = &t->v[i];
			bestd = d;
		}
	}
	if (!best)
		return 0;
	memset(out, 0, sizeof *out);
	snprintf(out->lift, sizeof out->lift, "%s", lift);
	date_format(best->day, out->date);
	out->load_kg = best->load_kg;
	out->reps = (int)lround(best->rtf);
	out->e1rm_kg = best->e1rm_kg;
	snprintf(out->formula, sizeof out->formula, "training");
	*rtf = best->rtf;
	return 1;
}

/* The weekly bests of every lift logged within `window` days of `day`. */
static int window_trend(struct sd_ctx *ctx, long long athlete, long day_, int window,
			struct tlog_trend *t, struct sd_err *e)
{
	char from[DATE_LEN], to[DATE_LEN];

	date_format(day_ - window, from);
	date_format(day_ + window, to);
	return logd_trend(ctx, athlete, E1RM_DEFAULT, from, to, t, e);
}

/* The lifts a block can be judged by: every tested lift, and every lift logged near its start
 * or its end. */
static int lift_names(const struct sd_ctx *ctx, const struct resp_data *rs,
		      const struct tlog_trend *t0, const struct tlog_trend *t1,
		      char (**out)[DB_NAME_MAX], int *n, struct sd_err *e)
{
	int cap = rs->nt + t0->n + t1->n, k = 0;
	char (*v)[DB_NAME_MAX] = malloc((size_t)(cap ? cap : 1) * sizeof *v);

	if (!v)
		return sd_fail(e, "out of memory");
	for (int i = 0; i < cap; i++) {
		const char *name = i < rs->nt ? rs->t[i].lift : i < rs->nt + t0->n ?
			ctx->lib.ex[t0->v[i - rs->nt].ex].name :
			ctx->lib.ex[t1->v[i - rs->nt - t0->n].ex].name;
		int j;
		for (j = 0; j < k && strcmp(v[j], name); j++)
			;
		if (j == k)
			snprintf(v[k++], DB_NAME_MAX, "%s", name);
	}
	*out = v;
	*n = k;
	return 0;
}

static int add_row(struct resp_data *rs, const struct resp_row *r, struct sd_err *e)
{
	if (rs->n == rs->cap) {
		int ncap = rs->cap ? 2 * rs->cap : 16;
		struct resp_row *nv = realloc(rs->v, (size_t)ncap * sizeof *nv);
		if (!nv)
			return sd_fail(e, "out of memory");
		rs->v = nv;
		rs->cap = ncap;
	}
	rs->v[rs->n++] = *r;
	return 0;
}

/* All observations of one completed block (their fit comes once the variances are known). */
static int block_rows(struct sd_ctx *ctx, struct audits *c, int window,
		      const struct resp_opts *ro, const struct db_block *b, struct resp_data *rs,
		      struct sd_err *e)
{
	struct sd_covars cov = { app_block_weeks(b), b->trained };
	const struct sd_audit *au = audit_of(ctx, c, b, cov.weeks, e);
	struct tlog_trend t0 = { 0 }, t1 = { 0 };
	struct tlog_span span;
	char (*lifts)[DB_NAME_MAX] = NULL;
	double plan[SD_NMUSCLES], done[SD_NMUSCLES];
	long s = day(b->start), f = day(b->end);
	int rc = -1, before = rs->n, nl = 0, logged = 0;

	if (!au)
		return -1;
	for (int m = 0; m < SD_NMUSCLES; m++)
		plan[m] = au->row[m].dose.fractional;
	/* An athlete with no log at all costs no further query. */
	if (rs->logged) {
		if (logd_block_done(ctx, b, done, &span, e) ||
		    window_trend(ctx, b->athlete_id, s, window, &t0, e) ||
		    window_trend(ctx, b->athlete_id, f, window, &t1, e))
			goto done;
		logged = span.rows > 0;
	}
	if (lift_names(ctx, rs, &t0, &t1, &lifts, &nl, e))
		goto done;
	for (int i = 0; i < nl; i++) {
		int lo, hi;
		const struct db_test *pre, *post;
		struct resp_row r;

		lift_tests(rs, lifts[i], &lo, &hi);
		pre = nearest(rs->t, rs->day, lo, hi, s, window, 0);
		post = nearest(rs->t, rs->day, lo, hi, f, window, 1);
		memset(&r, 0, sizeof r);
		if (pre) {
			r.pre = *pre;
			r.pre_reps = pre->reps;
		} else if (!(r.pre_est = best_estimate(ctx, &t0, lifts[i], s, 0, &r.pre,
								    &r.pre_reps))) {
			continue;
		}
		if (post) {
			r.post = *post;
			r.post_reps = post->reps;
		} else if (!(r.post_est = best_estimate(ctx, &t1, lifts[i], f, 1, &r.post,
								     &r.post_reps))) {
			continue;
		}
		if (strcmp(r.pre.date, r.post.date) >= 0)
			continue;
		r.planned = lift_dose(ctx, plan, lifts[i]);
		r.dose_logged = logged;
		r.dose = logged ? lift_dose(ctx, done, lifts[i]) : r.planned;
		if (r.dose < 0)
			continue;   /* a lift no longer in the library, or with no prime mover */
		r.block = b->id;
		r.weeks = cov.weeks;
		snprintf(r.lift, sizeof r.lift, "%s", lifts[i]);
		curve_eval(&ctx->profile, &cov, r.dose, ro->level, &r.pt);
		r.beyond = r.pt.beyond;
		resp_obs_set(&ctx->profile, &cov, r.dose, log(r.post.e1rm_kg / r.pre.e1rm_kg),
			     resp_change_var2(r.pre_est ? ro->est_sd : ro->test_sd,
					      r.post_est ? ro->est_sd : ro->test_sd, r.pre_reps,
					      r.post_reps), b->id, &r.ob);
		if (add_row(rs, &r, e))
			goto done;
	}
	if (rs->n > before)
		rs->nblocks++;
	rc = 0;
done:
	free(lifts);
	tlog_trend_free(&t0);
	tlog_trend_free(&t1);
	return rc;
}


int respd_check_opts(const struct resp_opts *o, struct sd_err *e)
{
	if (!isfinite(o->test_sd) || o->test_sd < 0 || o->test_sd > 1)
		return sd_usage(e, "bad test error %g: expected a log-scale SD from 0 to 1", o->test_sd);
	if (!isfinite(o->est_sd) || o->est_sd < 0 || o->est_sd > 1)
		return sd_usage(e, "bad estimate error %g: expected a log-scale SD from 0 to 1",
				o->est_sd);
	if (o->prior_sd != RESPD_PRIOR_PROFILE &&
	    (!isfinite(o->prior_sd) || o->prior_sd <= 0 || o->prior_sd > 2))
		return sd_usage(e, "bad prior SD %g: expected a log-scale SD above 0, at most 2",
				o->prior_sd);
	if (!(o->level > 0 && o->level < 1))
		return sd_usage(e, "bad level %g: expected a number between 0 and 1", o->level);
	return 0;
}

/* The rows of one athlete: every completed block's observations. */
static int athlete_rows(struct sd_ctx *ctx, struct audits *c, long long only_block, int window,
			const struct resp_opts *ro, struct resp_data *d, struct sd_err *e)
{
	int found = 0;

	long long nlog;

	if (db_block_list(ctx->db, d->athlete.id, &d->b, &d->nb, e) ||
	    db_test_list(ctx->db, d->athlete.id, NULL, &d->t, &d->nt, e) ||
	    db_log_count(ctx->db, d->athlete.id, &nlog, e))
		return -1;
	/* Each test's date parsed once, not once per block and lift. */
	if (!(d->day = malloc((size_t)(d->nt ? d->nt : 1) * sizeof *d->day)))
		return sd_fail(e, "out of memory");
	for (int i = 0; i < d->nt; i++)
		d->day[i] = day(d->t[i].date);
	d->logged = nlog > 0;
	for (int i = 0; i < d->nb; i++) {
		const struct db_block *b = &d->b[i];
		if (only_block && b->id == only_block) {
			found = 1;
			if (!b->end[0])
				return sd_fail(e, "block %lld is still open (end it with 'setdose block end "
					       "%lld')", only_block, only_block);
		}
		if (b->end[0] && block_rows(ctx, c, window, ro, b, d, e))
			return -1;
	}
	if (only_block && !found)
		return sd_fail(e, "block %lld is not one of athlete '%s''s blocks", only_block,
			       d->athlete.name);
	return 0;
}

struct roster {
	int n, cap;
	int *athlete;
	long long *block;
	double *dev, *v;
};

static int roster_add(struct roster *r, int athlete, const struct resp_data *d, struct sd_err *e)
{
	if (r->n + d->n > r->cap) {
		int cap = 2 * (r->n + d->n) + 16;
		int *a = realloc(r->athlete, (size_t)cap * sizeof *a);
		if (a)
			r->athlete = a;
		long long *b = realloc(r->block, (size_t)cap * sizeof *b);
		if (b)
			r->block = b;
		double *dv = realloc(r->dev, (size_t)cap * sizeof *dv);
		if (dv)
			r->dev = dv;
		double *v = realloc(r->v, (size_t)cap * sizeof *v);
		if (v)
			r->v = v;
		if (!a || !b || !dv || !v)
			return sd_fail(e, "out of memory");
		r->cap = cap;
	}
	for (int i = 0; i < d->n; i++, r->n++) {
		r->athlete[r->n] = athlete;
		r->block[r->n] = d->v[i].ob.block;
		r->dev[r->n] = d->v[i].ob.obs - d->v[i].ob.yhat;
		r->v[r->n] = d->v[i].ob.v;
	}
	return 0;
}

/* Every athlete's observations, for the roster estimate of the variances. */
static int roster_vars(struct sd_ctx *ctx, struct audits *c, int window,
		       const struct resp_opts *ro, struct resp_vars *vars, struct sd_err *e)
{
	struct db_roster as;
	struct roster r = { 0 };
	int rc = -1;

	/* Ids and names are all the pairing needs: the compact roster, not whole records. */
	if (db_roster_load(ctx->db, 1, 0, &as, e))
		return -1;
	for (int i = 0; i < as.n; i++) {
		struct resp_data d;
		memset(&d, 0, sizeof d);
		d.athlete.id = as.v[i].id;
		snprintf(d.athlete.name, sizeof d.athlete.name, "%s", as.v[i].name);
		if (athlete_rows(ctx, c, 0, window, ro, &d, e) || roster_add(&r, i, &d, e)) {
			respd_free(&d);
			goto done;
		}
		respd_free(&d);
	}
	struct resp_roster rr = { r.n, r.athlete, r.block, r.dev, r.v };
	rc = resp_roster_vars(&rr, vars, e);
done:
	free(r.athlete);
	free(r.block);
	free(r.dev);
	free(r.v);
	db_roster_free(&as);
	return rc;
}

int respd_load(struct sd_ctx *ctx, const char *athlete, long long only_block, int window,
	       const struct resp_opts *ro, struct resp_data *d, struct sd_err *e)
{
	struct resp_obs *obs = NULL;
	const struct sd_profile *p = &ctx->profile;
	struct audits c = { NULL, 0 };
	int rc = -1;

	memset(d, 0, sizeof *d);
	if (respd_check_opts(ro, e) || app_athlete_get(ctx->db, athlete, &d->athlete, e))
		return -1;
	if (athlete_rows(ctx, &c, only_block, window, ro, d, e))
		goto done;
	resp_prior_vars(p, ro->prior_sd == RESPD_PRIOR_PROFILE ? p->athlete_var
			: ro->prior_sd * ro->prior_sd, &d->vars);
	if (ro->priors_only)
		snprintf(d->vars.why, sizeof d->vars.why, "asked for (--priors)");
	else if (roster_vars(ctx, &c, window, ro, &d->vars, e))
		goto done;
	if (d->n && !(obs = malloc((size_t)d->n * sizeof *obs))) {
		sd_fail(e, "out of memory");
		goto done;
	}
	for (int i = 0; i < d->n; i++) {
		resp_observe(p, &d->v[i].ob, &d->vars, ro->level, &d->v[i].fit);
		obs[i] = d->v[i].ob;
	}
	rc = resp_personal(p, obs, d->n, &d->vars, ro->level, &d->personal, e);
done:
	free(obs);
	audits_free(&c);
	if (rc)
		respd_free(d);
	return rc;
}

void respd_free(struct resp_data *d)
{
	free(d->v);
	free(d->t);
	free(d->day);
	free(d->b);
	memset(d, 0, sizeof *d);
}
