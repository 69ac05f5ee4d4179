# Propflight. `make run` installs what is missing, builds and starts the
# program on the embedded demo; `make test` runs every test.
GO ?= go
BIN := propflight

.PHONY: run test test-quick check staticcheck build deps bench fuzz clean

# staticcheck is a Go tool, not a module dependency: `make staticcheck`
# installs it into GOPATH/bin when it is missing.
STATICCHECK := $(shell $(GO) env GOPATH)/bin/staticcheck

deps:
	@./scripts/install-deps.sh

build: deps
	$(GO) build -o $(BIN) ./cmd/propflight

# Without a display (a server, CI) the window cannot open: show the demo's
# verdict on the terminal instead.
run: build
	@if [ -n "$$DISPLAY$$WAYLAND_DISPLAY" ]; then ./$(BIN); else \
		echo "propflight: no display (DISPLAY is not set), so here is the demo on the terminal; run 'make run' on a desktop for the window"; \
		./$(BIN) check; fi

# What CI runs (.ci/run): vet, staticcheck, and every test once under the
# race detector (the race run is the full suite, so there is no second
# plain run).
test: deps check

check: staticcheck
	$(GO) vet ./...
	$(STATICCHECK) ./...
	$(GO) test -race ./...

# The plain suite without the race detector, for a quick run while working.
test-quick:
	$(GO) vet ./...
	$(GO) test ./...

staticcheck:
	@[ -x "$(STATICCHECK)" ] || { echo "propflight: installing staticcheck"; $(GO) install honnef.co/go/tools/cmd/staticcheck@latest; }

bench:
	$(GO) test -run XXX -bench . -benchmem ./...

fuzz:
	$(GO) test -run XXX -fuzz FuzzParse -fuzztime 60s ./app/project
	$(GO) test -run XXX -fuzz FuzzParse -fuzztime 30s ./app/cli

clean:
	rm -f $(BIN)
