/* A PROGRAM argument of compare and allot: a program file, or the name of a template stored
 * in the database when no file has that name. The database is opened only then, and only
 * when it already exists, so comparing files never creates one. */
#ifndef SD_PROGARG_H
#define SD_PROGARG_H

#include "../core/program.h"
#include "ctx.h"

struct progarg {
	struct sd_db *db;          /* opened here when ctx->db was not; closed by progarg_close */
};

/* Loads arg into p (freed with prog_free). */
int progarg_load(struct sd_ctx *ctx, struct progarg *pa, const char *arg, struct sd_program *p,
		 struct sd_err *e);
void progarg_close(struct progarg *pa);

#endif
