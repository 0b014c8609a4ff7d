#include "library.h"

#include <stdio.h>
#include <stdlib.h>
#include <string.h>

static void free_aliases(struct sd_exercise *x)
{
	for (int i = 0; i < x->naliases; i++)
		free(x->aliases[i]);
	free(x->aliases);
	x->aliases = NULL;
	x->naliases = 0;
}

static int slot_of(const struct sd_library *lib, const char *key, unsigned hash)
{
	for (int i = 0; i < lib->n; i++)
		if (lib->ex[i].keyhash == hash && !strcmp(key, lib->ex[i].key))
			return i;
	return -1;
}

static void drop_index(struct sd_library *lib)
{
	free(lib->keys);   /* any change invalidates the index */
	free(lib->keypool);
	lib->keys = NULL;
	lib->keypool = NULL;
	lib->nkeys = 0;
}

int lib_put(struct sd_library *lib, struct sd_exercise *x, struct sd_err *e)
{
	int i;

	if (lib_norm(x->name, x->key, sizeof x->key) || !x->key[0])
		return sd_fail(e, "exercise name '%s' is empty or too long once folded", x->name);
	x->keyhash = lib_hash(x->key);
	i = slot_of(lib, x->key, x->keyhash);
	if (x->fatigue == 0)   /* exercises built in code (tests, allot) leave it unset */
		x->fatigue = 1.0;
	drop_index(lib);
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

int lib_alias(struct sd_library *lib, const char *name, const char *const *targets, int n,
	      const char *origin, int line, struct sd_err *e)
{
	struct sd_alias a;
	int i;

	memset(&a, 0, sizeof a);
	if (n < 1 || n > SD_MAX_CHOICES)
		return sd_fail(e, "alias '%s' must name 1 to %d exercises", name, SD_MAX_CHOICES);
	if (strlen(name) >= SD_NAME_MAX)
		return sd_fail(e, "alias '%s' is longer than %d bytes", name, SD_NAME_MAX - 1);
	if (lib_norm(name, a.key, sizeof a.key) || !a.key[0])
		return sd_fail(e, "alias '%s' is empty or too long once folded", name);
	snprintf(a.name, sizeof a.name, "%s", name);
	for (i = 0; i < n; i++) {
		if (strlen(targets[i]) >= SD_NAME_MAX)
			return sd_fail(e, "exercise name '%s' is longer than %d bytes", targets[i],
				       SD_NAME_MAX - 1);
		snprintf(a.target[i], sizeof a.target[i], "%s", targets[i]);
	}
	a.ntargets = n;
	a.line = line;
	if (!(a.origin = strdup(origin ? origin : "")))
		return sd_fail(e, "out of memory");
	drop_index(lib);
	for (i = 0; i < lib->nal; i++)
		if (!strcmp(lib->al[i].key, a.key)) {
			free(lib->al[i].origin);   /* a later file's entry replaces an earlier one */
			lib->al[i] = a;
			return 0;
		}
	if (lib->nal == lib->capal) {
		int ncap = lib->capal ? lib->capal * 2 : 16;
		struct sd_alias *na = realloc(lib->al, (size_t)ncap * sizeof *na);
		if (!na) {
			free(a.origin);
			return sd_fail(e, "out of memory");
		}
		lib->al = na;
		lib->capal = ncap;
	}
	lib->al[lib->nal++] = a;
	return 0;
}

static int keycmp(const void *a, const void *b)
{
	return strcmp(((const struct sd_libkey *)a)->key, ((const struct sd_libkey *)b)->key);
}

static const struct sd_libkey *lookup(const struct sd_library *lib, const char *key)
{
	struct sd_libkey probe = { key, 0 };
	return bsearch(&probe, lib->keys, (size_t)lib->nkeys, sizeof *lib->keys, keycmp);
}

/* Checks every [aliases] entry against the names of the exercises (already indexed) and
 * resolves its targets. */
static int resolve_alias(const struct sd_library *lib, struct sd_alias *a, struct sd_err *e)
{
	const struct sd_libkey *hit;
	char key[SD_KEY_MAX];

	for (int t = 0; t < a->ntargets; t++) {
		lib_norm(a->target[t], key, sizeof key);
		if (!(hit = lookup(lib, key))) {
			int s[1];
			char hint[SD_NAME_MAX + 32] = "";
			if (lib_suggest(lib, a->target[t], s, 1) == 1)
				snprintf(hint, sizeof hint, " (did you mean '%s'?)", lib->ex[s[0]].name);
			return sd_fail(e, "cannot read exercise library '%s' line %d: alias '%s' names "
				       "unknown exercise '%s'%s", a->origin, a->line, a->name, a->target[t],
				       hint);
		}
		a->ex[t] = hit->ex;
		for (int u = 0; u < t; u++)
			if (a->ex[u] == a->ex[t])
				return sd_fail(e, "cannot read exercise library '%s' line %d: alias '%s' names "
					       "'%s' twice", a->origin, a->line, a->name, lib->ex[hit->ex].name);
	}
	hit = lookup(lib, a->key);
	if (hit && !(a->ntargets == 1 && hit->ex == a->ex[0]))
		return sd_fail(e, "cannot read exercise library '%s' line %d: alias '%s' is already a "
			       "name of '%s'", a->origin, a->line, a->name, lib->ex[hit->ex].name);
	return 0;
}

/* Indexes a section alias: folded into the pool at *used. */
static int add_key(struct sd_library *lib, const char *name, int ex, size_t *used,
		   struct sd_err *e)
{
	char *k = lib->keypool + *used;
	if (lib_norm(name, k, SD_KEY_MAX) || !k[0])
		return sd_fail(e, "exercise library: name or alias '%s' is empty or too long once "
			       "folded", name);
	*used += strlen(k) + 1;
	lib->keys[lib->nkeys].key = k;
	lib->keys[lib->nkeys++].ex = ex;
	return 0;
}

/* Adds the [aliases] names to the sorted index: sorted apart, then merged, since the index is
 * rebuilt on every run. */
static int merge_aliases(struct sd_library *lib, struct sd_err *e)
{
	struct sd_libkey *al = malloc((size_t)lib->nal * sizeof *al), *all;
	int n = 0, i = 0, j = 0, k = 0;

	if (!al)
		return sd_fail(e, "out of memory");
	for (int a = 0; a < lib->nal; a++) {
		const struct sd_alias *x = &lib->al[a];
		if (x->ntargets == 1 && lookup(lib, x->key))
			continue;   /* already a name of that very exercise */
		al[n].key = x->key;
		al[n++].ex = x->ntargets == 1 ? x->ex[0] : -1 - a;
	}
	qsort(al, (size_t)n, sizeof *al, keycmp);
	if (!(all = malloc((size_t)(lib->nkeys + n) * sizeof *all))) {
		free(al);
		return sd_fail(e, "out of memory");
	}
	while (i < lib->nkeys || j < n)
		all[k++] = j == n || (i < lib->nkeys && keycmp(&lib->keys[i], &al[j]) <= 0) ?
				   lib->keys[i++] : al[j++];
	free(al);
	free(lib->keys);
	lib->keys = all;
	lib->nkeys = k;
	return 0;
}

int lib_index(struct sd_library *lib, struct sd_err *e)
{
	int total = lib->nal, naliases = 0;
	size_t used = 0;

	for (int i = 0; i < lib->n; i++)
		naliases += lib->ex[i].naliases;
	total += lib->n + naliases;
	drop_index(lib);
	lib->keys = malloc((size_t)(total ? total : 1) * sizeof *lib->keys);
	lib->keypool = malloc((size_t)(naliases ? naliases : 1) * SD_KEY_MAX);
	if (!lib->keys || !lib->keypool) {
		sd_fail(e, "out of memory");
		goto fail;
	}
	for (int i = 0; i < lib->n; i++) {
		lib->keys[lib->nkeys].key = lib->ex[i].key;
		lib->keys[lib->nkeys++].ex = i;
		for (int j = 0; j < lib->ex[i].naliases; j++)
			if (add_key(lib, lib->ex[i].aliases[j], i, &used, e))
				goto fail;
	}
	qsort(lib->keys, (size_t)lib->nkeys, sizeof *lib->keys, keycmp);
	/* Two exercises answering to one name would make lookups arbitrary. */
	for (int i = 1; i < lib->nkeys; i++)
		if (!strcmp(lib->keys[i].key, lib->keys[i - 1].key) &&
		    lib->keys[i].ex != lib->keys[i - 1].ex) {
			sd_fail(e, "exercise library: '%s' and '%s' share the name or alias '%s'",
				lib->ex[lib->keys[i - 1].ex].name, lib->ex[lib->keys[i].ex].name,
				lib->keys[i].key);
			goto fail;
		}
	for (int a = 0; a < lib->nal; a++)
		if (resolve_alias(lib, &lib->al[a], e))
			goto fail;
	if (lib->nal && merge_aliases(lib, e))
		goto fail;
	return 0;
fail:
	drop_index(lib);
	return -1;
}

int lib_find(const struct sd_library *lib, const char *name)
{
	char key[SD_KEY_MAX], b[SD_KEY_MAX];

	if (lib_norm(name, key, sizeof key) || !key[0])
		return -1;
	if (lib->keys) {
		const struct sd_libkey *hit = lookup(lib, key);
		return hit && hit->ex >= 0 ? hit->ex : -1;
	}
	for (int i = 0; i < lib->n; i++) {
		if (!strcmp(key, lib->ex[i].key))
			return i;
		for (int j = 0; j < lib->ex[i].naliases; j++) {
			lib_norm(lib->ex[i].aliases[j], b, sizeof b);
			if (!strcmp(key, b))
				return i;
		}
	}
	return -1;
}

/* Looks a name up; fills m for a hit (exact or ambiguous). */
static int match_one(const struct sd_library *lib, const char *name, enum sd_match_kind kind,
		     struct sd_match *m)
{
	char key[SD_KEY_MAX];
	const struct sd_libkey *hit;

	if (!lib->keys || lib_norm(name, key, sizeof key) || !key[0] || !(hit = lookup(lib, key)))
		return 0;
	if (hit->ex >= 0) {
		m->kind = kind;
		m->ex = hit->ex;
		return 1;
	}
	const struct sd_alias *a = &lib->al[-1 - hit->ex];
	m->kind = SD_MATCH_AMBIGUOUS;
	m->nchoices = a->ntargets;
	memcpy(m->choice, a->ex, sizeof m->choice);
	return 1;
}

int lib_match(const struct sd_library *lib, const char *name, struct sd_match *m)
{
	memset(m, 0, sizeof *m);
	m->kind = SD_MATCH_NONE;
	m->ex = -1;
	if (match_one(lib, name, SD_MATCH_EXACT, m))
		return m->kind;
	/* "squat (pause)": first the qualifier in front ("pause squat"), then the base lift. */
	const char *open = strchr(name, '('), *close = open ? strchr(open, ')') : NULL;
	if (!open || !close)
		return m->kind;
	size_t n = strlen(name);
	char *inner_first = malloc(2 * n + 2), *base = malloc(n + 1);
	if (inner_first && base) {
		snprintf(base, n + 1, "%.*s %s", (int)(open - name), name, close + 1);
		snprintf(inner_first, 2 * n + 2, "%.*s %s", (int)(close - open - 1), open + 1, base);
		if (!match_one(lib, inner_first, SD_MATCH_VARIANT, m))
			match_one(lib, base, SD_MATCH_VARIANT, m);
	}
	free(inner_first);
	free(base);
	return m->kind;
}

/* "'a', 'b' or 'c'" of the exercises idx[0..n). */
static void name_list(const struct sd_library *lib, const int *idx, int n, char *buf, size_t size)
{
	size_t used = 0;

	buf[0] = '\0';
	for (int i = 0; i < n && used < size; i++)
		used += (size_t)snprintf(buf + used, size - used, "%s'%s'",
					 i == 0 ? "" : (i == n - 1 ? " or " : ", "), lib->ex[idx[i]].name);
}

int lib_resolve(const struct sd_library *lib, const char *name, int *variant, struct sd_err *e)
{
	struct sd_match m;
	char list[400];
	int near[3], n;

	*variant = 0;
	if (strlen(name) >= SD_NAME_MAX)
		return sd_fail(e, "exercise name longer than %d bytes", SD_NAME_MAX - 1);
	switch (lib_match(lib, name, &m)) {
	case SD_MATCH_EXACT:
		return m.ex;
	case SD_MATCH_VARIANT:
		*variant = 1;
		return m.ex;
	case SD_MATCH_AMBIGUOUS:
		name_list(lib, m.choice, m.nchoices, list, sizeof list);
		return sd_fail(e, "'%s' names more than one exercise; write %s", name, list);
	default:
		n = lib_suggest(lib, name, near, 3);
		name_list(lib, near, n, list, sizeof list);
		return sd_fail(e, "unknown exercise '%s'%s%s%s", name, n ? " (did you mean " : "", list,
			       n ? "?)" : "");
	}
}

void lib_free(struct sd_library *lib)
{
	for (int i = 0; i < lib->n; i++)
		free_aliases(&lib->ex[i]);
	for (int i = 0; i < lib->nal; i++)
		free(lib->al[i].origin);
	free(lib->ex);
	free(lib->al);
	drop_index(lib);
	memset(lib, 0, sizeof *lib);
}
