# The bad-input table (tests/data/badinput/cases.tsv): every case exits with its status,
# prints exactly its one error line, and changes neither the database nor any file.
B=$ROOT/tests/data/badinput
sh "$ROOT/tests/demo_db.sh" "$SD" "$SETDOSE_DB" >/dev/null || { _rec failed "demo database built"; return 0; }
mkdir work
cp "$B"/* work/
cd work || return 0
printf 'keep\n' >victim
ln -s victim link.png
printf 'old\n' >existing.csv
state() {
	sqlite3 "$SETDOSE_DB" .dump
	ls -l --time-style=+%s.%N . | grep -v ' gym\.db'
	cat victim existing.csv
}
state >"$TMP/before"
n=0
tab=$(printf '\t')
while IFS="$tab" read -r want cmd msg; do
	case $want in '#'*|'') continue ;; esac
	n=$((n + 1))
	eval "\"\$SD\" $cmd" >"$TMP/out" 2>"$TMP/err"
	got=$?
	LAST_OUT=$TMP/err
	if [ "$got" -eq "$want" ]; then _rec passed "case $n exit $want: $cmd"
	else _rec failed "case $n exit $want (got $got): $cmd"; fi
	printf '%s\n' "$msg" >"$TMP/want"
	check "case $n one line: $msg" cmp -s "$TMP/err" "$TMP/want"
	state >"$TMP/after"
	check "case $n changed no stored data and no file" cmp -s "$TMP/before" "$TMP/after"
done <"$B/cases.tsv"
check "the table has at least 60 cases ($n)" test "$n" -ge 60
cd "$TMP"
