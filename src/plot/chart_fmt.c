/* File-name extensions of the chart formats and the chart kinds' names: in the main binary, so
 * a wrong name is refused before the chart module is loaded (the module has its own copy). */
#include "chart_mod.h"

#include <string.h>
#include <strings.h>

enum chart_fmt chart_format(const char *path)
{
	const char *dot = strrchr(path, '.');
	if (!dot)
		return FMT_NONE;
	if (!strcasecmp(dot, ".png"))
		return FMT_PNG;
	if (!strcasecmp(dot, ".svg"))
		return FMT_SVG;
	if (!strcasecmp(dot, ".pdf"))
		return FMT_PDF;
	return FMT_NONE;
}

int chart_format_ok(const char *path)
{
	return chart_format(path) != FMT_NONE;
}

static const char *const kind_names[CHART_NKINDS] = { "curve", "muscles", "compare", "returns" };

int chart_kind_find(const char *name)
{
	for (int k = 0; k < CHART_NKINDS; k++)
		if (!strcasecmp(name, kind_names[k]))
			return k;
	return -1;
}

const char *chart_kind_name(enum chart_kind k)
{
	return (unsigned)k < CHART_NKINDS ? kind_names[k] : "?";
}
