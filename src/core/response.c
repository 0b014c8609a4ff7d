#include "response.h"

#include <math.h>

#include "stats.h"

int resp_check_opts(const struct resp_opts *opt, struct sd_err *e)
{
	if (!isfinite(opt->test_sd) || opt->test_sd < 0 || opt->test_sd > 1)
		return sd_usage(e, "bad test error %g: expected a log-scale SD from 0 to 1",
				opt->test_sd);
	if (!isfinite(opt->prior_sd) || opt->prior_sd <= 0 || opt->prior_sd > 2)
		return sd_usage(e, "bad prior SD %g: expected a log-scale SD above 0, at most 2",
				opt->prior_sd);
	if (!(opt->level > 0 && opt->level < 1))
		return sd_usage(e, "bad level %g: expected a number between 0 and 1", opt->level);
	return 0;
}

static double pred_var(const struct resp_obs *o, const struct resp_opts *opt)
{
	return o->sp * o->sp + 2.0 * opt->test_sd * opt->test_sd;
}

void resp_observe(const struct resp_obs *o, const struct resp_opts *opt, struct resp_fit *out)
{
	double q = st_crit(opt->level, 0);

	out->dev = o->obs - o->yhat;
	out->sd = sqrt(pred_var(o, opt));
	out->z = out->sd > 0 ? out->dev / out->sd : 0;
	out->pctile = 100.0 * st_cdf(out->z, 0);
	out->lo = o->yhat - q * out->sd;
	out->hi = o->yhat + q * out->sd;
}

int resp_personal(const struct resp_obs *o, int n, const struct resp_opts *opt,
		  struct resp_personal *out, struct sd_err *e)
{
	double prec0 = 1.0 / (opt->prior_sd * opt->prior_sd), sw = 0, swd = 0, q;

	if (resp_check_opts(opt, e))
		return -1;
	for (int k = 0; k < n; k++) {
		double v = pred_var(&o[k], opt);
		if (!(v > 0) || !isfinite(v) || !isfinite(o[k].obs) || !isfinite(o[k].yhat))
			return sd_fail(e, "observation %d has no usable variance", k + 1);
		sw += 1.0 / v;
		swd += (o[k].obs - o[k].yhat) / v;
	}
	q = st_crit(opt->level, 0);
	out->n = n;
	out->mean = swd / (prec0 + sw);
	out->sd = sqrt(1.0 / (prec0 + sw));
	out->lo = out->mean - q * out->sd;
	out->hi = out->mean + q * out->sd;
	out->raw = n ? swd / sw : 0;
	out->raw_se = n ? sqrt(1.0 / sw) : 0;
	out->weight = sw / (prec0 + sw);
	return 0;
}
