/* Allotment of a weekly set budget: whole sets per candidate exercise that maximise
 *     sum over muscles m of  priority_m * g(F_m),   F_m = sum_e a_em n_e,
 * with g(F) = b_dose (f(F) - f(0)) the predicted gain on the lnRR scale over no sets (the
 * intercept and moderators add the same constant to every allotment), a_em the fractional sets
 * one set of exercise e gives muscle m (direct 1.0, indirect 0.5), subject to the weekly
 * constraints
 *     sum_e n_e <= budget,   sum_e cost_e n_e <= fatigue budget (when given),
 *     min_m <= F_m <= max_m,
 *     n_e = 0 or n_e in A, the counts that can be dealt over the sessions in pieces of
 *         min_sets..max_sets sets, one piece per session (a piece split off over two or more
 *         sessions has at least 2 sets whatever min_sets), and
 *     sum_e k(n_e) <= nsessions * max_exercises,  k(n) = ceil(n / max_sets), the fewest
 *         sessions n sets need.
 * n is in A exactly when k(n) <= nsessions and n >= k(n) * (k(n) == 1 ? min_sets :
 * max(min_sets, 2)): the fewest pieces are also the ones whose lower limit is easiest to meet.
 * g must be concave and non-decreasing (the profile's dose form and the sign of b_dose).
 *
 * Floors are lower limits that are kept only when a greedy cover (the set that covers most
 * of what is missing, one after another) meets them all within the other constraints; then
 * they are constraints like --min, else they are all dropped (result.floored says which).
 *
 * What is proved (the guarantee): the weekly set counts are optimal (within the tolerance)
 * among all that meet the weekly constraints (with the floors when kept). Every such allotment can be laid out
 * (allot_layout): each chosen exercise in k(n_e) distinct sessions, its n_e sets split evenly
 * (pieces of floor or ceil of n_e / k, all within the piece limits because n_e is in A), and
 * sessions filled by taking, for each exercise, the k sessions with the most free exercise
 * places: their free places then never differ by more than one, so k <= nsessions free
 * sessions are always found while sum k <= nsessions * max_exercises. The layout is a
 * separate step on top: it balances sets and fatigue between sessions and keeps each muscle
 * under the session cap and each session under its set limit where it can, never breaking the
 * rules above; what it cannot meet it reports (allot_layout.over_*).
 *
 * Method: branch-and-bound. Each exercise's weekly sets are semi-continuous (0, or a count in
 * A): a node fixes one exercise's count, its children being "not used" and each allowed
 * count, so the search branches on used or not and then on how much. The incumbent comes from
 * a greedy fill plus an exchange search over allowed counts; every bound is the Lagrangian
 * dual of the continuous relaxation (the exercise-place constraint relaxed to its convex
 * envelope sum n_e <= max_sets * places left, each n_e <= the most it can still take), a valid
 * upper bound for any multipliers and equal to the continuous optimum at the best ones, which
 * a log-barrier Newton method finds, each node starting from its parent's multipliers and
 * barrier point (see core/allot_dual.h). A node is dropped when its bound cannot beat the
 * incumbent by more than the tolerance, so when the tree is exhausted the allotment is within
 * the tolerance of the best possible (optimal to 1e-9 relative with tolerance 0); when the
 * node limit stops it first, the reported gap (root bound minus value) bounds how far from the
 * best it can be. Exercises with the same muscle map and cost are interchangeable; the search
 * gives the first of them at least as many sets as the next. */
#ifndef SD_ALLOT_H
#define SD_ALLOT_H

#include "err.h"
#include "muscle.h"
#include "profile.h"

#define ALLOT_MAX_CAND 256
#define ALLOT_NODE_LIMIT 20000L
#define ALLOT_TOLERANCE 0.001   /* default of the command, priority-weighted lnRR */

/* Session rules of the command (common practice, no source). */
#define ALLOT_MIN_SETS 2        /* sets of a chosen exercise in one session at least */
#define ALLOT_MAX_SETS 5        /* ... and at most */
#define ALLOT_MAX_EXERCISES 6   /* exercises in one session at most */

struct allot_problem {
	int ncand;
	const double *a;               /* ncand x SD_NMUSCLES, row-major */
	const double *cost;            /* ncand fatigue costs per set (> 0); NULL: 1 each */
	double weight[SD_NMUSCLES];    /* priority, >= 0 */
	double min[SD_NMUSCLES];       /* fractional sets at least (0: none) */
	double max[SD_NMUSCLES];       /* fractional sets at most */
	double floor[SD_NMUSCLES];     /* soft --min: kept as limits only when a greedy cover meets
					* them all within every other limit (0: none) */
	int budget;                    /* weekly sets, >= 1 */
	double fatigue_budget;         /* weekly sum of cost x sets at most; 0: no limit */
	int nsessions;                 /* sessions a week; 0: 1 */
	int min_sets, max_sets;        /* a chosen exercise's sets in one session; 0: 1, budget */
	int max_exercises;             /* exercises in one session at most; 0: no limit */
	enum sd_form form;
	double b_dose;                 /* the profile's dose coefficient */
	long node_limit;               /* 0: ALLOT_NODE_LIMIT */
	double tolerance;              /* prove within this of the best (objective units); 0: exact */
	int cold;                      /* 1: every node's barrier starts afresh (for comparison) */
};

struct allot_result {
	int *sets;                     /* ncand; owned (allot_free) */
	int used;                      /* sets allotted (may be below the budget when more buy nothing) */
	double fatigue;                /* sum of cost x sets */
	int places;                    /* sum of k(n_e): exercise places the sessions must hold */
	double dose[SD_NMUSCLES];      /* F_m */
	double min[SD_NMUSCLES];       /* the lower limits solved for: --min, with the floors */
	int floored;                   /* 1: the floors were kept; 0: none given, or not met */
	double value;                  /* the objective (priority-weighted lnRR) */
	double relaxation;             /* the root bound: Lagrangian dual over whole-set loads */
	double bound;                  /* proved upper bound on the best possible value */
	double gap;                    /* bound - value >= 0: how far from the best it may be */
	int proved;                    /* 1: search finished, so gap <= max(tolerance, 1e-9 rel) */
	long nodes;                    /* branch-and-bound nodes visited */
	long newton;                   /* Newton steps of the dual solver, all nodes */
	int distinct;                  /* useful columns (exercises that reach a muscle that counts) */
	double last_set;               /* value lost without the least valuable removable set */
	double next_set;               /* value one more set on a chosen exercise would add */
};

/* The bundled default candidate list (library names), NULL-terminated: common exercises that
 * between them train every muscle group. */
extern const char *const allot_default_candidates[];

/* Fills a row (SD_NMUSCLES) of coefficients from a library exercise's muscle masks. */
void allot_coeffs(unsigned direct, unsigned indirect, double w_direct, double w_indirect,
		  double *row);
/* 1 when an exercise with these muscle masks counts as multi-joint: it trains two or more
 * muscles directly, or three or more in all, leaving out forearms and abs (grip and bracing
 * come with most lifts). Common practice, no source: a rule on the library's muscle maps. */
int allot_multi_joint(unsigned direct, unsigned indirect);
/* Checks the problem can be posed: a concave rising gain, weights, limits, session rules,
 * costs, and that the --min limits can be reached at all (usage errors naming the muscle). */
int allot_check(const struct allot_problem *p, struct sd_err *e);
/* Solves; r->sets is allocated. Fails (exit status 1) when no allotment meets the limits. */
int allot_solve(const struct allot_problem *p, struct allot_result *r, struct sd_err *e);
/* The objective of any allotment (limits not checked). */
double allot_value(const struct allot_problem *p, const int *sets);
/* Sum of cost x sets. */
double allot_fatigue(const struct allot_problem *p, const int *sets);
/* The fewest sessions n weekly sets of one exercise need, or -1 when n is not an allowed
 * count (0 needs none). */
int allot_pieces(const struct allot_problem *p, int n);
/* 1 when sets meet every weekly constraint above. */
int allot_feasible(const struct allot_problem *p, const int *sets);
void allot_free(struct allot_result *r);

/* Session layout: the weekly sets of each exercise dealt over the sessions under the rules
 * above (always met when the weekly constraints hold), balanced in sets and fatigue, each
 * session under per_session sets (0: no limit) and each muscle under cap fractional sets per
 * session where possible. */
struct allot_layout {
	int nsessions, ncand;
	int *sets;                     /* nsessions x ncand; owned */
	int over_cap;                  /* muscle-session pairs left above the cap */
	int over_limit;                /* sessions left above per_session */
	int broken;                    /* rule breaks: 0 whenever the weekly constraints hold */
};

/* Lays sets (per candidate) out; out->sets is allocated (allot_layout_free). */
int allot_layout(const struct allot_problem *p, const int *sets, int per_session, double cap,
		 struct allot_layout *out, struct sd_err *e);
/* Fractional sets of muscle m in session s of a layout. */
double allot_session_load(const struct allot_problem *p, const struct allot_layout *l, int s,
			  int m);
/* Sets and fatigue of session s. */
int allot_session_sets(const struct allot_layout *l, int s);
double allot_session_fatigue(const struct allot_problem *p, const struct allot_layout *l, int s);
/* Rule breaks of a layout of sets: pieces outside the limits, sessions over max_exercises,
 * totals that do not add up. 0 for a valid layout. */
int allot_layout_check(const struct allot_problem *p, const int *sets, const struct allot_layout *l);
void allot_layout_free(struct allot_layout *l);

#endif
