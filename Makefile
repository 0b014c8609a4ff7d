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
           libcairo2-dev libcmocka-dev libcjson-dev tmux sqlite3 valgrind poppler-utils

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

.PHONY: all deps check unit unit-asan cli cli-asan tui-test demo bench install uninstall clean help

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
	@sh tests/cli/run.sh $(RESULTS) $(CURDIR)/$(B)/setdose

tui-test: $(B)/setdose
	@mkdir -p $(dir $(RESULTS))
	@if ls tests/tui/t_*.sh >/dev/null 2>&1; then sh tests/tui/run.sh $(RESULTS) $(CURDIR)/$(B)/setdose; fi

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
