#include "allot_out.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

#include <cjson/cJSON.h>

#include "jsonout.h"

#include "audit_out.h"
#include "table.h"

static double pct(double y)
{
	return curve_pct(y);
}

static int sets_in(const struct allot_view *v, int s, int c)
{
	return v->lay->sets[(size_t)s * (size_t)v->lay->ncand + (size_t)c];
}

static int exact(const struct allot_result *r)
{
	return r->gap <= 1e-9 * fmax(1, fabs(r->value));
}

static const char *method_line(const struct allot_view *v, char *buf, size_t n)
{
	const struct allot_result *r = v->res;
	int len = snprintf(buf, n, "branch-and-bound over %d distinct exercise%s, %ld node%s: ",
			   r->distinct, r->distinct == 1 ? "" : "s", r->nodes, r->nodes == 1 ? "" : "s");
	if (len < 0 || (size_t)len >= n)
		return buf;
	if (r->proved && exact(r))
		snprintf(buf + len, n - (size_t)len, "proved optimal");
	else if (r->proved)
		snprintf(buf + len, n - (size_t)len, "proved within %.2g of the best possible "
			 "(tolerance %g)", r->gap, v->prob->tolerance);
	else
		snprintf(buf + len, n - (size_t)len, "node limit reached; within %.2g of the best "
			 "possible", r->gap);
	return buf;
}

static struct sd_table *exercise_table(const struct allot_view *v)
{
	int N = v->lay->nsessions, ncol = 2 + N;
	const char **heads = calloc((size_t)ncol, sizeof *heads);
	char (*names)[16] = calloc((size_t)N, sizeof *names);
	struct sd_table *t = NULL;

	if (!heads || !names)
		goto done;
	heads[0] = "<exercise";
	heads[1] = "sets";
	for (int s = 0; s < N; s++) {
		snprintf(names[s], sizeof names[s], "day %d", s + 1);
		heads[2 + s] = names[s];
	}
	if (!(t = tbl_new(ncol, heads)))
		goto done;
	for (int c = 0; c < v->prob->ncand; c++) {
		if (!v->res->sets[c])
			continue;
		tbl_row(t);
		tbl_set(t, 0, "%s", v->lib->ex[v->ex[c]].name);
		tbl_set(t, 1, "%d", v->res->sets[c]);
		for (int s = 0; s < N; s++)
			tbl_set(t, 2 + s, "%d", sets_in(v, s, c));
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
		tbl_set(t, 2, "%g", v->prob->min[m]);
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

/* Only the warnings about muscles: the counting notes (no RIR stated) say nothing here, as an
 * allotment is of hard sets by definition. */
static int shown(const struct sd_warning *w)
{
	return w->muscle >= 0;
}

void allot_out_table(FILE *f, const struct allot_view *v, int color)
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
	fprintf(f, "%s, %g-week block; profile %s; session cap %g fractional sets per muscle\n",
		a->cov.trained >= 0.5 ? "trained" : "untrained", a->cov.weeks, v->prof->name, v->cap);
	fprintf(f, "method: %s\n\n", method_line(v, buf, sizeof buf));
	if ((t = exercise_table(v))) {
		tbl_row(t);
		tbl_set(t, 0, "total");
		tbl_set(t, 1, "%d", r->used);
		for (int s = 0; s < N; s++) {
			int sum = 0;
			for (int c = 0; c < v->prob->ncand; c++)
				sum += sets_in(v, s, c);
			tbl_set(t, 2 + s, "%d", sum);
		}
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
	for (int i = 0; i < 8 && v->notes[i]; i++)
		fprintf(f, "note: %s\n", v->notes[i]);
	for (int i = 0; i < a->nwarn; i++)
		if (shown(&a->warn[i]))
			fprintf(f, "%swarning:%s %s\n", color ? "\033[33m" : "", color ? "\033[0m" : "",
				a->warn[i].text);
}

int allot_out_csv(FILE *f, const struct allot_view *v)
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
	cJSON *o = cJSON_CreateObject();
	if (!o)
		return NULL;
	cJSON_AddNumberToObject(o, "budget", v->prob->budget);
	cJSON_AddNumberToObject(o, "used", r->used);
	cJSON_AddNumberToObject(o, "sessions", v->lay->nsessions);
	if (v->per_session)
		cJSON_AddNumberToObject(o, "per_session_limit", v->per_session);
	else
		cJSON_AddNullToObject(o, "per_session_limit");
	json_num(o, "session_cap", v->cap, 4);
	cJSON_AddStringToObject(o, "status", v->audit->cov.trained >= 0.5 ? "trained" : "untrained");
	json_num(o, "weeks", v->audit->cov.weeks, 2);
	json_profile(o, v->prof);
	cJSON_AddStringToObject(o, "method", "branch-and-bound");
	cJSON_AddBoolToObject(o, "proved", r->proved);
	cJSON_AddBoolToObject(o, "proved_optimal", r->proved && exact(r));
	json_num(o, "tolerance", v->prob->tolerance, 8);
	cJSON_AddNumberToObject(o, "nodes", (double)r->nodes);
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
	for (int c = 0; arr && c < v->prob->ncand; c++) {
		cJSON *o, *per;
		if (!v->res->sets[c])
			continue;
		if (!(o = cJSON_CreateObject()))
			return arr;
		cJSON_AddStringToObject(o, "exercise", v->lib->ex[v->ex[c]].name);
		cJSON_AddNumberToObject(o, "sets", v->res->sets[c]);
		per = cJSON_AddArrayToObject(o, "per_session");
		for (int s = 0; per && s < v->lay->nsessions; s++)
			cJSON_AddItemToArray(per, cJSON_CreateNumber(sets_in(v, s, c)));
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
		json_num(o, "min", v->prob->min[m], 4);
		json_num(o, "max", v->prob->max[m], 4);
		json_num(o, "fractional", r->dose.fractional, 2);
		json_num(o, "max_per_session", r->dose.max_session, 2);
		cJSON_AddNumberToObject(o, "sessions", r->dose.sessions);
		json_num(o, "lnrr", r->pt.y, 6);
		json_num(o, "gain_pct", pct(r->pt.y), 3);
		json_bands(o, &r->pt, 3);
		json_num(o, "plus1_pct", r->plus1.pct, 4);
		json_num(o, "plus1_low", r->plus1.lo, 4);
		json_num(o, "plus1_high", r->plus1.hi, 4);
		cJSON_AddStringToObject(o, "zone", zone_name(r->zone));
		cJSON_AddItemToArray(arr, o);
	}
	return arr;
}

int allot_out_json(FILE *f, const struct allot_view *v)
{
	cJSON *o = cJSON_CreateObject(), *ws, *notes;
	char *text = NULL;
	int rc = -1;

	if (!o)
		return -1;
	cJSON_AddItemToObject(o, "allotment", summary_json(v));
	cJSON_AddItemToObject(o, "exercises", exercises_json(v));
	cJSON_AddItemToObject(o, "muscles", muscles_json(v));
	notes = cJSON_AddArrayToObject(o, "notes");
	for (int i = 0; notes && i < 8 && v->notes[i]; i++)
		cJSON_AddItemToArray(notes, cJSON_CreateString(v->notes[i]));
	ws = cJSON_AddArrayToObject(o, "warnings");
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
	cJSON_AddStringToObject(o, "caution", aout_caution);
	if (!(text = cJSON_Print(o)))
		goto done;
	fprintf(f, "%s\n", text);
	rc = 0;
done:
	free(text);
	cJSON_Delete(o);
	return rc;
}
