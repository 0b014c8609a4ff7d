# `response` for an athlete with 1,000 strength tests (4 lifts, about every other day for
# 5.5 years) and 40 completed blocks, in a roster of 20 invented athletes (each with 40 blocks
# and 200 tests), so the variances come from the roster by REML. Generated with the sqlite3
# shell; invented data, for timing only. Before the dates were parsed once per athlete:
# 56 M instructions (issue measurement on the previous code).
command -v sqlite3 >/dev/null || { echo "b_response: needs the sqlite3 shell (make deps)"; exit 1; }
DB=$WORK/bench-response.db
rm -f "$DB"
"$SD" --db "$DB" program add "$ROOT/profiles/demo-upperlower4.ini" >/dev/null || exit 1
sqlite3 "$DB" <<'SQL' || exit 1
BEGIN;
WITH RECURSIVE n(i) AS (SELECT 1 UNION ALL SELECT i + 1 FROM n WHERE i < 20)
INSERT INTO athletes (name, status, units) SELECT printf('athlete %02d', i), 'trained', 'kg' FROM n;
WITH RECURSIVE a(i) AS (SELECT 1 UNION ALL SELECT i + 1 FROM a WHERE i < 20),
	       k(j) AS (SELECT 0 UNION ALL SELECT j + 1 FROM k WHERE j < 39)
INSERT INTO blocks (athlete_id, program_id, start_date, weeks, end_date)
	SELECT i, 1, date('2020-01-06', printf('+%d days', j * 49)), 6,
	       date('2020-01-06', printf('+%d days', j * 49 + 42)) FROM a, k;
WITH RECURSIVE a(i) AS (SELECT 1 UNION ALL SELECT i + 1 FROM a WHERE i < 20),
	       k(j) AS (SELECT 0 UNION ALL SELECT j + 1 FROM k WHERE j < 999)
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula)
	SELECT i, CASE j % 4 WHEN 0 THEN 'back squat' WHEN 1 THEN 'bench press'
	                     WHEN 2 THEN 'deadlift' ELSE 'overhead press' END,
	       date('2020-01-04', printf('+%d days', (j / 4) * 8 + j % 4)),
	       100 + j * 0.05 + i, 1, 100 + j * 0.05 + i, 'tested'
	FROM a, k WHERE i = 1 OR j < 200;
COMMIT;
SQL
echo "$(sqlite3 "$DB" "SELECT count(*) FROM tests WHERE athlete_id = 1") tests of athlete 01, $(sqlite3 "$DB" 'SELECT count(*) FROM tests') in all, $(sqlite3 "$DB" 'SELECT count(*) FROM blocks') blocks"
"$BENCHBIN/bench_run" 11 "response, 1,000 tests (roster of 20)" "$SD" --db "$DB" response "athlete 01"
instr "" "$SD" --db "$DB" response "athlete 01"
