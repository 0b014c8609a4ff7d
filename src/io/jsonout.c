#include "jsonout.h"

#include <math.h>

void json_num(cJSON *o, const char *key, double v, int digits)
{
	double s = pow(10, digits);
	cJSON_AddNumberToObject(o, key, round(v * s) / s);
}
