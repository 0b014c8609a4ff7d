/* The global options (main.c takes them from anywhere on the line), as an option table. */
#include <stdio.h>
#include <string.h>

#include "../app/parse.h"
#include "cmd.h"


static int parse_number(const char *opt, const char *v, double lo, double hi, double *out,
			struct sd_err *e)
{
	char what[32];
	snprintf(what, sizeof what, "--%s", opt);
	return app_num(what, v, lo, hi, out, e);
}

/* Each global option by name (the table below), with its own checks. */
static int gapply(void *dst, const struct sd_optdef *d, const char *v, struct sd_err *e)
{
	struct gvals *g = dst;
	struct sd_opts *o = &g->o;
	const char *name = d->name;
	double x;

	if (!strcmp(name, "db"))
		o->db_path = v;
	else if (!strcmp(name, "profile"))
		o->profile_path = v;
	else if (!strcmp(name, "exercises"))
		o->exercises_path = v;
	else if (!strcmp(name, "format")) {
		if (!strcmp(v, "table"))
			o->format = SD_FMT_TABLE;
		else if (!strcmp(v, "csv"))
			o->format = SD_FMT_CSV;
		else if (!strcmp(v, "json"))
			o->format = SD_FMT_JSON;
		else
			return sd_usage(e, "--format wants table, csv or json, not '%s'", v);
	} else if (!strcmp(name, "status")) {
		if (strcmp(v, "trained") && strcmp(v, "untrained"))
			return sd_usage(e, "--status wants trained or untrained, not '%s'", v);
		o->status_set = 1;
		o->trained = !strcmp(v, "trained");
	} else if (!strcmp(name, "weeks")) {
		if (parse_number(name, v, SD_WEEKS_MIN, SD_WEEKS_MAX, &o->weeks, e))
			return -1;
		o->weeks_set = 1;
	} else if (!strcmp(name, "level")) {
		if (parse_number(name, v, 0.5, 0.999, &o->level, e))
			return -1;
	} else if (!strcmp(name, "swc")) {
		if (parse_number(name, v, 0.1, 50, &o->swc_pct, e))
			return -1;
		o->swc_set = 1;
	} else if (!strcmp(name, "units")) {
		if (strcmp(v, "kg") && strcmp(v, "lb"))
			return sd_usage(e, "--units wants kg or lb, not '%s'", v);
		o->units_lb = !strcmp(v, "lb");
		o->units_set = 1;
	} else if (!strcmp(name, "max-rir")) {
		if (parse_number(name, v, 0, 10, &x, e))
			return -1;
		o->max_rir = (int)x;
		if (x != o->max_rir)
			return sd_usage(e, "--max-rir wants a whole number, not '%s'", v);
	} else if (!strcmp(name, "no-color"))
		o->color = 0;
	else if (!strcmp(name, "version"))
		g->version = 1;
	else if (!strcmp(name, "help"))
		g->help = 1;
	return 0;
}

#define G(n, a, h) { n, OPT_CALL, 0, 0, 0, gapply, a, h }
const struct sd_optdef sd_global_opts[] = {
	G("db", "PATH", "database (default $XDG_DATA_HOME/setdose/setdose.db, or SETDOSE_DB)"),
	G("profile", "PATH", "dose-response profile (default: bundled strength.ini)"),
	G("exercises", "FILE", "one more exercise library file for this run"),
	G("format", "FMT", "table, csv or json"),
	G("status", "S", "trained or untrained (default untrained)"),
	G("weeks", "N", "block length in weeks (default: the program's, else 10)"),
	G("level", "L", "confidence level (default 0.95)"),
	G("swc", "PCT", "smallest worthwhile change in percent (default: the profile's)"),
	G("max-rir", "N", "sets with RIR above N are not hard sets (default 4)"),
	G("units", "U", "load units, kg or lb"),
	G("no-color", NULL, "no colour (NO_COLOR is honoured too)"),
	G("version", NULL, "print the version and the database schema version"),
	G("help", NULL, "this text; after a command, that command's help"),
};
#undef G

const int sd_nglobal_opts = OPT_N(sd_global_opts);
