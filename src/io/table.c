#include "table.h"

#include <locale.h>
#include <stdarg.h>
#include <stdlib.h>
#include <string.h>
#include <wchar.h>

struct sd_table {
	int ncols, nrows, caprows;
	char **head;
	int *left;
	int *narrow_out;  /* '~' columns: left out of the narrow text table */
	char **cells;   /* nrows x ncols */
};

struct sd_table *tbl_new(int ncols, const char *const *headers)
{
	struct sd_table *t = calloc(1, sizeof *t);
	if (!t)
		return NULL;
	t->ncols = ncols;
	t->head = calloc((size_t)ncols, sizeof *t->head);
	t->left = calloc((size_t)ncols, sizeof *t->left);
	t->narrow_out = calloc((size_t)ncols, sizeof *t->narrow_out);
	if (!t->head || !t->left || !t->narrow_out) {
		tbl_free(t);
		return NULL;
	}
	for (int i = 0; i < ncols; i++) {
		const char *h = headers[i];
		if ((t->narrow_out[i] = *h == '~'))
			h++;
		if ((t->left[i] = *h == '<'))
			h++;
		if (!(t->head[i] = strdup(h))) {
			tbl_free(t);
			return NULL;
		}
	}
	return t;
}

int tbl_row(struct sd_table *t)
{
	if (t->nrows == t->caprows) {
		int ncap = t->caprows ? t->caprows * 2 : 32;
		char **nc = realloc(t->cells, (size_t)ncap * (size_t)t->ncols * sizeof *nc);
		if (!nc)
			return -1;
		t->cells = nc;
		t->caprows = ncap;
	}
	memset(&t->cells[(size_t)t->nrows * (size_t)t->ncols], 0, (size_t)t->ncols * sizeof *t->cells);
	t->nrows++;
	return 0;
}

int tbl_set(struct sd_table *t, int col, const char *fmt, ...)
{
	va_list ap;
	char *s = NULL;
	if (!t->nrows || col < 0 || col >= t->ncols)
		return -1;
	va_start(ap, fmt);
	int n = vasprintf(&s, fmt, ap);
	va_end(ap);
	if (n < 0)
		return -1;
	char **cell = &t->cells[(size_t)(t->nrows - 1) * (size_t)t->ncols + (size_t)col];
	free(*cell);
	*cell = s;
	return 0;
}

int tbl_rows(const struct sd_table *t)
{
	return t->nrows;
}

void tbl_locale(void)
{
	static int done;
	if (!done) {
		setlocale(LC_CTYPE, "");
		done = 1;
	}
}

/* Display width of UTF-8 text (muscle names are ASCII, but program and athlete names may not
 * be), so columns line up on a terminal. A colour escape (ESC [ ... letter) takes no column. */
int tbl_width(const char *s)
{
	mbstate_t st;
	int w = 0;
	const char *p = s;

	while (*p && !(*p & 0x80) && *p != '\033')   /* plain ASCII: one column a byte */
		p++;
	if (!*p)
		return (int)(p - s);
	tbl_locale();
	memset(&st, 0, sizeof st);
	while (*s) {
		wchar_t wc;
		size_t n;
		if (s[0] == '\033' && s[1] == '[') {
			for (s += 2; *s && !(*s >= 0x40 && *s <= 0x7e); s++)
				;
			s += !!*s;
			continue;
		}
		n = mbrtowc(&wc, s, MB_CUR_MAX, &st);
		if (n == (size_t)-1 || n == (size_t)-2 || n == 0) {
			w++;
			s++;
			memset(&st, 0, sizeof st);
			continue;
		}
		int cw = wcwidth(wc);
		w += cw > 0 ? cw : 0;
		s += n;
	}
	return w;
}

void tbl_csv_field(FILE *f, const char *s)
{
	if (!strpbrk(s, ",\"\n\r")) {
		fputs(s, f);
		return;
	}
	fputc('"', f);
	for (; *s; s++) {
		if (*s == '"')
			fputc('"', f);
		fputc(*s, f);
	}
	fputc('"', f);
}

static const char *cell(const struct sd_table *t, int r, int c)
{
	const char *s = r < 0 ? t->head[c] : t->cells[(size_t)r * (size_t)t->ncols + (size_t)c];
	return s ? s : "";
}

int tbl_mode(int csv, int wide)
{
	return csv ? TBL_CSV : wide ? TBL_WIDE : TBL_TEXT;
}

static void print_csv(const struct sd_table *t, FILE *f)
{
	for (int r = -1; r < t->nrows; r++) {
		for (int c = 0; c < t->ncols; c++) {
			if (c)
				fputc(',', f);
			tbl_csv_field(f, cell(t, r, c));
		}
		fputc('\n', f);
	}
}

/* Display widths of the columns shown in this mode; 0 for a column left out (w[c] < 0). */
static int *col_widths(const struct sd_table *t, int mode)
{
	int *w = calloc((size_t)t->ncols, sizeof *w);
	if (!w)
		return NULL;
	for (int c = 0; c < t->ncols; c++) {
		if (mode == TBL_TEXT && t->narrow_out[c]) {
			w[c] = -1;
			continue;
		}
		for (int r = -1; r < t->nrows; r++) {
			int cw = tbl_width(cell(t, r, c));
			if (cw > w[c])
				w[c] = cw;
		}
	}
	return w;
}

/* Rows of the columns in show[] (a list of column numbers), skipping a row whose columns
 * from `skip_from` on are all empty when skip_from > 0. */
static void print_cols(const struct sd_table *t, FILE *f, const int *w, const int *show, int n,
		       int skip_from)
{
	for (int r = -1; r < t->nrows; r++) {
		if (r >= 0 && skip_from > 0) {
			int any = 0;
			for (int i = skip_from; i < n && !any; i++)
				any = *cell(t, r, show[i]) != '\0';
			if (!any)
				continue;
		}
		/* Padding is written only before text, so no line ends in blanks. */
		int pend = 0;
		for (int i = 0; i < n; i++) {
			int c = show[i];
			const char *s = cell(t, r, c);
			int pad = w[c] - tbl_width(s);
			pend += i ? 2 : 0;
			if (!t->left[c])
				pend += pad;
			if (*s) {
				fprintf(f, "%*s%s", pend, "", s);
				pend = 0;
			}
			if (t->left[c])
				pend += pad;
		}
		fputc('\n', f);
	}
}

void tbl_print_panels(const struct sd_table *t, FILE *f, int mode, int width, int keep)
{
	int *w, *show, nkeep = 0, kw = 0;

	if (mode == TBL_CSV) {
		print_csv(t, f);
		return;
	}
	w = col_widths(t, mode);
	show = calloc((size_t)t->ncols, sizeof *show);
	if (!w || !show)
		goto out;
	for (int c = 0; c < t->ncols && c < keep; c++)
		if (w[c] >= 0) {
			show[nkeep++] = c;
			kw += w[c] + 2;
		}
	/* Each panel takes the next columns that fit beside the kept ones (at least one). */
	for (int c = nkeep ? show[nkeep - 1] + 1 : 0, first = 1; c < t->ncols || first; first = 0) {
		int n = nkeep, used = kw;
		for (; c < t->ncols; c++) {
			if (w[c] < 0)
				continue;
			if (n > nkeep && width > 0 && used + w[c] > width)
				break;
			show[n++] = c;
			used += w[c] + 2;
		}
		if (!first)
			fputc('\n', f);
		print_cols(t, f, w, show, n, c < t->ncols || !first ? nkeep : 0);
	}
out:
	free(w);
	free(show);
}

void tbl_print(const struct sd_table *t, FILE *f, int mode)
{
	tbl_print_panels(t, f, mode, 0, 0);
}

void tbl_free(struct sd_table *t)
{
	if (!t)
		return;
	for (int i = 0; t->head && i < t->ncols; i++)
		free(t->head[i]);
	for (size_t i = 0; i < (size_t)t->nrows * (size_t)t->ncols; i++)
		free(t->cells[i]);
	free(t->cells);
	free(t->head);
	free(t->left);
	free(t->narrow_out);
	free(t);
}
