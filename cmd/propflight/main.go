// Command propflight plans thrown props: with no arguments it opens the
// window on the demo, with a subcommand it runs in batch without one (see
// propflight --help and package propflight/app/cli).
package main

import (
	"errors"
	"os"
	"runtime"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/app"

	"propflight/app/cli"
	"propflight/app/ui"
	"propflight/assets"
	_ "propflight/internal/locale" // before Fyne reads the locale: see its doc
)

// errNoDisplay explains a window that cannot open, in place of the
// graphics library's own error.
var errNoDisplay = errors.New("no display to open the window on (DISPLAY is not set): run it on a desktop or under Xvfb, or use propflight check")

func main() {
	openWindow := func(path string) error {
		if runtime.GOOS == "linux" && os.Getenv("DISPLAY") == "" && os.Getenv("WAYLAND_DISPLAY") == "" {
			return errNoDisplay
		}
		a := app.NewWithID("dev.propflight.app")
		a.SetIcon(fyne.NewStaticResource("propflight.png", assets.Icon))
		return ui.Run(a, path)
	}
	os.Exit(cli.Run(os.Args[1:], os.Stdout, os.Stderr, openWindow))
}
