#include "log_io.h"

#include <errno.h>
#include <stdarg.h>
#include <stdlib.h>
#include <string.h>
#include <strings.h>

#include "../core/bounds.h"
#include "../core/date.h"
#include "../core/program.h"
#include "../core/units.h"
#include "csv.h"
#include "ini.h"
#include "table.h"

#define NAME_CACHE 64          /* distinct exercise and athlete names remembered while reading */

enum { C_DATE, C_EXERCISE, C_SETS, C_REPS, C_LOAD, C_EFFORT, C_RIR, C_RPE, C_ATHLETE, C_NOTES,
       C_N };
static const char *const colname[C_N] = { "date", "exercise", "sets", "reps", "load", "effort",
	"rir", "rpe", "athlete", "notes" };

/* A name already resolved: an exercise index, or an athlete's id and units, or why not. */
struct known {
	char name[SD_NAME_MAX];
	int ex;
	long long id;
	int lb;
	char err[200];             /* non-empty: the name is refused for this reason */
};

struct reader {
	const char *path;
	const struct logio_src *src;
	struct logio_rows *out;
	struct sd_err *e;
	int col[C_N];
	int nerr, fatal;
	struct known ex[NAME_CACHE], ath[NAME_CACHE];
	int nex, nath;
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
	if (r->nerr++ == 0)
		sd_fail(r->e, "cannot read log '%s' line %d: %s", r->path, line, msg);
	else
		sd_more(r->e, "cannot read log '%s' line %d: %s", r->path, line, msg);
}

static char *trim(char *s)
{
	while (*s == ' ' || *s == '\t')
		s++;
	char *end = s + strlen(s);
	while (end > s && (end[-1] == ' ' || end[-1] == '\t'))
		*--end = '\0';
	return s;
}

/* Remembers a resolved name; once the cache is full the oldest half is dropped. */
static struct known *remember(struct known *k, int *n, const char *name)
{
	if (*n == NAME_CACHE) {
		memmove(k, k + NAME_CACHE / 2, (NAME_CACHE / 2) * sizeof *k);
		*n = NAME_CACHE / 2;
	}
	memset(&k[*n], 0, sizeof k[*n]);
	snprintf(k[*n].name, sizeof k[*n].name, "%s", name);
	return &k[(*n)++];
}

static const struct known *find(const struct known *k, int n, const char *name)
{
	for (int i = n - 1; i >= 0; i--)
		if (!strcmp(k[i].name, name))
			return &k[i];
	return NULL;
}

static const struct known *exercise(struct reader *r, const char *name)
{
	const struct known *k = strlen(name) < SD_NAME_MAX ? find(r->ex, r->nex, name) : NULL;
	struct known *nk;
	struct sd_err le;
	int variant;

	if (k)
		return k;
	nk = remember(r->ex, &r->nex, strlen(name) < SD_NAME_MAX ? name : "");
	if ((nk->ex = lib_resolve(r->src->lib, name, &variant, &le)) < 0)
		snprintf(nk->err, sizeof nk->err, "%s", le.msg);
	return nk;
}

static const struct known *athlete(struct reader *r, const char *name)
{
	const struct known *k = find(r->ath, r->nath, name);
	struct known *nk;
	struct sd_err ae;

	if (k)
		return k;
	nk = remember(r->ath, &r->nath, name);
	if (strlen(name) >= SD_NAME_MAX)
		snprintf(nk->err, sizeof nk->err, "athlete name longer than %d bytes", SD_NAME_MAX - 1);
	else if (r->src->athlete(r->src->arg, name, &nk->id, &nk->lb, &ae))
		snprintf(nk->err, sizeof nk->err, "%s", ae.msg);
	return nk;
}

static int header(struct reader *r, char **f, int n, int line)
{
	int bad = 0, efforts = 0;

	for (int c = 0; c < C_N; c++)
		r->col[c] = -1;
	for (int i = 0; i < n; i++) {
		const char *h = trim(f[i]);
		int c;
		for (c = 0; c < C_N && strcasecmp(h, colname[c]); c++)
			;
		if (c == C_N) {
			problem(r, line, "unknown column '%s' (expected date, exercise, sets, reps, load, "
				"effort, rir, rpe, athlete, notes)", h);
			bad = 1;
		} else if (r->col[c] >= 0) {
			problem(r, line, "column '%s' given twice", colname[c]);
			bad = 1;
		} else {
			r->col[c] = i;
		}
	}
	for (int c = C_EFFORT; c <= C_RPE; c++)
		efforts += r->col[c] >= 0;
	if (efforts > 1) {
		problem(r, line, "header names more than one of effort, rir and rpe; keep one");
		bad = 1;
	}
	if (!bad && (r->col[C_DATE] < 0 || r->col[C_EXERCISE] < 0 || r->col[C_REPS] < 0)) {
		problem(r, line, "header must name the columns date, exercise and reps (and optionally "
			"sets, load, effort, athlete)");
		bad = 1;
	}
	if (!bad && r->col[C_ATHLETE] < 0 && !r->src->have_default) {
		problem(r, line, "no athlete column: give the athlete with --athlete NAME");
		bad = 1;
	}
	return bad ? -1 : 0;
}

static int blank_row(char **f, int n)
{
	for (int i = 0; i < n; i++)
		if (*trim(f[i]))
			return 0;
	return 1;
}

static char *field(char **f, int n, int col)
{
	static char empty[1];
	return col >= 0 && col < n ? trim(f[col]) : empty;
}

/* "100kg", "225 lb", "102,5" (a decimal comma, from a ';'-separated file), "100" (the
 * athlete's units), "" or "bw" (no load). */
static int parse_load(char *s, struct tlog_entry *en, char *why, size_t n)
{
	char *end;
	double v;

	en->load = 0;
	en->unit = TLOG_UNIT_NONE;
	if (!*s || !strcasecmp(s, "bw") || !strcasecmp(s, "bodyweight"))
		return 0;
	for (char *p = s; *p; p++)
		if (*p == ',')
			*p = '.';
	errno = 0;
	v = strtod(s, &end);
	if (end == s || errno || !(v > 0) || v > 1e6) {
		snprintf(why, n, "bad load '%s' (expected a positive number with kg or lb, e.g. 100kg)", s);
		return -1;
	}
	while (*end == ' ')
		end++;
	if (!strcasecmp(end, "kg"))
		en->unit = TLOG_UNIT_KG;
	else if (!strcasecmp(end, "lb") || !strcasecmp(end, "lbs"))
		en->unit = TLOG_UNIT_LB;
	else if (!*end)
		en->unit = TLOG_UNIT_DEFAULT;
	else {
		snprintf(why, n, "bad load '%s' (expected a positive number with kg or lb, e.g. 100kg)", s);
		return -1;
	}
	en->load = v;
	return 0;
}

/* The load in kilograms once the unit is known, inside its documented range. */
static int check_load(const struct tlog_entry *en, char *why, size_t n)
{
	double kg = en->unit == TLOG_UNIT_LB ? units_lb_to_kg(en->load) : en->load;
	struct sd_err be;

	if (en->unit == TLOG_UNIT_NONE || !bound_check(&bound_log_load, "load", kg, &be))
		return 0;
	snprintf(why, n, "%s", be.msg);
	return -1;
}

static int parse_reps(const char *s, struct tlog_entry *en, char *why, size_t n)
{
	struct sd_entry g;
	struct sd_err pe;

	memset(&g, 0, sizeof g);
	g.rir = -1;
	if (!*s) {
		snprintf(why, n, "empty reps");
		return -1;
	}
	if (prog_parse_reps(s, &g, &pe)) {
		snprintf(why, n, "%s", pe.msg);
		return -1;
	}
	if (g.flags & SD_SET_AMRAP) {
		snprintf(why, n, "reps '%s': a log records the reps done (write the number)", s);
		return -1;
	}
	if (g.reps_hi != g.reps) {
		snprintf(why, n, "reps '%s': a log records the reps done, not a range", s);
		return -1;
	}
	en->reps = g.reps;
	en->timed = !!(g.flags & SD_SET_TIMED);
	return 0;
}

static int parse_effort(struct reader *r, char **f, int n, struct tlog_entry *en, char *why,
			size_t wn)
{
	struct sd_entry g;
	struct sd_err pe;
	int col = r->col[C_EFFORT] >= 0 ? C_EFFORT : r->col[C_RIR] >= 0 ? C_RIR : C_RPE;
	const char *s = field(f, n, r->col[col]);
	int rc;

	en->rir = -1;
	en->scale = SD_EFFORT_NONE;
	if (!*s)
		return 0;
	memset(&g, 0, sizeof g);
	g.rir = -1;
	if (col == C_EFFORT)
		rc = prog_parse_effort_text(s, &g, &pe);
	else
		rc = prog_parse_effort(s, col == C_RIR ? SD_EFFORT_RIR : SD_EFFORT_RPE, &g, &pe);
	if (rc) {
		snprintf(why, wn, "%s", pe.msg);
		return -1;
	}
	en->rir = g.rir;
	en->scale = g.effort;
	en->eff_lo = g.eff_lo;
	en->eff_hi = g.eff_hi;
	return 0;
}

static int add(struct reader *r, const struct tlog_entry *en)
{
	struct logio_rows *o = r->out;

	if (o->n == o->cap) {
		int ncap = o->cap ? 2 * o->cap : 256;
		struct tlog_entry *nv = realloc(o->v, (size_t)ncap * sizeof *nv);
		if (!nv) {
			r->fatal = 1;
			return sd_fail(r->e, "out of memory");
		}
		o->v = nv;
		o->cap = ncap;
	}
	o->v[o->n++] = *en;
	return 0;
}

/* One data row; every problem of it is reported. */
static void row(struct reader *r, char **f, int n, int line)
{
	struct tlog_entry en;
	char why[400], *s, *load;
	const struct known *k;
	struct sd_err be;
	double x;
	int bad = 0, lb;
	long long id;
	long today = r->src->today;

	memset(&en, 0, sizeof en);
	en.line = line;
	s = field(f, n, r->col[C_DATE]);
	if (date_parse(s, &en.day, NULL)) {
		problem(r, line, "bad date '%s' (expected YYYY-MM-DD, a real day)", s);
		bad = 1;
	} else if (en.day > today) {
		char t[DATE_LEN];
		date_format(today, t);
		problem(r, line, "date %s is after today (%s)", s, t);
		bad = 1;
	}
	s = field(f, n, r->col[C_EXERCISE]);
	if (!*s) {
		problem(r, line, "empty exercise");
		bad = 1;
	} else if ((k = exercise(r, s))->err[0]) {
		problem(r, line, "%s", k->err);
		bad = 1;
	} else {
		en.ex = k->ex;
	}
	s = field(f, n, r->col[C_SETS]);
	en.sets = 1;
	if (*s && csv_double(s, &x)) {
		problem(r, line, "bad set count '%s' (a whole number from 1 to %d)", s, SD_MAX_SETS);
		bad = 1;
	} else if (*s && bound_check(&bound_log_sets, "sets", x, &be)) {
		problem(r, line, "%s", be.msg);
		bad = 1;
	} else if (*s) {
		en.sets = (int)x;
	}
	if (parse_reps(field(f, n, r->col[C_REPS]), &en, why, sizeof why)) {
		problem(r, line, "%s", why);
		bad = 1;
	}
	if (parse_effort(r, f, n, &en, why, sizeof why)) {
		problem(r, line, "%s", why);
		bad = 1;
	}
	s = field(f, n, r->col[C_ATHLETE]);
	if (*s) {
		if ((k = athlete(r, s))->err[0]) {
			problem(r, line, "%s", k->err);
			return;
		}
		id = k->id;
		lb = k->lb;
	} else if (r->src->have_default) {
		id = r->src->default_id;
		lb = r->src->default_lb;
	} else {
		problem(r, line, "no athlete: the row names none and no --athlete was given");
		return;
	}
	en.athlete_id = id;
	load = field(f, n, r->col[C_LOAD]);
	if (parse_load(load, &en, why, sizeof why)) {
		problem(r, line, "%s", why);
		return;
	}
	if (en.unit == TLOG_UNIT_DEFAULT)
		en.unit = lb ? TLOG_UNIT_LB : TLOG_UNIT_KG;
	if (check_load(&en, why, sizeof why)) {
		problem(r, line, "%s", why);
		return;
	}
	if (!bad && !r->nerr)
		add(r, &en);
}

int logio_read(const char *path, const struct logio_src *src, struct logio_rows *out,
	       struct sd_err *e)
{
	struct reader *r;
	struct sd_csv *c = NULL;
	struct sd_err ce;
	char *text = NULL, **f;
	size_t len, skip = 0;
	int n, rc, nul, ret = -1;

	memset(out, 0, sizeof *out);
	if (!(r = calloc(1, sizeof *r)))
		return sd_fail(e, "out of memory");
	r->path = path;
	r->src = src;
	r->out = out;
	r->e = e;
	if (ini_slurp("log", path, &text, &len, e))
		goto done;
	if (len >= 3 && !memcmp(text, "\xEF\xBB\xBF", 3))
		skip = 3;
	if ((nul = ini_nul_line(text + skip, len - skip))) {
		sd_fail(e, "cannot read log '%s' line %d: binary data (NUL byte)", path, nul);
		goto done;
	}
	if (!(c = csv_open_mem(path, text + skip, len - skip, e)))
		goto done;
	csv_set_comments(c, 1);
	csv_set_delim(c, csv_detect(text + skip, len - skip));
	rc = csv_next(c, &f, &n, &ce);
	if (rc == 0 || (rc > 0 && blank_row(f, n))) {
		sd_fail(e, "cannot read log '%s': no header row (empty file)", path);
		goto done;
	}
	if (rc > 0 && header(r, f, n, csv_line(c)) == 0)
		while (!r->fatal && (rc = csv_next(c, &f, &n, &ce)) > 0)
			if (!blank_row(f, n))
				row(r, f, n, csv_line(c));
	if (rc < 0) {
		/* The reader's own message already names the file and line. */
		if (r->nerr++ == 0)
			sd_fail(e, "cannot read log %s", ce.msg);
		else
			sd_more(e, "cannot read log %s", ce.msg);
	}
	if (r->fatal)
		goto done;
	if (r->nerr > 1) {
		size_t used = strlen(e->msg);
		snprintf(e->msg + used, sizeof e->msg - used, " (first of %d errors)", r->nerr);
	}
	if (!r->nerr && !out->n) {
		sd_fail(e, "cannot read log '%s': no rows after the header", path);
		goto done;
	}
	ret = r->nerr ? -1 : 0;
done:
	if (ret)
		logio_free(out);
	csv_close(c);
	free(text);
	free(r);
	return ret;
}

void logio_free(struct logio_rows *r)
{
	free(r->v);
	memset(r, 0, sizeof *r);
}

void logio_head(FILE *f)
{
	fputs("date,athlete,exercise,sets,reps,load,effort\n", f);
}

void logio_row(FILE *f, const char *date, const char *athlete, const char *exercise, int sets,
	       int reps, int timed, double load, const char *unit, const char *effort)
{
	fprintf(f, "%s,", date);
	tbl_csv_field(f, athlete);
	fputc(',', f);
	tbl_csv_field(f, exercise);
	fprintf(f, ",%d,%d%s,", sets, reps, timed ? "s" : "");
	/* %.10g gives back the number as entered (loads are written with a few decimals). */
	if (load > 0)
		fprintf(f, "%.10g%s", load, unit);
	fputc(',', f);
	tbl_csv_field(f, effort);
	fputc('\n', f);
}
