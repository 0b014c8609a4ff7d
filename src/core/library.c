#include "library.h"

#include <ctype.h>
#include <stdlib.h>
#include <string.h>

void lib_norm(const char *in, char *buf, int size)
{
	int n = 0;
	for (; *in && n < size - 1; in++) {
		unsigned char c = (unsigned char)*in;
		if (c == ' ' || c == '\t' || c == '-' || c == '_')
			continue;
		buf[n++] = (char)tolower(c);
	}
	buf[n] = '\0';
}

static void free_aliases(struct sd_exercise *x)
{
	for (int i = 0; i < x->naliases; i++)
		free(x->aliases[i]);
	free(x->aliases);
	x->aliases = NULL;
	x->naliases = 0;
}

static int slot_of(const struct sd_library *lib, const char *key)
{
	for (int i = 0; i < lib->n; i++)
		if (!strcmp(key, lib->ex[i].key))
			return i;
	return -1;
}

int lib_put(struct sd_library *lib, struct sd_exercise *x, struct sd_err *e)
{
	int i;

	lib_norm(x->name, x->key, sizeof x->key);
	i = slot_of(lib, x->key);
	if (x->fatigue == 0)   /* exercises built in code (tests, allot) leave it unset */
		x->fatigue = 1.0;

	free(lib->keys);   /* any change invalidates the index */
	lib->keys = NULL;
	lib->nkeys = 0;
	if (i >= 0) {
		free_aliases(&lib->ex[i]);
		lib->ex[i] = *x;
		x->aliases = NULL;
		x->naliases = 0;
		return 0;
	}
	if (lib->n == lib->cap) {
		int ncap = lib->cap ? lib->cap * 2 : 128;
		struct sd_exercise *nx = realloc(lib->ex, (size_t)ncap * sizeof *nx);
		if (!nx)
			return sd_fail(e, "out of memory");
		lib->ex = nx;
		lib->cap = ncap;
	}
	lib->ex[lib->n++] = *x;
	x->aliases = NULL;
	x->naliases = 0;
	return 0;
}

static int keycmp(const void *a, const void *b)
{
	return strcmp(((const struct sd_libkey *)a)->key, ((const struct sd_libkey *)b)->key);
}

int lib_index(struct sd_library *lib, struct sd_err *e)
{
	int total = 0, k = 0;

	for (int i = 0; i < lib->n; i++)
		total += 1 + lib->ex[i].naliases;
	free(lib->keys);
	lib->keys = malloc((size_t)(total ? total : 1) * sizeof *lib->keys);
	if (!lib->keys)
		return sd_fail(e, "out of memory");
	for (int i = 0; i < lib->n; i++) {
		memcpy(lib->keys[k].key, lib->ex[i].key, SD_NAME_MAX);
		lib->keys[k++].ex = i;
		for (int j = 0; j < lib->ex[i].naliases; j++) {
			lib_norm(lib->ex[i].aliases[j], lib->keys[k].key, SD_NAME_MAX);
			lib->keys[k++].ex = i;
		}
	}
	qsort(lib->keys, (size_t)k, sizeof *lib->keys, keycmp);
	lib->nkeys = k;
	/* Two exercises answering to one name would make lookups arbitrary. */
	for (int i = 1; i < k; i++)
		if (!strcmp(lib->keys[i].key, lib->keys[i - 1].key) &&
		    lib->keys[i].ex != lib->keys[i - 1].ex)
			return sd_fail(e, "exercise library: '%s' and '%s' share the name or alias '%s'",
				       lib->ex[lib->keys[i - 1].ex].name, lib->ex[lib->keys[i].ex].name,
				       lib->keys[i].key);
	return 0;
}

int lib_find(const struct sd_library *lib, const char *name)
{
	struct sd_libkey probe;
	char b[SD_NAME_MAX];

	lib_norm(name, probe.key, sizeof probe.key);
	if (!probe.key[0])
		return -1;
	if (lib->keys) {
		const struct sd_libkey *hit = bsearch(&probe, lib->keys, (size_t)lib->nkeys,
						      sizeof *lib->keys, keycmp);
		return hit ? hit->ex : -1;
	}
	for (int i = 0; i < lib->n; i++) {
		lib_norm(lib->ex[i].name, b, sizeof b);
		if (!strcmp(probe.key, b))
			return i;
		for (int j = 0; j < lib->ex[i].naliases; j++) {
			lib_norm(lib->ex[i].aliases[j], b, sizeof b);
			if (!strcmp(probe.key, b))
				return i;
		}
	}
	return -1;
}

/* Levenshtein distance of two short strings (names are below SD_NAME_MAX). */
static int edit_distance(const char *a, const char *b)
{
	int la = (int)strlen(a), lb = (int)strlen(b);
	int row[SD_NAME_MAX + 1];

	for (int j = 0; j <= lb; j++)
		row[j] = j;
	for (int i = 1; i <= la; i++) {
		int diag = row[0];
		row[0] = i;
		for (int j = 1; j <= lb; j++) {
			int up = row[j];
			int best = diag + (a[i - 1] != b[j - 1]);
			if (up + 1 < best)
				best = up + 1;
			if (row[j - 1] + 1 < best)
				best = row[j - 1] + 1;
			row[j] = best;
			diag = up;
		}
	}
	return row[lb];
}

/* Distance of `key` to an exercise: the best over its name and aliases; a name that contains
 * the key (or the reverse) counts as close, so "squat" suggests the squats. */
static int distance_to(const struct sd_exercise *x, const char *key)
{
	char b[SD_NAME_MAX];
	int best;

	lib_norm(x->name, b, sizeof b);
	best = edit_distance(key, b);
	if (strlen(key) >= 4 && strstr(b, key))
		best = best < 2 ? best : 2;
	for (int j = 0; j < x->naliases; j++) {
		lib_norm(x->aliases[j], b, sizeof b);
		int d = edit_distance(key, b);
		if (d < best)
			best = d;
	}
	return best;
}

int lib_suggest(const struct sd_library *lib, const char *name, int *out, int k)
{
	char key[SD_NAME_MAX];
	int dist[8], n = 0;
	int limit;

	if (k > 8)
		k = 8;
	lib_norm(name, key, sizeof key);
	limit = (int)strlen(key) / 3 + 2;  /* beyond this a "suggestion" is noise */
	for (int i = 0; i < lib->n; i++) {
		int d = distance_to(&lib->ex[i], key);
		if (d > limit)
			continue;
		int pos = n < k ? n++ : k;
		if (pos == k && d >= dist[k - 1])
			continue;
		if (pos == k)
			pos = k - 1;
		while (pos > 0 && dist[pos - 1] > d) {
			dist[pos] = dist[pos - 1];
			out[pos] = out[pos - 1];
			pos--;
		}
		dist[pos] = d;
		out[pos] = i;
	}
	return n;
}

void lib_free(struct sd_library *lib)
{
	for (int i = 0; i < lib->n; i++)
		free_aliases(&lib->ex[i]);
	free(lib->ex);
	free(lib->keys);
	memset(lib, 0, sizeof *lib);
}
