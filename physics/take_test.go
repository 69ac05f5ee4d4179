package physics

import (
	"errors"
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

// TestTake_Projectile checks the centre of mass against the projectile
// formulas of any mechanics text (e.g. Halliday, Resnick & Walker,
// Fundamentals of Physics, ch. 4: apex time v_y/g, apex height v_y^2/(2g),
// level range 2 v_x v_y / g), with the check values of REFERENCES.md §5.1:
// v0 = (3, 8, 0) m/s under g_n.
func TestTake_Projectile(t *testing.T) {
	// A small ball released with its centre at y = 0 over ground at -r lands
	// when the centre is back at 0: the level flight time.
	r := 0.01
	ball := Prop{Parts: []Part{{Shape: Sphere, Radius: r, Mass: 0.1, Orient: IdentityRotation()}}}
	mp := mustMass(t, &ball)
	th := DefaultThrow()
	th.Position = r3.Vec{}
	th.Velocity = r3.Vec{X: 3, Y: 8}
	th.GroundY = -r - 1e-12
	take, err := Simulate(&ball, &mp, &th)
	if err != nil {
		t.Fatal(err)
	}
	checkRel(t, "apex time", take.ApexTime, 0.8157729704, 1e-9)
	apex := th.CMAt(take.ApexTime)
	checkRel(t, "apex height", apex.Y, 3.263091882, 1e-9)
	checkRel(t, "time of flight", take.FlightTime, 1.631545941, 1e-9)
	checkRel(t, "range", th.CMAt(take.FlightTime).X, 4.894637822, 1e-9)
	// 1.631545941 s x 24 fps = 39.157 intervals: landing frame 39, apex frame
	// nearest 0.8158 s x 24 = 19.58 -> 20.
	if take.LandingFrame != 39 || len(take.Frames) != 40 || take.ApexFrame != 20 {
		t.Errorf("landing frame %d (%d frames), apex %d; want 39 (40), 20", take.LandingFrame, len(take.Frames), take.ApexFrame)
	}
	f1, f3 := take.Frames[1], take.Frames[3]
	if !vecClose(f1.CM, r3.Vec{X: 0.125, Y: 0.3248206163}, 1e-9) || !vecClose(f3.CM, r3.Vec{X: 0.375, Y: 0.9233855469}, 1e-9) {
		t.Errorf("frame 1 %v, frame 3 %v", f1.CM, f3.CM)
	}
	// Spacing is the chord between frames.
	checkRel(t, "spacing 1", f1.Spacing, math.Hypot(0.125, 0.3248206163), 1e-9)
}

// TestVelocityFromHang: a throw given by hang time and distance comes back to
// its release height after the hang time, having travelled the distance
// along its heading (y = vy t - g t^2/2 = 0 at t = T gives vy = gT/2).
func TestVelocityFromHang(t *testing.T) {
	for _, c := range []struct{ hang, dist, heading float64 }{{1.2, 3, 0}, {0.8, 2.5, 90 * deg}, {2, 0, 30 * deg}} {
		th := DefaultThrow()
		th.Velocity = VelocityFromHang(c.hang, c.dist, c.heading, th.Gravity)
		end := th.CMAt(c.hang)
		checkRel(t, "height after hang time", end.Y, th.Position.Y, 1e-12)
		d := r3.Sub(end, th.Position)
		checkRel(t, "distance", math.Hypot(d.X, d.Z), c.dist, 1e-12)
		if c.dist > 0 {
			checkRel(t, "heading", math.Atan2(-d.Z, d.X), c.heading, 1e-12)
		}
	}
}

// corners returns the world positions of a box part's eight corners for a
// take frame: the obvious oracle for the box's support.
func corners(p *Part, mp *MassProps, f Frame) []r3.Vec {
	var out []r3.Vec
	h := r3.Scale(0.5, p.Size)
	for _, sx := range []float64{-1, 1} {
		for _, sy := range []float64{-1, 1} {
			for _, sz := range []float64{-1, 1} {
				local := r3.Vec{X: sx * h.X, Y: sy * h.Y, Z: sz * h.Z}
				inProp := r3.Add(p.Position, p.Orient.Rotate(local))
				out = append(out, r3.Add(f.CM, f.Orient.Rotate(r3.Sub(inProp, mp.CM))))
			}
		}
	}
	return out
}

// TestTake_LandingBySupport: a tumbling two-box prop lands when its lowest
// corner reaches the ground, found from the corners themselves.
func TestTake_LandingBySupport(t *testing.T) {
	a, b := box(2, 0.2, 0.1, 0.05), box(0.5, 0.05, 0.3, 0.05)
	b.Position = r3.Vec{X: 0.12, Y: 0.05}
	b.Orient = EulerXYZ(0.2, 0.3, 0.4)
	p := Prop{Parts: []Part{a, b}}
	mp := mustMass(t, &p)
	th := DefaultThrow()
	th.Velocity = r3.Vec{X: 2, Y: 4}
	th.Spin = Spin{Axis: Middle, Tilt: 2 * deg, TiltToward: Least, Rate: 4 * math.Pi}
	take, err := Simulate(&p, &mp, &th)
	if err != nil {
		t.Fatal(err)
	}
	lowest := func(f Frame) float64 {
		low := math.Inf(1)
		for i := range p.Parts {
			for _, c := range corners(&p.Parts[i], &mp, f) {
				low = math.Min(low, c.Y)
			}
		}
		return low
	}
	for _, f := range take.Frames {
		if lowest(f) <= th.GroundY {
			t.Errorf("frame %d is below ground before the landing", f.N)
		}
	}
	// The orientation at the landing instant, integrated from the last frame.
	f := newFlight(&p, &mp, &th)
	last := take.Frames[len(take.Frames)-1]
	qb := last.Orient.Mul(f.qp).Normalize() // principal frame -> world
	s := body{L: qb.RotateInv(last.Omega), Q: qb}
	s.L = r3.Vec{X: mp.Moments[0] * s.L.X, Y: mp.Moments[1] * s.L.Y, Z: mp.Moments[2] * s.L.Z}
	s = run(&f.rot, s, take.FlightTime-last.Time)
	land := Frame{CM: th.CMAt(take.FlightTime), Orient: f.propOrient(s)}
	if d := lowest(land) - th.GroundY; math.Abs(d) > 1e-9 {
		t.Errorf("lowest corner at the landing time is %.3g m from the ground", d)
	}
	if take.LandingFrame != th.FPS.Frame(take.FlightTime) || take.FlightTime < last.Time {
		t.Errorf("landing frame %d for flight time %g", take.LandingFrame, take.FlightTime)
	}
}

// TestTake_Invariants: along a take the world angular momentum (from the
// world angular velocity and the turned inertia tensor) stays put, the
// orientation stays unit and a steady spin turns rate/fps per frame.
func TestTake_Invariants(t *testing.T) {
	p := demoProp()
	mp := mustMass(t, &p)
	th := DefaultThrow()
	th.Velocity = r3.Vec{X: 1, Y: 6}
	th.Orient = EulerXYZ(0.3, -0.2, 0.1)
	th.Spin = Spin{Axis: Least, Tilt: 20 * deg, TiltToward: Greatest, Rate: 3 * 2 * math.Pi}
	take, err := Simulate(&p, &mp, &th)
	if err != nil {
		t.Fatal(err)
	}
	worldL := func(f Frame) r3.Vec {
		R := f.Orient.Mat()
		return mp.Inertia.Rotated(R).MulVec(f.Omega)
	}
	l0 := worldL(take.Frames[0])
	for _, f := range take.Frames {
		if d := r3.Norm(r3.Sub(worldL(f), l0)) / r3.Norm(l0); d > 1e-10 {
			t.Fatalf("frame %d: world L off by %.3g relative", f.N, d)
		}
		checkRel(t, "time", f.Time, float64(f.N)/24, 1e-15)
	}
	// Steady spin about the greatest axis: 2 turns/s at 24 fps is 30 degrees
	// a frame exactly (common practice: turns per frame = rate / fps).
	th.Spin = Spin{Axis: Greatest, Rate: 2 * 2 * math.Pi}
	take, err = Simulate(&p, &mp, &th)
	if err != nil {
		t.Fatal(err)
	}
	for _, f := range take.Frames[1:] {
		checkRel(t, "turn per frame", f.TurnDeg, 30, 1e-9)
	}
}

func TestSimulate_Errors(t *testing.T) {
	p := Prop{Parts: []Part{box(1, 0.2, 0.2, 0.2)}}
	mp := mustMass(t, &p)
	th := DefaultThrow()
	th.Position = r3.Vec{Y: 0.05}
	var fe *FieldError
	if _, err := Simulate(&p, &mp, &th); !errors.As(err, &fe) || fe.Field != "throw.release_position" {
		t.Errorf("prop through the ground: %v", err)
	}
	th = DefaultThrow()
	th.GroundY = -1e9
	if _, err := Simulate(&p, &mp, &th); !errors.Is(err, ErrNoLanding) {
		t.Errorf("ground out of reach: %v", err)
	}
	th = DefaultThrow()
	th.FPS = Rate{10000, 1}
	th.Velocity = r3.Vec{Y: 60} // about 12 s: 120000 frames
	if _, err := Simulate(&p, &mp, &th); !errors.As(err, &fe) || fe.Field != "throw.fps" {
		t.Errorf("too many frames: %v", err)
	}
	th = DefaultThrow()
	th.Gravity = 0
	if _, err := Simulate(&p, &mp, &th); !errors.As(err, &fe) || fe.Field != "throw.gravity" {
		t.Errorf("zero gravity: %v", err)
	}
}

func TestParseRate(t *testing.T) {
	good := map[string]Rate{"24": {24, 1}, "24000/1001": {24000, 1001}, "23.976": {24000, 1001}, "29.97": {30000, 1001},
		"12.5": {25, 2}, "48/2": {24, 1}, " 60 ": {60, 1}}
	for s, want := range good {
		got, err := ParseRate(s)
		if err != nil || got != want {
			t.Errorf("ParseRate(%q) = %v, %v; want %v", s, got, err, want)
		}
	}
	for _, s := range []string{"", "0", "-24", "24/0", "abc", "1/x", "1e9", "24/-1", "NaN"} {
		if _, err := ParseRate(s); err == nil {
			t.Errorf("ParseRate(%q) accepted", s)
		}
	}
	// 23.976 fps: frame 1 lasts 1001/24000 s = 41.708333 ms (REFERENCES.md §5.2).
	checkRel(t, "23.976 frame", Rate{24000, 1001}.Time(1), 0.041708333333, 1e-9)
}

// TestSimulate_NeedleFlies: a needle (radius 10 um, length 1 m) has
// I3/I1 = (3r^2 + L^2)/(6 r^2) ~ 1.7e9 (cylinder table, REFERENCES.md
// §1.1). Spun at 10 turns/s it used to be refused (the fixed-point stage
// solve needed h |L|/I1 <= 2, about 1e9 steps a frame); with the Newton
// stage solve it flies and follows the closed form of the symmetric top
// (REFERENCES.md §2.1). The tolerance is the round-off floor of the
// problem: an error of one ulp in L1 turns the needle about its own axis at
// eps |L|/I1 ~ 2.4e-5 rad/s more or less.
func TestSimulate_NeedleFlies(t *testing.T) {
	p := Prop{Parts: []Part{{Name: "needle", Shape: Cylinder, Radius: 1e-5, Length: 1, Mass: 1, Orient: IdentityRotation()}}}
	mp := mustMass(t, &p)
	th := DefaultThrow()
	th.Velocity = r3.Vec{X: 2, Y: 4}
	th.Spin = Spin{Axis: Greatest, Tilt: 10 * deg, TiltToward: Least, Rate: 10 * 2 * math.Pi}
	take, err := Simulate(&p, &mp, &th)
	if err != nil {
		t.Fatalf("needle spun at 10 turns/s: %v", err)
	}
	f0 := take.Frames[0]
	lw := mp.Inertia.Rotated(f0.Orient.Mat()).MulVec(f0.Omega)
	axis := r3.Vec{Z: 1}
	omegaAxial := r3.Dot(f0.Orient.RotateInv(f0.Omega), axis)
	var worst float64
	for _, f := range take.Frames {
		want := symmetricTop(f0.Orient, lw, axis, mp.Moments[0], mp.Moments[2], omegaAxial, f.Time)
		worst = math.Max(worst, RotationAngle(f.Orient, want))
	}
	if worst > 1e-4 {
		t.Errorf("needle take: %.3g rad from the closed form", worst)
	}
	t.Logf("%d frames, worst %.3g rad from the closed form", len(take.Frames), worst)
}

// TestThrow_GroundTime: the centre of mass reaches the ground at the larger
// root of y0 - g_y + vy t - g t^2/2 = 0 (projectile motion, REFERENCES.md
// §5.1: v0 = (3, 8, 0) from the ground lands at 1.631545941 s).
func TestThrow_GroundTime(t *testing.T) {
	th := DefaultThrow()
	th.Position = r3.Vec{}
	th.GroundY = -1e-300 // just below: the level flight time
	th.Velocity = r3.Vec{X: 3, Y: 8}
	checkRel(t, "level flight", th.groundTime(), 1.631545941, 1e-9)
	// Dropped from 1.5 m: sqrt(2 h / g) (free fall, from memory).
	th = DefaultThrow()
	checkRel(t, "drop", th.groundTime(), math.Sqrt(2*1.5/StandardGravity), 1e-12)
	// Thrown down at 8 m/s from 3.263091882 m: the textbook root
	// t = (vy + sqrt(vy^2 + 2 g h)) / g with vy = -8 m/s (quadratic
	// formula; the code uses the rationalised form 2h / (sqrt(...) - vy)).
	th.Position = r3.Vec{Y: 3.263091882}
	th.Velocity = r3.Vec{Y: -8}
	want := (-8 + math.Sqrt(64+2*StandardGravity*3.263091882)) / StandardGravity
	checkRel(t, "downward throw", th.groundTime(), want, 1e-12)
}
