/* Names and labels: UTF-8 validity, control and bidirectional control characters, and the
 * repair that keeps JSON output valid UTF-8. Byte sequences follow RFC 3629 (Yergeau 2003),
 * section 3 and its table of well-formed sequences; the bidirectional controls are those of
 * Unicode Standard Annex #9 (embeddings, overrides, isolates). */
#include "testutil.h"

#include <stdlib.h>
#include <string.h>

#include "core/text.h"

struct text_case {
	const char *s;
	long bad_at;          /* -1: accepted; else the byte offset in the message */
	const char *problem;  /* part of the message */
};

static const struct text_case cases[] = {
	{ "Ada Example", -1, NULL },
	{ "Ma\xc3\xaf" "a \xe2\x80\x93 K\xc3\xb6rber", -1, NULL },             /* ï, en dash, ö */
	{ "\xf0\x9f\x8f\x8b lifter", -1, NULL },                            /* U+1F3CB, 4 bytes */
	{ "", -1, NULL },
	{ "bad\xff", 3, "not UTF-8 (0xFF)" },
	{ "\x80start", 0, "not UTF-8 (0x80)" },                            /* lone continuation */
	{ "over\xc0\xaflong", 4, "not UTF-8 (0xC0)" },                      /* overlong '/' */
	{ "e0\xe0\x80\xafx", 2, "not UTF-8 (0xE0)" },                      /* overlong, 3 bytes */
	{ "sur\xed\xa0\x80", 3, "not UTF-8 (0xED)" },                      /* U+D800 surrogate */
	{ "big\xf4\x90\x80\x80", 3, "not UTF-8 (0xF4)" },                  /* past U+10FFFF */
	{ "cut\xe2\x80", 3, "not UTF-8 (0xE2)" },                          /* truncated */
	{ "tab\there", 3, "control character (U+0009)" },
	{ "nl\n", 2, "control character (U+000A)" },
	{ "del\x7f", 3, "control character (U+007F)" },
	{ "c1\xc2\x85", 2, "control character (U+0085)" },                 /* NEL */
	{ "Eve\xe2\x80\xaelin", 3, "bidirectional control character (U+202E)" },
	{ "x\xe2\x80\xaay", 1, "bidirectional control character (U+202A)" },
	{ "x\xe2\x81\xa6y", 1, "bidirectional control character (U+2066)" },
	{ "x\xe2\x81\xa9y", 1, "bidirectional control character (U+2069)" },
	{ "x\xe2\x80\x8ey", -1, NULL },                                     /* LRM is a mark: allowed */
};

static void check_table(void **state)
{
	(void)state;
	for (size_t i = 0; i < sizeof cases / sizeof cases[0]; i++) {
		const struct text_case *c = &cases[i];
		struct sd_err e = { 0 };
		int rc = text_check("athlete name", c->s, strlen(c->s), &e);
		if (c->bad_at < 0) {
			if (rc)
				fail_msg("case %zu rejected: %s", i, e.msg);
			continue;
		}
		char at[48];
		snprintf(at, sizeof at, "at byte %ld", c->bad_at);
		if (!rc || !strstr(e.msg, c->problem) || !strstr(e.msg, at) ||
		    strncmp(e.msg, "athlete name has ", 17))
			fail_msg("case %zu: rc %d, message '%s'", i, rc, e.msg);
	}
}

static void repair_is_valid(void **state)
{
	(void)state;
	for (size_t i = 0; i < sizeof cases / sizeof cases[0]; i++) {
		char *r = text_repair(cases[i].s);
		assert_non_null(r);
		/* Valid UTF-8 afterwards (control characters are valid UTF-8 and stay). */
		for (size_t k = 0; r[k];) {
			size_t len = text_utf8_len((const unsigned char *)r + k, strlen(r + k));
			if (!len)
				fail_msg("case %zu: byte %zu still invalid after repair", i, k);
			k += len;
		}
		free(r);
	}
	char *r = text_repair("a\xff" "b\xc3");
	assert_string_equal(r, "a\xef\xbf\xbd" "b\xef\xbf\xbd");
	free(r);
	r = text_repair("caf\xc3\xa9");
	assert_string_equal(r, "caf\xc3\xa9");   /* valid text is left as it is */
	free(r);
}

int main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(check_table),
		cmocka_unit_test(repair_is_valid),
	};
	return cmocka_run_group_tests(tests, NULL, NULL);
}
