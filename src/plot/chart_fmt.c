/* File-name extensions of the chart formats: in the main binary, so a wrong name is refused
 * before the chart module is loaded. */
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
