/* Fitting entry point and the summaries drawn from a fit (see metareg.h). */
#include "metareg.h"

#include <math.h>
#include <stdio.h>
#include <string.h>

#include <gsl/gsl_blas.h>
#include <gsl/gsl_cdf.h>
#include <gsl/gsl_linalg.h>

#include "mr_lik.h"

/* Cochran's Q_E for residual heterogeneity and the typical sampling variance (n - p)/tr(P0),
 * both from the fixed-effects fit with weights 1/v: the quantities metafor reports as QE and
 * uses for the multilevel I^2 (Nakagawa & Santos 2012, as computed in Viechtbauer's metafor
 * documentation). */
static void heterogeneity(const struct mr_data *d, struct mr_fit *f)
{
	int n = d->n, p = d->p;
	double A[MR_MAXP * MR_MAXP] = {0}, A2[MR_MAXP * MR_MAXP] = {0}, b[MR_MAXP] = {0};
	double beta[MR_MAXP], sw = 0, q = 0, tr = 0;

	for (int i = 0; i < n; i++) {
		const double *x = d->X + (size_t)i * p;
		double w = 1 / d->v[i];
		sw += w;
		for (int j = 0; j < p; j++) {
			b[j] += w * x[j] * d->y[i];
			for (int k = 0; k < p; k++) {
				A[j * p + k] += w * x[j] * x[k];
				A2[j * p + k] += w * w * x[j] * x[k];
			}
		}
	}
	gsl_matrix_view Av = gsl_matrix_view_array(A, p, p);
	gsl_vector_view bv = gsl_vector_view_array(b, p), betav = gsl_vector_view_array(beta, p);
	f->qe = f->qe_p = f->v_typical = NAN;
	f->qe_df = n - p;
	if (gsl_linalg_cholesky_decomp1(&Av.matrix) ||
	    gsl_linalg_cholesky_solve(&Av.matrix, &bv.vector, &betav.vector) ||
	    gsl_linalg_cholesky_invert(&Av.matrix))
		return;
	for (int i = 0; i < n; i++) {
		double r = d->y[i];
		for (int j = 0; j < p; j++)
			r -= d->X[(size_t)i * p + j] * beta[j];
		q += r * r / d->v[i];
	}
	for (int j = 0; j < p; j++)
		for (int k = 0; k < p; k++)
			tr += A[j * p + k] * A2[k * p + j];
	f->qe = q;
	f->qe_p = gsl_cdf_chisq_Q(q, n - p);
	f->v_typical = (n - p) / (sw - tr);
	/* With random slopes the between-study variance depends on the dose: take it at the
	 * mean of the slope column. */
	double t2 = f->tau2;
	if (f->slopes) {
		double fm = 0;
		for (int i = 0; i < n; i++)
			fm += d->X[(size_t)i * p + f->slope_col];
		fm /= n;
		t2 += 2 * fm * f->cov_slope + fm * fm * f->tau2_slope;
	}
	double tot = t2 + f->sigma2 + f->v_typical;
	f->i2_study = 100 * t2 / tot;
	f->i2_effect = 100 * f->sigma2 / tot;
}

static void fill(const struct mr_data *d, const struct mr_opts *o, struct mr_work *w,
		 const struct mr_eval *ev, const struct mr_conv *cv, struct mr_fit *f)
{
	int p = d->p, K = mr_work_nvc(w);

	f->nvc = K;
	f->converged = cv->converged;
	f->iter_bfgs = cv->iter_bfgs;
	f->iter_newton = cv->iter_newton;
	f->starts = cv->starts;
	f->decrement = cv->decrement;
	f->tau2_zero = f->slope_zero = f->sigma2_zero = 0;
	for (int k = 0; k < K; k++) {
		double t = f->theta[k];
		switch (mr_work_kind(w, k)) {
		case MR_K_TAU2: f->tau2 = t; f->tau2_zero = cv->zero[k]; break;
		case MR_K_COV: f->cov_slope = t; break;
		case MR_K_SLOPE: f->tau2_slope = t; f->slope_zero = cv->zero[k]; break;
		case MR_K_SIGMA2: f->sigma2 = t; f->sigma2_zero = cv->zero[k]; break;
		}
	}
	f->rho = f->slopes && f->tau2 > 0 && f->tau2_slope > 0 ?
		 f->cov_slope / sqrt(f->tau2 * f->tau2_slope) : NAN;
	f->rho_bound = cv->rho_bound && !isnan(f->rho);
	if (f->rho_bound)
		f->rho = f->rho > 0 ? 1 : -1;
	f->df = o->t_test ? (f->nstudy - p > 1 ? f->nstudy - p : 1) : 0;
	f->level = o->level > 0 && o->level < 1 ? o->level : 0.95;
	double a = (1 - f->level) / 2;
	f->crit = f->df ? gsl_cdf_tdist_Qinv(a, f->df) : gsl_cdf_ugaussian_Qinv(a);
	memcpy(f->beta, ev->beta, sizeof(double) * p);
	memcpy(f->vcov, ev->C, sizeof(double) * p * p);
	for (int j = 0; j < p; j++) {
		f->se[j] = sqrt(ev->C[j * p + j]);
		f->stat[j] = f->beta[j] / f->se[j];
		f->pval[j] = 2 * (f->df ? gsl_cdf_tdist_Q(fabs(f->stat[j]), f->df) :
				   gsl_cdf_ugaussian_Q(fabs(f->stat[j])));
		f->lo[j] = f->beta[j] - f->crit * f->se[j];
		f->hi[j] = f->beta[j] + f->crit * f->se[j];
	}
	f->loglik = ev->ll;
	f->npar = p + K;
	f->aic = -2 * f->loglik + 2 * f->npar;
	f->bic = -2 * f->loglik + f->npar * log(f->method == MR_REML ? f->n - p : f->n);
	heterogeneity(d, f);
}

int mr_fit(const struct mr_data *d, const struct mr_opts *o, struct mr_fit *f, struct sd_err *e)
{
	struct mr_work *w;
	struct mr_conv cv;
	struct mr_eval ev;
	int ret = -1, reml = o->method == MR_REML;

	memset(f, 0, sizeof *f);
	if (!(w = mr_work_new(d, e)))
		return -1;
	f->n = d->n;
	f->p = d->p;
	f->nstudy = mr_work_nblock(w);
	f->method = o->method;
	f->slopes = d->slope_col >= 0;
	f->slope_col = d->slope_col;
	f->effect_level = d->effect != NULL;
	if (o->start)
		memcpy(f->theta, o->start, sizeof(double) * mr_work_nvc(w));
	else
		mr_start(w, f->theta);
	if (mr_optimise(w, reml, o->max_iter, o->start != NULL, f->theta, &cv, e))
		goto done;
	if (mr_work_eval(w, f->theta, reml, MR_WANT_LL, &ev)) {
		sd_fail(e, "the likelihood could not be evaluated at the estimates");
		goto done;
	}
	fill(d, o, w, &ev, &cv, f);
	if (!f->converged) {
		sd_fail(e, "the %s fit did not converge (%d quasi-Newton and %d Newton iterations; "
			"last Newton decrement %.3g)", reml ? "REML" : "ML", cv.iter_bfgs,
			cv.iter_newton, cv.decrement);
		goto done;
	}
	ret = 0;
done:
	mr_work_free(w);
	return ret;
}

void mr_predict(const struct mr_fit *f, const double *z, struct mr_pred *out)
{
	int p = f->p;
	double y = 0, v = 0, het = f->tau2 + f->sigma2;

	for (int j = 0; j < p; j++) {
		y += z[j] * f->beta[j];
		for (int k = 0; k < p; k++)
			v += z[j] * f->vcov[j * p + k] * z[k];
	}
	if (f->slopes) {
		double x = z[f->slope_col];
		het += 2 * x * f->cov_slope + x * x * f->tau2_slope;
	}
	out->pred = y;
	out->se = sqrt(v);
	out->ci_lo = y - f->crit * out->se;
	out->ci_hi = y + f->crit * out->se;
	double sp = sqrt(v + het);
	out->pi_lo = y - f->crit * sp;
	out->pi_hi = y + f->crit * sp;
}

int mr_to_profile(const struct mr_fit *f, enum sd_form form, const char *const *terms,
		  struct sd_profile *p, struct sd_err *e)
{
	if (f->p < 2 || f->p > SD_MAX_TERMS)
		return sd_fail(e, "a profile needs an intercept, a dose term and at most %d terms",
			       SD_MAX_TERMS);
	memset(p, 0, sizeof *p);
	snprintf(p->name, sizeof p->name, "fitted");
	snprintf(p->outcome, sizeof p->outcome, "strength");
	snprintf(p->scale, sizeof p->scale, "lnRR");
	p->form = form;
	p->nterms = f->p;
	for (int j = 0; j < f->p; j++) {
		const char *t = j == 0 ? "intercept" : j == 1 ? "dose" : terms[j];
		if (strlen(t) >= sizeof p->term[j])
			return sd_fail(e, "term name '%s' is too long", t);
		snprintf(p->term[j], sizeof p->term[j], "%s", t);
		p->beta[j] = f->beta[j];
		p->centre[j] = 0;
		for (int k = 0; k < f->p; k++)
			p->vcov[j * f->p + k] = f->vcov[j * f->p + k];
	}
	p->tau2 = f->tau2;
	p->sigma2 = f->sigma2;
	p->slopes = f->slopes;
	p->tau2_slope = f->tau2_slope;
	p->cov_slope = f->cov_slope;
	p->swc = log(1.03);
	p->w_direct = 1;
	p->w_indirect = 0.5;
	p->df = f->df;
	return 0;
}
