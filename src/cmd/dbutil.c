#include "dbutil.h"

#include <errno.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>
#include <unistd.h>

#include "../core/text.h"
#include "../io/program_io.h"
#include "../io/recout.h"

_Static_assert((int)REC_TABLE == (int)SD_FMT_TABLE && (int)REC_CSV == (int)SD_FMT_CSV &&
	       (int)REC_JSON == (int)SD_FMT_JSON,
	       "recout formats follow SD_FMT_*");






int dbu_confirm(const char *question, struct sd_err *e)
{
	char line[32];

	if (!isatty(STDIN_FILENO))
		return sd_usage(e, "%s: not asking without a terminal (use --yes)", question);
	fprintf(stderr, "%s [y/N] ", question);
	fflush(stderr);
	if (!fgets(line, sizeof line, stdin))
		return 0;
	return line[0] == 'y' || line[0] == 'Y';
}






int dbu_no_negatives(int argc, char **argv, struct sd_err *e)
{
	for (int i = 1; i < argc && strcmp(argv[i], "--"); i++) {
		char *end;
		if (argv[i][0] != '-' || !argv[i][1])
			continue;
		strtod(argv[i], &end);
		if (end != argv[i] && (!*end || !strcmp(end, "kg") || !strcmp(end, "lb")))
			return sd_usage(e, "bad value '%s': must be positive", argv[i]);
	}
	return 0;
}


int dbu_subcommand(struct sd_ctx *ctx, const struct sd_cmd *cmd, int argc, char **argv,
		   struct sd_err *e)
{
	const char *sub = argc > 1 ? argv[1] : "";

	for (const struct sd_sub *s = cmd->subs; s->name; s++) {
		if (strcmp(sub, s->name))
			continue;
		/* A subcommand without options still refuses one, with the one message. */
		int n = s->nopts ? argc - 1 : opt_parse(s->label, NULL, 0, NULL, argc - 1, argv + 1, e);
		return n < 0 ? -1 : s->fn(ctx, n, argv + 1, e);
	}
	return sd_usage(e, "usage: setdose %s", cmd->usage);
}
