/* Loads the chart module on the first chart or report and forwards to it (chart_mod.h).
 *
 * Where it is looked for: beside the binary, in lib/setdose/ under the binary's folder (the build
 * tree: build/setdose and build/lib/setdose/chart.so, so tests use the module of their own
 * build), then in the folder `make install` put it in (SD_LIBDIR). No environment variable
 * names a path, so nothing outside the installation decides which code is loaded. */
#include "chart_mod.h"

#include <dlfcn.h>
#include <limits.h>
#include <stdio.h>
#include <string.h>
#include <unistd.h>

#ifndef SD_LIBDIR
#define SD_LIBDIR "/usr/local/lib/setdose"
#endif
#define MOD_NAME "chart.so"

static const struct sd_chart_api *api;

static void *open_beside_binary(void)
{
	char exe[PATH_MAX], path[PATH_MAX + 32];
	ssize_t n = readlink("/proc/self/exe", exe, sizeof exe - 1);
	char *slash;

	if (n <= 0)
		return NULL;
	exe[n] = '\0';
	if (!(slash = strrchr(exe, '/')))
		return NULL;
	*slash = '\0';
	snprintf(path, sizeof path, "%s/lib/setdose/" MOD_NAME, exe);
	return access(path, R_OK) ? NULL : dlopen(path, RTLD_NOW | RTLD_LOCAL);
}

static const struct sd_chart_api *load(struct sd_err *e)
{
	const struct sd_chart_api *a;
	void *h;

	if (api)
		return api;
	if (!(h = open_beside_binary()) && !(h = dlopen(SD_LIBDIR "/" MOD_NAME, RTLD_NOW | RTLD_LOCAL))) {
		const char *why = dlerror();
		sd_fail(e, "charts need the chart module %s: %s (reinstall setdose)",
			SD_LIBDIR "/" MOD_NAME, why ? why : "not found");
		return NULL;
	}
	/* Kept loaded until exit: cairo and fontconfig keep caches that outlive one chart. */
	a = dlsym(h, "sd_chart_api");
	if (!a || a->version != SD_CHART_API_VERSION) {
		sd_fail(e, "the chart module does not match this setdose (version %d, wanted %d); "
			"reinstall setdose", a ? a->version : -1, SD_CHART_API_VERSION);
		return NULL;
	}
	return api = a;
}

int chart_write(const char *name, const struct sd_chart *c, chart_sink_fn sink, void *closure,
		struct sd_err *e)
{
	const struct sd_chart_api *a = load(e);
	return a ? a->chart_write(name, c, sink, closure, e) : -1;
}

int report_write(const char *name, const struct sd_report *r, chart_sink_fn sink, void *closure,
		 struct sd_err *e)
{
	const struct sd_chart_api *a = load(e);
	return a ? a->report_write(name, r, sink, closure, e) : -1;
}
