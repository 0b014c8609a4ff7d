/* audit: weekly fractional sets per muscle of one or more program files, on the curve. */
#include <stddef.h>
#include <stdlib.h>
#include <string.h>

#include "../core/audit.h"
#include "../io/audit_out.h"
#include "../io/pathlist.h"
#include "../io/program_io.h"
#include "../io/table.h"
#include "audit_all.h"
#include "cmd.h"

extern const struct sd_cmd cmd_audit;

struct audit_args {
	int summary, all;
	double cap;
	int wide, by_exercise;
};

static const struct sd_optdef opts[] = {
	{ "summary", OPT_FLAG, 0, 0, offsetof(struct audit_args, summary), NULL, NULL,
	  "one line per program and muscle instead of one report each" },
	{ "all", OPT_FLAG, 0, 0, offsetof(struct audit_args, all), NULL, NULL,
	  "every open block in the database, one line per athlete and muscle\n"
	  "(the athlete's status, the block's planned weeks)" },
	{ "session-cap", OPT_NUM, SD_SESSION_CAP_MIN, SD_SESSION_CAP_MAX,
	  offsetof(struct audit_args, cap), NULL, "N",
	  "warn when a muscle gets more than N fractional sets in one session\n"
	  "(default 10; common practice, no source)" },
	{ "by-exercise", OPT_FLAG, 0, 0, offsetof(struct audit_args, by_exercise), NULL, NULL,
	  "for each muscle, the exercises and sets behind its total" },
	{ "wide", OPT_FLAG, 0, 0, offsetof(struct audit_args, wide), NULL, NULL,
	  "every column: adds the group and +1set intervals (the default\n"
	  "table fits 80 columns; CSV and JSON always have every column)" },
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
	struct sd_covars cov = app_covars(ctx, prog.weeks);
	if (audit_run(&prog, &ctx->lib, &ctx->profile, &cov, &o, &au, e))
		goto out;
	struct sd_audit_info in = { .label = path, .prog = &prog, .prof = &ctx->profile,
				    .audit = &au, .wide = a->wide, .lib = &ctx->lib,
				    .by_exercise = a->by_exercise };
	if (ctx->opt.format == SD_FMT_JSON)
		rc = aout_json_item(ctx->out, &in, first);
	else if (a->summary) {
		rc = aout_sum_rows(so, &in);
	} else if (csv)
		rc = a->by_exercise ? aout_source_rows(csv, &in) : aout_muscle_rows(csv, &in, 1);
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
	struct audit_args a = { .cap = SD_SESSION_CAP };
	struct sd_table *csv = NULL;
	struct sd_sumout so = { ctx->out, ctx->opt.format == SD_FMT_CSV, 0, 0, 7, 0, NULL };
	struct pathlist list = { NULL, 0, NULL };
	char **files;
	int rc = 0, nfiles;

	if ((argc = opt_parse("audit", opts, OPT_N(opts), &a, argc, argv, e)) < 0)
		return -1;
	files = argv + 1;
	nfiles = argc - 1;
	if (a.by_exercise && (a.all || a.summary))
		return sd_usage(e, "audit --by-exercise goes with PROGRAM files, not --summary or --all");
	if (a.all && nfiles)
		return sd_usage(e, "audit --all takes no PROGRAM files (it audits the open blocks)");
	if (a.all)
		return cmd_audit_all(ctx, a.cap, e);
	/* "-" alone: the programs' file names, one a line, from standard input. */
	if (nfiles == 1 && !strcmp(files[0], "-")) {
		if (paths_read(stdin, "standard input", &list, e))
			return -1;
		files = list.v;
		nfiles = list.n;
		if (!nfiles)
			return sd_usage(e, "audit -: standard input named no PROGRAM file");
	}
	if (!nfiles) {
		paths_free(&list);
		return sd_usage(e, "audit needs at least one PROGRAM file (usage: setdose %s)",
				cmd_audit.usage);
	}
	for (int i = 0; i < nfiles; i++) {
		int w = (int)strlen(files[i]);
		if (w > so.wp)
			so.wp = w;
	}
	if (ctx->opt.format == SD_FMT_JSON)
		aout_json_begin(ctx->out);
	else if (a.summary)
		aout_sum_head(&so);
	else if (ctx->opt.format == SD_FMT_CSV &&
		 !(csv = a.by_exercise ? aout_source_table() : aout_muscle_table(1)))
		rc = sd_fail(e, "out of memory");
	for (int i = 0; i < nfiles && !rc; i++)
		rc = one(ctx, &a, files[i], csv, &so, i == 0, e);
	if (!rc) {
		if (ctx->opt.format == SD_FMT_JSON)
			aout_json_end(ctx->out);
		else if (csv)
			tbl_print(csv, ctx->out, 1);
		else
			cmd_print_caution(ctx);
	}
	tbl_free(csv);
	paths_free(&list);
	return rc;
}

const struct sd_cmd cmd_audit = {
	.name = "audit",
	.summary = "weekly fractional sets per muscle of programs, placed on the curve",
	.usage = "audit [--summary | --by-exercise] [--wide] [--session-cap N] PROGRAM...\n"
		 "       setdose audit --all [--session-cap SETS]\n"
		 "  PROGRAM  an INI or CSV program file (see 'man setdose', PROGRAM FILES); '-'\n"
		 "           alone reads the file names, one a line, from standard input",
	.flags = CMD_PROFILE | CMD_LIBRARY,
	.exec = exec_audit,
	.opts = opts,
	.nopts = OPT_N(opts),
};
