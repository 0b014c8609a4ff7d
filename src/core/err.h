/* One error convention for the whole program.
 *
 * Functions that can fail return 0 on success and -1 on failure, after filling
 * a struct sd_err with one lowercase line (no "setdose:" prefix, no newline).
 * Only main.c prints it and exits. `code` is the exit status main uses:
 * SD_EXIT_FAIL for bad data or a failed operation, SD_EXIT_USAGE for a command
 * line the user must fix. */
#ifndef SD_ERR_H
#define SD_ERR_H

#include <stdarg.h>

enum { SD_EXIT_OK = 0, SD_EXIT_FAIL = 1, SD_EXIT_USAGE = 2 };

struct sd_err {
	int code;       /* SD_EXIT_FAIL or SD_EXIT_USAGE once set */
	char msg[512];
};

/* Fills e (if not NULL) with a failure message; returns -1 so callers can `return sd_fail(...)`. */
int sd_fail(struct sd_err *e, const char *fmt, ...) __attribute__((format(printf, 2, 3)));
/* Same, but marks the error as a usage error (exit status 2). */
int sd_usage(struct sd_err *e, const char *fmt, ...) __attribute__((format(printf, 2, 3)));
/* Prefixes an existing message: "PREFIX: old message". Returns -1. */
int sd_wrap(struct sd_err *e, const char *fmt, ...) __attribute__((format(printf, 2, 3)));
/* Clears e. */
void sd_err_clear(struct sd_err *e);

#endif
