# The store: `audit --all` over 100,000 open blocks (target <= 0.5 s), plus 100,000
# ended blocks it must skip. Athletes, templates and blocks are generated (invented, for timing
# only) straight into the database with the sqlite3 shell; the templates go in through
# `program add` so they are validated and stored as the tool stores them.
command -v sqlite3 >/dev/null || { echo "b_store: needs the sqlite3 shell (make deps)"; exit 1; }
DB=$WORK/bench-store.db
rm -f "$DB"
mkdir -p storeprogs
awk 'BEGIN {
	split("back squat,bench press,barbell row,overhead press,romanian deadlift,lat pulldown,leg press,dumbbell curl,triceps pushdown,standing calf raise,lateral raise,hip thrust", ex, ",")
	srand(11)
	for (i = 0; i < 20; i++) {
		f = sprintf("storeprogs/t%02d.ini", i)
		printf "[program]\nname = bench template %d\nweeks = %d\n", i, 6 + i % 8 > f
		for (d = 1; d <= 2 + i % 4; d++) {
			printf "[day %d]\n", d > f
			for (k = 1; k <= 12; k++) if (rand() < 0.5) printf "%s = %dx%d RIR %d\n", ex[k], 1 + int(rand() * 5), 5 + int(rand() * 8), int(rand() * 4) > f
		}
		close(f)
	}
}'
"$SD" --db "$DB" program add storeprogs/*.ini >/dev/null || exit 1
sqlite3 "$DB" <<'SQL' || exit 1
BEGIN;
WITH RECURSIVE n(i) AS (SELECT 1 UNION ALL SELECT i + 1 FROM n WHERE i < 100000)
INSERT INTO athletes (name, status, units)
	SELECT printf('athlete %06d', i), CASE i % 3 WHEN 0 THEN 'trained' ELSE 'untrained' END,
	       CASE i % 4 WHEN 0 THEN 'lb' ELSE 'kg' END FROM n;
WITH RECURSIVE n(i) AS (SELECT 1 UNION ALL SELECT i + 1 FROM n WHERE i < 100000)
INSERT INTO blocks (athlete_id, program_id, start_date, weeks, end_date)
	SELECT i, 1 + (i * 7) % 20, date('2025-01-06', printf('+%d days', i % 90)), 8,
	       date('2025-01-06', printf('+%d days', i % 90 + 56)) FROM n;
WITH RECURSIVE n(i) AS (SELECT 1 UNION ALL SELECT i + 1 FROM n WHERE i < 100000)
INSERT INTO blocks (athlete_id, program_id, start_date, weeks)
	SELECT i, 1 + i % 20, date('2026-01-05', printf('+%d days', i % 200)), 6 + i % 8 FROM n;
COMMIT;
SQL
echo "$(sqlite3 "$DB" 'SELECT count(*) FROM blocks WHERE end_date IS NULL') open blocks, $(sqlite3 "$DB" 'SELECT count(*) FROM blocks') blocks in all"
"$BENCHBIN/bench_run" 5 "audit --all over 100,000 open blocks (target 0.5 s)" "$SD" --db "$DB" audit --all
"$BENCHBIN/bench_run" 5 "audit --all --format csv, same blocks" "$SD" --db "$DB" audit --all --format csv
"$BENCHBIN/bench_run" 20 "block list of one athlete" "$SD" --db "$DB" block list "athlete 050000"
# A new load each run (the same test twice is refused); exec keeps the shell's cost small.
echo 0 >count
export DB
"$BENCHBIN/bench_run" 20 "test add (one write transaction)" sh -c 'i=$(cat count); echo $((i + 1)) >count; exec "$SD" --db "$DB" test add "athlete 050000" "bench press" $((100 + i)) 5 --date 2026-03-01'

"$SD" --db "$DB" db check
