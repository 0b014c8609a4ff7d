#!/bin/sh
# Builds the demo database (invented gym, invented athletes: db/demo.sql) into a scratch file,
# never the user's database. Usage: demo_db.sh SETDOSE [PATH]   (default PATH: build/demo.db)
set -e
SD=$1
ROOT=$(cd "$(dirname "$0")/.." && pwd)
OUT=${2:-$ROOT/build/demo.db}
command -v sqlite3 >/dev/null || { echo "demo_db.sh: needs the sqlite3 shell (make deps)" >&2; exit 1; }
rm -f "$OUT" "$OUT-wal" "$OUT-shm"
SETDOSE_DB= "$SD" --db "$OUT" program add "$ROOT"/profiles/demo-*.ini >/dev/null
sqlite3 "$OUT" <"$ROOT/db/demo.sql"
"$SD" --db "$OUT" db check
echo "demo database (invented data): $OUT"
echo "  try: setdose --db $OUT athlete list"
echo "       setdose --db $OUT response 'Maren Oakhollow'"
echo "       setdose --db $OUT audit --all"
