#include "err.h"

#include <stdio.h>
#include <string.h>

static int vfail(struct sd_err *e, int code, const char *fmt, va_list ap)
{
	if (e) {
		e->code = code;
		vsnprintf(e->msg, sizeof e->msg, fmt, ap);
		e->nmore = 0;
		e->more[0] = '\0';
	}
	return -1;
}

int sd_more(struct sd_err *e, const char *fmt, ...)
{
	char line[sizeof e->msg];
	va_list ap;

	if (!e)
		return -1;
	va_start(ap, fmt);
	vsnprintf(line, sizeof line, fmt, ap);
	va_end(ap);
	size_t used = strlen(e->more), n = strlen(line);
	/* A line that does not fit whole is counted, not cut: main says how many were left out. */
	if (e->nmore == sd_more_shown(e) && used + n + 2 <= sizeof e->more) {
		memcpy(e->more + used, line, n);
		e->more[used + n] = '\n';
		e->more[used + n + 1] = '\0';
	}
	e->nmore++;
	if (!e->code)
		e->code = SD_EXIT_FAIL;
	return -1;
}

int sd_more_shown(const struct sd_err *e)
{
	int n = 0;
	for (const char *s = e->more; *s; s++)
		n += *s == '\n';
	return n;
}

int sd_fail(struct sd_err *e, const char *fmt, ...)
{
	va_list ap;
	va_start(ap, fmt);
	vfail(e, SD_EXIT_FAIL, fmt, ap);
	va_end(ap);
	return -1;
}

int sd_usage(struct sd_err *e, const char *fmt, ...)
{
	va_list ap;
	va_start(ap, fmt);
	vfail(e, SD_EXIT_USAGE, fmt, ap);
	va_end(ap);
	return -1;
}

int sd_wrap(struct sd_err *e, const char *fmt, ...)
{
	char prefix[256], old[sizeof e->msg];
	va_list ap;

	if (!e)
		return -1;
	va_start(ap, fmt);
	vsnprintf(prefix, sizeof prefix, fmt, ap);
	va_end(ap);
	memcpy(old, e->msg, sizeof old);
	snprintf(e->msg, sizeof e->msg, "%s: %s", prefix, old);
	if (!e->code)
		e->code = SD_EXIT_FAIL;
	return -1;
}

void sd_err_clear(struct sd_err *e)
{
	if (e) {
		e->code = 0;
		e->msg[0] = '\0';
		e->nmore = 0;
		e->more[0] = '\0';
	}
}
