#include "csv.h"

#include <errno.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

struct sd_csv {
	FILE *f;
	int own;
	char path[512];
	int line, start;     /* current line; line where the last record began */
	char *buf;           /* field text, NUL-separated */
	size_t len, cap;
	char **fields;
	int nf, capf;
	char delim;          /* field separator, ',' unless set */
	int comments;        /* skip lines starting with '#' */
};

struct sd_csv *csv_open(const char *path, struct sd_err *e)
{
	struct sd_csv *c = calloc(1, sizeof *c);
	if (!c) {
		sd_fail(e, "out of memory");
		return NULL;
	}
	snprintf(c->path, sizeof c->path, "%s", path);
	if (!strcmp(path, "-")) {
		c->f = stdin;
	} else {
		c->f = fopen(path, "rb");
		c->own = 1;
	}
	if (!c->f) {
		sd_fail(e, "cannot read '%s': %s", path, strerror(errno));
		free(c);
		return NULL;
	}
	/* Skip a UTF-8 byte-order mark (spreadsheet exports); a file without one is rewound. */
	if (c->own) {
		unsigned char bom[3];
		if (fread(bom, 1, 3, c->f) != 3 || memcmp(bom, "\xEF\xBB\xBF", 3))
			rewind(c->f);
	}
	c->line = 1;
	c->delim = ',';
	return c;
}

struct sd_csv *csv_open_mem(const char *label, const char *text, size_t len, struct sd_err *e)
{
	struct sd_csv *c = calloc(1, sizeof *c);
	if (!c) {
		sd_fail(e, "out of memory");
		return NULL;
	}
	snprintf(c->path, sizeof c->path, "%s", label);
	/* fmemopen refuses a zero-length buffer; an empty text is simply a file with no records. */
	c->f = fmemopen((void *)(len ? text : " "), len ? len : 1, "r");
	c->own = 1;
	if (!c->f) {
		sd_fail(e, "cannot read '%s': %s", label, strerror(errno));
		free(c);
		return NULL;
	}
	c->line = 1;
	c->delim = ',';
	return c;
}

void csv_set_delim(struct sd_csv *c, char delim)
{
	c->delim = delim;
}

void csv_set_first_line(struct sd_csv *c, int line)
{
	c->line = c->start = line;
}

void csv_set_comments(struct sd_csv *c, int on)
{
	c->comments = on;
}

char csv_detect(const char *line, size_t len)
{
	int n[3] = { 0, 0, 0 }, quoted = 0;
	static const char cand[3] = { ',', ';', '\t' };

	for (size_t i = 0; i < len && line[i] != '\n'; i++) {
		if (line[i] == '"')
			quoted = !quoted;
		for (int k = 0; k < 3 && !quoted; k++)
			n[k] += line[i] == cand[k];
	}
	int best = 0;
	for (int k = 1; k < 3; k++)
		if (n[k] > n[best])
			best = k;
	return cand[best];
}

static int put(struct sd_csv *c, char ch, struct sd_err *e)
{
	if (c->len + 1 >= c->cap) {
		size_t ncap = c->cap ? c->cap * 2 : 256;
		char *nb = realloc(c->buf, ncap);
		if (!nb)
			return sd_fail(e, "out of memory");
		c->buf = nb;
		c->cap = ncap;
	}
	c->buf[c->len++] = ch;
	return 0;
}

/* Field starts are stored as offsets while reading (the buffer may move), then turned into
 * pointers once the record is complete. */
static int end_field(struct sd_csv *c, size_t *starts, int *nstart, size_t *start, struct sd_err *e)
{
	if (put(c, '\0', e))
		return -1;
	starts[(*nstart)++] = *start;
	*start = c->len;
	return 0;
}

int csv_next(struct sd_csv *c, char ***fields, int *n, struct sd_err *e)
{
	enum { FIELD_START, PLAIN, QUOTED, QUOTE_IN_QUOTED } st = FIELD_START;
	size_t starts[256], start = 0;
	int nstart = 0, ch, any = 0;

	c->len = 0;
	c->start = c->line;
	for (;;) {
		/* One thread reads a stream: the unlocked getc saves a lock per byte. */
		ch = getc_unlocked(c->f);
		if (ch == EOF) {
			if (ferror(c->f))
				return sd_fail(e, "cannot read '%s': %s", c->path, strerror(errno));
			if (st == QUOTED)
				return sd_fail(e, "'%s' line %d: quoted field not closed", c->path, c->start);
			if (!any)
				return 0;
			break;
		}
		if (ch == '\0')
			return sd_fail(e, "'%s' line %d: NUL byte in a text file", c->path, c->line);
		if (ch == '#' && c->comments && !any && st == FIELD_START) {
			while ((ch = getc_unlocked(c->f)) != EOF && ch != '\n')
				if (ch == '\0')
					return sd_fail(e, "'%s' line %d: NUL byte in a text file", c->path, c->line);
			c->line++;
			c->start = c->line;
			if (ch == EOF)
				return 0;
			continue;
		}
		if (st == QUOTED) {
			if (ch == '"')
				st = QUOTE_IN_QUOTED;
			else {
				if (ch == '\n')
					c->line++;
				if (put(c, (char)ch, e))
					return -1;
			}
			continue;
		}
		if (st == QUOTE_IN_QUOTED) {
			if (ch == '"') {
				if (put(c, '"', e))
					return -1;
				st = QUOTED;
				continue;
			}
			st = PLAIN;  /* closing quote; fall through to the separators */
		}
		if (ch == '\r')
			continue;
		if (ch == '\n') {
			c->line++;
			if (!any) {       /* blank line */
				c->start = c->line;
				continue;
			}
			break;
		}
		any = 1;
		if (ch == c->delim) {
			if (nstart >= 255)
				return sd_fail(e, "'%s' line %d: more than 255 fields", c->path, c->start);
			if (end_field(c, starts, &nstart, &start, e))
				return -1;
			st = FIELD_START;
			continue;
		}
		if (ch == '"' && st == FIELD_START) {
			st = QUOTED;
			continue;
		}
		st = PLAIN;
		if (put(c, (char)ch, e))
			return -1;
	}
	if (end_field(c, starts, &nstart, &start, e))
		return -1;
	if (nstart > c->capf) {
		char **nf = realloc(c->fields, (size_t)nstart * sizeof *nf);
		if (!nf)
			return sd_fail(e, "out of memory");
		c->fields = nf;
		c->capf = nstart;
	}
	for (int i = 0; i < nstart; i++)
		c->fields[i] = c->buf + starts[i];
	c->nf = nstart;
	*fields = c->fields;
	*n = nstart;
	return 1;
}

int csv_line(const struct sd_csv *c)
{
	return c->start;
}

const char *csv_path(const struct sd_csv *c)
{
	return c->path;
}

void csv_close(struct sd_csv *c)
{
	if (!c)
		return;
	if (c->own && c->f)
		fclose(c->f);
	free(c->buf);
	free(c->fields);
	free(c);
}

/* Trims surrounding blanks in place of copying: returns the first non-blank and its length. */
static const char *trim(const char *s, size_t *len)
{
	while (*s == ' ' || *s == '\t')
		s++;
	*len = strlen(s);
	while (*len && (s[*len - 1] == ' ' || s[*len - 1] == '\t'))
		(*len)--;
	return s;
}

/* The cell without its surrounding blanks, as a string in tmp (n bytes); -1 when empty or
 * too long. */
static int cell(const char *s, char *tmp, size_t n)
{
	size_t len;
	s = trim(s, &len);
	if (!len || len >= n)
		return -1;
	memcpy(tmp, s, len);
	tmp[len] = '\0';
	errno = 0;
	return 0;
}

int csv_double(const char *s, double *out)
{
	char tmp[128], *end;
	double v;

	if (cell(s, tmp, sizeof tmp))
		return -1;
	v = strtod(tmp, &end);
	if (*end || errno || !isfinite(v))
		return -1;
	*out = v;
	return 0;
}

int csv_int(const char *s, int *out)
{
	char tmp[32], *end;
	long v;

	if (cell(s, tmp, sizeof tmp))
		return -1;
	v = strtol(tmp, &end, 10);
	if (*end || errno || v > 1000000000L || v < -1000000000L)
		return -1;
	*out = (int)v;
	return 0;
}
