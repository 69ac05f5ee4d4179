//go:build unix

package cli

import (
	"os"
	"path/filepath"
	"strings"
	"syscall"
	"testing"
	"time"
)

func TestRun_NamedPipeAsProject(t *testing.T) {
	pipe := filepath.Join(t.TempDir(), "pan.json")
	if err := syscall.Mkfifo(pipe, 0o644); err != nil {
		t.Skipf("cannot make a named pipe: %v", err)
	}
	type result struct {
		code   int
		stderr string
	}
	done := make(chan result, 1)
	go func() {
		code, _, stderr := run(t, "check", pipe)
		done <- result{code, stderr}
	}()
	select {
	case r := <-done:
		if r.code != ExitInput || !strings.Contains(r.stderr, pipe+": is a named pipe, not a project file") {
			t.Errorf("exit %d: %s", r.code, r.stderr)
		}
	case <-time.After(30 * time.Second): // hang guard: the bug is a check that never returns
		if w, err := os.OpenFile(pipe, os.O_WRONLY|syscall.O_NONBLOCK, 0); err == nil {
			w.Close()
		}
		t.Fatal("check on a named pipe did not return")
	}
}

func TestRun_EmptyPathRefused(t *testing.T) {
	for _, args := range [][]string{
		{"check", ""},
		{""},
		{"open", ""},
		{"sheet", "", "-o", filepath.Join(t.TempDir(), "x.pdf")},
		{"export", testdataBrick(), "--format", "csv", "-o", ""},
		{"check", "--preset", ""},
	} {
		code, out, stderr := run(t, args...)
		if code != ExitInput || out != "" || !strings.Contains(stderr, "empty") {
			t.Errorf("%q: exit %d, stdout %q, stderr %q", args, code, out, stderr)
		}
	}
}

func testdataBrick() string { return brick }
