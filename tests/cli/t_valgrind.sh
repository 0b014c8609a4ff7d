# The main commands under valgrind: no invalid access, no leak (skipped for the sanitizer
# build, which valgrind cannot run).
case "$SD" in */asan/*) return 0 ;; esac
command -v valgrind >/dev/null || { _rec failed "valgrind installed (make deps)"; return 0; }
P=$ROOT/profiles
vg() { valgrind -q --error-exitcode=99 --leak-check=full --errors-for-leak-kinds=definite,indirect "$@"; }
run 0 vg "$SD" audit --format json "$P/demo-upperlower4.ini"
run 0 vg "$SD" audit --summary "$P/demo-fullbody3.ini" "$P/demo-fullbody3.csv"
run 0 vg "$SD" curve --program "$P/demo-minimal2.ini"
run 0 vg "$SD" returns --format csv
printf '[a]\nbench pres = 3\n' >bad.ini
run 1 vg "$SD" audit bad.ini
run 0 vg "$SD" chart --out c.png --program "$P/demo-minimal2.ini"
run 0 vg "$SD" report --out r.pdf "$P/demo-minimal2.ini"
