# Long names end in an ellipsis where they are cut, so two athletes sharing a long beginning
# read apart; Ctrl-L reloads what another process changed; the title's way here stops short of
# the profile label; a database in a read-only folder opens and reads (invented names).
demo_db || return 0
DB=$TMP/demo.db
A="Ottoline Featherstonehaugh-Wintergreen Alpha"   # invented, 44 bytes
B="Ottoline Featherstonehaugh-Wintergreen Bravo"
"$SD" --db "$DB" athlete add "$A" >/dev/null
"$SD" --db "$DB" athlete add "$B" >/dev/null

start 60 20 -- --db "$DB" browse
wait_for "10 of 10 athletes" "opens on the roster with the two long names" || { finish; return 0; }
on_screen "Ottoline Feath[^ ]*…" "a cut name ends in an ellipsis"
# The roster lists by name, so the two are on neighbouring lines; neither may read as the full
# name without its ellipsis.
not_on_screen "Ottoline Featherstonehaugh-Wintergreen Alpha" "the cut name is not shown as if whole"

# Another process adds an athlete; Ctrl-L shows it.
"$SD" --db "$DB" athlete add "Quill Ashdown" >/dev/null
keys C-l
wait_for "11 of 11 athletes" "Ctrl-L reloads what another process changed"
on_screen "Quill Ashdown" "the new athlete is listed"

# At 80 columns, on a long-named athlete's page, the way here is cut and ends two columns
# before the profile label.
resize 80 24
text "/bravo"
keys Enter
wait_for "blocks \(current first\)" "the athlete page opens"
grab
check "the title's way here ends in an ellipsis two blanks before the profile label" \
    sh -c "head -1 '$TMP/screen' | grep -Eq '…  +profile '"
keys F10
left_alone 0
finish

# A read-only folder (a read-only bind of the scratch folder where root can mount one; else
# the folder's write permission off, which holds for a user other than root).
mkdir ro
cp "$DB" ro/ro.db
if [ "$(id -u)" = 0 ]; then
	mount --bind ro ro 2>/dev/null && mount -o remount,bind,ro ro 2>/dev/null && rodone=mount
else
	chmod a-w ro && rodone=chmod
fi
if [ -n "$rodone" ]; then
	start 80 24 -- --db "$TMP/ro/ro.db" browse
	wait_for "10 of 10 athletes" "a database in a read-only folder opens in the interface"
	keys +
	wait_for "new athlete" "the new-athlete form opens"
	text "Never Stored"
	keys Enter
	wait_for "can only be read here" "a write is refused with the reason"
	keys Escape F10
	left_alone 0
	finish
	[ "$rodone" = mount ] && umount ro || chmod u+w ro
else
	echo "tui $T: read-only folder check skipped: cannot make a read-only folder" >>"$RESULTS"
fi
