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

/* The test of `lift` nearest to `target` within the window; on a tie the one farther outside
 * the block (earlier for the start, later for the end), so the pair spans the whole block. */
static const struct db_test *nearest(const struct db_test *t, int n, const char *lift,
				     long target, int window, int later)
{
	const struct db_test *best = NULL;
	long bestd = 0;

	for (int i = 0; i < n; i++) {
		long d;
		if (strcmp(t[i].lift, lift))
			continue;
		d = labs(day(t[i].date) - target);
		if (d > window)
			continue;
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
static int block_rows(struct sd_ctx *ctx, int window, const struct resp_opts *ro,
		      const struct db_block *b, struct resp_data *rs, struct sd_err *e)
{
	struct db_program p = { 0 };
	struct sd_program prog = { 0 };
	struct sd_audit au = { 0 };
	struct sd_covars cov = { dbu_block_weeks(b), b->trained };
	struct tlog_trend t0 = { 0 }, t1 = { 0 };
	struct tlog_span span;
	char (*lifts)[DB_NAME_MAX] = NULL;
	double plan[SD_NMUSCLES], done[SD_NMUSCLES];
	long s = day(b->start), f = day(b->end);
	int rc = -1, before = rs->n, nl = 0, logged = 0;

	if (db_program_get_id(ctx->db, b->program_id, &p, e) ||
	    dbu_block_audit(ctx, b, &p, SD_SESSION_CAP, &prog, &au, e))
		goto done;
	for (int m = 0; m < SD_NMUSCLES; m++)
		plan[m] = au.row[m].dose.fractional;
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
		const struct db_test *pre = nearest(rs->t, rs->nt, lifts[i], s, window, 0);
		const struct db_test *post = nearest(rs->t, rs->nt, lifts[i], f, window, 1);
		struct resp_row r;

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
	audit_free(&au);
	prog_free(&prog);
	db_program_free(&p);
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
static int athlete_rows(struct sd_ctx *ctx, long long only_block, int window,
			const struct resp_opts *ro, struct resp_data *d, struct sd_err *e)
{
	int found = 0;

	long long nlog;

	if (db_block_list(ctx->db, d->athlete.id, &d->b, &d->nb, e) ||
	    db_test_list(ctx->db, d->athlete.id, NULL, &d->t, &d->nt, e) ||
	    db_log_count(ctx->db, d->athlete.id, &nlog, e))
		return -1;
	d->logged = nlog > 0;
	for (int i = 0; i < d->nb; i++) {
		const struct db_block *b = &d->b[i];
		if (only_block && b->id == only_block) {
			found = 1;
			if (!b->end[0])
				return sd_fail(e, "block %lld is still open (end it with 'setdose block end "
					       "%lld')", only_block, only_block);
		}
		if (b->end[0] && block_rows(ctx, window, ro, b, d, e))
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
static int roster_vars(struct sd_ctx *ctx, int window, const struct resp_opts *ro,
		       struct resp_vars *vars, struct sd_err *e)
{
	struct db_athlete *as = NULL;
	struct roster r = { 0 };
	int na = 0, rc = -1;

	if (db_athlete_list(ctx->db, &as, &na, e))
		return -1;
	for (int i = 0; i < na; i++) {
		struct resp_data d;
		memset(&d, 0, sizeof d);
		d.athlete = as[i];
		if (athlete_rows(ctx, 0, window, ro, &d, e) || roster_add(&r, i, &d, e)) {
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
	free(as);
	return rc;
}

int respd_load(struct sd_ctx *ctx, const char *athlete, long long only_block, int window,
	       const struct resp_opts *ro, struct resp_data *d, struct sd_err *e)
{
	struct resp_obs *obs = NULL;
	const struct sd_profile *p = &ctx->profile;
	int rc = -1;

	memset(d, 0, sizeof *d);
	if (respd_check_opts(ro, e) || db_athlete_get(ctx->db, athlete, &d->athlete, e))
		return -1;
	if (athlete_rows(ctx, only_block, window, ro, d, e))
		goto done;
	resp_prior_vars(p, ro->prior_sd == RESPD_PRIOR_PROFILE ? p->athlete_var
			: ro->prior_sd * ro->prior_sd, &d->vars);
	if (ro->priors_only)
		snprintf(d->vars.why, sizeof d->vars.why, "asked for (--priors)");
	else if (roster_vars(ctx, window, ro, &d->vars, e))
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
	if (rc)
		respd_free(d);
	return rc;
}

void respd_free(struct resp_data *d)
{
	free(d->v);
	free(d->t);
	free(d->b);
	memset(d, 0, sizeof *d);
}
