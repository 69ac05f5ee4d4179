//go:build unix

package fsutil

import (
	"errors"
	"os"
	"path/filepath"
	"strings"
	"syscall"
	"testing"
	"time"
)

// openSoon runs OpenRegular on another goroutine and fails the test if it
// has not returned after a long while: the bug this guards against is an
// open that never returns (a hang guard, not a speed check).
func openSoon(t *testing.T, path string) (*os.File, error) {
	t.Helper()
	type result struct {
		f   *os.File
		err error
	}
	done := make(chan result, 1)
	go func() {
		f, err := OpenRegular(path)
		done <- result{f, err}
	}()
	select {
	case r := <-done:
		return r.f, r.err
	case <-time.After(30 * time.Second):
		// Unblock the stuck open by opening the pipe's other end.
		if w, err := os.OpenFile(path, os.O_WRONLY|syscall.O_NONBLOCK, 0); err == nil {
			defer w.Close()
		}
		t.Fatalf("OpenRegular(%s) did not return", path)
		return nil, nil
	}
}

func TestOpenRegular(t *testing.T) {
	dir := t.TempDir()
	file := filepath.Join(dir, "pan.json")
	if err := os.WriteFile(file, []byte("{}"), 0o644); err != nil {
		t.Fatal(err)
	}
	fifo := filepath.Join(dir, "pipe.json")
	if err := syscall.Mkfifo(fifo, 0o644); err != nil {
		t.Skipf("cannot make a named pipe: %v", err)
	}
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
