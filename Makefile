# Propflight. `make run` installs what is missing, builds and starts the
# program on the embedded demo; `make test` runs every test.
GO ?= go
BIN := propflight

# The one version (assets/VERSION); --version, the About box, FyneApp.toml
# and the Debian archive all read it.
VERSION := $(shell cat assets/VERSION)
APPID := dev.propflight.app
ICON_SIZES := 16 22 24 32 48 64 128 256 512
PREFIX ?= /usr/local
DESTDIR ?=
DEB := dist/propflight_$(VERSION)_amd64.deb

.PHONY: run test test-quick check staticcheck build deps bench fuzz clean install uninstall package check-package

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
	for f in FuzzReadSTL FuzzReadOBJ FuzzReadGLB FuzzReadGLTF; do $(GO) test -run XXX -fuzz "^$$f$$" -fuzztime 15s ./app/meshio || exit 1; done
	$(GO) test -run XXX -fuzz FuzzString -fuzztime 30s ./internal/printable
	for f in FuzzParseMarks FuzzOpenGIF; do $(GO) test -run XXX -fuzz "^$$f$$" -fuzztime 15s ./app/footage || exit 1; done

# install: the program, its menu entry, metainfo and icons under
# $(DESTDIR)$(PREFIX) (freedesktop layout; REFERENCES.md §12).
install: build
	install -Dm755 $(BIN) $(DESTDIR)$(PREFIX)/bin/propflight
	install -Dm644 packaging/$(APPID).desktop $(DESTDIR)$(PREFIX)/share/applications/$(APPID).desktop
	mkdir -p $(DESTDIR)$(PREFIX)/share/metainfo
	sed 's/@VERSION@/$(VERSION)/' packaging/$(APPID).metainfo.xml > $(DESTDIR)$(PREFIX)/share/metainfo/$(APPID).metainfo.xml
	chmod 644 $(DESTDIR)$(PREFIX)/share/metainfo/$(APPID).metainfo.xml
	for s in $(ICON_SIZES); do \
		install -Dm644 assets/icon/png/$$s.png $(DESTDIR)$(PREFIX)/share/icons/hicolor/$${s}x$$s/apps/$(APPID).png || exit 1; \
	done
	install -Dm644 assets/icon/propflight.svg $(DESTDIR)$(PREFIX)/share/icons/hicolor/scalable/apps/$(APPID).svg

uninstall:
	rm -f $(DESTDIR)$(PREFIX)/bin/propflight $(DESTDIR)$(PREFIX)/share/applications/$(APPID).desktop \
		$(DESTDIR)$(PREFIX)/share/metainfo/$(APPID).metainfo.xml $(DESTDIR)$(PREFIX)/share/icons/hicolor/scalable/apps/$(APPID).svg
	for s in $(ICON_SIZES); do rm -f $(DESTDIR)$(PREFIX)/share/icons/hicolor/$${s}x$$s/apps/$(APPID).png; done

# package: the Debian archive dist/propflight_VERSION_amd64.deb (dpkg-deb),
# installed under /usr. It depends on the GL and X11 libraries the program
# links; GLFW opens the X extension libraries itself when present.
package: deps
	rm -rf dist/deb
	$(MAKE) --no-print-directory install DESTDIR=$(CURDIR)/dist/deb PREFIX=/usr GOFLAGS="$(GOFLAGS) -trimpath"
	mkdir -p dist/deb/DEBIAN
	sed -e 's/@VERSION@/$(VERSION)/' -e "s/@SIZE@/$$(du -sk dist/deb/usr | cut -f1)/" packaging/debian-control > dist/deb/DEBIAN/control
	dpkg-deb --root-owner-group -Zgzip --build dist/deb $(DEB)
	@echo "propflight: built $(DEB)"

# check-package: the menu entry and metainfo validate, and the archive's
# own binary reports the archive's version (what CI runs).
check-package: package
	desktop-file-validate packaging/$(APPID).desktop
	appstreamcli validate --no-net --pedantic dist/deb/usr/share/metainfo/$(APPID).metainfo.xml
	@rm -rf dist/check && mkdir -p dist/check && dpkg-deb -x $(DEB) dist/check
	@got=$$(dist/check/usr/bin/propflight --version | cut -d' ' -f2); \
	want=$$(dpkg-deb -f $(DEB) Version); \
	if [ "$$got" != "$$want" ]; then echo "check-package: the binary says $$got, the archive $$want" >&2; exit 1; fi; \
	echo "check-package: $(DEB) is version $$want and its binary agrees"

clean:
	rm -rf $(BIN) dist
