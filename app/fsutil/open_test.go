//go:build unix

package fsutil

import (
	"errors"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"propflight/internal/pipetest"
)

// openSoon runs OpenRegular on path under the hang guard of the pipe
// (the bug it guards against is an open that never returns).
func openSoon(t *testing.T, path string) (*os.File, error) {
	t.Helper()
	type result struct {
		f   *os.File
		err error
	}
	r := pipetest.Within(t, path, func() result {
		f, err := OpenRegular(path)
		return result{f, err}
	})
	return r.f, r.err
}

func TestOpenRegular(t *testing.T) {
	dir := t.TempDir()
	file := filepath.Join(dir, "pan.json")
	if err := os.WriteFile(file, []byte("{}"), 0o644); err != nil {
		t.Fatal(err)
	}
	fifo := pipetest.Make(t, dir, "pipe.json")
	link := filepath.Join(dir, "link.json")
	if err := os.Symlink(file, link); err != nil {
		t.Fatal(err)
	}
	pipeLink := filepath.Join(dir, "pipelink.json")
	if err := os.Symlink(fifo, pipeLink); err != nil {
		t.Fatal(err)
	}

	for _, path := range []string{file, link} {
		f, err := openSoon(t, path)
		if err != nil {
			t.Errorf("%s: %v", path, err)
			continue
		}
		b := make([]byte, 8)
		n, err := f.Read(b)
		if err != nil || string(b[:n]) != "{}" {
			t.Errorf("%s: read %q, %v", path, b[:n], err)
		}
		f.Close()
	}
	for _, tt := range []struct{ path, kind string }{
		{fifo, "is a named pipe"},
		{pipeLink, "is a named pipe"},
		{dir, "is a folder"},
		{"/dev/null", "is a character device"},
	} {
		f, err := openSoon(t, tt.path)
		if err == nil {
			f.Close()
			t.Errorf("%s: opened", tt.path)
			continue
		}
		if !errors.Is(err, ErrNotRegular) || !strings.Contains(err.Error(), tt.kind) || !strings.Contains(err.Error(), tt.path) {
			t.Errorf("%s: error %q, want ErrNotRegular saying %q", tt.path, err, tt.kind)
		}
	}
	if _, err := OpenRegular(filepath.Join(dir, "none.json")); !errors.Is(err, os.ErrNotExist) {
		t.Errorf("missing file: %v", err)
	}
}
