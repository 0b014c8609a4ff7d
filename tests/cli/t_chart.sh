# chart and report: real files in each format, checked by their signatures and page counts; the
# layout each one reports (SETDOSE_TEST_LAYOUT=1) checked by layout_check.py: no label box meets
# another label, a mark or a threshold line; no text under 8 pt at A4; report pages filled.
P=$ROOT/profiles
LC="python3 $ROOT/tests/cli/layout_check.py"
run 0 "$SD" chart --out c.png --program "$P/demo-upperlower4.ini"
has out '^wrote c.png \(curve chart\)'
check "chart.png is a PNG 1190 pixels wide (595 points, 2 pixels a point)" python3 -c '
import struct,sys
d=open("c.png","rb").read(24)
assert d[:8]==b"\x89PNG\r\n\x1a\n", d[:8]
w,h=struct.unpack(">II", d[16:24]); assert w==1190 and 700<h<1400, (w,h)'
run 0 "$SD" chart --out c.svg
check "chart.svg is SVG" grep -q '<svg' c.svg
run 0 "$SD" --status trained chart --out c.pdf --program "$P/demo-minimal2.ini"
check "chart.pdf is a PDF" sh -c 'head -c 5 c.pdf | grep -q "%PDF-"'

# Every kind, every demo program: the layout's boxes.
for prog in demo-upperlower4.ini demo-fullbody3.ini demo-minimal2.ini; do
	SETDOSE_TEST_LAYOUT=1 "$SD" chart --force --out l.png --program "$P/$prog" 2>lay.txt >/dev/null
	check "curve chart of $prog: labels clear of each other, marks and lines; text >= 8 pt" \
		$LC lay.txt --labels 5
	SETDOSE_TEST_LAYOUT=1 "$SD" chart --force --kind muscles --out l.pdf --program "$P/$prog" 2>lay.txt >/dev/null
	check "muscles chart of $prog: text >= 8 pt, one mark a muscle" $LC lay.txt
done
SETDOSE_TEST_LAYOUT=1 "$SD" --status trained --weeks 104 chart --force --out l.png --program "$P/demo-minimal2.ini" 2>lay.txt >/dev/null
check "curve chart, trained, beyond the evidence: labels clear" $LC lay.txt --labels 5
check "the muscles chart marks every muscle with sets twice (dose and gain)" sh -c \
	"SETDOSE_TEST_LAYOUT=1 '$SD' chart --force --kind muscles --out l.svg --program '$P/demo-minimal2.ini' 2>&1 >/dev/null | grep -c '^box 0 0 mark' | grep -qx 26"
run 0 "$SD" chart --kind compare --out cmp.png --program "$P/demo-fullbody3.ini" --against "$P/demo-upperlower4.ini"
has out '^wrote cmp.png \(compare chart\)'
SETDOSE_TEST_LAYOUT=1 "$SD" chart --force --kind compare --out cmp.png --program "$P/demo-fullbody3.ini" \
	--against "$P/demo-upperlower4.ini" 2>lay.txt >/dev/null
check "compare chart: text >= 8 pt" $LC lay.txt
run 0 "$SD" chart --kind returns --out ret.svg
has out '^wrote ret.svg \(returns chart\)'
SETDOSE_TEST_LAYOUT=1 "$SD" chart --force --kind returns --out ret.png 2>lay.txt >/dev/null
check "returns heat map: text >= 8 pt" $LC lay.txt
if command -v pdftotext >/dev/null; then
	"$SD" chart --force --kind compare --out cmp.pdf --program "$P/demo-fullbody3.ini" --against "$P/demo-upperlower4.ini" >/dev/null
	"$SD" --format csv compare "$P/demo-fullbody3.ini" "$P/demo-upperlower4.ini" >cmp.csv
	check "compare chart's decisions are the compare command's" sh -c '
		for m in forearms abs calves chest; do
			want=$(grep ",$m," cmp.csv | grep -o "clear-gain\|equivalent\|some-gain\|unclear\|some-loss\|clear-loss" | head -n 1)
			pdftotext -layout cmp.pdf - | grep -E "^ *$m " | grep -q -- "$want" || exit 1
		done'
	"$SD" chart --force --kind returns --out ret.pdf >/dev/null
	"$SD" --format csv returns >ret.csv
	check "returns heat map: the 0 to 30 cell is the returns command's" sh -c '
		want=$(awk -F, "\$1==0 && \$2==30 {printf \"%.1f\", \$3}" ret.csv)
		[ -n "$want" ] && pdftotext -layout ret.pdf - | grep -E "^ *0 " | grep -q -- "$want"'
fi
run 2 "$SD" chart --kind compare --out x.png --program "$P/demo-minimal2.ini"
has err "needs --against PROGRAM"
run 2 "$SD" chart --kind muscles --out x.png
has err "needs --program PROGRAM"
run 2 "$SD" chart --kind pie --out x.png
has err "unknown chart kind 'pie'"
run 2 "$SD" chart --kind returns --out x.png --program "$P/demo-minimal2.ini"
has err "takes no --program"

run 0 "$SD" report --out r.pdf "$P/demo-fullbody3.ini" "$P/demo-minimal2.ini" "$P/demo-fullbody3.csv"
has out 'wrote r.pdf \(3 sections\)'
SETDOSE_TEST_LAYOUT=1 "$SD" report --force --athlete "Wren Calloway" --out r.pdf "$P/demo-upperlower4.ini" \
	"$P/demo-fullbody3.ini" "$P/demo-minimal2.ini" 2>lay.txt >/dev/null
if command -v pdfinfo >/dev/null; then
	check "report pages: labels clear, text >= 8 pt, every page but the last three quarters full" \
		$LC lay.txt --labels 15 --fill r.pdf
	pdftotext -layout r.pdf r.txt
	check "report carries the caution" grep -q "Not medical advice" r.txt
	check "report header names the athlete and the template, not the file" sh -c \
		'grep -q "Wren Calloway" r.txt && grep -q "Template: Tidewater minimal, two days" r.txt && ! grep -q "profiles/demo" r.txt'
	check "report shows the chest row" sh -c 'grep -q "chest *9 *0 *9.0" r.txt || pdftotext -layout r.pdf - | grep -q "chest  *14  *0  *14.0"'
	check "report has three findings" sh -c 'grep -q "In short" r.txt && grep -q "More sets pay most for\|Every muscle is at or past" r.txt && grep -q "practical returns" r.txt && grep -q "the evidence" r.txt'
	check "report: warnings under a heading" grep -q "^ *Warnings" r.txt
	check "report: where the sets come from" grep -q "Where the sets come from" r.txt
	check "report names the three levels" sh -c 'tr "\n" " " <r.txt | tr -s " " | grep -q "curve: the average curve (confidence interval); group: a new group or study"'
	check "report carries the profile line" grep -q "profile 'strength-default' (calibrated)" r.txt
	check "report legend: one athlete" grep -q "95%: one athlete" r.txt
	run 0 "$SD" --weeks 104 chart --out w.pdf
	check "chart says a block length beyond the evidence" sh -c 'pdftotext w.pdf - | tr "\n" " " | grep -q "104 is beyond the evidence (4 to 24): the curve uses 24"'
fi

# From the store: a block, an athlete's latest block, the roster with its contents page.
"$SD" program add "$P/demo-minimal2.ini" "$P/demo-upperlower4.ini" >/dev/null
"$SD" athlete add "Wren Calloway" --notes "invented athlete" >/dev/null
"$SD" athlete add "Odile Marsh" --status trained --notes "invented athlete" >/dev/null
"$SD" block add "Wren Calloway" "Tidewater minimal, two days" --start 2026-01-05 >/dev/null
"$SD" block add "Odile Marsh" "Tidewater upper/lower, four days" --start 2026-02-02 --weeks 6 >/dev/null
run 0 "$SD" report --out b.pdf --block 1
has out 'wrote b.pdf \(1 section\)'
run 0 "$SD" report --out a.pdf --athlete "Odile Marsh"
run 1 "$SD" report --out z.pdf --athlete "Nobody Here"
has err "unknown athlete 'Nobody Here'"
SETDOSE_TEST_LAYOUT=1 "$SD" report --out roster.pdf --roster 2>lay.txt >out.txt
check "roster report: two sections" grep -q "wrote roster.pdf (2 sections)" out.txt
if command -v pdfinfo >/dev/null; then
	check "roster report: labels clear, text >= 8 pt, section pages full (after the contents page)" \
		$LC lay.txt --labels 10 --fill roster.pdf --skip-pages 1
	pdftotext -layout roster.pdf roster.txt
	check "roster report: a contents page naming both athletes" sh -c \
		'head -n 30 roster.txt | grep -q Contents && head -n 30 roster.txt | grep -q "Odile Marsh" && head -n 30 roster.txt | grep -q "Wren Calloway"'
	check "roster report: each section's header shows its block" sh -c \
		'grep -q "block 1, from 2026-01-05" roster.txt && grep -q "block 2, from 2026-02-02, 6 weeks planned" roster.txt'
	check "block report: trained status from the store" sh -c 'pdftotext a.pdf - | grep -q "trained athlete, 6-week block"'
fi
run 2 "$SD" report --out x.pdf --roster "$P/demo-minimal2.ini"
has err "takes no PROGRAM arguments"
run 2 "$SD" report --out x.pdf --roster --block 1
has err "one of --roster, --block ID and --athlete NAME"

run 2 "$SD" chart --out c.gif
has err "name it .png, .svg or .pdf"
run 2 "$SD" report --out r.png "$P/demo-minimal2.ini"
has err "the report is a PDF"
run 2 "$SD" chart
has err "needs --out FILE"
printf '[a]\nbench pres = 3\n' >bad.ini
run 1 "$SD" report --out bad.pdf "$P/demo-minimal2.ini" bad.ini
check "no report written on bad input" test ! -e bad.pdf
run 1 "$SD" chart --out /nonexistent/dir/c.png
has err "^setdose: folder '/nonexistent/dir' does not exist$"
