#include "units.h"

#include <math.h>
#include <stdlib.h>
#include <strings.h>

double units_lb_to_kg(double lb)
{
	return lb * UNITS_KG_PER_LB;
}

double units_kg_to_lb(double kg)
{
	return kg / UNITS_KG_PER_LB;
}

double units_show(double kg, int lb)
{
	return lb ? units_kg_to_lb(kg) : kg;
}

const char *units_name(int lb)
{
	return lb ? "lb" : "kg";
}

int units_parse_load(const char *s, int default_lb, double *kg, struct sd_err *e)
{
	char *end;
	double v;
	int lb = default_lb;

	v = strtod(s, &end);
	if (end == s)
		return sd_usage(e, "bad load '%s' (expected a number, optionally with kg or lb)", s);
	while (*end == ' ')
		end++;
	if (!strcasecmp(end, "kg"))
		lb = 0;
	else if (!strcasecmp(end, "lb") || !strcasecmp(end, "lbs"))
		lb = 1;
	else if (*end)
		return sd_usage(e, "bad load '%s' (expected a number, optionally with kg or lb)", s);
	if (!isfinite(v) || v <= 0)
		return sd_usage(e, "bad load '%s': must be a positive number", s);
	v = lb ? units_lb_to_kg(v) : v;
	if (v > UNITS_MAX_KG)
		return sd_usage(e, "bad load '%s': more than %.0f kg", s, UNITS_MAX_KG);
	*kg = v;
	return 0;
}
