# The roster's and the athlete page's forms on the demo database (invented data): add an
# athlete, refuse bad input without storing anything, edit the status, start and finish a
# block, remove the athlete after a confirmation. Each write is checked with the commands.
demo_db || return 0
DB=$TMP/demo.db
P="Pell Quarrymoor"   # an invented name

start 80 24 -- --db "$DB" browse
wait_for "8 of 8 athletes" "opens on the roster" || { finish; return 0; }

# Bad input: an empty name, then a name already taken. Nothing is stored.
keys +
wait_for "new athlete" "+ opens the new-athlete form"
keys Enter
wait_for "athlete name is empty; nothing stored" "an empty name is refused"
text "Maren Oakhollow"
keys Enter
wait_for "nothing stored" "a name already taken is refused"
on_screen "new athlete" "the form stays open after an error"
keys Escape
wait_for "closed: nothing stored" "Esc closes the form"
wait_for "8 of 8 athletes" "still 8 athletes"

# A new athlete: name, trained, lb, notes.
keys +
wait_for "new athlete" "+ opens the form again"
text "$P"
keys Tab Right Tab Right Tab
text "invented test athlete"
keys Enter
wait_for "added athlete '$P' \(trained, lb\)" "the form adds the athlete"
wait_for "9 of 9 athletes" "the roster counts 9 athletes"
on_screen "▸ $P +trained +lb +invented test athlete" "the new athlete is selected on the roster"

# Edit the status.
keys =
wait_for "edit athlete" "= opens the edit form"
on_screen "name +$P" "the edit form is filled in"
keys Tab Left Enter
wait_for "updated athlete '$P' \(untrained, lb\)" "the status is changed"
wait_for "$P +untrained +lb" "the roster shows the new status"

# A block through the form: template, start date; the template gives the length.
keys Enter
wait_for "no blocks yet" "the new athlete has no blocks"
on_screen "this is the prior" "with no data the personal response is the prior"
keys b
wait_for "new block" "b opens the block form"
on_screen "athlete +.*$P" "the block form starts on this athlete"
keys Tab Right Tab BSpace BSpace BSpace BSpace BSpace BSpace BSpace BSpace BSpace BSpace
text "2026-02-30"
keys Enter
wait_for "nothing stored" "an impossible start date is refused"
keys BSpace BSpace BSpace BSpace BSpace
text "06-15"
keys Enter
wait_for "added block [0-9]+: '$P' follows 'Tidewater minimal, two days'" "the form adds the block"
on_screen "2026-06-15 for 12 weeks" "a long message takes two lines; the block has the template's 12 weeks"
wait_for "2026-06-15, open +12 wk Tidewater minimal.*current" "the page lists it as the current block"

# Finish it: the form asks the end date, today (2026-07-01 in the tests) unless changed, and
# obeys the rule of 'block end': no date after today, none before the start.
keys f
wait_for "finish block [0-9]+ \(from 2026-06-15\)" "f opens the finish form for the selected block"
on_screen "end date +2026-07-01" "the end date starts as today"
keys BSpace BSpace BSpace BSpace BSpace
text "07-02"
keys Enter
wait_for "after today.*nothing stored" "an end date after today is refused, as 'block end' refuses it"
keys BSpace BSpace BSpace BSpace BSpace
text "06-10"
keys Enter
wait_for "before.*nothing stored" "an end date before the block's start is refused"
check "nothing changed: the block is still open" sh -c "'$SD' --db '$DB' block list '$P' --format csv | grep -q ',open'"
keys BSpace BSpace BSpace BSpace BSpace
text "06-29"
keys Enter
wait_for "block [0-9]+ finished on 2026-06-29" "Enter finishes it on the date given"
wait_for "2026-06-15 to 2026-06-29" "the page shows the end date"
check "'setdose block list' shows the end date given in the form" sh -c \
	"'$SD' --db '$DB' block list '$P' --format csv | grep -q '2026-06-29'"
keys f
wait_for "already finished on 2026-06-29" "f on a finished block says why it cannot act"

# Remove the athlete: no, then yes.
keys Escape
wait_for "9 of 9 athletes" "Esc goes back to the roster"
keys DC
wait_for "remove '$P' with 1 block and 0 tests\?" "Delete asks, naming what goes with the athlete"
keys n
wait_for "nothing changed" "n keeps the athlete"
on_screen "9 of 9 athletes" "still 9 athletes"
keys DC
wait_for "remove '$P'" "Delete asks again"
keys y
wait_for "removed the athlete with their blocks and tests" "y removes the athlete"
wait_for "8 of 8 athletes" "the roster is back to 8 athletes"

keys Escape
left_alone 0 "Esc on the roster leaves with status 0"
finish

"$SD" --db "$DB" athlete list --format csv >athletes.csv 2>&1
check "'setdose athlete list' no longer has the removed athlete" sh -c "! grep -q '$P' athletes.csv"
check "'setdose athlete list' still has the demo athletes" grep -q "Maren Oakhollow" athletes.csv
"$SD" --db "$DB" block list --format csv >blocks.csv 2>&1
check "the removed athlete's block went with them" sh -c "! grep -q '$P' blocks.csv"
check "'setdose db check' passes after the run" sh -c "'$SD' --db '$DB' db check >/dev/null"
