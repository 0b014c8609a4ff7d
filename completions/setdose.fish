# fish completion for setdose. The candidates come from `setdose complete`, which reads the
# command table and, for athlete and template names, the database.
function __setdose_complete
	set -l words (commandline -opc) (commandline -ct)
	setdose complete -- $words[2..-1] 2>/dev/null
end
complete -c setdose -a '(__setdose_complete)'
