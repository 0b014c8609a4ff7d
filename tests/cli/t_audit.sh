# audit, curve, returns, exercises, profile, help: the main job through the real binary.
P=$ROOT/profiles

run 0 "$SD" audit "$P/demo-fullbody3.ini"
has out '^chest +9 +0 +9\.0 ' "chest: 9 direct sets -> 9.0 fractional"
has out '^upper-back .* 10\.0 .* 26\.1 ' "upper-back at 10 sets: +26.1%"
has out 'plateau at 5 weekly fractional sets'
has out 'Not medical advice'

# JSON: every per-muscle field the interface promises, valid JSON, stable numbers.
run 0 "$SD" audit --format json "$P/demo-fullbody3.ini"
check "json parses and has all per-muscle fields" python3 - "$TMP/out" <<'PY'
import json, sys
d = json.load(open(sys.argv[1]))
a = d["audits"][0]
need = "muscle direct indirect fractional max_per_session sessions gain_pct ci_low ci_high pi_low pi_high marginal_pct zone".split()
assert len(a["muscles"]) == 16
for m in a["muscles"]:
    for k in need: assert k in m, k
chest = [m for m in a["muscles"] if m["muscle"] == "chest"][0]
assert chest["fractional"] == 9 and chest["zone"] == "plateau"
assert chest["ci_low"] < chest["gain_pct"] < chest["ci_high"]
assert chest["pi_low"] < chest["ci_low"] and chest["pi_high"] > chest["ci_high"]
assert a["plateau"] == 5 and "caution" in d
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

# Trained, longer block: -0.05 and +0.02 on the lnRR scale.
run 0 "$SD" curve --no-plot --status trained --weeks 12 --format csv
has out '^10,22\.4,' "trained 12 weeks at 10 sets: 100(exp(0.25-0.2/11+0.02-0.05)-1) = 22.4%"
run 0 "$SD" curve --no-plot --format csv
has out '^0,5\.1,' "untrained 10 weeks at 0 sets: +5.1%"
has out '^10,26\.1,' "untrained 10 weeks at 10 sets: +26.1%"
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
run 0 "$SD" help audit
has out 'audit \[--summary\]'
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
sed 's/^dose .*/dose = -0.000144, 0.00001, 0, 0/' "$P/strength.ini" >notpd.ini
run 1 "$SD" --profile notpd.ini audit "$P/demo-minimal2.ini"
has err "profile 'notpd.ini': covariance matrix is not positive definite"
grep -v '^beta' "$P/strength.ini" >nobeta.ini
run 1 "$SD" profile check nobeta.ini
has err "missing \[terms\] names or beta"
sed 's/^beta .*/beta = 0.25, -0.20, 0.01/' "$P/strength.ini" >short.ini
run 1 "$SD" profile check short.ini
has err "beta needs 4 numbers, one per term \(missing coefficient\?\)"
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
