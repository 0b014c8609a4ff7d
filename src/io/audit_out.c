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

void aout_report(FILE *f, const struct sd_audit_info *in, int color)
{
	const struct sd_audit *a = in->audit;
	const struct sd_program *p = in->prog;
	int lvl = (int)lround(a->level * 100);
	struct sd_table *t = aout_muscle_table(0);

	fprintf(f, "%s%s%s (%s)\n", color ? "\033[1m" : "", p->name, color ? "\033[0m" : "", in->label);
	if (in->athlete)
		fprintf(f, "athlete: %s\n", in->athlete);
	fprintf(f, "%d day%s, %d hard sets a week; %s, %g-week block; profile %s; plateau at %g "
		"weekly fractional sets (SWC %.1f%%)\n\n", p->ndays, p->ndays == 1 ? "" : "s",
		a->vol.hard_sets, status_name(a), a->cov.weeks, in->prof->name, a->plateau,
		pct(in->prof->swc));
	if (t && !aout_muscle_rows(t, in, 0)) {
		tbl_print(t, f, 0);
	}
	tbl_free(t);
	fprintf(f, "\ngain: predicted 1RM change over the block, %d%% CI (average athlete) and %d%% PI "
		"(a new athlete); +1 set: gain per extra weekly set.\n", lvl, lvl);
	for (int i = 0; i < a->nwarn; i++)
		fprintf(f, "%swarning:%s %s\n", color ? "\033[33m" : "", color ? "\033[0m" : "",
			a->warn[i].text);
}

static const char *const muscle_heads[] = {
	"<program", "<muscle", "direct", "indirect", "fractional", "max/session", "sessions",
	"gain%", "ci_low", "ci_high", "pi_low", "pi_high", "+1set%", "<zone",
};

struct sd_table *aout_muscle_table(int with_label)
{
	return tbl_new(with_label ? 14 : 13, muscle_heads + (with_label ? 0 : 1));
}

int aout_muscle_rows(struct sd_table *t, const struct sd_audit_info *in, int with_label)
{
	const struct sd_audit *a = in->audit;
	for (int m = 0; m < SD_NMUSCLES; m++) {
		const struct sd_audit_row *r = &a->row[m];
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
		tbl_set(t, c++, "%.1f", pct(r->pt.y));
		tbl_set(t, c++, "%.1f", pct(r->pt.ci_lo));
		tbl_set(t, c++, "%.1f", pct(r->pt.ci_hi));
		tbl_set(t, c++, "%.1f", pct(r->pt.pi_lo));
		tbl_set(t, c++, "%.1f", pct(r->pt.pi_hi));
		tbl_set(t, c++, "%.2f", r->marg.pct);
		tbl_set(t, c++, "%s", zone_name(r->zone));
	}
	return 0;
}

void aout_sum_head(const struct sd_sumout *o)
{
	if (o->csv) {
		fprintf(o->f, "%sprogram,muscle,fractional,gain_pct,ci_low,ci_high,marginal_pct,zone\n",
			o->with_athlete ? "athlete," : "");
		return;
	}
	if (o->with_athlete)
		fprintf(o->f, "%-*s  ", o->wa, "athlete");
	fprintf(o->f, "%-*s  %-11s  %10s  %6s  %7s  %7s  %7s  %s\n", o->wp, "program", "muscle",
		"fractional", "gain%", "ci_low", "ci_high", "+1set%", "zone");
}

void aout_sum_rows(const struct sd_sumout *o, const struct sd_audit_info *in)
{
	const struct sd_audit *a = in->audit;
	for (int m = 0; m < SD_NMUSCLES; m++) {
		const struct sd_audit_row *r = &a->row[m];
		if (o->csv) {
			if (o->with_athlete) {
				tbl_csv_field(o->f, in->athlete ? in->athlete : "");
				fputc(',', o->f);
			}
			tbl_csv_field(o->f, in->label);
			fprintf(o->f, ",%s,%.2f,%.3f,%.3f,%.3f,%.4f,%s\n", muscle_name(m),
				r->dose.fractional, pct(r->pt.y), pct(r->pt.ci_lo), pct(r->pt.ci_hi),
				r->marg.pct, zone_name(r->zone));
			continue;
		}
		if (o->with_athlete)
			fprintf(o->f, "%-*s  ", o->wa, in->athlete ? in->athlete : "");
		fprintf(o->f, "%-*s  %-11s  %10.1f  %6.1f  %7.1f  %7.1f  %7.2f  %s\n", o->wp, in->label,
			muscle_name(m), r->dose.fractional, pct(r->pt.y), pct(r->pt.ci_lo),
			pct(r->pt.ci_hi), r->marg.pct, zone_name(r->zone));
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
	json_num(o, "ci_low", pct(r->pt.ci_lo), 3);
	json_num(o, "ci_high", pct(r->pt.ci_hi), 3);
	json_num(o, "pi_low", pct(r->pt.pi_lo), 3);
	json_num(o, "pi_high", pct(r->pt.pi_hi), 3);
	json_num(o, "marginal_pct", r->marg.pct, 4);
	json_num(o, "marginal_low", r->marg.lo, 4);
	json_num(o, "marginal_high", r->marg.hi, 4);
	cJSON_AddStringToObject(o, "zone", zone_name(r->zone));
	return o;
}

int aout_json_item(FILE *f, const struct sd_audit_info *in, int first)
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
	cJSON_AddStringToObject(o, "profile", in->prof->name);
	json_num(o, "level", a->level, 4);
	json_num(o, "swc_pct", pct(in->prof->swc), 4);
	json_num(o, "plateau", a->plateau, 2);
	json_num(o, "evidence_max", in->prof->dose_max, 2);
	ms = cJSON_AddArrayToObject(o, "muscles");
	for (int m = 0; ms && m < SD_NMUSCLES; m++)
		cJSON_AddItemToArray(ms, muscle_json(a, m));
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
