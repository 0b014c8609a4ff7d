#include "stats.h"

#include <gsl/gsl_cdf.h>

double st_quantile(double p, int df)
{
	return df > 0 ? gsl_cdf_tdist_Pinv(p, df) : gsl_cdf_ugaussian_Pinv(p);
}

double st_crit(double level, int df)
{
	return st_quantile(0.5 + level / 2.0, df);
}

double st_cdf(double z, int df)
{
	return df > 0 ? gsl_cdf_tdist_P(z, df) : gsl_cdf_ugaussian_P(z);
}
