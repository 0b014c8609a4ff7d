# The full-screen interface: a full redraw (every cell repainted and written out) of the dose
# view and of the curve view on a 200x60 screen, 200 times each (target <= 16 ms per redraw).
"$BENCHBIN/bench_tui" 200 "$ROOT/profiles"
