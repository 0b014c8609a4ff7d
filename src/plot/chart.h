/* Charts and the printable report, drawn with cairo. The output format follows the file name's
 * extension: .png, .svg or .pdf. cairo types stay inside src/plot/.
 *
 * The picture goes to a sink the caller owns (io/safefile.h's sf_sink: a temporary file put
 * in place only once complete); this module never opens a file. A failed write is an error
 * even where cairo would not report it.
 *
 * Sizes are in points as printed on A4 (a chart is 595 points wide, the width of the page), so
 * "at least 8 pt at A4" is a plain number; PNG draws 2 pixels a point. */
#ifndef SD_CHART_H
#define SD_CHART_H

#include "../io/audit_out.h"

enum chart_kind {
	CHART_CURVE,     /* the curve, its three bands, the plateau; an audit's muscles marked */
	CHART_MUSCLES,   /* one row per muscle: its dose on a shared axis, zones, athlete band */
	CHART_COMPARE,   /* per muscle, B - A in predicted gain with its interval against +-SWC */
	CHART_RETURNS,   /* the returns grid: gain from a to b weekly sets, as a heat map */
	CHART_NKINDS
};

/* What the layout placed, for tests (SETDOSE_TEST_LAYOUT): label boxes, marks, every text
 * with its size, and per page the extent of its content. Units: points at A4. */
enum chart_box_kind { BOX_LABEL, BOX_MARK, BOX_OBSTACLE, BOX_TEXT, BOX_CONTENT, BOX_NKINDS };
struct chart_box {
	int page, group;            /* group: one chart; labels must not meet within a group */
	enum chart_box_kind kind;
	double x, y, w, h, size;    /* size: font size of a text */
	char text[40];
};
struct chart_layout {
	struct chart_box *box;      /* the caller's array of cap boxes */
	int n, cap, dropped;        /* dropped: boxes past cap */
	double page_w, page_h;      /* of the last page drawn */
	int pages;
};

struct sd_chart {
	enum chart_kind kind;
	const struct sd_profile *prof;
	struct sd_covars cov;
	double level;
	const struct sd_audit *audit;   /* CURVE: or NULL; MUSCLES, COMPARE: program (A) */
	const struct sd_audit *other;   /* COMPARE: program B */
	const char *title;              /* CURVE, MUSCLES: the program's name, or NULL */
	const char *name_a, *name_b;    /* COMPARE: the two programs' names */
	const double *doses;            /* RETURNS: increasing weekly doses, or NULL for a default */
	int ndoses;
	struct chart_layout *layout;    /* or NULL */
	int bare;                       /* 1: no title and context lines (a report page has them) */
};

/* One section of the report: a program audited for an athlete (or none), with the block it
 * belongs to when it comes from the store. */
struct sd_report_item {
	struct sd_audit_info info;      /* info.label: the template's name; info.athlete or NULL */
	const struct sd_library *lib;   /* names the exercises of the breakdown */
	const char *block;              /* e.g. "block 4, from 2026-09-07, 8 weeks (open)", or NULL */
};
struct sd_report {
	const char *date;               /* the report's date, YYYY-MM-DD */
	const char *title;              /* of the contents page, e.g. the roster's name */
	const struct sd_report_item *item;
	int n;
	int contents;                   /* 1: a contents page first (a roster) */
	struct chart_layout *layout;    /* or NULL */
};

/* Receives the bytes of the picture: 0, or -1 when they could not be written. */
typedef int (*chart_sink_fn)(void *closure, const unsigned char *data, unsigned int len);

/* Draws the chart in the format `name`'s extension picks, into sink. */
int chart_write(const char *name, const struct sd_chart *c, chart_sink_fn sink, void *closure,
		struct sd_err *e);
/* The report: per item, page one (header, the per-muscle chart, the table, three findings),
 * then where the sets come from, the per-session warnings, the curve, the profile's
 * provenance and the caution. PDF only (a printable document). */
int report_write(const char *name, const struct sd_report *r, chart_sink_fn sink, void *closure,
		 struct sd_err *e);
/* 1 when the name ends in an extension chart_write supports. */
int chart_format_ok(const char *path);
/* The kind by name ("curve", "muscles", "compare", "returns"), -1 if unknown; and its name. */
int chart_kind_find(const char *name);
const char *chart_kind_name(enum chart_kind k);

#endif
