#include "profile_io.h"

#include <errno.h>
#include <stdarg.h>
#include <stdio.h>
#include <math.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include <iniparser/iniparser.h>

#define SWC_DEFAULT 0.029558802241544  /* ln(1.03) */

/* iniparser reports syntax errors through a printf-like callback; keep the first one so the
 * message can name the file instead of going to stderr. */
static char ini_error[256];

static int ini_errback(const char *fmt, ...)
{
	va_list ap;
	if (ini_error[0])
		return 0;
	va_start(ap, fmt);
	vsnprintf(ini_error, sizeof ini_error, fmt, ap);
	va_end(ap);
	return 0;
}

static int get_double(dictionary *d, const char *key, double *out, int required, double dflt,
		      const char *path, struct sd_err *e)
{
	const char *s = iniparser_getstring(d, key, NULL);
	char *end;
	if (!s) {
		if (required)
			return sd_fail(e, "profile '%s': missing '%s'", path, key);
		*out = dflt;
		return 0;
	}
	errno = 0;
	*out = strtod(s, &end);
	while (*end == ' ')
		end++;
	if (end == s || *end || errno || !isfinite(*out))
		return sd_fail(e, "profile '%s': '%s' is not a number ('%s')", path, key, s);
	return 0;
}

/* Splits a comma-separated list of numbers; returns how many or -1. */
static int parse_list(const char *s, double *v, int max)
{
	int n = 0;
	char *end;
	while (*s) {
		while (*s == ' ' || *s == ',')
			s++;
		if (!*s)
			break;
		if (n == max)
			return -1;
		errno = 0;
		v[n] = strtod(s, &end);
		if (end == s || errno || !isfinite(v[n]))
			return -1;
		n++;
		s = end;
		while (*s == ' ')
			s++;
		if (*s && *s != ',')
			return -1;
	}
	return n;
}

static int parse_names(const char *s, struct sd_profile *p)
{
	int n = 0;
	while (*s) {
		while (*s == ' ' || *s == ',')
			s++;
		if (!*s)
			break;
		if (n == SD_MAX_TERMS)
			return -1;
		int len = 0;
		while (s[len] && s[len] != ',')
			len++;
		int l = len;
		while (l && s[l - 1] == ' ')
			l--;
		if (l >= (int)sizeof p->term[0])
			return -1;
		memcpy(p->term[n], s, (size_t)l);
		p->term[n][l] = '\0';
		n++;
		s += len;
	}
	return n;
}

static void get_text(dictionary *d, const char *key, char *buf, size_t n, const char *dflt)
{
	snprintf(buf, n, "%s", iniparser_getstring(d, key, dflt));
}

static int load_terms(dictionary *d, const char *path, struct sd_profile *p, struct sd_err *e)
{
	const char *names = iniparser_getstring(d, "terms:names", NULL);
	const char *beta = iniparser_getstring(d, "terms:beta", NULL);
	const char *centre = iniparser_getstring(d, "terms:centre", NULL);
	double row[SD_MAX_TERMS];
	int n;

	if (!names || !beta)
		return sd_fail(e, "profile '%s': missing [terms] names or beta", path);
	n = parse_names(names, p);
	if (n < 0)
		return sd_fail(e, "profile '%s': bad [terms] names (at most %d)", path, SD_MAX_TERMS);
	p->nterms = n;
	if (parse_list(beta, p->beta, SD_MAX_TERMS) != n)
		return sd_fail(e, "profile '%s': [terms] beta needs %d numbers, one per term "
			       "(missing coefficient?)", path, n);
	if (centre && parse_list(centre, p->centre, SD_MAX_TERMS) != n)
		return sd_fail(e, "profile '%s': [terms] centre needs %d numbers", path, n);
	for (int i = 0; i < n; i++) {
		char key[64];
		snprintf(key, sizeof key, "covariance:%s", p->term[i]);
		const char *s = iniparser_getstring(d, key, NULL);
		if (!s)
			return sd_fail(e, "profile '%s': missing covariance row '%s'", path, p->term[i]);
		if (parse_list(s, row, SD_MAX_TERMS) != n)
			return sd_fail(e, "profile '%s': covariance row '%s' needs %d numbers", path,
				       p->term[i], n);
		memcpy(&p->vcov[i * n], row, (size_t)n * sizeof *row);
	}
	return 0;
}

static void load_provenance(dictionary *d, struct sd_profile *p)
{
	size_t used = 0;
	p->provenance[0] = '\0';
	for (int i = 1; i < 100; i++) {
		char key[32];
		snprintf(key, sizeof key, "provenance:line%d", i);
		const char *s = iniparser_getstring(d, key, NULL);
		if (!s)
			break;
		int w = snprintf(p->provenance + used, sizeof p->provenance - used, "%s%s",
				 used ? "\n" : "", s);
		if (w < 0 || (size_t)w >= sizeof p->provenance - used)
			break;
		used += (size_t)w;
	}
}

int profile_load(const char *path, struct sd_profile *p, struct sd_err *e)
{
	dictionary *d = NULL;
	const char *form;
	int rc = -1, f;
	double df;

	memset(p, 0, sizeof *p);
	if (access(path, R_OK))
		return sd_fail(e, "cannot read profile '%s': %s", path, strerror(errno));
	ini_error[0] = '\0';
	iniparser_set_error_callback(ini_errback);
	d = iniparser_load(path);
	if (!d || ini_error[0]) {
		char *nl = strchr(ini_error, '\n');
		if (nl)
			*nl = '\0';
		sd_fail(e, "cannot read profile '%s': %s", path, ini_error[0] ? ini_error : "not an INI file");
		goto out;
	}
	if (iniparser_find_entry(d, "profile") == 0) {
		sd_fail(e, "profile '%s': no [profile] section", path);
		goto out;
	}
	get_text(d, "profile:name", p->name, sizeof p->name, "unnamed");
	get_text(d, "profile:outcome", p->outcome, sizeof p->outcome, "1RM strength");
	get_text(d, "profile:scale", p->scale, sizeof p->scale, "lnRR");
	if (strcmp(p->scale, "lnRR")) {
		sd_fail(e, "profile '%s': scale '%s' is not supported (only lnRR)", path, p->scale);
		goto out;
	}
	form = iniparser_getstring(d, "profile:form", NULL);
	if (!form || (f = form_find(form)) < 0) {
		sd_fail(e, "profile '%s': form must be linear, log, sqrt or reciprocal", path);
		goto out;
	}
	p->form = (enum sd_form)f;
	if (get_double(d, "profile:dose_min", &p->dose_min, 1, 0, path, e) ||
	    get_double(d, "profile:dose_max", &p->dose_max, 1, 0, path, e) ||
	    get_double(d, "profile:swc", &p->swc, 0, SWC_DEFAULT, path, e) ||
	    get_double(d, "profile:w_direct", &p->w_direct, 0, 1.0, path, e) ||
	    get_double(d, "profile:w_indirect", &p->w_indirect, 0, 0.5, path, e) ||
	    get_double(d, "profile:df", &df, 0, 0, path, e) ||
	    get_double(d, "heterogeneity:tau2", &p->tau2, 1, 0, path, e) ||
	    get_double(d, "heterogeneity:sigma2", &p->sigma2, 0, 0, path, e) ||
	    get_double(d, "heterogeneity:tau2_slope", &p->tau2_slope, 0, 0, path, e) ||
	    get_double(d, "heterogeneity:cov_slope", &p->cov_slope, 0, 0, path, e))
		goto out;
	p->df = (int)df;
	p->slopes = iniparser_getboolean(d, "heterogeneity:slopes", 0);
	if (load_terms(d, path, p, e))
		goto out;
	load_provenance(d, p);
	if (profile_validate(p, e)) {
		sd_wrap(e, "profile '%s'", path);
		goto out;
	}
	rc = 0;
out:
	if (d)
		iniparser_freedict(d);
	return rc;
}

static void write_row(FILE *f, const char *key, const double *v, int n)
{
	fprintf(f, "%-10s = ", key);
	for (int i = 0; i < n; i++)
		fprintf(f, "%s%.12g", i ? ", " : "", v[i]);
	fputc('\n', f);
}

int profile_write(FILE *f, const struct sd_profile *p, struct sd_err *e)
{
	char names[SD_MAX_TERMS * 34] = "";
	const char *s = p->provenance;
	int n = p->nterms, line = 1;

	for (int i = 0; i < n; i++)
		strcat(strcat(names, i ? ", " : ""), p->term[i]);
	fprintf(f, "; setdose dose-response profile (lnRR scale). See setdose(1), PROFILE FILES.\n");
	fprintf(f, "[profile]\nname       = %s\noutcome    = %s\nscale      = %s\nform       = %s\n",
		p->name, p->outcome, p->scale, form_name(p->form));
	fprintf(f, "dose_min   = %.12g\ndose_max   = %.12g\nswc        = %.12g\n", p->dose_min,
		p->dose_max, p->swc);
	fprintf(f, "w_direct   = %.12g\nw_indirect = %.12g\ndf         = %d\n\n", p->w_direct,
		p->w_indirect, p->df);
	fprintf(f, "[terms]\nnames      = %s\n", names);
	write_row(f, "beta", p->beta, n);
	write_row(f, "centre", p->centre, n);
	fprintf(f, "\n[covariance]\n");
	for (int i = 0; i < n; i++)
		write_row(f, p->term[i], &p->vcov[i * n], n);
	fprintf(f, "\n[heterogeneity]\ntau2       = %.12g\nsigma2     = %.12g\nslopes     = %s\n",
		p->tau2, p->sigma2, p->slopes ? "yes" : "no");
	if (p->slopes)
		fprintf(f, "tau2_slope = %.12g\ncov_slope  = %.12g\n", p->tau2_slope, p->cov_slope);
	fprintf(f, "\n[provenance]\n");
	/* One quoted key per line: iniparser has no multi-line values and ';' would start a
	 * comment in an unquoted value. Double quotes cannot be escaped, so they become single. */
	while (*s) {
		size_t len = strcspn(s, "\n");
		fprintf(f, "line%d = \"", line++);
		for (size_t i = 0; i < len; i++)
			fputc(s[i] == '"' ? '\'' : s[i], f);
		fprintf(f, "\"\n");
		s += len;
		if (*s == '\n')
			s++;
	}
	if (ferror(f))
		return sd_fail(e, "cannot write profile: %s", strerror(errno));
	return 0;
}
