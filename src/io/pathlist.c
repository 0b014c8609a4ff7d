#include "pathlist.h"

#include <errno.h>
#include <stdlib.h>
#include <string.h>

int paths_read(FILE *f, const char *label, struct pathlist *l, struct sd_err *e)
{
	size_t len = 0, cap = 1 << 16;
	int ncap = 0, c;

	memset(l, 0, sizeof *l);
	if (!(l->buf = malloc(cap)))
		return sd_fail(e, "out of memory");
	while ((c = getc(f)) != EOF) {
		if (len + 2 > cap) {
			char *b = realloc(l->buf, cap * 2);
			if (!b)
				goto oom;
			l->buf = b;
			cap *= 2;
		}
		l->buf[len++] = (char)c;
	}
	if (ferror(f)) {
		paths_free(l);
		return sd_fail(e, "cannot read the file list from %s: %s", label, strerror(errno));
	}
	l->buf[len] = '\0';
	for (char *p = l->buf, *nl; *p; p = nl + 1) {
		size_t k;
		int last;
		nl = strchr(p, '\n');
		if (!nl)
			nl = p + strlen(p);
		last = !*nl;
		k = (size_t)(nl - p);
		if (k && p[k - 1] == '\r')
			k--;
		if (k) {
			if (l->n == ncap) {
				char **v = realloc(l->v, (size_t)(ncap ? ncap * 2 : 1024) * sizeof *v);
				if (!v)
					goto oom;
				l->v = v;
				ncap = ncap ? ncap * 2 : 1024;
			}
			l->v[l->n++] = p;
			p[k] = '\0';
		}
		if (last)
			break;
	}
	return 0;
oom:
	paths_free(l);
	return sd_fail(e, "out of memory");
}

void paths_free(struct pathlist *l)
{
	free(l->v);
	free(l->buf);
	memset(l, 0, sizeof *l);
}
