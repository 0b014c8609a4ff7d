# Programs as coaches write them, through the real binary: every notation, every mistake of a
# file in one run (and nothing stored), CSV from spreadsheets, user aliases, programs written
# when @N meant RIR, and the README's examples exactly as printed.
D=$ROOT/tests/data

# audits_alike WHAT A B: the two programs audit alike (name, weeks, hard sets, every muscle's
# figures and the warnings, whose line numbers may differ).
audits_alike() {
	run 0 "$SD" audit --format json "$2"
	cp "$TMP/out" alike-a.json
	run 0 "$SD" audit --format json "$3"
	cp "$TMP/out" alike-b.json
	check "$1" python3 - alike-a.json alike-b.json <<'PY'
import json, re, sys
a, b = (json.load(open(f))["audits"][0] for f in sys.argv[1:3])
for k in ("program", "weeks", "hard_sets", "muscles"):
    assert a[k] == b[k], (k, a[k], b[k])
strip = lambda ws: [(w["day"], re.sub(r"^lines? [0-9, ]+: |\(first on line [0-9]+\)", "", w["text"]))
                    for w in ws]
assert strip(a["warnings"]) == strip(b["warnings"]), (a["warnings"], b["warnings"])
assert a["hard_sets"] > 20 and a["weeks"] in (6, 10)
PY
}

# One file, six mistakes: all reported, each with its line, status 1, nothing on stdout.
run 1 "$SD" audit "$D/program-mistakes.ini"
lines err 6
has err "^setdose: cannot read program '.*program-mistakes.ini' line 8: unknown exercise 'bench pres' .*\(first of 6 errors\)$"
has err "line 10: RPE out of range in '3x8 @11'"
has err "line 12: 'french press' names more than one exercise; write 'skull crusher' or 'overhead triceps extension'$"
has err "line 24: '3x12,10,8': a lone number after a comma is ambiguous"
has err "line 30: unknown exercise 'hip trusts' \(did you mean 'hip thrust'"
has err "line 33: day 'upper a' appears twice \(first on line 7\)$"
lines out 0
# ... and program add stores nothing, not even the good file given with it.
run 1 "$SD" program add "$ROOT/profiles/demo-minimal2.ini" "$D/program-mistakes.ini"
lines err 6
run 0 "$SD" program list
has out '^no programs yet'

# Every notation in one program; the counts by hand (RIR = 10 - RPE; common practice, no source):
# chest: bench 1 + 3 (top set and back-offs), then 2 + 2 on thursday = 8 direct; the warm-up and the
# RPE 5.5 group (RIR 4.5) are not counted.
cat >all.ini <<'INI'
[program]
name = every notation
weeks = 6
[mon]
bench press = 2x5 warm-up, 1x3 @9, 3x5 @7
Squats = 3x5 RPE 8.5
pull-ups = 3xAMRAP
lateral raises = 3x12–15 @rpe9
bulgarian split squats = 3x8/side @2 RIR
plank = 3x45s
triceps pushdown = 3x12 @5.5
[thu]
squat (high bar) = 1x5 @8
bench press = 2x8-10 rir1
bench press = 2x10 @8
RDLs = 3x8 @8
INI
run 0 "$SD" audit all.ini
has out '^every notation \(all\.ini\)'
has out '2 days, 27 hard sets a week; untrained, 6-week block'
has out '^chest +8 +0 +8\.0 '
has out '^quads +7 +0 +7\.0 '
has out "warning: line 13: 'squat \(high bar\)' counted as 'back squat'"
says out "warning: line 15: 'bench press' again in 'thu' \(first on line 14\): the sets add up"
has out 'warning: 3 sets with RIR above 4 listed but not counted as hard sets'
has out 'warning: 2 warm-up sets listed but not counted'
run 0 "$SD" audit --format json all.ini
check "json: the notes are warnings with their day" python3 - "$TMP/out" <<'PY'
import json, sys
a = json.load(open(sys.argv[1]))["audits"][0]
assert a["hard_sets"] == 27, a["hard_sets"]
w = [x for x in a["warnings"] if "again in" in x["text"]]
assert len(w) == 1 and w[0]["day"] == "thu", w
PY

# A program written when @N meant RIR is not silently miscounted: one warning names its lines;
# 'effort = rir' keeps the old reading.
printf '[program]\nname = old style\n[a]\nbench press = 3x5 @2\nback squat = 3x5 @1\nbarbell row = 3x8 @3\nlat pulldown = 3x10 @0 RIR\n' >old.ini
run 0 "$SD" audit old.ini
says out "warning: lines 4, 5, 6: RPE 2 is far from hard; did you mean RIR 2\? \(a bare @N is RPE: write 'RIR 2', or 'effort = rir' under \[program\]\)"
has out '1 day, 3 hard sets a week'
sed 's/^name = old style$/&\neffort = rir/' old.ini >old-rir.ini
run 0 "$SD" audit old-rir.ini
has out '1 day, 12 hard sets a week'
hasnt out 'far from hard'
# ... also when it is stored as a template, and whenever a block following it is shown.
run 0 "$SD" program add old.ini
has err "^setdose: warning: 'old\.ini' lines 4, 5, 6: RPE 2 is far from hard"
run 0 "$SD" program show "old style"
check "the stored template is the text as written" cmp -s "$TMP/out" old.ini
run 0 "$SD" athlete add "Pat Example" --status trained
run 0 "$SD" block add "Pat Example" "old style" --start 2025-01-06 --weeks 8
run 0 "$SD" block show 1
says out "warning: lines 4, 5, 6: RPE 2 is far from hard; did you mean RIR 2\?"

# CSV from spreadsheets: semicolons, decimal commas, name and weeks in comment lines.
printf '# name: every notation\n# weeks: 6\nday;exercise;sets;reps;rpe\nmon;bench press;2x5 warm-up, 1x3 @9, 3x5 @7;;\nmon;Squats;3;5;8,5\nmon;pull-ups;3;AMRAP;\nmon;lateral raises;3;12-15;9\nmon;bulgarian split squats;3x8/side @2 RIR;;\nmon;plank;3;45s;\nmon;triceps pushdown;3;12;5,5\nthu;squat (high bar);1;5;8\nthu;bench press;2x8-10 rir1;;\nthu;bench press;2;10;8\nthu;RDLs;3;8;8\n' >all.csv
audits_alike "the same program as INI and as semicolon CSV audits alike" all.ini all.csv
printf 'day\texercise\tsets\treps\trir\nmon\tbench press\t3\t8\t2\n' >tab.csv
run 0 "$SD" audit --format csv tab.csv
has out '^tab\.csv,chest,3,0,3\.0,'
printf 'day;exercise;sets\nmon;bench pres;3\nmon;squatz;x\n' >two.csv
run 1 "$SD" audit two.csv
lines err 2
has err "line 2: unknown exercise 'bench pres'"
has err "line 3: bad set syntax 'x'"

# A user library: aliases without copying sections, and a name made unambiguous.
mkdir -p "$XDG_CONFIG_HOME/setdose"
printf '[aliases]\nthe big one = deadlift\nfrench press = overhead triceps extension\n' >"$XDG_CONFIG_HOME/setdose/exercises.ini"
printf '[a]\nthe big one = 3x3 @8\nfrench press = 3x10 @9\n' >mine.ini
run 0 "$SD" audit mine.ini
has out '^hamstrings +3 '
has out '^triceps +3 '
printf '[aliases]\nthe big one = deadlift\nThe Big-One = back squat\n' >"$XDG_CONFIG_HOME/setdose/exercises.ini"
run 1 "$SD" audit mine.ini
has err "line 3: alias 'The Big-One' appears twice \(first on line 2\)"
rm "$XDG_CONFIG_HOME/setdose/exercises.ini"
# A NUL byte in a library is an error with its line, not a silent end of the file.
printf '[a]\ndirect = quads\n[b]\ndirect = gl\000utes\n' >nul.ini
run 1 "$SD" --exercises nul.ini exercises
has err "^setdose: cannot read exercise library 'nul\.ini' line 4: binary data \(NUL byte\)$"
printf '[a]\nbench press = 3\n[b]\nsquat = 3x\0005\n' >nul-prog.ini
run 1 "$SD" audit nul-prog.ini
has err "line 4: binary data \(NUL byte\)$"

# Bounds: a program name over 127 bytes is an error, not a cut.
long=$(printf '%0130d' 0 | tr 0 n)
printf '[program]\nname = %s\n[a]\nbench press = 3\n' "$long" >long.ini
run 1 "$SD" audit long.ini
has err "line 2: program name longer than 127 bytes$"

# Written back (allot --write) in the new notation, and read back the same.
run 0 "$SD" allot --budget 12 --write plan.ini
check "a written program has no bare @N below 5" sh -c "! grep -Eq '@[0-4]([^0-9.%]|$)' plan.ini"

# The README's examples, exactly as printed: its INI and CSV programs and the commands that use them.
awk '/^```ini$/ && !i { i = 1; next } i == 1 && /^```$/ { i = 2 } i == 1' "$ROOT/README.md" >week.ini
awk '/^```csv$/ && !c { c = 1; next } c == 1 && /^```$/ { c = 2 } c == 1' "$ROOT/README.md" >week.csv
check "README has an INI and a CSV program" test -s week.ini -a -s week.csv
run 0 "$SD" audit week.ini
has out '^Upper/lower, four days \(week\.ini\)'
hasnt out 'far from hard'
audits_alike "README: the INI and CSV examples audit alike" week.ini week.csv
sed -n '/^## Using it/,/^```$/p' "$ROOT/README.md" | sed -n '/^setdose .*week\./p' | sed 's/ *#.*//' >readme-cmds.txt
check "README: commands on week.ini found" test "$(wc -l <readme-cmds.txt)" -ge 5
while read -r cmd; do
	# shellcheck disable=SC2086
	run 0 "$SD" ${cmd#setdose }
done <readme-cmds.txt
