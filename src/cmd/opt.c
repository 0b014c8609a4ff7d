#include "opt.h"

#include <stdlib.h>
#include <string.h>

#include "../app/parse.h"

#define OPT_HELP_WIDTH 80   /* `setdose help` fits 80 columns */

/* "-5", "-2.5kg": a negative number is an argument (the command then says what is wrong
 * with it), never an option. */
static int is_number(const char *w)
{
	char *end;
	strtod(w, &end);
	return end != w && (!*end || !strcmp(end, "kg") || !strcmp(end, "lb"));
}

int opt_unknown(const char *cmd, const char *word, struct sd_err *e)
{
	return sd_usage(e, "unknown option '%s' for '%s' (see 'setdose help %s')", word, cmd, cmd);
}

int opt_find(const char *cmd, const struct sd_optdef *defs, int n, const char *word,
	     const char **value, struct sd_err *e)
{
	const char *name = word + 2, *eq;
	size_t len;
	int hit = -1, hits = 0;

	*value = NULL;
	if (strncmp(word, "--", 2) || !*name)
		return -1;
	eq = strchr(name, '=');
	len = eq ? (size_t)(eq - name) : strlen(name);
	if (eq)
		*value = eq + 1;
	for (int i = 0; i < n; i++) {
		if (strncmp(defs[i].name, name, len))
			continue;
		if (strlen(defs[i].name) == len)
			return i;   /* an exact name wins over longer ones it prefixes */
		hit = i;
		hits++;
	}
	if (hits > 1) {
		char list[256] = "";
		for (int i = 0; i < n; i++)
			if (!strncmp(defs[i].name, name, len))
				snprintf(list + strlen(list), sizeof list - strlen(list), "%s--%s",
					 list[0] ? ", " : "", defs[i].name);
		sd_usage(e, "option '%.*s' for '%s' is ambiguous: %s (see 'setdose help %s')",
			 (int)(len + 2), word, cmd, list, cmd);
		return -2;
	}
	return hit;
}

int opt_apply(const char *cmd, const struct sd_optdef *d, void *dst, const char *value,
	      struct sd_err *e)
{
	char what[48];
	void *field = (char *)dst + d->off;

	snprintf(what, sizeof what, "--%s", d->name);
	(void)cmd;
	switch (d->kind) {
	case OPT_FLAG:
		*(int *)field = 1;
		return 0;
	case OPT_STR:
		*(const char **)field = value;
		return 0;
	case OPT_INT:
		return app_int(what, value, (long long)d->lo, (long long)d->hi, field, e);
	case OPT_NUM:
		return app_num(what, value, d->lo, d->hi, field, e);
	default:
		return d->call(dst, d, value, e);
	}
}

/* The range of a number, checked without a place to store it. */
static int check_range(const struct sd_optdef *d, const char *value, struct sd_err *e)
{
	union { long long i; double x; } scratch;
	struct sd_optdef copy = *d;

	if (d->kind != OPT_INT && d->kind != OPT_NUM)
		return 0;
	copy.off = 0;
	return opt_apply("", &copy, &scratch, value, e);
}

int opt_parse(const char *cmd, const struct sd_optdef *defs, int n, void *dst, int argc,
	      char **argv, struct sd_err *e)
{
	int out = 1, i, k;

	for (i = 1; i < argc; i++) {
		const char *w = argv[i], *value;
		if (!strcmp(w, "--")) {
			i++;
			break;
		}
		if (w[0] != '-' || !w[1] || is_number(w)) {
			argv[out++] = argv[i];
			continue;
		}
		if ((k = opt_find(cmd, defs, n, w, &value, e)) == -2)
			return -1;
		if (k < 0)
			return opt_unknown(cmd, w, e);
		if (!defs[k].arg && value)
			return sd_usage(e, "option '--%s' for '%s' takes no value (see 'setdose help %s')",
					defs[k].name, cmd, cmd);
		if (defs[k].arg && !value) {
			if (i + 1 >= argc)
				return sd_usage(e, "option '--%s' for '%s' needs a value (see 'setdose help "
						"%s')", defs[k].name, cmd, cmd);
			value = argv[++i];
		}
		if (dst ? opt_apply(cmd, &defs[k], dst, value, e) : check_range(&defs[k], value, e))
			return -1;
	}
	for (; i < argc; i++)
		argv[out++] = argv[i];
	argv[out] = NULL;
	return out;
}

void opt_help(FILE *f, const struct sd_optdef *defs, int n)
{
	int w = 0;

	for (int i = 0; i < n; i++) {
		int l = (int)strlen(defs[i].name) + (defs[i].arg ? (int)strlen(defs[i].arg) + 1 : 0);
		if (l > w)
			w = l;
	}
	for (int i = 0; i < n; i++) {
		char left[64];
		int indent = 4 + w + 2, col = indent, room = OPT_HELP_WIDTH - indent;
		snprintf(left, sizeof left, "%s%s%s", defs[i].name, defs[i].arg ? " " : "",
			 defs[i].arg ? defs[i].arg : "");
		fprintf(f, "  --%-*s  ", w, left);
		/* Words fill the line up to OPT_HELP_WIDTH columns and continue under the first
		 * (a newline in the text is a space: the width decides). */
		for (const char *h = defs[i].help; *h;) {
			size_t len = strcspn(h, " \n");
			if (col > indent && col + 1 + (int)len > indent + (room > 20 ? room : 20)) {
				fprintf(f, "\n%*s", indent, "");
				col = indent;
			} else if (col > indent) {
				fputc(' ', f);
				col++;
			}
			fwrite(h, 1, len, f);
			col += (int)len;
			h += len;
			while (*h == ' ' || *h == '\n')
				h++;
		}
		fputc('\n', f);
	}
}
