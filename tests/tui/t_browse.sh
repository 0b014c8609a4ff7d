# The daily round at 80x24 on the demo database (invented gym, invented athletes): open the
# interface, find an athlete by typing, open the current block's dose view and the curve,
# read the curve with the cursor and the context toggles, the key card, log a strength test
# through the form, resize the window, leave. Every number checked on screen is checked
# against what the command-line commands print for the same thing.
demo_db || return 0
DB=$TMP/demo.db
A="Maren Oakhollow"

# Expected figures from the commands themselves.
"$SD" --db "$DB" response "$A" --format csv >resp.csv 2>&1
RESP=$(awk -F, 'p { printf "%+.1f%% against the curve, 95%% interval %+.1f%% to %+.1f%%; data weight %.2f", $7, $8, $9, $12; exit } /^observations,/ { p = 1 }' resp.csv | sed 's/+/\\+/g')
# (fields counted from the end: template names hold commas)
BLOCK=$("$SD" --db "$DB" block list "$A" --format csv | awk -F, '$NF == "open" { print $1 }' | tail -1)
"$SD" --db "$DB" block show "$BLOCK" --format csv >block.csv 2>&1
CHEST=$(awk -F, '$(NF-17) == "chest" { printf "chest {1,}%.1f .* %+.1f {1,}%.1f to %.1f {1,}%+.2f %s", $(NF-14), $(NF-11), $(NF-10), $(NF-9), $(NF-4), $(NF-1) }' block.csv | sed 's/+/\\+/g')
DETAIL=$(awk -F, '$(NF-17) == "chest" { printf "gain %+.1f%%, 95%%: curve %.1f to %.1f, group %.1f to %.1f, athlete %.1f to %.1f", $(NF-11), $(NF-10), $(NF-9), $(NF-8), $(NF-7), $(NF-6), $(NF-5) }' block.csv | sed 's/+/\\+/g')
PLATEAU=$("$SD" --db "$DB" block show "$BLOCK" | sed -n 's/.*plateau at \([0-9.]*\) weekly.*/\1/p')
# readout at DOSE for STATUS and WEEKS, as `setdose curve` tabulates it
readout() {
	"$SD" --db "$DB" --status "$2" --weeks "$3" curve --step 0.5 --no-plot --format csv |
		awk -F, -v x="$1" '$1 == x { printf "at %s sets: gain %+.1f%%  95%%: curve %.1f to %.1f  group %.1f to %.1f", x, $2, $3, $4, $5, $6 }' |
		sed 's/+/\\+/g'
}
check "expected figures computed by the commands" [ -n "$RESP" ] && [ -n "$BLOCK" ] && [ -n "$CHEST" ] && [ -n "$DETAIL" ] && [ -n "$PLATEAU" ]

# setdose with no command on a terminal opens the interface.
start 80 24 -- --db "$DB"
wait_for "roster" "opens on the roster" || { finish; return 0; }
wait_for "8 of 8 athletes" "lists the demo database's 8 athletes"
on_screen "Maren Oakhollow +trained +kg" "athlete rows show status and units"
on_screen "\? keys +q leave" "status line shows the help key and q"

# / starts the search; Enter opens the athlete's page.
text "/oakh"
wait_for "search +oakh" "the search text is shown as it is typed"
on_screen "1 of 8 athletes" "typing 'oakh' narrows the roster to one athlete"
not_on_screen "Tobin Reedmere" "other athletes are hidden"
keys Enter
wait_for "blocks \(current first\)" "Enter opens the athlete's page"
on_screen "#$BLOCK +2026-06-08, open +12 wk Tidewater minimal.*current" "the open block is listed first, marked current"
on_screen "strength tests \(newest first\)" "tests are listed"
on_screen "2026-06-01 +bench press +120\.0 kg x 5 +1RM 135\.0 kg" "a test row shows load, reps and 1RM"
on_screen "$RESP" "personal response equals 'setdose response' (estimate, interval, data weight)"

# The dose view of the current block.
keys Enter
wait_for "block $BLOCK 'Tidewater minimal, two days'" "Enter opens the current block's dose view"
on_screen "trained, 12-week block" "the dose view states the athlete's status and block length"
on_screen "plateau $PLATEAU .* end of evidence 30" "the scale names the plateau and the end of the evidence"
on_screen "$CHEST" "chest row equals 'setdose block show' (sets, gain, CI, +1 set, zone)"
on_screen "calves +0\.0 .* none" "a muscle without sets is shown as such"
on_screen "profile 'strength-default' \(calibrated\): calibrated from memory" "the dose view shows the profile's provenance line"
on_screen "$DETAIL" "the selected muscle's detail names the three levels, as 'setdose block show'"
on_screen "chest +5\.0 [▁▂▃▄▅▆▇█]+●[▁▂▃▄▅▆▇█┊┃]+" "the dose sits on a strip as tall as the curve, drawn with block characters"

# The curve, its cursor starting at the selected muscle's dose (chest, 5.0 sets).
keys k
wait_for "$(readout 5.0 trained 12)" "k opens the curve; the cursor reads the curve at 5.0 sets as 'setdose curve' does"
on_screen "█ mean +▓ 95% curve +▒ group +░ athlete" "the curve's legend names the three bands"
on_screen "^ *athlete .* to .*; \+1 set " "the readout gives the one-athlete band and +1 set"
on_screen "a chest 5\.0" "the block's muscles are marked and listed"
on_screen "here: a chest" "the cursor names the muscles at its dose"
on_screen "sets: +0 .*10 .*20 .*30" "the dose axis is labelled"
keys Right Right Right
wait_for "$(readout 6.5 trained 12)" "Right moves the cursor to 6.5 sets; values equal 'setdose curve'"
keys s
wait_for "untrained, 12-week block \(own: trained, 12 wk\)" "s switches the training status"
wait_for "$(readout 6.5 untrained 12)" "untrained values equal 'setdose curve --status untrained'"
keys ]
wait_for "untrained, 13-week block" "] makes the block one week longer"
wait_for "$(readout 6.5 untrained 13)" "13-week values equal 'setdose curve --weeks 13'"
keys o
wait_for "$(readout 6.5 trained 12)" "o restores the block's own context"

# The key card lists every key, the current view's first.
keys '?'
wait_for "curve \(this view\)" "? opens the key card with this view's keys first"
on_screen "Tab +cursor to the next marked muscle" "the key card lists the curve's keys"
on_screen "everywhere" "the key card lists the keys that work everywhere"
keys NPage NPage NPage NPage NPage NPage
wait_for "questions" "the key card scrolls to its end (forms and questions)"
keys Escape
wait_gone "this key card|questions" "Esc closes the key card"

# Back to the athlete, log a test through the form.
keys Escape
wait_for "muscle +sets" "Esc goes back to the dose view"
keys Escape
wait_for "personal response" "Esc goes back to the athlete's page"
keys t
wait_for "strength test \(loads in kg\)" "t opens the test form"
on_screen "date +2026-07-01" "the date defaults to today"
text "bench press"
keys Tab Tab
text "100"
keys Tab BSpace
text "5"
# Brzycki (1993): 1RM = load x 36 / (37 - reps) = 100 x 36 / 32 = 112.5
wait_for "1RM 112\.5 kg \(brzycki\)" "the form shows the estimated 1RM as it is typed (Brzycki 1993)"
keys Enter
wait_for "logged test [0-9]+: bench press 100\.0 kg x 5 on 2026-07-01; 1RM 112\.5 kg \(brzycki\)" "Enter stores the test"
wait_for "2026-07-01 +bench press +100\.0 kg x 5 +1RM 112\.5 kg" "the new test heads the list"

# Resizing: wider, narrow, too small, back.
resize 120 40
wait_for "2026-07-01 +bench press +100\.0 kg x 5 +1RM 112\.5 kg +brzycki" "at 120x40 the page adds the formula column"
keys Enter
wait_for "95% athlete" "at 120 columns the dose view adds the one-athlete band column"
resize 60 20
wait_for "^ muscle +sets .* gain% +95% curve +\+1 set" "at 60x20 the dose view is drawn without the athlete column"
resize 30 10
wait_for "terminal too small" "a 30x10 window says it is too small"
resize 80 24
wait_for "muscle +sets" "back at 80x24 the dose view is drawn again"

keys F10
left_alone 0 "F10 leaves with status 0"
finish

"$SD" --db "$DB" test list "$A" --format csv >tests.csv 2>&1
check "'setdose test list' shows the test logged in the form" \
	grep -q ',2026-07-01,bench press,100.0,5,112.5,kg,brzycki$' tests.csv
