/* The dose-response curve of a profile, evaluated for one athlete context.
 * Everything is on the lnRR scale unless a name says pct (100 (e^y - 1)). */
#ifndef SD_CURVE_H
#define SD_CURVE_H

#include "profile.h"

/* Moderator values of the athlete and block. Profiles may name other moderators; those
 * are held at their centring value (contribute 0). */
struct sd_covars {
	double weeks;      /* block length in weeks */
	double trained;    /* 0 untrained, 1 trained */
};

struct sd_point {
	double x;                    /* weekly fractional sets */
	double y;                    /* mean on lnRR scale */
	double se;                   /* SE of the mean: sqrt(z'Vz) */
	double sp;                   /* predictive SD: sqrt(z'Vz + heterogeneity) */
	double ci_lo, ci_hi;         /* confidence limits, lnRR */
	double pi_lo, pi_hi;         /* prediction limits, lnRR */
};

struct sd_delta {
	double a, b;                 /* doses compared */
	double d, se, lo, hi;        /* y(b) - y(a) on lnRR scale with its confidence interval */
	int practical;               /* d > swc */
	int statistical;             /* interval excludes 0 */
};

struct sd_marginal {
	double pct, lo, hi;          /* d(percent)/dx at x, per extra weekly set, with interval */
};

enum sd_zone { SD_ZONE_NONE, SD_ZONE_CLIMB, SD_ZONE_PLATEAU, SD_ZONE_BEYOND };

double curve_pct(double y);
/* Design vector z at dose x; returns its length (the profile's nterms). */
int curve_design(const struct sd_profile *p, const struct sd_covars *c, double x, double *z);
/* Mean, confidence and prediction limits at x. */
void curve_eval(const struct sd_profile *p, const struct sd_covars *c, double x, double level,
		struct sd_point *out);
/* Difference y(b) - y(a) for the same athlete (heterogeneity cancels; only the coefficient
 * covariance enters). */
void curve_delta(const struct sd_profile *p, const struct sd_covars *c, double a, double b,
		 double level, struct sd_delta *out);
/* Percent gain bought by one more weekly set at x (derivative), delta-method interval. */
void curve_marginal(const struct sd_profile *p, const struct sd_covars *c, double x, double level,
		    struct sd_marginal *out);
/* Practical plateau: the smallest a on the grid dose_min, dose_min+step, ... such that no b
 * on that grid up to dose_max gives y(b) - y(a) > swc. */
double curve_plateau(const struct sd_profile *p, const struct sd_covars *c, double step);
/* Zone of dose x given the plateau: NONE (x = 0), CLIMB (below the plateau), PLATEAU
 * (at or past it, inside the evidence), BEYOND (past the evidence range: extrapolation). */
enum sd_zone curve_zone(const struct sd_profile *p, double plateau, double x);
const char *zone_name(enum sd_zone z);

#endif
