#!/bin/sh
# `make demo`: the main job on bundled, invented demo data (the invented gym's templates).
SD=$1
ROOT=$(cd "$(dirname "$0")/.." && pwd)
echo "== setdose audit profiles/demo-fullbody3.ini (invented demo template)"
"$SD" audit "$ROOT/profiles/demo-fullbody3.ini" || exit 1
