#include "allot_out.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

#include <cjson/cJSON.h>

#include "jsonout.h"

#include "audit_out.h"
#include "wrap.h"
#include "table.h"

static double pct(double y)
{
	return curve_pct(y);
}

static int sets_in(const struct allot_view *v, int s, int c)
{
	return v->lay->sets[(size_t)s * (size_t)v->lay->ncand + (size_t)c];
}

static double cost(const struct allot_problem *p, int c)
{
	return p->cost ? p->cost[c] : 1;
}

static int exact(const struct allot_result *r)
{
	/* The search prunes at 1e-9 relative (core/allot.h); a little room for rounding. */
	return r->gap <= 1.5e-9 * fmax(1, fabs(r->value));
}

static const char *method_line(const struct allot_view *v, char *buf, size_t n)
{
	const struct allot_result *r = v->res;
	int len = snprintf(buf, n, "branch-and-bound over %d exercise%s, %ld node%s: ",
			   r->distinct, r->distinct == 1 ? "" : "s", r->nodes, r->nodes == 1 ? "" : "s");
	if (len < 0 || (size_t)len >= n)
		return buf;
	if (r->proved && exact(r))
		snprintf(buf + len, n - (size_t)len, "weekly sets proved optimal");
	else if (r->proved)
		snprintf(buf + len, n - (size_t)len, "weekly sets proved within %.2g of the best "
			 "possible (tolerance %g)", r->gap, v->prob->tolerance);
	else
		snprintf(buf + len, n - (size_t)len, "node limit reached; within %.2g of the best "
			 "possible", r->gap);
	return buf;
}

static const char *joint(const struct allot_view *v, int c)
{
	return v->multi[c] ? "multi" : "single";
}

static struct sd_table *exercise_table(const struct allot_view *v)
{
	int N = v->lay->nsessions, ncol = 4 + N;
	const char **heads = calloc((size_t)ncol, sizeof *heads);
	char (*names)[16] = calloc((size_t)N, sizeof *names);
	struct sd_table *t = NULL;

	if (!heads || !names)
		goto done;
	heads[0] = "<exercise";
	heads[1] = "<joint";
	heads[2] = "sets";
	heads[3] = "fatigue";
	for (int s = 0; s < N; s++) {
		snprintf(names[s], sizeof names[s], "day %d", s + 1);
		heads[4 + s] = names[s];
	}
	if (!(t = tbl_new(ncol, heads)))
		goto done;
	for (int i = 0; i < v->prob->ncand; i++) {
		int c = v->order[i];
		if (!v->res->sets[c])
			continue;
		tbl_row(t);
		tbl_set(t, 0, "%s", v->lib->ex[v->ex[c]].name);
		tbl_set(t, 1, "%s", joint(v, c));
		tbl_set(t, 2, "%d", v->res->sets[c]);
		tbl_set(t, 3, "%.2f", v->res->sets[c] * cost(v->prob, c));
		for (int s = 0; s < N; s++)
			tbl_set(t, 4 + s, "%d", sets_in(v, s, c));
	}
done:
	free(heads);
	free(names);
	return t;
}

static struct sd_table *muscle_table(const struct allot_view *v)
{
	static const char *const heads[] = { "<muscle", "priority", "min", "fractional",
					     "max/session", "gain%", "curve_lo", "curve_hi",
					     "athlete_lo", "athlete_hi", "+1set%", "+1set_lo",
					     "+1set_hi", "<zone" };
	struct sd_table *t = tbl_new(14, heads);
	if (!t)
		return NULL;
	for (int m = 0; m < SD_NMUSCLES; m++) {
		const struct sd_audit_row *r = &v->audit->row[m];
		tbl_row(t);
		tbl_set(t, 0, "%s", muscle_name(m));
		tbl_set(t, 1, "%g", v->prob->weight[m]);
		tbl_set(t, 2, "%g", v->res->min[m]);
		tbl_set(t, 3, "%.1f", r->dose.fractional);
		tbl_set(t, 4, "%.1f", r->dose.max_session);
		tbl_set(t, 5, "%.1f", pct(r->pt.y));
		tbl_set(t, 6, "%.1f", pct(r->pt.ci_lo));
		tbl_set(t, 7, "%.1f", pct(r->pt.ci_hi));
		tbl_set(t, 8, "%.1f", pct(r->pt.ath_lo));
		tbl_set(t, 9, "%.1f", pct(r->pt.ath_hi));
		tbl_set(t, 10, "%.2f", r->plus1.pct);
		tbl_set(t, 11, "%.2f", r->plus1.lo);
		tbl_set(t, 12, "%.2f", r->plus1.hi);
		tbl_set(t, 13, "%s", zone_name(r->zone));
	}
	return t;
}

/* Only the warnings about muscles: the counting notes say nothing here, as an allotment is of
 * hard sets at the stated effort by definition. */
static int shown(const struct sd_warning *w)
{
	return w->muscle >= 0;
}

static void rules_line(FILE *f, const struct allot_problem *p)
{
	fprintf(f, "rules: %d to %d sets of an exercise in a session, ", p->min_sets, p->max_sets);
	if (p->max_exercises > 0)
		fprintf(f, "at most %d exercises a session", p->max_exercises);
	else
		fprintf(f, "any number of exercises a session");
	fprintf(f, " (common practice, no source)\n");
}

static void print_table(FILE *f, const struct allot_view *v, int color)
{
	const struct allot_result *r = v->res;
	const struct sd_audit *a = v->audit;
	struct sd_table *t;
	char buf[256];
	int N = v->lay->nsessions;

	fprintf(f, "%sAllotment of %d weekly hard set%s over %d session%s%s (budget %d", color ? "\033[1m" : "",
		r->used, r->used == 1 ? "" : "s", N, N == 1 ? "" : "s", color ? "\033[0m" : "",
		v->prob->budget);
	if (v->per_session)
		fprintf(f, "; at most %d sets a session", v->per_session);
	fprintf(f, "%s%s)\n", v->limit_note ? ": " : "", v->limit_note ? v->limit_note : "");
	fprintf(f, "every set at %s; fatigue %.1f a week", v->effort, r->fatigue);
	if (v->prob->fatigue_budget > 0)
		fprintf(f, " of at most %g (--fatigue-budget)\n", v->prob->fatigue_budget);
	else
		fprintf(f, " (no --fatigue-budget)\n");
	fprintf(f, "%s, %g-week block; profile %s; session cap %g fractional sets per muscle\n",
		a->cov.trained >= 0.5 ? "trained" : "untrained", a->cov.weeks, v->prof->name, v->cap);
	rules_line(f, v->prob);
	fprintf(f, "method: %s\n\n", method_line(v, buf, sizeof buf));
	if ((t = exercise_table(v))) {
		tbl_row(t);
		tbl_set(t, 0, "total");
		tbl_set(t, 2, "%d", r->used);
		tbl_set(t, 3, "%.2f", r->fatigue);
		for (int s = 0; s < N; s++)
			tbl_set(t, 4 + s, "%d", allot_session_sets(v->lay, s));
		tbl_row(t);
		tbl_set(t, 0, "fatigue");
		for (int s = 0; s < N; s++)
			tbl_set(t, 4 + s, "%.2f", allot_session_fatigue(v->prob, v->lay, s));
		tbl_print(t, f, 0);
	}
	tbl_free(t);
	fputc('\n', f);
	if ((t = muscle_table(v)))
		tbl_print(t, f, 0);
	tbl_free(t);
	fprintf(f, "\nobjective %.4f: priority x predicted gain (lnRR over no sets), summed over "
		"muscles\n", r->value);
	fprintf(f, "the best possible is at most %.4f (gap %.4f); the root relaxation's bound is "
		"%.4f\n", r->bound, r->gap, r->relaxation);
	fprintf(f, "the last set bought %.4f; one more set would buy %.4f (priority x lnRR; the SWC is "
		"%.4f)\n", r->last_set, r->next_set, v->prof->swc);
	for (int i = 0; i < ALLOT_NOTES && v->notes[i]; i++)
		wrap_printf(f, 6, "note: %s", v->notes[i]);
	for (int i = 0; i < a->nwarn; i++)
		if (shown(&a->warn[i]))
			wrap_printf(f, 9, "%swarning:%s %s", color ? "\033[33m" : "",
				    color ? "\033[0m" : "", a->warn[i].text);
	fputc('\n', f);
	aout_caution_text(f);
}

static int print_csv(FILE *f, const struct allot_view *v)
{
	struct sd_table *t = exercise_table(v);
	if (!t)
		return -1;
	tbl_print(t, f, 1);
	tbl_free(t);
	fputc('\n', f);
	if (!(t = muscle_table(v)))
		return -1;
	tbl_print(t, f, 1);
	tbl_free(t);
	return 0;
}

static cJSON *summary_json(const struct allot_view *v)
{
	const struct allot_result *r = v->res;
	const struct allot_problem *p = v->prob;
	cJSON *o = cJSON_CreateObject();
	if (!o)
		return NULL;
	cJSON_AddNumberToObject(o, "budget", p->budget);
	cJSON_AddNumberToObject(o, "used", r->used);
	cJSON_AddNumberToObject(o, "sessions", v->lay->nsessions);
	if (v->per_session)
		cJSON_AddNumberToObject(o, "per_session_limit", v->per_session);
	else
		cJSON_AddNullToObject(o, "per_session_limit");
	cJSON_AddNumberToObject(o, "min_sets", p->min_sets);
	cJSON_AddNumberToObject(o, "max_sets", p->max_sets);
	cJSON_AddNumberToObject(o, "max_exercises", p->max_exercises);
	json_num(o, "fatigue", r->fatigue, 2);
	if (p->fatigue_budget > 0)
		json_num(o, "fatigue_budget", p->fatigue_budget, 2);
	else
		cJSON_AddNullToObject(o, "fatigue_budget");
	cJSON_AddStringToObject(o, "effort", v->effort);
	json_num(o, "session_cap", v->cap, 4);
	cJSON_AddStringToObject(o, "status", v->audit->cov.trained >= 0.5 ? "trained" : "untrained");
	json_num(o, "weeks", v->audit->cov.weeks, 2);
	json_profile(o, v->prof);
	cJSON_AddStringToObject(o, "method", "branch-and-bound");
	cJSON_AddBoolToObject(o, "proved", r->proved);
	cJSON_AddBoolToObject(o, "proved_optimal", r->proved && exact(r));
	json_num(o, "tolerance", p->tolerance, 8);
	cJSON_AddNumberToObject(o, "nodes", (double)r->nodes);
	cJSON_AddNumberToObject(o, "newton_steps", (double)r->newton);
	cJSON_AddNumberToObject(o, "distinct_exercises", r->distinct);
	json_num(o, "objective", r->value, 8);
	json_num(o, "upper_bound", r->bound, 8);
	json_num(o, "relaxation_bound", r->relaxation, 8);
	json_num(o, "gap", r->gap, 8);
	json_num(o, "last_set_gain", r->last_set, 8);
	json_num(o, "next_set_gain", r->next_set, 8);
	json_num(o, "swc_lnrr", v->prof->swc, 6);
	return o;
}

static cJSON *exercises_json(const struct allot_view *v)
{
	cJSON *arr = cJSON_CreateArray();
	for (int i = 0; arr && i < v->prob->ncand; i++) {
		int c = v->order[i];
		cJSON *o, *per;
		if (!v->res->sets[c])
			continue;
		if (!(o = cJSON_CreateObject()))
			return arr;
		cJSON_AddStringToObject(o, "exercise", v->lib->ex[v->ex[c]].name);
		cJSON_AddStringToObject(o, "joint", joint(v, c));
		cJSON_AddNumberToObject(o, "sets", v->res->sets[c]);
		json_num(o, "fatigue_per_set", cost(v->prob, c), 2);
		json_num(o, "fatigue", v->res->sets[c] * cost(v->prob, c), 2);
		per = cJSON_AddArrayToObject(o, "per_session");
		for (int s = 0; per && s < v->lay->nsessions; s++)
			cJSON_AddItemToArray(per, cJSON_CreateNumber(sets_in(v, s, c)));
		cJSON_AddItemToArray(arr, o);
	}
	return arr;
}

static cJSON *sessions_json(const struct allot_view *v)
{
	cJSON *arr = cJSON_CreateArray();
	for (int s = 0; arr && s < v->lay->nsessions; s++) {
		cJSON *o = cJSON_CreateObject();
		if (!o)
			return arr;
		cJSON_AddNumberToObject(o, "sets", allot_session_sets(v->lay, s));
		json_num(o, "fatigue", allot_session_fatigue(v->prob, v->lay, s), 2);
		cJSON_AddItemToArray(arr, o);
	}
	return arr;
}

static cJSON *muscles_json(const struct allot_view *v)
{
	cJSON *arr = cJSON_CreateArray();
	for (int m = 0; arr && m < SD_NMUSCLES; m++) {
		const struct sd_audit_row *r = &v->audit->row[m];
		cJSON *o = cJSON_CreateObject();
		if (!o)
			return arr;
		cJSON_AddStringToObject(o, "muscle", muscle_name(m));
		json_num(o, "priority", v->prob->weight[m], 6);
		json_num(o, "min", v->res->min[m], 4);
		json_num(o, "max", v->prob->max[m], 4);
		json_audit_row(o, r);
		cJSON_AddItemToArray(arr, o);
	}
	return arr;
}

static cJSON *warnings_json(const struct allot_view *v)
{
	cJSON *ws = cJSON_CreateArray();
	for (int i = 0; ws && i < v->audit->nwarn; i++) {
		const struct sd_warning *w = &v->audit->warn[i];
		cJSON *x;
		if (!shown(w) || !(x = cJSON_CreateObject()))
			continue;
		cJSON_AddStringToObject(x, "muscle", muscle_name(w->muscle));
		if (w->day >= 0)
			cJSON_AddStringToObject(x, "day", v->prog->days[w->day].name);
		else
			cJSON_AddNullToObject(x, "day");
		cJSON_AddStringToObject(x, "text", w->text);
		cJSON_AddItemToArray(ws, x);
	}
	return ws;
}

static int print_json(FILE *f, const struct allot_view *v)
{
	cJSON *o = cJSON_CreateObject(), *notes;

	if (!o)
		return -1;
	cJSON_AddItemToObject(o, "allotment", summary_json(v));
	cJSON_AddItemToObject(o, "exercises", exercises_json(v));
	cJSON_AddItemToObject(o, "sessions", sessions_json(v));
	cJSON_AddItemToObject(o, "muscles", muscles_json(v));
	notes = cJSON_AddArrayToObject(o, "notes");
	for (int i = 0; notes && i < ALLOT_NOTES && v->notes[i]; i++)
		cJSON_AddItemToArray(notes, cJSON_CreateString(v->notes[i]));
	cJSON_AddItemToObject(o, "warnings", warnings_json(v));
	cJSON_AddStringToObject(o, "caution", aout_caution);
	return json_emit(f, o);
}

int allot_out_print(FILE *f, const struct allot_view *v, enum allot_fmt fmt, int color)
{
	if (fmt == ALLOT_JSON)
		return print_json(f, v);
	if (fmt == ALLOT_CSV)
		return print_csv(f, v);
	print_table(f, v, color);
	return 0;
}

static void muscle_list(FILE *f, const struct allot_problem *p, int targeted)
{
	int first = 1;
	for (int m = 0; m < SD_NMUSCLES; m++)
		if ((p->weight[m] > 0) == targeted) {
			if (targeted && p->weight[m] != 1)
				fprintf(f, "%s%s (%g)", first ? "" : ", ", muscle_name(m), p->weight[m]);
			else
				fprintf(f, "%s%s", first ? "" : ", ", muscle_name(m));
			first = 0;
		}
	fprintf(f, "%s\n", first ? "none" : "");
}

void allot_out_explain(FILE *f, const struct allot_explain *x)
{
	const struct allot_problem *p = x->prob;
	fprintf(f, "allot maximises, over whole hard sets per exercise,\n"
		"  sum over muscles of priority x predicted gain (lnRR over no sets)\n"
		"at each muscle's weekly fractional sets (direct %g, indirect %g), on the curve of the "
		"%s profile\n(dose form %s, dose coefficient %g).\n\n", x->prof->w_direct,
		x->prof->w_indirect, x->prof->name, form_name(x->prof->form), x->prof->beta[1]);
	fprintf(f, "targets (priority above 0): ");
	muscle_list(f, p, 1);
	fprintf(f, "counted, not targeted (priority 0): ");
	muscle_list(f, p, 0);
	fprintf(f, "  (defaults: targets chest, back, delts, arms, quads, hamstrings, glutes, calves; "
		"change with --priority)\n");
	fprintf(f, "practical threshold of the profile: %g weekly fractional sets (its plateau: past "
		"it no dose\n  in the evidence range adds more than the SWC of %.4f lnRR)\n",
		x->plateau, x->prof->swc);
	fprintf(f, "floors: ");
	int first = 1;
	for (int m = 0; m < SD_NMUSCLES; m++)
		if (p->floor[m] > 0 || p->min[m] > 0) {
			fprintf(f, "%s%s %g%s", first ? "" : ", ", muscle_name(m),
				fmax(p->floor[m], p->min[m]), p->min[m] > 0 ? " (--min)" : "");
			first = 0;
		}
	fprintf(f, "%s\n  (each target is held at the threshold, unless --min says otherwise or "
		"--no-floor, when\n  a greedy cover shows the budget and rules allow it)\n\n",
		first ? "none" : "");
	fprintf(f, "weekly limits and rules in use:\n");
	fprintf(f, "  sessions a week                      %d (default %d)\n", p->nsessions,
		x->sessions_default);
	fprintf(f, "  sets of a chosen exercise a session  %d to %d (defaults %d to %d; common "
		"practice, no source)\n", p->min_sets, p->max_sets, ALLOT_MIN_SETS, ALLOT_MAX_SETS);
	fprintf(f, "  exercises a session at most          %d (default %d; common practice, no "
		"source)\n", p->max_exercises, ALLOT_MAX_EXERCISES);
	fprintf(f, "  fractional sets of a muscle a session %g at most (default 10; common practice, "
		"no source)\n", x->cap);
	fprintf(f, "  fractional sets of a muscle a week   %g at most (the evidence range, and "
		"sessions x cap)\n", p->max[0]);
	if (x->per_session)
		fprintf(f, "  sets a session                       %d at most\n", x->per_session);
	if (p->fatigue_budget > 0)
		fprintf(f, "  fatigue a week                       %g at most\n", p->fatigue_budget);
	else
		fprintf(f, "  fatigue a week                       no limit (--fatigue-budget); shown "
			"beside the sets\n");
	fprintf(f, "  effort written on every set          %s (default RIR 2; common practice, no "
		"source)\n\n", x->effort);
	fprintf(f, "candidates, in session order (multi-joint first), with fatigue per set\n(%s):\n",
		x->cost_source);
	for (int i = 0; x->cand[i]; i++)
		fprintf(f, "  %-24s %-6s %.2f\n", x->cand[i], x->multi[i] ? "multi" : "single",
			x->cost[i]);
	fprintf(f, "\nguarantee: the weekly sets per exercise are optimal (within --tolerance) "
		"among all that meet\nthe budgets, the muscle limits and the rules above; any such "
		"allotment can be laid out\nover the sessions, and the layout is a separate "
		"balancing step (see 'setdose help allot').\n");
}
