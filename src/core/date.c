#include "date.h"

#include <stdio.h>
#include <string.h>

/* Days from civil and back: the era-based algorithms of Howard Hinnant, "chrono-Compatible
 * Low-Level Date Algorithms" (2013); exact for every proleptic Gregorian date. */
long date_days(int y, int m, int d)
{
	long yy = y - (m <= 2);
	long era = (yy >= 0 ? yy : yy - 399) / 400;
	long yoe = yy - era * 400;
	long doy = (153 * (m + (m > 2 ? -3 : 9)) + 2) / 5 + d - 1;
	long doe = yoe * 365 + yoe / 4 - yoe / 100 + doy;
	return era * 146097 + doe - 719468;
}

static void civil(long z, int *y, int *m, int *d)
{
	long era, doe, yoe, doy, mp;

	z += 719468;
	era = (z >= 0 ? z : z - 146096) / 146097;
	doe = z - era * 146097;
	yoe = (doe - doe / 1460 + doe / 36524 - doe / 146096) / 365;
	doy = doe - (365 * yoe + yoe / 4 - yoe / 100);
	mp = (5 * doy + 2) / 153;
	*d = (int)(doy - (153 * mp + 2) / 5 + 1);
	*m = (int)(mp < 10 ? mp + 3 : mp - 9);
	*y = (int)(yoe + era * 400 + (*m <= 2));
}

int date_valid(int y, int m, int d)
{
	static const int mdays[12] = { 31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31 };
	int leap = (y % 4 == 0 && y % 100 != 0) || y % 400 == 0;

	if (m < 1 || m > 12 || d < 1)
		return 0;
	return d <= mdays[m - 1] + (m == 2 && leap);
}

static int digits(const char *s, int n)
{
	int v = 0;

	for (int i = 0; i < n; i++) {
		if (s[i] < '0' || s[i] > '9')
			return -1;
		v = v * 10 + (s[i] - '0');
	}
	return v;
}

int date_parse(const char *s, long *days, struct sd_err *e)
{
	int y, m, d;

	if (strlen(s) != 10 || s[4] != '-' || s[7] != '-' ||
	    (y = digits(s, 4)) < 0 || (m = digits(s + 5, 2)) < 0 || (d = digits(s + 8, 2)) < 0)
		return sd_usage(e, "bad date '%s' (expected YYYY-MM-DD)", s);
	if (!date_valid(y, m, d))
		return sd_usage(e, "bad date '%s': no such day", s);
	if (y < 1900 || y > 2999)
		return sd_usage(e, "bad date '%s': year out of range 1900-2999", s);
	*days = date_days(y, m, d);
	return 0;
}

void date_format(long days, char *buf)
{
	int y, m, d;

	civil(days, &y, &m, &d);
	snprintf(buf, DATE_LEN, "%04d-%02d-%02d", y % 10000, m, d);
}
