#include "text.h"

#include <stdlib.h>
#include <string.h>

size_t text_utf8_len(const unsigned char *s, size_t n)
{
	unsigned c = s[0];
	size_t len;
	unsigned cp, min;

	if (c < 0x80)
		return 1;
	if (c >= 0xC2 && c <= 0xDF) {
		len = 2;
		cp = c & 0x1F;
		min = 0x80;
	} else if (c >= 0xE0 && c <= 0xEF) {
		len = 3;
		cp = c & 0x0F;
		min = 0x800;
	} else if (c >= 0xF0 && c <= 0xF4) {
		len = 4;
		cp = c & 0x07;
		min = 0x10000;
	} else {
		return 0;   /* a continuation byte, C0/C1 (overlong) or F5..FF */
	}
	if (n < len)
		return 0;
	for (size_t i = 1; i < len; i++) {
		if ((s[i] & 0xC0) != 0x80)
			return 0;
		cp = cp << 6 | (s[i] & 0x3F);
	}
	if (cp < min || cp > 0x10FFFF || (cp >= 0xD800 && cp <= 0xDFFF))
		return 0;
	return len;
}

static unsigned decode(const unsigned char *s, size_t len)
{
	static const unsigned lead[5] = { 0, 0x7F, 0x1F, 0x0F, 0x07 };
	unsigned cp = s[0] & lead[len];
	for (size_t i = 1; i < len; i++)
		cp = cp << 6 | (s[i] & 0x3F);
	return cp;
}

int text_check(const char *what, const char *s, size_t n, struct sd_err *e)
{
	const unsigned char *u = (const unsigned char *)s;

	for (size_t i = 0; i < n;) {
		size_t len = text_utf8_len(u + i, n - i);
		unsigned cp;
		if (!len)
			return sd_fail(e, "%s has a byte that is not UTF-8 (0x%02X) at byte %zu", what,
				       u[i], i);
		cp = decode(u + i, len);
		if (cp < 0x20 || cp == 0x7F || (cp >= 0x80 && cp <= 0x9F))
			return sd_fail(e, "%s has a control character (U+%04X) at byte %zu", what, cp, i);
		if ((cp >= 0x202A && cp <= 0x202E) || (cp >= 0x2066 && cp <= 0x2069))
			return sd_fail(e, "%s has a bidirectional control character (U+%04X) at byte "
				       "%zu", what, cp, i);
		i += len;
	}
	return 0;
}

char *text_repair(const char *s)
{
	const unsigned char *u = (const unsigned char *)s;
	size_t n = strlen(s), o = 0;
	char *out = malloc(3 * n + 1);   /* each bad byte becomes three */

	if (!out)
		return NULL;
	for (size_t i = 0; i < n;) {
		size_t len = text_utf8_len(u + i, n - i);
		if (!len) {
			memcpy(out + o, "\xEF\xBF\xBD", 3);
			o += 3;
			i++;
			continue;
		}
		memcpy(out + o, s + i, len);
		o += len;
		i += len;
	}
	out[o] = '\0';
	return out;
}

char *text_trim(char *s)
{
	char *end;

	while (*s == ' ' || *s == '\t')
		s++;
	end = s + strlen(s);
	while (end > s && (end[-1] == ' ' || end[-1] == '\t' || end[-1] == '\r'))
		*--end = '\0';
	return s;
}
