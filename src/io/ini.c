#include "ini.h"
#include "../core/text.h"

#include <errno.h>
#include <stdarg.h>
#include <fcntl.h>
#include <sys/stat.h>
#include <unistd.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

/* A value may be quoted to keep ';' or '#' in it; otherwise they start a comment. */
static char *value_of(char *v, int *bad)
{
	v = text_trim(v);
	*bad = 0;
	if (*v == '"') {
		char *close = strchr(v + 1, '"');
		if (!close) {
			*bad = 1;
			return v;
		}
		*close = '\0';
		char *rest = text_trim(close + 1);
		if (*rest && *rest != ';' && *rest != '#')
			*bad = 1;
		return v + 1;
	}
	char *comment = strpbrk(v, ";#");
	if (comment)
		*comment = '\0';
	return text_trim(v);
}

/* Reports a malformed line: through the callback (ini_scan_all) or as the error (ini_scan). */
static int malformed(struct sd_ini_item *it, const char *what, const char *label, int all,
		     sd_ini_fn fn, void *arg, struct sd_err *e, const char *fmt, ...)
	__attribute__((format(printf, 8, 9)));

static int malformed(struct sd_ini_item *it, const char *what, const char *label, int all,
		     sd_ini_fn fn, void *arg, struct sd_err *e, const char *fmt, ...)
{
	char msg[400];
	va_list ap;

	va_start(ap, fmt);
	vsnprintf(msg, sizeof msg, fmt, ap);
	va_end(ap);
	if (!all)
		return sd_fail(e, "cannot read %s '%s' line %d: %s", what, label, it->line, msg);
	struct sd_ini_item bad = { it->section, NULL, NULL, it->line, msg };
	return fn(&bad, arg, e);
}

static int scan(const char *what, const char *label, char *text, int all, sd_ini_fn fn,
		void *arg, struct sd_err *e)
{
	struct sd_ini_item it = { NULL, NULL, NULL, 0, NULL };
	int rc, skip = 0;

	if (!strncmp(text, "\xEF\xBB\xBF", 3))   /* a UTF-8 byte-order mark, as some editors write */
		text += 3;

	for (char *raw = text, *next; raw; raw = next) {
		next = strchr(raw, '\n');
		if (next)
			*next++ = '\0';
		it.line++;
		char *s = text_trim(raw);
		if (!*s || *s == ';' || *s == '#')
			continue;
		if (*s == '[') {
			char *end = strchr(s, ']');
			char *rest = end ? text_trim(end + 1) : NULL;
			if (!end || (*rest && *rest != ';' && *rest != '#')) {
				skip = 1;
				if ((rc = malformed(&it, what, label, all, fn, arg, e,
						    "bad section header '%s'", s)))
					return rc;
				continue;
			}
			*end = '\0';
			char *name = text_trim(s + 1);
			if (!*name) {
				skip = 1;
				if ((rc = malformed(&it, what, label, all, fn, arg, e, "empty section name")))
					return rc;
				continue;
			}
			skip = 0;
			it.section = name;
			it.key = NULL;
			it.value = NULL;
			if ((rc = fn(&it, arg, e)))
				return rc;
			continue;
		}
		if (skip)
			continue;
		char *eq = strchr(s, '=');
		if (!eq) {
			if ((rc = malformed(&it, what, label, all, fn, arg, e,
					    "expected 'name = value', got '%s'", s)))
				return rc;
			continue;
		}
		*eq = '\0';
		int bad;
		it.key = text_trim(s);
		it.value = value_of(eq + 1, &bad);
		if (bad) {
			if ((rc = malformed(&it, what, label, all, fn, arg, e,
					    "unclosed or misplaced quote")))
				return rc;
			continue;
		}
		if (!*it.key) {
			if ((rc = malformed(&it, what, label, all, fn, arg, e, "missing key before '='")))
				return rc;
			continue;
		}
		if ((rc = fn(&it, arg, e)))
			return rc;
	}
	return 0;
}

int ini_scan(const char *what, const char *label, char *text, sd_ini_fn fn, void *arg,
	     struct sd_err *e)
{
	return scan(what, label, text, 0, fn, arg, e);
}

int ini_scan_all(char *text, sd_ini_fn fn, void *arg, struct sd_err *e)
{
	return scan("", "", text, 1, fn, arg, e);
}

int ini_nul_line(const char *text, size_t len)
{
	const char *nul = memchr(text, '\0', len);
	int line = 1;
	if (!nul)
		return 0;
	for (const char *s = text; s < nul; s++)
		line += *s == '\n';
	return line;
}

int ini_slurp(const char *what, const char *path, char **text, size_t *len, struct sd_err *e)
{
	struct stat sb;
	char *buf = NULL;
	size_t n = 0, cap;
	int fd = open(path, O_RDONLY | O_CLOEXEC);

	if (fd < 0)
		return sd_fail(e, "cannot read %s '%s': %s", what, path, strerror(errno));
	if (fstat(fd, &sb) == 0 && S_ISDIR(sb.st_mode)) {
		close(fd);
		return sd_fail(e, "cannot read %s '%s': %s", what, path, strerror(EISDIR));
	}
	/* Sized from fstat so a whole file is one read; pipes and files that grow still work. */
	cap = sb.st_size > 0 ? (size_t)sb.st_size + 1 : 8192;
	for (;;) {
		if (cap - n < 2) {
			char *nb = realloc(buf, cap * 2);
			if (!nb)
				goto oom;
			buf = nb;
			cap *= 2;
		}
		if (!buf && !(buf = malloc(cap)))
			goto oom;
		ssize_t got = read(fd, buf + n, cap - n - 1);
		if (got < 0) {
			if (errno == EINTR)
				continue;
			sd_fail(e, "cannot read %s '%s': %s", what, path, strerror(errno));
			free(buf);
			close(fd);
			return -1;
		}
		if (got == 0)
			break;
		n += (size_t)got;
	}
	close(fd);
	buf[n] = '\0';
	*text = buf;
	*len = n;
	return 0;
oom:
	free(buf);
	close(fd);
	return sd_fail(e, "out of memory");
}
