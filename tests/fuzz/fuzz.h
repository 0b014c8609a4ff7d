/* Shared by the libFuzzer harnesses: the bundled exercise library, and a scratch file for the
 * readers that take a path. FUZZ_DATADIR (the profiles/ folder) is set by the Makefile. */
#ifndef SD_FUZZ_H
#define SD_FUZZ_H

#include <stddef.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "core/library.h"
#include "io/library_io.h"

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size);
/* Optional: the harnesses that need set-up define it. */
int LLVMFuzzerInitialize(int *argc, char ***argv);

/* The bundled library, loaded once (a harness that cannot load it stops at once). */
static inline struct sd_library *fuzz_library(void)
{
	static struct sd_library lib;
	static int loaded;
	struct sd_err e = { 0 };
	if (!loaded && library_load_file(FUZZ_DATADIR "/exercises.ini", &lib, &e)) {
		fprintf(stderr, "fuzz: %s\n", e.msg);
		abort();
	}
	loaded = 1;
	return &lib;
}

/* Writes the input to a file of this process on a tmpfs and returns its path. */
static inline const char *fuzz_file(const uint8_t *data, size_t size, const char *ext)
{
	static char path[128];
	FILE *f;
	snprintf(path, sizeof path, "/dev/shm/setdose-fuzz-%ld%s", (long)getpid(), ext);
	if (!(f = fopen(path, "wb")) || fwrite(data, 1, size, f) != size || fclose(f))
		abort();
	return path;
}

#endif
