/* The returns grid as a heat map: for each pair of weekly doses a < b, what moving from a to b
 * adds to the predicted 1RM gain (curve_delta, as the returns command prints it). Darker is
 * more; a framed cell is both worthwhile (past the SWC) and clear (its interval excludes 0). */
#include <math.h>
#include <stdio.h>
#include <string.h>

#include "chart_int.h"

#define MAXD 32
#define CELL_H 21.0
#define HEAD_H 46.0

static int doses(const struct sd_chart *c, double *d)
{
	static const double dflt[] = { 0, 1, 2, 3, 4, 5, 6, 8, 10, 12, 15, 20, 25, 30 };
	int n = 0;
	if (c->doses && c->ndoses >= 2) {
		for (int i = 0; i < c->ndoses && i < MAXD; i++)
			d[n++] = c->doses[i];
		return n;
	}
	for (size_t i = 0; i < sizeof dflt / sizeof *dflt && dflt[i] <= c->prof->dose_max; i++)
		d[n++] = dflt[i];
	return n;
}

double ch_returns_height(const struct sd_chart *c, double w)
{
	double d[MAXD];
	(void)w;
	return HEAD_H + 30 + (doses(c, d) - 1) * CELL_H + 30 + 52;
}

/* The heat ramp: four stops whose lightness falls monotonically (palette.h). */
static void heat(cairo_t *cr, double t, double *lum)
{
	static const enum sd_pal stop[] = { PAL_HEAT0, PAL_HEAT1, PAL_HEAT2, PAL_HEAT3 };
	double u = fmin(fmax(t, 0), 1) * 3;
	int k = (int)fmin(floor(u), 2);
	double f = u - k;
	const struct sd_colour *a = &sd_palette[stop[k]], *b = &sd_palette[stop[k + 1]];
	double r = (a->r + (b->r - a->r) * f) / 255, g = (a->g + (b->g - a->g) * f) / 255,
	       bl = (a->b + (b->b - a->b) * f) / 255;
	cairo_set_source_rgb(cr, r, g, bl);
	*lum = 0.2126 * r + 0.7152 * g + 0.0722 * bl;
}

void ch_draw_returns(struct cdraw *d, const struct sd_chart *c, struct rect r)
{
	cairo_t *cr = d->cr;
	double ds[MAXD], top = 0, swc = curve_pct(c->prof->swc), y;
	int n = doses(c, ds);
	struct sd_delta dl;
	char buf[600];
	double plateau = curve_plateau(c->prof, &c->cov, 1.0);

	y = ch_chart_head(d, c, r, "What more weekly sets add: from a to b");
	y = fmax(y, r.y + HEAD_H);
	for (int i = 0; i + 1 < n; i++) {
		curve_delta(c->prof, &c->cov, ds[i], ds[n - 1], c->level, 0, &dl);
		top = fmax(top, curve_pct(dl.d));
	}
	if (!(top > 0))
		top = 1;
	double rowlab = 62, cw = (r.w - rowlab) / (n - 1);
	double gx = r.x + rowlab, gy = y + 30;
	ch_col(cr, PAL_INK);
	ch_text(d, gx + (n - 1) * cw / 2, y + 10, 8.5, 1, 0.5, "to b weekly fractional sets");
	for (int j = 1; j < n; j++) {
		snprintf(buf, sizeof buf, "%g", ds[j]);
		ch_text(d, gx + (j - 0.5) * cw, gy - 5, 8, 0, 0.5, buf);
	}
	ch_text(d, r.x, gy - 5, 8.5, 1, 0, "from a");
	for (int i = 0; i + 1 < n; i++) {
		double cy = gy + i * CELL_H;
		ch_col(cr, PAL_INK);
		snprintf(buf, sizeof buf, "%g", ds[i]);
		ch_text(d, gx - 6, cy + CELL_H / 2 + 3, 8, 0, 1, buf);
		for (int j = i + 1; j < n; j++) {
			double cx = gx + (j - 1) * cw, lum;
			curve_delta(c->prof, &c->cov, ds[i], ds[j], c->level, 0, &dl);
			double v = curve_pct(dl.d);
			heat(cr, v / top, &lum);
			cairo_rectangle(cr, cx + 0.5, cy + 0.5, cw - 1, CELL_H - 1);
			cairo_fill(cr);
			int worth = dl.d > c->prof->swc && dl.lo > 0;
			if (worth) {
				ch_col(cr, PAL_INK);
				cairo_set_line_width(cr, 1.4);
				cairo_rectangle(cr, cx + 1.5, cy + 1.5, cw - 3, CELL_H - 3);
				cairo_stroke(cr);
				if (lum < 0.45) {
					cairo_set_source_rgb(cr, 1, 1, 1);
					cairo_set_line_width(cr, 0.6);
					cairo_rectangle(cr, cx + 2.6, cy + 2.6, cw - 5.2, CELL_H - 5.2);
					cairo_stroke(cr);
				}
			}
			if (lum < 0.45)
				cairo_set_source_rgb(cr, 1, 1, 1);
			else
				ch_col(cr, PAL_INK);
			snprintf(buf, sizeof buf, "%.1f", v);
			ch_text(d, cx + cw / 2, cy + CELL_H / 2 + 3, 8, worth, 0.5, buf);
		}
	}
	/* The practical plateau among the rows: a line above the first row at or past it. */
	for (int i = 0; i + 1 < n; i++)
		if (ds[i] >= plateau - 1e-9) {
			double ly = gy + i * CELL_H;
			ch_col(cr, PAL_MARK);
			cairo_set_line_width(cr, 1.6);
			cairo_move_to(cr, r.x, ly);
			cairo_line_to(cr, gx + (n - 1) * cw, ly);
			cairo_stroke(cr);
			break;
		}
	y = gy + (n - 1) * CELL_H + 14;
	ch_col(cr, PAL_INK);
	snprintf(buf, sizeof buf, "Cells: percentage points of 1RM gain that moving from a to b weekly "
		 "sets adds on the average curve. Framed and bold: more than the smallest worthwhile "
		 "change (%.1f%%) with a %.0f%% interval above 0. Rows under the dark orange line start "
		 "at or past the practical plateau (%g weekly sets).", swc, c->level * 100, plateau);
	y = ch_para(d, r.x, y, r.w, 8, 0, buf, 0);
	double lum;
	for (int k = 0; k <= 4; k++) {
		heat(cr, k / 4.0, &lum);
		cairo_rectangle(cr, r.x + k * 34, y + 2, 34, 10);
		cairo_fill(cr);
		ch_col(cr, PAL_INK);
		snprintf(buf, sizeof buf, "%.0f", top * k / 4);
		ch_text(d, r.x + k * 34 + 17, y + 22, 8, 0, 0.5, buf);
	}
	ch_text(d, r.x + 5 * 34 + 8, y + 10, 8, 0, 0, "percentage points added");
}
