#include "program_io.h"

#include <errno.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <strings.h>

#include "csv.h"
#include "ini.h"

#define SD_MAX_WEEKS 104

int program_slurp(const char *path, char **text, size_t *len, struct sd_err *e)
{
	return ini_slurp("program", path, text, len, e);
}

static char *trim(char *s)
{
	while (*s == ' ' || *s == '\t')
		s++;
	char *end = s + strlen(s);
	while (end > s && (end[-1] == ' ' || end[-1] == '\t' || end[-1] == '\r'))
		*--end = '\0';
	return s;
}

/* "unknown exercise 'x' (did you mean 'a' or 'b'?)" */
static int unknown_exercise(const struct sd_library *lib, const char *label, int line,
			    const char *name, struct sd_err *e)
{
	int idx[3], n = lib_suggest(lib, name, idx, 3);
	char hint[256] = "";

	if (n > 0) {
		size_t used = (size_t)snprintf(hint, sizeof hint, " (did you mean ");
		for (int i = 0; i < n && used < sizeof hint; i++)
			used += (size_t)snprintf(hint + used, sizeof hint - used, "%s'%s'",
						 i == 0 ? "" : (i == n - 1 ? " or " : ", "),
						 lib->ex[idx[i]].name);
		if (used < sizeof hint)
			snprintf(hint + used, sizeof hint - used, "?)");
	}
	return sd_fail(e, "cannot read program '%s' line %d: unknown exercise '%s'%s", label, line,
		       name, hint);
}

/* Adds one exercise line to the current day, refusing a second entry of the same exercise
 * in the day: INI readers commonly keep only the last, and a coach would lose sets. */
static int add_entry(struct sd_program *p, const struct sd_library *lib, const char *label,
		     int line, const char *name, int sets, int reps, int rir, struct sd_err *e)
{
	struct sd_entry en = { .sets = sets, .reps = reps, .rir = rir, .line = line,
			       .day = p->ndays - 1 };

	en.ex = lib_find(lib, name);
	if (en.ex < 0)
		return unknown_exercise(lib, label, line, name, e);
	for (int i = p->nentries - 1; i >= 0 && p->entries[i].day == en.day; i--)
		if (p->entries[i].ex == en.ex)
			return sd_fail(e, "cannot read program '%s' line %d: '%s' appears twice in '%s' "
				       "(first on line %d); combine the sets on one line",
				       label, line, name, p->days[en.day].name, p->entries[i].line);
	return prog_add_entry(p, &en, e);
}

static int find_day(const struct sd_program *p, const char *name)
{
	for (int i = 0; i < p->ndays; i++)
		if (!strcasecmp(p->days[i].name, name))
			return i;
	return -1;
}

static int program_key(struct sd_program *p, const char *label, int line, const char *key,
		       const char *val, struct sd_err *e)
{
	if (!strcasecmp(key, "name")) {
		snprintf(p->name, sizeof p->name, "%s", val);
		return 0;
	}
	if (!strcasecmp(key, "weeks")) {
		char *end;
		errno = 0;
		long w = strtol(val, &end, 10);
		if (end == val || *end || errno || w < 1 || w > SD_MAX_WEEKS)
			return sd_fail(e, "cannot read program '%s' line %d: weeks must be a whole number "
				       "from 1 to %d, not '%s'", label, line, SD_MAX_WEEKS, val);
		p->weeks = (int)w;
		return 0;
	}
	return sd_fail(e, "cannot read program '%s' line %d: unknown key '%s' in [program] "
		       "(expected name or weeks)", label, line, key);
}

struct ini_state {
	const char *label;
	const struct sd_library *lib;
	struct sd_program *p;
	int in_program;
};

static int on_item(const struct sd_ini_item *it, void *arg, struct sd_err *e)
{
	struct ini_state *st = arg;
	struct sd_program *p = st->p;
	int sets, reps, rir;

	if (!it->key) {
		st->in_program = !strcasecmp(it->section, "program");
		if (st->in_program)
			return 0;
		if (find_day(p, it->section) >= 0)
			return sd_fail(e, "cannot read program '%s' line %d: day '%s' appears twice",
				       st->label, it->line, it->section);
		if (strlen(it->section) >= sizeof p->days[0].name)
			return sd_fail(e, "cannot read program '%s' line %d: day name too long", st->label,
				       it->line);
		return prog_add_day(p, it->section, it->line, e);
	}
	if (!it->section)
		return sd_fail(e, "cannot read program '%s' line %d: '%s' comes before any [day] section",
			       st->label, it->line, it->key);
	if (st->in_program)
		return program_key(p, st->label, it->line, it->key, it->value, e);
	if (prog_parse_sets(it->value, &sets, &reps, &rir, e))
		return sd_wrap(e, "cannot read program '%s' line %d", st->label, it->line);
	return add_entry(p, st->lib, st->label, it->line, it->key, sets, reps, rir, e);
}

static int column(char **f, int n, const char *name)
{
	for (int i = 0; i < n; i++)
		if (!strcasecmp(trim(f[i]), name))
			return i;
	return -1;
}

static int csv_number(const char *label, int line, const char *what, const char *s, int lo,
		      int hi, int *out, struct sd_err *e)
{
	if (csv_int(s, out) || *out < lo || *out > hi)
		return sd_fail(e, "cannot read program '%s' line %d: %s must be a whole number from %d "
			       "to %d, not '%s'", label, line, what, lo, hi, s);
	return 0;
}

static int parse_csv(const char *label, const char *text, size_t len,
		     const struct sd_library *lib, struct sd_program *p, struct sd_err *e)
{
	struct sd_csv *c = csv_open_mem(label, text, len, e);
	char **f;
	int n, r, cday, cex, csets, creps, crir, rc = -1;

	if (!c)
		return -1;
	r = csv_next(c, &f, &n, e);
	if (r <= 0) {
		if (r == 0)
			rc = 0;  /* empty: reported as an empty program by the caller */
		goto out;
	}
	cday = column(f, n, "day");
	cex = column(f, n, "exercise");
	csets = column(f, n, "sets");
	creps = column(f, n, "reps");
	crir = column(f, n, "rir");
	if (cday < 0 || cex < 0 || csets < 0) {
		sd_fail(e, "cannot read program '%s' line 1: header must name the columns day, exercise, "
			"sets (and optionally reps, rir)", label);
		goto out;
	}
	while ((r = csv_next(c, &f, &n, e)) > 0) {
		int line = csv_line(c), sets, reps = 0, rir = -1;
		if (n <= cday || n <= cex || n <= csets) {
			sd_fail(e, "cannot read program '%s' line %d: too few fields (%d) for the day, "
				"exercise and sets columns", label, line, n);
			goto out;
		}
		char *day = trim(f[cday]), *ex = trim(f[cex]);
		if (!*day || !*ex) {
			sd_fail(e, "cannot read program '%s' line %d: empty day or exercise", label, line);
			goto out;
		}
		if (csv_number(label, line, "sets", f[csets], 1, SD_MAX_SETS, &sets, e) ||
		    (creps >= 0 && creps < n && *trim(f[creps]) &&
		     csv_number(label, line, "reps", f[creps], 1, SD_MAX_REPS, &reps, e)) ||
		    (crir >= 0 && crir < n && *trim(f[crir]) &&
		     csv_number(label, line, "rir", f[crir], 0, SD_MAX_RIR, &rir, e)))
			goto out;
		int d = find_day(p, day);
		if (d >= 0 && d != p->ndays - 1) {
			/* Rows of one day must be together, or the day order would be ambiguous. */
			sd_fail(e, "cannot read program '%s' line %d: rows of day '%s' are not together",
				label, line, day);
			goto out;
		}
		if (d < 0 && (strlen(day) >= sizeof p->days[0].name || prog_add_day(p, day, line, e))) {
			if (strlen(day) >= sizeof p->days[0].name)
				sd_fail(e, "cannot read program '%s' line %d: day name too long", label, line);
			goto out;
		}
		if (add_entry(p, lib, label, line, ex, sets, reps, rir, e))
			goto out;
	}
	if (r == 0)
		rc = 0;
out:
	csv_close(c);
	return rc;
}

static int has_suffix(const char *s, const char *suffix)
{
	size_t a = strlen(s), b = strlen(suffix);
	return a >= b && !strcasecmp(s + a - b, suffix);
}

int program_parse(const char *label, const char *text, size_t len, int is_csv,
		  const struct sd_library *lib, struct sd_program *p, struct sd_err *e)
{
	char *copy;
	int rc;

	memset(p, 0, sizeof *p);
	/* Spreadsheets export CSV with a UTF-8 byte-order mark; it is not part of the header. */
	if (len >= 3 && !memcmp(text, "\xEF\xBB\xBF", 3)) {
		text += 3;
		len -= 3;
	}
	if (memchr(text, '\0', len))
		return sd_fail(e, "cannot read program '%s': binary data (NUL byte)", label);
	if (is_csv) {
		rc = parse_csv(label, text, len, lib, p, e);
	} else {
		if (!(copy = malloc(len + 1)))
			return sd_fail(e, "out of memory");
		memcpy(copy, text, len);
		copy[len] = '\0';
		struct ini_state st = { label, lib, p, 0 };
		rc = ini_scan("program", label, copy, on_item, &st, e) ? -1 : 0;
		free(copy);
	}
	if (!rc && p->nentries == 0)
		rc = sd_fail(e, "cannot read program '%s': no exercises (empty program)", label);
	if (!rc && !p->name[0]) {
		const char *base = strrchr(label, '/');
		snprintf(p->name, sizeof p->name, "%s", base ? base + 1 : label);
	}
	if (rc)
		prog_free(p);
	return rc;
}

int program_load(const char *path, const struct sd_library *lib, struct sd_program *p,
		 struct sd_err *e)
{
	char *text;
	size_t len;
	int rc;

	if (program_slurp(path, &text, &len, e))
		return -1;
	rc = program_parse(path, text, len, has_suffix(path, ".csv"), lib, p, e);
	free(text);
	return rc;
}
