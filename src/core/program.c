#include "program.h"

#include <ctype.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

static int grow(void **buf, int *cap, int need, size_t size, struct sd_err *e)
{
	if (need <= *cap)
		return 0;
	int ncap = *cap ? *cap * 2 : 16;
	while (ncap < need)
		ncap *= 2;
	void *nb = realloc(*buf, (size_t)ncap * size);
	if (!nb)
		return sd_fail(e, "out of memory");
	*buf = nb;
	*cap = ncap;
	return 0;
}

int prog_add_day(struct sd_program *p, const char *name, int line, struct sd_err *e)
{
	if (grow((void **)&p->days, &p->capdays, p->ndays + 1, sizeof *p->days, e))
		return -1;
	struct sd_day *d = &p->days[p->ndays++];
	snprintf(d->name, sizeof d->name, "%s", name);
	d->line = line;
	return 0;
}

int prog_add_entry(struct sd_program *p, const struct sd_entry *en, struct sd_err *e)
{
	if (grow((void **)&p->entries, &p->capentries, p->nentries + 1, sizeof *p->entries, e))
		return -1;
	p->entries[p->nentries++] = *en;
	return 0;
}

void prog_free(struct sd_program *p)
{
	free(p->days);
	free(p->entries);
	memset(p, 0, sizeof *p);
}

/* Reads a whole non-negative decimal number, refusing overflow and anything huge; the
 * caller range-checks. */
static int number(const char **s, long *out)
{
	const char *q = *s;
	long v = 0;
	if (!isdigit((unsigned char)*q))
		return -1;
	while (isdigit((unsigned char)*q)) {
		if (v > 1000000)
			return -2;
		v = v * 10 + (*q++ - '0');
	}
	*s = q;
	*out = v;
	return 0;
}

static void skip_space(const char **s)
{
	while (**s == ' ' || **s == '\t')
		(*s)++;
}

int prog_parse_sets(const char *text, int *sets, int *reps, int *rir, struct sd_err *e)
{
	const char *s = text;
	long v;
	int rc;

	*reps = 0;
	*rir = -1;
	skip_space(&s);
	if (*s == '-')
		return sd_fail(e, "negative set count '%s'", text);
	if ((rc = number(&s, &v)))
		return rc == -2 ? sd_fail(e, "absurd set count '%s' (at most %d per exercise and day)",
					  text, SD_MAX_SETS)
				: sd_fail(e, "bad set syntax '%s' (expected SETS, SETSxREPS or SETSxREPS @RIR)", text);
	if (v < 1)
		return sd_fail(e, "set count must be at least 1 in '%s'", text);
	if (v > SD_MAX_SETS)
		return sd_fail(e, "absurd set count %ld in '%s' (at most %d per exercise and day)", v,
			       text, SD_MAX_SETS);
	*sets = (int)v;
	skip_space(&s);
	if (*s == 'x' || *s == 'X' || *s == '*') {
		s++;
		skip_space(&s);
		if (*s == '-')
			return sd_fail(e, "negative rep count in '%s'", text);
		if ((rc = number(&s, &v)) || v < 1 || v > SD_MAX_REPS)
			return sd_fail(e, "bad rep count in '%s' (1 to %d)", text, SD_MAX_REPS);
		*reps = (int)v;
		skip_space(&s);
	}
	if (*s == '@') {
		s++;
		skip_space(&s);
		if (*s == '-')
			return sd_fail(e, "RIR out of range in '%s' (0 to %d)", text, SD_MAX_RIR);
		if ((rc = number(&s, &v)) || v > SD_MAX_RIR)
			return sd_fail(e, "RIR out of range in '%s' (0 to %d)", text, SD_MAX_RIR);
		*rir = (int)v;
		skip_space(&s);
	}
	if (*s)
		return sd_fail(e, "bad set syntax '%s' (expected SETS, SETSxREPS or SETSxREPS @RIR)", text);
	return 0;
}
