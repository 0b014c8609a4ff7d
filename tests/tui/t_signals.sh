# Leaving by a signal: Ctrl-C, SIGTERM and SIGHUP each end the interface with the terminal
# restored (the same settings as before, the normal screen back) and one line naming the
# cause; a crash (SIGSEGV) restores the terminal before the default action; and no terminal
# at all is refused with a usage error.
demo_db || return 0
DB=$TMP/demo.db

# The pid of setdose in the tmux window: the wrapper shell's child.
sd_pid() {
	sh_pid=$(tmx display-message -p '#{pane_pid}')
	ps -o pid= --ppid "$sh_pid" | tr -d ' ' | head -1
}

start 80 24 -- --db "$DB" browse
wait_for "8 of 8 athletes" "opens on the roster" || { finish; return 0; }
keys Tab
wait_for "stored templates" "a view over the roster is open"
keys C-c
wait_for "setdose: interrupted by Ctrl-C" "Ctrl-C ends it with one line naming the cause"
left_alone 1 "Ctrl-C leaves with status 1"
not_on_screen "stored templates" "the normal screen is back (the interface's screen is gone)"

for sig in TERM HUP; do
	start 80 24 -- --db "$DB" browse
	wait_for "8 of 8 athletes" "opens again for SIG$sig" || continue
	keys +
	wait_for "new athlete" "a form is open when SIG$sig arrives"
	pid=$(sd_pid)
	check "found the pid of setdose for SIG$sig" [ -n "$pid" ]
	[ -n "$pid" ] && kill -s "$sig" "$pid"
	case $sig in TERM) why="a termination signal" ;; HUP) why="a hangup" ;; esac
	wait_for "setdose: interrupted by $why" "SIG$sig ends it with one line naming the cause"
	left_alone 1 "SIG$sig leaves with status 1"
done

# A crash, simulated by sending SIGSEGV: the terminal is put back before the default action.
# (Not with the sanitizer build or valgrind, which take over SIGSEGV to report it.)
case "$SD $WRAP" in
*/asan/*|*valgrind*) finish ;;
*)
start 80 24 -- --db "$DB" browse
wait_for "8 of 8 athletes" "opens again for SIGSEGV"
keys Tab
wait_for "stored templates" "a view is open when SIGSEGV arrives"
pid=$(sd_pid)
[ -n "$pid" ] && kill -s SEGV "$pid"
left_alone 139 "SIGSEGV ends it with the signal's status (128 + 11)"
not_on_screen "stored templates" "after the crash the normal screen is back"
finish
;;
esac

# No terminal: refused, nothing drawn.
"$SD" --db "$DB" browse </dev/null >out 2>err
status=$?
check "browse without a terminal exits with status 2" [ "$status" -eq 2 ]
check "browse without a terminal says why" grep -q "^setdose: browse needs a terminal" err
check "browse without a terminal prints nothing on standard output" [ ! -s out ]
"$SD" --db "$DB" </dev/null >out 2>err
check "setdose alone without a terminal prints the usage instead" grep -q "^usage: setdose" out
"$SD" --db "$DB" browse extra </dev/null >out 2>err
status=$?
check "browse takes no arguments (status 2, usage)" sh -c "[ $status -eq 2 ] && grep -q '^setdose: usage: setdose browse' err"
