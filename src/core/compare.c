#include "compare.h"

#include "stats.h"

double cmp_decision_level(double level)
{
	double l = 1.0 - 2.0 * (1.0 - level);
	return l > 0 ? l : 0;
}

enum cmp_decision cmp_decide(double lo, double hi, double swc)
{
	if (lo > swc)
		return CMP_CLEAR_GAIN;
	if (hi < -swc)
		return CMP_CLEAR_LOSS;
	if (lo > -swc && hi < swc)
		return CMP_EQUIVALENT;
	if (lo > 0)
		return CMP_SOME_GAIN;
	if (hi < 0)
		return CMP_SOME_LOSS;
	return CMP_UNCLEAR;
}

static const char *const names[CMP_NDECISIONS] = {
	"clear-gain", "equivalent", "some-gain", "unclear", "some-loss", "clear-loss",
};

static const char *const meanings[CMP_NDECISIONS] = {
	"wholly above +SWC", "wholly inside +-SWC (two one-sided tests)",
	"above 0, reaching inside the SWC", "includes 0 and reaches past the SWC",
	"below 0, reaching inside the SWC", "wholly below -SWC",
};

const char *cmp_decision_name(enum cmp_decision v)
{
	return v < CMP_NDECISIONS ? names[v] : "?";
}

const char *cmp_decision_meaning(enum cmp_decision v)
{
	return v < CMP_NDECISIONS ? meanings[v] : "?";
}

void cmp_muscle(const struct sd_profile *p, const struct sd_covars *c, double level, double xa,
		double xb, struct cmp_diff *out)
{
	struct sd_delta dl;
	double q;

	curve_delta(p, c, xa, xb, level, 1, &dl);
	out->xa = xa;
	out->xb = xb;
	out->d = dl.d;
	out->se = dl.se;
	out->lo = dl.lo;
	out->hi = dl.hi;
	q = st_crit(cmp_decision_level(level), p->df);
	out->dlo = dl.d - q * dl.se;
	out->dhi = dl.d + q * dl.se;
	out->decision = cmp_decide(out->dlo, out->dhi, p->swc);
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
