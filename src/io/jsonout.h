/* Small cJSON helpers shared by the JSON writers in src/io (cJSON stays inside io/). */
#ifndef SD_JSONOUT_H
#define SD_JSONOUT_H

#include <stdio.h>

#include <cjson/cJSON.h>

#include "../core/curve.h"

/* Adds a number rounded to `digits` decimals, so output is stable across platforms'
 * last-digit noise. */
void json_num(cJSON *o, const char *key, double v, int digits);
/* Adds a number to 10 significant digits (statistics whose scale varies: estimates, variances,
 * p-values), or null when it is not finite. */
void json_sig(cJSON *o, const char *key, double v);
/* Adds "profile": {"name", "basis", "summary"}: what the numbers come from. */
void json_profile(cJSON *o, const struct sd_profile *p);
/* The same object as text (malloc'd), for writers that assemble JSON from pieces. */
char *json_profile_text(const struct sd_profile *p);
/* Adds the three intervals of a point in percent under their names ("curve_low",
 * "curve_high", "group_low", "group_high", "athlete_low", "athlete_high") and
 * "beyond_evidence": the list of values outside the evidence (empty when none). */
void json_bands(cJSON *o, const struct sd_point *pt, int digits);
/* Adds "evidence": the profile's ranges, {"dose": {"low", "high"}, "weeks": {"low", "high",
 * "value", "used", "beyond"}, ...}, with the context's value of each moderator it carries. */
void json_evidence(cJSON *o, const struct sd_profile *p, const struct sd_covars *c);
/* Adds "beyond_evidence": ["dose", "weeks", ...] for SD_BEYOND_* bits. */
void json_beyond(cJSON *o, unsigned bits);

/* Adds a muscle's audit row: fractional, max_per_session, sessions, lnrr, gain_pct, the three
 * bands, plus1_pct/low/high and zone, rounded as every writer rounds them. */
struct sd_audit_row;
void json_audit_row(cJSON *o, const struct sd_audit_row *r);
/* Prints o formatted with a newline and deletes it; 0, or -1 when out of memory. */
int json_emit(FILE *f, cJSON *o);

/* The text of o, formatted or on one line, with every byte that is not valid UTF-8 replaced
 * by U+FFFD: cJSON copies string bytes as given, and a name from a file or the command line
 * may be in any encoding, but JSON output is always valid UTF-8. NULL when out of memory;
 * free() it. */
char *json_print(const cJSON *o, int formatted);

#endif
