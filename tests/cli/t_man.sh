# The man page renders without warnings (groff -ww; mandoc -T lint at warning level when
# installed), and its EXAMPLES run as written, in order, in a scratch folder.
M=$ROOT/man/setdose.1
groff -ww -man -z "$M" >"$TMP/out" 2>&1
lines out 0
if command -v mandoc >/dev/null; then
	mandoc -T lint -W warning "$M" >"$TMP/out" 2>&1
	lines out 0
fi
# The example lines, de-escaped as man shows them.
sed -n '/^\.SH EXAMPLES/,/^\.SH /p' "$M" | sed -n '/^\.nf/,/^\.fi/p' | sed '1d;$d' |
	sed 's/\\-/-/g; s/\\(aq/'"'"'/g' >examples.sh
check "the man page has examples" test "$(wc -l <examples.sh)" -ge 10
mkdir -p templates "$HOME"
sed 's/^name *=.*/name = My week/' "$ROOT/profiles/demo-upperlower4.ini" >week.ini
cp "$ROOT/profiles/demo-fullbody3.ini" other.ini
# An invented week of logged sets for the log example.
printf 'date,exercise,sets,reps,load,effort\n2025-01-06,back squat,3,5,100kg,RIR 2\n2025-01-08,bench press,3,8,70kg,RPE 8\n' >week1.csv
cp "$ROOT/profiles/demo-"*.ini templates/
PATH=$(dirname "$SD"):$PATH
export PATH
while IFS= read -r line; do
	sh -c "$line" >"$TMP/out" 2>"$TMP/err"
	rc=$?
	LAST_OUT=$TMP/err
	if [ $rc -eq 0 ]; then _rec passed "man example runs: $line"
	else _rec failed "man example runs (exit $rc): $line"; fi
done <examples.sh
