# allot: a weekly set budget turned into sets per exercise, laid out over the sessions;
# --write gives a program that audit reads back to the same doses; limits and bad input.
P=$ROOT/profiles

run 0 "$SD" allot --budget 30
has out '^Allotment of 30 weekly hard sets over 3 sessions \(budget 30\)'
has out '^method: branch-and-bound over 25 distinct exercises, .*proved'
has out '^total +30 '
has out '^calves +1 +0 '
has out 'the last set bought 0\.0167'
has out 'Not medical advice'

# The written program, audited, has the doses allot printed (JSON of both, field by field).
run 0 "$SD" allot --budget 24 --sessions 2 --priority quads=2,glutes=2,others=0.5 \
	--min calves=4 --format json --write plan.ini
cp "$TMP/out" allot.json
run 0 "$SD" audit --format json plan.ini
cp "$TMP/out" audit.json
check "allot --write audited gives the doses allot printed" python3 - allot.json audit.json <<'PY'
import json, sys
a = json.load(open(sys.argv[1]))
b = json.load(open(sys.argv[2]))["audits"][0]
assert a["allotment"]["used"] == 24 == b["hard_sets"] and b["days"] == 2
fa = {m["muscle"]: (m["fractional"], m["max_per_session"], m["gain_pct"]) for m in a["muscles"]}
fb = {m["muscle"]: (m["fractional"], m["max_per_session"], m["gain_pct"]) for m in b["muscles"]}
assert fa == fb, (fa, fb)
assert fa["calves"][0] >= 4
assert sum(e["sets"] for e in a["exercises"]) == 24
for e in a["exercises"]:
    assert sum(e["per_session"]) == e["sets"]
PY
lines err 0
run 2 "$SD" allot --budget 24 --write plan.ini
has err "^setdose: 'plan\.ini' exists; choose another file or add --force$"
run 0 "$SD" allot --budget 12 --write plan.ini --force
run 0 "$SD" audit plan.ini
has out ' 12 hard sets a week'

# Small instance by hand: bench press (chest 1; triceps, front delts 0.5) and back squat (quads,
# glutes, adductors 1; lower back 0.5), budget 6, quads at least 5: five squats, one bench press,
# value g(1) + 2 g(0.5) + 3 g(5) + g(2.5) = 0.876190 with g(F) = 0.2 F/(F+1).
run 0 "$SD" allot --candidates "bench press, back squat" --budget 6 --min quads=5 --tolerance 0
has out '^bench press +1 '
has out '^back squat +5 '
has out 'proved optimal'
has out '^objective 0\.8762'

# The session cap: 30 sets of bench press over 3 sessions go 10 + 10 + 10; over 2 sessions
# chest may get at most 2 x 10, and the rest of the budget is left out, said so.
run 0 "$SD" allot --budget 30 --sessions 3 --candidates "bench press"
has out '^bench press +30 +10 +10 +10$'
hasnt out 'warning:'
run 0 "$SD" allot --budget 30 --sessions 2 --candidates "bench press"
has out '^bench press +20 +10 +10$'
has out 'note: 10 of the 30 sets would buy nothing more'
# A cap no whole set fits under: spread as well as it goes, and said.
run 0 "$SD" allot --budget 4 --sessions 2 --session-cap 0.75 --candidates "leg extension"
has out 'note: the sets could not all be spread'
has out 'warning: quads: 1\.0 fractional sets'

# Minutes: 45 minutes a session at 3 minutes a set is 15 sets a session, 45 a week.
run 0 "$SD" allot --minutes-per-session 45 --minutes-per-set 3 --sessions 3 --format json
check "minutes: budget 45, at most 15 sets a session" python3 - "$TMP/out" <<'PY'
import json, sys
d = json.load(open(sys.argv[1]))
assert d["allotment"]["budget"] == 45 and d["allotment"]["per_session_limit"] == 15
per = [0, 0, 0]
for e in d["exercises"]:
    for s, k in enumerate(e["per_session"]):
        per[s] += k
assert max(per) <= 15 and sum(per) == d["allotment"]["used"]
for m in d["muscles"]:
    assert m["max_per_session"] <= 10
PY

# --from: a program's exercises and its days.
run 0 "$SD" allot --from "$P/demo-minimal2.ini" --budget 16
has out 'over 2 sessions'
has out '12-week block'
hasnt out '^(deadlift|lateral raise) '

run 0 "$SD" allot --budget 30 --format csv
has out '^exercise,sets,day 1,day 2,day 3$'
has out '^muscle,priority,min,fractional,'

run 0 "$SD" help allot
has out 'branch-and-bound'
has out 'within T of the best possible'

# Bad input: one clear line, status 2.
bad() { # stderr-regex args...
	re=$1; shift
	run 2 "$SD" allot "$@"
	has err "$re"
	lines err 1
}
bad "^setdose: unknown muscle 'chset' in --priority \(muscles: chest, " --budget 10 --priority chset=2
bad "^setdose: unknown muscle 'wings' in --min" --budget 10 --min wings=2
bad "^setdose: --budget must be at least 1 set, not '0'$" --budget 0
bad "^setdose: --budget must be at least 1 set, not '-5'$" --budget -5
bad "^setdose: a budget of 5 sets is below the --min limits: chest=6 needs at least 6 sets$" \
	--budget 5 --min chest=6
bad "^setdose: a budget of 10 sets is below the --min limits: together they need at least 18" \
	--budget 10 --min chest=6,quads=6,calves=6 --candidates "bench press,back squat,standing calf raise"
bad "^setdose: conflicting limits: a budget of 60 sets does not fit 3 sessions of at most 10 sets" \
	--budget 60 --max-per-session 10
bad "^setdose: conflicting limits: a budget of 40 sets does not fit 2 sessions of at most 15 sets \(45 min" \
	--budget 40 --sessions 2 --minutes-per-session 45 --minutes-per-set 3
bad "^setdose: conflicting limits: --min chest=12 does not fit 1 session under the session cap of 10" \
	--budget 20 --sessions 1 --min chest=12
bad "^setdose: conflicting limits: --min quads=35 is past the evidence range" --budget 40 --min quads=35
bad "^setdose: --minutes-per-session and --minutes-per-set go together$" --minutes-per-session 45
bad "^setdose: allot needs --budget SETS" --sessions 3
bad "^setdose: --candidates and --from both choose the exercises" --budget 9 --candidates dip --from x.ini
bad "^setdose: unknown exercise 'bench pres' in --candidates \(did you mean 'bench press'\?\)" \
	--budget 9 --candidates "bench pres"
bad "^setdose: --priority names chest twice$" --budget 9 --priority chest=1,chest=2
bad "^setdose: unknown option '--frobnicate'" --budget 9 --frobnicate
bad "^setdose: a budget of 7 sets is below the --min limits: together they need at least 8 sets" \
	--budget 7 --min chest=4,quads=4 --candidates "bench press,back squat"
# Quads 2.5 takes 3 squats, 3 quads sets in the one session, above the cap of 2.5: no check
# before the search sees it, the search does.
run 1 "$SD" allot --budget 5 --sessions 1 --session-cap 2.5 --min quads=2.5 --candidates "back squat"
has err "^setdose: no allotment of at most 5 sets meets the --min limits"
lines err 1
check "a refused --write leaves no file" test ! -e none.ini
run 2 "$SD" allot --budget 0 --write none.ini
check "a refused --write leaves no file" test ! -e none.ini
