#include "fit_out.h"

#include <math.h>
#include <stdlib.h>

#include <cjson/cJSON.h>

#include "jsonout.h"

void fit_json(FILE *out, const char *path, const char *form, const struct ef_model *mod,
	      const struct mr_fit *f)
{
	cJSON *root = cJSON_CreateObject(), *co, *vc;

	if (!root)
		return;
	cJSON_AddStringToObject(root, "input", path);
	cJSON_AddStringToObject(root, "method", f->method == MR_REML ? "REML" : "ML");
	cJSON_AddStringToObject(root, "form", form);
	json_sig(root, "effects", f->n);
	json_sig(root, "studies", f->nstudy);
	co = cJSON_AddArrayToObject(root, "coefficients");
	vc = cJSON_CreateObject();
	if (!co || !vc) {
		cJSON_Delete(vc);
		cJSON_Delete(root);
		return;
	}
	for (int j = 0; j < f->p; j++) {
		cJSON *o = cJSON_CreateObject();
		if (!o)
			break;
		cJSON_AddStringToObject(o, "term", mod->names[j]);
		json_sig(o, "estimate", f->beta[j]);
		json_sig(o, "se", f->se[j]);
		json_sig(o, "stat", f->stat[j]);
		json_sig(o, "p", f->pval[j]);
		json_sig(o, "ci_low", f->lo[j]);
		json_sig(o, "ci_high", f->hi[j]);
		cJSON_AddItemToArray(co, o);
	}
	json_sig(vc, "tau2", f->tau2);
	if (f->slopes) {
		json_sig(vc, "tau2_slope", f->tau2_slope);
		json_sig(vc, "cov_slope", f->cov_slope);
		json_sig(vc, "rho", f->rho);
	}
	if (f->effect_level)
		json_sig(vc, "sigma2", f->sigma2);
	cJSON_AddItemToObject(root, "variance", vc);
	json_sig(root, "loglik", f->loglik);
	json_sig(root, "aic", f->aic);
	json_sig(root, "bic", f->bic);
	json_sig(root, "df", f->df);
	json_sig(root, "qe", f->qe);
	json_sig(root, "qe_p", f->qe_p);
	json_sig(root, "i2_study", f->i2_study);
	json_sig(root, "i2_effect", f->i2_effect);
	cJSON_AddBoolToObject(root, "converged", f->converged);
	json_emit(out, root);
}

void fit_forms_json(FILE *out, const struct fit_form *r, int n)
{
	cJSON *arr = cJSON_CreateArray();

	for (int k = 0; arr && k < n; k++) {
		cJSON *o = cJSON_CreateObject();
		if (!o)
			break;
		cJSON_AddStringToObject(o, "form", r[k].form);
		json_sig(o, "loglik", r[k].fit->loglik);
		json_sig(o, "aic", r[k].fit->aic);
		json_sig(o, "bic", r[k].fit->bic);
		json_sig(o, "loso_rmse", r[k].cv->rmse);
		json_sig(o, "loso_mlpd", r[k].cv->mlpd);
		json_sig(o, "loso_folds", r[k].cv->folds);
		json_sig(o, "loso_skipped", r[k].cv->skipped);
		json_sig(o, "rank_aic", r[k].rank[0]);
		json_sig(o, "rank_bic", r[k].rank[1]);
		json_sig(o, "rank_rmse", r[k].rank[2]);
		json_sig(o, "rank_mlpd", r[k].rank[3]);
		cJSON_AddItemToArray(arr, o);
	}
	json_emit(out, arr);
}

void slopes_json(FILE *out, const struct ef_model *mod, const struct mr_fit *f,
		 const struct mr_study *st)
{
	cJSON *root = cJSON_CreateObject(), *arr = cJSON_CreateArray();

	if (!root || !arr) {
		cJSON_Delete(root);
		cJSON_Delete(arr);
		return;
	}
	cJSON_AddStringToObject(root, "form", form_name(mod->form));
	json_sig(root, "b_dose", f->beta[1]);
	json_sig(root, "se_dose", f->se[1]);
	json_sig(root, "tau2", f->tau2);
	json_sig(root, "tau2_slope", f->tau2_slope);
	json_sig(root, "rho", f->rho);
	for (int s = 0; s < f->nstudy; s++) {
		cJSON *o = cJSON_CreateObject();
		if (!o)
			break;
		cJSON_AddStringToObject(o, "study", mod->study_name[st[s].id]);
		json_sig(o, "effects", st[s].k);
		json_sig(o, "doses", st[s].ndose);
		json_sig(o, "weight_pct", st[s].weight);
		/* A study with one dose has no slope of its own. */
		json_sig(o, "raw_slope", st[s].raw_ok ? st[s].raw_b : NAN);
		json_sig(o, "raw_se", st[s].raw_ok ? st[s].raw_se_b : NAN);
		json_sig(o, "shrunk_slope", f->beta[1] + st[s].u1);
		json_sig(o, "blup_slope", st[s].u1);
		json_sig(o, "blup_slope_se", st[s].se_u1);
		json_sig(o, "blup_intercept", st[s].u0);
		json_sig(o, "blup_intercept_se", st[s].se_u0);
		cJSON_AddItemToArray(arr, o);
	}
	cJSON_AddItemToObject(root, "studies", arr);
	json_emit(out, root);
}
