# Stave build, test and benchmark entry points.
#
#   make run    install what is missing, build, open Stave on the demo model
#   make test   install what is missing, run every check CI runs
#   make bench  solver and drawing benchmarks (speed is measured here, never asserted in tests)

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

FUZZ_TIME ?= 10s

.PHONY: deps build run test vet fmt-check unit race fuzz smoke bench clean

deps:
	@./.ci/install-deps.sh $(SYSTEM_PACKAGES)

build: deps
	$(GO) build -o $(BIN) ./cmd/stave

run: build
	$(BIN) testdata/demo.json

test: deps vet fmt-check unit race fuzz smoke

vet:
	$(GO) vet ./...

fmt-check:
	@out=$$(gofmt -l $$(git ls-files '*.go' 2>/dev/null || find . -name '*.go')); \
	if [ -n "$$out" ]; then echo "gofmt would change: $$out"; exit 1; fi

unit:
	$(GO) test -count=1 ./...

race:
	$(GO) test -count=1 -race ./fem/... ./app/...

# Short runs of every fuzz target; a crasher is written under the package's testdata/fuzz.
fuzz:
	@for pkg in $$(grep -rl --include='*_test.go' '^func Fuzz' . | xargs -n1 dirname | sort -u); do \
	  for target in $$(grep -h '^func Fuzz' $$pkg/*_test.go | sed 's/^func \(Fuzz[A-Za-z0-9_]*\).*/\1/'); do \
	    echo "fuzz $$pkg $$target for $(FUZZ_TIME)"; \
	    $(GO) test -run '^$$' -fuzz "^$$target\$$" -fuzztime $(FUZZ_TIME) $$pkg || exit 1; \
	  done; \
	done

smoke: build
	STAVE_BINARY=$(BIN) ./.ci/smoke.sh

bench: build
	$(GO) test -run '^$$' -bench . -benchmem ./fem/... ./canvas/... ./app/...
	$(BIN) bench

clean:
	rm -f $(BIN)
