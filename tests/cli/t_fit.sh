# effects, fit, slopes: effect sizes, the meta-regression, and fit --write -> audit --profile.
# Outside check values: tests/data/ref (metafor 3.8-1, Viechtbauer 2010; see its README).
R=$ROOT/tests/data/ref
SIM=$R/sim_reciprocal_effects.csv
MODEL="--effect effect --mods weeks,trained"

# --- effects: two-group lnRR (Hedges, Gurevitch & Curtis 1999) on Curtis & Wang (1998)
cut -d, -f1-9 "$R/curtis1998_rom.csv" >curtis.csv
run 0 "$SD" effects --m1 m1i --sd1 sd1i --n1 n1i --m2 m2i --sd2 sd2i --n2 n2i curtis.csv
check "effects: lnRR and variances of 102 Curtis rows match metafor" python3 - "$TMP/out" "$R/curtis1998_rom.csv" <<'PY'
import csv, sys
got = list(csv.DictReader(open(sys.argv[1]))); ref = list(csv.DictReader(open(sys.argv[2])))
assert len(got) == len(ref) == 102
for g, r in zip(got, ref):
    assert abs(float(g["yi"]) - float(r["yi"])) < 1e-9, (g, r)
    assert abs(float(g["vi"]) - float(r["vi"])) < 1e-11, (g, r)
PY
run 1 "$SD" effects curtis.csv
has err "neither two-group columns"

# --- effects: pre-post lnRR with correlation r (Lajeunesse 2011)
cut -d, -f1-6 "$R/romc_prepost.csv" >pp.csv
run 0 "$SD" effects pp.csv --output pp_out.csv
has out "wrote 5 pre-post lnRR effects to 'pp_out.csv'"
check "effects: pre-post rows match metafor (ROMC)" python3 - pp_out.csv "$R/romc_prepost.csv" <<'PY'
import csv, sys
got = list(csv.DictReader(open(sys.argv[1]))); ref = list(csv.DictReader(open(sys.argv[2])))
assert len(got) == 5
for g, r in zip(got, ref):
    assert abs(float(g["yi"]) - float(r["yi"])) < 1e-11 and abs(float(g["vi"]) - float(r["vi"])) < 1e-13
    assert g["r_source"] == "data"
PY
cut -d, -f1-5 "$R/romc_prepost.csv" >pp_nor.csv
run 1 "$SD" effects pp_nor.csv
has err "line 2: the pre-post correlation r is missing \(give --r-default R"
run 0 "$SD" effects --r-default 0.7 pp_nor.csv
has out "^100,120,15,16,12,0.18232155679.,0.00102314814815,0.7,default$" "default r used and marked in r_source"
printf 'm_pre,m_post,sd_pre,sd_post,n,r\n100,120,15,16,12,0.5\n0,96,12,13,20,0.7\n60,70,9,10,1,0.9\n50,60,5,6,10,1.5\n' >bad.csv
run 1 "$SD" effects bad.csv --output never.csv
has err "3 of 4 rows rejected.*line 3: non-positive mean m_pre = 0.*line 4: sample size n = 1.*line 5: correlation r = 1.5"
check "effects: nothing written on bad input" test ! -e never.csv
run 2 "$SD" effects --design cross-over pp.csv

# --- fit: the invented simulation against metafor, via the CSV output
run 0 "$SD" --format csv fit $MODEL "$SIM"
check "fit: REML reciprocal coefficients and variances match metafor" python3 - "$TMP/out" "$R/sim_reciprocal_fits.txt" <<'PY'
import csv, sys
got = {r["quantity"]: r for r in csv.DictReader(open(sys.argv[1]))}
ref = dict(l.split(" = ") for l in open(sys.argv[2]).read().splitlines())
for q, k, tol in [("intercept", "b0", 1e-5), ("dose", "b_dose", 1e-5), ("weeks", "b_weeks", 1e-5),
                  ("trained", "b_trained", 1e-5), ("tau2", "sigma2_study", 1e-6), ("sigma2", "sigma2_effect", 1e-6)]:
    assert abs(float(got[q]["estimate"]) - float(ref["reciprocal_reml_" + k])) < tol, q
assert abs(float(got["dose"]["se"]) - float(ref["reciprocal_reml_se_dose"])) < 1e-5
assert got["converged"]["estimate"] == "1" and got["studies"]["estimate"] == "40"
PY
run 0 "$SD" fit $MODEL "$SIM"
has out "^dose +-0\.26517"
has out "converged after"
has out "Q_E\(114\)"
run 0 "$SD" fit $MODEL --test t --level 0.9 "$SIM"
has out "t with df = 36 \(studies - coefficients\)"
has out "^term .* t .* p "

# --- fit --forms all: every form by ML, ranked; the simulation was drawn from the reciprocal
run 0 "$SD" fit $MODEL --forms all "$SIM"
has out "^reciprocal +181\.753 +-351\.505 +0\.000 +-334\.881" "forms: reciprocal first, ML logLik/AIC/BIC as metafor"
has out "^linear +138\.883 +-265\.766"
run 0 "$SD" --format csv fit $MODEL --forms all "$SIM"
lines out 5
run 0 "$SD" --format json fit $MODEL --forms all "$SIM"
check "forms json: four forms, ranked, reciprocal best" python3 - "$TMP/out" <<'PY2'
import json, sys
d = json.load(open(sys.argv[1]))
assert [x["form"] for x in d] == ["reciprocal", "log", "sqrt", "linear"]
assert all(x["loso_folds"] == 40 and x["loso_skipped"] == 0 for x in d)
assert d[0]["rank_aic"] == d[0]["rank_bic"] == d[0]["rank_rmse"] == d[0]["rank_mlpd"] == 1
PY2
run 0 "$SD" --format json fit $MODEL --slopes "$SIM"
check "fit json: coefficients, variances, fit statistics" python3 - "$TMP/out" <<'PY2'
import json, sys
d = json.load(open(sys.argv[1]))
assert d["studies"] == 40 and d["effects"] == 118 and d["converged"] is True
assert [c["term"] for c in d["coefficients"]] == ["intercept", "dose", "weeks", "trained"]
assert abs(d["variance"]["rho"] - 0.7078725913) < 1e-3 and abs(d["loglik"] - 176.7996015) < 1e-4
PY2
run 2 "$SD" fit $MODEL --forms all --write x.ini "$SIM"
run 2 "$SD" fit --forms some "$SIM"

# --- fit --write -> profile check -> audit --profile (round trip)
run 0 "$SD" fit $MODEL --slopes --write fitted.ini --name sim-fit "$SIM"
has out "wrote profile 'fitted.ini' \(reciprocal form, 4 terms\)"
run 0 "$SD" profile check fitted.ini
has out "^ok: fitted.ini"
run 0 "$SD" --profile fitted.ini profile show
has out "sim-fit"
has out "^dose +-0\.2668"
has out "random slopes"
has out "^basis       fitted: fitted by setdose fit to 'sim_reciprocal_effects.csv' \(118 effects, 40 studies\)"
has out "^weeks       6 to 16 \(evidence range" "each moderator's range is the data's (weeks 6-16 in make_sim.R)"
has out "^trained     0 to 1 "
has out "source: Copied from profile 'strength-default', not estimated: study-level effect sizes cannot estimate"
run 0 "$SD" fit $MODEL --write plain.ini "$SIM"
has out "^not estimable from study-level effects: the between-athlete variance \(0\.0064 copied from the active profile"
check "the written profile marks its basis and copied athlete variance" sh -c \
	"grep -q '^basis *= fitted' plain.ini && grep -q '^athlete *= 0.0064' plain.ini && grep -q '^weeks *= 6, 16' plain.ini"
run 0 "$SD" --profile fitted.ini audit "$ROOT/profiles/demo-fullbody3.ini"
has out "profile sim-fit"
says out "profile 'sim-fit' \(fitted\): fitted by setdose fit to 'sim_reciprocal_effects.csv'" "the fitted profile's provenance line under the table"
run 0 "$SD" --profile fitted.ini --weeks 30 --format json audit "$ROOT/profiles/demo-fullbody3.ini"
check "a fitted profile flags block lengths outside its data (6-16 weeks)" python3 -c '
import json,sys; a=json.load(open(sys.argv[1]))["audits"][0]
assert a["evidence"]["weeks"] == {"low": 6, "high": 16, "value": 30, "used": 16, "beyond": True}
assert a["profile"]["basis"] == "fitted"' "$TMP/out"
run 0 "$SD" --swc 5 fit $MODEL --write swc5.ini "$SIM"
check "--swc sets the written profile's SWC" grep -q '^swc *= 0.04879016416' swc5.ini

# --- degenerate input: a clear message, exit 1, never a nonsense fit
printf 'study,sets,yi,vi\na,0,0.1,0.01\na,4,0.2,0.01\na,8,0.25,0.01\n' >one_study.csv
run 1 "$SD" fit one_study.csv
has err "all 3 effects come from one study"
printf 'study,sets,yi,vi\na,6,0.1,0.01\nb,6,0.2,0.01\nc,6,0.25,0.01\n' >one_dose.csv
run 1 "$SD" fit one_dose.csv
has err "every effect is at one dose \(6 weekly sets\)"
printf 'study,sets,yi,vi\na,0,0.1,0.01\nb,4,0.2,0\nc,8,0.25,0.01\n' >zero_v.csv
run 1 "$SD" fit zero_v.csv
has err "zero_v.csv' line 3: sampling variance vi = 0 \(must be positive\)"
printf 'study,sets,yi,vi\na,0,0.1,0.01\nb,4,0.2,-0.01\nc,8,0.25,0.01\n' >neg_v.csv
run 1 "$SD" fit neg_v.csv
has err "line 3: sampling variance vi = -0.01"
# effects spread less than their sampling variances: tau2 = 0 at the boundary, said so
printf 'study,sets,yi,vi\na,0,0.10,0.01\na,8,0.12,0.01\nb,0,0.11,0.01\nb,8,0.12,0.01\nc,0,0.10,0.01\nc,8,0.13,0.01\n' >flat.csv
run 0 "$SD" fit --form linear flat.csv
has out "^  tau2 +0 .*0 at the boundary"
run 0 "$SD" fit --form linear --slopes flat.csv
has out "^  tau2_slope +0 .*0 at the boundary"
has out "correlation undefined"
has out "converged after"
run 1 "$SD" fit $MODEL --slopes --max-iter 1 "$SIM"
has err "the REML fit did not converge"
has out "NOT converged"
run 1 "$SD" fit --mods nosuch "$SIM"
has err "no moderator column 'nosuch'"
run 2 "$SD" fit --form cubic "$SIM"
run 2 "$SD" fit --bogus "$SIM"
run 2 "$SD" fit
run 1 "$SD" fit missing.csv

# --- slopes: raw within-study and shrunken study slopes, with the picture
run 0 "$SD" slopes $MODEL "$SIM"
has out "raw within-study lines"
has out "shrunken study lines"
has out "^1 +4 +4 "
run 0 "$SD" --format csv slopes $MODEL "$SIM"
lines out 41
check "slopes: shrunken slope = pooled + BLUP, as metafor's BLUPs" python3 - "$TMP/out" "$R/sim_reciprocal_study_blups_slopes.csv" <<'PY'
import csv, sys
got = list(csv.DictReader(open(sys.argv[1]))); ref = list(csv.DictReader(open(sys.argv[2])))
for g, r in zip(got, ref):
    assert g["study"] == r["study"]
    assert abs(float(g["blup_slope"]) - float(r["blup_slope"])) < 1e-5
    assert abs(float(g["blup_intercept"]) - float(r["blup_intercept"])) < 1e-5
PY
run 1 "$SD" slopes one_dose.csv

# --- under valgrind: no invalid access, no leak (not for the sanitizer build)
case "$SD" in */asan/*) return 0 ;; esac
command -v valgrind >/dev/null || return 0
vg() { valgrind -q --error-exitcode=99 --leak-check=full --errors-for-leak-kinds=definite,indirect "$@"; }
run 0 vg "$SD" fit $MODEL --slopes --write vg.ini "$SIM"
run 0 vg "$SD" --format json slopes $MODEL "$SIM"
run 0 vg "$SD" effects --r-default 0.5 pp_nor.csv
run 1 vg "$SD" effects bad.csv
