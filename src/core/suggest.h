/* "Did you mean": the stored names closest to a misspelt one (athletes, templates). Exercise
 * names have their own folding and ranking (library.h, lib_suggest). */
#ifndef SD_SUGGEST_H
#define SD_SUGGEST_H

#include <stddef.h>

#define SD_SUGGEST_MAX 3

/* Levenshtein distance (insertions, deletions, substitutions) of two strings of up to 160
 * bytes; longer ones count as far apart as the longer is long. */
int sd_edit_distance(const char *a, const char *b);

/* Ranks the n names found at base, base + stride, ... (each a NUL-terminated string inside a
 * record) against `name`: more words in common first (case-insensitive), then the smaller edit
 * distance; a name sharing no word and further than a third of its length plus 2 is left out.
 * Writes up to k (at most SD_SUGGEST_MAX) indices into out; returns how many. */
int sd_suggest(const char *name, const char *base, size_t stride, int n, int *out, int k);

#endif
