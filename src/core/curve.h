/* The dose-response curve of a profile, evaluated for one athlete context.
 * Everything is on the lnRR scale unless a name says pct (100 (e^y - 1)).
 *
 * Evidence: a moderator (weeks, trained) outside the profile's range for it is held at the
 * nearest edge of the range for the mean and every band, and the result is flagged; the
 * prediction therefore never leaves what the profile states at its edges. The dose keeps its
 * form past dose_max (every form is monotone, and the chart shows where it leaves the
 * evidence) and is flagged. */
#ifndef SD_CURVE_H
#define SD_CURVE_H

#include <stddef.h>

#include "profile.h"

/* Moderator values of the athlete and block. Profiles may name other moderators; those
 * are held at their centring value (contribute 0). */
struct sd_covars {
	double weeks;      /* block length in weeks */
	double trained;    /* 0 untrained, 1 trained */
};

/* Which values lie outside the profile's evidence (bits of sd_point.beyond). */
enum { SD_BEYOND_DOSE = 1, SD_BEYOND_WEEKS = 2, SD_BEYOND_TRAINED = 4 };

/* The three levels of uncertainty, as named in every output (profile.h has the variances). */
struct sd_point {
	double x;                    /* weekly fractional sets */
	double y;                    /* mean on lnRR scale */
	double se;                   /* the average curve: sqrt(z'Vz) */
	double sd_group;             /* a new group or study: sqrt(se^2 + heterogeneity) */
	double sd_athlete;           /* one athlete: sqrt(sd_group^2 + athlete_var) */
	double ci_lo, ci_hi;         /* the average curve (confidence interval), lnRR */
	double group_lo, group_hi;   /* a new group or study, lnRR */
	double ath_lo, ath_hi;       /* one athlete, lnRR */
	unsigned beyond;             /* SD_BEYOND_* */
};

struct sd_delta {
	double a, b;                 /* doses compared */
	double d, se, lo, hi;        /* y(b) - y(a) on lnRR scale with its interval */
	int practical;               /* d > swc */
	int statistical;             /* interval excludes 0 */
};

/* "+1 set": pct(x + 1) - pct(x), percentage points of 1RM gain bought by one more weekly set
 * on the average curve, with its confidence interval (delta method on the percent scale). */
struct sd_plus1 {
	double pct, lo, hi;
};

enum sd_zone { SD_ZONE_NONE, SD_ZONE_CLIMB, SD_ZONE_PLATEAU, SD_ZONE_BEYOND };

double curve_pct(double y);
/* Design vector z at dose x, moderators held inside their ranges; returns its length. */
int curve_design(const struct sd_profile *p, const struct sd_covars *c, double x, double *z);
/* SD_BEYOND_* bits of dose x and the context c. */
unsigned curve_beyond(const struct sd_profile *p, const struct sd_covars *c, double x);
/* The context's moderators beyond the evidence as one sentence into buf ("" when none);
 * returns their SD_BEYOND_* bits. */
unsigned curve_context_note(const struct sd_profile *p, const struct sd_covars *c, char *buf,
			    size_t n);
/* Names of the SD_BEYOND_* bits, comma-separated ("dose,weeks"), or "" for none. */
const char *curve_beyond_names(unsigned bits, char *buf, size_t n);
/* The dose coefficient in context: b_dose plus the "m:dose" terms at the context's values. */
double curve_dose_coef(const struct sd_profile *p, const struct sd_covars *c);
/* Between-study variance of a new group's true effect at f = f(x) (random slopes included). */
double curve_heterogeneity(const struct sd_profile *p, double f);
/* Mean and the three intervals at x. */
void curve_eval(const struct sd_profile *p, const struct sd_covars *c, double x, double level,
		struct sd_point *out);
/* Difference y(b) - y(a) at one context. With same_athlete, for one athlete at two doses:
 * the athlete's own slope deviation enters as (f(b) - f(a))^2 tau2_slope when the profile has
 * random slopes (intercept deviations cancel); otherwise only the coefficient covariance. */
void curve_delta(const struct sd_profile *p, const struct sd_covars *c, double a, double b,
		 double level, int same_athlete, struct sd_delta *out);
/* "+1 set" at x. */
void curve_plus1(const struct sd_profile *p, const struct sd_covars *c, double x, double level,
		 struct sd_plus1 *out);
/* Practical plateau: the smallest a on the grid dose_min, dose_min+step, ... such that no b
 * on that grid up to dose_max gives y(b) - y(a) > swc. The grid has at most
 * (dose_max - dose_min) / step + 1 points (step >= 0.01). */
double curve_plateau(const struct sd_profile *p, const struct sd_covars *c, double step);
/* Zone of dose x given the plateau: NONE (x = 0), CLIMB (below the plateau), PLATEAU
 * (at or past it, inside the evidence), BEYOND (outside the dose range: extrapolation). */
enum sd_zone curve_zone(const struct sd_profile *p, double plateau, double x);
const char *zone_name(enum sd_zone z);

#endif
