# The database under hostile conditions: a read-only folder and a read-only file (listings
# and checks work, writes are refused and change nothing), a damaged page (writes and backups
# refused with a pointer to db check and db recover; recover copies the readable rows into a
# new file, never in place), names with invalid UTF-8 or bidirectional controls (refused with
# the byte offset), JSON always valid UTF-8, and "added" only after a commit.
P=$ROOT/profiles
DB=$SETDOSE_DB
sh "$ROOT/tests/demo_db.sh" "$SD" "$DB" >/dev/null || { _rec failed "demo database built"; return 0; }
dump() { sqlite3 "$1" .dump; }
checkpoint() { sqlite3 "$1" 'PRAGMA wal_checkpoint(TRUNCATE)' >/dev/null; }

# ------------------------------------------------------------ read-only folder and file
mkdir ro
cp "$DB" ro/gym.db
dump ro/gym.db >before.sql
how=
if [ "$(id -u)" = 0 ]; then
	mount --bind ro ro 2>/dev/null && mount -o remount,bind,ro ro 2>/dev/null && how=mount
	[ -n "$how" ] && trap 'umount "$TMP/ro" 2>/dev/null' EXIT
else
	chmod a-w ro && how=chmod
fi
if [ -n "$how" ]; then
	RO="--db ro/gym.db"
	run 0 "$SD" $RO athlete list
	has out "^Maren Oakhollow " "read-only folder: athlete list works"
	run 0 "$SD" $RO program list
	run 0 "$SD" $RO block list
	run 0 "$SD" $RO test list "Maren Oakhollow"
	run 0 "$SD" $RO response "Maren Oakhollow"
	run 0 "$SD" $RO audit --all
	run 0 "$SD" $RO athlete list --format json
	run 0 "$SD" $RO db check
	has out "^ok: ro/gym.db"
	run 0 "$SD" $RO db backup ro-copy.db
	run 0 "$SD" --db ro-copy.db db check
	run 1 "$SD" $RO athlete add "Never Stored"
	has err "^setdose: database 'ro/gym.db' can only be read here \(its folder cannot be written\); nothing was written$"
	check "read-only folder: no file appeared beside the database" test "$(ls -A ro)" = gym.db
	[ $how = mount ] && umount ro && trap - EXIT || chmod u+w ro
	check "read-only folder: the database is unchanged" sh -c "sqlite3 ro/gym.db .dump | cmp -s - before.sql"
else
	echo "cli $T: read-only folder checks skipped: cannot make a read-only folder" >>"$RESULTS"
fi
# A read-only file in a writable folder (root can write it regardless, so only for others).
if [ "$(id -u)" != 0 ]; then
	cp "$DB" rofile.db && chmod a-w rofile.db
	run 0 "$SD" --db rofile.db athlete list
	run 1 "$SD" --db rofile.db athlete add "Never Stored"
	has err "cannot be written"
fi

# ------------------------------------------------------------ a damaged page
cp "$DB" hurt.db
checkpoint hurt.db
page=$(sqlite3 hurt.db "SELECT pageno FROM dbstat WHERE name = 'tests' AND pagetype = 'leaf' ORDER BY pageno LIMIT 1")
size=$(sqlite3 hurt.db 'PRAGMA page_size')
ntests=$(sqlite3 hurt.db 'SELECT count(*) FROM tests')
check "the demo database has a tests leaf page to damage" test -n "$page"
# Random bytes over one page of strength tests (a fixed seed, so every run hurts it alike).
python3 -c "
import random, sys
random.seed(16)
with open('hurt.db', 'r+b') as f:
    f.seek(($page - 1) * $size); f.write(bytes(random.getrandbits(8) for _ in range($size)))"
cp hurt.db hurt-before.db
run 1 "$SD" --db hurt.db db check
has err "^setdose: .*(malformed|failed its check)"
run 1 "$SD" --db hurt.db athlete add "Never Stored"
has err "^setdose: database 'hurt.db' is damaged \(.*\); nothing was written: 'setdose db check' shows the damage, 'setdose db recover NEW.db' copies out what can be read$"
run 1 "$SD" --db hurt.db test add "Maren Oakhollow" "back squat" 100 5 --date 2026-01-05
has err "is damaged"
run 1 "$SD" --db hurt.db db backup hurt-copy.db
has err "^setdose: database 'hurt.db' is damaged: its copy fails the check"
check "no backup file for a damaged database" test ! -e hurt-copy.db
hasnt out "backed up" "a damaged database is not called backed up"
run 0 "$SD" --db hurt.db db recover saved.db
has out "^recovered [0-9]+ rows of hurt.db into saved.db: athletes 8, programs 3, blocks [0-9]+, tests [0-9]+ \([0-9]+ left out, 1 damaged region skipped\), logs [0-9]+$"
says out "note: .*1 damaged region skipped"
run 0 "$SD" --db saved.db db check
run 0 "$SD" --db saved.db athlete list
lines out 9
got=$(sqlite3 saved.db 'SELECT count(*) FROM tests')
check "recover: some tests survive, the damaged page's are lost ($got of $ntests)" test "$got" -gt 0 -a "$got" -lt "$ntests"
check "recover: every recovered test equals the original row" sh -c "
	sqlite3 saved.db 'SELECT * FROM tests' | sort >rec.txt
	sqlite3 '$DB' 'SELECT * FROM tests' | sort >orig.txt
	test \$(comm -23 rec.txt orig.txt | wc -l) -eq 0"
check "recover never writes the damaged file" cmp -s hurt.db hurt-before.db
run 0 "$SD" --db saved.db athlete add "Stored Afterwards"
run 1 "$SD" --db hurt.db db recover saved.db
has err "'saved.db' exists; choose another file or add --force"
run 1 "$SD" --db missing.db db recover x.db
has err "^setdose: database 'missing.db' does not exist$"
check "recover: nothing created for a missing database" test ! -e x.db
cp "$DB" newer.db
sqlite3 newer.db 'PRAGMA user_version = 99'
run 1 "$SD" --db newer.db db recover z.db
has err "^setdose: database 'newer.db' has schema version 99, newer than this setdose understands"
check "recover: nothing written for a newer database" test ! -e z.db
printf 'not a database at all, just some text padding it out to more than a header\n%.0s' 1 2 3 4 5 6 >junk.db
run 1 "$SD" --db junk.db db recover y.db
has err "nothing can be read|not a database"
check "recover: no file for an unreadable database" test ! -e y.db

# ------------------------------------------------------------ text
dump "$DB" >before.sql
run 2 "$SD" athlete add "$(printf 'Eve\342\200\256lin')"
has err "^setdose: athlete name has a bidirectional control character \(U\+202E\) at byte 3$"
run 2 "$SD" athlete add "$(printf 'Bad\377Byte')"
has err "^setdose: athlete name has a byte that is not UTF-8 \(0xFF\) at byte 3$"
run 2 "$SD" athlete add "$(printf 'Tab\there')"
has err "control character \(U\+0009\) at byte 3"
run 1 "$SD" athlete add "Fine Name" --notes "$(printf 'a\033[31m red')"
has err "^setdose: athlete notes has a control character \(U\+001B\) at byte 1$"
run 2 "$SD" athlete edit "Maren Oakhollow" --name "$(printf 'M\342\201\246x')"
has err "U\+2066"
run 2 "$SD" program add --name "$(printf 'wk\300\257')" "$P/demo-minimal2.ini"
has err "not UTF-8 \(0xC0\) at byte 2"
check "refused names changed nothing" sh -c "sqlite3 '$DB' .dump | cmp -s - before.sql"
run 0 "$SD" athlete add "$(printf 'Zo\303\253 K\303\266rber')" --notes "$(printf 'caf\303\251 \342\200\223 ok')"
has out "added athlete 'Zoë Körber'"

# JSON output is valid UTF-8 whatever bytes a file holds.
printf '[program]\nname = bad \377 name\nweeks = 8\n[d\303\050y one]\nbench press = 3x8 @2\n' >bytes.ini
run 0 "$SD" audit --format json bytes.ini
check "audit JSON of a file with invalid UTF-8 is valid UTF-8 JSON" python3 -c "
import json; d = json.loads(open('$TMP/out', 'rb').read().decode('utf-8', 'strict'))
assert d['audits'][0]['program'] == 'bad \ufffd name', d['audits'][0]['program']"
run 0 "$SD" compare --format json bytes.ini "$P/demo-minimal2.ini"
check "compare JSON is valid UTF-8" python3 -c "import json; json.loads(open('$TMP/out', 'rb').read().decode('utf-8'))"
printf 'study,sets,yi,vi\n\377a,1,0.1,0.01\n\377a,5,0.2,0.01\nb\300,2,0.15,0.02\nb\300,9,0.3,0.02\nc,3,0.1,0.01\nc,12,0.25,0.01\n' >bytes.csv
run 0 "$SD" slopes --format json bytes.csv
check "slopes JSON with invalid study labels is valid UTF-8" python3 -c "import json; json.loads(open('$TMP/out', 'rb').read().decode('utf-8'))"

# ------------------------------------------------------------ "added" only after the commit
printf '[program]\nname = goes first\n[a]\nbench press = 3\n' >first.ini
printf '[a]\nbench pres = 3\n' >second.ini
run 1 "$SD" program add first.ini second.ini
hasnt out "added" "nothing is called added when the transaction fails"
has err "second.ini' line 2: unknown exercise 'bench pres'"
run 1 "$SD" program show "goes first"
