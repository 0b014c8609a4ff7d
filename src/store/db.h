/* The store: athletes, program templates, training blocks and strength tests in SQLite.
 * This module is the only code that touches SQLite; sqlite3 types never leave it.
 *
 * Contract: every function returns 0 (or a count, where it says) on success and -1 with e
 * filled on failure. Writes are made inside db_begin .. db_commit so one command's writes land
 * together or not at all; db_close rolls back a transaction left open. Dates are ISO
 * YYYY-MM-DD strings, loads are kilograms. Records own nothing unless a field says so. */
#ifndef SD_DB_H
#define SD_DB_H

#include <stddef.h>

#include "../core/err.h"

#include "../core/limits.h"

#define DB_NAME_MAX SD_NAME_MAX
#define DB_PROGNAME_MAX SD_PROGNAME_MAX
#define DB_NOTES_MAX SD_NOTES_MAX
#define DB_DATE_LEN 11          /* "YYYY-MM-DD" and its NUL */
#define DB_STAMP_LEN 20         /* "YYYY-MM-DD HH:MM:SS" and its NUL */
#define DB_FORMULA_MAX 16
#define DB_EFFORT_MAX 16        /* a log row's effort as written: "RPE 8.5", "RIR 1-2" */
#define DB_SOURCE_MAX 96        /* a log row's origin: "FILE line N" */

struct sd_db;

struct db_athlete {
	long long id;
	char name[DB_NAME_MAX];
	int trained;                /* 1 trained, 0 untrained */
	int units_lb;               /* 1: loads shown and entered in lb */
	char notes[DB_NOTES_MAX];
	char created[DB_STAMP_LEN]; /* UTC */
};

struct db_program {
	long long id;
	char name[DB_PROGNAME_MAX];
	int is_csv;                 /* the source is CSV, not INI */
	char *source;               /* the template text verbatim, NUL-terminated; owned */
	size_t len;                 /* bytes in source (it may hold no NUL of its own) */
	char created[DB_STAMP_LEN];
};

struct db_block {
	long long id;
	long long athlete_id, program_id;
	char athlete[DB_NAME_MAX];
	char program[DB_PROGNAME_MAX];
	char start[DB_DATE_LEN];
	char end[DB_DATE_LEN];      /* "" while the block is open */
	int weeks;                  /* planned length */
	int trained;                /* the athlete's current status: 1 trained */
};

struct db_test {
	long long id, athlete_id;
	char lift[DB_NAME_MAX];     /* the library's canonical exercise name */
	char date[DB_DATE_LEN];
	double load_kg;
	int reps;
	double e1rm_kg;
	char formula[DB_FORMULA_MAX];
};

/* One row of the training log (db/002_logs.sql says how rows are recognised as the same). */
struct db_log {
	long long athlete_id;
	char date[DB_DATE_LEN];
	char exercise[DB_NAME_MAX]; /* the library's canonical name */
	int sets;                   /* identical sets the row stands for, 1..100 */
	int reps;                   /* reps of each, or seconds when timed */
	int timed;
	double rir;                 /* reps in reserve; -1 when the log did not record an effort */
	char effort[DB_EFFORT_MAX]; /* the effort as written ("RPE 8"), "" when none */
	double load;                /* in unit as entered; 0 with unit "" (no load) */
	char unit[3];               /* "kg", "lb" or "" */
	int ordinal;                /* place among the identical rows of its athlete and day in
				     * its file, from 1 */
	char source[DB_SOURCE_MAX]; /* where it was first imported from (not part of identity) */
};

/* The log summed per day and exercise, for the weekly aggregation: sets whose RIR is at most
 * max_rir, above it, and without a recorded effort. */
struct db_log_sum {
	char date[DB_DATE_LEN];
	char exercise[DB_NAME_MAX];
	int within, above, unrecorded;
};

/* The log summed per ISO week (its Monday), exercise and RIR (-1: not recorded), with the days
 * of the week the sets were logged on (bit d: day d, 0 Monday). */
struct db_log_week {
	char monday[DB_DATE_LEN];
	char exercise[DB_NAME_MAX];
	double rir;
	int sets;
	unsigned days;
};

/* Called once per record by the *_each functions; a non-zero return stops the walk and is
 * returned (a callback that fails fills its own error). */
typedef int (*db_block_fn)(const struct db_block *b, void *arg);
/* Log rows; athlete is the athlete's name. */
typedef int (*db_log_fn)(const struct db_log *r, const char *athlete, void *arg);
typedef int (*db_log_sum_fn)(const struct db_log_sum *s, void *arg);
typedef int (*db_log_week_fn)(const struct db_log_week *w, void *arg);
/* Hands out the rows to add one by one: 1 with *out filled, 0 at the end, -1 on an error
 * (filled by the producer). */
typedef int (*db_log_next_fn)(void *arg, struct db_log *out, struct sd_err *e);

/* Opens the database at path: a new file (and its folder) is created read-write and migrated;
 * an existing one is opened read-only (so reading works on a read-only file or folder) and
 * reopened read-write by the first db_begin. Where the folder cannot hold SQLite's WAL index
 * the file is read through a checked in-memory snapshot (see db.c). Foreign keys on, WAL
 * journal, a busy timeout. ":memory:" works for tests. */
int db_open(const char *path, struct sd_db **out, struct sd_err *e);
/* Closes; rolls back an unfinished transaction. NULL is a no-op. */
void db_close(struct sd_db *db);
/* The default database path: $XDG_DATA_HOME/setdose/setdose.db, else
 * $HOME/.local/share/setdose/setdose.db; returns buf, or NULL when neither variable is set. */
const char *db_default_path(char *buf, size_t n);
/* The path db was opened with. */
const char *db_path(const struct sd_db *db);
/* Schema version of the open database, and the newest this binary knows. */
int db_schema_version(struct sd_db *db);
int db_schema_latest(void);

/* One write transaction (taken at once, waiting out other writers up to the busy timeout).
 * Reopens a read-only connection read-write, and refuses a damaged database (PRAGMA
 * quick_check) before anything is written. */
int db_begin(struct sd_db *db, struct sd_err *e);
int db_commit(struct sd_db *db, struct sd_err *e);
/* Rolls back the open transaction, if any. */
void db_rollback(struct sd_db *db);

/* PRAGMA integrity_check and foreign_key_check: 0 when both pass; otherwise -1 with the
 * first problems in e. *problems (may be NULL) gets how many rows they reported. */
int db_check(struct sd_db *db, int *problems, struct sd_err *e);
/* Copies the open database with the online backup API into dest, an empty file the caller
 * made (io/safefile.h's temporary file, renamed into place only after this succeeds), then
 * checks the copy (integrity_check, foreign_key_check) and fails if it does not pass. `label`
 * names the target in messages. */
int db_backup(struct sd_db *db, const char *dest, const char *label, struct sd_err *e);
/* Copies every row that can still be read from the (damaged) database at src into dest, an
 * empty file the caller made, under the current schema; rows whose parent row was lost or
 * that break a constraint are left out and counted. The copy is checked like a backup.
 * Never writes to src. */
struct db_recovery {
	int tables;                 /* tables copied */
	long long rows, dropped;    /* rows copied; rows read but left out */
	int damaged;                /* damaged regions skipped while reading */
	char detail[400];           /* "athletes 8, programs 3, ..." */
};
int db_recover(const char *src, const char *dest, const char *label, struct db_recovery *r,
	       struct sd_err *e);
/* Takes a new snapshot of a database read through a snapshot (read-only folder); a no-op
 * for a live connection, which sees other processes' commits at its next read. */
int db_refresh(struct sd_db *db, struct sd_err *e);

/* Athletes. Names are unique, compared case-insensitively (ASCII). */
int db_athlete_add(struct sd_db *db, const struct db_athlete *a, long long *id, struct sd_err *e);
/* Finds by name; fails with "unknown athlete 'NAME'" when absent. */
int db_athlete_get(struct sd_db *db, const char *name, struct db_athlete *out, struct sd_err *e);
/* Rewrites name, status, units and notes of the athlete with a->id. */
int db_athlete_update(struct sd_db *db, const struct db_athlete *a, struct sd_err *e);
/* All athletes by name; *out is malloc'd (free it), *n set. */
int db_athlete_list(struct sd_db *db, struct db_athlete **out, int *n, struct sd_err *e);
/* The roster in compact form, for lists of many athletes: per athlete its id, status, units,
 * name, the name folded to lowercase (for searching) and the first note_max bytes of its notes
 * (0: all of them), in one string pool. 100,000 athletes take a few MB, not 113. */
struct db_roster_row {
	long long id;
	const char *name, *key, *notes;
	unsigned char trained, units_lb;
	int nblocks, ntests;        /* with_counts only */
	char created[11];           /* YYYY-MM-DD, UTC */
};
struct db_roster {
	struct db_roster_row *v;
	int n;
	char *pool;
	size_t used, cap;
};
int db_roster_load(struct sd_db *db, int note_max, int with_counts, struct db_roster *r,
		   struct sd_err *e);
void db_roster_free(struct db_roster *r);
/* Finds by id (full record, notes included). */
int db_athlete_get_id(struct sd_db *db, long long id, struct db_athlete *out, struct sd_err *e);
/* Blocks and tests that reference the athlete. */
int db_athlete_refs(struct sd_db *db, long long id, int *nblocks, int *ntests, struct sd_err *e);
/* Removes the athlete; with cascade also its blocks and tests, else refuses while they exist. */
int db_athlete_rm(struct sd_db *db, long long id, int cascade, struct sd_err *e);

/* Program templates. Names are unique, compared case-insensitively (ASCII). */
int db_program_add(struct sd_db *db, const char *name, const char *src, size_t len, int is_csv,
		   long long *id, struct sd_err *e);
/* Finds by name, loading the source; free with db_program_free. */
int db_program_get(struct sd_db *db, const char *name, struct db_program *out, struct sd_err *e);
int db_program_get_id(struct sd_db *db, long long id, struct db_program *out, struct sd_err *e);
/* All templates by name, without their source (source NULL, len set); free with
 * db_program_list_free. */
int db_program_list(struct sd_db *db, struct db_program **out, int *n, struct sd_err *e);
/* Blocks that use the template. */
int db_program_refs(struct sd_db *db, long long id, int *nblocks, struct sd_err *e);
/* Removes a template; refuses while blocks use it. */
int db_program_rm(struct sd_db *db, long long id, struct sd_err *e);
void db_program_free(struct db_program *p);
void db_program_list_free(struct db_program *p, int n);

/* Training blocks. */
int db_block_add(struct sd_db *db, long long athlete_id, long long program_id, const char *start,
		 int weeks, long long *id, struct sd_err *e);
/* Fails with "unknown block ID" when absent. */
int db_block_get(struct sd_db *db, long long id, struct db_block *out, struct sd_err *e);
/* Sets the end date of an open block. */
int db_block_end(struct sd_db *db, long long id, const char *end, struct sd_err *e);
/* Blocks of one athlete (athlete_id > 0) or all, by start date then id; *out malloc'd. */
int db_block_list(struct sd_db *db, long long athlete_id, struct db_block **out, int *n,
		  struct sd_err *e);
/* Walks the open blocks (no end date) ordered by athlete name, start, id, without loading them
 * all at once. Returns 0, -1 on a store error, or the callback's non-zero value. */
int db_block_each_open(struct sd_db *db, db_block_fn fn, void *arg, struct sd_err *e);

/* Longest athlete and program names among the open blocks, and how many there are. */
int db_block_open_widths(struct sd_db *db, int *athlete, int *program, long long *n,
			 struct sd_err *e);

/* Strength tests. */
int db_test_add(struct sd_db *db, const struct db_test *t, long long *id, struct sd_err *e);
/* Tests of one athlete, optionally of one lift (NULL: all), by lift, date, id; *out malloc'd. */
int db_test_list(struct sd_db *db, long long athlete_id, const char *lift, struct db_test **out,
		 int *n, struct sd_err *e);

/* The training log (store/logs.c). */
/* Adds rows inside the caller's transaction (db_begin .. db_commit), all through one prepared
 * statement; a row identical to a stored one (same identity, see db/002_logs.sql) is
 * skipped. *added gets how many were new; the weekly sums (db_log_weeks) grow by them. */
int db_log_add(struct sd_db *db, db_log_next_fn next, void *arg, long long *added,
	       struct sd_err *e);
/* Walks the rows of one athlete (athlete_id > 0) or of all, by athlete name, date, id,
 * between from and to (inclusive; NULL: open). Returns 0, -1 or the callback's value. */
int db_log_each(struct sd_db *db, long long athlete_id, const char *from, const char *to,
		db_log_fn fn, void *arg, struct sd_err *e);
/* Walks one athlete's log summed per date and exercise (dates in order) between from and to
 * (NULL: open), counting sets against max_rir. Reads the index only. */
int db_log_sums(struct sd_db *db, long long athlete_id, const char *from, const char *to,
		double max_rir, db_log_sum_fn fn, void *arg, struct sd_err *e);
/* Walks one athlete's log summed per week, exercise and RIR, for the weeks whose Monday is
 * between from and to (NULL: open), in week order. Reads one row per week, exercise and
 * effort however many sets were logged. */
int db_log_weeks(struct sd_db *db, long long athlete_id, const char *from, const char *to,
		 db_log_week_fn fn, void *arg, struct sd_err *e);
/* Rows stored for an athlete (athlete_id > 0) or in all; and whether any exist between
 * from and to. */
int db_log_count(struct sd_db *db, long long athlete_id, long long *n, struct sd_err *e);
int db_log_any(struct sd_db *db, long long athlete_id, const char *from, const char *to,
	       int *any, struct sd_err *e);

#endif
