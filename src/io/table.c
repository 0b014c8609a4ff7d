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
	if (!t->head || !t->left) {
		tbl_free(t);
		return NULL;
	}
	for (int i = 0; i < ncols; i++) {
		t->left[i] = headers[i][0] == '<';
		if (!(t->head[i] = strdup(headers[i] + t->left[i]))) {
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
 * be), so columns line up on a terminal. */
static int width(const char *s)
{
	mbstate_t st;
	int w = 0;
	const char *p = s;

	while (*p && !(*p & 0x80))   /* plain ASCII, the common case: one column a byte */
		p++;
	if (!*p)
		return (int)(p - s);
	tbl_locale();
	memset(&st, 0, sizeof st);
	while (*s) {
		wchar_t wc;
		size_t n = mbrtowc(&wc, s, MB_CUR_MAX, &st);
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

void tbl_print(const struct sd_table *t, FILE *f, int csv)
{
	if (csv) {
		for (int r = -1; r < t->nrows; r++) {
			for (int c = 0; c < t->ncols; c++) {
				if (c)
					fputc(',', f);
				tbl_csv_field(f, cell(t, r, c));
			}
			fputc('\n', f);
		}
		return;
	}
	int *w = calloc((size_t)t->ncols, sizeof *w);
	if (!w)
		return;
	for (int r = -1; r < t->nrows; r++)
		for (int c = 0; c < t->ncols; c++) {
			int cw = width(cell(t, r, c));
			if (cw > w[c])
				w[c] = cw;
		}
	for (int r = -1; r < t->nrows; r++) {
		for (int c = 0; c < t->ncols; c++) {
			const char *s = cell(t, r, c);
			int pad = w[c] - width(s);
			int last = c == t->ncols - 1;
			if (c)
				fputs("  ", f);
			if (!t->left[c])
				fprintf(f, "%*s", pad, "");
			fputs(s, f);
			if (t->left[c] && !last)
				fprintf(f, "%*s", pad, "");
		}
		fputc('\n', f);
	}
	free(w);
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
	free(t);
}
