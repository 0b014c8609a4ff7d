/* Effect-size tables: read, turned into model data (every numeric field bounded), and, when
 * small, fitted by REML as `setdose fit` does. */
#include "fuzz.h"

#include "core/metareg.h"
#include "io/effects_io.h"

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size)
{
	struct ef_table t;
	struct ef_model m;
	struct ef_spec s;
	struct mr_fit f;
	struct sd_err e = { 0 };

	if (eft_read(fuzz_file(data, size, ".csv"), &t, &e))
		return 0;
	memset(&s, 0, sizeof s);
	s.form = SD_FORM_RECIPROCAL;
	if (!ef_model_build(&t, &s, &m, &e)) {
		/* The fit is the costly part; small tables keep the fuzzer fast. */
		if (m.d.n <= 40) {
			struct mr_opts o = { MR_REML, 0.95, 0, 0, NULL };
			mr_fit(&m.d, &o, &f, &e);
		}
		ef_model_free(&m);
	}
	eft_free(&t);
	return 0;
}
