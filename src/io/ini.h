/* An ordered INI scanner with line numbers, for programs, the exercise library and profiles.
 *
 * iniparser keeps neither the order of sections nor line numbers, drops duplicate keys
 * silently, and loads in quadratic time; programs need all four, profiles the line numbers
 * and the duplicates, and the library is read on every run. Syntax: `[section]`,
 * `key = value`, comments from ';' or '#' (at the start of a line, or after a value), blank
 * lines. Keys and sections keep their case. */
#ifndef SD_INI_H
#define SD_INI_H

#include <stddef.h>

#include "../core/err.h"

struct sd_ini_item {
	const char *section;   /* NULL before the first section */
	const char *key;       /* NULL for a section header */
	const char *value;
	int line;
	const char *error;     /* ini_scan_all only: the line is malformed, this says how (key NULL) */
};

/* Called once per section header (key NULL) and once per key; a non-zero return stops the
 * scan and is returned (the callback fills e). */
typedef int (*sd_ini_fn)(const struct sd_ini_item *it, void *arg, struct sd_err *e);

/* Scans text in place (it is modified). Messages read "cannot read WHAT 'LABEL' line N: ...",
 * e.g. what = "program", label = the file name. */
int ini_scan(const char *what, const char *label, char *text, sd_ini_fn fn, void *arg,
	     struct sd_err *e);

/* Like ini_scan, but a malformed line is passed to fn as an item with `error` set instead of
 * stopping the scan, so a caller can report every bad line in one run; the keys under a
 * malformed section header are skipped. */
int ini_scan_all(char *text, sd_ini_fn fn, void *arg, struct sd_err *e);

/* Line (from 1) of the first NUL byte in text[0..len), or 0 when there is none. */
int ini_nul_line(const char *text, size_t len);

/* Reads a whole file into a NUL-terminated malloc'd buffer; messages say "cannot read WHAT". */
int ini_slurp(const char *what, const char *path, char **text, size_t *len, struct sd_err *e);

#endif
