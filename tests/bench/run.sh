#!/bin/sh
# `make bench`: runs each tests/bench/b_*.sh section with SD (the binary), BENCHBIN (the
# compiled bench_* programs) and WORK (a scratch folder). Each prints its figures.
SD=$1; BENCHBIN=$2
ROOT=$(cd "$(dirname "$0")/../.." && pwd)
WORK=$(mktemp -d)
export SD BENCHBIN ROOT WORK
for b in "$ROOT"/tests/bench/b_*.sh; do
	[ -f "$b" ] || continue
	echo "== $(basename "$b" .sh)"
	( cd "$WORK" && HOME="$WORK/home" XDG_CONFIG_HOME="$WORK/config" XDG_DATA_HOME="$WORK/data" \
	    NO_COLOR=1 sh -c '. "$0/tests/bench/lib.sh" && . "$1"' "$ROOT" "$b" ) ||
		echo "bench $(basename "$b") failed"
done
rm -rf "$WORK"
