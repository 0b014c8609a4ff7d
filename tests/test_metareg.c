/* Tests of the multilevel meta-regression (core/metareg).
 *
 * Outside check values: tests/data/ref/, computed with metafor 3.8-1 (Viechtbauer 2010) on
 * Curtis & Wang (1998), Konstantopoulos (2011) and an invented simulation (see the README
 * there). Tolerances as stated in that README: fixed effects and predictions 1e-5 absolute,
 * variance components 1e-6 absolute, log-likelihoods 1e-4 absolute. */
#include "testutil.h"

#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include <gsl/gsl_cdf.h>
#include <gsl/gsl_linalg.h>
#include <gsl/gsl_randist.h>
#include <gsl/gsl_rng.h>

#include "core/metareg.h"
#include "core/mr_lik.h"
#include "io/effects_io.h"

#define REF "tests/data/ref/"
#define TOL_B 1e-5
#define TOL_V 1e-6
#define TOL_LL 1e-4

/* A value "key = number" from a metafor reference file. */
static double ref(const char *file, const char *key)
{
	char path[256], line[256], k[128];
	double v;
	FILE *f;

	snprintf(path, sizeof path, REF "%s", file);
	f = fopen(path, "r");
	if (!f)
		fail_msg("cannot open %s", path);
	while (fgets(line, sizeof line, f))
		if (sscanf(line, "%127s = %lf", k, &v) == 2 && !strcmp(k, key)) {
			fclose(f);
			return v;
		}
	fclose(f);
	fail_msg("no key %s in %s", key, file);
	return NAN;
}

/* Loads an effect table into model data with the given columns. */
static void load(const char *file, struct ef_spec *s, struct ef_table *t, struct ef_model *m)
{
	struct sd_err e = { 0 };
	if (eft_read(file, t, &e) || ef_model_build(t, s, m, &e))
		fail_msg("%s", e.msg);
}

static struct mr_fit fit_or_fail(const struct mr_data *d, enum mr_method method)
{
	struct mr_opts o = { method, 0.95, 0, 0, NULL };
	struct mr_fit f;
	struct sd_err e = { 0 };
	if (mr_fit(d, &o, &f, &e))
		fail_msg("fit failed: %s", e.msg);
	assert_true(f.converged);
	return f;
}

/* Intercept-only data: y, v, one cluster column and one effect column of a CSV. */
struct simple {
	int n;
	double y[200], v[200], X[200];
	int study[200], effect[200];
};

static void read_simple(const char *file, int cs, int ce, int cy, int cv, struct simple *d)
{
	char path[256], line[512];
	FILE *f;

	snprintf(path, sizeof path, REF "%s", file);
	assert_non_null(f = fopen(path, "r"));
	d->n = 0;
	assert_non_null(fgets(line, sizeof line, f));   /* header */
	while (fgets(line, sizeof line, f) && d->n < 200) {
		double col[16];
		int nc = 0;
		for (char *s = strtok(line, ",\n"); s && nc < 16; s = strtok(NULL, ",\n"))
			col[nc++] = atof(s);
		d->y[d->n] = col[cy];
		d->v[d->n] = col[cv];
		d->X[d->n] = 1;
		d->study[d->n] = (int)col[cs];
		d->effect[d->n] = (int)col[ce];
		d->n++;
	}
	fclose(f);
}

/* Konstantopoulos (2011) three-level model, REML and ML; metafor 3.8-1. */
static void test_konstantopoulos(void **state)
{
	static struct simple s;
	const char *K = "konstantopoulos2011_threelevel.txt";
	(void)state;
	read_simple("konstantopoulos2011.csv", 0, 1, 3, 4, &s);
	assert_int_equal(s.n, 56);
	struct mr_data d = { s.n, 1, s.y, s.v, s.X, s.study, s.effect, -1, NULL };

	struct mr_fit f = fit_or_fail(&d, MR_REML);
	assert_near(f.beta[0], ref(K, "b0"), TOL_B);
	assert_near(f.se[0], ref(K, "se0"), TOL_B);
	assert_near(f.tau2, ref(K, "sigma2_district"), TOL_V);
	assert_near(f.sigma2, ref(K, "sigma2_school"), TOL_V);
	assert_near(f.loglik, ref(K, "logLik_REML"), TOL_LL);
	assert_near(f.aic, ref(K, "AIC_REML"), TOL_LL);
	assert_int_equal(f.nstudy, 11);

	f = fit_or_fail(&d, MR_ML);
	assert_near(f.beta[0], ref(K, "ml_b0"), TOL_B);
	assert_near(f.se[0], ref(K, "ml_se0"), TOL_B);
	assert_near(f.tau2, ref(K, "ml_sigma2_district"), TOL_V);
	assert_near(f.sigma2, ref(K, "ml_sigma2_school"), TOL_V);
	assert_near(f.loglik, ref(K, "ml_logLik"), TOL_LL);
	assert_near(f.aic, ref(K, "ml_AIC"), TOL_LL);
	assert_near(f.bic, ref(K, "ml_BIC"), TOL_LL);
}

/* Curtis & Wang (1998) lnRR, random = ~1 | paper/id, with and without `time`; metafor 3.8-1. */
static void test_curtis(void **state)
{
	const char *C = "curtis1998_multilevel.txt";
	struct ef_spec sp = { .study = "paper", .effect = "id", .dose = "time",
			      .form = SD_FORM_LINEAR };
	struct ef_table t;
	struct ef_model m;
	struct mr_pred pr;
	(void)state;

	load(REF "curtis1998_rom.csv", &sp, &t, &m);
	assert_int_equal(m.d.n, 102);
	assert_int_equal(m.nstudy, 29);
	/* intercept only: the same rows with X = [1] */
	struct mr_data d0 = m.d;
	double *X1 = malloc(sizeof(double) * m.d.n);
	for (int i = 0; i < m.d.n; i++)
		X1[i] = 1;
	d0.p = 1;
	d0.X = X1;
	struct mr_fit f = fit_or_fail(&d0, MR_REML);
	assert_near(f.beta[0], ref(C, "b0"), TOL_B);
	assert_near(f.se[0], ref(C, "se0"), TOL_B);
	assert_near(f.tau2, ref(C, "sigma2_paper"), TOL_V);
	assert_near(f.sigma2, ref(C, "sigma2_id"), TOL_V);
	assert_near(f.loglik, ref(C, "logLik_REML"), TOL_LL);
	free(X1);

	/* time as the (linear) dose term */
	f = fit_or_fail(&m.d, MR_REML);
	assert_near(f.beta[0], ref(C, "mod_b0"), TOL_B);
	assert_near(f.beta[1], ref(C, "mod_b_time"), TOL_B);
	assert_near(f.se[0], ref(C, "mod_se0"), TOL_B);
	assert_near(f.se[1], ref(C, "mod_se_time"), TOL_B);
	assert_near(f.tau2, ref(C, "mod_sigma2_paper"), TOL_V);
	assert_near(f.sigma2, ref(C, "mod_sigma2_id"), TOL_V);
	assert_near(f.loglik, ref(C, "mod_logLik_REML"), TOL_LL);
	static const double at[2] = { 20, 100 };
	static const char *const key[2] = { "pred_time20", "pred_time100" };
	for (int k = 0; k < 2; k++) {
		char name[64];
		double z[2] = { 1, at[k] };
		mr_predict(&f, z, &pr);
		assert_near(pr.pred, ref(C, key[k]), TOL_B);
		snprintf(name, sizeof name, "%s_ci_lb", key[k]);
		assert_near(pr.ci_lo, ref(C, name), TOL_B);
		snprintf(name, sizeof name, "%s_ci_ub", key[k]);
		assert_near(pr.ci_hi, ref(C, name), TOL_B);
		snprintf(name, sizeof name, "%s_pi_lb", key[k]);
		assert_near(pr.pi_lo, ref(C, name), TOL_B);
		snprintf(name, sizeof name, "%s_pi_ub", key[k]);
		assert_near(pr.pi_hi, ref(C, name), TOL_B);
	}
	ef_model_free(&m);
	eft_free(&t);
}

static struct ef_spec sim_spec(enum sd_form form, int slopes)
{
	struct ef_spec s = { .effect = "effect", .form = form, .nmods = 2,
			     .mods = { "weeks", "trained" }, .slopes = slopes };
	return s;
}

/* Invented simulation, all four dose forms: ML fit statistics and REML coefficients. */
static void test_sim_forms(void **state)
{
	const char *S = "sim_reciprocal_fits.txt";
	static const char *const bname[4] = { "b0", "b_dose", "b_weeks", "b_trained" };
	(void)state;

	for (int form = 0; form < SD_NFORMS; form++) {
		struct ef_spec sp = sim_spec((enum sd_form)form, 0);
		struct ef_table t;
		struct ef_model m;
		char key[64];
		const char *fn = form_name((enum sd_form)form);

		load(REF "sim_reciprocal_effects.csv", &sp, &t, &m);
		struct mr_fit f = fit_or_fail(&m.d, MR_ML);
		snprintf(key, sizeof key, "%s_ml_logLik", fn);
		assert_near(f.loglik, ref(S, key), TOL_LL);
		snprintf(key, sizeof key, "%s_ml_AIC", fn);
		assert_near(f.aic, ref(S, key), TOL_LL);
		snprintf(key, sizeof key, "%s_ml_BIC", fn);
		assert_near(f.bic, ref(S, key), TOL_LL);

		f = fit_or_fail(&m.d, MR_REML);
		for (int j = 0; j < 4; j++) {
			snprintf(key, sizeof key, "%s_reml_%s", fn, bname[j]);
			assert_near(f.beta[j], ref(S, key), TOL_B);
		}
		snprintf(key, sizeof key, "%s_reml_se_dose", fn);
		assert_near(f.se[1], ref(S, key), TOL_B);
		snprintf(key, sizeof key, "%s_reml_sigma2_study", fn);
		assert_near(f.tau2, ref(S, key), TOL_V);
		snprintf(key, sizeof key, "%s_reml_sigma2_effect", fn);
		assert_near(f.sigma2, ref(S, key), TOL_V);
		ef_model_free(&m);
		eft_free(&t);
	}
}

/* Invented simulation, random slopes on the reciprocal term (struct GEN), REML. */
static void test_sim_slopes(void **state)
{
	const char *S = "sim_reciprocal_fits.txt";
	struct ef_spec sp = sim_spec(SD_FORM_RECIPROCAL, 1);
	struct ef_table t;
	struct ef_model m;
	struct mr_pred pr;
	(void)state;

	load(REF "sim_reciprocal_effects.csv", &sp, &t, &m);
	struct mr_fit f = fit_or_fail(&m.d, MR_REML);
	assert_near(f.beta[0], ref(S, "rs_b0"), TOL_B);
	assert_near(f.beta[1], ref(S, "rs_b_dose"), TOL_B);
	assert_near(f.beta[2], ref(S, "rs_b_weeks"), TOL_B);
	assert_near(f.beta[3], ref(S, "rs_b_trained"), TOL_B);
	assert_near(f.se[1], ref(S, "rs_se_dose"), TOL_B);
	assert_near(f.tau2, ref(S, "rs_tau2_intercept"), TOL_V);
	assert_near(f.tau2_slope, ref(S, "rs_tau2_slope"), TOL_V);
	/* rho is a correlation, not a variance: held to the relative 1e-3 of the README. */
	assert_near(f.rho, ref(S, "rs_rho"), 1e-3 * ref(S, "rs_rho"));
	assert_near(f.sigma2, ref(S, "rs_sigma2_effect"), TOL_V);
	assert_near(f.loglik, ref(S, "rs_logLik_REML"), TOL_LL);
	assert_int_equal(f.npar, 8);

	double z1[4] = { 1, 1.0 / 11, 10, 1 }, z2[4] = { 1, 1.0 / 4, 12, 0 };
	mr_predict(&f, z1, &pr);
	assert_near(pr.pred, ref(S, "rs_pred_10sets_trained_w10"), TOL_B);
	assert_near(pr.ci_lo, ref(S, "rs_pred_10sets_ci_lb"), TOL_B);
	assert_near(pr.ci_hi, ref(S, "rs_pred_10sets_ci_ub"), TOL_B);
	mr_predict(&f, z2, &pr);
	assert_near(pr.pred, ref(S, "rs_pred_3sets_untrained_w12"), TOL_B);
	assert_near(pr.ci_lo, ref(S, "rs_pred_3sets_ci_lb"), TOL_B);
	assert_near(pr.ci_hi, ref(S, "rs_pred_3sets_ci_ub"), TOL_B);
	/* Prediction interval: the heterogeneity at f = 1/11 is g00 + 2 f g01 + f^2 g11 + sigma2. */
	mr_predict(&f, z1, &pr);
	double fx = 1.0 / 11, het = f.tau2 + 2 * fx * f.cov_slope + fx * fx * f.tau2_slope + f.sigma2;
	assert_near(pr.pi_hi - pr.pred, f.crit * sqrt(pr.se * pr.se + het), 1e-12);
	ef_model_free(&m);
	eft_free(&t);
}

/* Study BLUPs of both models against metafor's (ranef, and G Z'V^-1 (y - Xb)). */
static void check_blups(int slopes, const char *file)
{
	struct ef_spec sp = sim_spec(SD_FORM_RECIPROCAL, slopes);
	struct ef_table t, rt;
	struct ef_model m;
	struct sd_err e = { 0 };

	load(REF "sim_reciprocal_effects.csv", &sp, &t, &m);
	struct mr_fit f = fit_or_fail(&m.d, MR_REML);
	struct mr_study *st = calloc(f.nstudy, sizeof *st);
	assert_int_equal(mr_studies(&m.d, &f, st, &e), 0);
	assert_int_equal(eft_read(file, &rt, &e), 0);
	assert_int_equal(rt.nrow, f.nstudy);
	double wsum = 0;
	for (int i = 0; i < rt.nrow; i++) {
		double id, u0, u1;
		assert_int_equal(eft_number(&rt, i, 0, &id, &e), 0);
		assert_int_equal(eft_number(&rt, i, 1, &u0, &e), 0);
		/* studies are numbered 1..40 in file order, so label k is study k-1 */
		const struct mr_study *s = &st[(int)id - 1];
		assert_string_equal(m.study_name[s->id], eft_cell(&rt, i, 0));
		assert_near(s->u0, u0, TOL_B);
		if (slopes) {
			assert_int_equal(eft_number(&rt, i, 2, &u1, &e), 0);
			assert_near(s->u1, u1, TOL_B);
			assert_true(s->se_u1 > 0 && s->se_u1 < sqrt(f.tau2_slope));
		}
		assert_true(s->se_u0 > 0 && s->se_u0 < sqrt(f.tau2));
		wsum += s->weight;
	}
	assert_near(wsum, 100, 1e-9);
	free(st);
	eft_free(&rt);
	ef_model_free(&m);
	eft_free(&t);
}

static void test_blups(void **state)
{
	(void)state;
	check_blups(0, REF "sim_reciprocal_study_blups_intercept.csv");
	check_blups(1, REF "sim_reciprocal_study_blups_slopes.csv");
}

/* The 200-study benchmark data: both fits agree with metafor. */
static void test_big200(void **state)
{
	const char *B = "bench_big200_fits.txt";
	struct ef_table t;
	struct ef_model m;
	(void)state;

	for (int slopes = 0; slopes < 2; slopes++) {
		struct ef_spec sp = sim_spec(SD_FORM_RECIPROCAL, slopes);
		const char *pre = slopes ? "rs" : "threelevel";
		char k[64];
		load("tests/bench/bench_big200_effects.csv", &sp, &t, &m);
		struct mr_fit f = fit_or_fail(&m.d, MR_REML);
		static const char *const bn[4] = { "b0", "b_dose", "b_weeks", "b_trained" };
		for (int j = 0; j < 4; j++) {
			snprintf(k, sizeof k, "%s_%s", pre, bn[j]);
			assert_near(f.beta[j], ref(B, k), TOL_B);
		}
		snprintf(k, sizeof k, "%s_logLik_REML", pre);
		assert_near(f.loglik, ref(B, k), TOL_LL);
		if (slopes) {
			assert_near(f.tau2, ref(B, "rs_tau2_intercept"), TOL_V);
			assert_near(f.tau2_slope, ref(B, "rs_tau2_slope"), TOL_V);
			assert_near(f.rho, ref(B, "rs_rho"), 1e-3 * ref(B, "rs_rho"));
			assert_near(f.sigma2, ref(B, "rs_sigma2_effect"), TOL_V);
		} else {
			assert_near(f.tau2, ref(B, "threelevel_sigma2_study"), TOL_V);
			assert_near(f.sigma2, ref(B, "threelevel_sigma2_effect"), TOL_V);
		}
		ef_model_free(&m);
		eft_free(&t);
	}
}

/* The analytic score and observed Hessian at th against central differences (step h) of the
 * likelihood and of the score. A step that leaves the positive-definite set is skipped only
 * when skip is set. */
static void check_fd(struct mr_work *w, const double *th, int reml, double h, int skip)
{
	struct mr_eval ev, a, b;
	int K = mr_work_nvc(w);
	assert_int_equal(mr_work_eval(w, th, reml, MR_WANT_HESS, &ev), 0);
	for (int k = 0; k < K; k++) {
		double tp[MR_MAXK], tm[MR_MAXK];
		memcpy(tp, th, sizeof tp);
		memcpy(tm, th, sizeof tm);
		tp[k] += h;
		tm[k] -= h;
		int bad = mr_work_eval(w, tp, reml, MR_WANT_GRAD, &a) ||
			  mr_work_eval(w, tm, reml, MR_WANT_GRAD, &b);
		if (bad && skip)
			continue;
		assert_false(bad);
		double num = (a.ll - b.ll) / (2 * h);
		assert_near(ev.g[k], num, 1e-4 * (1 + fabs(num)));
		for (int l = 0; l < K; l++) {
			double nh = (a.g[l] - b.g[l]) / (2 * h);
			assert_near(ev.H[l * K + k], nh, 1e-4 * (1 + fabs(nh)));
		}
	}
}

/* The analytic score and observed Hessian against central differences of the likelihood
 * (and of the score), for each random structure and both criteria. */
static void test_derivatives(void **state)
{
	(void)state;
	for (int slopes = 0; slopes < 2; slopes++)
		for (int reml = 0; reml < 2; reml++) {
			struct ef_spec sp = sim_spec(SD_FORM_RECIPROCAL, slopes);
			struct ef_table t;
			struct ef_model m;
			struct sd_err e = { 0 };
			load(REF "sim_reciprocal_effects.csv", &sp, &t, &m);
			struct mr_work *w = mr_work_new(&m.d, &e);
			assert_non_null(w);
			double th[MR_MAXK] = { 0.0015, 0.0004, 0.002, 0.001 };
			if (!slopes)
				th[1] = 0.001;
			check_fd(w, th, reml, 1e-7, 0);
			mr_work_free(w);
			ef_model_free(&m);
			eft_free(&t);
		}
}

/* ---- the likelihood computations against each other on random blocks ---- */

/* A random data set (invented, for these checks only): studies of 1 to 5 rows, X = [1, dose
 * term, p - 2 normal moderators], effect ids absent (mode 0), one per row (1) or shared by
 * consecutive rows of a study (2). */
struct rdata {
	int n, nstudy, p;
	double y[120], v[120], X[120 * 8];
	int study[120], effect[120];
	struct mr_data d;
};

static void random_data(gsl_rng *rng, int mode, int slopes, int p, struct rdata *r)
{
	int n = 0, eff = 0;
	r->p = p;
	r->nstudy = 6 + (int)gsl_rng_uniform_int(rng, 10);
	for (int s = 0; s < r->nstudy; s++) {
		int m = 1 + (int)gsl_rng_uniform_int(rng, 5);
		if (s < 2 && m < 3)
			m = 3;                  /* the effect level and slopes need studies with >= 2 */
		double u0 = gsl_ran_gaussian(rng, 0.1), u1 = gsl_ran_gaussian(rng, 0.2);
		for (int a = 0; a < m; a++, n++) {
			double f = 1.0 / (1 + (int)gsl_rng_uniform_int(rng, 12));
			r->X[p * n] = 1;
			r->X[p * n + 1] = f;
			for (int j = 2; j < p; j++)
				r->X[p * n + j] = gsl_ran_gaussian(rng, 1);
			r->v[n] = 0.005 + 0.02 * gsl_rng_uniform(rng);
			r->y[n] = 0.2 - 0.3 * f + u0 + u1 * f + gsl_ran_gaussian(rng, 0.1);
			r->study[n] = 100 - s;  /* ids out of order: the blocks are sorted */
			if (mode == 2 && a > 0 && gsl_rng_uniform(rng) < 0.4)
				r->effect[n] = eff;    /* shares the previous row's group */
			else
				r->effect[n] = ++eff;
		}
	}
	r->n = n;
	struct mr_data d = { n, p, r->y, r->v, r->X, r->study, mode ? r->effect : NULL,
			     slopes ? 1 : -1, NULL };
	r->d = d;
}

/* The same quantities by brute force on the whole n x n V (GSL's dense Cholesky): ll, beta, C. */
static void dense_eval(const struct rdata *r, const double *th, int reml, struct mr_eval *out)
{
	int n = r->n, p = r->p, slopes = r->d.slope_col >= 0;
	gsl_matrix *V = gsl_matrix_alloc(n, n), *WX = gsl_matrix_alloc(n, p);
	gsl_vector *wy = gsl_vector_alloc(n);
	double tau2 = th[0], cov = slopes ? th[1] : 0, ts = slopes ? th[2] : 0;
	double sig2 = r->d.effect ? th[slopes ? 3 : 1] : 0, A[64] = {0}, xtx[64] = {0}, b[8] = {0};
	double ld = 0, ldx = 0, ldxx = 0, rwr = 0;

	for (int i = 0; i < n; i++)
		for (int j = 0; j < n; j++) {
			double x = 0, fi = r->X[p * i + 1], fj = r->X[p * j + 1];
			if (r->study[i] == r->study[j])
				x = tau2 + cov * (fi + fj) + ts * fi * fj;
			if (r->d.effect && r->study[i] == r->study[j] && r->effect[i] == r->effect[j])
				x += sig2;
			gsl_matrix_set(V, i, j, x + (i == j ? r->v[i] : 0));
		}
	assert_int_equal(gsl_linalg_cholesky_decomp1(V), 0);
	for (int i = 0; i < n; i++) {
		ld += 2 * log(gsl_matrix_get(V, i, i));
		gsl_vector_set(wy, i, r->y[i]);
		for (int j = 0; j < p; j++)
			gsl_matrix_set(WX, i, j, r->X[p * i + j]);
	}
	gsl_linalg_cholesky_svx(V, wy);
	assert_int_equal(gsl_linalg_cholesky_svx_mat(V, WX), 0);
	for (int j = 0; j < p; j++)
		for (int k = 0; k < p; k++)
			for (int i = 0; i < n; i++) {
				A[j * p + k] += r->X[p * i + j] * gsl_matrix_get(WX, i, k);
				xtx[j * p + k] += r->X[p * i + j] * r->X[p * i + k];
				if (k == 0)
					b[j] += r->X[p * i + j] * gsl_vector_get(wy, i);
			}
	gsl_matrix_view Av = gsl_matrix_view_array(A, p, p), Xv = gsl_matrix_view_array(xtx, p, p);
	gsl_vector_view bv = gsl_vector_view_array(b, p), betav = gsl_vector_view_array(out->beta, p);
	assert_int_equal(gsl_linalg_cholesky_decomp1(&Av.matrix), 0);
	assert_int_equal(gsl_linalg_cholesky_decomp1(&Xv.matrix), 0);
	gsl_linalg_cholesky_solve(&Av.matrix, &bv.vector, &betav.vector);
	for (int j = 0; j < p; j++) {
		ldx += 2 * log(A[j * p + j]);
		ldxx += 2 * log(xtx[j * p + j]);
	}
	gsl_linalg_cholesky_invert(&Av.matrix);
	memcpy(out->C, A, sizeof(double) * p * p);
	for (int i = 0; i < n; i++) {     /* r'V^-1 r = y'V^-1 y - b'X'V^-1 y at the GLS estimate */
		double res = r->y[i];
		for (int j = 0; j < p; j++)
			res -= r->X[p * i + j] * out->beta[j];
		double wr = gsl_vector_get(wy, i);
		for (int j = 0; j < p; j++)
			wr -= gsl_matrix_get(WX, i, j) * out->beta[j];
		rwr += res * wr;
	}
	out->ll = reml ? -0.5 * ((n - p) * log(2 * M_PI) + ld + ldx - ldxx + rwr) :
			 -0.5 * (n * log(2 * M_PI) + ld + rwr);
	gsl_matrix_free(V);
	gsl_matrix_free(WX);
	gsl_vector_free(wy);
}

static void assert_rel(double a, double b, double tol, const char *what, int k)
{
	if (!(fabs(a - b) <= tol * (1 + fabs(b))))
		fail_msg("%s[%d] = %.15g, expected %.15g", what, k, a, b);
}

/* The closed form (intercept models) and the general Cholesky path agree with each other and
 * with the dense computation: log-likelihood, coefficients and their covariance, score,
 * observed Hessian and expected information, both criteria, every effect-level layout. */
static void test_closed_form(void **state)
{
	gsl_rng *rng = gsl_rng_alloc(gsl_rng_mt19937);
	static struct rdata r;
	(void)state;
	gsl_rng_set(rng, 17);
	for (int rep = 0; rep < 30; rep++)
		for (int mode = 0; mode < 3; mode++) {
			struct sd_err e = { 0 };
			random_data(rng, mode, 0, rep % 5 ? 3 : 8, &r);
			struct mr_work *w = mr_work_new(&r.d, &e);
			if (!w)
				fail_msg("%s", e.msg);
			int K = mr_work_nvc(w);
			double th[MR_MAXK] = { 0.02 * gsl_rng_uniform(rng), 0.02 * gsl_rng_uniform(rng) };
			if (rep == 0)
				th[0] = 0;                 /* a boundary is an ordinary point */
			for (int reml = 0; reml < 2; reml++) {
				struct mr_eval cf, gp, dn;
				w->general = 0;
				assert_int_equal(mr_work_eval(w, th, reml, MR_WANT_HESS, &cf), 0);
				w->general = 1;
				assert_int_equal(mr_work_eval(w, th, reml, MR_WANT_HESS, &gp), 0);
				dense_eval(&r, th, reml, &dn);
				assert_rel(cf.ll, dn.ll, 1e-10, "ll", 0);
				assert_rel(gp.ll, dn.ll, 1e-10, "ll general", 0);
				for (int j = 0; j < r.p; j++) {
					assert_rel(cf.beta[j], dn.beta[j], 1e-9, "beta", j);
					assert_rel(gp.beta[j], dn.beta[j], 1e-9, "beta general", j);
				}
				for (int j = 0; j < r.p * r.p; j++) {
					assert_rel(cf.C[j], dn.C[j], 1e-9, "C", j);
					assert_rel(gp.C[j], dn.C[j], 1e-9, "C general", j);
				}
				for (int k = 0; k < K; k++) {
					double gs = 1e-9 * (1 + fabs(gp.g[k]));
					assert_near(cf.g[k], gp.g[k], gs);
					for (int l = 0; l < K; l++) {
						double hs = 1e-9 * (1 + fabs(gp.H[k * K + l]));
						assert_near(cf.H[k * K + l], gp.H[k * K + l], hs);
						assert_near(cf.F[k * K + l], gp.F[k * K + l], hs);
					}
				}
			}
			mr_work_free(w);
		}
	gsl_rng_free(rng);
}

/* The general path with random slopes (the small Cholesky factorisation) against the dense
 * computation, and its score and Hessian against differences of the likelihood. */
static void test_general_slopes(void **state)
{
	gsl_rng *rng = gsl_rng_alloc(gsl_rng_mt19937);
	static struct rdata r;
	(void)state;
	gsl_rng_set(rng, 18);
	for (int rep = 0; rep < 20; rep++) {
		struct sd_err e = { 0 };
		int mode = rep % 3;
		random_data(rng, mode, 1, rep % 5 ? 3 : 8, &r);
		struct mr_work *w = mr_work_new(&r.d, &e);
		if (!w)
			fail_msg("%s", e.msg);
		double t0 = 0.02 * gsl_rng_uniform(rng), t2 = 0.05 * gsl_rng_uniform(rng);
		double rho = 2 * gsl_rng_uniform(rng) - 1;
		double th[MR_MAXK] = { t0, rho * sqrt(t0 * t2), t2, 0.02 * gsl_rng_uniform(rng) };
		for (int reml = 0; reml < 2; reml++) {
			struct mr_eval ev, dn;
			assert_int_equal(mr_work_eval(w, th, reml, MR_WANT_HESS, &ev), 0);
			dense_eval(&r, th, reml, &dn);
			assert_rel(ev.ll, dn.ll, 1e-10, "ll", 0);
			for (int j = 0; j < r.p; j++)
				assert_rel(ev.beta[j], dn.beta[j], 1e-9, "beta", j);
			for (int j = 0; j < r.p * r.p; j++)
				assert_rel(ev.C[j], dn.C[j], 1e-9, "C", j);
			check_fd(w, th, reml, 1e-8, 1);   /* |rho| near 1: a step may leave */
		}
		mr_work_free(w);
	}
	gsl_rng_free(rng);
}

/* The closed form's score and Hessian against differences of its own likelihood, with effect
 * groups of several rows (the sums the simulation files never exercise). */
static void test_closed_form_derivatives(void **state)
{
	gsl_rng *rng = gsl_rng_alloc(gsl_rng_mt19937);
	static struct rdata r;
	(void)state;
	gsl_rng_set(rng, 19);
	for (int rep = 0; rep < 10; rep++) {
		struct sd_err e = { 0 };
		random_data(rng, 2, 0, 3, &r);
		struct mr_work *w = mr_work_new(&r.d, &e);
		assert_non_null(w);
		double th[MR_MAXK] = { 0.002 + 0.02 * gsl_rng_uniform(rng),
				       0.002 + 0.02 * gsl_rng_uniform(rng) };
		for (int reml = 0; reml < 2; reml++)
			check_fd(w, th, reml, 1e-8, 0);
		mr_work_free(w);
	}
	gsl_rng_free(rng);
}

/* A repeated request returns the earlier result, never a stale one after another point. */
static void test_eval_memo(void **state)
{
	struct ef_spec sp = sim_spec(SD_FORM_RECIPROCAL, 0);
	struct ef_table t;
	struct ef_model m;
	struct sd_err e = { 0 };
	struct mr_eval a, b, c, d;
	double t1[MR_MAXK] = { 0.0015, 0.001 }, t2[MR_MAXK] = { 0.002, 0.0005 };
	(void)state;
	load(REF "sim_reciprocal_effects.csv", &sp, &t, &m);
	struct mr_work *w = mr_work_new(&m.d, &e);
	assert_int_equal(mr_work_eval(w, t1, 1, MR_WANT_HESS, &a), 0);
	assert_int_equal(mr_work_eval(w, t2, 1, MR_WANT_LL, &b), 0);
	assert_true(a.ll != b.ll);
	assert_int_equal(mr_work_eval(w, t1, 1, MR_WANT_GRAD, &c), 0);
	assert_true(c.ll == a.ll && c.g[0] == a.g[0] && c.g[1] == a.g[1]);
	assert_int_equal(mr_work_eval(w, t1, 0, MR_WANT_LL, &d), 0);   /* other criterion */
	assert_true(d.ll != a.ll);
	assert_int_equal(mr_work_eval(w, t1, 1, MR_WANT_HESS, &d), 0);
	assert_true(d.ll == a.ll && d.H[1] == a.H[1]);
	mr_work_free(w);
	ef_model_free(&m);
	eft_free(&t);
}

/* Extra starts only on a reason: the well-curved interior maxima of the 200-study data need
 * none (nor the quasi-Newton stage); boundary estimates (test_boundary's data) get them. */
static void test_start_logic(void **state)
{
	struct ef_table t;
	struct ef_model m;
	(void)state;
	for (int slopes = 0; slopes < 2; slopes++) {
		struct ef_spec sp = sim_spec(SD_FORM_RECIPROCAL, slopes);
		load("tests/bench/bench_big200_effects.csv", &sp, &t, &m);
		struct mr_fit f = fit_or_fail(&m.d, MR_REML);
		assert_int_equal(f.iter_bfgs, 0);
		assert_true(f.iter_newton <= 6);
		if (!slopes)
			assert_int_equal(f.starts, 0);
		ef_model_free(&m);
		eft_free(&t);
	}
	double y[8] = { 0.10, 0.11, 0.10, 0.09, 0.10, 0.11, 0.09, 0.10 }, v[8], X[8];
	int s[8] = { 1, 1, 2, 2, 3, 3, 4, 4 }, ef[8] = { 1, 2, 3, 4, 5, 6, 7, 8 };
	for (int i = 0; i < 8; i++) {
		v[i] = 0.01;
		X[i] = 1;
	}
	struct mr_data d = { 8, 1, y, v, X, s, ef, -1, NULL };
	struct mr_fit f = fit_or_fail(&d, MR_REML);
	assert_true(f.tau2_zero && f.sigma2_zero);
	assert_true(f.starts > 0);
}

/* Leave-one-study-out with warm starts equals refitting each reduced data set from scratch. */
static void test_loso(void **state)
{
	struct ef_spec sp = sim_spec(SD_FORM_LOG, 0);
	struct ef_table t;
	struct ef_model m;
	struct sd_err e = { 0 };
	struct mr_cv cv;
	struct mr_opts o = { MR_ML, 0.95, 0, 0, NULL };
	(void)state;

	load(REF "sim_reciprocal_effects.csv", &sp, &t, &m);
	struct mr_fit f = fit_or_fail(&m.d, MR_ML);
	assert_int_equal(mr_loso(&m.d, &o, &f, &cv, NULL, NULL, &e), 0);
	assert_int_equal(cv.folds + cv.skipped, m.nstudy);

	/* brute force: drop each study's rows, fit cold, predict its effects */
	int n = m.d.n, p = m.d.p, folds = 0, neff = 0;
	double *y = malloc(sizeof(double) * n), *v = malloc(sizeof(double) * n);
	double *X = malloc(sizeof(double) * n * p), sse = 0, lpd = 0;
	int *s = malloc(sizeof(int) * n), *ef = malloc(sizeof(int) * n);
	for (int out = 0; out < m.nstudy; out++) {
		int k = 0, rows[64], nr = 0;
		for (int i = 0; i < n; i++) {
			if (m.study[i] == out) {
				rows[nr++] = i;
				continue;
			}
			y[k] = m.y[i];
			v[k] = m.v[i];
			memcpy(X + k * p, m.X + i * p, sizeof(double) * p);
			s[k] = m.study[i];
			ef[k] = m.effect[i];
			k++;
		}
		struct mr_data d = { k, p, y, v, X, s, ef, -1, NULL };
		struct mr_fit g;
		if (mr_fit(&d, &o, &g, &e))
			continue;
		/* joint density of the held-out rows: V_i = tau2 J + sigma2 I + diag(v) + X C X' */
		double S[64 * 64], r[64];
		gsl_matrix_view Sv = gsl_matrix_view_array(S, nr, nr);
		for (int a = 0; a < nr; a++) {
			const double *xa = m.X + rows[a] * p;
			r[a] = m.y[rows[a]];
			for (int j = 0; j < p; j++)
				r[a] -= xa[j] * g.beta[j];
			for (int c = 0; c < nr; c++) {
				const double *xc = m.X + rows[c] * p;
				double q = g.tau2 + (a == c ? g.sigma2 + m.v[rows[a]] : 0);
				for (int i = 0; i < p; i++)
					for (int j = 0; j < p; j++)
						q += xa[i] * g.vcov[i * p + j] * xc[j];
				S[a * nr + c] = q;
			}
			sse += r[a] * r[a];
		}
		assert_int_equal(gsl_linalg_cholesky_decomp1(&Sv.matrix), 0);
		double z[64], ld = 0, quad = 0;
		memcpy(z, r, sizeof(double) * nr);
		gsl_vector_view zv = gsl_vector_view_array(z, nr);
		gsl_linalg_cholesky_svx(&Sv.matrix, &zv.vector);
		for (int a = 0; a < nr; a++) {
			ld += 2 * log(S[a * nr + a]);
			quad += r[a] * z[a];
		}
		lpd += -0.5 * (nr * log(2 * M_PI) + ld + quad);
		folds++;
		neff += nr;
	}
	assert_int_equal(cv.folds, folds);
	assert_int_equal(cv.neff, neff);
	assert_near(cv.rmse, sqrt(sse / neff), 1e-8);
	assert_near(cv.mlpd, lpd / neff, 1e-7);
	free(y);
	free(v);
	free(X);
	free(s);
	free(ef);
	ef_model_free(&m);
	eft_free(&t);
}

/* ---- degenerate input ---- */

static void test_one_study(void **state)
{
	double y[3] = { 0.1, 0.2, 0.15 }, v[3] = { 0.01, 0.01, 0.01 }, X[3] = { 1, 1, 1 };
	int s[3] = { 7, 7, 7 };
	struct mr_data d = { 3, 1, y, v, X, s, NULL, -1, NULL };
	struct mr_opts o = { MR_REML, 0.95, 0, 0, NULL };
	struct mr_fit f;
	struct sd_err e = { 0 };
	(void)state;
	assert_int_equal(mr_fit(&d, &o, &f, &e), -1);
	assert_non_null(strstr(e.msg, "one study"));
}

static void test_constant_dose(void **state)
{
	double y[4] = { 0.1, 0.2, 0.15, 0.3 }, v[4] = { 0.01, 0.01, 0.01, 0.02 };
	double X[8] = { 1, 0.5, 1, 0.5, 1, 0.5, 1, 0.5 };
	int s[4] = { 1, 1, 2, 2 };
	const char *names[2] = { "intercept", "dose" };
	struct mr_data d = { 4, 2, y, v, X, s, NULL, -1, names };
	struct mr_opts o = { MR_REML, 0.95, 0, 0, NULL };
	struct mr_fit f;
	struct sd_err e = { 0 };
	(void)state;
	assert_int_equal(mr_fit(&d, &o, &f, &e), -1);
	assert_non_null(strstr(e.msg, "'dose' has the same value"));
}

static void test_bad_variance(void **state)
{
	double y[4] = { 0.1, 0.2, 0.15, 0.3 }, v[4] = { 0.01, 0, 0.01, 0.02 }, X[4] = { 1, 1, 1, 1 };
	int s[4] = { 1, 1, 2, 2 };
	struct mr_data d = { 4, 1, y, v, X, s, NULL, -1, NULL };
	struct mr_opts o = { MR_REML, 0.95, 0, 0, NULL };
	struct mr_fit f;
	struct sd_err e = { 0 };
	(void)state;
	assert_int_equal(mr_fit(&d, &o, &f, &e), -1);
	assert_non_null(strstr(e.msg, "effect 2: the sampling variance is 0"));
	v[1] = -0.01;
	assert_int_equal(mr_fit(&d, &o, &f, &e), -1);
	assert_non_null(strstr(e.msg, "must be positive"));
}

/* Effects that vary less than their sampling variances allow: both variance estimates sit
 * on the boundary and are reported as exactly 0. */
static void test_boundary(void **state)
{
	double y[8] = { 0.10, 0.11, 0.10, 0.09, 0.10, 0.11, 0.09, 0.10 }, v[8], X[8];
	int s[8] = { 1, 1, 2, 2, 3, 3, 4, 4 }, ef[8] = { 1, 2, 3, 4, 5, 6, 7, 8 };
	struct mr_data d = { 8, 1, y, v, X, s, ef, -1, NULL };
	(void)state;
	for (int i = 0; i < 8; i++) {
		v[i] = 0.01;
		X[i] = 1;
	}
	for (int meth = 0; meth < 2; meth++) {
		struct mr_fit f = fit_or_fail(&d, (enum mr_method)meth);
		assert_true(f.tau2 == 0 && f.tau2_zero);
		assert_true(f.sigma2 == 0 && f.sigma2_zero);
		assert_near(f.beta[0], 0.1, 1e-12);          /* the plain mean: equal weights */
		assert_near(f.se[0], sqrt(0.01 / 8), 1e-12);
	}
	/* Only the study level at 0: studies identical on average, effects spread within. */
	double y2[8] = { 0.0, 0.2, 0.0, 0.2, 0.0, 0.2, 0.0, 0.2 };
	d.y = y2;
	struct mr_fit f = fit_or_fail(&d, MR_REML);
	assert_true(f.tau2 == 0 && f.tau2_zero);
	assert_true(f.sigma2 > 0 && !f.sigma2_zero);

	/* Random slopes on flat data: the maximum is at G = 0 (a corner of the parameter space,
	 * where a log-scale search stalls at rho -> -1), reported as exactly 0. */
	double y3[6] = { 0.10, 0.12, 0.11, 0.12, 0.10, 0.13 }, v3[6], X3[12];
	int s3[6] = { 1, 1, 2, 2, 3, 3 };
	for (int i = 0; i < 6; i++) {
		v3[i] = 0.01;
		X3[2 * i] = 1;
		X3[2 * i + 1] = i % 2 ? 8 : 0;
	}
	struct mr_data d3 = { 6, 2, y3, v3, X3, s3, NULL, 1, NULL };
	f = fit_or_fail(&d3, MR_REML);
	assert_true(f.tau2 == 0 && f.tau2_zero && f.tau2_slope == 0 && f.slope_zero);
	assert_true(f.cov_slope == 0 && isnan(f.rho));
	struct mr_data d4 = d3;
	d4.slope_col = -1;
	struct mr_fit g = fit_or_fail(&d4, MR_REML);
	assert_near(f.loglik, g.loglik, 1e-10);        /* the same model once G = 0 */
}

/* A likelihood with two maxima: invented data (7 effects, 5 studies) whose ML likelihood has
 * a local maximum on the boundary tau2 = 0 and a higher one inside. The fit must report the
 * higher one; the boundary really is a local maximum (its score is negative). */
static void test_two_maxima(void **state)
{
	double y[7] = { -0.040308, 0.215197, 0.136810, 0.180074, 0.191736, -0.065460, 0.334051 };
	double v[7] = { 0.010610, 0.008214, 0.005177, 0.004013, 0.001181, 0.008296, 0.009208 };
	double sets[7] = { 0, 6, 7, 9, 2, 2, 6 }, X[14];
	int s[7] = { 1, 1, 2, 3, 3, 4, 5 };
	struct mr_data d = { 7, 2, y, v, X, s, NULL, -1, NULL };
	struct mr_eval at0, at_fit;
	struct sd_err e = { 0 };
	(void)state;
	for (int i = 0; i < 7; i++) {
		X[2 * i] = 1;
		X[2 * i + 1] = 1 / (sets[i] + 1);
	}
	struct mr_fit f = fit_or_fail(&d, MR_ML);
	struct mr_work *w = mr_work_new(&d, &e);
	double zero = 0, tiny = 1e-9;
	assert_int_equal(mr_work_eval(w, &zero, 0, MR_WANT_LL, &at0), 0);
	assert_int_equal(mr_work_eval(w, &tiny, 0, MR_WANT_GRAD, &at_fit), 0);
	assert_true(at_fit.g[0] < 0);                 /* tau2 = 0 is a local maximum ... */
	assert_true(f.tau2 > 0.001 && f.tau2 < 0.0015);
	assert_true(f.loglik > at0.ll + 0.005);      /* ... but not the best one */
	mr_work_free(w);
}

static void test_not_converged(void **state)
{
	struct ef_spec sp = sim_spec(SD_FORM_RECIPROCAL, 1);
	struct ef_table t;
	struct ef_model m;
	struct mr_opts o = { MR_REML, 0.95, 0, 1, NULL };
	struct mr_fit f;
	struct sd_err e = { 0 };
	(void)state;
	load(REF "sim_reciprocal_effects.csv", &sp, &t, &m);
	assert_int_equal(mr_fit(&m.d, &o, &f, &e), -1);
	assert_false(f.converged);
	assert_non_null(strstr(e.msg, "did not converge"));
	ef_model_free(&m);
	eft_free(&t);
}

static void test_unidentifiable_levels(void **state)
{
	double y[4] = { 0.1, 0.2, 0.15, 0.3 }, v[4] = { 0.01, 0.01, 0.01, 0.02 }, X[4] = { 1, 1, 1, 1 };
	int s[4] = { 1, 2, 3, 4 }, ef[4] = { 1, 2, 3, 4 };
	struct mr_data d = { 4, 1, y, v, X, s, ef, -1, NULL };
	struct mr_opts o = { MR_REML, 0.95, 0, 0, NULL };
	struct mr_fit f;
	struct sd_err e = { 0 };
	(void)state;
	assert_int_equal(mr_fit(&d, &o, &f, &e), -1);
	assert_non_null(strstr(e.msg, "cannot be told apart"));
}

/* t intervals: df = studies - coefficients, the t quantile. */
static void test_t_df(void **state)
{
	struct ef_spec sp = sim_spec(SD_FORM_RECIPROCAL, 0);
	struct ef_table t;
	struct ef_model m;
	struct mr_opts o = { MR_REML, 0.90, 1, 0, NULL };
	struct mr_fit f;
	struct sd_err e = { 0 };
	(void)state;
	load(REF "sim_reciprocal_effects.csv", &sp, &t, &m);
	assert_int_equal(mr_fit(&m.d, &o, &f, &e), 0);
	assert_int_equal(f.df, 40 - 4);
	assert_near(f.crit, gsl_cdf_tdist_Pinv(0.95, 36), 1e-12);
	assert_near(f.hi[1] - f.beta[1], f.crit * f.se[1], 1e-12);
	assert_near(f.pval[1], 2 * gsl_cdf_tdist_Q(fabs(f.beta[1] / f.se[1]), 36), 1e-12);
	ef_model_free(&m);
	eft_free(&t);
}

/* The profile made from a fit: terms, coefficients, covariance, heterogeneity; it validates. */
static void test_profile(void **state)
{
	struct ef_spec sp = sim_spec(SD_FORM_RECIPROCAL, 1);
	struct ef_table t;
	struct ef_model m;
	struct sd_profile p;
	struct sd_err e = { 0 };
	(void)state;
	load(REF "sim_reciprocal_effects.csv", &sp, &t, &m);
	struct mr_fit f = fit_or_fail(&m.d, MR_REML);
	assert_int_equal(mr_to_profile(&f, SD_FORM_RECIPROCAL, m.names, &p, &e), 0);
	p.dose_min = m.dose_min;
	p.dose_max = m.dose_max;
	/* Every moderator needs an evidence range (fit --write takes the data's). */
	p.range[0] = (struct sd_range){ "weeks", 6, 16 };
	p.range[1] = (struct sd_range){ "trained", 0, 1 };
	p.nranges = 2;
	assert_int_equal(profile_validate(&p, &e), 0);
	assert_int_equal(p.nterms, 4);
	assert_string_equal(p.term[0], "intercept");
	assert_string_equal(p.term[1], "dose");
	assert_string_equal(p.term[2], "weeks");
	assert_string_equal(p.term[3], "trained");
	for (int j = 0; j < 4; j++) {
		assert_near(p.beta[j], f.beta[j], 0);
		assert_near(p.centre[j], 0, 0);
		for (int k = 0; k < 4; k++)
			assert_near(p.vcov[j * 4 + k], f.vcov[j * 4 + k], 0);
	}
	assert_true(p.slopes);
	assert_near(p.tau2, f.tau2, 0);
	assert_near(p.tau2_slope, f.tau2_slope, 0);
	assert_near(p.cov_slope, f.cov_slope, 0);
	assert_near(p.sigma2, f.sigma2, 0);
	assert_near(p.swc, log(1.03), 1e-15);
	assert_int_equal(p.df, 0);
	ef_model_free(&m);
	eft_free(&t);
}

/* Simulation recovery: data drawn from known parameters (GSL's mt19937, fixed seed); the 95%
 * confidence intervals of the four coefficients should cover the truth in about 95% of the
 * replicates. Each count is checked against the central 99.9% range of Binomial(R, 0.95), and
 * the mean REML variance estimates against the truth within 4 Monte Carlo standard errors
 * (a z-type check; the 4 is common practice, no source). */
static void test_recovery(void **state)
{
	enum { R = 300, S = 40 };
	const double beta[4] = { 0.20, -0.22, 0.008, -0.05 }, tau2 = 0.0016, sigma2 = 0.0009;
	static const double doses[] = { 0, 1, 2, 3, 4, 6, 8, 10, 12, 16, 20, 24 };
	gsl_rng *rng = gsl_rng_alloc(gsl_rng_mt19937);
	static double y[S * 4], v[S * 4], X[S * 4 * 4];
	static int st[S * 4], ef[S * 4];
	int cover[4] = { 0 };
	double t2[R], s2[R];
	(void)state;

	gsl_rng_set(rng, 20261201);
	for (int rep = 0; rep < R; rep++) {
		int n = 0;
		for (int s = 0; s < S; s++) {
			int trained = gsl_rng_uniform(rng) < 0.5, weeks = 6 + (int)gsl_rng_uniform_int(rng, 11);
			int arms = 2 + (int)gsl_rng_uniform_int(rng, 3);
			double u = gsl_ran_gaussian(rng, sqrt(tau2));
			for (int a = 0; a < arms; a++) {
				double x = doses[gsl_rng_uniform_int(rng, 12)], fx = 1 / (x + 1);
				int nsub = 8 + (int)gsl_rng_uniform_int(rng, 13);
				double *row = X + n * 4;
				row[0] = 1;
				row[1] = fx;
				row[2] = weeks;
				row[3] = trained;
				v[n] = 0.0144 / nsub * 0.4 + 0.0004;
				y[n] = beta[0] + beta[1] * fx + beta[2] * weeks + beta[3] * trained + u +
				       gsl_ran_gaussian(rng, sqrt(sigma2)) + gsl_ran_gaussian(rng, sqrt(v[n]));
				st[n] = s;
				ef[n] = n;
				n++;
			}
		}
		struct mr_data d = { n, 4, y, v, X, st, ef, -1, NULL };
		struct mr_fit f = fit_or_fail(&d, MR_REML);
		for (int j = 0; j < 4; j++)
			cover[j] += f.lo[j] <= beta[j] && beta[j] <= f.hi[j];
		t2[rep] = f.tau2;
		s2[rep] = f.sigma2;
	}
	gsl_rng_free(rng);
	int lo = 0, hi = R;
	while (gsl_cdf_binomial_P(lo, 0.95, R) < 0.0005)
		lo++;
	while (hi > 0 && gsl_cdf_binomial_P(hi - 1, 0.95, R) > 0.9995)
		hi--;
	for (int j = 0; j < 4; j++) {
		if (cover[j] < lo || cover[j] > hi)
			fail_msg("coefficient %d: %d of %d intervals cover the truth (accept %d-%d)", j,
				 cover[j], R, lo, hi);
	}
	const double *est[2] = { t2, s2 }, truth[2] = { tau2, sigma2 };
	for (int k = 0; k < 2; k++) {
		double m = 0, ss = 0;
		for (int r = 0; r < R; r++)
			m += est[k][r];
		m /= R;
		for (int r = 0; r < R; r++)
			ss += (est[k][r] - m) * (est[k][r] - m);
		double se = sqrt(ss / (R - 1) / R);
		assert_near(m, truth[k], 4 * se);
	}
}

int main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(test_konstantopoulos),
		cmocka_unit_test(test_curtis),
		cmocka_unit_test(test_sim_forms),
		cmocka_unit_test(test_sim_slopes),
		cmocka_unit_test(test_blups),
		cmocka_unit_test(test_big200),
		cmocka_unit_test(test_derivatives),
		cmocka_unit_test(test_closed_form),
		cmocka_unit_test(test_general_slopes),
		cmocka_unit_test(test_closed_form_derivatives),
		cmocka_unit_test(test_eval_memo),
		cmocka_unit_test(test_start_logic),
		cmocka_unit_test(test_loso),
		cmocka_unit_test(test_one_study),
		cmocka_unit_test(test_constant_dose),
		cmocka_unit_test(test_bad_variance),
		cmocka_unit_test(test_boundary),
		cmocka_unit_test(test_two_maxima),
		cmocka_unit_test(test_not_converged),
		cmocka_unit_test(test_unidentifiable_levels),
		cmocka_unit_test(test_t_df),
		cmocka_unit_test(test_profile),
		cmocka_unit_test(test_recovery),
	};
	return cmocka_run_group_tests(tests, NULL, NULL);
}
