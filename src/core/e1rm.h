/* Estimated one-repetition maximum (1RM) from a set of REPS repetitions to failure with LOAD,
 * by the published prediction equations. The result is in the unit of the load.
 *
 * Default: Brzycki (1993). It returns exactly the load at 1 rep without a special case and
 * agrees with Epley at 10 reps. It is not central: of the seven it gives the lowest estimate
 * from 2 to 4 reps, ties O'Conner for lowest at 5, is second lowest at 6-7, third at 8-9 and
 * fourth at 10 (tests/test_e1rm.c), so at the low reps where strength is tested it is the
 * conservative end. */
#ifndef SD_E1RM_H
#define SD_E1RM_H

#include "limits.h"

#include "err.h"

enum e1rm_formula {
	E1RM_EPLEY, E1RM_BRZYCKI, E1RM_LANDER, E1RM_LOMBARDI, E1RM_MAYHEW, E1RM_OCONNER,
	E1RM_WATHAN, E1RM_NFORMULAS
};

#define E1RM_DEFAULT E1RM_BRZYCKI
/* Above this the estimates lose accuracy (Reynolds, Gordon & Robergs 2006): warn. */
#define E1RM_WARN_REPS SD_TEST_REPS_WARN
/* Above this a rep set says more about endurance than strength: refuse. */
#define E1RM_MAX_REPS SD_TEST_REPS_MAX

/* Lowercase name ("brzycki", "oconner"). */
const char *e1rm_name(int f);
/* The published source, "Author (year)". */
const char *e1rm_source(int f);
/* The equation as text, for help output. */
const char *e1rm_equation(int f);
/* Formula by name, ignoring case and an apostrophe ("O'Conner"); -1 if unknown. */
int e1rm_find(const char *name);
/* The bare equation at reps (no checks, no 1-rep rule). Reps may be fractional: a logged set's
 * reps plus a half-step RIR (core/tlog.h). */
double e1rm_raw(int f, double load, double reps);
/* The estimate with this tool's rules: the load itself at 1 rep, refusal of a non-positive
 * load or reps outside 1..E1RM_MAX_REPS; *warn (may be NULL) is set to 1 above
 * E1RM_WARN_REPS, else 0. */
int e1rm_estimate(int f, double load, int reps, double *out, int *warn, struct sd_err *e);

#endif
