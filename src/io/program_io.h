/* Reads program files (INI or CSV, see man/setdose.1 "PROGRAM FILES") into struct sd_program,
 * resolving exercise names against the library. Every error names the file and line. */
#ifndef SD_PROGRAM_IO_H
#define SD_PROGRAM_IO_H

#include <stddef.h>

#include "../core/library.h"
#include "../core/program.h"

/* Reads a file; CSV when the name ends in .csv, INI otherwise. */
int program_load(const char *path, const struct sd_library *lib, struct sd_program *p,
		 struct sd_err *e);
/* Parses program text held in memory; `label` names it in messages (a file name or a stored
 * template's name). */
int program_parse(const char *label, const char *text, size_t len, int is_csv,
		  const struct sd_library *lib, struct sd_program *p, struct sd_err *e);
/* Reads a whole file into a NUL-terminated malloc'd buffer. */
int program_slurp(const char *path, char **text, size_t *len, struct sd_err *e);

#endif
