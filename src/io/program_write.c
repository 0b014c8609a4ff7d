#include "program_write.h"

#include <string.h>
#include <strings.h>

#include "safefile.h"

#define MAX_LINE 2048   /* 16 groups of at most about 40 characters fit */

/* A value the line reader would cut or mis-split: it strips ';' and '#' comments, splits at
 * the first '=', trims blanks and ends a section name at ']'. */
static int unsafe(const char *s, int section)
{
	size_t n = strlen(s);
	if (!n || s[0] == ' ' || s[0] == '\t' || s[n - 1] == ' ' || s[n - 1] == '\t')
		return 1;
	for (; *s; s++)
		if (*s == '\n' || *s == '\r' || (section ? *s == ']' : *s == '=' || *s == ';' || *s == '#'))
			return 1;
	return 0;
}

/* The groups of one line ("1x3 @9, 3x5 @7"): consecutive entries of one exercise, day and
 * source line. Returns how many entries it wrote. */
static int line_text(const struct sd_program *p, int i, char *buf, size_t n)
{
	const struct sd_entry *en = &p->entries[i];
	size_t used = 0;
	int k = 0;

	buf[0] = '\0';
	do {
		char g[96];
		prog_format_group(&p->entries[i + k], g, sizeof g);
		if (used < n)
			used += (size_t)snprintf(buf + used, n - used, "%s%s", k ? ", " : "", g);
		k++;
	} while (i + k < p->nentries && en->line > 0 && p->entries[i + k].line == en->line &&
		 p->entries[i + k].ex == en->ex && p->entries[i + k].day == en->day);
	return k;
}

int pwrite_ini(FILE *f, const struct sd_program *p, const struct sd_library *lib,
	       const char *comment, struct sd_err *e)
{
	if (comment)
		for (const char *s = comment; *s;) {
			size_t n = strcspn(s, "\n");
			fprintf(f, "; %.*s\n", (int)n, s);
			s += n + (s[n] == '\n');
		}
	if (p->name[0] && !unsafe(p->name, 0) && !strchr(p->name, ']'))
		fprintf(f, "[program]\nname  = %s\n", p->name);
	else
		fprintf(f, "[program]\n");
	if (p->weeks > 0)
		fprintf(f, "weeks = %d\n", p->weeks);
	/* Efforts are written with their scale spelled out (or as @N from RPE 5 up), so no
	 * 'effort' key is needed: the text reads the same under either default. */
	for (int d = 0; d < p->ndays; d++) {
		if (unsafe(p->days[d].name, 1) || !strcasecmp(p->days[d].name, "program"))
			return sd_fail(e, "day name '%s' cannot be written to a program file",
				       p->days[d].name);
		fprintf(f, "\n[%s]\n", p->days[d].name);
		for (int i = 0; i < p->nentries;) {
			const struct sd_entry *en = &p->entries[i];
			char sets[MAX_LINE];
			if (en->day != d) {
				i++;
				continue;
			}
			if (unsafe(lib->ex[en->ex].name, 0))
				return sd_fail(e, "exercise name '%s' cannot be written to a program file",
					       lib->ex[en->ex].name);
			i += line_text(p, i, sets, sizeof sets);
			fprintf(f, "%s = %s\n", lib->ex[en->ex].name, sets);
		}
	}
	return 0;
}

int pwrite_file(const char *path, const struct sd_program *p, const struct sd_library *lib,
		const char *comment, int overwrite, struct sd_err *e)
{
	struct sf_file sf;

	/* A temporary file put in place only once complete (io/safefile.h). */
	if (sf_open(&sf, path, overwrite, e))
		return -1;
	return sf_finish(&sf, pwrite_ini(sf.fp, p, lib, comment, e), e);
}
