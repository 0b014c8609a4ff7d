#include "volume.h"

#include <stdlib.h>
#include <string.h>

double vol_day(const struct sd_volume *v, int d, int m)
{
	return v->day[(size_t)d * SD_NMUSCLES + (size_t)m];
}

/* Whether a group's sets are hard sets. RIR values are whole, half or quarter (a range's
 * midpoint) numbers, exact in binary, so the comparison with the whole-number limit is exact. */
static int is_hard(const struct sd_entry *en, const struct sd_exercise *x, int max_rir)
{
	if (en->flags & SD_SET_WARMUP)
		return 0;
	return x->ungraded || en->rir < 0 || en->rir <= max_rir;
}

/* Adds sets of exercise ex to muscle m's sources (a short linear list per muscle). */
static int add_source(struct sd_volume *v, int *cap, int m, int ex, double dir, double ind,
		      double frac, struct sd_err *e)
{
	for (int i = 0; i < v->nsrc; i++)
		if (v->src[i].muscle == m && v->src[i].ex == ex) {
			v->src[i].direct += dir;
			v->src[i].indirect += ind;
			v->src[i].fractional += frac;
			return 0;
		}
	if (v->nsrc == *cap) {
		int ncap = *cap ? *cap * 2 : 32;
		struct sd_source *ns = realloc(v->src, (size_t)ncap * sizeof *ns);
		if (!ns)
			return sd_fail(e, "out of memory");
		v->src = ns;
		*cap = ncap;
	}
	v->src[v->nsrc++] = (struct sd_source){ m, ex, dir, ind, frac };
	return 0;
}

static int source_order(const void *pa, const void *pb)
{
	const struct sd_source *a = pa, *b = pb;
	if (a->muscle != b->muscle)
		return a->muscle - b->muscle;
	if (a->fractional != b->fractional)
		return a->fractional > b->fractional ? -1 : 1;
	return a->ex - b->ex;
}

void vol_weights(const struct sd_exercise *x, double w_direct, double w_indirect,
		 double w[SD_NMUSCLES])
{
	for (int m = 0; m < SD_NMUSCLES; m++)
		w[m] = x->direct >> m & 1 ? w_direct : x->indirect >> m & 1 ? w_indirect : 0;
}

int vol_count(const struct sd_program *p, const struct sd_library *lib, double w_direct,
	      double w_indirect, int max_rir, struct sd_volume *v, struct sd_err *e)
{
	double w[SD_NMUSCLES];
	int cap = 0;

	memset(v, 0, sizeof *v);
	v->ndays = p->ndays;
	v->day = calloc((size_t)(p->ndays ? p->ndays : 1) * SD_NMUSCLES, sizeof *v->day);
	if (!v->day)
		return sd_fail(e, "out of memory");

	for (int i = 0; i < p->nentries; i++) {
		const struct sd_entry *en = &p->entries[i];
		const struct sd_exercise *x = &lib->ex[en->ex];

		if (en->flags & SD_SET_WARMUP) {
			v->warmup_sets += en->sets;
			continue;
		}
		if (!is_hard(en, x, max_rir)) {
			v->easy_sets += en->sets;
			for (int m = 0; m < SD_NMUSCLES; m++)
				if ((x->direct | x->indirect) >> m & 1)
					v->m[m].easy += en->sets;
			continue;
		}
		v->hard_sets += en->sets;
		if (en->rir < 0 && !x->ungraded)
			v->unknown_rir += en->sets;
		vol_weights(x, w_direct, w_indirect, w);
		for (int m = 0; m < SD_NMUSCLES; m++) {
			double dir = 0, ind = 0;
			if (!((x->direct | x->indirect) >> m & 1))
				continue;
			if (x->direct >> m & 1)
				dir = en->sets;
			else
				ind = en->sets;
			v->m[m].direct += dir;
			v->m[m].indirect += ind;
			v->day[(size_t)en->day * SD_NMUSCLES + (size_t)m] += w[m] * en->sets;
			if (add_source(v, &cap, m, en->ex, dir, ind, w[m] * en->sets, e))
				goto fail;
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
	if (v->nsrc)
		qsort(v->src, (size_t)v->nsrc, sizeof *v->src, source_order);
	return 0;
fail:
	vol_free(v);
	return -1;
}

const struct sd_source *vol_sources(const struct sd_volume *v, int m, int *n)
{
	int i = 0, k = 0;
	while (i < v->nsrc && v->src[i].muscle < m)
		i++;
	while (i + k < v->nsrc && v->src[i + k].muscle == m)
		k++;
	*n = k;
	return k ? &v->src[i] : NULL;
}

void vol_free(struct sd_volume *v)
{
	free(v->day);
	free(v->src);
	v->day = NULL;
	v->src = NULL;
	v->nsrc = 0;
}
