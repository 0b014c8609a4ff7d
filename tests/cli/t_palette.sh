# The one palette (src/plot/palette.h) reads apart for a deuteranope and in greyscale print:
# tests/tools/cvd.py simulates both (Machado, Oliveira & Fernandes 2009; ITU-R BT.709).
check "palette: every pair apart after deuteranopia and in greyscale" \
	python3 "$ROOT/tests/tools/cvd.py" check "$ROOT/src/plot/palette.h"
# The check can fail: two band shades one step apart are refused.
sed 's/{ 0xbb, 0xd0, 0xe5, 152, "band-group" }/{ 0x8d, 0xaf, 0xd1, 152, "band-group" }/' \
	"$ROOT/src/plot/palette.h" >near.h
check "palette check refuses two shades too close" sh -c "! python3 '$ROOT/tests/tools/cvd.py' check near.h >/dev/null"
if command -v pdftoppm >/dev/null; then
	"$SD" chart --out c.pdf --program "$ROOT/profiles/demo-minimal2.ini" >/dev/null
	pdftoppm -r 30 c.pdf pg
	check "a rendered chart, simulated for a deuteranope and in greyscale" sh -c \
		"python3 '$ROOT/tests/tools/cvd.py' image pg-1.ppm sim && head -c 8 sim-deut.png | grep -q PNG && head -c 8 sim-grey.png | grep -q PNG"
fi
