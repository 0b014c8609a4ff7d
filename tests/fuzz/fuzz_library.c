/* Exercise library files, added on top of the bundled one as --exercises FILE is. */
#include "fuzz.h"

int LLVMFuzzerInitialize(int *argc, char ***argv)
{
	(void)argc;
	(void)argv;
	fuzz_library();
	return 0;
}

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size)
{
	struct sd_library lib;
	struct sd_err e = { 0 };

	memset(&lib, 0, sizeof lib);
	/* A fresh copy each time would cost more than the parse: load the bundled file and
	 * the input into a library of this run. */
	if (!library_load_file(FUZZ_DATADIR "/exercises.ini", &lib, &e))
		library_load_file(fuzz_file(data, size, ".ini"), &lib, &e);
	lib_free(&lib);
	return 0;
}
