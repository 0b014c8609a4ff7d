# The main job: one audit as a whole process (target <= 5 ms median of >= 20 runs), and
# 10,000 generated program files in one `audit --summary` run (target <= 1 s, <= 32 MB RSS).
# The generated programs are invented, for timing only.
# The floor first: what any process costs to start on this machine.
"$BENCHBIN/bench_run" 101 "/bin/true (process start floor)" /bin/true
"$BENCHBIN/bench_run" 101 "audit one program (target 5 ms)" "$SD" audit "$ROOT/profiles/demo-upperlower4.ini"
mkdir -p progs
awk 'BEGIN {
	split("back squat,bench press,barbell row,overhead press,romanian deadlift,lat pulldown,leg press,dumbbell curl,triceps pushdown,standing calf raise,lateral raise,hip thrust", ex, ",")
	srand(7)
	for (i = 0; i < 10000; i++) {
		f = sprintf("progs/p%05d.ini", i)
		printf "[program]\nname = generated %d\nweeks = %d\n", i, 6 + i % 8 > f
		for (d = 1; d <= 2 + i % 4; d++) {
			printf "[day %d]\n", d > f
			for (k = 1; k <= 12; k++) if (rand() < 0.5) printf "%s = %dx%d RIR %d\n", ex[k], 1 + int(rand() * 5), 5 + int(rand() * 8), int(rand() * 6) > f
			printf "plank = 2\n" > f
		}
		close(f)
	}
}'
"$BENCHBIN/bench_run" 5 "audit --summary of 10,000 programs (1 s, 32 MB)" "$SD" audit --summary progs/*.ini
# The same summary for the first 1,000 of those programs, their names from standard input:
# target <= 100 M instructions (with BENCH_INSTR=1).
ls progs/p0*.ini | head -1000 >list1000.txt
"$BENCHBIN/bench_run" 5 "audit --summary - of 1,000 programs" sh -c 'exec "$0" audit --summary - <list1000.txt' "$SD"
instr 100 "$SD" audit --summary - <list1000.txt
