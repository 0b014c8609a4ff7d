/* Small cJSON helpers shared by the JSON writers in src/io (cJSON stays inside io/). */
#ifndef SD_JSONOUT_H
#define SD_JSONOUT_H

#include <cjson/cJSON.h>

/* Adds a number rounded to `digits` decimals, so output is stable across platforms'
 * last-digit noise. */
void json_num(cJSON *o, const char *key, double v, int digits);

/* The text of o, formatted or on one line, with every byte that is not valid UTF-8 replaced
 * by U+FFFD: cJSON copies string bytes as given, and a name from a file or the command line
 * may be in any encoding, but JSON output is always valid UTF-8. NULL when out of memory;
 * free() it. */
char *json_print(const cJSON *o, int formatted);

#endif
