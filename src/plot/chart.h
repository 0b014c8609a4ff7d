/* Charts and the printable report, drawn with cairo. The output format follows the file name's
 * extension: .png, .svg or .pdf. cairo types stay inside src/plot/. */
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

int chart_write(const char *path, const struct sd_chart *c, struct sd_err *e);
/* One page per audit: header, per-muscle table, the chart, warnings and the caution.
 * PDF only (a printable document). */
int report_write(const char *path, const struct sd_audit_info *in, int n, struct sd_err *e);
/* 1 when the name ends in an extension chart_write supports. */
int chart_format_ok(const char *path);

#endif
