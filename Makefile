# swaysheet: see README.md. Every target runs from a clean clone.
SHELL := /bin/bash
GO ?= go
GOROOT := $(shell $(GO) env GOROOT)
WASM_EXEC := $(GOROOT)/lib/wasm/go_js_wasm_exec
OUT := out
ADDR ?= 127.0.0.1:8080

.PHONY: all test test-go test-wasm test-browser deps vet serve wasm bench reference dist clean

all: test

# System packages the tests need (Debian): chromium for browser tests,
# poppler-utils for the print tests. Installed only when missing.
deps:
	@need=""; \
	command -v chromium >/dev/null 2>&1 || need="$$need chromium"; \
	command -v pdfinfo >/dev/null 2>&1 || need="$$need poppler-utils"; \
	if [ -n "$$need" ]; then \
	  echo "installing:$$need"; \
	  if [ "$$(id -u)" = 0 ]; then apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq $$need; \
	  else sudo apt-get update -qq && sudo DEBIAN_FRONTEND=noninteractive apt-get install -y -qq $$need; fi; \
	fi
	$(GO) mod download

vet:
	$(GO) vet ./...
	@out=$$(gofmt -l core wasm web 2>/dev/null); if [ -n "$$out" ]; then echo "gofmt needed: $$out"; exit 1; fi

# Every test: unit and physics tests, the core built for js/wasm, wasm tests
# under node, browser tests in headless Chromium.
test: deps vet test-go test-wasm test-browser

test-go:
	$(GO) test ./...

test-wasm:
	GOOS=js GOARCH=wasm $(GO) build ./core/...
	GOOS=js GOARCH=wasm $(GO) test -exec="$(WASM_EXEC)" ./core/... ./wasm/...

# Browser tests: headless Chromium driven from Go (web/browsertest). The
# test builds the wasm itself; the screenshots go to out/browser/.
test-browser:
	SWAYSHEET_BROWSER=1 $(GO) test -count=1 -timeout 8m ./web/browsertest/

# The page's build output: the wasm and Go's matching wasm_exec.js.
wasm:
	@mkdir -p $(OUT)/web
	GOOS=js GOARCH=wasm $(GO) build -trimpath -o $(OUT)/web/swaysheet.wasm ./wasm
	cp "$(GOROOT)/lib/wasm/wasm_exec.js" $(OUT)/web/wasm_exec.js

# Build the wasm and serve the page on 127.0.0.1 (ADDR=127.0.0.1:PORT to move it).
serve: wasm
	$(GO) run ./web/serve -addr $(ADDR) -build $(OUT)/web

bench:
	$(GO) test -run '^$$' -bench . -benchtime 200x ./core/...

clean:
	rm -rf $(OUT) dist
