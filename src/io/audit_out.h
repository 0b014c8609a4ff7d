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
};

/* The full report of one audit as aligned text. */
void aout_report(FILE *f, const struct sd_audit_info *in, int color);
/* One CSV block of one audit: a row per muscle, with the program label as first column. */
struct sd_table *aout_muscle_table(int with_label);
int aout_muscle_rows(struct sd_table *t, const struct sd_audit_info *in, int with_label);
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
	int with_done;              /* a "done" column after fractional (audit --all) */
	const struct aout_done *done;  /* the current rows' logged dose; NULL or not logged: empty */
};
void aout_sum_head(const struct sd_sumout *o);
void aout_sum_rows(const struct sd_sumout *o, const struct sd_audit_info *in);

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
/* The profile's provenance in one line (profile_oneline). */
void aout_profile_line(FILE *f, const struct sd_profile *p);

#endif
