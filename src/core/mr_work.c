/* The data of a meta-regression grouped by study: block order, copies of the rows, each
 * block's effect-level groups and the checks that the model can be fitted at all. The
 * likelihood itself is in mr_lik.c and mr_cs.c, the starting values in mr_start.c. */
#include "mr_lik.h"

#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include <gsl/gsl_errno.h>
#include <gsl/gsl_linalg.h>

int mr_work_nvc(const struct mr_work *w) { return w->nk; }
enum mr_kind mr_work_kind(const struct mr_work *w, int k) { return w->kind[k]; }
int mr_work_nblock(const struct mr_work *w) { return w->nb; }
int mr_work_p(const struct mr_work *w) { return w->p; }
double mr_work_vscale(const struct mr_work *w) { return w->vscale; }
double mr_work_fscale(const struct mr_work *w) { return w->fscale; }

int mr_work_block(const struct mr_work *w, int b, int *id, const int **rows)
{
	if (id)
		*id = w->bid[b];
	if (rows)
		*rows = w->order + w->bstart[b];
	return w->blen[b];
}

static const struct mr_data *sort_data;  /* qsort has no context argument */

static int cmp_rows(const void *a, const void *b)
{
	int i = *(const int *)a, j = *(const int *)b;
	int si = sort_data->study[i], sj = sort_data->study[j];
	if (si != sj)
		return si < sj ? -1 : 1;
	return i < j ? -1 : i > j;   /* keep the file order inside a study */
}

void mr_work_free(struct mr_work *w)
{
	if (!w)
		return;
	free(w->order);
	free(w->bstart);
	free(w->blen);
	free(w->bid);
	free(w->loff);
	free(w->ngrp);
	free(w->gsize);
	free(w->bmulti);
	free(w->logv);
	free(w->iv);
	free(w->ca);
	free(w->ct);
	free(w->cid);
	free(w->cb);
	free(w->caX);
	free(w->y);
	free(w->v);
	free(w->X);
	free(w->f);
	free(w->eg);
	free(w->W);
	free(w->WX);
	free(w->r);
	free(w->q);
	free(w->S);    /* allocated by the first evaluation */
	free(w->scr);
	free(w->iscr);
	free(w->memo);
	free(w);
}

static const char *colname(const struct mr_data *d, int j, char *buf, size_t len)
{
	if (d->names && d->names[j])
		return d->names[j];
	snprintf(buf, len, "%d", j + 1);
	return buf;
}

/* Rank of the design over the blocks in use: X'X scaled to unit diagonal must be comfortably
 * positive definite. A constant column beside the intercept is named, since that is the usual
 * cause (every effect at one dose, a moderator that never varies). */
static int check_rank(struct mr_work *w, struct sd_err *e)
{
	int p = w->p;
	double xtx[MR_MAXP * MR_MAXP] = {0}, s[MR_MAXP];
	char buf[16];

	for (int b = 0; b < w->nb; b++) {
		if (b == w->excl)
			continue;
		for (int i = w->bstart[b]; i < w->bstart[b] + w->blen[b]; i++)
			for (int j = 0; j < p; j++)
				for (int k = 0; k < p; k++)
					xtx[j * p + k] += w->X[i * p + j] * w->X[i * p + k];
	}
	for (int j = 0; j < p; j++) {
		if (!(xtx[j * p + j] > 0))
			return sd_fail(e, "column '%s' of the design is all zero",
				       colname(w->d, j, buf, sizeof buf));
		s[j] = sqrt(xtx[j * p + j]);
	}
	/* Named only when column 0 is the intercept: without one a constant column is fine. */
	int icpt = 1;
	for (int b = 0; b < w->nb && icpt; b++)
		for (int i = w->bstart[b]; b != w->excl && i < w->bstart[b] + w->blen[b]; i++)
			if (w->X[i * p] != 1)
				icpt = 0;
	for (int j = 1; icpt && j < p; j++) {
		double first = NAN;
		int constant = 1;
		for (int b = 0; b < w->nb && constant; b++) {
			if (b == w->excl)
				continue;
			for (int i = w->bstart[b]; i < w->bstart[b] + w->blen[b]; i++) {
				double x = w->X[i * p + j];
				if (isnan(first))
					first = x;
				else if (x != first) {
					constant = 0;
					break;
				}
			}
		}
		if (constant)
			return sd_fail(e, "column '%s' has the same value (%g) for every effect, so its "
				       "coefficient cannot be estimated", colname(w->d, j, buf, sizeof buf),
				       first);
	}
	double sc[MR_MAXP * MR_MAXP], wk[3 * MR_MAXP], rcond = 0;
	for (int j = 0; j < p; j++)
		for (int k = 0; k < p; k++)
			sc[j * p + k] = xtx[j * p + k] / (s[j] * s[k]);
	gsl_matrix_view m = gsl_matrix_view_array(sc, p, p);
	gsl_vector_view wv = gsl_vector_view_array(wk, 3 * p);
	if (gsl_linalg_cholesky_decomp1(&m.matrix) ||
	    gsl_linalg_cholesky_rcond(&m.matrix, &rcond, &wv.vector) || rcond < 1e-12)
		return sd_fail(e, "the design columns are collinear (one is a combination of the "
			       "others), so the coefficients cannot be estimated");
	/* log|X'X| for the restricted likelihood's constant, from the scaled factor. */
	double ld = 0;
	for (int j = 0; j < p; j++)
		ld += 2 * log(gsl_matrix_get(&m.matrix, j, j)) + 2 * log(s[j]);
	w->logdet_xtx = ld;
	return 0;
}

/* The kinds of variance parameter in fit order: tau2 [cov slope] [sigma2]. */
static void set_kinds(struct mr_work *w)
{
	w->nk = 0;
	w->kind[w->nk++] = MR_K_TAU2;
	if (w->d->slope_col >= 0) {
		w->kind[w->nk++] = MR_K_COV;
		w->kind[w->nk++] = MR_K_SLOPE;
	}
	if (w->d->effect)
		w->kind[w->nk++] = MR_K_SIGMA2;
}

/* Per study: local effect-group numbers, and what each level needs to be identifiable. */
static int group_blocks(struct mr_work *w, struct sd_err *e)
{
	const struct mr_data *d = w->d;
	int p = d->p, multi_eff = 0, multi_dose = 0, loff = 0;

	w->nb = 0;
	for (int i = 0; i < d->n; i++) {
		if (i == 0 || d->study[w->order[i]] != d->study[w->order[i - 1]]) {
			w->bstart[w->nb] = i;
			w->bid[w->nb] = d->study[w->order[i]];
			w->blen[w->nb] = 0;
			w->nb++;
		}
		w->blen[w->nb - 1]++;
	}
	for (int b = 0; b < w->nb; b++) {
		int s = w->bstart[b], m = w->blen[b], ngrp = 0, ndose = 1;
		w->loff[b] = loff;
		loff += m * m;
		w->logv[b] = 0;
		if (m > w->mmax)
			w->mmax = m;
		for (int i = s; i < s + m; i++) {
			int r = w->order[i];
			w->y[i] = d->y[r];
			w->v[i] = d->v[r];
			w->iv[i] = 1 / d->v[r];
			w->logv[b] += log(d->v[r]);
			w->gsize[i] = 0;
			memcpy(w->X + (size_t)i * p, d->X + (size_t)r * p, sizeof(double) * p);
			w->f[i] = d->slope_col >= 0 ? d->X[(size_t)r * p + d->slope_col] : 0;
			if (w->eg) {
				int g = -1;
				for (int j = s; j < i && g < 0; j++)
					if (d->effect[w->order[j]] == d->effect[r])
						g = w->eg[j];
				w->eg[i] = g >= 0 ? g : ngrp++;
			}
			for (int j = s; j < i; j++) {
				if (w->f[j] == w->f[i])
					break;
				if (j == i - 1)
					ndose++;
			}
		}
		w->ngrp[b] = w->eg ? ngrp : m;
		w->bmulti[b] = 0;
		for (int i = s; w->eg && i < s + m; i++)
			w->bmulti[b] |= ++w->gsize[s + w->eg[i]] > 1;
		multi_eff += ngrp >= 2;
		multi_dose += ndose >= 2;
	}
	if (w->nb < 2)
		return sd_fail(e, "all %d effects come from one study: the between-study variance "
			       "cannot be estimated (needs at least 2 studies)", d->n);
	if (d->effect && !multi_eff)
		return sd_fail(e, "no study has two or more effect-level groups, so the study and "
			       "effect variances cannot be told apart (drop the effect level)");
	if (d->slope_col >= 0 && !multi_dose)
		return sd_fail(e, "random slopes need at least one study with two or more doses; "
			       "every study has a single dose");
	return 0;
}

struct mr_work *mr_work_new(const struct mr_data *d, struct sd_err *e)
{
	struct mr_work *w = calloc(1, sizeof *w);
	int n = d->n, p = d->p;

	/* GSL's default handler aborts; every GSL call here checks its return value instead. */
	gsl_set_error_handler_off();
	if (!w) {
		sd_fail(e, "out of memory");
		return NULL;
	}
	w->d = d;
	w->n = n;
	w->p = p;
	w->excl = -1;
	if (n < 1 || p < 1 || p > MR_MAXP || (d->slope_col >= p)) {
		sd_fail(e, "bad model: %d effects, %d columns (at most %d)", n, p, MR_MAXP);
		goto fail;
	}
	for (int i = 0; i < n; i++) {
		if (!isfinite(d->y[i])) {
			sd_fail(e, "effect %d: the effect size is not a finite number", i + 1);
			goto fail;
		}
		if (!isfinite(d->v[i]) || d->v[i] <= 0) {
			sd_fail(e, "effect %d: the sampling variance is %g (must be positive)", i + 1,
				d->v[i]);
			goto fail;
		}
		for (int j = 0; j < p; j++)
			if (!isfinite(d->X[(size_t)i * p + j])) {
				sd_fail(e, "effect %d: a moderator value is not a finite number", i + 1);
				goto fail;
			}
	}
	set_kinds(w);
	w->order = malloc(sizeof(int) * n);
	w->bstart = malloc(sizeof(int) * n);
	w->blen = malloc(sizeof(int) * n);
	w->bid = malloc(sizeof(int) * n);
	w->loff = malloc(sizeof(int) * n);
	w->ngrp = malloc(sizeof(int) * n);
	w->gsize = malloc(sizeof(int) * n);
	w->bmulti = malloc(sizeof(int) * n);
	w->logv = malloc(sizeof(double) * n);
	w->iv = malloc(sizeof(double) * n);
	w->ca = malloc(sizeof(double) * n);
	w->ct = malloc(sizeof(double) * n);
	w->cid = malloc(sizeof(double) * n);
	w->cb = malloc(sizeof(double) * 3 * n);
	w->caX = malloc(sizeof(double) * n * p);
	w->y = malloc(sizeof(double) * n);
	w->v = malloc(sizeof(double) * n);
	w->f = malloc(sizeof(double) * n);
	w->X = malloc(sizeof(double) * n * p);
	w->WX = malloc(sizeof(double) * n * p);
	w->q = malloc(sizeof(double) * n);
	w->r = malloc(sizeof(double) * n);
	w->eg = d->effect ? malloc(sizeof(int) * n) : NULL;
	if (!w->order || !w->bstart || !w->blen || !w->bid || !w->loff || !w->ngrp || !w->logv ||
	    !w->gsize || !w->bmulti || !w->iv || !w->ca || !w->ct || !w->cid || !w->cb ||
	    !w->caX || !w->y || !w->v ||
	    !w->f || !w->X || !w->WX || !w->q || !w->r || (d->effect && !w->eg)) {
		sd_fail(e, "out of memory");
		goto fail;
	}
	for (int i = 0; i < n; i++)
		w->order[i] = i;
	sort_data = d;
	qsort(w->order, n, sizeof(int), cmp_rows);
	if (group_blocks(w, e))
		goto fail;
	size_t nl = 0, r = (size_t)w->mmax + 2;
	for (int b = 0; b < w->nb; b++)
		nl += (size_t)w->blen[b] * w->blen[b];
	w->closed = d->slope_col < 0;
	w->W = malloc(sizeof(double) * nl);
	/* scratch: the general path's L^-1, U'W, M, Y, U'q, Y C, Y C Y' (r = columns of U), or the
	 * closed form's per-row and per-group values (fewer) */
	w->scr = malloc(sizeof(double) * r * (4 * r + 3 * p + 10));
	w->iscr = malloc(sizeof(int) * 2 * (MR_MAXK + 2 + r));
	if (!w->W || !w->scr || !w->iscr) {
		sd_fail(e, "out of memory");
		goto fail;
	}
	if (mr_work_exclude(w, -1, e))
		goto fail;
	return w;
fail:
	mr_work_free(w);
	return NULL;
}

int mr_work_exclude(struct mr_work *w, int b, struct sd_err *e)
{
	double sv = 0, sf = 0;

	w->excl = b;
	w->n_act = 0;
	for (int k = 0; k < w->nb; k++) {
		if (k == b)
			continue;
		w->n_act += w->blen[k];
		for (int i = w->bstart[k]; i < w->bstart[k] + w->blen[k]; i++) {
			sv += w->v[i];
			sf += w->f[i] * w->f[i];
		}
	}
	w->vscale = sv / w->n_act;
	w->fscale = sf / w->n_act;
	if (w->nb - (b >= 0) < 2)
		return sd_fail(e, "fewer than 2 studies left");
	if (w->n_act <= w->p)
		return sd_fail(e, "%d effects for %d coefficients: too few to fit the model", w->n_act,
			       w->p);
	return check_rank(w, e);
}

void mr_work_vblock(const struct mr_work *w, int b, const double *theta, double *V)
{
	int s = w->bstart[b], m = w->blen[b];
	const double *f = w->f + s;
	const int *eg = w->eg ? w->eg + s : NULL;
	double tau2 = 0, cov = 0, slope = 0, sig2 = 0;

	for (int k = 0; k < w->nk; k++)
		switch (w->kind[k]) {
		case MR_K_TAU2: tau2 = theta[k]; break;
		case MR_K_COV: cov = theta[k]; break;
		case MR_K_SLOPE: slope = theta[k]; break;
		case MR_K_SIGMA2: sig2 = theta[k]; break;
		}
	for (int a = 0; a < m; a++)
		for (int c = a; c < m; c++) {
			double x = tau2 + cov * (f[a] + f[c]) + slope * f[a] * f[c];
			if (eg && eg[a] == eg[c])
				x += sig2;
			if (a == c)
				x += w->v[s + a];
			V[a * m + c] = V[c * m + a] = x;
		}
}

void mr_work_view(const struct mr_work *w, int b, struct mr_blockview *out)
{
	int s = w->bstart[b], p = w->p;
	out->m = w->blen[b];
	out->id = w->bid[b];
	out->y = w->y + s;
	out->v = w->v + s;
	out->f = w->f + s;
	out->X = w->X + (size_t)s * p;
	out->WX = w->WX + (size_t)s * p;
	out->W = w->W + w->loff[b];
	out->q = w->q + s;
}
