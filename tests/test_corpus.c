/* The program-line corpus (tests/data/program-corpus.txt): realistic lines in every notation
 * and the bad forms, each with its expected count, note or one-line error, read against the
 * bundled library. Run from the top folder. */
#include "testutil.h"

#include <stdlib.h>
#include <string.h>

#include "core/volume.h"
#include "io/library_io.h"
#include "io/program_io.h"

static struct sd_library lib;

static int setup(void **state)
{
	(void)state;
	memset(&lib, 0, sizeof lib);
	return tu_bundled_library(&lib);
}

static int teardown(void **state)
{
	(void)state;
	lib_free(&lib);
	return 0;
}

/* Checks one corpus entry; returns 0 or prints why not and returns -1. */
static int check(int lineno, const char *line, char *expect)
{
	char text[600];
	struct sd_program p;
	struct sd_volume v;
	struct sd_err e;
	int rc = -1;

	snprintf(text, sizeof text, "[day]\n%s\n", line);
	sd_err_clear(&e);
	int parsed = program_parse("corpus", text, strlen(text), 0, &lib, &p, &e);
	if (!strncmp(expect, "error: ", 7)) {
		char want[700];
		snprintf(want, sizeof want, "cannot read program 'corpus' line 2: %s", expect + 7);
		if (parsed == 0) {
			fprintf(stderr, "corpus line %d: accepted, expected error: %s\n", lineno, want);
			prog_free(&p);
			return -1;
		}
		if (strcmp(e.msg, want) || e.nmore || strchr(e.msg, '\n')) {
			fprintf(stderr, "corpus line %d:\n  got  %s\n  want %s\n", lineno, e.msg, want);
			return -1;
		}
		return 0;
	}
	if (parsed) {
		fprintf(stderr, "corpus line %d: %s\n", lineno, e.msg);
		return -1;
	}
	if (vol_count(&p, &lib, 1.0, 0.5, 4, &v, &e)) {
		prog_free(&p);
		return -1;
	}
	char *note = strstr(expect, "note: ");
	if (note) {
		*note = '\0';
		note += 6;
		if (p.nnotes != 1 || !strstr(p.notes[0].text, note)) {
			fprintf(stderr, "corpus line %d: want the note '%s', got %d note(s)%s%s\n", lineno,
				note, p.nnotes, p.nnotes ? ": " : "", p.nnotes ? p.notes[0].text : "");
			goto done;
		}
	} else if (p.nnotes) {
		fprintf(stderr, "corpus line %d: unexpected note '%s'\n", lineno, p.notes[0].text);
		goto done;
	}
	int seen = 0;
	for (char *tok = strtok(expect, " "); tok; tok = strtok(NULL, " ")) {
		char *eq = strchr(tok, '=');
		if (!eq) {
			fprintf(stderr, "corpus line %d: bad expectation '%s'\n", lineno, tok);
			goto done;
		}
		*eq = '\0';
		double want = atof(eq + 1), got;
		int m = muscle_find(tok);
		if (!strcmp(tok, "hard"))
			got = v.hard_sets, seen |= 1;
		else if (!strcmp(tok, "easy"))
			got = v.easy_sets, seen |= 2;
		else if (!strcmp(tok, "warmup"))
			got = v.warmup_sets, seen |= 4;
		else if (m >= 0)
			got = v.m[m].fractional;
		else {
			fprintf(stderr, "corpus line %d: unknown field '%s'\n", lineno, tok);
			goto done;
		}
		if (got != want) {
			fprintf(stderr, "corpus line %d: %s = %g, expected %g\n", lineno, tok, got, want);
			goto done;
		}
	}
	if (seen != 7) {
		fprintf(stderr, "corpus line %d: hard, easy and warmup must all be given\n", lineno);
		goto done;
	}
	rc = 0;
done:
	vol_free(&v);
	prog_free(&p);
	return rc;
}

static void test_corpus(void **state)
{
	FILE *f = fopen("tests/data/program-corpus.txt", "r");
	char buf[1024];
	int lineno = 0, n = 0, bad = 0, errors = 0, notations = 0;

	(void)state;
	assert_non_null(f);
	while (fgets(buf, sizeof buf, f)) {
		lineno++;
		buf[strcspn(buf, "\n")] = '\0';
		if (!buf[0] || buf[0] == '#')
			continue;
		char *tab = strchr(buf, '\t');
		if (!tab) {
			fprintf(stderr, "corpus line %d: no tab\n", lineno);
			bad++;
			continue;
		}
		*tab = '\0';
		n++;
		errors += !strncmp(tab + 1, "error: ", 7);
		notations += !!strchr(buf, '@') + !!strstr(buf, "RIR") + !!strstr(buf, "RPE");
		bad += check(lineno, buf, tab + 1) != 0;
	}
	fclose(f);
	if (bad)
		fail_msg("%d of %d corpus lines failed", bad, n);
	assert_true(n >= 40);
	assert_true(errors >= 15);
	assert_true(n - errors >= 40);
	assert_true(notations >= 30);
}

int main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(test_corpus),
	};
	return cmocka_run_group_tests_name("corpus", tests, setup, teardown);
}
