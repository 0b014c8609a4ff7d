#include "library_io.h"

#include <errno.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <strings.h>
#include <unistd.h>

#include "ini.h"

struct lib_state {
	const char *path;
	struct sd_library *lib;
	struct sd_exercise x;      /* the section being read */
	int open, line, have_direct;
};

static void drop(struct sd_exercise *x)
{
	for (int i = 0; i < x->naliases; i++)
		free(x->aliases[i]);
	free(x->aliases);
	memset(x, 0, sizeof *x);
}

/* Calls fn on each comma-separated, trimmed, non-empty item of list. */
static int each_item(const char *list, int (*fn)(const char *, void *, struct sd_err *),
		     void *arg, struct sd_err *e)
{
	char buf[1024];
	snprintf(buf, sizeof buf, "%s", list);
	for (char *tok = strtok(buf, ","); tok; tok = strtok(NULL, ",")) {
		while (*tok == ' ' || *tok == '\t')
			tok++;
		char *end = tok + strlen(tok);
		while (end > tok && (end[-1] == ' ' || end[-1] == '\t'))
			*--end = '\0';
		if (*tok && fn(tok, arg, e))
			return -1;
	}
	return 0;
}

struct mus_arg {
	const struct lib_state *st;
	const char *key;
	sd_mset *set;
};

static int add_muscle(const char *name, void *arg, struct sd_err *e)
{
	struct mus_arg *a = arg;
	int m = muscle_find(name);
	if (m < 0)
		return sd_fail(e, "cannot read exercise library '%s' line %d: unknown muscle '%s' in %s "
			       "(see 'setdose exercises --muscles')", a->st->path, a->st->line, name, a->key);
	*a->set |= (sd_mset)1 << m;
	return 0;
}

static int add_alias(const char *name, void *arg, struct sd_err *e)
{
	struct sd_exercise *x = arg;
	char **na = realloc(x->aliases, (size_t)(x->naliases + 1) * sizeof *na);
	if (!na)
		return sd_fail(e, "out of memory");
	x->aliases = na;
	if (!(x->aliases[x->naliases] = strdup(name)))
		return sd_fail(e, "out of memory");
	x->naliases++;
	return 0;
}

static int finish(struct lib_state *st, struct sd_err *e)
{
	if (!st->open)
		return 0;
	st->open = 0;
	if (!st->have_direct || !st->x.direct) {
		sd_fail(e, "cannot read exercise library '%s' line %d: [%s] names no direct muscle",
			st->path, st->line, st->x.name);
		drop(&st->x);
		return -1;
	}
	st->x.indirect &= ~st->x.direct;
	if (lib_put(st->lib, &st->x, e)) {
		drop(&st->x);
		return -1;
	}
	memset(&st->x, 0, sizeof st->x);
	return 0;
}

static int on_item(const struct sd_ini_item *it, void *arg, struct sd_err *e)
{
	struct lib_state *st = arg;
	struct sd_exercise *x = &st->x;

	if (!it->key) {
		if (finish(st, e))
			return -1;
		st->line = it->line;
		if (strlen(it->section) >= SD_NAME_MAX)
			return sd_fail(e, "cannot read exercise library '%s' line %d: name too long '%s'",
				       st->path, it->line, it->section);
		snprintf(x->name, sizeof x->name, "%s", it->section);
		snprintf(x->kind, sizeof x->kind, "other");
		x->fatigue = 1.0;
		st->open = 1;
		st->have_direct = 0;
		return 0;
	}
	if (!st->open)
		return sd_fail(e, "cannot read exercise library '%s' line %d: '%s' comes before any "
			       "[exercise] section", st->path, it->line, it->key);
	st->line = it->line;
	if (!strcasecmp(it->key, "direct") || !strcasecmp(it->key, "indirect")) {
		int direct = !strcasecmp(it->key, "direct");
		struct mus_arg a = { st, direct ? "direct" : "indirect", direct ? &x->direct : &x->indirect };
		st->have_direct |= direct;
		return each_item(it->value, add_muscle, &a, e);
	}
	if (!strcasecmp(it->key, "aliases"))
		return each_item(it->value, add_alias, x, e);
	if (!strcasecmp(it->key, "kind")) {
		snprintf(x->kind, sizeof x->kind, "%s", it->value);
		return 0;
	}
	if (!strcasecmp(it->key, "fatigue")) {
		char *end;
		errno = 0;
		double f = strtod(it->value, &end);
		if (end == it->value || *end || errno || !(f >= SD_FATIGUE_MIN && f <= SD_FATIGUE_MAX))
			return sd_fail(e, "cannot read exercise library '%s' line %d: fatigue must be a number "
				       "from %g to %g, not '%s'", st->path, it->line, SD_FATIGUE_MIN,
				       SD_FATIGUE_MAX, it->value);
		x->fatigue = f;
		return 0;
	}
	return sd_fail(e, "cannot read exercise library '%s' line %d: unknown key '%s' (expected "
		       "aliases, kind, fatigue, direct or indirect)", st->path, it->line, it->key);
}

int library_load_file(const char *path, struct sd_library *lib, struct sd_err *e)
{
	struct lib_state st;
	char *text;
	size_t len;
	int rc;

	memset(&st, 0, sizeof st);
	st.path = path;
	st.lib = lib;
	if (ini_slurp("exercise library", path, &text, &len, e))
		return -1;
	rc = ini_scan("exercise library", path, text, on_item, &st, e);
	if (!rc)
		rc = finish(&st, e);
	else if (st.open)
		drop(&st.x);
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
