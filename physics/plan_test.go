package physics

import (
	"context"
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

const turn = 2 * math.Pi // rad/s per turn per second

// brickThrow returns a 0.3 x 0.2 x 0.1 m box (least axis x, middle y,
// greatest z: Goldstein §5.3's box moments m(b^2 + c^2)/12) thrown from
// 1.5 m so that its centre of mass is back at the release height after
// hang seconds (t = 2 vy / g), with no horizontal speed.
func brickThrow(hang float64) (Prop, MassProps, Throw) {
	p := Prop{Parts: []Part{box(1, 0.3, 0.2, 0.1)}}
	mp, _ := p.MassProps()
	th := DefaultThrow()
	th.Velocity = VelocityFromHang(hang, 0.8, 0, th.Gravity)
	th.Spin = Spin{Axis: Greatest, TiltToward: Least, Rate: 3 * turn}
	return p, mp, th
}

// oracleError flies the throw at rate r in real time (flyToEnd, the step
// rule of Simulate) and returns the end time and the target error: the
// slow, obvious counterpart of the plan's one scaled integration.
func oracleError(t *testing.T, p *Prop, mp *MassProps, th *Throw, tg Target, end End, r float64) (float64, float64) {
	t.Helper()
	rt := *th
	rt.Spin.Rate = r
	f := newFlight(p, mp, &rt)
	te, b, err := f.flyToEnd(f.initial(mp), end)
	if err != nil {
		t.Fatal(err)
	}
	return te, tg.Error(f.propOrient(b))
}

// TestPlan_PrincipalSpin_ClosedForm: a prop spun exactly about a principal
// axis turns steadily, so an axis perpendicular to the spin is back at its
// release direction after whole turns: solutions n/t turns per second with
// windows n/t +- T/(360 t) (REFERENCES.md §11; t = 2 vy / g for a catch at
// the release height). Both the asymmetric box's greatest axis and a plate's
// symmetry axis; a 5 and a 10 degree tolerance.
func TestPlan_PrincipalSpin_ClosedForm(t *testing.T) {
	const hang = 1.2
	p, mp, th := brickThrow(hang)
	plate := Prop{Parts: []Part{{Shape: Cylinder, Radius: 0.13, Length: 0.01, Mass: 0.6, Orient: IdentityRotation()}}}
	mpPlate := mustMass(t, &plate) // symmetry axis = prop z (greatest)
	for _, c := range []struct {
		name string
		p    *Prop
		mp   *MassProps
		tolD float64
	}{{"box greatest", &p, &mp, 10}, {"box greatest", &p, &mp, 5}, {"plate symmetry axis", &plate, &mpPlate, 10}} {
		tg := Target{Axis: r3.Vec{X: 1}, Dir: r3.Vec{X: 1}} // a prop axis perpendicular to the spin, back where it started
		spec := PlanSpec{Target: tg, End: End{Catch: true, CatchY: th.Position.Y}, Tolerance: c.tolD * deg,
			RateMin: 0.25 * turn, RateMax: 9.9 * turn, Thresholds: DefaultThresholds()}
		plan, err := PlanLanding(context.Background(), c.p, c.mp, &th, spec)
		if err != nil {
			t.Fatal(err)
		}
		checkRel(t, c.name+" flight time", plan.FlightTime, hang, closeTol)
		// n = 1 .. 11: n/1.2 <= 9.9 turns/s.
		if len(plan.Solutions) != 11 {
			t.Fatalf("%s: %d solutions, want 11: %+v", c.name, len(plan.Solutions), plan.Solutions)
		}
		half := c.tolD / (360 * hang) // turns per second
		for i, s := range plan.Solutions {
			n := float64(i + 1)
			want := n / hang
			if math.Abs(s.Rate/turn-want) > 1e-7 || s.Error > 1e-6 {
				t.Errorf("%s: solution %d at %.9f turns/s (error %.3g rad), want %.9f", c.name, i, s.Rate/turn, s.Error, want)
			}
			if math.Abs(s.WindowLo/turn-(want-half)) > 1e-8 || math.Abs(s.WindowHi/turn-(want+half)) > 1e-8 {
				t.Errorf("%s: window %d [%.9f, %.9f], want [%.9f, %.9f]", c.name, i, s.WindowLo/turn, s.WindowHi/turn, want-half, want+half)
			}
			checkRel(t, c.name+" turns", s.Turns, n, 1e-7)
			if s.Motion != Spinning {
				t.Errorf("%s: motion %v", c.name, s.Motion)
			}
		}
	}
}

// TestPlan_RangeEnd: a minimum exactly at the end of the range (12 turns in
// 1.2 s at 10 turns/s) is a solution whose window is cut at the range.
func TestPlan_RangeEnd(t *testing.T) {
	p, mp, th := brickThrow(1.2)
	spec := PlanSpec{Target: Target{Axis: r3.Vec{X: 1}, Dir: r3.Vec{X: 1}}, End: End{Catch: true, CatchY: 1.5},
		Tolerance: 10 * deg, RateMin: 0.25 * turn, RateMax: 10 * turn, Thresholds: DefaultThresholds()}
	plan, err := PlanLanding(context.Background(), &p, &mp, &th, spec)
	if err != nil {
		t.Fatal(err)
	}
	last := plan.Solutions[len(plan.Solutions)-1]
	if len(plan.Solutions) != 12 || math.Abs(last.Rate/turn-10) > 1e-7 || last.WindowHi != spec.RateMax {
		t.Errorf("%d solutions, last %+v", len(plan.Solutions), last)
	}
}

// TestPlan_GroundSphere_ClosedForm: a ball touches the ground when its
// centre is one radius above it, whatever its spin, so a ground landing has
// the same closed form with t from y0 + vy t - g t^2/2 = R (exact support of
// a sphere).
func TestPlan_GroundSphere_ClosedForm(t *testing.T) {
	ball := Prop{Parts: []Part{{Shape: Sphere, Radius: 0.11, Mass: 0.45, Orient: IdentityRotation()}}}
	mp := mustMass(t, &ball)
	th := DefaultThrow()
	th.Velocity = r3.Vec{X: 1, Y: 4}
	th.Spin = Spin{Axis: Free, Vector: r3.Vec{Z: 1}, Rate: turn}
	g, y0, R := th.Gravity, th.Position.Y, 0.11
	tc := (4 + math.Sqrt(16+2*g*(y0-R))) / g
	spec := PlanSpec{Target: Target{Axis: r3.Vec{Y: 1}, Dir: r3.Vec{Y: 1}}, Tolerance: 10 * deg,
		RateMin: 0.25 * turn, RateMax: 6 * turn, Thresholds: DefaultThresholds()}
	plan, err := PlanLanding(context.Background(), &ball, &mp, &th, spec)
	if err != nil {
		t.Fatal(err)
	}
	checkRel(t, "flight time", plan.FlightTime, tc, 1e-10)
	half := 10 / (360 * tc)
	for i, s := range plan.Solutions {
		want := float64(i+1) / tc
		if math.Abs(s.Rate/turn-want) > 1e-7 || math.Abs(s.WindowLo/turn-(want-half)) > 1e-8 || math.Abs(s.WindowHi/turn-(want+half)) > 1e-8 {
			t.Errorf("solution %d: %+v, want %.9f +- %.9f turns/s", i, s, want, half)
		}
	}
	if want := int(6 * tc); len(plan.Solutions) != want {
		t.Errorf("%d solutions, want %d", len(plan.Solutions), want)
	}
}

// TestPlan_Tumble_AgainstOracle: a brick thrown 2 degrees off its middle
// axis tumbles, its error curve is irregular and the landing time depends on
// the rate. Every solution must be a true local minimum within tolerance
// (checked by flying that rate in real time), every window edge must sit
// at the tolerance, the landing time must be Simulate's, and no grid rate
// within tolerance may be left outside all windows.
func TestPlan_Tumble_AgainstOracle(t *testing.T) {
	p, mp, th := brickThrow(1.2)
	th.Spin = Spin{Axis: Middle, Tilt: 2 * deg, TiltToward: Least}
	tg := Target{Axis: mp.Axes[Least], Dir: r3.Vec{X: 1}} // land lying along the throw
	tol := 10 * deg
	spec := PlanSpec{Target: tg, Tolerance: tol, RateMin: 0.25 * turn, RateMax: 10 * turn, Thresholds: DefaultThresholds()}
	plan, err := PlanLanding(context.Background(), &p, &mp, &th, spec)
	if err != nil {
		t.Fatal(err)
	}
	if plan.Motion != Tumbling || len(plan.Solutions) == 0 {
		t.Fatalf("motion %v, %d solutions", plan.Motion, len(plan.Solutions))
	}
	for i, s := range plan.Solutions {
		te, e := oracleError(t, &p, &mp, &th, tg, End{}, s.Rate)
		if math.Abs(te-s.FlightTime) > 1e-9 || math.Abs(e-s.Error) > 1e-6 || e > tol || s.Motion != Tumbling {
			t.Errorf("solution %d at %.6f turns/s: plan t %.12f err %.9f, oracle t %.12f err %.9f", i, s.Rate/turn, s.FlightTime, s.Error, te, e)
		}
		rt := th
		rt.Spin.Rate = s.Rate
		if take, err := Simulate(&p, &mp, &rt); err != nil || math.Abs(take.FlightTime-s.FlightTime) > 1e-9 {
			t.Errorf("solution %d: Simulate flight time %v (%v), plan %v", i, take.FlightTime, err, s.FlightTime)
		}
		for _, d := range []float64{-1e-4, 1e-4} {
			if r := s.Rate + d; r > spec.RateMin && r < spec.RateMax {
				if _, en := oracleError(t, &p, &mp, &th, tg, End{}, r); en < e-1e-7 {
					t.Errorf("solution %d is not a local minimum: error %.9f at %+g rad/s, %.9f at the solution", i, en, d, e)
				}
			}
		}
		for _, edge := range []float64{s.WindowLo, s.WindowHi} {
			if edge == spec.RateMin || edge == spec.RateMax {
				continue
			}
			if _, ee := oracleError(t, &p, &mp, &th, tg, End{}, edge); math.Abs(ee-tol) > 1e-5 {
				t.Errorf("solution %d: error %.7f deg at the window edge %.6f turns/s, want %.1f", i, ee/deg, edge/turn, tol/deg)
			}
		}
	}
	for i, r := range plan.Rates {
		if plan.Errors[i] > tol {
			continue
		}
		in := false
		for _, s := range plan.Solutions {
			in = in || (r >= s.WindowLo && r <= s.WindowHi)
		}
		if !in {
			t.Errorf("grid rate %.6f turns/s has error %.3f deg but lies in no window", r/turn, plan.Errors[i]/deg)
		}
	}
}

// TestPlan_NoneFound: a box spun about its greatest axis keeps its least
// axis perpendicular to the spin, so that axis can never point along the
// spin axis: 90 degrees off at every rate, no solution.
func TestPlan_NoneFound(t *testing.T) {
	p, mp, th := brickThrow(1.2)
	spec := PlanSpec{Target: Target{Axis: r3.Vec{X: 1}, Dir: r3.Vec{Z: 1}}, End: End{Catch: true, CatchY: 1},
		Tolerance: 10 * deg, RateMin: 0.25 * turn, RateMax: 10 * turn}
	plan, err := PlanLanding(context.Background(), &p, &mp, &th, spec)
	if err != nil {
		t.Fatal(err)
	}
	if len(plan.Solutions) != 0 || plan.Best() != -1 {
		t.Errorf("solutions %+v", plan.Solutions)
	}
	for i, e := range plan.Errors {
		if math.Abs(e-math.Pi/2) > 1e-9 {
			t.Fatalf("grid error %d = %.12g, want pi/2", i, e)
		}
	}
}

// TestPlan_BadInput: each bad number is refused naming its flag.
func TestPlan_BadInput(t *testing.T) {
	p, mp, th := brickThrow(1.2)
	good := PlanSpec{Target: Target{Axis: r3.Vec{X: 1}, Dir: r3.Vec{Y: 1}}, Tolerance: 10 * deg, RateMin: 1, RateMax: 10}
	for _, c := range []struct {
		field string
		edit  func(*PlanSpec)
	}{
		{"land", func(s *PlanSpec) { s.Target.Axis = r3.Vec{} }},
		{"land", func(s *PlanSpec) { s.Target.Dir = r3.Vec{Y: math.NaN()} }},
		{"rate-min", func(s *PlanSpec) { s.RateMin = 20 }},
		{"rate-min", func(s *PlanSpec) { s.RateMin = -1 }},
		{"rate-max", func(s *PlanSpec) { s.RateMax = math.Inf(1) }},
		{"tolerance-deg", func(s *PlanSpec) { s.Tolerance = 0 }},
		{"tolerance-deg", func(s *PlanSpec) { s.Tolerance = 181 * deg }},
		{"tolerance-deg", func(s *PlanSpec) { s.Tolerance = math.NaN() }},
		{"catch-height", func(s *PlanSpec) { s.End = End{Catch: true, CatchY: 50} }},
		{"catch-height", func(s *PlanSpec) { s.End = End{Catch: true, CatchY: -1} }},
	} {
		s := good
		c.edit(&s)
		_, err := PlanLanding(context.Background(), &p, &mp, &th, s)
		fe, ok := err.(*FieldError)
		if !ok || fe.Field != c.field {
			t.Errorf("want a %s error, got %v", c.field, err)
		}
	}
	ctx, cancel := context.WithCancel(context.Background())
	cancel()
	if _, err := PlanLanding(ctx, &p, &mp, &th, good); err != context.Canceled {
		t.Errorf("cancelled: %v", err)
	}
}

// TestCatchTime: the catch is the larger root of the centre-of-mass height
// (projectile formula); a downward throw caught below the release.
func TestCatchTime(t *testing.T) {
	th := DefaultThrow()
	th.Velocity = r3.Vec{Y: -2}
	got, err := End{Catch: true, CatchY: 1}.catchTime(&th)
	g := th.Gravity
	want := (-2 + math.Sqrt(4+2*g*0.5)) / g
	if err != nil || !relClose(got, want, closeTol) {
		t.Errorf("downward: %v %v, want %v", got, err, want)
	}
	if _, err := (End{Catch: true, CatchY: 1.5}).catchTime(&th); err == nil {
		t.Error("a downward throw caught at its release height must be refused")
	}
}

// TestPlan_FlightTimeOutsideRange: with no solution, a ground landing's
// FlightTime is the throw's own; when the throw's rate lies above the
// searched range it must still agree with Simulate (the slow, obvious
// oracle), not come from one long step past the end of the plan's scaled
// motion (it was 6 ms short for this tumbling brick).
func TestPlan_FlightTimeOutsideRange(t *testing.T) {
	p, mp, th := brickThrow(1.2)
	th.Spin = Spin{Axis: Middle, Tilt: 0.05, TiltToward: Least, Rate: 9 * turn}
	spec := PlanSpec{Target: Target{Axis: r3.Vec{X: 1}, Dir: r3.Vec{Z: 1}},
		Tolerance: 0.01 * deg, RateMin: 0.25 * turn, RateMax: 1 * turn}
	plan, err := PlanLanding(context.Background(), &p, &mp, &th, spec)
	if err != nil {
		t.Fatal(err)
	}
	if len(plan.Solutions) != 0 {
		t.Fatalf("want no solution, got %d", len(plan.Solutions))
	}
	take, err := Simulate(&p, &mp, &th)
	if err != nil {
		t.Fatal(err)
	}
	if d := math.Abs(plan.FlightTime - take.FlightTime); d > 1e-9 {
		t.Errorf("plan flight time %.12g s, take %.12g s (off by %.3g s)", plan.FlightTime, take.FlightTime, d)
	}
}

// TestScaledMotion_PastEnd: a phase past the motion's last checkpoint is
// reached by steps of the motion's own size, so it agrees with a motion
// built long enough to hold it (both the step rule of Simulate), instead of
// one Gauss step many times too long.
func TestScaledMotion_PastEnd(t *testing.T) {
	I := [3]float64{1, 2, 3}
	rot := newRotor(I)
	s0 := body{L: lOf(I, r3.Unit(r3.Vec{X: 0.1, Y: 1, Z: 0.2})), Q: identity}
	short, ok1 := newScaledMotion(rot, s0, 1)
	long, ok2 := newScaledMotion(rot, s0, 12)
	if !ok1 || !ok2 {
		t.Fatal("motion refused")
	}
	const phase = 10.3
	a, b := short.at(phase), long.at(phase)
	if d := RotationAngle(a.Q, b.Q); d > 1e-9 {
		t.Errorf("past the end: orientation off by %.3g rad", d)
	}
	if d := r3.Norm(r3.Sub(a.L, b.L)); d > 1e-9 {
		t.Errorf("past the end: L off by %.3g", d)
	}
}
