package cli

import (
	"bytes"
	"encoding/json"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"

	"propflight/app/footage"
	"propflight/internal/mark"
)

// writeRef6Marks writes REFERENCES.md §6's noisy data as a marks file:
// y_n = 400 - 30 n + 4.256358507 n^2 plus §6's noise list, n = 0..11, and
// x_n = 100 + 5 n (our own straight line; §6 gives y only).
func writeRef6Marks(t *testing.T, dir string) string {
	t.Helper()
	noise := []float64{0.3, -0.2, 0.1, 0.4, -0.5, 0.2, 0.0, -0.3, 0.25, -0.1, 0.35, -0.4}
	var marks []mark.Mark
	for n := range 12 {
		f := float64(n)
		marks = append(marks, mark.Mark{Frame: n, X: 100 + 5*f, Y: 400 - 30*f + 4.256358507*f*f + noise[n]})
	}
	var buf bytes.Buffer
	if err := footage.WriteMarks(&buf, marks); err != nil {
		t.Fatal(err)
	}
	p := filepath.Join(dir, "marks.csv")
	if err := os.WriteFile(p, buf.Bytes(), 0o644); err != nil {
		t.Fatal(err)
	}
	return p
}

func relClose(got, want float64) bool { return math.Abs(got-want) <= 1e-8*math.Abs(want) }

// TestRun_FitJSON checks the --json object against REFERENCES.md §6's
// noisy check values (Kiusalaas §3.4; computed there).
func TestRun_FitJSON(t *testing.T) {
	p := writeRef6Marks(t, t.TempDir())
	code, out, errOut := run(t, "fit", p, "--fps", "24", "--gravity=9.80665", "--json")
	if code != ExitOK || errOut != "" {
		t.Fatalf("exit %d, stderr %q", code, errOut)
	}
	var j map[string]any
	if err := json.Unmarshal([]byte(out), &j); err != nil {
		t.Fatalf("stdout is not JSON: %v\n%s", err, out)
	}
	var keys []string
	for k := range j {
		keys = append(keys, k)
	}
	slices.Sort(keys)
	wantKeys := []string{"apex_frame", "gravity_px_per_frame2", "hint", "metres_per_pixel", "release_velocity_px_per_frame",
		"rms_px", "turn_deg_per_frame", "turn_rms_deg"}
	if !slices.Equal(keys, wantKeys) {
		t.Errorf("keys %v, want %v", keys, wantKeys)
	}
	if g := j["gravity_px_per_frame2"].(float64); !relClose(g, 8.514415316) {
		t.Errorf("gravity_px_per_frame2 %.10g, want 8.514415316", g)
	}
	if s := j["metres_per_pixel"].(float64); !relClose(s, 0.001999601076) {
		t.Errorf("metres_per_pixel %.10g, want 0.001999601076", s)
	}
	code, out, _ = run(t, "fit", "--json", p, "--fps=24")
	if code != ExitOK || !strings.Contains(out, `"metres_per_pixel": null`) {
		t.Errorf("no gravity: exit %d\n%s", code, out)
	}
}

func TestRun_FitSummary(t *testing.T) {
	p := writeRef6Marks(t, t.TempDir())
	code, out, errOut := run(t, "fit", p, "--fps", "24", "--gravity", "9.80665")
	if code != ExitOK || errOut != "" {
		t.Fatalf("exit %d, stderr %q", code, errOut)
	}
	for _, s := range []string{"12 marks on frames 0 to 11", "8.51442 px/frame^2", "0.0019996 m/px (gravity 9.80665 m/s^2 at 24 fps)",
		"vy 30.0251 px/frame (y up)", "px RMS", "turn       none", "throw", "to the right"} {
		if !strings.Contains(out, s) {
			t.Errorf("summary lacks %q:\n%s", s, out)
		}
	}
	// f = sqrt(g / (2 c2 s)) = 24 sqrt(0.001999601076 / 0.002) from §6's
	// measured scale at 24 fps.
	code, out, _ = run(t, "fit", p, "--gravity", "9.80665", "--scale", "0.002")
	if want := fmt.Sprintf("frame rate %.6g fps solved", 24*math.Sqrt(0.001999601076/0.002)); code != ExitOK || !strings.Contains(out, want) {
		t.Errorf("solved fps: exit %d\n%s", code, out)
	}
	if code, _, errOut := run(t, "fit", p, "--fps", "23.976"); code != ExitOK {
		t.Errorf("--fps 23.976: exit %d, %s", code, errOut)
	}
}

// TestRun_FitBadInput: every problem with the marks is exit 2 with one line
// naming the file, the line and the column.
func TestRun_FitBadInput(t *testing.T) {
	dir := t.TempDir()
	bad := filepath.Join(dir, "bad.csv")
	os.WriteFile(bad, []byte("frame,x,y\n0,1,2\n2,abc,4\n"), 0o644)
	flat := filepath.Join(dir, "flat.csv")
	os.WriteFile(flat, []byte("0,1,10\n1,2,20\n2,3,30\n3,4,40\n"), 0o644)
	two := filepath.Join(dir, "two.csv")
	os.WriteFile(two, []byte("0,1,10\n1,2,20\n"), 0o644)
	missing := filepath.Join(dir, "nope.csv")
	for _, tc := range []struct {
		name string
		args []string
		want string
	}{
		{"no args", []string{"fit"}, "fit: the marks file is missing"},
		{"missing file", []string{"fit", missing, "--fps", "24"}, missing + ": cannot open: no such file"},
		{"bad cell", []string{"fit", bad, "--fps", "24"}, bad + ": line 3: x: not a number"},
		{"straight marks", []string{"fit", flat, "--fps", "24"}, flat + ": marks: the marks do not curve downward"},
		{"two marks", []string{"fit", two, "--fps", "24", "--json"}, two + ": marks: need at least 3"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			code, out, errOut := run(t, tc.args...)
			if code != ExitInput || out != "" || strings.Count(errOut, "\n") != 1 || !strings.Contains(errOut, tc.want) {
				t.Errorf("exit %d, stdout %q, stderr %q; want exit 2 and %q", code, out, errOut, tc.want)
			}
		})
	}
}

func TestRun_FitWriteFailure(t *testing.T) {
	p := writeRef6Marks(t, t.TempDir())
	var e bytes.Buffer
	if code := Run([]string{"fit", p, "--fps", "24"}, failingWriter{}, &e, nil); code != ExitFailure || !strings.Contains(e.String(), "broken pipe") {
		t.Errorf("exit %d, stderr %q", code, e.String())
	}
}
