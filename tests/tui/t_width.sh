# 80x24 without cut words: the key card and the lines of text above and under each view's
# table (the athlete's heading and personal response, the dose view's detail and provenance,
# the curve's readout, the comparison's context and decision, the status line with a long
# message) are broken between words, never cut with an ellipsis. Lists may still end a long
# name in an ellipsis (a template name in the block list); that is a cell, not a sentence.
# On the demo database (invented gym, invented athletes).
demo_db || return 0
DB=$TMP/demo.db

# card_text   the key card's inside (between its frame's sides) of the screen now, one line
# each, blanks at the ends removed; the frame is the first and last '│' of a line.
card_text() {
	python3 - "$TMP/screen" <<'PY'
import sys
for line in open(sys.argv[1], encoding="utf-8").read().split("\n"):
    a, b = line.find("\u2502"), line.rfind("\u2502")
    if a >= 0 and b > a:
        print(line[a + 1:b].strip())
PY
}
# joined FILE   the file's lines joined with single spaces (text broken between words reads
# as one line again)
joined() { tr '\n' ' ' <"$1" | sed 's/  */ /g'; }
ELL=$(printf '\342\200\246')

start 80 24 -- --db "$DB" browse
wait_for "8 of 8 athletes" "opens at 80x24" || { finish; return 0; }

# The whole key card, a page at a time.
keys '?'
wait_for "roster \(this view\)" "? opens the key card"
: >card.txt
for i in 1 2 3 4 5 6 7 8; do
	settle
	card_text >>card.txt
	keys NPage
done
check "the key card was read (at least 100 lines)" test "$(wc -l <card.txt)" -ge 100
check "the key card has no cut line (no ellipsis inside its frame)" sh -c "! grep -q '$ELL' card.txt"
joined card.txt >card1.txt
check "a long description reads whole: 'edit the text in \$VISUAL or \$EDITOR; stored only once valid'" \
	grep -qF 'edit the text in $VISUAL or $EDITOR; stored only once valid' card1.txt
check "a long description reads whole: 'check and store (nothing is stored while a field is wrong)'" \
	grep -qF 'check and store (nothing is stored while a field is wrong)' card1.txt
check "a long description reads whole: 'back to the view before; Esc on the roster leaves'" \
	grep -qF 'back to the view before; Esc on the roster leaves' card1.txt
check "... broken under itself: a line holding only the rest of a description" \
	grep -qx 'valid' card.txt
keys Escape
wait_gone "roster \(this view\)" "Esc closes the key card"

# The athlete's page: heading and personal response.
keys /
text "oakh"
keys Enter
wait_for "blocks \(current first\)" "the athlete's page"
settle
check "the athlete's heading reads whole over two lines" sh -c "sed -n 2,3p '$TMP/screen' | tr '\n' ' ' | sed 's/  */ /g' | grep -q 'trained, loads in kg; competes in local meets; invented demo athlete'"
sed -n '/personal response/,$p' "$TMP/screen" >panel.txt
check "the personal response panel has no cut line" sh -c "! grep -q '$ELL' panel.txt"
joined panel.txt >panel1.txt
check "... and names the latest observation whole" grep -Eq 'latest: block [0-9]+ [a-z ]+ [+-][0-9.]+% \(predicted [+-][0-9.]+%, percentile [0-9]+\)' panel1.txt

# A long message on the status line takes the lines above, broken between words.
keys t
wait_for "strength test \(loads in kg\)" "t opens the test form"
text "bench pres"
keys Tab Tab
text "100"
keys Enter
wait_for "nothing stored" "a misspelt lift is refused"
settle
tail -n 3 "$TMP/screen" >status.txt
check "the status message has no cut line" sh -c "! grep -q '$ELL' status.txt"
joined status.txt >status1.txt
check "... and reads whole over its lines" grep -q "unknown lift 'bench pres' (did you mean 'bench press', 'incline bench press', 'decline bench press'); nothing stored" status1.txt
keys Escape
wait_for "closed: nothing stored" "Esc closes the form"

# The dose view, the curve and (from the templates) the comparison: nothing cut anywhere.
keys Enter
wait_for "muscle +sets" "the dose view"
settle
check "the dose view has no cut line" sh -c "! grep -q '$ELL' '$TMP/screen'"
on_screen "^ +strength-volume literature, not fitted to study data" "the provenance goes on under itself"
on_screen "^ calves " "every muscle still on screen at 80x24"
on_screen "no warnings +┊ plateau [0-9.]+ +┃ end of evidence 30 +\? keys +q leave" "warnings and the scale's marks share the status line"
keys k
wait_for "at 5\.0 sets: gain" "the curve"
settle
check "the curve view has no cut line" sh -c "! grep -q '$ELL' '$TMP/screen'"
joined "$TMP/screen" >curve1.txt
check "the readout names every muscle at the cursor" grep -q 'here: a chest, k quads, l hamstrings' curve1.txt
keys s ]
wait_for "untrained, 13-week block \(own: trained, 12 wk\)" "a longer context"
settle
on_screen "^ █ mean +▓ 95% curve +▒ group +░ athlete" "the legend moves to its own line rather than being cut"
check "... nothing cut" sh -c "! grep -q '$ELL' '$TMP/screen'"
keys Escape Escape Escape Tab
wait_for "stored templates" "the templates"
keys Space Down c
wait_for "B over A" "the comparison"
settle
check "the comparison has no cut line" sh -c "! grep -q '$ELL' '$TMP/screen'"
joined "$TMP/screen" >cmp1.txt
check "the comparison's context reads whole" grep -q "decision: the 90% interval against +/- the SWC 3.0%" cmp1.txt
check "the decision reads whole" grep -Eq 'B over A [+-][0-9.]+% \(95% CI [-0-9.]+ to [-0-9.]+\): [a-z-]+, the 90% interval [-0-9.]+ to [-0-9.]+ is ' cmp1.txt
keys F10
left_alone 0
finish
