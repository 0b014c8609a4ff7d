/* What every chart draws with: colours from the palette, text that records its box, wrapped
 * paragraphs, axes, legends, and the label placement. */
#include <math.h>
#include <stdio.h>
#include <string.h>

#include "chart_int.h"

void ch_col(cairo_t *cr, enum sd_pal p)
{
	const struct sd_colour *c = &sd_palette[p];
	cairo_set_source_rgb(cr, c->r / 255.0, c->g / 255.0, c->b / 255.0);
}

void ch_col_tint(cairo_t *cr, enum sd_pal p, double t)
{
	const struct sd_colour *c = &sd_palette[p];
	cairo_set_source_rgb(cr, (c->r / 255.0) * (1 - t) + t, (c->g / 255.0) * (1 - t) + t,
			     (c->b / 255.0) * (1 - t) + t);
}

double ch_fx(const struct frame *f, double x)
{
	return f->x + (x - f->x0) / (f->x1 - f->x0) * f->w;
}

double ch_fy(const struct frame *f, double y)
{
	return f->y + f->h - (y - f->y0) / (f->y1 - f->y0) * f->h;
}

double ch_tick_step(double span, int want)
{
	double raw = span / want, mag = pow(10, floor(log10(raw)));
	double norm = raw / mag;
	return (norm < 1.5 ? 1 : norm < 3.5 ? 2 : norm < 7.5 ? 5 : 10) * mag;
}

void ch_rec(struct cdraw *d, enum chart_box_kind k, double x, double y, double w, double h,
	 double size, const char *s)
{
	struct chart_layout *l = d->lay;
	double x0 = x, y0 = y, x1 = x + w, y1 = y + h;

	if (!l)
		return;
	if (l->n >= l->cap) {
		l->dropped++;
		return;
	}
	cairo_user_to_device(d->cr, &x0, &y0);
	cairo_user_to_device(d->cr, &x1, &y1);
	struct chart_box *b = &l->box[l->n++];
	b->page = d->page;
	b->group = d->group;
	b->kind = k;
	b->x = fmin(x0, x1) / d->dev_per_pt;
	b->y = fmin(y0, y1) / d->dev_per_pt;
	b->w = fabs(x1 - x0) / d->dev_per_pt;
	b->h = fabs(y1 - y0) / d->dev_per_pt;
	/* A text's size as printed: the user-space size times the scale in force. */
	double ux = 0, uy = size;
	cairo_user_to_device_distance(d->cr, &ux, &uy);
	b->size = hypot(ux, uy) / d->dev_per_pt;
	snprintf(b->text, sizeof b->text, "%s", s ? s : "");
}

static void font(cairo_t *cr, double size, int bold)
{
	cairo_select_font_face(cr, "sans-serif", CAIRO_FONT_SLANT_NORMAL,
			       bold ? CAIRO_FONT_WEIGHT_BOLD : CAIRO_FONT_WEIGHT_NORMAL);
	cairo_set_font_size(cr, size);
}

double ch_text_w(struct cdraw *d, double size, int bold, const char *s)
{
	cairo_text_extents_t ext;
	font(d->cr, size, bold);
	cairo_text_extents(d->cr, s, &ext);
	return ext.x_advance;
}

double ch_text(struct cdraw *d, double x, double y, double size, int bold, double align,
	    const char *s)
{
	double w = ch_text_w(d, size, bold, s);
	cairo_move_to(d->cr, x - align * w, y);
	cairo_show_text(d->cr, s);
	/* The box spans the font's ascent and descent, so lines set apart do not meet. */
	ch_rec(d, BOX_TEXT, x - align * w, y - 0.78 * size, w, 1.0 * size, size, s);
	return w;
}

double ch_para(struct cdraw *d, double x, double y, double width, double size, int bold,
	    const char *s, int dry)
{
	char line[600];
	size_t len = 0;

	while (*s) {
		size_t word = strcspn(s, " ");
		char trial[600];
		if (len + word + 2 >= sizeof line)
			word = sizeof line - len - 2;
		snprintf(trial, sizeof trial, "%.*s%s%.*s", (int)len, line, len ? " " : "", (int)word, s);
		if (ch_text_w(d, size, bold, trial) > width && len) {
			line[len] = '\0';
			if (!dry)
				ch_text(d, x, y, size, bold, 0, line);
			y += size * 1.32;
			len = 0;
			continue;
		}
		snprintf(line, sizeof line, "%s", trial);
		len = strlen(line);
		s += word;
		while (*s == ' ')
			s++;
	}
	if (len) {
		line[len] = '\0';
		if (!dry)
			ch_text(d, x, y, size, bold, 0, line);
		y += size * 1.32;
	}
	return y;
}

void ch_axes(struct cdraw *d, const struct frame *f, const char *xtitle, const char *ytitle,
	  const char *yfmt)
{
	cairo_t *cr = d->cr;
	char buf[32];
	double sx = ch_tick_step(f->x1 - f->x0, 7), sy = ch_tick_step(f->y1 - f->y0, 6);

	cairo_set_line_width(cr, 0.5);
	for (double y = ceil(f->y0 / sy) * sy; y <= f->y1 + 1e-9; y += sy) {
		ch_col(cr, PAL_GRID);
		cairo_move_to(cr, f->x, ch_fy(f, y));
		cairo_line_to(cr, f->x + f->w, ch_fy(f, y));
		cairo_stroke(cr);
		ch_col(cr, PAL_INK);
		/* y + 0.0 would keep a negative zero; print 0 plainly. */
		if (fabs(y) < 1e-9)
			snprintf(buf, sizeof buf, "0%s", strchr(yfmt, '%') && strstr(yfmt, "%%") ? "%" : "");
		else
			snprintf(buf, sizeof buf, yfmt, y);
		ch_text(d, f->x - 4, ch_fy(f, y) + 3, 8, 0, 1, buf);
	}
	ch_col(cr, PAL_INK);
	for (double x = ceil(f->x0 / sx) * sx; x <= f->x1 + 1e-9; x += sx) {
		cairo_move_to(cr, ch_fx(f, x), f->y + f->h);
		cairo_line_to(cr, ch_fx(f, x), f->y + f->h + 3);
		cairo_stroke(cr);
		snprintf(buf, sizeof buf, "%g", x);
		ch_text(d, ch_fx(f, x), f->y + f->h + 12, 8, 0, 0.5, buf);
	}
	cairo_set_line_width(cr, 0.8);
	cairo_move_to(cr, f->x, f->y);
	cairo_line_to(cr, f->x, f->y + f->h);
	cairo_line_to(cr, f->x + f->w, f->y + f->h);
	cairo_stroke(cr);
	if (xtitle)
		ch_text(d, f->x + f->w / 2, f->y + f->h + 24, 8.5, 0, 0.5, xtitle);
	if (ytitle) {
		cairo_save(cr);
		cairo_translate(cr, f->x - 30, f->y + f->h / 2);
		cairo_rotate(cr, -M_PI / 2);
		ch_text(d, 0, 0, 8.5, 0, 0.5, ytitle);
		cairo_restore(cr);
	}
}

void ch_vline(struct cdraw *d, const struct frame *f, double x)
{
	static const double dash[] = { 4, 3 };
	cairo_t *cr = d->cr;
	cairo_set_dash(cr, dash, 2, 0);
	cairo_set_line_width(cr, 0.9);
	cairo_move_to(cr, ch_fx(f, x), f->y);
	cairo_line_to(cr, ch_fx(f, x), f->y + f->h);
	cairo_stroke(cr);
	cairo_set_dash(cr, NULL, 0, 0);
}

void ch_hatch(struct cdraw *d, struct rect r)
{
	cairo_t *cr = d->cr;
	cairo_save(cr);
	cairo_rectangle(cr, r.x, r.y, r.w, r.h);
	cairo_clip(cr);
	ch_col(cr, PAL_ZONE_BEYOND);
	cairo_paint(cr);
	ch_col(cr, PAL_MUTED);
	cairo_set_line_width(cr, 0.4);
	for (double s = -r.h; s < r.w; s += 4) {
		cairo_move_to(cr, r.x + s, r.y + r.h);
		cairo_line_to(cr, r.x + s + r.h, r.y);
	}
	cairo_stroke(cr);
	cairo_restore(cr);
}

double ch_legend(struct cdraw *d, double x, double y, double w, const struct swatch *s, int n)
{
	cairo_t *cr = d->cr;
	double cx = x, size = 8;

	for (int i = 0; i < n; i++) {
		double tw = ch_text_w(d, size, 0, s[i].text) + 18 + 12;
		if (cx > x && cx + tw > x + w) {
			cx = x;
			y += size * 1.6;
		}
		struct rect sw = { cx, y - 7, 12, 8 };
		switch (s[i].kind) {
		case 1:
			ch_col(cr, s[i].pal);
			cairo_set_line_width(cr, 2);
			cairo_move_to(cr, sw.x, sw.y + 4);
			cairo_line_to(cr, sw.x + 12, sw.y + 4);
			cairo_stroke(cr);
			break;
		case 2:
			ch_col(cr, s[i].pal);
			cairo_new_path(cr);
			cairo_arc(cr, sw.x + 6, sw.y + 4, 3.2, 0, 2 * M_PI);
			cairo_fill(cr);
			break;
		case 3:
			ch_hatch(d, sw);
			break;
		default:
			ch_col(cr, s[i].pal);
			cairo_rectangle(cr, sw.x, sw.y, sw.w, sw.h);
			cairo_fill_preserve(cr);
			ch_col(cr, PAL_MUTED);
			cairo_set_line_width(cr, 0.4);
			cairo_stroke(cr);
		}
		ch_col(cr, PAL_INK);
		cx += 16 + ch_text(d, cx + 16, y, size, 0, 0, s[i].text) + 12;
	}
	return y + size * 1.2;
}

double ch_chart_head(struct cdraw *d, const struct sd_chart *c, struct rect r, const char *title)
{
	char buf[300], note[240];
	double y = r.y + 14;

	if (c->bare)
		return r.y;
	ch_col(d->cr, PAL_INK);
	ch_text(d, r.x, y, 12, 1, 0, title);
	y += 13;
	snprintf(buf, sizeof buf, "%s athlete, %g-week block; profile '%s'; %.0f%% intervals",
		 c->cov.trained >= 0.5 ? "trained" : "untrained", c->cov.weeks, c->prof->name,
		 c->level * 100);
	ch_col(d->cr, PAL_MUTED);
	y = ch_para(d, r.x, y, r.w, 8.5, 0, buf, 0);
	/* A block length or status outside the evidence is said on the chart itself. */
	if (curve_context_note(c->prof, &c->cov, note, sizeof note)) {
		ch_col(d->cr, PAL_MARK);
		y = ch_para(d, r.x, y, r.w, 8.5, 1, note, 0);
	}
	return y;
}

/* ---- label placement ---- */

int ch_rect_meet(const struct rect *a, const struct rect *b)
{
	return a->x < b->x + b->w && b->x < a->x + a->w && a->y < b->y + b->h && b->y < a->y + a->h;
}

static int inside(const struct rect *a, const struct rect *b)
{
	return a->x >= b->x && a->y >= b->y && a->x + a->w <= b->x + b->w &&
	       a->y + a->h <= b->y + b->h;
}

/* Does the segment p-q cross rectangle r? (Liang-Barsky clipping.) */
static int seg_meets(double px, double py, double qx, double qy, const struct rect *r)
{
	double t0 = 0, t1 = 1, dx = qx - px, dy = qy - py;
	double p[4] = { -dx, dx, -dy, dy };
	double q[4] = { px - r->x, r->x + r->w - px, py - r->y, r->y + r->h - py };
	for (int i = 0; i < 4; i++) {
		if (p[i] == 0) {
			if (q[i] < 0)
				return 0;
			continue;
		}
		double t = q[i] / p[i];
		if (p[i] < 0)
			t0 = fmax(t0, t);
		else
			t1 = fmin(t1, t);
		if (t0 > t1)
			return 0;
	}
	return 1;
}

/* The point of r nearest to (x, y): where a leader line ends. */
static void nearest(const struct rect *r, double x, double y, double *nx, double *ny)
{
	*nx = fmin(fmax(x, r->x), r->x + r->w);
	*ny = fmin(fmax(y, r->y), r->y + r->h);
}

static struct rect mark_box(const struct place_label *l)
{
	return (struct rect){ l->ax - l->ar, l->ay - l->ar, 2 * l->ar, 2 * l->ar };
}

/* How many things candidate `at` of label i would meet (0: a clean place). */
static int conflicts(const struct place_label *l, int n, int i, const struct rect *at,
		     const struct rect *obst, int nobst, struct rect bounds)
{
	int bad = !inside(at, &bounds) ? 100 : 0;
	double ex, ey;
	const double pad = 1.5;
	struct rect grown = { at->x - pad, at->y - pad, at->w + 2 * pad, at->h + 2 * pad };

	nearest(at, l[i].ax, l[i].ay, &ex, &ey);
	for (int k = 0; k < nobst; k++)
		bad += ch_rect_meet(&grown, &obst[k]) * 3;
	for (int k = 0; k < n; k++) {
		struct rect mb = mark_box(&l[k]);
		bad += ch_rect_meet(&grown, &mb) * 5;
		if (k != i && seg_meets(l[i].ax, l[i].ay, ex, ey, &mb) &&
		    hypot(ex - l[i].ax, ey - l[i].ay) > l[i].ar + 4)
			bad += 1;
		if (k < i) {      /* placed already */
			bad += ch_rect_meet(&grown, &l[k].at) * 10;
			if (seg_meets(l[i].ax, l[i].ay, ex, ey, &l[k].at))
				bad += 2;
		}
	}
	return bad;
}

void ch_place_labels(struct place_label *l, int n, const struct rect *obst, int nobst,
		  struct rect bounds)
{
	/* Right of the mark first (text reads away from it), then above, below and left, at
	 * growing distances; a leader line covers the distance. */
	static const double ang[] = { 0, -30, 30, -60, 60, -90, 90, 180, -150, 150, -120, 120 };
	static const double dist[] = { 3, 7, 13, 20, 30, 42, 56, 72, 92, 116, 144 };
	const int na = sizeof ang / sizeof *ang, nd = sizeof dist / sizeof *dist;

	for (int i = 0; i < n; i++) {
		int best = 1 << 30;
		struct rect bestat = { 0, 0, 0, 0 };
		for (int di = 0; di < nd && best; di++)
			for (int ai = 0; ai < na && best; ai++) {
				double a = ang[ai] * M_PI / 180, c = cos(a), s = sin(a);
				double r = l[i].ar + dist[di];
				/* The box touches the circle of radius r around the anchor in the
				 * direction a: its centre moves out by half its size along a. */
				double cx = l[i].ax + c * (r + l[i].w / 2), cy = l[i].ay + s * (r + l[i].h / 2);
				struct rect at = { cx - l[i].w / 2, cy - l[i].h / 2, l[i].w, l[i].h };
				int bad = conflicts(l, n, i, &at, obst, nobst, bounds);
				/* Among equally clean places, nearer wins (the loops run nearest first). */
				if (bad < best) {
					best = bad;
					bestat = at;
				}
			}
		l[i].at = bestat;
		l[i].fit = best == 0;
	}
}
