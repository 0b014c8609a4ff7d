/* Calendar dates as ISO YYYY-MM-DD text and as day numbers (days since 1970-01-01), in the
 * proleptic Gregorian calendar. Only real dates are accepted (no 2023-02-29). */
#ifndef SD_DATE_H
#define SD_DATE_H

#include "err.h"

#define DATE_LEN 11   /* "YYYY-MM-DD" and its NUL */

/* Parses a date between 1900-01-01 and 2999-12-31 into a day number. */
int date_parse(const char *s, long *days, struct sd_err *e);
/* Writes the day number as YYYY-MM-DD into buf (at least DATE_LEN bytes). */
void date_format(long days, char *buf);
/* Day number of year/month/day (month 1..12, day 1..31; no range check). */
long date_days(int y, int m, int d);
/* 1 for a real calendar date. */
int date_valid(int y, int m, int d);

#endif
