# The athlete page's training log panel (invented athlete and log): the current block's
# weeks done against planned per muscle, its logged average against its plan, and each lift's
# e1RM trend. The numbers on screen are checked against `log weeks --block` and `log e1rm`.
A="Tamsin Ferrow"   # an invented name
"$SD" athlete add "$A" --status trained >/dev/null &&
	"$SD" program add "$ROOT/profiles/demo-fullbody3.ini" >/dev/null &&
	"$SD" block add "$A" "Tidewater full body, three days" --start 2026-06-01 >/dev/null ||
	{ _rec failed "scratch database built"; return 0; }
# Four weeks of June (today is 2026-07-01 in these tests): squat and bench progress, the
# last week is half done.
{
	echo "date,exercise,sets,reps,load,effort"
	for w in 0 1 2 3; do
		d1=$(date -d "2026-06-01 +$((7 * w)) days" +%F)
		d2=$(date -d "2026-06-03 +$((7 * w)) days" +%F)
		echo "$d1,back squat,3,5,$((100 + 5 * w))kg,RIR 2"
		echo "$d1,bench press,3,6,$((70 + 2 * w))kg,RIR 2"
		echo "$d1,barbell row,3,8,60kg,RIR 2"
		[ "$w" -lt 3 ] && echo "$d2,romanian deadlift,3,8,90kg,RIR 2"
		[ "$w" -lt 3 ] && echo "$d2,overhead press,3,6,40kg,RIR 2"
	done
} >log.csv
"$SD" log import log.csv --athlete "$A" >/dev/null || { _rec failed "log imported"; return 0; }

# Expected figures from the commands: the block's planned and logged average per muscle, and
# the latest weekly best e1RM of each lift.
"$SD" log weeks "$A" --block 1 --format csv >weeks.csv
# (the block table's template name holds a comma: its fields are counted from the end)
avg() { awk -F, -v m="$1" '$1 ~ /^[0-9]+$/ && $(NF-3) == m { printf "%s +[^ ]+ +%.1f/%.1f", m, $(NF-1), $(NF-2) }' weeks.csv; }
# The strip: a cell per week, eighths of the planned dose done (a dot for none).
strip() {
	awk -F, -v m="$1" 'BEGIN { split("▁ ▂ ▃ ▄ ▅ ▆ ▇ █", b, " ") }
	$1 ~ /-W/ && $7 == m { r = $8 / $9; s = s (r >= 1 ? "█" : r == 0 ? "·" : b[int(r * 8) + 1]) }
	END { printf "%s +%s ", m, s }' weeks.csv
}
GLUTES=$(avg glutes)
CHEST=$(avg chest)
GSTRIP=$(strip glutes)
"$SD" log e1rm "$A" --format csv >e1rm.csv
SQUAT=$(awk -F, '$1 == "back squat" { v = $8 } END { printf "back squat .* e1RM %.1f kg", v }' e1rm.csv)
BENCH=$(awk -F, '$1 == "bench press" { v = $8 } END { printf "bench press .* e1RM %.1f kg", v }' e1rm.csv)
check "expected figures computed by the commands" [ -n "$GLUTES" ] && [ -n "$CHEST" ] && [ -n "$SQUAT" ] && [ -n "$GSTRIP" ]
check "the squat's latest weekly e1RM: 115 kg x 5 at RIR 2, 115 x 36 / 30 = 138 kg (Brzycki 1993)" \
	grep -q '^back squat,2026-W26,2026-06-22,115.0,5,2,7,138.000,kg$' e1rm.csv

start 100 30 -- --db "$SETDOSE_DB" browse
wait_for "1 of 1 athlete" "opens on the roster" || { finish; return 0; }
keys Enter
wait_for "training log, block #1, 2026-W23 to 2026-W27" "the athlete page shows the log panel of the current block"
on_screen "$GLUTES" "glutes: logged average and planned dose equal 'log weeks --block'"
on_screen "$CHEST" "chest: logged average and planned dose equal 'log weeks --block'"
on_screen "$SQUAT" "the squat's latest weekly e1RM equals 'log e1rm'"
on_screen "$BENCH" "the bench press's latest weekly e1RM equals 'log e1rm'"
# Week by week, as 'log weeks' gives them; the week of 2026-06-29 has nothing logged: a dot.
on_screen "$GSTRIP" "glutes: a cell per week, the share of the plan done as 'log weeks' gives it"
on_screen "glutes +[^ ]{4}· " "the week with nothing logged is a dot"
keys F10
left_alone

# In a terminal without UTF-8 the strip is ASCII.
TUI_LANG=C start 100 30 -- --db "$SETDOSE_DB" browse
wait_for "1 of 1 athlete" "opens again in the C locale" || { finish; return 0; }
keys Enter
wait_for "training log, block #1" "the log panel in the C locale"
on_screen "glutes +[-_=+#]{4}\. " "glutes in ASCII: a mark per week, . for nothing"
keys F10
left_alone
finish
