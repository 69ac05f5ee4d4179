//go:build unix

package meshio

import (
	"os"
	"path/filepath"
	"strings"
	"syscall"
	"testing"
	"time"
)

// TestReadFile_NamedPipeRefused: a mesh file that is a named pipe is
// refused at once instead of blocking the load forever.
func TestReadFile_NamedPipeRefused(t *testing.T) {
	pipe := filepath.Join(t.TempDir(), "pan.stl")
	if err := syscall.Mkfifo(pipe, 0o644); err != nil {
		t.Skipf("cannot make a named pipe: %v", err)
	}
	done := make(chan error, 1)
	go func() {
		_, err := ReadFile(pipe, Options{})
		done <- err
	}()
	select {
	case err := <-done:
		if err == nil || !strings.Contains(err.Error(), "named pipe") {
			t.Errorf("err = %v, want a refusal of the named pipe", err)
		}
	case <-time.After(30 * time.Second): // hang guard, not a speed check
		if w, err := os.OpenFile(pipe, os.O_WRONLY|syscall.O_NONBLOCK, 0); err == nil {
			w.Close()
		}
		t.Fatal("ReadFile on a named pipe did not return")
	}
}
