package physics

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/num/quat"
	"gonum.org/v1/gonum/spatial/r3"
)

// thinWire is a copper wire 0.4 mm across and 1 m long (copper 8960
// kg/m^3, common practice, no source). Its least moment (about its own
// axis, m r^2/2) is 2.4e-7 times the other two (m (3 r^2 + L^2)/12;
// cylinder rows of REFERENCES.md §1.1).
func thinWire() Prop {
	return Prop{Parts: []Part{{Name: "wire", Shape: Cylinder, Radius: 0.2e-3, Length: 1, Density: 8960, Orient: IdentityRotation()}}}
}

// wireThrow spins the wire end over end (greatest axis) at 4 turns per
// second, tilted 3 degrees toward its own axis, for a flight of about a
// second.
func wireThrow() Throw {
	th := DefaultThrow()
	th.Velocity = r3.Vec{X: 1, Y: 3.4}
	th.Spin = Spin{Axis: Greatest, Tilt: 3 * deg, TiltToward: Least, Rate: 4 * 2 * math.Pi}
	return th
}

// symmetricTop is the closed-form motion of a free symmetric top
// (REFERENCES.md §2.1; Landau & Lifshitz, Mechanics, §33 and §35 Problem 1):
// the body turns about the fixed angular momentum L at phiDot = |L|/I_perp
// (the wobble) while it turns about its own symmetry axis a at psiDot =
// omega_a (1 - I_a/I_perp) (the Euler-angle spin), so q(t) = exp(phiDot t
// L^) q0 exp(psiDot t a), with q0 the prop-frame -> world orientation at t = 0.
func symmetricTop(q0 Rotation, lWorld r3.Vec, axis r3.Vec, iAxial, iPerp, omegaAxial, t float64) Rotation {
	phiDot := r3.Norm(lWorld) / iPerp
	psiDot := omegaAxial * (1 - iAxial/iPerp)
	return ((AxisAngle(lWorld, phiDot*t)).Mul(q0)).Mul(AxisAngle(axis, psiDot*t))
}

// TestSimulate_ThinWireSpun: a 0.4 mm wire spun end over end flies (no
// refusal) and every frame of its take agrees with the closed form of the
// free symmetric top, the world angular momentum stays put and the
// quaternion stays unit.
func TestSimulate_ThinWireSpun(t *testing.T) {
	p := thinWire()
	mp := mustMass(t, &p)
	if r := mp.Moments[2] / mp.Moments[0]; r < 1e6 {
		t.Fatalf("wire I3/I1 = %.3g, want a very thin prop", r)
	}
	th := wireThrow()
	take, err := Simulate(&p, &mp, &th)
	if err != nil {
		t.Fatalf("0.4 mm wire spun end over end: %v", err)
	}
	if take.FlightTime < 0.9 {
		t.Fatalf("flight time %g s, want about 1 s", take.FlightTime)
	}
	f0 := take.Frames[0]
	iw := mp.Inertia.Rotated(f0.Orient.Mat())
	lw := iw.MulVec(f0.Omega)
	axis := r3.Vec{Z: 1} // the cylinder's own axis, prop frame
	iAxial, iPerp := mp.Moments[0], mp.Moments[2]
	omegaAxial := r3.Dot(f0.Orient.RotateInv(f0.Omega), axis)
	var worstAngle, worstL, worstQ float64
	for _, f := range take.Frames {
		want := symmetricTop(f0.Orient, lw, axis, iAxial, iPerp, omegaAxial, f.Time)
		worstAngle = math.Max(worstAngle, RotationAngle(f.Orient, want))
		l := mp.Inertia.Rotated(f.Orient.Mat()).MulVec(f.Omega)
		worstL = math.Max(worstL, r3.Norm(r3.Sub(l, lw))/r3.Norm(lw))
		worstQ = math.Max(worstQ, math.Abs(quat.Abs(f.Orient.Quat())-1))
	}
	t.Logf("%d frames: worst angle from the closed form %.3g rad, world L %.3g relative, |q|-1 %.3g", len(take.Frames), worstAngle, worstL, worstQ)
	// The round-off floor of the problem: one ulp of |L| in L1 turns the
	// wire about its own axis at eps |L|/I1 ~ 2e-8 rad/s more or less.
	if worstAngle > 1e-8 || worstL > 1e-9 || worstQ > 1e-13 {
		t.Errorf("wire take: angle %.3g rad from the closed form, world L off %.3g, |q|-1 %.3g", worstAngle, worstL, worstQ)
	}
}

// TestRotor_JacobianFiniteDifference: rotor.jacobian against central
// differences of rotor.f (the slow, obvious oracle).
func TestRotor_JacobianFiniteDifference(t *testing.T) {
	r := newRotor([3]float64{0.3, 1.1, 2.5})
	y := state{0.4, -1.2, 0.7, 0.8, -0.1, 0.5, 0.3}
	var J [7][7]float64
	r.jacobian(&y, &J)
	const d = 1e-6
	for col := range 7 {
		yp, ym := y, y
		yp[col] += d
		ym[col] -= d
		var fp, fm state
		r.f(&yp, &fp)
		r.f(&ym, &fm)
		for row := range 7 {
			// f is quadratic, so the central difference is exact up to round-off.
			if fd := (fp[row] - fm[row]) / (2 * d); math.Abs(fd-J[row][col]) > 1e-9 {
				t.Errorf("J[%d][%d] = %.12g, central difference %.12g", row, col, J[row][col], fd)
			}
		}
	}
}

// TestStepper_NewtonMatchesFixedPoint: on a step where the fixed-point
// iteration contracts, the Newton solve finds the same Gauss step.
func TestStepper_NewtonMatchesFixedPoint(t *testing.T) {
	I := [3]float64{1, 2, 3}
	r := newRotor(I)
	b := body{L: r3.Vec{X: 0.3, Y: 2, Z: -0.6}, Q: Rotation{Real: 0.9, Imag: 0.1, Jmag: -0.3, Kmag: 0.2}.Normalize()}
	h := 0.2 // h |L|/I1 = 0.42
	fixed := r.step(b, h)
	st := stepper{rot: &r, h: h}
	s := flatten(b)
	var k [gaussStages]state
	var f0 state
	r.f(&s, &f0)
	for i := range k {
		k[i] = f0
	}
	got, ok := st.newton(&s, &k)
	if !ok {
		t.Fatal("Newton did not converge on an easy step")
	}
	nb := got.body()
	if !vecClose(nb.L, fixed.L, 1e-15*r3.Norm(b.L)*4) || RotationAngle(nb.Q, fixed.Q) > 1e-15*4 {
		t.Errorf("Newton %v %v, fixed point %v %v", nb.L, nb.Q, fixed.L, fixed.Q)
	}
}

// TestRotor_NewtonKeepsInvariants: 1000 Newton-solved steps of the thin
// wire (h |L|/I1 ~ 1e6) keep E, |L|^2 and |Q|^2 to round-off (Gauss
// methods conserve quadratic invariants; Hairer, Lubich & Wanner, GNI
// §IV.2, Theorem 2.2).
func TestRotor_NewtonKeepsInvariants(t *testing.T) {
	p := thinWire()
	mp := mustMass(t, &p)
	r := newRotor(mp.Moments)
	w := r3.Vec{X: 25 * math.Sin(3*deg), Z: 25 * math.Cos(3*deg)}
	l := r3.Vec{X: mp.Moments[0] * w.X, Y: mp.Moments[1] * w.Y, Z: mp.Moments[2] * w.Z}
	s := body{L: l, Q: Rotation{Real: 0.9, Imag: 0.1, Jmag: -0.3, Kmag: 0.2}.Normalize()}
	e0, l0 := r.energy(l), r3.Norm2(l)
	h := 0.35 / r.fastest(l)
	if stiff := h * r3.Norm(l) * r.inv[0]; stiff < 1e5 {
		t.Fatalf("h |L|/I1 = %.3g: not a stiff step", stiff)
	}
	st := stepper{rot: &r, h: h}
	var worstE, worstL, worstQ float64
	for range 1000 {
		s = st.next(s)
		worstE = math.Max(worstE, math.Abs(r.energy(s.L)-e0)/e0)
		worstL = math.Max(worstL, math.Abs(r3.Norm2(s.L)-l0)/l0)
		worstQ = math.Max(worstQ, math.Abs(quat.Abs(s.Q.Quat())-1))
	}
	t.Logf("1000 steps: energy %.2g, |L|^2 %.2g, |q|-1 %.2g, unsolved %d", worstE, worstL, worstQ, st.unsolved)
	if worstE > 1e-13 || worstL > 1e-13 || worstQ > 1e-13 || st.unsolved > 0 {
		t.Errorf("drift: energy %.2g, |L|^2 %.2g, |q|-1 %.2g, unsolved steps %d", worstE, worstL, worstQ, st.unsolved)
	}
}

// TestRotor_Fastest: the step rule's rate bounds the |omega| met along the
// motion (sampled by the tiny-step RK4 oracle) and is reached by it within
// 1 %, and it stays near the spin rate for the thin wire.
func TestRotor_Fastest(t *testing.T) {
	brick := [3]float64{0.0020833333, 0.0070833333, 0.0083333333}
	cases := []struct {
		name string
		I    [3]float64
		w    r3.Vec
		span float64 // s, at least one polhode period
	}{
		{"brick tumbling 2 deg off middle", brick, r3.Vec{X: 4 * math.Pi * math.Sin(2*deg), Y: 4 * math.Pi * math.Cos(2*deg)}, 3},
		{"brick near least", brick, r3.Vec{X: 10, Y: 1, Z: 1}, 3},
		{"brick near greatest", brick, r3.Vec{X: 1, Y: 1, Z: 10}, 3},
		{"(1,2,3) generic", [3]float64{1, 2, 3}, r3.Vec{X: 0.5, Y: 1, Z: 0.2}, 40},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			r := newRotor(c.I)
			l := r3.Vec{X: c.I[0] * c.w.X, Y: c.I[1] * c.w.Y, Z: c.I[2] * c.w.Z}
			s := body{L: l, Q: IdentityRotation()}
			var most float64
			for range 3000 {
				s = rk4(&r, s, c.span/3000, c.span/30000)
				most = math.Max(most, r3.Norm(r.omega(s.L)))
			}
			got := r.fastest(l)
			if got < most*(1-1e-9) || got > most*1.01 {
				t.Errorf("fastest %.6g rad/s, RK4 samples reach %.6g", got, most)
			}
		})
	}
	p := thinWire()
	mp := mustMass(t, &p)
	r := newRotor(mp.Moments)
	w := r3.Vec{X: 25 * math.Sin(3*deg), Z: 25 * math.Cos(3*deg)}
	l := r3.Vec{X: mp.Moments[0] * w.X, Y: mp.Moments[1] * w.Y, Z: mp.Moments[2] * w.Z}
	// Symmetric top: |omega| is constant (REFERENCES.md §2.1).
	// I2 and I3 differ by round-off, so the ends of the segment are found
	// with some cancellation.
	checkRel(t, "wire fastest", r.fastest(l), 25, 1e-8)
}

// BenchmarkTakeThinWire flies the 0.4 mm wire spun end over end for about
// a second (the take of TestSimulate_ThinWireSpun).
func BenchmarkTakeThinWire(b *testing.B) {
	p := thinWire()
	mp, _ := p.MassProps()
	th := wireThrow()
	for b.Loop() {
		if _, err := Simulate(&p, &mp, &th); err != nil {
			b.Fatal(err)
		}
	}
}
