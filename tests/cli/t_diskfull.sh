# Every writer on a full (and on a nearly full) file system: it exits non-zero, the old file is
# left as it was and no temporary file remains; a PDF reported as written opens (pdfinfo).
# The small file system is a tmpfs mounted here when this runs as root (CI does); otherwise
# `ulimit -f` stands in for it (the writes fail with EFBIG instead of ENOSPC); otherwise the
# checks are skipped with the reason in the results file.
. "$ROOT/tests/cli/writers.sh"
writer_inputs
M=$TMP/small
mkdir -p "$M"
how=
if [ "$(id -u)" = 0 ] && mount -t tmpfs -o size=1m tmpfs "$M" 2>/dev/null; then
	how=tmpfs
	trap 'umount "$M" 2>/dev/null' EXIT
elif (ulimit -f 16) 2>/dev/null; then
	how=ulimit
else
	echo "cli $T: full-disk checks skipped: cannot mount a tmpfs (needs root) and ulimit -f is unavailable" >>"$RESULTS"
	return 0 2>/dev/null || exit 0
fi

printf 'the old file, to be kept\n' >"$TMP/old"
# Files in M other than the targets (out.EXT) and the filler: what no write may leave.
stray() { ls -A "$M" | grep -v -x -e 'out\.[a-z]*' -e fill | grep -c . ; }

# fill FREE_KB: leaves about FREE_KB of the tmpfs free.
fill() {
	rm -f "$M/fill"
	dd if=/dev/zero of="$M/fill" bs=4096 2>/dev/null
	[ "$1" -gt 0 ] && truncate -s "-$1K" "$M/fill"
	sync
}

# attempt KIND FREE_KB: one run of the writer with FREE_KB left; checks what a failure must
# leave. Sets $got to the exit status.
attempt() {
	f=out.$(ext $1)
	cp "$TMP/old" "$M/$f"
	if [ $how = tmpfs ]; then
		fill "$2"
		write $1 "$M/$f" --force >"$TMP/out" 2>"$TMP/err"
		got=$?
	else
		# SIGXFSZ ignored (inherited by the command): a write past the limit fails with
		# EFBIG, as on a full disk, wherever it happens. The limit also holds for files the
		# output is redirected to, so the output goes through a pipe. Limits count 512-byte
		# blocks.
		( trap '' XFSZ; ulimit -f $(($2 * 2)); write $1 "$M/$f" --force 2>&1; echo "exit=$?" ) |
		    cat >"$TMP/all"
		got=$(sed -n 's/^exit=//p' "$TMP/all")
		grep '^setdose: ' "$TMP/all" >"$TMP/err"
		grep -v -e '^setdose: ' -e '^exit=' "$TMP/all" >"$TMP/out"
	fi
	LAST_OUT=$TMP/err
}

# With nothing free every writer must fail; with a little free the small files may fit, and
# then they must be whole and announced.
for k in $WRITER_KINDS; do
	f=out.$(ext $k)
	attempt $k 0
	if [ "$got" -ne 0 ]; then _rec passed "$k on a full disk ($how): exit $got"
	else _rec failed "$k on a full disk ($how): exit 0"; fi
	if [ $how = tmpfs ]; then
		has err "^setdose: .*(cannot write|disk is full|No space)" "$k on a full disk: says why"
	else
		has err "^setdose: " "$k over the file-size limit: says why"
	fi
	lines err 1
	check "$k on a full disk: the old file is intact" cmp -s "$TMP/old" "$M/$f"
	check "$k on a full disk: no temporary file left" test "$(stray)" -eq 0
	hasnt out "$(said $k)" "$k on a full disk: nothing claims success"
	attempt $k 8
	if [ "$got" -ne 0 ]; then
		check "$k with 8K free: failed, the old file is intact" cmp -s "$TMP/old" "$M/$f"
		hasnt out "$(said $k)" "$k with 8K free: failed, nothing claims success"
	else
		has out "$(said $k)" "$k with 8K free: written and announced"
		check "$k with 8K free: written, not the old file" sh -c "! cmp -s '$TMP/old' '$M/$f'"
	fi
	check "$k with 8K free: no temporary file left" test "$(stray)" -eq 0
	rm -f "$M/fill"
done

# The report at growing amounts of free space: whenever it says "wrote", the PDF opens;
# whenever it fails, the old file is there. Some runs must fail and the last must succeed.
if command -v pdfinfo >/dev/null; then
	fails=0 oks=0
	for free in 0 4 8 12 16 20 24 28 32 40 48 64 96 200; do
		attempt report $free
		if [ "$got" -eq 0 ]; then
			oks=$((oks + 1))
			check "report with ${free}K free: written and announced, it opens" sh -c \
			    "grep -q '^wrote' '$TMP/out' && pdfinfo '$M/out.pdf' >/dev/null 2>&1"
		else
			fails=$((fails + 1))
			check "report with ${free}K free: failed, the old file is intact" cmp -s "$TMP/old" "$M/out.pdf"
		fi
		check "report with ${free}K free: no temporary file left" test "$(stray)" -eq 0
		rm -f "$M/fill"
	done
	check "report: some runs hit the full disk ($fails) and the roomiest run wrote ($oks)" \
	    test "$fails" -gt 0 -a "$got" -eq 0
fi
[ $how = tmpfs ] && umount "$M" && trap - EXIT
