# Colours, the monochrome fallback (NO_COLOR, --no-color) and the ASCII fallback outside a
# UTF-8 locale.
demo_db || return 0
DB=$TMP/demo.db
ESC=$(printf '\033')

# colours ON SCREEN-WITH-ESCAPES   1 when the screen uses a foreground or background colour
colours() { grep -Eq "$ESC\\[([0-9;]*;)?(3[0-7]|4[0-7]|38;5|48;5)[;m]" "$1"; }

start 80 24 -- --db "$DB" browse
wait_for "8 of 8 athletes" "opens with colours allowed" || { finish; return 0; }
settle
tmx capture-pane -p -e >colour.txt
check "with colours allowed the screen is coloured" colours colour.txt
keys F10
left_alone 0

start 80 24 NO_COLOR=1 -- --db "$DB" browse
wait_for "8 of 8 athletes" "opens with NO_COLOR set"
settle
tmx capture-pane -p -e >mono.txt
check "NO_COLOR: no colour on the screen" sh -c "! grep -Eq '$ESC\\[([0-9;]*;)?(3[0-7]|4[0-7]|38;5|48;5)[;m]' mono.txt"
check "NO_COLOR: the selection is still marked (reverse video)" grep -q "$ESC\\[7m" mono.txt
keys F10
left_alone 0

start 80 24 -- --db "$DB" --no-color browse
wait_for "8 of 8 athletes" "opens with --no-color"
settle
tmx capture-pane -p -e >mono2.txt
check "--no-color: no colour on the screen" sh -c "! grep -Eq '$ESC\\[([0-9;]*;)?(3[0-7]|4[0-7]|38;5|48;5)[;m]' mono2.txt"
keys F10
left_alone 0

# ASCII: the C locale gets no UTF-8 at all, and every view still reads.
TUI_LANG=C
start 80 24 -- --db "$DB" browse
wait_for "8 of 8 athletes" "opens in the C locale"
on_screen "setdose \| roster" "the title uses an ASCII separator"
text "/oakh"
keys Enter
wait_for "blocks \(current first\)" "the athlete's page in ASCII"
on_screen "^-- personal response -+$" "the rule is drawn with '-'"
keys Enter
wait_for "chest +5\.0 [-_.~=+*#]+@[-_.~=+*#:]+\|" "the dose strip in ASCII: the curve's rise in '_' to '#', the dose '@', the end of the evidence '|'"
on_screen "side-delts +1\.0 [-_.~=+*#]*@[-_.~=+*#]*:[-_.~=+*#]+\|" "the plateau past a muscle's dose is marked ':'"
keys k
wait_for "# mean += 95% curve +: group +\. athlete" "the curve's legend uses ASCII glyphs"
on_screen "#" "the curve's mean is drawn with '#'"
settle
check "no byte outside printable ASCII on any of these screens" sh -c "! LC_ALL=C grep -q '[^ -~]' '$TMP/screen'"
keys F10
left_alone 0
finish
TUI_LANG=
