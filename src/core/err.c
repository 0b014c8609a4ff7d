#include "err.h"

#include <stdio.h>
#include <string.h>

static int vfail(struct sd_err *e, int code, const char *fmt, va_list ap)
{
	if (e) {
		e->code = code;
		vsnprintf(e->msg, sizeof e->msg, fmt, ap);
	}
	return -1;
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
	}
}
