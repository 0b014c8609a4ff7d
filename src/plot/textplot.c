#include "textplot.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

struct sd_tplot *tplot_new(int w, int h)
{
	struct sd_tplot *p = calloc(1, sizeof *p);
	if (!p)
		return NULL;
	p->w = w;
	p->h = h;
	p->kind = calloc((size_t)w * (size_t)h, 1);
	p->mark = calloc((size_t)w * (size_t)h, 1);
	if (!p->kind || !p->mark) {
		tplot_free(p);
		return NULL;
	}
	return p;
}

void tplot_free(struct sd_tplot *p)
{
	if (!p)
		return;
	free(p->kind);
	free(p->mark);
	free(p);
}

int tplot_col(const struct sd_tplot *p, double x)
{
	int c = (int)lround((x - p->x0) / (p->x1 - p->x0) * (p->w - 1));
	return c < 0 ? 0 : c >= p->w ? p->w - 1 : c;
}

int tplot_row(const struct sd_tplot *p, double y)
{
	int r = (int)lround((p->y1 - y) / (p->y1 - p->y0) * (p->h - 1));
	return r < 0 ? 0 : r >= p->h ? p->h - 1 : r;
}

static void fill(struct sd_tplot *p, int col, double lo, double hi, unsigned char kind)
{
	int r0 = tplot_row(p, hi), r1 = tplot_row(p, lo);
	for (int r = r0; r <= r1; r++) {
		unsigned char *k = &p->kind[(size_t)r * (size_t)p->w + (size_t)col];
		if (*k < kind)
			*k = kind;
	}
}

void tplot_curve(struct sd_tplot *p, const struct sd_profile *prof, const struct sd_covars *c,
		 double level, double xmax)
{
	struct sd_point pt;
	double lo = INFINITY, hi = -INFINITY;

	memset(p->kind, 0, (size_t)p->w * (size_t)p->h);
	memset(p->mark, 0, (size_t)p->w * (size_t)p->h);
	p->x0 = 0;
	p->x1 = xmax > 0 ? xmax : 1;
	for (int col = 0; col < p->w; col++) {
		curve_eval(prof, c, p->x0 + (p->x1 - p->x0) * col / (p->w - 1), level, &pt);
		if (curve_pct(pt.ath_lo) < lo)
			lo = curve_pct(pt.ath_lo);
		if (curve_pct(pt.ath_hi) > hi)
			hi = curve_pct(pt.ath_hi);
	}
	/* Round the axis to whole 5 % steps so the labels read cleanly. */
	p->y0 = floor(lo / 5) * 5;
	p->y1 = ceil(hi / 5) * 5;
	if (p->y1 <= p->y0)
		p->y1 = p->y0 + 5;
	for (int col = 0; col < p->w; col++) {
		curve_eval(prof, c, p->x0 + (p->x1 - p->x0) * col / (p->w - 1), level, &pt);
		fill(p, col, curve_pct(pt.ath_lo), curve_pct(pt.ath_hi), TP_ATHLETE);
		fill(p, col, curve_pct(pt.group_lo), curve_pct(pt.group_hi), TP_GROUP);
		fill(p, col, curve_pct(pt.ci_lo), curve_pct(pt.ci_hi), TP_CI);
		fill(p, col, curve_pct(pt.y), curve_pct(pt.y), TP_MEAN);
	}
}

void tplot_mark(struct sd_tplot *p, double x, double y, char letter)
{
	size_t i = (size_t)tplot_row(p, y) * (size_t)p->w + (size_t)tplot_col(p, x);
	p->kind[i] = TP_MARK;
	p->mark[i] = letter;
}

const char *tplot_glyph(const struct sd_tplot *p, int col, int row, int unicode, char *buf)
{
	size_t i = (size_t)row * (size_t)p->w + (size_t)col;
	static const char *const uni[] = { " ", "\u2591", "\u2592", "\u2593", "\u2588", "", "\u2502" };
	static const char *const ascii[] = { " ", ".", ":", "=", "#", "", "|" };
	if (p->kind[i] == TP_MARK) {
		buf[0] = p->mark[i];
		buf[1] = '\0';
		return buf;
	}
	return (unicode ? uni : ascii)[p->kind[i]];
}

void tplot_print(FILE *f, const struct sd_tplot *p, int unicode)
{
	char buf[8];
	for (int r = 0; r < p->h; r++) {
		double y = p->y1 - (p->y1 - p->y0) * r / (p->h - 1);
		/* Label about every fourth row, and always the top and bottom. */
		if (r == 0 || r == p->h - 1 || r % 4 == 0)
			fprintf(f, "%6.0f%% |", y);
		else
			fprintf(f, "        |");
		for (int c = 0; c < p->w; c++)
			fputs(tplot_glyph(p, c, r, unicode, buf), f);
		fputc('\n', f);
	}
	fprintf(f, "        +");
	for (int c = 0; c < p->w; c++)
		fputc(c % 10 == 0 ? '+' : '-', f);
	fprintf(f, "\n         ");
	for (int c = 0; c < p->w; c += 10) {
		char lab[16];
		int n = snprintf(lab, sizeof lab, "%.0f", p->x0 + (p->x1 - p->x0) * c / (p->w - 1));
		fputs(lab, f);
		if (c + 10 < p->w)
			fprintf(f, "%*s", 10 - n, "");
	}
	fprintf(f, "\n         weekly fractional sets\n");
}
