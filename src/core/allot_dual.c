#include "allot_dual.h"

#include <math.h>
#include <string.h>

#include <gsl/gsl_errno.h>
#include <gsl/gsl_linalg.h>
#include <gsl/gsl_matrix.h>

#define MAXD (SD_NMUSCLES + 1)
#define TOL 1e-9

double allot_gain_value(const struct allot_gain *g, int m, double F)
{
	return g->weight[m] * g->coef * (form_f(g->form, F) - form_f(g->form, 0));
}

double allot_gain_slope(const struct allot_gain *g, int m, double F)
{
	return g->weight[m] * g->coef * form_df(g->form, F);
}

/* The maximiser of v_m(F) - mu F over [lo, hi] and its derivative in mu. The slope v_m' is
 * k/(F+1)^2, k/(F+1), k/(2 sqrt F) or k for the four forms, so the stationary point has a
 * closed form; with a linear (or zero) slope the maximiser jumps between the two limits. */
static double fstar(const struct allot_gain *g, int m, double mu, double *dfdmu)
{
	double k = fabs(g->weight[m] * g->coef), lo = g->lo[m], hi = g->hi[m], F, d;

	*dfdmu = 0;
	if (k <= 0 || g->form == SD_FORM_LINEAR)
		return mu < k ? hi : lo;
	if (mu <= 0)
		return hi;
	switch (g->form) {
	case SD_FORM_RECIPROCAL:
		F = sqrt(k / mu) - 1;
		d = -0.5 * sqrt(k) / (mu * sqrt(mu));
		break;
	case SD_FORM_LOG:
		F = k / mu - 1;
		d = -k / (mu * mu);
		break;
	default: /* sqrt */
		F = (k / (2 * mu)) * (k / (2 * mu));
		d = -k * k / (2 * mu * mu * mu);
		break;
	}
	if (F <= lo)
		return lo;
	if (F >= hi)
		return hi;
	*dfdmu = d;
	return F;
}

/* Muscles whose v_m is linear (a zero priority, or the linear form) have a dual term with a
 * kink and no curvature: max((k - mu) lo, (k - mu) hi). Newton steps blow up there, so the
 * barrier's smooth model replaces it by tau log(e^(l1/tau) + e^(l2/tau)), above it by at most
 * tau ln 2, with tau = 1/s shrinking along the path. Only the multipliers come from the
 * model: the bound is always the exact term at them. */
static int flat(const struct allot_gain *g, int m)
{
	return g->form == SD_FORM_LINEAR || !(fabs(g->weight[m] * g->coef) > 0);
}

static double smooth_flat(const struct allot_gain *g, int m, double mu, double F0, double s,
			  double *grad, double *hess)
{
	double k = fabs(g->weight[m] * g->coef), lo = g->lo[m], hi = g->hi[m];
	double l1 = (k - mu) * lo, l2 = (k - mu) * hi, top = fmax(l1, l2);
	double e1 = exp(s * (l1 - top)), e2 = exp(s * (l2 - top)), p = e1 / (e1 + e2);
	double F = p * lo + (1 - p) * hi;
	if (grad)
		*grad = -(F - F0);
	if (hess)
		*hess = s * (hi - lo) * (hi - lo) * p * (1 - p);
	return top + log(e1 + e2) / s + mu * F0;
}

/* One node of the problem: which muscles the free columns reach (only those keep a
 * multiplier), and the exact value of the others, whose loads are fixed. */
struct node {
	const struct allot_gain *g;
	const double *F0;
	int R;
	const struct allot_col *cols;
	const int *fc;
	int nfree;
	int d;                      /* active muscles */
	int nflat;                  /* of which flat (see flat()) */
	int mi[SD_NMUSCLES];        /* active index -> muscle */
	int pos[SD_NMUSCLES];       /* muscle -> active index, -1 if inactive */
	double base;                /* sum of v_m(F0_m) over inactive muscles */
	int infeasible;
};

static void node_setup(struct node *nd, const struct allot_gain *g, const double *F0, int R,
		       const struct allot_col *cols, const int *fc, int nfree)
{
	nd->g = g;
	nd->F0 = F0;
	nd->R = R;
	nd->cols = cols;
	nd->fc = fc;
	nd->nfree = R > 0 ? nfree : 0;
	nd->d = 0;
	nd->nflat = 0;
	nd->base = 0;
	nd->infeasible = 0;
	for (int m = 0; m < SD_NMUSCLES; m++)
		nd->pos[m] = -1;
	for (int i = 0; i < nd->nfree; i++) {
		const struct allot_col *c = &cols[fc[i]];
		for (int k = 0; k < c->nm; k++)
			if (nd->pos[c->m[k]] < 0) {
				nd->pos[c->m[k]] = nd->d;
				nd->mi[nd->d++] = c->m[k];
				nd->nflat += flat(g, c->m[k]);
			}
	}
	for (int m = 0; m < SD_NMUSCLES; m++) {
		if (nd->pos[m] >= 0)
			continue;
		if (F0[m] < g->lo[m] - TOL || F0[m] > g->hi[m] + TOL)
			nd->infeasible = 1;
		nd->base += allot_gain_value(g, m, F0[m]);
	}
}

/* Column j's reduced price sum_m a_jm mu_m, with mu given per active index. */
static double price(const struct node *nd, const struct allot_col *c, const double *x)
{
	double s = 0;
	for (int k = 0; k < c->nm; k++)
		s += c->a[k] * x[nd->pos[c->m[k]]];
	return s;
}

static double cmax(const struct node *nd, const double *x)
{
	double best = -HUGE_VAL;
	for (int i = 0; i < nd->nfree; i++) {
		double c = price(nd, &nd->cols[nd->fc[i]], x);
		if (c > best)
			best = c;
	}
	return best;
}

/* The separable part: sum over active muscles of max_F [v(F) - mu (F - F0)], flat muscles
 * smoothed at temperature 1/s. */
static double sep_part(const struct node *nd, const double *x, double s, double *grad,
		       double *hess)
{
	double sum = 0;
	for (int p = 0; p < nd->d; p++) {
		int m = nd->mi[p];
		if (flat(nd->g, m)) {
			sum += smooth_flat(nd->g, m, x[p], nd->F0[m], s, grad ? grad + p : NULL,
					   hess ? hess + p : NULL);
			continue;
		}
		double dF, F = fstar(nd->g, m, x[p], &dF);
		sum += allot_gain_value(nd->g, m, F) - x[p] * (F - nd->F0[m]);
		if (grad)
			grad[p] = -(F - nd->F0[m]);
		if (hess)
			hess[p] = -dF;
	}
	return sum;
}

/* max over lattice points F in [lo, hi] of v(F) - mu F: v is concave, so the best point is
 * one of the two around the continuous maximiser. */
static double lattice_part(const struct node *nd, const double *x)
{
	double sum = 0;
	for (int p = 0; p < nd->d; p++) {
		int m = nd->mi[p];
		double dF, F = fstar(nd->g, m, x[p], &dF), h = nd->g->step[m], best;
		if (h > 0) {
			double klo = ceil(nd->g->lo[m] / h - TOL), khi = floor(nd->g->hi[m] / h + TOL);
			double k = floor(F / h + TOL);
			best = -HUGE_VAL;
			for (double q = k; q <= k + 1; q++) {
				double kk = q < klo ? klo : q > khi ? khi : q, v;
				v = allot_gain_value(nd->g, m, kk * h) - x[p] * kk * h;
				if (v > best)
					best = v;
			}
			if (klo <= khi) {
				sum += best + x[p] * nd->F0[m];
				continue;
			}
		}
		sum += allot_gain_value(nd->g, m, F) - x[p] * (F - nd->F0[m]);
	}
	return sum;
}

static double node_eval(const struct node *nd, const double *x)
{
	if (nd->infeasible)
		return -HUGE_VAL;
	double c = nd->nfree ? cmax(nd, x) : 0;
	return nd->base + lattice_part(nd, x) + nd->R * (c > 0 ? c : 0);
}

double allot_dual_eval(const struct allot_gain *g, const double *F0, int R,
		       const struct allot_col *cols, const int *fc, int nfree, const double *mu)
{
	struct node nd;
	double x[MAXD];

	node_setup(&nd, g, F0, R, cols, fc, nfree);
	for (int p = 0; p < nd.d; p++)
		x[p] = mu[nd.mi[p]];
	return node_eval(&nd, x);
}

/* The barrier function s (sep + R t) - sum_j log(t - c_j) - log t; +inf outside. */
static double barrier(const struct node *nd, const double *x, double s)
{
	double t = x[nd->d], v;
	if (!(t > 0))
		return HUGE_VAL;
	v = s * (sep_part(nd, x, s, NULL, NULL) + nd->R * t) - log(t);

	for (int i = 0; i < nd->nfree; i++) {
		double sl = t - price(nd, &nd->cols[nd->fc[i]], x);
		if (!(sl > 0))
			return HUGE_VAL;
		v -= log(sl);
	}
	return v;
}

/* Solves H dx = -g by Cholesky, adding a ridge when H is (numerically) singular: directions
 * in which the barrier function is flat carry no information about the bound. */
static int newton_dir(double *H, const double *gr, int n, double *dx)
{
	double maxd = 0, ridge, work[MAXD * MAXD], rhs[MAXD];
	int rc = -1;
	gsl_error_handler_t *old = gsl_set_error_handler_off();

	for (int i = 0; i < n; i++)
		if (H[i * n + i] > maxd)
			maxd = H[i * n + i];
	ridge = 1e-14 * maxd + 1e-300;
	for (int tries = 0; tries < 12 && rc; tries++, ridge *= 100) {
		memcpy(work, H, sizeof(double) * (size_t)(n * n));
		for (int i = 0; i < n; i++) {
			work[i * n + i] += ridge;
			rhs[i] = -gr[i];
		}
		gsl_matrix_view A = gsl_matrix_view_array(work, (size_t)n, (size_t)n);
		gsl_vector_view b = gsl_vector_view_array(rhs, (size_t)n);
		gsl_vector_view xv = gsl_vector_view_array(dx, (size_t)n);
		if (!gsl_linalg_cholesky_decomp1(&A.matrix) &&
		    !gsl_linalg_cholesky_solve(&A.matrix, &b.vector, &xv.vector))
			rc = 0;
	}
	gsl_set_error_handler(old);
	return rc;
}

/* Damped Newton on the barrier function for one s: the centering step of the barrier method. */
static void center(const struct node *nd, double *x, double s)
{
	int n = nd->d + 1, T = nd->d;
	double H[MAXD * MAXD], gr[MAXD], hs[MAXD], dx[MAXD], xn[MAXD];

	for (int it = 0; it < 60; it++) {
		double t = x[T], lam2, g0, alpha;

		memset(H, 0, sizeof(double) * (size_t)(n * n));
		sep_part(nd, x, s, gr, hs);
		for (int p = 0; p < nd->d; p++) {
			gr[p] *= s;
			H[p * n + p] = s * hs[p];
		}
		gr[T] = s * nd->R - 1 / t;
		H[T * n + T] = 1 / (t * t);
		for (int i = 0; i < nd->nfree; i++) {
			const struct allot_col *c = &nd->cols[nd->fc[i]];
			double inv = 1 / (t - price(nd, c, x)), inv2 = inv * inv;
			for (int k = 0; k < c->nm; k++) {
				int p = nd->pos[c->m[k]];
				gr[p] += c->a[k] * inv;
				H[p * n + T] -= c->a[k] * inv2;
				H[T * n + p] -= c->a[k] * inv2;
				for (int l = 0; l < c->nm; l++)
					H[p * n + nd->pos[c->m[l]]] += c->a[k] * c->a[l] * inv2;
			}
			gr[T] -= inv;
			H[T * n + T] += inv2;
		}
		if (newton_dir(H, gr, n, dx))
			return;
		lam2 = 0;
		for (int i = 0; i < n; i++)
			lam2 -= gr[i] * dx[i];
		g0 = barrier(nd, x, s);
		/* Centred once the decrement (half of it estimates g0 - min) is below what the
		 * arithmetic can still resolve in g0: beyond that the line search only halves. */
		if (!(lam2 > 2e-10 && lam2 > 1e-13 * fabs(g0)))
			return;
		/* Start no further than 99% of the way to the nearest constraint, so the search
		 * does not spend its halvings leaving the feasible region. */
		alpha = dx[T] < 0 ? fmin(1, -0.99 * x[T] / dx[T]) : 1;
		for (int i = 0; i < nd->nfree; i++) {
			const struct allot_col *c = &nd->cols[nd->fc[i]];
			double ds = dx[T] - price(nd, c, dx), sl = x[T] - price(nd, c, x);
			if (ds < 0)
				alpha = fmin(alpha, -0.99 * sl / ds);
		}
		for (; alpha > 1e-9; alpha *= 0.5) {
			for (int i = 0; i < n; i++)
				xn[i] = x[i] + alpha * dx[i];
			double gn = barrier(nd, xn, s);
			if (gn <= g0 - 0.25 * alpha * lam2)
				break;
		}
		if (alpha <= 1e-9)
			return;
		memcpy(x, xn, sizeof(double) * (size_t)n);
	}
}

double allot_dual_solve(const struct allot_gain *g, const double *F0, int R,
			const struct allot_col *cols, const int *fc, int nfree, double *mu,
			double *primal, double stop_below)
{
	struct node nd;
	double x[MAXD], bestx[MAXD], best, s, used_s, c, delta;
	int T;

	node_setup(&nd, g, F0, R, cols, fc, nfree);
	T = nd.d;
	for (int p = 0; p < nd.d; p++)
		x[p] = bestx[p] = mu[nd.mi[p]];
	best = node_eval(&nd, x);
	if (primal)
		for (int i = 0; i < nfree; i++)
			primal[i] = 0;
	if (nd.infeasible || nd.d == 0 || best <= stop_below)
		return best;

	/* Start strictly inside: t a little above every column's price and above 0, and s so that
	 * the barrier's pull and the objective's are of one size there. */
	c = cmax(&nd, x);
	delta = 0.1 * fmax(fabs(c), 1e-2);
	x[T] = fmax(c, 0) + delta;
	s = (nd.nfree + 1) / (nd.R * delta);
	used_s = s;
	for (int outer = 0; outer < 40; outer++, s *= 8) {
		center(&nd, x, s);
		used_s = s;
		double v = node_eval(&nd, x);
		if (v < best) {
			best = v;
			memcpy(bestx, x, sizeof(double) * (size_t)nd.d);
		}
		/* On the central path D - (continuous optimum) <= (constraints) / s. So once the
		 * barrier's objective less that margin is above stop_below, no multipliers bring the
		 * bound down to it: a branch-and-bound node that asked is kept, and more work would
		 * not change that (an early stop here never drops a node). */
		double gap = (nd.nfree + 1 + M_LN2 * nd.nflat) / s;
		if (best <= stop_below || gap <= 1e-10 * (1 + fabs(best)))
			break;
		if (stop_below > -HUGE_VAL &&
		    nd.base + sep_part(&nd, x, s, NULL, NULL) + nd.R * x[T] - gap > stop_below)
			break;
	}
	/* The primal solution is the barrier's multipliers: n_j = 1 / (s (t - c_j)). */
	if (primal)
		for (int i = 0; i < nd.nfree; i++)
			primal[i] = 1 / (used_s * (x[T] - price(&nd, &cols[fc[i]], x)));
	for (int p = 0; p < nd.d; p++)
		mu[nd.mi[p]] = bestx[p];
	return best;
}
