/* The response model (core/response.h): the test-error rule, each observation's place in its
 * predictive distribution, the athlete's posterior deviation worked by hand on a two-lift
 * example, and the roster's REML variances and posteriors against metafor on an invented,
 * simulated roster (tests/data/ref/make_roster.R). */
#include "testutil.h"

#include <stdlib.h>
#include <string.h>

#include "core/e1rm.h"
#include "core/response.h"
#include "io/profile_io.h"

static struct sd_profile lin, bundled;

static int setup(void **state)
{
	struct sd_err e;
	(void)state;
	if (profile_load("tests/data/linear-profile.ini", &lin, &e) ||
	    profile_load("profiles/strength.ini", &bundled, &e)) {
		fprintf(stderr, "%s\n", e.msg);
		return -1;
	}
	return 0;
}

/* The equations' disagreement at r reps: the sample variance of ln(e1RM/load) over the seven
 * formulas of e1rm.c. At 5 reps, by hand from the published equations (e1rm.c names them):
 * Epley 1 + 5/30 = 1.166667, Brzycki 36/32 = 1.125, Lander 100/(101.3 - 13.35615) = 1.137085,
 * Lombardi 5^0.1 = 1.174619, Mayhew 100/(52.2 + 41.9 e^-0.275) = 1.190493, O'Conner 1.125,
 * Wathan 100/(48.8 + 53.8 e^-0.375) = 1.165713; metafor's script (R's var) gives 0.000499522. */
static void test_rule(void **state)
{
	double l[7], m = 0, ss = 0;
	(void)state;
	for (int f = 0; f < E1RM_NFORMULAS; f++)
		m += (l[f] = log(e1rm_raw(f, 1, 5))) / 7;
	for (int f = 0; f < E1RM_NFORMULAS; f++)
		ss += (l[f] - m) * (l[f] - m);
	assert_near(l[E1RM_BRZYCKI], log(1.125), 1e-12);
	assert_near(resp_equation_var(5), ss / 6, 1e-15);
	assert_near(resp_equation_var(5), 0.000499521706062, 1e-12);   /* make_roster.R, eqvar_5 */
	assert_near(resp_equation_var(3), 0.00065253990255, 1e-12);    /* eqvar_3 */
	assert_near(resp_equation_var(1), 0, 0);
	/* Same rep count: the conversion cancels, 2 t^2. Different: each test adds its own. */
	assert_near(resp_change_var(0.03, 5, 5), 0.0018, 1e-15);
	assert_near(resp_change_var(0.03, 1, 1), 0.0018, 1e-15);
	assert_near(resp_change_var(0.03, 3, 5), 0.0018 + 0.00065253990255 + 0.000499521706062, 1e-12);
	assert_near(resp_change_var(0.03, 1, 8), 0.0018 + 0.000438347401638, 1e-12);
	/* A test and a training estimate: 0.03^2 + 0.06^2 = 0.0045, plus the equations'
	 * disagreement at 3 and 5 reps when the counts differ. */
	assert_near(resp_change_var2(0.03, 0.06, 5, 5), 0.0045, 1e-15);
	assert_near(resp_change_var2(0.03, 0.06, 3, 5), 0.0045 + 0.00065253990255 + 0.000499521706062,
		    1e-12);
	assert_near(resp_change_var2(0.03, 0.03, 3, 5), resp_change_var(0.03, 3, 5), 1e-15);
}

/* Two lifts of one athlete under the linear test profile (y = 0.02 + 0.01 x, V = diag(1e-4,
 * 1e-6), tau2 + sigma2 = 0.0025, athlete variance 0.0024), test error 2 t^2 = 0.0018:
 *   lift 1: dose 8, obs 0.15, yhat 0.10, d1 = 0.05;   lift 2: dose 4, obs 0.02, yhat 0.06, d2 = -0.04
 *   curve covariance z_j'V z_l: C11 = 1e-4 + 64e-6 = 0.000164, C22 = 0.000116, C12 = 0.000132
 * In different blocks: Sigma0 = C + B I + v I with B = 0.0025, so
 *   S11 = 0.004464, S22 = 0.004416, S12 = 0.000132, det = 1.96956e-5,
 *   S^-1 1 = (0.004284, 0.004332)/det, s = 437.4581, t = 0.00004092/det = 2.077621,
 *   posterior mean A t/(1 + A s) = 0.0024324, var A/(1 + A s) = 0.0011708.
 * The test recomputes these from the 2x2 inverse written out, and again by the full-covariance
 * form E[a|d] = A 1'S^-1 d with S = Sigma0 + A 11' (the form make_roster.R uses). */
static void personal_by_hand(double same_block)
{
	struct resp_obs o[2];
	struct resp_vars v;
	struct resp_personal p;
	struct sd_covars c = { 10, 0 };
	double A = 0.0024, B = 0.0025, vt = 0.0018;

	resp_prior_vars(&lin, lin.athlete_var, &v);
	assert_near(v.athlete, A, 0);
	assert_near(v.block, B, 1e-15);
	resp_obs_set(&lin, &c, 8, 0.15, vt, 1, &o[0]);
	resp_obs_set(&lin, &c, 4, 0.02, vt, same_block ? 1 : 2, &o[1]);
	assert_near(o[0].yhat, 0.10, 1e-15);
	assert_near(o[1].yhat, 0.06, 1e-15);
	assert_int_equal(resp_personal(&lin, o, 2, &v, 0.95, &p, NULL), 0);

	double s11 = 0.000164 + B + vt, s22 = 0.000116 + B + vt, s12 = 0.000132 + same_block * B;
	double det = s11 * s22 - s12 * s12;
	double w1 = (s22 - s12) / det, w2 = (s11 - s12) / det;     /* S0^-1 1 */
	double s = w1 + w2, t = w1 * 0.05 + w2 * -0.04;
	assert_near(p.mean, A * t / (1 + A * s), 1e-12);
	assert_near(p.sd, sqrt(A / (1 + A * s)), 1e-12);
	assert_near(p.raw, t / s, 1e-12);
	assert_near(p.raw_se, 1 / sqrt(s), 1e-12);
	assert_near(p.weight, A * s / (1 + A * s), 1e-12);
	assert_near(p.lo, p.mean - 1.959963985 * p.sd, 1e-9);
	if (!same_block) {
		assert_near(det, 1.96956e-5, 1e-10);
		assert_near(s, 437.4581, 1e-3);
		assert_near(t, 2.077621, 1e-5);
		assert_near(p.mean, 0.0024324, 1e-7);
		assert_near(p.sd * p.sd, 0.0011708, 1e-7);
	}
	/* Full-covariance form: S = S0 + A 11'. */
	double f11 = s11 + A, f22 = s22 + A, f12 = s12 + A, fd = f11 * f22 - f12 * f12;
	double u1 = (f22 - f12) / fd, u2 = (f11 - f12) / fd;
	assert_near(p.mean, A * (u1 * 0.05 + u2 * -0.04), 1e-12);
	assert_near(p.sd * p.sd, A - A * A * (u1 + u2), 1e-12);
}

static void test_personal_two_blocks(void **state)
{
	(void)state;
	personal_by_hand(0);
}

/* The same two lifts in one block share its deviation: the data say less about the athlete. */
static void test_personal_one_block(void **state)
{
	struct resp_obs o[2];
	struct resp_vars v;
	struct resp_personal two, one;
	struct sd_covars c = { 10, 0 };
	(void)state;
	personal_by_hand(1);
	resp_prior_vars(&lin, lin.athlete_var, &v);
	resp_obs_set(&lin, &c, 8, 0.15, 0.0018, 1, &o[0]);
	resp_obs_set(&lin, &c, 4, 0.02, 0.0018, 2, &o[1]);
	resp_personal(&lin, o, 2, &v, 0.95, &two, NULL);
	o[1].block = 1;
	resp_personal(&lin, o, 2, &v, 0.95, &one, NULL);
	assert_true(one.weight < two.weight);
	assert_true(one.sd > two.sd);
}

/* Each observation's predictive distribution: N(yhat, z'Vz + A + B + v); with no data the
 * posterior is the prior. */
static void test_observe_and_prior(void **state)
{
	struct resp_obs o;
	struct resp_vars v;
	struct resp_fit f;
	struct resp_personal p;
	struct sd_covars c = { 10, 0 };
	(void)state;
	resp_prior_vars(&lin, lin.athlete_var, &v);
	resp_obs_set(&lin, &c, 8, 0.15, 0.0018, 1, &o);
	resp_observe(&lin, &o, &v, 0.95, &f);
	double sd = sqrt(0.000164 + 0.0024 + 0.0025 + 0.0018);
	assert_near(f.sd, sd, 1e-12);
	assert_near(f.z, 0.05 / sd, 1e-12);
	/* sd = sqrt(0.006864) = 0.0828493, z = 0.603506; Phi(0.6035) from the normal table
	 * (Abramowitz & Stegun 1964, Table 26.1): Phi(0.60) = 0.7257, Phi(0.61) = 0.7291;
	 * interpolated 0.7269. */
	assert_near(f.z, 0.603506, 1e-6);
	assert_near(f.pctile, 72.69, 0.02);
	assert_near(f.hi, 0.10 + 1.959963985 * sd, 1e-9);
	assert_int_equal(resp_personal(&lin, NULL, 0, &v, 0.95, &p, NULL), 0);
	assert_near(p.mean, 0, 0);
	assert_near(p.sd, sqrt(0.0024), 1e-15);
	assert_near(p.weight, 0, 0);
	/* The bundled profile's priors: A its between-athlete variance, B = tau2 + sigma2, so one
	 * observation's variance is the "one athlete" band's plus test error. */
	resp_prior_vars(&bundled, bundled.athlete_var, &v);
	resp_obs_set(&bundled, &c, 10, 0.2, 0.0018, 1, &o);
	resp_observe(&bundled, &o, &v, 0.95, &f);
	struct sd_point pt;
	curve_eval(&bundled, &c, 10, 0.95, &pt);
	assert_near(f.sd * f.sd, pt.sd_athlete * pt.sd_athlete + 0.0018, 1e-15);
}

/* ---- against metafor on the simulated roster ---- */

struct roster_ref {
	double mean_dev, mean_dev_se, var_athlete, var_block;
	int n, athletes, repeated;
	double amean[3], asd[3];
	int an[3];
};

static int read_ref(struct roster_ref *r)
{
	FILE *f = fopen("tests/data/ref/roster_fits.txt", "r");
	char line[256], key[64];
	double v;
	if (!f)
		return -1;
	while (fgets(line, sizeof line, f)) {
		if (line[0] == '#' || sscanf(line, "%63s = %lf", key, &v) != 2)
			continue;
		if (!strcmp(key, "mean_dev")) r->mean_dev = v;
		else if (!strcmp(key, "mean_dev_se")) r->mean_dev_se = v;
		else if (!strcmp(key, "var_athlete")) r->var_athlete = v;
		else if (!strcmp(key, "var_block")) r->var_block = v;
		else if (!strcmp(key, "n")) r->n = (int)v;
		else if (!strcmp(key, "athletes")) r->athletes = (int)v;
		else if (!strcmp(key, "repeated")) r->repeated = (int)v;
		for (int a = 0; a < 3; a++) {
			char k[32];
			snprintf(k, sizeof k, "athlete%d_mean", a + 1);
			if (!strcmp(key, k)) r->amean[a] = v;
			snprintf(k, sizeof k, "athlete%d_sd", a + 1);
			if (!strcmp(key, k)) r->asd[a] = v;
			snprintf(k, sizeof k, "athlete%d_n", a + 1);
			if (!strcmp(key, k)) r->an[a] = (int)v;
		}
	}
	fclose(f);
	return 0;
}

#define MAXOBS 512

struct roster {
	int n, athlete[MAXOBS];
	long long block[MAXOBS];
	double dev[MAXOBS], v[MAXOBS];
	struct resp_obs o[MAXOBS];
};

/* The simulated tests, each observation built by the library from its dose, the block's
 * length and the athlete's status, with the test-error rule. */
static int read_roster(struct roster *r)
{
	FILE *f = fopen("tests/data/ref/roster_tests.csv", "r");
	char line[256];
	r->n = 0;
	if (!f || !fgets(line, sizeof line, f))
		return -1;
	while (fgets(line, sizeof line, f) && r->n < MAXOBS) {
		int a, rp, rq;
		long long b;
		double dose, weeks, trained, obs;
		char lift[64];
		if (sscanf(line, "%d,%lld,%63[^,],%lf,%lf,%lf,%d,%d,%lf", &a, &b, lift, &dose, &weeks,
			   &trained, &rp, &rq, &obs) != 9)
			return -1;
		struct sd_covars c = { weeks, trained };
		double v = resp_change_var(RESP_TEST_SD, rp, rq);
		resp_obs_set(&bundled, &c, dose, obs, v, b, &r->o[r->n]);
		r->athlete[r->n] = a;
		r->block[r->n] = b;
		r->dev[r->n] = obs - r->o[r->n].yhat;
		r->v[r->n] = v;
		r->n++;
	}
	fclose(f);
	return 0;
}

/* Tolerances as for the meta-regression references (tests/data/ref/README.md): fixed effects
 * 1e-5 absolute, variance components 1e-6 absolute; the posteriors 1e-9 at metafor's own
 * variances (the same closed form, two algebraic routes) and 1e-6 at ours. */
static void test_roster_vs_metafor(void **state)
{
	static struct roster r;
	struct roster_ref ref = { 0 };
	struct resp_vars v;
	struct sd_err e;
	(void)state;

	assert_int_equal(read_ref(&ref), 0);
	assert_int_equal(read_roster(&r), 0);
	assert_int_equal(r.n, ref.n);
	resp_prior_vars(&bundled, bundled.athlete_var, &v);
	struct resp_roster rr = { r.n, r.athlete, r.block, r.dev, r.v };
	assert_int_equal(resp_roster_vars(&rr, &v, &e), 0);
	assert_int_equal(v.roster_athletes, ref.athletes);
	assert_int_equal(v.roster_repeated, ref.repeated);
	assert_true(v.estimated);
	assert_near(v.athlete, ref.var_athlete, 1e-6);
	assert_near(v.block, ref.var_block, 1e-6);
	assert_near(v.mean_dev, ref.mean_dev, 1e-5);
	assert_near(v.mean_dev_se, ref.mean_dev_se, 1e-5);

	for (int a = 0; a < 3; a++) {
		struct resp_obs mine[MAXOBS];
		struct resp_personal p;
		struct resp_vars at = v;
		int n = 0;
		for (int i = 0; i < r.n; i++)
			if (r.athlete[i] == a + 1)
				mine[n++] = r.o[i];
		assert_int_equal(n, ref.an[a]);
		at.athlete = ref.var_athlete;
		at.block = ref.var_block;
		assert_int_equal(resp_personal(&bundled, mine, n, &at, 0.95, &p, &e), 0);
		assert_near(p.mean, ref.amean[a], 1e-9);
		assert_near(p.sd, ref.asd[a], 1e-9);
		assert_int_equal(resp_personal(&bundled, mine, n, &v, 0.95, &p, &e), 0);
		assert_near(p.mean, ref.amean[a], 1e-6);
		assert_near(p.sd, ref.asd[a], 1e-6);
	}
}

/* Below the threshold the priors stay, and the reason is given. */
static void test_roster_too_small(void **state)
{
	static struct roster r;
	struct resp_vars v;
	struct sd_err e;
	int n = 0;
	(void)state;
	assert_int_equal(read_roster(&r), 0);
	while (n < r.n && r.athlete[n] <= RESP_EB_MIN_ATHLETES - 1)
		n++;
	resp_prior_vars(&bundled, bundled.athlete_var, &v);
	struct resp_roster rr = { n, r.athlete, r.block, r.dev, r.v };
	assert_int_equal(resp_roster_vars(&rr, &v, &e), 0);
	assert_false(v.estimated);
	assert_int_equal(v.roster_athletes, RESP_EB_MIN_ATHLETES - 1);
	assert_near(v.athlete, bundled.athlete_var, 0);
	assert_non_null(strstr(v.why, "too small"));
}

int main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(test_rule),
		cmocka_unit_test(test_personal_two_blocks),
		cmocka_unit_test(test_personal_one_block),
		cmocka_unit_test(test_observe_and_prior),
		cmocka_unit_test(test_roster_vs_metafor),
		cmocka_unit_test(test_roster_too_small),
	};
	return cmocka_run_group_tests_name("response", tests, setup, NULL);
}
