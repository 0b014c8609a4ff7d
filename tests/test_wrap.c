/* Wrapping prose to the terminal's width: exact lines for the caution, hanging indents,
 * words longer than the line, paragraphs, display width of UTF-8, and the width rule
 * (80 columns when the output is not a terminal). */
#include "testutil.h"

#include <stdlib.h>
#include <string.h>

#include "io/audit_out.h"
#include "io/wrap.h"

/* The text wrap_print writes, in a malloc'd string. */
static char *wrapped(const char *text, int width, int indent)
{
	char *buf = NULL;
	size_t n = 0;
	FILE *f = open_memstream(&buf, &n);
	assert_non_null(f);
	wrap_print(f, width, indent, text);
	fclose(f);
	return buf;
}

static void expect(const char *text, int width, int indent, const char *want)
{
	char *got = wrapped(text, width, indent);
	if (strcmp(got, want))
		fail_msg("wrap to %d (indent %d) of '%s':\n--- got\n%s--- wanted\n%s", width, indent,
			 text, got, want);
	free(got);
}

static void caution_at_80(void **state)
{
	(void)state;
	/* The standard caution, 195 columns on one line before. */
	expect(aout_caution, 80, 0,
	       "Caution: a population-average model; individual responses vary. Progress volume\n"
	       "gradually, stop and see a qualified professional on pain or injury. Not medical\n"
	       "advice; defer to licensed practice.\n");
}

static void caution_at_40(void **state)
{
	(void)state;
	expect(aout_caution, 40, 0,
	       "Caution: a population-average model;\n"
	       "individual responses vary. Progress\n"
	       "volume gradually, stop and see a\n"
	       "qualified professional on pain or\n"
	       "injury. Not medical advice; defer to\n"
	       "licensed practice.\n");
}

static void exact_fit_and_one_over(void **state)
{
	(void)state;
	/* "aaaa bbbb" is 9 columns: fits in 9, breaks in 8. */
	expect("aaaa bbbb", 9, 0, "aaaa bbbb\n");
	expect("aaaa bbbb", 8, 0, "aaaa\nbbbb\n");
	/* A word wider than the line stands alone, uncut. */
	expect("a verylongwordhere b", 6, 0, "a\nverylongwordhere\nb\n");
}

static void hanging_indent(void **state)
{
	(void)state;
	/* A warning's continuation lines start under its text. */
	expect("warning: block length (weeks) 104 is beyond the evidence (4 to 24): the curve "
	       "uses 24", 40, 9,
	       "warning: block length (weeks) 104 is\n"
	       "         beyond the evidence (4 to 24):\n"
	       "         the curve uses 24\n");
	/* A paragraph's own leading spaces stay on its first line. */
	expect("  group    a new group or study (adds the between-study heterogeneity tau2 + "
	       "sigma2)", 60, 11,
	       "  group    a new group or study (adds the between-study\n"
	       "           heterogeneity tau2 + sigma2)\n");
}

static void paragraphs_and_spaces(void **state)
{
	(void)state;
	expect("one two\n\nthree", 80, 0, "one two\n\nthree\n");
	expect("one two\n", 80, 0, "one two\n");
	expect("", 80, 0, "");
	/* Spaces at a break are dropped, inside a line kept; trailing spaces are not printed. */
	expect("a  b  c   ", 4, 0, "a  b\nc\n");
}

static void display_width(void **state)
{
	(void)state;
	tbl_locale();
	if (tbl_width("\xc3\xa9") != 1)
		skip();   /* no UTF-8 locale on this machine: widths are bytes */
	/* "Zoë Kärnä" is 9 columns in 12 bytes: it fits a 9-column line. */
	expect("Zo\xc3\xab K\xc3\xa4rn\xc3\xa4 x", 9, 0, "Zo\xc3\xab K\xc3\xa4rn\xc3\xa4\nx\n");
}

static void line_count(void **state)
{
	struct wrap_line l[2];
	(void)state;
	/* More lines than room: the count is still the whole text's, the first ones filled. */
	assert_int_equal(wrap_lines("aa bb cc dd", 2, 0, l, 2), 4);
	assert_int_equal(l[0].len, 2);
	assert_memory_equal(l[1].s, "bb", 2);
	assert_int_equal(l[1].lead, 0);
	assert_int_equal(wrap_lines("aa bb", 2, 1, l, 2), 2);
	assert_int_equal(l[1].lead, 1);
}

static void width_not_a_terminal(void **state)
{
	(void)state;
	FILE *f = tmpfile();
	assert_non_null(f);
	setenv("COLUMNS", "132", 1);   /* only a terminal's width counts */
	assert_int_equal(wrap_width(f), WRAP_DEFAULT);
	unsetenv("COLUMNS");
	fclose(f);
}

int main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(caution_at_80),
		cmocka_unit_test(caution_at_40),
		cmocka_unit_test(exact_fit_and_one_over),
		cmocka_unit_test(hanging_indent),
		cmocka_unit_test(paragraphs_and_spaces),
		cmocka_unit_test(display_width),
		cmocka_unit_test(line_count),
		cmocka_unit_test(width_not_a_terminal),
	};
	return cmocka_run_group_tests(tests, NULL, NULL);
}
