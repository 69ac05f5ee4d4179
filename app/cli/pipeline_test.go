package cli

import (
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

// TestRun_ExportCSV_StartFrameZUp: --start-frame 1001 --up z numbers the
// rows from 1001 and turns every position by (x, y, z) -> (x, -z, y)
// (REFERENCES.md §13) against the plain export.
func TestRun_ExportCSV_StartFrameZUp(t *testing.T) {
	_, plain, _ := run(t, "export", brick, "--format", "csv", "-o", "-")
	code, zup, stderr := run(t, "export", brick, "--format", "csv", "--start-frame", "1001", "--up", "z", "-o", "-")
	if code != 0 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	a, b := strings.Split(strings.TrimSpace(plain), "\n"), strings.Split(strings.TrimSpace(zup), "\n")
	if len(a) != len(b) || a[0] != b[0] {
		t.Fatalf("%d and %d lines, headers %q %q", len(a), len(b), a[0], b[0])
	}
	for i := 1; i < len(a); i++ {
		p, z := strings.Split(a[i], ","), strings.Split(b[i], ",")
		num := func(s string) float64 { x, _ := strconv.ParseFloat(s, 64); return x }
		if num(z[0]) != num(p[0])+1001 || z[1] != p[1] {
			t.Errorf("row %d: frame %s time %s, plain %s %s", i, z[0], z[1], p[0], p[1])
		}
		if z[2] != p[2] || num(z[3]) != -num(p[4]) || z[4] != p[3] {
			t.Errorf("row %d: cg %v, plain %v", i, z[2:5], p[2:5])
		}
		if z[5] != p[5] || z[6] != p[6] || num(z[7]) != -num(p[8]) || z[8] != p[7] {
			t.Errorf("row %d: q %v, plain %v", i, z[5:9], p[5:9])
		}
	}
	for _, c := range []struct {
		args []string
		want string
	}{
		{[]string{"--up", "z", "-o", "t.glb"}, "--up z goes with csv"},
		{[]string{"--start-frame", "1001", "-o", "t.glb"}, "--start-frame goes with csv or png"},
		{[]string{"--start-frame", "-1", "-o", "t.csv"}, "--start-frame: must be 0 to"},
		{[]string{"--up", "x", "-o", "t.csv"}, "--up: unknown value x (use y, z)"},
	} {
		code, _, stderr := run(t, append([]string{"export", brick}, c.args...)...)
		if code != 2 || !strings.Contains(stderr, c.want) {
			t.Errorf("%q: exit %d, stderr %q, want %q", c.args, code, stderr, c.want)
		}
	}
}

// pdfText is the text of a PDF by pdftotext (poppler-utils), in layout
// order; the test is skipped without it.
func pdfText(t *testing.T, path string) string {
	t.Helper()
	exe, err := exec.LookPath("pdftotext")
	if err != nil {
		t.Skip("pdftotext is not installed (apt-get install poppler-utils)")
	}
	out, err := exec.Command(exe, "-layout", path, "-").Output()
	if err != nil {
		t.Fatalf("pdftotext: %v", err)
	}
	return string(out)
}

// TestRun_Sheet_StartFrameAndTimecode: a sheet starting at frame 1001 and
// 01:00:00:00, read back: the release row says 1001 and 01:00:00:00, the
// next 1002 and 01:00:00:01 (24 fps), and no frame 0 row is left. At
// 29.97 the header says HH:MM:SS;FF (drop-frame, SMPTE ST 12-1) and the
// labels use ';'; with --non-drop ':' again.
func TestRun_Sheet_StartFrameAndTimecode(t *testing.T) {
	dir := t.TempDir()
	out := filepath.Join(dir, "shot.pdf")
	code, _, stderr := run(t, "sheet", brick, "-o", out, "--start-frame", "1001", "--start-timecode", "01:00:00:00")
	if code != 0 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	text := pdfText(t, out)
	for _, want := range []string{"1001  01:00:00:00", "1002  01:00:00:01", "1025  01:00:01:00", "HH:MM:SS:FF", "release (frame 1001)"} {
		if !strings.Contains(strings.Join(strings.Fields(text), "  "), want) && !strings.Contains(text, want) {
			t.Errorf("sheet lacks %q", want)
		}
	}
	if strings.Contains(text, "00:00:00:00") {
		t.Errorf("the sheet still prints 00:00:00:00")
	}

	ntsc := brickWith(t, `"fps": 24,`, `"fps": "30000/1001",`)
	drop := filepath.Join(dir, "drop.pdf")
	if code, _, stderr := run(t, "sheet", ntsc, "-o", drop, "--start-timecode", "00:00:59;29"); code != 0 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	text = strings.Join(strings.Fields(pdfText(t, drop)), " ")
	for _, want := range []string{"HH:MM:SS;FF DF", "00:00:59;29", "00:01:00;02"} {
		if !strings.Contains(text, want) {
			t.Errorf("drop-frame sheet lacks %q", want)
		}
	}
	nd := filepath.Join(dir, "nondrop.pdf")
	if code, _, stderr := run(t, "sheet", ntsc, "-o", nd, "--non-drop", "--start-timecode", "00:00:59:29"); code != 0 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	text = strings.Join(strings.Fields(pdfText(t, nd)), " ")
	for _, want := range []string{"HH:MM:SS:FF NDF", "00:00:59:29", "00:01:00:00"} {
		if !strings.Contains(text, want) {
			t.Errorf("non-drop sheet lacks %q", want)
		}
	}
	if code, _, stderr := run(t, "sheet", ntsc, "-o", nd, "--start-timecode", "00:01:00;00"); code != 2 || !strings.Contains(stderr, "--start-timecode") {
		t.Errorf("a skipped drop-frame label: exit %d, %q", code, stderr)
	}
	if entries, _ := os.ReadDir(dir); len(entries) != 3 {
		t.Errorf("%d files written", len(entries))
	}
}
