#include "allot.h"

#include <limits.h>
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "allot_dual.h"

#define TOL 1e-9
#define TINY 1e-12

_Static_assert(ALLOT_MAX_CAND <= ALLOT_DUAL_MAXCOL, "a node's free columns must fit the dual");

/* Between them these train every muscle group, each map distinct: a compound and an isolation
 * choice for the big groups, one isolation exercise for the small ones. */
const char *const allot_default_candidates[] = {
	"back squat", "deadlift", "romanian deadlift", "leg press", "leg extension",
	"lying leg curl", "hip thrust", "adductor machine", "standing calf raise",
	"back extension", "bench press", "dip", "chest fly machine", "overhead press",
	"lateral raise", "face pull", "barbell row", "chest-supported row", "lat pulldown",
	"shrug", "barbell curl", "hammer curl", "triceps pushdown", "wrist curl",
	"hanging leg raise", NULL,
};

void allot_coeffs(unsigned direct, unsigned indirect, double w_direct, double w_indirect,
		  double *row)
{
	/* A muscle listed both ways counts once, as direct (as core/volume.c counts it). */
	for (int m = 0; m < SD_NMUSCLES; m++)
		row[m] = direct >> m & 1 ? w_direct : indirect >> m & 1 ? w_indirect : 0;
}

int allot_multi_joint(unsigned direct, unsigned indirect)
{
	unsigned aside = 1u << SD_FOREARMS | 1u << SD_ABS;
	int nd = __builtin_popcount(direct & ~aside);
	int nall = __builtin_popcount((direct | indirect) & ~aside);
	return nd >= 2 || nall >= 3;
}

/* The session rules with the problem's zeros read as "no rule". */
struct rules {
	int N, smin, smax, places;
	double W;                   /* fatigue budget; HUGE_VAL: none */
};

static struct rules rules_of(const struct allot_problem *p)
{
	struct rules r;
	r.N = p->nsessions > 0 ? p->nsessions : 1;
	r.smin = p->min_sets > 0 ? p->min_sets : 1;
	/* Without a limit one piece may hold the whole budget and one set more (finish asks what
	 * one more set would buy). */
	r.smax = p->max_sets > 0 ? p->max_sets : p->budget > 0 ? p->budget + 1 : 1;
	r.places = p->max_exercises > 0 ? r.N * p->max_exercises : INT_MAX / 2;
	r.W = p->fatigue_budget > 0 ? p->fatigue_budget : HUGE_VAL;
	return r;
}

static int pieces_of(const struct rules *r, int n)
{
	if (n <= 0)
		return n == 0 ? 0 : -1;
	int k = (n + r->smax - 1) / r->smax;
	int lo = k == 1 ? r->smin : r->smin > 2 ? r->smin : 2;
	return k <= r->N && n >= k * lo ? k : -1;
}

int allot_pieces(const struct allot_problem *p, int n)
{
	struct rules r = rules_of(p);
	return pieces_of(&r, n);
}

static double cost_of(const struct allot_problem *p, int e)
{
	return p->cost ? p->cost[e] : 1;
}

static double gain(const struct allot_problem *p, double F)
{
	return p->b_dose * (form_f(p->form, F) - form_f(p->form, 0));
}

static void loads(const struct allot_problem *p, const int *sets, double *F)
{
	for (int m = 0; m < SD_NMUSCLES; m++)
		F[m] = 0;
	for (int e = 0; e < p->ncand; e++)
		for (int m = 0; m < SD_NMUSCLES; m++)
			F[m] += sets[e] * p->a[e * SD_NMUSCLES + m];
}

double allot_value(const struct allot_problem *p, const int *sets)
{
	double F[SD_NMUSCLES], v = 0;
	loads(p, sets, F);
	for (int m = 0; m < SD_NMUSCLES; m++)
		v += p->weight[m] * gain(p, F[m]);
	return v;
}

double allot_fatigue(const struct allot_problem *p, const int *sets)
{
	double f = 0;
	for (int e = 0; e < p->ncand; e++)
		f += sets[e] * cost_of(p, e);
	return f;
}

int allot_feasible(const struct allot_problem *p, const int *sets)
{
	struct rules r = rules_of(p);
	double F[SD_NMUSCLES];
	int total = 0, places = 0;
	for (int e = 0; e < p->ncand; e++) {
		int k = pieces_of(&r, sets[e]);
		if (k < 0)
			return 0;
		total += sets[e];
		places += k;
	}
	if (total > p->budget || places > r.places)
		return 0;
	if (r.W < HUGE_VAL && allot_fatigue(p, sets) > r.W + TOL)
		return 0;
	loads(p, sets, F);
	for (int m = 0; m < SD_NMUSCLES; m++)
		if (F[m] < p->min[m] - TOL || F[m] > p->max[m] + TOL)
			return 0;
	return 1;
}

/* The method needs v_m concave and non-decreasing: reciprocal with a negative dose
 * coefficient, log, sqrt or linear with a positive one. */
static int rising_concave(enum sd_form f, double b)
{
	return f == SD_FORM_RECIPROCAL ? b < 0 : b > 0;
}

static int check_rules(const struct allot_problem *p, struct sd_err *e)
{
	if (p->nsessions < 0 || p->min_sets < 0 || p->max_sets < 0 || p->max_exercises < 0)
		return sd_usage(e, "sessions, sets per session and exercises per session must be "
				"numbers from 1 up");
	if (p->min_sets > 0 && p->max_sets > 0 && p->min_sets > p->max_sets)
		return sd_usage(e, "--min-sets %d is above --max-sets %d", p->min_sets, p->max_sets);
	if (!(p->fatigue_budget >= 0) || !isfinite(p->fatigue_budget))
		return sd_usage(e, "the fatigue budget must be a number from 0 up");
	double cheapest = HUGE_VAL;
	for (int c = 0; c < p->ncand; c++) {
		double k = p->cost ? p->cost[c] : 1;
		int useful = 0;
		if (!(k > 0) || !isfinite(k))
			return sd_usage(e, "fatigue costs must be above 0 (candidate %d has %g)", c + 1, k);
		for (int m = 0; m < SD_NMUSCLES; m++)
			useful |= p->a[c * SD_NMUSCLES + m] > 0 && (p->weight[m] > 0 || p->min[m] > 0);
		if (useful)
			cheapest = fmin(cheapest, k);
	}
	/* Not even the cheapest exercise that counts fits at its least sets: say so rather than
	 * plan nothing. */
	int least = p->min_sets > 0 ? p->min_sets : 1;
	if (p->fatigue_budget > 0 && cheapest < HUGE_VAL && cheapest * least > p->fatigue_budget + TOL)
		return sd_usage(e, "a fatigue budget of %g cannot pay for one exercise: the cheapest "
				"candidate that trains a target costs %g a set, %g for %d sets",
				p->fatigue_budget, cheapest, cheapest * least, least);
	return 0;
}

int allot_check(const struct allot_problem *p, struct sd_err *e)
{
	double wsum = 0, colmax = 0, minsum = 0;

	if (p->budget < 1)
		return sd_usage(e, "the budget must be at least 1 set, not %d", p->budget);
	if (p->ncand < 1 || p->ncand > ALLOT_MAX_CAND)
		return sd_usage(e, "allot needs 1 to %d candidate exercises, not %d", ALLOT_MAX_CAND,
				p->ncand);
	if ((int)p->form < 0 || p->form >= SD_NFORMS || !rising_concave(p->form, p->b_dose))
		return sd_fail(e, "allot needs a profile whose gain rises with dose and flattens "
			       "(dose form %s with coefficient %g does not)", form_name(p->form),
			       p->b_dose);
	if (check_rules(p, e))
		return -1;
	for (int m = 0; m < SD_NMUSCLES; m++) {
		if (!(p->weight[m] >= 0) || !isfinite(p->weight[m]))
			return sd_usage(e, "priority of %s must be a number from 0 up", muscle_name(m));
		if (!(p->min[m] >= 0) || !isfinite(p->min[m]) || !(p->max[m] >= 0))
			return sd_usage(e, "limits of %s must be numbers from 0 up", muscle_name(m));
		if (p->min[m] > p->max[m] + TOL)
			return sd_usage(e, "%s: --min %g is above the most it may get (%g fractional "
					"sets a week)", muscle_name(m), p->min[m], p->max[m]);
		wsum += p->weight[m];
		minsum += p->min[m];
	}
	if (!(wsum > 0))
		return sd_usage(e, "every muscle has priority 0: nothing to allot for");
	/* One set adds at most colmax fractional sets to the muscles with a --min together. */
	for (int c = 0; c < p->ncand; c++) {
		double s = 0;
		for (int m = 0; m < SD_NMUSCLES; m++)
			if (p->min[m] > 0)
				s += p->a[c * SD_NMUSCLES + m];
		if (s > colmax)
			colmax = s;
	}
	for (int m = 0; m < SD_NMUSCLES; m++) {
		double best = 0;
		if (!(p->min[m] > 0))
			continue;
		for (int c = 0; c < p->ncand; c++)
			if (p->a[c * SD_NMUSCLES + m] > best)
				best = p->a[c * SD_NMUSCLES + m];
		if (!(best > 0))
			return sd_usage(e, "no candidate exercise trains %s (--min %s=%g)", muscle_name(m),
					muscle_name(m), p->min[m]);
		double need = ceil(p->min[m] / best - TOL);
		if (need > p->budget)
			return sd_usage(e, "a budget of %d sets is below the --min limits: %s=%g needs at "
					"least %.0f sets", p->budget, muscle_name(m), p->min[m], need);
	}
	if (minsum > 0 && ceil(minsum / colmax - TOL) > p->budget)
		return sd_usage(e, "a budget of %d sets is below the --min limits: together they need "
				"at least %.0f sets", p->budget, ceil(minsum / colmax - TOL));
	return 0;
}

/* Where the search stands: loads, sets, fatigue and exercise places used. */
struct state {
	double F[SD_NMUSCLES];
	int used, places;
	double fat;
};

struct solver {
	const struct allot_problem *p;
	struct rules r;
	struct allot_gain g;        /* the objective scaled by 1/sigma */
	double sigma;
	int J;                      /* useful columns */
	struct allot_col *col;
	int *ord;                   /* branching order of the columns */
	double *sufmax;             /* (J + 1) x SD_NMUSCLES: max a over columns ord[k..] */
	double *hint;               /* J x J: per depth, the relaxation's sets per column */
	double *prim;               /* J: scratch */
	double *ub;                 /* J: scratch, the free columns' most sets at a node */
	int *cur;                   /* sets per column on the current branch */
	int *best;                  /* incumbent sets per column */
	int *tmp;                   /* J: scratch */
	int *depth;                 /* J: column -> its depth in the branching order */
	double bestval;
	int have;
	long nodes, limit, newton;
	int aborted;
	double eps;
};

static double val_of(const struct solver *sv, const double *F)
{
	double v = 0;
	for (int m = 0; m < SD_NMUSCLES; m++)
		v += allot_gain_value(&sv->g, m, F[m]);
	return v;
}

/* Change in value when dv sets of column j are added to loads F (dv may be negative). */
static double col_delta(const struct solver *sv, const double *F, int j, int dv)
{
	const struct allot_col *c = &sv->col[j];
	double d = 0;
	for (int k = 0; k < c->nm; k++) {
		int m = c->m[k];
		d += allot_gain_value(&sv->g, m, F[m] + dv * c->a[k]) - allot_gain_value(&sv->g, m, F[m]);
	}
	return d;
}

static int allowed(const struct solver *sv, int n)
{
	return pieces_of(&sv->r, n) >= 0;
}

/* The largest allowed count at most n (0 always is). */
static int allowed_below(const struct solver *sv, int n)
{
	for (; n > 0; n--)
		if (allowed(sv, n))
			return n;
	return 0;
}

/* The next allowed count above n, or -1. */
static int step_up(const struct solver *sv, int n)
{
	for (int v = n + 1; v <= sv->r.N * sv->r.smax; v++)
		if (allowed(sv, v))
			return v;
	return -1;
}

/* The most sets column j could have in state st if it has none now: the set budget, the
 * fatigue budget, the exercise places, each muscle's maximum, the piece rules. */
static int room(const struct solver *sv, const struct state *st, int j)
{
	const struct allot_col *c = &sv->col[j];
	long v = sv->p->budget - st->used;
	long pl = (long)sv->r.places - st->places;
	if (pl * sv->r.smax < v)
		v = pl * sv->r.smax;
	if (sv->r.N * sv->r.smax < v)
		v = sv->r.N * sv->r.smax;
	if (sv->r.W < HUGE_VAL) {
		double f = floor((sv->r.W - st->fat) / c->cost + TOL);
		if (f < v)
			v = f < 0 ? 0 : (long)f;
	}
	for (int k = 0; k < c->nm; k++) {
		double f = floor((sv->g.hi[c->m[k]] - st->F[c->m[k]]) / c->a[k] + TOL);
		if (f < v)
			v = f < 0 ? 0 : (long)f;
	}
	return v <= 0 ? 0 : allowed_below(sv, (int)v);
}

/* Whether column j may go from n[j] sets to v: budget, fatigue, places, the muscles' maximum
 * when it grows and (keep_lo) their minimum when it shrinks. */
static int fits(const struct solver *sv, const struct state *st, const int *n, int j, int v,
		int keep_lo)
{
	const struct allot_col *c = &sv->col[j];
	int dv = v - n[j];
	if (!allowed(sv, v) || st->used + dv > sv->p->budget ||
	    st->places - pieces_of(&sv->r, n[j]) + pieces_of(&sv->r, v) > sv->r.places)
		return 0;
	if (sv->r.W < HUGE_VAL && st->fat + dv * c->cost > sv->r.W + TOL)
		return 0;
	for (int k = 0; k < c->nm; k++) {
		double F = st->F[c->m[k]] + dv * c->a[k];
		if ((dv > 0 && F > sv->g.hi[c->m[k]] + TOL) ||
		    (dv < 0 && keep_lo && F < sv->g.lo[c->m[k]] - TOL))
			return 0;
	}
	return 1;
}

static void set_count(const struct solver *sv, struct state *st, int *n, int j, int v)
{
	const struct allot_col *c = &sv->col[j];
	int dv = v - n[j];
	for (int k = 0; k < c->nm; k++)
		st->F[c->m[k]] += dv * c->a[k];
	st->used += dv;
	st->places += pieces_of(&sv->r, v) - pieces_of(&sv->r, n[j]);
	st->fat += dv * c->cost;
	n[j] = v;
}

static void state_of(const struct solver *sv, const int *n, struct state *st)
{
	int zero[ALLOT_MAX_CAND] = { 0 };
	memset(st, 0, sizeof *st);
	for (int j = 0; j < sv->J; j++)
		if (n[j])
			set_count(sv, st, zero, j, n[j]);
}

static int mins_met(const struct solver *sv, const double *F)
{
	for (int m = 0; m < SD_NMUSCLES; m++)
		if (F[m] < sv->g.lo[m] - TOL)
			return 0;
	return 1;
}

/* Meets the --min limits first: each step goes to the column covering most of what is still
 * missing per set (ties: the larger gain). Returns -1 when it cannot (the limits may still be
 * reachable; branch-and-bound decides). */
static int cover_mins(const struct solver *sv, struct state *st, int *n)
{
	for (;;) {
		int bj = -1, bv = 0;
		double bc = 0, bd = -HUGE_VAL;
		if (mins_met(sv, st->F))
			return 0;
		for (int j = 0; j < sv->J; j++) {
			const struct allot_col *c = &sv->col[j];
			int v = step_up(sv, n[j]);
			double cover = 0, d;
			if (v < 0 || !fits(sv, st, n, j, v, 0))
				continue;
			for (int k = 0; k < c->nm; k++) {
				double miss = sv->g.lo[c->m[k]] - st->F[c->m[k]];
				if (miss > TOL)
					cover += fmin((v - n[j]) * c->a[k], miss);
			}
			cover /= v - n[j];
			d = col_delta(sv, st->F, j, v - n[j]) / (v - n[j]);
			if (cover > bc + TOL || (cover > bc - TOL && cover > 0 && d > bd)) {
				bj = j;
				bv = v;
				bc = cover;
				bd = d;
			}
		}
		if (bj < 0)
			return -1;
		set_count(sv, st, n, bj, bv);
	}
}

/* The best single step up (most value per set), or -1. */
static int best_add(const struct solver *sv, const struct state *st, const int *n, int *to)
{
	int bj = -1;
	double bd = TINY;
	for (int j = 0; j < sv->J; j++) {
		int v = step_up(sv, n[j]);
		double d;
		if (v < 0 || !fits(sv, st, n, j, v, 1))
			continue;
		if ((d = col_delta(sv, st->F, j, v - n[j]) / (v - n[j])) > bd) {
			bd = d;
			bj = j;
			*to = v;
		}
	}
	return bj;
}

/* Greedy fill (the step that adds most per set, while any adds something), then an exchange
 * search: one column one step down (one set, or to 0 when one set less is not allowed) and
 * another one step up, whichever adds most, until no such move adds anything. */
static double improve(const struct solver *sv, struct state *st, int *n)
{
	for (int iter = 0; iter < 100000; iter++) {
		int bi = -1, bj, vi = 0, vj = 0;
		double bd = TINY;
		if ((bj = best_add(sv, st, n, &vj)) >= 0) {
			set_count(sv, st, n, bj, vj);
			continue;
		}
		for (int i = 0; i < sv->J; i++) {
			struct state si;
			int down = n[i] > 0 ? allowed_below(sv, n[i] - 1) : -1, save;
			double di;
			if (down < 0 || !fits(sv, st, n, i, down, 1))
				continue;
			di = col_delta(sv, st->F, i, down - n[i]);
			si = *st;
			save = n[i];
			set_count(sv, &si, n, i, down);
			for (int j = 0; j < sv->J; j++) {
				int v = step_up(sv, n[j]);
				double d;
				if (j == i || v < 0 || !fits(sv, &si, n, j, v, 1))
					continue;
				d = di + col_delta(sv, si.F, j, v - n[j]);
				if (d > bd) {
					bd = d;
					bi = i;
					vi = down;
					bj = j;
					vj = v;
				}
			}
			n[i] = save;
		}
		if (bi < 0)
			break;
		set_count(sv, st, n, bi, vi);
		set_count(sv, st, n, bj, vj);
	}
	return val_of(sv, st->F);
}

static int over(const struct solver *sv, const struct state *st);

/* Moves the sets of dominated columns to their dominators where they fit (see
 * find_dominance): the same value with no more fatigue, so among equals the lighter plan. */
static void merge_dominated(const struct solver *sv, int *n)
{
	int U = sv->r.N * sv->r.smax;
	for (int pass = 0, moved = 1; pass < sv->J && moved; pass++) {
		moved = 0;
		for (int b = 0; b < sv->J; b++) {
			int a = sv->col[b].dom, na, nb;
			struct state st;
			if (a < 0 || n[b] <= 0 || n[a] + n[b] > U)
				continue;
			na = n[a];
			nb = n[b];
			n[a] += nb;
			n[b] = 0;
			state_of(sv, n, &st);
			if (!allowed(sv, n[a]) || over(sv, &st)) {
				n[a] = na;
				n[b] = nb;
				continue;
			}
			moved = 1;
		}
	}
}

static void offer(struct solver *sv, const int *n, double v)
{
	if (sv->have && !(v > sv->bestval + TINY * (1 + fabs(sv->bestval))))
		return;
	memcpy(sv->best, n, sizeof(int) * (size_t)sv->J);
	merge_dominated(sv, sv->best);
	sv->bestval = v;
	sv->have = 1;
	sv->eps = fmax(1e-9 * fmax(1, fabs(v)), sv->p->tolerance / sv->sigma);
}

static int over(const struct solver *sv, const struct state *st)
{
	if (st->used > sv->p->budget || st->places > sv->r.places || st->fat > sv->r.W + TOL)
		return 1;
	for (int m = 0; m < SD_NMUSCLES; m++)
		if (st->F[m] > sv->g.hi[m] + TOL)
			return 1;
	return 0;
}

/* Incumbent from the relaxation's continuous sets: round down to allowed counts, trim what
 * breaks a limit, then the same fill and exchange search. */
static void from_relaxation(struct solver *sv, const double *cont)
{
	struct state st;

	for (int j = 0; j < sv->J; j++)
		sv->cur[j] = cont[j] > 0 ? allowed_below(sv, (int)floor(cont[j] + 1e-6)) : 0;
	state_of(sv, sv->cur, &st);
	for (int guard = 0; guard < 100000 && over(sv, &st); guard++) {
		int bj = -1;
		for (int j = 0; j < sv->J; j++)
			if (sv->cur[j] > 0 && (bj < 0 || sv->cur[j] > sv->cur[bj]))
				bj = j;
		set_count(sv, &st, sv->cur, bj, allowed_below(sv, sv->cur[bj] - 1));
	}
	if (cover_mins(sv, &st, sv->cur) == 0)
		offer(sv, sv->cur, improve(sv, &st, sv->cur));
}

/* Column b is dominated by column a when a gives every muscle that counts (a priority or a
 * lower limit) the same load, every other muscle no more, and costs no more fatigue, b not
 * being a twin of a. With pieces of 2 sets at least, any allotment using b while a has room
 * for b's sets (n_a + n_b <= nsessions x max_sets) can move them all to a: the merged count
 * is allowed, takes no more exercise places, has the same value and no more fatigue or side
 * load. So some optimal allotment has n_b = 0 or n_a + n_b > nsessions x max_sets for every
 * such pair (and twins in order): take, among the optimal ones, the one least in (fatigue,
 * side load, counts in reverse lexicographic order); every merge or twin swap lowers that.
 * The search keeps only such allotments (see canonical()). */
static void find_dominance(struct solver *sv)
{
	const struct allot_problem *p = sv->p;
	int counted[SD_NMUSCLES];
	for (int m = 0; m < SD_NMUSCLES; m++)
		counted[m] = p->weight[m] > 0 || p->min[m] > 0;
	for (int b = 0; b < sv->J; b++) {
		const double *rb = p->a + (size_t)sv->col[b].cand * SD_NMUSCLES;
		sv->col[b].dom = -1;
		if (sv->r.smin < 2)
			continue;
		for (int a = 0; a < sv->J; a++) {
			const double *ra = p->a + (size_t)sv->col[a].cand * SD_NMUSCLES;
			int ok = a != b && sv->col[a].cost <= sv->col[b].cost, strict;
			strict = sv->col[a].cost < sv->col[b].cost;
			for (int m = 0; m < SD_NMUSCLES && ok; m++) {
				ok = counted[m] ? ra[m] == rb[m] : ra[m] <= rb[m];
				strict |= !counted[m] && ra[m] < rb[m];
			}
			if (ok && strict && (sv->col[b].dom < 0 ||
					     sv->col[a].cost < sv->col[sv->col[b].dom].cost))
				sv->col[b].dom = a;
		}
	}
}

/* Whether column j at v sets, with the columns before depth k fixed, keeps the allotment in
 * the canonical form above (twins in order, dominated columns used only past their
 * dominator's room). */
static int canonical(const struct solver *sv, int k, int j, int v)
{
	int U = sv->r.N * sv->r.smax, t = sv->col[j].twin, d = sv->col[j].dom;
	if (t >= 0 && sv->depth[t] < k && v > sv->cur[t])
		return 0;
	if (v > 0 && d >= 0 && sv->depth[d] < k && sv->cur[d] + v <= U)
		return 0;
	for (int b = 0; b < sv->J; b++)
		if (sv->col[b].dom == j && sv->depth[b] < k && sv->cur[b] > 0 && v + sv->cur[b] <= U)
			return 0;
	return 1;
}

static int reachable(const struct solver *sv, const double *F, int R, int k)
{
	for (int m = 0; m < SD_NMUSCLES; m++) {
		double miss = sv->g.lo[m] - F[m];
		if (miss > TOL && R * sv->sufmax[k * SD_NMUSCLES + m] < miss - TOL)
			return 0;
	}
	return 1;
}

/* Sets the remaining columns may take together: the set budget and the convex envelope of
 * the exercise places (a column with n sets takes at least n / max_sets places). */
static int sets_left(const struct solver *sv, const struct state *st)
{
	long R = sv->p->budget - st->used, P = ((long)sv->r.places - st->places) * sv->r.smax;
	return (int)(R < P ? R : P);
}

/* The best count of column ord[k] when it is the last one that can still take sets. */
static void leaf(struct solver *sv, int k, const struct state *st)
{
	int j = sv->ord[k], vmax = room(sv, st, j), bv = -1;
	double bval = -HUGE_VAL;

	for (int v = 0; v <= vmax; v++) {
		double Fv[SD_NMUSCLES];
		if (!allowed(sv, v) || !canonical(sv, k, j, v))
			continue;
		memcpy(Fv, st->F, sizeof Fv);
		for (int q = 0; q < sv->col[j].nm; q++)
			Fv[sv->col[j].m[q]] += v * sv->col[j].a[q];
		if (!mins_met(sv, Fv))
			continue;
		double val = val_of(sv, Fv);
		if (val > bval) {
			bval = val;
			bv = v;
		}
	}
	sv->nodes++;
	if (bv >= 0) {
		sv->cur[j] = bv;
		offer(sv, sv->cur, bval);
		sv->cur[j] = 0;
	}
}

/* Depth-first branch-and-bound: depth k fixes column ord[k] (not used, or each allowed
 * count), trying counts outward from the relaxation's value; a child is dropped when its
 * bound (first at the parent's multipliers, then re-minimised from the parent's barrier point)
 * cannot beat the incumbent by more than eps. */
static void branch(struct solver *sv, int k, const struct state *st, const struct allot_dual *dual)
{
	int j = sv->ord[k], nfree = sv->J - k - 1, vmax, h;
	const int *fc = sv->ord + k + 1;
	const double *hint = sv->hint + (size_t)k * (size_t)sv->J;

	if (k == sv->J - 1) {
		leaf(sv, k, st);
		return;
	}
	vmax = room(sv, st, j);
	if (sv->col[j].twin >= 0 && sv->cur[sv->col[j].twin] < vmax)
		vmax = sv->cur[sv->col[j].twin];
	h = (int)lround(hint[j]);
	h = h < 0 ? 0 : h > vmax ? vmax : h;
	/* Counts outward from the relaxation's value: h, h+1, h-1, h+2, ... */
	for (int step = 0; step <= 2 * vmax + 1; step++) {
		int v = step % 2 ? h + (step + 1) / 2 : h - step / 2, R, any = 0;
		struct state sc = *st;
		struct allot_dual d2;
		double b, thr;
		if (v < 0 || v > vmax || !allowed(sv, v) || !canonical(sv, k, j, v))
			continue;
		if (sv->nodes >= sv->limit) {
			sv->aborted = 1;
			return;
		}
		sv->nodes++;
		set_count(sv, &sc, sv->cur, j, v);
		R = sets_left(sv, &sc);
		if (!reachable(sv, sc.F, R, k + 1)) {
			sv->cur[j] = 0;
			continue;
		}
		for (int i = 0; i < nfree; i++)
			any |= (sv->ub[i] = room(sv, &sc, fc[i])) > 0;
		if (!any) {
			/* Nothing more fits: this branch is complete. */
			if (mins_met(sv, sc.F))
				offer(sv, sv->cur, val_of(sv, sc.F));
			sv->cur[j] = 0;
			continue;
		}
		struct allot_node nd = { sc.F, R, sv->r.W < HUGE_VAL ? sv->r.W - sc.fat : HUGE_VAL,
					 sv->col, fc, nfree, sv->ub };
		thr = sv->have ? sv->bestval + sv->eps : -HUGE_VAL;
		b = allot_dual_eval(&sv->g, &nd, dual);
		if (b == -HUGE_VAL || (sv->have && b <= thr)) {
			sv->cur[j] = 0;
			continue;
		}
		d2 = *dual;
		d2.newton = 0;
		b = allot_dual_solve(&sv->g, &nd, &d2, !sv->p->cold, sv->prim, thr);
		sv->newton += d2.newton;
		if (b == -HUGE_VAL || (sv->have && b <= thr)) {
			sv->cur[j] = 0;
			continue;
		}
		double *child = sv->hint + (size_t)(k + 1) * (size_t)sv->J;
		for (int i = 0; i < nfree; i++)
			child[fc[i]] = sv->prim[i];
		branch(sv, k + 1, &sc, &d2);
		sv->cur[j] = 0;
		if (sv->aborted)
			return;
	}
}

/* Columns that can matter: an exercise that only reaches muscles with priority 0 and no --min
 * buys nothing. An exercise with the same map and cost as an earlier one is its twin. */
static int build_columns(struct solver *sv)
{
	const struct allot_problem *p = sv->p;
	for (int e = 0; e < p->ncand; e++) {
		const double *row = p->a + (size_t)e * SD_NMUSCLES;
		int useful = 0;
		for (int m = 0; m < SD_NMUSCLES; m++)
			useful |= row[m] > 0 && (p->weight[m] > 0 || p->min[m] > 0);
		if (!useful)
			continue;
		struct allot_col *c = &sv->col[sv->J];
		c->cand = e;
		c->cost = cost_of(p, e);
		c->twin = -1;
		c->dom = -1;
		for (int j = sv->J - 1; j >= 0 && c->twin < 0; j--)
			if (sv->col[j].cost == c->cost &&
			    !memcmp(row, p->a + (size_t)sv->col[j].cand * SD_NMUSCLES,
				    sizeof(double) * SD_NMUSCLES))
				c->twin = j;
		c->nm = 0;
		for (int m = 0; m < SD_NMUSCLES; m++)
			if (row[m] > 0) {
				c->m[c->nm] = m;
				c->a[c->nm++] = row[m];
			}
		sv->J++;
	}
	return sv->J;
}

static double *g_sort_key;

static int by_key_desc(const void *a, const void *b)
{
	int x = *(const int *)a, y = *(const int *)b;
	if (g_sort_key[x] != g_sort_key[y])
		return g_sort_key[x] > g_sort_key[y] ? -1 : 1;
	return x - y;
}

/* Twins keep their index order in the branching order (the positions a class of twins holds
 * are given to its members first to last), so a column's twin is always fixed before it. */
static void order_twins(struct solver *sv)
{
	int *rank = sv->cur, *root = sv->tmp;   /* scratch: column -> position, -> first twin */
	for (int k = 0; k < sv->J; k++)
		rank[sv->ord[k]] = k;
	for (int j = 0; j < sv->J; j++)
		root[j] = sv->col[j].twin < 0 ? j : root[sv->col[j].twin];
	for (int h = 0; h < sv->J; h++) {
		if (root[h] != h)
			continue;
		/* The class's positions, smallest first, to its members in index order. */
		for (int i = h; i < sv->J; i++) {
			if (root[i] != h)
				continue;
			int lo = i;
			for (int q = i + 1; q < sv->J; q++)
				if (root[q] == h && rank[q] < rank[lo])
					lo = q;
			if (lo != i) {
				int a = rank[i];
				rank[i] = rank[lo];
				rank[lo] = a;
			}
		}
	}
	for (int j = 0; j < sv->J; j++)
		sv->ord[rank[j]] = j;
	memset(sv->cur, 0, sizeof(int) * (size_t)sv->J);
}

static void finish(const struct solver *sv, struct allot_result *r)
{
	const struct allot_problem *p = sv->p;
	struct state st;
	int *n = sv->best;

	memset(r->sets, 0, sizeof(int) * (size_t)p->ncand);
	for (int j = 0; j < sv->J; j++)
		r->sets[sv->col[j].cand] = n[j];
	state_of(sv, n, &st);
	r->used = st.used;
	r->places = st.places;
	r->fatigue = allot_fatigue(p, r->sets);
	memcpy(r->dose, st.F, sizeof st.F);
	r->value = allot_value(p, r->sets);
	r->last_set = r->next_set = 0;
	for (int j = 0, first = 1; j < sv->J; j++)
		if (n[j] > 0 && fits(sv, &st, n, j, n[j] - 1, 1)) {
			double d = -col_delta(sv, st.F, j, -1) * sv->sigma;
			if (first || d < r->last_set)
				r->last_set = d;
			first = 0;
		}
	/* One more set: past the set budget, within every other limit. */
	st.used--;
	for (int j = 0; j < sv->J; j++)
		if (n[j] > 0 && fits(sv, &st, n, j, n[j] + 1, 1)) {
			double d = col_delta(sv, st.F, j, 1) * sv->sigma;
			if (d > r->next_set)
				r->next_set = d;
		}
}

static int solver_alloc(struct solver *sv, int n)
{
	size_t J = (size_t)n;
	sv->col = calloc(J, sizeof *sv->col);
	sv->ord = calloc(J, sizeof *sv->ord);
	sv->sufmax = calloc((J + 1) * SD_NMUSCLES, sizeof *sv->sufmax);
	sv->hint = calloc(J * J, sizeof *sv->hint);
	sv->prim = calloc(J, sizeof *sv->prim);
	sv->ub = calloc(J, sizeof *sv->ub);
	sv->cur = calloc(J, sizeof *sv->cur);
	sv->best = calloc(J, sizeof *sv->best);
	sv->tmp = calloc(J, sizeof *sv->tmp);
	sv->depth = calloc(J, sizeof *sv->depth);
	return sv->col && sv->ord && sv->sufmax && sv->hint && sv->prim && sv->ub && sv->cur &&
	       sv->best && sv->tmp && sv->depth ? 0 : -1;
}

static void solver_free(struct solver *sv)
{
	free(sv->col);
	free(sv->ord);
	free(sv->sufmax);
	free(sv->hint);
	free(sv->prim);
	free(sv->ub);
	free(sv->cur);
	free(sv->best);
	free(sv->tmp);
	free(sv->depth);
}

static void setup_gain(struct solver *sv)
{
	const struct allot_problem *p = sv->p;
	double wmax = 0;
	for (int m = 0; m < SD_NMUSCLES; m++)
		wmax = fmax(wmax, p->weight[m]);
	/* Scaled so the steepest muscle's slope near one set is about 1: the barrier's numbers
	 * then sit near 1 whatever the profile's units. */
	sv->sigma = fabs(p->b_dose) * wmax * fabs(form_df(p->form, 1));
	sv->g.form = p->form;
	sv->g.coef = p->b_dose / sv->sigma;
	for (int m = 0; m < SD_NMUSCLES; m++) {
		sv->g.weight[m] = p->weight[m];
		sv->g.lo[m] = p->min[m];
		sv->g.hi[m] = p->max[m];
	}
}

/* The lattice of muscle m's whole-set loads: the largest step of which every column's
 * coefficient is a whole multiple (0.5 with weights 1 and 0.5); 0 when there is none small
 * enough to be worth using. */
static void set_steps(struct solver *sv)
{
	for (int m = 0; m < SD_NMUSCLES; m++) {
		double amin = HUGE_VAL;
		sv->g.step[m] = 0;
		for (int j = 0; j < sv->J; j++)
			for (int k = 0; k < sv->col[j].nm; k++)
				if (sv->col[j].m[k] == m)
					amin = fmin(amin, sv->col[j].a[k]);
		for (int div = 1; div <= 8 && amin < HUGE_VAL && !sv->g.step[m]; div++) {
			double h = amin / div;
			int ok = 1;
			for (int j = 0; j < sv->J && ok; j++)
				for (int k = 0; k < sv->col[j].nm && ok; k++)
					if (sv->col[j].m[k] == m) {
						double q = sv->col[j].a[k] / h;
						ok = fabs(q - round(q)) < 1e-9;
					}
			if (ok)
				sv->g.step[m] = h;
		}
	}
}

static void suffix_max(struct solver *sv)
{
	for (int k = sv->J - 1; k >= 0; k--)
		for (int m = 0; m < SD_NMUSCLES; m++) {
			double a = 0;
			for (int q = 0; q < sv->col[sv->ord[k]].nm; q++)
				if (sv->col[sv->ord[k]].m[q] == m)
					a = sv->col[sv->ord[k]].a[q];
			sv->sufmax[k * SD_NMUSCLES + m] = fmax(a, sv->sufmax[(k + 1) * SD_NMUSCLES + m]);
		}
}

static int search(struct solver *sv, struct allot_result *r)
{
	struct state st, zero;
	struct allot_dual d;
	double *cont = sv->hint;

	memset(&zero, 0, sizeof zero);
	memset(&d, 0, sizeof d);
	/* Greedy incumbent. */
	st = zero;
	if (cover_mins(sv, &st, sv->cur) == 0)
		offer(sv, sv->cur, improve(sv, &st, sv->cur));
	if (sv->have)
		state_of(sv, sv->best, &st);
	for (int m = 0; m < SD_NMUSCLES; m++)
		d.mu[m] = allot_gain_slope(&sv->g, m, fmax(st.F[m], 0.25));

	/* Root bound and the relaxation's solution, in column order. */
	for (int j = 0; j < sv->J; j++) {
		sv->ord[j] = j;
		sv->ub[j] = room(sv, &zero, j);
	}
	struct allot_node root = { zero.F, sets_left(sv, &zero), sv->r.W, sv->col, sv->ord, sv->J,
				   sv->ub };
	r->relaxation = allot_dual_solve(&sv->g, &root, &d, 0, sv->prim, -HUGE_VAL);
	sv->newton += d.newton;
	d.newton = 0;
	for (int j = 0; j < sv->J; j++)
		cont[j] = sv->prim[j];
	memset(sv->cur, 0, sizeof(int) * (size_t)sv->J);
	from_relaxation(sv, cont);
	memset(sv->cur, 0, sizeof(int) * (size_t)sv->J);

	/* Branch on the columns the relaxation uses most first. */
	g_sort_key = cont;
	qsort(sv->ord, (size_t)sv->J, sizeof *sv->ord, by_key_desc);
	order_twins(sv);
	for (int k = 0; k < sv->J; k++)
		sv->depth[sv->ord[k]] = k;
	suffix_max(sv);
	if (r->relaxation == -HUGE_VAL)
		return -1;
	if (!sv->have || r->relaxation > sv->bestval + sv->eps)
		branch(sv, 0, &zero, &d);
	return sv->have ? 0 : -1;
}

static int solve(const struct allot_problem *p, struct allot_result *r, struct sd_err *e)
{
	struct solver sv;
	int rc = -1;

	memset(&sv, 0, sizeof sv);
	sv.p = p;
	sv.r = rules_of(p);
	sv.limit = p->node_limit > 0 ? p->node_limit : ALLOT_NODE_LIMIT;
	setup_gain(&sv);
	r->sets = calloc((size_t)p->ncand, sizeof *r->sets);
	if (!r->sets || solver_alloc(&sv, p->ncand)) {
		sd_fail(e, "out of memory");
		goto out;
	}
	if (!build_columns(&sv)) {
		sd_usage(e, "no candidate exercise trains a muscle with a priority above 0");
		goto out;
	}
	r->distinct = sv.J;
	set_steps(&sv);
	find_dominance(&sv);
	if (search(&sv, r)) {
		if (sv.aborted)
			sd_fail(e, "no allotment meeting the --min limits was found within %ld "
				"branch-and-bound nodes", sv.limit);
		else
			sd_fail(e, "no allotment of at most %d sets meets the --min limits with these "
				"exercises and the limits per exercise, session and muscle%s", p->budget,
				p->fatigue_budget > 0 ? " and the fatigue budget" : "");
		goto out;
	}
	r->nodes = sv.nodes;
	r->newton = sv.newton;
	r->proved = !sv.aborted;
	/* A finished search pruned only what could not beat the incumbent by more than eps. */
	r->relaxation = fmax(r->relaxation, sv.bestval) * sv.sigma;
	finish(&sv, r);
	r->bound = r->proved ? fmin(r->relaxation, r->value + sv.eps * sv.sigma) : r->relaxation;
	r->bound = fmax(r->bound, r->value);
	r->gap = r->bound - r->value;
	memcpy(r->min, p->min, sizeof r->min);
	rc = 0;
out:
	solver_free(&sv);
	if (rc)
		allot_free(r);
	return rc;
}

/* Whether the greedy cover meets p's --min limits within every other limit. */
static int cover_ok(const struct allot_problem *p)
{
	struct solver sv;
	struct state st;
	int ok = 0;

	memset(&sv, 0, sizeof sv);
	memset(&st, 0, sizeof st);
	sv.p = p;
	sv.r = rules_of(p);
	setup_gain(&sv);
	if (solver_alloc(&sv, p->ncand) == 0 && build_columns(&sv))
		ok = cover_mins(&sv, &st, sv.cur) == 0;
	solver_free(&sv);
	return ok;
}

int allot_solve(const struct allot_problem *p, struct allot_result *r, struct sd_err *e)
{
	struct allot_problem q = *p;
	struct sd_err quiet;
	int any = 0, floored = 0;

	memset(r, 0, sizeof *r);
	if (allot_check(p, e))
		return -1;
	for (int m = 0; m < SD_NMUSCLES; m++)
		if (p->floor[m] > p->min[m]) {
			q.min[m] = fmin(p->floor[m], p->max[m]);
			any = 1;
		}
	if (any && allot_check(&q, &quiet) == 0 && cover_ok(&q))
		floored = 1;
	if (solve(floored ? &q : p, r, e))
		return -1;
	r->floored = floored;
	return 0;
}

void allot_free(struct allot_result *r)
{
	free(r->sets);
	r->sets = NULL;
}
