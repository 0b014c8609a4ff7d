# The cost of the PRAGMA quick_check every write runs first (src/store/db.c), on the demo
# database and on a generated one with 100,000 athletes, 200,000 blocks and 400,000 tests
# (invented, for timing only): the pragma alone through the sqlite3 shell against a trivial
# query, and a whole `athlete add` (open, check, insert, commit) on each.
command -v sqlite3 >/dev/null || { echo "b_quickcheck: needs the sqlite3 shell (make deps)"; exit 1; }
DEMO=$WORK/qc-demo.db BIG=$WORK/qc-big.db
sh "$ROOT/tests/demo_db.sh" "$SD" "$DEMO" >/dev/null || exit 1
rm -f "$BIG"
"$SD" --db "$BIG" program add "$ROOT"/profiles/demo-*.ini >/dev/null || exit 1
sqlite3 "$BIG" <<'SQL' || exit 1
BEGIN;
WITH RECURSIVE n(i) AS (SELECT 1 UNION ALL SELECT i + 1 FROM n WHERE i < 100000)
INSERT INTO athletes (name, status, units, notes)
	SELECT printf('athlete %06d', i), CASE i % 3 WHEN 0 THEN 'trained' ELSE 'untrained' END,
	       'kg', 'generated for timing' FROM n;
WITH RECURSIVE n(i) AS (SELECT 1 UNION ALL SELECT i + 1 FROM n WHERE i < 200000)
INSERT INTO blocks (athlete_id, program_id, start_date, weeks, end_date)
	SELECT 1 + i % 100000, 1 + i % 3, date('2025-01-06', printf('+%d days', i % 300)), 8,
	       CASE WHEN i % 2 THEN date('2025-01-06', printf('+%d days', i % 300 + 56)) END FROM n;
WITH RECURSIVE n(i) AS (SELECT 1 UNION ALL SELECT i + 1 FROM n WHERE i < 400000)
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula)
	SELECT 1 + i % 100000, 'back squat', date('2025-01-06', printf('+%d days', i % 400)),
	       60 + i % 80, 5, (60 + i % 80) * 1.125, 'brzycki' FROM n;
COMMIT;
SQL
for db in "$DEMO" "$BIG"; do
	echo "$(basename "$db"): $(wc -c <"$db") bytes, $(sqlite3 "$db" 'SELECT count(*) FROM athletes') athletes"
	"$BENCHBIN/bench_run" 10 "sqlite3: SELECT 1 (process and open)" sqlite3 "$db" "SELECT 1"
	"$BENCHBIN/bench_run" 10 "sqlite3: PRAGMA quick_check" sqlite3 "$db" "PRAGMA quick_check"
	"$BENCHBIN/bench_run" 10 "setdose athlete list --format csv (read-only)" "$SD" --db "$db" athlete list --format csv
	"$BENCHBIN/bench_run" 10 "setdose athlete add (quick_check, insert, commit)" sh -c \
	    '"$0" --db "$1" athlete add "timing $$ $(od -An -N4 -tu4 /dev/urandom | tr -d " ")" >/dev/null' "$SD" "$db"
done
