# The completion scripts (completions/) run in their own shells and complete a command, an
# option and a stored athlete name (invented) from the command table and the database.
PATH=$(dirname "$SD"):$PATH
export PATH
C=$ROOT/completions
run 0 "$SD" athlete add "Ida Fernhollow"
run 0 "$SD" program add "$ROOT/profiles/demo-minimal2.ini"

bashc() { # WORDS...: the completions bash offers for the last word
	bash --norc --noprofile -c '. "$0"; COMP_WORDS=("$@"); COMP_CWORD=$(($# - 1)); _setdose
		printf "%s\n" "${COMPREPLY[@]}"' "$C/setdose.bash" setdose "$@" >"$TMP/out" 2>"$TMP/err"
}
bashc bl
has out '^block$' "bash: 'bl' completes to the command block"
bashc audit --sess
has out '^--session-cap$' "bash: an option of the command"
bashc block add Ida
has out '^Ida\\ Fernhollow$' "bash: a stored athlete name, quoted for the shell"
bashc block add 'Ida\ Fernhollow' Tide
has out '^Tidewater\\ minimal\\,\\ two\\ days$' "bash: a stored template as the second argument"

if command -v zsh >/dev/null; then
	zshc() {
		zsh -f -c 'compadd() { [[ $1 == -- ]] && shift; print -rl -- "$@"; }
			_files() { print FILES; }
			words=("$@"); CURRENT=$#; source "$0"' "$C/_setdose" setdose "$@" >"$TMP/out" 2>"$TMP/err"
	}
	zshc bl
	has out '^block$' "zsh: 'bl' completes to the command block"
	zshc compare --again
	has out '^--against-first$' "zsh: an option of the command"
	zshc test list I
	has out '^Ida Fernhollow$' "zsh: a stored athlete name"
	zshc audit prof
	has out '^FILES$' "zsh: a program file argument falls back to file names"
else
	check "zsh is installed (make deps)" false
fi

if command -v fish >/dev/null; then
	fishc() { HOME=$TMP fish --no-config -c "source $C/setdose.fish; complete -C '$1'" >"$TMP/out" 2>"$TMP/err"; }
	fishc "setdose bl"
	has out '^block' "fish: 'bl' completes to the command block"
	fishc "setdose block add --ov"
	has out '^--overlap' "fish: an option of the subcommand"
	fishc "setdose response I"
	has out '^Ida Fernhollow' "fish: a stored athlete name"
else
	check "fish is installed (make deps)" false
fi
