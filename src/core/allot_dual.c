#include "allot_dual.h"

#include <math.h>
#include <string.h>

#include <gsl/gsl_errno.h>
#include <gsl/gsl_linalg.h>
#include <gsl/gsl_matrix.h>

#define MAXD (SD_NMUSCLES + 2)
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

/* Muscles whose v_m is linear, k F (a zero priority, or the linear form), have a dual term
 * with a kink and no curvature: max over lo <= F <= hi of (k - mu) F, that is
 * (k - mu) lo + (hi - lo) max(0, k - mu). The barrier writes the kink as z >= 0, z >= k - mu
 * with z minimised out, the same closed form as a column's cap (phi below): no smoothing, and
 * two more barrier terms per such muscle. */
static int flat(const struct allot_gain *g, int m)
{
	return g->form == SD_FORM_LINEAR || !(fabs(g->weight[m] * g->coef) > 0);
}

/* One column's barrier terms with its y (the multiplier of n <= ub) minimised out:
 *     phi(r) = min_y [a y - log y - log(y - r)],  a = s ub,  r = price - t,
 * at y = (a r + 2 + S) / (2a), S = sqrt((a r)^2 + 4). With P = a r + S and M = S - a r
 * (each computed without cancellation; P M = 4), a y = (2 + P) / 2, y (y - r) = (2 + S) / a^2,
 * so phi = (2 + P) / 2 - log(2 + S) + 2 log a; phi' = 1 / (y - r) = 2a / (2 + M) and
 * phi'' = 2 a^2 M / (S (2+M)^2). phi' / s is the column's sets in the barrier's primal
 * solution. The constant 2 log a is left out: the barrier is only compared with itself at
 * one s. */
static double phi(double a, double r, double *d1, double *d2)
{
	double ar = a * r, S = sqrt(ar * ar + 4);
	double P = ar >= 0 ? ar + S : 4 / (S - ar);
	double M = ar <= 0 ? S - ar : 4 / (S + ar);
	if (d1)
		*d1 = 2 * a / (2 + M);
	if (d2)
		*d2 = 2 * a * a * M / (S * (2 + M) * (2 + M));
	return (2 + P) / 2 - log(2 + S);
}

/* One node of the problem: which muscles the free columns reach (only those keep a
 * multiplier), and the exact value of the others, whose loads are fixed. Free columns that may
 * take no set are left out. */
struct node {
	const struct allot_gain *g;
	const double *F0;
	int R;
	double W;
	int fat;                    /* a fatigue budget: lambda is a variable */
	const struct allot_col *cols;
	int fc[ALLOT_DUAL_MAXCOL];  /* kept free columns */
	double ub[ALLOT_DUAL_MAXCOL];
	int where[ALLOT_DUAL_MAXCOL]; /* index in the caller's fc */
	int nfree;
	int d;                      /* active muscles */
	int nflat;                  /* of which flat (see flat()) with hi > lo */
	int mi[SD_NMUSCLES];        /* active index -> muscle */
	int pos[SD_NMUSCLES];       /* muscle -> active index, -1 if inactive */
	double base;                /* sum of v_m(F0_m) over inactive muscles */
	int infeasible;
};

static void node_setup(struct node *nd, const struct allot_gain *g, const struct allot_node *n)
{
	nd->g = g;
	nd->F0 = n->F0;
	nd->R = n->R;
	nd->W = n->W;
	nd->fat = n->W < HUGE_VAL;
	nd->cols = n->cols;
	nd->nfree = 0;
	nd->d = 0;
	nd->nflat = 0;
	nd->base = 0;
	nd->infeasible = 0;
	for (int m = 0; m < SD_NMUSCLES; m++)
		nd->pos[m] = -1;
	for (int i = 0; i < n->nfree && n->R > 0 && !(nd->fat && n->W <= 0); i++) {
		const struct allot_col *c = &n->cols[n->fc[i]];
		if (!(n->ub[i] > 0))
			continue;
		nd->fc[nd->nfree] = n->fc[i];
		nd->ub[nd->nfree] = fmin(n->ub[i], n->R);
		nd->where[nd->nfree++] = i;
		for (int k = 0; k < c->nm; k++)
			if (nd->pos[c->m[k]] < 0) {
				nd->pos[c->m[k]] = nd->d;
				nd->mi[nd->d++] = c->m[k];
				nd->nflat += flat(g, c->m[k]) && g->hi[c->m[k]] > g->lo[c->m[k]];
			}
	}
	for (int m = 0; m < SD_NMUSCLES; m++) {
		if (n->F0[m] > g->hi[m] + TOL)
			nd->infeasible = 1;
		if (nd->pos[m] >= 0)
			continue;
		if (n->F0[m] < g->lo[m] - TOL)
			nd->infeasible = 1;
		nd->base += allot_gain_value(g, m, n->F0[m]);
	}
}

/* Column j's reduced price sum_m a_jm mu_m - lambda c_j, with mu given per active index. */
static double price(const struct node *nd, const struct allot_col *c, const double *x,
		    double lambda)
{
	double s = -lambda * c->cost;
	for (int k = 0; k < c->nm; k++)
		s += c->a[k] * x[nd->pos[c->m[k]]];
	return s;
}

static double lam_of(const struct node *nd, const double *x)
{
	return nd->fat ? x[nd->d + 1] : 0;
}

/* The fractional knapsack: the most sum n_j q_j with 0 <= n_j <= ub_j and sum n_j <= R, by
 * filling the best-priced columns first. */
static double knapsack(const struct node *nd, const double *x)
{
	double q[ALLOT_DUAL_MAXCOL], u[ALLOT_DUAL_MAXCOL], total = 0, sum = 0, left = nd->R;
	int np = 0;

	for (int i = 0; i < nd->nfree; i++) {
		double v = price(nd, &nd->cols[nd->fc[i]], x, lam_of(nd, x));
		if (v > 0) {
			q[np] = v;
			u[np++] = nd->ub[i];
			total += nd->ub[i];
		}
	}
	if (total <= left) {
		for (int i = 0; i < np; i++)
			sum += q[i] * u[i];
		return sum;
	}
	/* Insertion sort, best price first: a few dozen columns at most. */
	for (int i = 1; i < np; i++)
		for (int j = i; j > 0 && q[j] > q[j - 1]; j--) {
			double tq = q[j], tu = u[j];
			q[j] = q[j - 1];
			u[j] = u[j - 1];
			q[j - 1] = tq;
			u[j - 1] = tu;
		}
	for (int i = 0; i < np && left > 0; i++) {
		double take = fmin(u[i], left);
		sum += q[i] * take;
		left -= take;
	}
	return sum;
}

/* The separable part over the active muscles with curvature: sum of max_F [v(F) - mu (F - F0)]
 * (flat muscles are in flat_part). grad and hess are given together or not at all. */
static double sep_part(const struct node *nd, const double *x, double *grad, double *hess)
{
	double sum = 0;
	for (int p = 0; p < nd->d; p++) {
		int m = nd->mi[p];
		if (flat(nd->g, m)) {
			if (grad)
				grad[p] = hess[p] = 0;
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

/* The flat muscles' barrier terms (in the barrier's units, s included):
 * s ((k - mu) lo + mu F0) + phi(s (hi - lo), k - mu), with its gradient and Hessian diagonal
 * added to grad and hess when given. */
static double flat_part(const struct node *nd, const double *x, double s, double *grad,
			double *hess)
{
	double sum = 0;
	for (int p = 0; p < nd->d; p++) {
		int m = nd->mi[p];
		if (!flat(nd->g, m))
			continue;
		double k = fabs(nd->g->weight[m] * nd->g->coef), lo = nd->g->lo[m], hi = nd->g->hi[m];
		double d1 = 0, d2 = 0;
		sum += s * ((k - x[p]) * lo + x[p] * nd->F0[m]);
		if (hi > lo)
			sum += phi(s * (hi - lo), k - x[p], &d1, &d2);
		if (grad) {
			grad[p] += s * (nd->F0[m] - lo) - d1;
			hess[p] += d2;
		}
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
	return nd->base + lattice_part(nd, x) + lam_of(nd, x) * (nd->fat ? nd->W : 0) +
	       (nd->nfree ? knapsack(nd, x) : 0);
}

double allot_dual_eval(const struct allot_gain *g, const struct allot_node *n,
		       const struct allot_dual *d)
{
	struct node nd;
	double x[MAXD];

	node_setup(&nd, g, n);
	for (int p = 0; p < nd.d; p++)
		x[p] = d->mu[nd.mi[p]];
	x[nd.d] = 0;
	x[nd.d + 1] = d->lambda > 0 ? d->lambda : 0;
	return node_eval(&nd, x);
}

/* The barrier function s (sep + R t + W lambda) + sum_j phi_j - log t - log lambda (up to a
 * constant for a given s); +inf outside. */
static double barrier(const struct node *nd, const double *x, double s)
{
	double t = x[nd->d], lam = lam_of(nd, x), v;
	if (!(t > 0) || (nd->fat && !(lam > 0)))
		return HUGE_VAL;
	v = s * (sep_part(nd, x, NULL, NULL) + nd->R * t) + flat_part(nd, x, s, NULL, NULL) - log(t);
	if (nd->fat)
		v += s * nd->W * lam - log(lam);
	for (int i = 0; i < nd->nfree; i++)
		v += phi(s * nd->ub[i], price(nd, &nd->cols[nd->fc[i]], x, lam) - t, NULL, NULL);
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

/* Gradient and Hessian of the barrier function at x. */
static void derivs(const struct node *nd, const double *x, double s, double *gr, double *H)
{
	int n = nd->d + 1 + nd->fat, T = nd->d, L = nd->d + 1;
	double hs[MAXD], t = x[T], lam = lam_of(nd, x);

	memset(H, 0, sizeof(double) * (size_t)(n * n));
	sep_part(nd, x, gr, hs);
	for (int p = 0; p < nd->d; p++) {
		gr[p] *= s;
		hs[p] *= s;
	}
	flat_part(nd, x, s, gr, hs);
	for (int p = 0; p < nd->d; p++)
		H[p * n + p] = hs[p];
	gr[T] = s * nd->R - 1 / t;
	H[T * n + T] = 1 / (t * t);
	if (nd->fat) {
		gr[L] = s * nd->W - 1 / lam;
		H[L * n + L] = 1 / (lam * lam);
	}
	for (int i = 0; i < nd->nfree; i++) {
		const struct allot_col *c = &nd->cols[nd->fc[i]];
		double d1, d2, v[MAXD];
		int idx[MAXD], nv = 0;
		phi(s * nd->ub[i], price(nd, c, x, lam) - t, &d1, &d2);
		/* r = sum a mu - lambda c - t: its gradient v over the variables it touches. */
		for (int k = 0; k < c->nm; k++) {
			idx[nv] = nd->pos[c->m[k]];
			v[nv++] = c->a[k];
		}
		idx[nv] = T;
		v[nv++] = -1;
		if (nd->fat) {
			idx[nv] = L;
			v[nv++] = -c->cost;
		}
		for (int k = 0; k < nv; k++) {
			gr[idx[k]] += d1 * v[k];
			for (int l = 0; l < nv; l++)
				H[idx[k] * n + idx[l]] += d2 * v[k] * v[l];
		}
	}
}

/* Damped Newton on the barrier function for one s: the centering step of the barrier method.
 * Returns 1 when centred (the Newton decrement is down to rounding), 0 when it stopped short. */
static int center(const struct node *nd, double *x, double s, long *steps)
{
	int n = nd->d + 1 + nd->fat, T = nd->d, L = nd->d + 1;
	double H[MAXD * MAXD], gr[MAXD], dx[MAXD], xn[MAXD], g0 = barrier(nd, x, s), gn = g0;

	for (int it = 0; it < 60; it++) {
		double lam2, alpha;

		derivs(nd, x, s, gr, H);
		if (newton_dir(H, gr, n, dx))
			return 0;
		(*steps)++;
		lam2 = 0;
		for (int i = 0; i < n; i++)
			lam2 -= gr[i] * dx[i];
		/* Centred once the decrement (half of it estimates g0 - min) is below what the
		 * arithmetic can still resolve in g0: beyond that the line search only halves. */
		if (!(lam2 > 2e-10 && lam2 > 1e-13 * fabs(g0)))
			return 1;
		/* Start no further than 99% of the way to t = 0 or lambda = 0. */
		alpha = dx[T] < 0 ? fmin(1, -0.99 * x[T] / dx[T]) : 1;
		if (nd->fat && dx[L] < 0)
			alpha = fmin(alpha, -0.99 * x[L] / dx[L]);
		for (; alpha > 1e-9; alpha *= 0.5) {
			for (int i = 0; i < n; i++)
				xn[i] = x[i] + alpha * dx[i];
			gn = barrier(nd, xn, s);
			if (gn <= g0 - 0.25 * alpha * lam2)
				break;
		}
		if (alpha <= 1e-9)
			return 0;
		memcpy(x, xn, sizeof(double) * (size_t)n);
		g0 = gn;
	}
	return 0;
}

/* A starting point inside: t a little above the best price and above 0, lambda of the size
 * that makes the costliest column's fatigue price comparable, and s so that the barrier's pull
 * and the objective's are of one size there. */
static double cold_start(const struct node *nd, double *x, int nterms)
{
	double c = -HUGE_VAL, cmax = 0, delta;
	for (int i = 0; i < nd->nfree; i++) {
		c = fmax(c, price(nd, &nd->cols[nd->fc[i]], x, 0));
		cmax = fmax(cmax, nd->cols[nd->fc[i]].cost);
	}
	delta = 0.1 * fmax(fabs(c), 1e-2);
	x[nd->d] = fmax(c, 0) + delta;
	if (nd->fat)
		x[nd->d + 1] = delta / fmax(cmax, 1e-9);
	return nterms / (nd->R * delta + (nd->fat ? nd->W * x[nd->d + 1] : 0));
}

double allot_dual_solve(const struct allot_gain *g, const struct allot_node *n,
			struct allot_dual *d, int warm, double *primal, double stop_below)
{
	struct node nd;
	double x[MAXD], bestx[MAXD], best, s, used_s;
	int T, nterms, retreats = 0;

	node_setup(&nd, g, n);
	T = nd.d;
	for (int p = 0; p < nd.d; p++)
		x[p] = bestx[p] = d->mu[nd.mi[p]];
	x[T] = 0;
	x[T + 1] = bestx[T + 1] = nd.fat && d->lambda > 0 ? d->lambda : 0;
	best = node_eval(&nd, x);
	if (primal)
		for (int i = 0; i < n->nfree; i++)
			primal[i] = 0;
	if (nd.infeasible || nd.d == 0 || nd.nfree == 0 || best <= stop_below)
		return best;

	nterms = 2 * nd.nfree + 1 + nd.fat + 2 * nd.nflat;
	warm = warm && d->s > 0 && d->t > 0 && (!nd.fat || d->lambda > 0);
	s = cold_start(&nd, x, nterms);
	if (warm) {
		/* The parent's point (its multipliers, t and lambda), at a barrier parameter between
		 * a fresh start's and where the parent stopped (s_fresh^0.7 s_parent^0.3): the
		 * child's problem differs by one fixed column, so its path passes near the parent's
		 * point, but not at the parent's final s (measured on the benchmark: about a third
		 * fewer instructions than restarting the barrier, for the same nodes). */
		x[T] = d->t;
		x[T + 1] = nd.fat ? d->lambda : 0;
		s = fmax(s, exp(0.7 * log(s) + 0.3 * log(d->s)));
	}
	used_s = s;
	for (int outer = 0; outer < 40; outer++) {
		int centred = center(&nd, x, s, &d->newton);
		used_s = s;
		double v = node_eval(&nd, x);
		if (v < best) {
			best = v;
			memcpy(bestx, x, sizeof(double) * (size_t)(nd.d + 2));
		}
		if (best <= stop_below)
			break;
		if (!centred && warm) {
			/* The parent's point was too far from this node's path at that s: further back
			 * along it, then afresh (the gap estimate below holds only on the path). */
			for (int p = 0; p < nd.d; p++)
				x[p] = bestx[p];
			x[T + 1] = bestx[T + 1];
			if (++retreats <= ALLOT_WARM_RETREATS) {
				s /= ALLOT_WARM_BACK;
			} else {
				s = cold_start(&nd, x, nterms);
				warm = 0;
			}
			continue;
		}
		/* Centred at s, D is within (barrier terms) / s of the continuous optimum. */
		double gap = nterms / s;
		/* Converged; or a node that asked about stop_below stands above it by a hundred times
		 * what more centring could still take off the smooth bound: the node is kept either
		 * way (stopping early never drops a node, it can only keep one). */
		if (centred && (gap <= 1e-10 * (1 + fabs(best)) ||
				(stop_below > -HUGE_VAL && gap <= 0.01 * (best - stop_below))))
			break;
		s *= 8;
	}
	/* The primal solution is the barrier's multipliers: n_j = phi'_j / s. */
	if (primal)
		for (int i = 0; i < nd.nfree; i++) {
			double d1;
			phi(used_s * nd.ub[i], price(&nd, &nd.cols[nd.fc[i]], x, lam_of(&nd, x)) - x[T],
			    &d1, NULL);
			primal[nd.where[i]] = d1 / used_s;
		}
	for (int p = 0; p < nd.d; p++)
		d->mu[nd.mi[p]] = bestx[p];
	d->lambda = nd.fat ? bestx[T + 1] : 0;
	d->t = x[T];
	d->s = used_s;
	return best;
}
