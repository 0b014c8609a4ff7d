#!/bin/sh
# Runs every tests/cli/t_*.sh against one setdose binary, each in its own scratch folder
# with its own database and no user configuration.
# A third argument runs one test file alone: `sh tests/cli/run.sh RESULTS SD t_audit`
# (`make cli T=t_audit` does the same).
RESULTS=$1; SD=$2; ONLY=${3:-}
ROOT=$(cd "$(dirname "$0")/../.." && pwd)
export RESULTS SD ROOT
fail=0
for t in "$ROOT"/tests/cli/t_*.sh; do
	[ -z "$ONLY" ] || [ "$(basename "$t" .sh)" = "${ONLY%.sh}" ] || continue
	TMP=$(mktemp -d)
	T=$(basename "$t" .sh)
	before=$(grep -c ' failed$' "$RESULTS" 2>/dev/null || true)
	( cd "$TMP" && export TMP T HOME="$TMP/home" XDG_CONFIG_HOME="$TMP/config" \
	    XDG_DATA_HOME="$TMP/data" SETDOSE_DB="$TMP/test.db" NO_COLOR=1 &&
	  . "$ROOT/tests/cli/lib.sh" && . "$t" ) || echo "cli $T: script exited early failed" >>"$RESULTS"
	after=$(grep -c ' failed$' "$RESULTS" 2>/dev/null || true)
	[ "${after:-0}" = "${before:-0}" ] || fail=1
	rm -rf "$TMP"
done
echo "cli: $(grep -c '^cli .* passed$' "$RESULTS") checks passed, $(grep -c '^cli .* failed$' "$RESULTS") failed so far"
exit $fail
