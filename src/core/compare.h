/* Program comparison: per muscle, the difference in predicted gain between two programs for
 * one athlete, and per program the totals a gym owner weighs.
 *
 * For the same athlete and block (same moderators), the difference between programs A and B
 * for a muscle is  d = y(x_B) - y(x_A) = (z_B - z_A)'b + u1 (f(x_B) - f(x_A))  on the lnRR
 * scale, u1 the athlete's own deviation in the dose slope: the intercept, the athlete's level
 * and the between-study intercept variance cancel, so Var(d) = dz'V dz + (f_B - f_A)^2
 * tau2_slope, the second part only when the profile has random slopes (without them every
 * athlete is assumed to share the curve's slope). Pure computation.
 *
 * Decisions are interval-based against the SWC (never a probability read off an interval:
 * Sainani 2018): the decision interval is the 1 - 2 alpha interval, alpha = 1 - level (90 %
 * for the usual 95 %), so "wholly inside +-SWC" is the two one-sided tests procedure at alpha
 * (Schuirmann 1987; Lakens 2017) and "wholly above +SWC" a one-sided test at alpha. */
#ifndef SD_COMPARE_H
#define SD_COMPARE_H

#include "audit.h"

/* The decision on a difference d against the smallest worthwhile change, read from the
 * decision interval (see cmp_muscle): each outcome is one or two one-sided tests at alpha. */
enum cmp_decision {
	CMP_CLEAR_GAIN,        /* wholly above +SWC */
	CMP_EQUIVALENT,        /* wholly inside -SWC..+SWC: equivalent by two one-sided tests */
	CMP_SOME_GAIN,         /* wholly above 0, but reaching inside the SWC */
	CMP_UNCLEAR,           /* includes 0 and reaches past the SWC */
	CMP_SOME_LOSS,         /* wholly below 0, but reaching inside the SWC */
	CMP_CLEAR_LOSS,        /* wholly below -SWC */
	CMP_NDECISIONS
};

struct cmp_diff {
	double xa, xb;           /* weekly fractional sets under A and B */
	double d, se, lo, hi;    /* y(x_B) - y(x_A), lnRR, with its interval at the asked level */
	double dlo, dhi;         /* the decision interval, level 1 - 2 alpha with alpha = 1 - level */
	enum cmp_decision decision;
};

struct cmp_totals {
	int hard_sets;           /* hard sets a week */
	int sessions;            /* days in the program */
	double sets_per_session; /* hard sets a week / sessions */
	int under_plateau;       /* muscles below the practical plateau (including those at 0) */
	int past_plateau;        /* muscles at or past it: past practical returns */
	int beyond_evidence;     /* muscles past the evidence range */
	int over_cap;            /* muscle-session pairs above the session cap */
};

/* The level of the decision interval for an interval level: 1 - 2 (1 - level), e.g. 0.90 for
 * 0.95, so each one-sided test runs at alpha = 1 - level (Schuirmann 1987). */
double cmp_decision_level(double level);
/* Decision from the decision interval lo..hi and the SWC (lnRR). */
enum cmp_decision cmp_decide(double lo, double hi, double swc);
/* The decision's one word, the same in every output ("clear-gain", "equivalent", ...), and
 * its meaning in a few words for legends. */
const char *cmp_decision_name(enum cmp_decision v);
const char *cmp_decision_meaning(enum cmp_decision v);
/* Compares doses xa (program A) and xb (program B) of one muscle for one athlete context:
 * the same athlete at two doses (curve_delta with same_athlete: the profile's slope
 * variance enters when it has random slopes). */
void cmp_muscle(const struct sd_profile *p, const struct sd_covars *c, double level, double xa,
		double xb, struct cmp_diff *out);
/* Totals of one audited program against a session cap (fractional sets per muscle per day). */
void cmp_totals(const struct sd_audit *a, double session_cap, struct cmp_totals *out);
/* The pairs to compare among n programs: every pair (i < j), or each against the first.
 * Writes (a, b) index pairs into pairs (room for n (n - 1) / 2) and returns how many. */
int cmp_pairs(int n, int against_first, int (*pairs)[2]);

#endif
