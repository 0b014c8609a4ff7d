# The training log: import (all rows or none, every bad row named, a second import adds
# nothing, a killed import leaves the database as it was), export and its round trip, the
# weeks done against planned across a year boundary (hand-counted), e1RM from logged sets,
# and the response from the logged dose and training estimates. Invented athletes and logs.
export SETDOSE_TODAY=2027-01-10
run 0 "$SD" athlete add "Ada Quill" --status trained
run 0 "$SD" athlete add "Bo Lark" --units lb
run 0 "$SD" program add "$ROOT/profiles/demo-minimal2.ini"
DB=$SETDOSE_DB
rows() { sqlite3 "$DB" "SELECT count(*) FROM logs${1:+ WHERE $1}"; }
snapshot() { sqlite3 "$DB" .dump | md5sum; }

# ---------------------------------------------------------------- import, twice
# A small log across the end of 2026-W53 (2026 began on a Thursday: 53 ISO weeks) and the
# start of 2027-W01. The two identical rows of 2027-01-04 are two groups of sets.
cat >year.csv <<'EOF'
date,exercise,sets,reps,load,effort
2026-12-29,back squat,3,5,100kg,RIR 2
2026-12-31,bench press,3,8,80kg,RPE 8
2026-12-31,bench press,2,8,80kg,RIR 6
2027-01-03,pull-ups,3,8,,RIR 1
2027-01-04,Squat,4,5,105,RPE 8.5
2027-01-04,squat,4,5,105,RPE 8.5
EOF
run 0 "$SD" log import year.csv --athlete "Ada Quill"
has out "^imported 'year.csv': 6 rows read, 6 new, 0 already stored$"
check "6 rows stored" test "$(rows)" -eq 6
check "names stored as the library's, a bare load in the athlete's units (kg)" test \
	"$(rows "exercise = 'back squat' AND load = 105 AND unit = 'kg'")" -eq 2
check "the identical rows get ordinals 1 and 2" test \
	"$(sqlite3 "$DB" "SELECT group_concat(ordinal) FROM logs WHERE log_date = '2027-01-04'")" = "1,2"
before=$(snapshot)
run 0 "$SD" log import year.csv --athlete "Ada Quill"
has out "^imported 'year.csv': 6 rows read, 0 new, 6 already stored$" "importing twice adds nothing"
check "importing twice stores nothing new" test "$(snapshot)" = "$before"
# The same rows under another file name, with the columns in another order, are the same
# rows; a third identical squat row on 2027-01-04 is a new set (on another athlete, removed
# afterwards with its log).
{ echo "exercise,date,reps,sets,effort,load"; echo "back squat,2027-01-04,5,4,RPE 8.5,105kg"
  echo "back squat,2027-01-04,5,4,RPE 8.5,105 kg"; echo "back squat,2027-01-04,5,4,RPE 8.5,105kg"; } >again.csv
run 0 "$SD" athlete add "Cy Moss"
run 0 "$SD" log import year.csv --athlete "Cy Moss"
run 0 "$SD" log import again.csv --athlete "Cy Moss"
has out "3 rows read, 1 new, 2 already stored" "recognised by content, not by file: the third identical row is new"
run 1 "$SD" athlete rm "Cy Moss" --yes
has err "has 0 blocks, 0 tests and 7 logged rows; not removed \(use --cascade"
run 0 "$SD" athlete rm "Cy Moss" --cascade --yes
has out "removed athlete 'Cy Moss' \(0 blocks, 0 tests, 7 logged rows\)"
check "Cy Moss's rows and weekly sums are gone with him" test "$(rows)" -eq 6 -a \
	"$(sqlite3 "$DB" "SELECT count(*) FROM log_weeks WHERE athlete_id NOT IN (SELECT id FROM athletes)")" -eq 0

# ---------------------------------------------------------------- a bad row
# One bad row among good ones: nothing is stored, and the row is named.
before=$(snapshot)
{ echo "date,exercise,sets,reps,load,effort,athlete"
  echo "2027-01-05,bench press,3,5,185,RIR 2,Bo Lark"
  echo "2027-01-05,bench press,3,5,185lb,RIR 2,Bo Lark"
  echo "2027-01-06,bench pres,3,5,185lb,RIR 2,Bo Lark"
  echo "2027-01-07,bench press,3,5,185lb,RIR 2,Bo Lark"; } >onebad.csv
run 1 "$SD" log import onebad.csv
has err "^setdose: cannot read log 'onebad.csv' line 4: unknown exercise 'bench pres' \(did you mean 'bench press'"
lines err 1
check "a file with one bad row stores nothing" test "$(snapshot)" = "$before"
# Every bad row is named, each on its line.
{ echo "date,exercise,sets,reps,load,effort"
  echo "2027-01-05,bench press,0,5,80kg,RIR 2"
  echo "2027-01-05,bench press,3,5-8,80kg,RIR 2"
  echo "2027-01-05,bench press,3,5,80 stone,RIR 2"
  echo "2027-01-05,bench press,3,5,80kg,RPE 11"
  echo "2027-01-11,bench press,3,5,80kg,RIR 2"
  echo "2027-01-05,bench press,3,5,1200kg,RIR 2"; } >manybad.csv
run 1 "$SD" log import manybad.csv --athlete "Ada Quill"
has err "line 2: sets = 0 is outside 1 to 100 \(a set count\) \(first of 6 errors\)$"
has err "line 3: reps '5-8': a log records the reps done, not a range$"
has err "line 4: bad load '80 stone'"
has err "line 5: RPE out of range in 'RPE 11' \(1 to 10\)$"
has err "line 6: date 2027-01-11 is after today \(2027-01-10\)$"
has err "line 7: load = 1200 is outside 0.01 to 1000 \(a load in kg\)$"
lines err 6
check "nothing stored from a file of bad rows" test "$(snapshot)" = "$before"
run 1 "$SD" log import onebad.csv --athlete "Ada Quill"
run 1 "$SD" log import year.csv
has err "line 1: no athlete column: give the athlete with --athlete NAME"
run 1 "$SD" log import year.csv --athlete "Nobody Here"
has err "unknown athlete 'Nobody Here'"
run 2 "$SD" log import
run 2 "$SD" log import year.csv --athlete
run 2 "$SD" log import year.csv --bogus
check "no bad import changed anything" test "$(snapshot)" = "$before"

# ---------------------------------------------------------------- a killed import
# A large invented log (tests/bench/gen_logs.sh), killed with SIGKILL while it writes: the
# database is as before, passes its check, and the same import then goes through.
sh "$ROOT/tests/bench/gen_logs.sh" 400000 100 2015-01-05 >big.csv
before=$(snapshot)
"$SD" log import big.csv --athlete "Bo Lark" >/dev/null 2>&1 &
pid=$!
# Wait until the transaction is writing (SQLite's write-ahead log grows past 1 MB), then kill.
end=$(( $(date +%s) + 30 ))
while kill -0 "$pid" 2>/dev/null && [ "$(stat -c %s "$DB-wal" 2>/dev/null || echo 0)" -lt 1048576 ] &&
      [ "$(date +%s)" -lt "$end" ]; do sleep 0.02; done
kill -9 "$pid" 2>/dev/null
{ wait "$pid"; } 2>/dev/null
check "the import was killed while writing (status 137)" test $? -eq 137
check "a killed import leaves the database as before" test "$(snapshot)" = "$before"
run 0 "$SD" db check
# Killed at whatever point timeout finds it, twice more.
for t in 0.3 0.8; do
	timeout -s KILL "$t" "$SD" log import big.csv --athlete "Bo Lark" >/dev/null 2>&1
	check "killed after $t s: the database as before" test "$(snapshot)" = "$before"
done
run 0 "$SD" log import big.csv --athlete "Bo Lark"
has out "400000 rows read, 400000 new, 0 already stored" "after the kills the whole import goes through"
run 0 "$SD" db check
run 0 "$SD" athlete rm "Bo Lark" --cascade --yes

# ---------------------------------------------------------------- weeks, hand-counted
# Ada's log, weights 1 (prime mover) and 0.5 (synergist), RIR 4 or less counts:
#   2026-W53: back squat 3 (quads, glutes, adductors; lower back 0.5), bench press 3 at RPE 8
#             (chest; triceps, front delts 0.5), 2 at RIR 6 not counted, pull-up 3 (lats;
#             biceps, upper back 0.5): quads 3, chest 3, triceps 1.5, lats 3, biceps 1.5;
#             sessions Tue, Thu, Sun = 3.
#   2027-W01: back squat 4 + 4: quads 8, lower back 4; one session.
# No block yet: nothing planned.
run 0 "$SD" log weeks "Ada Quill" --format csv
has out '^2026-W53,2026-12-28,,3,0.0,0,quads,3.000,0.000,$' "2026-W53 quads 3, nothing planned"
has out '^2026-W53,2026-12-28,,3,0.0,0,triceps,1.500,0.000,$' "2026-W53 triceps 1.5"
has out '^2026-W53,2026-12-28,,3,0.0,0,lats,3.000,0.000,$' "2026-W53 lats 3"
has out '^2026-W53,2026-12-28,,3,0.0,0,chest,3.000,0.000,$' "2026-W53 chest 3 (the RIR 6 sets not counted)"
has out '^2027-W01,2027-01-04,,1,0.0,0,quads,8.000,0.000,$' "2027-W01 quads 8, one session"
has out '^2027-W01,2027-01-04,,1,0.0,0,lower-back,4.000,0.000,$' "2027-W01 lower back 4"
hasnt out '^2027-W01.*,chest,' "2027-W01 has no chest"
# A block from Wednesday 2026-12-30: 5 of 2026-W53's 7 days are in it, so that week plans
# 5/7 of the template's weekly dose and of its 2 days (1.43, rounded 1: nothing missed);
# 2027-W01 plans all of it (2 days, 1 trained: 1 missed). Planned doses from `audit`.
run 0 "$SD" block add "Ada Quill" "Tidewater minimal, two days" --start 2026-12-30
"$SD" audit "$ROOT/profiles/demo-minimal2.ini" --format csv >plan.csv
Q=$(awk -F, '$2 == "quads" { print $5 }' plan.csv)
check "the template plans some quads sets" awk -v q="$Q" 'BEGIN { exit !(q > 0) }'
run 0 "$SD" log weeks "Ada Quill" --format csv
check "2026-W53 plans 5/7 of the weekly quads dose, adherence 3 / that" awk -F, -v q="$Q" '
	$1 == "2026-W53" && $7 == "quads" { ok = $3 == 1 && $4 == 3 && $5 == "1.4" && $6 == 0 &&
		($9 - q * 5 / 7) ^ 2 < 1e-6 && ($10 - 300 / (q * 5 / 7)) ^ 2 < 1e-3 }
	END { exit !ok }' "$TMP/out"
check "2027-W01 plans the whole weekly dose, 1 session missed, adherence 8 / quads" awk -F, -v q="$Q" '
	$1 == "2027-W01" && $7 == "quads" { ok = $4 == 1 && $5 == "2.0" && $6 == 1 &&
		($9 - q) ^ 2 < 1e-6 && ($10 - 800 / q) ^ 2 < 1e-3 }
	END { exit !ok }' "$TMP/out"
# The block's logged average: from 2026-12-30 to today 2027-01-10 (12 days): the squats of
# 2027-01-04, quads 8, over 12/7 weeks = 4.667 a week.
check "the block's logged average quads dose is 8 / (12/7) = 4.667" awk -F, '
	$1 == 1 && $(NF-3) == "quads" { ok = $(NF-7) == "2026-12-30" && $(NF-6) == "2027-01-10" &&
		($(NF-1) - 8 * 7 / 12) ^ 2 < 1e-6 }
	END { exit !ok }' "$TMP/out"
run 0 "$SD" log weeks "Ada Quill"
has out '^athlete Ada Quill: weekly fractional sets logged'
has out '^2026-W53 +2026-12-28 +1 +3 +1\.4 +0 +quads +3\.0 '
has out 'Caution: a population-average model'
run 0 "$SD" log weeks "Ada Quill" --block 1 --format json
check "log weeks JSON: weeks, blocks, caution" python3 -c "
import json; d=json.load(open('$TMP/out'))
assert {w['week'] for w in d['weeks']} == {'2026-W53', '2027-W01'}, d
q=[b for b in d['blocks'] if b['muscle']=='quads'][0]
assert abs(q['done'] - 8*7/12) < 1e-3 and d['rir_limit'] == 4 and d['caution']"
run 1 "$SD" log weeks "Ada Quill" --block 99
has err "block 99 is not one of athlete 'Ada Quill''s blocks"
run 1 "$SD" log weeks "Nobody Here"
# audit --all: the open block's done column is the same logged average.
run 0 "$SD" audit --all --format csv
check "audit --all: done = the block's logged average (4.67 quads), the last column" awk -F, '
	$(NF-13) == "quads" { ok = $NF == "4.67" } END { exit !ok }' "$TMP/out"

# ---------------------------------------------------------------- e1RM from logged sets
# 100 kg x 5 at RIR 2: 7 reps to failure, Brzycki (1993) 100 x 36 / 30 = 120 kg. 105 kg x 5 at
# RPE 8.5 (RIR 1.5): 6.5 reps, 105 x 36 / 30.5 = 123.934 kg. Bench 80 kg x 8 at RPE 8: 10 reps,
# 80 x 36 / 27 = 106.667 kg; the sets at RIR 6 (14 reps) are outside the equations' range.
run 0 "$SD" log e1rm "Ada Quill" --format csv
has out '^back squat,2026-W53,2026-12-29,100.0,5,2,7,120.000,kg$'
has out '^back squat,2027-W01,2027-01-04,105.0,5,1.5,6.5,123.934,kg$'
has out '^bench press,2026-W53,2026-12-31,80.0,8,2,10,106.667,kg$'
hasnt out '^pull-up' "no e1RM without a load"
run 0 "$SD" log e1rm "Ada Quill" "bench" --formula epley --format csv
has out '^bench press,2026-W53,2026-12-31,80.0,8,2,10,106.667,kg$' "Epley (1985): 80 x (1 + 10/30) = 106.667 too"
lines out 2

# ---------------------------------------------------------------- response
# The block ends with no strength test: its squat is judged by training estimates (the weekly
# best nearest the start, 2026-12-29, 120 kg; nearest the end, 2027-01-04, 123.934 kg), from
# the logged dose (4.667), each with the estimate's error.
run 0 "$SD" block end 1 --date 2027-01-10
run 0 "$SD" response "Ada Quill" --format csv
has out '^1,back squat,2026-12-29,2027-01-04,120.000,123.934,7,6.5,.*,logged,[0-9.]+,training,training$' "a block without tests: training estimates, flagged"
check "the logged dose of the squat's prime movers: 4.667" awk -F, '$2 == "back squat" { ok = ($11 - 8 * 7 / 12) ^ 2 < 1e-6 } END { exit !ok }' "$TMP/out"
has out '^observations,.*,estimate_error$'
has out ',0\.06$' "the estimate error (default 0.06) in the CSV"
run 0 "$SD" response "Ada Quill" --estimate-error 0.1 --format json
check "response JSON: estimate_error 0.1, the row's sources" python3 -c "
import json; d=json.load(open('$TMP/out'))
o=[o for o in d['observations'] if o['lift']=='back squat'][0]
assert d['estimate_error']==0.1 and o['dose_from']=='logged' and o['pre_from']=='training', o"
run 0 "$SD" response "Ada Quill"
has out 'test error 0\.060 \(--estimate-error\)'
run 2 "$SD" response "Ada Quill" --estimate-error 2
# A formal test near the start (and not near the end) wins over the estimate there.
run 0 "$SD" test add "Ada Quill" "back squat" 110 3 --date 2026-12-20
run 0 "$SD" response "Ada Quill" --format csv
has out '^1,back squat,2026-12-20,2027-01-04,.*,logged,[0-9.]+,test,training$' "a test near the start is used, the end estimated"

# ---------------------------------------------------------------- export
run 0 "$SD" log export --out all.csv
has out "^wrote all.csv \(6 rows\)$"
check "export: a header and 6 rows" test "$(wc -l <all.csv)" -eq 7
has_line() { grep -qx -- "$2" "$1"; }
check "export writes the library's names, the unit, the effort as written" has_line all.csv \
	"2027-01-04,Ada Quill,back squat,4,5,105kg,RPE 8.5"
run 1 "$SD" log export --out all.csv
has err "'all.csv' exists; choose another file or add --force"
run 0 "$SD" log export --out all.csv --force
run 2 "$SD" log export --force
# Round trip: into an empty database with the same athletes the export gives back the same
# rows; into this one it adds nothing.
run 0 "$SD" log import all.csv
has out "6 rows read, 0 new, 6 already stored" "an export imported back adds nothing"
export SETDOSE_DB=$TMP/other.db
run 0 "$SD" athlete add "Ada Quill"
run 0 "$SD" log import all.csv
run 0 "$SD" log export --out round.csv
check "export round-trips: the second export equals the first" cmp -s all.csv round.csv
run 0 "$SD" log export --athlete "Ada Quill"
check "export to standard output, one athlete" cmp -s all.csv "$TMP/out"
export SETDOSE_DB=$DB
# A damaged-then-recovered database rebuilds the weekly sums from the rows it saved.
"$SD" log weeks "Ada Quill" --format csv >weeks-before.csv
run 0 "$SD" db recover saved.db
run 0 "$SD" --db saved.db log weeks "Ada Quill" --format csv
check "recover: the weekly view of the copy equals the original's" cmp -s weeks-before.csv "$TMP/out"
