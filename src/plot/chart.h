/* Charts and the printable report, drawn with cairo. The output format follows the file name's
 * extension: .png, .svg or .pdf. cairo types stay inside src/plot/.
 *
 * The picture goes to a sink the caller owns (io/safefile.h's sf_sink: a temporary file put
 * in place only once complete); this module never opens a file. A failed write is an error
 * even where cairo would not report it. */
#ifndef SD_CHART_H
#define SD_CHART_H

#include "../io/audit_out.h"

/* The curve with its confidence and prediction bands, the practical plateau and the end of the
 * evidence; with an audit, its muscles marked at their doses. */
struct sd_chart {
	const struct sd_profile *prof;
	struct sd_covars cov;
	double level;
	const struct sd_audit *audit;   /* or NULL */
	const char *title;
};

/* Receives the bytes of the picture: 0, or -1 when they could not be written. */
typedef int (*chart_sink_fn)(void *closure, const unsigned char *data, unsigned int len);

/* Draws the chart in the format `name`'s extension picks, into sink. */
int chart_write(const char *name, const struct sd_chart *c, chart_sink_fn sink, void *closure,
		struct sd_err *e);
/* One page per audit: header, per-muscle table, the chart, warnings and the caution.
 * PDF only (a printable document). */
int report_write(const char *name, const struct sd_audit_info *in, int n, chart_sink_fn sink,
		 void *closure, struct sd_err *e);
/* 1 when the name ends in an extension chart_write supports. */
int chart_format_ok(const char *path);

#endif
