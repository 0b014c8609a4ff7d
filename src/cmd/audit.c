/* audit: weekly fractional sets per muscle of one or more program files, on the curve. */
#include <getopt.h>
#include <stdlib.h>
#include <string.h>

#include "../core/audit.h"
#include "../io/audit_out.h"
#include "../io/program_io.h"
#include "../io/table.h"
#include "audit_all.h"
#include "cmd.h"

extern const struct sd_cmd cmd_audit;

struct audit_args {
	int summary;
	double cap;
};

static int one(struct sd_ctx *ctx, const struct audit_args *a, const char *path,
	       struct sd_table *csv, const struct sd_sumout *so, int first, struct sd_err *e)
{
	struct sd_program prog;
	struct sd_audit au;
	struct sd_audit_opts o = { ctx->opt.level, ctx->opt.max_rir, a->cap };
	int rc = -1;

	if (program_load(path, &ctx->lib, &prog, e))
		return -1;
	struct sd_covars cov = cmd_covars(ctx, prog.weeks);
	if (audit_run(&prog, &ctx->lib, &ctx->profile, &cov, &o, &au, e))
		goto out;
	struct sd_audit_info in = { path, &prog, &ctx->profile, &au, NULL };
	if (ctx->opt.format == SD_FMT_JSON)
		rc = aout_json_item(ctx->out, &in, first);
	else if (a->summary) {
		aout_sum_rows(so, &in);
		rc = 0;
	} else if (csv)
		rc = aout_muscle_rows(csv, &in, 1);
	else {
		if (!first)
			fputc('\n', ctx->out);
		aout_report(ctx->out, &in, ctx->opt.color);
		rc = 0;
	}
	if (rc)
		sd_fail(e, "out of memory");
	audit_free(&au);
out:
	prog_free(&prog);
	return rc;
}

static int exec_audit(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	static const struct option longopts[] = {
		{ "summary", no_argument, NULL, 's' },
		{ "all", no_argument, NULL, 'a' },
		{ "session-cap", required_argument, NULL, 'c' },
		{ NULL, 0, NULL, 0 },
	};
	struct audit_args a = { 0, SD_SESSION_CAP };
	struct sd_table *csv = NULL;
	struct sd_sumout so = { ctx->out, ctx->opt.format == SD_FMT_CSV, 0, 0, 7, 0, NULL };
	int c, rc = 0, all = 0;
	char *end;

	optind = 0;
	while ((c = getopt_long(argc, argv, "+s", longopts, NULL)) != -1) {
		switch (c) {
		case 's':
			a.summary = 1;
			break;
		case 'a':
			all = 1;
			break;
		case 'c':
			a.cap = strtod(optarg, &end);
			if (end == optarg || *end || !(a.cap > 0 && a.cap <= 100))
				return sd_usage(e, "--session-cap wants a number from 0 to 100, not '%s'", optarg);
			break;
		default:
			return sd_usage(e, "usage: setdose %s", cmd_audit.usage);
		}
	}
	if (all && optind < argc)
		return sd_usage(e, "audit --all takes no PROGRAM files (it audits the open blocks)");
	if (all)
		return cmd_audit_all(ctx, a.cap, e);
	if (optind >= argc)
		return sd_usage(e, "audit needs at least one PROGRAM file (usage: setdose %s)",
				cmd_audit.usage);
	for (int i = optind; i < argc; i++) {
		int w = (int)strlen(argv[i]);
		if (w > so.wp)
			so.wp = w;
	}
	if (ctx->opt.format == SD_FMT_JSON)
		aout_json_begin(ctx->out);
	else if (a.summary)
		aout_sum_head(&so);
	else if (ctx->opt.format == SD_FMT_CSV && !(csv = aout_muscle_table(1)))
		return sd_fail(e, "out of memory");
	for (int i = optind; i < argc && !rc; i++)
		rc = one(ctx, &a, argv[i], csv, &so, i == optind, e);
	if (!rc) {
		if (ctx->opt.format == SD_FMT_JSON)
			aout_json_end(ctx->out);
		else if (csv)
			tbl_print(csv, ctx->out, 1);
		else
			cmd_print_caution(ctx);
	}
	tbl_free(csv);
	return rc;
}

const struct sd_cmd cmd_audit = {
	.name = "audit",
	.summary = "weekly fractional sets per muscle of programs, placed on the curve",
	.usage = "audit [--summary] [--session-cap SETS] PROGRAM...\n"
		 "       setdose audit --all [--session-cap SETS]\n"
		 "  PROGRAM         an INI or CSV program file (see 'man setdose', PROGRAM FILES)\n"
		 "  --summary       one line per program and muscle instead of one report each\n"
		 "  --all           every open block in the database, one line per athlete and\n"
		 "                  muscle (the athlete's status, the block's planned weeks)\n"
		 "  --session-cap N warn when a muscle gets more than N fractional sets in one\n"
		 "                  session (default 10; common practice, no source)",
	.flags = CMD_PROFILE | CMD_LIBRARY,
	.exec = exec_audit,
};
