# setdose — build, test, install.  `make help` lists the targets.
PREFIX  ?= /usr/local
DESTDIR ?=
BINDIR   = $(PREFIX)/bin
MANDIR   = $(PREFIX)/share/man/man1
DATADIR  = $(PREFIX)/share/setdose

CC      ?= cc
B       ?= build
OPT     ?= -O2 -g
SAN     ?=
PKGS     = ncursesw sqlite3 gsl cairo libcjson
DEPS_DEB = build-essential pkg-config libncurses-dev libsqlite3-dev libiniparser-dev libgsl-dev \
           libcairo2-dev libcmocka-dev libcjson-dev tmux sqlite3 valgrind poppler-utils clang

PKG_CFLAGS := $(shell pkg-config --cflags $(PKGS) 2>/dev/null)
# Libraries whose Debian -dev package ships an archive are linked statically: every command is
# a short-lived process, and loading and binding some twenty shared objects (cairo alone pulls in
# pixman, freetype, fontconfig, png and the X11 client libraries) took longer than a whole audit.
# cJSON ships no archive and stays shared (glibc itself provides what libXdmcp once took from
# libbsd).
STATIC_LIBS = -lsqlite3 -lgsl -lgslcblas -liniparser -lncursesw -ltinfo \
              -lcairo -lpixman-1 -lfontconfig -lexpat -lfreetype -lpng16 -lz -lbrotlidec \
              -lbrotlicommon -lxcb-shm -lxcb-render -lXrender -lXext -lX11 -lxcb -lXau -lXdmcp
PKG_LIBS   := -Wl,-Bstatic $(STATIC_LIBS) -Wl,-Bdynamic -lcjson -lpthread -ldl
CFLAGS_ALL  = -std=c11 -D_GNU_SOURCE -Wall -Wextra -Werror \
              -Wshadow -Wno-format-truncation -MMD -MP $(OPT) $(SAN) $(PKG_CFLAGS) \
              -DSD_DATADIR='"$(DATADIR)"' $(CFLAGS)
LDLIBS_ALL  = $(PKG_LIBS) -lm $(LDLIBS)

SRC   := $(sort $(wildcard src/core/*.c src/io/*.c src/store/*.c src/cmd/*.c src/tui/*.c src/plot/*.c))
OBJ   := $(SRC:src/%.c=$(B)/obj/%.o)
TSRC  := $(sort $(wildcard tests/test_*.c))
TBIN  := $(TSRC:tests/%.c=$(B)/tests/%)
BSRC  := $(sort $(wildcard tests/bench/bench_*.c))
BBIN  := $(BSRC:tests/bench/%.c=$(B)/bench/%)

.PHONY: all deps check unit unit-asan cli cli-asan tui-test demo bench install uninstall clean help \
        fuzz fuzz-build fuzz-replay

all: $(B)/setdose

help:
	@echo "targets: deps all check demo bench install uninstall clean (PREFIX=$(PREFIX) DESTDIR=$(DESTDIR))"

deps:
	@if dpkg -s $(DEPS_DEB) >/dev/null 2>&1; then echo "deps: all packages present"; \
	else apt-get update && DEBIAN_FRONTEND=noninteractive apt-get install -y --no-install-recommends $(DEPS_DEB); fi

# The command is linked as a fixed-address executable: a position-independent one spends
# its start-up applying some six thousand relocations to the statically linked libraries,
# about a seventh of a whole audit on this machine class (make bench). Shared libraries and
# the stack are still randomised.
$(B)/setdose: $(B)/obj/main.o $(OBJ)
	$(CC) $(OPT) $(SAN) -no-pie -o $@ $^ $(LDLIBS_ALL)

$(B)/obj/%.o: src/%.c
	@mkdir -p $(dir $@)
	$(CC) $(CFLAGS_ALL) -c -o $@ $<

# The schema migrations db/NNN_*.sql are compiled in (db/embed.sh): the binary needs no SQL files.
$(B)/gen/schema.h: db/embed.sh $(sort $(wildcard db/0*.sql))
	@mkdir -p $(dir $@)
	sh db/embed.sh $(sort $(wildcard db/0*.sql)) >$@.tmp && mv $@.tmp $@
$(B)/obj/store/migrate.o: $(B)/gen/schema.h
$(B)/obj/store/migrate.o: CFLAGS_ALL += -I$(B)/gen

$(B)/tests/%: tests/%.c $(OBJ) tests/testutil.h
	@mkdir -p $(dir $@)
	$(CC) $(CFLAGS_ALL) -Isrc -o $@ $< $(OBJ) $(LDLIBS_ALL) -lcmocka

$(B)/bench/%: tests/bench/%.c $(OBJ)
	@mkdir -p $(dir $@)
	$(CC) $(CFLAGS_ALL) -Isrc -o $@ $< $(OBJ) $(LDLIBS_ALL)

# Unit tests (cmocka), the command-line tests against the real binary, then the same unit and
# command-line tests built with AddressSanitizer + UndefinedBehaviorSanitizer, then the tmux
# tests of the full-screen interface.  The last line is the total: "N passed, N failed".
check:
	@rm -f $(B)/results.txt
	@mkdir -p $(B)
	$(MAKE) unit cli || echo "make unit cli failed" >>$(B)/results.txt
	$(MAKE) B=build/asan OPT='-O1 -g -fno-omit-frame-pointer' \
	    SAN='-fsanitize=address,undefined -fno-sanitize-recover=all' unit cli \
	    RESULTS=$(CURDIR)/$(B)/results.txt || echo "make asan unit cli failed" >>$(B)/results.txt
	$(MAKE) tui-test || echo "make tui-test failed" >>$(B)/results.txt
	$(MAKE) fuzz-replay || echo "make fuzz-replay failed" >>$(B)/results.txt
	@sh tests/summary.sh $(B)/results.txt

RESULTS ?= $(CURDIR)/$(B)/results.txt
export ASAN_OPTIONS = detect_leaks=1:abort_on_error=1
export LSAN_OPTIONS = suppressions=$(CURDIR)/tests/lsan.supp
export UBSAN_OPTIONS = print_stacktrace=1:halt_on_error=1

unit: $(TBIN)
	@mkdir -p $(dir $(RESULTS))
	@sh tests/run_unit.sh $(RESULTS) $(TBIN)

cli: $(B)/setdose
	@mkdir -p $(dir $(RESULTS))
	@sh tests/cli/run.sh $(RESULTS) $(CURDIR)/$(B)/setdose $(T)

tui-test: $(B)/setdose
	@mkdir -p $(dir $(RESULTS))
	@if ls tests/tui/t_*.sh >/dev/null 2>&1; then sh tests/tui/run.sh $(RESULTS) $(CURDIR)/$(B)/setdose; fi

# libFuzzer harnesses (tests/fuzz/fuzz_*.c), built with clang, AddressSanitizer and
# UndefinedBehaviorSanitizer into build/fuzz. `make fuzz FUZZ_SECONDS=N` runs each target for N
# seconds, one after the other, on one core, growing build/fuzz/corpus/TARGET from the seeds in
# tests/fuzz/corpus/TARGET; an input that crashes is written to build/fuzz/crash-TARGET-* (copy
# it into tests/fuzz/crashes/TARGET once fixed). `make fuzz-replay` (part of `make check`) runs
# every seed and every input that ever crashed through the harnesses once; without clang it
# says so, and tests/cli/t_fuzzcorpus.sh replays them through the setdose binary instead.
FUZZ_TARGETS = program_ini program_csv library profile effects
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

demo: $(B)/setdose
	@sh tests/demo.sh $(CURDIR)/$(B)/setdose

bench: $(B)/setdose $(BBIN)
	@sh tests/bench/run.sh $(CURDIR)/$(B)/setdose $(CURDIR)/$(B)/bench

install: $(B)/setdose
	install -d $(DESTDIR)$(BINDIR) $(DESTDIR)$(MANDIR) $(DESTDIR)$(DATADIR)
	install -m 755 $(B)/setdose $(DESTDIR)$(BINDIR)/setdose
	install -m 644 man/setdose.1 $(DESTDIR)$(MANDIR)/setdose.1
	install -m 644 profiles/*.ini $(DESTDIR)$(DATADIR)/
	if ls profiles/*.csv >/dev/null 2>&1; then install -m 644 profiles/*.csv $(DESTDIR)$(DATADIR)/; fi
	if [ -f db/demo.sql ]; then install -m 644 db/*.sql $(DESTDIR)$(DATADIR)/; fi

uninstall:
	rm -f $(DESTDIR)$(BINDIR)/setdose $(DESTDIR)$(MANDIR)/setdose.1
	rm -rf $(DESTDIR)$(DATADIR)

clean:
	rm -rf build

-include $(OBJ:.o=.d) $(B)/obj/main.d
