/* Closed-form likelihood pieces for a study block of the intercept models.
 *
 * Without random slopes a block's covariance is V = tau2 ee' + B with B = D + sigma2 A, where
 * D = diag(v), e the vector of ones and A = sum_g 1_g 1_g' over the block's effect-level groups g
 * (sigma2 = 0 without that level). Two Sherman-Morrison steps invert it without factoring:
 *   B^-1 = D^-1 - sum_g c_g (D^-1 1_g)(D^-1 1_g)',  c_g = sigma2 / den_g,  den_g = 1 + sigma2 s_g,
 *   W = V^-1 = B^-1 - kappa a a',  a = B^-1 e,  kappa = tau2 / den,  den = 1 + tau2 S,
 *   log|V| = sum log v + sum_g log den_g + log den,
 * with s_g = 1_g'D^-1 1_g, t_g = 1_g'B^-1 1_g = s_g / den_g and S = e'B^-1 e = sum_g t_g. V is
 * positive definite exactly when every den_g and den is positive (matrix determinant lemma).
 * A row alone in its group has B^-1 = 1/(v + sigma2) = a on the diagonal and t_g = a.
 * (Sherman & Morrison 1950; the nested form as in Searle, Casella & McCulloch 1992, ch. 6.)
 *
 * The derivative matrices are V_tau2 = ee' and V_sigma2 = sum_g 1_g 1_g', so every sum in
 * mr_lik.c reduces to the small matrix M = U'WU for U = [e, 1_1 .. 1_G]:
 *   e'We = lambda S,  e'W 1_g = lambda t_g,  1_g'W 1_h = [g = h] t_g - kappa t_g t_h,
 * lambda = 1 / den, and to the p-vectors e'WX = lambda a'X and u_g = 1_g'WX = a_g'X - kappa t_g a'X
 * (a_g: a on the rows of group g). A block costs O(m p^2) and never forms an m x m matrix.
 *
 * Pass 1 keeps each block's coefficients (a per row; t_g and 1/den_g per group, stored at the
 * block's first rows; S, kappa, lambda and a'X per block) for pass 2. The kernels take the
 * number of columns p as a constant for the usual sizes, so their short loops unroll. */
#include "mr_lik.h"

#include <string.h>

/* The upper triangle of M += s x z'. */
MR_INLINE void outer_add(double *M, const int p, double s, const double *x, const double *z)
{
	#pragma GCC unroll 8
	for (int i = 0; i < p; i++) {
		double xi = s * x[i];
		#pragma GCC unroll 8
		for (int k = i; k < p; k++)
			M[i * p + k] += xi * z[k];
	}
}

MR_INLINE int factor_p(struct mr_work *w, int b, const double *theta, double *xtwx, double *xtwy,
		    struct mr_ldet *ld, const int p)
{
	int s = w->bstart[b], m = w->blen[b], G = w->eg ? w->ngrp[b] : 0, multi = w->bmulti[b];
	const int *eg = w->eg ? w->eg + s : NULL, *gs = w->gsize + s;
	const double *X = w->X + (size_t)s * p, *y = w->y + s, *iv = w->iv + s;
	double *a = w->ca + s, *t = w->ct + s, *id = w->cid + s, *cb = w->cb + 3 * b;
	double *aX = w->caX + (size_t)b * p, tau2 = theta[0], sig2 = eg ? theta[1] : 0;
	double S = 0, ay = 0;

	if (!eg) {
		for (int j = 0; j < m; j++) {
			a[j] = iv[j];
			S += iv[j];
		}
	} else {
		for (int g = 0; g < G; g++)
			t[g] = 0;
		for (int j = 0; j < m; j++)
			t[eg[j]] += iv[j];
		for (int g = 0; g < G; g++) {
			double den = 1 + sig2 * t[g];
			if (!(den > 0))
				return -1;
			mr_ldet_mul(ld, den);
			id[g] = 1 / den;
			t[g] *= id[g];
			S += t[g];
		}
		for (int j = 0; j < m; j++)
			a[j] = iv[j] * id[eg[j]];
	}
	double den = 1 + tau2 * S;
	if (!(den > 0))
		return -1;
	mr_ldet_mul(ld, den);
	ld->log += w->logv[b];
	cb[0] = S;
	cb[2] = 1 / den;
	cb[1] = tau2 * cb[2];
	#pragma GCC unroll 8
	for (int i = 0; i < p; i++)
		aX[i] = 0;
	/* X'B^-1 X: rows alone in their group take a; the rows of larger groups take 1/v and
	 * the group's rank-one term below. */
	for (int j = 0; j < m; j++) {
		const double *x = X + (size_t)j * p;
		double om = multi && gs[eg[j]] > 1 ? iv[j] : a[j];
		#pragma GCC unroll 8
		for (int i = 0; i < p; i++) {
			double wx = om * x[i];
			xtwy[i] += wx * y[j];
			#pragma GCC unroll 8
			for (int k = i; k < p; k++)
				xtwx[i * p + k] += wx * x[k];
			aX[i] += a[j] * x[i];
		}
		ay += a[j] * y[j];
	}
	if (multi) {
		double *dx = w->scr, *dy = dx + (size_t)G * p;
		memset(dx, 0, sizeof(double) * G * (p + 1));
		for (int j = 0; j < m; j++) {
			int g = eg[j];
			#pragma GCC unroll 8
			for (int i = 0; i < p; i++)
				dx[g * p + i] += iv[j] * X[(size_t)j * p + i];
			dy[g] += iv[j] * y[j];
		}
		for (int g = 0; g < G; g++) {
			if (gs[g] < 2)
				continue;
			double cg = sig2 * id[g];
			outer_add(xtwx, p, -cg, dx + g * p, dx + g * p);
			#pragma GCC unroll 8
			for (int i = 0; i < p; i++)
				xtwy[i] -= cg * dx[g * p + i] * dy[g];
		}
	}
	outer_add(xtwx, p, -cb[1], aX, aX);
	#pragma GCC unroll 8
	for (int i = 0; i < p; i++)
		xtwy[i] -= cb[1] * aX[i] * ay;
	return 0;
}

/* One effect group's share of the sigma2 sums: t_g, Q_g = 1_g'Wr, u_g = 1_g'WX. */
struct gsum {
	double st, st2, st3, tQ, tQ2, Q2;
	double tu[MR_MAXP];
};

MR_INLINE void add_group(struct mr_sums *S, int hess, double tg, double Q, const double *u,
		      struct gsum *a, const int p)
{
	a->st += tg;
	a->st2 += tg * tg;
	a->st3 += tg * tg * tg;
	a->tQ += tg * Q;
	a->tQ2 += tg * Q * Q;
	a->Q2 += Q * Q;
	outer_add(S->B[1], p, 1, u, u);
	#pragma GCC unroll 8
	for (int i = 0; i < p; i++)
		S->ev[1][i] += Q * u[i];
	if (hess) {
		outer_add(S->D[1][1], p, tg, u, u);
		#pragma GCC unroll 8
		for (int i = 0; i < p; i++)
			a->tu[i] += tg * u[i];
	}
}

MR_INLINE void derivs_p(struct mr_work *w, int b, const double *theta, const double *beta,
		     int hess, struct mr_sums *S, double *rwr, const int p)
{
	int s = w->bstart[b], m = w->blen[b], G = w->eg ? w->ngrp[b] : 0, multi = w->bmulti[b];
	const int *eg = w->eg ? w->eg + s : NULL, *gs = w->gsize + s;
	const double *X = w->X + (size_t)s * p, *y = w->y + s, *iv = w->iv + s;
	const double *a = w->ca + s, *t = w->ct + s, *id = w->cid + s, *cb = w->cb + 3 * b;
	const double *aX = w->caX + (size_t)b * p;
	double kappa = cb[1], L = cb[2], ar = 0, *r = w->r + s, *q = w->q + s;

	for (int j = 0; j < m; j++) {
		const double *x = X + (size_t)j * p;
		double rj = y[j];
		#pragma GCC unroll 8
		for (int i = 0; i < p; i++)
			rj -= x[i] * beta[i];
		r[j] = rj;
		ar += a[j] * rj;
		q[j] = a[j] * rj;             /* B^-1 r for a row alone in its group */
	}
	if (multi) {                          /* rows of larger groups: D^-1 (r - c_g 1_g 1_g'D^-1 r) */
		double *dr = w->scr, sig2 = theta[1];
		memset(dr, 0, sizeof(double) * G);
		for (int j = 0; j < m; j++)
			dr[eg[j]] += iv[j] * r[j];
		for (int j = 0; j < m; j++)
			if (gs[eg[j]] > 1)
				q[j] = iv[j] * (r[j] - sig2 * id[eg[j]] * dr[eg[j]]);
	}
	for (int j = 0; j < m; j++) {
		q[j] -= kappa * a[j] * ar;
		*rwr += r[j] * q[j];
	}
	if (!S)
		return;

	/* tau2: U = e, e'Wr = lambda a'r, e'WX = lambda a'X, e'We = lambda S */
	double Qe = L * ar, lS = L * cb[0];
	S->trWV[0] += lS;
	S->qVq[0] += Qe * Qe;
	outer_add(S->B[0], p, L * L, aX, aX);
	#pragma GCC unroll 8
	for (int i = 0; i < p; i++)
		S->ev[0][i] += L * Qe * aX[i];
	if (hess) {
		S->trWVWV[0][0] += lS * lS;
		S->aWa[0][0] += Qe * Qe * lS;
		outer_add(S->D[0][0], p, L * L * lS, aX, aX);
	}
	if (!eg)
		return;

	/* sigma2: U = [1_g], 1_g'Wr = Q_g, 1_g'WX = u_g, M_gh = [g = h] t_g - kappa t_g t_h */
	struct gsum gsum = {0};
	if (!multi) {
		for (int j = 0; j < m; j++) {          /* each row its own group: t_g = a */
			const double *x = X + (size_t)j * p;
			double u[MR_MAXP];
			#pragma GCC unroll 8
			for (int i = 0; i < p; i++)
				u[i] = a[j] * (x[i] - kappa * aX[i]);
			add_group(S, hess, a[j], q[j], u, &gsum, p);
		}
	} else {
		double *Q = w->scr, *u = Q + G;
		memset(Q, 0, sizeof(double) * G * (p + 1));
		for (int j = 0; j < m; j++) {
			Q[eg[j]] += q[j];
			#pragma GCC unroll 8
			for (int i = 0; i < p; i++)
				u[eg[j] * p + i] += a[j] * X[(size_t)j * p + i];
		}
		for (int g = 0; g < G; g++) {
			double *ug = u + g * p;
			#pragma GCC unroll 8
			for (int i = 0; i < p; i++)
				ug[i] -= kappa * t[g] * aX[i];
			add_group(S, hess, t[g], Q[g], ug, &gsum, p);
		}
	}
	S->trWV[1] += gsum.st - kappa * gsum.st2;
	S->qVq[1] += gsum.Q2;
	if (hess) {
		S->trWVWV[1][0] += L * L * gsum.st2;
		S->trWVWV[1][1] += gsum.st2 - 2 * kappa * gsum.st3 + kappa * kappa * gsum.st2 * gsum.st2;
		S->aWa[1][0] += L * Qe * gsum.tQ;
		S->aWa[1][1] += gsum.tQ2 - kappa * gsum.tQ * gsum.tQ;
		/* X'W V_tau2 W V_sigma2 W X = lambda^2 aX tu', symmetrised: only tr(C .) is used */
		outer_add(S->D[1][0], p, L * L / 2, aX, gsum.tu);
		outer_add(S->D[1][0], p, L * L / 2, gsum.tu, aX);
		outer_add(S->D[1][1], p, -kappa, gsum.tu, gsum.tu);
	}
}

int mr_cs_factor(struct mr_work *w, int b, const double *theta, double *xtwx, double *xtwy,
		 struct mr_ldet *ld)
{
	int ret;
	MR_WITH_P(w->p, ret = factor_p(w, b, theta, xtwx, xtwy, ld, P));
	return ret;
}

void mr_cs_derivs(struct mr_work *w, int b, const double *theta, const double *beta, int hess,
		  struct mr_sums *S, double *rwr)
{
	MR_WITH_P(w->p, derivs_p(w, b, theta, beta, hess, S, rwr, P));
}
