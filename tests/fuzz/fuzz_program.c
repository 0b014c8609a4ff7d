/* Program files through the parser and the audit, as `setdose audit` reads them: INI, or CSV
 * when built with FUZZ_CSV=1 (the Makefile builds both). */
#include "fuzz.h"

#include "core/audit.h"
#include "core/curve.h"
#include "io/profile_io.h"
#include "io/program_io.h"

static struct sd_profile prof;

int LLVMFuzzerInitialize(int *argc, char ***argv)
{
	struct sd_err e = { 0 };
	(void)argc;
	(void)argv;
	fuzz_library();
	if (profile_load(FUZZ_DATADIR "/strength.ini", &prof, &e))
		abort();
	return 0;
}

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size)
{
	struct sd_program p;
	struct sd_audit au;
	struct sd_err e = { 0 };
	struct sd_audit_opts o = { 0.95, 4, SD_SESSION_CAP };

	if (program_parse(FUZZ_CSV ? "fuzz.csv" : "fuzz.ini", (const char *)data, size, FUZZ_CSV, fuzz_library(), &p, &e))
		return 0;
	struct sd_covars cov = { p.weeks > 0 ? p.weeks : 10, 0 };
	if (!audit_run(&p, fuzz_library(), &prof, &cov, &o, &au, &e))
		audit_free(&au);
	prog_free(&p);
	return 0;
}
