#include "numfmt.h"

#include <math.h>
#include <stdio.h>
#include <string.h>

static const double pow10tab[] = { 1, 10, 100, 1e3, 1e4, 1e5, 1e6 };

char *nf_fixed(char *p, double v, int dec)
{
	double s, r, frac;
	unsigned long long u, div;
	char digits[24];
	int n = 0;

	if (dec < 0 || dec > 6 || !isfinite(v) || fabs(v) >= 1e12)
		return p + snprintf(p, 32, "%.*f", dec, v);
	s = fabs(v) * pow10tab[dec];
	frac = s - floor(s);
	/* Near a tie the product's own rounding could decide differently from printf, which
	 * rounds the exact binary value (half to even): let printf decide. */
	if (fabs(frac - 0.5) < 1e-6)
		return p + snprintf(p, 32, "%.*f", dec, v);
	r = floor(s + 0.5);
	u = (unsigned long long)r;
	if (signbit(v))
		*p++ = '-';
	div = (unsigned long long)pow10tab[dec];
	/* The integer part, then the decimals with their leading zeros. */
	unsigned long long ip = u / div, fp = u % div;
	do {
		digits[n++] = (char)('0' + ip % 10);
		ip /= 10;
	} while (ip);
	while (n)
		*p++ = digits[--n];
	if (dec) {
		*p++ = '.';
		for (int k = dec - 1; k >= 0; k--) {
			p[k] = (char)('0' + fp % 10);
			fp /= 10;
		}
		p += dec;
	}
	*p = '\0';
	return p;
}

char *nf_pad(char *p, double v, int width, int dec)
{
	char tmp[40];
	char *end = nf_fixed(tmp, v, dec);
	int len = (int)(end - tmp);

	for (; len < width; width--)
		*p++ = ' ';
	memcpy(p, tmp, (size_t)len + 1);
	return p + len;
}
