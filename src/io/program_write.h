/* Writes a program as an INI program file (see man/setdose.1, PROGRAM FILES) that
 * io/program_io.c reads back to the same days, exercises and sets. */
#ifndef SD_PROGRAM_WRITE_H
#define SD_PROGRAM_WRITE_H

#include <stdio.h>

#include "../core/library.h"
#include "../core/program.h"

/* Writes the program's text; `comment` (may be NULL) becomes leading '; ' lines, one per
 * '\n'-separated line. Returns 0, or -1 when the program cannot be written faithfully (a
 * name the reader would read differently) with e filled. */
int pwrite_ini(FILE *f, const struct sd_program *p, const struct sd_library *lib,
	       const char *comment, struct sd_err *e);
/* Writes to path through io/safefile.h: a failure leaves the old file as it was and no
 * half file; refuses an existing file unless overwrite, and a symbolic link always. */
int pwrite_file(const char *path, const struct sd_program *p, const struct sd_library *lib,
		const char *comment, int overwrite, struct sd_err *e);

#endif
