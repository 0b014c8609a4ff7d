/* The exercise library: which muscles each exercise trains directly (prime movers)
 * and indirectly (synergists). Plain data; io/library.c fills it from INI files.
 *
 * Ownership: a library owns its exercises and alias strings; lib_free releases them. */
#ifndef SD_LIBRARY_H
#define SD_LIBRARY_H

#include "err.h"
#include "muscle.h"

#define SD_NAME_MAX 64
#define SD_FATIGUE_MIN 0.25
#define SD_FATIGUE_MAX 5.0

struct sd_exercise {
	char name[SD_NAME_MAX];
	char key[SD_NAME_MAX];   /* normalised name, set by lib_put */
	char **aliases;          /* naliases strings */
	int naliases;
	sd_mset direct, indirect;
	char kind[16];           /* barbell, dumbbell, machine, cable, bodyweight, other */
	double fatigue;          /* systemic and axial cost of one hard set, 1 = a typical machine or
				  * isolation set; SD_FATIGUE_MIN..SD_FATIGUE_MAX, 1.0 when unstated */
};

struct sd_libkey {
	char key[SD_NAME_MAX];   /* normalised name or alias */
	int ex;
};

struct sd_library {
	struct sd_exercise *ex;
	int n, cap;
	struct sd_libkey *keys;  /* sorted by key once lib_index has run; NULL before */
	int nkeys;
};

/* Adds or replaces (same normalised name) an exercise; takes ownership of x's aliases. A
 * fatigue of 0 (unset) becomes 1.0. */
int lib_put(struct sd_library *lib, struct sd_exercise *x, struct sd_err *e);
/* Builds the sorted name index lib_find uses; call after the last lib_put. */
int lib_index(struct sd_library *lib, struct sd_err *e);
/* Index of the exercise whose name or alias matches, ignoring case, spaces, '-' and '_'; -1 if none. */
int lib_find(const struct sd_library *lib, const char *name);
/* Writes up to k indices of the closest names (edit distance) into out; returns how many. */
int lib_suggest(const struct sd_library *lib, const char *name, int *out, int k);
/* Normalises a name for matching into buf (lowercase, no spaces, '-' or '_'). */
void lib_norm(const char *in, char *buf, int size);
void lib_free(struct sd_library *lib);

#endif
