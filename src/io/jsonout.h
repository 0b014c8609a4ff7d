/* Small cJSON helpers shared by the JSON writers in src/io (cJSON stays inside io/). */
#ifndef SD_JSONOUT_H
#define SD_JSONOUT_H

#include <cjson/cJSON.h>

/* Adds a number rounded to `digits` decimals, so output is stable across platforms'
 * last-digit noise. */
void json_num(cJSON *o, const char *key, double v, int digits);

#endif
