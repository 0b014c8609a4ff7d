/* allot: the whole sets per exercise that buy the most priority-weighted predicted gain within
 * a weekly set budget, laid out over the sessions, optionally written as a program file. */
#include <getopt.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <strings.h>

#include "../core/allot.h"
#include "../core/audit.h"
#include "../io/allot_out.h"
#include "../io/program_write.h"
#include "dbutil.h"
#include "progarg.h"
#include "cmd.h"

extern const struct sd_cmd cmd_allot;

#define MAX_BUDGET 500
#define MAX_SESSIONS 14
#define DEFAULT_SESSIONS 3

struct allot_args {
	long long budget, sessions, max_per_session, node_limit;
	double minutes, per_set, cap, tolerance;
	const char *candidates, *from, *write;
	int force;
	double weight[SD_NMUSCLES], min[SD_NMUSCLES];
	int wset[SD_NMUSCLES], minset[SD_NMUSCLES];
	double others;
	int others_set;
};

static char *trim(char *s)
{
	while (*s == ' ' || *s == '\t')
		s++;
	char *end = s + strlen(s);
	while (end > s && (end[-1] == ' ' || end[-1] == '\t'))
		*--end = '\0';
	return s;
}

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
			return sd_usage(e, "--%s wants muscle=NUMBER pairs, not '%s'", opt, trim(tok));
		*eq = '\0';
		name = trim(tok);
		x = strtod(trim(eq + 1), &end);
		if (end == trim(eq + 1) || *end || !(x >= 0 && x <= hi))
			return sd_usage(e, "--%s %s wants a number from 0 to %g, not '%s'", opt, name, hi,
					trim(eq + 1));
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
		char *name = trim(tok);
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

/* One line, without getopt's own message: the option as typed and where the usage is. */
static int bad_option(int argc, char **argv, struct sd_err *e)
{
	const char *bad = optind > 0 && optind <= argc ? argv[optind - 1] : "?";
	if (optopt && !strncmp(bad, "--", 2) && !strchr(bad, '='))
		return sd_usage(e, "option '%s' needs a value (see 'setdose help %s')", bad, "allot");
	return sd_usage(e, "unknown option '%s' (see 'setdose help allot')", bad);
}

static int parse_args(const struct sd_ctx *ctx, int argc, char **argv, struct allot_args *a,
		      struct sd_err *e)
{
	static const struct option longopts[] = {
		{ "budget", required_argument, NULL, 'b' },
		{ "sessions", required_argument, NULL, 'n' },
		{ "minutes-per-session", required_argument, NULL, 'M' },
		{ "minutes-per-set", required_argument, NULL, 'S' },
		{ "priority", required_argument, NULL, 'p' },
		{ "min", required_argument, NULL, 'm' },
		{ "max-per-session", required_argument, NULL, 'x' },
		{ "candidates", required_argument, NULL, 'c' },
		{ "from", required_argument, NULL, 'f' },
		{ "session-cap", required_argument, NULL, 'C' },
		{ "write", required_argument, NULL, 'w' },
		{ "force", no_argument, NULL, 'F' },
		{ "node-limit", required_argument, NULL, 'L' },
		{ "tolerance", required_argument, NULL, 'T' },
		{ NULL, 0, NULL, 0 },
	};
	int c;

	memset(a, 0, sizeof *a);
	a->cap = SD_SESSION_CAP;
	a->tolerance = ALLOT_TOLERANCE;
	a->minutes = a->per_set = -1;
	a->budget = a->sessions = a->max_per_session = -1;
	optind = 0;
	opterr = 0;
	while ((c = getopt_long(argc, argv, "+", longopts, NULL)) != -1) {
		int rc = 0;
		switch (c) {
		case 'b':
			/* Zero and negative budgets get their own words: the commonest slip. */
			{
				char *end;
				double x = strtod(optarg, &end);
				if (end != optarg && !*end && x <= 0)
					return sd_usage(e, "--budget must be at least 1 set, not '%s'", optarg);
			}
			rc = dbu_int("--budget", optarg, 1, MAX_BUDGET, &a->budget, e);
			break;
		case 'n':
			rc = dbu_int("--sessions", optarg, 1, MAX_SESSIONS, &a->sessions, e);
			break;
		case 'M':
			rc = dbu_num("--minutes-per-session", optarg, 1, 600, &a->minutes, e);
			break;
		case 'S':
			rc = dbu_num("--minutes-per-set", optarg, 0.25, 60, &a->per_set, e);
			break;
		case 'p':
			rc = parse_list("priority", optarg, 1000, a->weight, a->wset, &a->others,
					&a->others_set, e);
			break;
		case 'm':
			rc = parse_list("min", optarg, 1000, a->min, a->minset, NULL, NULL, e);
			break;
		case 'x':
			rc = dbu_int("--max-per-session", optarg, 1, MAX_BUDGET, &a->max_per_session, e);
			break;
		case 'c':
			a->candidates = optarg;
			break;
		case 'f':
			a->from = optarg;
			break;
		case 'C':
			rc = dbu_num("--session-cap", optarg, 0.5, 100, &a->cap, e);
			break;
		case 'w':
			a->write = optarg;
			break;
		case 'F':
			a->force = 1;
			break;
		case 'L':
			rc = dbu_int("--node-limit", optarg, 1, 100000000, &a->node_limit, e);
			break;
		case 'T':
			rc = dbu_num("--tolerance", optarg, 0, 1, &a->tolerance, e);
			break;
		default:
			return bad_option(argc, argv, e);
		}
		if (rc)
			return -1;
	}
	if (optind < argc)
		return sd_usage(e, "allot takes no arguments besides options, got '%s' (a program goes "
				"after --from)", argv[optind]);
	if (a->candidates && a->from)
		return sd_usage(e, "--candidates and --from both choose the exercises; give one");
	if ((a->minutes > 0) != (a->per_set > 0))
		return sd_usage(e, "--minutes-per-session and --minutes-per-set go together");
	(void)ctx;
	return 0;
}

/* Sessions, the per-session set limit and the budget, from whichever the user gave; limits
 * that cannot all hold are a usage error naming them. */
static int settle_limits(struct allot_args *a, const struct sd_program *from, int *N, int *P,
			 int *budget, char *note, size_t nn, struct sd_err *e)
{
	int by_time = 0;

	*N = a->sessions > 0 ? (int)a->sessions : from ? from->ndays : DEFAULT_SESSIONS;
	if (*N > MAX_SESSIONS)
		*N = MAX_SESSIONS;
	*P = 0;
	note[0] = '\0';
	if (a->minutes > 0) {
		by_time = (int)floor(a->minutes / a->per_set + 1e-9);
		if (by_time < 1)
			return sd_usage(e, "a %g-minute session has no room for a %g-minute set",
					a->minutes, a->per_set);
		*P = by_time;
		snprintf(note, nn, "%g min a session / %g min a set", a->minutes, a->per_set);
	}
	if (a->max_per_session > 0 && (!*P || a->max_per_session < *P)) {
		*P = (int)a->max_per_session;
		snprintf(note, nn, "--max-per-session %d", *P);
	}
	if (a->budget < 0) {
		if (!*P)
			return sd_usage(e, "allot needs --budget SETS, or --minutes-per-session with "
					"--minutes-per-set");
		*budget = *N * *P > MAX_BUDGET ? MAX_BUDGET : *N * *P;
		return 0;
	}
	*budget = (int)a->budget;
	if (*P && *budget > *N * *P)
		return sd_usage(e, "conflicting limits: a budget of %d sets does not fit %d session%s "
				"of at most %d sets (%s)", *budget, *N, *N == 1 ? "" : "s", *P, note);
	return 0;
}

static int set_muscles(const struct sd_ctx *ctx, const struct allot_args *a, int N,
		       struct allot_problem *p, struct sd_err *e)
{
	double evid = ctx->profile.dose_max, room = N * a->cap;

	for (int m = 0; m < SD_NMUSCLES; m++) {
		p->weight[m] = a->wset[m] ? a->weight[m] : a->others_set ? a->others : 1;
		p->min[m] = a->minset[m] ? a->min[m] : 0;
		/* Never past the evidence, nor more than the sessions can hold under the cap. */
		p->max[m] = fmin(evid, room);
		if (p->min[m] > evid)
			return sd_usage(e, "conflicting limits: --min %s=%g is past the evidence range of "
					"the profile (%g weekly fractional sets)", muscle_name(m),
					p->min[m], evid);
		if (p->min[m] > room)
			return sd_usage(e, "conflicting limits: --min %s=%g does not fit %d session%s "
					"under the session cap of %g", muscle_name(m), p->min[m], N,
					N == 1 ? "" : "s", a->cap);
	}
	return 0;
}

static int candidates(struct sd_ctx *ctx, const struct allot_args *a,
		      const struct sd_program *from, int *ex, int *n, struct sd_err *e)
{
	*n = 0;
	if (a->candidates)
		return parse_candidates(&ctx->lib, a->candidates, ex, n, e);
	if (from) {
		for (int i = 0; i < from->nentries; i++)
			if (add_candidate(ex, n, from->entries[i].ex, e))
				return -1;
		return 0;
	}
	for (int i = 0; allot_default_candidates[i]; i++) {
		int idx = lib_find(&ctx->lib, allot_default_candidates[i]);
		if (idx < 0)
			return sd_fail(e, "the exercise library lacks '%s', one of the default candidates; "
				       "give --candidates", allot_default_candidates[i]);
		if (add_candidate(ex, n, idx, e))
			return -1;
	}
	return 0;
}

/* The laid-out program: one day per non-empty session, named by its session number. */
static int build_program(const struct allot_layout *l, const int *ex, int weeks, int budget,
			 struct sd_program *p, int *day_of, struct sd_err *e)
{
	memset(p, 0, sizeof *p);
	snprintf(p->name, sizeof p->name, "allotment of %d sets over %d sessions", budget,
		 l->nsessions);
	p->weeks = weeks;
	for (int s = 0; s < l->nsessions; s++) {
		char name[32];
		int any = 0;
		day_of[s] = -1;
		for (int c = 0; c < l->ncand; c++)
			any |= l->sets[(size_t)s * (size_t)l->ncand + (size_t)c] > 0;
		if (!any)
			continue;
		snprintf(name, sizeof name, "day %d", s + 1);
		if (prog_add_day(p, name, 0, e))
			return -1;
		day_of[s] = p->ndays - 1;
		for (int c = 0; c < l->ncand; c++) {
			int k = l->sets[(size_t)s * (size_t)l->ncand + (size_t)c];
			struct sd_entry en = { .ex = ex[c], .sets = k, .rir = -1, .day = p->ndays - 1 };
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

static int exec_allot(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	struct allot_args a;
	struct progarg pa = { NULL };
	struct sd_program from, prog;
	struct allot_problem prob;
	struct allot_result res;
	struct allot_layout lay;
	struct sd_audit au;
	struct allot_view view;
	int ex[ALLOT_MAX_CAND], day_of[MAX_SESSIONS], n = 0, N = 0, P = 0, budget = 0, rc = -1;
	int nnotes = 0;
	int have_from = 0;
	double *rows = NULL;
	char note[128], unused[160], nolay[200], stop[200];

	memset(&from, 0, sizeof from);
	memset(&prog, 0, sizeof prog);
	memset(&res, 0, sizeof res);
	memset(&lay, 0, sizeof lay);
	memset(&au, 0, sizeof au);
	memset(&prob, 0, sizeof prob);
	if (parse_args(ctx, argc, argv, &a, e))
		return -1;
	if (a.from) {
		if (progarg_load(ctx, &pa, a.from, &from, e))
			goto done;
		have_from = 1;
	}
	if (settle_limits(&a, have_from ? &from : NULL, &N, &P, &budget, note, sizeof note, e) ||
	    candidates(ctx, &a, have_from ? &from : NULL, ex, &n, e) ||
	    set_muscles(ctx, &a, N, &prob, e))
		goto done;
	if (!(rows = calloc((size_t)n * SD_NMUSCLES, sizeof *rows))) {
		sd_fail(e, "out of memory");
		goto done;
	}
	for (int c = 0; c < n; c++)
		allot_coeffs(ctx->lib.ex[ex[c]].direct, ctx->lib.ex[ex[c]].indirect,
			     ctx->profile.w_direct, ctx->profile.w_indirect, rows + (size_t)c * SD_NMUSCLES);
	prob.ncand = n;
	prob.a = rows;
	prob.budget = budget;
	prob.form = ctx->profile.form;
	prob.node_limit = a.node_limit;
	prob.tolerance = a.tolerance;

	struct sd_covars cov = cmd_covars(ctx, have_from ? from.weeks : 0);
	/* The dose slope for this athlete's status and block length ("m:dose" terms included). */
	prob.b_dose = curve_dose_coef(&ctx->profile, &cov);
	int weeks = cov.weeks == floor(cov.weeks) ? (int)cov.weeks : 0;
	struct sd_audit_opts ao = { ctx->opt.level, ctx->opt.max_rir, a.cap };
	if (allot_solve(&prob, &res, e) || allot_layout(&prob, res.sets, N, P, a.cap, &lay, e) ||
	    build_program(&lay, ex, weeks, budget, &prog, day_of, e) ||
	    audit_run(&prog, &ctx->lib, &ctx->profile, &cov, &ao, &au, e))
		goto done;

	view = (struct allot_view){ &prob, &res, &lay, ex, &ctx->lib, &ctx->profile, &prog, &au,
				    day_of, P, a.cap, note[0] ? note : NULL, { NULL } };
	if (res.used < budget) {
		snprintf(unused, sizeof unused, "%d of the %d sets would buy nothing more within the "
			 "limits (priorities, the evidence range, the session cap) and are left out",
			 budget - res.used, budget);
		view.notes[nnotes++] = unused;
	}
	if (lay.over_cap) {
		snprintf(nolay, sizeof nolay, "the sets could not all be spread to keep every muscle at "
			 "or under %g fractional sets a session (%d muscle-session%s over; see the "
			 "warnings)", a.cap, lay.over_cap, lay.over_cap == 1 ? "" : "s");
		view.notes[nnotes++] = nolay;
	}
	if (!res.proved) {
		snprintf(stop, sizeof stop, "the search stopped at its node limit: the allotment is "
			 "within %.4f of the best possible (raise --node-limit or --tolerance)", res.gap);
		view.notes[nnotes++] = stop;
	}
	if (ctx->opt.format == SD_FMT_JSON)
		rc = allot_out_json(ctx->out, &view);
	else if (ctx->opt.format == SD_FMT_CSV)
		rc = allot_out_csv(ctx->out, &view);
	else {
		allot_out_table(ctx->out, &view, ctx->opt.color);
		cmd_print_caution(ctx);
		rc = 0;
	}
	if (rc) {
		sd_fail(e, "out of memory");
		goto done;
	}
	if (a.write) {
		char comment[512];
		snprintf(comment, sizeof comment,
			 "Written by setdose allot: %d weekly hard sets over %d sessions for the %s "
			 "profile.\nSets are hard sets (a few reps in reserve at most); add reps and "
			 "RIR as you like.", res.used, N, ctx->profile.name);
		rc = pwrite_file(a.write, &prog, &ctx->lib, comment, a.force, e);
	}
done:
	free(rows);
	audit_free(&au);
	prog_free(&prog);
	allot_layout_free(&lay);
	allot_free(&res);
	prog_free(&from);
	progarg_close(&pa);
	return rc;
}

const struct sd_cmd cmd_allot = {
	.name = "allot",
	.summary = "the exercise sets that buy the most predicted gain within a weekly set budget",
	.usage = "allot --budget SETS [--sessions N] [--minutes-per-session M --minutes-per-set S]\n"
		 "      [--priority MUSCLE=W,...] [--min MUSCLE=SETS,...] [--max-per-session SETS]\n"
		 "      [--candidates LIST | --from PROGRAM] [--session-cap N] [--write FILE [--force]]\n"
		 "      [--tolerance T] [--node-limit N]\n"
		 "  --budget SETS          hard sets a week (or, without it, sessions x sets a session)\n"
		 "  --sessions N           sessions a week (default: --from's days, else 3)\n"
		 "  --minutes-per-session M, --minutes-per-set S\n"
		 "                         at most floor(M/S) sets a session; caps the budget\n"
		 "  --priority LIST        weights, e.g. quads=2,glutes=2,others=0.5 (default 1 each;\n"
		 "                         0 leaves a muscle out of the objective)\n"
		 "  --min LIST             fractional sets a week at least, e.g. calves=4\n"
		 "  --max-per-session SETS hard sets in one session at most\n"
		 "  --candidates LIST      exercises to choose from, comma-separated (default: 25 common\n"
		 "                         exercises covering every muscle); --exercises is the global\n"
		 "                         library option, hence this name\n"
		 "  --from PROGRAM         choose among the exercises of a program file or stored template\n"
		 "  --session-cap N        at most N fractional sets per muscle in one session (default\n"
		 "                         10; common practice, no source): sets are spread to respect it\n"
		 "  --write FILE           write the allotment as a program file ('audit FILE' reads it\n"
		 "                         back to the same doses); --force replaces an existing file\n"
		 "  --tolerance T          prove the allotment within T of the best possible objective\n"
		 "                         (default 0.001, about a thirtieth of the 3% SWC; 0: exact)\n"
		 "  --node-limit N         branch-and-bound nodes before stopping (default 20000)\n"
		 "Objective: sum over muscles of priority x predicted gain (lnRR over no sets); no muscle\n"
		 "past the profile's evidence range or above sessions x session cap.\n"
		 "Method and guarantee: branch-and-bound over whole sets. Every bound is the Lagrangian\n"
		 "dual of the continuous relaxation over whole-set loads (valid for any multipliers; a\n"
		 "log-barrier Newton method finds good ones); the first allotment comes from a greedy\n"
		 "fill plus single-set exchanges. A branch is dropped only when its bound cannot beat\n"
		 "the best allotment found by more than T, so a finished search proves the result is\n"
		 "within T of the best possible ('proved optimal' when the gap is 0). If the node limit\n"
		 "stops it first, the printed gap is still a proved bound on the shortfall. A greedy\n"
		 "pass alone guarantees nothing here: one exercise feeds several muscles.",
	.flags = CMD_PROFILE | CMD_LIBRARY,
	.exec = exec_allot,
};
