#!/bin/sh
# Runs every tests/tui/t_*.sh against one setdose binary in tmux, each in its own scratch
# folder and private tmux server, with no user configuration. Then all of them once more with
# the AddressSanitizer + UndefinedBehaviorSanitizer build (build/asan/setdose, when it has been
# built) and once under valgrind, and checks that neither reported anything.
# Usage: run.sh RESULTS SETDOSE
# Environment: TUI_ONLY (test files to run instead of all), WRAP (a command put before
# setdose, e.g. valgrind), TUI_LABEL (added to each test's name), TUI_EXTRA=0 (skip the
# sanitizer and valgrind passes), TUI_TIMEOUT (seconds to wait for a screen).
RESULTS=$1; SD=$2
ROOT=$(cd "$(dirname "$0")/../.." && pwd)
export RESULTS SD ROOT
fail=0
n=0

if ! command -v tmux >/dev/null; then
	echo "tui run.sh: tmux installed (make deps) failed" >>"$RESULTS"
	exit 1
fi

# run_one FILE LABEL   sources FILE after lib.sh; LABEL tells the reruns apart
run_one() {
	n=$((n + 1))
	TMP=$(mktemp -d)
	T=$(basename "$1" .sh)$2
	SOCK=sdtest-$$-$n
	before=$(grep -c ' failed$' "$RESULTS" 2>/dev/null || true)
	( cd "$TMP" && export TMP T SOCK WRAP HOME="$TMP/home" XDG_CONFIG_HOME="$TMP/config" \
	    XDG_DATA_HOME="$TMP/data" SETDOSE_DB="$TMP/test.db" SETDOSE_TODAY=2026-07-01 &&
	  unset NO_COLOR VISUAL EDITOR &&
	  . "$ROOT/tests/tui/lib.sh" && . "$1"; tmx_stop ) ||
		echo "tui $T: script exited early failed" >>"$RESULTS"
	after=$(grep -c ' failed$' "$RESULTS" 2>/dev/null || true)
	[ "$after" = "$before" ] || fail=1
	rm -rf "$TMP"
}

for t in ${TUI_ONLY:-"$ROOT"/tests/tui/t_*.sh}; do
	run_one "$t" "${TUI_LABEL:-}"
done
summary() {
	echo "tui: $(grep -c '^tui .* passed$' "$RESULTS") checks passed, $(grep -c '^tui .* failed$' "$RESULTS") failed so far"
}
if [ "${TUI_EXTRA:-1}" = 0 ]; then
	summary
	exit $fail
fi
WRAP=

# The same tests with the sanitizer build: every report goes to a log file, and there
# must be none.
ASAN_SD=$(dirname "$SD")/asan/setdose
case "$SD" in
*/asan/*) ;;
*)
	if [ -x "$ASAN_SD" ]; then
		LOGS=$(mktemp -d)
		(
			SD=$ASAN_SD
			ASAN_OPTIONS="detect_leaks=1:abort_on_error=0:log_path=$LOGS/asan"
			UBSAN_OPTIONS="print_stacktrace=1:halt_on_error=1:log_path=$LOGS/ubsan"
			TUI_TIMEOUT=40
			export SD ASAN_OPTIONS UBSAN_OPTIONS TUI_TIMEOUT
			for t in ${TUI_ONLY:-"$ROOT"/tests/tui/t_*.sh}; do
				run_one "$t" " (asan+ubsan build)"
			done
			[ $fail -eq 0 ]
		) || fail=1
		if [ -z "$(ls "$LOGS")" ]; then
			echo "tui sanitizers: no AddressSanitizer or UndefinedBehaviorSanitizer report during the tmux tests passed" >>"$RESULTS"
		else
			echo "tui sanitizers: no AddressSanitizer or UndefinedBehaviorSanitizer report during the tmux tests failed" >>"$RESULTS"
			cat "$LOGS"/* >&2
			fail=1
		fi
		rm -rf "$LOGS"
	else
		echo "tui run.sh: no $ASAN_SD yet; the sanitizer pass runs in 'make check' after it is built" >&2
	fi
	;;
esac

# The same tests under valgrind (not for the sanitizer build, which valgrind cannot run).
if [ "${TUI_VALGRIND:-1}" != 0 ]; then
	case "$SD" in
	*/asan/*) ;;
	*)
		if command -v valgrind >/dev/null; then
			sh "$ROOT/tests/tui/valgrind.sh" "$RESULTS" "$SD" || fail=1
		else
			echo "tui valgrind: valgrind installed (make deps) failed" >>"$RESULTS"
			fail=1
		fi
		;;
	esac
fi

summary
exit $fail
