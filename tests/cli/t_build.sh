# The binary is built as Debian hardens its packages (dpkg-buildflags, hardening=+all) and links
# the system's shared libraries; the chart backend is a module loaded only to draw.
# readelf stands in for devscripts' hardening-check, which needs perl modules CI lacks.
MOD=$(dirname "$SD")/lib/setdose/chart.so
readelf -h -l -d --dyn-syms -W "$SD" >"$TMP/out" 2>"$TMP/err"
has out 'Type: +DYN' "position-independent executable (ELF type DYN)"
has out 'FLAGS_1.*PIE' "PIE flag in the dynamic section"
has out 'GNU_RELRO' "RELRO segment"
has out 'BIND_NOW|FLAGS.*NOW' "immediate binding (BIND_NOW)"
has out '__stack_chk_fail' "stack protector (__stack_chk_fail referenced)"
has out '__[a-z]*printf_chk|__mem[a-z]*_chk|__str[a-z]*_chk' "fortify (_chk functions referenced)"
has out 'NEEDED.*libsqlite3\.so' "SQLite is the system's shared library"
has out 'NEEDED.*libgsl\.so' "GSL is the system's shared library"
hasnt out 'NEEDED.*libcairo' "cairo is not loaded at start-up (only by the chart module)"
hasnt out 'TEXTREL' "no text relocations"
readelf -d -l -W "$MOD" >"$TMP/out" 2>"$TMP/err"
has out 'NEEDED.*libcairo\.so' "the chart module links the system's cairo"
has out 'BIND_NOW|FLAGS.*NOW' "the chart module is bound at load (BIND_NOW)"
has out 'GNU_RELRO' "the chart module has a RELRO segment"
run 0 "$SD" --version
has out '^setdose [0-9]+\.[0-9]+\.[0-9]+ \(database schema [0-9]+\)$' "--version names the schema version"
