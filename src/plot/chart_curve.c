/* The curve chart: the average curve with its three bands, the practical plateau, the end of
 * the evidence, and a program's muscles at their doses, labelled without collisions. */
#include <math.h>
#include <stdio.h>
#include <string.h>

#include "chart_int.h"

enum band_kind { B_CURVE, B_GROUP, B_ATHLETE };

static double band_edge(const struct sd_point *pt, enum band_kind k, int high)
{
	switch (k) {
	case B_GROUP: return high ? pt->group_hi : pt->group_lo;
	case B_ATHLETE: return high ? pt->ath_hi : pt->ath_lo;
	default: return high ? pt->ci_hi : pt->ci_lo;
	}
}

static void band(cairo_t *cr, const struct frame *f, const struct sd_chart *c, enum band_kind k)
{
	const int n = 120;
	struct sd_point pt;
	for (int i = 0; i <= n; i++) {
		double x = f->x0 + (f->x1 - f->x0) * i / n;
		curve_eval(c->prof, &c->cov, x, c->level, &pt);
		double v = curve_pct(band_edge(&pt, k, 1));
		if (i == 0)
			cairo_move_to(cr, ch_fx(f, x), ch_fy(f, v));
		else
			cairo_line_to(cr, ch_fx(f, x), ch_fy(f, v));
	}
	for (int i = n; i >= 0; i--) {
		double x = f->x0 + (f->x1 - f->x0) * i / n;
		curve_eval(c->prof, &c->cov, x, c->level, &pt);
		cairo_line_to(cr, ch_fx(f, x), ch_fy(f, curve_pct(band_edge(&pt, k, 0))));
	}
	cairo_close_path(cr);
	cairo_fill(cr);
}

/* Marks that share a dose share one mark; their names stack in one label. */
struct mgroup {
	double x, y;               /* dose, percent */
	int m[SD_NMUSCLES], n;
};

static int group_marks(const struct sd_audit *a, struct mgroup *g)
{
	int order[SD_NMUSCLES], n = 0, ng = 0;
	for (int m = 0; m < SD_NMUSCLES; m++)
		if (a->row[m].dose.fractional > 0)
			order[n++] = m;
	for (int i = 1; i < n; i++)
		for (int j = i; j > 0 && a->row[order[j]].dose.fractional <
					 a->row[order[j - 1]].dose.fractional; j--) {
			int t = order[j];
			order[j] = order[j - 1];
			order[j - 1] = t;
		}
	for (int k = 0; k < n; k++) {
		const struct sd_audit_row *r = &a->row[order[k]];
		if (ng && fabs(r->dose.fractional - g[ng - 1].x) < 1e-9) {
			g[ng - 1].m[g[ng - 1].n++] = order[k];
			continue;
		}
		g[ng] = (struct mgroup){ r->dose.fractional, curve_pct(r->pt.y), { order[k] }, 1 };
		ng++;
	}
	return ng;
}

#define LABEL_PT 8.5
#define LINE_H (LABEL_PT * 1.2)

void ch_draw_curve(struct cdraw *d, const struct sd_chart *c, struct rect r)
{
	cairo_t *cr = d->cr;
	struct sd_point pt;
	double lo = INFINITY, hi = -INFINITY, xmax = c->prof->dose_max;
	double plateau = curve_plateau(c->prof, &c->cov, 1.0);
	struct mgroup g[SD_NMUSCLES];
	struct place_label pl[SD_NMUSCLES];
	struct rect obst[128];
	int ng = 0, nob = 0;
	char buf[200];
	double y;

	y = ch_chart_head(d, c, r, c->title ? c->title : "The dose-response curve");
	if (c->audit) {
		ng = group_marks(c->audit, g);
		for (int i = 0; i < ng; i++)
			xmax = fmax(xmax, g[i].x);
	}
	/* The legend goes under the plot: measure it first. */
	char what[3][80];
	int lv = (int)lround(c->level * 100);
	snprintf(what[0], sizeof what[0], "%d%%: where the average curve lies", lv);
	snprintf(what[1], sizeof what[1], "%d%%: a new group or study", lv);
	snprintf(what[2], sizeof what[2], "%d%%: one athlete", lv);
	struct swatch sw[6] = {
		{ PAL_CURVE, 1, "average curve" }, { PAL_BAND_CI, 0, what[0] },
		{ PAL_BAND_GROUP, 0, what[1] }, { PAL_BAND_ATH, 0, what[2] },
	};
	int nsw = 4;
	if (c->audit)
		sw[nsw++] = (struct swatch){ PAL_MARK, 2, "a muscle at its weekly dose" };
	double legend_h = 2 * 8 * 1.6 + 8;

	struct frame f = { r.x + 42, y + 10, r.w - 42 - 8, 0, 0, xmax * 1.04, 0, 0 };
	f.h = r.y + r.h - f.y - 30 - legend_h;
	for (int i = 0; i <= 60; i++) {
		curve_eval(c->prof, &c->cov, f.x1 * i / 60, c->level, &pt);
		lo = fmin(lo, curve_pct(pt.ath_lo));
		hi = fmax(hi, curve_pct(pt.ath_hi));
	}
	double ys = ch_tick_step(hi - lo, 6);
	f.y0 = floor(lo / ys) * ys;
	f.y1 = ceil(hi / ys) * ys;

	cairo_save(cr);
	cairo_rectangle(cr, f.x, f.y, f.w, f.h);
	cairo_clip(cr);
	ch_col(cr, PAL_BAND_ATH);
	band(cr, &f, c, B_ATHLETE);
	ch_col(cr, PAL_BAND_GROUP);
	band(cr, &f, c, B_GROUP);
	ch_col(cr, PAL_BAND_CI);
	band(cr, &f, c, B_CURVE);
	cairo_restore(cr);
	ch_axes(d, &f, "weekly fractional sets", "predicted 1RM change over the block", "%+.0f%%");

	/* Threshold lines, their labels at the top inside the plot; both are obstacles. */
	double vx[2] = { plateau, c->prof->dose_max };
	const char *vt[2] = { "practical plateau", "end of the evidence" };
	int nv = xmax > c->prof->dose_max + 1e-9 ? 2 : 1;
	for (int i = 0; i < nv; i++) {
		ch_col(cr, PAL_INK);
		ch_vline(d, &f, vx[i]);
		snprintf(buf, sizeof buf, "%s %g", vt[i], vx[i]);
		double tw = ch_text_w(d, 8, 0, buf);
		/* Right of the line unless that runs off the plot. */
		double tx = ch_fx(&f, vx[i]) + 3;
		if (tx + tw > f.x + f.w)
			tx = ch_fx(&f, vx[i]) - 3 - tw;
		struct rect tb = { tx - 2, f.y + 2, tw + 4, 11 };
		cairo_set_source_rgba(cr, 1, 1, 1, 0.85);
		cairo_rectangle(cr, tb.x, tb.y, tb.w, tb.h);
		cairo_fill(cr);
		ch_col(cr, PAL_INK);
		ch_text(d, tx, f.y + 10.5, 8, 0, 0, buf);
		obst[nob++] = tb;
		obst[nob++] = (struct rect){ ch_fx(&f, vx[i]) - 1, f.y, 2, f.h };
		ch_rec(d, BOX_OBSTACLE, tb.x, tb.y, tb.w, tb.h, 0, vt[i]);
		ch_rec(d, BOX_OBSTACLE, ch_fx(&f, vx[i]) - 1, f.y, 2, f.h, 0, "threshold line");
	}

	/* The average curve; its path is an obstacle too, so no label hides it. */
	ch_col(cr, PAL_CURVE);
	cairo_set_line_width(cr, 2.2);
	double last_x = 0, last_y = 0;
	for (int i = 0; i <= 200; i++) {
		curve_eval(c->prof, &c->cov, f.x1 * i / 200, c->level, &pt);
		double X = ch_fx(&f, pt.x), Y = ch_fy(&f, curve_pct(pt.y));
		if (i == 0)
			cairo_move_to(cr, X, Y);
		else
			cairo_line_to(cr, X, Y);
		if (i % 8 == 0 && i && nob < (int)(sizeof obst / sizeof *obst))
			obst[nob++] = (struct rect){ fmin(X, last_x), fmin(Y, last_y) - 1.5,
						     fabs(X - last_x), fabs(Y - last_y) + 3 };
		if (i % 8 == 0) {
			last_x = X;
			last_y = Y;
		}
	}
	cairo_stroke(cr);

	/* The muscles: marks, then their labels placed clear of everything. */
	for (int i = 0; i < ng; i++) {
		double wmax = 0;
		for (int k = 0; k < g[i].n; k++)
			wmax = fmax(wmax, ch_text_w(d, LABEL_PT, 0, muscle_name(g[i].m[k])));
		pl[i] = (struct place_label){ ch_fx(&f, g[i].x), ch_fy(&f, g[i].y), 4.5, wmax + 4,
					      g[i].n * LINE_H + 2, { 0, 0, 0, 0 }, 0 };
	}
	ch_place_labels(pl, ng, obst, nob, (struct rect){ f.x + 2, f.y + 2, f.w - 4, f.h - 4 });
	for (int i = 0; i < ng; i++) {
		double ex = fmin(fmax(pl[i].ax, pl[i].at.x), pl[i].at.x + pl[i].at.w);
		double ey = fmin(fmax(pl[i].ay, pl[i].at.y), pl[i].at.y + pl[i].at.h);
		if (hypot(ex - pl[i].ax, ey - pl[i].ay) > pl[i].ar + 3) {
			ch_col(cr, PAL_MUTED);
			cairo_set_line_width(cr, 0.8);
			cairo_move_to(cr, pl[i].ax, pl[i].ay);
			cairo_line_to(cr, ex, ey);
			cairo_stroke(cr);
		}
	}
	for (int i = 0; i < ng; i++) {
		cairo_new_path(cr);
		cairo_set_source_rgb(cr, 1, 1, 1);
		cairo_arc(cr, pl[i].ax, pl[i].ay, pl[i].ar, 0, 2 * M_PI);
		cairo_fill(cr);
		ch_col(cr, PAL_MARK);
		cairo_arc(cr, pl[i].ax, pl[i].ay, pl[i].ar - 1.1, 0, 2 * M_PI);
		cairo_fill(cr);
		ch_rec(d, BOX_MARK, pl[i].ax - pl[i].ar, pl[i].ay - pl[i].ar, 2 * pl[i].ar,
		    2 * pl[i].ar, 0, muscle_name(g[i].m[0]));
	}
	for (int i = 0; i < ng; i++) {
		struct rect *a = &pl[i].at;
		cairo_set_source_rgba(cr, 1, 1, 1, 0.88);
		cairo_rectangle(cr, a->x, a->y, a->w, a->h);
		cairo_fill(cr);
		ch_col(cr, PAL_INK);
		for (int k = 0; k < g[i].n; k++)
			ch_text(d, a->x + 2, a->y + 1 + LINE_H * (k + 1) - 2.4, LABEL_PT, 0, 0,
			     muscle_name(g[i].m[k]));
		ch_rec(d, BOX_LABEL, a->x, a->y, a->w, a->h, LABEL_PT, muscle_name(g[i].m[0]));
	}

	y = f.y + f.h + 40;
	ch_legend(d, r.x + 8, y, r.w - 16, sw, nsw);
}
