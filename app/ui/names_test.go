package ui

import (
	"os"
	"path/filepath"
	"strings"
	"testing"
)

func TestWindow_ControlCharactersInNamesEscaped(t *testing.T) {
	w := newTestWindow(t, "frying-pan")
	path := filepath.Join(t.TempDir(), "hostile.json")
	src := `{"format": "propflight/v1", "name": "pan\u001b]0;owned\u0007\r\nx",
 "prop": {"parts": [{"name": "head\u001b[31m\u009b", "shape": "box", "size": [0.2, 0.1, 0.05], "mass": 2}]},
 "throw": {"release_velocity": [1, 4, 0], "spin": {"axis": "least", "turns_per_second": 2}}}`
	if err := os.WriteFile(path, []byte(src), 0o644); err != nil {
		t.Fatal(err)
	}
	if !w.openPath(path) {
		t.Fatalf("open failed: %v", w.lastDialog)
	}
	shown := map[string]string{"window title": w.win.Title(), "parts list": strings.Join(w.props.labels, "|")}
	for what, s := range shown {
		for _, r := range s {
			if r < 0x20 || (r >= 0x7f && r < 0xa0) {
				t.Errorf("%s holds U+%04X: %q", what, r, s)
				break
			}
		}
	}
	if !strings.Contains(w.win.Title(), `pan\x1b]0;owned\x07`) || w.props.labels[0] != `head\x1b[31m\u009b` {
		t.Errorf("title %q, parts %q: want the escaped names", w.win.Title(), w.props.labels)
	}
	// The document keeps the names as written.
	if d := w.ed.Doc(); d.Name != "pan\x1b]0;owned\a\r\nx" || d.Prop.Parts[0].Name != "head\x1b[31m\u009b" {
		t.Errorf("document names changed: %q, %q", d.Name, d.Prop.Parts[0].Name)
	}
}

func TestWindow_ErrorDialogEscapesControlCharacters(t *testing.T) {
	w := newTestWindow(t, "frying-pan")
	bad := filepath.Join(t.TempDir(), "pan\x1b[31m\a.json")
	if w.openPath(bad) {
		t.Fatal("a missing file opened")
	}
	msg := w.lastDialog.message
	if strings.ContainsAny(msg, "\x1b\a") || !strings.Contains(msg, `pan\x1b[31m\x07.json`) {
		t.Errorf("dialog message %q", msg)
	}
}
