/* Training log files: CSV with a header row, read into core/tlog.h entries (every bad row
 * reported with its line, nothing returned unless every row is good) and written back in
 * the same format. The format is documented in man setdose, LOG FILES:
 *
 *   date,exercise,sets,reps,load,effort,athlete
 *   2026-12-31,back squat,3,5,100kg,RIR 2,
 *
 * Columns in any order, names case-insensitive. Required: date (YYYY-MM-DD, not after
 * today), exercise (resolved as in programs), reps (reps done, or seconds: 30s). Optional:
 * sets (identical sets, default 1), load (100kg, 225lb, a bare number in the athlete's units;
 * empty or "bw": no load), one effort column: effort (as programs write it: RIR 2, RPE 8, @8)
 * or rir or rpe (a number), athlete (the athlete's name; empty: the one given with
 * --athlete), notes (ignored). Lines starting with '#' are comments; ',', ';' or tab
 * separates, as for CSV programs. */
#ifndef SD_LOG_IO_H
#define SD_LOG_IO_H

#include <stdio.h>

#include "../core/tlog.h"

struct logio_src {
	const struct sd_library *lib;
	long today;                 /* day number: later dates are refused */
	/* Resolves an athlete named in the file: 0 with *id and *lb (a bare load is in lb), or
	 * -1 with e saying why ("unknown athlete 'X'"). */
	int (*athlete)(void *arg, const char *name, long long *id, int *lb, struct sd_err *e);
	void *arg;
	int have_default;           /* rows without an athlete belong to default_id */
	long long default_id;
	int default_lb;
};

struct logio_rows {
	struct tlog_entry *v;
	int n, cap;
};

/* Reads the log file at path. On any bad row: -1, e holding the first problem ("cannot read
 * log 'PATH' line N: ...", with "(first of N errors)") and the others in e->more, out empty. */
int logio_read(const char *path, const struct logio_src *src, struct logio_rows *out,
	       struct sd_err *e);
void logio_free(struct logio_rows *r);

/* The header the writer uses, and one row in the same format (load 0: an empty cell). */
void logio_head(FILE *f);
void logio_row(FILE *f, const char *date, const char *athlete, const char *exercise, int sets,
	       int reps, int timed, double load, const char *unit, const char *effort);

#endif
