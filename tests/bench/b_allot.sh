# allot as a whole process with 40 candidate exercises and a budget of 60 sets, the session rules
# on (2-5 sets of an exercise a session, at most 6 exercises a session, fatigue costs, floors at
# the practical threshold), proved exactly optimal (--tolerance 0; target <= 200 ms median);
# the same with every node's barrier started afresh (--cold-start: the multipliers still start
# at the parent's, as before the warm start); for information the default tolerance and the coach's plan (40 sets, defaults).
# Each timed case is followed by its node and Newton-step counts.
C40="back squat,front squat,deadlift,romanian deadlift,leg press,hack squat,bulgarian split squat,leg extension,lying leg curl,nordic curl,hip thrust,glute bridge,adductor machine,standing calf raise,seated calf raise,back extension,good morning,bench press,incline bench press,close-grip bench press,dip,chest fly machine,push-up,overhead press,lateral raise,face pull,rear delt row,barbell row,chest-supported row,lat pulldown,pull-up,dumbbell pullover,shrug,barbell curl,hammer curl,triceps pushdown,skull crusher,wrist curl,hanging leg raise,farmer's carry"
counts() { # args...: nodes and Newton steps of one run
	"$SD" allot "$@" --format json | python3 -c '
import json, sys
a = json.load(sys.stdin)["allotment"]
print("    %d nodes, %d Newton steps, proved optimal: %s" % (a["nodes"], a["newton_steps"],
      "yes" if a["proved_optimal"] else "no (gap %g)" % a["gap"]))'
}
"$BENCHBIN/bench_run" 11 "allot, 40 cand., budget 60, exact (target 200 ms)" "$SD" allot --budget 60 --candidates "$C40" --tolerance 0
counts --budget 60 --candidates "$C40" --tolerance 0
"$BENCHBIN/bench_run" 5 "allot, the same, --cold-start" "$SD" allot --budget 60 --candidates "$C40" --tolerance 0 --cold-start
counts --budget 60 --candidates "$C40" --tolerance 0 --cold-start
"$BENCHBIN/bench_run" 11 "allot, 40 cand., budget 60, tolerance 0.001" "$SD" allot --budget 60 --candidates "$C40"
counts --budget 60 --candidates "$C40"
"$BENCHBIN/bench_run" 11 "allot --budget 40 --sessions 3 (defaults)" "$SD" allot --budget 40 --sessions 3
counts --budget 40 --sessions 3
