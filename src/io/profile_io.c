#include "profile_io.h"

#include <errno.h>
#include <math.h>
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <strings.h>

#include "ini.h"

/* Profiles are read with the ordered scanner (ini.c) rather than iniparser, which drops a
 * repeated key or section silently and keeps no line numbers: here a repeated section or key
 * is an error naming both lines, an unknown section or key is an error (a misspelt key would
 * otherwise fall back to a default unnoticed), and every numeric field is checked against
 * its documented range (profile_check_value) with its line. */

enum sec { S_PROFILE, S_TERMS, S_COVARIANCE, S_RANGES, S_HETERO, S_PROVENANCE, S_NSEC };

static const char *const sec_names[S_NSEC] = { "profile", "terms", "covariance", "ranges",
					       "heterogeneity", "provenance" };

/* Keys of the fixed sections; covariance and ranges take term and variable names, provenance
 * takes basis, summary and line1 ... line99. */
static const char *const fixed_keys[S_NSEC][11] = {
	[S_PROFILE] = { "name", "outcome", "scale", "form", "dose_min", "dose_max", "swc",
			"w_direct", "w_indirect", "df", NULL },
	[S_TERMS] = { "names", "beta", "centre", NULL },
	[S_HETERO] = { "tau2", "sigma2", "slopes", "tau2_slope", "cov_slope", "athlete",
		       "athlete_source", NULL },
};

#define MAX_ITEMS 256
#define MAX_LINES 99

struct item {
	enum sec sec;
	const char *key, *value;
	int line;
};

struct reader {
	const char *path;
	int sec_line[S_NSEC];      /* line of each section's header, 0 when absent */
	int cur;                   /* current section, -1 before the first */
	struct item it[MAX_ITEMS];
	int n;
};

static int fail_at(const struct reader *r, int line, struct sd_err *e, const char *fmt, ...)
	__attribute__((format(printf, 4, 5)));

static int fail_at(const struct reader *r, int line, struct sd_err *e, const char *fmt, ...)
{
	char msg[400];
	va_list ap;

	va_start(ap, fmt);
	vsnprintf(msg, sizeof msg, fmt, ap);
	va_end(ap);
	if (line > 0)
		return sd_fail(e, "cannot read profile '%s' line %d: %s", r->path, line, msg);
	return sd_fail(e, "cannot read profile '%s': %s", r->path, msg);
}

static int known_key(enum sec s, const char *key)
{
	if (s == S_COVARIANCE || s == S_RANGES)
		return 1;
	if (s == S_PROVENANCE) {
		char *end;
		long k;
		if (!strcasecmp(key, "basis") || !strcasecmp(key, "summary"))
			return 1;
		if (strncasecmp(key, "line", 4))
			return 0;
		k = strtol(key + 4, &end, 10);
		return end != key + 4 && !*end && k >= 1 && k <= MAX_LINES;
	}
	for (int i = 0; fixed_keys[s][i]; i++)
		if (!strcasecmp(key, fixed_keys[s][i]))
			return 1;
	return 0;
}

static int on_item(const struct sd_ini_item *it, void *arg, struct sd_err *e)
{
	struct reader *r = arg;

	if (!it->key) {
		int s;
		for (s = 0; s < S_NSEC && strcasecmp(it->section, sec_names[s]); s++)
			;
		if (s == S_NSEC)
			return fail_at(r, it->line, e, "unknown section [%s] (sections: profile, terms, "
				       "covariance, ranges, heterogeneity, provenance)", it->section);
		if (r->sec_line[s])
			return fail_at(r, it->line, e, "section [%s] appears twice (lines %d and %d)",
				       sec_names[s], r->sec_line[s], it->line);
		r->sec_line[s] = it->line;
		r->cur = s;
		return 0;
	}
	if (r->cur < 0)
		return fail_at(r, it->line, e, "'%s' comes before any section", it->key);
	if (!known_key((enum sec)r->cur, it->key))
		return fail_at(r, it->line, e, "unknown key '%s' in [%s]", it->key, sec_names[r->cur]);
	for (int i = 0; i < r->n; i++)
		if (r->it[i].sec == (enum sec)r->cur && !strcasecmp(r->it[i].key, it->key))
			return fail_at(r, it->line, e, "key '%s' appears twice in [%s] (lines %d and %d)",
				       it->key, sec_names[r->cur], r->it[i].line, it->line);
	if (r->n == MAX_ITEMS)
		return fail_at(r, it->line, e, "more than %d keys", MAX_ITEMS);
	r->it[r->n++] = (struct item){ (enum sec)r->cur, it->key, it->value, it->line };
	return 0;
}

/* Fixed keys match whatever their case; term and variable names exactly. */
static const struct item *find(const struct reader *r, enum sec s, const char *key)
{
	int exact = s == S_COVARIANCE || s == S_RANGES;
	for (int i = 0; i < r->n; i++)
		if (r->it[i].sec == s && !(exact ? strcmp : strcasecmp)(r->it[i].key, key))
			return &r->it[i];
	return NULL;
}

static int need(const struct reader *r, enum sec s, const char *key, const struct item **out,
		struct sd_err *e)
{
	if (!(*out = find(r, s, key)))
		return fail_at(r, 0, e, "missing '%s' in [%s]", key, sec_names[s]);
	return 0;
}

static int text(const struct reader *r, const struct item *it, char *buf, size_t n,
		struct sd_err *e)
{
	if (strlen(it->value) >= n)
		return fail_at(r, it->line, e, "'%s' is longer than %zu bytes", it->key, n - 1);
	memcpy(buf, it->value, strlen(it->value) + 1);
	return 0;
}

/* A number checked against the documented range of `limit` (profile.c). */
static int number(const struct reader *r, const struct item *it, const char *limit, double *out,
		  struct sd_err *e)
{
	char *end;

	errno = 0;
	*out = strtod(it->value, &end);
	if (end == it->value || *end || errno)
		return fail_at(r, it->line, e, "'%s' is not a number ('%s')", it->key, it->value);
	if (profile_check_value(limit, *out, e))
		return sd_wrap(e, "cannot read profile '%s' line %d", r->path, it->line);
	return 0;
}

static int opt_number(const struct reader *r, enum sec s, const char *key, double dflt,
		      double *out, struct sd_err *e)
{
	const struct item *it = find(r, s, key);
	if (!it) {
		*out = dflt;
		return 0;
	}
	return number(r, it, key, out, e);
}

/* A comma-separated list of exactly `want` numbers, each within `limit`. */
static int list(const struct reader *r, const struct item *it, const char *limit, int want,
		double *v, struct sd_err *e)
{
	const char *s = it->value;
	int n = 0;

	while (*s) {
		char *end;
		while (*s == ' ' || *s == '\t')
			s++;
		if (n == want)
			return fail_at(r, it->line, e, "'%s' needs %d numbers, got more", it->key, want);
		errno = 0;
		v[n] = strtod(s, &end);
		if (end == s || errno)
			return fail_at(r, it->line, e, "'%s' needs %d numbers, one per term: '%.40s' is "
				       "not a number", it->key, want, s);
		char what[80];
		snprintf(what, sizeof what, "'%s' number %d", it->key, n + 1);
		if (profile_check_named(limit, what, v[n], e))
			return sd_wrap(e, "cannot read profile '%s' line %d", r->path, it->line);
		n++;
		s = end;
		while (*s == ' ' || *s == '\t')
			s++;
		if (*s && *s++ != ',')
			return fail_at(r, it->line, e, "'%s': expected ',' after number %d", it->key, n);
	}
	if (n != want)
		return fail_at(r, it->line, e, "'%s' needs %d numbers, %s, got %d", it->key, want,
			       want == 2 && strchr(limit, ':') ? "low and high" :
			       !strcmp(it->key, "beta") ? "one per term (missing coefficient?)" :
			       "one per term", n);
	return 0;
}

static int names(const struct reader *r, const struct item *it, struct sd_profile *p,
		 struct sd_err *e)
{
	const char *s = it->value;

	p->nterms = 0;
	while (*s) {
		size_t len, l;
		while (*s == ' ' || *s == ',')
			s++;
		if (!*s)
			break;
		if (p->nterms == SD_MAX_TERMS)
			return fail_at(r, it->line, e, "more than %d terms", SD_MAX_TERMS);
		len = strcspn(s, ",");
		for (l = len; l && s[l - 1] == ' '; l--)
			;
		if (l >= sizeof p->term[0])
			return fail_at(r, it->line, e, "term name '%.*s' is longer than %zu bytes",
				       (int)l, s, sizeof p->term[0] - 1);
		memcpy(p->term[p->nterms], s, l);
		p->term[p->nterms++][l] = '\0';
		s += len;
	}
	return 0;
}

static int load_profile_section(const struct reader *r, struct sd_profile *p, struct sd_err *e)
{
	const struct item *it;
	double df;
	int f;

	snprintf(p->name, sizeof p->name, "unnamed");
	snprintf(p->outcome, sizeof p->outcome, "1RM strength");
	if (((it = find(r, S_PROFILE, "name")) && text(r, it, p->name, sizeof p->name, e)) ||
	    ((it = find(r, S_PROFILE, "outcome")) && text(r, it, p->outcome, sizeof p->outcome, e)))
		return -1;
	if ((it = find(r, S_PROFILE, "scale")) && strcmp(it->value, "lnRR"))
		return fail_at(r, it->line, e, "scale '%s' is not supported (only lnRR)", it->value);
	snprintf(p->scale, sizeof p->scale, "lnRR");
	if (need(r, S_PROFILE, "form", &it, e))
		return -1;
	if ((f = form_find(it->value)) < 0)
		return fail_at(r, it->line, e, "form must be linear, log, sqrt or reciprocal, not '%s'",
			       it->value);
	p->form = (enum sd_form)f;
	if (need(r, S_PROFILE, "dose_min", &it, e) || number(r, it, "dose_min", &p->dose_min, e) ||
	    need(r, S_PROFILE, "dose_max", &it, e) || number(r, it, "dose_max", &p->dose_max, e))
		return -1;
	if (!(p->dose_max > p->dose_min))
		return fail_at(r, it->line, e, "dose_max %g must be above dose_min %g (line %d)",
			       p->dose_max, p->dose_min, find(r, S_PROFILE, "dose_min")->line);
	if (opt_number(r, S_PROFILE, "swc", log(1.03), &p->swc, e) ||
	    opt_number(r, S_PROFILE, "w_direct", 1.0, &p->w_direct, e) ||
	    opt_number(r, S_PROFILE, "w_indirect", 0.5, &p->w_indirect, e) ||
	    opt_number(r, S_PROFILE, "df", 0, &df, e))
		return -1;
	if (p->w_indirect > p->w_direct)
		return fail_at(r, find(r, S_PROFILE, "w_indirect")->line, e, "w_indirect %g must not "
			       "exceed w_direct %g", p->w_indirect, p->w_direct);
	p->df = (int)df;   /* a whole number within 0..1e6: checked */
	return 0;
}

static int load_terms(const struct reader *r, struct sd_profile *p, struct sd_err *e)
{
	const struct item *it;
	int n;

	if (need(r, S_TERMS, "names", &it, e) || names(r, it, p, e))
		return -1;
	n = p->nterms;
	if (n < 2 || strcmp(p->term[0], "intercept") || strcmp(p->term[1], "dose"))
		return fail_at(r, it->line, e, "the first two terms must be 'intercept' and 'dose'");
	if (need(r, S_TERMS, "beta", &it, e) || list(r, it, "beta", n, p->beta, e))
		return -1;
	if ((it = find(r, S_TERMS, "centre")) && list(r, it, "centre", n, p->centre, e))
		return -1;
	for (int i = 0; i < n; i++) {
		if (!(it = find(r, S_COVARIANCE, p->term[i])))
			return fail_at(r, r->sec_line[S_COVARIANCE], e, "missing covariance row '%s'",
				       p->term[i]);
		if (list(r, it, "covariance", n, &p->vcov[i * n], e))
			return -1;
		if (profile_check_value("variance", p->vcov[i * n + i], e))
			return sd_wrap(e, "cannot read profile '%s' line %d: covariance row '%s'",
				       r->path, it->line, p->term[i]);
	}
	for (int i = 0; i < r->n; i++)
		if (r->it[i].sec == S_COVARIANCE && profile_term(p, r->it[i].key) < 0)
			return fail_at(r, r->it[i].line, e, "covariance row '%s' is not a term",
				       r->it[i].key);
	return 0;
}

/* [ranges]: one line per moderator variable, "weeks = 4, 24"; each used by some term. */
static int load_ranges(const struct reader *r, struct sd_profile *p, struct sd_err *e)
{
	for (int i = 0; i < r->n; i++) {
		const struct item *it = &r->it[i];
		struct sd_range *g;
		char key[48], var[32];
		double v[2];
		int used = 0;

		if (it->sec != S_RANGES)
			continue;
		for (int k = 2; k < p->nterms && !used; k++) {
			profile_term_var(p->term[k], var, sizeof var);
			used = !strcmp(var, it->key);
		}
		if (!used)
			return fail_at(r, it->line, e, "range of '%s', but no term uses it", it->key);
		snprintf(key, sizeof key, "range:%s", it->key);
		if (list(r, it, key, 2, v, e))
			return -1;
		if (v[0] > v[1])
			return fail_at(r, it->line, e, "range of '%s' runs backwards (%g to %g)", it->key,
				       v[0], v[1]);
		g = &p->range[p->nranges++];
		snprintf(g->var, sizeof g->var, "%s", it->key);
		g->lo = v[0];
		g->hi = v[1];
	}
	return 0;
}

static int load_hetero(const struct reader *r, struct sd_profile *p, struct sd_err *e)
{
	const struct item *it;

	if (need(r, S_HETERO, "tau2", &it, e) || number(r, it, "tau2", &p->tau2, e) ||
	    opt_number(r, S_HETERO, "sigma2", 0, &p->sigma2, e))
		return -1;
	if ((it = find(r, S_HETERO, "slopes"))) {
		const char *v = it->value;
		if (!strcasecmp(v, "yes") || !strcasecmp(v, "true") || !strcmp(v, "1"))
			p->slopes = 1;
		else if (strcasecmp(v, "no") && strcasecmp(v, "false") && strcmp(v, "0"))
			return fail_at(r, it->line, e, "slopes wants yes or no, not '%s'", v);
	}
	if (p->slopes && (opt_number(r, S_HETERO, "tau2_slope", 0, &p->tau2_slope, e) ||
			  opt_number(r, S_HETERO, "cov_slope", 0, &p->cov_slope, e)))
		return -1;
	if (!p->slopes && ((it = find(r, S_HETERO, "tau2_slope")) || (it = find(r, S_HETERO, "cov_slope"))))
		return fail_at(r, it->line, e, "'%s' given but slopes = no", it->key);
	if (need(r, S_HETERO, "athlete", &it, e) || number(r, it, "athlete", &p->athlete_var, e) ||
	    need(r, S_HETERO, "athlete_source", &it, e) ||
	    text(r, it, p->athlete_source, sizeof p->athlete_source, e))
		return -1;
	return 0;
}

static int load_provenance(const struct reader *r, struct sd_profile *p, struct sd_err *e)
{
	const struct item *it;
	size_t used = 0;
	int b;

	if (need(r, S_PROVENANCE, "basis", &it, e))
		return -1;
	if ((b = basis_find(it->value)) < 0)
		return fail_at(r, it->line, e, "basis must be calibrated or fitted, not '%s'", it->value);
	p->basis = (enum sd_basis)b;
	if (need(r, S_PROVENANCE, "summary", &it, e) || text(r, it, p->summary, sizeof p->summary, e))
		return -1;
	p->provenance[0] = '\0';
	for (int k = 1; k <= MAX_LINES; k++) {
		char key[16];
		snprintf(key, sizeof key, "line%d", k);
		if (!(it = find(r, S_PROVENANCE, key)))
			continue;
		size_t len = strlen(it->value);
		if (used + len + 2 > sizeof p->provenance)
			return fail_at(r, it->line, e, "provenance is longer than %zu bytes",
				       sizeof p->provenance - 1);
		if (used)
			p->provenance[used++] = '\n';
		memcpy(p->provenance + used, it->value, len + 1);
		used += len;
	}
	return 0;
}

int profile_load(const char *path, struct sd_profile *p, struct sd_err *e)
{
	struct reader *r = calloc(1, sizeof *r);
	char *buf = NULL;
	size_t len;
	int rc = -1;

	memset(p, 0, sizeof *p);
	if (!r)
		return sd_fail(e, "out of memory");
	r->path = path;
	r->cur = -1;
	if (ini_slurp("profile", path, &buf, &len, e))
		goto out;
	if (strlen(buf) != len) {
		int line = 1;
		for (const char *s = buf; *s; s++)
			line += *s == '\n';
		fail_at(r, line, e, "a NUL byte (not a text file)");
		goto out;
	}
	if (ini_scan("profile", path, buf, on_item, r, e))
		goto out;
	if (!r->sec_line[S_PROFILE]) {
		fail_at(r, 0, e, "no [profile] section");
		goto out;
	}
	if (load_profile_section(r, p, e) || load_terms(r, p, e) || load_ranges(r, p, e) ||
	    load_hetero(r, p, e) || load_provenance(r, p, e))
		goto out;
	if (profile_validate(p, e)) {
		sd_wrap(e, "cannot read profile '%s'", path);
		goto out;
	}
	profile_index(p);
	rc = 0;
out:
	free(buf);
	free(r);
	return rc;
}

static void write_row(FILE *f, const char *key, const double *v, int n)
{
	fprintf(f, "%-12s = ", key);
	for (int i = 0; i < n; i++)
		fprintf(f, "%s%.12g", i ? ", " : "", v[i]);
	fputc('\n', f);
}

/* A quoted value: ';' and '#' would start a comment in an unquoted one, and a double quote
 * cannot be escaped, so it becomes a single one. */
static void quoted(FILE *f, const char *key, const char *s, size_t len)
{
	fprintf(f, "%-12s = \"", key);
	for (size_t i = 0; i < len; i++)
		fputc(s[i] == '"' ? '\'' : s[i], f);
	fprintf(f, "\"\n");
}

int profile_write(FILE *f, const struct sd_profile *p, struct sd_err *e)
{
	char names[SD_MAX_TERMS * 34] = "";
	const char *s = p->provenance;
	int n = p->nterms, line = 1;

	for (int i = 0; i < n; i++)
		strcat(strcat(names, i ? ", " : ""), p->term[i]);
	fprintf(f, "; setdose dose-response profile (lnRR scale). See setdose(1), PROFILE FILES.\n");
	fprintf(f, "[profile]\nname         = %s\noutcome      = %s\nscale        = %s\n"
		"form         = %s\n", p->name, p->outcome, p->scale, form_name(p->form));
	fprintf(f, "dose_min     = %.12g\ndose_max     = %.12g\nswc          = %.12g\n", p->dose_min,
		p->dose_max, p->swc);
	fprintf(f, "w_direct     = %.12g\nw_indirect   = %.12g\ndf           = %d\n\n", p->w_direct,
		p->w_indirect, p->df);
	fprintf(f, "[terms]\nnames        = %s\n", names);
	write_row(f, "beta", p->beta, n);
	write_row(f, "centre", p->centre, n);
	fprintf(f, "\n[covariance]\n");
	for (int i = 0; i < n; i++)
		write_row(f, p->term[i], &p->vcov[i * n], n);
	if (p->nranges) {
		fprintf(f, "\n[ranges]\n");
		for (int i = 0; i < p->nranges; i++) {
			double v[2] = { p->range[i].lo, p->range[i].hi };
			write_row(f, p->range[i].var, v, 2);
		}
	}
	fprintf(f, "\n[heterogeneity]\ntau2         = %.12g\nsigma2       = %.12g\nslopes       = %s\n",
		p->tau2, p->sigma2, p->slopes ? "yes" : "no");
	if (p->slopes)
		fprintf(f, "tau2_slope   = %.12g\ncov_slope    = %.12g\n", p->tau2_slope, p->cov_slope);
	fprintf(f, "athlete      = %.12g\n", p->athlete_var);
	quoted(f, "athlete_source", p->athlete_source, strlen(p->athlete_source));
	fprintf(f, "\n[provenance]\nbasis        = %s\n", basis_name(p->basis));
	quoted(f, "summary", p->summary, strlen(p->summary));
	while (*s) {
		char key[16];
		size_t len = strcspn(s, "\n");
		snprintf(key, sizeof key, "line%d", line++);
		quoted(f, key, s, len);
		s += len;
		if (*s == '\n')
			s++;
	}
	if (ferror(f))
		return sd_fail(e, "cannot write profile: %s", strerror(errno));
	return 0;
}
