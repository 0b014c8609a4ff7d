/* Prints audits: a per-program report (table), or rows of a summary table shared by
 * `audit --summary` and `audit --all`, or JSON objects (cJSON stays inside io/). */
#ifndef SD_AUDIT_OUT_H
#define SD_AUDIT_OUT_H

#include <stdio.h>

#include "../core/audit.h"
#include "../core/library.h"
#include "../core/profile.h"
#include "table.h"

struct sd_audit_info {
	const char *label;          /* file name or stored template name */
	const struct sd_program *prog;
	const struct sd_profile *prof;
	const struct sd_audit *audit;
	const char *athlete;        /* or NULL */
	int overdue_days;           /* with athlete: days an open block ran past its planned end */
	int wide;                   /* table output with every column (--wide) */
	const struct sd_library *lib;  /* for by_exercise: the exercises' names */
	int by_exercise;            /* where each muscle's sets come from (--by-exercise) */
};

/* The full report of one audit as aligned text; prose wrapped to the output's width. */
void aout_report(FILE *f, const struct sd_audit_info *in, int color);
/* One CSV block of one audit: a row per muscle, with the program label as first column. */
struct sd_table *aout_muscle_table(int with_label);
int aout_muscle_rows(struct sd_table *t, const struct sd_audit_info *in, int with_label);
/* The same for --by-exercise: a row per muscle and exercise (program, muscle, exercise, direct,
 * indirect, fractional), the muscles in their usual order, the largest share first. */
struct sd_table *aout_source_table(void);
int aout_source_rows(struct sd_table *t, const struct sd_audit_info *in);

/* The curve's columns as every table shows them: gain%, the three intervals, +1 set with its
 * interval. The narrow table keeps gain%, the curve and athlete intervals and +1set%; the
 * group interval and the +1 set interval are --wide, CSV and JSON only. A table of `key`
 * (the first column) and these, and a trailing zone column when with_zone. */
struct sd_table *aout_gain_table(const char *key, int with_zone);
/* Sets the gain columns of the current row from column c; returns the next column. precise:
 * the digits of CSV (3 for percents, 4 for +1 set), else those of the table (1 and 2). */
int aout_gain_cells(struct sd_table *t, int c, const struct sd_point *pt,
		    const struct sd_plus1 *p1, int precise);
/* Summary lines, streamed (10,000 programs must not be held in memory): one line per
 * program (and athlete) and muscle. Widths are fixed up front by the caller. */
/* What an athlete logged in a block (cmd/logdata.h): the average weekly dose per muscle over
 * the block's span so far. */
struct aout_done {
	int logged;                 /* 0: nothing logged in the span (done is all 0) */
	double dose[SD_NMUSCLES];
	char from[11], to[11];      /* the span, YYYY-MM-DD */
	double weeks;
	int days;                   /* days with a logged hard set */
};

struct sd_sumout {
	FILE *f;
	int csv;
	int with_athlete;
	int wa, wp;                 /* athlete and program column widths (table only) */
	int with_done;              /* a "done" column: after the athlete (table), last (CSV) */
	const struct aout_done *done;  /* the current rows' logged dose; NULL or not logged: empty */
};
void aout_sum_head(const struct sd_sumout *o);
/* One audit's summary rows; 0, or -1 when out of memory. */
int aout_sum_rows(const struct sd_sumout *o, const struct sd_audit_info *in);
/* The same in two steps, for printing one audit's rows for many athletes: the rows' text after
 * the athlete column, formatted once (free with aout_sum_free), then printed per athlete. */
struct sd_sumrows {
	char *text;
};
int aout_sum_format(const struct sd_sumout *o, const struct sd_audit_info *in,
		    struct sd_sumrows *r);
void aout_sum_print(const struct sd_sumout *o, const struct sd_audit_info *in,
		    const struct sd_sumrows *r);
void aout_sum_free(struct sd_sumrows *r);

/* JSON, streamed: begin prints '{"audits": [', item one audit object, end the caution and the
 * closing brackets. */
void aout_json_begin(FILE *f);
int aout_json_item(FILE *f, const struct sd_audit_info *in, int first);
/* The same with the block's logged dose as "logged" (null when nothing was logged). */
int aout_json_item_done(FILE *f, const struct sd_audit_info *in, const struct aout_done *done,
			int first);
void aout_json_end(FILE *f);

extern const char aout_caution[];
/* The three levels of uncertainty in one sentence, as every output names them (curve, group,
 * athlete), and as three lines for text legends (aout_bands_text prints them). */
extern const char aout_bands_legend[];
extern const char *const aout_band_lines[3];
void aout_bands_text(FILE *f, int level_pct);
/* The line under tables that show +1 set. */
void aout_plus1_text(FILE *f);
/* The profile's provenance (profile_oneline), wrapped. */
void aout_profile_line(FILE *f, const struct sd_profile *p);
/* The caution, wrapped to the output's width. */
void aout_caution_text(FILE *f);

#endif
