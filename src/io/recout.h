/* Listings of stored records (athletes, programs, blocks, tests, responses) in the three
 * output formats from one set of cells: an aligned table or CSV (through io/table.h), or a
 * JSON array of objects keyed by the column names. In JSON a right-aligned (numeric) column's
 * cell is a number when it parses as one and null when empty; left-aligned cells are strings.
 *
 * Ownership: rec_new returns a listing owning its cells; rec_free releases it. */
#ifndef SD_RECOUT_H
#define SD_RECOUT_H

#include <stdio.h>

struct sd_rec;

enum { REC_TABLE, REC_CSV, REC_JSON };   /* the same numbers as SD_FMT_* in cmd/cmd.h */

/* Headers as in tbl_new ('<' marks a left-aligned text column, '~' one the narrow table
 * leaves out); fmt is REC_*. */
struct sd_rec *rec_new(int ncols, const char *const *headers, int fmt);
/* Table output with every column (--wide); CSV and JSON always have every column. */
void rec_wide(struct sd_rec *r, int wide);
/* Starts a row; 0 or -1 (out of memory). */
int rec_row(struct sd_rec *r);
/* Sets a cell of the current row; 0 or -1. */
int rec_set(struct sd_rec *r, int col, const char *fmt, ...) __attribute__((format(printf, 3, 4)));
/* Prints the listing; under `key` in a JSON object when key is not NULL. */
void rec_print(const struct sd_rec *r, FILE *f);
int rec_rows(const struct sd_rec *r);
void rec_free(struct sd_rec *r);
/* Prints a JSON object {"KEY": listing, ...extra} where extra is pairs of key and preformatted
 * JSON values (numbers or quoted strings made with rec_json_string), NULL-terminated. */
void rec_print_json_object(const struct sd_rec *r, const char *key, FILE *f, const char *const *extra);
/* A JSON string literal for s (quoted, escaped) in a malloc'd buffer; NULL on failure. */
char *rec_json_string(const char *s);

#endif
