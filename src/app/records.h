/* The rules for what is stored: athletes and templates found by name (with a did-you-mean),
 * blocks that do not overlap by accident, tests that are neither in the future nor recorded
 * twice. The commands and the interface both call these, inside their own db_begin ..
 * db_commit, so both obey the same rules with the same messages. */
#ifndef SD_APP_RECORDS_H
#define SD_APP_RECORDS_H

#include "../core/program.h"
#include "../store/db.h"
#include "ctx.h"

/* Finds an athlete or a template by name; an unknown name fails naming up to three close
 * stored names ("did you mean ...?"). */
int app_athlete_get(struct sd_db *db, const char *name, struct db_athlete *out, struct sd_err *e);
int app_program_get(struct sd_db *db, const char *name, struct db_program *out, struct sd_err *e);
/* Reads the program file at path, checks it against the exercise library and stores it as a
 * template (inside the caller's transaction) under name_opt, else the file's [program] name,
 * else the file's name without folder and extension. prog gets the parsed program (free it
 * with prog_free; left empty on failure), name (n bytes) the stored name. */
int app_program_add_file(const struct sd_ctx *ctx, const char *path, const char *name_opt,
			 struct sd_program *prog, char *name, size_t n, struct sd_err *e);
/* The library's canonical name of LIFT into buf, or an error suggesting the closest names. */
int app_lift(const struct sd_library *lib, const char *lift, char *buf, size_t n, struct sd_err *e);

/* Adds a block: athlete a follows template p from start for `weeks` (0: the template's own
 * length, which it must then state). The template must still read with the current exercise
 * library. A block whose weeks meet another block of the athlete (an open one counts as running
 * on) is refused unless overlap is 1. *id and *weeks_out get what was stored. */
int app_block_add(const struct sd_ctx *ctx, const struct db_athlete *a, const struct db_program *p,
		  const char *start, int weeks, int overlap, long long *id, int *weeks_out,
		  struct sd_err *e);
/* Ends block id on `end` (NULL: today); a date after today is refused. end_out (DATE_LEN
 * bytes, may be NULL) gets the date used. */
int app_block_end(struct sd_db *db, long long id, const char *end, char *end_out,
		  struct sd_err *e);

/* Which input of a test was wrong (for a form to put its cursor there). */
enum app_test_field { APP_T_LIFT, APP_T_DATE, APP_T_LOAD, APP_T_REPS };
/* Builds a test record of athlete a from typed values: lift (library name), date (NULL or "":
 * today; not after today), load (in the athlete's units unless it names kg or lb), reps (NULL
 * or "": 1, a tested 1RM; 1..SD_TEST_REPS_MAX) and an e1rm.h formula. *warn is set above
 * SD_TEST_REPS_WARN reps. On failure *field names the input at fault. */
int app_test_build(const struct sd_ctx *ctx, const struct db_athlete *a, const char *lift,
		   const char *date, const char *load, const char *reps, int formula,
		   struct db_test *t, int *warn, int *field, struct sd_err *e);
/* Stores t; the exact same test (athlete, lift, date, load, reps) recorded before is refused. */
int app_test_add(struct sd_db *db, struct db_test *t, struct sd_err *e);

#endif
