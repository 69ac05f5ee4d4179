package cli

import (
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// hostileNames is the brick sample with control characters in the project
// name and the part name: ESC sequences (colour, clear screen, window
// title), BEL, CR/LF, a C1 CSI and DEL.
func hostileNames(t *testing.T) string {
	t.Helper()
	data, err := os.ReadFile(brick)
	if err != nil {
		t.Fatal(err)
	}
	s := strings.Replace(string(data), `"brick flip (contract sample)"`, `"pan\u001b[31mRED\u001b[2J\u001b]0;owned\u0007\r\nfake line\u009b\u007f"`, 1)
	s = strings.Replace(s, `"name": "brick"`, `"name": "head\u001b[1m\u0007"`, 1)
	return writeFile(t, "hostile.json", s)
}

// noControls fails when s holds a control character other than the
// newlines that end lines.
func noControls(t *testing.T, what, s string) {
	t.Helper()
	for _, r := range s {
		if (r < 0x20 && r != '\n') || (r >= 0x7f && r < 0xa0) {
			t.Errorf("%s holds control character U+%04X:\n%q", what, r, s)
			return
		}
	}
}

func TestNames_ControlCharactersEscapedOnTheTerminal(t *testing.T) {
	path := hostileNames(t)
	for _, args := range [][]string{
		{"check", path},
		{"check", path, "--json"},
		{"sheet", path, "-o", filepath.Join(t.TempDir(), "s.pdf")},
		{"export", path, "--format", "csv", "-o", filepath.Join(t.TempDir(), "t.csv")},
		{"export", path, "--format", "gltf", "-o", filepath.Join(t.TempDir(), "t.glb")},
		{"map", path, "--samples", "50"},
		{"plan", path, "--land", "least:up"},
		{"spread", path, "--samples", "20"},
	} {
		code, out, errs := run(t, args...)
		if code != 0 {
			t.Fatalf("%v: exit %d: %s", args, code, errs)
		}
		noControls(t, strings.Join(args[:1], " ")+" stdout", out)
		noControls(t, strings.Join(args[:1], " ")+" stderr", errs)
		if len(args) == 2 && !strings.Contains(out, `pan\x1b[31mRED`) {
			t.Errorf("check does not show the escaped name:\n%s", out)
		}
	}
	// The file keeps the name as written.
	data, _ := os.ReadFile(path)
	if !strings.Contains(string(data), `\u001b[31m`) {
		t.Error("the project file changed")
	}
}
