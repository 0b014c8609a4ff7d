# Every file writer through the one safe writer (src/io/safefile.c): a new file is written and
# announced; an existing file is refused without --force and left as it was; --force replaces
# it; a symbolic link is never written through (with or without --force); a missing folder is
# named plainly; no temporary file is ever left behind.
. "$ROOT/tests/cli/writers.sh"
writer_inputs

leftovers() { ls -A | grep -c 'setdose-' ; }

for k in $WRITER_KINDS; do
	f=out-$k.$(ext $k)
	run 0 write $k "$f"
	has out "$(said $k)" "$k: success is announced"
	check "$k: the file is written" test -s "$f"
	cp "$f" keep
	run 1 write $k "$f"
	has err "^setdose: '$f' exists; choose another file or add --force$"
	check "$k: the existing file is left as it was" cmp -s "$f" keep
	hasnt out "$(said $k)" "$k: nothing announced when refused"
	run 0 write $k "$f" --force
	check "$k: --force replaced the file" test -s "$f"
	printf 'not to be touched\n' >victim
	ln -s victim "link.$(ext $k)"
	for force in "" --force; do
		run 1 write $k "link.$(ext $k)" $force
		has err "^setdose: 'link\.$(ext $k)' is a symbolic link; setdose does not write through links"
	done
	check "$k: the link's target is untouched" sh -c 'test "$(cat victim)" = "not to be touched"'
	check "$k: the link is still a link" test -L "link.$(ext $k)"
	run 1 write $k "nofolder/x.$(ext $k)"
	has err "^setdose: folder 'nofolder' does not exist$"
	mkdir "dir.$(ext $k)"
	run 1 write $k "dir.$(ext $k)" --force
	has err "is a folder, not a file"
	check "$k: no temporary file is left" test "$(leftovers)" -eq 0
	rm -rf keep victim "link.$(ext $k)" "dir.$(ext $k)"
done

# What was written is what it claims to be.
check "chart PNG signature" sh -c 'head -c 8 out-png.png | od -An -c | grep -q "P   N   G"'
check "chart SVG" grep -q '<svg' out-svg.svg
if command -v pdfinfo >/dev/null; then
	check "chart PDF opens" sh -c 'pdfinfo out-pdf.pdf >/dev/null'
	check "report PDF opens" sh -c 'pdfinfo out-report.pdf >/dev/null'
fi
run 0 "$SD" --profile out-fit.ini profile check
run 0 "$SD" audit out-allot.ini
run 0 "$SD" --db out-backup.db db check
run 0 "$SD" --db out-backup.db athlete list
has out "^Wren Calloway "
run 0 "$SD" --db out-recover.db db check

# A new file gets 0666 less the umask; a replaced one keeps its permissions.
(umask 027 && write effects perm.csv >/dev/null)
check "a new file honours the umask" sh -c 'test "$(stat -c %a perm.csv)" = 640'
chmod 600 perm.csv
write effects perm.csv --force >/dev/null
check "a replaced file keeps its permissions" sh -c 'test "$(stat -c %a perm.csv)" = 600'

# Bad input writes nothing, not even a temporary file.
printf '[a]\nbench pres = 3\n' >bad.ini
run 1 "$SD" report --out bad.pdf "$P/demo-minimal2.ini" bad.ini
check "no report for bad input" test ! -e bad.pdf
run 1 "$SD" chart --out bad.png --program bad.ini
check "no chart for bad input" test ! -e bad.png
check "still no temporary file" test "$(leftovers)" -eq 0
