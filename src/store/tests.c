/* The tests table: strength tests (a load lifted for some reps, and its estimated 1RM). */
#include "db_int.h"

#include <stdlib.h>
#include <string.h>

#include "../core/text.h"

int db_test_add(struct sd_db *db, const struct db_test *t, long long *id, struct sd_err *e)
{
	sqlite3_stmt *st = NULL;

	if (text_check("lift name", t->lift, strlen(t->lift), e))
		return -1;
	if (dbi_prepare(db, "INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, "
			    "e1rm_kg, formula) VALUES (?1, ?2, ?3, ?4, ?5, ?6, ?7)", &st, e))
		goto done;
	sqlite3_bind_int64(st, 1, t->athlete_id);
	sqlite3_bind_text(st, 2, t->lift, -1, SQLITE_TRANSIENT);
	sqlite3_bind_text(st, 3, t->date, -1, SQLITE_TRANSIENT);
	sqlite3_bind_double(st, 4, t->load_kg);
	sqlite3_bind_int(st, 5, t->reps);
	sqlite3_bind_double(st, 6, t->e1rm_kg);
	sqlite3_bind_text(st, 7, t->formula, -1, SQLITE_TRANSIENT);
	return dbi_insert(db, st, "add the test", id, e);
done:
	sqlite3_finalize(st);   /* NULL, or a statement that failed before the insert */
	return -1;
}

static int collect_test(sqlite3_stmt *st, void *rec, struct sd_err *e)
{
	struct db_test *t = rec;
	(void)e;
	t->id = sqlite3_column_int64(st, 0);
	t->athlete_id = sqlite3_column_int64(st, 1);
	dbi_text(st, 2, t->lift, sizeof t->lift);
	dbi_text(st, 3, t->date, sizeof t->date);
	t->load_kg = sqlite3_column_double(st, 4);
	t->reps = sqlite3_column_int(st, 5);
	t->e1rm_kg = sqlite3_column_double(st, 6);
	dbi_text(st, 7, t->formula, sizeof t->formula);
	return 0;
}

int db_test_list(struct sd_db *db, long long athlete_id, const char *lift, struct db_test **out,
		 int *n, struct sd_err *e)
{
	sqlite3_stmt *st = NULL;
	int ret = -1;

	if (dbi_prepare(db, "SELECT id, athlete_id, lift, test_date, load_kg, reps, e1rm_kg, "
			    "formula FROM tests WHERE athlete_id = ?1 AND (?2 IS NULL OR lift = ?2 "
			    "COLLATE NOCASE) ORDER BY lift COLLATE NOCASE, test_date, id", &st, e))
		goto done;
	sqlite3_bind_int64(st, 1, athlete_id);
	if (lift)
		sqlite3_bind_text(st, 2, lift, -1, SQLITE_TRANSIENT);
	ret = dbi_collect(db, st, sizeof(struct db_test), collect_test, (void **)out, n,
			  "read tests", e);
done:
	sqlite3_finalize(st);
	return ret;
}
