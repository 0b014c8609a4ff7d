/* Allotment of a weekly set budget: whole sets per candidate exercise that maximise
 *     sum over muscles m of  priority_m * g(F_m),   F_m = sum_e a_em n_e,
 * with g(F) = b_dose (f(F) - f(0)) the predicted gain on the lnRR scale over no sets (the
 * intercept and moderators add the same constant to every allotment), a_em the fractional sets
 * one set of exercise e gives muscle m (direct 1.0, indirect 0.5), subject to
 *     sum_e n_e <= budget,   min_m <= F_m <= max_m.
 * g must be concave and non-decreasing (the profile's dose form and the sign of b_dose).
 *
 * Method (the guarantee): branch-and-bound over whole set counts. The incumbent comes from a
 * greedy fill plus a single-set exchange search; every bound is the Lagrangian dual of the
 * continuous relaxation (relaxing F = A n), a valid upper bound for any multipliers and equal
 * to the continuous optimum at the best ones, which a log-barrier Newton method finds (taken
 * over whole-set loads, see core/allot_dual.h). A node is dropped when its bound cannot beat
 * the incumbent by more than the tolerance, so when the tree is exhausted the allotment is
 * within the tolerance of the best possible (optimal to 1e-9 relative with tolerance 0); when
 * the node limit stops it first, the reported gap (root bound minus value) bounds how far
 * from the best it can be. Exercises with the same muscle map are interchangeable; the first
 * of them gets the sets. */
#ifndef SD_ALLOT_H
#define SD_ALLOT_H

#include "err.h"
#include "muscle.h"
#include "profile.h"

#define ALLOT_MAX_CAND 256
#define ALLOT_NODE_LIMIT 20000L
#define ALLOT_TOLERANCE 0.001   /* default of the command, priority-weighted lnRR */

struct allot_problem {
	int ncand;
	const double *a;               /* ncand x SD_NMUSCLES, row-major */
	double weight[SD_NMUSCLES];    /* priority, >= 0 */
	double min[SD_NMUSCLES];       /* fractional sets at least (0: none) */
	double max[SD_NMUSCLES];       /* fractional sets at most */
	int budget;                    /* weekly sets, >= 1 */
	enum sd_form form;
	double b_dose;                 /* the profile's dose coefficient */
	long node_limit;               /* 0: ALLOT_NODE_LIMIT */
	double tolerance;              /* prove within this of the best (objective units); 0: exact */
};

struct allot_result {
	int *sets;                     /* ncand; owned (allot_free) */
	int used;                      /* sets allotted (may be below the budget when more buy nothing) */
	double dose[SD_NMUSCLES];      /* F_m */
	double value;                  /* the objective (priority-weighted lnRR) */
	double relaxation;             /* the root bound: Lagrangian dual over whole-set loads */
	double bound;                  /* proved upper bound on the best possible value */
	double gap;                    /* bound - value >= 0: how far from the best it may be */
	int proved;                    /* 1: search finished, so gap <= max(tolerance, 1e-9 rel) */
	long nodes;                    /* branch-and-bound nodes visited */
	int distinct;                  /* distinct useful muscle maps among the candidates */
	double last_set;               /* value lost without the least valuable set (0: none) */
	double next_set;               /* value one more set within the limits would add */
};

/* The bundled default candidate list (library names), NULL-terminated: common exercises that
 * between them train every muscle group. */
extern const char *const allot_default_candidates[];

/* Fills a row (SD_NMUSCLES) of coefficients from a library exercise's muscle masks. */
void allot_coeffs(unsigned direct, unsigned indirect, double w_direct, double w_indirect,
		  double *row);
/* Checks the problem can be posed: a concave rising gain, weights, limits, and that the
 * --min limits can be reached at all (usage errors naming the muscle). */
int allot_check(const struct allot_problem *p, struct sd_err *e);
/* Solves; r->sets is allocated. Fails (exit status 1) when no allotment meets the limits. */
int allot_solve(const struct allot_problem *p, struct allot_result *r, struct sd_err *e);
/* The objective of any allotment (limits not checked). */
double allot_value(const struct allot_problem *p, const int *sets);
/* 1 when sets meet the budget and the per-muscle limits. */
int allot_feasible(const struct allot_problem *p, const int *sets);
void allot_free(struct allot_result *r);

/* Session layout: the weekly sets of each exercise dealt over nsessions sessions so that no
 * session holds more than per_session sets (0: no limit) and, where possible, no muscle gets
 * more than cap fractional sets in one session. */
struct allot_layout {
	int nsessions, ncand;
	int *sets;                     /* nsessions x ncand; owned */
	int over_cap;                  /* muscle-session pairs left above the cap */
	int over_limit;                /* sessions left above per_session (0 unless impossible) */
};

/* Lays sets (per candidate) out over nsessions; out->sets is allocated (allot_layout_free). */
int allot_layout(const struct allot_problem *p, const int *sets, int nsessions,
		 int per_session, double cap, struct allot_layout *out, struct sd_err *e);
/* Fractional sets of muscle m in session s of a layout. */
double allot_session_load(const struct allot_problem *p, const struct allot_layout *l, int s,
			  int m);
void allot_layout_free(struct allot_layout *l);

#endif
