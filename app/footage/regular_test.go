//go:build unix

package footage

import (
	"errors"
	"os"
	"path/filepath"
	"strings"
	"syscall"
	"testing"
	"time"

	"propflight/app/fsutil"
)

// openGuarded runs Open on another goroutine; if it has not returned after
// a long while it opens the pipe's writing end to free it and fails (a hang
// guard: the bug is an open that never returns, not a slow one).
func openGuarded(t *testing.T, path, pipe string) error {
	t.Helper()
	done := make(chan error, 1)
	go func() {
		_, err := Open(path, Options{})
		done <- err
	}()
	select {
	case err := <-done:
		return err
	case <-time.After(30 * time.Second):
		if w, err := os.OpenFile(pipe, os.O_WRONLY|syscall.O_NONBLOCK, 0); err == nil {
			w.Close()
		}
		t.Fatalf("Open(%s) did not return", path)
		return nil
	}
}

func TestOpen_NamedPipeIsRefused(t *testing.T) {
	dir := t.TempDir()
	// A named pipe as the footage itself.
	pipe := filepath.Join(dir, "clip.gif")
	if err := syscall.Mkfifo(pipe, 0o644); err != nil {
		t.Skipf("cannot make a named pipe: %v", err)
	}
	err := openGuarded(t, pipe, pipe)
	var fe *Error
	if !errors.As(err, &fe) || !errors.Is(err, fsutil.ErrNotRegular) || !strings.Contains(err.Error(), "named pipe") {
		t.Errorf("pipe as footage: %v", err)
	}

	// A named pipe among a folder's frames.
	frames := filepath.Join(dir, "frames")
	if err := os.Mkdir(frames, 0o755); err != nil {
		t.Fatal(err)
	}
	writePNG(t, filepath.Join(frames, "f0001.png"), indexFrame(8, 6, 1))
	framePipe := filepath.Join(frames, "f0002.png")
	if err := syscall.Mkfifo(framePipe, 0o644); err != nil {
		t.Fatal(err)
	}
	err = openGuarded(t, frames, framePipe)
	if !errors.As(err, &fe) || fe.File != framePipe || !strings.Contains(err.Error(), "named pipe") {
		t.Errorf("pipe among the frames: %v", err)
	}
}
