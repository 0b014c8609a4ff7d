# setdose — build, test, install.  `make help` lists the targets.
PREFIX  ?= /usr/local
DESTDIR ?=
BINDIR   = $(PREFIX)/bin
MANDIR   = $(PREFIX)/share/man/man1
DATADIR  = $(PREFIX)/share/setdose
LIBDIR   = $(PREFIX)/lib/setdose
# Where each shell looks for completions of installed programs (Debian's paths).
BASHCOMPDIR = $(PREFIX)/share/bash-completion/completions
ZSHCOMPDIR  = $(PREFIX)/share/zsh/vendor-completions
FISHCOMPDIR = $(PREFIX)/share/fish/vendor_completions.d

CC      ?= cc
B       ?= build
OPT     ?= -O2 -g
SAN     ?=
PKGS     = ncursesw sqlite3 gsl libcjson
MOD_PKGS = cairo fontconfig
DEPS_DEB = build-essential pkg-config libncurses-dev libsqlite3-dev libiniparser-dev libgsl-dev \
           libcairo2-dev libcmocka-dev libcjson-dev tmux sqlite3 valgrind poppler-utils clang \
           zsh fish mandoc dpkg-dev

# Every flag that asks pkg-config or dpkg-buildflags is a recursive (=) variable, evaluated when a
# recipe first uses it: `make deps demo` installs the packages before anything asks for their
# flags, so a fresh machine builds in one invocation.
# once = $(eval ...) computes the value at first use and keeps it for the rest of the run.
PKG_CFLAGS  = $(eval PKG_CFLAGS := $(shell pkg-config --cflags $(PKGS) $(MOD_PKGS) 2>/dev/null))$(PKG_CFLAGS)
PKG_LIBS    = $(eval PKG_LIBS := $(shell pkg-config --libs $(PKGS) 2>/dev/null) -liniparser -ldl)$(PKG_LIBS)
MOD_LIBS    = $(eval MOD_LIBS := $(shell pkg-config --libs $(MOD_PKGS) 2>/dev/null))$(MOD_LIBS)

# Hardened as Debian packages are (dpkg-buildflags, hardening=+all): stack protector, fortify,
# format-security, RELRO with immediate binding; position-independent code and executable.
# Shared system libraries, so a security update of SQLite, libpng or cairo reaches setdose;
# --as-needed keeps only the libraries the binary really calls. HARDEN= (empty) builds without
# the dpkg flags (for a machine without dpkg-dev); nothing else turns the protections off.
HARDEN     ?= 1
DPKG_FLAGS  = DEB_BUILD_MAINT_OPTIONS=hardening=+all dpkg-buildflags
HARD_CFLAGS = $(eval HARD_CFLAGS := $(if $(HARDEN),$(filter-out -O% -g -ffile-prefix-map=%,\
                $(shell $(DPKG_FLAGS) --get CFLAGS 2>/dev/null) \
                $(shell $(DPKG_FLAGS) --get CPPFLAGS 2>/dev/null))))$(HARD_CFLAGS)
HARD_LDFLAGS = $(eval HARD_LDFLAGS := $(if $(HARDEN),$(shell $(DPKG_FLAGS) --get LDFLAGS 2>/dev/null)))$(HARD_LDFLAGS)

# Warnings: the same set for gcc and clang. -Werror only when asked (WERROR=1, as CI does), so a
# newer compiler's new warning does not stop a user's build.
WERROR     ?=
WARN        = -Wall -Wextra -Wshadow $(if $(WERROR),-Werror) $(WARN_CC)
WARN_CC     = $(eval WARN_CC := $(if $(findstring clang,$(shell $(CC) --version 2>/dev/null | head -n 1)),\
                $(CLANG_DWARF),-Wno-format-truncation))$(WARN_CC)
# clang 14 writes DWARF 5, which Debian 12's valgrind (3.19) cannot read: the valgrind tests of a
# clang build need DWARF 4.
CLANG_DWARF = -gdwarf-4
CFLAGS_ALL  = -std=c11 -D_GNU_SOURCE $(WARN) -fPIC -MMD -MP $(OPT) $(HARD_CFLAGS) $(SAN) \
              $(PKG_CFLAGS) -DSD_DATADIR='"$(DATADIR)"' -DSD_LIBDIR='"$(LIBDIR)"' $(CFLAGS)
LDFLAGS_ALL = -pie -Wl,--as-needed $(HARD_LDFLAGS) $(LDFLAGS)
LDLIBS_ALL  = $(PKG_LIBS) -lm $(LDLIBS)

# src/plot/chart.c and the drawing files beside it are the chart module (plot/chart_mod.h),
# loaded only when a chart is drawn; chart_fmt.c is in both (names checked before loading).
MODSRC = src/plot/chart.c src/plot/chart_draw.c src/plot/chart_curve.c src/plot/chart_rows.c \
         src/plot/chart_returns.c src/plot/chart_report.c
MODOBJ = $(MODSRC:src/%.c=$(B)/obj/%.o)
SRC   := $(filter-out $(MODSRC),$(sort $(wildcard src/core/*.c src/app/*.c src/io/*.c src/store/*.c src/cmd/*.c \
         src/tui/*.c src/plot/*.c)))
OBJ   := $(SRC:src/%.c=$(B)/obj/%.o)
COREOBJ := $(filter $(B)/obj/core/% $(B)/obj/io/%,$(OBJ))
MOD    = $(B)/lib/setdose/chart.so
TSRC  := $(sort $(wildcard tests/test_*.c))
TBIN  := $(TSRC:tests/%.c=$(B)/tests/%)
BSRC  := $(sort $(wildcard tests/bench/bench_*.c))
BBIN  := $(BSRC:tests/bench/%.c=$(B)/bench/%)

.PHONY: all deps check unit unit-asan cli cli-asan tui-test demo bench install uninstall clean help \
        fuzz fuzz-build fuzz-replay check-plain check-asan FORCE

all: $(B)/setdose $(MOD)

help:
	@echo "targets: deps all check demo bench install uninstall clean (PREFIX=$(PREFIX) DESTDIR=$(DESTDIR))"

deps:
	@if dpkg -s $(DEPS_DEB) >/dev/null 2>&1; then echo "deps: all packages present"; \
	else apt-get update && DEBIAN_FRONTEND=noninteractive apt-get install -y --no-install-recommends $(DEPS_DEB); fi

$(B)/setdose: $(B)/obj/main.o $(OBJ)
	$(CC) $(OPT) $(SAN) $(LDFLAGS_ALL) -o $@ $^ $(LDLIBS_ALL)

# The module carries its own copy of the core code it calls (from an archive, so only what it
# uses); the executable exports nothing, so neither binds to the other's copy. -Bsymbolic binds
# the module's own functions to themselves, never to a same-named one loaded before (ncurses).
$(MOD): $(MODOBJ) $(B)/obj/plot/chart_fmt.o $(B)/libcore.a
	@mkdir -p $(dir $@)
	$(CC) $(OPT) $(SAN) -shared -Wl,--as-needed -Wl,-Bsymbolic $(HARD_LDFLAGS) $(LDFLAGS) \
	    $(MOD_NOUNDEF) -o $@ $^ $(MOD_LIBS) $(PKG_LIBS) -lm
# Every symbol of the module resolved at link time, except in sanitizer builds: clang leaves the
# sanitizer runtime to the executable, which provides it when the module is loaded.
MOD_NOUNDEF = $(if $(SAN),,-Wl,--no-undefined)
$(B)/libcore.a: $(COREOBJ)
	rm -f $@ && ar rcs $@ $^

$(B)/obj/%.o: src/%.c
	@mkdir -p $(dir $@)
	$(CC) $(CFLAGS_ALL) -c -o $@ $<

# The files that compile in an installation folder are rebuilt when PREFIX changes, so
# `make install PREFIX=/usr` never installs a binary that looks in /usr/local.
$(B)/prefix.stamp: FORCE
	@mkdir -p $(B)
	@echo '$(DATADIR) $(LIBDIR)' | cmp -s - $@ || echo '$(DATADIR) $(LIBDIR)' >$@
$(B)/obj/main.o $(B)/obj/plot/chart_load.o: $(B)/prefix.stamp
FORCE:

# The schema migrations db/NNN_*.sql are compiled in (db/embed.sh): the binary needs no SQL files.
$(B)/gen/schema.h: db/embed.sh $(sort $(wildcard db/0*.sql))
	@mkdir -p $(dir $@)
	sh db/embed.sh $(sort $(wildcard db/0*.sql)) >$@.tmp && mv $@.tmp $@
$(B)/obj/store/migrate.o: $(B)/gen/schema.h
$(B)/obj/store/migrate.o: CFLAGS_ALL += -I$(B)/gen

$(B)/tests/%: tests/%.c $(OBJ) tests/testutil.h
	@mkdir -p $(dir $@)
	$(CC) $(CFLAGS_ALL) $(LDFLAGS_ALL) -Isrc -o $@ $< $(OBJ) $(LDLIBS_ALL) -lcmocka

$(B)/bench/%: tests/bench/%.c $(OBJ)
	@mkdir -p $(dir $@)
	$(CC) $(CFLAGS_ALL) $(LDFLAGS_ALL) -Isrc -o $@ $< $(OBJ) $(LDLIBS_ALL)

# Unit tests (cmocka) and the command-line tests against the real binary, once as built and once
# with AddressSanitizer + UndefinedBehaviorSanitizer (in $(B)/asan), the two side by side
# (make -j2: they share nothing but the results file, appended a line at a time); then the tmux
# tests of the full-screen interface and the fuzz replay, alone, as they watch the clock.
# The last line is the total: "N passed, N failed".
ASAN_B = $(B)/asan
check:
	@rm -f $(B)/results.txt
	@mkdir -p $(B)
	-$(MAKE) -j2 --no-print-directory check-plain check-asan
	$(MAKE) tui-test || echo "make tui-test failed" >>$(B)/results.txt
	$(MAKE) fuzz-replay || echo "make fuzz-replay failed" >>$(B)/results.txt
	@sh tests/summary.sh $(B)/results.txt

check-plain:
	$(MAKE) unit cli RESULTS=$(CURDIR)/$(B)/results.txt || echo "make unit cli failed" >>$(B)/results.txt
check-asan:
	$(MAKE) B=$(ASAN_B) OPT='-O1 -g -fno-omit-frame-pointer' \
	    SAN='-fsanitize=address,undefined -fno-sanitize-recover=all' unit cli \
	    RESULTS=$(CURDIR)/$(B)/results.txt || echo "make asan unit cli failed" >>$(B)/results.txt

RESULTS ?= $(CURDIR)/$(B)/results.txt
export ASAN_OPTIONS = detect_leaks=1:abort_on_error=1
export LSAN_OPTIONS = suppressions=$(CURDIR)/tests/lsan.supp
export UBSAN_OPTIONS = print_stacktrace=1:halt_on_error=1

unit: $(TBIN)
	@mkdir -p $(dir $(RESULTS))
	@sh tests/run_unit.sh $(RESULTS) $(TBIN)

cli: $(B)/setdose $(MOD)
	@mkdir -p $(dir $(RESULTS))
	@sh tests/cli/run.sh $(RESULTS) $(CURDIR)/$(B)/setdose $(T)

tui-test: $(B)/setdose $(MOD)
	@mkdir -p $(dir $(RESULTS))
	@if ls tests/tui/t_*.sh >/dev/null 2>&1; then sh tests/tui/run.sh $(RESULTS) $(CURDIR)/$(B)/setdose; fi

# libFuzzer harnesses (tests/fuzz/fuzz_*.c), built with clang, AddressSanitizer and
# UndefinedBehaviorSanitizer into build/fuzz. `make fuzz FUZZ_SECONDS=N` runs each target for N
# seconds, one after the other, on one core, growing build/fuzz/corpus/TARGET from the seeds in
# tests/fuzz/corpus/TARGET; an input that crashes is written to build/fuzz/crash-TARGET-* (copy
# it into tests/fuzz/crashes/TARGET once fixed). `make fuzz-replay` (part of `make check`) runs
# every seed and every input that ever crashed through the harnesses once; without clang it
# says so, and tests/cli/t_fuzzcorpus.sh replays them through the setdose binary instead.
FUZZ_TARGETS = program_ini program_csv library profile effects log
FUZZ_SECONDS ?= 60
FUZZ_B       = build/fuzz
FUZZ_BINS    = $(FUZZ_TARGETS:%=$(FUZZ_B)/bin/fuzz_%)
FUZZ_SAN     = -fsanitize=address,undefined -fno-sanitize-recover=all
FUZZ_FLAGS   = -Isrc -Itests/fuzz -DFUZZ_DATADIR='"$(CURDIR)/profiles"'

fuzz-build:
	@command -v clang >/dev/null || { echo "fuzz: needs clang (apt-get install clang)"; exit 1; }
	$(MAKE) B=$(FUZZ_B) CC=clang OPT='-O1 -g -fno-omit-frame-pointer' \
	    SAN='$(FUZZ_SAN) -fsanitize=fuzzer-no-link' CFLAGS=-Wno-unknown-warning-option $(FUZZ_BINS)

$(FUZZ_B)/bin/fuzz_program_ini: tests/fuzz/fuzz_program.c tests/fuzz/fuzz.h $(OBJ)
	@mkdir -p $(dir $@)
	$(CC) $(CFLAGS_ALL) $(FUZZ_FLAGS) -DFUZZ_CSV=0 -fsanitize=fuzzer -o $@ $< $(OBJ) $(LDLIBS_ALL)
$(FUZZ_B)/bin/fuzz_program_csv: tests/fuzz/fuzz_program.c tests/fuzz/fuzz.h $(OBJ)
	@mkdir -p $(dir $@)
	$(CC) $(CFLAGS_ALL) $(FUZZ_FLAGS) -DFUZZ_CSV=1 -fsanitize=fuzzer -o $@ $< $(OBJ) $(LDLIBS_ALL)
$(FUZZ_B)/bin/fuzz_%: tests/fuzz/fuzz_%.c tests/fuzz/fuzz.h $(OBJ)
	@mkdir -p $(dir $@)
	$(CC) $(CFLAGS_ALL) $(FUZZ_FLAGS) -fsanitize=fuzzer -o $@ $< $(OBJ) $(LDLIBS_ALL)

fuzz: fuzz-build
	@for t in $(FUZZ_TARGETS); do \
	    mkdir -p $(FUZZ_B)/corpus/$$t tests/fuzz/crashes/$$t; \
	    echo "== fuzz $$t for $(FUZZ_SECONDS) s"; \
	    $(FUZZ_B)/bin/fuzz_$$t -max_total_time=$(FUZZ_SECONDS) -timeout=10 -rss_limit_mb=1024 \
	        -print_final_stats=1 -artifact_prefix=$(FUZZ_B)/crash-$$t- \
	        $(FUZZ_B)/corpus/$$t tests/fuzz/corpus/$$t tests/fuzz/crashes/$$t 2>&1 | \
	        grep -E '^(stat::number_of_executed_units|stat::average_exec_per_sec|stat::new_units_added|==[0-9]+==|SUMMARY|Done)' ; \
	done

fuzz-replay:
	@mkdir -p $(dir $(RESULTS))
	@if command -v clang >/dev/null; then \
	    $(MAKE) fuzz-build >$(FUZZ_B).log 2>&1 || { echo "fuzz build (see $(FUZZ_B).log) failed" >>$(RESULTS); exit 1; }; \
	    for t in $(FUZZ_TARGETS); do \
	        if $(FUZZ_B)/bin/fuzz_$$t -runs=0 tests/fuzz/corpus/$$t tests/fuzz/crashes/$$t >$(FUZZ_B)/replay-$$t.log 2>&1; \
	        then echo "fuzz replay $$t: seeds and past crashes passed" >>$(RESULTS); \
	        else echo "fuzz replay $$t: seeds and past crashes (see $(FUZZ_B)/replay-$$t.log) failed" >>$(RESULTS); fi; \
	    done; \
	else echo "fuzz replay: no clang; the corpus is replayed through setdose by tests/cli/t_fuzzcorpus.sh"; fi

demo: $(B)/setdose $(MOD)
	@sh tests/demo.sh $(CURDIR)/$(B)/setdose

bench: $(B)/setdose $(MOD) $(BBIN)
	@sh tests/bench/run.sh $(CURDIR)/$(B)/setdose $(CURDIR)/$(B)/bench

install: $(B)/setdose $(MOD) $(MOD)
	install -d $(DESTDIR)$(BINDIR) $(DESTDIR)$(MANDIR) $(DESTDIR)$(DATADIR)
	install -m 755 $(B)/setdose $(DESTDIR)$(BINDIR)/setdose
	install -d $(DESTDIR)$(LIBDIR)
	install -m 644 $(MOD) $(DESTDIR)$(LIBDIR)/chart.so
	install -d $(DESTDIR)$(BASHCOMPDIR) $(DESTDIR)$(ZSHCOMPDIR) $(DESTDIR)$(FISHCOMPDIR)
	install -m 644 completions/setdose.bash $(DESTDIR)$(BASHCOMPDIR)/setdose
	install -m 644 completions/_setdose $(DESTDIR)$(ZSHCOMPDIR)/_setdose
	install -m 644 completions/setdose.fish $(DESTDIR)$(FISHCOMPDIR)/setdose.fish
	install -m 644 man/setdose.1 $(DESTDIR)$(MANDIR)/setdose.1
	install -m 644 profiles/*.ini $(DESTDIR)$(DATADIR)/
	if ls profiles/*.csv >/dev/null 2>&1; then install -m 644 profiles/*.csv $(DESTDIR)$(DATADIR)/; fi
	if [ -f db/demo.sql ]; then install -m 644 db/*.sql $(DESTDIR)$(DATADIR)/; fi

uninstall:
	rm -f $(DESTDIR)$(BINDIR)/setdose $(DESTDIR)$(MANDIR)/setdose.1
	rm -f $(DESTDIR)$(BASHCOMPDIR)/setdose $(DESTDIR)$(ZSHCOMPDIR)/_setdose \
	    $(DESTDIR)$(FISHCOMPDIR)/setdose.fish
	rm -rf $(DESTDIR)$(DATADIR) $(DESTDIR)$(LIBDIR)

clean:
	rm -rf build

-include $(OBJ:.o=.d) $(B)/obj/main.d $(B)/obj/plot/chart.d
