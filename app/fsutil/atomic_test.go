package fsutil

import (
	"errors"
	"io"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// leftovers returns the names in dir other than keep.
func leftovers(t *testing.T, dir string, keep ...string) []string {
	t.Helper()
	entries, err := os.ReadDir(dir)
	if err != nil {
		t.Fatal(err)
	}
	var extra []string
outer:
	for _, e := range entries {
		for _, k := range keep {
			if e.Name() == k {
				continue outer
			}
		}
		extra = append(extra, e.Name())
	}
	return extra
}

func writeString(s string) func(io.Writer) error {
	return func(w io.Writer) error {
		_, err := io.WriteString(w, s)
		return err
	}
}

func TestWriteAtomic_NewFile(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "take.csv")
	if err := WriteAtomic(path, writeString("frame\n0\n")); err != nil {
		t.Fatal(err)
	}
	got, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	if string(got) != "frame\n0\n" {
		t.Errorf("content = %q", got)
	}
	info, err := os.Stat(path)
	if err != nil {
		t.Fatal(err)
	}
	// CreateTemp makes 0600 files; the saved file must be readable like any other.
	if info.Mode().Perm() != newFileMode {
		t.Errorf("mode = %v, want %v", info.Mode().Perm(), newFileMode)
	}
	if extra := leftovers(t, dir, "take.csv"); len(extra) != 0 {
		t.Errorf("left behind %v", extra)
	}
}

func TestWriteAtomic_ReplacesAndKeepsMode(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "pan.json")
	if err := os.WriteFile(path, []byte("old"), 0o600); err != nil {
		t.Fatal(err)
	}
	if err := WriteAtomic(path, writeString("new content")); err != nil {
		t.Fatal(err)
	}
	got, _ := os.ReadFile(path)
	if string(got) != "new content" {
		t.Errorf("content = %q", got)
	}
	info, _ := os.Stat(path)
	if info.Mode().Perm() != 0o600 {
		t.Errorf("mode = %v, want 0600 kept from the old file", info.Mode().Perm())
	}
}

func TestWriteAtomic_WriteFails_OldFileIntact(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "pan.json")
	if err := os.WriteFile(path, []byte("precious"), 0o644); err != nil {
		t.Fatal(err)
	}
	boom := errors.New("boom")
	err := WriteAtomic(path, func(w io.Writer) error {
		// Write more than the buffer holds so that part of it reaches the
		// temporary file before the failure.
		if _, err := io.WriteString(w, strings.Repeat("x", 200<<10)); err != nil {
			return err
		}
		return boom
	})
	if !errors.Is(err, boom) {
		t.Fatalf("err = %v, want the write func's error", err)
	}
	got, _ := os.ReadFile(path)
	if string(got) != "precious" {
		t.Errorf("old file changed to %d bytes", len(got))
	}
	if extra := leftovers(t, dir, "pan.json"); len(extra) != 0 {
		t.Errorf("temporary file left behind: %v", extra)
	}
}

func TestWriteAtomic_WriteFails_NoFileCreated(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "new.json")
	err := WriteAtomic(path, func(io.Writer) error { return errors.New("nope") })
	if err == nil {
		t.Fatal("no error")
	}
	if _, statErr := os.Stat(path); !errors.Is(statErr, os.ErrNotExist) {
		t.Errorf("file exists after a failed write: %v", statErr)
	}
	if extra := leftovers(t, dir); len(extra) != 0 {
		t.Errorf("left behind %v", extra)
	}
}

func TestWriteAtomic_MissingFolder(t *testing.T) {
	path := filepath.Join(t.TempDir(), "no", "such", "folder", "x.csv")
	called := false
	err := WriteAtomic(path, func(io.Writer) error { called = true; return nil })
	if err == nil {
		t.Fatal("no error for a missing folder")
	}
	if called {
		t.Error("write was called although no temporary file could be made")
	}
}

func TestWriteAtomic_PathIsFolder(t *testing.T) {
	dir := t.TempDir()
	sub := filepath.Join(dir, "sub")
	if err := os.Mkdir(sub, 0o755); err != nil {
		t.Fatal(err)
	}
	if err := WriteAtomic(sub, writeString("x")); err == nil {
		t.Fatal("no error writing over a folder")
	}
	if err := WriteAtomic(sub+string(filepath.Separator), writeString("x")); err == nil {
		t.Fatal("no error for a path ending in a separator")
	}
	if extra := leftovers(t, dir, "sub"); len(extra) != 0 {
		t.Errorf("left behind %v", extra)
	}
}

func TestWriteAtomic_RenameFails_TempRemoved(t *testing.T) {
	// Renaming a file over a non-empty folder fails, and the folder check
	// runs first, so make the target appear as a folder only after the
	// write: the write func creates it.
	dir := t.TempDir()
	path := filepath.Join(dir, "late")
	err := WriteAtomic(path, func(w io.Writer) error {
		if err := os.MkdirAll(filepath.Join(path, "inner"), 0o755); err != nil {
			return err
		}
		_, err := io.WriteString(w, "data")
		return err
	})
	if err == nil {
		t.Fatal("rename over a non-empty folder succeeded")
	}
	if extra := leftovers(t, dir, "late"); len(extra) != 0 {
		t.Errorf("temporary file left behind: %v", extra)
	}
}

func TestWriteAtomic_RelativePath(t *testing.T) {
	dir := t.TempDir()
	t.Chdir(dir)
	if err := WriteAtomic("rel.txt", writeString("ok")); err != nil {
		t.Fatal(err)
	}
	got, err := os.ReadFile(filepath.Join(dir, "rel.txt"))
	if err != nil || string(got) != "ok" {
		t.Fatalf("got %q, %v", got, err)
	}
}
