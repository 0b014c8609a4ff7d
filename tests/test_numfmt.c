/* nf_fixed and nf_pad against printf itself (glibc's exact "%.*f", the reference) over a
 * sweep of millions of values: random magnitudes, values at and around rounding ties, signs,
 * negative zero and the extremes. Any difference fails with the value. */
#include "testutil.h"

#include <stdlib.h>
#include <string.h>

#include "io/numfmt.h"

static void same(double v, int dec)
{
	char want[64], got[64], wpad[64], gpad[64];
	snprintf(want, sizeof want, "%.*f", dec, v);
	nf_fixed(got, v, dec);
	if (strcmp(want, got))
		fail_msg("%.17g with %d decimals: printf '%s', nf_fixed '%s'", v, dec, want, got);
	snprintf(wpad, sizeof wpad, "%*.*f", 10, dec, v);
	nf_pad(gpad, v, 10, dec);
	if (strcmp(wpad, gpad))
		fail_msg("%.17g padded: printf '%s', nf_pad '%s'", v, wpad, gpad);
}

static void sweep(void **state)
{
	unsigned long long x = 20261203;
	(void)state;
	/* 3 million pseudo-random values over 12 decades, both signs, every decimal count. */
	for (int i = 0; i < 3000000; i++) {
		x = x * 6364136223846793005ULL + 1442695040888963407ULL;
		double m = (double)(x >> 11) / 9007199254740992.0;   /* [0, 1) */
		int decade = (int)((x >> 3) % 12) - 4;
		double v = m * pow(10, decade) * ((x & 1) ? -1 : 1);
		same(v, (int)((x >> 7) % 7));
	}
	/* Ties and their neighbours: k / 2 / 10^dec, one ulp each way. */
	for (int dec = 0; dec <= 6; dec++)
		for (int k = -20001; k <= 20001; k += 2) {
			double t = k / 2.0 / pow(10, dec);
			same(t, dec);
			same(nextafter(t, 1e9), dec);
			same(nextafter(t, -1e9), dec);
		}
	/* What audits print: percents and sets to 1-4 decimals. */
	for (int k = 0; k <= 400000; k++) {
		same(k / 1000.0 - 200, 1);
		same(k / 7.0, 3);
		same(k * 0.01, 2);
		same(-k / 13.0, 4);
	}
	same(0.0, 2);
	same(-0.0, 2);
	same(-0.004, 2);
	same(0.5, 0);
	same(1.5, 0);
	same(2.5, 0);
	same(1e11 + 0.25, 1);
	same(1e13, 2);
	same(NAN, 2);
	same(INFINITY, 1);
	same(-INFINITY, 1);
}

int main(void)
{
	const struct CMUnitTest t[] = { cmocka_unit_test(sweep) };
	return cmocka_run_group_tests(t, NULL, NULL);
}
