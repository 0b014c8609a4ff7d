/* The set notation of program files: what a coach writes after "exercise =".
 *
 *   value   = group *( "," group )
 *   group   = [ "w" ] SETS [ "x" REPS ] *modifier
 *   REPS    = N [ "-" N ] [ "s" | "sec" | "min" ]  |  "AMRAP"
 *   modifier= "/side" | "each" [side] | "per side"            per side: the set count is unchanged
 *           | "@" E | "@" E "RIR" | "@" E "RPE" | "@RIR" E | "@RPE" E | "RIR" E | "RPE" E
 *           | "@" N "%" | N "%"                               load, percent of 1RM (kept, not used)
 *           | "warm-up" | "warmup"                            listed, never counted
 *   E       = X [ "-" X ],  X a whole or half number
 *
 * Case does not matter; blanks are optional; an en dash, em dash or minus sign reads as '-'
 * and '×' as 'x'; parentheses around modifiers are ignored. A bare "@N" is RPE N (RIR = 10 - RPE,
 * the RIR-based RPE scale; common practice, no source), or RIR N when the program says
 * 'effort = rir'. */
#include "program.h"

#include <math.h>
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

struct cur {
	const char *s;       /* lowercase ASCII copy of one group */
	const char *text;    /* the whole value as written, for messages */
};

static void blanks(struct cur *c)
{
	while (*c->s == ' ' || *c->s == '\t' || *c->s == '(' || *c->s == ')')
		c->s++;
}

static int is_alpha(char ch)
{
	return ch >= 'a' && ch <= 'z';
}

static int is_digit(char ch)
{
	return ch >= '0' && ch <= '9';
}

/* Consumes word w when it is not followed by another letter. */
static int word(struct cur *c, const char *w)
{
	size_t n = strlen(w);
	if (strncmp(c->s, w, n) || is_alpha(c->s[n]))
		return 0;
	c->s += n;
	return 1;
}

/* A whole number, guarded against overflow: -2 when absurdly long. */
static int whole(struct cur *c, long *out)
{
	long v = 0;
	if (!is_digit(*c->s))
		return -1;
	while (is_digit(*c->s)) {
		if (v > 100000)
			return -2;
		v = v * 10 + (*c->s++ - '0');
	}
	*out = v;
	return 0;
}

/* A whole or half number ("8", "8.5", "8.0"); -1 when not a number, -2 for other fractions. */
static int half(struct cur *c, double *out)
{
	long w;
	int rc = whole(c, &w);
	if (rc)
		return rc;
	double v = (double)w;
	if (*c->s == '.' && is_digit(c->s[1])) {
		c->s++;
		long frac = 0;
		int nd = 0;
		while (is_digit(*c->s)) {
			if (nd < 6)
				frac = frac * 10 + (*c->s - '0'), nd++;
			c->s++;
		}
		double f = (double)frac / pow(10, nd);
		if (f != 0 && f != 0.5)
			return -2;
		v += f;
	}
	*out = v;
	return 0;
}

static int bad_syntax(const struct cur *c, struct sd_err *e)
{
	return sd_fail(e, "bad set syntax '%s' (expected SETS or SETSxREPS, then an effort such as "
		       "@8, RPE 8 or RIR 2)", c->text);
}

/* Something no rule reads, quoted from where reading stopped. */
static int unexpected(const struct cur *c, const char *at, struct sd_err *e)
{
	return sd_fail(e, "bad set syntax '%s' at '%s' (expected SETS or SETSxREPS, then an effort "
		       "such as @8, RPE 8 or RIR 2)", c->text, at);
}

/* Reads "X" or "X-Y" on a scale and stores it in en. */
static int effort_value(struct cur *c, enum sd_effort scale, int bare, struct sd_entry *en,
			struct sd_err *e)
{
	const char *name = scale == SD_EFFORT_RPE ? "RPE" : "RIR";
	double lo, hi;
	int rc;

	if (en->effort != SD_EFFORT_NONE)
		return sd_fail(e, "two efforts in '%s' (give RIR or RPE once per group)", c->text);
	blanks(c);
	if (*c->s == '-')
		return sd_fail(e, "%s out of range in '%s' (%s)", name, c->text,
			       scale == SD_EFFORT_RPE ? "1 to 10" : "0 to 10");
	if ((rc = half(c, &lo)))
		return rc == -2 ? sd_fail(e, "%s in '%s' must be a whole or half number (e.g. 8.5)",
					  name, c->text)
				: sd_fail(e, "%s without a number in '%s'", name, c->text);
	hi = lo;
	const char *save = c->s;
	blanks(c);
	if (*c->s == '-' && (is_digit(c->s[1]) || c->s[1] == ' ')) {
		c->s++;
		blanks(c);
		if ((rc = half(c, &hi)))
			return rc == -2 ? sd_fail(e, "%s in '%s' must be a whole or half number (e.g. 8.5)",
						  name, c->text)
					: bad_syntax(c, e);
	} else {
		c->s = save;
	}
	if (hi < lo)
		return sd_fail(e, "%s range in '%s' runs backwards", name, c->text);
	if (scale == SD_EFFORT_RPE) {
		if (lo < SD_MIN_RPE || hi > SD_MAX_RPE) {
			if (bare && lo < SD_MIN_RPE)
				return sd_fail(e, "RPE %g is below the scale (1 to 10) in '%s'; did you mean "
					       "RIR %g? (write 'RIR %g'; a bare @N is RPE)", lo, c->text, lo, lo);
			return sd_fail(e, "RPE out of range in '%s' (1 to 10)", c->text);
		}
		en->rir = SD_MAX_RPE - (lo + hi) / 2;
	} else {
		if (hi > SD_MAX_RIR)
			return sd_fail(e, "RIR out of range in '%s' (0 to %d)", c->text, SD_MAX_RIR);
		en->rir = (lo + hi) / 2;
	}
	en->effort = scale;
	en->eff_lo = lo;
	en->eff_hi = hi;
	return 0;
}

static int load_value(struct cur *c, long v, struct sd_entry *en, struct sd_err *e)
{
	if (en->load_pct)
		return sd_fail(e, "two loads in '%s'", c->text);
	if (v < 1 || v > SD_MAX_LOAD_PCT)
		return sd_fail(e, "load out of range in '%s' (1%% to %d%% of 1RM)", c->text,
			       SD_MAX_LOAD_PCT);
	c->s++;   /* the '%' */
	en->load_pct = (int)v;
	return 0;
}

/* "@..." after the '@'. */
static int at_sign(struct cur *c, int bare_rir, struct sd_setinfo *info, struct sd_entry *en,
		   struct sd_err *e)
{
	blanks(c);
	if (word(c, "rir"))
		return effort_value(c, SD_EFFORT_RIR, 0, en, e);
	if (word(c, "rpe"))
		return effort_value(c, SD_EFFORT_RPE, 0, en, e);
	/* A number: a load ("@75%"), or an effort whose scale follows or is the bare default. */
	const char *start = c->s;
	long v;
	if (*c->s == '-')
		return sd_fail(e, "negative effort in '%s'", c->text);
	if (whole(c, &v) == 0 && *c->s == '%')
		return load_value(c, v, en, e);
	c->s = start;
	struct cur probe = *c;
	double x;
	if (half(&probe, &x) == -1)
		return bad_syntax(c, e);
	/* Look past the number (and a range) for an explicit scale word. */
	while (*probe.s == ' ' || is_digit(*probe.s) || *probe.s == '-' || *probe.s == '.')
		probe.s++;
	enum sd_effort scale = bare_rir ? SD_EFFORT_RIR : SD_EFFORT_RPE;
	int bare = 1;
	if (!strncmp(probe.s, "rir", 3) && !is_alpha(probe.s[3]))
		scale = SD_EFFORT_RIR, bare = 0;
	else if (!strncmp(probe.s, "rpe", 3) && !is_alpha(probe.s[3]))
		scale = SD_EFFORT_RPE, bare = 0;
	if (effort_value(c, scale, bare, en, e))
		return -1;
	if (!bare) {
		blanks(c);
		if (!word(c, scale == SD_EFFORT_RIR ? "rir" : "rpe"))
			return unexpected(c, c->s, e);
	} else if (scale == SD_EFFORT_RPE && en->eff_lo < 5 && info && info->bare_low < 0) {
		info->bare_low = en->eff_lo;
	}
	return 0;
}

static int reps_part(struct cur *c, struct sd_entry *en, struct sd_err *e)
{
	long lo, hi;
	int rc;

	blanks(c);
	if (word(c, "amrap")) {
		en->flags |= SD_SET_AMRAP;
		return 0;
	}
	if (*c->s == '-')
		return sd_fail(e, "negative rep count in '%s'", c->text);
	if ((rc = whole(c, &lo)))
		return rc == -2 ? sd_fail(e, "bad rep count in '%s' (1 to %d)", c->text, SD_MAX_REPS)
				: bad_syntax(c, e);
	hi = lo;
	const char *save = c->s;
	blanks(c);
	if (*c->s == '-' && !is_alpha(c->s[1])) {
		c->s++;
		blanks(c);
		if ((rc = whole(c, &hi)))
			return rc == -2 ? sd_fail(e, "bad rep count in '%s' (1 to %d)", c->text, SD_MAX_REPS)
					: bad_syntax(c, e);
		save = c->s;
		blanks(c);
	}
	if (word(c, "s") || word(c, "sec") || word(c, "secs") || word(c, "seconds")) {
		en->flags |= SD_SET_TIMED;
	} else if (word(c, "min") || word(c, "mins")) {
		en->flags |= SD_SET_TIMED;
		if (hi > SD_MAX_SECONDS / 60)
			return sd_fail(e, "timed set out of range in '%s' (1 to %d seconds)", c->text,
				       SD_MAX_SECONDS);
		lo *= 60;
		hi *= 60;
	} else {
		c->s = save;
		blanks(c);
		if (!word(c, "reps") && !word(c, "rep"))
			c->s = save;
	}
	if (hi < lo)
		return sd_fail(e, "rep range in '%s' runs backwards", c->text);
	if (en->flags & SD_SET_TIMED) {
		if (lo < 1 || hi > SD_MAX_SECONDS)
			return sd_fail(e, "timed set out of range in '%s' (1 to %d seconds)", c->text,
				       SD_MAX_SECONDS);
	} else if (lo < 1 || hi > SD_MAX_REPS) {
		return sd_fail(e, "bad rep count in '%s' (1 to %d)", c->text, SD_MAX_REPS);
	}
	en->reps = (int)lo;
	en->reps_hi = (int)hi;
	return 0;
}

static int side_word(struct cur *c)
{
	return word(c, "side") || word(c, "leg") || word(c, "arm") || word(c, "sides") ||
	       word(c, "legs") || word(c, "arms");
}

static int group(struct cur *c, int bare_rir, struct sd_setinfo *info, struct sd_entry *en,
		 struct sd_err *e)
{
	long v;
	int rc;

	memset(en, 0, sizeof *en);
	en->rir = -1;
	blanks(c);
	if (*c->s == 'w' && is_digit(c->s[1])) {
		en->flags |= SD_SET_WARMUP;
		c->s++;
	}
	if (*c->s == '-')
		return sd_fail(e, "negative set count '%s'", c->text);
	if ((rc = whole(c, &v)))
		return rc == -2 ? sd_fail(e, "absurd set count '%s' (at most %d per group)", c->text,
					  SD_MAX_SETS)
				: bad_syntax(c, e);
	if (*c->s == '.' && is_digit(c->s[1]))
		return sd_fail(e, "set count must be a whole number in '%s'", c->text);
	if (v < 1)
		return sd_fail(e, "set count must be at least 1 in '%s'", c->text);
	if (v > SD_MAX_SETS)
		return sd_fail(e, "absurd set count %ld in '%s' (at most %d per group)", v, c->text,
			       SD_MAX_SETS);
	en->sets = (int)v;
	blanks(c);
	if (!word(c, "sets"))
		word(c, "set");
	blanks(c);
	if ((*c->s == 'x' && !(is_alpha(c->s[1]) && strncmp(c->s + 1, "amrap", 5))) || *c->s == '*') {
		c->s++;
		if (reps_part(c, en, e))
			return -1;
	}
	for (;;) {
		blanks(c);
		if (!*c->s)
			break;
		if (*c->s == '@') {
			c->s++;
			if (at_sign(c, bare_rir, info, en, e))
				return -1;
		} else if (word(c, "rir")) {
			if (effort_value(c, SD_EFFORT_RIR, 0, en, e))
				return -1;
		} else if (word(c, "rpe")) {
			if (effort_value(c, SD_EFFORT_RPE, 0, en, e))
				return -1;
		} else if (*c->s == '/') {
			c->s++;
			blanks(c);
			if (!side_word(c))
				return bad_syntax(c, e);
			en->flags |= SD_SET_SIDE;
		} else if (word(c, "each") || word(c, "per")) {
			blanks(c);
			side_word(c);
			en->flags |= SD_SET_SIDE;
		} else if (word(c, "warm-up") || word(c, "warmup") || word(c, "warm")) {
			blanks(c);
			if (*c->s == '-')
				c->s++;
			word(c, "up");
			en->flags |= SD_SET_WARMUP;
		} else if (is_digit(*c->s)) {
			const char *start = c->s;
			if (whole(c, &v) || *c->s != '%')
				return unexpected(c, start, e);
			if (load_value(c, v, en, e))
				return -1;
		} else {
			return unexpected(c, c->s, e);
		}
	}
	/* AMRAP is a set to failure unless the coach says otherwise. */
	if ((en->flags & SD_SET_AMRAP) && en->effort == SD_EFFORT_NONE)
		en->rir = 0;
	return 0;
}

/* Lowercase ASCII copy with the typographic dashes and '×' folded; any other byte the notation
 * has no use for becomes '?', which no rule accepts. NULL when out of memory. */
static char *fold(const char *text)
{
	size_t n = strlen(text);
	char *out = malloc(n + 1), *o = out;
	if (!out)
		return NULL;
	for (const unsigned char *s = (const unsigned char *)text; *s; s++) {
		if (s[0] == 0xE2 && s[1] == 0x80 && (s[2] == 0x93 || s[2] == 0x94)) {
			*o++ = '-';   /* en and em dash */
			s += 2;
		} else if (s[0] == 0xE2 && s[1] == 0x88 && s[2] == 0x92) {
			*o++ = '-';   /* minus sign */
			s += 2;
		} else if (s[0] == 0xC3 && s[1] == 0x97) {
			*o++ = 'x';   /* multiplication sign */
			s += 1;
		} else if (*s >= 0x80 || (*s < 0x20 && *s != '\t')) {
			*o++ = '?';
		} else {
			*o++ = (char)(*s >= 'A' && *s <= 'Z' ? *s + 32 : *s);
		}
	}
	*o = '\0';
	return out;
}

/* A group that is a lone number after a comma: "3x12,10,8" (reps per set) or "@8,5" (a decimal
 * comma) would silently become more sets. */
static int lone_number(const char *g)
{
	while (*g == ' ' || *g == '\t')
		g++;
	if (!is_digit(*g))
		return 0;
	while (is_digit(*g))
		g++;
	while (*g == ' ' || *g == '\t')
		g++;
	return !*g;
}

int prog_parse_sets(const char *text, int bare_rir, struct sd_entry *out, int max,
		    struct sd_setinfo *info, struct sd_err *e)
{
	char *buf = fold(text), *g;
	int n = 0, rc = -1;

	if (!buf)
		return sd_fail(e, "out of memory");
	if (info)
		info->bare_low = -1;
	g = buf;
	for (;;) {
		char *comma = strchr(g, ',');
		if (comma)
			*comma = '\0';
		struct cur c = { g, text };
		while (*c.s == ' ' || *c.s == '\t')
			c.s++;
		if (!*c.s) {   /* "", "3x5," or ", 3x5": a group is missing */
			sd_fail(e, "empty set group in '%s'", text);
			break;
		}
		if (n > 0 && lone_number(g)) {
			sd_fail(e, "'%s': a lone number after a comma is ambiguous; write each group in "
				"full (1x12, 1x10, 1x8) and half steps with a point (8.5)", text);
			break;
		}
		if (n == max) {
			sd_fail(e, "too many set groups in '%s' (at most %d)", text, max);
			break;
		}
		if (group(&c, bare_rir, info, &out[n], e))
			break;
		n++;
		if (!comma) {
			rc = n;
			break;
		}
		g = comma + 1;
	}
	free(buf);
	return rc;
}

int prog_parse_reps(const char *text, struct sd_entry *en, struct sd_err *e)
{
	char *buf = fold(text);
	int rc = -1;

	if (!buf)
		return sd_fail(e, "out of memory");
	struct cur c = { buf, text };
	if (reps_part(&c, en, e))
		goto done;
	for (;;) {
		blanks(&c);
		if (!*c.s)
			break;
		if (*c.s == '/') {
			c.s++;
			blanks(&c);
			if (!side_word(&c)) {
				sd_fail(e, "bad reps '%s' (expected N, N-M, AMRAP, Ns or N/side)", text);
				goto done;
			}
		} else if (word(&c, "each") || word(&c, "per")) {
			blanks(&c);
			side_word(&c);
		} else {
			sd_fail(e, "bad reps '%s' (expected N, N-M, AMRAP, Ns or N/side)", text);
			goto done;
		}
		en->flags |= SD_SET_SIDE;
	}
	if ((en->flags & SD_SET_AMRAP) && en->effort == SD_EFFORT_NONE)
		en->rir = 0;
	rc = 0;
done:
	free(buf);
	return rc;
}

int prog_parse_effort(const char *text, enum sd_effort scale, struct sd_entry *en, struct sd_err *e)
{
	char *buf = fold(text);
	int rc = -1;

	if (!buf)
		return sd_fail(e, "out of memory");
	/* A spreadsheet in a decimal-comma locale writes 8,5. */
	for (char *s = buf; *s; s++)
		if (*s == ',')
			*s = '.';
	struct cur c = { buf, text };
	blanks(&c);
	if (*c.s == '@')
		c.s++;
	if (effort_value(&c, scale, 0, en, e) == 0) {
		blanks(&c);
		if (*c.s)
			sd_fail(e, "bad %s '%s' (expected a number such as 2, 1.5 or 1-2)",
				scale == SD_EFFORT_RPE ? "RPE" : "RIR", text);
		else
			rc = 0;
	}
	free(buf);
	return rc;
}

int prog_parse_effort_text(const char *text, struct sd_entry *en, struct sd_err *e)
{
	char *buf = fold(text);
	int rc = -1;

	if (!buf)
		return sd_fail(e, "out of memory");
	struct cur c = { buf, text };
	en->effort = SD_EFFORT_NONE;
	blanks(&c);
	if (*c.s == '@') {
		c.s++;
		rc = at_sign(&c, 0, NULL, en, e);
	} else if (word(&c, "rir")) {
		rc = effort_value(&c, SD_EFFORT_RIR, 0, en, e);
	} else if (word(&c, "rpe")) {
		rc = effort_value(&c, SD_EFFORT_RPE, 0, en, e);
	} else {
		sd_fail(e, "bad effort '%s' (expected RIR 2, RPE 8 or @8)", text);
	}
	if (rc == 0) {
		blanks(&c);
		/* "@75%" is a load, not an effort. */
		if (*c.s || en->effort == SD_EFFORT_NONE)
			rc = sd_fail(e, "bad effort '%s' (expected RIR 2, RPE 8 or @8)", text);
	}
	free(buf);
	return rc;
}

/* Appends to buf; keeps len at the text's length even when it no longer fits. */
static int put(char *buf, int size, int len, const char *fmt, ...) __attribute__((format(printf, 4, 5)));

static int put(char *buf, int size, int len, const char *fmt, ...)
{
	va_list ap;
	if (len < 0 || len >= size)
		return len;
	va_start(ap, fmt);
	len += vsnprintf(buf + len, (size_t)(size - len), fmt, ap);
	va_end(ap);
	return len;
}

void prog_format_group(const struct sd_entry *en, char *buf, int size)
{
	int len = snprintf(buf, (size_t)size, "%d", en->sets);

	if (en->flags & SD_SET_AMRAP)
		len = put(buf, size, len, "xAMRAP");
	else if (en->reps > 0 && en->reps_hi > en->reps)
		len = put(buf, size, len, "x%d-%d", en->reps, en->reps_hi);
	else if (en->reps > 0)
		len = put(buf, size, len, "x%d", en->reps);
	if (en->reps > 0 && (en->flags & SD_SET_TIMED))
		len = put(buf, size, len, "s");
	if (en->flags & SD_SET_SIDE)
		len = put(buf, size, len, "/side");
	if (en->load_pct)
		len = put(buf, size, len, " @%d%%", en->load_pct);
	if (en->effort != SD_EFFORT_NONE) {
		/* A bare @N is RPE and reads without a warning from 5 up; anything else is spelled out. */
		const char *pre = en->effort == SD_EFFORT_RIR ? " RIR " : en->eff_lo >= 5 ? " @" : " RPE ";
		if (en->eff_hi > en->eff_lo)
			len = put(buf, size, len, "%s%g-%g", pre, en->eff_lo, en->eff_hi);
		else
			len = put(buf, size, len, "%s%g", pre, en->eff_lo);
	}
	if (en->flags & SD_SET_WARMUP)
		put(buf, size, len, " warm-up");
}
