#include "muscle.h"

#include <ctype.h>
#include <stddef.h>

static const char *const names[SD_NMUSCLES] = {
	"chest", "front-delts", "side-delts", "rear-delts",
	"lats", "upper-back", "lower-back", "biceps",
	"triceps", "forearms", "abs", "glutes",
	"quads", "hamstrings", "adductors", "calves",
};

const char *muscle_name(int m)
{
	return m >= 0 && m < SD_NMUSCLES ? names[m] : "?";
}

static int sep(int c)
{
	return c == '-' || c == '_' || c == ' ';
}

int muscle_find(const char *name)
{
	for (int m = 0; m < SD_NMUSCLES; m++) {
		const char *a = name, *b = names[m];
		while (*a && *b) {
			if (sep(*a) && sep(*b)) {
				a++, b++;
				continue;
			}
			if (tolower((unsigned char)*a) != *b)
				break;
			a++, b++;
		}
		if (!*a && !*b)
			return m;
	}
	return -1;
}
