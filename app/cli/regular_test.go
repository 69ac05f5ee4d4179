//go:build unix

package cli

import (
	"path/filepath"
	"strings"
	"testing"

	"propflight/internal/pipetest"
)

func TestRun_NamedPipeAsProject(t *testing.T) {
	pipe := pipetest.Make(t, t.TempDir(), "pan.json")
	type result struct {
		code   int
		stderr string
	}
	r := pipetest.Within(t, pipe, func() result {
		code, _, stderr := run(t, "check", pipe)
		return result{code, stderr}
	})
	if r.code != ExitInput || !strings.Contains(r.stderr, pipe+": is a named pipe, not a project file") {
		t.Errorf("exit %d: %s", r.code, r.stderr)
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

// TestRun_OutputIsAFolder: -o naming a folder is a mistake in the command
// line (exit 2, saying so), not a failure of the program.
func TestRun_OutputIsAFolder(t *testing.T) {
	dir := t.TempDir()
	for _, args := range [][]string{
		{"export", testdataBrick(), "--format", "csv", "-o", dir},
		{"sheet", testdataBrick(), "-o", dir},
	} {
		code, _, stderr := run(t, args...)
		if code != ExitInput || !strings.Contains(stderr, dir+": is a folder; give -o a file name") {
			t.Errorf("%q: exit %d, stderr %q", args, code, stderr)
		}
	}
}
