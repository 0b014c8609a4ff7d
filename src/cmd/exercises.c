/* exercises: the exercise library, optionally filtered. */
#include <getopt.h>
#include <stdlib.h>
#include <string.h>
#include <strings.h>

#include "../io/table.h"
#include "cmd.h"

extern const struct sd_cmd cmd_exercises;

static void mset_text(sd_mset s, char *buf, size_t n)
{
	size_t used = 0;
	buf[0] = '\0';
	for (int m = 0; m < SD_NMUSCLES && used < n; m++)
		if (s >> m & 1)
			used += (size_t)snprintf(buf + used, n - used, "%s%s", used ? " " : "", muscle_name(m));
}

static int matches(const struct sd_exercise *x, const char *pat)
{
	char key[SD_NAME_MAX], b[SD_NAME_MAX];
	if (!pat)
		return 1;
	lib_norm(pat, key, sizeof key);
	lib_norm(x->name, b, sizeof b);
	if (strstr(b, key))
		return 1;
	for (int j = 0; j < x->naliases; j++) {
		lib_norm(x->aliases[j], b, sizeof b);
		if (strstr(b, key))
			return 1;
	}
	return 0;
}

static int exec_exercises(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	static const struct option longopts[] = {
		{ "muscles", no_argument, NULL, 'm' },
		{ "muscle", required_argument, NULL, 'M' },
		{ NULL, 0, NULL, 0 },
	};
	static const char *const heads[] = { "<exercise", "<kind", "<direct", "<indirect", "<aliases" };
	int c, list_muscles = 0, only = -1;
	const char *pat = NULL;
	struct sd_table *t;

	optind = 0;
	while ((c = getopt_long(argc, argv, "+", longopts, NULL)) != -1) {
		if (c == 'm')
			list_muscles = 1;
		else if (c == 'M') {
			if ((only = muscle_find(optarg)) < 0)
				return sd_usage(e, "unknown muscle '%s' (see 'setdose exercises --muscles')", optarg);
		} else
			return sd_usage(e, "usage: setdose %s", cmd_exercises.usage);
	}
	if (optind < argc)
		pat = argv[optind++];
	if (optind < argc)
		return sd_usage(e, "exercises takes one PATTERN at most");
	if (list_muscles) {
		for (int m = 0; m < SD_NMUSCLES; m++)
			fprintf(ctx->out, "%s\n", muscle_name(m));
		return 0;
	}
	if (!(t = tbl_new(5, heads)))
		return sd_fail(e, "out of memory");
	for (int i = 0; i < ctx->lib.n; i++) {
		const struct sd_exercise *x = &ctx->lib.ex[i];
		char dir[256], ind[256], al[512];
		size_t used = 0;
		if (!matches(x, pat) || (only >= 0 && !((x->direct | x->indirect) >> only & 1)))
			continue;
		mset_text(x->direct, dir, sizeof dir);
		mset_text(x->indirect, ind, sizeof ind);
		al[0] = '\0';
		for (int j = 0; j < x->naliases && used < sizeof al; j++)
			used += (size_t)snprintf(al + used, sizeof al - used, "%s%s", j ? ", " : "", x->aliases[j]);
		tbl_row(t);
		tbl_set(t, 0, "%s", x->name);
		tbl_set(t, 1, "%s", x->kind);
		tbl_set(t, 2, "%s", dir);
		tbl_set(t, 3, "%s", ind);
		tbl_set(t, 4, "%s", al);
	}
	if (!tbl_rows(t) && pat) {
		tbl_free(t);
		return sd_fail(e, "no exercise matches '%s'", pat);
	}
	tbl_print(t, ctx->out, ctx->opt.format == SD_FMT_CSV);
	tbl_free(t);
	return 0;
}

const struct sd_cmd cmd_exercises = {
	.name = "exercises",
	.summary = "list the exercise library (direct and indirect muscles)",
	.usage = "exercises [PATTERN] [--muscle MUSCLE] [--muscles]\n"
		 "  PATTERN          show exercises whose name or alias contains it\n"
		 "  --muscle MUSCLE  only exercises that train MUSCLE\n"
		 "  --muscles        list the muscle groups",
	.flags = CMD_LIBRARY,
	.exec = exec_exercises,
};
