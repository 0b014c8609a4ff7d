/* Upper bounds for the allotment problem (core/allot.h): the Lagrangian dual of its continuous
 * relaxation, used at the root and at every branch-and-bound node.
 *
 * A node fixes some exercises' sets (fixed loads F0 per muscle) and leaves the free exercises
 * at most R sets together, at most ub_j each and, with a fatigue budget, at most W of fatigue
 * (sum c_j n_j). Relaxing F = F0 + A n with multipliers mu (any real vector) and the fatigue
 * budget with lambda >= 0 gives
 *     D(mu, lambda) = sum_m max_{lo_m <= F <= hi_m} [v_m(F) - mu_m (F - F0_m)] + lambda W
 *                     + max { sum_j n_j (sum_m a_jm mu_m - lambda c_j) : 0 <= n_j <= ub_j,
 *                             sum_j n_j <= R },
 * the last term a fractional knapsack (fill the best-priced columns first), an upper bound on
 * every allotment of the node for ANY mu and lambda >= 0 (weak duality), and equal to the
 * continuous optimum at the minimising ones (strong duality: concave objective, linear
 * limits). allot_dual_solve minimises D by a log-barrier Newton method on (mu, t, lambda),
 * t the multiplier of sum n <= R and y_j >= max(0, price_j - t) that of n_j <= ub_j, with
 * each y_j minimised out in closed form; whatever it returns is D evaluated exactly at the
 * best (mu, lambda) it met, so the bound is valid even when the minimisation stops early.
 *
 * Whole sets put each load on a lattice (multiples of step_m: 0.5 with the usual weights), so
 * the inner maximum over F may be taken over lattice points only: still an upper bound on
 * every whole-set allotment, and never above the continuous one (the maximum over fewer
 * points). The bound returned is that lattice form; the Newton method works on the smooth one
 * to find the multipliers.
 *
 * Warm start: struct allot_dual carries the barrier point and parameter; a child node starts
 * from its parent's point (the problems of a node and of its children differ by one fixed
 * column) at a barrier parameter between a fresh start's and the parent's final one. Without
 * it (warm = 0) the multipliers still start at the parent's but the barrier starts afresh,
 * as it did before. */
#ifndef SD_ALLOT_DUAL_H
#define SD_ALLOT_DUAL_H

#include "muscle.h"
#include "profile.h"

#define ALLOT_DUAL_MAXCOL 256   /* free columns of one node at most */
#define ALLOT_WARM_BACK 4.0     /* a warm start that does not centre steps s back by this ... */
#define ALLOT_WARM_RETREATS 3   /* ... at most this many times, then starts afresh */

/* The per-muscle objective v_m(F) = weight_m coef (f(F) - f(0)), concave, non-decreasing. */
struct allot_gain {
	enum sd_form form;
	double coef;                   /* scaled dose coefficient */
	double weight[SD_NMUSCLES];
	double lo[SD_NMUSCLES], hi[SD_NMUSCLES];
	double step[SD_NMUSCLES];      /* every whole-set load of m is a multiple of this (0: none) */
};

/* One exercise in sparse form. */
struct allot_col {
	int cand;                      /* the candidate */
	int twin;                      /* an earlier column with the same map and cost, or -1 */
	int dom;                       /* a column that dominates this one, or -1 (core/allot.c) */
	double cost;                   /* fatigue per set */
	int nm;
	int m[SD_NMUSCLES];
	double a[SD_NMUSCLES];
};

/* A branch-and-bound node as the dual sees it. */
struct allot_node {
	const double *F0;              /* loads of the fixed columns */
	int R;                         /* sets the free columns may take together */
	double W;                      /* fatigue they may take; HUGE_VAL: no fatigue budget */
	const struct allot_col *cols;
	const int *fc;                 /* the free columns */
	int nfree;
	const double *ub;              /* per free column (as fc): sets at most */
};

/* Multipliers and the barrier state they came from. */
struct allot_dual {
	double mu[SD_NMUSCLES];
	double lambda;                 /* fatigue multiplier (0 without a fatigue budget) */
	double t;                      /* set-budget multiplier at the barrier point */
	double s;                      /* barrier parameter reached; 0: none (start afresh) */
	long newton;                   /* Newton steps taken (a running count) */
};

/* v_m(F) and its slope v_m'(F). */
double allot_gain_value(const struct allot_gain *g, int m, double F);
double allot_gain_slope(const struct allot_gain *g, int m, double F);
/* D(mu, lambda) for the node; -HUGE_VAL when the fixed loads already break a muscle limit
 * that no free column can change. */
double allot_dual_eval(const struct allot_gain *g, const struct allot_node *n,
		       const struct allot_dual *d);
/* Minimises D from d (updated in place to the best multipliers found and the barrier state)
 * and returns the bound; stops early once the bound is at or below stop_below. With warm set
 * and d->s > 0 it starts at d's barrier point instead of afresh. When primal is not NULL it
 * receives, per free column, the continuous sets of the relaxation's solution (approximate). */
double allot_dual_solve(const struct allot_gain *g, const struct allot_node *n,
			struct allot_dual *d, int warm, double *primal, double stop_below);

#endif
