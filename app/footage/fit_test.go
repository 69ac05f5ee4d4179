package footage

import (
	"errors"
	"math"
	"strings"
	"testing"

	"propflight/internal/mark"
	"propflight/physics"
)

// Tolerances. closeTol is for closed forms evaluated in float64
// (REFERENCES.md's advice: 1e-9 relative for closed forms).
const closeTol = 1e-9

func relClose(got, want, tol float64) bool {
	if want == 0 {
		return math.Abs(got) <= tol
	}
	return math.Abs(got-want) <= tol*math.Abs(want)
}

func checkRel(t *testing.T, name string, got, want, tol float64) {
	t.Helper()
	if !relClose(got, want, tol) {
		t.Errorf("%s = %.12g, want %.12g (relative tolerance %g)", name, got, want, tol)
	}
}

// ref6Noise is the noise list of REFERENCES.md §6.
var ref6Noise = []float64{0.3, -0.2, 0.1, 0.4, -0.5, 0.2, 0.0, -0.3, 0.25, -0.1, 0.35, -0.4}

// ref6Marks returns the §6 data y_n = 400 - 30 n + 4.256358507 n^2,
// n = 0..11, with the noise list added when noisy, and x_n = 100 + 5 n
// (our own straight line; §6 gives y only).
func ref6Marks(noisy bool) []mark.Mark {
	var m []mark.Mark
	for n := range 12 {
		f := float64(n)
		y := 400 - 30*f + 4.256358507*f*f
		if noisy {
			y += ref6Noise[n]
		}
		m = append(m, mark.Mark{Frame: n, X: 100 + 5*f, Y: y})
	}
	return m
}

// TestFit_Reference6 checks the least-squares parabola against the check
// values of REFERENCES.md §6 (method: J. Kiusalaas, Numerical Methods in
// Engineering with Python, §3.4, eqs. 3.21-3.23; the numbers were computed
// there, at 24 fps, true scale 0.002 m/px, g_n = 9.80665 m/s^2 exactly
// (3rd CGPM, 1901)).
func TestFit_Reference6(t *testing.T) {
	opt := FitOptions{FPS: 24, Gravity: physics.StandardGravity}
	t.Run("exact", func(t *testing.T) {
		r, err := Fit(ref6Marks(false), opt)
		if err != nil {
			t.Fatal(err)
		}
		checkRel(t, "c0", r.Y[0], 400, closeTol)
		checkRel(t, "c1", r.Y[1], -30, closeTol)
		checkRel(t, "c2", r.Y[2], 4.256358507, closeTol)
		checkRel(t, "g_px", r.GravityPxPerFrame2, 8.512717014, closeTol)
		checkRel(t, "scale", r.MetresPerPixel, 0.002, closeTol)
		checkRel(t, "d0", r.X[0], 100, closeTol)
		checkRel(t, "d1", r.X[1], 5, closeTol)
		// Exact data leave no residual beyond round-off.
		if !(r.RMSPx < 1e-9) {
			t.Errorf("rms = %g px, want ~0", r.RMSPx)
		}
		// Velocity at frame 0, y up: -(c1) = 30; apex -c1/(2 c2).
		checkRel(t, "vx", r.ReleaseVelocityPxPerFrame[0], 5, closeTol)
		checkRel(t, "vy", r.ReleaseVelocityPxPerFrame[1], 30, closeTol)
		checkRel(t, "apex", r.ApexFrame, 30/(2*4.256358507), closeTol)
	})
	t.Run("noisy", func(t *testing.T) {
		r, err := Fit(ref6Marks(true), opt)
		if err != nil {
			t.Fatal(err)
		}
		checkRel(t, "c0", r.Y[0], 400.1104396, closeTol)
		checkRel(t, "c1", r.Y[1], -30.02507493, closeTol)
		checkRel(t, "c2", r.Y[2], 4.257207658, closeTol)
		checkRel(t, "g_px", r.GravityPxPerFrame2, 8.514415316, closeTol)
		checkRel(t, "scale", r.MetresPerPixel, 0.001999601076, closeTol)
		// The x line is exact, so the RMS is that of the y residuals: a
		// slow, obvious oracle from the fitted coefficients.
		var sum float64
		for n, m := range ref6Marks(true) {
			f := float64(n)
			d := m.Y - (r.Y[0] + r.Y[1]*f + r.Y[2]*f*f)
			sum += d * d
		}
		checkRel(t, "rms", r.RMSPx, math.Sqrt(sum/12), 1e-6)
	})
}

// TestFit_SolveFPSAndGravity checks the two other uses of the same
// relation s = g / (2 c2 f^2) (REFERENCES.md §6), on §6's exact data.
func TestFit_SolveFPSAndGravity(t *testing.T) {
	r, err := Fit(ref6Marks(false), FitOptions{Gravity: physics.StandardGravity, MetresPerPixel: 0.002})
	if err != nil {
		t.Fatal(err)
	}
	checkRel(t, "solved fps", r.SolvedFPS, 24, closeTol)
	checkRel(t, "fps", r.FPS, 24, closeTol)
	checkRel(t, "scale", r.MetresPerPixel, 0.002, 0)
	if !math.IsNaN(r.SolvedGravity) {
		t.Errorf("solved gravity = %g, want NaN when gravity is given", r.SolvedGravity)
	}

	r, err = Fit(ref6Marks(false), FitOptions{FPS: 24, MetresPerPixel: 0.002})
	if err != nil {
		t.Fatal(err)
	}
	checkRel(t, "solved gravity", r.SolvedGravity, physics.StandardGravity, closeTol)
	if !math.IsNaN(r.MetresPerPixel) || r.JSON()["metres_per_pixel"] != nil {
		t.Errorf("metres per pixel = %g, JSON %v; want NaN and null without gravity", r.MetresPerPixel, r.JSON()["metres_per_pixel"])
	}

	// Given all three, the scale is measured and the frame rate solved
	// from the given scale; consistent inputs agree.
	r, err = Fit(ref6Marks(false), FitOptions{FPS: 24, Gravity: physics.StandardGravity, MetresPerPixel: 0.002})
	if err != nil {
		t.Fatal(err)
	}
	checkRel(t, "scale", r.MetresPerPixel, 0.002, closeTol)
	checkRel(t, "solved fps", r.SolvedFPS, 24, closeTol)
}

// TestFit_ThrowSettings checks ToThrow against the ballistic check values
// of REFERENCES.md §5.1 (computed there from r(t) = r0 + v0 t + g t^2 / 2
// with v0 = (3, 8) m/s, g = g_n): apex time 0.8157729704 s, level flight
// time 1.631545941 s, range 4.894637822 m. The marks are that flight seen
// at 24 fps and 0.002 m/px, with a prop line turning 45 degrees a frame
// counter-clockwise (3 turns per second at 24 fps).
func TestFit_ThrowSettings(t *testing.T) {
	const fps, s = 24.0, 0.002
	var marks []mark.Mark
	for n := range 40 {
		tm := float64(n) / fps
		x := 3 * tm
		y := 8*tm - physics.StandardGravity*tm*tm/2
		a := (10 + 45*float64(n)) * math.Pi / 180
		X, Y := 100+x/s, 2000-y/s
		marks = append(marks, mark.Mark{Frame: n, X: X, Y: Y, HasSecond: true, X2: X + 50*math.Cos(a), Y2: Y - 50*math.Sin(a)})
	}
	r, err := Fit(marks, FitOptions{FPS: fps, Gravity: physics.StandardGravity})
	if err != nil {
		t.Fatal(err)
	}
	checkRel(t, "scale", r.MetresPerPixel, s, closeTol)
	checkRel(t, "apex frame", r.ApexFrame, 0.8157729704*fps, closeTol)
	checkRel(t, "turn", r.TurnDegPerFrame, 45, closeTol)
	if r.Hint != HintSteady || !(r.TurnRMSDeg < 1e-9) {
		t.Errorf("hint %q, rms %g deg; want steady, 0", r.Hint, r.TurnRMSDeg)
	}
	th, err := r.ToThrow(r.MetresPerPixel)
	if err != nil {
		t.Fatal(err)
	}
	checkRel(t, "vx", th.Velocity[0], 3, closeTol)
	checkRel(t, "vy", th.Velocity[1], 8, closeTol)
	checkRel(t, "speed", th.Speed, math.Sqrt(73), closeTol)
	checkRel(t, "angle", th.AngleDeg, math.Atan2(8, 3)*180/math.Pi, closeTol)
	checkRel(t, "hang", th.HangTime, 1.631545941, closeTol)
	checkRel(t, "distance", th.Distance, 4.894637822, closeTol)
	checkRel(t, "turns/s", th.TurnsPerSecond, 3, closeTol)
	if !th.HasHang || !th.HasSpin || !th.CounterClockwise || th.Leftward {
		t.Errorf("flags %+v", th)
	}

	// The same throw mirrored on the screen goes left, still 69.4 degrees
	// above the horizontal, and the mirrored line turns clockwise.
	for i := range marks {
		marks[i].X, marks[i].X2 = 1000-marks[i].X, 1000-marks[i].X2
	}
	r, err = Fit(marks, FitOptions{FPS: fps, Gravity: physics.StandardGravity})
	if err != nil {
		t.Fatal(err)
	}
	th, err = r.ToThrow(s)
	if err != nil {
		t.Fatal(err)
	}
	checkRel(t, "mirrored angle", th.AngleDeg, math.Atan2(8, 3)*180/math.Pi, closeTol)
	checkRel(t, "mirrored turn", r.TurnDegPerFrame, -45, closeTol)
	if !th.Leftward || th.CounterClockwise {
		t.Errorf("mirrored flags %+v", th)
	}

	if _, err := r.ToThrow(0); err == nil || !strings.Contains(err.Error(), "metres_per_pixel") {
		t.Errorf("ToThrow(0) = %v, want an error naming metres_per_pixel", err)
	}
	// A prop thrown downward never comes back to its release height.
	down := []mark.Mark{{Frame: 0, Y: 100}, {Frame: 1, Y: 110}, {Frame: 2, Y: 122}, {Frame: 3, Y: 136}}
	r, err = Fit(down, FitOptions{FPS: 24})
	if err != nil {
		t.Fatal(err)
	}
	if th, err := r.ToThrow(0.01); err != nil || th.HasHang || th.AngleDeg >= 0 {
		t.Errorf("downward throw: %+v, %v; want no hang and a negative angle", th, err)
	}
}

// turnMarks returns marks on a fixed parabola whose prop line, 60 px long,
// is at angle(n) degrees on the listed frames.
func turnMarks(frames []int, angle func(n float64) float64) []mark.Mark {
	var m []mark.Mark
	for _, n := range frames {
		f := float64(n)
		x, y := 50+4*f, 300-20*f+f*f
		a := angle(f) * math.Pi / 180
		m = append(m, mark.Mark{Frame: n, X: x, Y: y, HasSecond: true, X2: x + 60*math.Cos(a), Y2: y - 60*math.Sin(a)})
	}
	return m
}

func frameRange(a, b, step int) []int {
	var f []int
	for n := a; n <= b; n += step {
		f = append(f, n)
	}
	return f
}

// TestFit_Turn checks the unwrapping and the line fit of the prop angle
// on exact turns (the slope of a straight line is recovered exactly).
func TestFit_Turn(t *testing.T) {
	tests := []struct {
		name   string
		frames []int
		angle  func(float64) float64
		want   float64 // degrees per frame
		hint   string
	}{
		{"slow ccw", frameRange(0, 11, 1), func(n float64) float64 { return 5 + 3*n }, 3, HintSteady},
		{"fast ccw wraps", frameRange(0, 11, 1), func(n float64) float64 { return 100 * n }, 100, HintSteady},
		{"fast cw wraps", frameRange(0, 11, 1), func(n float64) float64 { return 170 - 150*n }, -150, HintSteady},
		{"every other frame", frameRange(0, 20, 2), func(n float64) float64 { return -30 + 40*n }, 40, HintSteady},
		{"late frames", frameRange(100, 110, 1), func(n float64) float64 { return 7 * n }, 7, HintSteady},
		// Over half a turn between marks is seen the short way round:
		// 200 degrees a frame looks like -160 (documented aliasing).
		{"aliased", frameRange(0, 11, 1), func(n float64) float64 { return 200 * n }, -160, HintSteady},
		{"still", frameRange(0, 11, 1), func(float64) float64 { return 30 }, 0, HintSteady},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			r, err := Fit(turnMarks(tc.frames, tc.angle), FitOptions{FPS: 24})
			if err != nil {
				t.Fatal(err)
			}
			if !r.HasTurn || r.TurnMarks != len(tc.frames) {
				t.Fatalf("HasTurn %v, %d marks", r.HasTurn, r.TurnMarks)
			}
			if math.Abs(r.TurnDegPerFrame-tc.want) > 1e-9*math.Max(1, math.Abs(tc.want)) {
				t.Errorf("turn = %.12g deg/frame, want %g", r.TurnDegPerFrame, tc.want)
			}
			if r.Hint != tc.hint || !(r.TurnRMSDeg < 1e-9) {
				t.Errorf("hint %q, rms %g; want %q, 0", r.Hint, r.TurnRMSDeg, tc.hint)
			}
		})
	}

	// A wobble on top of a steady turn: 12 deg/frame plus 20 degrees of
	// swing with a 7-frame period. The line through it leaves an RMS near
	// 20/sqrt(2) = 14 degrees, so the turn is irregular.
	r, err := Fit(turnMarks(frameRange(0, 20, 1), func(n float64) float64 { return 12*n + 20*math.Sin(2*math.Pi*n/7) }), FitOptions{FPS: 24})
	if err != nil {
		t.Fatal(err)
	}
	if r.Hint != HintIrregular || !(r.TurnRMSDeg > 10 && r.TurnRMSDeg < 16) {
		t.Errorf("wobble: hint %q, rms %g deg; want irregular, about 14", r.Hint, r.TurnRMSDeg)
	}

	// Two orientation marks give no turn; a second point on the centre is
	// an error naming the frame.
	m := ref6Marks(false)
	m[0].HasSecond, m[0].X2, m[0].Y2 = true, m[0].X+10, m[0].Y
	m[5].HasSecond, m[5].X2, m[5].Y2 = true, m[5].X, m[5].Y-10
	r, err = Fit(m, FitOptions{FPS: 24})
	if err != nil || r.HasTurn || r.TurnMarks != 2 || r.Hint != "" || r.JSON()["hint"] != nil {
		t.Errorf("two orientation marks: %+v, %v; want no turn", r, err)
	}
	m[7].HasSecond, m[7].X2, m[7].Y2 = true, m[7].X, m[7].Y
	if _, err := Fit(m, FitOptions{FPS: 24}); err == nil || !strings.Contains(err.Error(), "frame 7") {
		t.Errorf("second point on the centre: %v, want an error naming frame 7", err)
	}
}

// TestTurnHint pins the documented rule (turn.go) at its edges.
func TestTurnHint(t *testing.T) {
	tests := []struct {
		rms, mean float64
		want      string
	}{
		{1.0, 30, HintSteady},
		{4.9, 30, HintSteady},    // under 5 and under 7.5
		{5.0, 90, HintIrregular}, // not under 5 however fast
		{2.0, 4, HintIrregular},  // over a quarter of the 4-degree step and over the noise floor
		{0.9, 4, HintSteady},     // under a quarter of the step
		{1.4, 0, HintSteady},     // under the clicking noise floor
		{1.6, 0, HintIrregular},
		{1.6, -8, HintSteady}, // the sense of the turn does not matter
	}
	for _, tc := range tests {
		if got := turnHint(tc.rms, tc.mean); got != tc.want {
			t.Errorf("turnHint(%g, %g) = %q, want %q", tc.rms, tc.mean, got, tc.want)
		}
	}
}

func TestFit_Errors(t *testing.T) {
	good := ref6Marks(false)
	tests := []struct {
		name  string
		marks []mark.Mark
		opt   FitOptions
		want  string
	}{
		{"two marks", good[:2], FitOptions{FPS: 24}, "at least 3"},
		{"no marks", nil, FitOptions{FPS: 24}, "at least 3"},
		{"straight", []mark.Mark{{Frame: 0, Y: 10}, {Frame: 1, Y: 20}, {Frame: 2, Y: 30}, {Frame: 3, Y: 40}}, FitOptions{FPS: 24}, "do not curve downward"},
		{"upside down", []mark.Mark{{Frame: 0, Y: 10}, {Frame: 1, Y: 5}, {Frame: 2, Y: -2}}, FitOptions{FPS: 24}, "do not curve downward"},
		{"duplicate", append([]mark.Mark{good[3]}, good...), FitOptions{FPS: 24}, "frame 3 is marked twice"},
		{"negative frame", append([]mark.Mark{{Frame: -1}}, good...), FitOptions{FPS: 24}, "frame"},
		{"nan", append([]mark.Mark{{Frame: 20, X: math.NaN()}}, good...), FitOptions{FPS: 24}, "x:"},
		{"no fps", good, FitOptions{Gravity: 9.8}, "fps:"},
		{"negative fps", good, FitOptions{FPS: -24}, "fps:"},
		{"inf gravity", good, FitOptions{FPS: 24, Gravity: math.Inf(1)}, "gravity:"},
		{"nan scale", good, FitOptions{FPS: 24, MetresPerPixel: math.NaN()}, "metres_per_pixel:"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			_, err := Fit(tc.marks, tc.opt)
			var fe *Error
			if err == nil || !errors.As(err, &fe) || !strings.Contains(err.Error(), tc.want) {
				t.Errorf("Fit error = %v, want an *Error containing %q", err, tc.want)
			}
		})
	}

	// Three marks fit exactly: no residual, and JSON says null.
	r, err := Fit(good[:3], FitOptions{FPS: 24})
	if err != nil {
		t.Fatal(err)
	}
	if !math.IsNaN(r.RMSPx) || r.JSON()["rms_px"] != nil {
		t.Errorf("3 marks: rms %g, JSON %v; want NaN, null", r.RMSPx, r.JSON()["rms_px"])
	}
	checkRel(t, "3-mark c2", r.Y[2], 4.256358507, closeTol)
}

// TestFit_JSONKeys checks the exact key set of the --json object.
func TestFit_JSONKeys(t *testing.T) {
	want := []string{"gravity_px_per_frame2", "metres_per_pixel", "release_velocity_px_per_frame", "apex_frame",
		"rms_px", "turn_deg_per_frame", "turn_rms_deg", "hint"}
	r, err := Fit(turnMarks(frameRange(0, 11, 1), func(n float64) float64 { return 3 * n }), FitOptions{FPS: 24, Gravity: 9.80665})
	if err != nil {
		t.Fatal(err)
	}
	j := r.JSON()
	if len(j) != len(want) {
		t.Errorf("JSON has %d keys, want %d: %v", len(j), len(want), j)
	}
	for _, k := range want {
		if _, ok := j[k]; !ok {
			t.Errorf("JSON lacks %q", k)
		}
	}
	if j["hint"] != "steady" || j["turn_deg_per_frame"] == nil || j["metres_per_pixel"] == nil {
		t.Errorf("JSON values %v", j)
	}
	v, ok := j["release_velocity_px_per_frame"].([]float64)
	if !ok || len(v) != 2 || v[0] != r.ReleaseVelocityPxPerFrame[0] || v[1] != r.ReleaseVelocityPxPerFrame[1] {
		t.Errorf("release velocity %v", j["release_velocity_px_per_frame"])
	}
}
