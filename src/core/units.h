/* Load units. Loads are stored in kilograms; pounds convert with the exact international
 * definition 1 lb = 0.45359237 kg (international yard and pound agreement, 1959). */
#ifndef SD_UNITS_H
#define SD_UNITS_H

#include "err.h"

#define UNITS_KG_PER_LB 0.45359237
#define UNITS_MAX_KG 1000.0     /* heavier loads are refused as typing errors */

double units_lb_to_kg(double lb);
double units_kg_to_lb(double kg);
/* Kilograms shown in the unit asked for (lb when lb != 0). */
double units_show(double kg, int lb);
const char *units_name(int lb);
/* Parses a load "100", "102.5kg", "225 lb" into kilograms; a number without a unit is in lb
 * when default_lb. Refuses zero, negative, non-finite and absurd loads. */
int units_parse_load(const char *s, int default_lb, double *kg, struct sd_err *e);

#endif
