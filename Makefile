# swaysheet: see README.md. Every target runs from a clean clone.
SHELL := /bin/bash
GO ?= go
GOROOT := $(shell $(GO) env GOROOT)
WASM_EXEC := $(GOROOT)/lib/wasm/go_js_wasm_exec
OUT := out
ADDR ?= 127.0.0.1:8080

.PHONY: all test test-go test-wasm test-browser deps vet serve wasm examples bench scipy-deps reference planned fuzz fuzz-long hostile dist single-wasm clean

all: test

# System packages the tests need (Debian): chromium for browser tests,
# poppler-utils for the print tests. Installed only when missing. The
# browser tests' accessibility checks run axe-core from the npm registry,
# installed into out/axe (never committed; web/browsertest installs it
# too when it is missing; keep the version in step with axeVersion there).
AXE_VERSION := 4.10.3
AXE := $(OUT)/axe/node_modules/axe-core/axe.min.js
deps:
	@need=""; \
	command -v chromium >/dev/null 2>&1 || need="$$need chromium"; \
	command -v pdfinfo >/dev/null 2>&1 || need="$$need poppler-utils"; \
	command -v pdftoppm >/dev/null 2>&1 || need="$$need poppler-utils"; \
	command -v npm >/dev/null 2>&1 || need="$$need npm"; \
	if [ -n "$$need" ]; then \
	  echo "installing:$$need"; \
	  if [ "$$(id -u)" = 0 ]; then apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq $$need; \
	  else sudo apt-get update -qq && sudo DEBIAN_FRONTEND=noninteractive apt-get install -y -qq $$need; fi; \
	fi
	$(GO) mod download
	@test -f $(AXE) || { echo "installing: axe-core $(AXE_VERSION) (npm, into $(OUT)/axe)"; \
	  npm install --prefix $(OUT)/axe --no-audit --no-fund --no-save axe-core@$(AXE_VERSION); }

vet:
	$(GO) vet ./...
	@out=$$(gofmt -l core wasm web 2>/dev/null); if [ -n "$$out" ]; then echo "gofmt needed: $$out"; exit 1; fi

# Every test: unit and physics tests, the core built for js/wasm, wasm tests
# under node, browser tests in headless Chromium.
test: deps vet test-go test-wasm test-browser fuzz

test-go:
	$(GO) test ./...

# Each test binary is packed first, as the page's wasm is (swaypack
# -exec: direct jumps, wasm loops, data joined), so the wasm tests run
# that code.
test-wasm:
	GOOS=js GOARCH=wasm $(GO) build ./core/...
	@mkdir -p $(OUT)
	$(GO) build -o $(OUT)/swaypack ./web/cmd/swaypack
	GOOS=js GOARCH=wasm $(GO) test -exec="$(CURDIR)/$(OUT)/swaypack -exec $(WASM_EXEC)" ./core/... $(if $(wildcard wasm/*.go),./wasm/...)

# Browser tests: headless Chromium driven from Go (web/browsertest, and
# web/sheettest for the printed check sheet, offline use and the single
# file). The tests build the wasm themselves; screenshots and the printed
# sheets (PDF, PNG) go to out/browser/.
test-browser:
	SWAYSHEET_BROWSER=1 $(GO) test -p 1 -count=1 -timeout 15m ./web/browsertest/ ./web/sheettest/

# The wasm embeds the example scenarios for pages opened from a file, as
# one file (wasm/bridge/examples.json: each file's name and its text as it
# is); a test in wasm/bridge fails when it differs from testdata/scenarios.
examples:
	@set -e; LC_ALL=C; sep=''; { printf '['; for f in testdata/scenarios/*.json; do \
	  printf '%s\n{"file": "%s", "scenario": ' "$$sep" "$${f##*/}"; cat "$$f"; printf '}'; sep=','; \
	done; printf '\n]\n'; } > wasm/bridge/examples.json
	@echo "wrote wasm/bridge/examples.json"

# The page's build output: the wasm (the core, with no net/http), the
# small fetch wasm for the site library (wasm/fetch: tinyutil's httputil,
# loaded only when the library is opened) and Go's matching wasm_exec.js. -s -w
# leave out the wasm's name section (function names for the browser's
# debugger, about 40 KB gzipped); Go's own panics and stack traces still
# name functions (they read Go's function table, not that section).
# NOINLINE: packages of the main wasm compiled without inlining (-l):
# they run once a call, not in the simulation's loops, and Go's wasm code
# pays for each inlined copy (about 85 kB gzipped; see web/dist/gcflags.go,
# which holds the same list for the tests).
NOINLINE := swaysheet/core/sheet swaysheet/core/scenario swaysheet/core/figures swaysheet/core/words swaysheet/core/units swaysheet/core/ropelength swaysheet/core/qr swaysheet/wasm/bridge swaysheet/core/crane swaysheet/core/motion swaysheet/core/version swaysheet/core/internal/sorts fmt encoding/json reflect strings strconv unicode/utf8 bytes internal/reflectlite internal/fmtsort compress/flate encoding/csv bufio syscall/js
WASM_GCFLAGS := $(foreach p,$(NOINLINE),-gcflags=$(p)=-l)
wasm:
	@mkdir -p $(OUT)/web
	rm -f $(OUT)/web/swaysheet.wasm $(OUT)/web/swayfetch.wasm
	GOOS=js GOARCH=wasm $(GO) build -trimpath $(WASM_GCFLAGS) -ldflags='-s -w' -o $(OUT)/web/swaysheet.wasm ./wasm
	$(GO) run ./web/cmd/swaypack $(OUT)/web/swaysheet.wasm
	GOOS=js GOARCH=wasm $(GO) build -trimpath -ldflags='-s -w' -o $(OUT)/web/swayfetch.wasm ./wasm/fetch
	$(GO) run ./web/cmd/swaypack $(OUT)/web/swayfetch.wasm
	cp "$(GOROOT)/lib/wasm/wasm_exec.js" $(OUT)/web/wasm_exec.js

# The wasm of the single-file page: no fetch at all (a page opened from a
# file has no origin to fetch from; the examples are the copies inside it,
# and there is no site library), symbols stripped. Every wasm file is
# packed (swaypack, web/dist.Pack): its jumps made direct branches and its
# for loops wasm loops (about 15 to 25 % faster under node) and its data
# segments joined (the same memory at start, about 6 % less gzipped).
# A packed file keeps Go's build ID, so go build would take it for up to
# date and leave it as the last pack made it: each is removed first.
single-wasm:
	@mkdir -p $(OUT)/single
	rm -f $(OUT)/single/swaysheet.wasm
	GOOS=js GOARCH=wasm $(GO) build -trimpath -tags nofetch $(WASM_GCFLAGS) -ldflags='-s -w' -o $(OUT)/single/swaysheet.wasm ./wasm
	$(GO) run ./web/cmd/swaypack $(OUT)/single/swaysheet.wasm

# dist/web: the page to host on any web server (with its service worker);
# dist/swaysheet.html: one file, the wasm inside, that opens from a file.
# The single file's wasm is gzipped with zopfli (Debian's zopfli,
# installed when missing; about 5 % smaller than gzip -9).
dist: wasm single-wasm
	@command -v zopfli >/dev/null 2>&1 || { echo "installing: zopfli"; \
	  if [ "$$(id -u)" = 0 ]; then apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq zopfli; \
	  else sudo apt-get update -qq && sudo DEBIAN_FRONTEND=noninteractive apt-get install -y -qq zopfli; fi; }
	zopfli -c --i5 $(OUT)/single/swaysheet.wasm > $(OUT)/single/swaysheet.wasm.gz
	$(GO) run ./web/cmd/swaydist -build $(OUT)/web -single-wasm $(OUT)/single/swaysheet.wasm -single-gz $(OUT)/single/swaysheet.wasm.gz -out dist

# Build the wasm and serve the page on 127.0.0.1 (ADDR=127.0.0.1:PORT to move it).
serve: wasm
	$(GO) run ./web/serve -addr $(ADDR) -build $(OUT)/web

# Fuzz targets, each for FUZZTIME (go test -fuzz takes one target at a time).
# Seeds: every scenario file plus core/*/testdata/fuzz/. A failing input is
# written to the package's testdata/fuzz/FuzzX/ and fails the run.
# Go 1.26's fuzz coordinator can report "context deadline exceeded" as a
# failure when FUZZTIME ends while a worker is mid-input (golang/go#75804,
# fixed in Go 1.27): with nothing else wrong (no failing input written, no
# panic or test error), that one line is said and the target run again
# once; any other failure, or the same twice, fails the run.
FUZZTIME ?= 10s
FUZZ_TARGETS := core/scenario:FuzzParse core/scenario:FuzzKeyScan core/sway:FuzzEvaluate core/motion:FuzzParseCSV \
	core/plan:FuzzPlan core/plan:FuzzPlanValues core/ropelength:FuzzParse
fuzz:
	@set -e; log=$$(mktemp); trap 'rm -f $$log' EXIT; for t in $(FUZZ_TARGETS); do \
	  for try in 1 2; do \
	    echo "fuzz $${t#*:} ($(FUZZTIME))"; \
	    if $(GO) test -run '^$$' -fuzz "^$${t#*:}\$$" -fuzztime $(FUZZTIME) ./$${t%%:*} 2>&1 | tee $$log; [ $${PIPESTATUS[0]} = 0 ]; then break; fi; \
	    if [ $$try = 1 ] && grep -q 'context deadline exceeded' $$log && \
	       ! grep -qE 'Failing input written|panic:|_test\.go:[0-9]+:' $$log; then \
	      echo "fuzz $${t#*:}: the fuzz coordinator's end-of-time race (golang/go#75804), no failing input: run again"; continue; fi; \
	    exit 1; \
	  done; \
	done

# Each target for at least FUZZLONG executions, one at a time and niced (CPU
# heavy: hours on two cores; not part of `make test`). The README's "Bad
# input" section records the last run.
FUZZLONG ?= 1000000x
fuzz-long:
	@set -e; for t in $(FUZZ_TARGETS); do \
	  echo "fuzz $${t#*:} ($(FUZZLONG))"; \
	  nice -n 19 $(GO) test -run '^$$' -fuzz "^$${t#*:}\$$" -fuzztime $(FUZZLONG) -timeout 0 ./$${t%%:*}; \
	done

# Hostile inputs (testdata/hostile/hostile.py): files built to make the
# core work as long as it can; times the command line on each, fails when
# one takes more than 10 s. Not part of `make test` (timing is for bench).
hostile:
	@mkdir -p $(OUT)/hostile
	$(GO) build -o $(OUT)/hostile/swaysheet ./core/cmd/swaysheet
	$(PYTHON_REF) testdata/hostile/hostile.py $(OUT)/hostile $(OUT)/hostile/swaysheet

# Regenerate testdata/reference/results.json, results_double.json (hook
# block and rigging) and results_rigid.json (rigid loads) with SciPy (Debian's
# python3-scipy, installed when missing). The tests read the committed file
# and need no Python.
PYTHON_REF ?= /usr/bin/python3
scipy-deps:
	@$(PYTHON_REF) -c 'import scipy' 2>/dev/null || { \
	  echo "installing: python3-scipy"; \
	  if [ "$$(id -u)" = 0 ]; then apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq python3-scipy; \
	  else sudo apt-get update -qq && sudo DEBIAN_FRONTEND=noninteractive apt-get install -y -qq python3-scipy; fi; }

reference: scipy-deps
	$(PYTHON_REF) testdata/reference/double.py generate
	$(PYTHON_REF) testdata/reference/rigid.py generate
	$(PYTHON_REF) testdata/reference/reference.py generate

# The planner's moves as reference scenarios (testdata/reference/scenarios/
# planned-*.json, from `swaysheet -plan -json` of each plan-*.json example);
# run `make reference` after it.
planned:
	$(PYTHON_REF) testdata/reference/planned.py

# Speed and size, side by side, in one table (see README "Benchmarks").
# The examples are timed in five rounds, natively and as wasm by turns:
# the wasm/native row is the fastest wasm round over the fastest native
# one, so that a slow spell of the host during one side of some rounds
# does not make it.
BENCH := $(OUT)/bench
# Scenarios timed with SciPy beside the core (those in the reference data).
BENCH_SCIPY := $(addprefix testdata/scenarios/,bay-travel.json diagonal-travel.json tower-slew.json \
	slew-with-trolley.json hoist-during-travel.json hard-stop.json wind-gust.json)
bench: deps scipy-deps dist
	@mkdir -p $(BENCH)
	$(GO) test -run '^$$' -bench . -benchtime 100x ./core/... ./core/sheet/ | tee $(BENCH)/go-bench.txt
	GOOS=js GOARCH=wasm $(GO) build -trimpath $(WASM_GCFLAGS) -o $(BENCH)/parts.wasm ./wasm
	$(GO) run ./web/cmd/swaysize -wasm $(OUT)/web/swaysheet.wasm -fetch-wasm $(OUT)/web/swayfetch.wasm -single-wasm $(OUT)/single/swaysheet.wasm -single dist/swaysheet.html -static dist/web -parts $(BENCH)/parts.wasm > $(BENCH)/size.json
	$(GO) run ./core/cmd/swaybench -json testdata/scenarios > $(BENCH)/native.json
	$(GO) run ./core/cmd/swaybench -floor testdata/scenarios/diagonal-travel.json -repeat 201 > $(BENCH)/kernel.json
	$(GO) run ./core/cmd/swaybench -shapes > $(BENCH)/shapes.json
	$(GO) run ./core/cmd/swaybench -draws testdata/scenarios/bay-travel.json > $(BENCH)/draws.json
	rm -f $(BENCH)/swaybench.wasm
	GOOS=js GOARCH=wasm $(GO) build -o $(BENCH)/swaybench.wasm ./core/cmd/swaybench
	$(GO) run ./web/cmd/swaypack $(BENCH)/swaybench.wasm
	node $(GOROOT)/lib/wasm/wasm_exec_node.js $(BENCH)/swaybench.wasm -json testdata/scenarios > $(BENCH)/wasm.json
	for r in 2 3 4 5; do \
		$(GO) run ./core/cmd/swaybench -round $$r -json testdata/scenarios > $(BENCH)/native-round$$r.json && \
		node $(GOROOT)/lib/wasm/wasm_exec_node.js $(BENCH)/swaybench.wasm -round $$r -json testdata/scenarios > $(BENCH)/wasm-round$$r.json || exit 1; \
	done
	GOMAXPROCS=1 $(GO) run ./core/cmd/swaybench -plans testdata/scenarios -repeat 21 > $(BENCH)/plans.json
	node $(GOROOT)/lib/wasm/wasm_exec_node.js $(BENCH)/swaybench.wasm -plans testdata/scenarios -repeat 21 > $(BENCH)/plans-wasm.json
	node $(GOROOT)/lib/wasm/wasm_exec_node.js $(BENCH)/swaybench.wasm -floor testdata/scenarios/diagonal-travel.json -repeat 101 > $(BENCH)/kernel-wasm.json
	node $(GOROOT)/lib/wasm/wasm_exec_node.js $(BENCH)/swaybench.wasm -shapes > $(BENCH)/shapes-wasm.json
	node $(GOROOT)/lib/wasm/wasm_exec_node.js $(BENCH)/swaybench.wasm -draws testdata/scenarios/bay-travel.json > $(BENCH)/draws-wasm.json
	$(GO) run ./core/cmd/swaybench -scipy testdata/reference/results.json -python $(PYTHON_REF) -repeat 1001 $(BENCH_SCIPY) > $(BENCH)/scipy.json
	SWAYSHEET_BROWSER=1 SWAYSHEET_BENCH_OUT=$(CURDIR)/$(BENCH)/browser.json $(GO) test -count=1 -run '^TestBenchPage$$' ./web/browsertest
	@echo
	@$(GO) run ./core/cmd/swaybench -table $(BENCH)/*.json

clean:
	rm -rf $(OUT) dist
