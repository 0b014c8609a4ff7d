#include "chart.h"
#include "chart_mod.h"

#include <math.h>
#include <stdio.h>
#include <string.h>
#include <strings.h>

#include <cairo.h>
#include <cairo-pdf.h>
#include <cairo-svg.h>
#include <fontconfig/fontconfig.h>

#include "../core/curve.h"

/* This project's palette: slate text, a teal curve on sand-coloured bands. */
#define INK 0.16, 0.20, 0.25
#define GRID 0.86, 0.86, 0.84
#define BAND_ATH 0.96, 0.94, 0.89
#define BAND_GROUP 0.90, 0.85, 0.74
#define BAND_CI 0.78, 0.71, 0.56
#define CURVE 0.05, 0.45, 0.47
#define MARK 0.70, 0.25, 0.15

struct frame {
	double x, y, w, h;        /* plot area in device units */
	double x0, x1, y0, y1;    /* data range */
};

static double px(const struct frame *f, double x)
{
	return f->x + (x - f->x0) / (f->x1 - f->x0) * f->w;
}

static double py(const struct frame *f, double y)
{
	return f->y + f->h - (y - f->y0) / (f->y1 - f->y0) * f->h;
}

static void text(cairo_t *cr, double x, double y, double size, int bold, double align,
		 const char *s)
{
	cairo_text_extents_t ext;
	cairo_select_font_face(cr, "sans-serif", CAIRO_FONT_SLANT_NORMAL,
			       bold ? CAIRO_FONT_WEIGHT_BOLD : CAIRO_FONT_WEIGHT_NORMAL);
	cairo_set_font_size(cr, size);
	cairo_text_extents(cr, s, &ext);
	cairo_move_to(cr, x - align * ext.x_advance, y);
	cairo_show_text(cr, s);
}

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
			cairo_move_to(cr, px(f, x), py(f, v));
		else
			cairo_line_to(cr, px(f, x), py(f, v));
	}
	for (int i = n; i >= 0; i--) {
		double x = f->x0 + (f->x1 - f->x0) * i / n;
		curve_eval(c->prof, &c->cov, x, c->level, &pt);
		cairo_line_to(cr, px(f, x), py(f, curve_pct(band_edge(&pt, k, 0))));
	}
	cairo_close_path(cr);
	cairo_fill(cr);
}

/* Whole-number tick step giving about six ticks. */
static double tick_step(double span)
{
	double raw = span / 6, mag = pow(10, floor(log10(raw)));
	double norm = raw / mag;
	return (norm < 1.5 ? 1 : norm < 3.5 ? 2 : norm < 7.5 ? 5 : 10) * mag;
}

static void axes(cairo_t *cr, const struct frame *f)
{
	char buf[32];
	double sx = tick_step(f->x1 - f->x0), sy = tick_step(f->y1 - f->y0);

	cairo_set_line_width(cr, 0.6);
	for (double y = ceil(f->y0 / sy) * sy; y <= f->y1 + 1e-9; y += sy) {
		cairo_set_source_rgb(cr, GRID);
		cairo_move_to(cr, f->x, py(f, y));
		cairo_line_to(cr, f->x + f->w, py(f, y));
		cairo_stroke(cr);
		cairo_set_source_rgb(cr, INK);
		/* y + 0.0 would keep a negative zero; print 0 as "0%". */
		snprintf(buf, sizeof buf, "%+.0f%%", fabs(y) < 1e-9 ? 0.0 : y);
		text(cr, f->x - 6, py(f, y) + 4, 10, 0, 1, buf);
	}
	for (double x = ceil(f->x0 / sx) * sx; x <= f->x1 + 1e-9; x += sx) {
		cairo_set_source_rgb(cr, INK);
		cairo_move_to(cr, px(f, x), f->y + f->h);
		cairo_line_to(cr, px(f, x), f->y + f->h + 4);
		cairo_stroke(cr);
		snprintf(buf, sizeof buf, "%g", x);
		text(cr, px(f, x), f->y + f->h + 16, 10, 0, 0.5, buf);
	}
	cairo_set_source_rgb(cr, INK);
	cairo_rectangle(cr, f->x, f->y, f->w, f->h);
	cairo_stroke(cr);
	text(cr, f->x + f->w / 2, f->y + f->h + 32, 11, 0, 0.5, "weekly fractional sets");
	cairo_save(cr);
	cairo_translate(cr, f->x - 44, f->y + f->h / 2);
	cairo_rotate(cr, -M_PI / 2);
	text(cr, 0, 0, 11, 0, 0.5, "predicted 1RM change over the block");
	cairo_restore(cr);
}

static void vline(cairo_t *cr, const struct frame *f, double x, const char *label)
{
	static const double dash[] = { 4, 3 };
	cairo_set_source_rgb(cr, INK);
	cairo_set_dash(cr, dash, 2, 0);
	cairo_set_line_width(cr, 0.8);
	cairo_move_to(cr, px(f, x), f->y);
	cairo_line_to(cr, px(f, x), f->y + f->h);
	cairo_stroke(cr);
	cairo_set_dash(cr, NULL, 0, 0);
	text(cr, px(f, x) + 3, f->y + 12, 9, 0, 0, label);
}

/* Draws the chart into the rectangle (x, y, w, h) of the surface. */
static void draw_chart(cairo_t *cr, const struct sd_chart *c, double x, double y, double w,
		       double h)
{
	struct frame f = { x + 64, y + 34, w - 84, h - 84, 0, 0, 0, 0 };
	struct sd_point pt;
	double lo = INFINITY, hi = -INFINITY, xmax = c->prof->dose_max;
	double plateau = curve_plateau(c->prof, &c->cov, 1.0);
	char buf[256];

	if (c->audit)
		for (int m = 0; m < SD_NMUSCLES; m++)
			if (c->audit->row[m].dose.fractional > xmax)
				xmax = c->audit->row[m].dose.fractional;
	f.x1 = xmax;
	for (int i = 0; i <= 60; i++) {
		curve_eval(c->prof, &c->cov, xmax * i / 60, c->level, &pt);
		lo = fmin(lo, curve_pct(pt.ath_lo));
		hi = fmax(hi, curve_pct(pt.ath_hi));
	}
	f.y0 = floor(lo / 5) * 5;
	f.y1 = ceil(hi / 5) * 5;

	cairo_set_source_rgb(cr, INK);
	text(cr, x + 16, y + 18, 14, 1, 0, c->title ? c->title : c->prof->name);
	snprintf(buf, sizeof buf, "%s, %g-week block; profile %s; %.0f%% bands",
		 c->cov.trained >= 0.5 ? "trained" : "untrained", c->cov.weeks, c->prof->name,
		 c->level * 100);
	text(cr, x + w - 16, y + 18, 10, 0, 1, buf);
	/* A block length or status outside the evidence is said on the chart itself. */
	if (curve_context_note(c->prof, &c->cov, buf, sizeof buf)) {
		cairo_set_source_rgb(cr, MARK);
		text(cr, x + w - 16, y + 30, 9, 1, 1, buf);
	}

	cairo_set_source_rgb(cr, BAND_ATH);
	band(cr, &f, c, B_ATHLETE);
	cairo_set_source_rgb(cr, BAND_GROUP);
	band(cr, &f, c, B_GROUP);
	cairo_set_source_rgb(cr, BAND_CI);
	band(cr, &f, c, B_CURVE);
	axes(cr, &f);
	snprintf(buf, sizeof buf, "plateau %g", plateau);
	vline(cr, &f, plateau, buf);
	if (xmax > c->prof->dose_max)
		vline(cr, &f, c->prof->dose_max, "end of evidence");

	cairo_set_source_rgb(cr, CURVE);
	cairo_set_line_width(cr, 2.2);
	for (int i = 0; i <= 200; i++) {
		curve_eval(c->prof, &c->cov, xmax * i / 200, c->level, &pt);
		if (i == 0)
			cairo_move_to(cr, px(&f, pt.x), py(&f, curve_pct(pt.y)));
		else
			cairo_line_to(cr, px(&f, pt.x), py(&f, curve_pct(pt.y)));
	}
	cairo_stroke(cr);

	if (c->audit) {
		/* Marks in dose order; labels cycle through four heights (two above, two below the
		 * curve) so muscles at nearby doses stay readable. */
		int order[SD_NMUSCLES], n = 0;
		for (int m = 0; m < SD_NMUSCLES; m++)
			if (c->audit->row[m].dose.fractional > 0)
				order[n++] = m;
		for (int i = 1; i < n; i++)
			for (int j = i; j > 0 && c->audit->row[order[j]].dose.fractional <
						 c->audit->row[order[j - 1]].dose.fractional; j--) {
				int t = order[j];
				order[j] = order[j - 1];
				order[j - 1] = t;
			}
		static const double lift[4] = { -10, 18, -22, 30 };
		/* Muscles at the same dose share one mark and one label. */
		for (int k = 0, slot = 0; k < n; slot++) {
			const struct sd_audit_row *r = &c->audit->row[order[k]];
			double mx = px(&f, r->dose.fractional), my = py(&f, curve_pct(r->pt.y));
			double ly = my + lift[slot % 4];
			char names[160];
			size_t used = 0;
			int j = k;
			names[0] = '\0';
			for (; j < n && c->audit->row[order[j]].dose.fractional - r->dose.fractional < 1e-9; j++)
				if (used < sizeof names)
					used += (size_t)snprintf(names + used, sizeof names - used, "%s%s",
								 j > k ? ", " : "", muscle_name(order[j]));
			k = j;
			cairo_set_source_rgb(cr, MARK);
			cairo_arc(cr, mx, my, 3.5, 0, 2 * M_PI);
			cairo_fill(cr);
			cairo_set_line_width(cr, 0.5);
			cairo_move_to(cr, mx, my);
			cairo_line_to(cr, mx, ly + (lift[slot % 4] > 0 ? -9 : 2));
			cairo_stroke(cr);
			text(cr, mx, ly, 8.5, 0, 0.5, names);
		}
	}
	/* Legend: what each band means, in the words every output uses. */
	static const char *const what[] = {
		"the average curve (confidence interval)",
		"a new group or study (+ between-study spread)",
		"one athlete (+ between-athlete spread)",
	};
	double lx = f.x + f.w - 250, ly = f.y + f.h - 68;
	cairo_set_source_rgb(cr, 1, 1, 1);
	cairo_rectangle(cr, lx - 6, ly - 12, 250, 68);
	cairo_fill(cr);
	cairo_set_source_rgb(cr, CURVE);
	cairo_rectangle(cr, lx, ly - 5, 16, 3);
	cairo_fill(cr);
	cairo_set_source_rgb(cr, INK);
	text(cr, lx + 22, ly, 9, 0, 0, "mean");
	for (int i = 0; i < 3; i++) {
		if (i == 0)
			cairo_set_source_rgb(cr, BAND_CI);
		else if (i == 1)
			cairo_set_source_rgb(cr, BAND_GROUP);
		else
			cairo_set_source_rgb(cr, BAND_ATH);
		cairo_rectangle(cr, lx, ly + 8 + 16 * i, 16, 8);
		cairo_fill(cr);
		cairo_set_source_rgb(cr, INK);
		snprintf(buf, sizeof buf, "%.0f%% %s", c->level * 100, what[i]);
		text(cr, lx + 22, ly + 16 + 16 * i, 9, 0, 0, buf);
	}
}

/* cairo writes through this; a failed write is recorded here as well as reported to cairo,
 * because cairo does not report every failed write (the PDF's final flush). */
struct stream {
	chart_sink_fn sink;
	void *closure;
	int failed;
};

static cairo_status_t write_cb(void *closure, const unsigned char *data, unsigned int len)
{
	struct stream *out = closure;
	if (out->failed || out->sink(out->closure, data, len)) {
		out->failed = 1;
		return CAIRO_STATUS_WRITE_ERROR;
	}
	return CAIRO_STATUS_SUCCESS;
}

static int finish(cairo_surface_t *s, cairo_t *cr, const char *name, enum chart_fmt fmt,
		  struct stream *out, struct sd_err *e)
{
	cairo_status_t st = cairo_status(cr);
	cairo_destroy(cr);
	if (!st && fmt == FMT_PNG)
		st = cairo_surface_write_to_png_stream(s, write_cb, out);
	cairo_surface_finish(s);
	if (!st)
		st = cairo_surface_status(s);
	cairo_surface_destroy(s);
	/* Release cairo's and fontconfig's process-wide font caches, so leak checkers see a
	 * clean exit (a chart is drawn once per process). */
	cairo_debug_reset_static_data();
	FcFini();
	if (out->failed)
		return sd_fail(e, "cannot write '%s': the output could not be written", name);
	if (st)
		return sd_fail(e, "cannot write '%s': %s", name, cairo_status_to_string(st));
	return 0;
}

static cairo_surface_t *surface(enum chart_fmt fmt, struct stream *out, double w, double h)
{
	switch (fmt) {
	case FMT_PNG: return cairo_image_surface_create(CAIRO_FORMAT_RGB24, (int)w, (int)h);
	case FMT_SVG: return cairo_svg_surface_create_for_stream(write_cb, out, w, h);
	case FMT_PDF: return cairo_pdf_surface_create_for_stream(write_cb, out, w, h);
	default: return NULL;
	}
}

/* A surface ready to draw on, or -1 with e filled. */
static int start(enum chart_fmt fmt, const char *name, struct stream *out, double w, double h,
		 cairo_surface_t **s, struct sd_err *e)
{
	*s = surface(fmt, out, w, h);
	if (!*s || cairo_surface_status(*s)) {
		cairo_status_t st = *s ? cairo_surface_status(*s) : CAIRO_STATUS_NO_MEMORY;
		if (*s)
			cairo_surface_destroy(*s);
		return sd_fail(e, "cannot write '%s': %s", name, cairo_status_to_string(st));
	}
	return 0;
}

static int mod_chart_write(const char *name, const struct sd_chart *c, chart_sink_fn sink, void *closure,
		struct sd_err *e)
{
	enum chart_fmt fmt = chart_format(name);
	double w = 900, h = 572;
	char buf[300];
	struct stream out = { sink, closure, 0 };
	cairo_surface_t *s;
	cairo_t *cr;

	if (fmt == FMT_NONE)
		return sd_usage(e, "cannot tell the chart format of '%s': name it .png, .svg or .pdf", name);
	if (start(fmt, name, &out, w, h, &s, e))
		return -1;
	cr = cairo_create(s);
	cairo_set_source_rgb(cr, 1, 1, 1);
	cairo_paint(cr);
	draw_chart(cr, c, 0, 0, w, h);
	cairo_set_source_rgb(cr, INK);
	profile_oneline(c->prof, buf, sizeof buf);
	text(cr, 16, h - 22, 8.5, 0, 0, buf);
	text(cr, 16, h - 10, 8.5, 0, 0, aout_caution);
	return finish(s, cr, name, fmt, &out, e);
}

/* Wraps s at about `width` points on word boundaries; returns the y below the last line. */
static double para(cairo_t *cr, double x, double y, double width, double size, const char *s)
{
	char line[512];
	size_t len = 0;
	cairo_text_extents_t ext;

	cairo_select_font_face(cr, "sans-serif", CAIRO_FONT_SLANT_NORMAL, CAIRO_FONT_WEIGHT_NORMAL);
	cairo_set_font_size(cr, size);
	while (*s) {
		size_t word = strcspn(s, " ");
		if (len + word + 2 >= sizeof line)
			word = sizeof line - len - 2;
		char trial[512];
		snprintf(trial, sizeof trial, "%.*s%s%.*s", (int)len, line, len ? " " : "", (int)word, s);
		cairo_text_extents(cr, trial, &ext);
		if (ext.x_advance > width && len) {
			line[len] = '\0';
			cairo_move_to(cr, x, y);
			cairo_show_text(cr, line);
			y += size * 1.3;
			len = 0;
			continue;
		}
		snprintf(line, sizeof line, "%s", trial);
		len = strlen(line);
		s += word;
		while (*s == ' ')
			s++;
	}
	if (len) {
		line[len] = '\0';
		cairo_move_to(cr, x, y);
		cairo_show_text(cr, line);
		y += size * 1.3;
	}
	return y;
}

static void report_page(cairo_t *cr, const struct sd_audit_info *in, double w)
{
	static const char *const heads[] = { "muscle", "direct", "indirect", "frac.", "gain %",
					      "curve", "group", "athlete", "+1 set", "+1 set int.",
					      "zone" };
	/* Left edge of the name and zone columns, right edge of the numeric ones. */
	static const double col[] = { 40, 128, 162, 192, 222, 278, 334, 392, 428, 486, 494 };
	enum { NC = 11 };
	const struct sd_audit *a = in->audit;
	char buf[300];
	double y = 50;
	int lvl = (int)lround(a->level * 100);

	cairo_set_source_rgb(cr, INK);
	text(cr, 40, y, 16, 1, 0, in->prog->name);
	y += 16;
	snprintf(buf, sizeof buf, "%s%s%s; %d days, %d hard sets a week; %s, %g-week block; profile %s",
		 in->athlete ? in->athlete : "", in->athlete ? " - " : "", in->label, in->prog->ndays,
		 a->vol.hard_sets, a->cov.trained >= 0.5 ? "trained" : "untrained", a->cov.weeks,
		 in->prof->name);
	y = para(cr, 40, y, w - 80, 9, buf) + 8;
	for (int i = 0; i < NC; i++)
		text(cr, col[i], y, 7.5, 1, i == 0 || i == NC - 1 ? 0 : 1, heads[i]);
	y += 4;
	cairo_set_line_width(cr, 0.5);
	cairo_move_to(cr, 40, y);
	cairo_line_to(cr, w - 40, y);
	cairo_stroke(cr);
	y += 11;
	for (int m = 0; m < SD_NMUSCLES; m++) {
		const struct sd_audit_row *r = &a->row[m];
		char cells[NC][48];
		snprintf(cells[0], 48, "%s", muscle_name(m));
		snprintf(cells[1], 48, "%g", r->dose.direct);
		snprintf(cells[2], 48, "%g", r->dose.indirect);
		snprintf(cells[3], 48, "%.1f", r->dose.fractional);
		snprintf(cells[4], 48, "%.1f", curve_pct(r->pt.y));
		snprintf(cells[5], 48, "%.1f to %.1f", curve_pct(r->pt.ci_lo), curve_pct(r->pt.ci_hi));
		snprintf(cells[6], 48, "%.1f to %.1f", curve_pct(r->pt.group_lo), curve_pct(r->pt.group_hi));
		snprintf(cells[7], 48, "%.1f to %.1f", curve_pct(r->pt.ath_lo), curve_pct(r->pt.ath_hi));
		snprintf(cells[8], 48, "%.2f", r->plus1.pct);
		snprintf(cells[9], 48, "%.2f to %.2f", r->plus1.lo, r->plus1.hi);
		snprintf(cells[10], 48, "%s", zone_name(r->zone));
		for (int i = 0; i < NC; i++)
			text(cr, col[i], y, 7.5, 0, i == 0 || i == NC - 1 ? 0 : 1, cells[i]);
		y += 11;
	}
	y += 4;
	snprintf(buf, sizeof buf, "%d%% intervals. %s. +1 set: percentage points one more weekly "
		 "set adds on the average curve.", lvl, aout_bands_legend);
	y = para(cr, 40, y + 6, w - 80, 7.5, buf);
	struct sd_chart c = { in->prof, a->cov, a->level, a, "The curve and this program's muscles" };
	cairo_save(cr);
	cairo_translate(cr, 20, y);
	cairo_scale(cr, (w - 40) / 900.0, (w - 40) / 900.0);
	draw_chart(cr, &c, 0, 0, 900, 520);
	cairo_restore(cr);
	y += 520 * (w - 40) / 900.0 + 10;
	cairo_set_source_rgb(cr, INK);
	for (int i = 0; i < a->nwarn && y < 770; i++)
		y = para(cr, 40, y, w - 80, 8.5, a->warn[i].text);
	profile_oneline(in->prof, buf, sizeof buf);
	para(cr, 40, 788, w - 80, 8, buf);
	para(cr, 40, 802, w - 80, 8, aout_caution);
}

static int mod_report_write(const char *name, const struct sd_audit_info *in, int n, chart_sink_fn sink,
		 void *closure, struct sd_err *e)
{
	double w = 595.276, h = 841.89;  /* A4 in points */
	struct stream out = { sink, closure, 0 };
	cairo_surface_t *s;
	cairo_t *cr;

	if (chart_format(name) != FMT_PDF)
		return sd_usage(e, "the report is a PDF: name it .pdf, not '%s'", name);
	if (start(FMT_PDF, name, &out, w, h, &s, e))
		return -1;
	cr = cairo_create(s);
	for (int i = 0; i < n; i++) {
		cairo_set_source_rgb(cr, 1, 1, 1);
		cairo_paint(cr);
		report_page(cr, &in[i], w);
		cairo_show_page(cr);
	}
	return finish(s, cr, name, FMT_PDF, &out, e);
}

/* The module's one exported symbol (chart_mod.h). */
const struct sd_chart_api sd_chart_api = {
	SD_CHART_API_VERSION, mod_chart_write, mod_report_write,
};
