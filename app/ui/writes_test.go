package ui

import (
	"bytes"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// TestWindow_ReadOnlyFileAsksFirst: saving the project over a read-only
// file, or exporting over one, asks first; Cancel keeps the file, the
// answer to replace writes it (and it stays read-only).
func TestWindow_ReadOnlyFileAsksFirst(t *testing.T) {
	w := newTestWindow(t, "frying-pan")
	dir := t.TempDir()
	target := filepath.Join(dir, "pan.json")
	old := []byte(`{"format": "propflight/v1", "prop": {"parts": [{"shape": "sphere", "radius": 0.1, "mass": 1}]}}`)
	if err := os.WriteFile(target, old, 0o444); err != nil {
		t.Fatal(err)
	}
	ran := 0
	w.savePicked(dir, "pan.json", func() { ran++ })
	w.lastDialog.choose["Replace"]() // the usual question for an existing file
	d := w.lastDialog
	if d == nil || d.choose == nil || !strings.Contains(d.title, "read-only") {
		t.Fatalf("no question before replacing a read-only file: %+v", d)
	}
	if data, _ := os.ReadFile(target); !bytes.Equal(data, old) || ran != 0 {
		t.Fatal("the read-only file was replaced before the answer")
	}
	d.choose["Cancel"]()
	if data, _ := os.ReadFile(target); !bytes.Equal(data, old) || ran != 0 || w.ed.Path() == target {
		t.Fatal("Cancel replaced the read-only file")
	}
	w.savePicked(dir, "pan.json", func() { ran++ })
	w.lastDialog.choose["Replace"]()
	w.lastDialog.choose["Replace anyway"]()
	if data, _ := os.ReadFile(target); bytes.Equal(data, old) || ran != 1 || w.ed.Path() != target {
		t.Fatalf("Replace anyway: replaced %v, then ran %d, path %q", !bytes.Equal(data, old), ran, w.ed.Path())
	}
	if fi, _ := os.Stat(target); fi.Mode().Perm() != 0o444 {
		t.Errorf("mode after replacing: %v", fi.Mode().Perm())
	}

	csv := filepath.Join(dir, "pan.csv")
	if err := os.WriteFile(csv, []byte("keep"), 0o444); err != nil {
		t.Fatal(err)
	}
	w.runExport(csvJob(), csv, w.good)
	d = w.lastDialog
	if d == nil || d.choose == nil || !strings.Contains(d.title, "read-only") {
		t.Fatalf("export over a read-only file did not ask: %+v", d)
	}
	d.choose["Replace anyway"]()
	if data, _ := os.ReadFile(csv); !bytes.HasPrefix(data, []byte("frame,")) {
		t.Errorf("export after the answer: %q", data)
	}
}

// TestWindow_SaveThroughSymlinkKeepsTheLink: a project opened through a
// symbolic link is saved into the file it names.
func TestWindow_SaveThroughSymlinkKeepsTheLink(t *testing.T) {
	w := newTestWindow(t, "frying-pan")
	dir := t.TempDir()
	real := filepath.Join(dir, "real.json")
	if err := w.ed.Save(real); err != nil {
		t.Fatal(err)
	}
	link := filepath.Join(dir, "pan.json")
	if err := os.Symlink("real.json", link); err != nil {
		t.Fatal(err)
	}
	if !w.openPath(link) {
		t.Fatal("open failed")
	}
	w.save(nil)
	if fi, err := os.Lstat(link); err != nil || fi.Mode()&os.ModeSymlink == 0 {
		t.Fatal("saving replaced the link with a file")
	}
}

// saveNow saves the project to path and reports whether it was saved
// without a question.
func saveNow(w *Window, path string) bool {
	ok := false
	w.saveTo(path, func() { ok = true })
	return ok
}
