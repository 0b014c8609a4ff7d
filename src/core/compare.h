/* Program comparison: per muscle, the difference in predicted gain between two programs for
 * one athlete, and per program the totals a gym owner weighs.
 *
 * For the same athlete and block (same moderators), the difference between programs A and B
 * for a muscle is  d = y(x_B) - y(x_A) = b_dose (f(x_B) - f(x_A))  on the lnRR scale: the
 * intercept, the moderators and the between-study heterogeneity cancel, so only the
 * coefficient covariance enters its interval (curve_delta). Pure computation. */
#ifndef SD_COMPARE_H
#define SD_COMPARE_H

#include "audit.h"

enum cmp_verdict {
	CMP_WORTHWHILE_GAIN,   /* d > SWC and the interval excludes 0 */
	CMP_UNSURE_GAIN,       /* d > SWC but the interval includes 0 */
	CMP_TRIVIAL_GAIN,      /* interval excludes 0 but d <= SWC */
	CMP_NO_DIFFERENCE,     /* neither */
	CMP_TRIVIAL_LOSS,
	CMP_UNSURE_LOSS,
	CMP_WORTHWHILE_LOSS,
	CMP_NVERDICTS
};

struct cmp_diff {
	double xa, xb;           /* weekly fractional sets under A and B */
	double d, se, lo, hi;    /* y(x_B) - y(x_A), lnRR, with its confidence interval */
	double p_gain;           /* P(d > SWC) */
	double p_loss;           /* P(d < -SWC) */
	enum cmp_verdict verdict;
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

/* P(d > t) for an estimate d with standard error se: 1 - Phi((t - d)/se), t(df) when df > 0;
 * with se = 0 it is 1 when d > t, else 0. */
double cmp_prob_above(double d, double se, double t, int df);
/* Verdict of a difference from its estimate, interval and the SWC (lnRR). */
enum cmp_verdict cmp_classify(double d, double lo, double hi, double swc);
/* Short stable name for CSV and JSON ("worthwhile-gain") and words for tables. */
const char *cmp_verdict_name(enum cmp_verdict v);
const char *cmp_verdict_text(enum cmp_verdict v);
/* Compares doses xa (program A) and xb (program B) of one muscle for one athlete context. */
void cmp_muscle(const struct sd_profile *p, const struct sd_covars *c, double level, double xa,
		double xb, struct cmp_diff *out);
/* Totals of one audited program against a session cap (fractional sets per muscle per day). */
void cmp_totals(const struct sd_audit *a, double session_cap, struct cmp_totals *out);
/* The pairs to compare among n programs: every pair (i < j), or each against the first.
 * Writes (a, b) index pairs into pairs (room for n (n - 1) / 2) and returns how many. */
int cmp_pairs(int n, int against_first, int (*pairs)[2]);

#endif
