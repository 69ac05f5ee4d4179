package physics

import (
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

// unitMP is a body with principal moments I and principal axes along the
// prop axes x, y, z.
func unitMP(I [3]float64) MassProps {
	return MassProps{Moments: I, Axes: [3]r3.Vec{{X: 1}, {Y: 1}, {Z: 1}}}
}

func judgeTilt(I [3]float64, a Axis, tilt float64, toward Axis) Verdict {
	mp := unitMP(I)
	th := DefaultThrow()
	th.Spin = Spin{Axis: a, Tilt: tilt, TiltToward: toward, Rate: 2 * math.Pi}
	return Judge(&mp, &th, DefaultThresholds())
}

// TestRatio_Reference: the spin-to-wobble ratio of a flat plate with
// I = (1, 2, 3) kg m^2, REFERENCES.md §10 (computed there by integrating
// with scipy DOP853, rtol 1e-12, and following the axis round L), printed
// to 8 digits.
func TestRatio_Reference(t *testing.T) {
	I := [3]float64{1, 2, 3}
	rows := []struct {
		name         string
		axis, toward Axis
		tiltDeg      float64
		want         float64
	}{
		{"5 deg off the greatest axis toward the least", Greatest, Least, 5, 2.0019153},
		{"5 deg off the least axis toward the greatest", Least, Greatest, 5, 0.4397568},
		{"20 deg off the greatest axis toward the middle", Greatest, Middle, 20, 2.0322078},
	}
	for _, r := range rows {
		v := judgeTilt(I, r.axis, r.tiltDeg*deg, r.toward)
		if !v.HasRatio || v.Motion != Spinning || v.Circles != r.axis {
			t.Fatalf("%s: %v about %v, HasRatio %v", r.name, v.Motion, v.Circles, v.HasRatio)
		}
		if math.Abs(v.WobblesPerTurn-r.want) > 6e-8 {
			t.Errorf("%s: ratio %.9f, want %.7f", r.name, v.WobblesPerTurn, r.want)
		}
		checkRel(t, r.name+": ratio of the rates", v.PrecessionRate/v.AxialRate, v.WobblesPerTurn, 1e-14)
	}
}

// TestRatio_NearAxisLimits: a spin 1e-5 rad off a stable axis has the ratio
// of the linearised motion (REFERENCES.md §3.4 rates; §10):
// 1 + sqrt((I3-I1)(I3-I2)/(I1 I2)) about the greatest axis,
// 1 - sqrt((I2-I1)(I3-I1)/(I2 I3)) about the least. The offset changes the
// ratio only at second order.
func TestRatio_NearAxisLimits(t *testing.T) {
	sets := [][3]float64{
		{1, 2, 3},
		{0.0020833333333, 0.0070833333333, 0.0083333333333}, // brick 0.2 x 0.1 x 0.05 m, 2 kg (REFERENCES.md §1)
		{0.00121, 0.01638, 0.01748},                         // racket (REFERENCES.md §4)
		{1, 1.5, 2.4},
	}
	for _, I := range sets {
		greatest := 1 + math.Sqrt((I[2]-I[0])*(I[2]-I[1])/(I[0]*I[1]))
		least := 1 - math.Sqrt((I[1]-I[0])*(I[2]-I[0])/(I[1]*I[2]))
		for _, toward := range []Axis{Least, Middle} {
			v := judgeTilt(I, Greatest, 1e-5, toward)
			checkRel(t, "greatest-axis limit", v.WobblesPerTurn, greatest, 1e-7)
		}
		for _, toward := range []Axis{Middle, Greatest} {
			v := judgeTilt(I, Least, 1e-5, toward)
			checkRel(t, "least-axis limit", v.WobblesPerTurn, least, 1e-7)
		}
		// Exactly on the axis: m = 0, the limit itself.
		checkRel(t, "on the greatest axis", judgeTilt(I, Greatest, 0, Least).WobblesPerTurn, greatest, closeTol)
		checkRel(t, "on the least axis", judgeTilt(I, Least, 0, Middle).WobblesPerTurn, least, closeTol)
	}
}

// TestRatio_SymmetricContinuity: as I2 -> I1 the asymmetric ratio tends to
// the symmetric top's (|L|/I_perp)/|omega . axis| = r / cos(theta) (Fowler,
// Graduate Classical Mechanics §26.2; REFERENCES.md §2.1).
func TestRatio_SymmetricContinuity(t *testing.T) {
	I := [3]float64{1, 1 + 1e-9, 2.2}
	w := r3.Vec{X: math.Sin(25 * deg), Y: 0.3, Z: math.Cos(25 * deg)}
	l := lOf(I, w)
	p, a, c, ok := asymmetricRatio(I, l)
	if !ok || c != Greatest {
		t.Fatalf("ok %v circles %v", ok, c)
	}
	cos := l.Z / r3.Norm(l)
	checkRel(t, "near-oblate ratio", p/a, I[2]/I[0]/cos, 1e-8)
}

// followAxis is the slow oracle: it integrates the free motion of
// principal moments I from body angular velocity w over `periods` polhode
// periods (steps steps each) and follows the circled axis e round the
// fixed world L: the unwrapped azimuth of e about L, and the trapezoid
// integral of omega . e (spectrally accurate over whole periods of a
// periodic integrand). It returns their ratio.
func followAxis(I [3]float64, w r3.Vec, circled Axis, periods, steps int) float64 {
	r := newRotor(I)
	s := body{L: lOf(I, w), Q: IdentityRotation()}
	T := PolhodePeriod(I, r3.Norm2(s.L), 2*r.energy(s.L))
	lw := r3.Unit(s.Q.Rotate(s.L))
	u := r3.Unit(r3.Cross(lw, r3.Vec{X: 0.3, Y: 0.5, Z: 0.7}))
	v := r3.Cross(lw, u)
	var e r3.Vec
	switch circled {
	case Least:
		e = r3.Vec{X: 1}
	case Greatest:
		e = r3.Vec{Z: 1}
	}
	azimuth := func(b body) float64 {
		ew := b.Q.Rotate(e)
		return math.Atan2(r3.Dot(ew, v), r3.Dot(ew, u))
	}
	n := periods * steps
	h := T / float64(steps)
	st := stepper{rot: &r, h: h}
	prev, total, turn := azimuth(s), 0.0, 0.0
	for range n {
		w0 := r3.Dot(r.omega(s.L), e)
		s = st.next(s)
		turn += 0.5 * h * (w0 + r3.Dot(r.omega(s.L), e))
		a := azimuth(s)
		total += math.Remainder(a-prev, 2*math.Pi)
		prev = a
	}
	return math.Abs(total) / math.Abs(turn)
}

// TestRatio_FollowAxis: the closed form (elliptic integrals of the third
// kind) against a long integration that follows the circled axis round L,
// for random spin directions of three bodies, both families.
func TestRatio_FollowAxis(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	sets := [][3]float64{{1, 2, 3}, {0.0020833333333, 0.0070833333333, 0.0083333333333}, {1, 1.5, 2.4}}
	checked := 0
	for checked < 15 {
		I := sets[checked%len(sets)]
		w := r3.Unit(r3.Vec{X: rng.NormFloat64(), Y: rng.NormFloat64(), Z: rng.NormFloat64()})
		mp := unitMP(I)
		th := Throw{Spin: Spin{Axis: Free, Vector: w, Rate: 3}}
		vd := Judge(&mp, &th, DefaultThresholds())
		if !vd.HasRatio {
			continue
		}
		got := followAxis(I, r3.Scale(3, w), vd.Circles, 3, 3000)
		checkRel(t, "ratio vs followed axis", vd.WobblesPerTurn, got, integrateTol)
		checked++
	}
}

// TestExcursion_Take: the closed-form excursion (where the polhode crosses
// the middle axis's plane, verdict.go) against the largest angle between L
// and the circled axis over an integrated take, for many directions of a
// handbook brick. The take samples at 480 fps over at least one polhode
// period, so its largest sampled angle is at most the closed form and
// within 1e-4 of it (relative).
func TestExcursion_Take(t *testing.T) {
	brick := Prop{Parts: []Part{box(2, 0.2, 0.1, 0.05)}}
	mp := mustMass(t, &brick)
	rng := rand.New(rand.NewPCG(2, 1))
	tensor := mp.Inertia
	checked := 0
	for i := range 24 {
		w := r3.Unit(r3.Vec{X: rng.NormFloat64(), Y: rng.NormFloat64(), Z: rng.NormFloat64()})
		th := DefaultThrow()
		th.FPS = Rate{480, 1}
		th.Spin = Spin{Axis: Free, Vector: w, Rate: 4 * math.Pi}
		v := Judge(&mp, &th, DefaultThresholds())
		pw := (RotationFromMat(mp.PrincipalMat())).RotateInv(th.Omega(&mp))
		l := lOf(mp.Moments, pw)
		T := PolhodePeriod(mp.Moments, r3.Norm2(l), r3.Dot(l, pw))
		if T > 20 {
			continue // too close to the separatrix for a short take
		}
		// Flight time 1.1 T from release height 1.5 m back to the ground.
		ft := 1.1*T + 0.2
		th.Position = r3.Vec{Y: 1.5}
		th.Velocity = r3.Vec{Y: (0.5*th.Gravity*ft*ft - 1.5) / ft}
		take, err := Simulate(&brick, &mp, &th)
		if err != nil {
			t.Fatal(err)
		}
		if take.FlightTime < T {
			t.Fatalf("direction %d: flight %g s shorter than the polhode period %g s", i, take.FlightTime, T)
		}
		axis := mp.Axes[v.Circles]
		worst := 0.0
		for _, f := range take.Frames {
			wp := f.Orient.RotateInv(f.Omega) // prop frame
			lp := tensor.MulVec(wp)
			worst = math.Max(worst, math.Acos(math.Min(1, math.Abs(r3.Dot(r3.Unit(lp), axis)))))
		}
		got := worst / deg
		if got > v.ExcursionDeg*(1+1e-9) || got < v.ExcursionDeg*(1-1e-4) {
			t.Errorf("direction %d (%v): take's largest angle %.8g deg, closed form %.8g deg", i, v.Motion, got, v.ExcursionDeg)
		}
		checked++
	}
	if checked < 20 {
		t.Errorf("only %d directions checked", checked)
	}
}

// TestRatio_NullCases: no ratio for a tumble, a symmetric body end over
// end or no spin; a ratio for a symmetric body spun on its axis and for a
// sphere (1).
func TestRatio_NullCases(t *testing.T) {
	if v := judgeTilt([3]float64{1, 2, 3}, Middle, 2*deg, Least); v.Motion != Tumbling || v.HasRatio {
		t.Errorf("tumble: %v HasRatio %v", v.Motion, v.HasRatio)
	}
	pin := [3]float64{0.1, 1, 1}
	if v := judgeTilt(pin, Greatest, 0, Least); v.HasRatio {
		t.Errorf("rolling pin end over end has a ratio %g", v.WobblesPerTurn)
	}
	disc := [3]float64{1, 1, 2}
	v := judgeTilt(disc, Greatest, 0.1*deg, Least)
	if v.Motion != Spinning || !v.HasRatio || v.HasWobble {
		t.Fatalf("disc on its axis: %v HasRatio %v HasWobble %v", v.Motion, v.HasRatio, v.HasWobble)
	}
	checkRel(t, "disc on its axis", v.WobblesPerTurn, 2/math.Cos(v.ExcursionDeg*deg), closeTol)
	if v := judgeTilt([3]float64{1, 1, 1}, Least, 0, Middle); !v.HasRatio || v.WobblesPerTurn != 1 {
		t.Errorf("sphere: HasRatio %v ratio %g", v.HasRatio, v.WobblesPerTurn)
	}
	mp := unitMP([3]float64{1, 2, 3})
	th := DefaultThrow()
	if v := Judge(&mp, &th, DefaultThresholds()); v.HasRatio {
		t.Error("no spin has a ratio")
	}
}
