#include "compare_out.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

#include <cjson/cJSON.h>

#include "jsonout.h"
#include "wrap.h"

#include "audit_out.h"
#include "table.h"

/* What the interval of a difference contains, for the profile at hand. */
static const char *interval_note(const struct sd_profile *p)
{
	if (p->slopes)
		return "Differences are for one athlete at two doses: the athlete's level cancels, "
		       "but their own dose slope does not, so each interval adds the profile's "
		       "random-slope variance (f(xB) - f(xA))^2 tau2_slope to the coefficient "
		       "covariance.";
	return "Differences are for one athlete at two doses: the athlete's level cancels and the "
	       "profile has no random slopes, so the intervals assume every athlete shares the "
	       "curve's dose slope (only the coefficient covariance enters).";
}

static double pct(double y)
{
	return curve_pct(y);
}

static char key(int i)
{
	return (char)('A' + i);
}

static const struct cmp_diff *diff_of(const struct cmp_view *v, int k, int m)
{
	return &v->diff[(size_t)k * SD_NMUSCLES + (size_t)m];
}

static struct sd_table *side_by_side(const struct cmp_view *v)
{
	int ncol = 1 + 2 * v->n;
	const char **heads = calloc((size_t)ncol, sizeof *heads);
	char (*names)[16] = calloc((size_t)ncol, sizeof *names);
	struct sd_table *t = NULL;

	if (!heads || !names)
		goto done;
	heads[0] = "<muscle";
	for (int i = 0; i < v->n; i++) {
		snprintf(names[2 * i], sizeof names[0], "%c sets", key(i));
		snprintf(names[2 * i + 1], sizeof names[0], "%c gain%%", key(i));
		heads[1 + 2 * i] = names[2 * i];
		heads[2 + 2 * i] = names[2 * i + 1];
	}
	if (!(t = tbl_new(ncol, heads)))
		goto done;
	for (int m = 0; m < SD_NMUSCLES; m++) {
		tbl_row(t);
		tbl_set(t, 0, "%s", muscle_name(m));
		for (int i = 0; i < v->n; i++) {
			const struct sd_audit_row *r = &v->audit[i].row[m];
			tbl_set(t, 1 + 2 * i, "%.1f", r->dose.fractional);
			tbl_set(t, 2 + 2 * i, "%.1f", pct(r->pt.y));
		}
	}
done:
	free(heads);
	free(names);
	return t;
}

static struct sd_table *pair_table(const struct cmp_view *v, int k)
{
	static const char *const heads[] = { "<muscle", "delta%", "ci_low", "ci_high", "dec_low",
					     "dec_high", "<decision" };
	struct sd_table *t = tbl_new(7, heads);
	for (int m = 0; t && m < SD_NMUSCLES; m++) {
		const struct cmp_diff *d = diff_of(v, k, m);
		tbl_row(t);
		tbl_set(t, 0, "%s", muscle_name(m));
		tbl_set(t, 1, "%.2f", pct(d->d));
		tbl_set(t, 2, "%.2f", pct(d->lo));
		tbl_set(t, 3, "%.2f", pct(d->hi));
		tbl_set(t, 4, "%.2f", pct(d->dlo));
		tbl_set(t, 5, "%.2f", pct(d->dhi));
		tbl_set(t, 6, "%s", cmp_decision_name(d->decision));
	}
	return t;
}

static struct sd_table *totals_table(const struct cmp_view *v)
{
	static const char *const rows[] = { "hard sets a week", "sessions", "sets a session",
					    "under the plateau", "past practical returns",
					    "beyond the evidence", "over the session cap" };
	const char **heads = calloc((size_t)(v->n + 1), sizeof *heads);
	char (*names)[4] = calloc((size_t)(v->n + 1), sizeof *names);
	struct sd_table *t = NULL;

	if (!heads || !names)
		goto done;
	heads[0] = "<totals";
	for (int i = 0; i < v->n; i++) {
		snprintf(names[i], sizeof names[0], "%c", key(i));
		heads[1 + i] = names[i];
	}
	if (!(t = tbl_new(v->n + 1, heads)))
		goto done;
	for (int r = 0; r < 7; r++) {
		tbl_row(t);
		tbl_set(t, 0, "%s", rows[r]);
		for (int i = 0; i < v->n; i++) {
			const struct cmp_totals *c = &v->tot[i];
			int x[] = { c->hard_sets, c->sessions, 0, c->under_plateau, c->past_plateau,
				    c->beyond_evidence, c->over_cap };
			if (r == 2)
				tbl_set(t, 1 + i, "%.1f", c->sets_per_session);
			else
				tbl_set(t, 1 + i, "%d", x[r]);
		}
	}
done:
	free(heads);
	free(names);
	return t;
}

void cmp_out_table(FILE *f, const struct cmp_view *v, int color)
{
	const struct sd_audit *a0 = &v->audit[0];
	struct sd_table *t;
	int lvl = (int)lround(v->level * 100);

	wrap_printf(f, 2, "%sComparing %d programs for one athlete%s: %s, %g-week block; profile %s; "
		    "SWC %.1f%%; %d%% intervals", color ? "\033[1m" : "", v->n, color ? "\033[0m" : "",
		a0->cov.trained >= 0.5 ? "trained" : "untrained", a0->cov.weeks, v->prof->name,
		pct(v->prof->swc), lvl);
	for (int i = 0; i < v->n; i++)
		fprintf(f, "  %c  %s (%s)\n", key(i), v->prog[i].name, v->label[i]);
	char note[240];
	if (curve_context_note(v->prof, &a0->cov, note, sizeof note))
		wrap_printf(f, 9, "%swarning:%s %s", color ? "\033[33m" : "", color ? "\033[0m" : "", note);
	fprintf(f, "\nweekly fractional sets and predicted gain (%%) per muscle\n");
	if ((t = side_by_side(v)))
		tbl_print(t, f, 0);
	tbl_free(t);
	for (int k = 0; k < v->npairs; k++) {
		fprintf(f, "\n%c vs %c: difference in predicted gain (%c minus %c; %% as a ratio of gains)\n",
			key(v->pair[k][1]), key(v->pair[k][0]), key(v->pair[k][1]), key(v->pair[k][0]));
		if ((t = pair_table(v, k)))
			tbl_print(t, f, 0);
		tbl_free(t);
	}
	fputc('\n', f);
	if ((t = totals_table(v)))
		tbl_print(t, f, 0);
	tbl_free(t);
	fprintf(f, "\nci: the %d%% interval of the difference; dec: the %.0f%% decision interval, each "
		"decision being one-sided\ntests at %.0f%% (two for equivalence: Schuirmann 1987). "
		"decision:\n", lvl, 100 * cmp_decision_level(v->level), 100 * (1 - v->level));
	for (int k = 0; k < CMP_NDECISIONS; k++)
		fprintf(f, "  %-11s %s\n", cmp_decision_name((enum cmp_decision)k),
			cmp_decision_meaning((enum cmp_decision)k));
	wrap_printf(f, 0, "%s", interval_note(v->prof));
	if (v->note)
		wrap_printf(f, 6, "note: %s", v->note);
	for (int i = 0; i < v->n; i++)
		for (int w = 0; w < v->audit[i].nwarn; w++)
			if (v->audit[i].warn[w].muscle >= 0)
				wrap_printf(f, 9, "%swarning:%s %c: %s", color ? "\033[33m" : "",
					    color ? "\033[0m" : "", key(i), v->audit[i].warn[w].text);
}

/* One table (one header) for everything: each row says what it is in `row` ("muscle": one
 * program's muscle; "difference": a pair's difference for one muscle, program first and second;
 * "totals": one program's totals) and leaves the columns of the other kinds empty. */
int cmp_out_csv(FILE *f, const struct cmp_view *v)
{
	fprintf(f, "row,program,second,source,muscle,fractional,fractional_second,gain_pct,"
		"curve_low,curve_high,zone,delta_pct,ci_low,ci_high,dec_low,dec_high,decision,"
		"hard_sets,sessions,sets_per_session,under_plateau,past_plateau,beyond_evidence,"
		"over_session_cap\n");
	for (int i = 0; i < v->n; i++)
		for (int m = 0; m < SD_NMUSCLES; m++) {
			const struct sd_audit_row *r = &v->audit[i].row[m];
			fprintf(f, "muscle,%c,,", key(i));
			tbl_csv_field(f, v->label[i]);
			fprintf(f, ",%s,%.2f,,%.3f,%.3f,%.3f,%s,,,,,,,,,,,,,\n", muscle_name(m),
				r->dose.fractional, pct(r->pt.y), pct(r->pt.ci_lo), pct(r->pt.ci_hi),
				zone_name(r->zone));
		}
	for (int k = 0; k < v->npairs; k++)
		for (int m = 0; m < SD_NMUSCLES; m++) {
			const struct cmp_diff *d = diff_of(v, k, m);
			fprintf(f, "difference,%c,%c,,%s,%.2f,%.2f,,,,,%.4f,%.4f,%.4f,%.4f,%.4f,%s,,,,,,,\n",
				key(v->pair[k][0]), key(v->pair[k][1]), muscle_name(m), d->xa, d->xb,
				pct(d->d), pct(d->lo), pct(d->hi), pct(d->dlo), pct(d->dhi),
				cmp_decision_name(d->decision));
		}
	for (int i = 0; i < v->n; i++) {
		const struct cmp_totals *c = &v->tot[i];
		fprintf(f, "totals,%c,,", key(i));
		tbl_csv_field(f, v->label[i]);
		fprintf(f, ",,,,,,,,,,,,,,%d,%d,%.2f,%d,%d,%d,%d\n", c->hard_sets, c->sessions,
			c->sets_per_session, c->under_plateau, c->past_plateau, c->beyond_evidence,
			c->over_cap);
	}
	return 0;
}

static cJSON *program_json(const struct cmp_view *v, int i)
{
	const struct sd_audit *a = &v->audit[i];
	const struct cmp_totals *c = &v->tot[i];
	char k[2] = { key(i), '\0' };
	cJSON *o = cJSON_CreateObject(), *ms, *ws;

	if (!o)
		return NULL;
	cJSON_AddStringToObject(o, "key", k);
	cJSON_AddStringToObject(o, "program", v->prog[i].name);
	cJSON_AddStringToObject(o, "source", v->label[i]);
	cJSON_AddNumberToObject(o, "hard_sets", c->hard_sets);
	cJSON_AddNumberToObject(o, "sessions", c->sessions);
	json_num(o, "sets_per_session", c->sets_per_session, 2);
	cJSON_AddNumberToObject(o, "under_plateau", c->under_plateau);
	cJSON_AddNumberToObject(o, "past_plateau", c->past_plateau);
	cJSON_AddNumberToObject(o, "beyond_evidence", c->beyond_evidence);
	cJSON_AddNumberToObject(o, "over_session_cap", c->over_cap);
	ms = cJSON_AddArrayToObject(o, "muscles");
	for (int m = 0; ms && m < SD_NMUSCLES; m++) {
		const struct sd_audit_row *r = &a->row[m];
		cJSON *x = cJSON_CreateObject();
		if (!x)
			break;
		cJSON_AddStringToObject(x, "muscle", muscle_name(m));
		json_num(x, "fractional", r->dose.fractional, 2);
		json_num(x, "max_per_session", r->dose.max_session, 2);
		json_num(x, "gain_pct", pct(r->pt.y), 3);
		json_num(x, "curve_low", pct(r->pt.ci_lo), 3);
		json_num(x, "curve_high", pct(r->pt.ci_hi), 3);
		cJSON_AddStringToObject(x, "zone", zone_name(r->zone));
		cJSON_AddItemToArray(ms, x);
	}
	ws = cJSON_AddArrayToObject(o, "warnings");
	for (int w = 0; ws && w < a->nwarn; w++) {
		const struct sd_warning *wn = &a->warn[w];
		cJSON *x;
		if (wn->muscle < 0 || !(x = cJSON_CreateObject()))
			continue;
		cJSON_AddStringToObject(x, "muscle", muscle_name(wn->muscle));
		if (wn->day >= 0)
			cJSON_AddStringToObject(x, "day", v->prog[i].days[wn->day].name);
		else
			cJSON_AddNullToObject(x, "day");
		cJSON_AddStringToObject(x, "text", wn->text);
		cJSON_AddItemToArray(ws, x);
	}
	return o;
}

static cJSON *pair_json(const struct cmp_view *v, int k)
{
	char a[2] = { key(v->pair[k][0]), '\0' }, b[2] = { key(v->pair[k][1]), '\0' };
	cJSON *o = cJSON_CreateObject(), *ms;
	if (!o)
		return NULL;
	cJSON_AddStringToObject(o, "first", a);
	cJSON_AddStringToObject(o, "second", b);
	ms = cJSON_AddArrayToObject(o, "muscles");
	for (int m = 0; ms && m < SD_NMUSCLES; m++) {
		const struct cmp_diff *d = diff_of(v, k, m);
		cJSON *x = cJSON_CreateObject();
		if (!x)
			break;
		cJSON_AddStringToObject(x, "muscle", muscle_name(m));
		json_num(x, "sets_first", d->xa, 2);
		json_num(x, "sets_second", d->xb, 2);
		json_num(x, "delta_lnrr", d->d, 6);
		json_num(x, "se_lnrr", d->se, 6);
		json_num(x, "delta_pct", pct(d->d), 4);
		json_num(x, "ci_low", pct(d->lo), 4);
		json_num(x, "ci_high", pct(d->hi), 4);
		json_num(x, "dec_low", pct(d->dlo), 4);
		json_num(x, "dec_high", pct(d->dhi), 4);
		cJSON_AddStringToObject(x, "decision", cmp_decision_name(d->decision));
		cJSON_AddItemToArray(ms, x);
	}
	return o;
}

int cmp_out_json(FILE *f, const struct cmp_view *v)
{
	cJSON *o = cJSON_CreateObject(), *ps, *cs;

	if (!o)
		return -1;
	cJSON_AddStringToObject(o, "status", v->audit[0].cov.trained >= 0.5 ? "trained" : "untrained");
	json_num(o, "weeks", v->audit[0].cov.weeks, 2);
	json_profile(o, v->prof);
	json_evidence(o, v->prof, &v->audit[0].cov);
	json_num(o, "level", v->level, 4);
	json_num(o, "decision_level", cmp_decision_level(v->level), 4);
	json_num(o, "swc_pct", pct(v->prof->swc), 4);
	json_num(o, "plateau", v->audit[0].plateau, 2);
	json_num(o, "session_cap", v->cap, 4);
	ps = cJSON_AddArrayToObject(o, "programs");
	for (int i = 0; ps && i < v->n; i++)
		cJSON_AddItemToArray(ps, program_json(v, i));
	cs = cJSON_AddArrayToObject(o, "comparisons");
	for (int k = 0; cs && k < v->npairs; k++)
		cJSON_AddItemToArray(cs, pair_json(v, k));
	cJSON_AddStringToObject(o, "intervals", interval_note(v->prof));
	if (v->note)
		cJSON_AddStringToObject(o, "note", v->note);
	cJSON_AddStringToObject(o, "caution", aout_caution);
	return json_emit(f, o);
}
