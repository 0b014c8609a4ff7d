# Shared functions for the tests of the full-screen interface. Each t_*.sh is sourced by run.sh with:
#   SD      the setdose binary under test
#   TMP     a scratch folder (removed afterwards)
#   ROOT    the project's top folder
#   SOCK    a private tmux socket name for this test file
#   WRAP    a command put before SD (valgrind, or nothing)
# The interface runs in a detached tmux window of a fixed size on the private socket; the
# tests type into it (send-keys) and read the screen back (capture-pane), waiting for the
# expected text with a timeout rather than sleeping a fixed time. Every check appends
# "tui FILE: WHAT passed|failed" to $RESULTS.

TUI_TIMEOUT=${TUI_TIMEOUT:-15}

_rec() { # status what
	echo "tui $T: $2 $1" >>"$RESULTS"
	if [ "$1" != passed ]; then
		echo "FAIL [$T] $2" >&2
		[ -f "$TMP/screen" ] && sed 's/^/    | /' "$TMP/screen" >&2
	fi
	return 0
}

tmx() { tmux -L "$SOCK" "$@"; }

# Stops this test's tmux server and removes its socket file.
tmx_stop() {
	tmx kill-server 2>/dev/null
	rm -f "${TMUX_TMPDIR:-/tmp}/tmux-$(id -u)/$SOCK"
	return 0
}

# start W H [ENV=VALUE...] -- ARGS...   runs WRAP SD ARGS in a W x H window. The wrapper
# records the terminal settings before and after, then prints "EXITED <status>", so a test
# can check the interface left the terminal as it found it.
start() {
	w=$1; h=$2; shift 2
	envs=
	while [ $# -gt 0 ] && [ "$1" != -- ]; do envs="$envs $1"; shift; done
	[ "$1" = -- ] && shift
	cat >"$TMP/wrap.sh" <<EOF
#!/bin/sh
# Like an interactive shell, this one outlives a Ctrl-C meant for the program it runs
# (a trap with a command, unlike an ignored signal, is reset for the program).
trap : INT
stty -g >"$TMP/stty.before"
$WRAP "$SD" "\$@"
echo "EXITED \$?"
stty -g >"$TMP/stty.after"
exec sleep 600
EOF
	rm -f "$TMP/stty.before" "$TMP/stty.after"
	# Each start gets a server of its own: a new one on a socket that a server being
	# shut down still holds could fail to start.
	tmx_stop
	STARTS=$(( ${STARTS:-0} + 1 ))
	SOCK=${SOCK%%.*}.$STARTS
	tmx -f /dev/null new-session -d -x "$w" -y "$h" \
	    "env TERM=${TUI_TERM:-screen-256color} LANG=${TUI_LANG:-C.UTF-8} LC_ALL= $envs sh $TMP/wrap.sh $*"
	tmx set-option -g window-size manual 2>/dev/null
}

# The screen as text now.
grab() { tmx capture-pane -p >"$TMP/screen" 2>/dev/null; }

# wait_for REGEX WHAT [SECONDS]   passes as soon as the screen matches REGEX (grep -E)
wait_for() {
	end=$(( $(date +%s) + ${3:-$TUI_TIMEOUT} ))
	while :; do
		grab
		if grep -Eq -- "$1" "$TMP/screen"; then _rec passed "$2"; return 0; fi
		[ "$(date +%s)" -ge "$end" ] && break
		sleep 0.1
	done
	_rec failed "$2 (waited for '$1')"
	return 1
}

# wait_gone REGEX WHAT   passes as soon as the screen no longer matches REGEX
wait_gone() {
	end=$(( $(date +%s) + ${3:-$TUI_TIMEOUT} ))
	while :; do
		grab
		if ! grep -Eq -- "$1" "$TMP/screen"; then _rec passed "$2"; return 0; fi
		[ "$(date +%s)" -ge "$end" ] && break
		sleep 0.1
	done
	_rec failed "$2 (still showing '$1')"
	return 1
}

# on_screen REGEX WHAT   the screen shows REGEX (polled like wait_for: a slow binary, under
# valgrind say, may still be writing the screen that wait_for saw begin)
on_screen() { wait_for "$@"; }

# settle   waits until two reads of the screen 0.2 s apart agree (at most 5 s)
settle() {
	end=$(( $(date +%s) + 5 ))
	grab
	while :; do
		cp "$TMP/screen" "$TMP/screen.before"
		sleep 0.2
		grab
		cmp -s "$TMP/screen" "$TMP/screen.before" && return 0
		[ "$(date +%s)" -ge "$end" ] && return 0
	done
}

# not_on_screen REGEX WHAT   the settled screen does not show REGEX
not_on_screen() {
	settle
	if grep -Eq -- "$1" "$TMP/screen"; then _rec failed "$2"; else _rec passed "$2"; fi
}

# keys KEY...   tmux key names (Enter, Escape, Down, F10, C-c) or literal text with -l
keys() { tmx send-keys "$@"; }
text() { tmx send-keys -l "$1"; }

# resize W H
resize() { tmx resize-window -x "$1" -y "$2"; }

# left_alone   the interface has ended and the terminal settings are as before it started
left_alone() {
	wait_for "^EXITED ${1:-0}\$" "${2:-the interface ends with status ${1:-0}}" || return 1
	end=$(( $(date +%s) + 5 ))
	while [ ! -s "$TMP/stty.after" ] && [ "$(date +%s)" -lt "$end" ]; do sleep 0.1; done
	if [ -s "$TMP/stty.before" ] && cmp -s "$TMP/stty.before" "$TMP/stty.after"; then
		_rec passed "terminal settings restored (stty -g equal before and after)"
	else
		_rec failed "terminal settings restored (stty -g equal before and after)"
	fi
}

finish() { tmx_stop; }

# check WHAT CMD...   passes when CMD exits 0 (for the command-line cross-checks)
check() {
	what=$1; shift
	if "$@"; then _rec passed "$what"; else _rec failed "$what"; fi
}

# The demo database (invented gym, invented athletes) in the scratch folder.
demo_db() {
	sh "$ROOT/tests/demo_db.sh" "$SD" "$TMP/demo.db" >/dev/null 2>"$TMP/demo.err" ||
		{ _rec failed "demo database built"; cat "$TMP/demo.err" >&2; return 1; }
}
