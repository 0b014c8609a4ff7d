#include "recout.h"
#include "recout_json.h"

#include <stdarg.h>
#include <stdlib.h>
#include <string.h>

#include <cjson/cJSON.h>

#include "table.h"
#include "jsonout.h"

struct sd_rec {
	int fmt, ncols, wide;
	struct sd_table *t;       /* table and CSV */
	cJSON *arr, *cur;         /* JSON */
	char **key;
	int *text;
};

struct sd_rec *rec_new(int ncols, const char *const *headers, int fmt)
{
	struct sd_rec *r = calloc(1, sizeof *r);

	if (!r)
		return NULL;
	r->fmt = fmt;
	r->ncols = ncols;
	if (fmt != REC_JSON) {
		if (!(r->t = tbl_new(ncols, headers)))
			goto fail;
		return r;
	}
	r->arr = cJSON_CreateArray();
	r->key = calloc((size_t)ncols, sizeof *r->key);
	r->text = calloc((size_t)ncols, sizeof *r->text);
	if (!r->arr || !r->key || !r->text)
		goto fail;
	for (int i = 0; i < ncols; i++) {
		const char *h = headers[i] + (headers[i][0] == '~');   /* every column is in JSON */
		r->text[i] = h[0] == '<';
		if (!(r->key[i] = strdup(h + r->text[i])))
			goto fail;
	}
	return r;
fail:
	rec_free(r);
	return NULL;
}

int rec_row(struct sd_rec *r)
{
	if (r->t)
		return tbl_row(r->t);
	r->cur = cJSON_CreateObject();
	if (!r->cur)
		return -1;
	cJSON_AddItemToArray(r->arr, r->cur);
	return 0;
}

static int json_cell(struct sd_rec *r, int col, const char *s)
{
	char *end;
	double v;

	if (!r->cur || col < 0 || col >= r->ncols)
		return -1;
	cJSON_DeleteItemFromObjectCaseSensitive(r->cur, r->key[col]);
	if (r->text[col])
		return cJSON_AddStringToObject(r->cur, r->key[col], s) ? 0 : -1;
	if (!*s)
		return cJSON_AddNullToObject(r->cur, r->key[col]) ? 0 : -1;
	v = strtod(s, &end);
	if (*end)
		return cJSON_AddStringToObject(r->cur, r->key[col], s) ? 0 : -1;
	return cJSON_AddNumberToObject(r->cur, r->key[col], v) ? 0 : -1;
}

int rec_set(struct sd_rec *r, int col, const char *fmt, ...)
{
	va_list ap;
	char *s = NULL;
	int n, rc;

	va_start(ap, fmt);
	n = vasprintf(&s, fmt, ap);
	va_end(ap);
	if (n < 0)
		return -1;
	rc = r->t ? tbl_set(r->t, col, "%s", s) : json_cell(r, col, s);
	free(s);
	return rc;
}

void rec_print(const struct sd_rec *r, FILE *f)
{
	char *s;

	if (r->t) {
		tbl_print(r->t, f, r->fmt == REC_CSV ? TBL_CSV : r->wide ? TBL_WIDE : TBL_TEXT);
		return;
	}
	s = json_print(r->arr, 1);
	if (s) {
		fputs(s, f);
		fputc('\n', f);
		free(s);
	}
}

void rec_print_json_object(const struct sd_rec *r, const char *key, FILE *f,
			   const char *const *extra)
{
	char *s = r->arr ? json_print(r->arr, 1) : NULL;

	fputs("{\n", f);
	for (int i = 0; extra && extra[i] && extra[i + 1]; i += 2)
		fprintf(f, "  \"%s\": %s,\n", extra[i], extra[i + 1]);
	fprintf(f, "  \"%s\": %s\n}\n", key, s ? s : "[]");
	free(s);
}

void rec_wide(struct sd_rec *r, int wide)
{
	r->wide = wide;
}

int rec_rows(const struct sd_rec *r)
{
	return r->t ? tbl_rows(r->t) : cJSON_GetArraySize(r->arr);
}

void rec_free(struct sd_rec *r)
{
	if (!r)
		return;
	tbl_free(r->t);
	cJSON_Delete(r->arr);
	for (int i = 0; r->key && i < r->ncols; i++)
		free(r->key[i]);
	free(r->key);
	free(r->text);
	free(r);
}

char *rec_json_string(const char *s)
{
	cJSON *j = cJSON_CreateString(s);
	char *out = j ? json_print(j, 0) : NULL;

	cJSON_Delete(j);
	return out;
}

cJSON *rec_json_rows(const struct sd_rec *r)
{
	return r->arr ? cJSON_Duplicate(r->arr, 1) : cJSON_CreateArray();
}
