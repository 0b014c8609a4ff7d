#!/bin/sh
# Totals the results file written by the test runners into the closing line CI reads.
r=$1
p=$(grep -c ' passed$' "$r" 2>/dev/null || true)
f=$(grep -c ' failed$' "$r" 2>/dev/null || true)
grep ' failed$' "$r" 2>/dev/null | sed 's/^/FAILED: /'
echo "${p:-0} passed, ${f:-0} failed"
[ "${f:-0}" -eq 0 ] && [ "${p:-0}" -gt 0 ]
