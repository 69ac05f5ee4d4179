// Package locale fixes the process locale variables before Fyne reads them.
//
// Fyne's lang package looks up the user's locale while it initialises and
// logs three lines of "Error parsing user locale C" on stderr for the
// POSIX locales C and POSIX (LANG=C.UTF-8 is the default on many Debian
// machines and containers). That noise would break the command line's
// promise of one line on stderr. This package, imported for its side
// effect by package main, replaces such values with en_US.UTF-8 for this
// process only.
//
// Order: since Go 1.21 packages initialise in import-path order among those
// whose imports are ready (The Go Programming Language Specification,
// "Package initialization"). This package imports only os and strings, and
// Fyne's lang package imports text/template, which imports os and sorts
// after "propflight/..."; so this init always runs first. A test in
// cmd/propflight checks the outcome on the built binary.
package locale

import (
	"os"
	"strings"
)

func init() { Fix() }

// Fix replaces a C or POSIX value of LC_ALL, LC_MESSAGES or LANG with
// en_US.UTF-8, keeping every other value as it is. It reports whether it
// changed anything.
func Fix() bool {
	changed := false
	for _, k := range []string{"LC_ALL", "LC_MESSAGES", "LANG"} {
		v, ok := os.LookupEnv(k)
		if !ok {
			continue
		}
		base, _, _ := strings.Cut(v, ".")
		if base == "C" || base == "POSIX" {
			os.Setenv(k, "en_US.UTF-8")
			changed = true
		}
	}
	return changed
}
