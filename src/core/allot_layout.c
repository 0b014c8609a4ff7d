/* Session layout of an allotment (core/allot.h): first a placement that always keeps the
 * rules (each exercise in the fewest sessions its sets need, even pieces, the sessions with
 * the most free exercise places first), then moves of sets between sessions that lower a
 * score and keep the rules. */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "allot.h"

#define TOL 1e-9

/* Weights of the score, so that its parts rank: a session above its set limit first, then a
 * muscle above the session cap, then balance. Balance is the spread of sets and of fatigue
 * between sessions (squared deviations from the mean), plus a small pull towards spreading
 * each muscle's load over the week (sum of squared loads per session). */
#define W_LIMIT 1e6
#define W_CAP 1e3
#define W_SPREAD 0.02

struct lay {
	const struct allot_problem *p;
	struct allot_layout *l;
	int N, X, smin, smax, P;
	double cap, mean_sets, mean_fat;
	int *count;                 /* sets per session */
	int *nex;                   /* exercises per session */
	double *fat;                /* fatigue per session */
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

static double cost(const struct lay *y, int e)
{
	return y->p->cost ? y->p->cost[e] : 1;
}

static double over(double x, double cap)
{
	return x > cap + TOL ? x - cap : 0;
}

/* The least sets of one piece when an exercise is in k sessions. */
static int piece_min(const struct lay *y, int k)
{
	return k <= 1 ? y->smin : y->smin > 2 ? y->smin : 2;
}

/* Session s's part of the score, with v more sets of e in it (v may be negative). */
static double part(const struct lay *y, int s, int e, int v)
{
	const double *a = e >= 0 ? row(y, e) : NULL, *ld = y->load + (size_t)s * SD_NMUSCLES;
	double n = y->count[s] + v, f = y->fat[s] + (e >= 0 ? v * cost(y, e) : 0), sc;

	sc = (y->P ? W_LIMIT * over(n, y->P) : 0) + (n - y->mean_sets) * (n - y->mean_sets) +
	     (f - y->mean_fat) * (f - y->mean_fat);
	for (int m = 0; m < SD_NMUSCLES; m++) {
		double L = ld[m] + (a ? v * a[m] : 0);
		sc += W_CAP * over(L, y->cap) + W_SPREAD * L * L;
	}
	return sc;
}

static void put(struct lay *y, int s, int e, int v)
{
	const double *a = row(y, e);
	int *c = cell(y, s, e);
	y->nex[s] += (*c + v > 0) - (*c > 0);
	*c += v;
	y->count[s] += v;
	y->fat[s] += v * cost(y, e);
	for (int m = 0; m < SD_NMUSCLES; m++)
		y->load[(size_t)s * SD_NMUSCLES + m] += v * a[m];
}

static int sessions_of(const struct lay *y, int e)
{
	int k = 0;
	for (int s = 0; s < y->N; s++)
		k += *cell(y, s, e) > 0;
	return k;
}

struct pick {
	int s, free;
	double delta;
};

static int by_free_then_delta(const void *x, const void *z)
{
	const struct pick *a = x, *b = z;
	if (a->free != b->free)
		return b->free - a->free;
	if (a->delta != b->delta)
		return a->delta < b->delta ? -1 : 1;
	return a->s - b->s;
}

/* Places exercise e's n sets in k pieces. The k sessions are those with the most free
 * exercise places (among equals, the ones the score likes best): free places then never differ
 * by more than one between sessions, so k sessions with a free place exist while the places
 * asked for in all do not exceed N x X. Returns -1 when a chosen session has no free place
 * (only when the weekly constraints do not hold). */
static int place(struct lay *y, int e, int n, int k, struct pick *pk)
{
	int size = n / k, extra = n % k, rc = 0;
	for (int s = 0; s < y->N; s++) {
		pk[s].s = s;
		pk[s].free = y->X - y->nex[s];
		pk[s].delta = part(y, s, e, size) - part(y, s, -1, 0);
	}
	qsort(pk, (size_t)y->N, sizeof *pk, by_free_then_delta);
	/* Of the k sessions, the ones with fewer sets take the larger pieces. */
	for (int i = 1; i < k; i++)
		for (int j = i; j > 0 && y->count[pk[j].s] < y->count[pk[j - 1].s]; j--) {
			struct pick t = pk[j];
			pk[j] = pk[j - 1];
			pk[j - 1] = t;
		}
	for (int i = 0; i < k; i++) {
		if (pk[i].free <= 0)
			rc = -1;
		put(y, pk[i].s, e, size + (i < extra));
	}
	return rc;
}

/* Whether moving q sets of e from session s to t keeps the rules: every piece of e within
 * the limits for the number of sessions it is then in, and t within X exercises. */
static int move_ok(const struct lay *y, int e, int s, int t, int q)
{
	int from = *cell(y, s, e), to = *cell(y, t, e), k = sessions_of(y, e);
	int k2 = k - (from == q) + (to == 0), lo = piece_min(y, k2);
	if (q < 1 || q > from || (to == 0 && y->nex[t] >= y->X))
		return 0;
	if (to + q > y->smax || (from > q && from - q < lo))
		return 0;
	for (int r = 0; r < y->N; r++) {
		int v = *cell(y, r, e) + (r == t ? q : 0) - (r == s ? q : 0);
		if (v > 0 && v < lo)
			return 0;
	}
	return 1;
}

/* Best-improvement moves of one set, a whole piece, or a smallest piece split off, while one
 * lowers the score. */
static void improve(struct lay *y)
{
	int n = y->l->ncand;
	for (int guard = 0; guard < 10000; guard++) {
		int be = -1, bs = -1, bt = -1, bq = 0;
		double bd = -1e-9;
		for (int e = 0; e < n; e++)
			for (int s = 0; s < y->N; s++) {
				int from = *cell(y, s, e), qs[3] = { 1, from, piece_min(y, 2) };
				if (!from)
					continue;
				double out0 = part(y, s, -1, 0);
				for (int t = 0; t < y->N; t++) {
					double in0;
					if (t == s)
						continue;
					in0 = part(y, t, -1, 0);
					for (int i = 0; i < 3; i++) {
						int q = qs[i];
						double d;
						if ((i && q == qs[0]) || (i == 2 && q == qs[1]) || !move_ok(y, e, s, t, q))
							continue;
						d = part(y, s, e, -q) - out0 + part(y, t, e, q) - in0;
						if (d < bd) {
							bd = d;
							be = e;
							bs = s;
							bt = t;
							bq = q;
						}
					}
				}
			}
		if (be < 0)
			return;
		put(y, bs, be, -bq);
		put(y, bt, be, bq);
	}
}

static int pieces_needed(const struct lay *y, int n)
{
	int k = (n + y->smax - 1) / y->smax;
	return k < 1 ? 1 : k > y->N ? y->N : k;
}

struct job {
	int e, n, k;
	double weight;
};

static int by_pieces_then_weight(const void *x, const void *z)
{
	const struct job *a = x, *b = z;
	if (a->k != b->k)
		return b->k - a->k;
	if (a->weight != b->weight)
		return a->weight > b->weight ? -1 : 1;
	return a->e - b->e;
}

int allot_layout(const struct allot_problem *p, const int *sets, int per_session, double cap,
		 struct allot_layout *out, struct sd_err *e)
{
	struct lay y;
	struct job *jobs = NULL;
	struct pick *pk = NULL;
	int nj = 0, rc = -1, N = p->nsessions > 0 ? p->nsessions : 1;
	double total_sets = 0, total_fat = 0;

	memset(out, 0, sizeof *out);
	memset(&y, 0, sizeof y);
	out->nsessions = N;
	out->ncand = p->ncand;
	y.p = p;
	y.l = out;
	y.N = N;
	y.X = p->max_exercises > 0 ? p->max_exercises : p->ncand;
	y.smin = p->min_sets > 0 ? p->min_sets : 1;
	y.smax = p->max_sets > 0 ? p->max_sets : 1 << 20;
	y.P = per_session;
	y.cap = cap;
	out->sets = calloc((size_t)N * (size_t)p->ncand, sizeof *out->sets);
	y.count = calloc((size_t)N, sizeof *y.count);
	y.nex = calloc((size_t)N, sizeof *y.nex);
	y.fat = calloc((size_t)N, sizeof *y.fat);
	y.load = calloc((size_t)N * SD_NMUSCLES, sizeof *y.load);
	jobs = calloc((size_t)p->ncand, sizeof *jobs);
	pk = calloc((size_t)N, sizeof *pk);
	if (!out->sets || !y.count || !y.nex || !y.fat || !y.load || !jobs || !pk) {
		sd_fail(e, "out of memory");
		goto done;
	}
	for (int c = 0; c < p->ncand; c++) {
		if (sets[c] <= 0)
			continue;
		int k = allot_pieces(p, sets[c]);
		/* A count the weekly rules do not allow is still laid out (and reported broken). */
		jobs[nj++] = (struct job){ c, sets[c], k > 0 ? k : pieces_needed(&y, sets[c]),
					   sets[c] * cost(&y, c) };
		total_sets += sets[c];
		total_fat += sets[c] * cost(&y, c);
	}
	y.mean_sets = total_sets / N;
	y.mean_fat = total_fat / N;
	qsort(jobs, (size_t)nj, sizeof *jobs, by_pieces_then_weight);
	for (int i = 0; i < nj; i++)
		place(&y, jobs[i].e, jobs[i].n, jobs[i].k, pk);
	improve(&y);
	for (int s = 0; s < N; s++) {
		if (per_session > 0 && y.count[s] > per_session)
			out->over_limit++;
		for (int m = 0; m < SD_NMUSCLES; m++)
			if (over(y.load[(size_t)s * SD_NMUSCLES + m], cap) > 0)
				out->over_cap++;
	}
	out->broken = allot_layout_check(p, sets, out);
	rc = 0;
done:
	free(jobs);
	free(pk);
	free(y.count);
	free(y.nex);
	free(y.fat);
	free(y.load);
	if (rc)
		allot_layout_free(out);
	return rc;
}

int allot_layout_check(const struct allot_problem *p, const int *sets, const struct allot_layout *l)
{
	int broken = 0, smin = p->min_sets > 0 ? p->min_sets : 1;
	int smax = p->max_sets > 0 ? p->max_sets : 1 << 20;
	int X = p->max_exercises > 0 ? p->max_exercises : p->ncand;

	for (int c = 0; c < l->ncand; c++) {
		int sum = 0, k = 0, lo;
		for (int s = 0; s < l->nsessions; s++) {
			int v = l->sets[(size_t)s * (size_t)l->ncand + (size_t)c];
			sum += v;
			k += v > 0;
			broken += v < 0;
		}
		lo = k <= 1 ? smin : smin > 2 ? smin : 2;
		for (int s = 0; s < l->nsessions; s++) {
			int v = l->sets[(size_t)s * (size_t)l->ncand + (size_t)c];
			broken += v > 0 && (v < lo || v > smax);
		}
		broken += sum != sets[c];
	}
	for (int s = 0; s < l->nsessions; s++) {
		int n = 0;
		for (int c = 0; c < l->ncand; c++)
			n += l->sets[(size_t)s * (size_t)l->ncand + (size_t)c] > 0;
		broken += n > X;
	}
	return broken;
}

double allot_session_load(const struct allot_problem *p, const struct allot_layout *l, int s,
			  int m)
{
	double f = 0;
	for (int e = 0; e < l->ncand; e++)
		f += l->sets[(size_t)s * (size_t)l->ncand + (size_t)e] * p->a[(size_t)e * SD_NMUSCLES + m];
	return f;
}

int allot_session_sets(const struct allot_layout *l, int s)
{
	int n = 0;
	for (int e = 0; e < l->ncand; e++)
		n += l->sets[(size_t)s * (size_t)l->ncand + (size_t)e];
	return n;
}

double allot_session_fatigue(const struct allot_problem *p, const struct allot_layout *l, int s)
{
	double f = 0;
	for (int e = 0; e < l->ncand; e++)
		f += l->sets[(size_t)s * (size_t)l->ncand + (size_t)e] * (p->cost ? p->cost[e] : 1);
	return f;
}

void allot_layout_free(struct allot_layout *l)
{
	free(l->sets);
	l->sets = NULL;
}
