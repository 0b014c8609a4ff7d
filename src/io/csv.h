/* A small RFC 4180 CSV reader: quoted fields, doubled quotes, CRLF, blank lines skipped.
 *
 * Ownership: csv_open returns a reader owning its buffers; each csv_next replaces the
 * previous record's fields (pointers valid until the next call or csv_close). */
#ifndef SD_CSV_H
#define SD_CSV_H

#include <stddef.h>

#include "../core/err.h"

struct sd_csv;

/* Opens path ("-" for standard input). */
struct sd_csv *csv_open(const char *path, struct sd_err *e);
/* Reads from text held in memory; `label` names it in messages. */
struct sd_csv *csv_open_mem(const char *label, const char *text, size_t len, struct sd_err *e);
/* Sets the field separator (',' by default). */
void csv_set_delim(struct sd_csv *c, char delim);
/* Numbers lines from `line` (text read from the middle of a file). */
void csv_set_first_line(struct sd_csv *c, int line);
/* Makes csv_next skip lines that start with '#' (comment lines). */
void csv_set_comments(struct sd_csv *c, int on);
/* The separator a header line uses: the most frequent of ',', ';' and tab outside quotes, ','
 * on a tie or when there is none. */
char csv_detect(const char *line, size_t len);
/* Reads the next record: 1 with fields and n set, 0 at end of file, -1 on error (e filled
 * with "FILE line N: problem"). */
int csv_next(struct sd_csv *c, char ***fields, int *n, struct sd_err *e);
/* Line number where the last record returned started. */
int csv_line(const struct sd_csv *c);
const char *csv_path(const struct sd_csv *c);
void csv_close(struct sd_csv *c);

/* Parses a whole field as a finite double / int; 0 on success, -1 otherwise. */
int csv_double(const char *s, double *out);
int csv_int(const char *s, int *out);

#endif
