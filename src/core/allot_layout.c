/* Session layout of an allotment (core/allot.h). */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "allot.h"

/* Sets of one exercise in one session beyond which it is split over more sessions; common
 * practice, no source. */
#define BLOCK_SETS 4
#define TOL 1e-9

struct lay {
	const struct allot_problem *p;
	struct allot_layout *l;
	int P;
	double cap;
	int *count;                 /* sets per session */
	double *load;               /* nsessions x SD_NMUSCLES */
};

static const double *row(const struct lay *y, int e)
{
	return y->p->a + (size_t)e * SD_NMUSCLES;
}

static int *cell(const struct lay *y, int s, int e)
{
	return &y->l->sets[(size_t)s * (size_t)y->l->ncand + (size_t)e];
}

static double over(double load, double cap)
{
	return load > cap + TOL ? load - cap : 0;
}

/* Extra fractional sets above the cap that v sets of e would add to session s. */
static double cap_cost(const struct lay *y, int s, int e, int v)
{
	const double *a = row(y, e), *ld = y->load + (size_t)s * SD_NMUSCLES;
	double c = 0;
	for (int m = 0; m < SD_NMUSCLES; m++)
		if (a[m] > 0)
			c += over(ld[m] + v * a[m], y->cap) - over(ld[m], y->cap);
	return c;
}

static void put(struct lay *y, int s, int e, int v)
{
	const double *a = row(y, e);
	*cell(y, s, e) += v;
	y->count[s] += v;
	for (int m = 0; m < SD_NMUSCLES; m++)
		y->load[(size_t)s * SD_NMUSCLES + m] += v * a[m];
}

struct block {
	int e, size;
	double weight;
};

static int by_weight(const void *x, const void *z)
{
	const struct block *a = x, *b = z;
	if (a->weight != b->weight)
		return a->weight > b->weight ? -1 : 1;
	if (a->e != b->e)
		return a->e - b->e;
	return b->size - a->size;
}

/* How many sessions an exercise's weekly sets are split over: blocks of about BLOCK_SETS,
 * more when one block alone would break the cap or the per-session limit. */
static int pieces(const struct lay *y, int e, int n)
{
	const double *a = row(y, e);
	int N = y->l->nsessions, k = (n + BLOCK_SETS - 1) / BLOCK_SETS;
	double amax = 0;
	for (int m = 0; m < SD_NMUSCLES; m++)
		amax = fmax(amax, a[m]);
	for (; k < N && k < n; k++) {
		int size = (n + k - 1) / k;
		if (amax * size <= y->cap + TOL && (!y->P || size <= y->P))
			break;
	}
	return k > N ? N : k > n ? n : k;
}

/* Places a block in the best session that does not hold the exercise yet: within the set
 * limit first, then least extra load above the cap, then the lowest peak of its muscles,
 * then the fewest sets. */
static void place(struct lay *y, const struct block *b)
{
	const double *a = row(y, b->e);
	int best = -1, N = y->l->nsessions;
	double bkey[4] = { 0 };

	for (int pass = 0; pass < 2 && best < 0; pass++)
		for (int s = 0; s < N; s++) {
			double key[4], peak = 0;
			if (!pass && *cell(y, s, b->e))
				continue;
			for (int m = 0; m < SD_NMUSCLES; m++)
				if (a[m] > 0)
					peak = fmax(peak, y->load[(size_t)s * SD_NMUSCLES + m] + b->size * a[m]);
			key[0] = y->P ? fmax(0, y->count[s] + b->size - y->P) : 0;
			key[1] = cap_cost(y, s, b->e, b->size);
			key[2] = peak;
			key[3] = y->count[s];
			int better = best < 0;
			for (int i = 0; i < 4 && !better; i++) {
				if (key[i] < bkey[i] - TOL)
					better = 1;
				else if (key[i] > bkey[i] + TOL)
					break;
			}
			if (better) {
				best = s;
				memcpy(bkey, key, sizeof key);
			}
		}
	put(y, best, b->e, b->size);
}

/* Moves single sets out of sessions above the set limit, each to the session with room
 * where it adds least load above the cap. */
static void fix_limit(struct lay *y)
{
	int N = y->l->nsessions, n = y->l->ncand;
	for (int guard = 0; guard < 100000; guard++) {
		int from = -1, be = -1, bt = -1;
		double bc = HUGE_VAL;
		for (int s = 0; s < N && from < 0; s++)
			if (y->count[s] > y->P)
				from = s;
		if (from < 0)
			return;
		for (int e = 0; e < n; e++) {
			if (!*cell(y, from, e))
				continue;
			for (int t = 0; t < N; t++) {
				if (t == from || y->count[t] >= y->P)
					continue;
				double c = cap_cost(y, t, e, 1) + cap_cost(y, from, e, -1);
				if (c < bc - TOL) {
					bc = c;
					be = e;
					bt = t;
				}
			}
		}
		if (be < 0)
			return;
		put(y, from, be, -1);
		put(y, bt, be, 1);
	}
}

/* Moves single sets between sessions while that lowers the total load above the cap. */
static void fix_cap(struct lay *y)
{
	int N = y->l->nsessions, n = y->l->ncand;
	for (int guard = 0; guard < 100000; guard++) {
		int bs = -1, be = -1, bt = -1;
		double bc = -TOL;
		for (int s = 0; s < N; s++) {
			int hot = 0;
			for (int m = 0; m < SD_NMUSCLES && !hot; m++)
				hot = over(y->load[(size_t)s * SD_NMUSCLES + m], y->cap) > 0;
			if (!hot)
				continue;
			for (int e = 0; e < n; e++) {
				if (!*cell(y, s, e))
					continue;
				double out = cap_cost(y, s, e, -1);
				if (out >= -TOL)
					continue;
				for (int t = 0; t < N; t++) {
					if (t == s || (y->P && y->count[t] >= y->P))
						continue;
					double c = out + cap_cost(y, t, e, 1);
					if (c < bc) {
						bc = c;
						bs = s;
						be = e;
						bt = t;
					}
				}
			}
		}
		if (bs < 0)
			return;
		put(y, bs, be, -1);
		put(y, bt, be, 1);
	}
}

int allot_layout(const struct allot_problem *p, const int *sets, int nsessions,
		 int per_session, double cap, struct allot_layout *out, struct sd_err *e)
{
	struct lay y = { p, out, per_session, cap, NULL, NULL };
	struct block *blocks = NULL;
	int nb = 0, rc = -1;

	memset(out, 0, sizeof *out);
	if (nsessions < 1)
		return sd_usage(e, "the number of sessions must be at least 1");
	out->nsessions = nsessions;
	out->ncand = p->ncand;
	out->sets = calloc((size_t)nsessions * (size_t)p->ncand, sizeof *out->sets);
	y.count = calloc((size_t)nsessions, sizeof *y.count);
	y.load = calloc((size_t)nsessions * SD_NMUSCLES, sizeof *y.load);
	if (!out->sets || !y.count || !y.load) {
		sd_fail(e, "out of memory");
		goto done;
	}
	for (int c = 0; c < p->ncand; c++)
		if (sets[c] > 0)
			nb += pieces(&y, c, sets[c]);
	if (nb && !(blocks = calloc((size_t)nb, sizeof *blocks))) {
		sd_fail(e, "out of memory");
		goto done;
	}
	nb = 0;
	for (int c = 0; c < p->ncand; c++) {
		if (sets[c] <= 0)
			continue;
		double asum = 0;
		int k = pieces(&y, c, sets[c]);
		for (int m = 0; m < SD_NMUSCLES; m++)
			asum += row(&y, c)[m];
		for (int i = 0; i < k; i++) {
			int size = sets[c] / k + (i < sets[c] % k);
			blocks[nb++] = (struct block){ c, size, size * asum };
		}
	}
	qsort(blocks, (size_t)nb, sizeof *blocks, by_weight);
	for (int i = 0; i < nb; i++)
		place(&y, &blocks[i]);
	if (per_session > 0)
		fix_limit(&y);
	fix_cap(&y);
	for (int s = 0; s < nsessions; s++) {
		if (per_session > 0 && y.count[s] > per_session)
			out->over_limit++;
		for (int m = 0; m < SD_NMUSCLES; m++)
			if (over(y.load[(size_t)s * SD_NMUSCLES + m], cap) > 0)
				out->over_cap++;
	}
	rc = 0;
done:
	free(blocks);
	free(y.count);
	free(y.load);
	if (rc)
		allot_layout_free(out);
	return rc;
}

double allot_session_load(const struct allot_problem *p, const struct allot_layout *l, int s,
			  int m)
{
	double f = 0;
	for (int e = 0; e < l->ncand; e++)
		f += l->sets[(size_t)s * (size_t)l->ncand + (size_t)e] * p->a[(size_t)e * SD_NMUSCLES + m];
	return f;
}

void allot_layout_free(struct allot_layout *l)
{
	free(l->sets);
	l->sets = NULL;
}
