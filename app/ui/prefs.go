package ui

import (
	"image/color"
	"slices"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/theme"

	"propflight/app/editor"
	"propflight/widgets/wire"
)

// The user's settings, not the project's: kept in the Fyne preferences
// of the app (fyne.App.Preferences, stored per app ID) so they survive a
// restart and never reach a project file.
const (
	prefImperial       = "imperial"        // bool: imperial units on screen
	prefRecent         = "recent_files"    // string list, newest first
	prefRecentMigrated = "recent_migrated" // bool: the old recent.json was read once
	prefView           = "view"            // int: the preview's wire.View
	prefOnion          = "onion"           // int: onion-skin frames each side, 0 to maxOnion
	prefTheme          = "theme"           // string: themeSystem, themeLight or themeDark
)

// Theme choices of the View menu.
const (
	themeSystem = "system"
	themeLight  = "light"
	themeDark   = "dark"
)

// loadRecent returns the recent-files list kept in the preferences. The
// first time, it takes over the list of the old hand-made file
// (editor.DefaultRecentPath) so no recent project is lost.
func loadRecent(a fyne.App) *editor.Recent {
	prefs := a.Preferences()
	files := prefs.StringList(prefRecent)
	if !prefs.Bool(prefRecentMigrated) {
		if path, err := editor.DefaultRecentPath(); err == nil {
			for _, f := range editor.LoadRecent(path).Files {
				if !slices.Contains(files, f) {
					files = append(files, f)
				}
			}
		}
		prefs.SetStringList(prefRecent, files)
		prefs.SetBool(prefRecentMigrated, true)
	}
	return editor.NewRecent(files, func(f []string) { prefs.SetStringList(prefRecent, f) })
}

// restorePrefs applies the saved settings to a newly built window.
func (w *Window) restorePrefs() {
	prefs := w.app.Preferences()
	w.exportOpts = w.loadExportOptions()
	if prefs.Bool(prefImperial) {
		w.menu.imperial.Checked = true
		w.setImperial(true)
	}
	if v := wire.View(prefs.IntWithFallback(prefView, int(wire.Front))); v >= wire.Front && v <= wire.Free {
		w.view.setView(v)
	}
	if n := prefs.IntWithFallback(prefOnion, 2); n >= 0 && n <= maxOnion {
		w.view.onion.SetSelected(onionLabel(n))
	}
	choice := prefs.StringWithFallback(prefTheme, themeSystem)
	if choice == themeLight || choice == themeDark {
		w.setTheme(choice)
	} else {
		w.markTheme(themeSystem) // the app's own theme stays
	}
}

var _ fyne.Theme = variantTheme{}

// variantTheme is the default theme held at one variant: the user's
// light or dark choice, whatever the system's.
type variantTheme struct {
	fyne.Theme
	v fyne.ThemeVariant
}

func (t variantTheme) Color(n fyne.ThemeColorName, _ fyne.ThemeVariant) color.Color {
	return t.Theme.Color(n, t.v)
}

// setTheme applies a theme choice (an unknown one is the system's), ticks
// it in the View menu and saves it.
func (w *Window) setTheme(choice string) {
	switch choice {
	case themeLight:
		w.app.Settings().SetTheme(variantTheme{theme.DefaultTheme(), theme.VariantLight})
	case themeDark:
		w.app.Settings().SetTheme(variantTheme{theme.DefaultTheme(), theme.VariantDark})
	default:
		choice = themeSystem
		w.app.Settings().SetTheme(theme.DefaultTheme())
	}
	w.app.Preferences().SetString(prefTheme, choice)
	w.markTheme(choice)
}

// markTheme ticks the theme choice in the View menu.
func (w *Window) markTheme(choice string) {
	for c, it := range w.menu.themes {
		it.Checked = c == choice
	}
	w.menu.main.Refresh()
}
