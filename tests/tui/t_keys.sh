# Keys a new user reaches for, on the demo database (invented data) and on an empty one: q
# leaves from every view (but types inside the search and a form's text), / starts the roster
# search, a key that cannot act says why, the compare view's arrows follow the predicted gain,
# and a template is added from a file path with nothing stored yet.
demo_db || return 0
DB=$TMP/demo.db
FB="Tidewater full body, three days"
MIN="Tidewater minimal, two days"

# q on the roster leaves.
start 100 30 -- --db "$DB" browse
wait_for "8 of 8 athletes" "opens on the roster" || { finish; return 0; }
keys x
wait_for "x does nothing in the roster view; \? lists its keys" "a key with no use says so on the status line"
keys q
left_alone 0 "q on the roster leaves with status 0"

# / starts the search; a q typed there is a letter, not a way out.
start 100 30 -- --db "$DB" browse
wait_for "8 of 8 athletes" "opens again"
on_screen "/ to search by name" "the roster says how to search"
text "/q"
wait_for "search +q" "after /, q types into the search"
wait_for "0 of 8 athletes|1 of 8 athletes|[0-9] of 8 athletes" "the search narrows the roster"
keys Escape
wait_for "8 of 8 athletes" "Esc ends the search and clears it, without leaving"
text "/oakh"
wait_for "1 of 8 athletes" "/oakh finds one athlete"
keys Enter
wait_for "blocks \(current first\)" "Enter ends the search and opens the athlete"
keys Down Down Down Down Down Down Down Down Down Down Down Down Down Down Down Down
keys f
wait_for "f finishes a block; this row is a strength test" "f on a test row says why it cannot act"
keys q
left_alone 0 "q on the athlete page leaves"

# The compare view: arrows scaled by the difference in predicted gain, headed in words; q leaves.
start 100 30 -- --db "$DB" browse
wait_for "8 of 8 athletes" "opens a third time"
keys Tab
wait_for "templates" "Tab opens the templates"
keys Home
wait_for "▸ *$FB|$FB" "the templates are listed"
# Mark the full-body template as A, then the minimal one as B.
rows=$(grep -c "Tidewater" "$TMP/screen")
i=1
while [ $i -le "$rows" ]; do
	grab
	if grep -q "▸ *$FB" "$TMP/screen"; then break; fi
	keys Down; i=$((i + 1)); settle
done
keys Space
wait_for "marked as A" "Space marks A"
keys Home
i=1
while [ $i -le "$rows" ]; do
	grab
	if grep -q "▸ *$MIN" "$TMP/screen"; then break; fi
	keys Down; i=$((i + 1)); settle
done
keys c
wait_for "less with B +more with B" "the arrows are headed in words, not 'B - A'"
wait_for "calves" "the compare view lists the muscles"
grab
check "arrow lengths order as the differences in predicted gain" python3 - "$TMP/screen" <<'PY'
import re, sys
rows = []
for line in open(sys.argv[1], encoding="utf-8"):
    m = re.match(r"^ (\S+) +\d+\.\d +\d+\.\d +(.*?) +([-+]\d+\.\d) +-?\d", line)
    if not m:
        continue
    arrow = sum(m.group(2).count(c) for c in "━◀▶")
    rows.append((abs(float(m.group(3))), arrow, m.group(1)))
assert len(rows) >= 10, rows
rows.sort()
for (d1, a1, n1), (d2, a2, n2) in zip(rows, rows[1:]):
    assert a1 <= a2, "%s (%.1f%%, %d cells) against %s (%.1f%%, %d cells)" % (n1, d1, a1, n2, d2, a2)
# The longest arrow is the largest difference, and it is longer than the smallest.
assert rows[-1][1] > rows[0][1], rows
PY
"$SD" --db "$DB" compare --format csv "$FB" "$MIN" >cmp.csv 2>&1
CALVES=$(awk -F, '$1 == "difference" && $5 == "calves" { printf "%+.1f", $12 }' cmp.csv | sed 's/+/\\+/')
on_screen "calves .* $CALVES " "the calves difference is the compare command's ($CALVES)"
keys q
left_alone 0 "q in the compare view leaves"

# An empty database: a template added from a file path, inside the interface.
start 100 30 -- --db "$TMP/empty.db" browse
wait_for "no athletes yet" "an empty database opens on an empty roster"
keys Tab
wait_for "no templates stored yet: \+ adds one from a program file" "the empty template list says how to add one"
keys Enter
wait_for "no template to show: \+ adds one" "Enter with no template says why"
keys +
wait_for "add a template from a program file" "+ opens the form"
text "$ROOT/profiles/no-such-file.ini"
keys Enter
wait_for "cannot read program .*no-such-file.ini.*No such file" "a missing file is refused, naming it"
i=0; while [ $i -lt 60 ]; do keys BSpace; i=$((i + 1)); done
text "$ROOT/profiles/demo-minimal2.ini"
keys Tab
text "quiet weeks q"
keys Enter
wait_for "added template 'quiet weeks q' \(2 days" "Enter stores it under the name given (q typed in a field)"
wait_for "quiet weeks q" "the template list shows it"
check "'setdose program list' lists the template added in the interface" sh -c \
	"'$SD' --db '$TMP/empty.db' program list | grep -q 'quiet weeks q'"
keys Enter
wait_for "chest +[0-9.]+ " "the new template opens in the dose view"
keys q
left_alone 0 "q in the dose view leaves"
finish
