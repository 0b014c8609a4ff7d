# The store's rules from the interface, with the messages of tests/cli/t_rules.sh: an overdue
# block is flagged, an overlapping block is refused unless "overlap: allow" is chosen, a test
# after today and the same test twice are refused. Invented athlete, bundled invented template;
# today is 2026-07-01 (run.sh).
DB=$TMP/rules.db
"$SD" --db "$DB" athlete add "Ida Fernhollow" --status trained >/dev/null 2>&1 &&
"$SD" --db "$DB" program add "$ROOT/profiles/demo-minimal2.ini" >/dev/null 2>&1 &&
"$SD" --db "$DB" block add "Ida Fernhollow" "Tidewater minimal, two days" --start 2026-01-05 \
	>/dev/null 2>&1 &&
"$SD" --db "$DB" test add "Ida Fernhollow" "back squat" 100 5 --date 2026-06-01 >/dev/null 2>&1
check "the scratch database is set up with the commands" test $? -eq 0
count() { sqlite3 "$DB" "SELECT count(*) FROM $1"; }

start 100 30 -- --db "$DB" browse
wait_for "1 of 1 athlete" "opens on the roster" || { finish; return 0; }
keys Enter
wait_for "2026-01-05, open .*93d over" "the athlete page flags the open block 93 days past its planned end"

# An overlapping block: refused with the command's message, then allowed on purpose.
keys b
wait_for "new block" "b opens the block form"
on_screen "overlap +.*refuse" "the form has an overlap choice, refusing by default"
keys Tab Tab BSpace BSpace BSpace BSpace BSpace BSpace BSpace BSpace BSpace BSpace
text "2026-06-01"
keys Enter
wait_for "still open\) overlaps these" "an overlapping block is refused as 'block add' refuses it"
on_screen "weeks; end it first" "with the same advice"
check "nothing stored after the refusal" test "$(count blocks)" -eq 1
keys Right
wait_for "overlap +.*allow" "overlap: allow"
keys Enter
wait_for "added block 2: 'Ida Fernhollow' follows" "with overlap allowed the block is added"
check "two blocks stored" test "$(count blocks)" -eq 2

# Tests: after today, then the same test twice.
keys t
wait_for "strength test" "t opens the test form"
text "back squat"
keys Tab BSpace BSpace BSpace BSpace BSpace BSpace BSpace BSpace BSpace BSpace
text "2026-07-02"
keys Tab
text "100"
keys Tab BSpace
text "5"
keys Enter
wait_for "test date 2026-07-02 is after today \(2026-07-01\)" "a test after today is refused with the command's message"
keys BSpace BSpace BSpace BSpace BSpace BSpace BSpace BSpace BSpace BSpace
text "2026-06-01"
keys Enter
wait_for "already recorded as test 1 \(back squat, 2026-06-01, 100.0 kg x 5\); not added twice" "the same test twice is refused with the command's message"
check "still one test stored" test "$(count tests)" -eq 1
keys Escape
keys Escape
wait_for "1 of 1 athlete" "back on the roster"
keys Escape
left_alone 0 "Esc leaves with status 0"
finish
