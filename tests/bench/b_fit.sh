# Meta-regression fits as whole processes (`setdose fit`, REML, moderators weeks and trained,
# reciprocal form, study and effect levels).
#
# 1. The invented 200-study table (618 effects): the three-level fit (target <= 20 ms) and the
#    random-slope fit (target <= 50 ms). metafor 3.8-1 (Viechtbauer 2010) needed about 0.58 s
#    and 10.4 s in-process on this machine class (tests/data/ref/README.md); the ratio is
#    printed beside each median, and the estimates are compared with bench_big200_fits.txt.
# 2. A simulated table of 5,000 studies (15,106 effects; invented, written by bench_simeffects
#    with seed 20261217): the three-level and random-slope fits, with instruction targets of
#    40% of what the fitter took before its closed-form likelihood and moment-started Newton
#    (callgrind, whole process, measured on the previous code with this same data):
#        three-level 5,000 studies   840.4 M instructions  -> target <= 336.1 M
#        random slopes 5,000 studies 1625.1 M instructions -> target <= 650.1 M
#        (618 effects: 32.1 M and 68.2 M then; no instruction target)
#    About 142 M of each 5,000-study figure is reading the CSV table, outside the fitter.
# With BENCH_INSTR=1 each fit is also run once under callgrind and its instruction count
# printed against the target.
DATA=$ROOT/tests/bench/bench_big200_effects.csv
REFS=$ROOT/tests/data/ref/bench_big200_fits.txt
ARGS="--effect effect --mods weeks,trained --form reciprocal"


one() { # LABEL METAFOR_MS PREFIX [--slopes]
	label=$1 ref_ms=$2 pre=$3; shift 3
	line=$("$BENCHBIN/bench_run" 31 "$label" "$SD" fit $ARGS "$@" "$DATA") || { echo "$line"; return 1; }
	echo "$line"
	echo "$line" | awk -v r="$ref_ms" '{ for (i = 1; i <= NF; i++) if ($i == "median") m = $(i + 1);
		printf "    metafor %.0f ms in-process / setdose %.2f ms whole process = %.0fx\n", r, m, r / m }'
	instr "" "$SD" fit $ARGS "$@" "$DATA"
	"$SD" --format csv fit $ARGS "$@" "$DATA" >fit.csv || return 1
	python3 - fit.csv "$REFS" "$pre" <<'PY'
import csv, sys
got = {r["quantity"]: float(r["estimate"]) for r in csv.DictReader(open(sys.argv[1]))}
ref = {k: float(v) for k, v in (l.split(" = ") for l in open(sys.argv[2]).read().splitlines())}
p = sys.argv[3]
groups = {"fixed effects": [("intercept", "b0"), ("dose", "b_dose"), ("weeks", "b_weeks"), ("trained", "b_trained")],
          "variance components": [("tau2", "sigma2_study" if p == "threelevel" else "tau2_intercept"),
                                  ("sigma2", "sigma2_effect")] + ([("tau2_slope", "tau2_slope")] if p == "rs" else []),
          "logLik": [("loglik", "logLik_REML")]}
if p == "rs":
    groups["rho"] = [("rho", "rho")]
out = []
for g, pairs in groups.items():
    dev = max(abs(got[a] - ref[p + "_" + b]) for a, b in pairs)
    out.append("%s %.2g" % (g, dev))
print("    agreement with metafor, max |difference|: " + "; ".join(out))
PY
}
one "fit three-level REML, 618 effects (20 ms)" 580 threelevel
one "fit random slopes REML, 618 effects (50 ms)" 10400 rs --slopes

big() { # LABEL TARGET_M [--slopes]
	label=$1 target=$2; shift 2
	"$BENCHBIN/bench_run" 11 "$label" "$SD" fit $ARGS "$@" sim5000.csv || return 1
	instr "$target" "$SD" fit $ARGS "$@" sim5000.csv
}
"$BENCHBIN/bench_simeffects" 20261217 5000 >sim5000.csv || exit 1
big "fit three-level REML, 5,000 studies" 336.1
big "fit random slopes REML, 5,000 studies" 650.1 --slopes
