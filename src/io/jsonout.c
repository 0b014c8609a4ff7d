#include "jsonout.h"

#include "../core/audit.h"

#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <stdlib.h>
#include <string.h>

#include "../core/text.h"

void json_num(cJSON *o, const char *key, double v, int digits)
{
	double s = pow(10, digits);
	cJSON_AddNumberToObject(o, key, round(v * s) / s);
}

void json_sig(cJSON *o, const char *key, double v)
{
	char buf[32];

	if (!isfinite(v)) {
		cJSON_AddNullToObject(o, key);
		return;
	}
	/* Ten significant digits survive a print and a read back exactly as printed. */
	snprintf(buf, sizeof buf, "%.10g", v);
	cJSON_AddNumberToObject(o, key, strtod(buf, NULL));
}

static cJSON *profile_obj(const struct sd_profile *p)
{
	cJSON *o = cJSON_CreateObject();
	if (!o)
		return NULL;
	cJSON_AddStringToObject(o, "name", p->name);
	cJSON_AddStringToObject(o, "basis", basis_name(p->basis));
	cJSON_AddStringToObject(o, "summary", p->summary);
	return o;
}

void json_profile(cJSON *o, const struct sd_profile *p)
{
	cJSON *x = profile_obj(p);
	if (x)
		cJSON_AddItemToObject(o, "profile", x);
}

char *json_profile_text(const struct sd_profile *p)
{
	cJSON *x = profile_obj(p);
	char *s = x ? cJSON_PrintUnformatted(x) : NULL;
	cJSON_Delete(x);
	return s;
}

void json_beyond(cJSON *o, unsigned bits)
{
	static const char *const names[] = { "dose", "weeks", "trained" };
	cJSON *a = cJSON_AddArrayToObject(o, "beyond_evidence");
	for (int i = 0; a && i < 3; i++)
		if (bits & (1u << i))
			cJSON_AddItemToArray(a, cJSON_CreateString(names[i]));
}

void json_bands(cJSON *o, const struct sd_point *pt, int digits)
{
	json_num(o, "curve_low", curve_pct(pt->ci_lo), digits);
	json_num(o, "curve_high", curve_pct(pt->ci_hi), digits);
	json_num(o, "group_low", curve_pct(pt->group_lo), digits);
	json_num(o, "group_high", curve_pct(pt->group_hi), digits);
	json_num(o, "athlete_low", curve_pct(pt->ath_lo), digits);
	json_num(o, "athlete_high", curve_pct(pt->ath_hi), digits);
	json_beyond(o, pt->beyond);
}

void json_evidence(cJSON *o, const struct sd_profile *p, const struct sd_covars *c)
{
	cJSON *ev = cJSON_AddObjectToObject(o, "evidence"), *x;

	if (!ev || !(x = cJSON_AddObjectToObject(ev, "dose")))
		return;
	json_num(x, "low", p->dose_min, 4);
	json_num(x, "high", p->dose_max, 4);
	for (int i = 0; i < p->nranges; i++) {
		const struct sd_range *r = &p->range[i];
		int known = !strcmp(r->var, "weeks") || !strcmp(r->var, "trained");
		double v = !strcmp(r->var, "weeks") ? c->weeks : c->trained;
		if (!(x = cJSON_AddObjectToObject(ev, r->var)))
			return;
		json_num(x, "low", r->lo, 4);
		json_num(x, "high", r->hi, 4);
		if (!known)
			continue;
		json_num(x, "value", v, 4);
		json_num(x, "used", v < r->lo ? r->lo : v > r->hi ? r->hi : v, 4);
		cJSON_AddBoolToObject(x, "beyond", v < r->lo || v > r->hi);
	}
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

void json_audit_row(cJSON *o, const struct sd_audit_row *r)
{
	json_num(o, "fractional", r->dose.fractional, 2);
	json_num(o, "max_per_session", r->dose.max_session, 2);
	cJSON_AddNumberToObject(o, "sessions", r->dose.sessions);
	json_num(o, "lnrr", r->pt.y, 6);
	json_num(o, "gain_pct", curve_pct(r->pt.y), 3);
	json_bands(o, &r->pt, 3);
	json_num(o, "plus1_pct", r->plus1.pct, 4);
	json_num(o, "plus1_low", r->plus1.lo, 4);
	json_num(o, "plus1_high", r->plus1.hi, 4);
	cJSON_AddStringToObject(o, "zone", zone_name(r->zone));
}

int json_emit(FILE *f, cJSON *o)
{
	char *text = o ? json_print(o, 1) : NULL;

	if (text)
		fprintf(f, "%s\n", text);
	free(text);
	cJSON_Delete(o);
	return text ? 0 : -1;
}
