/* A list of file names, one a line, read from a stream (`audit --summary -` reads its
 * programs from standard input: lists longer than a command line allows). */
#ifndef SD_PATHLIST_H
#define SD_PATHLIST_H

#include <stdio.h>

#include "../core/err.h"

struct pathlist {
	char **v;          /* n names, pointing into buf */
	int n;
	char *buf;
};

/* Reads every line of f; blank lines are skipped, a trailing '\r' dropped. `label` names the
 * stream in messages. */
int paths_read(FILE *f, const char *label, struct pathlist *l, struct sd_err *e);
void paths_free(struct pathlist *l);

#endif
