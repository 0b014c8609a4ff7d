#include "audit_out.h"
#include "numfmt.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

#include <cjson/cJSON.h>

#include "jsonout.h"
#include "wrap.h"

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

/* Continuation lines of a band's text start under the text, after the level's name. */
#define BAND_INDENT 11

void aout_bands_text(FILE *f, int level_pct)
{
	fprintf(f, "%d%% intervals for three levels:\n", level_pct);
	for (int i = 0; i < 3; i++)
		wrap_printf(f, BAND_INDENT, "  %s", aout_band_lines[i]);
}

void aout_plus1_text(FILE *f)
{
	wrap_printf(f, 7, "+1set: percentage points one more weekly set adds on the average curve, "
		    "with its interval.");
}

void aout_profile_line(FILE *f, const struct sd_profile *p)
{
	char line[300];
	profile_oneline(p, line, sizeof line);
	wrap_printf(f, 2, "%s", line);
}

void aout_caution_text(FILE *f)
{
	wrap_printf(f, 0, "%s", aout_caution);
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

/* '~': left out of the narrow table (table.h). */
static const char *const gain_heads[] = {
	"gain%", "curve_lo", "curve_hi", "~group_lo", "~group_hi", "athlete_lo", "athlete_hi",
	"+1set%", "~+1set_lo", "~+1set_hi",
};
#define NGAIN ((int)(sizeof gain_heads / sizeof gain_heads[0]))

struct sd_table *aout_gain_table(const char *key, int with_zone)
{
	const char *heads[NGAIN + 2];
	heads[0] = key;
	for (int i = 0; i < NGAIN; i++)
		heads[i + 1] = gain_heads[i];
	heads[NGAIN + 1] = "<zone";
	return tbl_new(NGAIN + 1 + !!with_zone, heads);
}

int aout_gain_cells(struct sd_table *t, int c, const struct sd_point *pt,
		    const struct sd_plus1 *p1, int precise)
{
	const char *g = precise ? "%.3f" : "%.1f", *m = precise ? "%.4f" : "%.2f";
	tbl_set(t, c++, g, pct(pt->y));
	tbl_set(t, c++, g, pct(pt->ci_lo));
	tbl_set(t, c++, g, pct(pt->ci_hi));
	tbl_set(t, c++, g, pct(pt->group_lo));
	tbl_set(t, c++, g, pct(pt->group_hi));
	tbl_set(t, c++, g, pct(pt->ath_lo));
	tbl_set(t, c++, g, pct(pt->ath_hi));
	tbl_set(t, c++, m, p1->pct);
	tbl_set(t, c++, m, p1->lo);
	tbl_set(t, c++, m, p1->hi);
	return c;
}

static struct sd_table *gain_table(const struct sd_audit *a)
{
	struct sd_table *t = aout_gain_table("<muscle", 0);
	for (int m = 0; t && m < SD_NMUSCLES; m++) {
		if (tbl_row(t))
			break;
		tbl_set(t, 0, "%s", muscle_name(m));
		aout_gain_cells(t, 1, &a->row[m].pt, &a->row[m].plus1, 0);
	}
	return t;
}

/* The exercises behind each muscle's total; the muscle named on its first row only. */
static struct sd_table *source_table(const struct sd_audit_info *in)
{
	static const char *const heads[] = { "<muscle", "<exercise", "direct", "indirect",
					     "fractional" };
	struct sd_table *t = tbl_new(5, heads);
	for (int m = 0; t && m < SD_NMUSCLES; m++) {
		int n;
		const struct sd_source *s = vol_sources(&in->audit->vol, m, &n);
		for (int i = 0; i < n; i++) {
			if (tbl_row(t))
				return t;
			if (!i)
				tbl_set(t, 0, "%s", muscle_name(m));
			tbl_set(t, 1, "%s", in->lib->ex[s[i].ex].name);
			tbl_set(t, 2, "%g", s[i].direct);
			tbl_set(t, 3, "%g", s[i].indirect);
			tbl_set(t, 4, "%.1f", s[i].fractional);
		}
	}
	return t;
}

void aout_report(FILE *f, const struct sd_audit_info *in, int color)
{
	const struct sd_audit *a = in->audit;
	const struct sd_program *p = in->prog;
	int lvl = (int)lround(a->level * 100), mode = tbl_mode(0, in->wide);
	struct sd_table *t;

	fputs(color ? "\033[1m" : "", f);
	wrap_printf(f, 2, "%s (%s)", p->name, in->label);
	fputs(color ? "\033[0m" : "", f);
	if (in->athlete)
		wrap_printf(f, 2, "athlete: %s", in->athlete);
	wrap_printf(f, 2, "%d day%s, %d hard sets a week; %s, %g-week block%s; profile %s; plateau "
		    "at %g weekly fractional sets (SWC %.1f%%)", p->ndays, p->ndays == 1 ? "" : "s",
		    a->vol.hard_sets, status_name(a), a->cov.weeks,
		    a->beyond ? " (beyond the evidence)" : "", in->prof->name, a->plateau,
		    pct(in->prof->swc));
	fputc('\n', f);
	if ((t = dose_table(a)))
		tbl_print(t, f, mode);
	tbl_free(t);
	fprintf(f, "\npredicted 1RM change over the block (%%), %d%% intervals\n", lvl);
	if ((t = gain_table(a)))
		tbl_print(t, f, mode);
	tbl_free(t);
	if (in->by_exercise && in->lib) {
		fputc('\n', f);
		wrap_printf(f, 2, "where the fractional sets come from (hard sets a week; a direct set "
			    "counts %g, an indirect set %g)", in->prof->w_direct, in->prof->w_indirect);
		if ((t = source_table(in)))
			tbl_print(t, f, mode);
		tbl_free(t);
	}
	fputc('\n', f);
	aout_bands_text(f, lvl);
	aout_plus1_text(f);
	if (!in->wide)
		wrap_printf(f, 2, "--wide adds the group interval and the +1set interval.");
	for (int i = 0; i < a->nwarn; i++)
		wrap_printf(f, 9, "%swarning:%s %s", color ? "\033[33m" : "", color ? "\033[0m" : "",
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
		c = aout_gain_cells(t, c, &r->pt, &r->plus1, 1);
		tbl_set(t, c++, "%s", zone_name(r->zone));
		tbl_set(t, c++, "%s", curve_beyond_names(r->pt.beyond, beyond, sizeof beyond));
	}
	return 0;
}

struct sd_table *aout_source_table(void)
{
	static const char *const heads[] = { "<program", "<muscle", "<exercise", "direct",
					     "indirect", "fractional" };
	return tbl_new(6, heads);
}

int aout_source_rows(struct sd_table *t, const struct sd_audit_info *in)
{
	for (int m = 0; m < SD_NMUSCLES; m++) {
		int n;
		const struct sd_source *s = vol_sources(&in->audit->vol, m, &n);
		for (int i = 0; i < n; i++) {
			if (tbl_row(t))
				return -1;
			tbl_set(t, 0, "%s", in->label);
			tbl_set(t, 1, "%s", muscle_name(m));
			tbl_set(t, 2, "%s", in->lib->ex[s[i].ex].name);
			tbl_set(t, 3, "%g", s[i].direct);
			tbl_set(t, 4, "%g", s[i].indirect);
			tbl_set(t, 5, "%.2f", s[i].fractional);
		}
	}
	return 0;
}

void aout_sum_head(const struct sd_sumout *o)
{
	if (o->csv) {
		fprintf(o->f, "%sprogram,muscle,fractional,gain_pct,curve_low,curve_high,athlete_low,"
			"athlete_high,plus1_pct,plus1_low,plus1_high,zone,beyond_evidence%s%s\n",
			o->with_athlete ? "athlete," : "", o->with_athlete ? ",overdue_days" : "",
			o->with_done ? ",done" : "");
		return;
	}
	if (o->with_athlete)
		fprintf(o->f, "%-*s  ", o->wa, "athlete");
	if (o->with_done)
		fprintf(o->f, "%6s  ", "done");
	fprintf(o->f, "%-*s  %-11s  %10s  ", o->wp, "program", "muscle", "fractional");
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
	} else if (logged) {
		fprintf(o->f, "%6.1f  ", o->done->dose[m]);
	} else {
		fprintf(o->f, "%6s  ", "-");
	}
}

/* The rows' text, built in memory without stdio: this is the inner loop of a batch audit. */
struct sbuf {
	char *p;
	size_t n, cap;
	int oom;
};

static char *room(struct sbuf *b, size_t k)
{
	if (b->n + k + 1 > b->cap) {
		size_t cap = b->cap ? b->cap : 4096;
		char *p;
		while (b->n + k + 1 > cap)
			cap *= 2;
		if (!(p = realloc(b->p, cap))) {
			b->oom = 1;
			return NULL;
		}
		b->p = p;
		b->cap = cap;
	}
	return b->p + b->n;
}

static void put(struct sbuf *b, const char *s)
{
	size_t k = strlen(s);
	char *d = room(b, k);
	if (d) {
		memcpy(d, s, k + 1);
		b->n += k;
	}
}

/* s left-aligned in width columns, as "%-*s" (bytes, like printf). */
static void put_left(struct sbuf *b, const char *s, int width)
{
	int k = (int)strlen(s);
	put(b, s);
	for (; k < width; k++)
		put(b, " ");
}

/* A number as "%*.*f" writes it, without the general formatter (numfmt.h); sep before it. */
static void put_num(struct sbuf *b, const char *sep, double v, int width, int dec)
{
	char num[48];
	nf_pad(num, v, width, dec);
	put(b, sep);
	put(b, num);
}

static void put_csv(struct sbuf *b, const char *s)
{
	if (!strpbrk(s, ",\"\n\r")) {
		put(b, s);
		return;
	}
	put(b, "\"");
	for (; *s; s++)
		put(b, *s == '"' ? "\"\"" : (char[2]){ *s, '\0' });
	put(b, "\"");
}

/* Every row's text after the athlete column (and before CSV's overdue_days), one row a line:
 * it depends only on the audit, so audit --all formats it once per template, status and
 * weeks and prints it for each of their athletes. */
int aout_sum_format(const struct sd_sumout *o, const struct sd_audit_info *in,
		    struct sd_sumrows *r)
{
	const struct sd_audit *a = in->audit;
	struct sbuf b = { NULL, 0, 0, 0 };
	char beyond[32];

	for (int m = 0; m < SD_NMUSCLES; m++) {
		const struct sd_audit_row *x = &a->row[m];
		if (o->csv) {
			put_csv(&b, in->label);
			put(&b, ",");
			put(&b, muscle_name(m));
			put_num(&b, ",", x->dose.fractional, 0, 2);
			put_num(&b, ",", pct(x->pt.y), 0, 3);
			put_num(&b, ",", pct(x->pt.ci_lo), 0, 3);
			put_num(&b, ",", pct(x->pt.ci_hi), 0, 3);
			put_num(&b, ",", pct(x->pt.ath_lo), 0, 3);
			put_num(&b, ",", pct(x->pt.ath_hi), 0, 3);
			put_num(&b, ",", x->plus1.pct, 0, 4);
			put_num(&b, ",", x->plus1.lo, 0, 4);
			put_num(&b, ",", x->plus1.hi, 0, 4);
			put(&b, ",");
			put(&b, zone_name(x->zone));
			put(&b, ",");
			put(&b, curve_beyond_names(x->pt.beyond, beyond, sizeof beyond));
			put(&b, "\n");
			continue;
		}
		put_left(&b, in->label, o->wp);
		put(&b, "  ");
		put_left(&b, muscle_name(m), 11);
		put_num(&b, "  ", x->dose.fractional, 10, 1);
		put_num(&b, "  ", pct(x->pt.y), 6, 1);
		put_num(&b, "  ", pct(x->pt.ci_lo), 8, 1);
		put_num(&b, "  ", pct(x->pt.ci_hi), 8, 1);
		put_num(&b, "  ", pct(x->pt.ath_lo), 10, 1);
		put_num(&b, "  ", pct(x->pt.ath_hi), 10, 1);
		put_num(&b, "  ", x->plus1.pct, 6, 2);
		put_num(&b, "  ", x->plus1.lo, 8, 2);
		put_num(&b, "  ", x->plus1.hi, 8, 2);
		put(&b, "  ");
		put(&b, zone_name(x->zone));
		if (x->pt.beyond & ~SD_BEYOND_DOSE) {
			put(&b, ", beyond: ");
			put(&b, curve_beyond_names(x->pt.beyond & ~SD_BEYOND_DOSE, beyond, sizeof beyond));
		}
		put(&b, "\n");
	}
	if (b.oom || !b.p) {
		free(b.p);
		return -1;
	}
	r->text = b.p;
	return 0;
}

void aout_sum_print(const struct sd_sumout *o, const struct sd_audit_info *in,
		    const struct sd_sumrows *r)
{
	/* The athlete's own cells (name, the dose logged, days overdue) go around the shared
	 * text: the athlete and the dose done first in the table, last in CSV. */
	int m = 0;
	for (const char *line = r->text, *nl; (nl = strchr(line, '\n')); line = nl + 1, m++) {
		if (o->with_athlete && o->csv) {
			tbl_csv_field(o->f, in->athlete ? in->athlete : "");
			fputc(',', o->f);
		} else if (o->with_athlete) {
			fprintf(o->f, "%-*s  ", o->wa, in->athlete ? in->athlete : "");
		}
		if (o->with_done && !o->csv)
			done_cell(o, m);
		fwrite(line, 1, (size_t)(nl - line), o->f);
		if (o->with_athlete && o->csv)
			fprintf(o->f, ",%d", in->overdue_days);
		if (o->with_done && o->csv) {
			fputc(',', o->f);
			done_cell(o, m);
		}
		fputc('\n', o->f);
	}
}

void aout_sum_free(struct sd_sumrows *r)
{
	free(r->text);
	r->text = NULL;
}

int aout_sum_rows(const struct sd_sumout *o, const struct sd_audit_info *in)
{
	struct sd_sumrows r = { NULL };

	if (aout_sum_format(o, in, &r))
		return -1;
	aout_sum_print(o, in, &r);
	aout_sum_free(&r);
	return 0;
}

/* The exercises behind a muscle's total (--by-exercise). */
static cJSON *sources_json(const struct sd_audit_info *in, int m)
{
	int n;
	const struct sd_source *s = vol_sources(&in->audit->vol, m, &n);
	cJSON *arr = cJSON_CreateArray();
	for (int i = 0; arr && i < n; i++) {
		cJSON *o = cJSON_CreateObject();
		if (!o)
			break;
		cJSON_AddStringToObject(o, "exercise", in->lib->ex[s[i].ex].name);
		json_num(o, "direct", s[i].direct, 2);
		json_num(o, "indirect", s[i].indirect, 2);
		json_num(o, "fractional", s[i].fractional, 2);
		cJSON_AddItemToArray(arr, o);
	}
	return arr;
}

static cJSON *muscle_json(const struct sd_audit_info *in, int m)
{
	const struct sd_audit *a = in->audit;
	const struct sd_audit_row *r = &a->row[m];
	cJSON *o = cJSON_CreateObject();
	if (!o)
		return NULL;
	cJSON_AddStringToObject(o, "muscle", muscle_name(m));
	json_num(o, "direct", r->dose.direct, 2);
	json_num(o, "indirect", r->dose.indirect, 2);
	json_num(o, "not_counted", r->dose.easy, 2);
	json_audit_row(o, r);
	json_num(o, "se", r->pt.se, 6);
	if (in->by_exercise && in->lib)
		cJSON_AddItemToObject(o, "sources", sources_json(in, m));
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
	if (in->athlete) {
		cJSON_AddStringToObject(o, "athlete", in->athlete);
		cJSON_AddNumberToObject(o, "overdue_days", in->overdue_days);
	}
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
		cJSON_AddItemToArray(ms, muscle_json(in, m));
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
