package physics

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/num/quat"
	"gonum.org/v1/gonum/spatial/r3"
)

// TestGaussTableau checks the order conditions of the 4-stage Gauss method
// (Hairer, Norsett & Wanner, Solving ODEs I, §II.7): sum_j a_ij = c_i,
// sum b_i c_i^(k-1) = 1/k for k = 1..8, and the symmetry c_i + c_(s+1-i) = 1.
func TestGaussTableau(t *testing.T) {
	for i := range gaussStages {
		var s float64
		for j := range gaussStages {
			s += gaussA[i][j]
		}
		checkRel(t, "row sum", s, gaussC[i], 1e-14)
		checkRel(t, "symmetric nodes", gaussC[i]+gaussC[gaussStages-1-i], 1, 1e-14)
	}
	for k := 1; k <= 2*gaussStages; k++ {
		var s float64
		for i := range gaussStages {
			s += gaussB[i] * math.Pow(gaussC[i], float64(k-1))
		}
		checkRel(t, "quadrature order", s, 1/float64(k), 1e-13)
	}
	// C(s) simplifying condition: sum_j a_ij c_j^(k-1) = c_i^k / k, k <= s.
	for i := range gaussStages {
		for k := 1; k <= gaussStages; k++ {
			var s float64
			for j := range gaussStages {
				s += gaussA[i][j] * math.Pow(gaussC[j], float64(k-1))
			}
			checkRel(t, "C(s)", s, math.Pow(gaussC[i], float64(k))/float64(k), 1e-12)
		}
	}
}

// rk4 is the slow, obvious oracle: classical Runge-Kutta with a tiny step
// on the same equations (Euler's equations plus quaternion kinematics).
func rk4(r *rotor, s body, t, h float64) body {
	n := int(math.Ceil(t / h))
	h = t / float64(n)
	for range n {
		k1 := r.deriv(s)
		k2 := r.deriv(axpy(s, h/2, k1))
		k3 := r.deriv(axpy(s, h/2, k2))
		k4 := r.deriv(axpy(s, h, k3))
		s = axpy(s, h/6, k1)
		s = axpy(s, h/3, k2)
		s = axpy(s, h/3, k3)
		s = axpy(s, h/6, k4)
		s.Q = s.Q.Normalize()
	}
	return s
}

// run integrates for t seconds with the production step rule.
func run(r *rotor, s body, t float64) body {
	n := r.substeps(s.L, t)
	h := t / float64(n)
	for range n {
		s = r.step(s, h)
	}
	return s
}

// TestRotor_Conservation: over 10 s the energy and |L| drift below 1e-10
// relative (the Gauss method conserves quadratic invariants; Hairer, Lubich
// & Wanner, GNI §IV.2) and the world angular momentum, which it does not
// conserve by construction, stays within 1e-9.
func TestRotor_Conservation(t *testing.T) {
	cases := []struct {
		name string
		I    [3]float64
		w    r3.Vec
	}{
		{"LL near middle axis (REFERENCES.md §3.3)", [3]float64{1, 2, 3}, r3.Vec{X: 0.01, Y: 1, Z: 0.01}},
		{"(1,2,3) generic", [3]float64{1, 2, 3}, r3.Vec{X: 0.5, Y: 1, Z: 0.2}},
		{"brick 2 turns/s, 2 deg off middle", [3]float64{0.0020833333, 0.0070833333, 0.0083333333}, r3.Vec{X: 4 * math.Pi * math.Sin(2*deg), Y: 4 * math.Pi * math.Cos(2*deg)}},
		{"racket (Brody 1985 via ACC 1991)", [3]float64{0.00121, 0.01638, 0.01748}, r3.Vec{X: 0.3, Y: 2 * math.Pi, Z: -0.3}},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			r := newRotor(c.I)
			l0 := r3.Vec{X: c.I[0] * c.w.X, Y: c.I[1] * c.w.Y, Z: c.I[2] * c.w.Z}
			s := body{L: l0, Q: Rotation{Real: 0.9, Imag: 0.1, Jmag: -0.3, Kmag: 0.2}.Normalize()}
			e0, n0, lw0 := r.energy(l0), r3.Norm(l0), s.Q.Rotate(l0)
			var worstE, worstL, worstQ, worstW float64
			for range 100 {
				s = run(&r, s, 0.1)
				worstE = math.Max(worstE, math.Abs(r.energy(s.L)-e0)/e0)
				worstL = math.Max(worstL, math.Abs(r3.Norm(s.L)-n0)/n0)
				worstQ = math.Max(worstQ, math.Abs(quat.Abs(s.Q.Quat())-1))
				worstW = math.Max(worstW, r3.Norm(r3.Sub(s.Q.Rotate(s.L), lw0))/n0)
			}
			if worstE > 1e-10 || worstL > 1e-10 || worstQ > 1e-12 || worstW > 1e-9 {
				t.Errorf("drift over 10 s: energy %.2g, |L| %.2g, |q|-1 %.2g, world L %.2g", worstE, worstL, worstQ, worstW)
			}
			t.Logf("drift over 10 s: energy %.2g, |L| %.2g, |q|-1 %.2g, world L %.2g", worstE, worstL, worstQ, worstW)
		})
	}
}

// TestRotor_AgainstRK4 compares the production integrator with the tiny-step
// RK4 oracle, and both with the RK4 samples of REFERENCES.md §3.3 for
// I = (1, 2, 3), omega0 = (0.01, 1, 0.01) (computed there with h = 1e-4).
func TestRotor_AgainstRK4(t *testing.T) {
	I := [3]float64{1, 2, 3}
	r := newRotor(I)
	s0 := body{L: r3.Vec{X: 0.01, Y: 2, Z: 0.03}, Q: IdentityRotation()}
	refs := []struct {
		t float64
		w r3.Vec
	}{
		{1, r3.Vec{X: 0.001148329, Y: 1.000049339, Z: 0.008191839}},
		{5, r3.Vec{X: -0.064829617, Y: 0.997946452, Z: 0.038309613}},
		{10, r3.Vec{X: -0.874573438, Y: 0.484996187, Z: 0.505001221}},
		{20, r3.Vec{X: -0.005813837, Y: -1.000033099, Z: 0.008827999}},
	}
	s, oracle, tPrev := s0, s0, 0.0
	for _, ref := range refs {
		s = run(&r, s, ref.t-tPrev)
		oracle = rk4(&r, oracle, ref.t-tPrev, 2e-4)
		tPrev = ref.t
		w := r.omega(s.L)
		if !vecClose(w, ref.w, 2e-8) {
			t.Errorf("t = %g: omega = %v, REFERENCES.md RK4 %v", ref.t, w, ref.w)
		}
		if !vecClose(w, r.omega(oracle.L), 1e-9) || RotationAngle(s.Q, oracle.Q) > 1e-9 {
			t.Errorf("t = %g: Gauss %v / %v differs from RK4 oracle %v / %v", ref.t, w, s.Q, r.omega(oracle.L), oracle.Q)
		}
	}
}
