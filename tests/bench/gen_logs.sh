#!/bin/sh
# Writes ROWS invented training-log rows (setdose's log format, for timing and for the killed
# import test only; no real data) to standard output: PER_DAY rows a day from FIRST on, over
# twelve barbell, dumbbell, machine and bodyweight exercises, loads and efforts varied by a
# fixed arithmetic rule so the output is the same in every awk.
# Usage: gen_logs.sh ROWS [PER_DAY] [FIRST]   (defaults 40 and 2000-01-03)
ROWS=${1:?usage: gen_logs.sh ROWS [PER_DAY] [FIRST]}
awk -v rows="$ROWS" -v per="${2:-40}" -v first="${3:-2000-01-03}" '
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
BEGIN {
	n = split("back squat:100;bench press:80;barbell row:70;overhead press:50;" \
		  "romanian deadlift:100;lat pulldown:60;leg press:150;dumbbell curl:14;" \
		  "triceps pushdown:30;standing calf raise:70;lateral raise:10;pull-up:0", ex, ";")
	for (i = 1; i <= n; i++) { split(ex[i], p, ":"); name[i] = p[1]; base[i] = p[2] }
	split("RIR 1;RIR 2;RIR 3;RPE 8;RPE 8.5;@9;RIR 5", eff, ";")
	print "date,exercise,sets,reps,load,effort"
	d0 = days(first)
	for (r = 0; r < rows; r++) {
		day = d0 + int(r / per)
		k = r % n + 1
		w = base[k] ? sprintf("%gkg", base[k] + (r * 7) % 40 * 2.5) : ""
		printf "%s,%s,%d,%d,%s,%s\n", date(day), name[k], 1 + r % 4, 3 + (r * 5) % 10, w, eff[1 + (r * 3) % 7]
	}
}'
