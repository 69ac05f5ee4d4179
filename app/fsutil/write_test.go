package fsutil

import (
	"errors"
	"io"
	"os"
	"path/filepath"
	"strings"
	"testing"
	"time"
)

func readString(t *testing.T, path string) string {
	t.Helper()
	b, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	return string(b)
}

func TestWriteAtomic_ThroughSymlinkKeepsTheLink(t *testing.T) {
	dir := t.TempDir()
	real := filepath.Join(dir, "shots", "take.csv")
	if err := os.MkdirAll(filepath.Dir(real), 0o755); err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(real, []byte("old"), 0o640); err != nil {
		t.Fatal(err)
	}
	link := filepath.Join(dir, "take.csv")
	if err := os.Symlink(filepath.Join("shots", "take.csv"), link); err != nil { // relative link
		t.Fatal(err)
	}
	chain := filepath.Join(dir, "latest.csv")
	if err := os.Symlink(link, chain); err != nil { // a link to the link
		t.Fatal(err)
	}
	for i, p := range []string{link, chain} {
		want := "new " + string(rune('a'+i))
		if err := WriteAtomic(p, writeString(want)); err != nil {
			t.Fatal(err)
		}
		if fi, err := os.Lstat(p); err != nil || fi.Mode()&os.ModeSymlink == 0 {
			t.Errorf("%s is no longer a symbolic link", p)
		}
		if got := readString(t, real); got != want {
			t.Errorf("target holds %q, want %q", got, want)
		}
		if fi, _ := os.Stat(real); fi.Mode().Perm() != 0o640 {
			t.Errorf("target mode %v, want 0640", fi.Mode().Perm())
		}
	}
	if extra := leftovers(t, dir, "shots", "take.csv", "latest.csv"); len(extra) != 0 {
		t.Errorf("left behind %v", extra)
	}
	// A link whose target does not exist yet: the target is created.
	dangling := filepath.Join(dir, "next.csv")
	if err := os.Symlink(filepath.Join("shots", "next.csv"), dangling); err != nil {
		t.Fatal(err)
	}
	if err := WriteAtomic(dangling, writeString("first")); err != nil {
		t.Fatal(err)
	}
	if fi, err := os.Lstat(dangling); err != nil || fi.Mode()&os.ModeSymlink == 0 {
		t.Error("the dangling link was replaced")
	}
	if got := readString(t, filepath.Join(dir, "shots", "next.csv")); got != "first" {
		t.Errorf("new target holds %q", got)
	}
}

func TestWriteAtomic_ReadOnlyRefusedUnlessAsked(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "sheet.pdf")
	if err := os.WriteFile(path, []byte("keep"), 0o444); err != nil {
		t.Fatal(err)
	}
	err := WriteAtomic(path, writeString("new"))
	if !errors.Is(err, ErrReadOnly) || !strings.Contains(err.Error(), path) {
		t.Fatalf("err = %v, want ErrReadOnly naming %s", err, path)
	}
	if got := readString(t, path); got != "keep" {
		t.Errorf("the read-only file was changed to %q", got)
	}
	if err := WriteFile(path, Options{ReplaceReadOnly: true}, writeString("new")); err != nil {
		t.Fatal(err)
	}
	if got := readString(t, path); got != "new" {
		t.Errorf("got %q after replacing", got)
	}
	if fi, _ := os.Stat(path); fi.Mode().Perm() != 0o444 {
		t.Errorf("mode %v, want the old 0444", fi.Mode().Perm())
	}
}

func TestWriteAtomic_RemovesStaleTemporaryFiles(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "pan.json")
	old := time.Now().Add(-time.Hour)
	stale := []string{".pan.json.tmp-123456789", ".pan.json.tmp-42"}
	keep := []string{
		".pan.json.tmp-notdigits", // not a name CreateTemp makes
		".other.json.tmp-1234",    // another file's
		"pan.json.tmp-1234",       // not hidden: the user's
		".pan.json.tmp-777",       // ours but fresh: a save in progress elsewhere
	}
	for _, n := range append(append([]string{}, stale...), keep...) {
		p := filepath.Join(dir, n)
		if err := os.WriteFile(p, []byte("x"), 0o600); err != nil {
			t.Fatal(err)
		}
		if n != ".pan.json.tmp-777" {
			if err := os.Chtimes(p, old, old); err != nil {
				t.Fatal(err)
			}
		}
	}
	if err := WriteAtomic(path, writeString("{}")); err != nil {
		t.Fatal(err)
	}
	for _, n := range stale {
		if _, err := os.Lstat(filepath.Join(dir, n)); err == nil {
			t.Errorf("stale %s is still there", n)
		}
	}
	for _, n := range keep {
		if _, err := os.Lstat(filepath.Join(dir, n)); err != nil {
			t.Errorf("%s was removed", n)
		}
	}
}

func TestWriteAtomic_ErrorsNameTheOutput(t *testing.T) {
	dir := t.TempDir()
	// A name longer than the file system allows: the error is about the
	// output's name, not about a temporary file.
	path := filepath.Join(dir, strings.Repeat("n", 300)+".csv")
	err := WriteAtomic(path, writeString("x"))
	if err == nil {
		t.Fatal("no error for a 300-character name")
	}
	if strings.Contains(err.Error(), ".tmp-") || !strings.Contains(err.Error(), path) {
		t.Errorf("error %q should name %s and no temporary file", err, path)
	}
	// A failure after the temporary file exists (the rename over a folder
	// made while writing) also names the output only.
	late := filepath.Join(dir, "late.csv")
	err = WriteAtomic(late, func(w io.Writer) error {
		return os.MkdirAll(filepath.Join(late, "inner"), 0o755)
	})
	if err == nil || strings.Contains(err.Error(), ".tmp-") || !strings.Contains(err.Error(), late) {
		t.Errorf("rename failure: %v", err)
	}
	if extra := leftovers(t, dir, "late.csv"); len(extra) != 0 {
		t.Errorf("left behind %v", extra)
	}
}

func TestShortName(t *testing.T) {
	long := strings.Repeat("é", 200) // 400 bytes
	a, b := ShortName(long+"a", 100), ShortName(long+"b", 100)
	if len(a) > 100 || len(b) > 100 || a == b {
		t.Errorf("ShortName gives %d and %d bytes, equal %v", len(a), len(b), a == b)
	}
	if !strings.HasPrefix(a, strings.Repeat("é", 10)) || !strings.ContainsRune(a[len(a)-10:], '-') {
		t.Errorf("ShortName = %q", a)
	}
	if got := ShortName("frying-pan", 100); got != "frying-pan" {
		t.Errorf("a short name changed: %q", got)
	}
}
