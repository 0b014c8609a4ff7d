/* effects: adds lnRR effect sizes (yi) and their sampling variances (vi) to a table of group
 * summaries, two-group or pre-post. */
#include <errno.h>
#include <stddef.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "../core/effects.h"
#include "../io/effects_io.h"
#include "../io/safefile.h"
#include "../io/table.h"
#include "../app/parse.h"
#include "../io/wrap.h"
#include "cmd.h"

extern const struct sd_cmd cmd_effects;

enum { TWO_GROUP, PRE_POST, AUTO };
enum { C_M1, C_SD1, C_N1, C_M2, C_SD2, C_N2, C_MPRE, C_MPOST, C_SDPRE, C_SDPOST, C_N, C_R, NCOLS };

static const char *const col_default[NCOLS] = {
	"m1", "sd1", "n1", "m2", "sd2", "n2", "m_pre", "m_post", "sd_pre", "sd_post", "n", "r",
};
static const char *const col_option[NCOLS] = {
	"m1", "sd1", "n1", "m2", "sd2", "n2", "m-pre", "m-post", "sd-pre", "sd-post", "n", "r",
};

struct job {
	int design;
	const char *name[NCOLS];  /* column name per role */
	int col[NCOLS];           /* its index in the table, -1 when absent */
	int r_default_set;
	double r_default;
	const char *out;
	int force;                /* --force: replace an existing --output file */
};

/* Problems are collected over the whole file so one message lists every bad row. */
struct problems {
	int n, shown;
	char text[400];
};

static void note_problem(struct problems *p, const struct ef_table *t, int row, const char *msg)
{
	size_t used = strlen(p->text);
	char one[300];
	snprintf(one, sizeof one, "%sline %d: %s", p->n ? "; " : "", t->line[row], msg);
	if (!p->n || used + strlen(one) < sizeof p->text - 40) {
		snprintf(p->text + used, sizeof p->text - used, "%s", one);
		p->shown++;
	}
	p->n++;
}

static int cell(const struct ef_table *t, int row, int col, double *x, struct sd_err *e)
{
	struct sd_err tmp = { 0 };
	if (eft_number(t, row, col, x, &tmp)) {
		/* keep only the part after "FILE line N: " for the collected message */
		const char *s = strstr(tmp.msg, ": ");
		return sd_fail(e, "%s", s ? s + 2 : tmp.msg);
	}
	return 0;
}

static int row_effect(const struct job *j, const struct ef_table *t, int i,
		      struct sd_effect *ef, double *r, int *r_from_default, struct sd_err *e)
{
	double v[NCOLS];
	if (j->design == TWO_GROUP) {
		for (int k = C_M1; k <= C_N2; k++)
			if (cell(t, i, j->col[k], &v[k], e))
				return -1;
		return eff_rom(v[C_M1], v[C_SD1], v[C_N1], v[C_M2], v[C_SD2], v[C_N2], ef, e);
	}
	for (int k = C_MPRE; k <= C_N; k++)
		if (cell(t, i, j->col[k], &v[k], e))
			return -1;
	*r_from_default = j->col[C_R] < 0 || !*eft_cell(t, i, j->col[C_R]);
	if (*r_from_default) {
		if (!j->r_default_set)
			return sd_fail(e, "the pre-post correlation %s is missing (give --r-default R "
				       "to assume one)", j->name[C_R]);
		v[C_R] = j->r_default;
	} else if (cell(t, i, j->col[C_R], &v[C_R], e))
		return -1;
	*r = v[C_R];
	return eff_romc(v[C_MPRE], v[C_MPOST], v[C_SDPRE], v[C_SDPOST], v[C_N], v[C_R], ef, e);
}

static int find_columns(struct job *j, const struct ef_table *t, struct sd_err *e)
{
	for (int k = 0; k < NCOLS; k++)
		j->col[k] = eft_col(t, j->name[k]);
	if (j->design == AUTO) {
		if (j->col[C_M1] >= 0)
			j->design = TWO_GROUP;
		else if (j->col[C_MPRE] >= 0)
			j->design = PRE_POST;
		else
			return sd_fail(e, "'%s' has neither two-group columns (%s, %s, %s, %s, %s, %s) "
				       "nor pre-post columns (%s, %s, %s, %s, %s, %s)", t->path,
				       j->name[C_M1], j->name[C_SD1], j->name[C_N1], j->name[C_M2],
				       j->name[C_SD2], j->name[C_N2], j->name[C_MPRE], j->name[C_MPOST],
				       j->name[C_SDPRE], j->name[C_SDPOST], j->name[C_N], j->name[C_R]);
	}
	int lo = j->design == TWO_GROUP ? C_M1 : C_MPRE, hi = j->design == TWO_GROUP ? C_N2 : C_N;
	for (int k = lo; k <= hi; k++)
		if (j->col[k] < 0)
			return sd_fail(e, "'%s' has no column '%s' (%s design; map it with --%s COL)",
				       t->path, j->name[k], j->design == TWO_GROUP ? "two-group" :
				       "pre-post", col_option[k]);
	return 0;
}

/* Output: the input columns as read, with yi and vi replaced in place when present, else
 * appended; pre-post rows also say which r was used and where it came from. */
static int print_rows(FILE *out, const struct job *j, const struct ef_table *t,
		      const struct sd_effect *ef, const double *r, const int *rdef)
{
	int cyi = eft_col(t, "yi"), cvi = eft_col(t, "vi"), pp = j->design == PRE_POST;
	for (int c = 0; c < t->ncol; c++) {
		if (c)
			fputc(',', out);
		tbl_csv_field(out, t->head[c]);
	}
	fprintf(out, "%s%s%s\n", cyi < 0 ? ",yi" : "", cvi < 0 ? ",vi" : "",
		pp ? ",r_used,r_source" : "");
	for (int i = 0; i < t->nrow; i++) {
		for (int c = 0; c < t->ncol; c++) {
			if (c)
				fputc(',', out);
			if (c == cyi)
				fprintf(out, "%.12g", ef[i].yi);
			else if (c == cvi)
				fprintf(out, "%.12g", ef[i].vi);
			else
				tbl_csv_field(out, eft_cell(t, i, c));
		}
		if (cyi < 0)
			fprintf(out, ",%.12g", ef[i].yi);
		if (cvi < 0)
			fprintf(out, ",%.12g", ef[i].vi);
		if (pp)
			fprintf(out, ",%g,%s", r[i], rdef[i] ? "default" : "data");
		fputc('\n', out);
	}
	return ferror(out) ? -1 : 0;
}

static int run(struct sd_ctx *ctx, struct job *j, const char *path, struct sd_err *e)
{
	struct ef_table t;
	struct sd_effect *ef = NULL;
	struct problems pb = { 0 };
	struct sf_file sf;
	double *r = NULL;
	int *rdef = NULL, ndef = 0, rc = -1;

	if (eft_read(path, &t, e))
		return -1;
	if (find_columns(j, &t, e))
		goto done;
	ef = calloc(t.nrow, sizeof *ef);
	r = calloc(t.nrow, sizeof *r);
	rdef = calloc(t.nrow, sizeof *rdef);
	if (!ef || !r || !rdef) {
		sd_fail(e, "out of memory");
		goto done;
	}
	for (int i = 0; i < t.nrow; i++) {
		struct sd_err re = { 0 };
		if (row_effect(j, &t, i, &ef[i], &r[i], &rdef[i], &re))
			note_problem(&pb, &t, i, re.msg);
		ndef += rdef[i];
	}
	if (pb.n) {
		char more[64] = "";
		if (pb.n > pb.shown)
			snprintf(more, sizeof more, "; and %d more rows", pb.n - pb.shown);
		sd_fail(e, "cannot compute effects from '%s' (%d of %d rows rejected): %s%s", path,
			pb.n, t.nrow, pb.text, more);
		goto done;
	}
	if (!j->out) {
		if (print_rows(ctx->out, j, &t, ef, r, rdef)) {
			sd_fail(e, "cannot write standard output: %s", strerror(errno));
			goto done;
		}
	} else {
		/* A temporary file put in place only once complete (io/safefile.h). */
		if (sf_open(&sf, j->out, j->force, e))
			goto done;
		if (sf_finish(&sf, print_rows(sf.fp, j, &t, ef, r, rdef) ?
			      sd_fail(e, "cannot write '%s'", j->out) : 0, e))
			goto done;
	}
	if (j->out)
		fprintf(ctx->out, "wrote %d %s effects to '%s'\n", t.nrow,
			j->design == TWO_GROUP ? "two-group lnRR" : "pre-post lnRR", j->out);
	if (j->out && ndef)
		wrap_printf(ctx->out, 6, "note: default r = %g assumed on %d of %d rows (r_source = default)",
			j->r_default, ndef, t.nrow);
	rc = 0;
done:
	free(ef);
	free(r);
	free(rdef);
	eft_free(&t);
	return rc;
}

static int opt_design(void *dst, const struct sd_optdef *d, const char *v, struct sd_err *e)
{
	struct job *j = dst;
	(void)d;
	if (!strcmp(v, "two-group"))
		j->design = TWO_GROUP;
	else if (!strcmp(v, "pre-post"))
		j->design = PRE_POST;
	else
		return sd_usage(e, "--design wants two-group or pre-post, not '%s'", v);
	return 0;
}

static int opt_rdefault(void *dst, const struct sd_optdef *d, const char *v, struct sd_err *e)
{
	struct job *j = dst;
	(void)d;
	if (app_num("--r-default", v, -1, 1, &j->r_default, e))
		return -1;
	j->r_default_set = 1;
	return 0;
}

#define JO(f) offsetof(struct job, f)
#define COL(n, c) { n, OPT_STR, 0, 0, JO(name[c]), NULL, "COL", "the column of " n }
static const struct sd_optdef opts[] = {
	{ "design", OPT_CALL, 0, 0, 0, opt_design, "D",
	  "two-group or pre-post (default: from the columns present)" },
	{ "r-default", OPT_CALL, 0, 0, 0, opt_rdefault, "R",
	  "pre-post correlation where r is missing (marked in the\n"
	  "r_source column)" },
	{ "output", OPT_STR, 0, 0, JO(out), NULL, "FILE",
	  "write the CSV to FILE instead of standard output" },
	{ "force", OPT_FLAG, 0, 0, JO(force), NULL, NULL, "replace an existing --output FILE" },
	COL("m1", C_M1), COL("sd1", C_SD1), COL("n1", C_N1), COL("m2", C_M2), COL("sd2", C_SD2),
	COL("n2", C_N2), COL("m-pre", C_MPRE), COL("m-post", C_MPOST), COL("sd-pre", C_SDPRE),
	COL("sd-post", C_SDPOST), COL("n", C_N), COL("r", C_R),
};
#undef COL
#undef JO

static int exec_effects(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	struct job j = { .design = AUTO };

	for (int k = 0; k < NCOLS; k++)
		j.name[k] = col_default[k];
	if ((argc = opt_parse("effects", opts, OPT_N(opts), &j, argc, argv, e)) < 0)
		return -1;
	if (argc != 2)
		return sd_usage(e, "usage: setdose %s", cmd_effects.usage);
	return run(ctx, &j, argv[1], e);
}

const struct sd_cmd cmd_effects = {
	.name = "effects",
	.summary = "add lnRR effect sizes and sampling variances to a table of group summaries",
	.usage = "effects [options] INPUT.csv\n"
		 "  two-group (Hedges, Gurevitch & Curtis 1999): columns m1 sd1 n1 m2 sd2 n2,\n"
		 "                     renamed with --m1 COL ... --n2 COL; yi = ln(m1/m2)\n"
		 "  pre-post (Lajeunesse 2011): columns m_pre m_post sd_pre sd_post n r, renamed\n"
		 "                     with --m-pre COL --m-post COL --sd-pre COL --sd-post COL\n"
		 "                     --n COL --r COL; yi = ln(m_post/m_pre)",
	.flags = 0,
	.exec = exec_effects,
	.opts = opts,
	.nopts = OPT_N(opts),
};
