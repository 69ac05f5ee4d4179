package main

import (
	"bytes"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"
)

// TestBinary_StderrContract builds the real program and checks the command
// line's stream contract (DESIGN.md "CLI") under the POSIX locale that many
// Debian machines default to: a good check prints nothing on stderr, a bad
// file exactly one line naming the file and the field, with status 2.
func TestBinary_StderrContract(t *testing.T) {
	if testing.Short() {
		t.Skip("builds the program")
	}
	bin := filepath.Join(t.TempDir(), "propflight")
	build := exec.Command("go", "build", "-o", bin, ".")
	if out, err := build.CombinedOutput(); err != nil {
		t.Fatalf("build: %v\n%s", err, out)
	}
	bad := filepath.Join(t.TempDir(), "bad.json")
	os.WriteFile(bad, []byte(`{"format": "propflight/v1", "prop": {"parts": [{"shape": "box", "size": [0.2, 0.1, 0.05], "mass": -2}]}}`), 0o644)
	for _, lang := range []string{"C.UTF-8", "C", "en_GB.UTF-8"} {
		run := func(args ...string) (int, string, string) {
			cmd := exec.Command(bin, args...)
			cmd.Env = append(os.Environ(), "LANG="+lang, "LC_ALL=")
			var o, e bytes.Buffer
			cmd.Stdout, cmd.Stderr = &o, &e
			err := cmd.Run()
			code := 0
			if ee, ok := err.(*exec.ExitError); ok {
				code = ee.ExitCode()
			} else if err != nil {
				t.Fatal(err)
			}
			return code, o.String(), e.String()
		}
		if code, out, errs := run("check", "--json"); code != 0 || errs != "" || !strings.HasPrefix(out, "{") {
			t.Errorf("LANG=%s check --json: exit %d, stderr %q", lang, code, errs)
		}
		code, out, errs := run("check", bad)
		lines := strings.Split(strings.TrimRight(errs, "\n"), "\n")
		if code != 2 || out != "" || len(lines) != 1 || !strings.Contains(errs, "bad.json") || !strings.Contains(errs, "mass") {
			t.Errorf("LANG=%s bad file: exit %d, stdout %q, stderr %q", lang, code, out, errs)
		}
	}
}
