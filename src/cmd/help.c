/* help: the list of commands, or one command's usage. */
#include <string.h>

#include "cmd.h"

static const char *const kinds[] = { "flag", "text", "int", "num", "value" };

static void table_rows(FILE *f, const char *cmd, const char *sub, const struct sd_optdef *d,
		       int n)
{
	if (!n)
		fprintf(f, "%s\t%s\t-\t-\n", cmd, sub);
	for (int i = 0; i < n; i++)
		fprintf(f, "%s\t%s\t--%s\t%s\n", cmd, sub, d[i].name,
			d[i].arg ? kinds[d[i].kind] : "flag");
}

/* `help --table`: every command, subcommand and option, one per line, tab-separated: command,
 * subcommand (or -), option (or -), and what it takes (flag, text, int, num, value). The
 * option tests and shell completion read it. */
static void print_table(FILE *f)
{
	for (int i = 0; sd_commands[i]; i++) {
		const struct sd_cmd *c = sd_commands[i];
		if (!c->subs)
			table_rows(f, c->name, "-", c->opts, c->nopts);
		for (const struct sd_sub *s = c->subs; s && s->name; s++)
			table_rows(f, c->name, s->name, s->opts, s->nopts);
	}
}

static const struct sd_optdef opts[] = {
	{ "table", OPT_FLAG, 0, 0, 0, NULL, NULL,
	  "every command, subcommand and option, tab-separated (for scripts)" },
};

static int exec_help(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	int table = 0;

	if ((argc = opt_parse("help", opts, OPT_N(opts), &table, argc, argv, e)) < 0)
		return -1;
	if (table) {
		print_table(ctx->out);
		return 0;
	}
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
	/* The option lines come from the same tables the parser reads (opt.h). */
	if (c->nopts) {
		fprintf(ctx->out, "\noptions:\n");
		opt_help(ctx->out, c->opts, c->nopts);
	}
	for (const struct sd_sub *s = c->subs; s && s->name; s++)
		if (s->nopts) {
			fprintf(ctx->out, "\noptions of '%s':\n", s->label);
			opt_help(ctx->out, s->opts, s->nopts);
		}
	fprintf(ctx->out, "\nglobal options ('setdose --help') go anywhere on the line.\n");
	return 0;
}

const struct sd_cmd cmd_help = {
	.name = "help",
	.summary = "list the commands, or show one command's usage",
	.usage = "help [COMMAND] | help --table",
	.flags = 0,
	.exec = exec_help,
	.opts = opts,
	.nopts = OPT_N(opts),
};
