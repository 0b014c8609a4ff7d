# Shared by t_writers.sh and t_diskfull.sh: every command that writes a file, run the same way.
# WRITER_KINDS lists them; `write KIND PATH [--force]` runs one.
WRITER_KINDS="png svg pdf report effects fit allot backup recover log"
P=$ROOT/profiles
R=$ROOT/tests/data/ref

# The inputs the writers read: a pre-post table, an athlete and a template in the database.
writer_inputs() {
	cut -d, -f1-6 "$R/romc_prepost.csv" >pp.csv
	"$SD" athlete add "Wren Calloway" --notes "invented athlete" >/dev/null
	"$SD" program add "$P/demo-minimal2.ini" >/dev/null
	printf 'date,exercise,sets,reps,load,effort\n2026-03-02,bench press,3,5,80kg,RIR 2\n' >log-in.csv
	SETDOSE_TODAY=2026-03-02 "$SD" log import log-in.csv --athlete "Wren Calloway" >/dev/null
}

# write KIND PATH [--force]: runs the writer of KIND into PATH.
write() {
	kind=$1 path=$2 force=$3
	case $kind in
	png|svg|pdf) "$SD" chart $force --out "$path" --program "$P/demo-minimal2.ini" ;;
	report) "$SD" report $force --out "$path" "$P/demo-minimal2.ini" ;;
	effects) "$SD" effects $force --output "$path" pp.csv ;;
	fit) "$SD" fit $force --write "$path" "$R/sim_reciprocal_effects.csv" ;;
	allot) "$SD" allot $force --budget 12 --write "$path" ;;
	backup) "$SD" db backup $force "$path" ;;
	recover) "$SD" db recover $force "$path" ;;
	log) "$SD" log export $force --out "$path" ;;
	esac
}
# The file name each kind writes, and what its success line says.
ext() { case $1 in png|svg|pdf) echo "$1" ;; report) echo pdf ;; effects|log) echo csv ;;
	fit|allot) echo ini ;; *) echo db ;; esac; }
said() { case $1 in png|svg|pdf|report|fit) echo "^wrote|wrote profile" ;;
	effects) echo "^wrote 5 pre-post" ;; allot) echo "weekly set budget|hard sets" ;;
	backup) echo "^backed up .* \(copy checked\)$" ;; recover) echo "^recovered [0-9]+ rows" ;;
	log) echo "^wrote .* \(1 row\)$" ;; esac; }

