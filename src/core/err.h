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
	/* An input checked as a whole (a program, a library file) reports every problem in one
	 * run: msg holds the first, `more` the others, one complete '\n'-terminated message per
	 * line, and `nmore` counts them all, including any that did not fit in `more`. main
	 * prints each line of `more` after msg, like msg. Empty for every other error. */
	int nmore;
	char more[4096];
};

/* Fills e (if not NULL) with a failure message; returns -1 so callers can `return sd_fail(...)`. */
int sd_fail(struct sd_err *e, const char *fmt, ...) __attribute__((format(printf, 2, 3)));
/* Same, but marks the error as a usage error (exit status 2). */
int sd_usage(struct sd_err *e, const char *fmt, ...) __attribute__((format(printf, 2, 3)));
/* Adds one more error after msg (see `more`); returns -1. */
int sd_more(struct sd_err *e, const char *fmt, ...) __attribute__((format(printf, 2, 3)));
/* How many of the nmore further errors `more` holds (the rest were counted only). */
int sd_more_shown(const struct sd_err *e);
/* Prefixes an existing message: "PREFIX: old message". Returns -1. */
int sd_wrap(struct sd_err *e, const char *fmt, ...) __attribute__((format(printf, 2, 3)));
/* Clears e. */
void sd_err_clear(struct sd_err *e);

#endif
