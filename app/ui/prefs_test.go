package ui

import (
	"os"
	"path/filepath"
	"slices"
	"testing"

	"fyne.io/fyne/v2/test"

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
