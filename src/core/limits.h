/* Every limit a rule of setdose checks, in one place: the commands, the full-screen interface,
 * the readers and the store all take their bounds from here. */
#ifndef SD_LIMITS_H
#define SD_LIMITS_H

/* A block or program length, in weeks. Beyond two years the curve's weeks term has no
 * evidence at all (the profile's evidence range is narrower still and flagged separately). */
#define SD_WEEKS_MIN 1
#define SD_WEEKS_MAX 104

/* Fractional sets of one muscle in one session above which a warning is given (common
 * practice, no source), and the range a user may set it to. */
#define SD_SESSION_CAP_DEFAULT 10.0
#define SD_SESSION_CAP_MIN 0.5
#define SD_SESSION_CAP_MAX 100.0

/* Reps of a strength test: the 1RM equations are refused above SD_TEST_REPS_MAX and warn
 * above SD_TEST_REPS_WARN (Reynolds, Gordon & Robergs 2006). */
#define SD_TEST_REPS_MAX 20
#define SD_TEST_REPS_WARN 10

/* Stored names and notes, bytes including the terminating NUL. */
#define SD_NAME_MAX 64          /* athlete, lift */
#define SD_PROGNAME_MAX 128     /* program template */
#define SD_NOTES_MAX 1024

/* Record IDs typed by a user. */
#define SD_ID_MAX 1000000000000000LL   /* 1e15: exact as a double, far above any row id */

/* A file or database path. */
#define SD_PATH_MAX 1024

#endif
