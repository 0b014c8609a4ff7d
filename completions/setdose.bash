# bash completion for setdose. The candidates come from `setdose complete`, which reads the
# command table and, for athlete and template names, the database.
_setdose()
{
	local IFS=$'\n' cur=${COMP_WORDS[COMP_CWORD]}
	local -a cands
	cands=($(setdose complete -- "${COMP_WORDS[@]:1:COMP_CWORD}" 2>/dev/null))
	if [ ${#cands[@]} -eq 0 ]; then
		cands=($(compgen -f -- "$cur"))
	fi
	# Names may hold spaces: quote each for the command line.
	COMPREPLY=()
	local c
	for c in "${cands[@]}"; do
		COMPREPLY+=("$(printf '%q' "$c")")
	done
}
complete -F _setdose setdose
