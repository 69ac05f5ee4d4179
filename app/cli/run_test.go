package cli

import (
	"bytes"
	"encoding/json"
	"errors"
	"math"
	"os"
	"path/filepath"
	"slices"
	"strconv"
	"strings"
	"testing"

	"propflight/app/export"
	"propflight/app/project"
	"propflight/assets"
	"propflight/physics"
)

// brick is the contract sample (/work/shared/samples/brick-flip.json,
// copied): a 2 kg box 0.2 x 0.1 x 0.05 m spun at 2 turns/s about its middle
// axis, tilted 2 degrees toward the least axis.
const brick = "testdata/brick-flip.json"

var itoa = strconv.Itoa

// run calls Run with buffers and no window.
func run(t *testing.T, args ...string) (code int, stdout, stderr string) {
	t.Helper()
	var out, errb bytes.Buffer
	code = Run(args, &out, &errb, nil)
	return code, out.String(), errb.String()
}

// writeFile writes a project into a temporary folder and returns its path.
func writeFile(t *testing.T, name, content string) string {
	t.Helper()
	path := filepath.Join(t.TempDir(), name)
	if err := os.WriteFile(path, []byte(content), 0o644); err != nil {
		t.Fatal(err)
	}
	return path
}

func brickWith(t *testing.T, old, new string) string {
	t.Helper()
	data, err := os.ReadFile(brick)
	if err != nil {
		t.Fatal(err)
	}
	s := string(data)
	if !strings.Contains(s, old) {
		t.Fatalf("sample lacks %q", old)
	}
	return writeFile(t, "edited.json", strings.Replace(s, old, new, 1))
}

var checkKeys = []string{"mass_kg", "center_of_mass", "inertia_tensor", "principal_moments", "principal_axes",
	"symmetry", "motion", "excursion_deg", "wobbles_per_turn", "flip_period_s", "flight_frames",
	"flight_time_s", "apex_frame", "landing_frame"}

// decodeCheck parses check --json output strictly: one object, the exact
// key set, and the type of every key.
func decodeCheck(t *testing.T, stdout string) map[string]any {
	t.Helper()
	dec := json.NewDecoder(strings.NewReader(stdout))
	var m map[string]any
	if err := dec.Decode(&m); err != nil {
		t.Fatalf("stdout is not a JSON object: %v\n%s", err, stdout)
	}
	if dec.More() {
		t.Fatalf("more than one JSON value on stdout")
	}
	var keys []string
	for k := range m {
		keys = append(keys, k)
	}
	slices.Sort(keys)
	want := slices.Clone(checkKeys)
	slices.Sort(want)
	if !slices.Equal(keys, want) {
		t.Fatalf("keys %v, want exactly %v", keys, want)
	}
	isNum := func(v any) bool { _, ok := v.(float64); return ok }
	isInt := func(v any) bool { x, ok := v.(float64); return ok && x == math.Trunc(x) && x >= 0 }
	vec3 := func(v any) bool {
		a, ok := v.([]any)
		return ok && len(a) == 3 && isNum(a[0]) && isNum(a[1]) && isNum(a[2])
	}
	mat3 := func(v any) bool {
		a, ok := v.([]any)
		return ok && len(a) == 3 && vec3(a[0]) && vec3(a[1]) && vec3(a[2])
	}
	orNull := func(f func(any) bool) func(any) bool { return func(v any) bool { return v == nil || f(v) } }
	str := func(allowed ...string) func(any) bool {
		return func(v any) bool { s, ok := v.(string); return ok && slices.Contains(allowed, s) }
	}
	for k, ok := range map[string]func(any) bool{
		"mass_kg": isNum, "center_of_mass": vec3, "inertia_tensor": mat3, "principal_moments": vec3,
		"principal_axes": mat3, "symmetry": str("none", "prolate", "oblate", "spherical"),
		"motion": str("spin", "tumble", "wobble"), "excursion_deg": isNum,
		"wobbles_per_turn": orNull(isNum), "flip_period_s": orNull(isNum),
		"flight_frames": isInt, "flight_time_s": isNum, "apex_frame": isInt, "landing_frame": isInt,
	} {
		if !ok(m[k]) {
			t.Errorf("key %s has an unexpected value %v", k, m[k])
		}
	}
	return m
}

func nums(v any) []float64 {
	var out []float64
	for _, x := range v.([]any) {
		out = append(out, x.(float64))
	}
	return out
}

func TestRun_CheckJSON_ContractSample(t *testing.T) {
	code, stdout, stderr := run(t, "check", brick, "--json")
	if code != 0 || stderr != "" {
		t.Fatalf("exit %d, stderr %q", code, stderr)
	}
	m := decodeCheck(t, stdout)
	// Solid cuboid m(b^2+c^2)/12 etc. (Wikipedia "List of moments of
	// inertia"; REFERENCES.md §1.2 box row).
	want := []float64{0.002083333333, 0.007083333333, 0.008333333333}
	for i, got := range nums(m["principal_moments"]) {
		if math.Abs(got-want[i]) > 1e-9 {
			t.Errorf("principal moment %d = %.12g, want %.12g", i+1, got, want[i])
		}
	}
	if m["mass_kg"] != 2.0 || m["symmetry"] != "none" || m["motion"] != "tumble" {
		t.Errorf("mass %v symmetry %v motion %v, want 2, none, tumble", m["mass_kg"], m["symmetry"], m["motion"])
	}
	if m["wobbles_per_turn"] != nil {
		t.Errorf("wobbles_per_turn = %v for an asymmetric body", m["wobbles_per_turn"])
	}
	if fp, ok := m["flip_period_s"].(float64); !ok || !(fp > 0) {
		t.Errorf("flip_period_s = %v for a tumble", m["flip_period_s"])
	}
	landing, frames := m["landing_frame"].(float64), m["flight_frames"].(float64)
	if frames != landing+1 {
		t.Errorf("flight_frames %v, landing_frame %v", frames, landing)
	}
	// Projectile bounds (REFERENCES.md §5.1: y = y0 + vy t - g t^2 / 2 with
	// g_n): the brick lands before its centre of mass would reach the ground
	// and after it would reach the half diagonal 0.5 sqrt(0.2^2+0.1^2+0.05^2).
	g, vy, y0 := 9.80665, 4.0, 1.5
	fall := func(h float64) float64 { return (vy + math.Sqrt(vy*vy+2*g*(y0-h))) / g }
	half := 0.5 * math.Sqrt(0.2*0.2+0.1*0.1+0.05*0.05)
	ft := m["flight_time_s"].(float64)
	if ft > fall(0) || ft < fall(half) {
		t.Errorf("flight_time_s %.4f outside [%.4f, %.4f]", ft, fall(half), fall(0))
	}
	if landing != math.Floor(ft*24) {
		t.Errorf("landing_frame %v, want floor(%g * 24)", landing, ft)
	}
	if apex := m["apex_frame"].(float64); apex != math.Round(24*vy/g) {
		t.Errorf("apex_frame %v, want round(24 vy / g) = %v", apex, math.Round(24*vy/g))
	}
	// principal_axes row i is axis i: for an unrotated box, the x, y, z axes.
	for i, row := range m["principal_axes"].([]any) {
		r := nums(row)
		if math.Abs(math.Abs(r[i])-1) > 1e-12 {
			t.Errorf("principal axis %d = %v", i+1, r)
		}
	}
}

// judged computes what check must report for a project, straight from the
// packages below the CLI.
func judged(t *testing.T, data []byte) (*project.Scene, physics.Verdict, *physics.Take) {
	t.Helper()
	doc, err := project.Parse("x.json", data)
	if err != nil {
		t.Fatal(err)
	}
	sc, err := doc.Build()
	if err != nil {
		t.Fatal(err)
	}
	v := physics.Judge(&sc.Mass, &sc.Throw, sc.Thresholds)
	take, err := physics.Simulate(&sc.Prop, &sc.Mass, &sc.Throw)
	if err != nil {
		t.Fatal(err)
	}
	return sc, v, take
}

func TestRun_CheckJSON_EveryPreset(t *testing.T) {
	for _, name := range assets.PresetNames() {
		code, stdout, stderr := run(t, "check", "--preset", name, "--json")
		if code != 0 {
			t.Fatalf("%s: exit %d: %s", name, code, stderr)
		}
		m := decodeCheck(t, stdout)
		data, _ := assets.Preset(name)
		sc, v, take := judged(t, data)
		if m["motion"] != v.Motion.String() || m["symmetry"] != v.Symmetry.String() {
			t.Errorf("%s: motion %v symmetry %v, want %v %v", name, m["motion"], m["symmetry"], v.Motion, v.Symmetry)
		}
		// Null only for a tumble and a symmetric prop end over end (DESIGN.md verdict rules).
		endOver := v.Symmetry != physics.Asymmetric && v.Symmetry != physics.Spherical && v.ExcursionDeg > 89.5
		if (m["wobbles_per_turn"] != nil) != (v.Motion != physics.Tumbling && !endOver && v.L > 0) {
			t.Errorf("%s: wobbles_per_turn %v for a %v", name, m["wobbles_per_turn"], v.Motion)
		}
		if v.HasRatio && m["wobbles_per_turn"] != v.WobblesPerTurn {
			t.Errorf("%s: wobbles_per_turn %v, want %v", name, m["wobbles_per_turn"], v.WobblesPerTurn)
		}
		if (m["flip_period_s"] != nil) != (v.Motion == physics.Tumbling) {
			t.Errorf("%s: flip_period_s %v for a %v", name, m["flip_period_s"], v.Motion)
		}
		if m["flight_time_s"] != take.FlightTime || int(m["landing_frame"].(float64)) != take.LandingFrame ||
			int(m["apex_frame"].(float64)) != take.ApexFrame || m["mass_kg"] != sc.Mass.Mass {
			t.Errorf("%s: flight numbers differ from the take", name)
		}
		for i, row := range m["inertia_tensor"].([]any) {
			for j, x := range nums(row) {
				if x != sc.Mass.Inertia[i][j] {
					t.Errorf("%s: inertia_tensor[%d][%d] = %v, want %v", name, i, j, x, sc.Mass.Inertia[i][j])
				}
			}
		}
	}
}

func TestRun_CheckSummary_Demo(t *testing.T) {
	code, stdout, stderr := run(t) // no arguments, no window: check the demo
	if code != 0 || stderr != "" {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	code2, stdout2, _ := run(t, "check")
	if code2 != 0 || stdout2 != stdout {
		t.Errorf("check without FILE differs from no arguments")
	}
	data, _ := assets.Preset(assets.Demo)
	sc, v, take := judged(t, data)
	if v.Motion != physics.Tumbling || !v.FirstFlipFound || !v.HasOnset {
		t.Fatalf("the demo should tumble with a first flip and an onset: %+v", v)
	}
	fps := sc.Throw.FPS.FPS()
	for _, want := range []string{
		sc.Name, "preset " + assets.Demo, "mass 1.2 kg", "Centre of mass",
		"least     I1 =", "middle    I2 =", "greatest  I3 =", "Symmetry        none",
		"TUMBLE", "from the middle axis", "I1 < I2 < I3", "Excursion", "from the least axis",
		"Flips         every", "First flip    frame " + itoa(int(math.Ceil(v.FirstFlip*fps))),
		"Onset", "frame " + itoa(int(math.Ceil(v.Onset*fps))),
		"Flight          " + itoa(take.LandingFrame+1) + " frames (0 to " + itoa(take.LandingFrame) + ") at 24 fps",
		"Apex          frame " + itoa(take.ApexFrame), "Landing       frame " + itoa(take.LandingFrame),
	} {
		if !strings.Contains(stdout, want) {
			t.Errorf("summary lacks %q:\n%s", want, stdout)
		}
	}
	if !strings.HasSuffix(stdout, Safety+"\n") {
		t.Errorf("summary does not end with the safety caution")
	}
	for _, line := range strings.Split(stdout, "\n") {
		if len(line) > 90 && line != Safety {
			t.Errorf("line longer than 90 characters: %q", line)
		}
	}
}

func TestRun_CheckSummary_WobbleAndSpin(t *testing.T) {
	_, stdout, _ := run(t, "check", "--preset", "dinner-plate")
	for _, want := range []string{"WOBBLE", "oblate", "wobbles per turn about the greatest axis", "spin : wobble = 1 : ", "Euler-angle spin", "one wobble every", "25 fps"} {
		if !strings.Contains(stdout, want) {
			t.Errorf("dinner plate summary lacks %q:\n%s", want, stdout)
		}
	}
	_, stdout, _ = run(t, "check", "--preset", "rolling-pin")
	for _, want := range []string{"SPIN (end over end)", "prolate", "24000/1001 fps (23.976)"} {
		if !strings.Contains(stdout, want) {
			t.Errorf("rolling pin summary lacks %q:\n%s", want, stdout)
		}
	}
	_, stdout, _ = run(t, "check", "--preset", "cutting-board")
	if !strings.Contains(stdout, "SPIN (steady)") || !strings.Contains(stdout, "stays near the least axis") {
		t.Errorf("cutting board summary:\n%s", stdout)
	}
	path := brickWith(t, `"spin": { "axis": "middle", "tilt_deg": 2, "tilt_toward": "least", "turns_per_second": 2 }`, `"ground_y": 0`)
	_, stdout, _ = run(t, "check", path)
	if !strings.Contains(stdout, "NO SPIN") {
		t.Errorf("no-spin summary:\n%s", stdout)
	}
}

func TestRun_ExitCodes(t *testing.T) {
	dir := t.TempDir()
	for _, c := range []struct {
		name      string
		args      []string
		code      int
		stderrHas string // a part of the one stderr line
	}{
		{"help", []string{"--help"}, 0, ""},
		{"help command", []string{"help"}, 0, ""},
		{"version", []string{"version"}, 0, ""},
		{"presets", []string{"presets"}, 0, ""},
		{"check preset", []string{"check", "--preset", "loaf"}, 0, ""},
		{"unknown command", []string{"frobnicate"}, 2, "unknown command frobnicate"},
		{"unknown flag", []string{"check", "--jsno"}, 2, "did you mean --json?"},
		{"two files", []string{"check", "a.json", "b.json"}, 2, "more than one FILE"},
		{"missing file", []string{"check", filepath.Join(dir, "nope.json"), "--json"}, 2, "nope.json: no such file"},
		{"folder as file", []string{"check", dir}, 2, "is a folder, not a project file"},
		{"unknown preset", []string{"check", "--preset", "spatula"}, 2, `--preset: no preset named "spatula" (presets: cutting-board, dinner-plate, frying-pan, ladle, loaf, rolling-pin)`},
		{"syntax error", []string{"check", writeFile(t, "syn.json", "{\n  \"format\": \"propflight/v1\",\n  \"prop\" {}\n}")}, 2, "syn.json: line 3, column 10: invalid character '{' after object key"},
		{"negative size", []string{"check", brickWith(t, `[0.2, 0.1, 0.05]`, `[0.2, -0.1, 0.05]`), "--json"}, 2, "edited.json: prop.parts[0].size: must be positive"},
		{"starts underground", []string{"check", brickWith(t, `"fps": 24,`, `"fps": 24, "ground_y": 2,`)}, 2, "edited.json: throw.release_position: the prop starts at or below the ground"},
		{"never lands", []string{"check", brickWith(t, `"fps": 24,`, `"fps": 24, "gravity": 0.01,`)}, 2, "edited.json: throw: the prop does not reach the ground within 600 s"},
		{"png size", []string{"export", brick, "--format", "png", "--width", "5", "-o", filepath.Join(dir, "frames")}, 2, "width: must be 16 to 8192 pixels"},
		{"png to stdout", []string{"export", brick, "--format", "png", "-o", "-"}, 2, "a PNG sequence needs a folder"},
		{"png flag on csv", []string{"export", brick, "--format", "csv", "--view", "top", "-o", filepath.Join(dir, "x.csv")}, 2, "go with --format png"},
		{"bad view", []string{"export", brick, "--format", "png", "--view", "under", "-o", filepath.Join(dir, "frames")}, 2, "--view: unknown value under"},
		{"twos on gltf", []string{"export", brick, "--twos", "-o", filepath.Join(dir, "x.glb")}, 2, "--twos goes with csv or png"},
		{"fit no marks", []string{"fit"}, 2, "the marks file is missing"},
		{"export bad input", []string{"export", brickWith(t, `"mass": 2.0`, `"mass": 0`), "-o", filepath.Join(dir, "bad.csv")}, 2, "prop.parts[0].mass: must be positive"},
		{"export no -o", []string{"export", brick}, 2, "export: -o OUT is required"},
		{"export unwritable", []string{"export", brick, "--format", "csv", "-o", filepath.Join(dir, "no", "such", "t.csv")}, 1, "t.csv: cannot write:"},
	} {
		t.Run(c.name, func(t *testing.T) {
			code, stdout, stderr := run(t, c.args...)
			if code != c.code {
				t.Fatalf("exit %d, want %d (stderr %q)", code, c.code, stderr)
			}
			if c.code == 0 {
				if stderr != "" || stdout == "" {
					t.Errorf("stdout %d bytes, stderr %q", len(stdout), stderr)
				}
				return
			}
			if stdout != "" {
				t.Errorf("stdout not empty on failure: %q", stdout)
			}
			if strings.Count(stderr, "\n") != 1 || !strings.HasPrefix(stderr, "propflight: ") {
				t.Errorf("stderr is not one line: %q", stderr)
			}
			if !strings.Contains(stderr, c.stderrHas) {
				t.Errorf("stderr %q lacks %q", stderr, c.stderrHas)
			}
			if strings.Contains(stderr, "goroutine") || strings.Contains(stderr, "panic") {
				t.Errorf("stack trace on stderr: %q", stderr)
			}
		})
	}
	if _, err := os.Stat(filepath.Join(dir, "bad.csv")); !errors.Is(err, os.ErrNotExist) {
		t.Errorf("a failed export left an output file: %v", err)
	}
}

func TestRun_NegativeMass_ContractCase(t *testing.T) {
	// The case contract-check runs: "mass": -2.0 in the sample.
	path := brickWith(t, `"mass": 2.0`, `"mass": -2.0`)
	code, stdout, stderr := run(t, "check", path, "--json")
	if code != 2 || stdout != "" || !strings.Contains(stderr, "mass") {
		t.Fatalf("exit %d, stdout %q, stderr %q", code, stdout, stderr)
	}
	if want := "propflight: " + path + ": prop.parts[0].mass: must be positive\n"; stderr != want {
		t.Errorf("stderr %q, want %q", stderr, want)
	}
}

func TestRun_Window(t *testing.T) {
	var out, errb bytes.Buffer
	opened, at := false, "?"
	open := func(path string) error { opened, at = true, path; return nil }
	if code := Run(nil, &out, &errb, open); code != 0 || !opened || at != "" {
		t.Errorf("exit %d, opened %v at %q", code, opened, at)
	}
	// A project file alone, or with open, opens the window on it.
	for _, args := range [][]string{{brick}, {"open", brick}} {
		opened, at = false, "?"
		if code := Run(args, &out, &errb, open); code != 0 || !opened || at != brick {
			t.Errorf("%q: exit %d, opened %v at %q", args, code, opened, at)
		}
	}
	if code := Run(nil, &out, &errb, func(string) error { return errors.New("no display") }); code != 1 || !strings.Contains(errb.String(), "no display") {
		t.Errorf("exit %d, stderr %q", code, errb.String())
	}
	// A subcommand never opens the window.
	if code := Run([]string{"presets"}, &out, &errb, func(string) error { t.Error("window opened"); return nil }); code != 0 {
		t.Errorf("presets exit %d", code)
	}
}

func TestRun_PanicIsOneLine(t *testing.T) {
	var out, errb bytes.Buffer
	code := Run(nil, &out, &errb, func(string) error { panic("boom\nsecond line") })
	if code != 1 {
		t.Errorf("exit %d", code)
	}
	if errb.String() != "propflight: internal error: boom second line\n" {
		t.Errorf("stderr %q", errb.String())
	}
}

type failingWriter struct{}

func (failingWriter) Write([]byte) (int, error) { return 0, errors.New("broken pipe") }

func TestRun_StdoutFailure(t *testing.T) {
	var errb bytes.Buffer
	if code := Run([]string{"presets"}, failingWriter{}, &errb, nil); code != 1 || !strings.Contains(errb.String(), "broken pipe") {
		t.Errorf("exit %d, stderr %q", code, errb.String())
	}
}

func TestRun_HelpVersionPresets(t *testing.T) {
	_, stdout, _ := run(t, "-h")
	for _, want := range []string{"propflight check [FILE] [--json]", "propflight export FILE --format csv|gltf|png -o OUT", "propflight sheet FILE -o OUT.pdf", "propflight fit MARKS.csv", "propflight help COMMAND", "Exit status: 0 ok, 2 bad input or usage, 1 other failure", Safety} {
		if !strings.Contains(stdout, want) {
			t.Errorf("help lacks %q", want)
		}
	}
	_, stdout, _ = run(t, "version")
	if !strings.HasPrefix(stdout, "propflight "+Version+" (go") {
		t.Errorf("version %q", stdout)
	}
	_, stdout, _ = run(t, "presets")
	lines := strings.Split(strings.TrimSpace(stdout), "\n")
	if len(lines) != len(assets.PresetNames()) {
		t.Fatalf("presets printed %d lines", len(lines))
	}
	for i, name := range assets.PresetNames() {
		if !strings.HasPrefix(lines[i], name+" ") {
			t.Errorf("line %d %q does not start with %s", i, lines[i], name)
		}
	}
	if !strings.Contains(stdout, "(the demo)") {
		t.Error("the demo is not marked")
	}
}

func TestRun_ExportCSV(t *testing.T) {
	_, js, _ := run(t, "check", brick, "--json")
	frames := int(decodeCheck(t, js)["flight_frames"].(float64))
	dir := t.TempDir()
	out := filepath.Join(dir, "take.csv")
	for _, args := range [][]string{
		{"export", brick, "--format", "csv", "-o", out},
		{"export", "-o=" + out, brick},
		{"export", "--output", out, "--format=csv", brick},
	} {
		code, stdout, stderr := run(t, args...)
		if code != 0 || stderr != "" {
			t.Fatalf("%q: exit %d: %s", args, code, stderr)
		}
		if !strings.Contains(stdout, "wrote "+out+": "+itoa(frames)+" frames") {
			t.Errorf("%q: stdout %q", args, stdout)
		}
		data, err := os.ReadFile(out)
		if err != nil {
			t.Fatal(err)
		}
		lines := strings.Split(strings.TrimSuffix(string(data), "\n"), "\n")
		if lines[0] != export.CSVHeader || len(lines)-1 != frames {
			t.Errorf("%q: header %q, %d rows, want %d", args, lines[0], len(lines)-1, frames)
		}
	}
	// -o - writes the CSV itself to stdout and nothing else.
	code, stdout, _ := run(t, "export", brick, "--format", "csv", "-o", "-")
	file, _ := os.ReadFile(out)
	if code != 0 || stdout != string(file) {
		t.Errorf("-o - gave exit %d and %d bytes, want the %d bytes of the file", code, len(stdout), len(file))
	}
	if entries, _ := os.ReadDir(dir); len(entries) != 1 {
		t.Errorf("export left %d entries in the folder", len(entries))
	}
}

// TestRun_ExportFormats runs every export and the sheet end to end on the
// contract sample and checks the files are what they claim: a GLB header
// (glTF 2.0.1 §4.4: magic "glTF", version 2), a JSON glTF, one PNG per
// frame, a PDF, and the CSV on twos with half the rows.
func TestRun_ExportFormats(t *testing.T) {
	_, js, _ := run(t, "check", brick, "--json")
	frames := int(decodeCheck(t, js)["flight_frames"].(float64))
	dir := t.TempDir()
	must := func(args ...string) string {
		t.Helper()
		code, stdout, stderr := run(t, args...)
		if code != 0 || stderr != "" {
			t.Fatalf("%q: exit %d: %s", args, code, stderr)
		}
		return stdout
	}
	must("export", brick, "-o", filepath.Join(dir, "take.glb"))
	if b, _ := os.ReadFile(filepath.Join(dir, "take.glb")); len(b) < 12 || string(b[:4]) != "glTF" || b[4] != 2 {
		t.Errorf("take.glb is not a GLB")
	}
	must("export", brick, "--format", "gltf", "-o", filepath.Join(dir, "take.gltf"))
	if b, _ := os.ReadFile(filepath.Join(dir, "take.gltf")); !strings.Contains(string(b), `"version": "2.0"`) {
		t.Errorf("take.gltf is not glTF JSON")
	}
	out := must("export", brick, "--format", "png", "--width", "64", "--height", "48", "--view", "side", "-o", filepath.Join(dir, "frames"))
	if entries, _ := os.ReadDir(filepath.Join(dir, "frames")); len(entries) != frames || !strings.Contains(out, "64x48") {
		t.Errorf("png: %d files for %d frames (%q)", len(entries), frames, out)
	}
	must("sheet", brick, "-o", filepath.Join(dir, "sheet.pdf"), "--paper", "letter", "--twos")
	if b, _ := os.ReadFile(filepath.Join(dir, "sheet.pdf")); !strings.HasPrefix(string(b), "%PDF-") {
		t.Errorf("sheet.pdf is not a PDF")
	}
	csv := must("export", brick, "--format", "csv", "--twos", "-o", "-")
	if rows := strings.Count(csv, "\n") - 1; rows != (frames+1)/2 {
		t.Errorf("csv on twos: %d rows for %d frames", rows, frames)
	}
}

// TestRun_VerdictRules: the project's verdict_rules judge it in check (text
// and JSON) and the sheet. The brick spun 2 degrees off its middle axis
// tumbles under the default 45-degree rule; its excursion is at most 90
// degrees (the angle between L and an axis), so from 95 degrees nothing
// tumbles and check calls it a spin.
func TestRun_VerdictRules(t *testing.T) {
	path := brickWith(t, `"throw": {`, `"verdict_rules": {"tumble_from_deg": 95}, "throw": {`)
	code, stdout, stderr := run(t, "check", path, "--json")
	if code != 0 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	if m := decodeCheck(t, stdout); m["motion"] != "spin" || m["flip_period_s"] != nil {
		t.Errorf("tumble_from_deg 95: motion %v, flip_period_s %v, want spin and null", m["motion"], m["flip_period_s"])
	}
	_, stdout, _ = run(t, "check", path)
	if !strings.Contains(stdout, "SPIN") || strings.Contains(stdout, "TUMBLE") {
		t.Errorf("summary under tumble_from_deg 95:\n%s", stdout)
	}
	_, stdout, _ = run(t, "check", brick, "--json")
	if m := decodeCheck(t, stdout); m["motion"] != "tumble" {
		t.Errorf("without rules: motion %v, want tumble", m["motion"])
	}
}

// TestRun_CheckSummary_OneWobble: a ratio of exactly 1 (a sphere: all
// moments equal) reads "1 wobble per turn", not "1 wobbles per turn".
func TestRun_CheckSummary_OneWobble(t *testing.T) {
	path := writeFile(t, "ball.json", `{"format": "propflight/v1", "prop": {"parts": [{"shape": "sphere", "radius": 0.1, "mass": 1}]}, "throw": {"fps": 24, "release_position": [0, 1.5, 0], "release_velocity": [2, 4, 0], "spin": {"axis": "greatest", "turns_per_second": 2}}}`)
	code, stdout, stderr := run(t, "check", path)
	if code != 0 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	if !strings.Contains(stdout, "1 wobble per turn about") || strings.Contains(stdout, "1 wobbles") {
		t.Errorf("sphere summary:\n%s", stdout)
	}
}
