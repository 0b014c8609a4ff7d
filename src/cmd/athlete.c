/* athlete: add, list, show, edit and remove the athletes kept in the database. */
#include <stddef.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "../core/units.h"
#include "../io/recout.h"
#include "dbutil.h"

extern const struct sd_cmd cmd_athlete;

static int usage(struct sd_err *e)
{
	return sd_usage(e, "usage: setdose %s", cmd_athlete.usage);
}

/* Options of add, edit and rm; --status and --units are global options (main.c). */
struct athlete_opts {
	const char *notes, *rename;
	int yes, cascade;
};

#define AO(f) offsetof(struct athlete_opts, f)
static const struct sd_optdef add_opts[] = {
	{ "notes", OPT_STR, 0, 0, AO(notes), NULL, "TEXT", "free text about the athlete" },
};
static const struct sd_optdef edit_opts[] = {
	{ "name", OPT_STR, 0, 0, AO(rename), NULL, "NEW", "rename the athlete" },
	{ "notes", OPT_STR, 0, 0, AO(notes), NULL, "TEXT", "replace the notes" },
};
static const struct sd_optdef rm_opts[] = {
	{ "yes", OPT_FLAG, 0, 0, AO(yes), NULL, NULL, "do not ask before removing" },
	{ "cascade", OPT_FLAG, 0, 0, AO(cascade), NULL, NULL,
	  "also remove the athlete's blocks, tests and log (else rm refuses)" },
};
#undef AO

/* Reads a subcommand's options; exactly one NAME must remain, as argv[1]. */
static int parse_opts(const char *label, const struct sd_optdef *defs, int n, int argc,
		      char **argv, struct athlete_opts *o, struct sd_err *e)
{
	memset(o, 0, sizeof *o);
	if ((argc = opt_parse(label, defs, n, o, argc, argv, e)) < 0)
		return -1;
	if (argc != 2)
		return usage(e);
	if (o->notes && strlen(o->notes) >= DB_NOTES_MAX)
		return sd_usage(e, "notes are too long (at most %d bytes)", DB_NOTES_MAX - 1);
	return 0;
}

static int do_add(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	struct db_athlete a;
	struct athlete_opts o;

	if (parse_opts("athlete add", add_opts, OPT_N(add_opts), argc, argv, &o, e))
		return -1;
	if (app_name("athlete", argv[1], DB_NAME_MAX, e))
		return -1;
	memset(&a, 0, sizeof a);
	snprintf(a.name, sizeof a.name, "%s", argv[1]);
	snprintf(a.notes, sizeof a.notes, "%s", o.notes ? o.notes : "");
	a.trained = ctx->opt.status_set && ctx->opt.trained >= 0.5;
	a.units_lb = ctx->opt.units_lb;
	if (db_begin(ctx->db, e) || db_athlete_add(ctx->db, &a, &a.id, e) ||
	    db_commit(ctx->db, e))
		return -1;
	fprintf(ctx->out, "added athlete '%s' (%s, %s)\n", a.name,
		a.trained ? "trained" : "untrained", units_name(a.units_lb));
	return 0;
}

static int do_edit(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	struct db_athlete a;
	struct athlete_opts o;
	const char *notes, *rename;

	if (parse_opts("athlete edit", edit_opts, OPT_N(edit_opts), argc, argv, &o, e))
		return -1;
	notes = o.notes;
	rename = o.rename;
	if (rename && app_name("athlete", rename, DB_NAME_MAX, e))
		return -1;
	if (db_begin(ctx->db, e) || app_athlete_get(ctx->db, argv[1], &a, e))
		return -1;
	if (rename)
		snprintf(a.name, sizeof a.name, "%s", rename);
	if (notes)
		snprintf(a.notes, sizeof a.notes, "%s", notes);
	if (ctx->opt.status_set)
		a.trained = ctx->opt.trained >= 0.5;
	if (ctx->opt.units_set)
		a.units_lb = ctx->opt.units_lb;
	if (db_athlete_update(ctx->db, &a, e) || db_commit(ctx->db, e))
		return -1;
	fprintf(ctx->out, "athlete '%s': %s, %s\n", a.name, a.trained ? "trained" : "untrained",
		units_name(a.units_lb));
	return 0;
}

static int do_list(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	static const char *const heads[] = { "<name", "<status", "<units", "blocks", "tests",
		"<created", "<notes" };
	struct db_roster v;
	struct sd_rec *r = NULL;
	int rc = -1;

	(void)argv;   /* takes no arguments; the signature is the subcommand table's */
	if (argc != 1)
		return usage(e);
	if (db_roster_load(ctx->db, 0, 1, &v, e))
		return -1;
	if (!(r = rec_new(7, heads, ctx->opt.format))) {
		sd_fail(e, "out of memory");
		goto done;
	}
	for (int i = 0; i < v.n; i++) {
		const struct db_roster_row *a = &v.v[i];
		if (rec_row(r)) {
			sd_fail(e, "out of memory");
			goto done;
		}
		rec_set(r, 0, "%s", a->name);
		rec_set(r, 1, "%s", a->trained ? "trained" : "untrained");
		rec_set(r, 2, "%s", units_name(a->units_lb));
		rec_set(r, 3, "%d", a->nblocks);
		rec_set(r, 4, "%d", a->ntests);
		rec_set(r, 5, "%s", a->created);
		rec_set(r, 6, "%s", a->notes);
	}
	if (!v.n && ctx->opt.format == SD_FMT_TABLE)
		fprintf(ctx->out, "no athletes yet (add one with 'setdose athlete add NAME')\n");
	else
		rec_print(r, ctx->out);
	rc = 0;
done:
	rec_free(r);
	db_roster_free(&v);
	return rc;
}

static int do_show(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	struct db_athlete a;
	struct db_block *b = NULL;
	struct db_test *t = NULL;
	int nb = 0, nt = 0, lb;

	if (argc != 2)
		return usage(e);
	if (app_athlete_get(ctx->db, argv[1], &a, e) || db_block_list(ctx->db, a.id, &b, &nb, e))
		return -1;
	if (db_test_list(ctx->db, a.id, NULL, &t, &nt, e)) {
		free(b);
		return -1;
	}
	lb = app_lb(ctx, &a);
	if (ctx->opt.format != SD_FMT_TABLE) {
		/* Machine-readable detail is in 'block list' and 'test list'; this is the card. */
		static const char *const heads[] = { "<name", "<status", "<units", "blocks", "tests",
			"<created", "<notes" };
		struct sd_rec *r = rec_new(7, heads, ctx->opt.format);
		if (!r || rec_row(r)) {
			rec_free(r);
			free(b);
			free(t);
			return sd_fail(e, "out of memory");
		}
		rec_set(r, 0, "%s", a.name);
		rec_set(r, 1, "%s", a.trained ? "trained" : "untrained");
		rec_set(r, 2, "%s", units_name(a.units_lb));
		rec_set(r, 3, "%d", nb);
		rec_set(r, 4, "%d", nt);
		rec_set(r, 5, "%s", a.created);
		rec_set(r, 6, "%s", a.notes);
		rec_print(r, ctx->out);
		rec_free(r);
		free(b);
		free(t);
		return 0;
	}
	fprintf(ctx->out, "athlete:  %s\nstatus:   %s\nunits:    %s\nadded:    %s UTC\n", a.name,
		a.trained ? "trained" : "untrained", units_name(a.units_lb), a.created);
	if (a.notes[0])
		fprintf(ctx->out, "notes:    %s\n", a.notes);
	fprintf(ctx->out, "blocks:   %d\n", nb);
	for (int i = 0; i < nb; i++)
		fprintf(ctx->out, "  %lld  %s  %s  %d weeks  %s%s\n", b[i].id, b[i].start,
			b[i].end[0] ? b[i].end : "open", b[i].weeks, b[i].program,
			b[i].end[0] ? "" : "  (open)");
	fprintf(ctx->out, "tests:    %d\n", nt);
	/* The latest test of each lift (the list is ordered by lift, then date). */
	for (int i = 0; i < nt; i++) {
		if (i + 1 < nt && !strcmp(t[i].lift, t[i + 1].lift))
			continue;
		fprintf(ctx->out, "  %-24s %s  1RM %.1f %s\n", t[i].lift, t[i].date,
			units_show(t[i].e1rm_kg, lb), units_name(lb));
	}
	free(b);
	free(t);
	return 0;
}

static int do_rm(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	struct athlete_opts o;
	struct db_athlete a;
	char logs[48];
	long long nl;
	int yes, cascade, nb, nt;

	if (parse_opts("athlete rm", rm_opts, OPT_N(rm_opts), argc, argv, &o, e))
		return -1;
	yes = o.yes;
	cascade = o.cascade;
	if (db_begin(ctx->db, e) || app_athlete_get(ctx->db, argv[1], &a, e) ||
	    db_athlete_refs(ctx->db, a.id, &nb, &nt, e) || db_log_count(ctx->db, a.id, &nl, e))
		return -1;
	/* The logged rows are named only when there are some: most athletes have none. */
	logs[0] = '\0';
	if (nl)
		snprintf(logs, sizeof logs, " and %lld logged row%s", nl, nl == 1 ? "" : "s");
	if ((nb || nt || nl) && !cascade)
		return sd_fail(e, "athlete '%s' has %d block%s%s %d test%s%s; not removed (use "
			       "--cascade to remove them too)", a.name, nb, nb == 1 ? "" : "s",
			       nl ? "," : " and", nt, nt == 1 ? "" : "s", logs);
	if (!yes) {
		char q[256];
		int ok;
		snprintf(q, sizeof q, "remove athlete '%s' with %d block%s%s %d test%s%s?", a.name,
			 nb, nb == 1 ? "" : "s", nl ? "," : " and", nt, nt == 1 ? "" : "s", logs);
		ok = dbu_confirm(q, e);
		if (ok < 0)
			return -1;
		if (!ok)
			return sd_fail(e, "athlete '%s' not removed", a.name);
	}
	if (db_athlete_rm(ctx->db, a.id, cascade, e) || db_commit(ctx->db, e))
		return -1;
	fprintf(ctx->out, "removed athlete '%s' (%d block%s, %d test%s", a.name, nb,
		nb == 1 ? "" : "s", nt, nt == 1 ? "" : "s");
	fprintf(ctx->out, nl ? ", %lld logged row%s)\n" : ")\n", nl, nl == 1 ? "" : "s");
	return 0;
}

static const struct sd_sub subs[] = {
	{ "add", "athlete add", do_add, add_opts, OPT_N(add_opts) },
	{ "list", "athlete list", do_list, NULL, 0 },
	{ "show", "athlete show", do_show, NULL, 0 },
	{ "edit", "athlete edit", do_edit, edit_opts, OPT_N(edit_opts) },
	{ "rm", "athlete rm", do_rm, rm_opts, OPT_N(rm_opts) },
	{ NULL, NULL, NULL, NULL, 0 },
};

const struct sd_cmd cmd_athlete = {
	.name = "athlete",
	.summary = "add, list, show, edit or remove athletes in the database",
	.usage = "athlete add NAME [--status trained|untrained] [--units kg|lb] [--notes TEXT]\n"
		 "       setdose athlete list\n"
		 "       setdose athlete show NAME\n"
		 "       setdose athlete edit NAME [--name NEW] [--status S] [--units U] [--notes TEXT]\n"
		 "       setdose athlete rm NAME [--yes] [--cascade]\n"
		 "  --status and --units are global options: the training status used for the curve\n"
		 "  (default untrained); kg or lb, how this athlete's loads are entered and shown",
	.flags = CMD_DB,
	.subs = subs,
};
