#include "defaults_io.h"

#include <errno.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "ini.h"

const char *defaults_path(char *buf, size_t n)
{
	const char *xdg = getenv("XDG_CONFIG_HOME"), *home = getenv("HOME");
	int len;

	if (xdg && *xdg)
		len = snprintf(buf, n, "%s/setdose/defaults.ini", xdg);
	else if (home && *home)
		len = snprintf(buf, n, "%s/.config/setdose/defaults.ini", home);
	else
		return NULL;
	return len > 0 && (size_t)len < n ? buf : NULL;
}

struct walk {
	const char *path;
	defaults_fn fn;
	void *arg;
	char home[4][1024];  /* expanded "~/" values, a few at most */
	int nhome;
};

static int on_item(const struct sd_ini_item *it, void *arg, struct sd_err *e)
{
	struct walk *w = arg;
	const char *v = it->value, *home = getenv("HOME");

	if (!it->key) {
		if (strcmp(it->section, "defaults"))
			return sd_usage(e, "defaults file '%s' line %d: unknown section [%s] (only "
					"[defaults], or none)", w->path, it->line, it->section);
		return 0;
	}
	if (!strncmp(v, "~/", 2) && home && *home) {
		if (w->nhome == 4)
			return sd_usage(e, "defaults file '%s' line %d: too many '~/' paths", w->path,
					it->line);
		snprintf(w->home[w->nhome], sizeof w->home[0], "%s/%s", home, v + 2);
		v = w->home[w->nhome++];
	}
	return w->fn(it->key, v, it->line, w->arg, e);
}

int defaults_read(const char *path, defaults_fn fn, void *arg, char **keep, struct sd_err *e)
{
	static struct walk w;   /* the expanded paths must outlive the call */
	size_t len;

	*keep = NULL;
	if (access(path, F_OK) && errno == ENOENT)
		return 0;
	if (ini_slurp("defaults file", path, keep, &len, e))
		return -1;
	w = (struct walk){ path, fn, arg, { "" }, 0 };
	return ini_scan("defaults file", path, *keep, on_item, &w, e);
}
