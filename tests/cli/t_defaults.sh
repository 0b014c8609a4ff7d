# The user defaults file ($XDG_CONFIG_HOME/setdose/defaults.ini): its settings apply, the
# command line overrides them, SETDOSE_DB overrides its db, and a bad line is a usage error
# naming the file and line. Invented athlete.
D=$XDG_CONFIG_HOME/setdose
mkdir -p "$D"
P=$ROOT/profiles/demo-minimal2.ini
printf '# my gym\n[defaults]\nunits = lb\nweeks = 12\nstatus = trained\nmax_rir = 3\ndb = ~/gym.db\n' >"$D/defaults.ini"
mkdir -p "$HOME"
run 0 env -u SETDOSE_DB "$SD" athlete add "Ula Venn"
has out "added athlete 'Ula Venn' \(trained, lb\)" "status and units come from the defaults file"
check "db = ~/gym.db is the home folder's gym.db" test -s "$HOME/gym.db"
run 0 "$SD" athlete list
hasnt out 'Ula Venn' "SETDOSE_DB wins over the file's db"
run 0 "$SD" audit "$P"
has out 'trained, 12-week block' "weeks and status from the file"
run 0 "$SD" --weeks 8 --status untrained audit "$P"
has out 'untrained, 8-week block' "the command line overrides the file"
printf '[program]\nname = rir four\nweeks = 8\n[day 1]\nback squat = 3x5 RIR 4\n' >r4.ini
run 0 "$SD" audit r4.ini
has out 'warning: 3 sets with RIR above 3 listed but not counted' "max_rir = 3 from the file: RIR 4 sets are not hard sets"
printf 'weeks = 500\n' >"$D/defaults.ini"
run 2 "$SD" audit "$P"
has err "^setdose: defaults file '.*/setdose/defaults.ini' line 1: --weeks wants a number from 1 to 104, not '500'$" "a bad value names the file and line"
printf '\n\ncolour = red\n' >"$D/defaults.ini"
run 2 "$SD" audit "$P"
has err "^setdose: defaults file '.*' line 3: unknown setting 'colour'" "an unknown setting names its line"
rm -f "$D/defaults.ini"
run 0 "$SD" audit "$P"
has out 'untrained' "without the file, the built-in defaults"
