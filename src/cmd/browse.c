/* browse: the full-screen interface (also what `setdose` alone opens on a terminal). */
#include "../tui/tui.h"
#include "cmd.h"

extern const struct sd_cmd cmd_browse;

static int exec_browse(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	(void)argv;
	if (argc > 1)
		return sd_usage(e, "usage: setdose %s", cmd_browse.usage);
	return tui_run(ctx, e);
}

const struct sd_cmd cmd_browse = {
	.name = "browse",
	.summary = "the full-screen interface: athletes, blocks, doses, the curve, tests",
	.usage = "browse\n"
		 "  opens the full-screen interface on the terminal (also what 'setdose' alone does);\n"
		 "  press ? inside it for every key. --level, --swc, --max-rir, --units and\n"
		 "  --no-color apply as in the other commands; --status and --weeks set the context\n"
		 "  of templates (a block takes its athlete's status and its own length)",
	.flags = CMD_PROFILE | CMD_LIBRARY | CMD_DB,
	.exec = exec_browse,
};
