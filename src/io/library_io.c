#include "library_io.h"

#include <errno.h>
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include <iniparser/iniparser.h>

static char ini_error[256];

static int ini_errback(const char *fmt, ...)
{
	va_list ap;
	if (ini_error[0])
		return 0;
	va_start(ap, fmt);
	vsnprintf(ini_error, sizeof ini_error, fmt, ap);
	va_end(ap);
	return 0;
}

static int parse_muscles(const char *list, sd_mset *out, const char *path, const char *sec,
			 const char *key, struct sd_err *e)
{
	char buf[512];
	*out = 0;
	snprintf(buf, sizeof buf, "%s", list);
	for (char *tok = strtok(buf, ","); tok; tok = strtok(NULL, ",")) {
		while (*tok == ' ')
			tok++;
		char *end = tok + strlen(tok);
		while (end > tok && end[-1] == ' ')
			*--end = '\0';
		if (!*tok)
			continue;
		int m = muscle_find(tok);
		if (m < 0)
			return sd_fail(e, "exercise library '%s' [%s]: unknown muscle '%s' in %s "
				       "(see 'setdose exercises --muscles')", path, sec, tok, key);
		*out |= (sd_mset)1 << m;
	}
	return 0;
}

static int parse_aliases(const char *list, struct sd_exercise *x, struct sd_err *e)
{
	char buf[1024];
	snprintf(buf, sizeof buf, "%s", list);
	for (char *tok = strtok(buf, ","); tok; tok = strtok(NULL, ",")) {
		while (*tok == ' ')
			tok++;
		char *end = tok + strlen(tok);
		while (end > tok && end[-1] == ' ')
			*--end = '\0';
		if (!*tok)
			continue;
		char **na = realloc(x->aliases, (size_t)(x->naliases + 1) * sizeof *na);
		if (!na)
			return sd_fail(e, "out of memory");
		x->aliases = na;
		if (!(x->aliases[x->naliases] = strdup(tok)))
			return sd_fail(e, "out of memory");
		x->naliases++;
	}
	return 0;
}

static int load_section(dictionary *d, const char *path, const char *sec,
			struct sd_library *lib, struct sd_err *e)
{
	struct sd_exercise x;
	char key[SD_NAME_MAX + 16];
	const char *v;

	memset(&x, 0, sizeof x);
	if (strlen(sec) >= SD_NAME_MAX)
		return sd_fail(e, "exercise library '%s': name too long '%s'", path, sec);
	snprintf(x.name, sizeof x.name, "%s", sec);
	snprintf(key, sizeof key, "%s:kind", sec);
	snprintf(x.kind, sizeof x.kind, "%s", iniparser_getstring(d, key, "other"));
	snprintf(key, sizeof key, "%s:direct", sec);
	v = iniparser_getstring(d, key, NULL);
	if (!v)
		return sd_fail(e, "exercise library '%s' [%s]: missing 'direct'", path, sec);
	if (parse_muscles(v, &x.direct, path, sec, "direct", e))
		return -1;
	if (!x.direct)
		return sd_fail(e, "exercise library '%s' [%s]: 'direct' names no muscle", path, sec);
	snprintf(key, sizeof key, "%s:indirect", sec);
	if (parse_muscles(iniparser_getstring(d, key, ""), &x.indirect, path, sec, "indirect", e))
		return -1;
	x.indirect &= ~x.direct;
	snprintf(key, sizeof key, "%s:aliases", sec);
	if (parse_aliases(iniparser_getstring(d, key, ""), &x, e) || lib_put(lib, &x, e)) {
		for (int i = 0; i < x.naliases; i++)
			free(x.aliases[i]);
		free(x.aliases);
		return -1;
	}
	return 0;
}

int library_load_file(const char *path, struct sd_library *lib, struct sd_err *e)
{
	dictionary *d;
	int rc = 0, n;

	if (access(path, R_OK))
		return sd_fail(e, "cannot read exercise library '%s': %s", path, strerror(errno));
	ini_error[0] = '\0';
	iniparser_set_error_callback(ini_errback);
	d = iniparser_load(path);
	if (!d || ini_error[0]) {
		char *nl = strchr(ini_error, '\n');
		if (nl)
			*nl = '\0';
		if (d)
			iniparser_freedict(d);
		return sd_fail(e, "cannot read exercise library '%s': %s", path,
			       ini_error[0] ? ini_error : "not an INI file");
	}
	n = iniparser_getnsec(d);
	for (int i = 0; i < n && !rc; i++)
		rc = load_section(d, path, iniparser_getsecname(d, i), lib, e);
	iniparser_freedict(d);
	return rc;
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
