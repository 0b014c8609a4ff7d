/* Maximising the (restricted) likelihood over the variance parameters.
 *
 * Newton's method on the exact Hessian in "root" parameters: the square root of each
 * intercept variance and the Cholesky factor L of the 2x2 slope covariance G = L L'
 * (tau2 = l1^2, cov = l1 l2, tau2_slope = l2^2 + l3^2). Every real vector of roots is a valid
 * covariance and every boundary is an ordinary point: a variance of 0 is a root of 0, a slope
 * correlation of +-1 is l3 = 0. At a boundary maximum the likelihood is locally a concave
 * quadratic in the root, so Newton converges to it (superlinearly) instead of creeping along a
 * log scale; a root that ends below 1e-5 of the parameter's scale is then set to exactly 0 and
 * reported as on the boundary. The Hessian is made positive definite by taking absolute
 * eigenvalues (the saddle-free Newton step), and at a saddle (a root of 0 whose variance
 * would raise the likelihood) the step follows the direction of negative curvature.
 *
 * A fresh fit runs Newton from a moment estimate (mr_start). Only if that does not converge
 * does a quasi-Newton search (GSL BFGS2 on log-variances and atanh(rho), so every iterate is a
 * valid covariance) bring the search near the optimum for Newton to finish.
 *
 * The likelihood can have more than one maximum (a boundary and an interior one, typically
 * with few studies), so the first fit is followed by other starts (Newton only) when it shows
 * a reason to look: it did not converge, an estimate lies on a boundary, or the curvature at
 * the maximum is flat or not negative definite; then each variance's boundary and, with few
 * studies, a grid of scales are tried and the best converged result kept. A well-curved
 * interior maximum has its boundaries checked only where the quadratic model says the
 * boundary lies within REACH log-likelihood units (the others cannot plausibly hold a higher
 * maximum). */
#include "mr_lik.h"

#include <math.h>
#include <string.h>

#include <gsl/gsl_eigen.h>
#include <gsl/gsl_multimin.h>

#define BFGS_MAX 400
#define NEWTON_MAX 100
/* The quasi-Newton stage only has to bring the search near the optimum (gradient in
 * log-likelihood units per log-variance); the Newton stage then converges in a few steps. */
#define BFGS_GTOL 1.0
#define DEC_TOL 1e-15     /* Newton decrement g'A^-1 g, log-likelihood units */
/* Below this decrement one more full Newton step lands within DEC_TOL (the decrement about
 * squares with each step near the maximum), so that step is taken without derivatives. */
#define DEC_LAST 1e-8
#define SNAP 1e-10        /* a variance below SNAP x its scale is a boundary 0 */
#define GRID_STUDIES 60   /* extra grid starts up to this many studies */
#define REACH 8.0         /* boundary checked when the quadratic model's drop to it is smaller */
#define FLAT 1e-8         /* curvature flat: smallest / largest eigenvalue, scaled roots */

struct ctx {
	struct mr_work *w;
	int reml, K, slopes;
	double scale[MR_MAXK];      /* natural size of each parameter (variances) */
};

static int is_var(const struct mr_work *w, int k)
{
	return mr_work_kind(w, k) != MR_K_COV;
}

/* ---- stage 1: quasi-Newton on log-variances and atanh(rho) ---- */

/* theta(phi) and J = d theta / d phi (K x K). The slope covariance sits between tau2
 * (index 0) and tau2_slope (index 2) whenever present. */
static void log_to_theta(const struct ctx *c, const double *phi, double *theta, double *J)
{
	int K = c->K;
	if (J)
		memset(J, 0, sizeof(double) * K * K);
	for (int k = 0; k < K; k++) {
		if (!is_var(c->w, k))
			continue;
		double x = phi[k] > 60 ? 60 : phi[k] < -200 ? -200 : phi[k];
		theta[k] = c->scale[k] * exp(x);
		if (J)
			J[k * K + k] = theta[k];
	}
	for (int k = 0; k < K; k++) {
		if (is_var(c->w, k))
			continue;
		double rho = tanh(phi[k]), s = sqrt(theta[0] * theta[2]);
		theta[k] = rho * s;
		if (J) {
			J[k * K + 0] = theta[k] / 2;
			J[k * K + 2] = theta[k] / 2;
			J[k * K + k] = (1 - rho * rho) * s;
		}
	}
}

static void theta_to_log(const struct ctx *c, const double *theta, double *phi)
{
	for (int k = 0; k < c->K; k++) {
		if (is_var(c->w, k)) {
			double t = theta[k] > 1e-8 * c->scale[k] ? theta[k] : 1e-8 * c->scale[k];
			phi[k] = log(t / c->scale[k]);
		} else {
			double s = sqrt(theta[0] * theta[2]), rho = s > 0 ? theta[k] / s : 0;
			rho = rho > 0.99 ? 0.99 : rho < -0.99 ? -0.99 : rho;
			phi[k] = atanh(rho);
		}
	}
}

static void fdf(const gsl_vector *x, void *arg, double *f, gsl_vector *g)
{
	struct ctx *c = arg;
	double phi[MR_MAXK], theta[MR_MAXK], J[MR_MAXK * MR_MAXK];
	struct mr_eval ev;
	int K = c->K;

	for (int k = 0; k < K; k++)
		phi[k] = gsl_vector_get(x, k);
	log_to_theta(c, phi, theta, J);
	if (mr_work_eval(c->w, theta, c->reml, g ? MR_WANT_GRAD : MR_WANT_LL, &ev)) {
		/* Cannot happen for a valid theta with positive sampling variances; a huge value
		 * makes the line search back off if rounding ever gets here. */
		if (f)
			*f = 1e300;
		if (g)
			gsl_vector_set_zero(g);
		return;
	}
	if (f)
		*f = -ev.ll;
	if (g)
		for (int a = 0; a < K; a++) {
			double s = 0;
			for (int k = 0; k < K; k++)
				s += J[k * K + a] * ev.g[k];
			gsl_vector_set(g, a, -s);
		}
}

static double f_only(const gsl_vector *x, void *arg)
{
	double f;
	fdf(x, arg, &f, NULL);
	return f;
}

static void df_only(const gsl_vector *x, void *arg, gsl_vector *g)
{
	double f;
	fdf(x, arg, &f, g);
}

static int bfgs(struct ctx *c, int max_iter, double *theta, int *iters)
{
	const gsl_multimin_fdfminimizer_type *T = gsl_multimin_fdfminimizer_vector_bfgs2;
	gsl_multimin_fdfminimizer *s = gsl_multimin_fdfminimizer_alloc(T, c->K);
	gsl_vector *x = gsl_vector_alloc(c->K);
	gsl_multimin_function_fdf fn = { f_only, df_only, fdf, c->K, c };
	double phi[MR_MAXK];
	int ret = -1, it = 0;

	if (!s || !x)
		goto done;
	theta_to_log(c, theta, phi);
	for (int k = 0; k < c->K; k++)
		gsl_vector_set(x, k, phi[k]);
	if (gsl_multimin_fdfminimizer_set(s, &fn, x, 0.5, 0.1))
		goto done;
	while (it < max_iter) {
		it++;
		if (gsl_multimin_fdfminimizer_iterate(s))
			break;     /* no further progress possible: the Newton stage takes over */
		if (gsl_multimin_test_gradient(s->gradient, BFGS_GTOL) == GSL_SUCCESS)
			break;
	}
	for (int k = 0; k < c->K; k++)
		phi[k] = gsl_vector_get(s->x, k);
	log_to_theta(c, phi, theta, NULL);
	ret = 0;
done:
	*iters += it;
	gsl_multimin_fdfminimizer_free(s);
	gsl_vector_free(x);
	return ret;
}

/* ---- stage 2: Newton on roots ---- */

/* theta(r), its Jacobian J (K x K) and the constant second derivatives of theta_k in r,
 * added as sum_k g_k d2theta_k/dr2 into Hr. Indices as in theta: for slopes r = (l1, l2, l3
 * [, s]) at the places of (tau2, cov, tau2_slope [, sigma2]). */
static void root_to_theta(const struct ctx *c, const double *r, double *theta, double *J)
{
	int K = c->K;
	if (J)
		memset(J, 0, sizeof(double) * K * K);
	for (int k = 0; k < K; k++) {
		theta[k] = r[k] * r[k];
		if (J)
			J[k * K + k] = 2 * r[k];
	}
	if (c->slopes) {
		theta[1] = r[0] * r[1];
		theta[2] = r[1] * r[1] + r[2] * r[2];
		if (J) {
			J[1 * K + 0] = r[1];
			J[1 * K + 1] = r[0];
			J[2 * K + 1] = 2 * r[1];
			J[2 * K + 2] = 2 * r[2];
		}
	}
}

static void add_curvature(const struct ctx *c, const double *g, double *Hr)
{
	int K = c->K;
	for (int k = 0; k < K; k++)
		if (!c->slopes || k == 3)
			Hr[k * K + k] += 2 * g[k];
	if (c->slopes) {
		Hr[0 * K + 0] += 2 * g[0];
		Hr[0 * K + 1] += g[1];
		Hr[1 * K + 0] += g[1];
		Hr[1 * K + 1] += 2 * g[2];
		Hr[2 * K + 2] += 2 * g[2];
	}
}

static void theta_to_root(const struct ctx *c, const double *theta, double *r)
{
	for (int k = 0; k < c->K; k++)
		r[k] = sqrt(theta[k] > 0 ? theta[k] : 0);
	if (c->slopes) {
		r[1] = r[0] > 0 ? theta[1] / r[0] : 0;
		double d = theta[2] - r[1] * r[1];
		r[2] = sqrt(d > 0 ? d : 0);
	}
}

struct step {
	double d[MR_MAXK];      /* ascent direction */
	double dec;             /* g'd */
	double lmin;            /* smallest eigenvalue of -H (negative: not a maximum) */
	double v[MR_MAXK];      /* its eigenvector */
};

/* Saddle-free Newton direction d = |A|^-1 g for A = -H (absolute eigenvalues, floored). */
static int direction(int K, const double *H, const double *g, gsl_eigen_symmv_workspace *ws,
		     struct step *st)
{
	double A[MR_MAXK * MR_MAXK], lam[MR_MAXK], V[MR_MAXK * MR_MAXK], big = 0;
	gsl_matrix_view Av = gsl_matrix_view_array(A, K, K), Vv = gsl_matrix_view_array(V, K, K);
	gsl_vector_view lv = gsl_vector_view_array(lam, K);

	for (int i = 0; i < K * K; i++)
		A[i] = -H[i];
	if (gsl_eigen_symmv(&Av.matrix, &lv.vector, &Vv.matrix, ws))
		return -1;
	st->lmin = INFINITY;
	for (int i = 0; i < K; i++) {
		big = fmax(big, fabs(lam[i]));
		if (lam[i] < st->lmin) {
			st->lmin = lam[i];
			for (int k = 0; k < K; k++)
				st->v[k] = V[k * K + i];
		}
	}
	if (!(big > 0))
		big = 1;
	st->dec = 0;
	for (int k = 0; k < K; k++)
		st->d[k] = 0;
	for (int i = 0; i < K; i++) {
		double l = fmax(fabs(lam[i]), 1e-10 * big), vg = 0;
		for (int k = 0; k < K; k++)
			vg += V[k * K + i] * g[k];
		for (int k = 0; k < K; k++)
			st->d[k] += V[k * K + i] * vg / l;
		st->dec += vg * vg / l;
	}
	return 0;
}

/* Evaluates ll, its gradient and Hessian in roots at r. */
static int eval_root(struct ctx *c, const double *r, int want, struct mr_eval *ev, double *gr,
		     double *Hr)
{
	int K = c->K;
	double theta[MR_MAXK], J[MR_MAXK * MR_MAXK];

	root_to_theta(c, r, theta, J);
	if (mr_work_eval(c->w, theta, c->reml, want, ev))
		return -1;
	if (want < MR_WANT_HESS)
		return 0;
	for (int a = 0; a < K; a++) {
		gr[a] = 0;
		for (int k = 0; k < K; k++)
			gr[a] += J[k * K + a] * ev->g[k];
		for (int b = 0; b < K; b++) {
			double h = 0;
			for (int k = 0; k < K; k++)
				for (int l = 0; l < K; l++)
					h += J[k * K + a] * ev->H[k * K + l] * J[l * K + b];
			Hr[a * K + b] = h;
		}
	}
	add_curvature(c, ev->g, Hr);
	return 0;
}

/* Sets roots whose variance is negligible to exactly 0 when that costs no likelihood. */
static void snap(struct ctx *c, double *r, double ll, struct mr_conv *cv)
{
	double t[MR_MAXK], th[MR_MAXK];
	struct mr_eval ev;
	int K = c->K;

	memcpy(t, r, sizeof t);
	root_to_theta(c, t, th, NULL);
	for (int k = 0; k < K; k++) {
		if (!is_var(c->w, k) || th[k] >= SNAP * c->scale[k])
			continue;
		if (c->slopes && k == 0)
			t[0] = 0;                     /* tau2 = 0 takes the covariance with it */
		else if (c->slopes && k == 2)
			t[1] = t[2] = 0;
		else
			t[k] = 0;
	}
	/* a slope correlation within rounding of +-1 is +-1 */
	if (c->slopes && t[2] != 0 && t[2] * t[2] < SNAP * (t[1] * t[1] + t[2] * t[2]))
		t[2] = 0;
	if (!memcmp(t, r, sizeof(double) * K))
		return;
	root_to_theta(c, t, th, NULL);
	if (mr_work_eval(c->w, th, c->reml, MR_WANT_LL, &ev) || ev.ll < ll - 1e-9 * (1 + fabs(ll)))
		return;
	memcpy(r, t, sizeof t);
	cv->loglik = ev.ll;
}

/* The best result so far, against which an extra start is abandoned early. */
struct best {
	double ll;
	const double *theta;
};

/* An extra start is not worth finishing once the likelihood is locally concave and either
 * the quadratic model's maximum (ll + dec/2, doubled for safety) stays below the best, or
 * the iterate is already in the best result's neighbourhood (it would converge there). */
static int hopeless(const struct ctx *c, const struct best *b, const struct mr_eval *ev,
		    const struct step *st, const double *r)
{
	double th[MR_MAXK], dist = 0;
	if (!b || !(st->lmin > 0))
		return 0;
	if (ev->ll + st->dec < b->ll - 1e-9 * (1 + fabs(b->ll)))
		return 1;
	root_to_theta(c, r, th, NULL);
	for (int k = 0; k < c->K; k++)
		dist = fmax(dist, fabs(th[k] - b->theta[k]) / c->scale[k]);
	return dist < 1e-3;
}

/* The curvature at a converged maximum in roots scaled to their parameters' sizes: flat when
 * -H is not clearly positive definite; otherwise, for each variance, the quadratic model's
 * log-likelihood drop when its roots go to 0 with the other roots re-maximised,
 * 1/2 r_S' [(-H)^-1_SS]^-1 r_S (S: one root, or the slope variance's two). */
static void curvature(const struct ctx *c, const double *r, const double *Hr,
		      gsl_eigen_symmv_workspace *ws, struct mr_conv *cv)
{
	int K = c->K;
	double A[MR_MAXK * MR_MAXK], V[MR_MAXK * MR_MAXK], lam[MR_MAXK], D[MR_MAXK];
	double Ai[MR_MAXK * MR_MAXK], z[MR_MAXK], lmin = INFINITY, lmax = 0;
	gsl_matrix_view Av = gsl_matrix_view_array(A, K, K), Vv = gsl_matrix_view_array(V, K, K);
	gsl_vector_view lv = gsl_vector_view_array(lam, K);

	cv->flat = 1;
	for (int k = 0; k < K; k++) {
		D[k] = sqrt(c->scale[k]);
		z[k] = r[k] / D[k];
		cv->drop[k] = 0;
	}
	for (int i = 0; i < K; i++)
		for (int j = 0; j < K; j++)
			A[i * K + j] = -Hr[i * K + j] * D[i] * D[j];
	if (gsl_eigen_symmv(&Av.matrix, &lv.vector, &Vv.matrix, ws))
		return;
	for (int i = 0; i < K; i++) {
		lmin = fmin(lmin, lam[i]);
		lmax = fmax(lmax, lam[i]);
	}
	if (!(lmin > FLAT * lmax))
		return;
	cv->flat = 0;
	for (int i = 0; i < K; i++)
		for (int j = 0; j < K; j++) {
			double x = 0;
			for (int l = 0; l < K; l++)
				x += V[i * K + l] * V[j * K + l] / lam[l];
			Ai[i * K + j] = x;
		}
	for (int k = 0; k < K; k++) {
		if (!is_var(c->w, k))
			continue;
		if (c->slopes && k == 2) {            /* tau2_slope = l2^2 + l3^2 */
			double a = Ai[1 * K + 1], b = Ai[1 * K + 2], d = Ai[2 * K + 2];
			double det = a * d - b * b;
			cv->drop[k] = 0.5 * (d * z[1] * z[1] - 2 * b * z[1] * z[2] + a * z[2] * z[2]) / det;
		} else {
			cv->drop[k] = 0.5 * z[k] * z[k] / Ai[k * K + k];
		}
	}
}

static int newton(struct ctx *c, int max_iter, double *theta, struct mr_conv *cv,
		  gsl_eigen_symmv_workspace *ws, const struct best *b)
{
	int K = c->K;
	struct mr_eval ev, nx;
	struct step st;
	double r[MR_MAXK] = {0}, gr[MR_MAXK], Hr[MR_MAXK * MR_MAXK], trial[MR_MAXK] = {0};
	double tg[MR_MAXK], tH[MR_MAXK * MR_MAXK];

	cv->converged = 0;
	theta_to_root(c, theta, r);
	if (eval_root(c, r, MR_WANT_HESS, &ev, gr, Hr))
		return -1;
	for (int it = 0; it < max_iter; it++) {
		if (direction(K, Hr, gr, ws, &st))
			return -1;
		cv->iter_newton++;
		cv->decrement = st.dec;
		cv->loglik = ev.ll;
		int saddle = st.lmin < -1e-8 * (1 + fabs(st.lmin)) && st.dec < 1e-8;
		if (st.dec < DEC_TOL && !saddle) {
			cv->converged = 1;
			break;
		}
		if (st.dec < DEC_LAST && !saddle) {
			for (int k = 0; k < K; k++)
				trial[k] = r[k] + st.d[k];
			if (!eval_root(c, trial, MR_WANT_LL, &nx, NULL, NULL) &&
			    nx.ll >= ev.ll - 1e-12 * (1 + fabs(ev.ll))) {
				memcpy(r, trial, sizeof r);
				cv->loglik = nx.ll;
			}
			cv->converged = 1;
			break;
		}
		if (hopeless(c, b, &ev, &st, r))
			return 0;
		if (saddle) {
			/* Gradient ~0 but not a maximum (typically a root of 0 whose variance should
			 * grow): move along the direction of negative curvature. */
			double size = 0;
			for (int k = 0; k < K; k++)
				size += c->scale[k];
			size = sqrt(size / K) * 0.1;
			double sg = 0;
			for (int k = 0; k < K; k++)
				sg += st.v[k] * gr[k];
			for (int k = 0; k < K; k++)
				st.d[k] = (sg < 0 ? -1 : 1) * st.v[k] * size;
		}
		/* The full step is evaluated with its derivatives, which the next iteration reuses
		 * when it is accepted (nearly always); shorter steps with the likelihood alone. */
		double alpha = 1, tol = 1e-12 * (1 + fabs(ev.ll));
		int ok = 0, full = 0;
		for (int half = 0; half < 50 && !ok; half++) {
			for (int k = 0; k < K; k++)
				trial[k] = r[k] + alpha * st.d[k];
			if (half == 0)
				ok = full = !eval_root(c, trial, MR_WANT_HESS, &nx, tg, tH) &&
					    nx.ll >= ev.ll - tol;
			else
				ok = !eval_root(c, trial, MR_WANT_LL, &nx, NULL, NULL) &&
				     nx.ll >= ev.ll - tol;
			alpha /= 2;
		}
		if (!ok) {
			/* No step improves: at the optimum to rounding, if the decrement is small. */
			cv->converged = st.dec < 1e-9 && !saddle;
			break;
		}
		memcpy(r, trial, sizeof r);
		if (full) {
			ev = nx;
			memcpy(gr, tg, sizeof gr);
			memcpy(Hr, tH, sizeof Hr);
		} else if (eval_root(c, r, MR_WANT_HESS, &ev, gr, Hr)) {
			return -1;
		}
		cv->loglik = ev.ll;
	}
	if (cv->converged) {
		curvature(c, r, Hr, ws, cv);
		snap(c, r, cv->loglik, cv);
	}
	root_to_theta(c, r, theta, NULL);
	for (int k = 0; k < K; k++)
		cv->zero[k] = is_var(c->w, k) && theta[k] == 0;
	cv->rho_bound = c->slopes && r[0] != 0 && (r[1] != 0) && r[2] == 0;
	return 0;
}

/* Keeps the better of two results, preferring a converged one; sums the work done. */
static void keep_best(double *theta, struct mr_conv *cv, const double *t, const struct mr_conv *tc)
{
	int ib = cv->iter_bfgs + tc->iter_bfgs, in = cv->iter_newton + tc->iter_newton;
	int starts = cv->starts;
	if (tc->converged && (!cv->converged ||
			      tc->loglik > cv->loglik + 1e-9 * (1 + fabs(cv->loglik)))) {
		memcpy(theta, t, sizeof(double) * MR_MAXK);
		*cv = *tc;
	}
	cv->iter_bfgs = ib;
	cv->iter_newton = in;
	cv->starts = starts;
}

int mr_optimise(struct mr_work *w, int reml, int max_iter, int warm, double *theta,
		struct mr_conv *cv, struct sd_err *e)
{
	struct ctx c = { .w = w, .reml = reml, .K = mr_work_nvc(w) };
	int bmax = max_iter > 0 ? max_iter : BFGS_MAX, nmax = max_iter > 0 ? max_iter : NEWTON_MAX;
	double start[MR_MAXK], vs = mr_work_vscale(w), fs = mr_work_fscale(w), t[MR_MAXK];
	gsl_eigen_symmv_workspace *ws = gsl_eigen_symmv_alloc(c.K);
	struct mr_conv tc;
	const char *why = "the likelihood could not be evaluated (covariance not positive definite)";
	int ret = -1;

	if (!ws)
		return sd_fail(e, "out of memory");
	c.slopes = c.K >= 3;    /* tau2, cov, tau2_slope [, sigma2] */
	for (int k = 0; k < c.K; k++)
		c.scale[k] = mr_work_kind(w, k) == MR_K_SLOPE && fs > 0 ? vs / fs : vs;
	memset(cv, 0, sizeof *cv);
	memcpy(start, theta, sizeof start);
	/* Warm starts (leave-one-study-out refits): Newton steps alone, from the full fit. */
	if (warm) {
		if (newton(&c, nmax, theta, cv, ws, NULL))
			goto done;
		if (cv->converged) {
			ret = 0;
			goto done;
		}
		memcpy(theta, start, sizeof start);
		memset(cv, 0, sizeof *cv);
	}
	if (!warm && newton(&c, nmax, theta, cv, ws, NULL))
		goto done;
	if (warm || !cv->converged) {
		int in = cv->iter_newton;
		memcpy(theta, start, sizeof start);
		memset(cv, 0, sizeof *cv);
		if (bfgs(&c, bmax, theta, &cv->iter_bfgs)) {
			why = "out of memory";
			goto done;
		}
		if (newton(&c, nmax, theta, cv, ws, NULL))
			goto done;
		cv->iter_newton += in;
	}
	/* A fit capped by --max-iter is reported as it stands. Otherwise more starts, Newton
	 * steps only, when the first fit gives a reason (see the top of the file). First the
	 * boundary of each variance: the best fit with that variance (and the slope covariance)
	 * set near 0, pursued only when the likelihood there falls as the variance grows, i.e.
	 * when the boundary may hold a maximum of its own. Then, with at most GRID_STUDIES
	 * studies (where likelihoods with two maxima turn up; with more the surface is close to
	 * quadratic and these starts would only cost time), every variance at 0.01, 0.1, 1 and
	 * 10 times its scale. */
	int wide = !cv->converged || cv->flat || cv->rho_bound;
	for (int k = 0; k < c.K; k++)
		wide |= cv->zero[k];
	static const double grid[] = { 1e-2, 1e-1, 1, 10 };
	int ngrid = wide && mr_work_nblock(w) <= GRID_STUDIES ? (int)(sizeof grid / sizeof *grid) : 0;
	for (int i = 0; max_iter <= 0 && i < c.K + ngrid; i++) {
		if (i < c.K) {
			struct mr_eval ev;
			if (!is_var(w, i) || cv->zero[i] || (!wide && cv->drop[i] >= REACH))
				continue;
			memcpy(t, theta, sizeof t);
			t[i] = 1e-6 * c.scale[i];
			if (c.slopes && i != 3)
				t[1] = 0;
			if (mr_work_eval(w, t, reml, MR_WANT_GRAD, &ev))
				goto done;
			if (ev.g[i] > 0)
				continue;
		} else {
			for (int k = 0; k < c.K; k++)
				t[k] = is_var(w, k) ? grid[i - c.K] * c.scale[k] : 0;
		}
		memset(&tc, 0, sizeof tc);
		struct best b = { cv->converged ? cv->loglik : -INFINITY, theta };
		if (newton(&c, nmax, t, &tc, ws, cv->converged ? &b : NULL))
			goto done;
		cv->starts++;
		keep_best(theta, cv, t, &tc);
	}
	ret = 0;
done:
	if (ret)
		sd_fail(e, "%s", why);
	gsl_eigen_symmv_free(ws);
	return ret;
}
