#include "response_out.h"

#include <cjson/cJSON.h>

#include "audit_out.h"
#include "jsonout.h"
#include "recout_json.h"

int resp_out_json(FILE *f, const struct resp_json *in, const struct sd_rec *obs)
{
	const struct resp_vars *v = in->vars;
	const struct resp_personal *p = in->personal;
	cJSON *o = cJSON_CreateObject(), *x;

	if (!o)
		return -1;
	cJSON_AddStringToObject(o, "athlete", in->athlete);
	cJSON_AddStringToObject(o, "status", in->trained ? "trained" : "untrained");
	json_profile(o, in->prof);
	json_sig(o, "test_error", in->test_sd);
	json_sig(o, "estimate_error", in->est_sd);
	json_sig(o, "level", in->level);
	cJSON_AddNumberToObject(o, "window_days", (double)in->window);
	if ((x = cJSON_AddObjectToObject(o, "variances"))) {
		cJSON_AddStringToObject(x, "source", v->estimated ? "roster-reml" : "priors");
		json_sig(x, "athlete", v->athlete);
		json_sig(x, "block", v->block);
		json_sig(x, "block_cov_slope", v->block_cov);
		json_sig(x, "block_slope", v->block_slope);
		cJSON_AddNumberToObject(x, "roster_athletes", v->roster_athletes);
		cJSON_AddNumberToObject(x, "roster_repeated", v->roster_repeated);
		cJSON_AddNumberToObject(x, "roster_observations", v->roster_obs);
		json_sig(x, "mean_deviation", v->mean_dev);
		json_sig(x, "mean_deviation_se", v->mean_dev_se);
		if (v->estimated)
			cJSON_AddNullToObject(x, "why_priors");
		else
			cJSON_AddStringToObject(x, "why_priors", v->why);
	}
	if ((x = cJSON_AddObjectToObject(o, "personal"))) {
		cJSON_AddNumberToObject(x, "observations", p->n);
		cJSON_AddNumberToObject(x, "blocks", in->nblocks);
		json_num(x, "lnrr", p->mean, 6);
		json_num(x, "sd", p->sd, 6);
		json_num(x, "low", p->lo, 6);
		json_num(x, "high", p->hi, 6);
		json_num(x, "pct", curve_pct(p->mean), 3);
		json_num(x, "pct_low", curve_pct(p->lo), 3);
		json_num(x, "pct_high", curve_pct(p->hi), 3);
		json_num(x, "unshrunk_lnrr", p->raw, 6);
		json_num(x, "unshrunk_se", p->raw_se, 6);
		json_num(x, "data_weight", p->weight, 4);
	}
	cJSON_AddStringToObject(o, "caution", aout_caution);
	cJSON_AddItemToObject(o, "observations", rec_json_rows(obs));
	return json_emit(f, o);
}
