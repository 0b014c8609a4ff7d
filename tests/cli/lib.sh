# Shared helpers for the command-line tests. Each t_*.sh is sourced by run.sh with:
#   SD      the setdose binary under test
#   TMP     a scratch folder (removed afterwards)
#   ROOT    the project's top folder
# Every check appends "cli FILE: WHAT passed|failed" to $RESULTS.

_rec() { # status what
	echo "cli $T: $2 $1" >>"$RESULTS"
	[ "$1" = passed ] || { echo "FAIL [$T] $2" >&2; [ -n "$LAST_OUT" ] && sed 's/^/    | /' "$LAST_OUT" >&2; }
}

# run EXPECTED_STATUS CMD...   runs CMD, keeps stdout+stderr in $TMP/out, $TMP/err
run() {
	want=$1; shift
	"$@" >"$TMP/out" 2>"$TMP/err"
	got=$?
	LAST_OUT=$TMP/err
	if [ "$got" -eq "$want" ]; then _rec passed "exit $want: $*"
	else _rec failed "exit $want (got $got): $*"; fi
}

# has FILE REGEX [WHAT]    FILE (out or err) contains REGEX (grep -E)
has() {
	LAST_OUT=$TMP/$1
	if grep -Eq -- "$2" "$TMP/$1"; then _rec passed "${3:-$1 has '$2'}"
	else _rec failed "${3:-$1 has '$2'}"; fi
}

# says FILE REGEX [WHAT]   the prose of FILE, its wrapped lines joined (a line break and the
# blanks around it read as one space), contains REGEX: text wrapped to 80 columns is found
# whatever the line it breaks at
says() {
	LAST_OUT=$TMP/$1
	if tr '\n' ' ' <"$TMP/$1" | sed 's/  */ /g' | grep -Eq -- "$2"; then _rec passed "${3:-$1 says '$2'}"
	else _rec failed "${3:-$1 says '$2'}"; fi
}

# hasnt FILE REGEX [WHAT]
hasnt() {
	LAST_OUT=$TMP/$1
	if grep -Eq -- "$2" "$TMP/$1"; then _rec failed "${3:-$1 lacks '$2'}"
	else _rec passed "${3:-$1 lacks '$2'}"; fi
}

# lines FILE N   FILE has exactly N lines
lines() {
	LAST_OUT=$TMP/$1
	n=$(wc -l <"$TMP/$1")
	if [ "$n" -eq "$2" ]; then _rec passed "$1 has $2 lines"
	else _rec failed "$1 has $2 lines (got $n)"; fi
}

# check WHAT CMD...   passes when CMD exits 0
check() {
	what=$1; shift
	LAST_OUT=
	if "$@"; then _rec passed "$what"; else _rec failed "$what"; fi
}
