/* Leave-one-study-out cross-validation: each study's effects are predicted by the model
 * refitted without it. The refit starts from the full-data estimates (Newton steps only, the
 * quasi-Newton search as a fallback), so a fold costs a few likelihood evaluations. */
#include "metareg.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

#include <gsl/gsl_linalg.h>

#include "mr_lik.h"

/* Joint predictive density of the held-out block: N(X b, V_b + X C X'). Adds the squared
 * errors and the log density; -1 when the covariance is unusable. */
static int score_block(const struct mr_work *w, int b, const double *theta,
		       const struct mr_eval *ev, double *S, double *sse, double *lpd)
{
	struct mr_blockview bv;
	int p = mr_work_p(w);

	mr_work_view(w, b, &bv);
	int m = bv.m;
	double *r = S + (size_t)m * m;
	mr_work_vblock(w, b, theta, S);
	for (int a = 0; a < m; a++) {
		const double *xa = bv.X + (size_t)a * p;
		r[a] = bv.y[a];
		for (int j = 0; j < p; j++)
			r[a] -= xa[j] * ev->beta[j];
		for (int c = 0; c < m; c++) {
			const double *xc = bv.X + (size_t)c * p;
			double v = 0;
			for (int j = 0; j < p; j++)
				for (int k = 0; k < p; k++)
					v += xa[j] * ev->C[j * p + k] * xc[k];
			S[a * m + c] += v;
		}
	}
	gsl_matrix_view Sv = gsl_matrix_view_array(S, m, m);
	if (gsl_linalg_cholesky_decomp1(&Sv.matrix))
		return -1;
	double logdet = 0, quad = 0, *z = r + m;
	memcpy(z, r, sizeof(double) * m);
	gsl_vector_view zv = gsl_vector_view_array(z, m);
	gsl_linalg_cholesky_svx(&Sv.matrix, &zv.vector);
	for (int a = 0; a < m; a++) {
		logdet += 2 * log(S[a * m + a]);
		quad += r[a] * z[a];
		*sse += r[a] * r[a];
	}
	*lpd += -0.5 * (m * 1.8378770664093454836 + logdet + quad);
	return 0;
}

int mr_loso(const struct mr_data *d, const struct mr_opts *o, const struct mr_fit *full,
	    struct mr_cv *out, mr_progress cb, void *arg, struct sd_err *e)
{
	struct mr_work *w = mr_work_new(d, e);
	struct mr_eval ev;
	struct mr_conv cv;
	struct sd_err fold;
	double *S = NULL, sse = 0, lpd = 0, theta[MR_MAXK];
	int ret = -1, reml = o->method == MR_REML, nb, mmax = 0;

	memset(out, 0, sizeof *out);
	if (!w)
		return -1;
	nb = mr_work_nblock(w);
	for (int b = 0; b < nb; b++) {
		int m = mr_work_block(w, b, NULL, NULL);
		if (m > mmax)
			mmax = m;
	}
	if (!(S = malloc(sizeof(double) * ((size_t)mmax * mmax + 2 * mmax)))) {
		sd_fail(e, "out of memory");
		goto done;
	}
	for (int b = 0; b < nb; b++) {
		if (cb)
			cb(arg, b, nb);
		memcpy(theta, full->theta, sizeof theta);
		/* A fold whose remaining data cannot carry the model (a moderator left constant,
		 * one study left) or whose refit fails is counted, not fatal. */
		if (mr_work_exclude(w, b, &fold) ||
		    mr_optimise(w, reml, o->max_iter, 1, theta, &cv, &fold) || !cv.converged ||
		    mr_work_eval(w, theta, reml, MR_WANT_LL, &ev) ||
		    score_block(w, b, theta, &ev, S, &sse, &lpd)) {
			out->skipped++;
			continue;
		}
		out->folds++;
		out->neff += mr_work_block(w, b, NULL, NULL);
	}
	if (cb)
		cb(arg, nb, nb);
	if (!out->folds) {
		sd_fail(e, "leave-one-study-out: no study could be predicted from the others");
		goto done;
	}
	out->rmse = sqrt(sse / out->neff);
	out->mlpd = lpd / out->neff;
	ret = 0;
done:
	free(S);
	mr_work_free(w);
	return ret;
}
