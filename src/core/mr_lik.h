/* Internal to the meta-regression module: the data grouped into study blocks (mr_work.c),
 * the (restricted) log-likelihood over them with its gradient, observed Hessian and expected
 * information in the natural variance parameters (mr_lik.c), and the optimiser (mr_opt.c).
 * Not for use outside src/core/mr_*.c and metareg.c. */
#ifndef SD_MR_LIK_H
#define SD_MR_LIK_H

#include <math.h>

#include "metareg.h"

/* For the per-block kernels: inlined with constant sizes, so their short loops unroll. */
#define MR_INLINE static inline __attribute__((always_inline))
/* Runs STMT with P the column count p: a compile-time constant for p <= 6, p itself beyond. */
#define MR_WITH_P(p, STMT) do {                                                       \
	switch (p) {                                                                  \
	case 1: { enum { P = 1 }; STMT; } break;                                      \
	case 2: { enum { P = 2 }; STMT; } break;                                      \
	case 3: { enum { P = 3 }; STMT; } break;                                      \
	case 4: { enum { P = 4 }; STMT; } break;                                      \
	case 5: { enum { P = 5 }; STMT; } break;                                      \
	case 6: { enum { P = 6 }; STMT; } break;                                      \
	default: { const int P = (p); STMT; } break;                                  \
	}                                                                             \
} while (0)

enum mr_kind { MR_K_TAU2, MR_K_COV, MR_K_SLOPE, MR_K_SIGMA2 };

/* The data grouped by study (mr_work.c) and the per-evaluation buffers (mr_lik.c). */
struct mr_work {
	const struct mr_data *d;
	int n, p, nb, nk, mmax;
	enum mr_kind kind[MR_MAXK];
	int *order;                 /* ordered row -> data row */
	int *bstart, *blen, *bid, *loff;
	int *ngrp;                  /* effect-level groups per block (1 per row without that level) */
	int *eg;                    /* local effect group per ordered row, NULL without that level */
	int *gsize;                 /* rows of local group g of the block starting at s, at s + g */
	int *bmulti;                /* per block: some effect group has two or more rows */
	double *logv;               /* per block, sum of log v over its rows */
	double *y, *v, *iv, *X, *f; /* copies in block order; iv = 1/v */
	double *W, *WX, *r, *q;     /* general path: V_b^-1 per block and W X; residuals, W r */
	double *ca, *ct, *cid, *cb, *caX;  /* closed form's coefficients from pass 1 (mr_cs.c) */
	struct mr_sums *S;          /* derivative sums, reused by every evaluation */
	double *scr;                /* per-block scratch */
	int *iscr;                  /* per-block integer scratch (the general path's patterns) */
	int closed;                 /* 1: intercept-only blocks, evaluated in closed form */
	int general;                /* 1: use the general (Cholesky) path even when closed applies */
	int excl, n_act;
	double logdet_xtx, vscale, fscale;
	struct mr_memo *memo;       /* the last evaluation, returned again for the same request */
};

struct mr_eval {
	double ll;
	double g[MR_MAXK];                 /* d ll / d theta */
	double H[MR_MAXK * MR_MAXK];       /* observed second derivatives */
	double F[MR_MAXK * MR_MAXK];       /* expected information */
	double beta[MR_MAXP];
	double C[MR_MAXP * MR_MAXP];       /* (X'V^-1 X)^-1 */
	double rwr;                        /* r'V^-1 r */
};

enum { MR_WANT_LL, MR_WANT_GRAD, MR_WANT_HESS };

/* The key and result of the last successful evaluation. */
struct mr_memo {
	double theta[MR_MAXK];
	int reml, want, excl, general;
	struct mr_eval ev;
};

/* Sums over blocks for the derivatives (see mr_lik.c), with W = V^-1, V_k = dV/dtheta_k,
 * q = W r and C = (X'WX)^-1: trWV = tr(W V_k), qVq = q'V_k q, B = X'W V_k W X, ev = X'W V_k q,
 * and for l <= k trWVWV = tr(W V_k W V_l), aWa = (V_k q)'W (V_l q), and
 * tr(C X'W V_l W V_k W X) = cd + tr(C D) (the general path sums the scalar cd block by block,
 * the closed form the matrix D). B and D hold their upper triangles only. */
struct mr_sums {
	double trWV[MR_MAXK], qVq[MR_MAXK], trWVWV[MR_MAXK][MR_MAXK], aWa[MR_MAXK][MR_MAXK];
	double cd[MR_MAXK][MR_MAXK];
	double B[MR_MAXK][MR_MAXP * MR_MAXP], D[MR_MAXK][MR_MAXK][MR_MAXP * MR_MAXP];
	double ev[MR_MAXK][MR_MAXP];
};

/* log|V| as a running product of factors, with a log taken only when the product leaves a
 * safe range: one log per many blocks instead of one per pivot. */
struct mr_ldet {
	double prod, log;
};
static inline void mr_ldet_mul(struct mr_ldet *l, double x)
{
	if (!(x > 1e-100 && x < 1e100)) {
		l->log += log(x);
		return;
	}
	l->prod *= x;
	if (l->prod > 1e150 || l->prod < 1e-150) {
		l->log += log(l->prod);
		l->prod = 1;
	}
}

/* Groups the data by study and checks it (variances, levels, rank); NULL on failure. */
struct mr_work *mr_work_new(const struct mr_data *d, struct sd_err *e);
void mr_work_free(struct mr_work *w);
/* Number of variance parameters and the kind of parameter k. */
int mr_work_nvc(const struct mr_work *w);
enum mr_kind mr_work_kind(const struct mr_work *w, int k);
/* Studies (blocks, sorted by id) and columns of X. */
int mr_work_nblock(const struct mr_work *w);
int mr_work_p(const struct mr_work *w);
/* Mean sampling variance of the blocks in use: the scale of the variance parameters. */
double mr_work_vscale(const struct mr_work *w);
/* Mean square of the slope column over the blocks in use (0 without random slopes). */
double mr_work_fscale(const struct mr_work *w);
/* Leaves block b out of every later evaluation (-1: use all); fails if the rest cannot be
 * fitted (fewer than 2 studies or a rank-deficient design). */
int mr_work_exclude(struct mr_work *w, int b, struct sd_err *e);
/* Evaluates at theta (which must give a positive-definite V); -1 when it does not. The same
 * request as the last (same theta and settings, no more derivatives) returns the same result
 * without recomputing; the buffers (W, q, ...) then also still belong to it. Blocks of
 * the intercept models (no random slopes) are evaluated in closed form (mr_cs.c) unless
 * w->general is set; every other block by a small Cholesky factorisation (mr_lik.c). */
int mr_work_eval(struct mr_work *w, const double *theta, int reml, int want, struct mr_eval *out);
/* Block b: its study id, length, and a pointer to its first row's index into the data. */
int mr_work_block(const struct mr_work *w, int b, int *id, const int **rows);
/* Closed form for a block of an intercept model, V_b = tau2 11' + sigma2 A + diag(v)
 * (mr_cs.c). Pass 1 adds the block's X'WX (upper triangle), X'Wy and log|V_b| factors; -1 when
 * V_b is not positive definite. */
int mr_cs_factor(struct mr_work *w, int b, const double *theta, double *xtwx, double *xtwy,
		 struct mr_ldet *ld);
/* Pass 2 at the estimate beta: adds r'Wr and, with S, the block's derivative sums. */
void mr_cs_derivs(struct mr_work *w, int b, const double *theta, const double *beta, int hess,
		  struct mr_sums *S, double *rwr);
/* Fills the m x m marginal covariance of block b at theta (row-major). */
void mr_work_vblock(const struct mr_work *w, int b, const double *theta, double *V);
/* Block b after the last evaluation on the general path (w->general set): rows in block order
 * of y, v, the slope column f, X (m x p) and W X, W = V_b^-1 (m x m, row-major) and
 * q = V_b^-1 (y - X b). */
struct mr_blockview {
	int m, id;
	const double *y, *v, *f, *X, *WX, *W, *q;
};
void mr_work_view(const struct mr_work *w, int b, struct mr_blockview *out);

/* Convergence of one optimisation. */
struct mr_conv {
	int converged, iter_bfgs, iter_newton;
	int starts;              /* extra Newton starts tried (boundaries, grid of scales) */
	double decrement, loglik;
	int zero[MR_MAXK];       /* variance k estimated on its boundary, exactly 0 */
	int rho_bound;           /* slope correlation exactly +-1 (G of rank 1) */
	int flat;                /* curvature at the maximum flat or not negative definite */
	double drop[MR_MAXK];    /* quadratic model's log-likelihood drop to variance k's boundary */
};
/* Maximises the (restricted) likelihood over theta, in place (theta holds the start): Newton
 * steps, with a quasi-Newton search first only when they do not converge, and extra starts
 * when the result gives a reason (mr_opt.c). With warm set, no extra starts unless the Newton
 * steps fail. Returns -1 only when the likelihood cannot be evaluated at all; a fit that
 * did not converge returns 0 with c->converged 0. */
int mr_optimise(struct mr_work *w, int reml, int max_iter, int warm, double *theta,
		struct mr_conv *c, struct sd_err *e);
/* A starting point: method-of-moments estimates of each variance (mr_start.c). */
void mr_start(struct mr_work *w, double *theta);

#endif
