# Stave build, test and benchmark entry points.
#
#   make run    install what is missing, build, open Stave on the demo model
#   make test   install what is missing, run every check CI runs
#   make bench  solver and drawing benchmarks (speed is measured here, never asserted in tests)
#   make dist   install what is missing, build the Linux bundle and the Windows stave.exe into dist/

SHELL := /bin/bash
GO ?= go
BIN := ./stave
export LANG ?= C.UTF-8
# Fyne cannot parse the plain C locale as a language and logs an error for it; Stave's text is English.
export LANGUAGE ?= en
export PATH := $(PATH):/usr/local/go/bin

# Debian/Ubuntu packages: a C compiler and the OpenGL/X11 headers for Fyne's GLFW driver,
# GTK for the native file dialogs, Xvfb + ImageMagick + xdotool for the screen smoke test.
SYSTEM_PACKAGES := gcc pkg-config libgl1-mesa-dev libx11-dev libxcursor-dev libxrandr-dev \
	libxinerama-dev libxi-dev libxxf86vm-dev libgtk-3-dev xvfb xauth imagemagick xdotool

# For `make dist`: xz for the Linux tarball, desktop-file-validate and xprop to check its menu
# entry and window icon; the mingw-w64 C compiler that cross-builds stave.exe with cgo.
DIST_LINUX_PACKAGES := xz-utils desktop-file-utils x11-utils
DIST_WINDOWS_PACKAGES := gcc-mingw-w64-x86-64

FUZZ_TIME ?= 10s

.PHONY: deps build run test vet fmt-check unit race fuzz smoke bench dist dist-linux dist-test clean

deps:
	@./.ci/install-deps.sh $(SYSTEM_PACKAGES)

build: deps
	$(GO) build -o $(BIN) ./cmd/stave

run: build
	$(BIN) testdata/demo.json

test: deps vet fmt-check unit race fuzz smoke dist-test

vet:
	$(GO) vet ./...

fmt-check:
	@out=$$(gofmt -l $$(git ls-files '*.go' 2>/dev/null || find . -name '*.go')); \
	if [ -n "$$out" ]; then echo "gofmt would change: $$out"; exit 1; fi

# Test binaries may run long on a busy 2-core machine (the window's tests
# under the race detector took over 10 minutes, go test's default limit,
# with other builds beside them); CI's own limit is 90 minutes.
TEST_TIMEOUT ?= 40m

unit:
	$(GO) test -count=1 -timeout $(TEST_TIMEOUT) ./...

race:
	$(GO) test -count=1 -race -timeout $(TEST_TIMEOUT) ./fem/... ./app/...

# Short runs of every fuzz target (.ci/fuzz.sh); a crasher is written under the package's testdata/fuzz.
fuzz:
	GO=$(GO) ./.ci/fuzz.sh $(FUZZ_TIME)

smoke: build
	STAVE_BINARY=$(BIN) ./.ci/smoke.sh

# dist/: the Linux bundle, stave.exe and SHA256SUMS (README "Install"), then checked.
dist: deps
	@./.ci/install-deps.sh $(DIST_LINUX_PACKAGES) $(DIST_WINDOWS_PACKAGES)
	./.ci/dist.sh linux windows
	./.ci/dist-check.sh

# The Linux bundle alone, checked (no cross compiler needed).
dist-linux: deps
	@./.ci/install-deps.sh $(DIST_LINUX_PACKAGES)
	./.ci/dist.sh linux
	./.ci/dist-check.sh

# CI's share: `make dist`, with wine installed so that the check runs stave.exe's headless
# commands too. A first Windows build compiles Fyne's driver for Windows (about 10 minutes on
# two cores); later ones reuse Go's build cache.
dist-test: deps
	@./.ci/install-deps.sh wine64
	@$(MAKE) --no-print-directory dist

bench: build
	$(GO) test -run '^$$' -bench . -benchmem ./fem/... ./canvas/... ./app/...
	$(BIN) bench

clean:
	rm -rf $(BIN) dist
