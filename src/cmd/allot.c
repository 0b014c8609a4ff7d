/* allot: the whole sets per exercise that buy the most priority-weighted predicted gain within
 * a weekly set budget and the session rules, laid out over the sessions, optionally written as
 * a program file. Four steps: the problem (options, candidates, limits), the solve, the layout
 * (and its audit), the output. */
#include <math.h>
#include <stdarg.h>
#include <stddef.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <strings.h>

#include "../core/allot.h"
#include "../core/text.h"
#include "../core/audit.h"
#include "../io/allot_out.h"
#include "../io/program_write.h"
#include "dbutil.h"
#include "../app/progarg.h"
#include "cmd.h"

extern const struct sd_cmd cmd_allot;

_Static_assert((int)ALLOT_TABLE == (int)SD_FMT_TABLE && (int)ALLOT_CSV == (int)SD_FMT_CSV &&
	       (int)ALLOT_JSON == (int)SD_FMT_JSON, "io/allot_out.h formats follow SD_FMT_*");

#define MAX_BUDGET 500
#define MAX_SESSIONS 14
#define DEFAULT_SESSIONS 3
#define DEFAULT_RIR 2           /* the effort written on every set; common practice, no source */

/* The muscles a coach programs for when no --priority says otherwise: chest, back (lats,
 * upper back), delts, arms (biceps, triceps), quads, hamstrings, glutes, calves. The others
 * (lower back, forearms, abs, adductors) are counted and shown but not aimed at: they get
 * work from the lifts above. */
static const int default_targets[] = {
	SD_CHEST, SD_LATS, SD_UPPER_BACK, SD_FRONT_DELTS, SD_SIDE_DELTS, SD_REAR_DELTS,
	SD_BICEPS, SD_TRICEPS, SD_QUADS, SD_HAMSTRINGS, SD_GLUTES, SD_CALVES,
};

struct allot_args {
	long long budget, sessions, max_per_session, node_limit, min_sets, max_sets, max_exercises;
	double minutes, per_set, cap, tolerance, fatigue_budget;
	const char *candidates, *from, *write, *effort;
	int force, explain, cold, no_floor;
	int rir;                         /* from --effort */
	char effort_text[16];
	double weight[SD_NMUSCLES], min[SD_NMUSCLES];
	int wset[SD_NMUSCLES], minset[SD_NMUSCLES];
	double others;
	int others_set;
};

static int unknown_muscle(const char *opt, const char *name, struct sd_err *e)
{
	char list[256] = "";
	for (int m = 0; m < SD_NMUSCLES; m++)
		snprintf(list + strlen(list), sizeof list - strlen(list), "%s%s", m ? ", " : "",
			 muscle_name(m));
	return sd_usage(e, "unknown muscle '%s' in --%s (muscles: %s)", name, opt, list);
}

/* "muscle=VALUE,muscle=VALUE"; --priority also takes "others=VALUE" for every muscle it does
 * not name. A muscle named twice is refused rather than silently taking one of the values. */
static int parse_list(const char *opt, const char *arg, double hi, double *val, int *set,
		      double *others, int *others_set, struct sd_err *e)
{
	char buf[1024];
	if (strlen(arg) >= sizeof buf)
		return sd_usage(e, "--%s list is too long", opt);
	snprintf(buf, sizeof buf, "%s", arg);
	for (char *save, *tok = strtok_r(buf, ",", &save); tok; tok = strtok_r(NULL, ",", &save)) {
		char *eq = strchr(tok, '='), *end, *name;
		double x;
		int m;
		if (!eq)
			return sd_usage(e, "--%s wants muscle=NUMBER pairs, not '%s'", opt, text_trim(tok));
		*eq = '\0';
		name = text_trim(tok);
		x = strtod(text_trim(eq + 1), &end);
		if (end == text_trim(eq + 1) || *end || !(x >= 0 && x <= hi))
			return sd_usage(e, "--%s %s wants a number from 0 to %g, not '%s'", opt, name, hi,
					text_trim(eq + 1));
		if (others && !strcasecmp(name, "others")) {
			if (*others_set)
				return sd_usage(e, "--%s names 'others' twice", opt);
			*others = x;
			*others_set = 1;
			continue;
		}
		if ((m = muscle_find(name)) < 0)
			return unknown_muscle(opt, name, e);
		if (set[m])
			return sd_usage(e, "--%s names %s twice", opt, muscle_name(m));
		val[m] = x;
		set[m] = 1;
	}
	return 0;
}

/* ---- The options: one table, read by one loop ---------------------------------------- */

static int opt_budget(void *dst, const struct sd_optdef *d, const char *arg, struct sd_err *e)
{
	struct allot_args *a = dst;

	(void)d;
	/* Zero and negative budgets get their own words: the commonest slip. */
	char *end;
	double x = strtod(arg, &end);
	if (end != arg && !*end && x <= 0)
		return sd_usage(e, "--budget must be at least 1 set, not '%s'", arg);
	return app_int("--budget", arg, 1, MAX_BUDGET, &a->budget, e);
}

static int opt_priority(void *dst, const struct sd_optdef *d, const char *arg, struct sd_err *e)
{
	struct allot_args *a = dst;

	(void)d;
	return parse_list("priority", arg, 1000, a->weight, a->wset, &a->others, &a->others_set, e);
}

static int opt_min(void *dst, const struct sd_optdef *d, const char *arg, struct sd_err *e)
{
	struct allot_args *a = dst;

	(void)d;
	return parse_list("min", arg, 1000, a->min, a->minset, NULL, NULL, e);
}

/* "RIR N", "N RIR" or "RPE N" (RIR = 10 - RPE), whole numbers; the scale is always named,
 * since a bare number means RIR to some coaches and RPE to others. */
static int opt_effort(void *dst, const struct sd_optdef *d, const char *arg, struct sd_err *e)
{
	struct allot_args *a = dst;

	(void)d;
	char w1[8] = "", w2[8] = "";
	int n = -1, k = -1, rpe = -1;
	if (sscanf(arg, " %7[A-Za-z] %d %n", w1, &n, &k) == 2 && k >= 0 && !arg[k])
		rpe = !strcasecmp(w1, "rpe") ? 1 : !strcasecmp(w1, "rir") ? 0 : -1;
	else if (k = -1, sscanf(arg, " %d %7[A-Za-z] %n", &n, w2, &k) == 2 && k >= 0 && !arg[k])
		rpe = !strcasecmp(w2, "rir") ? 0 : -1;
	if (rpe < 0 || n < 0 || n > 10)
		return sd_usage(e, "--effort wants 'RIR N' or 'RPE N' (whole numbers 0 to 10), not '%s'",
				arg);
	a->rir = rpe ? 10 - n : n;
	snprintf(a->effort_text, sizeof a->effort_text, "RIR %d", a->rir);
	return 0;
}

#define ARG(f) offsetof(struct allot_args, f)
static const struct sd_optdef opts[] = {
	{ "budget", OPT_CALL, 0, 0, 0, opt_budget, "SETS",
	  "hard sets a week (or, without it, sessions x sets a session)" },
	{ "sessions", OPT_INT, 1, MAX_SESSIONS, ARG(sessions), NULL, "N",
	  "sessions a week (default: --from's days, else 3)" },
	{ "minutes-per-session", OPT_NUM, 1, 600, ARG(minutes), NULL, "M",
	  "with --minutes-per-set S: at most floor(M/S) sets a session; caps the budget" },
	{ "minutes-per-set", OPT_NUM, 0.25, 60, ARG(per_set), NULL, "S", "see --minutes-per-session" },
	{ "priority", OPT_CALL, 0, 0, 0, opt_priority, "LIST",
	  "weights, e.g. quads=2,glutes=2,others=0.5. Default 1 for the\n"
	  "targets (chest, lats, upper-back, front-, side- and rear-delts,\n"
	  "biceps, triceps, quads, hamstrings, glutes, calves) and 0 for\n"
	  "lower-back, forearms, abs and adductors (counted, not aimed\n"
	  "at); a muscle the list does not name keeps its default" },
	{ "min", OPT_CALL, 0, 0, 0, opt_min, "LIST",
	  "fractional sets a week at least, e.g. calves=4. Without it\n"
	  "each target is held at the profile's practical threshold\n"
	  "(its plateau, 5 with the bundled profile) when a greedy\n"
	  "cover shows the budget and rules allow it" },
	{ "no-floor", OPT_FLAG, 0, 0, ARG(no_floor), NULL, NULL, "no such floors: the objective alone" },
	{ "max-per-session", OPT_INT, 1, MAX_BUDGET, ARG(max_per_session), NULL, "SETS",
	  "hard sets in one session at most" },
	{ "min-sets", OPT_INT, 1, 20, ARG(min_sets), NULL, "N",
	  "sets of a chosen exercise in a session at least (default 2;\n"
	  "an exercise split over sessions has 2 in each at least)" },
	{ "max-sets", OPT_INT, 1, 20, ARG(max_sets), NULL, "N", "... and at most (default 5)" },
	{ "max-exercises", OPT_INT, 1, 30, ARG(max_exercises), NULL, "N",
	  "exercises in one session at most (default 6)\n"
	  "(these three defaults: common practice, no source)" },
	{ "fatigue-budget", OPT_NUM, 0.25, 5000, ARG(fatigue_budget), NULL, "F",
	  "weekly fatigue at most: the sum over sets of each exercise's\n"
	  "cost per set (the library's 'fatigue': 1 a typical machine\n"
	  "or isolation set, heavy squats and hinges 2-2.5); without it\n"
	  "the plan shows its fatigue" },
	{ "effort", OPT_CALL, 0, 0, 0, opt_effort, "'RIR N'",
	  "the effort written on every set ('RPE N' too; default RIR 2,\n"
	  "common practice, no source)" },
	{ "candidates", OPT_STR, 0, 0, ARG(candidates), NULL, "LIST",
	  "exercises to choose from, comma-separated (default: 25 common\n"
	  "exercises covering every muscle); --exercises is the global\n"
	  "library option, hence this name" },
	{ "from", OPT_STR, 0, 0, ARG(from), NULL, "PROGRAM",
	  "choose among the exercises of a program file or stored template" },
	{ "session-cap", OPT_NUM, SD_SESSION_CAP_MIN, SD_SESSION_CAP_MAX, ARG(cap), NULL, "N",
	  "at most N fractional sets per muscle in one session (default\n"
	  "10; common practice, no source): sets are spread to respect it" },
	{ "write", OPT_STR, 0, 0, ARG(write), NULL, "FILE",
	  "write the laid-out plan as a program file ('audit FILE' reads\n"
	  "it back to the same doses)" },
	{ "force", OPT_FLAG, 0, 0, ARG(force), NULL, NULL, "with --write: replace an existing FILE" },
	{ "tolerance", OPT_NUM, 0, 1, ARG(tolerance), NULL, "T",
	  "prove the allotment within T of the best possible objective\n"
	  "(default 0.001, about a thirtieth of the 3% SWC; 0: exact)" },
	{ "node-limit", OPT_INT, 1, 100000000, ARG(node_limit), NULL, "N",
	  "branch-and-bound nodes before stopping (default 20000)" },
	{ "cold-start", OPT_FLAG, 0, 0, ARG(cold), NULL, NULL,
	  "start every node's barrier afresh, as before the warm start\n"
	  "(its multipliers still start at its parent's; slower, the same\n"
	  "answer; to compare)" },
	{ "explain", OPT_FLAG, 0, 0, ARG(explain), NULL, NULL,
	  "print the objective, the defaults in use and the guarantee" },
};
#undef ARG

static void defaults(struct allot_args *a)
{
	memset(a, 0, sizeof *a);
	a->cap = SD_SESSION_CAP;
	a->tolerance = ALLOT_TOLERANCE;
	a->minutes = a->per_set = -1;
	a->budget = a->sessions = a->max_per_session = -1;
	a->min_sets = ALLOT_MIN_SETS;
	a->max_sets = ALLOT_MAX_SETS;
	a->max_exercises = ALLOT_MAX_EXERCISES;
	a->rir = DEFAULT_RIR;
	snprintf(a->effort_text, sizeof a->effort_text, "RIR %d", DEFAULT_RIR);
}

static int parse_args(const struct sd_ctx *ctx, int argc, char **argv, struct allot_args *a,
		      struct sd_err *e)
{
	defaults(a);
	if ((argc = opt_parse("allot", opts, OPT_N(opts), a, argc, argv, e)) < 0)
		return -1;
	if (argc > 1)
		return sd_usage(e, "allot takes no arguments besides options, got '%s' (a program goes "
				"after --from)", argv[1]);
	if (a->candidates && a->from)
		return sd_usage(e, "--candidates and --from both choose the exercises; give one");
	if ((a->minutes > 0) != (a->per_set > 0))
		return sd_usage(e, "--minutes-per-session and --minutes-per-set go together");
	if (a->min_sets > a->max_sets)
		return sd_usage(e, "--min-sets %lld is above --max-sets %lld", a->min_sets, a->max_sets);
	if (a->rir > ctx->opt.max_rir)
		return sd_usage(e, "--effort %s is not a hard set (sets above RIR %d are not counted)",
				a->effort_text, ctx->opt.max_rir);
	return 0;
}

/* ---- The problem ------------------------------------------------------------------------ */

/* Everything one run works on; exec_allot owns it and plan_free releases it. */
struct plan {
	struct allot_args a;
	struct progarg pa;
	struct sd_program from;
	int have_from;
	int N, P, budget;
	double threshold;               /* the profile's practical threshold (plateau) */
	char note[128];
	int ex[ALLOT_MAX_CAND], n;
	double *rows, cost[ALLOT_MAX_CAND];
	int multi[ALLOT_MAX_CAND], order[ALLOT_MAX_CAND];
	struct allot_problem prob;
	struct allot_result res;
	struct allot_layout lay;
	struct sd_program prog;
	struct sd_audit au;
	int day_of[MAX_SESSIONS];
	char notes[ALLOT_NOTES][240];
	int nnotes;
};

/* Sessions, the per-session set limit and the budget, from whichever the user gave; limits
 * that cannot all hold are a usage error naming them. */
static int settle_limits(struct plan *pl, struct sd_err *e)
{
	struct allot_args *a = &pl->a;

	pl->N = a->sessions > 0 ? (int)a->sessions : pl->have_from ? pl->from.ndays : DEFAULT_SESSIONS;
	if (pl->N > MAX_SESSIONS)
		pl->N = MAX_SESSIONS;
	pl->P = 0;
	pl->note[0] = '\0';
	if (a->minutes > 0) {
		int by_time = (int)floor(a->minutes / a->per_set + 1e-9);
		if (by_time < 1)
			return sd_usage(e, "a %g-minute session has no room for a %g-minute set",
					a->minutes, a->per_set);
		pl->P = by_time;
		snprintf(pl->note, sizeof pl->note, "%g min a session / %g min a set", a->minutes,
			 a->per_set);
	}
	if (a->max_per_session > 0 && (!pl->P || a->max_per_session < pl->P)) {
		pl->P = (int)a->max_per_session;
		snprintf(pl->note, sizeof pl->note, "--max-per-session %d", pl->P);
	}
	if (pl->P && pl->P < a->min_sets)
		return sd_usage(e, "conflicting limits: a session of at most %d sets (%s) cannot hold "
				"one exercise at --min-sets %lld", pl->P, pl->note, a->min_sets);
	if (a->budget < 0) {
		if (!pl->P)
			return sd_usage(e, "allot needs --budget SETS, or --minutes-per-session with "
					"--minutes-per-set");
		pl->budget = pl->N * pl->P > MAX_BUDGET ? MAX_BUDGET : pl->N * pl->P;
		return 0;
	}
	pl->budget = (int)a->budget;
	if (pl->budget < a->min_sets)
		return sd_usage(e, "a budget of %d set%s cannot hold one exercise at --min-sets %lld",
				pl->budget, pl->budget == 1 ? "" : "s", a->min_sets);
	if (pl->P && pl->budget > pl->N * pl->P)
		return sd_usage(e, "conflicting limits: a budget of %d sets does not fit %d session%s "
				"of at most %d sets (%s)", pl->budget, pl->N, pl->N == 1 ? "" : "s", pl->P,
				pl->note);
	return 0;
}

/* Priorities, limits and floors per muscle. Each muscle with a priority above 0 and no --min
 * gets the profile's practical threshold as a floor: a coach holds every target at least
 * there before spending sets where they buy the most (kept when the budget and rules allow). */
static int muscle_limits(const struct sd_ctx *ctx, struct plan *pl, struct sd_err *e)
{
	const struct allot_args *a = &pl->a;
	double evid = ctx->profile.dose_max, room = pl->N * a->cap;
	struct allot_problem *p = &pl->prob;
	struct sd_covars cov = app_covars(ctx, pl->have_from ? pl->from.weeks : 0);

	pl->threshold = curve_plateau(&ctx->profile, &cov, 1.0);
	for (int m = 0; m < SD_NMUSCLES; m++) {
		double dflt = 0;
		for (size_t i = 0; i < sizeof default_targets / sizeof default_targets[0]; i++)
			dflt = default_targets[i] == m ? 1 : dflt;
		p->weight[m] = a->wset[m] ? a->weight[m] : a->others_set ? a->others : dflt;
		p->min[m] = a->minset[m] ? a->min[m] : 0;
		/* Never past the evidence, nor more than the sessions can hold under the cap. */
		p->max[m] = fmin(evid, room);
		p->floor[m] = !a->no_floor && !a->minset[m] && p->weight[m] > 0 ? pl->threshold : 0;
		if (p->min[m] > evid)
			return sd_usage(e, "conflicting limits: --min %s=%g is past the evidence range of "
					"the profile (%g weekly fractional sets)", muscle_name(m),
					p->min[m], evid);
		if (p->min[m] > room)
			return sd_usage(e, "conflicting limits: --min %s=%g does not fit %d session%s "
					"under the session cap of %g", muscle_name(m), p->min[m], pl->N,
					pl->N == 1 ? "" : "s", a->cap);
	}
	return 0;
}

static int add_candidate(int *ex, int *n, int idx, struct sd_err *e)
{
	for (int i = 0; i < *n; i++)
		if (ex[i] == idx)
			return 0;  /* an alias of one already listed */
	if (*n >= ALLOT_MAX_CAND)
		return sd_usage(e, "at most %d candidate exercises", ALLOT_MAX_CAND);
	ex[(*n)++] = idx;
	return 0;
}

static int parse_candidates(const struct sd_library *lib, const char *arg, int *ex, int *n,
			    struct sd_err *e)
{
	char *buf = strdup(arg);
	int rc = 0;
	if (!buf)
		return sd_fail(e, "out of memory");
	for (char *save, *tok = strtok_r(buf, ",", &save); tok && !rc;
	     tok = strtok_r(NULL, ",", &save)) {
		char *name = text_trim(tok);
		int idx = lib_find(lib, name), hint[1];
		if (!*name)
			continue;
		if (idx < 0) {
			if (lib_suggest(lib, name, hint, 1) == 1)
				rc = sd_usage(e, "unknown exercise '%s' in --candidates (did you mean '%s'?)",
					      name, lib->ex[hint[0]].name);
			else
				rc = sd_usage(e, "unknown exercise '%s' in --candidates", name);
			break;
		}
		rc = add_candidate(ex, n, idx, e);
	}
	free(buf);
	if (!rc && !*n)
		rc = sd_usage(e, "--candidates names no exercise");
	return rc;
}

static int candidates(const struct sd_ctx *ctx, struct plan *pl, struct sd_err *e)
{
	pl->n = 0;
	if (pl->a.candidates)
		return parse_candidates(&ctx->lib, pl->a.candidates, pl->ex, &pl->n, e);
	if (pl->have_from) {
		for (int i = 0; i < pl->from.nentries; i++)
			if (add_candidate(pl->ex, &pl->n, pl->from.entries[i].ex, e))
				return -1;
		return 0;
	}
	for (int i = 0; allot_default_candidates[i]; i++) {
		int idx = lib_find(&ctx->lib, allot_default_candidates[i]);
		if (idx < 0)
			return sd_fail(e, "the exercise library lacks '%s', one of the default candidates; "
				       "give --candidates", allot_default_candidates[i]);
		if (add_candidate(pl->ex, &pl->n, idx, e))
			return -1;
	}
	return 0;
}

/* Where the fatigue cost of a set comes from: the library's 'fatigue' key (common practice, no
 * source, stated per exercise in profiles/exercises.ini). */
static const char *const cost_source = "the library's fatigue key, common practice, no source";

/* Session order: multi-joint first, then the costlier, then library order. */
static const struct plan *g_order_plan;

static int by_session_order(const void *x, const void *y)
{
	const struct plan *pl = g_order_plan;
	int a = *(const int *)x, b = *(const int *)y;
	if (pl->multi[a] != pl->multi[b])
		return pl->multi[b] - pl->multi[a];
	if (pl->cost[a] != pl->cost[b])
		return pl->cost[a] > pl->cost[b] ? -1 : 1;
	return a - b;
}

static int build_problem(struct sd_ctx *ctx, struct plan *pl, struct sd_err *e)
{
	struct allot_problem *p = &pl->prob;
	const struct allot_args *a = &pl->a;
	int X = (int)a->max_exercises;

	if (settle_limits(pl, e) || candidates(ctx, pl, e) || muscle_limits(ctx, pl, e))
		return -1;
	if (!(pl->rows = calloc((size_t)pl->n * SD_NMUSCLES, sizeof *pl->rows)))
		return sd_fail(e, "out of memory");
	for (int c = 0; c < pl->n; c++) {
		const struct sd_exercise *x = &ctx->lib.ex[pl->ex[c]];
		allot_coeffs(x->direct, x->indirect, ctx->profile.w_direct, ctx->profile.w_indirect,
			     pl->rows + (size_t)c * SD_NMUSCLES);
		pl->cost[c] = x->fatigue;
		pl->multi[c] = allot_multi_joint(x->direct, x->indirect);
		pl->order[c] = c;
	}
	g_order_plan = pl;
	qsort(pl->order, (size_t)pl->n, sizeof *pl->order, by_session_order);
	/* A session of at most P sets holds at most P / min-sets exercises. */
	if (pl->P && pl->P / (int)a->min_sets < X)
		X = pl->P / (int)a->min_sets;
	p->ncand = pl->n;
	p->a = pl->rows;
	p->cost = pl->cost;
	p->budget = pl->budget;
	p->fatigue_budget = a->fatigue_budget;
	p->nsessions = pl->N;
	p->min_sets = (int)a->min_sets;
	p->max_sets = (int)a->max_sets;
	p->max_exercises = X;
	p->form = ctx->profile.form;
	/* The dose slope for this athlete's status and block length ("m:dose" terms included). */
	struct sd_covars cov = app_covars(ctx, pl->have_from ? pl->from.weeks : 0);
	p->b_dose = curve_dose_coef(&ctx->profile, &cov);
	p->node_limit = a->node_limit;
	p->tolerance = a->tolerance;
	p->cold = a->cold;
	return 0;
}

/* ---- The layout as a program ------------------------------------------------------------ */

/* One day per non-empty session, named by its session number, exercises in session order,
 * every graded set at the --effort RIR. */
static int build_program(struct plan *pl, const struct sd_library *lib, int weeks,
			 struct sd_err *e)
{
	const struct allot_layout *l = &pl->lay;
	struct sd_program *p = &pl->prog;

	memset(p, 0, sizeof *p);
	snprintf(p->name, sizeof p->name, "allotment of %d sets over %d sessions", pl->budget,
		 l->nsessions);
	p->weeks = weeks;
	for (int s = 0; s < l->nsessions; s++) {
		char name[32];
		pl->day_of[s] = -1;
		if (!allot_session_sets(l, s))
			continue;
		snprintf(name, sizeof name, "day %d", s + 1);
		if (prog_add_day(p, name, 0, e))
			return -1;
		pl->day_of[s] = p->ndays - 1;
		for (int i = 0; i < l->ncand; i++) {
			int c = pl->order[i], k = l->sets[(size_t)s * (size_t)l->ncand + (size_t)c];
			struct sd_entry en = { .ex = pl->ex[c], .sets = k, .rir = pl->a.rir,
					       .day = p->ndays - 1, .effort = SD_EFFORT_RIR,
					       .eff_lo = pl->a.rir, .eff_hi = pl->a.rir };
			/* Lifts the library marks as not graded by reps in reserve (Olympic lifts,
			 * carries, sleds) carry no RIR: each listed set counts as hard. */
			if (lib->ex[pl->ex[c]].ungraded) {
				en.rir = -1;
				en.effort = SD_EFFORT_NONE;
				en.eff_lo = en.eff_hi = 0;
			}
			if (!k)
				continue;
			if (k > SD_MAX_SETS)
				return sd_fail(e, "%d sets of one exercise in one session is more than a "
					       "program may hold (%d); add sessions", k, SD_MAX_SETS);
			if (prog_add_entry(p, &en, e))
				return -1;
		}
	}
	return 0;
}

static int lay_out(struct sd_ctx *ctx, struct plan *pl, struct sd_err *e)
{
	struct sd_covars cov = app_covars(ctx, pl->have_from ? pl->from.weeks : 0);
	int weeks = cov.weeks == floor(cov.weeks) ? (int)cov.weeks : 0;
	struct sd_audit_opts ao = { ctx->opt.level, ctx->opt.max_rir, pl->a.cap };

	if (allot_layout(&pl->prob, pl->res.sets, pl->P, pl->a.cap, &pl->lay, e) ||
	    build_program(pl, &ctx->lib, weeks, e) ||
	    audit_run(&pl->prog, &ctx->lib, &ctx->profile, &cov, &ao, &pl->au, e))
		return -1;
	if (pl->lay.broken)
		return sd_fail(e, "internal error: the session layout breaks %d rule%s", pl->lay.broken,
			       pl->lay.broken == 1 ? "" : "s");
	return 0;
}

static void add_note(struct plan *pl, const char *fmt, ...) __attribute__((format(printf, 2, 3)));
static void add_note(struct plan *pl, const char *fmt, ...)
{
	va_list ap;
	if (pl->nnotes >= ALLOT_NOTES - 1)
		return;
	va_start(ap, fmt);
	vsnprintf(pl->notes[pl->nnotes++], sizeof pl->notes[0], fmt, ap);
	va_end(ap);
}

static void notes(struct plan *pl)
{
	const struct allot_result *r = &pl->res;
	int budget = pl->budget, floors = 0;
	for (int m = 0; m < SD_NMUSCLES; m++)
		floors |= pl->prob.floor[m] > 0;
	if (floors && r->floored)
		add_note(pl, "every target is held at %g fractional sets at least (the profile's "
			 "practical threshold) before the rest goes where it buys most; --no-floor drops "
			 "this", pl->threshold);
	else if (floors)
		add_note(pl, "the budget and rules could not bring every target to %g fractional sets "
			 "(the profile's practical threshold), so no target is held there; --min sets "
			 "limits one by one", pl->threshold);
	if (r->used < budget)
		add_note(pl, "%d of the %d sets would buy nothing more within the limits (priorities, "
			 "the evidence range, the session cap, the rules per exercise and session%s) "
			 "and are left out", budget - r->used, budget,
			 pl->prob.fatigue_budget > 0 ? ", the fatigue budget" : "");
	if (pl->lay.over_cap)
		add_note(pl, "the sets could not all be spread to keep every muscle at or under %g "
			 "fractional sets a session (%d muscle-session%s over; see the warnings)",
			 pl->a.cap, pl->lay.over_cap, pl->lay.over_cap == 1 ? "" : "s");
	if (pl->lay.over_limit)
		add_note(pl, "%d session%s could not be kept to %d sets (%s): the exercises' pieces do "
			 "not pack that tightly", pl->lay.over_limit, pl->lay.over_limit == 1 ? "" : "s",
			 pl->P, pl->note);
	if (!r->proved)
		add_note(pl, "the search stopped at its node limit: the allotment is within %.4f of "
			 "the best possible (raise --node-limit or --tolerance)", r->gap);
}

/* ---- --explain -------------------------------------------------------------------------- */

static int explain(struct sd_ctx *ctx, struct plan *pl, struct sd_err *e)
{
	const char *names[ALLOT_MAX_CAND + 1];
	struct sd_covars cov = app_covars(ctx, pl->have_from ? pl->from.weeks : 0);

	/* The rules and limits need a budget; any that fits them will do for showing them. */
	if (pl->a.budget < 0 && pl->a.minutes < 0)
		pl->a.budget = pl->a.min_sets;
	if (build_problem(ctx, pl, e))
		return -1;
	for (int c = 0; c < pl->n; c++)
		names[c] = ctx->lib.ex[pl->ex[pl->order[c]]].name;
	names[pl->n] = NULL;
	double cost[ALLOT_MAX_CAND];
	int multi[ALLOT_MAX_CAND];
	for (int c = 0; c < pl->n; c++) {
		cost[c] = pl->cost[pl->order[c]];
		multi[c] = pl->multi[pl->order[c]];
	}
	struct allot_explain x = { &pl->prob, &ctx->profile, curve_plateau(&ctx->profile, &cov, 1.0),
				   pl->have_from ? pl->from.ndays : DEFAULT_SESSIONS, pl->a.cap,
				   pl->a.effort_text, pl->P, names, cost, multi, cost_source };
	allot_out_explain(ctx->out, &x);
	return 0;
}

static int write_plan(struct sd_ctx *ctx, const struct plan *pl, struct sd_err *e)
{
	char comment[512];
	snprintf(comment, sizeof comment,
		 "Written by setdose allot: %d weekly hard sets over %d sessions for the %s "
		 "profile,\nevery set at %s (--effort); fatigue %.1f a week. Add reps as you like.",
		 pl->res.used, pl->N, ctx->profile.name, pl->a.effort_text, pl->res.fatigue);
	return pwrite_file(pl->a.write, &pl->prog, &ctx->lib, comment, pl->a.force, e);
}

static void plan_free(struct plan *pl)
{
	free(pl->rows);
	audit_free(&pl->au);
	prog_free(&pl->prog);
	allot_layout_free(&pl->lay);
	allot_free(&pl->res);
	prog_free(&pl->from);
	progarg_close(&pl->pa);
}

static int exec_allot(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	struct plan *pl = calloc(1, sizeof *pl);
	int rc = -1;

	if (!pl)
		return sd_fail(e, "out of memory");
	if (parse_args(ctx, argc, argv, &pl->a, e))
		goto done;
	if (pl->a.from) {
		if (progarg_load(ctx, &pl->pa, pl->a.from, &pl->from, e))
			goto done;
		pl->have_from = 1;
	}
	if (pl->a.explain) {
		rc = explain(ctx, pl, e);
		goto done;
	}
	if (build_problem(ctx, pl, e) || allot_solve(&pl->prob, &pl->res, e) || lay_out(ctx, pl, e))
		goto done;
	notes(pl);
	struct allot_view view = { &pl->prob, &pl->res, &pl->lay, pl->ex, pl->multi, pl->order,
				   &ctx->lib, &ctx->profile, &pl->prog, &pl->au, pl->day_of, pl->P,
				   pl->a.cap, pl->note[0] ? pl->note : NULL, pl->a.effort_text,
				   { NULL } };
	for (int i = 0; i < pl->nnotes; i++)
		view.notes[i] = pl->notes[i];
	/* The program file is written before anything is printed, so no result is shown for a
	 * write that then fails. */
	if (pl->a.write && write_plan(ctx, pl, e))
		goto done;
	if (allot_out_print(ctx->out, &view, (enum allot_fmt)ctx->opt.format, ctx->opt.color)) {
		sd_fail(e, "out of memory");
		goto done;
	}
	rc = 0;
done:
	plan_free(pl);
	free(pl);
	return rc;
}

const struct sd_cmd cmd_allot = {
	.name = "allot",
	.summary = "the exercise sets that buy the most predicted gain within a weekly set budget",
	.usage = "allot --budget SETS [--sessions N] [--minutes-per-session M --minutes-per-set S]\n"
		 "      [--priority MUSCLE=W,...] [--min MUSCLE=SETS,...] [--max-per-session SETS]\n"
		 "      [--min-sets N] [--max-sets N] [--max-exercises N] [--fatigue-budget F]\n"
		 "      [--effort 'RIR N'] [--no-floor] [--candidates LIST | --from PROGRAM]\n"
		 "      [--session-cap N] [--write FILE [--force]] [--tolerance T] [--node-limit N]\n"
		 "      [--cold-start] [--explain]\n"
		 "Objective: sum over muscles of priority x predicted gain (lnRR over no sets); no muscle\n"
		 "past the profile's evidence range or above sessions x session cap.\n"
		 "Guarantee: the weekly sets per exercise are optimal (within T) among all that meet the\n"
		 "budget, the fatigue budget, the per-muscle limits and rules that make a layout\n"
		 "possible: each exercise 0 sets or a count that splits into pieces of --min-sets to\n"
		 "--max-sets, one piece a session, and the pieces all fitting --max-exercises a session.\n"
		 "Any such allotment can be laid out (proof in core/allot.h); the layout is then a\n"
		 "separate balancing step (sets and fatigue even between sessions, multi-joint lifts\n"
		 "first, the session cap and set limit kept where the pieces allow; what is not kept is\n"
		 "said). Method: branch-and-bound, each exercise used or not and then how many sets;\n"
		 "every bound is the Lagrangian dual of the continuous relaxation (valid for any\n"
		 "multipliers; a log-barrier Newton method finds good ones, each node starting from its\n"
		 "parent's); the first allotment comes from a greedy fill plus exchanges. A branch is\n"
		 "dropped only when its bound cannot beat the best allotment found by more than T, so a\n"
		 "finished search proves the result within T of the best possible ('proved optimal'\n"
		 "when the gap is 0). If the node limit stops it first, the printed gap is still a\n"
		 "proved bound on the shortfall.",
	.flags = CMD_PROFILE | CMD_LIBRARY,
	.exec = exec_allot,
	.opts = opts,
	.nopts = OPT_N(opts),
};
