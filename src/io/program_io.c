#include "program_io.h"
#include "../core/text.h"

#include <errno.h>
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <strings.h>

#include "csv.h"
#include "ini.h"

#define MAX_GROUPS 16          /* set groups on one line */
#define LOW_LINES 3            /* lines named in the note on bare @N below 5 */

int program_slurp(const char *path, char **text, size_t *len, struct sd_err *e)
{
	return ini_slurp("program", path, text, len, e);
}

/* One program being read. Every problem is recorded and reading goes on, so one run reports
 * them all; the first fills e->msg, the others e->more. */
struct reader {
	const char *label;
	const struct sd_library *lib;
	struct sd_program *p;
	struct sd_err *e;
	int is_csv;
	int nerr;
	int fatal;                 /* out of memory: stop */
	int program_line;          /* the [program] header, 0 before one */
	int in_program;
	int key_line[3];           /* name, weeks, effort: where given */
	int skip_day;              /* the current day was refused: check its lines, keep nothing */
	int low[LOW_LINES], nlow;  /* lines with a bare @N below 5 */
	double low_value;
};

static void problem(struct reader *r, int line, const char *fmt, ...)
	__attribute__((format(printf, 3, 4)));

static void problem(struct reader *r, int line, const char *fmt, ...)
{
	char msg[400];
	va_list ap;

	va_start(ap, fmt);
	vsnprintf(msg, sizeof msg, fmt, ap);
	va_end(ap);
	if (r->nerr++ == 0) {
		if (line > 0)
			sd_fail(r->e, "cannot read program '%s' line %d: %s", r->label, line, msg);
		else
			sd_fail(r->e, "cannot read program '%s': %s", r->label, msg);
	} else if (line > 0) {
		sd_more(r->e, "cannot read program '%s' line %d: %s", r->label, line, msg);
	} else {
		sd_more(r->e, "cannot read program '%s': %s", r->label, msg);
	}
}

static int oom(struct reader *r)
{
	r->fatal = 1;
	return sd_fail(r->e, "out of memory");
}

/* The library index of name, or -1 after recording why there is none. */
static int resolve(struct reader *r, int line, const char *name)
{
	struct sd_err le;
	int variant, ex = lib_resolve(r->lib, name, &variant, &le);

	if (ex < 0) {
		problem(r, line, "%s", le.msg);
		return -1;
	}
	if (variant && prog_note(r->p, line, r->p->ndays - 1, r->e, "line %d: '%s' counted as '%s'",
				 line, name, r->lib->ex[ex].name))
		return oom(r);
	return ex;
}

static int find_day(const struct sd_program *p, const char *name)
{
	for (int i = 0; i < p->ndays; i++)
		if (!strcasecmp(p->days[i].name, name))
			return i;
	return -1;
}

/* Adds the groups of one exercise line to the current day. The same exercise on an earlier
 * line of the day adds up, with a note: a coach may list it again for a back-off block. */
static void add_groups(struct reader *r, int line, const char *name, struct sd_entry *g, int ng)
{
	struct sd_program *p = r->p;
	int ex = resolve(r, line, name), day = p->ndays - 1;

	if (ex < 0 || r->skip_day || day < 0)
		return;
	for (int i = p->nentries - 1; i >= 0 && p->entries[i].day == day; i--)
		if (p->entries[i].ex == ex && p->entries[i].line != line) {
			if (prog_note(p, line, day, r->e, "line %d: '%s' again in '%s' (first on line %d): "
				      "the sets add up", line, name, p->days[day].name, p->entries[i].line))
				oom(r);
			break;
		}
	for (int i = 0; i < ng && !r->fatal; i++) {
		g[i].ex = ex;
		g[i].day = day;
		g[i].line = line;
		if (prog_add_entry(p, &g[i], r->e))
			oom(r);
	}
}

/* Parses a prescription and remembers a bare @N below 5 for the note at the end. */
static int parse_value(struct reader *r, int line, const char *value, struct sd_entry *g)
{
	struct sd_setinfo info;
	struct sd_err pe;
	int n = prog_parse_sets(value, r->p->bare_rir, g, MAX_GROUPS, &info, &pe);

	if (n < 0) {
		problem(r, line, "%s", pe.msg);
		return -1;
	}
	if (info.bare_low >= 0) {
		if (r->nlow < LOW_LINES)
			r->low[r->nlow] = line;
		if (r->nlow++ == 0)
			r->low_value = info.bare_low;
	}
	return n;
}

static int day_header(struct reader *r, int line, const char *name)
{
	struct sd_program *p = r->p;
	int d = find_day(p, name);

	r->skip_day = 1;
	if (d >= 0) {
		problem(r, line, "day '%s' appears twice (first on line %d)", name, p->days[d].line);
		return 0;
	}
	if (strlen(name) > SD_DAY_NAME_MAX) {
		problem(r, line, "day name longer than %d bytes", SD_DAY_NAME_MAX);
		return 0;
	}
	if (prog_add_day(p, name, line, r->e))
		return oom(r);
	r->skip_day = 0;
	return 0;
}

/* name, weeks and effort of [program] (INI) or "# key: value" lines (CSV). */
static void program_key(struct reader *r, int line, const char *key, const char *val)
{
	static const char *const keys[3] = { "name", "weeks", "effort" };
	struct sd_program *p = r->p;
	int k;

	for (k = 0; k < 3 && strcasecmp(key, keys[k]); k++)
		;
	if (k == 3) {
		problem(r, line, "unknown key '%s' in %s (expected name, weeks or effort)", key,
			r->is_csv ? "the comment lines" : "[program]");
		return;
	}
	if (r->key_line[k]) {
		problem(r, line, "'%s' given twice (first on line %d)", keys[k], r->key_line[k]);
		return;
	}
	r->key_line[k] = line;
	if (k == 0) {
		if (strlen(val) > SD_PROG_NAME_MAX) {
			problem(r, line, "program name longer than %d bytes", SD_PROG_NAME_MAX);
			return;
		}
		snprintf(p->name, sizeof p->name, "%s", val);
		p->named = !!*val;
	} else if (k == 1) {
		char *end;
		errno = 0;
		long w = strtol(val, &end, 10);
		if (end == val || *end || errno || w < 1 || w > SD_MAX_WEEKS)
			problem(r, line, "weeks must be a whole number from 1 to %d, not '%s'",
				SD_MAX_WEEKS, val);
		else
			p->weeks = (int)w;
	} else if (!strcasecmp(val, "rir") || !strcasecmp(val, "rpe")) {
		p->bare_rir = !strcasecmp(val, "rir");
	} else {
		problem(r, line, "effort must be 'rpe' (a bare @N is RPE, the default) or 'rir' (a bare "
			"@N is RIR), not '%s'", val);
	}
}

static int on_item(const struct sd_ini_item *it, void *arg, struct sd_err *e)
{
	struct reader *r = arg;
	struct sd_entry g[MAX_GROUPS];
	int n;

	(void)e;
	if (it->error) {
		problem(r, it->line, "%s", it->error);
		return 0;
	}
	if (!it->key) {
		r->in_program = !strcasecmp(it->section, "program");
		if (!r->in_program)
			return day_header(r, it->line, it->section) || r->fatal ? -1 : 0;
		if (r->program_line)
			problem(r, it->line, "second [program] section (the first is on line %d)",
				r->program_line);
		else
			r->program_line = it->line;
		return 0;
	}
	if (!it->section) {
		problem(r, it->line, "'%s' comes before any [day] section", it->key);
		return 0;
	}
	if (r->in_program) {
		program_key(r, it->line, it->key, it->value);
		return 0;
	}
	if ((n = parse_value(r, it->line, it->value, g)) > 0)
		add_groups(r, it->line, it->key, g, n);
	return r->fatal ? -1 : 0;
}

/* The note on bare @N below 5, once per program: a file written when @N meant RIR reads as
 * far-from-hard RPE, and this is how the coach finds out. */
static void low_note(struct reader *r)
{
	char lines[64];
	size_t used = 0;
	double v = r->low_value;
	const char *fix = r->is_csv ? "'# effort: rir' at the top" : "'effort = rir' under [program]";

	if (!r->nlow)
		return;
	for (int i = 0; i < r->nlow && i < LOW_LINES && used < sizeof lines; i++)
		used += (size_t)snprintf(lines + used, sizeof lines - used, "%s%d", i ? ", " : "",
					 r->low[i]);
	if (r->nlow > LOW_LINES && used < sizeof lines)
		snprintf(lines + used, sizeof lines - used, " and %d more", r->nlow - LOW_LINES);
	if (prog_note(r->p, r->low[0], -1, r->e, "line%s %s: RPE %g is far from hard; did you mean "
		      "RIR %g? (a bare @N is RPE: write 'RIR %g', or %s)", r->nlow > 1 ? "s" : "", lines,
		      v, v, v, fix))
		oom(r);
}

/* Notes in line order (the one on bare @N is made last, at its first line). */
static void sort_notes(struct sd_program *p)
{
	for (int i = 1; i < p->nnotes; i++) {
		struct sd_pnote t = p->notes[i];
		int j = i;
		for (; j > 0 && p->notes[j - 1].line > t.line; j--)
			p->notes[j] = p->notes[j - 1];
		p->notes[j] = t;
	}
}

/* ---------------------------------------------------------------- CSV */

static int column(char **f, int n, const char *name)
{
	for (int i = 0; i < n; i++)
		if (!strcasecmp(text_trim(f[i]), name))
			return i;
	return -1;
}

static int meta_key(const char *k, size_t n, const char *want)
{
	return n == strlen(want) && !strncasecmp(k, want, n);
}

/* "# name: Upper/lower" (also "#name = x") at the top of a CSV program; other comment lines
 * are plain comments. Returns the offset of the first line that is neither. */
static size_t csv_meta(struct reader *r, const char *text, size_t len, int *first_line)
{
	size_t pos = 0;
	int line = 1;

	while (pos < len) {
		const char *s = text + pos, *nl = memchr(s, '\n', len - pos);
		const char *end = nl ? nl : text + len, *k = s;
		while (k < end && (*k == ' ' || *k == '\t' || *k == '\r'))
			k++;
		if (k < end && *k != '#')
			break;
		if (k < end) {
			const char *ke = ++k, *v;
			while (ke < end && *ke != ':' && *ke != '=')
				ke++;
			v = ke + 1;
			while (k < ke && (*k == ' ' || *k == '\t'))
				k++;
			while (ke > k && (ke[-1] == ' ' || ke[-1] == '\t'))
				ke--;
			size_t kn = (size_t)(ke - k);
			if (v <= end && (meta_key(k, kn, "name") || meta_key(k, kn, "weeks") ||
					 meta_key(k, kn, "effort"))) {
				char key[8], *val = strndup(v, (size_t)(end - v));
				if (!val) {
					oom(r);
					return len;
				}
				memcpy(key, k, kn);
				key[kn] = '\0';
				program_key(r, line, key, text_trim(val));
				free(val);
			}
		}
		pos = (size_t)(end - text) + (nl != NULL);
		line++;
	}
	*first_line = line;
	return pos;
}

struct cols {
	int day, ex, sets, reps, effort;
	enum sd_effort scale;
};

static int csv_header(struct reader *r, char **f, int n, int line, struct cols *c)
{
	int rir = column(f, n, "rir"), rpe = column(f, n, "rpe");

	c->day = column(f, n, "day");
	c->ex = column(f, n, "exercise");
	c->sets = column(f, n, "sets");
	c->reps = column(f, n, "reps");
	c->effort = rir >= 0 ? rir : rpe;
	c->scale = rir >= 0 ? SD_EFFORT_RIR : SD_EFFORT_RPE;
	if (c->day < 0 || c->ex < 0 || c->sets < 0) {
		problem(r, line, "header must name the columns day, exercise, sets (and optionally reps, "
			"and rir or rpe)");
		return -1;
	}
	if (rir >= 0 && rpe >= 0) {
		problem(r, line, "header names both rir and rpe; keep one");
		return -1;
	}
	return 0;
}

static const char *field(char **f, int n, int col)
{
	return col >= 0 && col < n ? text_trim(f[col]) : "";
}

static void csv_row(struct reader *r, char **f, int n, int line, const struct cols *c)
{
	struct sd_program *p = r->p;
	struct sd_entry g[MAX_GROUPS];
	struct sd_err pe;
	const char *day = field(f, n, c->day), *ex = field(f, n, c->ex);
	const char *reps = field(f, n, c->reps), *eff = field(f, n, c->effort);
	int ng;

	if (n <= c->day || n <= c->ex || n <= c->sets) {
		problem(r, line, "too few fields (%d) for the day, exercise and sets columns", n);
		return;
	}
	if (!*day || !*ex) {
		problem(r, line, "empty day or exercise");
		return;
	}
	if ((ng = parse_value(r, line, field(f, n, c->sets), g)) < 0)
		return;
	if (*reps || *eff) {
		if (ng > 1) {
			problem(r, line, "several set groups in the sets column leave the reps and %s columns "
				"ambiguous; write the groups in full there", c->scale == SD_EFFORT_RIR ? "rir" : "rpe");
			return;
		}
		if (*reps && (g[0].reps || (g[0].flags & SD_SET_AMRAP))) {
			problem(r, line, "reps given in both the sets and reps columns");
			return;
		}
		if (*reps && prog_parse_reps(reps, &g[0], &pe)) {
			problem(r, line, "%s", pe.msg);
			return;
		}
		if (*eff && g[0].effort != SD_EFFORT_NONE) {
			problem(r, line, "effort given in both the sets and %s columns",
				c->scale == SD_EFFORT_RIR ? "rir" : "rpe");
			return;
		}
		if (*eff && prog_parse_effort(eff, c->scale, &g[0], &pe)) {
			problem(r, line, "%s", pe.msg);
			return;
		}
	}
	int d = find_day(p, day);
	if (d >= 0 && d != p->ndays - 1) {
		/* Rows of one day must be together, or the day order would be ambiguous. */
		problem(r, line, "rows of day '%s' are not together (it began on line %d)", day,
			p->days[d].line);
		return;
	}
	if (d < 0 && (day_header(r, line, day) || r->fatal))
		return;
	if (d < 0 && r->skip_day)
		return;
	r->skip_day = 0;
	add_groups(r, line, ex, g, ng);
}

/* A row of blanks only: spreadsheets export empty rows as ",,," or ";;;". */
static int blank_row(char **f, int n)
{
	for (int i = 0; i < n; i++)
		if (*text_trim(f[i]))
			return 0;
	return 1;
}

/* The CSV reader's own errors read "'LABEL' line N: problem". */
static void reader_error(struct reader *r, const struct sd_err *ce, int line)
{
	const char *s = strstr(ce->msg, "' line ");
	int at;
	if (s && sscanf(s, "' line %d: ", &at) == 1 && (s = strstr(s, ": ")))
		problem(r, at, "%s", s + 2);
	else
		problem(r, line, "%s", ce->msg);
}

static int parse_csv(struct reader *r, const char *text, size_t len)
{
	struct sd_csv *c = NULL;
	struct sd_err ce;
	struct cols cols;
	char **f;
	int n, rc, first_line;
	size_t start = csv_meta(r, text, len, &first_line);

	if (start >= len)
		return 0;   /* no header: reported as an empty program */
	if (!(c = csv_open_mem(r->label, text + start, len - start, &ce)))
		return oom(r);
	csv_set_first_line(c, first_line);
	csv_set_delim(c, csv_detect(text + start, len - start));
	csv_set_comments(c, 1);
	rc = csv_next(c, &f, &n, &ce);
	if (rc > 0 && csv_header(r, f, n, csv_line(c), &cols) == 0)
		while (!r->fatal && (rc = csv_next(c, &f, &n, &ce)) > 0)
			if (!blank_row(f, n))
				csv_row(r, f, n, csv_line(c), &cols);
	if (rc < 0)
		reader_error(r, &ce, csv_line(c));
	csv_close(c);
	return r->fatal ? -1 : 0;
}

/* ---------------------------------------------------------------- both */

static int has_suffix(const char *s, const char *suffix)
{
	size_t a = strlen(s), b = strlen(suffix);
	return a >= b && !strcasecmp(s + a - b, suffix);
}

int program_parse(const char *label, const char *text, size_t len, int is_csv,
		  const struct sd_library *lib, struct sd_program *p, struct sd_err *e)
{
	struct reader r;
	int nul;

	memset(p, 0, sizeof *p);
	memset(&r, 0, sizeof r);
	r.label = label;
	r.lib = lib;
	r.p = p;
	r.e = e;
	r.is_csv = is_csv;
	/* Spreadsheets export CSV with a UTF-8 byte-order mark; it is not part of the header. */
	if (len >= 3 && !memcmp(text, "\xEF\xBB\xBF", 3)) {
		text += 3;
		len -= 3;
	}
	if ((nul = ini_nul_line(text, len)))
		return sd_fail(e, "cannot read program '%s' line %d: binary data (NUL byte)", label, nul);
	if (is_csv) {
		parse_csv(&r, text, len);
	} else {
		char *copy = malloc(len + 1);
		if (!copy)
			return sd_fail(e, "out of memory");
		memcpy(copy, text, len);
		copy[len] = '\0';
		ini_scan_all(copy, on_item, &r, e);
		free(copy);
	}
	if (!r.fatal && !r.nerr && p->nentries == 0)
		problem(&r, 0, "no exercises (empty program)");
	if (!r.fatal && !r.nerr) {
		low_note(&r);
		sort_notes(p);
	}
	if (!r.fatal && r.nerr > 1) {
		size_t used = strlen(e->msg);
		snprintf(e->msg + used, sizeof e->msg - used, " (first of %d errors)", r.nerr);
	}
	if (r.fatal || r.nerr) {
		prog_free(p);
		return -1;
	}
	if (!p->name[0]) {
		const char *base = strrchr(label, '/');
		base = base ? base + 1 : label;
		/* A display name only (p->named stays 0): a long file name is shortened visibly. */
		if (strlen(base) > SD_PROG_NAME_MAX)
			snprintf(p->name, sizeof p->name, "%.*s...", SD_PROG_NAME_MAX - 3, base);
		else
			snprintf(p->name, sizeof p->name, "%s", base);
	}
	return 0;
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
