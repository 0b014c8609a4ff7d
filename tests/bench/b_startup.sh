# Start-up: a whole one-program audit against starting the sqlite3 shell on an empty in-memory
# database (`sqlite3 :memory: 'select 1'`), the floor of any SQLite-backed tool on this machine.
# Target: ratio at most 1.5. Medians of 101 runs each, alternated twice to even out the machine.
med() { "$BENCHBIN/bench_run" 101 "$@" | tee /dev/stderr | sed -n 's/.*median *\([0-9.]*\) ms.*/\1/p'; }
s1=$(med "sqlite3 :memory: 'select 1'" sqlite3 :memory: 'select 1')
a1=$(med "audit one program" "$SD" audit "$ROOT/profiles/demo-upperlower4.ini")
s2=$(med "sqlite3 :memory: 'select 1'" sqlite3 :memory: 'select 1')
a2=$(med "audit one program" "$SD" audit "$ROOT/profiles/demo-upperlower4.ini")
awk -v s1="$s1" -v s2="$s2" -v a1="$a1" -v a2="$a2" 'BEGIN {
	s = (s1 < s2) ? s1 : s2; a = (a1 < a2) ? a1 : a2
	r = a / s
	printf "start-up ratio (audit / sqlite3 shell, better of two medians): %.2f (target <= 1.5) %s\n", r, (r <= 1.5 ? "ok" : "OVER TARGET")
}'
