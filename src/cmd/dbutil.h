/* Helpers shared by the commands that work on the store (athlete, program, block, test,
 * response, db, audit --all): argument parsing, today's date, confirmation, units. */
#ifndef SD_DBUTIL_H
#define SD_DBUTIL_H

#include "../core/audit.h"
#include "../core/date.h"
#include "../store/db.h"
#include "cmd.h"

/* Today's local date as YYYY-MM-DD (SETDOSE_TODAY overrides it, for reproducible runs). */
int dbu_today(char *buf, struct sd_err *e);
/* Checks a date given to option `what` and copies it (normalised) into buf. */
int dbu_date(const char *what, const char *s, char *buf, struct sd_err *e);
/* Parses a whole number in [lo, hi] given as `what`. */
int dbu_int(const char *what, const char *s, long long lo, long long hi, long long *out,
	    struct sd_err *e);
/* Parses a finite number in [lo, hi] given as `what`. */
int dbu_num(const char *what, const char *s, double lo, double hi, double *out,
	    struct sd_err *e);
/* Checks a name for an athlete or program: 1..max-1 bytes, text core/text.h accepts (valid
 * UTF-8, no control or bidirectional control characters), no leading or trailing space. */
int dbu_name(const char *what, const char *s, size_t max, struct sd_err *e);
/* Asks QUESTION on the terminal; 1 when answered yes. Without a terminal it fails, naming
 * the option (--yes) that skips the question. */
int dbu_confirm(const char *question, struct sd_err *e);
/* Loads are shown in lb for this athlete: --units when given, else the athlete's units. */
int dbu_lb(const struct sd_ctx *ctx, const struct db_athlete *a);
/* The database path main.c would use: --db, SETDOSE_DB, else the default. */
int dbu_path(const struct sd_ctx *ctx, char *buf, size_t n, struct sd_err *e);

/* One subcommand: its name and the function given argv from the subcommand's name on. */
struct dbu_sub {
	const char *name;
	int (*fn)(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e);
};
/* Runs the subcommand named by argv[1] from the NULL-terminated table, or fails with the
 * command's usage. */
int dbu_subcommand(struct sd_ctx *ctx, const struct dbu_sub *subs, const struct sd_cmd *cmd,
		   int argc, char **argv, struct sd_err *e);

/* The usage error for an unknown option (call with getopt's optind as left after '?'). */
int dbu_badopt(const struct sd_cmd *cmd, int argc, char **argv, struct sd_err *e);
/* Refuses a negative number among the arguments before getopt could take it for an option. */
int dbu_no_negatives(int argc, char **argv, struct sd_err *e);
/* A block's length in weeks for the curve: the planned weeks while open; once ended, the
 * weeks from start to end (at least 1). */
double dbu_block_weeks(const struct db_block *b);
/* Parses a stored template (label: its name) and audits it for the block's athlete status and
 * length, with the global --level and --max-rir. Free prog and au with prog_free and
 * audit_free (both are left empty on failure). */
int dbu_block_audit(const struct sd_ctx *ctx, const struct db_block *b,
		    const struct db_program *src, double session_cap, struct sd_program *prog,
		    struct sd_audit *au, struct sd_err *e);
/* The library's canonical name of LIFT into buf, or an error suggesting the closest names. */
int dbu_lift(const struct sd_library *lib, const char *lift, char *buf, size_t n, struct sd_err *e);

#endif
