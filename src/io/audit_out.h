/* Prints audits: a per-program report (table), or rows of a summary table shared by
 * `audit --summary` and `audit --all`, or JSON objects (cJSON stays inside io/). */
#ifndef SD_AUDIT_OUT_H
#define SD_AUDIT_OUT_H

#include <stdio.h>

#include "../core/audit.h"
#include "../core/profile.h"
#include "table.h"

struct sd_audit_info {
	const char *label;          /* file name or stored template name */
	const struct sd_program *prog;
	const struct sd_profile *prof;
	const struct sd_audit *audit;
	const char *athlete;        /* or NULL */
	int overdue_days;           /* with athlete: days an open block ran past its planned end */
};

/* The full report of one audit as aligned text. */
void aout_report(FILE *f, const struct sd_audit_info *in, int color);
/* One CSV block of one audit: a row per muscle, with the program label as first column. */
struct sd_table *aout_muscle_table(int with_label);
int aout_muscle_rows(struct sd_table *t, const struct sd_audit_info *in, int with_label);
/* Summary lines, streamed (10,000 programs must not be held in memory): one line per
 * program (and athlete) and muscle. Widths are fixed up front by the caller. */
struct sd_sumout {
	FILE *f;
	int csv;
	int with_athlete;
	int wa, wp;                 /* athlete and program column widths (table only) */
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
void aout_json_end(FILE *f);

extern const char aout_caution[];
/* The three levels of uncertainty in one sentence, as every output names them (curve, group,
 * athlete), and as three lines for text legends (aout_bands_text prints them). */
extern const char aout_bands_legend[];
extern const char *const aout_band_lines[3];
void aout_bands_text(FILE *f, int level_pct);
/* The profile's provenance in one line (profile_oneline). */
void aout_profile_line(FILE *f, const struct sd_profile *p);

#endif
