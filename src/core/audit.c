#include "audit.h"

#include <stdarg.h>
#include <stdio.h>
#include <string.h>

static void warn(struct sd_audit *a, int muscle, int day, const char *fmt, ...)
	__attribute__((format(printf, 4, 5)));

static void warn(struct sd_audit *a, int muscle, int day, const char *fmt, ...)
{
	va_list ap;
	if (a->nwarn >= SD_MAX_WARN)
		return;
	struct sd_warning *w = &a->warn[a->nwarn++];
	if (a->nwarn == SD_MAX_WARN) {   /* the last slot says that more were left out */
		w->muscle = w->day = -1;
		snprintf(w->text, sizeof w->text, "more warnings not shown");
		return;
	}
	w->muscle = muscle;
	w->day = day;
	va_start(ap, fmt);
	vsnprintf(w->text, sizeof w->text, fmt, ap);
	va_end(ap);
}

int audit_run(const struct sd_program *prog, const struct sd_library *lib,
	      const struct sd_profile *prof, const struct sd_covars *cov,
	      const struct sd_audit_opts *o, struct sd_audit *out, struct sd_err *e)
{
	memset(out, 0, sizeof *out);
	out->cov = *cov;
	out->level = o->level;
	if (vol_count(prog, lib, prof->w_direct, prof->w_indirect, o->max_rir, &out->vol, e))
		return -1;
	out->plateau = curve_plateau(prof, cov, 1.0);

	for (int m = 0; m < SD_NMUSCLES; m++) {
		struct sd_audit_row *r = &out->row[m];
		r->dose = out->vol.m[m];
		curve_eval(prof, cov, r->dose.fractional, o->level, &r->pt);
		curve_plus1(prof, cov, r->dose.fractional, o->level, &r->plus1);
		r->zone = curve_zone(prof, out->plateau, r->dose.fractional);
	}

	/* Warnings, most serious first: how the program was read (an old-style effort can empty
	 * the whole count), a context beyond the evidence, extrapolation, per-session load, then
	 * counting notes. */
	for (int i = 0; i < prog->nnotes; i++)
		warn(out, -1, prog->notes[i].day, "%s", prog->notes[i].text);
	char note[200];
	if ((out->beyond = curve_context_note(prof, cov, note, sizeof note)))
		warn(out, -1, -1, "%s; every prediction is flagged", note);
	for (int m = 0; m < SD_NMUSCLES; m++)
		if (out->row[m].zone == SD_ZONE_BEYOND)
			warn(out, m, -1, "%s: %.1f weekly fractional sets is past the evidence (%.0f); "
			     "the curve is extrapolated", muscle_name(m), out->row[m].dose.fractional,
			     prof->dose_max);
	for (int d = 0; d < out->vol.ndays; d++)
		for (int m = 0; m < SD_NMUSCLES; m++) {
			double f = vol_day(&out->vol, d, m);
			if (f > o->session_cap)
				warn(out, m, d, "%s: %.1f fractional sets on '%s' (more than %.0f in one "
				     "session)", muscle_name(m), f, prog->days[d].name, o->session_cap);
		}
	if (out->vol.easy_sets)
		warn(out, -1, -1, "%d set%s with RIR above %d listed but not counted as hard sets",
		     out->vol.easy_sets, out->vol.easy_sets == 1 ? "" : "s", o->max_rir);
	if (out->vol.warmup_sets)
		warn(out, -1, -1, "%d warm-up set%s listed but not counted", out->vol.warmup_sets,
		     out->vol.warmup_sets == 1 ? "" : "s");
	if (out->vol.unknown_rir)
		warn(out, -1, -1, "%d set%s without a stated RIR counted as hard sets",
		     out->vol.unknown_rir, out->vol.unknown_rir == 1 ? "" : "s");
	return 0;
}

void audit_free(struct sd_audit *a)
{
	vol_free(&a->vol);
}
