# One option layer: for every command and subcommand in `setdose help --table`, the same message
# and exit status 2 for an unknown option, a missing value, a value given to a flag and a number
# out of range; all checked before anything is opened (the database file is never created).
# Then the global pass: a command option's value is never taken for a global option.
DB=$TMP/never.db
"$SD" help --table >table.tsv
check "help --table lists commands and options" test "$(wc -l <table.tsv)" -gt 50
while IFS="$(printf '\t')" read -r cmd sub opt kind; do
	if [ "$sub" = - ]; then set -- "$cmd"; label=$cmd; else set -- "$cmd" "$sub"; label="$cmd $sub"; fi
	want() { printf 'setdose: %s\n' "$1" >want.txt; }
	# An unknown option, wherever it stands.
	"$SD" --db "$DB" "$@" --no-such-option >out.txt 2>err.txt; rc=$?
	want "unknown option '--no-such-option' for '$label' (see 'setdose help $label')"
	check "$label: unknown option, exit 2 (got $rc)" test "$rc" -eq 2
	check "$label: unknown option, the one message" cmp -s err.txt want.txt
	[ "$opt" = - ] && continue
	case $kind in
	flag)
		"$SD" --db "$DB" "$@" "$opt=x" >out.txt 2>err.txt; rc=$?
		want "option '$opt' for '$label' takes no value (see 'setdose help $label')"
		check "$label $opt: a value for a flag, exit 2 (got $rc)" test "$rc" -eq 2
		check "$label $opt: a value for a flag, the one message" cmp -s err.txt want.txt ;;
	*)
		"$SD" --db "$DB" "$@" "$opt" >out.txt 2>err.txt; rc=$?
		want "option '$opt' for '$label' needs a value (see 'setdose help $label')"
		check "$label $opt: missing value, exit 2 (got $rc)" test "$rc" -eq 2
		check "$label $opt: missing value, the one message" cmp -s err.txt want.txt ;;
	esac
	case $kind in
	int|num)
		"$SD" --db "$DB" "$@" "$opt" 1e300 >out.txt 2>err.txt; rc=$?
		check "$label $opt: out of range, exit 2 (got $rc)" test "$rc" -eq 2
		check "$label $opt: out of range names the option and its range" \
			grep -Eq "^setdose: $opt wants a (whole )?number from [-0-9.e+]+ to [-0-9.e+]+, not '1e300'$" err.txt ;;
	esac
done <table.tsv
check "no option error created the database" test ! -e "$DB"

# A value is the next word, even one that looks like a global option.
DB=$TMP/opts.db
run 0 "$SD" --db "$DB" athlete add "Ona Bramblecote" --notes --no-color
run 0 "$SD" --db "$DB" athlete show "Ona Bramblecote"
has out '^notes: +--no-color$' "--notes took the next word, --no-color, as its value"
run 0 "$SD" --db "$DB" athlete add "Pim Harrowgate" --notes=--format
run 0 "$SD" athlete show "Pim Harrowgate" --db "$DB" --format csv
has out ',--format$' "--notes=VALUE works, and globals after the command still apply"
# Prefixes: unique ones work; one that fits two options is refused.
run 0 "$SD" --db "$DB" audit --sess 8 --summ "$ROOT/profiles/demo-minimal2.ini"
run 2 "$SD" --db "$DB" audit --s 8 "$ROOT/profiles/demo-minimal2.ini"
has err "^setdose: option '--s' is ambiguous: --summary or --swc|^setdose: option '--s' for 'audit' is ambiguous" "an ambiguous prefix is refused"
# After --, every word is an argument.
run 1 "$SD" --db "$DB" audit -- --summary
has err "cannot read program '--summary'|'--summary'" "after -- an option-looking word is a file name"
