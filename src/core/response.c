#include "response.h"

#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include <gsl/gsl_errno.h>
#include <gsl/gsl_linalg.h>
#include <gsl/gsl_matrix.h>

#include "e1rm.h"
#include "metareg.h"
#include "stats.h"

double resp_equation_var(double reps)
{
	double v[E1RM_NFORMULAS], mean = 0, ss = 0;

	if (reps <= 1)
		return 0;
	for (int f = 0; f < E1RM_NFORMULAS; f++) {
		v[f] = log(e1rm_raw(f, 1.0, reps));
		mean += v[f];
	}
	mean /= E1RM_NFORMULAS;
	for (int f = 0; f < E1RM_NFORMULAS; f++)
		ss += (v[f] - mean) * (v[f] - mean);
	return ss / (E1RM_NFORMULAS - 1);
}

double resp_change_var(double test_sd, int reps_pre, int reps_post)
{
	return resp_change_var2(test_sd, test_sd, reps_pre, reps_post);
}

double resp_change_var2(double sd_pre, double sd_post, double reps_pre, double reps_post)
{
	double v = sd_pre * sd_pre + sd_post * sd_post;
	if (reps_pre != reps_post)
		v += resp_equation_var(reps_pre) + resp_equation_var(reps_post);
	return v;
}

void resp_prior_vars(const struct sd_profile *p, double athlete_var, struct resp_vars *out)
{
	memset(out, 0, sizeof *out);
	out->athlete = athlete_var;
	out->block = p->tau2 + p->sigma2;
	if (p->slopes) {
		out->block_cov = p->cov_slope;
		out->block_slope = p->tau2_slope;
	}
}

void resp_obs_set(const struct sd_profile *p, const struct sd_covars *c, double dose,
		  double obs, double v, long long block, struct resp_obs *out)
{
	memset(out, 0, sizeof *out);
	curve_design(p, c, dose, out->z);
	for (int i = 0; i < p->nterms; i++)
		out->yhat += out->z[i] * p->beta[i];
	out->obs = obs;
	out->v = v;
	out->block = block;
}

/* z_j' V z_l: the curve's shared error between two observations. */
static double curve_cov(const struct sd_profile *p, const double *a, const double *b)
{
	int n = p->nterms;
	double s = 0;
	for (int i = 0; i < n; i++)
		for (int j = 0; j < n; j++)
			s += a[i] * p->vcov[i * n + j] * b[j];
	return s;
}

/* Covariance of two lifts' block deviations when they share a block (f = z[1]). */
static double block_cov(const struct resp_vars *v, const struct resp_obs *a,
			const struct resp_obs *b)
{
	double fa = a->z[1], fb = b->z[1];
	return v->block + (fa + fb) * v->block_cov + fa * fb * v->block_slope;
}

void resp_observe(const struct sd_profile *p, const struct resp_obs *o,
		  const struct resp_vars *v, double level, struct resp_fit *out)
{
	double q = st_crit(level, 0);
	double var = curve_cov(p, o->z, o->z) + v->athlete + block_cov(v, o, o) + o->v;

	out->dev = o->obs - o->yhat;
	out->sd = sqrt(var > 0 ? var : 0);
	out->z = out->sd > 0 ? out->dev / out->sd : 0;
	out->pctile = 100.0 * st_cdf(out->z, 0);
	out->lo = o->yhat - q * out->sd;
	out->hi = o->yhat + q * out->sd;
}

/* s = 1'S^-1 1 and t = 1'S^-1 d for S = Sigma0 over the observations, by Cholesky. */
static int solve_st(const struct sd_profile *p, const struct resp_obs *o, int n,
		    const struct resp_vars *v, double *s, double *t, struct sd_err *e)
{
	gsl_matrix *S = gsl_matrix_alloc((size_t)n, (size_t)n);
	gsl_vector *one = gsl_vector_alloc((size_t)n), *x = gsl_vector_alloc((size_t)n);
	gsl_error_handler_t *old;
	int rc = -1;

	if (!S || !one || !x) {
		sd_fail(e, "out of memory");
		goto done;
	}
	for (int j = 0; j < n; j++) {
		for (int l = 0; l <= j; l++) {
			double c = curve_cov(p, o[j].z, o[l].z);
			if (o[j].block == o[l].block)
				c += block_cov(v, &o[j], &o[l]);
			if (j == l)
				c += o[j].v;
			gsl_matrix_set(S, (size_t)j, (size_t)l, c);
			gsl_matrix_set(S, (size_t)l, (size_t)j, c);
		}
		gsl_vector_set(one, (size_t)j, 1.0);
	}
	old = gsl_set_error_handler_off();
	rc = gsl_linalg_cholesky_decomp1(S);
	if (!rc)
		rc = gsl_linalg_cholesky_solve(S, one, x);
	gsl_set_error_handler(old);
	if (rc) {
		rc = sd_fail(e, "the observations' covariance is singular (no test error and no "
			     "heterogeneity?)");
		goto done;
	}
	*s = *t = 0;
	for (int j = 0; j < n; j++) {
		double w = gsl_vector_get(x, (size_t)j);   /* (S^-1 1)_j */
		*s += w;
		*t += w * (o[j].obs - o[j].yhat);
	}
	rc = 0;
done:
	gsl_vector_free(x);
	gsl_vector_free(one);
	gsl_matrix_free(S);
	return rc;
}

int resp_personal(const struct sd_profile *p, const struct resp_obs *o, int n,
		  const struct resp_vars *v, double level, struct resp_personal *out,
		  struct sd_err *e)
{
	double s = 0, t = 0, A = v->athlete, q = st_crit(level, 0);

	memset(out, 0, sizeof *out);
	if (!(level > 0 && level < 1))
		return sd_usage(e, "bad level %g: expected a number between 0 and 1", level);
	for (int k = 0; k < n; k++)
		if (!isfinite(o[k].obs) || !isfinite(o[k].yhat) || !(o[k].v >= 0))
			return sd_fail(e, "observation %d has no usable value or variance", k + 1);
	if (n && solve_st(p, o, n, v, &s, &t, e))
		return -1;
	out->n = n;
	out->mean = A * t / (1 + A * s);
	out->sd = sqrt(A / (1 + A * s));
	out->lo = out->mean - q * out->sd;
	out->hi = out->mean + q * out->sd;
	out->raw = n ? t / s : 0;
	out->raw_se = n ? 1 / sqrt(s) : 0;
	out->weight = A * s / (1 + A * s);
	return 0;
}

/* ---- the roster: REML estimates of A and B ---- */

struct pair {
	int athlete;
	long long block;
	int idx;
};

static int by_athlete_block(const void *a, const void *b)
{
	const struct pair *x = a, *y = b;
	if (x->athlete != y->athlete)
		return x->athlete < y->athlete ? -1 : 1;
	return x->block < y->block ? -1 : x->block > y->block;
}

int resp_roster_vars(const struct resp_roster *r, struct resp_vars *out, struct sd_err *e)
{
	struct pair *pr = NULL;
	int *study = NULL, *effect = NULL, rc = -1;
	double *X = NULL;
	struct mr_fit *fit = NULL;
	struct sd_err fe;

	out->roster_obs = r->n;
	out->roster_athletes = out->roster_repeated = 0;
	if (r->n && (!(pr = malloc((size_t)r->n * sizeof *pr)) ||
		     !(study = malloc((size_t)r->n * sizeof *study)) ||
		     !(effect = malloc((size_t)r->n * sizeof *effect)) ||
		     !(X = malloc((size_t)r->n * sizeof *X)) || !(fit = malloc(sizeof *fit)))) {
		sd_fail(e, "out of memory");
		goto done;
	}
	for (int i = 0; i < r->n; i++)
		pr[i] = (struct pair){ r->athlete[i], r->block[i], i };
	if (r->n)
		qsort(pr, (size_t)r->n, sizeof *pr, by_athlete_block);
	/* Dense block ids for the fitter, and the counts that decide between REML and priors. */
	for (int i = 0, nb = 0, blocks = 0; i < r->n; i++) {
		int new_athlete = i == 0 || pr[i].athlete != pr[i - 1].athlete;
		int new_block = new_athlete || pr[i].block != pr[i - 1].block;
		if (new_athlete) {
			out->roster_athletes++;
			blocks = 0;
		}
		if (new_block && ++blocks == 2)
			out->roster_repeated++;
		nb += new_block;
		study[pr[i].idx] = pr[i].athlete;
		effect[pr[i].idx] = nb;
		X[i] = 1.0;
	}
	if (out->roster_athletes < RESP_EB_MIN_ATHLETES || out->roster_repeated < RESP_EB_MIN_REPEATED) {
		snprintf(out->why, sizeof out->why, "the roster is too small to estimate them: %d "
			 "athletes with observations (need %d), %d with two or more blocks (need %d)",
			 out->roster_athletes, RESP_EB_MIN_ATHLETES, out->roster_repeated,
			 RESP_EB_MIN_REPEATED);
		rc = 0;
		goto done;
	}
	for (int i = 0; i < r->n; i++)
		if (!(r->v[i] > 0)) {
			snprintf(out->why, sizeof out->why, "a test-error variance of 0 leaves the "
				 "roster model without sampling variances");
			rc = 0;
			goto done;
		}
	/* The curve's prediction enters as an offset: y - offset with the curve's coefficients
	 * fixed is the same model as an offset term, and the fitter has no offsets. The intercept
	 * takes the shift every athlete shares (mostly the curve's own error), so it does not
	 * inflate the variances. */
	static const char *const names[] = { "mean" };
	struct mr_data d = { r->n, 1, r->dev, r->v, X, study, effect, -1, names };
	struct mr_opts o = { MR_REML, 0.95, 0, 0, NULL };
	if (mr_fit(&d, &o, fit, &fe)) {
		snprintf(out->why, sizeof out->why, "the roster fit failed (%.150s)", fe.msg);
		rc = 0;
		goto done;
	}
	out->athlete = fit->tau2;
	out->block = fit->sigma2;
	out->block_cov = out->block_slope = 0;
	out->mean_dev = fit->beta[0];
	out->mean_dev_se = fit->se[0];
	out->estimated = 1;
	out->why[0] = '\0';
	rc = 0;
done:
	free(fit);
	free(X);
	free(effect);
	free(study);
	free(pr);
	return rc;
}
