/* Effect sizes on the log ratio of means (lnRR) scale with their sampling variances.
 *
 * Two independent groups: Hedges, Gurevitch & Curtis (1999), Ecology 80:1150-1156.
 * One group measured before and after (pre-post, correlation r between the two measurements):
 * Lajeunesse (2011), Ecology 92:2049-2055. Both are the large-sample (delta-method) variances. */
#ifndef SD_EFFECTS_H
#define SD_EFFECTS_H

#include "err.h"

struct sd_effect {
	double yi;   /* lnRR */
	double vi;   /* its sampling variance */
};

/* lnRR = ln(m1/m2) of two independent groups, v = sd1^2/(n1 m1^2) + sd2^2/(n2 m2^2).
 * Fails (message without file or line) on non-positive means, n < 2, negative SDs or v <= 0. */
int eff_rom(double m1, double sd1, double n1, double m2, double sd2, double n2,
	    struct sd_effect *out, struct sd_err *e);
/* Pre-post lnRR = ln(m_post/m_pre) with v = [sd_post^2/m_post^2 + sd_pre^2/m_pre^2
 * - 2 r sd_post sd_pre/(m_post m_pre)] / n. Fails on non-positive means, n < 2, |r| > 1,
 * negative SDs or v <= 0. */
int eff_romc(double m_pre, double m_post, double sd_pre, double sd_post, double n, double r,
	     struct sd_effect *out, struct sd_err *e);

#endif
