#include "audit_out.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

#include <cjson/cJSON.h>

#include "jsonout.h"

#include "../core/curve.h"

const char aout_caution[] =
	"Caution: a population-average model; individual responses vary. Progress volume "
	"gradually, stop and see a qualified professional on pain or injury. Not medical advice; "
	"defer to licensed practice.";

static double pct(double y)
{
	return curve_pct(y);
}

static const char *status_name(const struct sd_audit *a)
{
	return a->cov.trained >= 0.5 ? "trained" : "untrained";
}

const char aout_bands_legend[] =
	"curve: the average curve (confidence interval); group: a new group or study (adds the "
	"between-study heterogeneity); athlete: one athlete (adds the between-athlete variance "
	"of the response)";

const char *const aout_band_lines[3] = {
	"curve    the average curve (confidence interval)",
	"group    a new group or study (adds the between-study heterogeneity tau2 + sigma2)",
	"athlete  one athlete (adds the profile's between-athlete variance of the response)",
};

void aout_bands_text(FILE *f, int level_pct)
{
	fprintf(f, "%d%% intervals for three levels:\n", level_pct);
	for (int i = 0; i < 3; i++)
		fprintf(f, "  %s\n", aout_band_lines[i]);
}

void aout_profile_line(FILE *f, const struct sd_profile *p)
{
	char line[300];
	profile_oneline(p, line, sizeof line);
	fprintf(f, "%s\n", line);
}

static struct sd_table *dose_table(const struct sd_audit *a)
{
	static const char *const heads[] = { "<muscle", "direct", "indirect", "fractional",
					     "max/session", "sessions", "<zone" };
	struct sd_table *t = tbl_new(7, heads);
	for (int m = 0; t && m < SD_NMUSCLES; m++) {
		const struct sd_audit_row *r = &a->row[m];
		if (tbl_row(t))
			break;
		tbl_set(t, 0, "%s", muscle_name(m));
		tbl_set(t, 1, "%g", r->dose.direct);
		tbl_set(t, 2, "%g", r->dose.indirect);
		tbl_set(t, 3, "%.1f", r->dose.fractional);
		tbl_set(t, 4, "%.1f", r->dose.max_session);
		tbl_set(t, 5, "%d", r->dose.sessions);
		tbl_set(t, 6, "%s", zone_name(r->zone));
	}
	return t;
}

static const char *const gain_heads[] = {
	"<muscle", "gain%", "curve_lo", "curve_hi", "group_lo", "group_hi", "athlete_lo",
	"athlete_hi", "+1set%", "+1set_lo", "+1set_hi",
};

/* The gain columns of one row, from column c on: gain, the three intervals, +1 set. */
static int gain_cells(struct sd_table *t, int c, const struct sd_audit_row *r, int precise)
{
	const char *g = precise ? "%.3f" : "%.1f", *m = precise ? "%.4f" : "%.2f";
	tbl_set(t, c++, g, pct(r->pt.y));
	tbl_set(t, c++, g, pct(r->pt.ci_lo));
	tbl_set(t, c++, g, pct(r->pt.ci_hi));
	tbl_set(t, c++, g, pct(r->pt.group_lo));
	tbl_set(t, c++, g, pct(r->pt.group_hi));
	tbl_set(t, c++, g, pct(r->pt.ath_lo));
	tbl_set(t, c++, g, pct(r->pt.ath_hi));
	tbl_set(t, c++, m, r->plus1.pct);
	tbl_set(t, c++, m, r->plus1.lo);
	tbl_set(t, c++, m, r->plus1.hi);
	return c;
}

static struct sd_table *gain_table(const struct sd_audit *a)
{
	struct sd_table *t = tbl_new(11, gain_heads);
	for (int m = 0; t && m < SD_NMUSCLES; m++) {
		if (tbl_row(t))
			break;
		tbl_set(t, 0, "%s", muscle_name(m));
		gain_cells(t, 1, &a->row[m], 0);
	}
	return t;
}

void aout_report(FILE *f, const struct sd_audit_info *in, int color)
{
	const struct sd_audit *a = in->audit;
	const struct sd_program *p = in->prog;
	int lvl = (int)lround(a->level * 100);
	struct sd_table *t;

	fprintf(f, "%s%s%s (%s)\n", color ? "\033[1m" : "", p->name, color ? "\033[0m" : "", in->label);
	if (in->athlete)
		fprintf(f, "athlete: %s\n", in->athlete);
	fprintf(f, "%d day%s, %d hard sets a week; %s, %g-week block%s; profile %s; plateau at %g "
		"weekly fractional sets (SWC %.1f%%)\n\n", p->ndays, p->ndays == 1 ? "" : "s",
		a->vol.hard_sets, status_name(a), a->cov.weeks,
		a->beyond ? " (beyond the evidence)" : "", in->prof->name, a->plateau,
		pct(in->prof->swc));
	if ((t = dose_table(a)))
		tbl_print(t, f, 0);
	tbl_free(t);
	fprintf(f, "\npredicted 1RM change over the block (%%), %d%% intervals\n", lvl);
	if ((t = gain_table(a)))
		tbl_print(t, f, 0);
	tbl_free(t);
	fputc('\n', f);
	aout_bands_text(f, lvl);
	fprintf(f, "+1set: percentage points one more weekly set adds on the average curve, with its "
		"interval.\n");
	for (int i = 0; i < a->nwarn; i++)
		fprintf(f, "%swarning:%s %s\n", color ? "\033[33m" : "", color ? "\033[0m" : "",
			a->warn[i].text);
}

static const char *const muscle_heads[] = {
	"<program", "<muscle", "direct", "indirect", "fractional", "max/session", "sessions",
	"gain%", "curve_lo", "curve_hi", "group_lo", "group_hi", "athlete_lo", "athlete_hi",
	"+1set%", "+1set_lo", "+1set_hi", "<zone", "<beyond",
};

struct sd_table *aout_muscle_table(int with_label)
{
	return tbl_new(with_label ? 19 : 18, muscle_heads + (with_label ? 0 : 1));
}

int aout_muscle_rows(struct sd_table *t, const struct sd_audit_info *in, int with_label)
{
	const struct sd_audit *a = in->audit;
	for (int m = 0; m < SD_NMUSCLES; m++) {
		const struct sd_audit_row *r = &a->row[m];
		char beyond[32];
		int c = 0;
		if (tbl_row(t))
			return -1;
		if (with_label)
			tbl_set(t, c++, "%s", in->label);
		tbl_set(t, c++, "%s", muscle_name(m));
		tbl_set(t, c++, "%g", r->dose.direct);
		tbl_set(t, c++, "%g", r->dose.indirect);
		tbl_set(t, c++, "%.1f", r->dose.fractional);
		tbl_set(t, c++, "%.1f", r->dose.max_session);
		tbl_set(t, c++, "%d", r->dose.sessions);
		c = gain_cells(t, c, r, 1);
		tbl_set(t, c++, "%s", zone_name(r->zone));
		tbl_set(t, c++, "%s", curve_beyond_names(r->pt.beyond, beyond, sizeof beyond));
	}
	return 0;
}

void aout_sum_head(const struct sd_sumout *o)
{
	if (o->csv) {
		fprintf(o->f, "%sprogram,muscle,fractional,%sgain_pct,curve_low,curve_high,athlete_low,"
			"athlete_high,plus1_pct,plus1_low,plus1_high,zone,beyond_evidence\n",
			o->with_athlete ? "athlete," : "", o->with_done ? "done," : "");
		return;
	}
	if (o->with_athlete)
		fprintf(o->f, "%-*s  ", o->wa, "athlete");
	fprintf(o->f, "%-*s  %-11s  %10s  ", o->wp, "program", "muscle", "fractional");
	if (o->with_done)
		fprintf(o->f, "%6s  ", "done");
	fprintf(o->f, "%6s  %8s  %8s  %10s  %10s  %6s  %8s  %8s  %s\n", "gain%", "curve_lo",
		"curve_hi", "athlete_lo", "athlete_hi", "+1set%", "+1set_lo", "+1set_hi", "zone");
}

/* The logged dose of muscle m as a cell: empty when nothing was logged. */
static void done_cell(const struct sd_sumout *o, int m)
{
	int logged = o->done && o->done->logged;

	if (o->csv) {
		if (logged)
			fprintf(o->f, "%.2f", o->done->dose[m]);
		fputc(',', o->f);
	} else if (logged) {
		fprintf(o->f, "%6.1f  ", o->done->dose[m]);
	} else {
		fprintf(o->f, "%6s  ", "-");
	}
}

void aout_sum_rows(const struct sd_sumout *o, const struct sd_audit_info *in)
{
	const struct sd_audit *a = in->audit;
	char beyond[32];
	for (int m = 0; m < SD_NMUSCLES; m++) {
		const struct sd_audit_row *r = &a->row[m];
		if (o->csv) {
			if (o->with_athlete) {
				tbl_csv_field(o->f, in->athlete ? in->athlete : "");
				fputc(',', o->f);
			}
			tbl_csv_field(o->f, in->label);
			fprintf(o->f, ",%s,%.2f,", muscle_name(m), r->dose.fractional);
			if (o->with_done)
				done_cell(o, m);
			fprintf(o->f, "%.3f,%.3f,%.3f,%.3f,%.3f,%.4f,%.4f,%.4f,%s,%s\n",
				pct(r->pt.y), pct(r->pt.ci_lo),
				pct(r->pt.ci_hi), pct(r->pt.ath_lo), pct(r->pt.ath_hi), r->plus1.pct,
				r->plus1.lo, r->plus1.hi, zone_name(r->zone),
				curve_beyond_names(r->pt.beyond, beyond, sizeof beyond));
			continue;
		}
		if (o->with_athlete)
			fprintf(o->f, "%-*s  ", o->wa, in->athlete ? in->athlete : "");
		fprintf(o->f, "%-*s  %-11s  %10.1f  ", o->wp, in->label, muscle_name(m),
			r->dose.fractional);
		if (o->with_done)
			done_cell(o, m);
		fprintf(o->f, "%6.1f  %8.1f  %8.1f  %10.1f  %10.1f  %6.2f  %8.2f  "
			"%8.2f  %s%s%s\n",
			pct(r->pt.y), pct(r->pt.ci_lo), pct(r->pt.ci_hi), pct(r->pt.ath_lo),
			pct(r->pt.ath_hi), r->plus1.pct, r->plus1.lo, r->plus1.hi, zone_name(r->zone),
			r->pt.beyond & ~SD_BEYOND_DOSE ? ", beyond: " : "",
			r->pt.beyond & ~SD_BEYOND_DOSE ? curve_beyond_names(r->pt.beyond & ~SD_BEYOND_DOSE,
							 beyond, sizeof beyond) : "");
	}
}

static cJSON *muscle_json(const struct sd_audit *a, int m)
{
	const struct sd_audit_row *r = &a->row[m];
	cJSON *o = cJSON_CreateObject();
	if (!o)
		return NULL;
	cJSON_AddStringToObject(o, "muscle", muscle_name(m));
	json_num(o, "direct", r->dose.direct, 2);
	json_num(o, "indirect", r->dose.indirect, 2);
	json_num(o, "fractional", r->dose.fractional, 2);
	json_num(o, "max_per_session", r->dose.max_session, 2);
	cJSON_AddNumberToObject(o, "sessions", r->dose.sessions);
	json_num(o, "not_counted", r->dose.easy, 2);
	json_num(o, "lnrr", r->pt.y, 6);
	json_num(o, "se", r->pt.se, 6);
	json_num(o, "gain_pct", pct(r->pt.y), 3);
	json_bands(o, &r->pt, 3);
	json_num(o, "plus1_pct", r->plus1.pct, 4);
	json_num(o, "plus1_low", r->plus1.lo, 4);
	json_num(o, "plus1_high", r->plus1.hi, 4);
	cJSON_AddStringToObject(o, "zone", zone_name(r->zone));
	return o;
}

/* "logged": the block's logged average weekly dose, or null. */
static void done_json(cJSON *o, const struct aout_done *d)
{
	cJSON *l, *ms;

	if (!d || !d->logged) {
		cJSON_AddNullToObject(o, "logged");
		return;
	}
	if (!(l = cJSON_AddObjectToObject(o, "logged")))
		return;
	cJSON_AddStringToObject(l, "from", d->from);
	cJSON_AddStringToObject(l, "to", d->to);
	json_num(l, "weeks", d->weeks, 2);
	cJSON_AddNumberToObject(l, "days", d->days);
	if (!(ms = cJSON_AddArrayToObject(l, "muscles")))
		return;
	for (int m = 0; m < SD_NMUSCLES; m++) {
		cJSON *x = cJSON_CreateObject();
		if (!x)
			return;
		cJSON_AddStringToObject(x, "muscle", muscle_name(m));
		json_num(x, "done", d->dose[m], 2);
		cJSON_AddItemToArray(ms, x);
	}
}

int aout_json_item(FILE *f, const struct sd_audit_info *in, int first)
{
	return aout_json_item_done(f, in, NULL, first);
}

int aout_json_item_done(FILE *f, const struct sd_audit_info *in, const struct aout_done *done,
			int first)
{
	const struct sd_audit *a = in->audit;
	cJSON *o = cJSON_CreateObject(), *ms, *ws;
	char *text;
	int rc = -1;

	if (!o)
		return -1;
	if (in->athlete)
		cJSON_AddStringToObject(o, "athlete", in->athlete);
	cJSON_AddStringToObject(o, "program", in->prog->name);
	cJSON_AddStringToObject(o, "source", in->label);
	cJSON_AddNumberToObject(o, "days", in->prog->ndays);
	cJSON_AddNumberToObject(o, "hard_sets", a->vol.hard_sets);
	cJSON_AddNumberToObject(o, "sets_not_counted", a->vol.easy_sets);
	cJSON_AddStringToObject(o, "status", status_name(a));
	json_num(o, "weeks", a->cov.weeks, 2);
	json_profile(o, in->prof);
	json_evidence(o, in->prof, &a->cov);
	json_num(o, "level", a->level, 4);
	json_num(o, "swc_pct", pct(in->prof->swc), 4);
	json_num(o, "plateau", a->plateau, 2);
	ms = cJSON_AddArrayToObject(o, "muscles");
	for (int m = 0; ms && m < SD_NMUSCLES; m++)
		cJSON_AddItemToArray(ms, muscle_json(a, m));
	if (done)
		done_json(o, done);
	ws = cJSON_AddArrayToObject(o, "warnings");
	for (int i = 0; ws && i < a->nwarn; i++) {
		cJSON *w = cJSON_CreateObject();
		if (!w)
			goto out;
		if (a->warn[i].muscle >= 0)
			cJSON_AddStringToObject(w, "muscle", muscle_name(a->warn[i].muscle));
		else
			cJSON_AddNullToObject(w, "muscle");
		if (a->warn[i].day >= 0)
			cJSON_AddStringToObject(w, "day", in->prog->days[a->warn[i].day].name);
		else
			cJSON_AddNullToObject(w, "day");
		cJSON_AddStringToObject(w, "text", a->warn[i].text);
		cJSON_AddItemToArray(ws, w);
	}
	if (!ms || !ws || !(text = json_print(o, 1)))
		goto out;
	fprintf(f, "%s%s", first ? "\n" : ",\n", text);
	free(text);
	rc = 0;
out:
	cJSON_Delete(o);
	return rc;
}

void aout_json_begin(FILE *f)
{
	fputs("{\"audits\": [", f);
}

void aout_json_end(FILE *f)
{
	cJSON *s = cJSON_CreateString(aout_caution);
	char *text = s ? json_print(s, 0) : NULL;
	fprintf(f, "\n],\n\"caution\": %s}\n", text ? text : "\"\"");
	free(text);
	cJSON_Delete(s);
}
