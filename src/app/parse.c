/* Values typed by a user (options, form fields): whole numbers, numbers, dates, names. Every
 * bad value is a usage error naming what was being read. */
#include "parse.h"

#include <errno.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>

#include "../core/text.h"

int app_today(char *buf, struct sd_err *e)
{
	const char *env = getenv("SETDOSE_TODAY");
	time_t now = time(NULL);
	struct tm tm;

	if (env && *env)
		return app_date("SETDOSE_TODAY", env, buf, e);
	if (!localtime_r(&now, &tm))
		return sd_fail(e, "cannot read today's date");
	snprintf(buf, DATE_LEN, "%04d-%02d-%02d", (tm.tm_year + 1900) % 10000, tm.tm_mon + 1,
		 tm.tm_mday);
	return 0;
}

int app_date(const char *what, const char *s, char *buf, struct sd_err *e)
{
	long d;

	if (date_parse(s, &d, e))
		return sd_wrap(e, "%s", what);
	date_format(d, buf);
	return 0;
}

int app_int(const char *what, const char *s, long long lo, long long hi, long long *out,
	    struct sd_err *e)
{
	char *end;
	long long v;

	errno = 0;
	v = strtoll(s, &end, 10);
	if (end == s || *end || errno || v < lo || v > hi)
		return sd_usage(e, "%s wants a whole number from %lld to %lld, not '%s'", what, lo,
				hi, s);
	*out = v;
	return 0;
}

int app_num(const char *what, const char *s, double lo, double hi, double *out,
	    struct sd_err *e)
{
	char *end;
	double v;

	errno = 0;
	v = strtod(s, &end);
	if (end == s || *end || errno || !(v >= lo && v <= hi))
		return sd_usage(e, "%s wants a number from %g to %g, not '%s'", what, lo, hi, s);
	*out = v;
	return 0;
}

int app_name(const char *what, const char *s, size_t max, struct sd_err *e)
{
	size_t n = strlen(s);
	char label[64];

	if (!n)
		return sd_usage(e, "%s name is empty", what);
	if (n >= max)
		return sd_usage(e, "%s name '%.20s...' is too long (at most %zu bytes)", what, s,
				max - 1);
	if (s[0] == ' ' || s[n - 1] == ' ')
		return sd_usage(e, "%s name '%s' starts or ends with a space", what, s);
	snprintf(label, sizeof label, "%s name", what);
	if (text_check(label, s, n, e)) {
		e->code = SD_EXIT_USAGE;
		return -1;
	}
	return 0;
}
