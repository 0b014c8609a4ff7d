#!/bin/sh
# `make demo`: the main job on bundled, invented demo data (the invented gym's templates).
SD=$1
ROOT=$(cd "$(dirname "$0")/.." && pwd)
echo "== setdose audit profiles/demo-fullbody3.ini (invented demo template)"
"$SD" audit "$ROOT/profiles/demo-fullbody3.ini" || exit 1
echo "== demo database (invented gym, invented athletes) built into a scratch file"
sh "$ROOT/tests/demo_db.sh" "$SD" "$ROOT/build/demo.db" || exit 1
echo "== setdose --db build/demo.db response 'Maren Oakhollow' (invented athlete)"
"$SD" --db "$ROOT/build/demo.db" response "Maren Oakhollow" || exit 1
echo "== setdose --db build/demo.db response 'Caspian Hollowell' (invented athlete who trained far less than planned)"
"$SD" --db "$ROOT/build/demo.db" response "Caspian Hollowell" || exit 1
