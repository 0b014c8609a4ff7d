# The store's rules (src/app/records.c), from the command line; tests/tui/t_rules.sh answers the
# same cases from the interface with the same messages. Invented athletes and the bundled
# invented templates; today is fixed at 2026-07-01.
export SETDOSE_TODAY=2026-07-01
P=$ROOT/profiles
DB=$TMP/rules.db
S() { "$SD" --db "$DB" "$@"; }
count() { sqlite3 "$DB" "SELECT count(*) FROM $1"; }
run 0 S athlete add "Ida Fernhollow" --status trained
run 0 S program add "$P/demo-minimal2.ini"
run 0 S block add "Ida Fernhollow" "Tidewater minimal, two days" --start 2026-01-05
has out "for 12 weeks" "the template gives 12 weeks: planned end 2026-03-30"

# Overdue: an open block past its planned end (2026-01-05 + 12 x 7 days = 2026-03-30).
run 0 S block list
has out "open, 93 days past its planned end$" "block list flags the open block 93 days past its end (03-30 to 07-01)"
run 0 S audit --all
has out "^note: block 1 of 'Ida Fernhollow' is open 93 days past its planned end; end it with 'setdose block end 1'$" "audit --all names the overdue block"
run 0 S audit --all --format csv
has out '^athlete,program,.*,beyond_evidence,overdue_days,done$' "audit --all CSV has an overdue_days column (then the logged dose)"
has out '^Ida Fernhollow,.*,93,$' "audit --all CSV rows carry 93 (and no logged dose)"
run 0 S audit --all --format json
check "audit --all JSON gives overdue_days 93" python3 -c "
import json; a=json.load(open('$TMP/out'))['audits'][0]; assert a['overdue_days']==93, a"
run 0 S block show 1
has out "^note: open 93 days past its planned end" "block show says so too"

# Overlap: refused while the first block is open, unless --overlap.
run 1 S block add "Ida Fernhollow" "Tidewater minimal, two days" --start 2026-06-01
has err "^setdose: block 1 of 'Ida Fernhollow' \(Tidewater minimal, two days from 2026-01-05, still open\) overlaps these weeks; end it first \('setdose block end ID'\), or add --overlap if both are meant to run$" "an overlapping block is refused, naming the open one"
check "nothing stored after the refusal" test "$(count blocks)" -eq 1
run 2 S block end 1 --date 2026-07-02
has err "^setdose: end date 2026-07-02 is after today \(2026-07-01\)$" "a block end after today is refused"
check "the block is still open" test "$(sqlite3 "$DB" "SELECT count(*) FROM blocks WHERE end_date IS NULL")" -eq 1
run 0 S block end 1 --date 2026-03-30
run 1 S block add "Ida Fernhollow" "Tidewater minimal, two days" --start 2026-03-16
has err "block 1 of 'Ida Fernhollow' \(Tidewater minimal, two days from 2026-01-05, ended\) overlaps these weeks; choose another start" "a block inside an ended one's weeks is refused"
run 0 S block add "Ida Fernhollow" "Tidewater minimal, two days" --start 2026-03-31
has out "added block 2" "the day after the end is free"
run 0 S block add "Ida Fernhollow" "Tidewater minimal, two days" --start 2026-04-06 --overlap
has out "added block 3" "--overlap adds a block meant to run alongside"
check "three blocks stored" test "$(count blocks)" -eq 3

# Tests: not after today, not twice.
run 2 S test add "Ida Fernhollow" "back squat" 100 5 --date 2026-07-02
has err "^setdose: test date 2026-07-02 is after today \(2026-07-01\)$" "a test dated after today is refused"
run 0 S test add "Ida Fernhollow" "back squat" 100 5 --date 2026-06-01
run 1 S test add "Ida Fernhollow" squat 100kg 5 --date 2026-06-01
has err "^setdose: this test is already recorded as test 1 \(back squat, 2026-06-01, 100.0 kg x 5\); not added twice$" "the exact same test is refused (the lift by another name, the load with its unit)"
run 0 S test add "Ida Fernhollow" "back squat" 100 6 --date 2026-06-01
check "one test per distinct set: 2 stored" test "$(count tests)" -eq 2

# Did you mean: athlete and template names.
run 1 S block list "Ida Fernholow"
has err "^setdose: unknown athlete 'Ida Fernholow'; did you mean 'Ida Fernhollow'\? \(see 'setdose athlete list'\)$" "a misspelt athlete gets a suggestion"
run 1 S block add "Ida Fernhollow" "Tidewater minmal" --start 2026-09-01
has err "unknown program 'Tidewater minmal'; did you mean 'Tidewater minimal, two days'\?" "a misspelt template gets a suggestion"
run 1 S test list "Zed Quill"
has err "^setdose: unknown athlete 'Zed Quill' \(see 'setdose athlete list'\)$" "no suggestion when nothing is close"
