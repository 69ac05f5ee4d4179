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
	// The theme itself was applied before the window was built
	// (applySavedTheme); here the View menu learns which one it is.
	w.markTheme(savedTheme(w.app))
}

// savedTheme returns the theme choice kept in the preferences (the
// system's when none or an unknown one is kept).
func savedTheme(a fyne.App) string {
	switch c := a.Preferences().StringWithFallback(prefTheme, themeSystem); c {
	case themeLight, themeDark:
		return c
	}
	return themeSystem
}

// applySavedTheme sets the app's theme to the saved choice. It runs
// before the window's widgets are made: widgets measured under one theme
// and shown under another keep some of the first theme's colours (dark
// fields on a light window), so the theme must be in place first. The
// system choice leaves the app's theme as it is.
func applySavedTheme(a fyne.App) {
	if c := savedTheme(a); c != themeSystem {
		applyTheme(a, c)
	}
}

// applyTheme sets the app's theme for a choice (an unknown one is the
// system's) and returns the choice applied.
func applyTheme(a fyne.App, choice string) string {
	switch choice {
	case themeLight:
		a.Settings().SetTheme(variantTheme{theme.DefaultTheme(), theme.VariantLight})
	case themeDark:
		a.Settings().SetTheme(variantTheme{theme.DefaultTheme(), theme.VariantDark})
	default:
		choice = themeSystem
		a.Settings().SetTheme(theme.DefaultTheme())
	}
	return choice
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
	choice = applyTheme(w.app, choice)
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
