#!/bin/sh
# Builds the demo database (invented gym, invented athletes: db/demo.sql, and their invented
# training log written by tests/demo_logs.awk) into a scratch file, never the user's database.
# Usage: demo_db.sh SETDOSE [PATH]   (default PATH: build/demo.db)
set -e
SD=$1
ROOT=$(cd "$(dirname "$0")/.." && pwd)
OUT=${2:-$ROOT/build/demo.db}
command -v sqlite3 >/dev/null || { echo "demo_db.sh: needs the sqlite3 shell (make deps)" >&2; exit 1; }
rm -f "$OUT" "$OUT-wal" "$OUT-shm"
SETDOSE_DB= "$SD" --db "$OUT" program add "$ROOT"/profiles/demo-*.ini >/dev/null
sqlite3 "$OUT" <"$ROOT/db/demo.sql"
# The invented log runs to the demo's own today, so the demo is the same whatever the date.
DEMO_TODAY=2026-11-29
LOG=$(mktemp)
trap 'rm -f "$LOG"' EXIT
sqlite3 -separator '|' "$OUT" "SELECT a.name, a.units, p.name, b.start_date, b.weeks,
	coalesce(b.end_date, '') FROM blocks b JOIN athletes a ON a.id = b.athlete_id
	JOIN programs p ON p.id = b.program_id ORDER BY a.name, b.start_date" |
	awk -v cutoff=$DEMO_TODAY -f "$ROOT/tests/demo_logs.awk" "$ROOT"/profiles/demo-*.ini - >"$LOG"
SETDOSE_TODAY=$DEMO_TODAY "$SD" --db "$OUT" log import "$LOG" >/dev/null
"$SD" --db "$OUT" db check
echo "demo database (invented data): $OUT"
echo "  try: setdose --db $OUT athlete list"
echo "       setdose --db $OUT response 'Maren Oakhollow'"
echo "       setdose --db $OUT audit --all"
echo "       setdose --db $OUT log weeks 'Caspian Hollowell'"
