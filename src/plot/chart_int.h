/* Inside the chart module only: the drawing state, text and box recording, the palette in
 * cairo's terms, axes, and the label placement. Every chart_*.c of the module includes it. */
#ifndef SD_CHART_INT_H
#define SD_CHART_INT_H

#include <cairo.h>

#include "../core/curve.h"
#include "chart.h"
#include "palette.h"

/* Smallest text on any chart or page, in points at A4 (the floor for print). */
#define CH_MIN_PT 8.0

/* A drawing in progress: the cairo context, where boxes go, the page and the chart (group)
 * being drawn. Boxes are recorded in page points whatever translation is in force. */
struct cdraw {
	cairo_t *cr;
	struct chart_layout *lay;
	double dev_per_pt;         /* device units per point: 2 for PNG, 1 for vector formats */
	int page, group;
};

struct rect {
	double x, y, w, h;
};

struct frame {
	double x, y, w, h;         /* plot area */
	double x0, x1, y0, y1;     /* data range */
};

void ch_col(cairo_t *cr, enum sd_pal p);
/* Colour p mixed with white: t = 0 is p, 1 is white. */
void ch_col_tint(cairo_t *cr, enum sd_pal p, double t);
double ch_fx(const struct frame *f, double x);
double ch_fy(const struct frame *f, double y);
/* A round tick step giving about `want` ticks over span. */
double ch_tick_step(double span, int want);

/* Records a box in page points (from user coordinates). */
void ch_rec(struct cdraw *d, enum chart_box_kind k, double x, double y, double w, double h,
	 double size, const char *text);
/* Width of s at size. */
double ch_text_w(struct cdraw *d, double size, int bold, const char *s);
/* Draws s with its baseline at y; align 0 left, 0.5 centre, 1 right; records it. Returns its
 * width. */
double ch_text(struct cdraw *d, double x, double y, double size, int bold, double align,
	    const char *s);
/* Wraps s within width on word boundaries from baseline y; returns the baseline after the
 * last line. dry = 1 measures only. */
double ch_para(struct cdraw *d, double x, double y, double width, double size, int bold,
	    const char *s, int dry);
/* Axes with grid, ticks and titles; xfmt/yfmt printf formats of one double. */
void ch_axes(struct cdraw *d, const struct frame *f, const char *xtitle, const char *ytitle,
	  const char *yfmt);
/* A dashed vertical line at data x, from the frame's top to its bottom. */
void ch_vline(struct cdraw *d, const struct frame *f, double x);

/* Label placement: each label is put near its anchor where it meets no other label, no
 * obstacle and no anchor, inside bounds, trying positions at growing distances (greedy, in the
 * order given); a leader line is drawn when it ends up away from its anchor. */
struct place_label {
	double ax, ay, ar;         /* anchor: a mark's centre and radius */
	double w, h;               /* the label's box */
	struct rect at;            /* result */
	int fit;                   /* 1 placed without meeting anything */
};
void ch_place_labels(struct place_label *l, int n, const struct rect *obst, int nobst,
		  struct rect bounds);
int ch_rect_meet(const struct rect *a, const struct rect *b);

/* The charts, each into a rectangle of the current page; chart.c frames them as pictures and
 * chart_report.c places them on pages. h is a suggestion the chart may fill. */
void ch_draw_curve(struct cdraw *d, const struct sd_chart *c, struct rect r);
void ch_draw_muscles(struct cdraw *d, const struct sd_chart *c, struct rect r);
void ch_draw_compare(struct cdraw *d, const struct sd_chart *c, struct rect r);
void ch_draw_returns(struct cdraw *d, const struct sd_chart *c, struct rect r);
/* The height each chart needs at width w (the curve takes what it is given). */
double ch_muscles_height(const struct sd_chart *c, double w);
double ch_compare_height(const struct sd_chart *c, double w);
double ch_returns_height(const struct sd_chart *c, double w);

/* The chart's title line and its context line (status, weeks, profile, level), and a note
 * when the context is beyond the evidence; returns the y below them. */
double ch_chart_head(struct cdraw *d, const struct sd_chart *c, struct rect r, const char *title);
/* A legend row of swatches: returns the y below it. */
struct swatch {
	enum sd_pal pal;
	int kind;                  /* 0 box, 1 line, 2 dot, 3 hatched box */
	const char *text;
};
double ch_legend(struct cdraw *d, double x, double y, double w, const struct swatch *s, int n);
void ch_hatch(struct cdraw *d, struct rect r);

int ch_report_draw(cairo_surface_t *s, struct cdraw *d, const struct sd_report *r);

#endif
