/* exercises: the exercise library, optionally filtered. */
#include <stddef.h>
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

struct ex_opts {
	int list_muscles, only;
};

static int opt_muscle(void *dst, const struct sd_optdef *d, const char *v, struct sd_err *e)
{
	(void)d;
	if ((((struct ex_opts *)dst)->only = muscle_find(v)) < 0)
		return sd_usage(e, "unknown muscle '%s' (see 'setdose exercises --muscles')", v);
	return 0;
}

static const struct sd_optdef opts[] = {
	{ "muscles", OPT_FLAG, 0, 0, offsetof(struct ex_opts, list_muscles), NULL, NULL,
	  "list the muscle groups" },
	{ "muscle", OPT_CALL, 0, 0, 0, opt_muscle, "NAME", "only the exercises that train NAME" },
};

static int exec_exercises(struct sd_ctx *ctx, int argc, char **argv, struct sd_err *e)
{
	static const char *const heads[] = { "<exercise", "<kind", "<direct", "<indirect", "<aliases" };
	struct ex_opts o = { 0, -1 };
	int list_muscles, only;
	const char *pat = NULL;
	struct sd_table *t;

	if ((argc = opt_parse("exercises", opts, OPT_N(opts), &o, argc, argv, e)) < 0)
		return -1;
	list_muscles = o.list_muscles;
	only = o.only;
	if (argc > 2)
		return sd_usage(e, "exercises takes one PATTERN at most");
	if (argc == 2)
		pat = argv[1];
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
		 "  PATTERN          show exercises whose name or alias contains it",
	.flags = CMD_LIBRARY,
	.exec = exec_exercises,
	.opts = opts,
	.nopts = OPT_N(opts),
};
