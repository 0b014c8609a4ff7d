#include "volume.h"

#include <stdlib.h>
#include <string.h>

double vol_day(const struct sd_volume *v, int d, int m)
{
	return v->day[(size_t)d * SD_NMUSCLES + (size_t)m];
}

int vol_count(const struct sd_program *p, const struct sd_library *lib, double w_direct,
	      double w_indirect, int max_rir, struct sd_volume *v, struct sd_err *e)
{
	memset(v, 0, sizeof *v);
	v->ndays = p->ndays;
	v->day = calloc((size_t)(p->ndays ? p->ndays : 1) * SD_NMUSCLES, sizeof *v->day);
	if (!v->day)
		return sd_fail(e, "out of memory");

	for (int i = 0; i < p->nentries; i++) {
		const struct sd_entry *en = &p->entries[i];
		const struct sd_exercise *x = &lib->ex[en->ex];
		/* An unstated RIR counts as hard: programs that omit it usually mean working sets. */
		int hard = en->rir < 0 || en->rir <= max_rir;

		if (!hard) {
			v->easy_sets += en->sets;
			for (int m = 0; m < SD_NMUSCLES; m++)
				if ((x->direct | x->indirect) >> m & 1)
					v->m[m].easy += en->sets;
			continue;
		}
		v->hard_sets += en->sets;
		if (en->rir < 0)
			v->unknown_rir += en->sets;
		for (int m = 0; m < SD_NMUSCLES; m++) {
			double w = 0;
			/* A muscle listed both ways counts once, as direct. */
			if (x->direct >> m & 1) {
				v->m[m].direct += en->sets;
				w = w_direct;
			} else if (x->indirect >> m & 1) {
				v->m[m].indirect += en->sets;
				w = w_indirect;
			}
			v->day[(size_t)en->day * SD_NMUSCLES + (size_t)m] += w * en->sets;
		}
	}
	for (int m = 0; m < SD_NMUSCLES; m++) {
		struct sd_mdose *d = &v->m[m];
		d->fractional = w_direct * d->direct + w_indirect * d->indirect;
		for (int day = 0; day < p->ndays; day++) {
			double f = vol_day(v, day, m);
			if (f > 0)
				d->sessions++;
			if (f > d->max_session)
				d->max_session = f;
		}
	}
	return 0;
}

void vol_free(struct sd_volume *v)
{
	free(v->day);
	v->day = NULL;
}
