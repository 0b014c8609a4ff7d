/* The (restricted) log-likelihood of the multilevel model, one study block at a time.
 *
 * With W = V^-1 (block-diagonal), C = (X'WX)^-1, r = y - X b and q = W r = P y, the REML
 * criterion and its derivatives in the natural parameters theta_k (V linear in theta, with
 * basis matrices V_k) are
 *   ll   = -1/2 [(n-p) log 2pi + log|V| + log|X'WX| - log|X'X| + r'Wr]
 *   g_k  = -1/2 tr(P V_k) + 1/2 q'V_k q
 *   F_kl =  1/2 tr(P V_k P V_l),      H_kl = F_kl - (V_k q)' P (V_l q)
 * (ML: drop log|X'WX| - log|X'X|, use n and W in place of P in the traces). P is not
 * block-diagonal, but every term splits into per-block sums plus p x p corrections through C,
 * which is why nothing of size n x n is ever formed. */
#include "mr_lik.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

#include <gsl/gsl_blas.h>
#include <gsl/gsl_linalg.h>

/* Sums over blocks for the derivatives (see the top of the file). */
struct sums {
	double trWV[MR_MAXK], trWVWV[MR_MAXK][MR_MAXK], qVq[MR_MAXK], aWa[MR_MAXK][MR_MAXK];
	double B[MR_MAXK][MR_MAXP * MR_MAXP], D[MR_MAXK][MR_MAXK][MR_MAXP * MR_MAXP];
	double ev[MR_MAXK][MR_MAXP];
};

static double trace_prod(const double *A, const double *B, int p)   /* tr(A B) */
{
	double t = 0;
	for (int i = 0; i < p; i++)
		for (int j = 0; j < p; j++)
			t += A[i * p + j] * B[j * p + i];
	return t;
}

/* Solves L L' x = b in place, L the factor GSL leaves in the lower triangle of a row-major
 * m x m array; b's m entries are st apart (a column of a row-major matrix). Blocks are a few
 * rows square, where the substitution loops cost less than the calls into BLAS. */
static void chol_solve(const double *L, int m, double *b, int st)
{
	for (int i = 0; i < m; i++) {
		double x = b[i * st];
		for (int k = 0; k < i; k++)
			x -= L[i * m + k] * b[k * st];
		b[i * st] = x / L[i * m + i];
	}
	for (int i = m - 1; i >= 0; i--) {
		double x = b[i * st];
		for (int k = i + 1; k < m; k++)
			x -= L[k * m + i] * b[k * st];
		b[i * st] = x / L[i * m + i];
	}
}

/* Pass 1: factor each block (GSL Cholesky), accumulate X'WX, X'Wy and log|V|. */
static int pass_factor(struct mr_work *w, const double *theta, double *xtwx, double *xtwy,
		       double *logdet)
{
	int p = w->p;

	*logdet = 0;
	for (int b = 0; b < w->nb; b++) {
		if (b == w->excl)
			continue;
		int s = w->bstart[b], m = w->blen[b];
		double *L = w->L + w->loff[b], *WX = w->WX + (size_t)s * p;
		const double *X = w->X + (size_t)s * p, *y = w->y + s;
		mr_work_vblock(w, b, theta, L);
		gsl_matrix_view Lv = gsl_matrix_view_array(L, m, m);
		if (gsl_linalg_cholesky_decomp1(&Lv.matrix))
			return -1;
		for (int a = 0; a < m; a++)
			*logdet += 2 * log(L[a * m + a]);
		memcpy(WX, X, sizeof(double) * m * p);
		for (int j = 0; j < p; j++)
			chol_solve(L, m, WX + j, p);
		for (int a = 0; a < m; a++)
			for (int i = 0; i < p; i++) {
				double wx = WX[a * p + i];
				xtwy[i] += wx * y[a];
				for (int j = 0; j < p; j++)
					xtwx[i * p + j] += wx * X[a * p + j];
			}
	}
	return 0;
}

/* The block's share of the derivative sums. The matrices are a few rows square, so the
 * products are plain loops; the factorisation and inverse are GSL's. */
static void block_derivs(struct mr_work *w, int b, int hess, struct sums *S)
{
	int s = w->bstart[b], m = w->blen[b], p = w->p, K = w->nk;
	size_t mm = (size_t)m * m, mp = (size_t)m * p;
	const double *Bas = w->basis + (size_t)K * w->loff[b];
	const double *WX = w->WX + (size_t)s * p, *q = w->q + s;
	double *W = w->scr, *Mk = W + mm, *Gk = Mk + K * mm, *Hk = Gk + K * mp;
	double *uk = Hk + K * mp, *wk = uk + (size_t)K * m;

	memset(W, 0, sizeof(double) * mm);                       /* W = V_b^-1 */
	for (int a = 0; a < m; a++) {
		W[a * m + a] = 1;
		chol_solve(w->L + w->loff[b], m, W + a, m);
	}
	for (int k = 0; k < K; k++) {
		const double *V = Bas + k * mm;
		double *G = Gk + k * mp, *u = uk + (size_t)k * m, *B = S->B[k], t = 0;

		for (size_t i = 0; i < mm; i++)
			t += W[i] * V[i];
		S->trWV[k] += t;
		for (int a = 0; a < m; a++) {                           /* G = V_k W X */
			for (int j = 0; j < p; j++) {
				double x = 0;
				for (int c = 0; c < m; c++)
					x += V[a * m + c] * WX[c * p + j];
				G[a * p + j] = x;
			}
			double x = 0;                                   /* u = V_k q */
			for (int c = 0; c < m; c++)
				x += V[a * m + c] * q[c];
			u[a] = x;
		}
		t = 0;
		for (int a = 0; a < m; a++) {
			t += q[a] * u[a];
			for (int i = 0; i < p; i++) {
				S->ev[k][i] += WX[a * p + i] * u[a];          /* X'W V_k q */
				for (int j = 0; j < p; j++)
					B[i * p + j] += WX[a * p + i] * G[a * p + j];  /* X'W V_k W X */
			}
		}
		S->qVq[k] += t;
		if (!hess)
			continue;
		double *M = Mk + k * mm, *H = Hk + k * mp, *wv = wk + (size_t)k * m;
		for (int a = 0; a < m; a++) {
			for (int c = 0; c < m; c++) {                   /* M = W V_k */
				double x = 0;
				for (int d = 0; d < m; d++)
					x += W[a * m + d] * V[d * m + c];
				M[a * m + c] = x;
			}
			for (int j = 0; j < p; j++) {                   /* H = W V_k W X */
				double x = 0;
				for (int c = 0; c < m; c++)
					x += W[a * m + c] * G[c * p + j];
				H[a * p + j] = x;
			}
			double x = 0;                                   /* W V_k q */
			for (int c = 0; c < m; c++)
				x += W[a * m + c] * u[c];
			wv[a] = x;
		}
		for (int l = 0; l <= k; l++) {
			const double *Ml = Mk + l * mm, *Gl = Gk + l * mp, *ul = uk + (size_t)l * m;
			double *D = S->D[k][l];
			t = 0;
			for (int a = 0; a < m; a++)
				for (int c = 0; c < m; c++)
					t += M[a * m + c] * Ml[c * m + a];
			S->trWVWV[k][l] += t;
			t = 0;
			for (int a = 0; a < m; a++) {
				t += ul[a] * wv[a];
				for (int i = 0; i < p; i++)             /* X'W V_l W V_k W X */
					for (int j = 0; j < p; j++)
						D[i * p + j] += Gl[a * p + i] * H[a * p + j];
			}
			S->aWa[k][l] += t;
		}
	}
}

int mr_work_eval(struct mr_work *w, const double *theta, int reml, int want, struct mr_eval *out)
{
	int p = w->p, K = w->nk, n = w->n_act;
	double xtwx[MR_MAXP * MR_MAXP] = {0}, xtwy[MR_MAXP] = {0}, logdet, ldx = 0;
	static const double log2pi = 1.8378770664093454836;

	for (int k = 0; k < K; k++)
		if (!isfinite(theta[k]))
			return -1;
	if (pass_factor(w, theta, xtwx, xtwy, &logdet))
		return -1;
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
	struct sums *S = want >= MR_WANT_GRAD ? w->S : NULL;
	if (S)
		memset(S, 0, sizeof *S);
	out->rwr = 0;
	for (int b = 0; b < w->nb; b++) {
		if (b == w->excl)
			continue;
		int s = w->bstart[b], m = w->blen[b];
		for (int i = s; i < s + m; i++) {
			double r = w->y[i];
			for (int j = 0; j < p; j++)
				r -= w->X[(size_t)i * p + j] * out->beta[j];
			w->r[i] = w->q[i] = r;
		}
		chol_solve(w->L + w->loff[b], m, w->q + s, 1);
		for (int i = s; i < s + m; i++)
			out->rwr += w->r[i] * w->q[i];
		if (S)
			block_derivs(w, b, want >= MR_WANT_HESS, S);
	}
	if (reml)
		out->ll = -0.5 * ((n - p) * log2pi + logdet + ldx - w->logdet_xtx + out->rwr);
	else
		out->ll = -0.5 * (n * log2pi + logdet + out->rwr);
	if (!S)
		return 0;

	const double *C = out->C;
	double CB[MR_MAXK][MR_MAXP * MR_MAXP];
	for (int k = 0; k < K; k++) {
		gsl_matrix_const_view Cv = gsl_matrix_const_view_array(C, p, p);
		gsl_matrix_const_view Bv = gsl_matrix_const_view_array(S->B[k], p, p);
		gsl_matrix_view CBv = gsl_matrix_view_array(CB[k], p, p);
		gsl_blas_dgemm(CblasNoTrans, CblasNoTrans, 1, &Cv.matrix, &Bv.matrix, 0, &CBv.matrix);
		double trPV = S->trWV[k], tr = 0;
		for (int j = 0; j < p; j++)
			tr += CB[k][j * p + j];
		trPV -= tr;
		out->g[k] = -0.5 * (reml ? trPV : S->trWV[k]) + 0.5 * S->qVq[k];
	}
	if (want >= MR_WANT_HESS) {
		for (int k = 0; k < K; k++)
			for (int l = 0; l <= k; l++) {
				double f = S->trWVWV[k][l];
				if (reml)
					f += -2 * trace_prod(C, S->D[k][l], p) + trace_prod(CB[k], CB[l], p);
				double ce = 0;
				for (int i = 0; i < p; i++)
					for (int j = 0; j < p; j++)
						ce += S->ev[k][i] * C[i * p + j] * S->ev[l][j];
				double apa = S->aWa[k][l] - ce;
				out->F[k * K + l] = out->F[l * K + k] = 0.5 * f;
				out->H[k * K + l] = out->H[l * K + k] = 0.5 * f - apa;
			}
	}
	return 0;
}

