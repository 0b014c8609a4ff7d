/* What every command and the full-screen interface share for one run: the options given, the
 * profile, the exercise library and the database, and the rules that read them. Both src/cmd
 * and src/tui include this; neither includes the other. */
#ifndef SD_APP_CTX_H
#define SD_APP_CTX_H

#include <stddef.h>
#include <stdio.h>

#include "../core/curve.h"
#include "../core/err.h"
#include "../core/library.h"
#include "../core/limits.h"
#include "../core/profile.h"

enum { SD_FMT_TABLE, SD_FMT_CSV, SD_FMT_JSON };

struct sd_db;  /* store/db.h */

struct sd_opts {
	const char *db_path;       /* --db or SETDOSE_DB; NULL: default location */
	const char *profile_path;  /* --profile; NULL: bundled strength.ini */
	const char *exercises_path;/* --exercises: one more library file for this run */
	int format;                /* SD_FMT_* */
	int status_set;            /* --status given */
	double trained;            /* 0 or 1 */
	int weeks_set;
	double weeks;              /* --weeks */
	double level;              /* --level, default 0.95 */
	int swc_set;
	double swc_pct;            /* --swc in percent */
	int max_rir;               /* --max-rir, default 4 */
	int units_lb;              /* --units lb */
	int units_set;             /* --units given */
	int color;                 /* 0 with --no-color, NO_COLOR or a non-terminal */
};

struct sd_ctx {
	struct sd_opts opt;
	struct sd_profile profile;
	struct sd_library lib;
	struct sd_db *db;
	FILE *out;
	char datadir[SD_PATH_MAX];        /* where the bundled profiles live */
};

struct db_athlete;

/* The athlete context for the curve from the global options and a program's weeks. */
struct sd_covars app_covars(const struct sd_ctx *ctx, int program_weeks);
/* The smallest worthwhile change on the lnRR scale (profile's, or --swc). */
double app_swc(const struct sd_ctx *ctx);
/* The database path: --db, else SETDOSE_DB, else the default location; fails when it does
 * not fit in n bytes or no location is known. */
int app_db_path(const struct sd_ctx *ctx, char *buf, size_t n, struct sd_err *e);
/* Loads are shown in lb for this athlete: --units when given, else the athlete's units. */
int app_lb(const struct sd_ctx *ctx, const struct db_athlete *a);

#endif
