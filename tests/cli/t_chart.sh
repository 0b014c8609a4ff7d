# chart and report: real files in each format, checked by their signatures and page counts.
P=$ROOT/profiles
run 0 "$SD" chart --out c.png --program "$P/demo-upperlower4.ini"
has out '^wrote c.png'
check "chart.png is a 900x572 PNG" python3 -c '
import struct,sys
d=open("c.png","rb").read(24)
assert d[:8]==b"\x89PNG\r\n\x1a\n", d[:8]
w,h=struct.unpack(">II", d[16:24]); assert (w,h)==(900,572), (w,h)'
run 0 "$SD" chart --out c.svg
check "chart.svg is SVG" grep -q '<svg' c.svg
run 0 "$SD" --status trained chart --out c.pdf --program "$P/demo-minimal2.ini"
check "chart.pdf is a PDF" sh -c 'head -c 5 c.pdf | grep -q "%PDF-"'
run 0 "$SD" report --out r.pdf "$P/demo-fullbody3.ini" "$P/demo-minimal2.ini" "$P/demo-fullbody3.csv"
has out 'wrote r.pdf \(3 pages\)'
if command -v pdfinfo >/dev/null; then
	check "report has 3 pages" sh -c 'pdfinfo r.pdf | grep -q "^Pages: *3$"'
	check "report carries the caution" sh -c 'pdftotext r.pdf - | grep -q "Not medical advice"'
	check "report shows the chest row" sh -c 'pdftotext -layout r.pdf - | grep -q "chest *9 *0 *9.0"'
	check "report names the three levels" sh -c 'pdftotext r.pdf - | tr "\n" " " | grep -q "curve: the average curve (confidence interval); group: a new group or study"'
	check "report carries the profile line" sh -c "pdftotext r.pdf - | grep -q \"profile 'strength-default' (calibrated)\""
	check "report legend: one athlete" sh -c 'pdftotext r.pdf - | grep -q "one athlete (+ between-athlete spread)"'
	run 0 "$SD" --weeks 104 chart --out w.pdf
	check "chart says a block length beyond the evidence" sh -c 'pdftotext w.pdf - | grep -q "104 is beyond the evidence (4 to 24): the curve uses 24"'
fi
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
