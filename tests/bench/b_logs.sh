# The training log: importing 100,000 rows into a database that holds the athlete (target
# <= 1 s), and the weekly view of one athlete with 1,000,000 stored rows (target <= 200 ms),
# both with peak memory. The rows are invented by tests/bench/gen_logs.sh (timing only).
command -v sqlite3 >/dev/null || { echo "b_logs: needs the sqlite3 shell (make deps)"; exit 1; }
export SETDOSE_TODAY=2026-11-29
G=$ROOT/tests/bench/gen_logs.sh
sh "$G" 100000 40 2015-01-05 >log100k.csv
sh "$G" 1000000 110 2000-01-03 >log1m.csv

# A fresh copy of a database with the athlete for each run: every run imports all rows anew.
rm -f base.db
"$SD" --db base.db athlete add "Bench Lifter" >/dev/null || exit 1
"$BENCHBIN/bench_run" 5 "log import, 100,000 rows (target 1 s)" \
	sh -c 'cp base.db run.db && rm -f run.db-wal run.db-shm && exec "$0" --db run.db log import log100k.csv --athlete "Bench Lifter"' "$SD"
echo "  $(sqlite3 run.db 'SELECT count(*) FROM logs') rows stored, $(sqlite3 run.db 'SELECT count(*) FROM log_weeks') weekly sums"
"$BENCHBIN/bench_run" 5 "log import again (every row already stored)" \
	"$SD" --db run.db log import log100k.csv --athlete "Bench Lifter"

# One athlete with 1,000,000 rows over 25 years and two blocks of a template.
rm -f big.db
"$SD" --db big.db athlete add "Bench Lifter" >/dev/null || exit 1
"$SD" --db big.db program add "$ROOT/profiles/demo-fullbody3.ini" >/dev/null || exit 1
"$SD" --db big.db block add "Bench Lifter" "Tidewater full body, three days" --start 2024-01-08 >/dev/null
"$SD" --db big.db block end 1 --date 2024-03-17 >/dev/null
"$SD" --db big.db block add "Bench Lifter" "Tidewater full body, three days" --start 2024-03-18 >/dev/null
"$BENCHBIN/bench_run" 1 "log import, 1,000,000 rows (setup, one run)" \
	"$SD" --db big.db log import log1m.csv --athlete "Bench Lifter"
echo "  $(sqlite3 big.db 'SELECT count(*) FROM logs') rows stored, $(sqlite3 big.db 'SELECT count(*) FROM log_weeks') weekly sums, $(du -m big.db | cut -f1) MB"
"$BENCHBIN/bench_run" 10 "log weeks over 1,000,000 rows (target 200 ms)" \
	"$SD" --db big.db log weeks "Bench Lifter"
"$BENCHBIN/bench_run" 10 "log weeks --format csv, same rows" \
	"$SD" --db big.db log weeks "Bench Lifter" --format csv
"$BENCHBIN/bench_run" 10 "log weeks --block (one block's weeks)" \
	"$SD" --db big.db log weeks "Bench Lifter" --block 1
"$SD" --db big.db db check
