# The stored templates on the demo database (invented data): a template's dose view and
# curve, the comparison of two templates, and editing a template's text in the editor with
# validation before anything is stored. Numbers are checked against 'setdose audit' and
# 'setdose compare'.
demo_db || return 0
DB=$TMP/demo.db
FB="Tidewater full body, three days"
MIN="Tidewater minimal, two days"

# Expected figures from the commands (fields counted from the end: labels may hold commas).
"$SD" audit --format csv "$ROOT/profiles/demo-minimal2.ini" >audit.csv 2>&1
CHEST=$(awk -F, '$(NF-17) == "chest" { printf "chest {1,}%.1f .* %+.1f {1,}%.1f to %.1f {1,}%+.2f %s", $(NF-14), $(NF-11), $(NF-10), $(NF-9), $(NF-4), $(NF-1) }' audit.csv | sed 's/+/\\+/g')
"$SD" --db "$DB" compare --format csv "$FB" "$MIN" >compare.csv 2>&1
PAIR=$(awk -F, '$1 == "difference" && $2 == "A" && $3 == "B" && $5 == "chest" { printf "chest {1,}%.1f {1,}%.1f .* %+.1f {1,}%.1f to %.1f {1,}%s", $6, $7, $12, $13, $14, $17 }' compare.csv | sed 's/+/\\+/g')
DECISION=$(awk -F, '$1 == "difference" && $2 == "A" && $3 == "B" && $5 == "chest" { print $17 }' compare.csv)
PLATEAU=$("$SD" --weeks 12 returns | sed -n 's/^Practical plateau: \([0-9.]*\) .*/\1/p')
READ5=$("$SD" --weeks 12 curve --step 0.5 --no-plot --format csv |
	awk -F, -v x="$PLATEAU" '$1 == x { printf "at %.1f sets: gain %+.1f%%  95%%: curve %.1f to %.1f  group %.1f to %.1f", x, $2, $3, $4, $5, $6 }' |
	sed 's/+/\\+/g')
check "expected figures computed by the commands" [ -n "$CHEST" ] && [ -n "$PAIR" ] && [ -n "$READ5" ]

# An editor that makes one change per call: a typo first, then its fix, then a real change,
# then nothing.
cat >"$TMP/ed.sh" <<'EOF'
#!/bin/sh
n=$(cat "$0.count" 2>/dev/null || echo 0); n=$((n + 1)); echo $n >"$0.count"
case $n in
1) sed -i 's/^bench press *=.*/bench pres = 3x6 @8/' "$1" ;;
2) sed -i 's/^bench pres *=.*/bench press = 4x6 @8/' "$1" ;;
3) sed -i 's/^leg extension *=.*/leg extension = 2x15 @9/' "$1" ;;
esac
EOF
chmod +x "$TMP/ed.sh"

start 80 24 EDITOR="$TMP/ed.sh" -- --db "$DB" browse
wait_for "8 of 8 athletes" "opens on the roster" || { finish; return 0; }
keys Tab
wait_for "3 stored templates" "Tab shows the stored templates"
on_screen "▸ +$FB +ini" "templates are listed by name"

# A template's dose view and curve, for the default context (untrained, its own 12 weeks).
keys Down Enter
wait_for "template '$MIN'" "Enter opens the template's dose view"
on_screen "untrained, 12-week block; 2 days, 23 hard sets a week" "the template's own length, the default status"
on_screen "$CHEST" "chest row equals 'setdose audit' of the same file"
keys Escape k
wait_for "$READ5" "k opens the template's curve; the cursor starts at the plateau, values equal 'setdose curve'"
on_screen "a chest 5\.0" "the template's muscles are marked"
keys Escape

# Compare: mark A, select B, c.
keys Home
wait_for "▸ +$FB" "Home selects the first template"
keys Space
wait_for "marked as A" "Space marks the first of a comparison"
on_screen "A = '$FB'" "the mark is shown"
keys c
wait_for "select a different template than A" "c on the marked template itself says to pick another"
keys Down c
wait_for "A: '$FB'" "c opens the comparison"
on_screen "B: '$MIN'" "B is the selected template"
on_screen "48 hard sets a week" "A's hard sets"
on_screen "23 hard sets a week" "B's hard sets"
on_screen "$PAIR" "chest row equals 'setdose compare' (sets, difference, interval, decision)"
on_screen "B over A .*: $DECISION, the 90% interval" "the decision equals 'setdose compare' ($DECISION)"
keys x
wait_for "A: '$MIN'" "x swaps A and B"
keys Escape

# Edit a template used by blocks: a typo is refused (nothing stored), the fix reads, the
# same name is refused while blocks use it, a new name stores a new template.
wait_for "▸ +$MIN" "back on the templates, B is still selected"
keys e
wait_for "the edit does not read .*edit it again\?" "an edit that does not read is refused, with a question"
on_screen "line [0-9]+: unknown exercise" "the parse error names the line and the problem"
on_screen "'bench pres'" "the parse error quotes the unknown name"
keys y
wait_for "store the edited template as" "the second edit reads; the form asks for a name"
wait_for "the edit reads: 2 days, 9 entries" "the status line describes the edit"
keys Enter
wait_for "is used by [0-9]+ blocks: store the edit under" "the same name is refused while blocks use it"
keys BSpace BSpace BSpace BSpace
text "days v2"
keys Enter
wait_for "stored template '$MIN v2'" "a new name stores a new template"
wait_for "4 stored templates" "the list has the new template"
# An unused template's edit replaces it under the same name; no change stores nothing.
keys Down
wait_for "▸ +$MIN v2" "the new template is selected"
keys e
wait_for "store the edited template as" "the third edit reads"
keys Enter
wait_for "stored template '$MIN v2'" "the same name replaces an unused template"
keys e
wait_for "no change to '$MIN v2': nothing stored" "an edit that changes nothing stores nothing"

keys F10
left_alone 0
finish

"$SD" --db "$DB" program show "$MIN" >orig.ini 2>&1
"$SD" --db "$DB" program show "$MIN v2" >v2.ini 2>&1
check "the original template is unchanged" cmp -s orig.ini "$ROOT/profiles/demo-minimal2.ini"
check "the new template has the fixed and changed lines" \
	sh -c "grep -q '^bench press = 4x6 @8\$' v2.ini && grep -q '^leg extension = 2x15 @9\$' v2.ini"
check "the new template differs from the original only in those two lines" \
	sh -c "[ \$(diff orig.ini v2.ini | grep -c '^>') -eq 2 ]"
