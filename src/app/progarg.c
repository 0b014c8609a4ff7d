#include "progarg.h"

#include <string.h>
#include <strings.h>
#include <unistd.h>

#include "../io/program_io.h"
#include "../store/db.h"
#include "records.h"

/* Something typed as a path (a folder part or a program file's extension) is never looked
 * up in the store, so a mistyped file name gets the file's own error. */
static int looks_like_path(const char *s)
{
	size_t n = strlen(s);
	return strchr(s, '/') || (n > 4 && (!strcasecmp(s + n - 4, ".ini") ||
					    !strcasecmp(s + n - 4, ".csv")));
}

int progarg_load(struct sd_ctx *ctx, struct progarg *pa, const char *arg, struct sd_program *p,
		 struct sd_err *e)
{
	struct sd_db *db = ctx->db ? ctx->db : pa->db;
	struct db_program dp;
	char path[1200];
	int rc;

	memset(p, 0, sizeof *p);
	if (access(arg, F_OK) == 0 || looks_like_path(arg))
		return program_load(arg, &ctx->lib, p, e);
	if (!db) {
		if (app_db_path(ctx, path, sizeof path, e))
			return -1;
		if (access(path, F_OK) != 0)
			return sd_fail(e, "cannot read program '%s': no such file, and no database "
				       "holding stored templates at '%s'", arg, path);
		if (db_open(path, &pa->db, e))
			return -1;
		db = pa->db;
	}
	if (app_program_get(db, arg, &dp, e)) {
		if (e && !strncmp(e->msg, "unknown program", 15))
			sd_fail(e, "cannot read program '%s': no such file or stored template", arg);
		return -1;
	}
	rc = program_parse(dp.name, dp.source, dp.len, dp.is_csv, &ctx->lib, p, e);
	db_program_free(&dp);
	return rc;
}

void progarg_close(struct progarg *pa)
{
	db_close(pa->db);
	pa->db = NULL;
}
