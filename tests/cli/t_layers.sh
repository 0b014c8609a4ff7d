# The layering rules of DEVELOPERS.md, read from the sources: the interface and the commands
# share src/app and never include each other (but for browse.c, the entry point of the
# interface); cJSON, SQLite and ncurses stay in their modules.
S=$ROOT/src
check "no file in src/tui includes src/cmd" sh -c "! grep -l '#include \"../cmd/' '$S'/tui/*.[ch]"
check "only cmd/browse.c includes src/tui" sh -c "test \"\$(grep -l '#include \"../tui/' '$S'/cmd/*.[ch])\" = '$S/cmd/browse.c'"
check "src/app includes neither src/cmd nor src/tui" sh -c "! grep -lE '#include \"../(cmd|tui)/' '$S'/app/*.[ch]"
check "cJSON only in src/io" sh -c "! grep -rl 'cjson/cJSON.h\|io/jsonout.h\|io/recout_json.h' '$S'/cmd '$S'/tui '$S'/app '$S'/core '$S'/store '$S'/main.c"
check "SQLite only in src/store" sh -c "! grep -rl 'sqlite3.h' '$S'/cmd '$S'/tui '$S'/app '$S'/core '$S'/io '$S'/main.c"
check "ncurses only in src/tui" sh -c "! grep -rlE 'curses.h' '$S'/cmd '$S'/app '$S'/core '$S'/io '$S'/store '$S'/main.c"
check "src/core does no I/O (no stdio file calls)" sh -c "! grep -lE '\\b(fopen|fprintf|printf|fputs|puts)\\(' '$S'/core/*.c"
check "no getopt anywhere: one option layer" sh -c "! grep -rl 'getopt' '$S'"
check "the week limit is written once (core/limits.h)" sh -c "test \"\$(grep -rlw 104 '$S' --include=*.[ch] | grep -v '/mr_')\" = '$S/core/limits.h'"
