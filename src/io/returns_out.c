#include "returns_out.h"

#include <cjson/cJSON.h>

#include "audit_out.h"
#include "jsonout.h"
#include "table.h"
#include "wrap.h"

static const struct sd_delta *at(const struct returns_view *v, int i, int j)
{
	return &v->delta[i * v->n + j];
}

static int print_long(FILE *f, const struct returns_view *v, int json)
{
	static const char *const heads[] = { "from", "to", "delta_pct", "ci_low", "ci_high",
					     "practical", "statistical" };
	struct sd_table *t = json ? NULL : tbl_new(7, heads);
	cJSON *o = json ? cJSON_CreateObject() : NULL, *arr = NULL;

	if (json ? !o : !t)
		return -1;
	if (o) {
		json_profile(o, v->prof);
		json_num(o, "plateau", v->plateau, 4);
		json_num(o, "swc_pct", curve_pct(v->prof->swc), 4);
		json_num(o, "level", v->level, 4);
		json_num(o, "weeks", v->cov.weeks, 2);
		cJSON_AddBoolToObject(o, "weeks_beyond_evidence",
				      curve_beyond(v->prof, &v->cov, v->prof->dose_min) & SD_BEYOND_WEEKS);
		cJSON_AddStringToObject(o, "caution", aout_caution);
		arr = cJSON_AddArrayToObject(o, "returns");
	}
	for (int i = 0; i < v->n; i++)
		for (int j = i + 1; j < v->n; j++) {
			const struct sd_delta *d = at(v, i, j);
			if (arr) {
				cJSON *x = cJSON_CreateObject();
				if (!x)
					break;
				json_num(x, "from", v->dose[i], 4);
				json_num(x, "to", v->dose[j], 4);
				json_num(x, "delta_pct", curve_pct(d->d), 4);
				json_num(x, "ci_low", curve_pct(d->lo), 4);
				json_num(x, "ci_high", curve_pct(d->hi), 4);
				cJSON_AddBoolToObject(x, "practical", d->practical);
				cJSON_AddBoolToObject(x, "statistical", d->statistical);
				cJSON_AddItemToArray(arr, x);
				continue;
			}
			tbl_row(t);
			tbl_set(t, 0, "%g", v->dose[i]);
			tbl_set(t, 1, "%g", v->dose[j]);
			tbl_set(t, 2, "%.3f", curve_pct(d->d));
			tbl_set(t, 3, "%.3f", curve_pct(d->lo));
			tbl_set(t, 4, "%.3f", curve_pct(d->hi));
			tbl_set(t, 5, "%s", d->practical ? "yes" : "no");
			tbl_set(t, 6, "%s", d->statistical ? "yes" : "no");
		}
	if (o)
		return json_emit(f, o);
	tbl_print(t, f, 1);
	tbl_free(t);
	return 0;
}

/* The grid: row = from, column = to; each cell the extra gain in percent, marked '*' when it
 * exceeds the SWC and '+' when only its interval excludes zero; in panels of at most the
 * output's width, or in one piece (wide). */
static int print_grid(FILE *f, const struct returns_view *v)
{
	const char *heads[RET_MAX_DOSES];
	char lab[RET_MAX_DOSES][24];
	struct sd_table *t;

	wrap_printf(f, 0, "Extra gain (%%, as a ratio of gains) from moving FROM -> TO weekly "
		    "fractional sets");
	wrap_printf(f, 0, "%s, %g-week block; the average curve. '*' beyond the SWC (%.1f%%), "
		    "'+' interval excludes 0 only, '.' neither.", v->cov.trained >= 0.5 ? "trained" :
		    "untrained", v->cov.weeks, curve_pct(v->prof->swc));
	if (v->note[0])
		wrap_printf(f, 9, "warning: %s", v->note);
	fputc('\n', f);
	heads[0] = "from\\to";
	for (int j = 1; j < v->n; j++) {
		snprintf(lab[j], sizeof lab[j], "%g", v->dose[j]);
		heads[j] = lab[j];
	}
	if (!(t = tbl_new(v->n, heads)))
		return -1;
	for (int i = 0; i < v->n - 1; i++) {
		if (tbl_row(t))
			break;
		tbl_set(t, 0, "%g", v->dose[i]);
		for (int j = i + 1; j < v->n; j++) {
			const struct sd_delta *d = at(v, i, j);
			tbl_set(t, j, "%.1f%c", curve_pct(d->d),
				d->practical ? '*' : d->statistical ? '+' : '.');
		}
	}
	tbl_print_panels(t, f, tbl_mode(0, v->wide), v->wide ? 0 : wrap_width(f), 1);
	tbl_free(t);
	fputc('\n', f);
	wrap_printf(f, 0, "Practical plateau: %g weekly fractional sets (from there, no dose up "
		    "to %g adds more than the SWC).", v->plateau, v->prof->dose_max);
	return 0;
}

int returns_out_print(FILE *f, const struct returns_view *v, int fmt)
{
	if (fmt == RET_TABLE)
		return print_grid(f, v);
	return print_long(f, v, fmt == RET_JSON);
}
