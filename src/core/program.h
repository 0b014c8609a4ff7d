/* A weekly program as plain data: days in order, each a list of set groups. io/program_io.c
 * builds it from INI or CSV; core/volume.c counts it; io/program_write.c writes it back.
 *
 * One line of a program ("bench press = 1x3 @9, 3x5 @7") gives one entry per set group, all
 * with the line's number. The same exercise on two lines of one day gives entries that simply
 * add up (with a note). */
#ifndef SD_PROGRAM_H
#define SD_PROGRAM_H

#include "err.h"

/* Documented bounds of the numeric fields of a program (man setdose, PROGRAM FILES). */
#define SD_MAX_SETS 100        /* sets in one group above this are refused as absurd */
#define SD_MAX_REPS 100
#define SD_MAX_RIR 10
#define SD_MIN_RPE 1           /* the RIR-based RPE scale runs 1..10 */
#define SD_MAX_RPE 10
#define SD_MAX_SECONDS 3600    /* one timed set */
#define SD_MAX_LOAD_PCT 150    /* percent of 1RM (supramaximal holds and partials) */
#include "limits.h"

#define SD_MAX_WEEKS SD_WEEKS_MAX
#define SD_PROG_NAME_MAX 127   /* bytes of a program name (the store's limit too) */
#define SD_DAY_NAME_MAX 63     /* bytes of a day name */

/* How the effort of a group was written, so it is written back the same way. */
enum sd_effort { SD_EFFORT_NONE, SD_EFFORT_RIR, SD_EFFORT_RPE };

/* Flags of a set group. */
#define SD_SET_AMRAP  1u       /* as many reps as possible: RIR 0 unless an effort is stated */
#define SD_SET_TIMED  2u       /* reps/reps_hi are seconds */
#define SD_SET_SIDE   4u       /* per side (3x8/side): still 3 sets */
#define SD_SET_WARMUP 8u       /* warm-up sets: listed, never counted */

struct sd_entry {
	int ex;          /* index into the library */
	int sets;        /* 1..SD_MAX_SETS */
	int reps;        /* reps, the low end of a range, or seconds (SD_SET_TIMED); 0 if not given */
	double rir;      /* RIR the hard-set rule uses (a range's midpoint); -1 when not stated */
	int day;         /* index into days */
	int line;        /* source line, for messages */
	int reps_hi;     /* high end of a rep range; equal to reps when not a range */
	unsigned flags;  /* SD_SET_* */
	int effort;      /* enum sd_effort: the scale the effort was written in */
	double eff_lo, eff_hi;   /* the effort as written on that scale (RPE 7-8: 7 and 8) */
	int load_pct;    /* percent of 1RM ("@75%"), 0 when not given */
};

struct sd_day {
	char name[SD_DAY_NAME_MAX + 1];
	int line;
};

/* Something a coach should see about how the program was read (not an error). */
struct sd_pnote {
	int line;
	int day;         /* -1 when not about one day */
	char text[160];
};

struct sd_program {
	char name[SD_PROG_NAME_MAX + 1];
	int named;                 /* the name came from the file, not from its path */
	int weeks;                 /* block length; 0 when the file does not say */
	int bare_rir;              /* 'effort = rir': a bare @N is RIR N (files written before @N meant RPE) */
	struct sd_day *days;
	int ndays, capdays;
	struct sd_entry *entries;
	int nentries, capentries;
	struct sd_pnote *notes;
	int nnotes, capnotes;
};

int prog_add_day(struct sd_program *p, const char *name, int line, struct sd_err *e);
int prog_add_entry(struct sd_program *p, const struct sd_entry *en, struct sd_err *e);
/* Adds a note (printf-style text, cut to fit the note with an ellipsis). */
int prog_note(struct sd_program *p, int line, int day, struct sd_err *e, const char *fmt, ...)
	__attribute__((format(printf, 5, 6)));
void prog_free(struct sd_program *p);

/* How a prescription was read, beyond its groups: for the caller's notes. */
struct sd_setinfo {
	double bare_low;           /* a bare @N below 5 read as RPE N: N; -1 if none */
};

/* Parses a prescription (grammar: man setdose, PROGRAM FILES): one or more comma-separated
 * groups such as "4", "3x8-12 @8", "1x3 RPE 9, 3x5 RIR 2", "2x5 warm-up", "3x30s", "3xAMRAP",
 * "3x8/side". Fills up to max entries (ex, day and line left for the caller) and returns how
 * many, or -1 with a message naming the problem (not the file). bare_rir: a bare @N is RIR. */
int prog_parse_sets(const char *text, int bare_rir, struct sd_entry *out, int max,
		    struct sd_setinfo *info, struct sd_err *e);
/* Parses a reps field alone ("8", "8-12", "AMRAP", "30s", "8/side") into en. */
int prog_parse_reps(const char *text, struct sd_entry *en, struct sd_err *e);
/* Parses an effort field alone on a known scale (a CSV rir or rpe column): "2", "1-2", "8.5",
 * "8,5". */
int prog_parse_effort(const char *text, enum sd_effort scale, struct sd_entry *en, struct sd_err *e);
/* Parses an effort written as in programs, scale included: "RIR 2", "RPE 8", "@8" (RPE),
 * "@2 RIR", "RPE 7-8", "@RIR 1". */
int prog_parse_effort_text(const char *text, struct sd_entry *en, struct sd_err *e);
/* Writes a group back in the notation prog_parse_sets reads ("3x8-12 @8"). */
void prog_format_group(const struct sd_entry *en, char *buf, int size);

#endif
