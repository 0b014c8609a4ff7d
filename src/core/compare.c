#include "compare.h"

#include "stats.h"

double cmp_prob_above(double d, double se, double t, int df)
{
	if (!(se > 0))
		return d > t ? 1.0 : 0.0;
	/* Upper tail through the symmetric lower one: 1 - Phi(z) = Phi(-z), which keeps
	 * precision when the probability is tiny. */
	return st_cdf((d - t) / se, df);
}

enum cmp_verdict cmp_classify(double d, double lo, double hi, double swc)
{
	int clear = lo > 0 || hi < 0;

	if (d > swc)
		return clear ? CMP_WORTHWHILE_GAIN : CMP_UNSURE_GAIN;
	if (d < -swc)
		return clear ? CMP_WORTHWHILE_LOSS : CMP_UNSURE_LOSS;
	if (clear)
		return d > 0 ? CMP_TRIVIAL_GAIN : CMP_TRIVIAL_LOSS;
	return CMP_NO_DIFFERENCE;
}

static const char *const names[CMP_NVERDICTS] = {
	"worthwhile-gain", "unsure-gain", "trivial-gain", "no-clear-difference",
	"trivial-loss", "unsure-loss", "worthwhile-loss",
};

static const char *const texts[CMP_NVERDICTS] = {
	"worthwhile gain", "gain, unsure", "real but trivial gain", "no clear difference",
	"real but trivial loss", "loss, unsure", "worthwhile loss",
};

const char *cmp_verdict_name(enum cmp_verdict v)
{
	return v < CMP_NVERDICTS ? names[v] : "?";
}

const char *cmp_verdict_text(enum cmp_verdict v)
{
	return v < CMP_NVERDICTS ? texts[v] : "?";
}

void cmp_muscle(const struct sd_profile *p, const struct sd_covars *c, double level, double xa,
		double xb, struct cmp_diff *out)
{
	struct sd_delta dl;

	curve_delta(p, c, xa, xb, level, &dl);
	out->xa = xa;
	out->xb = xb;
	out->d = dl.d;
	out->se = dl.se;
	out->lo = dl.lo;
	out->hi = dl.hi;
	out->p_gain = cmp_prob_above(dl.d, dl.se, p->swc, p->df);
	out->p_loss = cmp_prob_above(-dl.d, dl.se, p->swc, p->df);
	out->verdict = cmp_classify(dl.d, dl.lo, dl.hi, p->swc);
}

void cmp_totals(const struct sd_audit *a, double session_cap, struct cmp_totals *out)
{
	out->hard_sets = a->vol.hard_sets;
	out->sessions = a->vol.ndays;
	out->sets_per_session = a->vol.ndays ? (double)a->vol.hard_sets / a->vol.ndays : 0;
	out->under_plateau = out->past_plateau = out->beyond_evidence = out->over_cap = 0;
	for (int m = 0; m < SD_NMUSCLES; m++) {
		if (a->row[m].dose.fractional < a->plateau)
			out->under_plateau++;
		else
			out->past_plateau++;
		if (a->row[m].zone == SD_ZONE_BEYOND)
			out->beyond_evidence++;
		for (int d = 0; d < a->vol.ndays; d++)
			if (vol_day(&a->vol, d, m) > session_cap)
				out->over_cap++;
	}
}

int cmp_pairs(int n, int against_first, int (*pairs)[2])
{
	int k = 0;
	for (int i = 0; i < n; i++)
		for (int j = i + 1; j < n; j++) {
			if (against_first && i > 0)
				return k;
			pairs[k][0] = i;
			pairs[k][1] = j;
			k++;
		}
	return k;
}
