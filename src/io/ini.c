#include "ini.h"

#include <errno.h>
#include <fcntl.h>
#include <sys/stat.h>
#include <unistd.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

static char *trim(char *s)
{
	while (*s == ' ' || *s == '\t')
		s++;
	char *end = s + strlen(s);
	while (end > s && (end[-1] == ' ' || end[-1] == '\t' || end[-1] == '\r'))
		*--end = '\0';
	return s;
}

/* A value may be quoted to keep ';' or '#' in it; otherwise they start a comment. */
static char *value_of(char *v, int *bad)
{
	v = trim(v);
	*bad = 0;
	if (*v == '"') {
		char *close = strchr(v + 1, '"');
		if (!close) {
			*bad = 1;
			return v;
		}
		*close = '\0';
		char *rest = trim(close + 1);
		if (*rest && *rest != ';' && *rest != '#')
			*bad = 1;
		return v + 1;
	}
	char *comment = strpbrk(v, ";#");
	if (comment)
		*comment = '\0';
	return trim(v);
}

int ini_scan(const char *what, const char *label, char *text, sd_ini_fn fn, void *arg,
	     struct sd_err *e)
{
	struct sd_ini_item it = { NULL, NULL, NULL, 0 };
	int rc;

	if (!strncmp(text, "\xEF\xBB\xBF", 3))   /* a UTF-8 byte-order mark, as some editors write */
		text += 3;

	for (char *raw = text, *next; raw; raw = next) {
		next = strchr(raw, '\n');
		if (next)
			*next++ = '\0';
		it.line++;
		char *s = trim(raw);
		if (!*s || *s == ';' || *s == '#')
			continue;
		if (*s == '[') {
			char *end = strchr(s, ']');
			char *rest = end ? trim(end + 1) : NULL;
			if (!end || (*rest && *rest != ';' && *rest != '#'))
				return sd_fail(e, "cannot read %s '%s' line %d: bad section header '%s'", what, label,
					       it.line, s);
			*end = '\0';
			it.section = trim(s + 1);
			if (!*it.section)
				return sd_fail(e, "cannot read %s '%s' line %d: empty section name", what, label, it.line);
			it.key = NULL;
			it.value = NULL;
			if ((rc = fn(&it, arg, e)))
				return rc;
			continue;
		}
		char *eq = strchr(s, '=');
		if (!eq)
			return sd_fail(e, "cannot read %s '%s' line %d: expected 'name = value', got '%s'", what, label,
				       it.line, s);
		*eq = '\0';
		int bad;
		it.key = trim(s);
		it.value = value_of(eq + 1, &bad);
		if (bad)
			return sd_fail(e, "cannot read %s '%s' line %d: unclosed or misplaced quote", what, label, it.line);
		if (!*it.key)
			return sd_fail(e, "cannot read %s '%s' line %d: missing key before '='", what, label, it.line);
		if ((rc = fn(&it, arg, e)))
			return rc;
	}
	return 0;
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
