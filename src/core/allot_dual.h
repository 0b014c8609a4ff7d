/* Upper bounds for the allotment problem (core/allot.h): the Lagrangian dual of its continuous
 * relaxation, used at the root and at every branch-and-bound node.
 *
 * A node fixes some exercises' sets (fixed loads F0 per muscle) and leaves R sets for the free
 * exercises. Relaxing F = F0 + A n with multipliers mu (any real vector) gives
 *     D(mu) = sum_m max_{lo_m <= F <= hi_m} [v_m(F) - mu_m (F - F0_m)]
 *             + R max(0, max_{j free} sum_m a_jm mu_m),
 * an upper bound on every allotment of the node for ANY mu (weak duality), and equal to the
 * continuous optimum at the minimising mu (strong duality: concave objective, linear limits).
 * allot_dual_solve minimises D by a log-barrier Newton method on (mu, t), t >= every
 * column's sum_m a_jm mu_m and t >= 0; whatever it returns is D evaluated exactly at the best
 * mu it met, so the bound is valid even when the minimisation stops early.
 *
 * Whole sets put each load on a lattice (multiples of step_m: 0.5 with the usual weights), so
 * the inner maximum over F may be taken over lattice points only: still an upper bound on
 * every whole-set allotment, and never above the continuous one (the maximum over fewer
 * points). The bound returned is that lattice form; the Newton method works on the smooth one
 * to find the multipliers. */
#ifndef SD_ALLOT_DUAL_H
#define SD_ALLOT_DUAL_H

#include "muscle.h"
#include "profile.h"

/* The per-muscle objective v_m(F) = weight_m coef (f(F) - f(0)), concave, non-decreasing. */
struct allot_gain {
	enum sd_form form;
	double coef;                   /* scaled dose coefficient */
	double weight[SD_NMUSCLES];
	double lo[SD_NMUSCLES], hi[SD_NMUSCLES];
	double step[SD_NMUSCLES];      /* every whole-set load of m is a multiple of this (0: none) */
};

/* One exercise (a distinct muscle map) in sparse form. */
struct allot_col {
	int cand;                      /* the first candidate with this map */
	int nm;
	int m[SD_NMUSCLES];
	double a[SD_NMUSCLES];
};

/* v_m(F) and its slope v_m'(F). */
double allot_gain_value(const struct allot_gain *g, int m, double F);
double allot_gain_slope(const struct allot_gain *g, int m, double F);
/* D(mu) for the node (F0, R, free columns fc[0..nfree-1]); -HUGE_VAL when the fixed loads
 * already break a muscle limit that no free column can change. */
double allot_dual_eval(const struct allot_gain *g, const double *F0, int R,
		       const struct allot_col *cols, const int *fc, int nfree, const double *mu);
/* Minimises D from the start mu (updated in place to the best found) and returns the bound;
 * stops early once the bound is at or below stop_below. When primal is not NULL it receives,
 * per free column, the continuous sets of the relaxation's solution (approximate). */
double allot_dual_solve(const struct allot_gain *g, const double *F0, int R,
			const struct allot_col *cols, const int *fc, int nfree, double *mu,
			double *primal, double stop_below);

#endif
