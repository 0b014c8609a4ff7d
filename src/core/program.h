/* A weekly program as plain data: days in order, each a list of exercise entries.
 * io/program.c builds it from INI or CSV; core/volume.c counts it. */
#ifndef SD_PROGRAM_H
#define SD_PROGRAM_H

#include "err.h"

#define SD_MAX_SETS 100        /* sets of one exercise in one day above this are refused as absurd */
#define SD_MAX_REPS 100
#define SD_MAX_RIR 10

struct sd_entry {
	int ex;        /* index into the library */
	int sets;      /* 1..SD_MAX_SETS */
	int reps;      /* 0 when not given */
	int rir;       /* -1 when not given (counted as hard) */
	int day;       /* index into days */
	int line;      /* source line, for messages */
};

struct sd_day {
	char name[64];
	int line;
};

struct sd_program {
	char name[128];
	int weeks;                 /* block length; 0 when the file does not say */
	struct sd_day *days;
	int ndays, capdays;
	struct sd_entry *entries;
	int nentries, capentries;
};

int prog_add_day(struct sd_program *p, const char *name, int line, struct sd_err *e);
int prog_add_entry(struct sd_program *p, const struct sd_entry *en, struct sd_err *e);
void prog_free(struct sd_program *p);

/* Parses a set prescription: "4", "3x8", "3 x 8 @2", "4@1". Returns 0 or -1 with a
 * message naming the problem (not the file). */
int prog_parse_sets(const char *text, int *sets, int *reps, int *rir, struct sd_err *e);

#endif
