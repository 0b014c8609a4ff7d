# 80 columns: the default tables of audit, returns, curve and response, with the prose under
# them, fit 80 columns (display width, not bytes) on the bundled demo programs and the demo
# database (invented gym, invented athletes); --wide shows every column; CSV keeps every
# column either way; prose follows the terminal's width (COLUMNS). Golden files in
# tests/data/golden hold the expected output of a few of them (GOLDEN_UPDATE=1 rewrites them,
# for a change that means to alter the output; read the diff before committing it).
P=$ROOT/profiles
G=$ROOT/tests/data/golden
DB=$TMP/demo.db
sh "$ROOT/tests/demo_db.sh" "$SD" "$DB" >/dev/null || { _rec failed "demo database built"; return 0; }
# Programs by relative names, so the golden files do not hold this machine's paths.
cp "$P"/demo-*.ini "$P"/demo-*.csv .

# widest FILE: the display width of FILE's widest line: a character of East Asian width W or F
# takes two columns, a combining mark none, any other one (Unicode Standard Annex #11).
widest() {
	python3 - "$1" <<'PY'
import sys, unicodedata
def width(line):
    return sum(0 if unicodedata.combining(c) else
               2 if unicodedata.east_asian_width(c) in "WF" else 1 for c in line)
lines = open(sys.argv[1], encoding="utf-8").read().split("\n")
print(max(width(l.rstrip("\r")) for l in lines))
PY
}

# fits NAME CMD...   CMD succeeds and its widest line is at most 80 columns
fits() {
	name=$1; shift
	run 0 "$@"
	w=$(widest "$TMP/out")
	check "$name: widest line $w columns, at most 80" test "$w" -le 80
}

# golden NAME   $TMP/out is tests/data/golden/NAME.txt
golden() {
	if [ "${GOLDEN_UPDATE:-0}" = 1 ]; then cp "$TMP/out" "$G/$1.txt"; fi
	LAST_OUT=$TMP/out
	if cmp -s "$TMP/out" "$G/$1.txt"; then _rec passed "$1: output as in golden/$1.txt"
	else _rec failed "$1: output as in golden/$1.txt"; diff "$G/$1.txt" "$TMP/out" | head -20 >&2; fi
}

# The measure itself: a line of 80 two-byte characters is 80 columns (160 bytes), one wide
# character more is 82.
python3 -c 'print("\u00e9" * 80)' >wide80.txt
check "the measure counts columns, not bytes (80 x U+00E9: 80)" test "$(widest wide80.txt)" -eq 80
python3 -c 'print("\u00e9" * 80 + "\u4e00")' >wide82.txt
check "a wide character takes two columns (82)" test "$(widest wide82.txt)" -eq 82

for f in demo-fullbody3.ini demo-fullbody3.csv demo-minimal2.ini demo-upperlower4.ini; do
	fits "audit $f" "$SD" audit "$f"
	fits "audit --by-exercise $f" "$SD" audit --by-exercise "$f"
	fits "curve --program $f" "$SD" curve --program "$f"
done
fits "audit of three programs" "$SD" audit "$P/demo-fullbody3.ini" "$P/demo-minimal2.ini" "$P/demo-upperlower4.ini"
run 0 "$SD" audit demo-upperlower4.ini
golden audit-upperlower4
has out '^muscle +gain% +curve_lo +curve_hi +athlete_lo +athlete_hi +\+1set%$' "the narrow gain table: dose's gain, its curve and athlete intervals, +1set%"
has out '^muscle +direct +indirect +fractional +max/session +sessions +zone$' "the dose table with the zone flag"
run 0 "$SD" audit --by-exercise demo-fullbody3.ini
golden audit-by-exercise-fullbody3

fits "returns" "$SD" returns
golden returns
fits "returns, trained, 6 weeks" "$SD" --status trained --weeks 6 returns
fits "returns, 3 weeks (beyond the evidence: a warning)" "$SD" --weeks 3 returns
says out 'warning: block length \(weeks\) 3 is beyond the evidence'
fits "returns, 20 doses" "$SD" returns --doses 0,1,2,3,4,5,6,7,8,9,10,11,12,14,16,18,20,24,27,30
fits "curve" "$SD" curve
golden curve
fits "curve, step 0.5, trained" "$SD" --status trained curve --step 0.5
run 0 "$SD" curve --program demo-upperlower4.ini
golden curve-upperlower4
fits "block show" "$SD" --db "$DB" block show 1

# Every athlete of the demo roster.
"$SD" --db "$DB" --format csv athlete list | tail -n +2 | cut -d, -f1 >athletes.txt
check "the demo roster has 8 athletes" test "$(wc -l <athletes.txt)" -eq 8
while IFS= read -r a; do
	fits "response '$a'" "$SD" --db "$DB" response "$a"
done <athletes.txt
run 0 "$SD" --db "$DB" response "Maren Oakhollow"
golden response-oakhollow

# The commands' help, which names --wide.
for c in audit curve returns response; do
	fits "help $c" "$SD" help "$c"
	has out '--wide' "help $c names --wide"
done

# --wide: more columns than the default, every one of them; the lines may then pass 80.
ncols() { grep -E "$1" "$TMP/out" | head -n 1 | awk '{ print NF }'; }
run 0 "$SD" audit "$P/demo-fullbody3.ini"
n_narrow=$(ncols '^muscle +gain%')
run 0 "$SD" audit --wide "$P/demo-fullbody3.ini"
n_wide=$(ncols '^muscle +gain%')
check "audit --wide: 11 gain columns against 7 ($n_wide, $n_narrow)" test "$n_wide" -eq 11 -a "$n_narrow" -eq 7
has out '^muscle +gain% +curve_lo +curve_hi +group_lo +group_hi +athlete_lo +athlete_hi +\+1set% +\+1set_lo +\+1set_hi$'
check "audit --wide passes 80 columns" test "$(widest "$TMP/out")" -gt 80
hasnt out '^--wide adds' "no --wide hint under the wide table"

run 0 "$SD" curve --no-plot
n_narrow=$(ncols '^sets +gain%')
run 0 "$SD" curve --no-plot --wide
n_wide=$(ncols '^sets +gain%')
check "curve --wide: 12 columns against 8 ($n_wide, $n_narrow)" test "$n_wide" -eq 12 -a "$n_narrow" -eq 8

run 0 "$SD" --db "$DB" response "Otto Vantwell"
n_narrow=$(ncols '^block +lift')
run 0 "$SD" --db "$DB" response --wide "Otto Vantwell"
n_wide=$(ncols '^block +lift')
check "response --wide: 21 columns against 7 ($n_wide, $n_narrow)" test "$n_wide" -eq 21 -a "$n_narrow" -eq 7
has out '^block +lift +pre +post +e1rm_pre +e1rm_post +reps_pre +reps_post +change% +lnRR +dose +weeks +predicted% +obs_lo% +obs_hi% +percentile +beyond +dose_from +planned +pre_from +post_from$'

# returns: the default grid in two panels (to 1..15, then 20..30), --wide in one.
run 0 "$SD" returns
check "returns: the grid in two panels" test "$(grep -c '^from\\to' "$TMP/out")" -eq 2
has out '^from\\to +1 +2 +3 +4 +5 +6 +8 +10 +12 +15$' "first panel: to 1 to 15"
has out '^from\\to +20 +25 +30$' "second panel: to 20 to 30"
has out '^ +25 +0\.1\+$' "the last row (from 25) only in the panel with its cell"
cp "$TMP/out" returns-narrow.txt
run 0 "$SD" returns --wide
check "returns --wide: the grid in one piece" test "$(grep -c '^from\\to' "$TMP/out")" -eq 1
n_wide=$(ncols '^from\\to')
check "returns --wide: 14 columns in the grid's header ($n_wide)" test "$n_wide" -eq 14
# The same cells either way: each "from" row's cells, in order.
cells() { awk '/^from\\to/ { g = 1; next } g && /^ *[0-9]/ { for (i = 2; i <= NF; i++) c[$1] = c[$1] " " $i } /^$/ { g = 0 }
	END { for (k in c) print k ":" c[k] }' "$1" | sort -n; }
cells returns-narrow.txt >cells-narrow.txt
cells "$TMP/out" >cells-wide.txt
check "returns: the panels hold the same cells as the one-piece grid" cmp -s cells-narrow.txt cells-wide.txt
check "returns: 13 rows of cells" test "$(wc -l <cells-wide.txt)" -eq 13

# CSV and JSON keep every column, with or without --wide.
"$SD" --format csv audit "$P/demo-fullbody3.ini" >a.csv
"$SD" --format csv audit --wide "$P/demo-fullbody3.ini" >b.csv
check "audit: the same CSV with --wide" cmp -s a.csv b.csv
"$SD" --format csv curve --no-plot >a.csv
"$SD" --format csv curve --no-plot --wide >b.csv
check "curve: the same CSV with --wide" cmp -s a.csv b.csv
"$SD" --format csv returns >a.csv
"$SD" --format csv returns --wide >b.csv
check "returns: the same CSV with --wide" cmp -s a.csv b.csv
run 0 "$SD" --format csv curve --no-plot
has out '^sets,gain%,curve_lo,curve_hi,group_lo,group_hi,athlete_lo,athlete_hi,\+1set%,\+1set_lo,\+1set_hi,zone$' "curve CSV: every column"
run 0 "$SD" --db "$DB" --format csv response "Otto Vantwell"
has out '^block,lift,pre,post,e1rm_pre,e1rm_post,reps_pre,reps_post,change%,lnRR,dose,weeks,predicted%,obs_lo%,obs_hi%,percentile,beyond,dose_from,planned,pre_from,post_from$' "response CSV: every column"
run 0 "$SD" --db "$DB" --format json response "Otto Vantwell"
check "response JSON: every column in each observation" python3 -c '
import json, sys
d = json.load(open(sys.argv[1]))
keys = set("block lift pre post e1rm_pre e1rm_post reps_pre reps_post change% lnRR dose weeks predicted% obs_lo% obs_hi% percentile beyond dose_from planned pre_from post_from".split())
assert d["observations"] and all(set(o) == keys for o in d["observations"])
' "$TMP/out"

# Prose follows the terminal: on a terminal (a pseudo-terminal through script(1)) COLUMNS
# sets the width; to a file or a pipe it is 80 whatever COLUMNS says.
COLUMNS=132 "$SD" audit "$P/demo-minimal2.ini" >pipe132.txt
check "to a pipe the width is 80 whatever COLUMNS says" test "$(widest pipe132.txt)" -le 80
COLUMNS=60 script -qec "$SD audit $P/demo-minimal2.ini" /dev/null | tr -d '\r' >tty60.txt
check "on a 60-column terminal the caution wraps at 60" grep -qx 'Caution: a population-average model; individual responses' tty60.txt
grep -A3 '^Caution' tty60.txt >caution60.txt
check "... every caution line at most 60 columns" test "$(widest caution60.txt)" -le 60
COLUMNS=132 script -qec "$SD audit $P/demo-minimal2.ini" /dev/null | tr -d '\r' >tty132.txt
check "on a 132-column terminal the caution takes two lines" grep -qx 'Caution: a population-average model; individual responses vary. Progress volume gradually, stop and see a qualified professional on' tty132.txt
check "... the tables stay as narrow as on 80 columns" grep -qx 'muscle       gain%  curve_lo  curve_hi  athlete_lo  athlete_hi  +1set%' tty132.txt
