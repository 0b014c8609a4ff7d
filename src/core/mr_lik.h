/* Internal to the meta-regression module: the data grouped into study blocks (mr_work.c),
 * the (restricted) log-likelihood over them with its gradient, observed Hessian and expected
 * information in the natural variance parameters (mr_lik.c), and the optimiser (mr_opt.c).
 * Not for use outside src/core/mr_*.c and metareg.c. */
#ifndef SD_MR_LIK_H
#define SD_MR_LIK_H

#include "metareg.h"

struct sums;   /* mr_lik.c */

enum mr_kind { MR_K_TAU2, MR_K_COV, MR_K_SLOPE, MR_K_SIGMA2 };

/* The data grouped by study (mr_work.c) and the per-evaluation buffers (mr_lik.c). */
struct mr_work {
	const struct mr_data *d;
	int n, p, nb, nk, mmax;
	enum mr_kind kind[MR_MAXK];
	int *order;                 /* ordered row -> data row */
	int *bstart, *blen, *bid, *loff;
	double *y, *v, *X, *f;      /* copies in block order */
	int *eg;                    /* local effect group per ordered row, NULL without that level */
	double *L, *WX, *r, *q;     /* Cholesky factors per block, W X, residuals, W r */
	struct sums *S;             /* derivative sums, reused by every evaluation */
	double *basis;              /* per block, the K matrices dV/dtheta_k (m x m each) */
	double *scr;                /* per-block scratch */
	int excl, n_act;
	double logdet_xtx, vscale, fscale;
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
/* Evaluates at theta (which must give a positive-definite V); -1 when it does not. */
int mr_work_eval(struct mr_work *w, const double *theta, int reml, int want, struct mr_eval *out);
/* Block b: its study id, length, and a pointer to its first row's index into the data. */
int mr_work_block(const struct mr_work *w, int b, int *id, const int **rows);
/* Fills the m x m marginal covariance of block b at theta (row-major). */
void mr_work_vblock(const struct mr_work *w, int b, const double *theta, double *V);
/* Block b after the last evaluation: rows in block order of y, v, the slope column f, X (m x p)
 * and W X, the Cholesky factor of V_b (m x m, GSL layout: L in the lower triangle) and
 * q = V_b^-1 (y - X b). */
struct mr_blockview {
	int m, id;
	const double *y, *v, *f, *X, *WX, *L, *q;
};
void mr_work_view(const struct mr_work *w, int b, struct mr_blockview *out);

/* Convergence of one optimisation. */
struct mr_conv {
	int converged, iter_bfgs, iter_newton;
	int starts;              /* extra Newton starts tried (boundaries, grid of scales) */
	double decrement, loglik;
	int zero[MR_MAXK];       /* variance k estimated on its boundary, exactly 0 */
	int rho_bound;           /* slope correlation exactly +-1 (G of rank 1) */
};
/* Maximises the (restricted) likelihood over theta, in place (theta holds the start). With
 * warm set, Newton steps start from theta directly (falling back to the full search when they
 * fail). Returns -1 only when the likelihood cannot be evaluated at all; a fit that
 * did not converge returns 0 with c->converged 0. */
int mr_optimise(struct mr_work *w, int reml, int max_iter, int warm, double *theta,
		struct mr_conv *c, struct sd_err *e);
/* A starting point: a moment estimate of the total heterogeneity split between the levels. */
void mr_start(struct mr_work *w, double *theta);

#endif
