/* Starting values for the variance parameters: method-of-moments estimates from the
 * fixed-effects fit, so that Newton's method starts near the maximum.
 *
 * With weights w = 1/v, the fixed-effects residuals e = y - X b0 and P0 = W0 - W0 X (X'W0 X)^-1
 * X'W0, Cochran's Q = e'W0 e has
 *   E[Q] = (n - p) + tau2 sum_i 1_i'P0 1_i + sigma2 tr(P0)
 * over the study blocks i (DerSimonian & Laird 1986 for one level; the same argument for two).
 * The spread of the residuals about each study's weighted mean,
 *   Q_w = sum_i sum_j w_ij (e_ij - e_i)^2,   E[Q_w] ~ sum_i (m_i - 1) + sigma2 sum_i (W_i - W2_i/W_i)
 * (W_i, W2_i: the sums of w and w^2 in study i; the fitted moderators' share of the residuals
 * is ignored, this being only a start) gives sigma2, and Q then tau2. With random slopes, each
 * study with two or more distinct values of the slope column f gives a weighted within-study
 * slope b_i of the residuals on f, and the DerSimonian-Laird estimator over the b_i gives the
 * slope variance; the intercept variance is what remains of tau2 at the mean of f^2 (the
 * covariance starts at 0). An estimate below a floor (1% of the typical sampling variance, on
 * each parameter's scale) starts at the floor, so that no root starts on its boundary, where
 * its gradient vanishes. */
#include "mr_lik.h"

#include <gsl/gsl_linalg.h>

/* DerSimonian-Laird moments of a set of estimates b with variances vb. */
struct dl {
	double sw, sw2, swb, swbb;
	int k;
};

static void dl_add(struct dl *d, double b, double vb)
{
	double u = 1 / vb;
	d->sw += u;
	d->sw2 += u * u;
	d->swb += u * b;
	d->swbb += u * b * b;
	d->k++;
}

static double dl_tau2(const struct dl *d)
{
	if (d->k < 2)
		return 0;
	double q = d->swbb - d->swb * d->swb / d->sw, c = d->sw - d->sw2 / d->sw;
	return c > 0 ? (q - (d->k - 1)) / c : 0;
}

/* The slope column's weighted within-study slope of the residuals in each block with two or
 * more distinct values, weights 1/(v + sigma2). */
static double slope_moment(const struct mr_work *w, const double *e, double sigma2)
{
	struct dl d = {0};
	for (int b = 0; b < w->nb; b++) {
		if (b == w->excl)
			continue;
		double su = 0, sf = 0, se = 0, sff = 0, sfe = 0;
		for (int i = w->bstart[b]; i < w->bstart[b] + w->blen[b]; i++) {
			double u = 1 / (w->v[i] + sigma2), f = w->f[i];
			su += u;
			sf += u * f;
			se += u * e[i];
			sff += u * f * f;
			sfe += u * f * e[i];
		}
		double sxx = sff - sf * sf / su;
		if (sxx > 1e-12 * sff && sxx > 0)
			dl_add(&d, (sfe - sf * se / su) / sxx, 1 / sxx);
	}
	return dl_tau2(&d);
}

void mr_start(struct mr_work *w, double *theta)
{
	int p = w->p, n = w->n_act;
	double A[MR_MAXP * MR_MAXP] = {0}, A2[MR_MAXP * MR_MAXP] = {0}, xty[MR_MAXP] = {0};
	double beta[MR_MAXP], sw = 0, f2 = 0, *e = w->r;
	double fl = 0.01 * w->vscale, tau2 = 0.1 * w->vscale, sigma2 = tau2, slope = 0;

	if (w->memo)
		w->memo->want = -1;      /* w->r is used as scratch below */

	for (int b = 0; b < w->nb; b++) {
		if (b == w->excl)
			continue;
		for (int i = w->bstart[b]; i < w->bstart[b] + w->blen[b]; i++) {
			const double *x = w->X + (size_t)i * p;
			double wi = w->iv[i];
			sw += wi;
			f2 += w->f[i] * w->f[i];
			for (int j = 0; j < p; j++) {
				xty[j] += wi * x[j] * w->y[i];
				for (int k = j; k < p; k++) {
					A[j * p + k] += wi * x[j] * x[k];
					A2[j * p + k] += wi * wi * x[j] * x[k];
				}
			}
		}
	}
	for (int j = 0; j < p; j++)
		for (int k = 0; k < j; k++) {
			A[j * p + k] = A[k * p + j];
			A2[j * p + k] = A2[k * p + j];
		}
	gsl_matrix_view Av = gsl_matrix_view_array(A, p, p);
	gsl_vector_view bv = gsl_vector_view_array(beta, p), yv = gsl_vector_view_array(xty, p);
	if (!gsl_linalg_cholesky_decomp1(&Av.matrix) &&
	    !gsl_linalg_cholesky_solve(&Av.matrix, &yv.vector, &bv.vector) &&
	    !gsl_linalg_cholesky_invert(&Av.matrix)) {
		/* A now holds (X'W0 X)^-1 */
		double q = 0, t1 = sw, tz = 0, qw = 0, tw = 0;
		int dfw = 0;
		for (int j = 0; j < p; j++)
			for (int k = 0; k < p; k++)
				t1 -= A[j * p + k] * A2[k * p + j];
		for (int b = 0; b < w->nb; b++) {
			if (b == w->excl)
				continue;
			int s = w->bstart[b], m = w->blen[b];
			double h[MR_MAXP] = {0}, wb = 0, w2 = 0, we = 0;
			for (int i = s; i < s + m; i++) {
				const double *x = w->X + (size_t)i * p;
				double r = w->y[i];
				for (int j = 0; j < p; j++) {
					r -= x[j] * beta[j];
					h[j] += w->iv[i] * x[j];
				}
				e[i] = r;
				q += w->iv[i] * r * r;
				wb += w->iv[i];
				w2 += w->iv[i] * w->iv[i];
				we += w->iv[i] * r;
			}
			tz += wb;                                    /* 1_i'P0 1_i */
			for (int j = 0; j < p; j++)
				for (int k = 0; k < p; k++)
					tz -= h[j] * A[j * p + k] * h[k];
			if (m < 2)
				continue;
			for (int i = s; i < s + m; i++)
				qw += w->iv[i] * (e[i] - we / wb) * (e[i] - we / wb);
			dfw += m - 1;
			tw += wb - w2 / wb;
		}
		sigma2 = w->eg && tw > 0 ? (qw - dfw) / tw : 0;
		tau2 = tz > 0 ? (q - (n - p) - (sigma2 > 0 ? sigma2 : 0) * t1) / tz : 0;
		if (w->d->slope_col >= 0) {
			slope = slope_moment(w, e, sigma2 > 0 ? sigma2 : 0);
			if (slope > 0)
				tau2 -= f2 / n * slope;
		}
	}
	for (int k = 0; k < w->nk; k++) {
		switch (w->kind[k]) {
		case MR_K_TAU2: theta[k] = tau2 > fl ? tau2 : fl; break;
		case MR_K_COV: theta[k] = 0; break;
		case MR_K_SLOPE: {
			double sf = w->fscale > 0 ? fl / w->fscale : fl;
			theta[k] = slope > sf ? slope : sf;
			break;
		}
		case MR_K_SIGMA2: theta[k] = sigma2 > fl ? sigma2 : fl; break;
		}
	}
}
