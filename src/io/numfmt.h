/* Fixed-decimal numbers without the general float formatter: the batch outputs (audit
 * --summary, audit --all) write millions of them, and printf's exact decimal expansion was
 * nine tenths of the run. The text is byte for byte what printf("%.*f") writes (tested against
 * it over a sweep of millions of values): where a value lies too close to a rounding tie for
 * a double's product to decide, it is handed to snprintf. */
#ifndef SD_NUMFMT_H
#define SD_NUMFMT_H

/* Writes v with dec decimals (0..6) at p, NUL-terminated; returns the end (the NUL). p needs
 * room for 32 bytes. */
char *nf_fixed(char *p, double v, int dec);
/* The same, right-aligned in width columns as "%*.*f" writes it. */
char *nf_pad(char *p, double v, int width, int dec);

#endif
