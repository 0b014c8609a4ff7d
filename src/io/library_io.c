#include "library_io.h"

#include <errno.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <strings.h>
#include <unistd.h>

#include "ini.h"

/* Keys of an exercise section, in the order their lines are remembered. */
static const char *const keys[] = { "aliases", "kind", "fatigue", "graded", "direct", "indirect" };
#define NKEYS (int)(sizeof keys / sizeof *keys)

static const char *const kinds[] = { "barbell", "dumbbell", "machine", "cable", "bodyweight",
				     "other" };

struct seen {
	char key[SD_KEY_MAX];
	unsigned hash;
	int line;
};

struct lib_state {
	const char *path;
	struct sd_library *lib;
	struct sd_exercise x;      /* the section being read */
	int open, line, in_aliases;
	int key_line[NKEYS];       /* where each key of the open section was given */
	struct seen *sec;          /* sections of this file, for duplicates */
	int nsec, capsec;
	struct seen *al;           /* [aliases] names of this file */
	int nal, capal;
};

static void drop(struct sd_exercise *x)
{
	for (int i = 0; i < x->naliases; i++)
		free(x->aliases[i]);
	free(x->aliases);
	memset(x, 0, sizeof *x);
}

/* Remembers a name; fails with both lines when this file already had it. */
static int once(struct lib_state *st, struct seen **v, int *n, int *cap, const char *name,
		int line, const char *what, struct sd_err *e)
{
	char key[SD_KEY_MAX];

	lib_norm(name, key, sizeof key);
	unsigned h = lib_hash(key);
	for (int i = 0; i < *n; i++)
		if ((*v)[i].hash == h && !strcmp((*v)[i].key, key))
			return sd_fail(e, "cannot read exercise library '%s' line %d: %s '%s' appears twice "
				       "(first on line %d)", st->path, line, what, name, (*v)[i].line);
	if (*n == *cap) {
		int ncap = *cap ? *cap * 2 : 64;
		struct seen *nv = realloc(*v, (size_t)ncap * sizeof *nv);
		if (!nv)
			return sd_fail(e, "out of memory");
		*v = nv;
		*cap = ncap;
	}
	memcpy((*v)[*n].key, key, sizeof key);
	(*v)[*n].hash = h;
	(*v)[(*n)++].line = line;
	return 0;
}

/* Calls fn on each trimmed, non-empty item of a list separated by sep; lists of any length. */
static int each_item(const char *list, char sep, int (*fn)(const char *, size_t, void *, struct sd_err *),
		     void *arg, struct sd_err *e)
{
	for (const char *s = list; *s;) {
		const char *end = strchr(s, sep);
		size_t n = end ? (size_t)(end - s) : strlen(s);
		const char *a = s, *b = s + n;
		while (a < b && (*a == ' ' || *a == '\t'))
			a++;
		while (b > a && (b[-1] == ' ' || b[-1] == '\t'))
			b--;
		if (b > a && fn(a, (size_t)(b - a), arg, e))
			return -1;
		if (!end)
			break;
		s = end + 1;
	}
	return 0;
}

struct mus_arg {
	const struct lib_state *st;
	const char *key;
	sd_mset *set;
};

static int add_muscle(const char *name, size_t n, void *arg, struct sd_err *e)
{
	struct mus_arg *a = arg;
	char buf[32];
	int m = -1;

	if (n < sizeof buf) {
		memcpy(buf, name, n);
		buf[n] = '\0';
		m = muscle_find(buf);
	}
	if (m < 0)
		return sd_fail(e, "cannot read exercise library '%s' line %d: unknown muscle '%.*s' in %s "
			       "(see 'setdose exercises --muscles')", a->st->path, a->st->line,
			       n > 200 ? 200 : (int)n, name, a->key);
	*a->set |= (sd_mset)1 << m;
	return 0;
}

struct alias_arg {
	const struct lib_state *st;
	struct sd_exercise *x;
};

static int add_alias(const char *name, size_t n, void *arg, struct sd_err *e)
{
	struct alias_arg *a = arg;
	struct sd_exercise *x = a->x;

	if (n >= SD_NAME_MAX)
		return sd_fail(e, "cannot read exercise library '%s' line %d: alias '%.40s...' is longer "
			       "than %d bytes", a->st->path, a->st->line, name, SD_NAME_MAX - 1);
	char **na = realloc(x->aliases, (size_t)(x->naliases + 1) * sizeof *na);
	if (!na)
		return sd_fail(e, "out of memory");
	x->aliases = na;
	if (!(x->aliases[x->naliases] = strndup(name, n)))
		return sd_fail(e, "out of memory");
	x->naliases++;
	return 0;
}

static int finish(struct lib_state *st, struct sd_err *e)
{
	if (!st->open)
		return 0;
	st->open = 0;
	if (!st->x.direct) {
		sd_fail(e, "cannot read exercise library '%s' line %d: [%s] names no direct muscle",
			st->path, st->line, st->x.name);
		drop(&st->x);
		return -1;
	}
	st->x.indirect &= ~st->x.direct;
	if (lib_put(st->lib, &st->x, e)) {
		sd_wrap(e, "cannot read exercise library '%s' line %d", st->path, st->line);
		drop(&st->x);
		return -1;
	}
	memset(&st->x, 0, sizeof st->x);
	return 0;
}

static int section(struct lib_state *st, const struct sd_ini_item *it, struct sd_err *e)
{
	struct sd_exercise *x = &st->x;

	if (finish(st, e))
		return -1;
	st->line = it->line;
	if (strlen(it->section) >= SD_NAME_MAX)
		return sd_fail(e, "cannot read exercise library '%s' line %d: name longer than %d bytes "
			       "'%.40s...'", st->path, it->line, SD_NAME_MAX - 1, it->section);
	if (once(st, &st->sec, &st->nsec, &st->capsec, it->section, it->line, "section", e))
		return -1;
	st->in_aliases = !strcasecmp(it->section, "aliases");
	if (st->in_aliases)
		return 0;
	snprintf(x->name, sizeof x->name, "%s", it->section);
	snprintf(x->kind, sizeof x->kind, "other");
	x->fatigue = 1.0;
	memset(st->key_line, 0, sizeof st->key_line);
	st->open = 1;
	return 0;
}

/* "my name = library name", or "name = a | b" for a name that means several exercises. */
struct target_arg {
	const char *t[SD_MAX_CHOICES];
	size_t len[SD_MAX_CHOICES];
	int n, too_many;
};

static int add_target(const char *name, size_t n, void *arg, struct sd_err *e)
{
	struct target_arg *a = arg;
	(void)e;
	if (a->n == SD_MAX_CHOICES) {
		a->too_many = 1;
		return 0;
	}
	a->t[a->n] = name;
	a->len[a->n++] = n;
	return 0;
}

static int alias_line(struct lib_state *st, const struct sd_ini_item *it, struct sd_err *e)
{
	struct target_arg a = { .n = 0 };
	char copy[SD_MAX_CHOICES][SD_NAME_MAX];
	const char *t[SD_MAX_CHOICES];

	if (strlen(it->key) >= SD_NAME_MAX)
		return sd_fail(e, "cannot read exercise library '%s' line %d: alias longer than %d bytes",
			       st->path, it->line, SD_NAME_MAX - 1);
	if (once(st, &st->al, &st->nal, &st->capal, it->key, it->line, "alias", e))
		return -1;
	each_item(it->value, '|', add_target, &a, e);
	if (!a.n || a.too_many)
		return sd_fail(e, "cannot read exercise library '%s' line %d: alias '%s' must name 1 to %d "
			       "exercises ('name = exercise', or 'name = a | b' when it means several)",
			       st->path, it->line, it->key, SD_MAX_CHOICES);
	for (int i = 0; i < a.n; i++) {
		if (a.len[i] >= SD_NAME_MAX)
			return sd_fail(e, "cannot read exercise library '%s' line %d: exercise name longer "
				       "than %d bytes", st->path, it->line, SD_NAME_MAX - 1);
		memcpy(copy[i], a.t[i], a.len[i]);
		copy[i][a.len[i]] = '\0';
		t[i] = copy[i];
	}
	if (lib_alias(st->lib, it->key, t, a.n, st->path, it->line, e))
		return sd_wrap(e, "cannot read exercise library '%s' line %d", st->path, it->line);
	return 0;
}

static int number_key(struct lib_state *st, const struct sd_ini_item *it, struct sd_err *e)
{
	char *end;
	errno = 0;
	double f = strtod(it->value, &end);
	if (end == it->value || *end || errno || !(f >= SD_FATIGUE_MIN && f <= SD_FATIGUE_MAX))
		return sd_fail(e, "cannot read exercise library '%s' line %d: fatigue must be a number "
			       "from %g to %g, not '%s'", st->path, it->line, SD_FATIGUE_MIN,
			       SD_FATIGUE_MAX, it->value);
	st->x.fatigue = f;
	return 0;
}

static int on_item(const struct sd_ini_item *it, void *arg, struct sd_err *e)
{
	struct lib_state *st = arg;
	struct sd_exercise *x = &st->x;
	int k;

	if (!it->key)
		return section(st, it, e);
	if (!st->open && !st->in_aliases)
		return sd_fail(e, "cannot read exercise library '%s' line %d: '%s' comes before any "
			       "[exercise] section", st->path, it->line, it->key);
	st->line = it->line;
	if (st->in_aliases)
		return alias_line(st, it, e);
	for (k = 0; k < NKEYS && strcasecmp(it->key, keys[k]); k++)
		;
	if (k == NKEYS)
		return sd_fail(e, "cannot read exercise library '%s' line %d: unknown key '%s' (expected "
			       "aliases, kind, fatigue, graded, direct or indirect)", st->path, it->line,
			       it->key);
	if (st->key_line[k])
		return sd_fail(e, "cannot read exercise library '%s' line %d: '%s' given twice in [%s] "
			       "(first on line %d)", st->path, it->line, keys[k], x->name, st->key_line[k]);
	st->key_line[k] = it->line;
	if (!strcmp(keys[k], "direct") || !strcmp(keys[k], "indirect")) {
		int direct = keys[k][0] == 'd';
		struct mus_arg a = { st, keys[k], direct ? &x->direct : &x->indirect };
		return each_item(it->value, ',', add_muscle, &a, e);
	}
	if (!strcmp(keys[k], "aliases")) {
		struct alias_arg a = { st, x };
		return each_item(it->value, ',', add_alias, &a, e);
	}
	if (!strcmp(keys[k], "fatigue"))
		return number_key(st, it, e);
	if (!strcmp(keys[k], "graded")) {
		if (strcasecmp(it->value, "yes") && strcasecmp(it->value, "no"))
			return sd_fail(e, "cannot read exercise library '%s' line %d: graded must be yes or "
				       "no, not '%s'", st->path, it->line, it->value);
		x->ungraded = !strcasecmp(it->value, "no");
		return 0;
	}
	for (size_t i = 0; i < sizeof kinds / sizeof *kinds; i++)
		if (!strcasecmp(it->value, kinds[i])) {
			snprintf(x->kind, sizeof x->kind, "%s", kinds[i]);
			return 0;
		}
	return sd_fail(e, "cannot read exercise library '%s' line %d: kind must be barbell, dumbbell, "
		       "machine, cable, bodyweight or other, not '%s'", st->path, it->line, it->value);
}

int library_load_file(const char *path, struct sd_library *lib, struct sd_err *e)
{
	struct lib_state st;
	char *text;
	size_t len;
	int rc, nul;

	memset(&st, 0, sizeof st);
	st.path = path;
	st.lib = lib;
	if (ini_slurp("exercise library", path, &text, &len, e))
		return -1;
	/* A NUL would end the text early and silently drop every later section. */
	if ((nul = ini_nul_line(text, len))) {
		free(text);
		return sd_fail(e, "cannot read exercise library '%s' line %d: binary data (NUL byte)",
			       path, nul);
	}
	rc = ini_scan("exercise library", path, text, on_item, &st, e);
	if (!rc)
		rc = finish(&st, e);
	else if (st.open)
		drop(&st.x);
	free(st.sec);
	free(st.al);
	free(text);
	return rc ? -1 : 0;
}

int library_load_all(const char *datadir, const char *extra, struct sd_library *lib,
		     struct sd_err *e)
{
	char path[1200];
	const char *xdg = getenv("XDG_CONFIG_HOME"), *home = getenv("HOME");

	snprintf(path, sizeof path, "%s/exercises.ini", datadir);
	if (library_load_file(path, lib, e))
		return -1;
	if (xdg && *xdg)
		snprintf(path, sizeof path, "%s/setdose/exercises.ini", xdg);
	else if (home && *home)
		snprintf(path, sizeof path, "%s/.config/setdose/exercises.ini", home);
	else
		path[0] = '\0';
	if (path[0] && !access(path, F_OK) && library_load_file(path, lib, e))
		return -1;
	if (extra && library_load_file(extra, lib, e))
		return -1;
	return lib_index(lib, e);
}
