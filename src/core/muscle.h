/* The fixed list of muscle groups every count is made over. Defined once, in muscle.c. */
#ifndef SD_MUSCLE_H
#define SD_MUSCLE_H

#include <stdint.h>

enum sd_muscle {
	SD_CHEST, SD_FRONT_DELTS, SD_SIDE_DELTS, SD_REAR_DELTS,
	SD_LATS, SD_UPPER_BACK, SD_LOWER_BACK, SD_BICEPS,
	SD_TRICEPS, SD_FOREARMS, SD_ABS, SD_GLUTES,
	SD_QUADS, SD_HAMSTRINGS, SD_ADDUCTORS, SD_CALVES,
	SD_NMUSCLES
};

typedef uint32_t sd_mset;   /* bit set of muscles: bit m is muscle m */

/* Canonical lowercase name ("front-delts"). */
const char *muscle_name(int m);
/* Index of a muscle by name, case-insensitive, '-', '_' and ' ' treated alike; -1 if unknown. */
int muscle_find(const char *name);

#endif
