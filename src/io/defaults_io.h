/* The user's defaults file: $XDG_CONFIG_HOME/setdose/defaults.ini (else
 * ~/.config/setdose/defaults.ini), lines `key = value` naming global options without their
 * dashes (units, max-rir, status, weeks, db, profile, exercises, level, swc, format). main.c
 * applies them through the global option table before the command line, which overrides them.
 * A file that is not there is no error. */
#ifndef SD_DEFAULTS_IO_H
#define SD_DEFAULTS_IO_H

#include <stddef.h>

#include "../core/err.h"

/* Called once per setting: its key, value (a leading "~/" expanded) and line. */
typedef int (*defaults_fn)(const char *key, const char *value, int line, void *arg,
			   struct sd_err *e);

/* The file's path into buf; NULL when neither XDG_CONFIG_HOME nor HOME is set. */
const char *defaults_path(char *buf, size_t n);
/* Reads the file at path and calls fn for each setting. *keep gets the buffer the values point
 * into (free it after the run; NULL when there was no file). */
int defaults_read(const char *path, defaults_fn fn, void *arg, char **keep, struct sd_err *e);

#endif
