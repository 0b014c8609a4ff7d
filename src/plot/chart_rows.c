/* Charts with one row per muscle: where each muscle's dose sits (a shared dose axis shaded by
 * zone, a miniature of the curve's shape, the predicted gain with the one-athlete band), and
 * what program B changes against A (the difference with its interval against +-SWC). Rows
 * cannot collide: every label has its own row and column. */
#include <math.h>
#include <stdio.h>
#include <string.h>

#include "../core/compare.h"
#include "chart_int.h"

#define ROW_H 15.0
#define NAME_W 78.0
#define HEAD_H 46.0     /* title, context line, a possible evidence note */
#define AXIS_H 34.0     /* ticks and titles under the rows */
#define LEG_H 28.0

static int muscles_shown(const struct sd_audit *a, const struct sd_audit *b, int *m)
{
	int n = 0;
	for (int i = 0; i < SD_NMUSCLES; i++)
		if (a->row[i].dose.fractional > 0 || (b && b->row[i].dose.fractional > 0))
			m[n++] = i;
	return n;
}

double ch_muscles_height(const struct sd_chart *c, double w)
{
	int m[SD_NMUSCLES];
	(void)w;
	return (c->bare ? 0 : HEAD_H) + 16 + muscles_shown(c->audit, NULL, m) * ROW_H + AXIS_H + LEG_H;
}

double ch_compare_height(const struct sd_chart *c, double w)
{
	int m[SD_NMUSCLES];
	(void)w;
	return HEAD_H + 16 + muscles_shown(c->audit, c->other, m) * ROW_H + AXIS_H + LEG_H;
}

/* A box on the x range of frame f at row y: clipped to the frame. */
static void xband(cairo_t *cr, const struct frame *f, double a, double b, double y, double h)
{
	a = fmax(a, f->x0);
	b = fmin(b, f->x1);
	if (b > a)
		cairo_rectangle(cr, ch_fx(f, a), y, ch_fx(f, b) - ch_fx(f, a), h);
}

static void xaxis(struct cdraw *d, const struct frame *f, double y, const char *fmt,
		  const char *title)
{
	cairo_t *cr = d->cr;
	char buf[32];
	double s = ch_tick_step(f->x1 - f->x0, 5);

	ch_col(cr, PAL_INK);
	cairo_set_line_width(cr, 0.6);
	cairo_move_to(cr, f->x, y);
	cairo_line_to(cr, f->x + f->w, y);
	cairo_stroke(cr);
	for (double x = ceil(f->x0 / s - 1e-9) * s; x <= f->x1 + 1e-9; x += s) {
		cairo_move_to(cr, ch_fx(f, x), y);
		cairo_line_to(cr, ch_fx(f, x), y + 3);
		cairo_stroke(cr);
		if (fabs(x) < 1e-9)
			snprintf(buf, sizeof buf, "0%s", strstr(fmt, "%%") ? "%" : "");
		else
			snprintf(buf, sizeof buf, fmt, x);
		ch_text(d, ch_fx(f, x), y + 12, 8, 0, 0.5, buf);
	}
	ch_text(d, f->x + f->w / 2, y + 24, 8.5, 0, 0.5, title);
}

static void dot(struct cdraw *d, double x, double y, double r, enum sd_pal p, const char *what)
{
	cairo_new_path(d->cr);
	cairo_set_source_rgb(d->cr, 1, 1, 1);
	cairo_arc(d->cr, x, y, r, 0, 2 * M_PI);
	cairo_fill(d->cr);
	ch_col(d->cr, p);
	cairo_arc(d->cr, x, y, r - 1, 0, 2 * M_PI);
	cairo_fill(d->cr);
	ch_rec(d, BOX_MARK, x - r, y - r, 2 * r, 2 * r, 0, what);
}

void ch_draw_muscles(struct cdraw *d, const struct sd_chart *c, struct rect r)
{
	cairo_t *cr = d->cr;
	const struct sd_audit *a = c->audit;
	int ms[SD_NMUSCLES], n = muscles_shown(a, NULL, ms);
	double xmax = c->prof->dose_max, glo = 0, ghi = 0, y;
	char buf[120];
	char title[160];

	snprintf(title, sizeof title, "%s: each muscle's weekly dose and predicted gain",
		 c->title ? c->title : "The program");
	y = ch_chart_head(d, c, r, title);
	if (!c->bare)
		y = fmax(y, r.y + HEAD_H);
	/* Rows grow into the height given (the report's page), up to a comfortable size. */
	double rh = n ? fmin(fmax((r.y + r.h - y - 16 - AXIS_H - LEG_H) / n, ROW_H), 30) : ROW_H;
	for (int i = 0; i < n; i++) {
		const struct sd_audit_row *w = &a->row[ms[i]];
		xmax = fmax(xmax, w->dose.fractional);
		glo = fmin(glo, curve_pct(w->pt.ath_lo));
		ghi = fmax(ghi, curve_pct(w->pt.ath_hi));
	}
	/* Two panels: the dose on a shared axis, and the gain it predicts on another. */
	double left = r.x + NAME_W, gap = 18, valw = 44;
	double pw = (r.w - NAME_W - gap - valw) * 0.48;
	struct frame fd = { left, y + 14, pw, n * rh, 0, ceil(xmax * 1.05), 0, 1 };
	struct frame fg = { left + pw + gap, y + 14, r.w - NAME_W - gap - valw - pw, n * rh, 0, 0, 0, 1 };
	double gs = ch_tick_step(ghi - glo, 5);
	fg.x0 = floor(glo / gs) * gs;
	fg.x1 = ceil(ghi / gs) * gs;

	ch_col(cr, PAL_INK);
	ch_text(d, fd.x, y + 9, 8.5, 1, 0, "weekly dose, shaded by zone");
	ch_text(d, fg.x, y + 9, 8.5, 1, 0, "predicted 1RM gain");
	/* The curve's shape, normalised to the row: the same rise in every row, so each dot
	 * shows how far up the curve of diminishing returns its muscle sits. */
	struct sd_point p0, p1, pt;
	curve_eval(c->prof, &c->cov, 0, c->level, &p0);
	curve_eval(c->prof, &c->cov, fd.x1, c->level, &p1);
	double span = p1.y - p0.y;
	if (!(fabs(span) > 1e-12))
		span = 1;
	for (int i = 0; i < n; i++) {
		const struct sd_audit_row *w = &a->row[ms[i]];
		double ry = fd.y + i * rh, base = ry + rh - 2.5, top = ry + 3;
		if (i % 2) {
			ch_col_tint(cr, PAL_GRID, 0.6);
			cairo_rectangle(cr, r.x, ry, r.w, rh);
			cairo_fill(cr);
		}
		ch_col(cr, PAL_ZONE_PLATEAU);
		xband(cr, &fd, a->plateau, c->prof->dose_max, ry + 1, rh - 2);
		cairo_fill(cr);
		if (fd.x1 > c->prof->dose_max)
			ch_hatch(d, (struct rect){ ch_fx(&fd, c->prof->dose_max), ry + 1,
						ch_fx(&fd, fd.x1) - ch_fx(&fd, c->prof->dose_max), rh - 2 });
		ch_col(cr, PAL_BAND_GROUP);
		cairo_move_to(cr, fd.x, base);
		for (int k = 0; k <= 40; k++) {
			double x = fd.x1 * k / 40;
			curve_eval(c->prof, &c->cov, x, c->level, &pt);
			cairo_line_to(cr, ch_fx(&fd, x), base - (pt.y - p0.y) / span * (base - top));
		}
		cairo_line_to(cr, fd.x + fd.w, base);
		cairo_close_path(cr);
		const struct sd_colour *sc = &sd_palette[PAL_BAND_CI];
		cairo_set_source_rgba(cr, sc->r / 255.0, sc->g / 255.0, sc->b / 255.0, 0.45);
		cairo_fill(cr);
		ch_col(cr, PAL_CURVE);
		cairo_set_line_width(cr, 1.0);
		for (int k = 0; k <= 40; k++) {
			double x = fd.x1 * k / 40;
			curve_eval(c->prof, &c->cov, x, c->level, &pt);
			double Y = base - (pt.y - p0.y) / span * (base - top);
			if (k)
				cairo_line_to(cr, ch_fx(&fd, x), Y);
			else
				cairo_move_to(cr, ch_fx(&fd, x), Y);
		}
		cairo_stroke(cr);
		double dy = base - (w->pt.y - p0.y) / span * (base - top);
		dot(d, ch_fx(&fd, w->dose.fractional), dy, 3.6, PAL_MARK, muscle_name(ms[i]));

		/* The gain: one athlete's band, the average curve's interval, the estimate. */
		double cy = ry + rh / 2;
		ch_col(cr, PAL_BAND_ATH);
		xband(cr, &fg, curve_pct(w->pt.ath_lo), curve_pct(w->pt.ath_hi), cy - 5, 10);
		cairo_fill_preserve(cr);
		ch_col(cr, PAL_BAND_CI);
		cairo_set_line_width(cr, 0.6);
		cairo_stroke(cr);
		ch_col(cr, PAL_BAND_CI);
		xband(cr, &fg, curve_pct(w->pt.ci_lo), curve_pct(w->pt.ci_hi), cy - 3, 6);
		cairo_fill(cr);
		dot(d, ch_fx(&fg, curve_pct(w->pt.y)), cy, 3.2, PAL_CURVE, muscle_name(ms[i]));

		ch_col(cr, PAL_INK);
		ch_text(d, r.x + 2, cy + 3, 8.5, 0, 0, muscle_name(ms[i]));
		snprintf(buf, sizeof buf, "%+.1f%%", curve_pct(w->pt.y));
		ch_text(d, r.x + r.w, cy + 3, 8.5, 1, 1, buf);
	}
	ch_col(cr, PAL_INK);
	cairo_set_line_width(cr, 0.6);
	if (fg.x0 < 0 && fg.x1 > 0) {
		ch_col(cr, PAL_MUTED);
		cairo_move_to(cr, ch_fx(&fg, 0), fg.y);
		cairo_line_to(cr, ch_fx(&fg, 0), fg.y + fg.h);
		cairo_stroke(cr);
	}
	xaxis(d, &fd, fd.y + fd.h + 2, "%g", "weekly fractional sets");
	xaxis(d, &fg, fg.y + fg.h + 2, "%+g%%", "predicted 1RM change over the block");
	int lv = (int)lround(c->level * 100);
	char ath[60], ci[60];
	snprintf(ath, sizeof ath, "%d%%: one athlete", lv);
	snprintf(ci, sizeof ci, "%d%%: the average curve", lv);
	struct swatch sw[] = {
		{ PAL_ZONE_CLIMB, 0, "building" }, { PAL_ZONE_PLATEAU, 0, "past practical returns" },
		{ PAL_ZONE_BEYOND, 3, "beyond the evidence" }, { PAL_CURVE, 1, "the curve's shape" },
		{ PAL_MARK, 2, "dose" }, { PAL_CURVE, 2, "gain" }, { PAL_BAND_CI, 0, ci },
		{ PAL_BAND_ATH, 0, ath },
	};
	ch_legend(d, r.x, fd.y + fd.h + AXIS_H + 8, r.w, sw, (int)(sizeof sw / sizeof *sw));
}

void ch_draw_compare(struct cdraw *d, const struct sd_chart *c, struct rect r)
{
	cairo_t *cr = d->cr;
	int ms[SD_NMUSCLES], n = muscles_shown(c->audit, c->other, ms);
	struct cmp_diff df[SD_NMUSCLES];
	double lo = -curve_pct(c->prof->swc) * 2, hi = curve_pct(c->prof->swc) * 2, swc = curve_pct(c->prof->swc);
	char title[200], buf[80];
	double y;

	snprintf(title, sizeof title, "'%s' against '%s'", c->name_b ? c->name_b : "B",
		 c->name_a ? c->name_a : "A");
	y = ch_chart_head(d, c, r, title);
	y = fmax(y, r.y + HEAD_H);
	for (int i = 0; i < n; i++) {
		cmp_muscle(c->prof, &c->cov, c->level, c->audit->row[ms[i]].dose.fractional,
			   c->other->row[ms[i]].dose.fractional, &df[i]);
		lo = fmin(lo, curve_pct(df[i].lo));
		hi = fmax(hi, curve_pct(df[i].hi));
	}
	double setw = 70, decw = 76;
	double s = ch_tick_step(hi - lo, 6);
	struct frame f = { r.x + NAME_W + setw, y + 14, r.w - NAME_W - setw - decw - 8, n * ROW_H,
			   floor(lo / s) * s, ceil(hi / s) * s, 0, 1 };
	ch_col(cr, PAL_INK);
	ch_text(d, r.x + NAME_W + setw - 8, y + 9, 8.5, 1, 1, "sets, A \xe2\x86\x92 B");
	ch_text(d, f.x, y + 9, 8.5, 1, 0, "difference in predicted 1RM gain, B over A");
	ch_text(d, r.x + r.w, y + 9, 8.5, 1, 1, "decision");
	ch_col(cr, PAL_SWC);
	xband(cr, &f, -swc, swc, f.y, f.h);
	cairo_fill(cr);
	ch_col(cr, PAL_MUTED);
	cairo_set_line_width(cr, 0.7);
	cairo_move_to(cr, ch_fx(&f, 0), f.y);
	cairo_line_to(cr, ch_fx(&f, 0), f.y + f.h);
	cairo_stroke(cr);
	for (int i = 0; i < n; i++) {
		const struct cmp_diff *q = &df[i];
		double cy = f.y + i * ROW_H + ROW_H / 2;
		enum sd_pal p = q->d >= 0 ? PAL_CURVE : PAL_MARK;
		ch_col(cr, PAL_INK);
		ch_text(d, r.x + 2, cy + 3, 8.5, 0, 0, muscle_name(ms[i]));
		snprintf(buf, sizeof buf, "%.1f \xe2\x86\x92 %.1f", q->xa, q->xb);
		ch_text(d, r.x + NAME_W + setw - 8, cy + 3, 8, 0, 1, buf);
		ch_col(cr, p);
		cairo_set_line_width(cr, 2.4);
		cairo_move_to(cr, ch_fx(&f, curve_pct(q->lo)), cy);
		cairo_line_to(cr, ch_fx(&f, curve_pct(q->hi)), cy);
		cairo_stroke(cr);
		dot(d, ch_fx(&f, curve_pct(q->d)), cy, 3.8, p, muscle_name(ms[i]));
		ch_col(cr, PAL_INK);
		ch_text(d, r.x + r.w, cy + 3, 8.5, q->decision == CMP_CLEAR_GAIN ||
		     q->decision == CMP_CLEAR_LOSS, 1, cmp_decision_name(q->decision));
	}
	xaxis(d, &f, f.y + f.h + 2, "%+g%%", "B over A, percent of predicted 1RM change");
	int lv = (int)lround(c->level * 100);
	char swct[80], ci[80];
	snprintf(swct, sizeof swct, "within the smallest worthwhile change (+/-%.1f%%)", swc);
	snprintf(ci, sizeof ci, "difference with its %d%% interval", lv);
	struct swatch sw[] = { { PAL_SWC, 0, swct }, { PAL_CURVE, 2, "B gains more" },
			       { PAL_MARK, 2, "B gains less" } };
	double ly = ch_legend(d, r.x, f.y + f.h + AXIS_H + 8, r.w, sw, 3);
	snprintf(title, sizeof title, "Each bar is the %s; the decision reads the %.0f%% interval "
		 "against the shaded region.", ci, 100 * cmp_decision_level(c->level));
	ch_col(cr, PAL_MUTED);
	ch_para(d, r.x, ly + 4, r.w, 8, 0, title, 0);
}
