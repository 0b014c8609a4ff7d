# Charts and the report as whole processes (no target yet; figures for the notes): the curve
# with its label placement as PNG, the per-muscle chart as PDF, a one-program report (laid out
# twice) and a 3-section report. --force, since each run replaces the same file.
P=$ROOT/profiles
"$BENCHBIN/bench_run" 21 "chart curve PNG with labels" "$SD" chart --force --out c.png --program "$P/demo-upperlower4.ini"
"$BENCHBIN/bench_run" 21 "chart muscles PDF" "$SD" chart --force --kind muscles --out m.pdf --program "$P/demo-upperlower4.ini"
"$BENCHBIN/bench_run" 11 "report, one program (3 pages)" "$SD" report --force --out r.pdf "$P/demo-upperlower4.ini"
"$BENCHBIN/bench_run" 11 "report, three programs" "$SD" report --force --out r3.pdf "$P/demo-upperlower4.ini" "$P/demo-fullbody3.ini" "$P/demo-minimal2.ini"
