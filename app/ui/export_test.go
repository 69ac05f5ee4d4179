package ui

import (
	"bytes"
	"os"
	"path/filepath"
	"strings"
	"testing"
	"time"

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
	w.runExport(sheetJob("a4"), filepath.Join(dir, "pan.pdf"), w.good)
	check("pan.pdf", func(b []byte) bool { return strings.HasPrefix(string(b), "%PDF-") })
	w.runExport(csvJob(), filepath.Join(dir, "pan.csv"), w.good)
	check("pan.csv", func(b []byte) bool {
		return strings.HasPrefix(string(b), export.CSVHeader+"\n") && strings.Count(string(b), "\n") == frames+1
	})
	w.runExport(gltfJob(), filepath.Join(dir, "pan.glb"), w.good)
	check("pan.glb", func(b []byte) bool { return len(b) > 12 && string(b[:4]) == "glTF" })
	w.runExport(pngJob(), filepath.Join(dir, "frames"), w.good)
	if entries, _ := os.ReadDir(filepath.Join(dir, "frames")); len(entries) != frames {
		t.Errorf("png: %d files for %d frames", len(entries), frames)
	}
	// A folder that cannot be written: an error dialog naming the file.
	w.runExport(csvJob(), filepath.Join(dir, "missing", "pan.csv"), w.good)
	if w.lastDialog == nil || w.lastDialog.title != "Export failed" || !strings.Contains(w.lastDialog.message, "pan.csv") {
		t.Errorf("bad folder: dialog %+v", w.lastDialog)
	}
}

// TestWindow_Export_SettingsTakenAtStart: an export runs off the UI
// goroutine and uses the settings the controls had when it started; a
// control changed while it runs (here the timing, to twos) is not read
// from the export's goroutine (go test -race reports such a read).
func TestWindow_Export_SettingsTakenAtStart(t *testing.T) {
	w := newTestWindow(t, assets.Demo)
	queue := make(chan func(), 64)
	w.synchronous, w.do = false, func(f func()) { queue <- f }
	path := filepath.Join(t.TempDir(), "pan.csv")
	w.runExport(csvJob(), path, w.good)
	w.throw.twos.SetSelected(timingOnTwos) // while the export runs
	deadline := time.After(time.Minute)
	for w.lastDialog == nil || w.lastDialog.title != "Exported" {
		select {
		case f := <-queue:
			f()
		case <-deadline:
			t.Fatalf("the export never finished: %+v", w.lastDialog)
		}
	}
	w.synchronous = true
	var want bytes.Buffer
	if err := export.WriteCSV(&want, w.good.Take); err != nil {
		t.Fatal(err)
	}
	if got, err := os.ReadFile(path); err != nil || !bytes.Equal(got, want.Bytes()) {
		t.Errorf("the CSV is not the take on ones as set at the start (%v)", err)
	}
}
