# Propflight. `make run` installs what is missing, builds and starts the
# program on the embedded demo; `make test` runs every test.
GO ?= go
BIN := propflight

.PHONY: run test build deps bench fuzz clean

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

test: deps
	$(GO) vet ./...
	$(GO) test ./...

bench:
	$(GO) test -run XXX -bench . -benchmem ./...

fuzz:
	$(GO) test -run XXX -fuzz FuzzParse -fuzztime 60s ./app/project
	$(GO) test -run XXX -fuzz FuzzParse -fuzztime 30s ./app/cli

clean:
	rm -f $(BIN)
