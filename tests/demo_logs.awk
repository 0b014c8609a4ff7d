# Writes the invented training log of the invented demo gym (Tidewater Strength Co-op) as a
# setdose log file (CSV, man setdose: LOG FILES). EVERYTHING IT WRITES IS INVENTED: the
# athletes, how often they trained, every load and every effort.
#
# Input, in this order: the demo templates (profiles/demo-*.ini), then the demo blocks, one a
# line: athlete|units|template name|start|weeks|end ("" while open). Variables: cutoff (the
# last day to log, YYYY-MM-DD).
#
# How the invented sessions are made: every planned day of every block week is trained when a
# deterministic pseudo-random draw (a linear congruential generator, seeded per athlete, the
# same in every awk) falls below the athlete's invented attendance; a trained day does the
# template's sets at its reps (a range's low end) and effort (RPE written as RPE, RIR as RIR,
# now and then half a point off), at an invented load that rises each week since 2026-01-05 by
# 0.8 % times the athlete's attendance (who trains less, progresses less). Warm-up
# groups are not logged. Bodyweight exercises are logged without a load.
BEGIN {
	FS = "|"
	# Invented attendance: the share of planned sessions each athlete trained.
	attend["Maren Oakhollow"] = 0.95; attend["Tobin Reedmere"] = 0.9
	attend["Ilse Brackwater"] = 0.85; attend["Juno Saltmarsh"] = 0.65
	attend["Caspian Hollowell"] = 0.3; attend["Wren Alderly"] = 0.55
	attend["Otto Vantwell"] = 1.0; attend["Sefa Northcote"] = 0.8
	# Invented strength of each athlete relative to the table of loads below.
	scale["Maren Oakhollow"] = 1.15; scale["Tobin Reedmere"] = 1.2
	scale["Ilse Brackwater"] = 0.55; scale["Juno Saltmarsh"] = 0.7
	scale["Caspian Hollowell"] = 1.0; scale["Wren Alderly"] = 0.6
	scale["Otto Vantwell"] = 1.1; scale["Sefa Northcote"] = 0.65
	# Invented working loads in kg of a reference lifter; 0: bodyweight, logged without one.
	n = split("back squat:120;bench press:85;barbell row:70;seated leg curl:40;" \
		  "lateral raise:10;barbell curl:35;romanian deadlift:110;overhead press:55;" \
		  "lat pulldown:65;dip:0;leg press:180;hanging leg raise:0;front squat:95;" \
		  "incline dumbbell press:30;chest-supported row:30;lying leg curl:40;" \
		  "standing calf raise:80;face pull:25;seated cable row:65;leg extension:50;" \
		  "push-up:0;pull-up:0;chest fly machine:50;cable lateral raise:8;" \
		  "overhead triceps extension:25;hammer curl:16;deadlift:150;" \
		  "bulgarian split squat:24;hip thrust:120;seated calf raise:50;cable crunch:40", kv, ";")
	for (i = 1; i <= n; i++) {
		split(kv[i], p, ":")
		load[p[1]] = p[2] + 0
	}
	# Training days of the week (0 = the block's first weekday) by the days a template has.
	offs[2] = "0 3"; offs[3] = "0 2 4"; offs[4] = "0 1 3 4"
	print "# Invented demo training log of the invented gym Tidewater Strength Co-op (not real data)."
	print "date,athlete,exercise,sets,reps,load,effort"
}

# A linear congruential generator (the constants of Numerical Recipes, modulo 2^32), written
# with exact integer arithmetic in doubles so every awk gives the same sequence.
function rnd() {
	seed = (seed * 1664525 + 1013904223) % 4294967296
	return seed / 4294967296
}

function trim(s) { gsub(/^[ \t]+|[ \t]+$/, "", s); return s }

# Days since 1970-01-01 of YYYY-MM-DD, and back (proleptic Gregorian; H. Hinnant's algorithm).
function days(s,   y, m, d, era, yoe, doy) {
	y = substr(s, 1, 4) + 0; m = substr(s, 6, 2) + 0; d = substr(s, 9, 2) + 0
	y -= m <= 2
	era = int(y / 400); yoe = y - era * 400
	doy = int((153 * (m + (m > 2 ? -3 : 9)) + 2) / 5) + d - 1
	return era * 146097 + yoe * 365 + int(yoe / 4) - int(yoe / 100) + doy - 719468
}
function date(z,   era, doe, yoe, doy, mp, d, m, y) {
	z += 719468; era = int(z / 146097); doe = z - era * 146097
	yoe = int((doe - int(doe / 1460) + int(doe / 36524) - int(doe / 146096)) / 365)
	doy = doe - (365 * yoe + int(yoe / 4) - int(yoe / 100)); mp = int((5 * doy + 2) / 153)
	d = doy - int((153 * mp + 2) / 5) + 1; m = mp < 10 ? mp + 3 : mp - 9
	y = yoe + era * 400 + (m <= 2)
	return sprintf("%04d-%02d-%02d", y, m, d)
}

# Templates: "[program]" keys name and weeks, then one section per day.
FILENAME ~ /\.ini$/ {
	line = $0
	sub(/;.*/, "", line)
	line = trim(line)
	if (line == "") next
	if (line ~ /^\[/) {
		sec = tolower(substr(line, 2, length(line) - 2))
		if (sec != "program") ndays[tpl]++
		next
	}
	k = trim(substr(line, 1, index(line, "=") - 1)); v = trim(substr(line, index(line, "=") + 1))
	if (sec == "program") {
		if (k == "name") tpl = v
		next
	}
	nl[tpl]++
	tday[tpl, nl[tpl]] = ndays[tpl]
	tex[tpl, nl[tpl]] = k
	tval[tpl, nl[tpl]] = v
	next
}

# One group "3x8-10 @8", "1x5 @9", "3x10 RIR 2", "3x10/side @8": sets, reps, effort text.
function group(g, out,   s, r, e) {
	g = trim(g)
	if (g ~ /warm/) return 0
	s = g; sub(/x.*/, "", s)
	r = g; sub(/^[0-9]+x/, "", r); sub(/[^0-9].*/, "", r)
	if (g ~ /@/) { e = g; sub(/.*@ */, "", e); e = "RPE " e }
	else if (g ~ /RIR/) { e = g; sub(/.*RIR */, "", e); e = "RIR " e }
	else e = ""
	out["sets"] = s + 0; out["reps"] = r + 0; out["effort"] = e
	return 1
}

# Now and then half a point off the planned effort, as lifters rate their own sets.
function effort(e,   v) {
	if (e == "") return e
	v = substr(e, 5) + 0
	if (rnd() < 0.3) v += (rnd() < 0.5 ? -0.5 : 0.5)
	if (e ~ /^RIR/ && v < 0) v = 0
	if (e ~ /^RPE/ && v > 10) v = 10
	return substr(e, 1, 4) v
}

function weight(ath, ex, day, lb,   kg, step) {
	if (!(ex in load) || load[ex] == 0) return ""
	kg = load[ex] * scale[ath] * (1 + 0.008 * attend[ath] * int((day - days("2026-01-05")) / 7))
	if (lb) { step = 5; return sprintf("%glb", int(kg / 0.45359237 / step + 0.5) * step) }
	step = kg < 30 ? 1 : 2.5
	return sprintf("%gkg", int(kg / step + 0.5) * step)
}

# Blocks: every planned session of every week up to the block's end (or the cutoff).
{
	ath = $1; lb = $2 == "lb"; tpl = $3; first = days($4); weeks = $5 + 0
	last = $6 != "" ? days($6) : first + 7 * weeks - 1
	if (last > days(cutoff)) last = days(cutoff)
	if (!(ath in seeded)) {
		seed = 0
		for (i = 1; i <= length(ath); i++) seed = (seed * 31 + index("abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZ ", substr(ath, i, 1))) % 4294967296
		seeded[ath] = 1
		state[ath] = seed
	}
	seed = state[ath]
	nd = split(offs[ndays[tpl]], off, " ")
	for (wk = 0; wk < weeks; wk++) {
		for (d = 1; d <= nd; d++) {
			day = first + 7 * wk + off[d]
			if (day > last) continue
			if (rnd() >= attend[ath]) continue
			for (i = 1; i <= nl[tpl]; i++) {
				if (tday[tpl, i] != d) continue
				ng = split(tval[tpl, i], gs, ",")
				for (j = 1; j <= ng; j++) {
					if (!group(gs[j], gr)) continue
					printf "%s,%s,%s,%d,%d,%s,%s\n", date(day), ath, tex[tpl, i], gr["sets"],
						gr["reps"], weight(ath, tex[tpl, i], day, lb), effort(gr["effort"])
				}
			}
		}
	}
	state[ath] = seed
}
