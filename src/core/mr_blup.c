/* Per-study summaries of a fit: empirical-Bayes (BLUP) random effects with their prediction
 * SEs, each study's weight, and the raw within-study dose slope beside them. */
#include "metareg.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "mr_lik.h"

/* Weighted least squares of y on [1, x] inside one study, weights 1/(v + sigma2): the
 * effect-level variance is noise around the study's own line in the fitted model. */
static void raw_slope(const double *x, const double *y, const double *v, int m, double sigma2,
		      struct mr_study *o)
{
	double sw = 0, sx = 0, sy = 0, sxx = 0, sxy = 0;
	for (int a = 0; a < m; a++) {
		double w = 1 / (v[a] + sigma2);
		sw += w;
		sx += w * x[a];
		sy += w * y[a];
		sxx += w * x[a] * x[a];
		sxy += w * x[a] * y[a];
	}
	double det = sw * sxx - sx * sx;
	o->raw_ok = o->ndose >= 2 && det > 0;
	if (!o->raw_ok) {
		o->raw_a = o->raw_b = o->raw_se_b = NAN;
		return;
	}
	o->raw_b = (sw * sxy - sx * sy) / det;
	o->raw_a = (sy - o->raw_b * sx) / sw;
	o->raw_se_b = sqrt(sw / det);
}

/* Scratch of 5 m doubles: Z and W Z (m x 2 each) and the doses. */
static void study(const struct mr_fit *f, const struct mr_blockview *bv, const double *C,
		 double *scr, struct mr_study *o)
{
	int m = bv->m, p = f->p, nz = f->slopes ? 2 : 1;
	double *Z = scr, *WZ = Z + 2 * m, *xs = WZ + 2 * m;
	double g[4] = { f->tau2, 0, 0, 0 };

	if (nz == 2) {
		g[1] = g[2] = f->cov_slope;
		g[3] = f->tau2_slope;
	}
	o->id = bv->id;
	o->k = m;
	for (int a = 0; a < m; a++) {
		xs[a] = f->slopes ? bv->f[a] : p > 1 ? bv->X[a * p + 1] : 0;
		Z[a * nz] = 1;
		if (nz == 2)
			Z[a * nz + 1] = bv->f[a];
	}
	o->ndose = 0;
	for (int a = 0; a < m; a++) {
		int seen = 0;
		for (int c = 0; c < a && !seen; c++)
			seen = xs[c] == xs[a];
		o->ndose += !seen;
	}
	for (int a = 0; a < m; a++)
		for (int i = 0; i < nz; i++) {
			double x = 0;
			for (int c = 0; c < m; c++)
				x += bv->W[a * m + c] * Z[c * nz + i];
			WZ[a * nz + i] = x;
		}
	/* u = G Z'q; Var(u - u^) = G - G Z'PZ G with Z'PZ = Z'WZ - Z'WX C X'WZ. */
	double zq[2] = {0}, zwz[4] = {0}, zwx[2 * MR_MAXP] = {0}, zpz[4], gz[4] = {0};
	for (int a = 0; a < m; a++)
		for (int i = 0; i < nz; i++) {
			zq[i] += Z[a * nz + i] * bv->q[a];
			for (int j = 0; j < nz; j++)
				zwz[i * nz + j] += Z[a * nz + i] * WZ[a * nz + j];
			for (int j = 0; j < p; j++)
				zwx[i * p + j] += WZ[a * nz + i] * bv->X[a * p + j];
		}
	for (int i = 0; i < nz; i++)
		for (int j = 0; j < nz; j++) {
			double c = 0;
			for (int r = 0; r < p; r++)
				for (int s = 0; s < p; s++)
					c += zwx[i * p + r] * C[r * p + s] * zwx[j * p + s];
			zpz[i * nz + j] = zwz[i * nz + j] - c;
		}
	double u[2] = {0}, var[2];
	for (int i = 0; i < nz; i++)
		for (int j = 0; j < nz; j++) {
			u[i] += g[i * nz + j] * zq[j];
			for (int r = 0; r < nz; r++)
				gz[i * nz + r] += g[i * nz + j] * zpz[j * nz + r];
		}
	for (int i = 0; i < nz; i++) {
		double s = 0;
		for (int r = 0; r < nz; r++)
			s += gz[i * nz + r] * g[r * nz + i];
		var[i] = g[i * nz + i] - s;
	}
	o->u0 = u[0];
	o->se_u0 = sqrt(var[0] > 0 ? var[0] : 0);
	o->u1 = nz == 2 ? u[1] : 0;
	o->se_u1 = nz == 2 ? sqrt(var[1] > 0 ? var[1] : 0) : 0;
	o->weight = zwz[0];    /* 1'V^-1 1, made a share by the caller */
	raw_slope(xs, bv->y, bv->v, m, f->sigma2, o);
}

int mr_studies(const struct mr_data *d, const struct mr_fit *f, struct mr_study *out,
	       struct sd_err *e)
{
	struct mr_work *w = mr_work_new(d, e);
	struct mr_eval ev;
	struct mr_blockview bv;
	double total = 0, *scr = malloc(sizeof(double) * 5 * d->n);
	int ret = -1;

	if (!w || !scr) {
		if (w)
			sd_fail(e, "out of memory");
		goto done;
	}
	w->general = 1;     /* the block inverses are needed below */
	if (mr_work_nblock(w) != f->nstudy || mr_work_eval(w, f->theta, 0, MR_WANT_LL, &ev)) {
		sd_fail(e, "the fit does not match the data");
		goto done;
	}
	for (int b = 0; b < f->nstudy; b++) {
		mr_work_view(w, b, &bv);
		study(f, &bv, ev.C, scr, &out[b]);
		total += out[b].weight;
	}
	for (int b = 0; b < f->nstudy; b++)
		out[b].weight *= 100 / total;
	ret = 0;
done:
	free(scr);
	mr_work_free(w);
	return ret;
}
