# audit, curve, returns, exercises, profile, help: the main job through the real binary.
P=$ROOT/profiles

run 0 "$SD" audit "$P/demo-fullbody3.ini"
has out '^chest +9 +0 +9\.0 ' "chest: 9 direct sets -> 9.0 fractional"
has out '^upper-back +6 +8 +10\.0 ' "upper-back: 6 direct, 8 indirect -> 10.0"
has out '^upper-back +26\.1 ' "upper-back at 10 sets: +26.1%"
has out 'plateau at 5 weekly fractional sets'
has out '^  curve    the average curve \(confidence interval\)' "the legend names the three levels"
has out '^  group    a new group or study'
has out '^  athlete  one athlete'
says out "profile 'strength-default' \(calibrated\): calibrated from memory" "provenance line under the table"
hasnt out 'prediction band|PI|new athlete' "no output calls a band 'prediction' or 'new athlete'"
says out 'Not medical advice'

# JSON: every per-muscle field the interface promises, valid JSON, stable numbers.
run 0 "$SD" audit --format json "$P/demo-fullbody3.ini"
check "json parses and has all per-muscle fields" python3 - "$TMP/out" <<'PY'
import json, sys
d = json.load(open(sys.argv[1]))
a = d["audits"][0]
need = ("muscle direct indirect fractional max_per_session sessions gain_pct curve_low curve_high "
        "group_low group_high athlete_low athlete_high plus1_pct plus1_low plus1_high zone "
        "beyond_evidence").split()
assert len(a["muscles"]) == 16
for m in a["muscles"]:
    for k in need: assert k in m, k
chest = [m for m in a["muscles"] if m["muscle"] == "chest"][0]
assert chest["fractional"] == 9 and chest["zone"] == "plateau" and chest["beyond_evidence"] == []
assert chest["curve_low"] < chest["gain_pct"] < chest["curve_high"]
assert chest["group_low"] < chest["curve_low"] and chest["group_high"] > chest["curve_high"]
assert chest["athlete_low"] < chest["group_low"] and chest["athlete_high"] > chest["group_high"]
assert chest["plus1_low"] < chest["plus1_pct"] < chest["plus1_high"]
assert a["plateau"] == 5 and "caution" in d
assert a["profile"] == {"name": "strength-default", "basis": "calibrated",
    "summary": "calibrated from memory of the strength-volume literature, not fitted to study data"}
assert a["evidence"]["weeks"] == {"low": 4, "high": 24, "value": 10, "used": 10, "beyond": False}
assert a["evidence"]["dose"] == {"low": 0, "high": 30}
PY

# The CSV twin of the INI demo program gives the same doses.
run 0 "$SD" audit --format csv "$P/demo-fullbody3.ini"
cut -d, -f2- "$TMP/out" >"$TMP/ini.csv"
run 0 "$SD" audit --format csv "$P/demo-fullbody3.csv"
cut -d, -f2- "$TMP/out" >"$TMP/csv.csv"
check "CSV and INI programs give the same audit" cmp -s "$TMP/ini.csv" "$TMP/csv.csv"

run 0 "$SD" audit --summary "$P/demo-fullbody3.ini" "$P/demo-minimal2.ini" "$P/demo-upperlower4.ini"
check "summary: a header and 16 rows per program" test "$(grep -c 'Tidewater\|demo-' "$TMP/out")" -eq 48
run 0 "$SD" audit "$P/demo-upperlower4.ini"
has out 'warning: 2 warm-up sets listed but not counted'
hasnt out 'not counted as hard sets'
# The hard-set limit: RPE 5.5 is RIR 4.5, above the default 4; --max-rir 5 counts it.
printf '[a]\nbench press = 3x10 @5.5\ntriceps pushdown = 2x12 RIR 4\n' >easy.ini
run 0 "$SD" audit easy.ini
has out 'warning: 3 sets with RIR above 4 listed but not counted as hard sets'
has out '^triceps +2 +0 +2\.0 '
run 0 "$SD" audit --max-rir 5 easy.ini
hasnt out 'not counted as hard sets'
has out '^triceps +2 +3 +3\.5 '

# Trained, 8-week block at 10 sets: 0.25 - 0.2/11 - 0.02 + 0.02/11 - 0.125 + 0.075/11 = 0.0954545,
# +10.016 %: inside the 8-12 % that trained trials of 8-12 weeks suggest (from memory).
run 0 "$SD" curve --no-plot --status trained --weeks 8 --format csv
has out '^10,10\.016,' "trained 8 weeks at 10 sets: +10.02%"
run 0 "$SD" curve --no-plot --format csv
has out '^0,5\.127,' "untrained 10 weeks at 0 sets: +5.1%"
has out '^10,26\.089,' "untrained 10 weeks at 10 sets: 100 (e^0.231818 - 1) = +26.09%"
has out '^sets,gain%,curve_lo,curve_hi,group_lo,group_hi,athlete_lo,athlete_hi,\+1set%,\+1set_lo,\+1set_hi,zone$'
# +1 set is the discrete step: at 0 sets 100 (e^0.15 - e^0.05) = 11.056 points, at 1 set 3.938.
has out '^0,5\.127,.*,11\.056[0-9],[0-9.]*,[0-9.]*,none$' "+1 set at 0 sets: 11.056"
has out '^1,16\.183,.*,3\.938[0-9],' "+1 set at 1 set: 3.938"

# Block length outside the evidence (4-24 weeks): flagged in the table and the JSON, and held
# at 24 weeks: 0.25 - 0.2/11 + 0.14 (10/11) = 0.359091, +43.203 % at 10 sets (not +169 %).
run 0 "$SD" --weeks 104 audit "$P/demo-fullbody3.ini"
has out 'untrained, 104-week block \(beyond the evidence\)' "table header flags the block length"
says out 'warning: block length \(weeks\) 104 is beyond the evidence \(4 to 24\): the curve uses 24'
has out '^upper-back +43\.2 ' "held at 24 weeks: +43.2% at 10 sets"
run 0 "$SD" --weeks 104 --format json audit "$P/demo-fullbody3.ini"
check "json flags weeks beyond the evidence on every muscle and in the evidence object" python3 - "$TMP/out" <<'PY'
import json, sys
a = json.load(open(sys.argv[1]))["audits"][0]
assert a["evidence"]["weeks"] == {"low": 4, "high": 24, "value": 104, "used": 24, "beyond": True}
for m in a["muscles"]: assert "weeks" in m["beyond_evidence"], m
ub = [m for m in a["muscles"] if m["muscle"] == "upper-back"][0]
assert abs(ub["gain_pct"] - 43.203) < 1e-3 and ub["gain_pct"] < 169
assert any("beyond the evidence" in w["text"] for w in a["warnings"])
PY
run 0 "$SD" --weeks 24 --format json audit "$P/demo-fullbody3.ini"
check "at the range's edge (24 weeks): inside, not flagged, the same +43.2%" python3 - "$TMP/out" <<'PY'
import json, sys
a = json.load(open(sys.argv[1]))["audits"][0]
assert a["evidence"]["weeks"]["beyond"] is False
ub = [m for m in a["muscles"] if m["muscle"] == "upper-back"][0]
assert abs(ub["gain_pct"] - 43.203) < 1e-3 and ub["beyond_evidence"] == []
PY
run 0 "$SD" --status trained --weeks 1 curve --no-plot --format csv
has out '^0,0\.000,' "trained, 1 week, 0 sets: held at 4 weeks, +0.0% (was -8.6%)"
run 0 "$SD" --weeks 52 curve --no-plot
has out '^warning: block length \(weeks\) 52 is beyond the evidence'
run 0 "$SD" --weeks 104 --format json curve --no-plot
check "curve json: weeks beyond the evidence on every point" python3 -c '
import json,sys; d=json.load(open(sys.argv[1]))
assert d["evidence"]["weeks"]["beyond"] and all("weeks" in p["beyond_evidence"] for p in d["points"])
assert d["profile"]["basis"] == "calibrated"' "$TMP/out"
run 0 "$SD" curve --program "$P/demo-minimal2.ini"
has out 'marks \(Tidewater'
has out 'weekly fractional sets'
run 0 "$SD" returns
has out 'Practical plateau: 5 weekly'
run 0 "$SD" returns --format json
check "returns json parses" python3 -c 'import json,sys; d=json.load(open(sys.argv[1])); assert d["plateau"]==5' "$TMP/out"

run 0 "$SD" exercises squat
has out '^back squat'
run 0 "$SD" exercises --muscles
lines out 16
run 0 "$SD" profile check
has out '^ok: '
run 0 "$SD" profile show
has out 'Calibrated default, not fitted'
has out '^basis       calibrated: calibrated from memory'
has out '^weeks       4 to 24 \(evidence range'
has out '^  one athlete          \+ between-athlete variance 0\.0064 \(SD 0\.080\)'
has out 'source: Between-athlete SD 0\.08 lnRR .*Hubal et al\. 2005'
run 0 "$SD" help audit
has out 'audit \[--summary'
run 0 "$SD" --version
has out '^setdose [0-9]'
run 0 "$SD" aud "$P/demo-minimal2.ini"
has out 'Tidewater' "unique prefix 'aud' runs audit"

# A user library adds exercises; --exercises adds one for a run.
mkdir -p "$XDG_CONFIG_HOME/setdose"
printf '[zercher carry]\ndirect = upper-back, quads\nindirect = biceps\n' >"$XDG_CONFIG_HOME/setdose/exercises.ini"
printf '[program]\nname = own\n[a]\nzercher carry = 3\nsled drag thing = 2\n' >own.ini
printf '[sled drag thing]\ndirect = quads\n' >extra.ini
run 0 "$SD" audit --exercises extra.ini own.ini
has out '^quads +5 '
run 1 "$SD" audit own.ini
has err "line 5: unknown exercise 'sled drag thing'"

# Bad input: one line on stderr, status 1 (2 for usage), nothing on stdout.
bad() { # status stderr-regex program-text
	printf '%b' "$3" >bad.ini
	run "$1" "$SD" audit bad.ini
	has err "$2"
	lines err 1
}
bad 1 "^setdose: cannot read program 'bad.ini' line 3: unknown exercise 'bench pres' \(did you mean 'bench press'" '[program]\n[a]\nbench pres = 3\n'
bad 1 "line 2: bad set syntax '3y8'" '[a]\nbench press = 3y8\n'
bad 1 "line 2: absurd set count" '[a]\nbench press = 10000\n'
bad 1 "line 2: negative set count" '[a]\nbench press = -4\n'
bad 1 "line 2: RPE out of range" '[a]\nbench press = 3x5 @15\n'
bad 1 "line 2: RIR out of range" '[a]\nbench press = 3x5 RIR 15\n'
bad 1 "no exercises \(empty program\)" '[program]\nname = x\n'
bad 1 "line 3: second \[program\] section \(the first is on line 1\)" '[program]\nname = a\n[program]\nweeks = 4\n[a]\nbench press = 3\n'
run 1 "$SD" audit missing.ini
has err "^setdose: cannot read program 'missing.ini': No such file"
printf '[a]\nbench press = 3\n' >locked.ini; chmod 000 locked.ini
if [ "$(id -u)" != 0 ]; then run 1 "$SD" audit locked.ini; has err "cannot read program 'locked.ini'"; fi
run 2 "$SD" audit --frobnicate "$P/demo-minimal2.ini"
run 2 "$SD" audit
has err 'needs at least one PROGRAM'
run 2 "$SD" --format yaml audit "$P/demo-minimal2.ini"
has err "--format wants table, csv or json, not 'yaml'"
run 2 "$SD" frobnicate
has err "unknown command 'frobnicate'"
run 2 "$SD" --weeks 0 curve
sed 's/^dose  .*/dose = -0.000144, 0.00001, 0, 0, 0, 0/' "$P/strength.ini" >notpd.ini
run 1 "$SD" --profile notpd.ini audit "$P/demo-minimal2.ini"
has err "profile 'notpd.ini': covariance matrix is not positive definite"
grep -v '^beta' "$P/strength.ini" >nobeta.ini
run 1 "$SD" profile check nobeta.ini
has err "missing 'beta' in \[terms\]"
sed 's/^beta .*/beta = 0.25, -0.20, 0.01/' "$P/strength.ini" >short.ini
run 1 "$SD" profile check short.ini
has err "line [0-9]*: 'beta' needs 6 numbers, one per term \(missing coefficient\?\), got 3"
# Bounded values, checked with their line; duplicates name both lines (no silent override).
sed 's/^dose_max .*/dose_max = 3088022415/' "$P/strength.ini" >huge.ini
run 1 "$SD" --profile huge.ini audit "$P/demo-minimal2.ini"
has err "^setdose: cannot read profile 'huge.ini' line 23: 'dose_max' must be above 0 and at most 200 weekly fractional sets, not 3088022415$"
lines err 1
sed 's/^df .*/df = 2.5/' "$P/strength.ini" >df.ini
run 1 "$SD" profile check df.ini
has err "line 27: 'df' must be a whole number from 0 to 1000000, not 2\.5"
sed 's/^tau2 .*/tau2 = 1e308/' "$P/strength.ini" >tau.ini
run 1 "$SD" profile check tau.ini
has err "'tau2' must be from 0 to 1 lnRR\^2, not 1e\+308"
{ cat "$P/strength.ini"; printf '[profile]\nform = linear\n'; } >twice.ini
run 1 "$SD" profile check twice.ini
has err "section \[profile\] appears twice \(lines 17 and [0-9]*\)"
sed 's/^form .*/form = reciprocal\nform = linear/' "$P/strength.ini" >twokeys.ini
run 1 "$SD" profile check twokeys.ini
has err "line 22: key 'form' appears twice in \[profile\] \(lines 21 and 22\)"
mkdir adir
run 1 "$SD" audit adir
has err "^setdose: cannot read program 'adir': Is a directory"
printf 'day,exercise,sets\nmon,bench press,3\nmon,nonsense lift,2\n' >bad.csv
run 1 "$SD" audit bad.csv
has err "^setdose: cannot read program 'bad.csv' line 3: unknown exercise 'nonsense lift'"
printf '[squat]\ndirect = quads, wings\n' >badlib.ini
run 1 "$SD" audit --exercises badlib.ini "$P/demo-minimal2.ini"
has err "^setdose: cannot read exercise library 'badlib.ini' line 2: unknown muscle 'wings' in direct"
printf '[my squat]\naliases = back squat\ndirect = quads\n' >clash.ini
run 1 "$SD" audit --exercises clash.ini "$P/demo-minimal2.ini"
has err "share the name or alias 'backsquat'"
# Spreadsheet and editor exports with a UTF-8 byte-order mark read like plain files.
printf '\357\273\277day,exercise,sets\r\nmon,bench press,3\r\n' >bom.csv
run 0 "$SD" audit --format csv bom.csv
has out '^bom.csv,chest,3,0,3\.0,'
printf '\357\273\277[program]\nname = bom\n[a]\nbench press = 3\n' >bom.ini
run 0 "$SD" audit --format csv bom.ini
has out '^bom.ini,chest,3,0,3\.0,'

# The documentation names the three levels as the outputs do, and no longer calls the group
# band a prediction for one athlete.
check "README names the three levels" sh -c "grep -q '\*\*curve\*\* — the average curve' '$ROOT/README.md' && grep -q '\*\*group\*\* — a new group or study' '$ROOT/README.md' && grep -q '\*\*athlete\*\* — one athlete' '$ROOT/README.md'"
check "the man page names the three levels" sh -c "grep -q '^.SH THREE LEVELS OF UNCERTAINTY' '$ROOT/man/setdose.1' && grep -q '^a new group or study: adds the between' '$ROOT/man/setdose.1' && grep -q '^one athlete: adds the profile' '$ROOT/man/setdose.1'"
check "no document calls a band a prediction band or 'a new athlete'" sh -c "! grep -Eqi 'prediction band|prediction interval \(a new athlete\)|\(one athlete\)\"' '$ROOT/README.md' '$ROOT/man/setdose.1' '$ROOT/DEVELOPERS.md'"

# --by-exercise: where each muscle's sets come from, against a program counted by hand with the
# bundled library's lists (profiles/exercises.ini: bench press trains the chest directly, the
# triceps and front delts indirectly; overhead press the front delts directly, side delts and
# triceps indirectly; barbell curl the biceps directly, the forearms indirectly). A direct set
# counts 1, an indirect set 0.5 (the profile's set weights); the RIR 6 sets are not hard sets
# and count nowhere.
cat >hand.ini <<'INI'
[program]
name = hand count
weeks = 8
[mon]
bench press = 3x8 RIR 2
overhead press = 2x6 RIR 2
lateral raise = 2x15 RIR 6
[thu]
bench press = 2x10 RIR 1
barbell curl = 2x12 RIR 1
INI
# chest 5 direct bench = 5.0; front-delts 2 direct press + 5 indirect bench = 2 + 2.5 = 4.5;
# triceps 5 indirect bench + 2 indirect press = 2.5 + 1.0 = 3.5; side-delts 2 indirect press
# = 1.0; biceps 2 direct curl = 2.0; forearms 2 indirect curl = 1.0.
run 0 "$SD" audit --by-exercise hand.ini
says out 'direct set counts 1, an indirect set 0\.5' "the section states the set weights"
has out '^chest +bench press +5 +0 +5\.0$' "chest: 5 direct bench press sets, 5.0"
has out '^front-delts +bench press +0 +5 +2\.5$' "front-delts: bench press first, 5 indirect sets, 2.5"
has out '^ +overhead press +2 +0 +2\.0$' "... then overhead press, 2 direct sets, 2.0"
has out '^triceps +bench press +0 +5 +2\.5$' "triceps: bench press 5 indirect, 2.5"
has out '^side-delts +overhead press +0 +2 +1\.0$' "side-delts: only the pressing counts (the RIR 6 raises do not)"
has out '^biceps +barbell curl +2 +0 +2\.0$'
has out '^forearms +barbell curl +0 +2 +1\.0$'
hasnt out '^ *[a-z-]* +lateral raise ' "the sets that are not hard are no source"
check "one source row per muscle and exercise: 8" test "$(sed -n '/^where the fractional sets/,/^$/p' "$TMP/out" | grep -c ' [0-9.]*$')" -eq 8
# The dose table agrees with the sums of the sources.
has out '^front-delts +2 +5 +4\.5 ' "front-delts 4.5 in the dose table"
has out '^triceps +0 +7 +3\.5 ' "triceps 3.5 in the dose table"
run 0 "$SD" --format csv audit --by-exercise hand.ini
has out '^program,muscle,exercise,direct,indirect,fractional$' "CSV header"
has out '^hand\.ini,triceps,overhead press,0,2,1\.00$' "CSV: triceps from overhead press 1.00"
lines out 9
run 0 "$SD" --format json audit --by-exercise hand.ini
check "JSON: each muscle's sources, summing to its total" python3 - "$TMP/out" <<'PY'
import json, sys
a = json.load(open(sys.argv[1]))["audits"][0]
want = {"chest": {"bench press": 5.0}, "front-delts": {"bench press": 2.5, "overhead press": 2.0},
        "triceps": {"bench press": 2.5, "overhead press": 1.0}, "side-delts": {"overhead press": 1.0},
        "biceps": {"barbell curl": 2.0}, "forearms": {"barbell curl": 1.0}}
for m in a["muscles"]:
    got = {s["exercise"]: s["fractional"] for s in m["sources"]}
    assert got == want.get(m["muscle"], {}), (m["muscle"], got)
    assert abs(sum(got.values()) - m["fractional"]) < 1e-9, m["muscle"]
tri = [m for m in a["muscles"] if m["muscle"] == "triceps"][0]["sources"]
assert tri[0] == {"exercise": "bench press", "direct": 0, "indirect": 5, "fractional": 2.5}
PY
run 0 "$SD" --format json audit hand.ini
check "JSON without --by-exercise has no sources" python3 -c 'import json,sys; a=json.load(open(sys.argv[1]))["audits"][0]; assert all("sources" not in m for m in a["muscles"])' "$TMP/out"
run 2 "$SD" audit --by-exercise --summary hand.ini
has err 'audit --by-exercise goes with PROGRAM files, not --summary or --all'
