#include "jsonout.h"

#include <math.h>
#include <stdlib.h>

#include "../core/text.h"

void json_num(cJSON *o, const char *key, double v, int digits)
{
	double s = pow(10, digits);
	cJSON_AddNumberToObject(o, key, round(v * s) / s);
}

char *json_print(const cJSON *o, int formatted)
{
	char *raw = formatted ? cJSON_Print(o) : cJSON_PrintUnformatted(o), *out;

	if (!raw)
		return NULL;
	out = text_repair(raw);
	cJSON_free(raw);
	return out;
}
