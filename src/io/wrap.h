/* Prose under the tables (the caution, the profile line, warnings and notes, legends) wrapped
 * at word boundaries to the width of the terminal it goes to, so nothing a coach must read
 * runs off the screen or is cut mid-word. Widths are display columns (tbl_width), not bytes.
 * The full-screen interface lays out its key card and status line with wrap_lines too. */
#ifndef SD_WRAP_H
#define SD_WRAP_H

#include <stdio.h>

#define WRAP_DEFAULT 80   /* columns when the output is not a terminal (a file, a pipe) */
#define WRAP_MIN 20       /* narrower terminals still get whole words on a line */

/* One line of wrapped text: lead spaces, then len bytes from s (no newline). */
struct wrap_line {
	const char *s;
	int len;
	int lead;
};

/* Columns for text written to f: on a terminal COLUMNS when set to a number, else the
 * terminal's width (TIOCGWINSZ), at least WRAP_MIN; WRAP_DEFAULT for anything else. */
int wrap_width(FILE *f);
/* Breaks text into lines of at most width columns at spaces, never inside a word (a word
 * wider than the line stands alone on its line). '\n' ends a paragraph; a paragraph's first
 * line keeps its leading spaces, the lines after it start with indent spaces. Fills at most
 * max entries of out and returns the number of lines the whole text takes. */
int wrap_lines(const char *text, int width, int indent, struct wrap_line *out, int max);
/* Prints text wrapped to width, each line ending in '\n'. */
void wrap_print(FILE *f, int width, int indent, const char *text);
/* printf into a wrapped paragraph (or several, split at '\n') at wrap_width(f). */
void wrap_printf(FILE *f, int indent, const char *fmt, ...) __attribute__((format(printf, 3, 4)));

#endif
