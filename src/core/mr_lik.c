/* The (restricted) log-likelihood of the multilevel model, one study block at a time.
 *
 * With W = V^-1 (block-diagonal), C = (X'WX)^-1, r = y - X b and q = W r = P y, the REML
 * criterion and its derivatives in the natural parameters theta_k (V linear in theta, with
 * derivative matrices V_k) are
 *   ll   = -1/2 [(n-p) log 2pi + log|V| + log|X'WX| - log|X'X| + r'Wr]
 *   g_k  = -1/2 tr(P V_k) + 1/2 q'V_k q
 *   F_kl =  1/2 tr(P V_k P V_l),      H_kl = F_kl - (V_k q)' P (V_l q)
 * (ML: drop log|X'WX| - log|X'X|, use n and W in place of P in the traces). P is not
 * block-diagonal, but every term splits into per-block sums (struct mr_sums) plus p x p
 * corrections through C, which is why nothing of size n x n is ever formed.
 *
 * Blocks of the intercept models are summed in closed form (mr_cs.c). The others (random
 * slopes) take the general path here: each block's V_b is factored by a small hand-written
 * Cholesky (the blocks are a few rows square, where calls into a general library cost more
 * than the arithmetic) and inverted. Each V_k of a block is U E_k U' for the block's random-
 * effect columns U = [e, f, 1_1 .. 1_G] (intercept, slope column, effect groups) and a sparse
 * symmetric E_k, so the sums need only M = U'WU, Y = U'WX, U'q and Y C Y'. */
#include "mr_lik.h"

#include <stdlib.h>
#include <string.h>

#include <gsl/gsl_linalg.h>

static double trace_prod(const double *A, const double *B, int p)   /* tr(A B) */
{
	double t = 0;
	for (int i = 0; i < p; i++)
		for (int j = 0; j < p; j++)
			t += A[i * p + j] * B[j * p + i];
	return t;
}

/* tr(C D) for symmetric C and a symmetric D held as its upper triangle. */
static double trace_upper(const double *C, const double *D, int p)
{
	double t = 0;
	for (int i = 0; i < p; i++) {
		t += C[i * p + i] * D[i * p + i];
		for (int j = i + 1; j < p; j++)
			t += 2 * C[i * p + j] * D[i * p + j];
	}
	return t;
}

static void mirror(double *A, int p)   /* upper triangle to lower */
{
	for (int i = 0; i < p; i++)
		for (int j = 0; j < i; j++)
			A[i * p + j] = A[j * p + i];
}

/* A = V (m x m, row-major) in, V^-1 out, by Cholesky V = L L' and L^-1; the pivots go into ld.
 * T: m x m scratch. -1 when V is not positive definite. Inlined with a constant m for the
 * usual block sizes so the loops unroll. */
MR_INLINE int chol_inverse_m(double *A, const int m, struct mr_ldet *ld, double *T)
{
	for (int j = 0; j < m; j++) {
		double s = A[j * m + j];
		for (int k = 0; k < j; k++)
			s -= A[j * m + k] * A[j * m + k];
		if (!(s > 0))
			return -1;
		mr_ldet_mul(ld, s);
		double l = sqrt(s), il = 1 / l;
		A[j * m + j] = l;
		T[j * m + j] = il;
		for (int i = j + 1; i < m; i++) {
			double x = A[i * m + j];
			for (int k = 0; k < j; k++)
				x -= A[i * m + k] * A[j * m + k];
			A[i * m + j] = x * il;
		}
	}
	for (int j = 0; j < m; j++)                 /* T = L^-1, lower */
		for (int i = j + 1; i < m; i++) {
			double x = 0;
			for (int k = j; k < i; k++)
				x -= A[i * m + k] * T[k * m + j];
			T[i * m + j] = x * T[i * m + i];
		}
	for (int a = 0; a < m; a++)                 /* V^-1 = T'T */
		for (int c = a; c < m; c++) {
			double x = 0;
			for (int k = c; k < m; k++)
				x += T[k * m + a] * T[k * m + c];
			A[a * m + c] = A[c * m + a] = x;
		}
	return 0;
}

static int chol_inverse(double *A, int m, struct mr_ldet *ld, double *T)
{
	switch (m) {
	case 1: return chol_inverse_m(A, 1, ld, T);
	case 2: return chol_inverse_m(A, 2, ld, T);
	case 3: return chol_inverse_m(A, 3, ld, T);
	case 4: return chol_inverse_m(A, 4, ld, T);
	default: return chol_inverse_m(A, m, ld, T);
	}
}

/* General pass 1: W = V_b^-1 kept for pass 2, W X, and the block's X'WX (upper), X'Wy. */
MR_INLINE int factor_p(struct mr_work *w, int b, const double *theta, double *xtwx, double *xtwy,
		    struct mr_ldet *ld, const int p)
{
	int s = w->bstart[b], m = w->blen[b];
	double *W = w->W + w->loff[b], *WX = w->WX + (size_t)s * p;
	const double *X = w->X + (size_t)s * p, *y = w->y + s;

	mr_work_vblock(w, b, theta, W);
	if (chol_inverse(W, m, ld, w->scr))
		return -1;
	for (int a = 0; a < m; a++) {
		double *wx = WX + (size_t)a * p;
		#pragma GCC unroll 8
		for (int j = 0; j < p; j++)
			wx[j] = 0;
		for (int c = 0; c < m; c++) {
			double wac = W[a * m + c];
			const double *x = X + (size_t)c * p;
			#pragma GCC unroll 8
			for (int j = 0; j < p; j++)
				wx[j] += wac * x[j];
		}
		#pragma GCC unroll 8
		for (int i = 0; i < p; i++) {
			xtwy[i] += wx[i] * y[a];
			#pragma GCC unroll 8
			for (int k = i; k < p; k++)
				xtwx[i * p + k] += wx[i] * X[(size_t)a * p + k];
		}
	}
	return 0;
}

/* The entries (i, j) of each E_k, the parameter's pattern over the columns of U: kind k's
 * entries are at ei/ej[at[k] .. at[k + 1]). */
struct pattern {
	int at[MR_MAXK + 1];
	int *ei, *ej;
};

static void patterns(const struct mr_work *w, int c0, int G, struct pattern *pt)
{
	int n = 0;
	for (int k = 0; k < w->nk; k++) {
		pt->at[k] = n;
		switch (w->kind[k]) {
		case MR_K_TAU2: pt->ei[n] = pt->ej[n] = 0; n++; break;
		case MR_K_COV:
			pt->ei[n] = 0; pt->ej[n] = 1; n++;
			pt->ei[n] = 1; pt->ej[n] = 0; n++;
			break;
		case MR_K_SLOPE: pt->ei[n] = pt->ej[n] = 1; n++; break;
		case MR_K_SIGMA2:
			for (int g = 0; g < G; g++, n++)
				pt->ei[n] = pt->ej[n] = c0 + g;
			break;
		}
	}
	pt->at[w->nk] = n;
}

/* For parameters k and l (patterns E_k, E_l over the r columns of U) the block's
 *   tr(W V_k W V_l) = tr(E_k M E_l M),  (V_k q)'W(V_l q) = (U'q)'E_k M E_l (U'q),
 *   tr(C X'W V_l W V_k W X) = tr(E_l M E_k Yt)
 * (M = U'WU, Yt = Y C Y', both symmetric): sums over the entries (i, j) of E_k and (a, c) of
 * E_l of M[j][a] M[c][i], Uq[i] M[j][a] Uq[c] and Yt[j][a] M[c][i]. */
static void pair_sums(const struct pattern *pt, int k, int l, const double *M, const double *Yt,
		      const double *Uq, int r, struct mr_sums *S)
{
	double tww = 0, awa = 0, cd = 0;
	for (int x = pt->at[k]; x < pt->at[k + 1]; x++) {
		int i = pt->ei[x], j = pt->ej[x];
		for (int y = pt->at[l]; y < pt->at[l + 1]; y++) {
			int a = pt->ei[y], c = pt->ej[y];
			double mja = M[j * r + a], mci = M[c * r + i];
			tww += mja * mci;
			awa += Uq[i] * mja * Uq[c];
			cd += Yt[j * r + a] * mci;
		}
	}
	S->trWVWV[k][l] += tww;
	S->aWa[k][l] += awa;
	S->cd[k][l] += cd;
}

/* General pass 2: the block's share of the derivative sums (q already W r). */
MR_INLINE void derivs_p(struct mr_work *w, int b, const double *C, int hess, struct mr_sums *S,
		     const int p)
{
	int s = w->bstart[b], m = w->blen[b], K = w->nk;
	int c0 = 1 + (w->d->slope_col >= 0), G = w->eg ? w->ngrp[b] : 0, r = c0 + G;
	const int *eg = w->eg ? w->eg + s : NULL;
	const double *W = w->W + w->loff[b], *WX = w->WX + (size_t)s * p, *q = w->q + s;
	const double *f = w->f + s;
	double *WU = w->scr, *M = WU + (size_t)r * m, *Y = M + (size_t)r * r, *Uq = Y + (size_t)r * p;
	double *YC = Uq + r, *Yt = YC + (size_t)r * p;
	struct pattern pt = { .ei = w->iscr, .ej = w->iscr + MR_MAXK + 2 + w->mmax };

	/* WU (column c of U times W, stored by column), then M = U'WU, Y = U'WX, U'q: the columns
	 * of U are ones, the slope column and group indicators, so U'z is sums of z's rows. */
	memset(WU, 0, sizeof(double) * ((size_t)r * m + (size_t)r * r + (size_t)r * p + r));
	for (int a = 0; a < m; a++)
		for (int c = 0; c < m; c++) {
			double x = W[a * m + c];
			WU[a] += x;
			if (c0 == 2)
				WU[m + a] += x * f[c];
			if (eg)
				WU[(size_t)(c0 + eg[c]) * m + a] += x;
		}
	for (int a = 0; a < m; a++) {
		int ga = eg ? c0 + eg[a] : -1;
		for (int j = 0; j < r; j++) {
			double x = WU[(size_t)j * m + a];
			M[j] += x;
			if (c0 == 2)
				M[r + j] += f[a] * x;
			if (eg)
				M[ga * r + j] += x;
		}
		#pragma GCC unroll 8
		for (int i = 0; i < p; i++) {
			double x = WX[(size_t)a * p + i];
			Y[i] += x;
			if (c0 == 2)
				Y[p + i] += f[a] * x;
			if (eg)
				Y[(size_t)ga * p + i] += x;
		}
		Uq[0] += q[a];
		if (c0 == 2)
			Uq[1] += f[a] * q[a];
		if (eg)
			Uq[ga] += q[a];
	}
	patterns(w, c0, G, &pt);
	for (int k = 0; k < K; k++) {
		double tr = 0, qq = 0;
		for (int x = pt.at[k]; x < pt.at[k + 1]; x++) {
			const double *yi = Y + pt.ei[x] * p, *yj = Y + pt.ej[x] * p;
			double uj = Uq[pt.ej[x]];
			tr += M[pt.ej[x] * r + pt.ei[x]];
			qq += Uq[pt.ei[x]] * uj;
			#pragma GCC unroll 8
			for (int a = 0; a < p; a++) {
				S->ev[k][a] += yi[a] * uj;
				#pragma GCC unroll 8
				for (int c = a; c < p; c++)
					S->B[k][a * p + c] += yi[a] * yj[c];
			}
		}
		S->trWV[k] += tr;
		S->qVq[k] += qq;
	}
	if (!hess)
		return;
	for (int i = 0; i < r; i++)                       /* Yt = Y C Y' */
		#pragma GCC unroll 8
		for (int a = 0; a < p; a++) {
			double x = 0;
			#pragma GCC unroll 8
			for (int c = 0; c < p; c++)
				x += Y[i * p + c] * C[c * p + a];
			YC[i * p + a] = x;
		}
	for (int i = 0; i < r; i++)
		for (int j = i; j < r; j++) {
			double x = 0;
			#pragma GCC unroll 8
			for (int a = 0; a < p; a++)
				x += YC[i * p + a] * Y[j * p + a];
			Yt[i * r + j] = Yt[j * r + i] = x;
		}
	for (int k = 0; k < K; k++)
		for (int l = 0; l <= k; l++)
			pair_sums(&pt, k, l, M, Yt, Uq, r, S);
}

static int gen_factor(struct mr_work *w, int b, const double *theta, double *xtwx, double *xtwy,
		      struct mr_ldet *ld)
{
	int ret;
	MR_WITH_P(w->p, ret = factor_p(w, b, theta, xtwx, xtwy, ld, P));
	return ret;
}

static void gen_derivs(struct mr_work *w, int b, const double *C, int hess, struct mr_sums *S)
{
	MR_WITH_P(w->p, derivs_p(w, b, C, hess, S, P));
}

static void derivatives(struct mr_work *w, int reml, int hess, struct mr_eval *out);

int mr_work_eval(struct mr_work *w, const double *theta, int reml, int want, struct mr_eval *out)
{
	int p = w->p, K = w->nk, n = w->n_act, closed = w->closed && !w->general;
	double xtwx[MR_MAXP * MR_MAXP] = {0}, xtwy[MR_MAXP] = {0}, ldx = 0;
	struct mr_ldet ld = { 1, 0 };
	static const double log2pi = 1.8378770664093454836;

	for (int k = 0; k < K; k++)
		if (!isfinite(theta[k]))
			return -1;
	struct mr_memo *mo = w->memo;
	if (mo && mo->want >= want && mo->reml == reml && mo->excl == w->excl &&
	    mo->general == w->general && !memcmp(mo->theta, theta, sizeof(double) * K)) {
		*out = mo->ev;
		return 0;
	}
	if (mo)
		mo->want = -1;     /* the buffers are about to change */
	for (int b = 0; b < w->nb; b++) {
		if (b == w->excl)
			continue;
		if (closed ? mr_cs_factor(w, b, theta, xtwx, xtwy, &ld) :
			     gen_factor(w, b, theta, xtwx, xtwy, &ld))
			return -1;
	}
	double logdet = ld.log + log(ld.prod);
	mirror(xtwx, p);
	gsl_matrix_view A = gsl_matrix_view_array(xtwx, p, p);
	if (gsl_linalg_cholesky_decomp1(&A.matrix))
		return -1;
	for (int j = 0; j < p; j++)
		ldx += 2 * log(xtwx[j * p + j]);
	gsl_vector_view bv = gsl_vector_view_array(out->beta, p);
	gsl_vector_const_view rhs = gsl_vector_const_view_array(xtwy, p);
	gsl_linalg_cholesky_solve(&A.matrix, &rhs.vector, &bv.vector);
	gsl_linalg_cholesky_invert(&A.matrix);
	memcpy(out->C, xtwx, sizeof(double) * p * p);

	/* Pass 2: residuals, q = W r, and the pieces of the derivatives. */
	if (want >= MR_WANT_GRAD && !w->S && !(w->S = malloc(sizeof *w->S)))
		return -1;
	struct mr_sums *S = want >= MR_WANT_GRAD ? w->S : NULL;
	int hess = want >= MR_WANT_HESS;
	if (S)
		memset(S, 0, sizeof *S);
	out->rwr = 0;
	for (int b = 0; b < w->nb; b++) {
		if (b == w->excl)
			continue;
		if (closed) {
			mr_cs_derivs(w, b, theta, out->beta, hess, S, &out->rwr);
			continue;
		}
		int s = w->bstart[b], m = w->blen[b];
		const double *Wb = w->W + w->loff[b];
		for (int i = s; i < s + m; i++) {
			double r = w->y[i];
			for (int j = 0; j < p; j++)
				r -= w->X[(size_t)i * p + j] * out->beta[j];
			w->r[i] = r;
		}
		for (int a = 0; a < m; a++) {
			double x = 0;
			for (int c = 0; c < m; c++)
				x += Wb[a * m + c] * w->r[s + c];
			w->q[s + a] = x;
			out->rwr += w->r[s + a] * x;
		}
		if (S)
			gen_derivs(w, b, out->C, hess, S);
	}
	if (reml)
		out->ll = -0.5 * ((n - p) * log2pi + logdet + ldx - w->logdet_xtx + out->rwr);
	else
		out->ll = -0.5 * (n * log2pi + logdet + out->rwr);
	if (S)
		derivatives(w, reml, hess, out);
	if (!mo && !(mo = w->memo = malloc(sizeof *mo)))
		return 0;
	memcpy(mo->theta, theta, sizeof(double) * K);
	mo->reml = reml;
	mo->want = want;
	mo->excl = w->excl;
	mo->general = w->general;
	mo->ev = *out;
	return 0;
}

/* The gradient, observed Hessian and expected information from the block sums (see the top
 * of the file). */
static void derivatives(struct mr_work *w, int reml, int hess, struct mr_eval *out)
{
	int p = w->p, K = w->nk;
	struct mr_sums *S = w->S;

	const double *C = out->C;
	double CB[MR_MAXK][MR_MAXP * MR_MAXP];
	for (int k = 0; k < K; k++) {
		mirror(S->B[k], p);
		for (int i = 0; i < p; i++)
			for (int j = 0; j < p; j++) {
				double x = 0;
				for (int c = 0; c < p; c++)
					x += C[i * p + c] * S->B[k][c * p + j];
				CB[k][i * p + j] = x;
			}
		double tr = 0;
		for (int j = 0; j < p; j++)
			tr += CB[k][j * p + j];
		double trPV = S->trWV[k] - tr;
		out->g[k] = -0.5 * (reml ? trPV : S->trWV[k]) + 0.5 * S->qVq[k];
	}
	if (hess) {
		for (int k = 0; k < K; k++)
			for (int l = 0; l <= k; l++) {
				double f = S->trWVWV[k][l];
				if (reml)
					f += -2 * (S->cd[k][l] + trace_upper(C, S->D[k][l], p)) +
					     trace_prod(CB[k], CB[l], p);
				double ce = 0;
				for (int i = 0; i < p; i++)
					for (int j = 0; j < p; j++)
						ce += S->ev[k][i] * C[i * p + j] * S->ev[l][j];
				double apa = S->aWa[k][l] - ce;
				out->F[k * K + l] = out->F[l * K + k] = 0.5 * f;
				out->H[k * K + l] = out->H[l * K + k] = 0.5 * f - apa;
			}
	}
}
