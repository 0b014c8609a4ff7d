/* The chart backend is a loadable module (lib/setdose/chart.so, built from chart*.c): cairo,
 * fontconfig, freetype, pixman, libpng and the X11 client libraries are mapped only by the
 * commands that draw, so every other command starts with a third of the shared libraries.
 * chart.h's chart_write and report_write load it on first use (chart_load.c). */
#ifndef SD_CHART_MOD_H
#define SD_CHART_MOD_H

#include "chart.h"

/* Bumped whenever struct sd_chart, sd_report, sd_audit_info or this table changes shape, so a
 * module left over from another build is refused instead of misread. */
#define SD_CHART_API_VERSION 2

struct sd_chart_api {
	int version;
	int (*chart_write)(const char *name, const struct sd_chart *c, chart_sink_fn sink,
			   void *closure, struct sd_err *e);
	int (*report_write)(const char *name, const struct sd_report *r, chart_sink_fn sink,
			    void *closure, struct sd_err *e);
};

extern const struct sd_chart_api sd_chart_api;

enum chart_fmt { FMT_NONE, FMT_PNG, FMT_SVG, FMT_PDF };
/* The format a file name's extension asks for. */
enum chart_fmt chart_format(const char *path);

#endif
