/* The exercise library: which muscles each exercise trains directly (prime movers)
 * and indirectly (synergists). Plain data; io/library_io.c fills it from INI files.
 *
 * Names are matched folded (libname.c): case, spaces, hyphens, underscores, apostrophes,
 * plurals and a few word abbreviations (db, bb, kb, sl...) do not matter.
 *
 * Ownership: a library owns its exercises, alias strings and [aliases] entries; lib_free
 * releases them. */
#ifndef SD_LIBRARY_H
#define SD_LIBRARY_H

#include "err.h"
#include "muscle.h"

#define SD_NAME_MAX 64           /* a name or alias is at most SD_NAME_MAX - 1 bytes */
#define SD_KEY_MAX 160           /* a folded name, abbreviations spelled out */
#define SD_FATIGUE_MIN 0.25
#define SD_FATIGUE_MAX 5.0
#define SD_MAX_CHOICES 8         /* exercises one ambiguous name may stand for */

struct sd_exercise {
	char name[SD_NAME_MAX];
	char key[SD_KEY_MAX];    /* folded name, set by lib_put */
	unsigned keyhash;        /* of key, so lib_put finds a same-named exercise quickly */
	char **aliases;          /* naliases strings */
	int naliases;
	sd_mset direct, indirect;
	char kind[16];           /* barbell, dumbbell, machine, cable, bodyweight, other */
	double fatigue;          /* systemic and axial cost of one hard set, 1 = a typical machine or
				  * isolation set; SD_FATIGUE_MIN..SD_FATIGUE_MAX, 1.0 when unstated */
	int ungraded;            /* sets are not graded by reps in reserve (Olympic lifts, carries,
				  * sleds): every listed working set counts as a hard set */
};

/* A name given in an [aliases] section: one exercise, or several when it is ambiguous. */
struct sd_alias {
	char name[SD_NAME_MAX];
	char key[SD_KEY_MAX];
	char target[SD_MAX_CHOICES][SD_NAME_MAX];   /* as written */
	int ntargets;
	int ex[SD_MAX_CHOICES];  /* resolved by lib_index */
	char *origin;            /* file, for messages; owned */
	int line;
};

struct sd_libkey {
	const char *key;         /* folded name or alias: in ex[].key, al[].key or keypool */
	int ex;                  /* exercise, or -1 - i for ambiguous [aliases] entry i */
};

struct sd_library {
	struct sd_exercise *ex;
	int n, cap;
	struct sd_alias *al;     /* [aliases] entries */
	int nal, capal;
	struct sd_libkey *keys;  /* sorted by key once lib_index has run; NULL before */
	int nkeys;
	char *keypool;           /* the folded section aliases the keys point to */
};

enum sd_match_kind {
	SD_MATCH_NONE,           /* unknown */
	SD_MATCH_EXACT,          /* the name or an alias */
	SD_MATCH_VARIANT,        /* "squat (high bar)": the base lift, or "pause squat" for "squat (pause)" */
	SD_MATCH_AMBIGUOUS,      /* a name the library marks as meaning several exercises */
};

struct sd_match {
	enum sd_match_kind kind;
	int ex;                  /* EXACT, VARIANT */
	int nchoices;            /* AMBIGUOUS */
	int choice[SD_MAX_CHOICES];
};

/* Adds or replaces (same folded name) an exercise; takes ownership of x's aliases. A
 * fatigue of 0 (unset) becomes 1.0. Fails when the folded name does not fit. */
int lib_put(struct sd_library *lib, struct sd_exercise *x, struct sd_err *e);
/* Adds an [aliases] entry (name = one or more exercises); one with the same folded name from an
 * earlier file is replaced. Targets are resolved by lib_index. */
int lib_alias(struct sd_library *lib, const char *name, const char *const *targets, int n,
	      const char *origin, int line, struct sd_err *e);
/* Resolves the [aliases] entries and builds the sorted name index lib_find uses; call after
 * the last lib_put and lib_alias. */
int lib_index(struct sd_library *lib, struct sd_err *e);
/* Index of the exercise whose name or alias matches (folded); -1 if none or ambiguous. */
int lib_find(const struct sd_library *lib, const char *name);
/* lib_find, plus parenthesised variants and ambiguous names; returns m->kind. */
int lib_match(const struct sd_library *lib, const char *name, struct sd_match *m);
/* The exercise a name written in a file stands for, as programs and logs read it: the index
 * (an exact name or alias, or a variant read as its base lift, *variant then 1), or -1 with
 * e reading "unknown exercise 'NAME' (did you mean 'A', 'B' or 'C'?)", "'NAME' names more
 * than one exercise; write 'A' or 'B'" or "exercise name longer than N bytes". */
int lib_resolve(const struct sd_library *lib, const char *name, int *variant, struct sd_err *e);
/* Writes up to k indices of the closest exercises (shared words first, then edit distance)
 * into out; returns how many. */
int lib_suggest(const struct sd_library *lib, const char *name, int *out, int k);
/* A hash of a folded name (FNV-1a), for quick inequality tests. */
unsigned lib_hash(const char *key);
/* Folds a name for matching into buf: lowercase, words singular, abbreviations spelled out,
 * no separators. Returns 0, or -1 when it does not fit (buf then holds what fitted). */
int lib_norm(const char *in, char *buf, int size);
void lib_free(struct sd_library *lib);

#endif
