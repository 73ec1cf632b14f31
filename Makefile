# Midrank: make serve runs the app locally, make test runs every check.
GO ?= go
WASMEXEC := $(shell $(GO) env GOROOT)/lib/wasm
FUZZTIME ?= 10s
# fuzz-once runs one fuzz test of one package for FUZZTIME
fuzz-once = $(GO) test $(1) -run '^$$' -fuzz '^$(2)$$' -fuzztime $(FUZZTIME) -fuzzminimizetime 2s

.PHONY: build serve edge edge-dev edge-deps test check test-deps test-go test-unit test-wasm test-arm64 vet fmt-check check-core fuzz bench bench-wasm bench-page reference clean

# build: write the static site and the WebAssembly module to dist/
build:
	$(GO) run ./tools/build --out dist

# serve: build, then serve dist/ on http://127.0.0.1:8080/ with the demo data ready
serve: build
	$(GO) run ./tools/serve --addr 127.0.0.1:8080 --dir dist

# edge: build the site and the edge worker (tools/edge/build, run by tools/edge/workerd.capnp)
edge:
	$(GO) run ./tools/build --out dist --edge

# edge-dev: run the edge worker in the local edge runtime on http://127.0.0.1:8787/
edge-dev: edge edge-deps
	cd tools/edge && node_modules/.bin/workerd serve workerd.capnp

# edge-deps: install the pinned local edge runtime (npm package workerd, see tools/edge/package-lock.json)
edge-deps:
	@test -x tools/edge/node_modules/.bin/workerd || (cd tools/edge && npm ci --no-audit --no-fund)

# test: every check that must pass before a change lands
test: fmt-check vet check-core test-deps test-go test-wasm test-arm64

# test-deps: install what the tests run on when it is missing (Debian's chromium, poppler-utils for the
# printed PDF's text, Node.js, qemu-user, the edge runtime)
test-deps:
	@command -v chromium >/dev/null 2>&1 || { apt-get update && apt-get install -y chromium; }
	@command -v pdftotext >/dev/null 2>&1 || { apt-get update && apt-get install -y --no-install-recommends poppler-utils; }
	@command -v qemu-aarch64 >/dev/null 2>&1 || { apt-get update && apt-get install -y --no-install-recommends qemu-user; }
	@command -v node >/dev/null 2>&1 || { apt-get update && apt-get install -y nodejs npm; }
	@$(MAKE) --no-print-directory edge-deps

# check: the fast inner loop (well under a minute): formatting, vet, the core's import rule and the Go
# tests that need neither a browser nor a build of the site
check: fmt-check vet check-core test-unit

# test-unit: the Go tests natively, but for the packages that build the module or drive the browser
FRESH := ./tools/browsertest ./tools/internal/sitebuild
test-unit:
	$(GO) test $$($(GO) list ./... | grep -v -e /tools/browsertest -e /tools/internal/sitebuild)

# test-go: the Go tests natively, the browser tests in headless Chromium among them. The packages that
# build the module in a child process run every time (-count=1): Go's test cache cannot see those inputs.
test-go: test-unit
	$(GO) test -count=1 -timeout 30m $(FRESH)

# test-wasm: the core and the module's tests compiled to js/wasm and run under Node
test-wasm:
	PATH="$(WASMEXEC):$$PATH" GOOS=js GOARCH=wasm $(GO) test ./core/... ./wasm/...

# test-arm64: the golden cases and the reference figures with the core built for arm64, where Go may fuse a
# multiply and an add into one instruction, run under Debian's qemu-user: the same bytes on every platform
ARM64TEST := $(CURDIR)/core.arm64.test
test-arm64:
	GOARCH=arm64 $(GO) test -c -o $(ARM64TEST) ./core
	cd core && qemu-aarch64 $(ARM64TEST) -test.run '^(TestGolden|TestAgainstReferences|TestExactOnOpenDatasets)$$' -test.v \
	  > $(ARM64TEST).log 2>&1; status=$$?; grep -E '^(--- |    |PASS|FAIL)' $(ARM64TEST).log; rm -f $(ARM64TEST) $(ARM64TEST).log; exit $$status

# vet: go vet, natively and for js/wasm
vet:
	$(GO) vet ./...
	GOOS=js GOARCH=wasm $(GO) vet ./core/... ./wasm/...

# fmt-check: fail when gofmt would change a file
fmt-check:
	@out=$$(gofmt -l .); if [ -n "$$out" ]; then echo "gofmt would change:"; echo "$$out"; exit 1; fi

# check-core: core/ imports nothing of its host: no syscall/js, os, net/http (direct imports;
# fmt itself pulls os and, on js/wasm, syscall/js in transitively)
check-core:
	@imports=$$(GOOS=js GOARCH=wasm $(GO) list -f '{{join .Imports "\n"}}' ./core/...); \
	for banned in syscall/js os net/http; do \
	  if echo "$$imports" | grep -qx "$$banned"; then echo "core/ must not import $$banned"; exit 1; fi; \
	done

# fuzz: runs every fuzz test for FUZZTIME (make fuzz FUZZTIME=5m). Not part of make test, whose result must not
# depend on luck: go test already replays every seed and every input kept in testdata/fuzz. Each run is retried
# once (Go's fuzzer can stop with "context deadline exceeded" when a worker is busy at the deadline); a real
# failure leaves its input in testdata/fuzz, fails again, and from then on fails make test until it is fixed.
fuzz:
	$(call fuzz-once,./core/table,FuzzParse) || $(call fuzz-once,./core/table,FuzzParse)
	$(call fuzz-once,./core/table,FuzzColumns) || $(call fuzz-once,./core/table,FuzzColumns)
	$(call fuzz-once,./core/table,FuzzHalves) || $(call fuzz-once,./core/table,FuzzHalves)
	$(call fuzz-once,./core,FuzzAnalyze) || $(call fuzz-once,./core,FuzzAnalyze)
	$(call fuzz-once,./core/rank,FuzzRank) || $(call fuzz-once,./core/rank,FuzzRank)
	$(call fuzz-once,./core/link,FuzzDecode) || $(call fuzz-once,./core/link,FuzzDecode)
	$(call fuzz-once,./core/findings,FuzzOpen) || $(call fuzz-once,./core/findings,FuzzOpen)
	$(call fuzz-once,./core/findings,FuzzShared) || $(call fuzz-once,./core/findings,FuzzShared)
	$(call fuzz-once,./core/montecarlo,FuzzParseJob) || $(call fuzz-once,./core/montecarlo,FuzzParseJob)
	$(call fuzz-once,./core/textenc,FuzzToUTF8) || $(call fuzz-once,./core/textenc,FuzzToUTF8)
	$(call fuzz-once,./core,FuzzDecodeOptions) || $(call fuzz-once,./core,FuzzDecodeOptions)
	$(call fuzz-once,./core/jsonlite,FuzzParseObject) || $(call fuzz-once,./core/jsonlite,FuzzParseObject)
	$(call fuzz-once,./core/jsonlite,FuzzParseTree) || $(call fuzz-once,./core/jsonlite,FuzzParseTree)
	$(call fuzz-once,./core,FuzzPreview) || $(call fuzz-once,./core,FuzzPreview)
	$(call fuzz-once,./core/exact,FuzzAgainstEnumeration) || $(call fuzz-once,./core/exact,FuzzAgainstEnumeration)
	$(call fuzz-once,./core/trend,FuzzAgainstEnumeration) || $(call fuzz-once,./core/trend,FuzzAgainstEnumeration)
	$(call fuzz-once,./core,FuzzPValues) || $(call fuzz-once,./core,FuzzPValues)
	$(call fuzz-once,./core/tables,FuzzTables) || $(call fuzz-once,./core/tables,FuzzTables)
	$(call fuzz-once,./core/sheet,FuzzOpen) || $(call fuzz-once,./core/sheet,FuzzOpen)
	$(call fuzz-once,./core/sheet,FuzzXML) || $(call fuzz-once,./core/sheet,FuzzXML)
	$(call fuzz-once,./core/sheet,FuzzPlainCells) || $(call fuzz-once,./core/sheet,FuzzPlainCells)

# bench: the speed and memory benchmarks
bench:
	$(GO) test ./core/... -run '^$$' -bench . -benchmem

# bench-wasm: the core's benchmarks compiled to WebAssembly under Node (20 rounds, so the engine's optimising tier runs)
bench-wasm:
	PATH="$(WASMEXEC):$$PATH" GOOS=js GOARCH=wasm $(GO) test ./core/... -run '^$$' -bench . -benchtime 20x -benchmem

# bench-page: the page's own figures in headless Chromium (load to the first result, 100,000 pasted rows, a file
# of 10,000,000 values, Monte Carlo on every core and on one worker, a battery of 60 measures), by its
# performance marks, medians of 5
bench-page: test-deps
	$(GO) test ./tools/browsertest -run '^$$' -bench Page -benchtime 1x -timeout 30m

# reference: regenerate testdata/reference/ with R and scipy (Debian: r-base-core, python3-scipy)
reference:
	bash tools/reference/generate.sh

# clean: remove build output
clean:
	rm -rf dist tools/edge/build tools/edge/site
