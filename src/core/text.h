/* Text setdose stores and shows: names, notes and labels.
 *
 * A name must be valid UTF-8 (no overlong forms, no UTF-16 surrogates, nothing past U+10FFFF),
 * without control characters (C0, DEL, C1) and without the bidirectional embedding, override
 * and isolate characters (U+202A to U+202E, U+2066 to U+2069), which make a name display as
 * a different one (Unicode Standard Annex #9 lists them). */
#ifndef SD_TEXT_H
#define SD_TEXT_H

#include <stddef.h>

#include "err.h"

/* 0 when the n bytes at s are such text; else -1 with e reading "WHAT has PROBLEM at byte
 * N" (N counted from 0). */
int text_check(const char *what, const char *s, size_t n, struct sd_err *e);
/* Length of the valid UTF-8 sequence at s (n bytes left), or 0 when it is not one. */
size_t text_utf8_len(const unsigned char *s, size_t n);
/* A malloc'd copy of the NUL-terminated s with every byte that does not start a valid UTF-8
 * sequence replaced by U+FFFD, so the result is always valid UTF-8; NULL when out of memory. */
char *text_repair(const char *s);

/* Cuts spaces, tabs and carriage returns from both ends of s in place; returns the first
 * character kept. */
char *text_trim(char *s);

#endif
