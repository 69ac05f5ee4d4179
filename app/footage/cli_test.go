package footage

import (
	"bytes"
	"encoding/json"
	"errors"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"
)

// writeRef6CSV writes REFERENCES.md §6's noisy data (full precision) as a
// marks file and returns its path.
func writeRef6CSV(t *testing.T, dir string) string {
	t.Helper()
	var buf bytes.Buffer
	if err := WriteMarks(&buf, ref6Marks(true)); err != nil {
		t.Fatal(err)
	}
	p := filepath.Join(dir, "marks.csv")
	if err := os.WriteFile(p, buf.Bytes(), 0o644); err != nil {
		t.Fatal(err)
	}
	return p
}

func runFit(args ...string) (code int, stdout, stderr string) {
	var o, e bytes.Buffer
	code = RunFit(args, &o, &e)
	return code, o.String(), e.String()
}

// TestRunFit_JSON checks the --json object against REFERENCES.md §6's
// noisy check values (Kiusalaas §3.4; computed there).
func TestRunFit_JSON(t *testing.T) {
	p := writeRef6CSV(t, t.TempDir())
	code, out, errOut := runFit(p, "--fps", "24", "--gravity=9.80665", "--json")
	if code != ExitOK || errOut != "" {
		t.Fatalf("exit %d, stderr %q", code, errOut)
	}
	var j map[string]any
	if err := json.Unmarshal([]byte(out), &j); err != nil {
		t.Fatalf("stdout is not JSON: %v\n%s", err, out)
	}
	keys := make([]string, 0, len(j))
	for k := range j {
		keys = append(keys, k)
	}
	slices.Sort(keys)
	want := []string{"apex_frame", "gravity_px_per_frame2", "hint", "metres_per_pixel", "release_velocity_px_per_frame",
		"rms_px", "turn_deg_per_frame", "turn_rms_deg"}
	if !slices.Equal(keys, want) {
		t.Errorf("keys %v, want %v", keys, want)
	}
	checkRel(t, "gravity_px_per_frame2", j["gravity_px_per_frame2"].(float64), 8.514415316, closeTol)
	checkRel(t, "metres_per_pixel", j["metres_per_pixel"].(float64), 0.001999601076, closeTol)
	v := j["release_velocity_px_per_frame"].([]any)
	checkRel(t, "vx", v[0].(float64), 5, closeTol)
	checkRel(t, "vy", v[1].(float64), 30.02507493, closeTol) // -c1 at frame 0, y up
	for _, k := range []string{"turn_deg_per_frame", "turn_rms_deg", "hint"} {
		if j[k] != nil {
			t.Errorf("%s = %v, want null without orientation marks", k, j[k])
		}
	}

	// Without gravity there is no scale.
	code, out, _ = runFit("--json", p, "--fps=24")
	if code != ExitOK || !strings.Contains(out, `"metres_per_pixel": null`) {
		t.Errorf("no gravity: exit %d\n%s", code, out)
	}
}

func TestRunFit_Summary(t *testing.T) {
	p := writeRef6CSV(t, t.TempDir())
	code, out, errOut := runFit(p, "--fps", "24", "--gravity", "9.80665")
	if code != ExitOK || errOut != "" {
		t.Fatalf("exit %d, stderr %q", code, errOut)
	}
	for _, s := range []string{"12 marks on frames 0 to 11", "8.51442 px/frame^2", "0.0019996 m/px (gravity 9.80665 m/s^2 at 24 fps)",
		"vy 30.0251 px/frame (y up)", "px RMS", "turn       none", "throw", "to the right"} {
		if !strings.Contains(out, s) {
			t.Errorf("summary lacks %q:\n%s", s, out)
		}
	}
	// Solving the frame rate from a known scale; 24000/1001 and the NTSC
	// names go through physics.ParseRate.
	// f = sqrt(g / (2 c2 s)) = 24 sqrt(0.001999601076 / 0.002) from §6's
	// measured scale at 24 fps: 23.99760.
	code, out, _ = runFit(p, "--gravity", "9.80665", "--scale", "0.002")
	if want := fmt.Sprintf("frame rate %.6g fps solved", 24*math.Sqrt(0.001999601076/0.002)); code != ExitOK || !strings.Contains(out, want) {
		t.Errorf("solved fps: exit %d\n%s", code, out)
	}
	if code, _, errOut := runFit(p, "--fps", "23.976"); code != ExitOK {
		t.Errorf("--fps 23.976: exit %d, %s", code, errOut)
	}
	if code, out, _ := runFit("-h"); code != ExitOK || !strings.HasPrefix(out, "usage: propflight fit") {
		t.Errorf("-h: exit %d, %q", code, out)
	}
}

func TestRunFit_BadInput(t *testing.T) {
	dir := t.TempDir()
	p := writeRef6CSV(t, dir)
	bad := filepath.Join(dir, "bad.csv")
	os.WriteFile(bad, []byte("frame,x,y\n0,1,2\n2,abc,4\n"), 0o644)
	flat := filepath.Join(dir, "flat.csv")
	os.WriteFile(flat, []byte("0,1,10\n1,2,20\n2,3,30\n3,4,40\n"), 0o644)
	two := filepath.Join(dir, "two.csv")
	os.WriteFile(two, []byte("0,1,10\n1,2,20\n"), 0o644)
	missing := filepath.Join(dir, "nope.csv")
	tests := []struct {
		name string
		args []string
		want string
	}{
		{"no args", nil, "the marks file is missing"},
		{"no fps", []string{p}, "--fps: required"},
		{"bad fps", []string{p, "--fps", "fast"}, `--fps: "fast"`},
		{"zero fps", []string{p, "--fps", "0"}, "--fps"},
		{"fps without value", []string{p, "--fps"}, "--fps needs a value"},
		{"bad gravity", []string{p, "--fps", "24", "--gravity", "-9.8"}, `--gravity: "-9.8" must be positive`},
		{"bad scale", []string{p, "--fps", "24", "--scale", "NaN"}, `--scale: "NaN" is not a number`},
		{"unknown flag", []string{p, "--fps", "24", "--fast"}, "unknown flag --fast"},
		{"json with value", []string{p, "--fps", "24", "--json=yes"}, "--json takes no value"},
		{"two files", []string{p, p, "--fps", "24"}, "one marks file"},
		{"missing file", []string{missing, "--fps", "24"}, missing + ": cannot open"},
		{"bad cell", []string{bad, "--fps", "24"}, bad + ": line 3: x: not a number"},
		{"straight marks", []string{flat, "--fps", "24"}, flat + ": marks: the marks do not curve downward"},
		{"two marks", []string{two, "--fps", "24", "--json"}, two + ": marks: need at least 3"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			code, out, errOut := runFit(tc.args...)
			if code != ExitBadUse {
				t.Errorf("exit %d, want %d", code, ExitBadUse)
			}
			if out != "" {
				t.Errorf("stdout %q, want nothing", out)
			}
			if !strings.Contains(errOut, tc.want) {
				t.Errorf("stderr %q lacks %q", errOut, tc.want)
			}
		})
	}
}

type failWriter struct{}

func (failWriter) Write([]byte) (int, error) { return 0, errors.New("disk full") }

func TestRunFit_WriteFailure(t *testing.T) {
	p := writeRef6CSV(t, t.TempDir())
	var e bytes.Buffer
	if code := RunFit([]string{p, "--fps", "24"}, failWriter{}, &e); code != ExitFailure || !strings.Contains(e.String(), "disk full") {
		t.Errorf("exit %d, stderr %q", code, e.String())
	}
}
