/* The curve as a grid of character cells, for the terminal: `curve` prints it as text and the
 * full-screen interface draws the same grid with ncurses. Pure layout; rendering is separate.
 *
 * Ownership: tplot_new allocates the grid; tplot_free releases it. */
#ifndef SD_TEXTPLOT_H
#define SD_TEXTPLOT_H

#include <stdio.h>

#include "../core/curve.h"

/* Cell kinds, widest band first: one athlete, a new group or study, the average curve. */
enum { TP_EMPTY, TP_ATHLETE, TP_GROUP, TP_CI, TP_MEAN, TP_MARK, TP_CURSOR };

struct sd_tplot {
	int w, h;                  /* plot area in cells (no axes) */
	double x0, x1, y0, y1;     /* data range: weekly sets, percent gain */
	unsigned char *kind;       /* w x h, row 0 at the top */
	char *mark;                /* mark letters where kind == TP_MARK */
};

struct sd_tplot *tplot_new(int w, int h);
void tplot_free(struct sd_tplot *p);
/* Fills the three bands and the mean of the curve over [0, xmax] (percent scale); the y range
 * covers the widest band (one athlete). */
void tplot_curve(struct sd_tplot *p, const struct sd_profile *prof, const struct sd_covars *c,
		 double level, double xmax);
/* Column of dose x and row of percent y (clamped to the grid). */
int tplot_col(const struct sd_tplot *p, double x);
int tplot_row(const struct sd_tplot *p, double y);
/* Puts a mark letter at (x, y) in data units. */
void tplot_mark(struct sd_tplot *p, double x, double y, char letter);
/* The glyph for a cell: UTF-8 block shades when unicode, else ASCII. */
const char *tplot_glyph(const struct sd_tplot *p, int col, int row, int unicode, char *buf);
/* Prints the grid with a y axis (percent) and an x axis (weekly fractional sets). */
void tplot_print(FILE *f, const struct sd_tplot *p, int unicode);

#endif
