/* Effect-size tables: reading (through io/csv.h) and turning columns into model data. */
#include "effects_io.h"

#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "../core/bounds.h"
#include "csv.h"

static char *dup_trim(const char *s)
{
	while (*s == ' ' || *s == '\t')
		s++;
	size_t n = strlen(s);
	while (n && (s[n - 1] == ' ' || s[n - 1] == '\t'))
		n--;
	char *d = malloc(n + 1);
	if (d) {
		memcpy(d, s, n);
		d[n] = '\0';
	}
	return d;
}

void eft_free(struct ef_table *t)
{
	for (int i = 0; t->head && i < t->ncol; i++)
		free(t->head[i]);
	for (size_t i = 0; t->cell && i < (size_t)t->nrow * t->ncol; i++)
		free(t->cell[i]);
	free(t->head);
	free(t->cell);
	free(t->line);
	memset(t, 0, sizeof *t);
}

static int add_row(struct ef_table *t, char **f, int n, int line, int *cap, struct sd_err *e)
{
	if (t->nrow == *cap) {
		int nc = *cap ? *cap * 2 : 64;
		char **cell = realloc(t->cell, sizeof(char *) * nc * t->ncol);
		if (cell)
			t->cell = cell;
		int *ln = realloc(t->line, sizeof(int) * nc);
		if (ln)
			t->line = ln;
		if (!cell || !ln)
			return sd_fail(e, "out of memory");
		*cap = nc;
	}
	char **row = t->cell + (size_t)t->nrow * t->ncol;
	for (int j = 0; j < t->ncol; j++)
		row[j] = NULL;
	t->line[t->nrow++] = line;
	for (int j = 0; j < t->ncol; j++)
		if (!(row[j] = dup_trim(j < n ? f[j] : "")))
			return sd_fail(e, "out of memory");
	return 0;
}

int eft_read(const char *path, struct ef_table *t, struct sd_err *e)
{
	struct sd_csv *c;
	char **f;
	int n, rc, cap = 0, ret = -1;

	memset(t, 0, sizeof *t);
	snprintf(t->path, sizeof t->path, "%s", path);
	if (!(c = csv_open(path, e)))
		return -1;
	rc = csv_next(c, &f, &n, e);
	if (rc <= 0) {
		if (rc == 0)
			sd_fail(e, "'%s' is empty (expected a header line of column names)", path);
		goto done;
	}
	if (!(t->head = calloc(n, sizeof(char *)))) {
		sd_fail(e, "out of memory");
		goto done;
	}
	t->ncol = n;
	for (int j = 0; j < n; j++) {
		if (!(t->head[j] = dup_trim(f[j]))) {
			sd_fail(e, "out of memory");
			goto done;
		}
		for (int k = 0; k < j; k++)
			if (!strcmp(t->head[k], t->head[j])) {
				sd_fail(e, "'%s' line %d: column '%s' appears twice", path, csv_line(c),
					t->head[j]);
				goto done;
			}
	}
	while ((rc = csv_next(c, &f, &n, e)) > 0) {
		if (n > t->ncol) {
			sd_fail(e, "'%s' line %d: %d fields but the header has %d columns", path,
				csv_line(c), n, t->ncol);
			goto done;
		}
		if (add_row(t, f, n, csv_line(c), &cap, e))
			goto done;
	}
	if (rc < 0)
		goto done;
	if (!t->nrow) {
		sd_fail(e, "'%s' has a header but no rows", path);
		goto done;
	}
	ret = 0;
done:
	csv_close(c);
	if (ret)
		eft_free(t);
	return ret;
}

int eft_col(const struct ef_table *t, const char *name)
{
	for (int j = 0; j < t->ncol; j++)
		if (!strcmp(t->head[j], name))
			return j;
	return -1;
}

const char *eft_cell(const struct ef_table *t, int row, int col)
{
	const char *s = t->cell[(size_t)row * t->ncol + col];
	return s ? s : "";
}

int eft_number(const struct ef_table *t, int row, int col, double *out, struct sd_err *e)
{
	const char *s = eft_cell(t, row, col);
	if (!*s)
		return sd_fail(e, "'%s' line %d: column '%s' is empty", t->path, t->line[row],
			       t->head[col]);
	if (csv_double(s, out))
		return sd_fail(e, "'%s' line %d: column '%s' is not a number ('%s')", t->path,
			       t->line[row], t->head[col], s);
	return 0;
}

void ef_model_free(struct ef_model *m)
{
	for (int i = 0; m->study_name && i < m->nstudy; i++)
		free(m->study_name[i]);
	free(m->study_name);
	free(m->y);
	free(m->v);
	free(m->X);
	free(m->dose);
	free(m->study);
	free(m->effect);
	free(m->line);
	memset(m, 0, sizeof *m);
}

static int need_col(const struct ef_table *t, const char *name, const char *what, int *col,
		    struct sd_err *e)
{
	char list[256] = "";
	if ((*col = eft_col(t, name)) >= 0)
		return 0;
	for (int j = 0; j < t->ncol && strlen(list) + strlen(t->head[j]) + 3 < sizeof list; j++)
		strcat(strcat(list, j ? ", " : ""), t->head[j]);
	return sd_fail(e, "'%s' has no %s column '%s' (columns: %s)", t->path, what, name, list);
}

static const struct ef_table *sort_tab;
static int sort_col;

static int cmp_label(const void *a, const void *b)
{
	int i = *(const int *)a, j = *(const int *)b;
	int c = strcmp(eft_cell(sort_tab, i, sort_col), eft_cell(sort_tab, j, sort_col));
	return c ? c : (i > j) - (i < j);
}

/* Numbers equal labels in order of first appearance (0, 1, ...); returns how many. Sorting
 * keeps this n log n for tables with one label per row. */
static int label_ids(const struct ef_table *t, int col, int *id, int *first, struct sd_err *e)
{
	int n = t->nrow, *ord = malloc(sizeof(int) * n), *grp = malloc(sizeof(int) * n), ng = 0;

	if (!ord || !grp) {
		free(ord);
		free(grp);
		return sd_fail(e, "out of memory");
	}
	for (int i = 0; i < n; i++)
		ord[i] = i;
	sort_tab = t;
	sort_col = col;
	qsort(ord, n, sizeof(int), cmp_label);
	/* grp[row] = first row of its label; then rank the first rows. */
	for (int k = 0; k < n; k++) {
		int lead = k > 0 && !strcmp(eft_cell(t, ord[k], col), eft_cell(t, ord[k - 1], col)) ?
			   grp[ord[k - 1]] : ord[k];
		grp[ord[k]] = lead;
	}
	for (int i = 0; i < n; i++)
		ord[i] = -1;
	for (int i = 0; i < n; i++) {
		if (grp[i] == i) {
			ord[i] = ng;
			if (first)
				first[ng] = i;
			ng++;
		}
		id[i] = ord[grp[i]];
	}
	free(ord);
	free(grp);
	return ng;
}

static int check_spec(const struct ef_spec *s, struct sd_err *e)
{
	if (s->nmods < 0 || s->nmods + 2 > MR_MAXP)
		return sd_usage(e, "at most %d moderators", MR_MAXP - 2);
	for (int k = 0; k < s->nmods; k++) {
		if (!strcmp(s->mods[k], "intercept") || !strcmp(s->mods[k], "dose") || !*s->mods[k])
			return sd_usage(e, "'%s' cannot be a moderator name", s->mods[k]);
		if (strlen(s->mods[k]) >= 32)
			return sd_usage(e, "moderator name '%s' is too long", s->mods[k]);
		for (int j = 0; j < k; j++)
			if (!strcmp(s->mods[k], s->mods[j]))
				return sd_usage(e, "moderator '%s' given twice", s->mods[k]);
	}
	return 0;
}

/* The number read from cell (row, col) is inside its documented range (core/bounds.h). */
static int in_range(const struct ef_table *t, int row, int col, const struct sd_bound *b,
		    double x, struct sd_err *e)
{
	if (bound_check(b, t->head[col], x, e))
		return sd_wrap(e, "'%s' line %d", t->path, t->line[row]);
	return 0;
}

/* Per row: the effect, its variance, dose and moderators, each checked. */
static int read_rows(const struct ef_table *t, const struct ef_spec *s, const int *col,
		     struct ef_model *m, struct sd_err *e)
{
	int p = 2 + s->nmods;
	for (int i = 0; i < t->nrow; i++) {
		double x;
		m->line[i] = t->line[i];
		if (eft_number(t, i, col[0], &m->y[i], e) || eft_number(t, i, col[1], &m->v[i], e) ||
		    eft_number(t, i, col[2], &m->dose[i], e))
			return -1;
		if (m->v[i] <= 0)
			return sd_fail(e, "'%s' line %d: sampling variance %s = %g (must be positive)",
				       t->path, t->line[i], t->head[col[1]], m->v[i]);
		if (m->dose[i] < 0)
			return sd_fail(e, "'%s' line %d: dose %s = %g (weekly sets cannot be negative)",
				       t->path, t->line[i], t->head[col[2]], m->dose[i]);
		if (in_range(t, i, col[0], &bound_yi, m->y[i], e) ||
		    in_range(t, i, col[1], &bound_vi, m->v[i], e) ||
		    in_range(t, i, col[2], &bound_dose, m->dose[i], e))
			return -1;
		if (!*eft_cell(t, i, col[3]))
			return sd_fail(e, "'%s' line %d: column '%s' (the study) is empty", t->path,
				       t->line[i], t->head[col[3]]);
		if (col[4] >= 0 && !*eft_cell(t, i, col[4]))
			return sd_fail(e, "'%s' line %d: column '%s' (the effect level) is empty",
				       t->path, t->line[i], t->head[col[4]]);
		m->X[(size_t)i * p] = 1;
		for (int k = 0; k < s->nmods; k++) {
			if (eft_number(t, i, col[5 + k], &x, e) ||
			    in_range(t, i, col[5 + k], &bound_moderator, x, e))
				return -1;
			m->X[(size_t)i * p + 2 + k] = x;
		}
		if (i == 0 || m->dose[i] < m->dose_min)
			m->dose_min = m->dose[i];
		if (i == 0 || m->dose[i] > m->dose_max)
			m->dose_max = m->dose[i];
	}
	return 0;
}

int ef_model_build(const struct ef_table *t, const struct ef_spec *s, struct ef_model *m,
		   struct sd_err *e)
{
	int n = t->nrow, p = 2 + s->nmods, col[5 + MR_MAXP], *first = NULL;

	memset(m, 0, sizeof *m);
	if (check_spec(s, e) ||
	    need_col(t, s->yi ? s->yi : "yi", "effect-size", &col[0], e) ||
	    need_col(t, s->vi ? s->vi : "vi", "variance", &col[1], e) ||
	    need_col(t, s->dose ? s->dose : "sets", "dose", &col[2], e) ||
	    need_col(t, s->study ? s->study : "study", "study", &col[3], e))
		return -1;
	col[4] = -1;
	if (s->effect && need_col(t, s->effect, "effect-level", &col[4], e))
		return -1;
	for (int k = 0; k < s->nmods; k++)
		if (need_col(t, s->mods[k], "moderator", &col[5 + k], e))
			return -1;
	m->y = malloc(sizeof(double) * n);
	m->v = malloc(sizeof(double) * n);
	m->dose = malloc(sizeof(double) * n);
	m->X = malloc(sizeof(double) * n * p);
	m->study = malloc(sizeof(int) * n);
	m->line = malloc(sizeof(int) * n);
	m->effect = s->effect ? malloc(sizeof(int) * n) : NULL;
	first = malloc(sizeof(int) * n);
	if (!m->y || !m->v || !m->dose || !m->X || !m->study || !m->line || !first ||
	    (s->effect && !m->effect)) {
		sd_fail(e, "out of memory");
		goto fail;
	}
	if (read_rows(t, s, col, m, e))
		goto fail;
	if ((m->nstudy = label_ids(t, col[3], m->study, first, e)) < 0)
		goto fail;
	if (s->effect && label_ids(t, col[4], m->effect, NULL, e) < 0)
		goto fail;
	if (!(m->study_name = calloc(m->nstudy, sizeof(char *)))) {
		sd_fail(e, "out of memory");
		goto fail;
	}
	for (int k = 0; k < m->nstudy; k++)
		if (!(m->study_name[k] = strdup(eft_cell(t, first[k], col[3])))) {
			sd_fail(e, "out of memory");
			goto fail;
		}
	if (m->dose_max == m->dose_min) {
		sd_fail(e, "'%s': every effect is at one dose (%g weekly sets), so no dose-response "
			"slope can be estimated", t->path, m->dose_min);
		goto fail;
	}
	m->names[0] = "intercept";
	m->names[1] = "dose";
	for (int k = 0; k < s->nmods; k++)
		m->names[2 + k] = s->mods[k];
	m->d.n = n;
	m->d.p = p;
	m->d.y = m->y;
	m->d.v = m->v;
	m->d.X = m->X;
	m->d.study = m->study;
	m->d.effect = m->effect;
	m->d.slope_col = s->slopes ? 1 : -1;
	m->d.names = m->names;
	ef_model_set_form(m, s->form);
	free(first);
	return 0;
fail:
	free(first);
	ef_model_free(m);
	return -1;
}

void ef_model_set_form(struct ef_model *m, enum sd_form form)
{
	m->form = form;
	for (int i = 0; i < m->d.n; i++)
		m->X[(size_t)i * m->d.p + 1] = form_f(form, m->dose[i]);
}
