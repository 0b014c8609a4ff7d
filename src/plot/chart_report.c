/* The printable report: a contents page for a roster, then per athlete (or program) page one
 * (who and when, three findings, the per-muscle chart, the table) and the pages after it
 * (where the sets come from, the warnings, the curve, the profile's provenance, the caution).
 *
 * Pages are filled, not left a third empty: the per-muscle chart's rows and the curve's height
 * grow into the room a page has left. Everything is laid out twice, first without drawing to
 * count the pages (the footers say "page N of M"), then for real. */
#include <math.h>
#include <stdio.h>
#include <string.h>

#include "../core/library.h"
#include "chart_int.h"

#define PW 595.276
#define PH 841.89
#define ML 40.0
#define TOP 40.0
#define BOTTOM (PH - 48.0)   /* content ends here; the footer line sits below */
#define CW (PW - 2 * ML)

struct flow {
	struct cdraw *d;
	cairo_surface_t *s;
	const struct sd_report *r;
	int dry;                   /* laying out only: count pages, draw nothing that shows */
	int page, pages;           /* current page (1-based), total (from the dry pass) */
	double y;
	char foot[300];            /* the running footer of the current section */
	/* A page that must break before the curve would be left part empty: its rows are spread
	 * over it instead. The dry pass finds the page and the spacing, the real pass uses them. */
	int rows;                  /* breakdown and warning rows on the current page */
	double *pad;               /* per item: extra space under each row of that page */
	int *padpage;              /* per item: the page it applies to */
	int item;
};

/* The extra space under a row of the page being drawn. */
static double row_pad(const struct flow *f)
{
	return f->page == f->padpage[f->item] ? f->pad[f->item] : 0;
}

static void footer(struct flow *f)
{
	char buf[300];
	ch_col(f->d->cr, PAL_MUTED);
	ch_text(f->d, ML, PH - 28, 8, 0, 0, f->foot);
	snprintf(buf, sizeof buf, "page %d of %d", f->page, f->pages);
	ch_text(f->d, PW - ML, PH - 28, 8, 0, 1, buf);
}

/* Records how far down the page's content reached (the test of the fill reads it). */
static void content_mark(struct flow *f)
{
	ch_rec(f->d, BOX_CONTENT, ML, TOP, CW, f->y - TOP, 0, "content");
}

static void new_page(struct flow *f)
{
	if (f->page) {
		content_mark(f);
		footer(f);
		if (!f->dry)
			cairo_show_page(f->d->cr);
		else
			cairo_new_path(f->d->cr);
	}
	f->page++;
	f->d->page = f->page - 1;
	f->y = TOP;
	f->rows = 0;
	cairo_set_source_rgb(f->d->cr, 1, 1, 1);
	cairo_paint(f->d->cr);
}

/* Room for h more points on this page, else a new page. */
static void need(struct flow *f, double h)
{
	if (f->y + h > BOTTOM)
		new_page(f);
}

static void heading(struct flow *f, const char *s)
{
	need(f, 40);
	f->y += 8;
	ch_col(f->d->cr, PAL_CURVE);
	ch_text(f->d, ML, f->y + 11, 12, 1, 0, s);
	f->y += 16;
	ch_col(f->d->cr, PAL_GRID);
	cairo_set_line_width(f->d->cr, 0.8);
	cairo_move_to(f->d->cr, ML, f->y);
	cairo_line_to(f->d->cr, PW - ML, f->y);
	cairo_stroke(f->d->cr);
	f->y += 6;
}

static void body(struct flow *f, double size, int bold, const char *s)
{
	double h = ch_para(f->d, ML, 0, CW, size, bold, s, 1);
	need(f, h);
	ch_col(f->d->cr, PAL_INK);
	f->y = ch_para(f->d, ML, f->y + size, CW, size, bold, s, 0) - size;
	f->y += 2 + row_pad(f);
	f->rows++;
}

/* A list of up to n names of muscles into buf: "a, b and c". */
static void names(char *buf, size_t size, const int *m, int n)
{
	size_t used = 0;
	buf[0] = '\0';
	for (int i = 0; i < n && used < size; i++)
		used += (size_t)snprintf(buf + used, size - used, "%s%s", i == 0 ? "" :
					 i == n - 1 ? " and " : ", ", muscle_name(m[i]));
}

/* Three plain-language findings: where more sets pay most, what is past practical returns,
 * what lies beyond the evidence. */
static void findings(const struct sd_report_item *it, char out[3][420])
{
	const struct sd_audit *a = it->info.audit;
	const struct sd_profile *p = it->info.prof;
	int best[3], nb = 0, past[SD_NMUSCLES], np = 0, beyond[SD_NMUSCLES], nbe = 0, nn = 0;
	char list[300], ctx[240];

	for (int k = 0; k < 3; k++) {
		int pick = -1;
		for (int m = 0; m < SD_NMUSCLES; m++) {
			int used = 0;
			for (int j = 0; j < nb; j++)
				used |= best[j] == m;
			if (used || a->row[m].zone == SD_ZONE_PLATEAU || a->row[m].zone == SD_ZONE_BEYOND)
				continue;
			if (pick < 0 || a->row[m].plus1.pct > a->row[pick].plus1.pct)
				pick = m;
		}
		if (pick >= 0)
			best[nb++] = pick;
	}
	for (int m = 0; m < SD_NMUSCLES; m++) {
		if (a->row[m].zone == SD_ZONE_PLATEAU)
			past[np++] = m;
		if (a->row[m].zone == SD_ZONE_BEYOND)
			beyond[nbe++] = m;
		if (a->row[m].dose.fractional <= 0)
			nn++;
	}
	if (nb) {
		size_t u = 0;
		list[0] = '\0';
		for (int i = 0; i < nb && u < sizeof list; i++)
			u += (size_t)snprintf(list + u, sizeof list - u, "%s%s (%+.1f)", i == 0 ? "" :
					      i == nb - 1 ? " and " : ", ", muscle_name(best[i]),
					      a->row[best[i]].plus1.pct);
		snprintf(out[0], 420, "More sets pay most for %s: percentage points of predicted 1RM "
			 "gain that one more hard set a week adds.%s", list,
			 nn ? " Muscles with no sets at all gain most from their first." : "");
	} else
		snprintf(out[0], 420, "Every muscle is at or past the practical plateau (%g weekly "
			 "sets): more sets would add little anywhere.", a->plateau);
	if (np) {
		names(list, sizeof list, past, np > 6 ? 6 : np);
		snprintf(out[1], 420, "Past practical returns: %s%s reach the practical plateau of %g "
			 "weekly sets; more sets there add less than the smallest worthwhile change%s.",
			 list, np > 6 ? " and others" : "", a->plateau, nb ? ", so sets moved from them to "
			 "the muscles in point 1 would buy more" : ": fewer sets there would cost little "
			 "predicted gain and save time and fatigue");
	} else
		snprintf(out[1], 420, "No muscle is past practical returns: every dose is below the "
			 "practical plateau of %g weekly sets, where more sets still add a worthwhile "
			 "amount.", a->plateau);
	if (nbe) {
		names(list, sizeof list, beyond, nbe > 6 ? 6 : nbe);
		snprintf(out[2], 420, "Beyond the evidence: %s%s get more than %g weekly sets, past the "
			 "doses the studies behind the curve tested; their predictions there are an "
			 "extrapolation.", list, nbe > 6 ? " and others" : "", p->dose_max);
	} else if (curve_context_note(p, &a->cov, ctx, sizeof ctx))
		snprintf(out[2], 420, "Every dose is within the evidence, but the athlete's context is "
			 "not: %s.", ctx);
	else
		snprintf(out[2], 420, "Every dose is within the evidence (up to %g weekly sets) for a "
			 "%s athlete over %g weeks.", p->dose_max, a->cov.trained >= 0.5 ? "trained" :
			 "untrained", a->cov.weeks);
}

static void header(struct flow *f, const struct sd_report_item *it)
{
	const struct sd_audit_info *in = &it->info;
	const struct sd_audit *a = in->audit;
	char buf[400];
	cairo_t *cr = f->d->cr;

	ch_col(cr, PAL_CURVE);
	cairo_rectangle(cr, ML, f->y, CW, 3);
	cairo_fill(cr);
	f->y += 22;
	ch_col(cr, PAL_INK);
	snprintf(buf, sizeof buf, "%s", in->athlete ? in->athlete : in->prog->name);
	ch_text(f->d, ML, f->y, 18, 1, 0, buf);
	ch_text(f->d, PW - ML, f->y, 10, 0, 1, f->r->date);
	f->y += 16;
	snprintf(buf, sizeof buf, "Template: %s", in->prog->name);
	if (it->block) {
		size_t u = strlen(buf);
		snprintf(buf + u, sizeof buf - u, "   \xc2\xb7   %s", it->block);
	}
	ch_col(cr, PAL_INK);
	f->y = ch_para(f->d, ML, f->y, CW, 10, 0, buf, 0);
	snprintf(buf, sizeof buf, "%d training days, %d hard sets a week; %s athlete, %g-week block; "
		 "curve from profile '%s' at %.0f%% intervals", in->prog->ndays, a->vol.hard_sets,
		 a->cov.trained >= 0.5 ? "trained" : "untrained", a->cov.weeks, in->prof->name,
		 a->level * 100);
	ch_col(cr, PAL_MUTED);
	f->y = ch_para(f->d, ML, f->y, CW, 9, 0, buf, 0);
	if (in->overdue_days > 0) {
		snprintf(buf, sizeof buf, "This block has run %d days past its planned end.", in->overdue_days);
		ch_col(cr, PAL_MARK);
		f->y = ch_para(f->d, ML, f->y, CW, 9, 1, buf, 0);
	}
	f->y += 4;
}

static void findings_box(struct flow *f, const struct sd_report_item *it)
{
	char fd[3][420];
	double h = 20;
	cairo_t *cr = f->d->cr;

	findings(it, fd);
	for (int i = 0; i < 3; i++)
		h += ch_para(f->d, ML + 24, 0, CW - 34, 9.5, 0, fd[i], 1) + 3;
	ch_col_tint(cr, PAL_BAND_ATH, 0.3);
	cairo_rectangle(cr, ML, f->y, CW, h);
	cairo_fill(cr);
	ch_col(cr, PAL_CURVE);
	cairo_rectangle(cr, ML, f->y, 3, h);
	cairo_fill(cr);
	ch_col(cr, PAL_INK);
	ch_text(f->d, ML + 10, f->y + 13, 10, 1, 0, "In short");
	double y = f->y + 20 + 9.5;
	for (int i = 0; i < 3; i++) {
		char num[8];
		snprintf(num, sizeof num, "%d", i + 1);
		ch_col(cr, PAL_CURVE);
		ch_text(f->d, ML + 12, y, 9.5, 1, 0, num);
		ch_col(cr, PAL_INK);
		y = ch_para(f->d, ML + 24, y, CW - 34, 9.5, 0, fd[i], 0) + 3;
	}
	f->y += h + 8;
}

#define TROW 10.0

static void muscle_table(struct flow *f, const struct sd_audit *a)
{
	static const char *const heads[] = { "muscle", "direct", "indirect", "weekly sets",
					      "gain", "average curve", "one athlete", "+1 set",
					      "zone" };
	/* Left edge of the name and zone columns, right edge of the numeric ones. */
	static const double colx[] = { 0, 112, 160, 215, 255, 330, 410, 450, 462 };
	enum { NC = 9 };
	cairo_t *cr = f->d->cr;
	char c[NC][48];

	need(f, 30 + SD_NMUSCLES * TROW);
	ch_col(cr, PAL_INK);
	f->y += 12;
	for (int i = 0; i < NC; i++)
		ch_text(f->d, ML + colx[i], f->y, 8, 1, i == 0 || i == NC - 1 ? 0 : 1, heads[i]);
	f->y += 3;
	cairo_set_line_width(cr, 0.5);
	cairo_move_to(cr, ML, f->y);
	cairo_line_to(cr, PW - ML, f->y);
	cairo_stroke(cr);
	f->y += 2;
	for (int m = 0; m < SD_NMUSCLES; m++) {
		const struct sd_audit_row *r = &a->row[m];
		if (m % 2) {
			ch_col_tint(cr, PAL_GRID, 0.6);
			cairo_rectangle(cr, ML, f->y, CW, TROW);
			cairo_fill(cr);
		}
		snprintf(c[0], 48, "%s", muscle_name(m));
		snprintf(c[1], 48, "%g", r->dose.direct);
		snprintf(c[2], 48, "%g", r->dose.indirect);
		snprintf(c[3], 48, "%.1f", r->dose.fractional);
		snprintf(c[4], 48, "%+.1f%%", curve_pct(r->pt.y));
		snprintf(c[5], 48, "%.1f to %.1f", curve_pct(r->pt.ci_lo), curve_pct(r->pt.ci_hi));
		snprintf(c[6], 48, "%.1f to %.1f", curve_pct(r->pt.ath_lo), curve_pct(r->pt.ath_hi));
		snprintf(c[7], 48, "%+.2f", r->plus1.pct);
		snprintf(c[8], 48, "%s", r->dose.fractional > 0 ? zone_name(r->zone) : "no sets");
		ch_col(cr, PAL_INK);
		for (int i = 0; i < NC; i++)
			ch_text(f->d, ML + colx[i], f->y + 8, 8, 0, i == 0 || i == NC - 1 ? 0 : 1, c[i]);
		f->y += TROW;
	}
	f->y += 4;
	char buf[400];
	snprintf(buf, sizeof buf, "Weekly sets: hard sets a week, direct sets counting 1 and indirect "
		 "sets (the muscle as a synergist) %g. Gain: predicted 1RM change over the block on "
		 "the average curve, with %.0f%% intervals for the average curve and for one athlete. "
		 "+1 set: percentage points one more weekly set adds.",
		 f->r->item[0].info.prof->w_indirect, a->level * 100);
	ch_col(cr, PAL_MUTED);
	f->y = ch_para(f->d, ML, f->y + 8, CW, 8, 0, buf, 0) - 8;
}

/* One exercise's line of the breakdown: its hard sets a week and the muscles it counts for. */
struct exline {
	int ex;
	double sets;
	sd_mset direct, indirect;
};

static int breakdown_lines(const struct sd_audit *a, struct exline *l, int cap)
{
	int n = 0;
	for (int s = 0; s < a->vol.nsrc; s++) {
		const struct sd_source *src = &a->vol.src[s];
		int k = 0;
		while (k < n && l[k].ex != src->ex)
			k++;
		if (k == n) {
			if (n == cap)
				continue;
			l[n++] = (struct exline){ src->ex, 0, 0, 0 };
		}
		l[k].sets = fmax(l[k].sets, src->direct + src->indirect);
		if (src->direct > 0)
			l[k].direct |= (sd_mset)1 << src->muscle;
		if (src->indirect > 0)
			l[k].indirect |= (sd_mset)1 << src->muscle;
	}
	/* Most sets first. */
	for (int i = 1; i < n; i++)
		for (int j = i; j > 0 && l[j].sets > l[j - 1].sets; j--) {
			struct exline t = l[j];
			l[j] = l[j - 1];
			l[j - 1] = t;
		}
	return n;
}

static void mset_names(sd_mset s, char *buf, size_t size)
{
	size_t u = 0;
	buf[0] = '\0';
	for (int m = 0; m < SD_NMUSCLES && u < size; m++)
		if (s & ((sd_mset)1 << m))
			u += (size_t)snprintf(buf + u, size - u, "%s%s", u ? ", " : "", muscle_name(m));
	if (!u)
		snprintf(buf, size, "-");
}

static void breakdown(struct flow *f, const struct sd_report_item *it)
{
	struct exline l[256];
	int n = breakdown_lines(it->info.audit, l, 256);
	char dir[200], ind[200], sets[32];
	cairo_t *cr = f->d->cr;

	heading(f, "Where the sets come from");
	body(f, 9, 0, "Each exercise's hard sets a week, and the muscles they count for: in full "
	     "where the muscle is a prime mover, at half where it is a synergist.");
	need(f, 16 + TROW * 2);
	f->y += 10;
	ch_col(cr, PAL_INK);
	ch_text(f->d, ML, f->y, 8, 1, 0, "exercise");
	ch_text(f->d, ML + 200, f->y, 8, 1, 1, "sets a week");
	ch_text(f->d, ML + 212, f->y, 8, 1, 0, "counts in full for");
	ch_text(f->d, ML + 362, f->y, 8, 1, 0, "counts at half for");
	f->y += 4;
	for (int i = 0; i < n; i++) {
		mset_names(l[i].direct, dir, sizeof dir);
		mset_names(l[i].indirect, ind, sizeof ind);
		double h = fmax(ch_para(f->d, 0, 0, 145, 8, 0, dir, 1), ch_para(f->d, 0, 0, 150, 8, 0, ind, 1));
		h = fmax(h, TROW);
		need(f, h + 2);
		double pad = row_pad(f);
		if (i % 2) {
			ch_col_tint(cr, PAL_GRID, 0.6);
			cairo_rectangle(cr, ML, f->y, CW, h + 1 + pad);
			cairo_fill(cr);
		}
		f->y += pad / 2;
		ch_col(cr, PAL_INK);
		const char *name = it->lib && l[i].ex >= 0 && l[i].ex < it->lib->n ? it->lib->ex[l[i].ex].name : "?";
		ch_text(f->d, ML, f->y + 8, 8, 0, 0, name);
		snprintf(sets, sizeof sets, "%g", l[i].sets);
		ch_text(f->d, ML + 200, f->y + 8, 8, 0, 1, sets);
		ch_para(f->d, ML + 212, f->y + 8, 145, 8, 0, dir, 0);
		ch_para(f->d, ML + 362, f->y + 8, 150, 8, 0, ind, 0);
		f->y += h + 1 + pad / 2;
		f->rows++;
	}
	f->y += 4;
}

static void warnings(struct flow *f, const struct sd_report_item *it)
{
	const struct sd_audit *a = it->info.audit;
	int nday = 0, nweek = 0;
	char buf[300];

	for (int i = 0; i < a->nwarn; i++)
		a->warn[i].day >= 0 ? nday++ : nweek++;
	heading(f, "Warnings");
	if (!a->nwarn) {
		body(f, 9, 0, "None: no session gives a muscle more than the session cap, and the "
		     "program reads without notes.");
		return;
	}
	for (int pass = 0; pass < 2; pass++) {
		int cnt = pass ? nweek : nday;
		if (!cnt)
			continue;
		need(f, 30);
		ch_col(f->d->cr, PAL_INK);
		ch_text(f->d, ML, f->y + 12, 9.5, 1, 0, pass ? "For the whole week" : "Per session");
		f->y += 16;
		for (int i = 0; i < a->nwarn; i++) {
			const struct sd_warning *w = &a->warn[i];
			if ((w->day >= 0) == pass)
				continue;
			if (w->day >= 0 && w->day < it->info.prog->ndays)
				snprintf(buf, sizeof buf, "%s: %s", it->info.prog->days[w->day].name, w->text);
			else
				snprintf(buf, sizeof buf, "%s", w->text);
			body(f, 8.5, 0, buf);
		}
	}
	f->y += 4;
}

static void about(struct flow *f, const struct sd_report_item *it, double h_only)
{
	char buf[400];
	(void)h_only;
	profile_oneline(it->info.prof, buf, sizeof buf);
	heading(f, "About these numbers");
	body(f, 8.5, 0, buf);
	body(f, 8.5, 0, aout_bands_legend);
	body(f, 8.5, 1, aout_caution);
}

static double about_height(struct flow *f, const struct sd_report_item *it)
{
	char buf[400];
	double h = 30;
	profile_oneline(it->info.prof, buf, sizeof buf);
	h += ch_para(f->d, 0, 0, CW, 8.5, 0, buf, 1) + 2;
	h += ch_para(f->d, 0, 0, CW, 8.5, 0, aout_bands_legend, 1) + 2;
	h += ch_para(f->d, 0, 0, CW, 8.5, 1, aout_caution, 1) + 2;
	return h + 8;
}

static struct sd_chart chart_of(const struct sd_report_item *it, enum chart_kind k,
				struct chart_layout *lay)
{
	const struct sd_audit *a = it->info.audit;
	return (struct sd_chart){ k, it->info.prof, a->cov, a->level, a, NULL, it->info.prog->name,
				  NULL, NULL, NULL, 0, lay, 0 };
}

static void section(struct flow *f, const struct sd_report_item *it, int *group)
{
	const struct sd_audit_info *in = &it->info;

	new_page(f);
	snprintf(f->foot, sizeof f->foot, "%s%s%s \xc2\xb7 %s", in->athlete ? in->athlete : "",
		 in->athlete ? " \xc2\xb7 " : "", in->prog->name, f->r->date);
	header(f, it);
	findings_box(f, it);
	/* The per-muscle chart takes the room the table leaves on page one. */
	struct sd_chart c = chart_of(it, CHART_MUSCLES, f->d->lay);
	double table_h = 24 + SD_NMUSCLES * TROW + 34;
	c.bare = 1;
	double room = BOTTOM - f->y - table_h;
	double h = fmax(ch_muscles_height(&c, CW), room);
	f->d->group = (*group)++;
	ch_draw_muscles(f->d, &c, (struct rect){ ML, f->y, CW, h });
	f->y += h;
	muscle_table(f, in->audit);

	new_page(f);
	breakdown(f, it);
	warnings(f, it);
	/* The curve fills what is left above the notes, on this page or the next. */
	double ah = about_height(f, it);
	if (BOTTOM - f->y - ah - 30 < 200) {
		if (f->dry && f->rows) {
			f->padpage[f->item] = f->page;
			f->pad[f->item] = fmin(0.9 * (BOTTOM - f->y) / f->rows, 10);
		}
		new_page(f);
	}
	heading(f, "The curve and this program's muscles");
	c = chart_of(it, CHART_CURVE, f->d->lay);
	c.bare = 1;
	h = fmin(BOTTOM - f->y - ah, 560);
	f->d->group = (*group)++;
	ch_draw_curve(f->d, &c, (struct rect){ ML, f->y, CW, h });
	f->y += h;
	about(f, it, 0);
}

/* The roster at a glance: a row per athlete, a column per muscle, each cell the weekly sets
 * shaded by zone; its rows grow into the page's room (up to 28 points). */
static void glance(struct flow *f)
{
	const struct sd_report *r = f->r;
	cairo_t *cr = f->d->cr;
	double namew = 96, cw = (CW - namew) / SD_NMUSCLES, headh = 52;
	char buf[32];

	heading(f, "At a glance: weekly sets per muscle, shaded by zone");
	double room = BOTTOM - f->y - headh - 60;
	double rh = fmin(fmax(room / (r->n ? r->n : 1), 12), 28);
	need(f, headh + rh);
	for (int m = 0; m < SD_NMUSCLES; m++) {
		cairo_save(cr);
		cairo_translate(cr, ML + namew + (m + 0.5) * cw + 3, f->y + headh - 4);
		cairo_rotate(cr, -M_PI / 3);
		ch_col(cr, PAL_INK);
		ch_text(f->d, 0, 0, 8, 0, 0, muscle_name(m));
		cairo_restore(cr);
	}
	f->y += headh;
	for (int i = 0; i < r->n; i++) {
		const struct sd_report_item *it = &r->item[i];
		if (f->y + rh > BOTTOM) {
			new_page(f);
			f->y += 4;
		}
		ch_col(cr, PAL_INK);
		ch_text(f->d, ML, f->y + rh / 2 + 3, 8.5, 0, 0, it->info.athlete ? it->info.athlete : it->info.prog->name);
		for (int m = 0; m < SD_NMUSCLES; m++) {
			const struct sd_audit_row *row = &it->info.audit->row[m];
			struct rect c = { ML + namew + m * cw + 0.5, f->y + 0.5, cw - 1, rh - 1 };
			if (row->zone == SD_ZONE_BEYOND)
				ch_hatch(f->d, c);
			else {
				ch_col(cr, row->dose.fractional <= 0 ? PAL_GRID : row->zone == SD_ZONE_PLATEAU ?
				       PAL_ZONE_PLATEAU : PAL_ZONE_CLIMB);
				cairo_rectangle(cr, c.x, c.y, c.w, c.h);
				cairo_fill_preserve(cr);
				ch_col(cr, PAL_GRID);
				cairo_set_line_width(cr, 0.5);
				cairo_stroke(cr);
			}
			snprintf(buf, sizeof buf, "%.3g", row->dose.fractional);
			ch_col(cr, PAL_INK);
			ch_text(f->d, c.x + c.w / 2, c.y + c.h / 2 + 3, 8, 0, 0.5, buf);
		}
		f->y += rh;
	}
	f->y += 6;
	struct swatch sw[] = { { PAL_ZONE_CLIMB, 0, "building" },
			       { PAL_ZONE_PLATEAU, 0, "past practical returns" },
			       { PAL_ZONE_BEYOND, 3, "beyond the evidence" }, { PAL_GRID, 0, "no sets" } };
	need(f, 20);
	f->y = ch_legend(f->d, ML, f->y + 10, CW, sw, 4);
}

static void contents(struct flow *f, const int *first_page)
{
	const struct sd_report *r = f->r;
	char buf[300];
	cairo_t *cr = f->d->cr;

	snprintf(f->foot, sizeof f->foot, "%s \xc2\xb7 %s", r->title ? r->title : "Training report", r->date);
	new_page(f);
	ch_col(cr, PAL_CURVE);
	cairo_rectangle(cr, ML, f->y, CW, 3);
	cairo_fill(cr);
	f->y += 24;
	ch_col(cr, PAL_INK);
	ch_text(f->d, ML, f->y, 18, 1, 0, r->title ? r->title : "Training report");
	ch_text(f->d, PW - ML, f->y, 10, 0, 1, r->date);
	f->y += 8;
	snprintf(buf, sizeof buf, "%d athlete%s; each section shows the current training block's "
		 "weekly sets per muscle, where they sit on the dose-response curve, and what more "
		 "sets would add.", r->n, r->n == 1 ? "" : "s");
	body(f, 9.5, 0, buf);
	heading(f, "Contents");
	ch_col(cr, PAL_INK);
	need(f, 14);
	f->y += 10;
	ch_text(f->d, ML, f->y, 8.5, 1, 0, "athlete");
	ch_text(f->d, ML + 130, f->y, 8.5, 1, 0, "template and block");
	ch_text(f->d, ML + 460, f->y, 8.5, 1, 1, "hard sets");
	ch_text(f->d, PW - ML, f->y, 8.5, 1, 1, "page");
	f->y += 4;
	for (int i = 0; i < r->n; i++) {
		const struct sd_report_item *it = &r->item[i];
		need(f, 22);
		if (i % 2) {
			ch_col_tint(cr, PAL_GRID, 0.6);
			cairo_rectangle(cr, ML, f->y, CW, 21);
			cairo_fill(cr);
		}
		ch_col(cr, PAL_INK);
		ch_text(f->d, ML, f->y + 9, 8.5, 0, 0, it->info.athlete ? it->info.athlete : it->info.prog->name);
		ch_text(f->d, ML + 130, f->y + 9, 8.5, 0, 0, it->info.prog->name);
		snprintf(buf, sizeof buf, "%d", it->info.audit->vol.hard_sets);
		ch_text(f->d, ML + 460, f->y + 9, 8.5, 0, 1, buf);
		snprintf(buf, sizeof buf, "%d", first_page[i]);
		ch_text(f->d, PW - ML, f->y + 9, 8.5, 0, 1, buf);
		if (it->block) {
			ch_col(cr, PAL_MUTED);
			ch_text(f->d, ML + 130, f->y + 18.5, 8, 0, 0, it->block);
		}
		f->y += 21;
	}
	glance(f);
	f->y += 6;
	body(f, 8.5, 1, aout_caution);
}

static void run(struct flow *f, int *first_page)
{
	int group = 0;
	f->page = 0;
	if (f->r->contents)
		contents(f, first_page);
	for (int i = 0; i < f->r->n; i++) {
		first_page[i] = f->page + 1;
		f->item = i;
		section(f, &f->r->item[i], &group);
	}
	content_mark(f);
	footer(f);
	if (!f->dry)
		cairo_show_page(f->d->cr);
}

int ch_report_draw(cairo_surface_t *s, struct cdraw *d, const struct sd_report *r)
{
	int n = r->n > 0 ? r->n : 1, first[n], padpage[n];
	double pad[n];
	memset(first, 0, sizeof first);
	memset(pad, 0, sizeof pad);
	memset(padpage, 0, sizeof padpage);
	struct flow f = { d, s, r, 1, 0, 0, 0, "", 0, pad, padpage, 0 };
	struct chart_layout *lay = d->lay;
	cairo_t *real = d->cr;
	cairo_surface_t *scratch = cairo_image_surface_create(CAIRO_FORMAT_RGB24, 1, 1);

	/* Pass one lays out on a scratch surface: the page count and each section's first page. */
	d->cr = cairo_create(scratch);
	d->lay = NULL;
	run(&f, first);
	cairo_destroy(d->cr);
	cairo_surface_destroy(scratch);
	f.pages = f.page;
	d->cr = real;
	d->lay = lay;
	f.dry = 0;
	run(&f, first);
	if (lay) {
		lay->pages = f.pages;
		lay->page_w = PW;
		lay->page_h = PH;
	}
	return 0;
}
