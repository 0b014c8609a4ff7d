/* Dose-response profiles: loaded and validated, then the curve, its bands, the plateau and
 * the returns grid evaluated over the profile's evidence range, as `curve` and `returns` do. */
#include "fuzz.h"

#include "core/curve.h"
#include "io/profile_io.h"

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size)
{
	struct sd_profile p;
	struct sd_err e = { 0 };
	struct sd_point pt;

	if (profile_load(fuzz_file(data, size, ".ini"), &p, &e))
		return 0;
	for (int trained = 0; trained <= 1; trained++) {
		struct sd_covars cov = { 10, trained };
		double plateau = curve_plateau(&p, &cov, 1.0);
		(void)plateau;
		for (int i = 0; i <= 8; i++)
			curve_eval(&p, &cov, p.dose_min + (p.dose_max - p.dose_min) * i / 8, 0.95, &pt);
	}
	return 0;
}
