#include "curve_out.h"

#include <math.h>
#include <stdlib.h>

#include <cjson/cJSON.h>

#include "audit_out.h"
#include "jsonout.h"
#include "table.h"
#include "wrap.h"

int curve_out_print(FILE *f, const struct sd_profile *p, const struct sd_covars *cov, double level,
		    double step, int wide, int fmt)
{
	struct sd_table *t = aout_gain_table("sets", 1);
	double plateau = curve_plateau(p, cov, 1.0);
	cJSON *arr = NULL;
	char note[240];
	int csv = fmt == CURVE_CSV;

	if (!t)
		return -1;
	if (fmt == CURVE_JSON && !(arr = cJSON_CreateArray())) {
		tbl_free(t);
		return -1;
	}
	curve_context_note(p, cov, note, sizeof note);
	/* The range is at most SD_DOSE_LIMIT wide and step at least 0.1: at most 2,001 rows. */
	int n = (int)((p->dose_max - p->dose_min) / step + 1e-9);
	for (int i = 0; i <= n; i++) {
		double x = p->dose_min + i * step;
		struct sd_point pt;
		struct sd_plus1 mg;
		curve_eval(p, cov, x, level, &pt);
		curve_plus1(p, cov, x, level, &mg);
		if (arr) {
			cJSON *o = cJSON_CreateObject();
			cJSON_AddNumberToObject(o, "sets", x);
			json_num(o, "lnrr", pt.y, 6);
			json_num(o, "gain_pct", curve_pct(pt.y), 4);
			json_bands(o, &pt, 4);
			json_num(o, "plus1_pct", mg.pct, 4);
			json_num(o, "plus1_low", mg.lo, 4);
			json_num(o, "plus1_high", mg.hi, 4);
			cJSON_AddStringToObject(o, "zone", zone_name(curve_zone(p, plateau, x)));
			cJSON_AddItemToArray(arr, o);
			continue;
		}
		tbl_row(t);
		tbl_set(t, 0, "%g", x);
		int c = aout_gain_cells(t, 1, &pt, &mg, csv);
		tbl_set(t, c, "%s", zone_name(curve_zone(p, plateau, x)));
	}
	if (arr) {
		cJSON *root = cJSON_CreateObject();
		json_profile(root, p);
		cJSON_AddStringToObject(root, "status", cov->trained >= 0.5 ? "trained" : "untrained");
		cJSON_AddNumberToObject(root, "weeks", cov->weeks);
		json_evidence(root, p, cov);
		cJSON_AddNumberToObject(root, "level", level);
		cJSON_AddNumberToObject(root, "plateau", plateau);
		cJSON_AddStringToObject(root, "bands", aout_bands_legend);
		if (note[0])
			cJSON_AddStringToObject(root, "warning", note);
		cJSON_AddItemToObject(root, "points", arr);
		cJSON_AddStringToObject(root, "caution", aout_caution);
		if (json_emit(f, root)) {
			tbl_free(t);
			return -1;
		}
	} else {
		if (fmt == CURVE_TABLE) {
			wrap_printf(f, 2, "%s; %s, %g-week block; %.0f%% intervals; plateau at "
				    "%g weekly fractional sets", p->name, cov->trained >= 0.5 ?
				    "trained" : "untrained", cov->weeks, level * 100, plateau);
			if (note[0])
				wrap_printf(f, 9, "warning: %s", note);
			fputc('\n', f);
		}
		tbl_print(t, f, tbl_mode(csv, wide));
		if (fmt == CURVE_TABLE) {
			fputc('\n', f);
			aout_bands_text(f, (int)lround(level * 100));
			aout_plus1_text(f);
			if (!wide)
				wrap_printf(f, 2, "--wide adds the group interval and the +1set "
					    "interval.");
		}
	}
	tbl_free(t);
	return 0;
}

