# Shared by the tests/bench/b_*.sh sections (run.sh sources it first).
# instr TARGET_M CMD...: with BENCH_INSTR=1, runs CMD once under callgrind and prints its
# instruction count against the target in millions (no target: the count alone).
instr() { # TARGET_M CMD... : the instruction count, when BENCH_INSTR=1
	target=$1; shift
	[ "${BENCH_INSTR:-0}" = 1 ] || return 0
	n=$(valgrind --tool=callgrind --callgrind-out-file=/dev/null "$@" 2>&1 >/dev/null |
		sed -n 's/.*Collected : \([0-9]*\).*/\1/p')
	awk -v n="$n" -v t="$target" 'BEGIN { if (t == "")
		printf "    instructions %.1f M\n", n / 1e6
	else
		printf "    instructions %.1f M, target <= %s M: %s\n", n / 1e6, t, n <= t * 1e6 ? "met" : "NOT met" }'
}
