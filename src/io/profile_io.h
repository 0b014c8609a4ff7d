/* Reads and writes dose-response profiles (INI). The format is documented in man/setdose.1
 * (section PROFILE FILES) and profiles/strength.ini is its reference example. */
#ifndef SD_PROFILE_IO_H
#define SD_PROFILE_IO_H

#include <stdio.h>

#include "../core/profile.h"

/* Loads and validates a profile. Errors name the file (and key). */
int profile_load(const char *path, struct sd_profile *p, struct sd_err *e);
/* Writes p in the same format profile_load reads, so a written profile loads back equal. */
int profile_write(FILE *f, const struct sd_profile *p, struct sd_err *e);

#endif
