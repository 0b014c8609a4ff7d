/* Distribution helpers over GSL, so the rest of core never names gsl types. */
#ifndef SD_STATS_H
#define SD_STATS_H

/* Two-sided critical value for a confidence level (e.g. 0.95): the normal quantile when
 * df <= 0, else Student's t with df degrees of freedom. */
double st_crit(double level, int df);
/* Upper-tail quantile: the p-quantile of N(0,1) or t(df). */
double st_quantile(double p, int df);
/* Cumulative probability P(Z <= z) for N(0,1) (df <= 0) or t(df). */
double st_cdf(double z, int df);

#endif
