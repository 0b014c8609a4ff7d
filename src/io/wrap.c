#include "wrap.h"

#include <stdarg.h>
#include <stdlib.h>
#include <string.h>
#include <sys/ioctl.h>
#include <unistd.h>

#include "table.h"

int wrap_width(FILE *f)
{
	int fd = fileno(f), w = 0;
	const char *env;
	struct winsize ws;

	if (fd < 0 || !isatty(fd))
		return WRAP_DEFAULT;
	/* COLUMNS first, as curses reads it: a user can ask for a width the terminal does not
	 * report (a pane, a log viewer). */
	if ((env = getenv("COLUMNS")) && *env) {
		char *end;
		long v = strtol(env, &end, 10);
		if (!*end && v > 0 && v < 100000)
			w = (int)v;
	}
	if (!w && ioctl(fd, TIOCGWINSZ, &ws) == 0 && ws.ws_col > 0)
		w = ws.ws_col;
	if (!w)
		w = WRAP_DEFAULT;
	return w < WRAP_MIN ? WRAP_MIN : w;
}

/* Display columns of the n bytes at s. */
static int cols(const char *s, size_t n)
{
	char buf[256];
	if (n < sizeof buf) {
		memcpy(buf, s, n);
		buf[n] = '\0';
		return tbl_width(buf);
	}
	char *p = strndup(s, n);
	int w = p ? tbl_width(p) : (int)n;
	free(p);
	return w;
}

static void put(struct wrap_line *out, int max, int k, const char *s, const char *end, int lead)
{
	if (k < max)
		out[k] = (struct wrap_line){ s, (int)(end - s), lead };
}

/* One paragraph (no '\n' inside) from p to end; returns the new line count. */
static int paragraph(const char *p, const char *end, int width, int indent,
		     struct wrap_line *out, int max, int k)
{
	const char *start = p, *line_end;
	int col, words = 0, lead = 0;

	while (p < end && *p == ' ')
		p++;
	col = (int)(p - start);
	line_end = p;
	while (p < end) {
		const char *gap = p, *w;
		while (p < end && *p == ' ')
			p++;
		if (p == end)
			break;   /* trailing spaces are not printed */
		w = p;
		while (p < end && *p != ' ')
			p++;
		int ww = cols(w, (size_t)(p - w)), gw = (int)(w - gap);
		if (words && col + gw + ww > width) {
			put(out, max, k++, start, line_end, lead);
			start = w;
			lead = indent;
			col = indent + ww;
		} else
			col += gw + ww;
		line_end = p;
		words++;
	}
	put(out, max, k++, start, line_end, lead);
	return k;
}

int wrap_lines(const char *text, int width, int indent, struct wrap_line *out, int max)
{
	int k = 0;
	const char *p = text;

	if (!*p)
		return 0;
	while (*p) {
		const char *nl = strchr(p, '\n'), *end = nl ? nl : p + strlen(p);
		k = paragraph(p, end, width, indent, out, max, k);
		p = nl ? nl + 1 : end;
	}
	return k;
}

void wrap_print(FILE *f, int width, int indent, const char *text)
{
	struct wrap_line small[32], *l = small;
	int n = wrap_lines(text, width, indent, small, 32);

	if (n > 32 && (l = malloc((size_t)n * sizeof *l)))
		wrap_lines(text, width, indent, l, n);
	else if (n > 32) {
		fputs(text, f);   /* out of memory: unwrapped rather than lost */
		fputc('\n', f);
		return;
	}
	for (int i = 0; i < n; i++)
		fprintf(f, "%*s%.*s\n", l[i].lead, "", l[i].len, l[i].s);
	if (l != small)
		free(l);
}

void wrap_printf(FILE *f, int indent, const char *fmt, ...)
{
	va_list ap;
	char *s = NULL;

	va_start(ap, fmt);
	int n = vasprintf(&s, fmt, ap);
	va_end(ap);
	if (n < 0)
		return;
	wrap_print(f, wrap_width(f), indent, s);
	free(s);
}
