/* Effect-size tables (CSV with a header line): read whole as text, then turned into the
 * numeric model data of core/metareg.h with every bad cell reported by file, line and column.
 *
 * Ownership: eft_read fills a table owning its text; eft_free releases it. ef_model_build
 * fills a model owning its arrays (the mr_data inside points into them); ef_model_free
 * releases them. */
#ifndef SD_EFFECTS_IO_H
#define SD_EFFECTS_IO_H

#include "../core/metareg.h"

struct ef_table {
	char path[512];
	int ncol, nrow;
	char **head;       /* ncol column names, trimmed */
	char **cell;       /* nrow x ncol, row-major; "" when a row is short */
	int *line;         /* nrow: the line each row starts on */
};

/* Reads a whole CSV file ("-" for standard input); fails on an empty file, a duplicate
 * column name or a row with more fields than the header. */
int eft_read(const char *path, struct ef_table *t, struct sd_err *e);
void eft_free(struct ef_table *t);
/* Index of a column by exact name, -1 if absent. */
int eft_col(const struct ef_table *t, const char *name);
/* Cell text as written; never NULL. */
const char *eft_cell(const struct ef_table *t, int row, int col);
/* Parses cell (row, col) as a finite number: 0, or -1 with "FILE line N: column 'C' ...". */
int eft_number(const struct ef_table *t, int row, int col, double *out, struct sd_err *e);

struct ef_spec {
	const char *yi, *vi;         /* effect and variance columns (default "yi", "vi") */
	const char *study;           /* cluster column (default "study") */
	const char *effect;          /* effect-level column, or NULL for no such level */
	const char *dose;            /* weekly sets column (default "sets") */
	enum sd_form form;
	int nmods;
	const char *mods[SD_MAX_TERMS];  /* moderator columns, numeric (0/1 for a factor) */
	int slopes;                  /* random study slopes on the dose term */
};

struct ef_model {
	struct mr_data d;            /* ready for mr_fit; X columns: intercept, f(dose), mods */
	double *y, *v, *X, *dose;    /* dose: the raw weekly sets */
	int *study, *effect, *line;  /* study: 0..nstudy-1 in order of first appearance */
	int nstudy;
	char **study_name;           /* nstudy labels as written in the file */
	const char *names[MR_MAXP];  /* term names: "intercept", "dose", then the moderators */
	double dose_min, dose_max;
	enum sd_form form;
};

/* Builds the model data from a table; errors name the file, the line and the column. */
int ef_model_build(const struct ef_table *t, const struct ef_spec *s, struct ef_model *m,
		   struct sd_err *e);
/* Recomputes the dose column of X for another form (the same rows). */
void ef_model_set_form(struct ef_model *m, enum sd_form form);
void ef_model_free(struct ef_model *m);

#endif
