/* Values typed by a user, on the command line or in a form of the interface: the same checks
 * and the same messages in both. Bad values are usage errors naming what was read. */
#ifndef SD_APP_PARSE_H
#define SD_APP_PARSE_H

#include <stddef.h>

#include "../core/date.h"
#include "../core/err.h"

/* Today's local date as YYYY-MM-DD (SETDOSE_TODAY overrides it, for reproducible runs). */
int app_today(char *buf, struct sd_err *e);
/* Checks a date given as `what` and copies it (normalised) into buf (DATE_LEN bytes). */
int app_date(const char *what, const char *s, char *buf, struct sd_err *e);
/* Parses a whole number in [lo, hi] given as `what`. */
int app_int(const char *what, const char *s, long long lo, long long hi, long long *out,
	    struct sd_err *e);
/* Parses a finite number in [lo, hi] given as `what`. */
int app_num(const char *what, const char *s, double lo, double hi, double *out,
	    struct sd_err *e);
/* Checks a name for an athlete or program: 1..max-1 bytes, text core/text.h accepts (valid
 * UTF-8, no control or bidirectional control characters), no leading or trailing space. */
int app_name(const char *what, const char *s, size_t max, struct sd_err *e);

#endif
