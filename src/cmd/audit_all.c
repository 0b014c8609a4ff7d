/* audit --all: the audits of all open blocks. Blocks share few templates, statuses and
 * lengths, so each (template, status, weeks) is parsed and audited once and reused. Next to
 * each block's planned dose, what its athlete logged in it so far (the logged average weekly
 * dose, cmd/logdata.h); a database without a log skips that query. */
#include <stdlib.h>
#include <string.h>

#include "../io/audit_out.h"
#include "audit_all.h"
#include "dbutil.h"
#include "../app/logdata.h"

#define CACHE_MAX 256   /* distinct (template, status, weeks) audits kept at once */
#define OVERDUE_SHOWN 20 /* overdue blocks named under the table; the rest are counted */

struct entry {
	long long program_id;
	int trained, weeks;
	char name[DB_PROGNAME_MAX];
	struct sd_program prog;
	struct sd_audit au;
	struct sd_sumrows rows;      /* the summary rows, formatted at first use */
};

struct walk {
	struct sd_ctx *ctx;
	struct sd_db *db;
	double cap;
	struct sd_sumout so;
	struct entry *cache;
	int n, first;
	char today[DATE_LEN];
	long long noverdue;
	char overdue[OVERDUE_SHOWN][DB_NAME_MAX + 160];  /* notes under the table */
	int any_logs;                /* the database holds logged sets */
	struct sd_ctx lctx;          /* the run's context on this walk's database, for the log */
	struct sd_err *e;
};

static void cache_clear(struct walk *w)
{
	for (int i = 0; i < w->n; i++) {
		audit_free(&w->cache[i].au);
		prog_free(&w->cache[i].prog);
		aout_sum_free(&w->cache[i].rows);
	}
	w->n = 0;
}

static struct entry *lookup(struct walk *w, const struct db_block *b)
{
	struct db_program p;
	struct entry *x;

	for (int i = 0; i < w->n; i++) {
		x = &w->cache[i];
		if (x->program_id == b->program_id && x->trained == b->trained && x->weeks == b->weeks)
			return x;
	}
	if (w->n == CACHE_MAX)
		cache_clear(w);
	if (db_program_get_id(w->db, b->program_id, &p, w->e))
		return NULL;
	x = &w->cache[w->n];
	if (app_block_audit(w->ctx, b, &p, w->cap, &x->prog, &x->au, w->e)) {
		db_program_free(&p);
		return NULL;
	}
	x->program_id = b->program_id;
	x->trained = b->trained;
	x->weeks = b->weeks;
	snprintf(x->name, sizeof x->name, "%s", p.name);
	db_program_free(&p);
	w->n++;
	return x;
}

/* The block's logged average dose so far. */
static int block_done(struct walk *w, const struct db_block *b, struct aout_done *d)
{
	struct tlog_span span;

	memset(d, 0, sizeof *d);
	if (!w->any_logs)
		return 0;
	if (logd_block_done(&w->lctx, b, d->dose, &span, w->e))
		return -1;
	d->logged = span.rows > 0;
	if (span.to >= span.from) {
		date_format(span.from, d->from);
		date_format(span.to, d->to);
	}
	d->weeks = tlog_span_weeks(&span);
	d->days = span.days;
	return 0;
}

static int one_block(const struct db_block *b, void *arg)
{
	struct walk *w = arg;
	struct entry *x = lookup(w, b);
	struct aout_done done;

	if (!x || block_done(w, b, &done))
		return -1;
	struct sd_audit_info in = { .label = x->name, .prog = &x->prog, .prof = &w->ctx->profile,
				    .audit = &x->au, .athlete = b->athlete,
				    .overdue_days = app_block_overdue(b, w->today) };
	if (in.overdue_days && w->noverdue++ < OVERDUE_SHOWN)
		snprintf(w->overdue[w->noverdue - 1], sizeof w->overdue[0],
			 "block %lld of '%s' is open %d days past its planned end; end it with "
			 "'setdose block end %lld'", b->id, b->athlete, in.overdue_days, b->id);
	if (w->ctx->opt.format == SD_FMT_JSON) {
		if (aout_json_item_done(w->ctx->out, &in, &done, w->first))
			return sd_fail(w->e, "out of memory");
	} else {
		if (!x->rows.text && aout_sum_format(&w->so, &in, &x->rows))
			return sd_fail(w->e, "out of memory");
		w->so.done = &done;
		aout_sum_print(&w->so, &in, &x->rows);
		w->so.done = NULL;
	}
	w->first = 0;
	return 0;
}

int cmd_audit_all(struct sd_ctx *ctx, double session_cap, struct sd_err *e)
{
	struct walk w;
	struct sd_db *own = NULL;
	char path[4096];
	long long nopen, nlogs;
	int wa, wp, rc = -1;

	memset(&w, 0, sizeof w);
	w.e = e;
	if (!ctx->db) {
		if (app_db_path(ctx, path, sizeof path, e) || db_open(path, &own, e))
			return -1;
	}
	w.ctx = ctx;
	w.db = own ? own : ctx->db;
	w.cap = session_cap;
	w.first = 1;
	if (app_today(w.today, e))
		goto done;
	w.cache = calloc(CACHE_MAX, sizeof *w.cache);
	if (!w.cache) {
		sd_fail(e, "out of memory");
		goto done;
	}
	if (db_block_open_widths(w.db, &wa, &wp, &nopen, e) || db_log_count(w.db, 0, &nlogs, e))
		goto done;
	w.any_logs = nlogs > 0;
	w.lctx = *ctx;
	w.lctx.db = w.db;
	w.so = (struct sd_sumout){ ctx->out, ctx->opt.format == SD_FMT_CSV, 1,
				   wa > 7 ? wa : 7, wp > 7 ? wp : 7, 1, NULL };
	if (ctx->opt.format == SD_FMT_JSON)
		aout_json_begin(ctx->out);
	else if (nopen)
		aout_sum_head(&w.so);
	else if (ctx->opt.format == SD_FMT_TABLE)
		fprintf(ctx->out, "no open blocks in %s\n", db_path(w.db));
	if (db_block_each_open(w.db, one_block, &w, e))
		goto done;
	if (ctx->opt.format == SD_FMT_JSON)
		aout_json_end(ctx->out);
	else if (nopen && ctx->opt.format == SD_FMT_TABLE) {
		fprintf(ctx->out, "\ndone: the weekly fractional sets logged in the block so far (its "
			"start to today), per week; -: nothing logged\n");
		for (long long i = 0; i < w.noverdue && i < OVERDUE_SHOWN; i++)
			fprintf(ctx->out, "note: %s\n", w.overdue[i]);
		if (w.noverdue > OVERDUE_SHOWN)
			fprintf(ctx->out, "note: %lld more open blocks past their planned end ('setdose "
				"block list')\n", w.noverdue - OVERDUE_SHOWN);
		cmd_print_caution(ctx);
	}
	rc = 0;
done:
	if (w.cache)
		cache_clear(&w);
	free(w.cache);
	db_close(own);
	return rc;
}
