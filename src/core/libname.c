/* Exercise names as coaches type them: folding for lookups and suggestions for unknown names.
 *
 * A name folds word by word: lowercase; apostrophes and dots dropped; space, tab, '-', '_',
 * '/', '&', ',' and parentheses separate words; a few abbreviations are spelled out (db, bb,
 * kb, sl, sa, cg, alt, inc, ext, rev, oh...); each word is made singular by spelling rules
 * (curls, presses, flies, crunches, push-ups); then the words are joined. Both the library
 * and the program go through the same folding, so a rule need not be good English, only
 * consistent; lib_index refuses two exercises that fold to one name. */
#include "library.h"
#include "suggest.h"

#include <stdlib.h>
#include <string.h>

#define WORD_MAX 40
#define WORDS_MAX 24

struct words {
	char w[WORDS_MAX][WORD_MAX];
	int n;
	int overflow;
};

/* Word abbreviations and spellings coaches use; common practice, no source. */
#define A(from, to) { from, sizeof from - 1, to }
static const struct { const char *from; size_t len; const char *to; } abbrev[] = {
	A("db", "dumbbell"), A("dumbell", "dumbbell"), A("bb", "barbell"), A("kb", "kettlebell"),
	A("bw", "bodyweight"), A("sl", "single leg"), A("sa", "single arm"), A("cg", "close grip"),
	A("wg", "wide grip"), A("ng", "neutral grip"), A("alt", "alternating"), A("inc", "incline"),
	A("incl", "incline"), A("dec", "decline"), A("ext", "extension"), A("rev", "reverse"),
	A("oh", "overhead"), A("bicep", "biceps"), A("tricep", "triceps"), A("tri", "triceps"),
	A("flye", "fly"), A("mil", "military"),
};
#undef A

/* Whether the n-letter word w ends in the k letters of e. */
static int ends(const char *w, size_t n, const char *e, size_t k)
{
	return n >= k && !memcmp(w + n - k, e, k);
}

/* Spelling rules for plurals; the exceptions keep words that only look plural. */
static void singular(char *w)
{
	size_t n = strlen(w);

	if (n < 3 || w[n - 1] != 's')
		return;
	if (n == 6 && !memcmp(w, "calves", 6)) {
		memcpy(w, "calf", 5);
		return;
	}
	if (ends(w, n, "ceps", 4) || ends(w, n, "ss", 2) || ends(w, n, "us", 2) ||
	    ends(w, n, "is", 2))      /* biceps, press, ... */
		return;
	if (n > 4 && ends(w, n, "ies", 3)) {              /* flies */
		memcpy(w + n - 3, "y", 2);
		return;
	}
	if (n > 4 && (ends(w, n, "sses", 4) || ends(w, n, "ches", 4) || ends(w, n, "shes", 4))) {
		w[n - 2] = '\0';                          /* presses, crunches, pushes */
		return;
	}
	if (n > 3 && ends(w, n, "xes", 3)) {              /* boxes */
		w[n - 2] = '\0';
		return;
	}
	w[n - 1] = '\0';
}

static void add_word(struct words *ws, const char *w, size_t len)
{
	if (!len)
		return;
	if (ws->n == WORDS_MAX || len >= WORD_MAX) {
		ws->overflow = 1;
		return;
	}
	memcpy(ws->w[ws->n], w, len);
	ws->w[ws->n][len] = '\0';
	ws->n++;
}

/* Spells out an abbreviation (possibly as two words), if w is one. */
static int expand(struct words *ws, const char *w)
{
	/* Every library name passes here on every run: reject most words on length and first
	 * letter before comparing. */
	size_t n = strnlen(w, 8);
	if (n < 2 || n > 7)
		return 0;
	for (size_t i = 0; i < sizeof abbrev / sizeof *abbrev; i++)
		if (abbrev[i].len == n && w[0] == abbrev[i].from[0] && !memcmp(w, abbrev[i].from, n)) {
			const char *sp = strchr(abbrev[i].to, ' ');
			if (sp) {
				add_word(ws, abbrev[i].to, (size_t)(sp - abbrev[i].to));
				add_word(ws, sp + 1, strlen(sp + 1));
			} else {
				add_word(ws, abbrev[i].to, strlen(abbrev[i].to));
			}
			return 1;
		}
	return 0;
}

/* One word: an abbreviation as written or once singular ("flyes" -> "flye" -> "fly"), else
 * the singular. "one" and "1" before arm, leg or hand mean single. */
static void put_word(struct words *ws, char *w, const char *next)
{
	if (expand(ws, w))
		return;
	if ((!strcmp(w, "one") || !strcmp(w, "1")) && next &&
	    (!strncmp(next, "arm", 3) || !strncmp(next, "leg", 3) || !strncmp(next, "hand", 4))) {
		add_word(ws, "single", 6);
		return;
	}
	size_t n = strlen(w);
	singular(w);
	if (strlen(w) == n || !expand(ws, w))   /* "flyes" -> "flye" -> "fly" */
		add_word(ws, w, strlen(w));
}

static int separator(unsigned char c)
{
	return c == ' ' || c == '\t' || c == '-' || c == '_' || c == '/' || c == '&' || c == ',' ||
	       c == '(' || c == ')' || c == '+';
}

/* Splits and folds a name into words. */
static void split(const char *in, struct words *ws)
{
	char raw[WORDS_MAX + 1][WORD_MAX];
	int nraw = 0;
	size_t len = 0;

	ws->n = 0;
	ws->overflow = 0;
	for (const unsigned char *s = (const unsigned char *)in;; s++) {
		if (!*s || separator(*s)) {
			if (len) {
				if (nraw == WORDS_MAX) {
					ws->overflow = 1;
					break;
				}
				raw[nraw][len] = '\0';
				nraw++;
				len = 0;
			}
			if (!*s)
				break;
			continue;
		}
		/* apostrophes (ASCII and U+2019) and dots vanish: farmer's = farmers, t.bar = tbar */
		if (*s == '\'' || *s == '.' || *s == '`')
			continue;
		if (s[0] == 0xE2 && s[1] == 0x80 && s[2] == 0x99) {
			s += 2;
			continue;
		}
		if (len + 1 >= WORD_MAX) {
			ws->overflow = 1;
			continue;
		}
		raw[nraw][len++] = (char)(*s >= 'A' && *s <= 'Z' ? *s + 32 : *s);
	}
	for (int i = 0; i < nraw; i++)
		put_word(ws, raw[i], i + 1 < nraw ? raw[i + 1] : NULL);
}

static int join(const struct words *ws, char *buf, int size)
{
	int n = 0, rc = ws->overflow ? -1 : 0;

	for (int i = 0; i < ws->n; i++)
		for (const char *c = ws->w[i]; *c; c++) {
			if (n >= size - 1) {
				rc = -1;
				goto done;
			}
			buf[n++] = *c;
		}
done:
	buf[n] = '\0';
	return rc;
}

int lib_norm(const char *in, char *buf, int size)
{
	struct words ws;
	split(in, &ws);
	return join(&ws, buf, size);
}

unsigned lib_hash(const char *key)
{
	unsigned h = 2166136261u;
	for (const unsigned char *s = (const unsigned char *)key; *s; s++)
		h = (h ^ *s) * 16777619u;
	return h;
}

/* Words that say how, not what: a shared "dumbbell" is weaker evidence than a shared "row". */
static int weight(const char *w)
{
	static const char *const weak[] = { "dumbbell", "barbell", "cable", "machine", "kettlebell",
					     "single", "arm", "leg", "seated", "standing", "lying",
					     "grip", "one", "bodyweight", "smith", "band", NULL };
	for (int i = 0; weak[i]; i++)
		if (!strcmp(w, weak[i]))
			return 1;
	return 2;
}

/* Two folded words are the same word, or one a slip of the other ("squatz", "raize"). */
static int same_word(const char *a, const char *b)
{
	if (!strcmp(a, b))
		return 1;
	return strlen(a) >= 5 && strlen(b) >= 5 && sd_edit_distance(a, b) <= 1;
}

/* Weighted count of the query's words found in a name. */
static int overlap(const struct words *q, const struct words *c)
{
	int score = 0;
	for (int i = 0; i < q->n; i++)
		for (int j = 0; j < c->n; j++)
			if (same_word(q->w[i], c->w[j])) {
				score += weight(q->w[i]);
				break;
			}
	return score;
}

struct cand {
	int ex, shared, dist;
};

/* Better first: more shared words, then closer spelling, then library order. */
static int better(const struct cand *a, const struct cand *b)
{
	if (a->shared != b->shared)
		return a->shared > b->shared;
	return a->dist < b->dist;
}

static void score(const char *name, const struct words *q, const char *qkey, struct cand *c)
{
	struct words w;
	char key[SD_KEY_MAX];

	split(name, &w);
	join(&w, key, sizeof key);
	int s = overlap(q, &w), d = sd_edit_distance(qkey, key);
	/* A name containing the whole query ("squat" in "box squat") is close in spelling too. */
	if (strlen(qkey) >= 4 && strstr(key, qkey) && d > 2)
		d = 2;
	struct cand x = { c->ex, s, d };
	if (better(&x, c))
		*c = x;
}

int lib_suggest(const struct sd_library *lib, const char *name, int *out, int k)
{
	struct cand best[8];
	struct words q;
	char qkey[SD_KEY_MAX];
	int n = 0, limit;

	if (k > 8)
		k = 8;
	split(name, &q);
	join(&q, qkey, sizeof qkey);
	limit = (int)strlen(qkey) / 3 + 2;   /* beyond this a spelling "suggestion" is noise */
	for (int i = 0; i < lib->n; i++) {
		const struct sd_exercise *x = &lib->ex[i];
		struct cand c = { i, -1, 1 << 20 };
		score(x->name, &q, qkey, &c);
		for (int j = 0; j < x->naliases; j++)
			score(x->aliases[j], &q, qkey, &c);
		for (int a = 0; a < lib->nal; a++)
			if (lib->al[a].ntargets == 1 && lib->al[a].ex[0] == i)
				score(lib->al[a].name, &q, qkey, &c);
		if (c.shared <= 0 && c.dist > limit)
			continue;
		int pos = n < k ? n++ : k;
		if (pos == k) {
			if (!better(&c, &best[k - 1]))
				continue;
			pos = k - 1;
		}
		while (pos > 0 && better(&c, &best[pos - 1])) {
			best[pos] = best[pos - 1];
			pos--;
		}
		best[pos] = c;
	}
	for (int i = 0; i < n; i++)
		out[i] = best[i].ex;
	return n;
}
