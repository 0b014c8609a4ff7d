#include "records.h"

#include <math.h>
#include <stddef.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <strings.h>

#include "../core/date.h"
#include "../core/e1rm.h"
#include "../core/suggest.h"
#include "../core/units.h"
#include "../io/program_io.h"
#include "parse.h"

/* Appends " (did you mean 'A', 'B'?)" for the names closest to `name` to e's message. The
 * store's "unknown ..." message is the only failure this adds to: any other error (a damaged
 * file, say) is left as it is. */
static void did_you_mean(const char *name, const char *base, size_t stride, int n,
			 const char *kind, struct sd_err *e)
{
	char msg[sizeof e->msg], hint[3 * 140 + 32] = "";
	int near[SD_SUGGEST_MAX], k = sd_suggest(name, base, stride, n, near, SD_SUGGEST_MAX);

	for (int i = 0; i < k; i++)
		snprintf(hint + strlen(hint), sizeof hint - strlen(hint), "%s'%s'",
			 i ? ", " : "; did you mean ", base + (size_t)near[i] * stride);
	snprintf(msg, sizeof msg, "unknown %s '%s'%s%s (see 'setdose %s list')", kind, name, hint,
		 k ? "?" : "", kind);
	sd_fail(e, "%s", msg);
}

int app_athlete_get(struct sd_db *db, const char *name, struct db_athlete *out, struct sd_err *e)
{
	struct db_athlete *v = NULL;
	int n = 0;

	if (!db_athlete_get(db, name, out, e))
		return 0;
	if (strncmp(e->msg, "unknown athlete", 15) || db_athlete_list(db, &v, &n, NULL))
		return -1;
	did_you_mean(name, v ? v[0].name : "", sizeof *v, n, "athlete", e);
	free(v);
	return -1;
}

int app_program_get(struct sd_db *db, const char *name, struct db_program *out, struct sd_err *e)
{
	struct db_program *v = NULL;
	int n = 0;

	if (!db_program_get(db, name, out, e))
		return 0;
	if (strncmp(e->msg, "unknown program", 15) || db_program_list(db, &v, &n, NULL))
		return -1;
	did_you_mean(name, v ? v[0].name : "", sizeof *v, n, "program", e);
	db_program_list_free(v, n);
	return -1;
}

int app_lift(const struct sd_library *lib, const char *lift, char *buf, size_t n, struct sd_err *e)
{
	int k = lib_find(lib, lift), near[3], nn;
	char hint[200] = "";

	if (!lift[0])
		return sd_fail(e, "the lift is empty");
	if (k >= 0) {
		snprintf(buf, n, "%s", lib->ex[k].name);
		return 0;
	}
	nn = lib_suggest(lib, lift, near, 3);
	for (int i = 0; i < nn; i++)
		snprintf(hint + strlen(hint), sizeof hint - strlen(hint), "%s'%s'",
			 i ? ", " : " (did you mean ", lib->ex[near[i]].name);
	return sd_fail(e, "unknown lift '%s'%s%s", lift, hint, nn ? ")" : "");
}

/* The last day a block covers: its end date once ended; while open it runs on (LONG_MAX), so
 * a block added after one that was never ended is caught. */
static long last_day(const struct db_block *b, long start)
{
	long end;
	if (!b->end[0])
		return 0x7fffffffL;
	return date_parse(b->end, &end, NULL) ? start + 7L * b->weeks - 1 : end;
}

static int check_overlap(struct sd_db *db, const struct db_athlete *a, long from, long to,
			 struct sd_err *e)
{
	struct db_block *v = NULL;
	int n = 0, rc = 0;

	if (db_block_list(db, a->id, &v, &n, e))
		return -1;
	for (int i = 0; i < n && !rc; i++) {
		long s;
		if (date_parse(v[i].start, &s, NULL) || s > to || last_day(&v[i], s) < from)
			continue;
		rc = sd_fail(e, "block %lld of '%s' (%s from %s, %s) overlaps these weeks; %s, or add "
			     "--overlap if both are meant to run", v[i].id, a->name, v[i].program,
			     v[i].start, v[i].end[0] ? "ended" : "still open",
			     v[i].end[0] ? "choose another start" : "end it first ('setdose block end ID')");
	}
	free(v);
	return rc;
}

int app_block_add(const struct sd_ctx *ctx, const struct db_athlete *a, const struct db_program *p,
		  const char *start, int weeks, int overlap, long long *id, int *weeks_out,
		  struct sd_err *e)
{
	struct sd_program prog;
	long from;
	int rc = -1;

	/* The template must still read with today's exercise library. */
	memset(&prog, 0, sizeof prog);
	if (program_parse(p->name, p->source, p->len, p->is_csv, &ctx->lib, &prog, e))
		return -1;
	if (!weeks)
		weeks = prog.weeks;
	prog_free(&prog);
	if (weeks < SD_WEEKS_MIN || weeks > SD_WEEKS_MAX)
		return sd_usage(e, "template '%s' does not give its length; give the weeks (%d to %d)",
				p->name, SD_WEEKS_MIN, SD_WEEKS_MAX);
	if (date_parse(start, &from, e))
		return sd_wrap(e, "start date");
	if (!overlap && check_overlap(ctx->db, a, from, from + 7L * weeks - 1, e))
		return -1;
	rc = db_block_add(ctx->db, a->id, p->id, start, weeks, id, e);
	*weeks_out = weeks;
	return rc;
}

/* Fails when day (YYYY-MM-DD) is after today, naming what it is. */
static int not_future(const char *what, const char *day, struct sd_err *e)
{
	char today[DATE_LEN];

	if (app_today(today, e))
		return -1;
	if (strcmp(day, today) > 0)
		return sd_usage(e, "%s %s is after today (%s)", what, day, today);
	return 0;
}

int app_block_end(struct sd_db *db, long long id, const char *end, char *end_out,
		  struct sd_err *e)
{
	char day[DATE_LEN];

	if (end && *end ? app_date("end date", end, day, e) : app_today(day, e))
		return -1;
	if (not_future("end date", day, e) || db_block_end(db, id, day, e))
		return -1;
	if (end_out)
		memcpy(end_out, day, DATE_LEN);
	return 0;
}

int app_test_build(const struct sd_ctx *ctx, const struct db_athlete *a, const char *lift,
		   const char *date, const char *load, const char *reps, int formula,
		   struct db_test *t, int *warn, int *field, struct sd_err *e)
{
	long long r = 1;
	int lb = app_lb(ctx, a);

	memset(t, 0, sizeof *t);
	*field = APP_T_LIFT;
	if (app_lift(&ctx->lib, lift, t->lift, sizeof t->lift, e))
		return -1;
	*field = APP_T_DATE;
	if (date && *date ? app_date("test date", date, t->date, e) : app_today(t->date, e))
		return -1;
	if (not_future("test date", t->date, e))
		return -1;
	*field = APP_T_LOAD;
	if (units_parse_load(load, lb, &t->load_kg, e))
		return -1;
	*field = APP_T_REPS;
	if (reps && *reps && app_int("reps", reps, 1, SD_TEST_REPS_MAX, &r, e))
		return -1;
	if (e1rm_estimate(formula, t->load_kg, (int)r, &t->e1rm_kg, warn, e))
		return -1;
	t->athlete_id = a->id;
	t->reps = (int)r;
	/* A single rep is a tested 1RM, not an estimate. */
	snprintf(t->formula, sizeof t->formula, "%s", r == 1 ? "tested" : e1rm_name(formula));
	return 0;
}

int app_test_add(struct sd_db *db, struct db_test *t, struct sd_err *e)
{
	struct db_test *v = NULL;
	int n = 0, dup = -1;

	if (db_test_list(db, t->athlete_id, t->lift, &v, &n, e))
		return -1;
	/* Loads are stored in kg from either unit: equal within half a gram is the same load. */
	for (int i = 0; i < n && dup < 0; i++)
		if (!strcmp(v[i].date, t->date) && v[i].reps == t->reps &&
		    fabs(v[i].load_kg - t->load_kg) < 0.0005)
			dup = i;
	if (dup >= 0) {
		sd_fail(e, "this test is already recorded as test %lld (%s, %s, %.1f kg x %d); not "
			"added twice", v[dup].id, v[dup].lift, v[dup].date, v[dup].load_kg, v[dup].reps);
		free(v);
		return -1;
	}
	free(v);
	return db_test_add(db, t, &t->id, e);
}

static int ends_with(const char *s, const char *suffix)
{
	size_t n = strlen(s), k = strlen(suffix);
	return n >= k && !strcasecmp(s + n - k, suffix);
}

/* The stored name: the option, else the file's [program] name, else the file name without its
 * folder and extension. */
static void pick_name(const char *opt, const struct sd_program *p, const char *path, char *buf,
		      size_t n)
{
	const char *base = strrchr(path, '/');
	char *dot;

	if (opt && *opt) {
		snprintf(buf, n, "%s", opt);
		return;
	}
	if (p->named) {
		snprintf(buf, n, "%s", p->name);
		return;
	}
	snprintf(buf, n, "%s", base ? base + 1 : path);
	dot = strrchr(buf, '.');
	if (dot && dot != buf)
		*dot = '\0';
}

int app_program_add_file(const struct sd_ctx *ctx, const char *path, const char *name_opt,
			 struct sd_program *prog, char *name, size_t n, struct sd_err *e)
{
	char *text = NULL;
	size_t len = 0;
	int is_csv = ends_with(path, ".csv"), rc = -1;

	memset(prog, 0, sizeof *prog);
	if (program_slurp(path, &text, &len, e))
		return -1;
	if (program_parse(path, text, len, is_csv, &ctx->lib, prog, e))
		goto done;
	pick_name(name_opt, prog, path, name, n);
	if (app_name("program", name, DB_PROGNAME_MAX, e))
		goto done;
	if (db_program_add(ctx->db, name, text, len, is_csv, NULL, e))
		goto done;
	rc = 0;
done:
	if (rc)
		prog_free(prog);
	free(text);
	return rc;
}
