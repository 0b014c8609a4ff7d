#include "allot.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "allot_dual.h"

#define TOL 1e-9
#define TINY 1e-12

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

int allot_feasible(const struct allot_problem *p, const int *sets)
{
	double F[SD_NMUSCLES];
	int total = 0;
	for (int e = 0; e < p->ncand; e++) {
		if (sets[e] < 0)
			return 0;
		total += sets[e];
	}
	if (total > p->budget)
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

struct solver {
	const struct allot_problem *p;
	struct allot_gain g;        /* the objective scaled by 1/sigma */
	double sigma;
	int J;                      /* distinct useful columns */
	struct allot_col *col;
	int *ord;                   /* branching order of the columns */
	double *sufmax;             /* (J + 1) x SD_NMUSCLES: max a over columns ord[k..] */
	double *hint;               /* J x J: per depth, the relaxation's sets per column */
	double *prim;               /* J: scratch */
	int *cur;                   /* sets per column on the current branch */
	int *best;                  /* incumbent sets per column */
	double bestval;
	int have;
	long nodes, limit;
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

/* Change in value when v sets of column j are added to loads F (v may be negative). */
static double col_delta(const struct solver *sv, const double *F, int j, int v)
{
	const struct allot_col *c = &sv->col[j];
	double d = 0;
	for (int k = 0; k < c->nm; k++) {
		int m = c->m[k];
		d += allot_gain_value(&sv->g, m, F[m] + v * c->a[k]) - allot_gain_value(&sv->g, m, F[m]);
	}
	return d;
}

static int fits_add(const struct solver *sv, const double *F, int j)
{
	const struct allot_col *c = &sv->col[j];
	for (int k = 0; k < c->nm; k++)
		if (F[c->m[k]] + c->a[k] > sv->g.hi[c->m[k]] + TOL)
			return 0;
	return 1;
}

static int fits_remove(const struct solver *sv, const double *F, const int *n, int j)
{
	const struct allot_col *c = &sv->col[j];
	if (n[j] < 1)
		return 0;
	for (int k = 0; k < c->nm; k++)
		if (F[c->m[k]] - c->a[k] < sv->g.lo[c->m[k]] - TOL)
			return 0;
	return 1;
}

static void apply(const struct solver *sv, double *F, int *n, int *used, int j, int v)
{
	const struct allot_col *c = &sv->col[j];
	for (int k = 0; k < c->nm; k++)
		F[c->m[k]] += v * c->a[k];
	n[j] += v;
	*used += v;
}

static void state_loads(const struct solver *sv, const int *n, double *F, int *used)
{
	memset(F, 0, sizeof(double) * SD_NMUSCLES);
	*used = 0;
	for (int j = 0; j < sv->J; j++)
		if (n[j]) {
			const struct allot_col *c = &sv->col[j];
			for (int k = 0; k < c->nm; k++)
				F[c->m[k]] += n[j] * c->a[k];
			*used += n[j];
		}
}

/* Meets the --min limits first: each set goes to the column covering most of what is still
 * missing (ties: the larger gain). Returns -1 when it cannot (the limits may still be
 * reachable; branch-and-bound decides). */
static int cover_mins(const struct solver *sv, double *F, int *n, int *used)
{
	for (;;) {
		int bj = -1, short_any = 0;
		double bc = 0, bd = -HUGE_VAL;
		for (int m = 0; m < SD_NMUSCLES; m++)
			short_any |= F[m] < sv->g.lo[m] - TOL;
		if (!short_any)
			return 0;
		if (*used >= sv->p->budget)
			return -1;
		for (int j = 0; j < sv->J; j++) {
			const struct allot_col *c = &sv->col[j];
			double cover = 0, d;
			if (!fits_add(sv, F, j))
				continue;
			for (int k = 0; k < c->nm; k++) {
				double miss = sv->g.lo[c->m[k]] - F[c->m[k]];
				if (miss > TOL)
					cover += fmin(c->a[k], miss);
			}
			d = col_delta(sv, F, j, 1);
			if (cover > bc + TOL || (cover > bc - TOL && cover > 0 && d > bd)) {
				bj = j;
				bc = cover;
				bd = d;
			}
		}
		if (bj < 0)
			return -1;
		apply(sv, F, n, used, bj, 1);
	}
}

/* Greedy fill (the set that adds most, while any adds something), then a single-set
 * exchange search: move one set from one exercise to another, or add one, whichever adds
 * most, until no such move adds anything. */
static double improve(const struct solver *sv, double *F, int *n, int *used)
{
	for (int iter = 0; iter < 100000; iter++) {
		int bi = -1, bj = -1;
		double bd = TINY;
		if (*used < sv->p->budget)
			for (int j = 0; j < sv->J; j++) {
				double d;
				if (fits_add(sv, F, j) && (d = col_delta(sv, F, j, 1)) > bd) {
					bd = d;
					bj = j;
				}
			}
		if (bj < 0)
			for (int i = 0; i < sv->J; i++) {
				double Fi[SD_NMUSCLES], di;
				if (!fits_remove(sv, F, n, i))
					continue;
				memcpy(Fi, F, sizeof Fi);
				di = col_delta(sv, F, i, -1);
				for (int k = 0; k < sv->col[i].nm; k++)
					Fi[sv->col[i].m[k]] -= sv->col[i].a[k];
				for (int j = 0; j < sv->J; j++) {
					double d;
					if (j == i || !fits_add(sv, Fi, j))
						continue;
					d = di + col_delta(sv, Fi, j, 1);
					if (d > bd) {
						bd = d;
						bi = i;
						bj = j;
					}
				}
			}
		if (bj < 0)
			break;
		if (bi >= 0)
			apply(sv, F, n, used, bi, -1);
		apply(sv, F, n, used, bj, 1);
	}
	return val_of(sv, F);
}

static void offer(struct solver *sv, const int *n, double v)
{
	if (sv->have && !(v > sv->bestval + TINY * (1 + fabs(sv->bestval))))
		return;
	memcpy(sv->best, n, sizeof(int) * (size_t)sv->J);
	sv->bestval = v;
	sv->have = 1;
	sv->eps = fmax(1e-9 * fmax(1, fabs(v)), sv->p->tolerance / sv->sigma);
}

/* Incumbent from the relaxation's continuous sets: round down, trim what breaks a limit,
 * then the same fill and exchange search. */
static void from_relaxation(struct solver *sv, const double *cont)
{
	double F[SD_NMUSCLES];
	int used;

	for (int j = 0; j < sv->J; j++)
		sv->cur[j] = cont[j] > 0 ? (int)floor(cont[j] + 1e-6) : 0;
	state_loads(sv, sv->cur, F, &used);
	for (int guard = 0; guard < 100000; guard++) {
		int over = used > sv->p->budget, bj = -1;
		for (int m = 0; m < SD_NMUSCLES && !over; m++)
			over = F[m] > sv->g.hi[m] + TOL;
		if (!over)
			break;
		for (int j = 0; j < sv->J; j++)
			if (sv->cur[j] > 0 && (bj < 0 || sv->cur[j] > sv->cur[bj]))
				bj = j;
		apply(sv, F, sv->cur, &used, bj, -1);
	}
	if (cover_mins(sv, F, sv->cur, &used) == 0)
		offer(sv, sv->cur, improve(sv, F, sv->cur, &used));
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

static int max_sets(const struct solver *sv, const double *F, int R, int j)
{
	const struct allot_col *c = &sv->col[j];
	int v = R;
	for (int k = 0; k < c->nm; k++) {
		int room = (int)floor((sv->g.hi[c->m[k]] - F[c->m[k]]) / c->a[k] + TOL);
		if (room < v)
			v = room;
	}
	return v < 0 ? 0 : v;
}

/* The last column: its best count given everything else is fixed. */
static void leaf(struct solver *sv, int k, const double *F, int used)
{
	int j = sv->ord[k], vmax = max_sets(sv, F, sv->p->budget - used, j), bv = -1;
	double bval = -HUGE_VAL;

	for (int v = 0; v <= vmax; v++) {
		double Fv[SD_NMUSCLES];
		int ok = 1;
		memcpy(Fv, F, sizeof Fv);
		for (int q = 0; q < sv->col[j].nm; q++)
			Fv[sv->col[j].m[q]] += v * sv->col[j].a[q];
		for (int m = 0; m < SD_NMUSCLES && ok; m++)
			ok = Fv[m] >= sv->g.lo[m] - TOL;
		if (!ok)
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

/* Depth-first branch-and-bound: depth k fixes column ord[k], trying counts outward from the
 * relaxation's value; a child is dropped when its bound (first at the parent's multipliers,
 * then re-minimised) cannot beat the incumbent by more than eps. */
static void branch(struct solver *sv, int k, const double *F, int used, const double *mu)
{
	int j = sv->ord[k], R = sv->p->budget - used, vmax, h, nfree = sv->J - k - 1;
	const int *fc = sv->ord + k + 1;
	const double *hint = sv->hint + (size_t)k * (size_t)sv->J;

	if (k == sv->J - 1) {
		leaf(sv, k, F, used);
		return;
	}
	vmax = max_sets(sv, F, R, j);
	h = (int)lround(hint[j]);
	h = h < 0 ? 0 : h > vmax ? vmax : h;
	for (int step = 0; step <= 2 * vmax + 1; step++) {
		int v = step % 2 ? h + (step + 1) / 2 : h - step / 2;
		double Fv[SD_NMUSCLES], mu2[SD_NMUSCLES], b, thr;
		if (v < 0 || v > vmax)
			continue;
		if (sv->nodes >= sv->limit) {
			sv->aborted = 1;
			return;
		}
		sv->nodes++;
		memcpy(Fv, F, sizeof Fv);
		for (int q = 0; q < sv->col[j].nm; q++)
			Fv[sv->col[j].m[q]] += v * sv->col[j].a[q];
		if (!reachable(sv, Fv, R - v, k + 1))
			continue;
		thr = sv->have ? sv->bestval + sv->eps : -HUGE_VAL;
		b = allot_dual_eval(&sv->g, Fv, R - v, sv->col, fc, nfree, mu);
		if (b == -HUGE_VAL || (sv->have && b <= thr))
			continue;
		memcpy(mu2, mu, sizeof mu2);
		b = allot_dual_solve(&sv->g, Fv, R - v, sv->col, fc, nfree, mu2, sv->prim, thr);
		if (b == -HUGE_VAL || (sv->have && b <= thr))
			continue;
		double *child = sv->hint + (size_t)(k + 1) * (size_t)sv->J;
		for (int i = 0; i < nfree; i++)
			child[fc[i]] = sv->prim[i];
		sv->cur[j] = v;
		branch(sv, k + 1, Fv, used + v, mu2);
		sv->cur[j] = 0;
		if (sv->aborted)
			return;
	}
}

/* Distinct muscle maps that can matter: a map that only reaches muscles with priority 0 and
 * no --min buys nothing. */
static int build_columns(struct solver *sv)
{
	const struct allot_problem *p = sv->p;
	for (int e = 0; e < p->ncand; e++) {
		const double *row = p->a + (size_t)e * SD_NMUSCLES;
		int useful = 0, dup = 0;
		for (int m = 0; m < SD_NMUSCLES; m++)
			useful |= row[m] > 0 && (p->weight[m] > 0 || p->min[m] > 0);
		for (int j = 0; j < sv->J && useful && !dup; j++)
			dup = !memcmp(row, p->a + (size_t)sv->col[j].cand * SD_NMUSCLES,
				      sizeof(double) * SD_NMUSCLES);
		if (!useful || dup)
			continue;
		struct allot_col *c = &sv->col[sv->J++];
		c->cand = e;
		c->nm = 0;
		for (int m = 0; m < SD_NMUSCLES; m++)
			if (row[m] > 0) {
				c->m[c->nm] = m;
				c->a[c->nm++] = row[m];
			}
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

static void finish(const struct solver *sv, struct allot_result *r)
{
	const struct allot_problem *p = sv->p;
	double F[SD_NMUSCLES];
	int used;

	memset(r->sets, 0, sizeof(int) * (size_t)p->ncand);
	for (int j = 0; j < sv->J; j++)
		r->sets[sv->col[j].cand] = sv->best[j];
	state_loads(sv, sv->best, F, &used);
	r->used = used;
	memcpy(r->dose, F, sizeof F);
	r->value = allot_value(p, r->sets);
	r->last_set = r->next_set = 0;
	for (int j = 0, first = 1; j < sv->J; j++)
		if (fits_remove(sv, F, sv->best, j)) {
			double d = -col_delta(sv, F, j, -1) * sv->sigma;
			if (first || d < r->last_set)
				r->last_set = d;
			first = 0;
		}
	for (int j = 0; j < sv->J; j++)
		if (fits_add(sv, F, j)) {
			double d = col_delta(sv, F, j, 1) * sv->sigma;
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
	sv->cur = calloc(J, sizeof *sv->cur);
	sv->best = calloc(J, sizeof *sv->best);
	return sv->col && sv->ord && sv->sufmax && sv->hint && sv->prim && sv->cur && sv->best ? 0 : -1;
}

static void solver_free(struct solver *sv)
{
	free(sv->col);
	free(sv->ord);
	free(sv->sufmax);
	free(sv->hint);
	free(sv->prim);
	free(sv->cur);
	free(sv->best);
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

static void start_mu(const struct solver *sv, const double *F, double *mu)
{
	for (int m = 0; m < SD_NMUSCLES; m++)
		mu[m] = allot_gain_slope(&sv->g, m, fmax(F[m], 0.25));
}

static int search(struct solver *sv, struct allot_result *r)
{
	double F[SD_NMUSCLES], mu[SD_NMUSCLES], Fz[SD_NMUSCLES] = { 0 }, *cont = sv->hint;
	int used = 0;

	/* Greedy incumbent. */
	state_loads(sv, sv->cur, F, &used);
	if (cover_mins(sv, F, sv->cur, &used) == 0)
		offer(sv, sv->cur, improve(sv, F, sv->cur, &used));
	if (sv->have)
		state_loads(sv, sv->best, F, &used);
	start_mu(sv, F, mu);

	/* Root bound and the relaxation's solution, in column order. */
	for (int j = 0; j < sv->J; j++)
		sv->ord[j] = j;
	r->relaxation = allot_dual_solve(&sv->g, Fz, sv->p->budget, sv->col, sv->ord, sv->J, mu,
					 sv->prim, -HUGE_VAL);
	for (int j = 0; j < sv->J; j++)
		cont[j] = sv->prim[j];
	memset(sv->cur, 0, sizeof(int) * (size_t)sv->J);
	from_relaxation(sv, cont);
	memset(sv->cur, 0, sizeof(int) * (size_t)sv->J);

	/* Branch on the columns the relaxation uses most first. */
	g_sort_key = cont;
	qsort(sv->ord, (size_t)sv->J, sizeof *sv->ord, by_key_desc);
	for (int k = sv->J - 1; k >= 0; k--)
		for (int m = 0; m < SD_NMUSCLES; m++) {
			double a = 0;
			for (int q = 0; q < sv->col[sv->ord[k]].nm; q++)
				if (sv->col[sv->ord[k]].m[q] == m)
					a = sv->col[sv->ord[k]].a[q];
			sv->sufmax[k * SD_NMUSCLES + m] = fmax(a, sv->sufmax[(k + 1) * SD_NMUSCLES + m]);
		}
	if (r->relaxation == -HUGE_VAL)
		return -1;
	if (!sv->have || r->relaxation > sv->bestval + sv->eps)
		branch(sv, 0, Fz, 0, mu);
	return sv->have ? 0 : -1;
}

int allot_solve(const struct allot_problem *p, struct allot_result *r, struct sd_err *e)
{
	struct solver sv;
	int rc = -1;

	memset(r, 0, sizeof *r);
	memset(&sv, 0, sizeof sv);
	if (allot_check(p, e))
		return -1;
	sv.p = p;
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
	if (search(&sv, r)) {
		if (sv.aborted)
			sd_fail(e, "no allotment meeting the --min limits was found within %ld "
				"branch-and-bound nodes", sv.limit);
		else
			sd_fail(e, "no allotment of at most %d sets meets the --min limits with these "
				"exercises and the per-muscle maximum", p->budget);
		goto out;
	}
	r->nodes = sv.nodes;
	r->proved = !sv.aborted;
	/* A finished search pruned only what could not beat the incumbent by more than eps. */
	r->relaxation = fmax(r->relaxation, sv.bestval) * sv.sigma;
	finish(&sv, r);
	r->bound = r->proved ? fmin(r->relaxation, r->value + sv.eps * sv.sigma) : r->relaxation;
	r->bound = fmax(r->bound, r->value);
	r->gap = r->bound - r->value;
	rc = 0;
out:
	solver_free(&sv);
	if (rc)
		allot_free(r);
	return rc;
}

void allot_free(struct allot_result *r)
{
	free(r->sets);
	r->sets = NULL;
}
