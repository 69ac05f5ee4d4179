package ui

import (
	"image/color"
	"os"
	"path/filepath"
	"slices"
	"testing"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/test"
	"fyne.io/fyne/v2/theme"

	"propflight/widgets/wire"
)

// TestPrefs_SurviveARestart: imperial units, the view, the onion skin, the
// theme and the recent files are the user's settings, kept in the Fyne
// preferences: a second window on the same app starts with them, and the
// project file holds none of them.
func TestPrefs_SurviveARestart(t *testing.T) {
	t.Setenv("XDG_CONFIG_HOME", t.TempDir())
	a := test.NewTempApp(t)
	doc, _ := presetDocument("frying-pan")
	w, err := newWindow(a, doc, "", true)
	if err != nil {
		t.Fatal(err)
	}
	w.menu.imperial.Action()
	w.view.setView(wire.Top)
	w.view.onion.SetSelected(onionLabel(4))
	w.setTheme(themeLight)
	w.recent.Add("/shots/pan.json")
	w.closed = true
	w.win.Close()

	w2, err := newWindow(a, doc, "", true)
	if err != nil {
		t.Fatal(err)
	}
	t.Cleanup(func() { w2.closed = true; w2.win.Close() })
	if !w2.imperial || !w2.menu.imperial.Checked {
		t.Error("imperial units not restored")
	}
	if w2.view.preview.View() != wire.Top || w2.view.before != 4 {
		t.Errorf("view %v, onion %d; want top and 4", w2.view.preview.View(), w2.view.before)
	}
	if !w2.menu.themes[themeLight].Checked || a.Preferences().String(prefTheme) != themeLight {
		t.Error("light theme not restored")
	}
	if !slices.Equal(w2.recent.Files, []string{"/shots/pan.json"}) {
		t.Errorf("recent %v", w2.recent.Files)
	}
}

// TestPrefs_MigrateOldRecentFile: the recent list of the old hand-made
// JSON file moves into the preferences once.
func TestPrefs_MigrateOldRecentFile(t *testing.T) {
	cfg := t.TempDir()
	t.Setenv("XDG_CONFIG_HOME", cfg)
	old := filepath.Join(cfg, "propflight", "recent.json")
	os.MkdirAll(filepath.Dir(old), 0o755)
	os.WriteFile(old, []byte(`{"files": ["/a/pan.json", "/b/plate.json"]}`), 0o644)
	a := test.NewTempApp(t)
	r := loadRecent(a)
	if !slices.Equal(r.Files, []string{"/a/pan.json", "/b/plate.json"}) {
		t.Fatalf("migrated %v", r.Files)
	}
	os.WriteFile(old, []byte(`{"files": ["/c/other.json"]}`), 0o644)
	if r := loadRecent(a); !slices.Equal(r.Files, []string{"/a/pan.json", "/b/plate.json"}) {
		t.Errorf("read the old file twice: %v", r.Files)
	}
}

// TestPrefs_SavedThemeBeforeWidgets: a theme kept in the preferences is
// in place before the window and its widgets are made. The desktop driver
// listens for theme changes only once its loop runs, so a theme set after
// the widgets were built (and measured) but before the loop starts leaves
// them in the old theme's colours: dark fields and pale text on a light
// window. The test driver refreshes at once, so the order is what is
// checked here.
func TestPrefs_SavedThemeBeforeWidgets(t *testing.T) {
	t.Setenv("XDG_CONFIG_HOME", t.TempDir())
	a := &windowWatcher{App: test.NewTempApp(t)}
	a.Preferences().SetString(prefTheme, themeLight)
	doc, _ := presetDocument("frying-pan")
	w, err := newWindow(a, doc, "", true)
	if err != nil {
		t.Fatal(err)
	}
	t.Cleanup(func() { w.closed = true; w.win.Close() })
	want := theme.DefaultTheme().Color(theme.ColorNameBackground, theme.VariantLight)
	if a.background != want {
		t.Errorf("the theme's background when the window was made is %v, want the light theme's %v", a.background, want)
	}
	if !w.menu.themes[themeLight].Checked {
		t.Error("the View menu does not tick the light theme")
	}
}

// windowWatcher is an app that notes the theme's background colour at
// the moment a window is made.
type windowWatcher struct {
	fyne.App
	background color.Color
}

func (a *windowWatcher) NewWindow(title string) fyne.Window {
	a.background = a.Settings().Theme().Color(theme.ColorNameBackground, a.Settings().ThemeVariant())
	return a.App.NewWindow(title)
}
