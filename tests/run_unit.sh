#!/bin/sh
# Runs each cmocka test binary; appends "unit NAME passed|failed" to the results file.
results=$1; shift
fail=0
for t in "$@"; do
	if "$t"; then echo "unit $(basename "$t") passed" >>"$results"
	else echo "unit $(basename "$t") failed" >>"$results"; fail=1; fi
done
exit $fail
