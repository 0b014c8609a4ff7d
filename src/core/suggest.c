#include "suggest.h"

#include <ctype.h>
#include <string.h>

#define SUG_LEN 64   /* longer names are compared on their first 63 bytes */

static void lower(const char *s, char *out)
{
	int i = 0;
	for (; s[i] && i < SUG_LEN - 1; i++)
		out[i] = (char)tolower((unsigned char)s[i]);
	out[i] = '\0';
}

/* One row of the dynamic programme; strings longer than this compare by length alone. */
#define EDIT_MAX 160

int sd_edit_distance(const char *a, const char *b)
{
	int la = (int)strlen(a), lb = (int)strlen(b), row[EDIT_MAX + 1];

	if (la > EDIT_MAX || lb > EDIT_MAX)
		return la > lb ? la : lb;
	for (int j = 0; j <= lb; j++)
		row[j] = j;
	for (int i = 1; i <= la; i++) {
		int diag = row[0], up;
		row[0] = i;
		for (int j = 1; j <= lb; j++) {
			int best = diag + (a[i - 1] != b[j - 1]);
			up = row[j];
			if (up + 1 < best)
				best = up + 1;
			if (row[j - 1] + 1 < best)
				best = row[j - 1] + 1;
			row[j] = best;
			diag = up;
		}
	}
	return row[lb];
}

/* Words of a that also occur in b (both lowercased, split on spaces). */
static int shared_words(const char *a, const char *b)
{
	char wa[SUG_LEN], wb[SUG_LEN], *sa, *sb, *ta, *tb;
	int n = 0;

	strcpy(wa, a);
	for (ta = strtok_r(wa, " ", &sa); ta; ta = strtok_r(NULL, " ", &sa)) {
		strcpy(wb, b);
		for (tb = strtok_r(wb, " ", &sb); tb; tb = strtok_r(NULL, " ", &sb))
			if (!strcmp(ta, tb)) {
				n++;
				break;
			}
	}
	return n;
}

int sd_suggest(const char *name, const char *base, size_t stride, int n, int *out, int k)
{
	int shared[SD_SUGGEST_MAX], dist[SD_SUGGEST_MAX], found = 0;
	char q[SUG_LEN], c[SUG_LEN];

	if (k > SD_SUGGEST_MAX)
		k = SD_SUGGEST_MAX;
	lower(name, q);
	for (int i = 0; i < n && k > 0; i++) {
		int s, d, pos;
		lower(base + (size_t)i * stride, c);
		s = shared_words(q, c);
		d = sd_edit_distance(q, c);
		if (!s && d > (int)strlen(q) / 3 + 2)
			continue;
		/* Insertion into the short ranked list. */
		for (pos = found; pos > 0 && (s > shared[pos - 1] ||
					      (s == shared[pos - 1] && d < dist[pos - 1])); pos--)
			if (pos < k) {
				shared[pos] = shared[pos - 1];
				dist[pos] = dist[pos - 1];
				out[pos] = out[pos - 1];
			}
		if (pos >= k)
			continue;
		shared[pos] = s;
		dist[pos] = d;
		out[pos] = i;
		if (found < k)
			found++;
	}
	return found;
}
