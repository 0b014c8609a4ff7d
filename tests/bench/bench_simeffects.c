/* Writes a simulated (invented) effect-size table for the fit benchmarks, in the layout of
 * tests/data/ref/make_sim.R (same model and parameters) but with its own generator so that
 * the table is the same on every machine without R: splitmix64 and Box-Muller.
 * The numbers are invented, for timing the fitter only, never evidence.
 * usage: bench_simeffects SEED STUDIES  >effects.csv */
#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>

static uint64_t state;

static uint64_t next(void)   /* splitmix64 (Steele, Lea & Flood 2014) */
{
	uint64_t z = (state += 0x9e3779b97f4a7c15ULL);
	z = (z ^ (z >> 30)) * 0xbf58476d1ce4e5b9ULL;
	z = (z ^ (z >> 27)) * 0x94d049bb133111ebULL;
	return z ^ (z >> 31);
}

static double unif(void) { return ((next() >> 11) + 0.5) / 9007199254740992.0; }
static int pick(int lo, int hi) { return lo + (int)(unif() * (hi - lo + 1)); }
static double normal(double sd) { return sd * sqrt(-2 * log(unif())) * cos(2 * M_PI * unif()); }

int main(int argc, char **argv)
{
	static const int dose[] = { 0, 1, 2, 3, 4, 5, 6, 8, 9, 10, 12, 14, 16, 18, 20, 24, 28, 32 };
	const int nd = (int)(sizeof dose / sizeof dose[0]);
	int eid = 0;

	if (argc != 3 || atoi(argv[2]) < 1) {
		fprintf(stderr, "usage: bench_simeffects SEED STUDIES\n");
		return 2;
	}
	state = strtoull(argv[1], NULL, 10);
	printf("study,effect,sets,trained,weeks,yi,vi\n");
	for (int s = 1; s <= atoi(argv[2]); s++) {
		int trained = unif() < 0.5, weeks = pick(6, 16), narm = pick(2, 4), used[32] = {0};
		double u0 = normal(0.04), u1 = normal(0.06);
		for (int a = 0; a < narm; a++) {      /* distinct doses, written in rising order */
			int j;
			do
				j = pick(0, nd - 1);
			while (used[j]);
			used[j] = 1;
		}
		for (int j = 0; j < nd; j++) {
			if (!used[j])
				continue;
			double x = dose[j], n = pick(8, 20);
			double mu = 0.26 - 0.22 / (x + 1) + 0.008 * (weeks - 10) - 0.05 * trained + u0 +
				    u1 / (x + 1);
			double vi = 0.12 * 0.12 / n * 2 * (1 - 0.8) + 0.0004;
			double yi = mu + normal(0.03) + normal(sqrt(vi));
			printf("%d,%d,%d,%d,%d,%.6f,%.8g\n", s, ++eid, dose[j], trained, weeks, yi, vi);
		}
	}
	return 0;
}
