/* The chart module's entry points (chart_mod.h): a surface in the asked format, one chart or
 * the report drawn on it, the bytes streamed to the caller's sink. */
#include "chart.h"
#include "chart_mod.h"

#include <math.h>
#include <stdio.h>
#include <string.h>
#include <strings.h>

#include <cairo-pdf.h>
#include <cairo-svg.h>
#include <fontconfig/fontconfig.h>

#include "chart_int.h"

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

/* PNG draws two pixels a point, so a chart printed at A4 width stays sharp. */
#define PNG_SCALE 2.0

static cairo_surface_t *surface(enum chart_fmt fmt, struct stream *out, double w, double h)
{
	switch (fmt) {
	case FMT_PNG: return cairo_image_surface_create(CAIRO_FORMAT_RGB24, (int)ceil(w * PNG_SCALE),
							 (int)ceil(h * PNG_SCALE));
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

#define PAGE_W 595.0
#define MARGIN 24.0

/* The height a chart of kind k takes at the page's width, before its footer. */
static double chart_height(const struct sd_chart *c, double w)
{
	switch (c->kind) {
	case CHART_MUSCLES: return ch_muscles_height(c, w);
	case CHART_COMPARE: return ch_compare_height(c, w);
	case CHART_RETURNS: return ch_returns_height(c, w);
	default: return 400;
	}
}

static void draw_kind(struct cdraw *d, const struct sd_chart *c, struct rect r)
{
	switch (c->kind) {
	case CHART_MUSCLES: ch_draw_muscles(d, c, r); break;
	case CHART_COMPARE: ch_draw_compare(d, c, r); break;
	case CHART_RETURNS: ch_draw_returns(d, c, r); break;
	default: ch_draw_curve(d, c, r); break;
	}
}

static int mod_chart_write(const char *name, const struct sd_chart *c, chart_sink_fn sink,
			   void *closure, struct sd_err *e)
{
	enum chart_fmt fmt = chart_format(name);
	char prov[300];
	struct stream out = { sink, closure, 0 };
	struct cdraw d = { NULL, c->layout, fmt == FMT_PNG ? PNG_SCALE : 1.0, 0, 0 };
	cairo_surface_t *s, *probe;
	double w = PAGE_W, body, foot, h;

	if (fmt == FMT_NONE)
		return sd_usage(e, "cannot tell the chart format of '%s': name it .png, .svg or .pdf", name);
	if (c->kind == CHART_COMPARE && (!c->audit || !c->other))
		return sd_usage(e, "the compare chart needs two programs");
	if ((c->kind == CHART_MUSCLES) && !c->audit)
		return sd_usage(e, "the %s chart needs a program", chart_kind_name(c->kind));
	/* The footer's height depends on how its lines wrap: measure on a scratch surface. */
	profile_oneline(c->prof, prov, sizeof prov);
	probe = cairo_image_surface_create(CAIRO_FORMAT_RGB24, 1, 1);
	d.cr = cairo_create(probe);
	d.lay = NULL;
	foot = ch_para(&d, 0, 0, w - 2 * MARGIN, 8, 0, prov, 1);
	foot = ch_para(&d, 0, foot + 2, w - 2 * MARGIN, 8, 0, aout_caution, 1);
	cairo_destroy(d.cr);
	cairo_surface_destroy(probe);
	body = chart_height(c, w - 2 * MARGIN);
	h = MARGIN + body + 10 + foot + MARGIN / 2;

	if (start(fmt, name, &out, w, h, &s, e))
		return -1;
	d.cr = cairo_create(s);
	d.lay = c->layout;
	if (fmt == FMT_PNG)
		cairo_scale(d.cr, PNG_SCALE, PNG_SCALE);
	cairo_set_source_rgb(d.cr, 1, 1, 1);
	cairo_paint(d.cr);
	draw_kind(&d, c, (struct rect){ MARGIN, MARGIN, w - 2 * MARGIN, body });
	ch_col(d.cr, PAL_MUTED);
	double y = MARGIN + body + 10 + 8;
	y = ch_para(&d, MARGIN, y, w - 2 * MARGIN, 8, 0, prov, 0);
	ch_para(&d, MARGIN, y + 2, w - 2 * MARGIN, 8, 0, aout_caution, 0);
	if (c->layout) {
		c->layout->page_w = w;
		c->layout->page_h = h;
		c->layout->pages = 1;
	}
	return finish(s, d.cr, name, fmt, &out, e);
}

static int mod_report_write(const char *name, const struct sd_report *r, chart_sink_fn sink,
			    void *closure, struct sd_err *e)
{
	struct stream out = { sink, closure, 0 };
	struct cdraw d = { NULL, r->layout, 1.0, 0, 0 };
	cairo_surface_t *s;

	if (chart_format(name) != FMT_PDF)
		return sd_usage(e, "the report is a PDF: name it .pdf, not '%s'", name);
	if (start(FMT_PDF, name, &out, 595.276, 841.89, &s, e))
		return -1;
	d.cr = cairo_create(s);
	ch_report_draw(s, &d, r);
	return finish(s, d.cr, name, FMT_PDF, &out, e);
}

/* The module's one exported symbol (chart_mod.h). */
const struct sd_chart_api sd_chart_api = {
	SD_CHART_API_VERSION, mod_chart_write, mod_report_write,
};
