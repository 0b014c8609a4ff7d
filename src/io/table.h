/* Rows of text cells printed as an aligned table or as CSV from the same data, so every
 * command's table and CSV output agree.
 *
 * Ownership: the table owns copies of every cell; tbl_free releases them. */
#ifndef SD_TABLE_H
#define SD_TABLE_H

#include <stdio.h>

struct sd_table;

/* A table with the given header cells; a header starting with '<' is left-aligned (the '<' is
 * not printed), others are right-aligned (numbers). NULL on allocation failure. */
struct sd_table *tbl_new(int ncols, const char *const *headers);
/* Starts a new row. */
int tbl_row(struct sd_table *t);
/* Sets a cell of the current row. */
int tbl_set(struct sd_table *t, int col, const char *fmt, ...) __attribute__((format(printf, 3, 4)));
/* Prints aligned columns (two spaces apart) or CSV (csv != 0) with a header line. */
void tbl_print(const struct sd_table *t, FILE *f, int csv);
int tbl_rows(const struct sd_table *t);
void tbl_free(struct sd_table *t);
/* Takes LC_CTYPE from the environment, once. Only what measures or draws non-ASCII text needs
 * it (table widths, Unicode plots, the full-screen interface): loading a locale costs a dozen
 * system calls that a plain audit should not pay. Numbers stay in the C locale. */
void tbl_locale(void);
/* Writes one CSV field, quoted when it must be. */
void tbl_csv_field(FILE *f, const char *s);

#endif
