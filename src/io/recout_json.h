/* Inside src/io only: a listing's rows as cJSON, for writers that nest them in a larger object. */
#ifndef SD_RECOUT_JSON_H
#define SD_RECOUT_JSON_H

#include <cjson/cJSON.h>

#include "recout.h"

/* A copy of the listing's JSON rows (an empty array for a table or CSV listing); NULL when out
 * of memory. */
cJSON *rec_json_rows(const struct sd_rec *r);

#endif
