# allot as a whole process with 40 candidate exercises and a budget of 60 sets (target <= 100 ms
# median), at the default tolerance; for information also budget 40 (a harder tree) and the
# 60-set case proved exactly optimal (--tolerance 0). The method line shows the proof reached.
C40="back squat,front squat,deadlift,romanian deadlift,leg press,hack squat,bulgarian split squat,leg extension,lying leg curl,nordic curl,hip thrust,glute bridge,adductor machine,standing calf raise,seated calf raise,back extension,good morning,bench press,incline bench press,close-grip bench press,dip,chest fly machine,push-up,overhead press,lateral raise,face pull,rear delt row,barbell row,chest-supported row,lat pulldown,pull-up,dumbbell pullover,shrug,barbell curl,hammer curl,triceps pushdown,skull crusher,wrist curl,hanging leg raise,farmer's carry"
"$BENCHBIN/bench_run" 21 "allot, 40 candidates, budget 60 (target 100 ms)" "$SD" allot --budget 60 --candidates "$C40"
"$SD" allot --budget 60 --candidates "$C40" | grep '^method:'
"$BENCHBIN/bench_run" 11 "allot, 40 candidates, budget 40" "$SD" allot --budget 40 --candidates "$C40"
"$SD" allot --budget 40 --candidates "$C40" | grep '^method:'
"$BENCHBIN/bench_run" 5 "allot, 40 candidates, budget 60, --tolerance 0" "$SD" allot --budget 60 --candidates "$C40" --tolerance 0
"$SD" allot --budget 60 --candidates "$C40" --tolerance 0 | grep '^method:'
