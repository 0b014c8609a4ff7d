#include "tlog.h"

#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "date.h"
#include "e1rm.h"
#include "program.h"
#include "volume.h"

/* ------------------------------------------------------------ identity */

static int cmp_num(double a, double b)
{
	return a < b ? -1 : a > b;
}

static int same_row(const struct tlog_entry *a, const struct tlog_entry *b)
{
	int c;
	if ((c = cmp_num((double)a->athlete_id, (double)b->athlete_id)) ||
	    (c = cmp_num((double)a->day, (double)b->day)) || (c = a->ex - b->ex) ||
	    (c = a->sets - b->sets) || (c = a->reps - b->reps) || (c = a->timed - b->timed) ||
	    (c = cmp_num(a->rir, b->rir)) || (c = cmp_num(a->load, b->load)) ||
	    (c = a->unit - b->unit))
		return c;
	return 0;
}

static int by_identity(const void *x, const void *y)
{
	const struct tlog_entry *a = *(const struct tlog_entry *const *)x;
	const struct tlog_entry *b = *(const struct tlog_entry *const *)y;
	int c = same_row(a, b);
	return c ? c : a->line - b->line;
}

int tlog_ordinals(struct tlog_entry *v, int n, struct sd_err *e)
{
	struct tlog_entry **p;

	if (n <= 0)
		return 0;
	if (!(p = malloc((size_t)n * sizeof *p)))
		return sd_fail(e, "out of memory");
	for (int i = 0; i < n; i++)
		p[i] = &v[i];
	qsort(p, (size_t)n, sizeof *p, by_identity);
	for (int i = 0; i < n; i++)
		p[i]->ordinal = i > 0 && !same_row(p[i], p[i - 1]) ? p[i - 1]->ordinal + 1 : 1;
	free(p);
	return 0;
}

void tlog_effort_text(int scale, double lo, double hi, char *buf, int size)
{
	const char *name = scale == SD_EFFORT_RIR ? "RIR" : "RPE";

	if (scale == SD_EFFORT_NONE)
		snprintf(buf, (size_t)size, "%s", "");
	else if (hi > lo)
		snprintf(buf, (size_t)size, "%s %g-%g", name, lo, hi);
	else
		snprintf(buf, (size_t)size, "%s %g", name, lo);
}

/* ------------------------------------------------------------ ISO weeks */

/* Weekday from 0 (Monday): day 0, 1970-01-01, was a Thursday. */
static int weekday0(long day)
{
	return (int)(((day + 3) % 7 + 7) % 7);
}

long tlog_monday(long day)
{
	return day - weekday0(day);
}

/* The ISO year is the calendar year of the week's Thursday, and week 1 is the week holding
 * that year's 4 January (ISO 8601-1:2019, 5.2.4.2): so the week number is the Thursday's
 * day of the year, counted from 0, divided by 7, plus 1. */
int tlog_iso_week(long day, int *year, int *week)
{
	long thu = tlog_monday(day) + 3;
	char ymd[16];
	int y;

	date_format(thu, ymd);
	y = atoi(ymd);
	*year = y;
	*week = (int)((thu - date_days(y, 1, 1)) / 7) + 1;
	return weekday0(day) + 1;
}

/* ------------------------------------------------------------ weeks */

int tlog_weeks_init(struct tlog_weeks *ws, long from, long to, struct sd_err *e)
{
	long first = tlog_monday(from), last = tlog_monday(to);
	int n = last >= first ? (int)((last - first) / 7 + 1) : 0;

	memset(ws, 0, sizeof *ws);
	if (!n)
		return 0;
	if (!(ws->w = calloc((size_t)n, sizeof *ws->w)))
		return sd_fail(e, "out of memory");
	ws->n = n;
	for (int i = 0; i < n; i++) {
		ws->w[i].monday = first + 7L * i;
		tlog_iso_week(ws->w[i].monday, &ws->w[i].year, &ws->w[i].week);
	}
	return 0;
}

int tlog_weeks_find(const struct tlog_weeks *ws, long day)
{
	long k;

	if (!ws->n || day < ws->w[0].monday)
		return -1;
	k = (day - ws->w[0].monday) / 7;
	return k < ws->n ? (int)k : -1;
}

/* Hard sets of one exercise-day: within the limit, without an effort, and above it for an
 * exercise not graded by RIR. */
static int hard_sets(const struct sd_library *lib, const struct tlog_daysets *d)
{
	int ungraded = d->ex >= 0 && lib->ex[d->ex].ungraded;
	return d->within + d->unrecorded + (ungraded ? d->above : 0);
}

/* Adds sets x the exercise's weights to sum. */
static void add_dose(double sum[SD_NMUSCLES], const struct sd_library *lib, double wd, double wi,
		     int ex, int sets)
{
	double w[SD_NMUSCLES];

	vol_weights(&lib->ex[ex], wd, wi, w);
	for (int m = 0; m < SD_NMUSCLES; m++)
		sum[m] += w[m] * sets;
}

void tlog_weeks_add(struct tlog_weeks *ws, const struct sd_library *lib, double w_direct,
		    double w_indirect, int max_rir, const struct tlog_weekrow *r)
{
	int k = tlog_weeks_find(ws, r->monday), ungraded = r->ex >= 0 && lib->ex[r->ex].ungraded;
	unsigned fresh;
	struct tlog_week *w;

	if (k < 0)
		return;
	w = &ws->w[k];
	if (!(r->rir < 0 || r->rir <= max_rir || ungraded)) {
		w->easy_sets += r->sets;
		return;
	}
	w->hard_sets += r->sets;
	if (r->ex < 0) {
		ws->unknown_sets += r->sets;
		return;
	}
	/* A day counts once however many exercises and efforts were logged on it. */
	fresh = r->days & 0x7fu & ~(unsigned)w->days;
	for (; fresh; fresh &= fresh - 1)
		w->sessions++;
	w->days |= (unsigned char)(r->days & 0x7fu);
	add_dose(w->done, lib, w_direct, w_indirect, r->ex, r->sets);
}

void tlog_weeks_plan(struct tlog_weeks *ws, long long block, long start, long end,
		     const double dose[SD_NMUSCLES], int sessions)
{
	for (int i = 0; i < ws->n; i++) {
		struct tlog_week *w = &ws->w[i];
		long a = start > w->monday ? start : w->monday;
		long b = end < w->monday + 6 ? end : w->monday + 6;
		int days = b >= a ? (int)(b - a + 1) : 0;
		if (!days)
			continue;
		for (int m = 0; m < SD_NMUSCLES; m++)
			w->planned[m] += dose[m] * days / 7.0;
		w->planned_sessions += sessions * days / 7.0;
		if (days >= w->block_days) {
			w->block = block;
			w->block_days = days;
		}
	}
}

void tlog_weeks_free(struct tlog_weeks *ws)
{
	free(ws->w);
	memset(ws, 0, sizeof *ws);
}

double tlog_adherence(double done, double planned)
{
	return planned > 0 ? 100.0 * done / planned : NAN;
}

int tlog_missed(const struct tlog_week *w)
{
	long planned = lround(w->planned_sessions);
	return planned > w->sessions ? (int)(planned - w->sessions) : 0;
}

/* ------------------------------------------------------------ spans */

void tlog_span_init(struct tlog_span *s, long from, long to)
{
	memset(s, 0, sizeof *s);
	s->from = from;
	s->to = to;
	s->last = from - 1;
}

void tlog_span_add(struct tlog_span *s, const struct sd_library *lib, double w_direct,
		   double w_indirect, const struct tlog_daysets *d)
{
	int hard;

	if (d->day < s->from || d->day > s->to)
		return;
	s->rows++;
	if (!(hard = hard_sets(lib, d)) || d->ex < 0)
		return;
	/* Days arrive in order from the store; a repeat of the last day is the same session. */
	if (d->day != s->last)
		s->days++;
	s->last = d->day;
	add_dose(s->sum, lib, w_direct, w_indirect, d->ex, hard);
}

double tlog_span_weeks(const struct tlog_span *s)
{
	return s->to >= s->from ? (double)(s->to - s->from + 1) / 7.0 : 0;
}

void tlog_span_dose(const struct tlog_span *s, double out[SD_NMUSCLES])
{
	double weeks = tlog_span_weeks(s);
	for (int m = 0; m < SD_NMUSCLES; m++)
		out[m] = weeks > 0 ? s->sum[m] / weeks : 0;
}

/* ------------------------------------------------------------ e1RM */

int tlog_e1rm(int f, double load, int reps, double rir, int timed, double *out, double *rtf)
{
	double r = reps + rir;

	if (!(load > 0) || rir < 0 || timed || reps < 1 || r > TLOG_E1RM_MAX_RTF)
		return -1;
	*rtf = r;
	/* As e1rm_estimate: a single to failure is the 1RM itself. */
	*out = r == 1 ? load : e1rm_raw(f, load, r);
	return 0;
}

int tlog_trend_add(struct tlog_trend *t, const struct tlog_best *b, struct sd_err *e)
{
	/* Sets come in date order, so the week's bests are at the end. */
	for (int i = t->n - 1; i >= 0 && t->v[i].monday == b->monday; i--)
		if (t->v[i].ex == b->ex) {
			if (b->e1rm_kg > t->v[i].e1rm_kg)
				t->v[i] = *b;
			return 0;
		}
	if (t->n == t->cap) {
		int ncap = t->cap ? 2 * t->cap : 32;
		struct tlog_best *nv = realloc(t->v, (size_t)ncap * sizeof *nv);
		if (!nv)
			return sd_fail(e, "out of memory");
		t->v = nv;
		t->cap = ncap;
	}
	t->v[t->n++] = *b;
	return 0;
}

static int by_lift_week(const void *x, const void *y)
{
	const struct tlog_best *a = x, *b = y;
	if (a->ex != b->ex)
		return a->ex - b->ex;
	return a->monday < b->monday ? -1 : a->monday > b->monday;
}

void tlog_trend_sort(struct tlog_trend *t)
{
	if (t->n > 1)
		qsort(t->v, (size_t)t->n, sizeof *t->v, by_lift_week);
}

void tlog_trend_free(struct tlog_trend *t)
{
	free(t->v);
	memset(t, 0, sizeof *t);
}
