/* Training log files (log import): logio_read with the bundled library, every athlete name
 * accepted (as a roster of one would), then the identity ordinals and a weekly aggregation. */
#include "fuzz.h"

#include "core/date.h"
#include "core/tlog.h"
#include "io/log_io.h"

int LLVMFuzzerInitialize(int *argc, char ***argv)
{
	struct sd_err e = { 0 };
	(void)argc;
	(void)argv;
	if (lib_index(fuzz_library(), &e))
		abort();
	return 0;
}

static int any_athlete(void *arg, const char *name, long long *id, int *lb, struct sd_err *e)
{
	(void)arg;
	(void)e;
	*id = name[0] ? 2 : 1;
	*lb = name[0] == 'L';
	return 0;
}

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size)
{
	struct logio_src src = { fuzz_library(), 0, any_athlete, NULL, 1, 1, 0 };
	struct logio_rows rows = { 0 };
	struct sd_err e = { 0 };

	/* Dates up to the end of 2030 are "not after today". */
	date_parse("2030-12-31", &src.today, NULL);
	if (!logio_read(fuzz_file(data, size, ".csv"), &src, &rows, &e))
		tlog_ordinals(rows.v, rows.n, &e);
	logio_free(&rows);
	return 0;
}
