/* The one option layer: every command, subcommand and the global options describe their
 * options in a table of struct sd_optdef; opt_parse reads argv against it and `setdose help`
 * prints the option lines from it.
 *
 * The rules, the same for every command (man page, OPTIONS):
 * - options and arguments mix in any order until "--", after which every word is an argument;
 * - a value is the next word, always (so "--notes --no-color" stores the text "--no-color"),
 *   or follows "=" ("--weeks=8");
 * - a long name may be shortened to a unique prefix ("--sess" for "--session-cap");
 * - global options (main.c) are taken from anywhere on the line; the global pass knows which
 *   options of the command take a value, so it never takes a command option's value for a
 *   global option;
 * - an unknown option, a missing value, a value given to a flag and a number out of range are
 *   usage errors (exit status 2) with one message shape, naming the command's help. */
#ifndef SD_OPT_H
#define SD_OPT_H

#include <stddef.h>
#include <stdio.h>

#include "../core/err.h"

enum opt_kind {
	OPT_FLAG,   /* sets an int field to 1 */
	OPT_STR,    /* stores the value (a const char * field) */
	OPT_INT,    /* a whole number in [lo, hi] into a long long field */
	OPT_NUM,    /* a number in [lo, hi] into a double field */
	OPT_CALL,   /* calls call(dst, def, value, e); value NULL when arg is NULL (a flag) */
};

struct sd_optdef {
	const char *name;          /* the long name without "--" */
	enum opt_kind kind;
	double lo, hi;             /* OPT_INT, OPT_NUM */
	size_t off;                /* offset of the field in the caller's options struct */
	int (*call)(void *dst, const struct sd_optdef *d, const char *value, struct sd_err *e);
	const char *arg;           /* the value's name in help ("N", "FILE"); NULL for a flag */
	const char *help;          /* one line for `setdose help` */
};

#define OPT_N(defs) ((int)(sizeof(defs) / sizeof((defs)[0])))

/* Reads the options of argv[1..argc-1] into dst. The other words (the arguments) are moved to
 * argv[1..] in order, argv[0] stays; returns the new argc, or -1 with a usage error in e.
 * `cmd` names the command in messages ("block add"). With dst NULL the names and values are
 * only checked, not applied (main.c checks them so before it opens anything). */
int opt_parse(const char *cmd, const struct sd_optdef *defs, int n, void *dst, int argc,
	      char **argv, struct sd_err *e);
/* The definition a word "--name[=value]" names in defs: its index, -1 when none matches, -2
 * when a prefix matches several (e filled, may be NULL). Sets *value to the part after '='
 * (or NULL). */
int opt_find(const char *cmd, const struct sd_optdef *defs, int n, const char *word,
	     const char **value, struct sd_err *e);
/* The usage error for a word that names no option. */
int opt_unknown(const char *cmd, const char *word, struct sd_err *e);
/* Applies one definition to dst with value (NULL for flags). */
int opt_apply(const char *cmd, const struct sd_optdef *d, void *dst, const char *value,
	      struct sd_err *e);
/* The option lines of `setdose help CMD`: "  --name ARG  help", aligned. */
void opt_help(FILE *f, const struct sd_optdef *defs, int n);

#endif
