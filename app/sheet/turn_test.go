package sheet

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics"
)

// TestRows_TurnOverHalfATurn: a take turning 240 degrees a frame (16
// turns/s at 24 fps; turns per frame = rate / fps, common practice) lists
// 240 a row on ones and 480 on twos, the quarter-turn marks follow the
// real total (240, 480, ...), not the shorter way round between the end
// orientations (120 the other way).
func TestRows_TurnOverHalfATurn(t *testing.T) {
	tk := &physics.Take{ApexFrame: 2, ApexTime: 2.0 / 24, LandingFrame: 4, FlightTime: 4.2 / 24}
	for i := range 5 {
		f := physics.Frame{N: i, Time: float64(i) / 24, CM: r3.Vec{X: 0.1 * float64(i), Y: 1},
			Orient: physics.AxisAngle(r3.Vec{Z: 1}, float64(i)*240*math.Pi/180), Omega: r3.Vec{Z: 240 * math.Pi / 180 * 24}}
		if i > 0 {
			f.TurnDeg, f.Spacing = 240, 0.1
		}
		tk.Frames = append(tk.Frames, f)
	}
	v := physics.Verdict{Motion: physics.Spinning}
	tm := analyse(tk, physics.Rate{Num: 24, Den: 1}, &v)
	for i, r := range tm.rows(false)[1:] {
		if r.turn != 240 || r.total != 240*float64(i+1) {
			t.Errorf("frame %d on ones: turn %g total %g", r.frame, r.turn, r.total)
		}
	}
	for _, r := range tm.rows(true)[1:] {
		if math.Abs(r.turn-480) > 1e-9 {
			t.Errorf("frame %d on twos: turn %g, want 480", r.frame, r.turn)
		}
	}
	last := func(i int) string {
		if len(tm.notes[i]) == 0 {
			return ""
		}
		return tm.notes[i][len(tm.notes[i])-1]
	}
	for i, want := range []string{"", "90°, 180°", "270°, 360°, 450°", "540°, 630°, 720°", "810°, 900°"} {
		if i > 0 && last(i) != want {
			t.Errorf("frame %d marks %q, want the quarter turns %q", i, tm.notes[i], want)
		}
	}
}
