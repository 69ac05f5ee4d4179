// Command propflight plans thrown props: with no arguments it opens the
// window on the demo, with a subcommand it runs in batch without one (see
// propflight --help and package propflight/app/cli).
package main

import (
	"os"

	"fyne.io/fyne/v2/app"

	"propflight/app/cli"
	"propflight/app/ui"
	_ "propflight/internal/locale" // before Fyne reads the locale: see its doc
)

func main() {
	openWindow := func() error { return ui.Run(app.NewWithID("dev.propflight.app"), "") }
	os.Exit(cli.Run(os.Args[1:], os.Stdout, os.Stderr, openWindow))
}
