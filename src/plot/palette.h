/* setdose's one palette, shared by the charts (PNG, SVG, PDF) and the full-screen interface.
 *
 * Chosen so every pair that must read apart differs in lightness, not only in hue: the bands
 * are one blue at three lightnesses, the marks a dark orange against them, the zones light
 * neutral shades, the heat map a ramp whose lightness falls monotonically. So the charts read
 * in greyscale print and for red-green colour-blind readers alike; tests/tools/cvd.py checks
 * the pairs after a simulated deuteranopia (Machado, Oliveira & Fernandes 2009) and after the
 * greyscale conversion of ITU-R BT.709. Each colour has its nearest xterm 256-colour index
 * for the interface; the 8-colour fallback is chosen in src/tui/draw.c. */
#ifndef SD_PALETTE_H
#define SD_PALETTE_H

struct sd_colour {
	unsigned char r, g, b;
	short xterm;              /* nearest colour of the xterm 256-colour cube */
	const char *name;
};

enum sd_pal {
	PAL_INK,          /* text, axes */
	PAL_MUTED,        /* secondary text, leader lines */
	PAL_GRID,         /* grid lines */
	PAL_CURVE,        /* the average curve; "more" in the compare chart */
	PAL_BAND_CI,      /* the average curve's interval */
	PAL_BAND_GROUP,   /* a new group or study */
	PAL_BAND_ATH,     /* one athlete */
	PAL_MARK,         /* a program's muscles at their doses; "less" in the compare chart */
	PAL_ZONE_CLIMB,   /* below the practical plateau: still building */
	PAL_ZONE_PLATEAU, /* past practical returns */
	PAL_ZONE_BEYOND,  /* past the evidence */
	PAL_SWC,          /* the +-SWC region */
	PAL_HEAT0, PAL_HEAT1, PAL_HEAT2, PAL_HEAT3,   /* heat map, light to dark */
	PAL_N
};

static const struct sd_colour sd_palette[PAL_N] = {
	[PAL_INK] = { 0x1e, 0x28, 0x33, 235, "ink" },
	[PAL_MUTED] = { 0x4a, 0x56, 0x62, 240, "muted" },
	[PAL_GRID] = { 0xdd, 0xe1, 0xe5, 254, "grid" },
	[PAL_CURVE] = { 0x15, 0x46, 0x7a, 24, "curve" },
	[PAL_BAND_CI] = { 0x8c, 0xae, 0xd0, 110, "band-curve" },
	[PAL_BAND_GROUP] = { 0xbb, 0xd0, 0xe5, 152, "band-group" },
	[PAL_BAND_ATH] = { 0xe4, 0xec, 0xf5, 189, "band-athlete" },
	[PAL_MARK] = { 0xb3, 0x4d, 0x00, 130, "mark" },
	[PAL_ZONE_CLIMB] = { 0xff, 0xff, 0xff, 231, "zone-building" },
	[PAL_ZONE_PLATEAU] = { 0xf1, 0xe6, 0xcc, 224, "zone-plateau" },
	[PAL_ZONE_BEYOND] = { 0xd4, 0xd4, 0xd4, 252, "zone-beyond" },
	[PAL_SWC] = { 0xe6, 0xe6, 0xe6, 254, "swc" },
	[PAL_HEAT0] = { 0xf7, 0xf3, 0xe3, 230, "heat0" },
	[PAL_HEAT1] = { 0xa9, 0xcb, 0xd8, 152, "heat1" },
	[PAL_HEAT2] = { 0x3f, 0x79, 0xa8, 67, "heat2" },
	[PAL_HEAT3] = { 0x12, 0x2a, 0x4f, 17, "heat3" },
};

#endif
