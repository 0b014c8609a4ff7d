/* What chart and report share: drawing into an output file through the safe writer, and the
 * test hook that prints the layout's boxes (SETDOSE_TEST_LAYOUT=1: one "box ..." line per
 * label, mark, text and page extent on standard error, for tests/cli/layout_check.py). */
#ifndef SD_CHARTCMD_H
#define SD_CHARTCMD_H

#include "../plot/chart.h"

/* Draws chart c, or report r when c is NULL, into a temporary file put in place only once
 * complete (io/safefile.h). */
int chartcmd_draw(const char *out, int force, const struct sd_chart *c, const struct sd_report *r,
		  struct sd_err *e);
/* A box store when the test hook is on, else NULL; _done prints it (when rc is 0) and frees. */
struct chart_layout *chartcmd_layout(void);
void chartcmd_layout_done(struct chart_layout *l, int rc);

#endif
