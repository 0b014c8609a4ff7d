# compare: programs side by side, the difference per muscle with its interval and a decision
# against the SWC; totals; per-session warnings; stored templates by name; bad input.
P=$ROOT/profiles

# Worked by hand with the bundled profile (y = 0.25 - 0.20/(x+1) + ..., SE(b_dose) 0.020):
# chest 3 -> 8 weekly sets: d = 0.2 (1/4 - 1/9) = 1/36, se = 1/360,
# 100(e^d - 1) = 2.8167%, 95% CI 2.2585% to 3.3780%; the 90% decision interval
# d -+ 1.644854/360 = [0.0232088, 0.0323468], 2.3480% to 3.2876%: above 0, reaching inside the
# SWC ln 1.03: some-gain (normal quantiles: Abramowitz & Stegun 1964, Table 26.1).
printf '[program]\nname = three\n[mon]\nbench press = 3\n' >a.ini
printf '[program]\nname = eight\n[mon]\nbench press = 4\n[thu]\nbench press = 4\n' >b.ini
printf '[program]\nname = one day\n[mon]\nbench press = 12\nlateral raise = 3\n' >c.ini

run 0 "$SD" compare a.ini b.ini
has out '^ +A +three \(a\.ini\)'
has out '^chest +3\.0 +22\.1 +8\.0 +25\.6' "chest: 3 and 8 sets, 100(e^0.2 - 1) = 22.1%, 100(e^(0.25-0.2/9) - 1) = 25.6%"
has out '^B vs A: difference'
has out '^chest +2\.82 +2\.26 +3\.38 +2\.35 +3\.29 +some-gain$' "chest delta by hand"
has out '^triceps +4\.08 .* clear-gain$' "triceps 1.5 -> 4: d = 0.04, 90% interval above the SWC"
has out '^calves +0\.00 .* equivalent$'
has out 'profile has no random slopes, so the intervals assume every athlete shares'
hasnt out 'P\(>SWC\)|verdict' "no probability-beyond-SWC column"
has out "^profile 'strength-default' \(calibrated\)"
has out '^hard sets a week +3 +8'
has out '^sessions +1 +2'
says out 'Not medical advice'

run 0 "$SD" compare --format csv a.ini b.ini
has out '^difference,A,B,,chest,3\.00,8\.00,,,,,2\.8167,2\.2585,3\.3780,2\.3480,3\.2876,some-gain,,,,,,,$' "csv row by hand"
check "compare CSV is one table: every line has the header's 24 fields" sh -c "awk -F, 'NF != 24 { exit 1 }' '$TMP/out'"
has out '^row,program,second,source,muscle,' "one header, first line"
has out ',hard_sets,sessions,sets_per_session,under_plateau,past_plateau,beyond_evidence,over_session_cap$' "the totals columns close the header"
has out '^totals,B,,b\.ini,,,,,,,,,,,,,,8,2,4\.00,'

run 0 "$SD" compare --format json a.ini b.ini c.ini
check "json: programs, all three pairs, hand values" python3 - "$TMP/out" <<'PY'
import json, sys
d = json.load(open(sys.argv[1]))
assert [p["key"] for p in d["programs"]] == ["A", "B", "C"]
assert [(c["first"], c["second"]) for c in d["comparisons"]] == [("A", "B"), ("A", "C"), ("B", "C")]
ch = [m for m in d["comparisons"][0]["muscles"] if m["muscle"] == "chest"][0]
assert abs(ch["delta_lnrr"] - 1 / 36) < 1e-6 and abs(ch["se_lnrr"] - 1 / 360) < 1e-6
assert abs(ch["dec_low"] - 2.3480) < 1e-4 and ch["decision"] == "some-gain"
assert "p_above_swc" not in ch and d["decision_level"] == 0.9
assert d["profile"]["name"] == "strength-default" and d["profile"]["basis"] == "calibrated"
c = d["programs"][2]
assert c["over_session_cap"] == 1 and c["warnings"][0]["muscle"] == "chest"
assert c["warnings"][0]["day"] == "mon"
assert "no random slopes" in d["intervals"] and "caution" in d
PY

# Each against the first only; session-cap warnings follow --session-cap.
run 0 "$SD" compare --against-first a.ini b.ini c.ini
has out '^B vs A'
has out '^C vs A'
hasnt out '^C vs B'
has out "warning: C: chest: 12\.0 fractional sets on 'mon' \(more than 10 in one session\)"
has out '^over the session cap +0 +0 +1'
run 0 "$SD" compare --session-cap 12 a.ini c.ini
hasnt out 'warning:'

# Different block lengths: all compared at the first's, and said so.
run 0 "$SD" compare "$P/demo-fullbody3.ini" "$P/demo-minimal2.ini"
has out 'note: the programs state different block lengths; all are compared at 10 weeks'
run 0 "$SD" compare --weeks 12 "$P/demo-fullbody3.ini" "$P/demo-minimal2.ini"
hasnt out 'different block lengths'
has out '12-week block'

run 0 "$SD" help compare
has out 'With a profile without random slopes \(the bundled one\)'
has out 'the interval assumes every athlete shares the curve.s slope'

# A profile with random slopes: one athlete's own slope deviation adds (f_B - f_A)^2 tau2_slope.
# By hand, chest 3 -> 8: (5/36)^2 (0.0004 + 0.0009) = 0.0000250772, se 0.00500771 (1.8 times
# 1/360); 90% interval 1/36 -+ 1.644854 (0.00500771) = [0.0195408, 0.0360148]: some-gain.
sed 's/^slopes .*/slopes     = yes\ntau2_slope = 0.0009\ncov_slope  = -0.0012/' "$P/strength.ini" >slopes.ini
run 0 "$SD" --profile slopes.ini --format json compare a.ini b.ini
check "slopes profile: se of a same-athlete difference by hand" python3 - "$TMP/out" <<'PY'
import json, sys
d = json.load(open(sys.argv[1]))
ch = [m for m in d["comparisons"][0]["muscles"] if m["muscle"] == "chest"][0]
assert abs(ch["se_lnrr"] - 0.00500771) < 1e-6, ch   # JSON rounds to 6 decimals
assert ch["decision"] == "some-gain" and "random-slope variance" in d["intervals"]
PY
run 0 "$SD" --profile slopes.ini compare a.ini b.ini
says out "adds the profile's random-slope variance"

# Bad input: one line, status 2 for usage and 1 for unreadable programs. Comparing files never
# creates a database; a name that is no file is looked up only in an existing one.
run 2 "$SD" compare a.ini
has err "^setdose: compare needs at least two programs, got 1"
lines err 1
run 2 "$SD" compare --frobnicate a.ini b.ini
has err "^setdose: unknown option '--frobnicate'"
lines err 1
run 1 "$SD" compare a.ini missing.ini
has err "^setdose: cannot read program 'missing.ini': No such file"
lines err 1
run 1 "$SD" compare a.ini "no such template"
has err "no such file, and no database holding stored templates"
lines err 1
check "compare created no database" test ! -e "$SETDOSE_DB"

# Stored templates by name, once the store holds them.
run 0 "$SD" program add b.ini --name "eight a week"
run 0 "$SD" compare a.ini "eight a week"
has out '^ +B +eight \(eight a week\)'
has out '^chest +2\.82 +2\.26 +3\.38'
run 1 "$SD" compare a.ini "nine a week"
has err "^setdose: cannot read program 'nine a week': no such file or stored template$"
lines err 1
