/* Rows of text cells printed as an aligned table or as CSV from the same data, so every
 * command's table and CSV output agree.
 *
 * Ownership: the table owns copies of every cell; tbl_free releases them. */
#ifndef SD_TABLE_H
#define SD_TABLE_H

#include <stdio.h>

struct sd_table;

/* A table with the given header cells; a header starting with '<' is left-aligned (the '<' is
 * not printed), others are right-aligned (numbers). A header starting with '~' (before any '<')
 * is a column the narrow text table leaves out: the writers mark there which columns the
 * default table keeps within 80 columns. NULL on allocation failure. */
struct sd_table *tbl_new(int ncols, const char *const *headers);
/* Starts a new row. */
int tbl_row(struct sd_table *t);
/* Sets a cell of the current row. */
int tbl_set(struct sd_table *t, int col, const char *fmt, ...) __attribute__((format(printf, 3, 4)));
/* How tbl_print shows a table: aligned text without the '~' columns (the default, 0), CSV
 * (every column, 1, so `csv` flags of old still work), or aligned text with every column. */
enum { TBL_TEXT = 0, TBL_CSV = 1, TBL_WIDE = 2 };
/* Prints aligned columns (two spaces apart) or CSV with a header line (mode: TBL_*). */
void tbl_print(const struct sd_table *t, FILE *f, int mode);
/* Prints the aligned text table (mode TBL_TEXT or TBL_WIDE) in panels of at most width
 * columns, one under the other, each repeating the first `keep` columns; a row with no text
 * in a panel's other columns is left out of that panel. One panel when it fits. */
void tbl_print_panels(const struct sd_table *t, FILE *f, int mode, int width, int keep);
/* TBL_WIDE when wide, else TBL_TEXT; CSV wins over both. */
int tbl_mode(int csv, int wide);
/* Display columns of UTF-8 text (a byte that is not UTF-8 counts one column). */
int tbl_width(const char *s);
int tbl_rows(const struct sd_table *t);
void tbl_free(struct sd_table *t);
/* Takes LC_CTYPE from the environment, once. Only what measures or draws non-ASCII text needs
 * it (table widths, Unicode plots, the full-screen interface): loading a locale costs a dozen
 * system calls that a plain audit should not pay. Numbers stay in the C locale. */
void tbl_locale(void);
/* Writes one CSV field, quoted when it must be. */
void tbl_csv_field(FILE *f, const char *s);

#endif
