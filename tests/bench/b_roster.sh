# A gym chain's roster: 100,000 invented athletes (a third with notes of 40 to 400 bytes)
# generated with the sqlite3 shell; the interface's first roster screen, each search keystroke
# and the peak memory (bench_roster), and `athlete list` as a whole process.
command -v sqlite3 >/dev/null || { echo "b_roster: needs the sqlite3 shell (make deps)"; exit 1; }
DB=$WORK/bench-roster.db
rm -f "$DB"
"$SD" --db "$DB" db check >/dev/null 2>&1 || "$SD" --db "$DB" athlete list >/dev/null || exit 1
sqlite3 "$DB" <<'SQL' || exit 1
BEGIN;
WITH RECURSIVE n(i) AS (SELECT 1 UNION ALL SELECT i + 1 FROM n WHERE i < 100000)
INSERT INTO athletes (name, status, units, notes)
	SELECT printf('athlete %06d', i), CASE i % 3 WHEN 0 THEN 'trained' ELSE 'untrained' END,
	       CASE i % 4 WHEN 0 THEN 'lb' ELSE 'kg' END,
	       CASE i % 3 WHEN 0 THEN substr(printf('%.400c', 'n'), 1, 40 + i % 361) ELSE '' END
	FROM n;
COMMIT;
SQL
echo "$(sqlite3 "$DB" 'SELECT count(*) FROM athletes') athletes"
"$BENCHBIN/bench_roster" "$DB" "$ROOT/profiles"
"$BENCHBIN/bench_run" 5 "athlete list --format csv, 100,000 athletes" "$SD" --db "$DB" --format csv athlete list
