#include "program.h"

#include <stdarg.h>
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
	if (strlen(name) > SD_DAY_NAME_MAX)
		return sd_fail(e, "day name longer than %d bytes", SD_DAY_NAME_MAX);
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

int prog_note(struct sd_program *p, int line, int day, struct sd_err *e, const char *fmt, ...)
{
	va_list ap;
	int n;

	if (grow((void **)&p->notes, &p->capnotes, p->nnotes + 1, sizeof *p->notes, e))
		return -1;
	struct sd_pnote *note = &p->notes[p->nnotes++];
	note->line = line;
	note->day = day;
	va_start(ap, fmt);
	n = vsnprintf(note->text, sizeof note->text, fmt, ap);
	va_end(ap);
	if (n >= (int)sizeof note->text)   /* a long name: say it was cut */
		memcpy(note->text + sizeof note->text - 4, "...", 4);
	return 0;
}

void prog_free(struct sd_program *p)
{
	free(p->days);
	free(p->entries);
	free(p->notes);
	memset(p, 0, sizeof *p);
}
