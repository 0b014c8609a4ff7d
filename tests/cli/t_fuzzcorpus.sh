# The fuzzing corpus (tests/fuzz/corpus: seeds; tests/fuzz/crashes: every input that ever
# crashed a harness) replayed through the setdose binary itself, so the inputs are checked
# with or without clang (make check runs this with the plain and the sanitizer build): each
# ends with exit 0 or 1 and at most one line on standard error, never a crash.
F=$ROOT/tests/fuzz
n=0
# try TARGET FILE EXT CMD...: copies FILE to input.EXT and runs CMD with INPUT replaced.
try() {
	target=$1 file=$2 ext=$3
	shift 3
	cp "$file" "input.$ext"
	"$SD" "$@" >"$TMP/out" 2>"$TMP/err"
	got=$?
	n=$((n + 1))
	LAST_OUT=$TMP/err
	if [ "$got" -le 1 ] && [ "$(wc -l <"$TMP/err")" -le 1 ]; then
		_rec passed "$target $(basename "$file"): $* exit $got"
	else
		_rec failed "$target $(basename "$file"): $* exit $got, $(wc -l <"$TMP/err") error lines"
	fi
}
for f in "$F"/corpus/program_ini/* "$F"/crashes/program_ini/*; do
	[ -f "$f" ] && try program_ini "$f" ini audit input.ini
done
for f in "$F"/corpus/program_csv/* "$F"/crashes/program_csv/*; do
	[ -f "$f" ] && try program_csv "$f" csv audit input.csv
done
for f in "$F"/corpus/library/* "$F"/crashes/library/*; do
	[ -f "$f" ] && try library "$f" ini --exercises input.ini exercises
done
for f in "$F"/corpus/profile/* "$F"/crashes/profile/*; do
	[ -f "$f" ] || continue
	try profile "$f" ini --profile input.ini curve
	try profile "$f" ini --profile input.ini returns
done
for f in "$F"/corpus/effects/* "$F"/crashes/effects/*; do
	[ -f "$f" ] || continue
	try effects "$f" csv fit input.csv
	try effects "$f" csv effects input.csv
done
check "the corpus was replayed ($n runs)" test "$n" -ge 50
# Logs report every bad row, a line each: any number of lines, but exit 0 or 1, no crash.
"$SD" athlete add "Fuzz Log" >/dev/null 2>&1
for f in "$F"/corpus/log/* "$F"/crashes/log/*; do
	[ -f "$f" ] || continue
	cp "$f" input.csv
	"$SD" log import input.csv --athlete "Fuzz Log" >"$TMP/out" 2>"$TMP/err"
	got=$?
	LAST_OUT=$TMP/err
	if [ "$got" -le 1 ]; then _rec passed "log $(basename "$f"): log import exit $got"
	else _rec failed "log $(basename "$f"): log import exit $got"; fi
done
