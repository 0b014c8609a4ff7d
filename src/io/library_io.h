/* Loads the exercise library: the bundled profiles/exercises.ini, then the user's
 * $XDG_CONFIG_HOME/setdose/exercises.ini (if present), then an --exercises file; later files
 * add exercises or replace ones with the same name. */
#ifndef SD_LIBRARY_IO_H
#define SD_LIBRARY_IO_H

#include "../core/library.h"

/* Loads one INI file into lib (adding/replacing). */
int library_load_file(const char *path, struct sd_library *lib, struct sd_err *e);
/* Loads the bundled file from datadir, the user's file, then `extra` (may be NULL). */
int library_load_all(const char *datadir, const char *extra, struct sd_library *lib,
		     struct sd_err *e);

#endif
