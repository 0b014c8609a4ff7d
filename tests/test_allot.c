/* Allotment of a weekly set budget: results checked against hand calculation and against the
 * exhaustive optimum found by brute force on small instances; on large ones the allotment must
 * be proved within the stated tolerance of an upper bound. Then the session layout.
 *
 * Per muscle the objective is g(F) = b (f(F) - f(0)); with the bundled reciprocal form and
 * b = -0.20 that is g(F) = 0.2 F / (F + 1). */
#include "testutil.h"

#include <stdlib.h>
#include <string.h>

#include "core/allot.h"
#include "io/library_io.h"

#define NM SD_NMUSCLES

static double gf(double F)
{
	return 0.2 * F / (F + 1);
}

static void base(struct allot_problem *p, const double *a, int n, int budget)
{
	memset(p, 0, sizeof *p);
	p->ncand = n;
	p->a = a;
	p->budget = budget;
	p->form = SD_FORM_RECIPROCAL;
	p->b_dose = -0.20;
	for (int m = 0; m < NM; m++) {
		p->weight[m] = 1;
		p->max[m] = 30;
	}
}

/* One exercise (bench press: chest 1, triceps and front delts 0.5), 5 sets: all five go to
 * it; value g(5) + 2 g(2.5) = 1/6 + 2 (0.5/3.5) = 0.452381. */
static void one_exercise(void **state)
{
	double a[NM] = { 0 };
	struct allot_problem p;
	struct allot_result r;
	struct sd_err e;
	(void)state;
	a[SD_CHEST] = 1;
	a[SD_TRICEPS] = a[SD_FRONT_DELTS] = 0.5;
	base(&p, a, 1, 5);
	assert_int_equal(allot_solve(&p, &r, &e), 0);
	assert_int_equal(r.sets[0], 5);
	assert_int_equal(r.used, 5);
	assert_near(r.value, 1.0 / 6 + 2 * 0.5 / 3.5, 1e-12);
	assert_near(r.dose[SD_CHEST], 5, 0);
	assert_near(r.dose[SD_TRICEPS], 2.5, 0);
	assert_true(r.proved);
	/* The fifth set bought g(5) - g(4) + 2 (g(2.5) - g(2)); a sixth would buy
	 * g(6) - g(5) + 2 (g(3) - g(2.5)). */
	assert_near(r.last_set, gf(5) - gf(4) + 2 * (gf(2.5) - gf(2)), 1e-12);
	assert_near(r.next_set, gf(6) - gf(5) + 2 * (gf(3) - gf(2.5)), 1e-12);
	allot_free(&r);
}

/* Where a greedy step per set goes wrong (found by search, checked by hand). Four muscles
 * with priority 1: X trains front and rear delts (1 each), Y rear and side delts, Z front
 * delts (1) and chest (0.5). Budget 4.
 *   greedy, ties to the first: X (0.2), Y (0.1333), Z (0.1), Y (0.05, tied with Z): sets
 *   (1, 2, 1), loads chest 0.5, front 2, side 2, rear 3: g(.5) + 2 g(2) + g(3) = 0.483333.
 *   best: (0, 2, 2), loads chest 1, front 2, side 2, rear 2: g(1) + 3 g(2) = 0.5. */
static void greedy_is_not_enough(void **state)
{
	double a[3 * NM] = { 0 };
	struct allot_problem p;
	struct allot_result r;
	struct sd_err e;
	int n[3] = { 0 };
	(void)state;
	a[0 * NM + SD_FRONT_DELTS] = a[0 * NM + SD_REAR_DELTS] = 1;
	a[1 * NM + SD_REAR_DELTS] = a[1 * NM + SD_SIDE_DELTS] = 1;
	a[2 * NM + SD_FRONT_DELTS] = 1;
	a[2 * NM + SD_CHEST] = 0.5;
	base(&p, a, 3, 4);
	for (int m = 0; m < NM; m++)
		p.weight[m] = m <= SD_REAR_DELTS;
	/* The greedy pass, done here to show its result. */
	for (int s = 0; s < 4; s++) {
		int best = 0;
		double bv = -1, v0 = allot_value(&p, n);
		for (int j = 0; j < 3; j++) {
			n[j]++;
			double d = allot_value(&p, n) - v0;
			n[j]--;
			if (d > bv + 1e-12) {
				bv = d;
				best = j;
			}
		}
		n[best]++;
	}
	assert_int_equal(n[0], 1);
	assert_int_equal(n[1], 2);
	assert_int_equal(n[2], 1);
	assert_near(allot_value(&p, n), gf(0.5) + 2 * gf(2) + gf(3), 1e-12);
	assert_near(allot_value(&p, n), 0.483333333, 1e-9);

	assert_int_equal(allot_solve(&p, &r, &e), 0);
	assert_int_equal(r.sets[0], 0);
	assert_int_equal(r.sets[1], 2);
	assert_int_equal(r.sets[2], 2);
	assert_near(r.value, 0.5, 1e-12);
	allot_free(&r);
}

/* A small deterministic generator, so the instances are the same everywhere. */
static unsigned long long rng = 88172645463325252ULL;
static int rnd(int n)
{
	rng ^= rng << 13;
	rng ^= rng >> 7;
	rng ^= rng << 17;
	return (int)(rng % (unsigned long long)n);
}

struct brute {
	const struct allot_problem *p;
	int n[8];
	double best;
	int found;
	int bestn[8];
};

static void enumerate(struct brute *b, int c, int left)
{
	if (c == b->p->ncand) {
		if (allot_feasible(b->p, b->n)) {
			double v = allot_value(b->p, b->n);
			if (!b->found || v > b->best) {
				b->best = v;
				memcpy(b->bestn, b->n, sizeof b->n);
			}
			b->found = 1;
		}
		return;
	}
	/* Counts the session rules do not allow are skipped here; allot_feasible would refuse
	 * them anyway. */
	for (int k = 0; k <= left; k++) {
		if (allot_pieces(b->p, k) < 0)
			continue;
		b->n[c] = k;
		enumerate(b, c + 1, left - k);
	}
	b->n[c] = 0;
}

/* Checks a solve against the brute-force optimum: 1 when solved (feasible, proved, the same
 * value), 0 when both agree there is nothing to solve. */
static int matches_brute(const struct allot_problem *p, const struct brute *b, int rc,
			 const struct allot_result *r, const struct sd_err *e, int t, int *infeasible)
{
	if (!b->found) {
		if (rc == 0)
			fail_msg("instance %d: no allotment is feasible, allot found one", t);
		(*infeasible)++;
		return 0;
	}
	/* Refused on purpose: no candidate reaches a muscle that counts, or the fatigue budget
	 * pays for no exercise; every feasible allotment is then worth 0. */
	if (rc && e->code == SD_EXIT_USAGE && (strstr(e->msg, "priority above 0") ||
					      strstr(e->msg, "cannot pay for one exercise"))) {
		assert_near(b->best, 0, 0);
		return 0;
	}
	if (rc)
		fail_msg("instance %d: %s", t, e->msg);
	assert_true(allot_feasible(p, r->sets));
	assert_true(r->proved);
	assert_near(r->value, b->best, 1e-9 * fmax(1, fabs(b->best)));
	assert_near(r->value, allot_value(p, r->sets), 1e-12);
	assert_true(r->bound >= b->best - 1e-12);
	return 1;
}

/* Random instance over six muscles (so exercises overlap): 1-2 direct muscles and 0-2
 * indirect ones per exercise, priorities 0-3, sometimes a --min or a low maximum, and each
 * of the four dose forms. */
static void random_problem(struct allot_problem *p, double *a, int ncand, int budget)
{
	static const enum sd_form forms[] = { SD_FORM_RECIPROCAL, SD_FORM_LOG, SD_FORM_SQRT,
					      SD_FORM_LINEAR };
	static const double bs[] = { -0.20, 0.05, 0.03, 0.01 };
	int f = rnd(8) < 5 ? 0 : 1 + rnd(3);

	memset(a, 0, sizeof(double) * (size_t)(ncand * NM));
	for (int c = 0; c < ncand; c++) {
		int nd = 1 + rnd(2), ni = rnd(3);
		for (int k = 0; k < nd; k++)
			a[c * NM + rnd(6)] = 1;
		for (int k = 0; k < ni; k++) {
			int m = rnd(6);
			if (!a[c * NM + m])
				a[c * NM + m] = 0.5;
		}
	}
	base(p, a, ncand, budget);
	p->form = forms[f];
	p->b_dose = bs[f];
	for (int m = 0; m < NM; m++)
		p->weight[m] = m < 6 ? rnd(4) : 0;
	p->weight[rnd(6)] += 1;
	if (rnd(4) == 0)
		p->min[rnd(6)] = rnd(5);
	if (rnd(3) == 0)
		p->max[rnd(6)] = 2 + rnd(6);
}

/* Up to 6 candidates and a budget up to 16: the allotment equals the exhaustive optimum. */
static void equals_brute_force(void **state)
{
	double a[6 * NM];
	int solved = 0, infeasible = 0;
	(void)state;
	for (int t = 0; t < 250; t++) {
		struct allot_problem p;
		struct allot_result r;
		struct sd_err e;
		struct brute b = { &p, { 0 }, 0, 0, { 0 } };
		int ncand = 1 + rnd(6), budget = 1 + rnd(16), rc;

		random_problem(&p, a, ncand, budget);
		enumerate(&b, 0, budget);
		rc = allot_solve(&p, &r, &e);
		if (!matches_brute(&p, &b, rc, &r, &e, t, &infeasible))
			continue;
		assert_true(r.relaxation >= b.best - 1e-12);
		solved++;
		allot_free(&r);
	}
	assert_true(solved > 150);
	assert_true(infeasible > 0);
}

/* Seven candidates, budget 18, exact: still the brute-force optimum. */
static void equals_brute_force_medium(void **state)
{
	double a[7 * NM];
	(void)state;
	for (int t = 0; t < 3; t++) {
		struct allot_problem p;
		struct allot_result r;
		struct sd_err e;
		struct brute b = { &p, { 0 }, 0, 0, { 0 } };
		random_problem(&p, a, 7, 18);
		for (int m = 0; m < NM; m++)
			p.min[m] = 0;
		enumerate(&b, 0, 18);
		assert_true(b.found);
		assert_int_equal(allot_solve(&p, &r, &e), 0);
		assert_near(r.value, b.best, 1e-9 * fmax(1, fabs(b.best)));
		allot_free(&r);
	}
}

/* The 40 library exercises of the benchmark (tests/bench/b_allot.sh): their rows, and a cost
 * per set of 1.5 for a multi-joint lift and 1 for a single-joint one when cost is not NULL. */
static void load40(struct sd_library *lib, double *a, double *cost)
{
	static const char *names[] = {
		"back squat", "front squat", "deadlift", "romanian deadlift", "leg press",
		"hack squat", "bulgarian split squat", "leg extension", "lying leg curl",
		"nordic curl", "hip thrust", "glute bridge", "adductor machine",
		"standing calf raise", "seated calf raise", "back extension", "good morning",
		"bench press", "incline bench press", "close-grip bench press", "dip",
		"chest fly machine", "push-up", "overhead press", "lateral raise", "face pull",
		"rear delt row", "barbell row", "chest-supported row", "lat pulldown", "pull-up",
		"dumbbell pullover", "shrug", "barbell curl", "hammer curl", "triceps pushdown",
		"skull crusher", "wrist curl", "hanging leg raise", "farmer's carry",
	};
	struct sd_err e;
	assert_int_equal(library_load_file("profiles/exercises.ini", lib, &e), 0);
	assert_int_equal(lib_index(lib, &e), 0);
	for (int c = 0; c < 40; c++) {
		int i = lib_find(lib, names[c]);
		assert_true(i >= 0);
		allot_coeffs(lib->ex[i].direct, lib->ex[i].indirect, 1, 0.5, a + c * NM);
		if (cost)
			cost[c] = allot_multi_joint(lib->ex[i].direct, lib->ex[i].indirect) ? 1.5 : 1;
	}
}

/* 40 library exercises, budget 60, the command's tolerance: proved within it of an upper
 * bound, the bound above every other allotment tried, and at least as good as a greedy pass. */
static void large_within_tolerance(void **state)
{
	struct sd_library lib = { 0 };
	struct sd_err e;
	double a[40 * NM];
	struct allot_problem p;
	struct allot_result r;
	int greedy[40] = { 0 };
	(void)state;

	load40(&lib, a, NULL);
	base(&p, a, 40, 60);
	p.tolerance = ALLOT_TOLERANCE;
	for (int m = 0; m < NM; m++)
		p.max[m] = 30;
	assert_int_equal(allot_solve(&p, &r, &e), 0);
	assert_true(r.proved);
	assert_true(r.gap <= ALLOT_TOLERANCE + 1e-12);
	assert_true(r.bound >= r.value);
	assert_true(r.relaxation >= r.bound - 1e-12);
	assert_int_equal(r.used, 60);
	assert_true(allot_feasible(&p, r.sets));

	/* No allotment may beat the bound: greedy, and random ones. */
	for (int s = 0; s < 60; s++) {
		int best = 0;
		double bv = -1, v0 = allot_value(&p, greedy);
		for (int j = 0; j < 40; j++) {
			greedy[j]++;
			double d = allot_value(&p, greedy) - v0;
			greedy[j]--;
			if (d > bv) {
				bv = d;
				best = j;
			}
		}
		greedy[best]++;
	}
	assert_true(allot_value(&p, greedy) <= r.bound + 1e-12);
	assert_true(r.value >= allot_value(&p, greedy) - 1e-12);
	for (int t = 0; t < 200; t++) {
		int n[40] = { 0 };
		for (int s = 0; s < 60; s++)
			n[rnd(40)]++;
		assert_true(allot_value(&p, n) <= r.bound + 1e-12);
	}
	allot_free(&r);

	/* The same with every muscle's maximum at 10 (one session under the cap). */
	for (int m = 0; m < NM; m++)
		p.max[m] = 10;
	assert_int_equal(allot_solve(&p, &r, &e), 0);
	assert_true(allot_feasible(&p, r.sets));
	assert_true(r.gap <= ALLOT_TOLERANCE + 1e-12 || !r.proved);
	allot_free(&r);
	lib_free(&lib);
}

/* Every default candidate is in the bundled library, and between them they train every
 * muscle directly. */
static void default_candidates(void **state)
{
	struct sd_library lib = { 0 };
	struct sd_err e;
	sd_mset direct = 0;
	int n = 0;
	(void)state;
	assert_int_equal(library_load_file("profiles/exercises.ini", &lib, &e), 0);
	assert_int_equal(lib_index(&lib, &e), 0);
	for (; allot_default_candidates[n]; n++) {
		int i = lib_find(&lib, allot_default_candidates[n]);
		assert_true(i >= 0);
		direct |= lib.ex[i].direct;
	}
	assert_true(n >= 20 && n <= 30);
	assert_int_equal(direct, (1u << NM) - 1);
	lib_free(&lib);
}

static void bad_problems(void **state)
{
	double a[2 * NM] = { 0 };
	struct allot_problem p;
	struct allot_result r;
	struct sd_err e;
	(void)state;
	a[SD_CHEST] = 1;
	a[NM + SD_QUADS] = a[NM + SD_GLUTES] = 1;
	base(&p, a, 2, 0);
	assert_int_equal(allot_check(&p, &e), -1);
	assert_int_equal(e.code, SD_EXIT_USAGE);
	assert_non_null(strstr(e.msg, "at least 1 set"));

	base(&p, a, 2, 10);
	p.min[SD_CALVES] = 2;
	assert_int_equal(allot_check(&p, &e), -1);
	assert_non_null(strstr(e.msg, "no candidate exercise trains calves"));

	base(&p, a, 2, 5);
	p.min[SD_CHEST] = 6;
	assert_int_equal(allot_check(&p, &e), -1);
	assert_non_null(strstr(e.msg, "chest=6 needs at least 6 sets"));

	/* Each alone fits, together they do not: chest 4 and quads 4 need 8 sets. */
	base(&p, a, 2, 7);
	p.min[SD_CHEST] = 4;
	p.min[SD_QUADS] = 4;
	assert_int_equal(allot_check(&p, &e), -1);
	assert_non_null(strstr(e.msg, "together they need at least 8 sets"));

	/* Quads 4 takes 4 squats, which give glutes 4, above its maximum of 2: no check before
	 * the search sees it, the search does. */
	base(&p, a, 2, 7);
	p.min[SD_QUADS] = 4;
	p.max[SD_GLUTES] = 2;
	assert_int_equal(allot_check(&p, &e), 0);
	assert_int_equal(allot_solve(&p, &r, &e), -1);
	assert_int_equal(e.code, SD_EXIT_FAIL);
	assert_non_null(strstr(e.msg, "meets the --min limits"));

	base(&p, a, 2, 7);
	p.min[SD_CHEST] = 12;
	p.max[SD_CHEST] = 10;
	assert_int_equal(allot_check(&p, &e), -1);
	assert_non_null(strstr(e.msg, "above the most"));

	base(&p, a, 2, 7);
	for (int m = 0; m < NM; m++)
		p.weight[m] = 0;
	assert_int_equal(allot_check(&p, &e), -1);
	assert_non_null(strstr(e.msg, "priority 0"));

	/* Session rules that cannot hold, and a fatigue budget below the cheapest exercise at its
	 * least sets (2 sets at 0.75). */
	double cost[2] = { 0.75, 2 };
	base(&p, a, 2, 7);
	p.min_sets = 4;
	p.max_sets = 3;
	assert_int_equal(allot_check(&p, &e), -1);
	assert_non_null(strstr(e.msg, "--min-sets 4 is above --max-sets 3"));
	base(&p, a, 2, 7);
	p.min_sets = 2;
	p.cost = cost;
	p.fatigue_budget = 1.4;
	assert_int_equal(allot_check(&p, &e), -1);
	assert_non_null(strstr(e.msg, "costs 0.75 a set, 1.5 for 2 sets"));
	p.weight[SD_CHEST] = 0;   /* the cheap one then trains nothing that counts */
	assert_int_equal(allot_check(&p, &e), -1);
	assert_non_null(strstr(e.msg, "costs 2 a set, 4 for 2 sets"));
	p.weight[SD_CHEST] = 1;
	p.fatigue_budget = 1.5;
	assert_int_equal(allot_check(&p, &e), 0);
	cost[1] = 0;
	assert_int_equal(allot_check(&p, &e), -1);
	assert_non_null(strstr(e.msg, "fatigue costs must be above 0"));

	/* A convex or falling curve is refused: the method needs a concave, rising one. */
	base(&p, a, 2, 7);
	p.b_dose = 0.2;
	assert_int_equal(allot_check(&p, &e), -1);
	p.form = SD_FORM_LOG;
	p.b_dose = -0.1;
	assert_int_equal(allot_check(&p, &e), -1);
}

/* --min met at the least cost to the rest: with a budget of 6, bench press and squat, equal
 * priorities, and --min quads=5, five squats and one bench press. */
static void min_is_met(void **state)
{
	double a[2 * NM] = { 0 };
	struct allot_problem p;
	struct allot_result r;
	struct sd_err e;
	(void)state;
	a[SD_CHEST] = 1;
	a[NM + SD_QUADS] = a[NM + SD_GLUTES] = 1;
	base(&p, a, 2, 6);
	p.min[SD_QUADS] = 5;
	assert_int_equal(allot_solve(&p, &r, &e), 0);
	assert_int_equal(r.sets[1], 5);
	assert_int_equal(r.sets[0], 1);
	assert_near(r.value, gf(1) + 2 * gf(5), 1e-12);
	allot_free(&r);
}

/* A priority-0 muscle with no --min does not attract sets, and sets that would buy nothing
 * are left unallotted. */
static void nothing_to_buy(void **state)
{
	double a[2 * NM] = { 0 };
	struct allot_problem p;
	struct allot_result r;
	struct sd_err e;
	(void)state;
	a[SD_CHEST] = 1;
	a[NM + SD_CALVES] = 1;
	base(&p, a, 2, 20);
	p.weight[SD_CALVES] = 0;
	p.max[SD_CHEST] = 8;
	assert_int_equal(allot_solve(&p, &r, &e), 0);
	assert_int_equal(r.sets[0], 8);
	assert_int_equal(r.sets[1], 0);
	assert_int_equal(r.used, 8);
	assert_near(r.next_set, 0, 0);
	assert_int_equal(r.distinct, 1);
	allot_free(&r);
}

/* Brute force with the session rules on: 2-5 candidates, 1-3 sessions, 2-3 sets at least and
 * 3-5 at most per session, 1-3 exercises per session, and a fatigue budget on some (costs 0.75
 * to 2.5 per set). Each rule must bind on some instances: the optimum without it breaks it. */
static void rules_problem(struct allot_problem *p, double *a, double *cost, int ncand)
{
	static const double costs[] = { 0.75, 1, 1.5, 2.5 };
	random_problem(p, a, ncand, 4 + rnd(11));
	p->cost = cost;
	for (int c = 0; c < ncand; c++)
		cost[c] = costs[rnd(4)];
	p->nsessions = 1 + rnd(3);
	p->min_sets = 2 + rnd(2);
	p->max_sets = p->min_sets + 1 + rnd(3);
	if (p->max_sets > 5)
		p->max_sets = 5;
	p->max_exercises = 1 + rnd(3);
	p->fatigue_budget = rnd(3) ? 0 : 4 + rnd(12);
	/* Half the time the last candidate is a dominated copy of the first: the same loads on
	 * the six muscles that may count, half a set more on one that does not (priority 0, no
	 * --min), and no less fatigue. */
	if (ncand >= 3 && rnd(2)) {
		memcpy(a + (ncand - 1) * NM, a, sizeof(double) * NM);
		a[(ncand - 1) * NM + 6 + rnd(10)] += 0.5;
		cost[ncand - 1] = cost[0] + 0.25 * rnd(3);
	}
}

/* Which rule a brute-force optimum without the rules breaks. */
static void rules_broken(const struct allot_problem *p, const int *n, int *mins, int *places,
			 int *fatigue)
{
	int pl = 0, bad = 0;
	for (int c = 0; c < p->ncand; c++) {
		int k = (n[c] + p->max_sets - 1) / p->max_sets;
		pl += k;
		bad |= n[c] > 0 && (n[c] < p->min_sets || k > p->nsessions);
	}
	*mins += bad;
	*places += pl > p->nsessions * p->max_exercises;
	*fatigue += p->fatigue_budget > 0 && allot_fatigue(p, n) > p->fatigue_budget + 1e-9;
}

static void equals_brute_force_rules(void **state)
{
	double a[5 * NM], cost[5];
	int solved = 0, infeasible = 0, b_mins = 0, b_places = 0, b_fat = 0, dominated = 0, dused = 0;
	(void)state;
	for (int t = 0; t < 300; t++) {
		struct allot_problem p, free_p;
		struct allot_result r, rc_;
		struct sd_err e;
		int ncand = 2 + rnd(4), rc;
		rules_problem(&p, a, cost, ncand);
		struct brute b = { &p, { 0 }, 0, 0, { 0 } };
		enumerate(&b, 0, p.budget);
		/* The same without the rules: its optimum shows which rules bind. */
		free_p = p;
		free_p.nsessions = free_p.min_sets = free_p.max_sets = free_p.max_exercises = 0;
		free_p.fatigue_budget = 0;
		struct brute fb = { &free_p, { 0 }, 0, 0, { 0 } };
		enumerate(&fb, 0, p.budget);
		rc = allot_solve(&p, &r, &e);
		if (!matches_brute(&p, &b, rc, &r, &e, t, &infeasible))
			continue;
		if (fb.found && fb.best > b.best + 1e-9)
			rules_broken(&p, fb.bestn, &b_mins, &b_places, &b_fat);
		if (ncand >= 3 && !memcmp(a, a + (ncand - 1) * NM, sizeof(double) * 6)) {
			dominated++;
			dused += r.sets[ncand - 1] > 0;
		}
		/* Cold starts give the same optimum. */
		p.cold = 1;
		assert_int_equal(allot_solve(&p, &rc_, &e), 0);
		assert_near(rc_.value, b.best, 1e-9 * fmax(1, fabs(b.best)));
		allot_free(&rc_);
		/* And the layout of the optimum keeps every rule. */
		struct allot_layout l;
		assert_int_equal(allot_layout(&p, r.sets, 0, 10, &l, &e), 0);
		assert_int_equal(l.broken, 0);
		allot_layout_free(&l);
		solved++;
		allot_free(&r);
	}
	print_message("rules: %d solved, %d infeasible; optimum without the rules breaks min/max "
		      "sets %d times, exercises per session %d, fatigue budget %d; %d with a "
		      "dominated copy (used in %d)\n", solved, infeasible, b_mins, b_places, b_fat,
		      dominated, dused);
	assert_true(solved > 200);
	assert_true(b_mins >= 20 && b_places >= 20 && b_fat >= 10 && dominated >= 50);
}

/* Minimum sets bind by hand: bench press and a lateral raise, 5 sets, 1 session, at least 2
 * and at most 5 sets of a chosen exercise. Without the rule the best is 4 bench + 1 raise
 * (g(4) + 2 g(2) + g(1) = 0.16 + 0.26667 + 0.1 = 0.52667, checked against 5 + 0: 0.45238 and
 * 3 + 2: 0.15 + 0.24 + 0.13333 = 0.52333); with it, 3 + 2. */
static void min_sets_by_hand(void **state)
{
	double a[2 * NM] = { 0 };
	struct allot_problem p;
	struct allot_result r;
	struct sd_err e;
	(void)state;
	a[SD_CHEST] = 1;
	a[SD_TRICEPS] = a[SD_FRONT_DELTS] = 0.5;
	a[NM + SD_SIDE_DELTS] = 1;
	base(&p, a, 2, 5);
	p.tolerance = 0;
	assert_int_equal(allot_solve(&p, &r, &e), 0);
	assert_int_equal(r.sets[0], 4);
	assert_int_equal(r.sets[1], 1);
	assert_near(r.value, gf(4) + 2 * gf(2) + gf(1), 1e-12);
	allot_free(&r);
	p.nsessions = 1;
	p.min_sets = 2;
	p.max_sets = 5;
	assert_int_equal(allot_solve(&p, &r, &e), 0);
	assert_int_equal(r.sets[0], 3);
	assert_int_equal(r.sets[1], 2);
	assert_near(r.value, gf(3) + 2 * gf(1.5) + gf(2), 1e-12);
	assert_int_equal(r.places, 2);
	allot_free(&r);
	/* One exercise a session: the single best one, bench press, 5 sets. */
	p.max_exercises = 1;
	assert_int_equal(allot_solve(&p, &r, &e), 0);
	assert_int_equal(r.sets[0], 5);
	assert_int_equal(r.sets[1], 0);
	allot_free(&r);
	/* Fatigue: bench 1.5 a set, raise 0.75; a budget of 6 fits 3 bench + 2 raises (6.0). */
	double cost[2] = { 1.5, 0.75 };
	p.max_exercises = 0;
	p.cost = cost;
	p.fatigue_budget = 6;
	assert_int_equal(allot_solve(&p, &r, &e), 0);
	assert_int_equal(r.sets[0], 3);
	assert_int_equal(r.sets[1], 2);
	assert_near(r.fatigue, 6, 1e-12);
	allot_free(&r);
	/* A budget of 5.9 does not. By hand: 2 bench + 3 raises (5.25) is
	 * g(2) + 2 g(1) + g(3) = 0.13333 + 0.2 + 0.15 = 0.48333, beating 2 + 2 (4.5; 0.46667),
	 * 3 + 0 (4.5; g(3) + 2 g(1.5) = 0.39) and 0 + 5 (3.75; g(5) = 0.16667). */
	p.fatigue_budget = 5.9;
	assert_int_equal(allot_solve(&p, &r, &e), 0);
	assert_int_equal(r.sets[0], 2);
	assert_int_equal(r.sets[1], 3);
	assert_near(r.value, gf(2) + 2 * gf(1) + gf(3), 1e-12);
	assert_near(r.value, 0.483333333, 1e-9);
	allot_free(&r);
}

/* A dominated exercise: the same chest and triceps load as bench press plus half a set for the
 * lower back (priority 0) at more fatigue. It is used only once bench press is full (5 sets a
 * session), and the value is the brute-force optimum either way. */
static void dominated_exercise(void **state)
{
	double a[2 * NM] = { 0 }, cost[2] = { 1.5, 2 };
	struct allot_problem p;
	struct allot_result r;
	struct sd_err e;
	(void)state;
	a[SD_CHEST] = a[NM + SD_CHEST] = 1;
	a[SD_TRICEPS] = a[NM + SD_TRICEPS] = 0.5;
	a[NM + SD_LOWER_BACK] = 0.5;
	base(&p, a, 2, 10);
	p.weight[SD_LOWER_BACK] = 0;
	p.cost = cost;
	p.nsessions = 2;
	p.min_sets = 2;
	p.max_sets = 5;
	p.tolerance = 0;
	struct brute b = { &p, { 0 }, 0, 0, { 0 } };
	enumerate(&b, 0, p.budget);
	assert_int_equal(allot_solve(&p, &r, &e), 0);
	assert_near(r.value, b.best, 1e-12);
	assert_int_equal(r.sets[0], 10);
	assert_int_equal(r.sets[1], 0);
	assert_near(r.value, gf(10) + gf(5), 1e-12);
	assert_near(r.fatigue, 15, 1e-12);
	allot_free(&r);
	p.nsessions = 1;
	struct brute b1 = { &p, { 0 }, 0, 0, { 0 } };
	enumerate(&b1, 0, p.budget);
	assert_int_equal(allot_solve(&p, &r, &e), 0);
	assert_near(r.value, b1.best, 1e-12);
	assert_int_equal(r.sets[0], 5);
	assert_int_equal(r.sets[1], 5);
	allot_free(&r);
}

/* The allowed weekly counts: 0, or k pieces of min..max sets (2 at least once split). */
static void allowed_counts(void **state)
{
	struct allot_problem p;
	double a[NM] = { 0 };
	(void)state;
	base(&p, a, 1, 40);
	p.nsessions = 3;
	p.min_sets = 3;
	p.max_sets = 4;
	/* 1 piece 3-4, 2 pieces 6-8, 3 pieces 9-12: 5 needs 2 pieces of at least 3. */
	static const int want[] = { 0, -1, -1, 1, 1, -1, 2, 2, 2, 3, 3, 3, 3, -1 };
	for (int n = 0; n < 14; n++)
		assert_int_equal(allot_pieces(&p, n), want[n]);
	/* --min-sets 1: one set alone is allowed, but a split piece has 2 at least (3 = 2 + 1 and
	 * 5 = 2 + 2 + 1 are not). */
	p.min_sets = 1;
	p.max_sets = 2;
	static const int want1[] = { 0, 1, 1, -1, 2, -1, 3, -1 };
	for (int n = 0; n < 8; n++)
		assert_int_equal(allot_pieces(&p, n), want1[n]);
}

/* 40 library exercises, budget 60, the command's rules and fatigue costs, exact: proved
 * optimal, every rule kept, and warm and cold starts agree. */
static void large_with_rules(void **state)
{
	struct sd_library lib = { 0 };
	struct sd_err e;
	double a[40 * NM], cost[40];
	struct allot_problem p;
	struct allot_result r, rc_;
	struct allot_layout l;
	(void)state;

	load40(&lib, a, cost);
	base(&p, a, 40, 60);
	p.cost = cost;
	p.nsessions = 3;
	p.min_sets = ALLOT_MIN_SETS;
	p.max_sets = ALLOT_MAX_SETS;
	p.max_exercises = ALLOT_MAX_EXERCISES;
	p.tolerance = 0;
	for (int m = 0; m < NM; m++)
		p.max[m] = 30;
	p.weight[SD_LOWER_BACK] = p.weight[SD_FOREARMS] = p.weight[SD_ABS] = 0;
	p.weight[SD_ADDUCTORS] = 0;
	assert_int_equal(allot_solve(&p, &r, &e), 0);
	if (!r.proved || r.gap > 1.5e-9 * fmax(1, r.value))
		fail_msg("not proved: %ld nodes, gap %g", r.nodes, r.gap);
	assert_true(allot_feasible(&p, r.sets));
	assert_true(r.places <= 18);
	p.cold = 1;
	assert_int_equal(allot_solve(&p, &rc_, &e), 0);
	assert_near(rc_.value, r.value, 1e-9 * r.value);
	print_message("40 candidates, budget 60, rules on, exact: %ld nodes and %ld Newton steps "
		      "warm, %ld and %ld cold\n", r.nodes, r.newton, rc_.nodes, rc_.newton);
	allot_free(&rc_);
	p.cold = 0;
	/* A fatigue budget below the plan's fatigue binds and is kept. */
	double f = r.fatigue;
	allot_free(&r);
	p.fatigue_budget = floor(0.8 * f);
	p.tolerance = ALLOT_TOLERANCE;
	assert_int_equal(allot_solve(&p, &r, &e), 0);
	assert_true(r.fatigue <= p.fatigue_budget + 1e-9);
	assert_true(allot_feasible(&p, r.sets));
	assert_int_equal(allot_layout(&p, r.sets, 0, 10, &l, &e), 0);
	assert_int_equal(l.broken, 0);
	allot_layout_free(&l);
	allot_free(&r);
	lib_free(&lib);
}

/* The multi-joint rule on the bundled library's maps (common practice, no source). */
static void multi_joint(void **state)
{
	static const char *multi[] = { "bench press", "back squat", "deadlift",
				       "romanian deadlift", "overhead press", "barbell row",
				       "lat pulldown", "pull-up", "dip", "leg press", "hip thrust",
				       "upright row", NULL };
	static const char *single[] = { "lateral raise", "leg extension", "lying leg curl",
					"barbell curl", "hammer curl", "triceps pushdown",
					"standing calf raise", "chest fly machine", "face pull",
					"wrist curl", "shrug", "hanging leg raise", "adductor machine",
					NULL };
	struct sd_library lib = { 0 };
	struct sd_err e;
	(void)state;
	assert_int_equal(library_load_file("profiles/exercises.ini", &lib, &e), 0);
	assert_int_equal(lib_index(&lib, &e), 0);
	for (int i = 0; multi[i]; i++) {
		int x = lib_find(&lib, multi[i]);
		assert_true(x >= 0);
		if (!allot_multi_joint(lib.ex[x].direct, lib.ex[x].indirect))
			fail_msg("%s should be multi-joint", multi[i]);
	}
	for (int i = 0; single[i]; i++) {
		int x = lib_find(&lib, single[i]);
		assert_true(x >= 0);
		if (allot_multi_joint(lib.ex[x].direct, lib.ex[x].indirect))
			fail_msg("%s should be single-joint", single[i]);
	}
	lib_free(&lib);
}

static void layout(void **state)
{
	double a[3 * NM] = { 0 }, cost[3] = { 1.5, 2, 1 };
	struct allot_problem p;
	struct allot_layout l;
	struct sd_err e;
	(void)state;
	a[SD_CHEST] = 1;                          /* bench-like */
	a[SD_TRICEPS] = a[SD_FRONT_DELTS] = 0.5;
	a[NM + SD_QUADS] = a[NM + SD_GLUTES] = 1; /* squat-like */
	a[2 * NM + SD_CHEST] = 1;                 /* fly-like */
	base(&p, a, 3, 40);
	p.cost = cost;
	p.nsessions = 3;
	p.min_sets = 2;
	p.max_sets = 5;
	p.max_exercises = 6;

	/* 12 sets of one exercise over 3 sessions: 4 + 4 + 4. */
	int one[3] = { 12, 0, 0 };
	assert_int_equal(allot_layout(&p, one, 0, 10, &l, &e), 0);
	for (int s = 0; s < 3; s++)
		assert_int_equal(l.sets[s * 3], 4);
	assert_int_equal(l.over_cap, 0);
	assert_int_equal(l.broken, 0);
	allot_layout_free(&l);

	/* 10 + 8 + 6 sets: every piece 2 to 5 sets, chest at most 10 a session, and each session
	 * within one set and within 2 fatigue of the mean (24 sets, 15 + 16 + 6 = 37 fatigue). */
	int mix[3] = { 10, 8, 6 };
	assert_int_equal(allot_layout(&p, mix, 0, 10, &l, &e), 0);

	assert_int_equal(l.broken, 0);
	assert_int_equal(l.over_cap, 0);
	for (int s = 0; s < 3; s++) {
		assert_true(abs(allot_session_sets(&l, s) - 8) <= 1);
		assert_true(fabs(allot_session_fatigue(&p, &l, s) - 37.0 / 3) <= 2);
		assert_true(allot_session_load(&p, &l, s, SD_CHEST) <= 10);
	}
	allot_layout_free(&l);

	/* One session cannot keep 12 chest sets under 10: said, not hidden. */
	int many[3] = { 5, 0, 5 };
	p.nsessions = 1;
	assert_int_equal(allot_layout(&p, many, 0, 8, &l, &e), 0);
	assert_int_equal(l.over_cap, 1);
	assert_int_equal(l.broken, 0);
	allot_layout_free(&l);
}

/* The layout keeps every rule whenever the weekly constraints hold: random allotments that
 * meet them (allowed counts, places within sessions x exercises), 1-6 sessions, 1-6 exercises
 * a session, piece limits 1-3 to that plus 0-3. */
static void layout_always_succeeds(void **state)
{
	double a[12 * NM];
	int tried = 0, tight = 0;
	(void)state;
	for (int t = 0; t < 3000; t++) {
		struct allot_problem p;
		struct allot_layout l;
		struct sd_err e;
		int sets[12] = { 0 }, n = 2 + rnd(11), places = 0;
		random_problem(&p, a, n, 200);
		p.nsessions = 1 + rnd(6);
		p.max_exercises = 1 + rnd(6);
		p.min_sets = 1 + rnd(3);
		p.max_sets = p.min_sets + rnd(4);
		for (int c = 0; c < n; c++) {
			int v = rnd(3 * p.max_sets * p.nsessions / 2 + 1), k = allot_pieces(&p, v);
			if (k < 0 || places + k > p.nsessions * p.max_exercises)
				continue;
			sets[c] = v;
			places += k;
		}
		tight += places == p.nsessions * p.max_exercises;
		assert_int_equal(allot_layout(&p, sets, rnd(2) ? 0 : 10, 1 + rnd(10), &l, &e), 0);
		if (l.broken)
			fail_msg("layout %d breaks %d rules", t, l.broken);
		allot_layout_free(&l);
		tried++;
	}
	print_message("layout: %d allotments laid out, %d with every exercise place taken\n", tried,
		      tight);
	assert_true(tight > 100);
}

int main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(one_exercise),
		cmocka_unit_test(greedy_is_not_enough),
		cmocka_unit_test(equals_brute_force),
		cmocka_unit_test(equals_brute_force_medium),
		cmocka_unit_test(equals_brute_force_rules),
		cmocka_unit_test(min_sets_by_hand),
		cmocka_unit_test(allowed_counts),
		cmocka_unit_test(dominated_exercise),
		cmocka_unit_test(large_within_tolerance),
		cmocka_unit_test(large_with_rules),
		cmocka_unit_test(default_candidates),
		cmocka_unit_test(multi_joint),
		cmocka_unit_test(bad_problems),
		cmocka_unit_test(min_is_met),
		cmocka_unit_test(nothing_to_buy),
		cmocka_unit_test(layout),
		cmocka_unit_test(layout_always_succeeds),
	};
	return cmocka_run_group_tests(tests, NULL, NULL);
}
