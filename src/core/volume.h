/* Weekly fractional sets: a direct set counts w_direct (1.0) for each prime mover, an
 * indirect set w_indirect (0.5) for each synergist. Only hard sets count:
 *  - a set with a stated RIR above max_rir is listed as not counted (RIR may be fractional:
 *    RPE 5.5 is RIR 4.5, above 4; a range counts at its midpoint);
 *  - warm-up sets never count;
 *  - a set without a stated RIR counts (programs that omit it usually mean working sets), as
 *    does every working set of an exercise the library marks as not graded by RIR. */
#ifndef SD_VOLUME_H
#define SD_VOLUME_H

#include "library.h"
#include "program.h"

struct sd_mdose {
	double direct;      /* hard sets with this muscle as prime mover */
	double indirect;    /* hard sets with this muscle as synergist */
	double fractional;  /* w_direct * direct + w_indirect * indirect */
	double max_session; /* largest fractional count in one day */
	int sessions;       /* days with a positive fractional count */
	double easy;        /* sets not counted (RIR above the limit) that would have hit it */
};

/* Where a muscle's fractional sets come from: one exercise's hard sets over the week. */
struct sd_source {
	int muscle;
	int ex;             /* index into the library */
	double direct;      /* hard sets of it that hit the muscle as prime mover */
	double indirect;    /* ... as synergist */
	double fractional;  /* their share of the muscle's fractional total */
};

struct sd_volume {
	struct sd_mdose m[SD_NMUSCLES];
	int ndays;
	double *day;        /* ndays x SD_NMUSCLES fractional sets per day; owned */
	int hard_sets;      /* hard sets in the week (whole sets, not fractional) */
	int easy_sets;      /* sets above the RIR limit */
	int warmup_sets;    /* sets marked as warm-up */
	int unknown_rir;    /* sets with no RIR stated (counted as hard) */
	struct sd_source *src;  /* by muscle, then largest share first; owned */
	int nsrc;
};

/* What one hard set of exercise x adds to each muscle: w_direct for a prime mover, w_indirect
 * for a synergist (a muscle listed both ways counts once, as direct), 0 elsewhere. */
void vol_weights(const struct sd_exercise *x, double w_direct, double w_indirect,
		 double w[SD_NMUSCLES]);
/* Counts a program. Fails only on allocation failure. */
int vol_count(const struct sd_program *p, const struct sd_library *lib, double w_direct,
	      double w_indirect, int max_rir, struct sd_volume *v, struct sd_err *e);
/* Fractional sets of muscle m on day d. */
double vol_day(const struct sd_volume *v, int d, int m);
/* The sources of muscle m: a pointer into v->src and their number in *n. */
const struct sd_source *vol_sources(const struct sd_volume *v, int m, int *n);
void vol_free(struct sd_volume *v);

#endif
