package sheet

import (
	"math"
	"slices"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics"
)

func TestBreakdownFrames(t *testing.T) {
	// The rule of the table's footnote: (a + b) / 2 rounded down, none for
	// keys less than two frames apart.
	for _, c := range []struct{ keys, want []int }{
		{[]int{0, 11, 27}, []int{5, 19}},
		{[]int{0, 2}, []int{1}},
		{[]int{0, 1, 5}, []int{3}},
		{[]int{0, 3}, []int{1}},
		{[]int{0}, nil},
	} {
		if got := breakdownFrames(c.keys); !slices.Equal(got, c.want) {
			t.Errorf("keys %v: breakdowns %v, want %v", c.keys, got, c.want)
		}
	}
}

func TestKeyFrames(t *testing.T) {
	tk := &physics.Take{Frames: make([]physics.Frame, 10), ApexFrame: 4}
	if got := keyFrames(tk); !slices.Equal(got, []int{0, 4, 9}) {
		t.Errorf("keys %v", got)
	}
	tk.ApexFrame = 0 // a downward throw
	if got := keyFrames(tk); !slices.Equal(got, []int{0, 9}) {
		t.Errorf("downward throw: keys %v", got)
	}
	tk.ApexFrame = 12 // past the last frame: clamped
	if got := keyFrames(tk); !slices.Equal(got, []int{0, 9}) {
		t.Errorf("apex past landing: keys %v", got)
	}
}

func TestQuarters(t *testing.T) {
	for _, c := range []struct {
		deg  float64
		want int
	}{{0, 0}, {89.9, 0}, {90 - 1e-9, 1}, {90, 1}, {179.99, 1}, {360, 4}, {1000, 11}} {
		if got := quarters(c.deg); got != c.want {
			t.Errorf("quarters(%g) = %d, want %d", c.deg, got, c.want)
		}
	}
	for _, c := range []struct {
		m0, m1 int
		want   string
	}{{0, 1, "90°"}, {1, 3, "180°, 270°"}, {3, 6, "360°, 450°, 540°"}, {0, 5, "90°–450° (5 quarters)"}} {
		if got := quarterNote(c.m0, c.m1); got != c.want {
			t.Errorf("quarterNote(%d, %d) = %q, want %q", c.m0, c.m1, got, c.want)
		}
	}
}

func TestFrameAtOrAfter(t *testing.T) {
	r := physics.Rate{Num: 24, Den: 1}
	for _, c := range []struct {
		t    float64
		want int
	}{{0, 0}, {0.001, 1}, {2.0 / 24, 2}, {2.0/24 + 1e-6, 3}, {0.1, 3}, {1, 24}} {
		if got := r.FrameAtOrAfter(c.t); got != c.want {
			t.Errorf("%g) = %d.FrameAtOrAfter(want %d", c.t, got, c.want)
		}
	}
	ntsc := physics.Rate{Num: 30000, Den: 1001}
	if got := ntsc.FrameAtOrAfter(ntsc.Time(17)); got != 17 {
		t.Errorf("a frame's own time at 29.97: frame %d, want 17", got)
	}
}

// syntheticTake has nine frames 1/24 s apart, each turning 50 degrees about
// z and moving 0.1 m along x: totals 0, 50, 100, ..., 400 degrees.
func syntheticTake() *physics.Take {
	tk := &physics.Take{ApexFrame: 4, ApexTime: 4.0 / 24, LandingFrame: 8, FlightTime: 8.2 / 24}
	for i := range 9 {
		f := physics.Frame{N: i, Time: float64(i) / 24, CM: r3.Vec{X: 0.1 * float64(i), Y: 1},
			Orient: physics.AxisAngle(r3.Vec{Z: 1}, float64(i)*50*math.Pi/180), Omega: r3.Vec{Z: 50 * math.Pi / 180 * 24}}
		if i > 0 {
			f.TurnDeg, f.Spacing = 50, 0.1
		}
		tk.Frames = append(tk.Frames, f)
	}
	return tk
}

func TestAnalyse_SyntheticTake(t *testing.T) {
	tk := syntheticTake()
	rate := physics.Rate{Num: 24, Den: 1}
	// A tumble flipping first at 0.1 s and every 0.1 s: at 2.4, 4.8 and 7.2
	// frames, so on frames 3, 5 and 8; the next, 9.6, is past the take.
	v := physics.Verdict{Motion: physics.Tumbling, HasFlip: true, FirstFlipFound: true, FirstFlip: 0.1, FlipPeriod: 0.1,
		HasOnset: true, Onset: 1.0 / 24}
	tm := analyse(tk, rate, &v)
	if !slices.Equal(tm.keys, []int{0, 4, 8}) || !slices.Equal(tm.flips, []int{3, 5, 8}) || tm.onset != 1 {
		t.Fatalf("keys %v flips %v onset %d", tm.keys, tm.flips, tm.onset)
	}
	want := [][]string{
		{"key: release"}, {"onset"}, {"breakdown", "90°"}, {"flip 1"}, {"key: apex", "180°"},
		{"flip 2"}, {"breakdown", "270°"}, nil, {"key: landing", "360°", "flip 3"},
	}
	for i, w := range want {
		if !slices.Equal(tm.notes[i], w) {
			t.Errorf("frame %d: marks %q, want %q", i, tm.notes[i], w)
		}
	}
	wantRoles := []Role{Key, InBetween, Breakdown, InBetween, Key, InBetween, Breakdown, InBetween, Key}
	if !slices.Equal(tm.roles, wantRoles) {
		t.Errorf("roles %v, want %v", tm.roles, wantRoles)
	}
	if tm.aliased {
		t.Error("50 degrees a frame flagged as more than half a turn")
	}

	// On twos: frames 0, 2, 4, 6, 8; the odd frames' marks join the row
	// before with "(at N)"; spacing and turn span two frames.
	rows := tm.rows(true)
	if len(rows) != 5 {
		t.Fatalf("%d rows on twos, want 5", len(rows))
	}
	if r := rows[1]; r.frame != 2 || !slices.Equal(r.notes, []string{"breakdown", "90°", "flip 1 (at 3)"}) {
		t.Errorf("row 1: frame %d marks %q", r.frame, r.notes)
	}
	if r := rows[0]; !slices.Equal(r.notes, []string{"key: release", "onset (at 1)"}) {
		t.Errorf("row 0 marks %q", r.notes)
	}
	if r := rows[2]; math.Abs(r.spacing-0.2) > 1e-12 || math.Abs(r.turn-100) > 1e-9 || r.total != 200 {
		t.Errorf("row 2 on twos: spacing %g turn %g total %g, want 0.2, 100, 200", r.spacing, r.turn, r.total)
	}
	ones := tm.rows(false)
	if r := ones[3]; len(ones) != 9 || r.spacing != 0.1 || r.turn != 50 || r.total != 150 {
		t.Errorf("row 3 on ones: %+v", r)
	}

	// A spin over half a turn a frame is flagged.
	tk.Frames[5].Omega = r3.Vec{Z: 200 * math.Pi / 180 * 24}
	if !analyse(tk, rate, &v).aliased {
		t.Error("200 degrees a frame not flagged")
	}
}

func TestPoseFrames(t *testing.T) {
	tk := &physics.Take{Frames: make([]physics.Frame, 100), ApexFrame: 49}
	tm := analyse(tk, physics.Rate{Num: 24, Den: 1}, &physics.Verdict{})
	got, step := tm.poseFrames(false, 25)
	if len(got) > 25 || step != 5 {
		t.Errorf("%d poses every %d frames, want at most 25 every 5", len(got), step)
	}
	for _, f := range []int{0, 24, 49, 74, 99} { // keys and breakdowns
		if !slices.Contains(got, f) {
			t.Errorf("poses %v lack key or breakdown %d", got, f)
		}
	}
	got, step = tm.poseFrames(true, 25)
	if step%2 != 0 || len(got) > 25 {
		t.Errorf("twos: %d poses every %d frames, want an even step", len(got), step)
	}
}

func TestFormat(t *testing.T) {
	for _, c := range []struct{ got, want string }{
		{fixed(-0.00004, 4), "0.0000"},
		{fixed(-1.25, 2), "−1.25"},
		{fixed(0.05263, 4), "0.0526"},
		{fixed(math.NaN(), 2), "—"},
		{sig(0.004347, 4), "0.004347"},
		{sig(1.25e-5, 3), "1.25×10⁻⁵"},
		{sig(123456, 3), "1.23×10⁵"},
		{sig(12345, 3), "12300"},
		{sig(-2.5, 3), "−2.5"},
		{sig(0, 3), "0"},
		{vec(r3.Vec{X: -0.081, Y: 0, Z: 0.997}, 3), "(−0.081, 0.000, 0.997)"},
		{ordinal(2), "2nd"}, {ordinal(3), "3rd"}, {ordinal(5), "5th"}, {ordinal(12), "12th"}, {ordinal(22), "22nd"},
		{ordinal(1), "1st"}, {ordinal(21), "21st"}, {ordinal(111), "111th"},
		{everyNth(1), "every"}, {everyNth(2), "every 2nd"}, {everyNth(31), "every 31st"},
	} {
		if c.got != c.want {
			t.Errorf("got %q, want %q", c.got, c.want)
		}
	}
}
