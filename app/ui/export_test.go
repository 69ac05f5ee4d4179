package ui

import (
	"os"
	"path/filepath"
	"strings"
	"testing"

	"propflight/app/export"
	"propflight/assets"
)

// TestWindow_Export_WritesEachFormat runs every export of the File menu on
// the demo's take and checks each file is what it claims (a PDF header, the
// CSV contract header, a GLB header per glTF 2.0.1 §4.4, one PNG a frame).
func TestWindow_Export_WritesEachFormat(t *testing.T) {
	w := newTestWindow(t, assets.Demo)
	dir := t.TempDir()
	frames := len(w.good.Take.Frames)
	check := func(name string, ok func([]byte) bool) {
		t.Helper()
		if w.lastDialog == nil || w.lastDialog.title != "Exported" {
			t.Fatalf("%s: dialog %+v", name, w.lastDialog)
		}
		b, err := os.ReadFile(filepath.Join(dir, name))
		if err != nil || !ok(b) {
			t.Errorf("%s: %d bytes, %v", name, len(b), err)
		}
	}
	w.runExport(w.sheetJob("a4"), filepath.Join(dir, "pan.pdf"), w.good)
	check("pan.pdf", func(b []byte) bool { return strings.HasPrefix(string(b), "%PDF-") })
	w.runExport(w.csvJob(), filepath.Join(dir, "pan.csv"), w.good)
	check("pan.csv", func(b []byte) bool {
		return strings.HasPrefix(string(b), export.CSVHeader+"\n") && strings.Count(string(b), "\n") == frames+1
	})
	w.runExport(gltfJob(), filepath.Join(dir, "pan.glb"), w.good)
	check("pan.glb", func(b []byte) bool { return len(b) > 12 && string(b[:4]) == "glTF" })
	w.runExport(w.pngJob(), filepath.Join(dir, "frames"), w.good)
	if entries, _ := os.ReadDir(filepath.Join(dir, "frames")); len(entries) != frames {
		t.Errorf("png: %d files for %d frames", len(entries), frames)
	}
	// A folder that cannot be written: an error dialog naming the file.
	w.runExport(w.csvJob(), filepath.Join(dir, "missing", "pan.csv"), w.good)
	if w.lastDialog == nil || w.lastDialog.title != "Export failed" || !strings.Contains(w.lastDialog.message, "pan.csv") {
		t.Errorf("bad folder: dialog %+v", w.lastDialog)
	}
}
