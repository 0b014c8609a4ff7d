/* One program's audit: per muscle the weekly dose, where it sits on the curve, what one more
 * set buys, its zone, and the warnings a coach should see. Pure computation. */
#ifndef SD_AUDIT_H
#define SD_AUDIT_H

#include "curve.h"
#include "volume.h"

#include "limits.h"

#define SD_SESSION_CAP SD_SESSION_CAP_DEFAULT
#define SD_MAX_WARN 64

struct sd_audit_row {
	struct sd_mdose dose;
	struct sd_point pt;          /* curve at dose.fractional */
	struct sd_plus1 plus1;       /* what one more weekly set buys */
	enum sd_zone zone;
};

struct sd_warning {
	int muscle;                  /* -1 when about the whole program */
	int day;                     /* -1 when not about one day */
	char text[240];
};

struct sd_audit {
	struct sd_volume vol;
	struct sd_covars cov;
	double level;
	double plateau;              /* practical plateau, weekly fractional sets */
	unsigned beyond;             /* SD_BEYOND_* bits of the context (weeks, trained) */
	struct sd_audit_row row[SD_NMUSCLES];
	struct sd_warning warn[SD_MAX_WARN];
	int nwarn;
};

struct sd_audit_opts {
	double level;                /* e.g. 0.95 */
	int max_rir;                 /* hard-set limit, default 4 */
	double session_cap;          /* SD_SESSION_CAP unless set */
};

int audit_run(const struct sd_program *prog, const struct sd_library *lib,
	      const struct sd_profile *prof, const struct sd_covars *cov,
	      const struct sd_audit_opts *o, struct sd_audit *out, struct sd_err *e);
void audit_free(struct sd_audit *a);

#endif
