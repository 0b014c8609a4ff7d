/* help: the list of commands, or one command's usage. */
#include <string.h>

#include "cmd.h"

static int exec_help(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	if (argc < 2) {
		fprintf(ctx->out, "usage: setdose [global options] COMMAND [ARGS]\n\ncommands:\n");
		for (int i = 0; sd_commands[i]; i++)
			fprintf(ctx->out, "  %-10s %s\n", sd_commands[i]->name, sd_commands[i]->summary);
		fprintf(ctx->out, "\n'setdose help COMMAND' for one command; 'setdose --help' for the "
			"global options; 'man setdose' for everything.\n");
		return 0;
	}
	const struct sd_cmd *c = cmd_find(argv[1], e);
	if (!c)
		return -1;
	fprintf(ctx->out, "setdose %s\n\n%s\n", c->usage, c->summary);
	return 0;
}

const struct sd_cmd cmd_help = {
	.name = "help",
	.summary = "list the commands, or show one command's usage",
	.usage = "help [COMMAND]",
	.flags = 0,
	.exec = exec_help,
};
