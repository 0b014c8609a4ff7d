#!/bin/sh
# The full-screen tests (tests/tui/t_*.sh, or TUI_ONLY) with setdose running under
# valgrind: no invalid access, no use of uninitialised memory, no definite or indirect leak.
# Every report goes to a log file, and there must be none. `make check` runs it through
# tests/tui/run.sh; by hand: sh tests/tui/valgrind.sh RESULTS build/setdose
RESULTS=$1; SD=$2
ROOT=$(cd "$(dirname "$0")/../.." && pwd)
LOGS=$(mktemp -d)
fail=0
WRAP="valgrind -q --error-exitcode=99 --leak-check=full --errors-for-leak-kinds=definite,indirect --log-file=$LOGS/vg.%p"
TUI_LABEL=" (under valgrind)" TUI_EXTRA=0 TUI_TIMEOUT=90 \
	WRAP=$WRAP sh "$ROOT/tests/tui/run.sh" "$RESULTS" "$SD" || fail=1
# valgrind -q writes nothing unless it has something to report.
if [ -z "$(find "$LOGS" -type f -size +0c)" ]; then
	echo "tui valgrind: no valgrind report during the tmux tests passed" >>"$RESULTS"
else
	echo "tui valgrind: no valgrind report during the tmux tests failed" >>"$RESULTS"
	cat "$LOGS"/* >&2
	fail=1
fi
rm -rf "$LOGS"
exit $fail
