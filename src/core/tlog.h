/* The training log's numbers: ISO 8601 weeks, the weekly fractional sets of the logged hard
 * sets next to the planned dose of the blocks a week falls in, adherence, a block's logged
 * average dose, the e1RM of a logged set and each lift's weekly best, and the ordinal that
 * tells identical logged rows apart. Pure computation; io/log_io.c reads log files into
 * struct tlog_entry, cmd/logdata.c feeds the store's rows in.
 *
 * Counting follows core/volume.h exactly: a hard set adds w_direct to each prime mover and
 * w_indirect to each synergist; a set whose RIR is above the limit is not counted; a set
 * without a recorded effort counts (as in programs), and so does every set of an exercise the
 * library marks as not graded by RIR. */
#ifndef SD_TLOG_H
#define SD_TLOG_H

#include "library.h"
#include "muscle.h"

/* The rep range of the 1RM equations: a logged set gives an e1RM only when its reps to
 * failure (reps + RIR) are at most this; beyond it the equations lose accuracy (Reynolds,
 * Gordon & Robergs 2006; the same limit `test add` warns at, core/e1rm.h). */
#define TLOG_E1RM_MAX_RTF 10

/* Load units of a logged row. TLOG_UNIT_DEFAULT: a number written without a unit, in the
 * athlete's units (the reader resolves it). */
enum { TLOG_UNIT_NONE, TLOG_UNIT_KG, TLOG_UNIT_LB, TLOG_UNIT_DEFAULT };

/* One row of a log file as read (io/log_io.c). */
struct tlog_entry {
	long long athlete_id;    /* resolved by the reader's caller */
	long day;                /* day number (core/date.h) */
	int ex;                  /* library index */
	int sets;                /* identical sets the row stands for */
	int reps;                /* reps of each, or seconds when timed */
	int timed;
	double rir;              /* reps in reserve, -1 when no effort was recorded */
	int scale;               /* enum sd_effort: how the effort was written */
	double eff_lo, eff_hi;   /* the effort as written on that scale */
	double load;             /* as written; 0 with TLOG_UNIT_NONE */
	int unit;                /* TLOG_UNIT_* (never DEFAULT once read) */
	int line;                /* in its file */
	int ordinal;             /* tlog_ordinals */
};

/* Sets each entry's ordinal: its place (from 1, in line order) among the entries identical
 * to it in athlete, day, exercise, sets, reps, timed, RIR, load and unit: the identity the
 * store recognises the same row by (db/002_logs.sql). Fails only when out of memory. */
int tlog_ordinals(struct tlog_entry *v, int n, struct sd_err *e);

/* The effort as text the log reader reads back ("RIR 2", "RPE 8.5", "RPE 7-8"; "" when
 * none). */
void tlog_effort_text(int scale, double lo, double hi, char *buf, int size);

/* ISO 8601 week of day number `day`: *year is the ISO year (that of the week's Thursday),
 * *week 1..53. Returns the weekday, 1 (Monday) to 7 (Sunday). */
int tlog_iso_week(long day, int *year, int *week);
/* The Monday of the ISO week holding day. */
long tlog_monday(long day);

/* One exercise's logged sets on one day, as the store sums them. */
struct tlog_daysets {
	long day;
	int ex;                  /* library index, -1 when the library no longer knows it */
	int within;              /* sets with RIR at most the limit */
	int above;               /* sets with RIR above it */
	int unrecorded;          /* sets without a recorded effort */
};

struct tlog_week {
	long monday;
	int year, week;                  /* ISO */
	double done[SD_NMUSCLES];        /* fractional sets from the logged hard sets */
	double planned[SD_NMUSCLES];     /* the blocks' weekly dose for the week's days in them */
	double planned_sessions;         /* the blocks' training days, the same way */
	int sessions;                    /* days with at least one logged hard set */
	int hard_sets, easy_sets;        /* whole sets logged (easy: RIR above the limit) */
	long long block;                 /* the block with the most days in the week, 0: none */
	int block_days;                  /* its days in the week */
	unsigned char days;              /* bit d: a hard set on day d (0 Monday) */
};

/* Consecutive ISO weeks. */
struct tlog_weeks {
	struct tlog_week *w;
	int n;
	int unknown_sets;                /* hard sets of exercises the library does not know */
};

/* One exercise's sets at one effort over one ISO week, as the store keeps them summed. */
struct tlog_weekrow {
	long monday;
	int ex;                  /* library index, -1 when the library no longer knows it */
	double rir;              /* -1: no effort recorded */
	int sets;
	unsigned days;           /* bit d: logged on day d of the week (0 Monday) */
};

/* The weeks from the one holding `from` to the one holding `to`, all empty. */
int tlog_weeks_init(struct tlog_weeks *ws, long from, long to, struct sd_err *e);
/* Adds one week row (a week outside the weeks is ignored); its sets are hard when the RIR is
 * at most max_rir, not recorded, or the exercise is not graded by RIR. */
void tlog_weeks_add(struct tlog_weeks *ws, const struct sd_library *lib, double w_direct,
		    double w_indirect, int max_rir, const struct tlog_weekrow *r);
/* Adds a block's plan: each week gets dose (weekly fractional sets per muscle) and sessions
 * (training days a week) times the share of its 7 days inside [start, end]; the week's
 * block becomes this one when it has more days in the week than the block recorded so far
 * (the later block on a tie, when plans are added in start order). */
void tlog_weeks_plan(struct tlog_weeks *ws, long long block, long start, long end,
		     const double dose[SD_NMUSCLES], int sessions);
/* Index of the week holding day, -1 when outside. */
int tlog_weeks_find(const struct tlog_weeks *ws, long day);
void tlog_weeks_free(struct tlog_weeks *ws);

/* Adherence in percent, 100 done / planned; NAN when nothing was planned. */
double tlog_adherence(double done, double planned);
/* Planned training days not trained in the week: the planned sessions rounded to the nearest
 * whole day, less the days with a logged hard set, never below 0. */
int tlog_missed(const struct tlog_week *w);

/* A span of days and what was logged in it, for a block's average dose. */
struct tlog_span {
	long from, to;                   /* inclusive */
	double sum[SD_NMUSCLES];         /* fractional sets from the hard sets in it */
	int days;                        /* days with a logged hard set */
	long last;                       /* last such day, for counting days */
	int rows;                        /* exercise-days added */
};

void tlog_span_init(struct tlog_span *s, long from, long to);
/* Adds one exercise's sets of one day (outside the span: ignored). */
void tlog_span_add(struct tlog_span *s, const struct sd_library *lib, double w_direct,
		   double w_indirect, const struct tlog_daysets *d);
/* The span's length in weeks (days / 7). */
double tlog_span_weeks(const struct tlog_span *s);
/* The average weekly dose: each muscle's sum over the span divided by its length in weeks. */
void tlog_span_dose(const struct tlog_span *s, double out[SD_NMUSCLES]);

/* The e1RM of a logged set with formula f (core/e1rm.h), its reps plus RIR taken as reps to
 * failure (common practice, no source), in the unit of load. 0 with *out and *rtf set, or -1
 * when the set cannot give one: no load, no recorded effort, a timed set, or reps to failure
 * above TLOG_E1RM_MAX_RTF. A set to failure of one rep is the load itself. */
int tlog_e1rm(int f, double load, int reps, double rir, int timed, double *out, double *rtf);

/* A lift's best e1RM in one ISO week, and the set it came from. */
struct tlog_best {
	int ex;
	long monday;
	long day;
	double e1rm_kg, load_kg, rir, rtf;
	int reps;
};

/* Weekly bests of every lift: per (exercise, week) the set with the highest e1RM. */
struct tlog_trend {
	struct tlog_best *v;
	int n, cap;
};

/* Offers one set's e1RM; it replaces the week's best of its lift when higher. */
int tlog_trend_add(struct tlog_trend *t, const struct tlog_best *b, struct sd_err *e);
/* Orders by exercise, then week. */
void tlog_trend_sort(struct tlog_trend *t);
void tlog_trend_free(struct tlog_trend *t);

#endif
