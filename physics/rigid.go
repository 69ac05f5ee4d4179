package physics

import (
	"math"

	"gonum.org/v1/gonum/integrate/quad"
	"gonum.org/v1/gonum/spatial/r3"
)

// Torque-free rotation of a rigid body, in its principal frame.
//
// The state is the body-frame angular momentum L (principal axes) and the
// unit quaternion Q that maps principal-frame vectors into the world.
// Euler's equations dL/dt = L x omega, omega_i = L_i / I_i (Landau &
// Lifshitz, Mechanics, §36) and the kinematics dQ/dt = Q (0, omega) / 2 are
// integrated by the s = 4 stage Gauss-Legendre collocation method (order 8).
// Gauss methods conserve every quadratic first integral exactly (Hairer,
// Lubich & Wanner, Geometric Numerical Integration, 2nd ed., §IV.2,
// Theorem 2.2): here the kinetic energy E = sum L_i^2 / (2 I_i), |L|^2 and
// |Q|^2, up to round-off: the implicit stage equations are solved to
// round-off, by fixed-point iteration or, for thin props whose Jacobian is
// large, by Newton iteration (gaussnewton.go). The step size is set by
// accuracy alone (substeps).

// gaussStages is the number of Gauss-Legendre stages (order 2s).
const gaussStages = 4

// gaussA, gaussB and gaussC are the Butcher tableau of the method: nodes c_i,
// weights b_j and a_ij = integral from 0 to c_i of the Lagrange polynomial
// l_j, computed once from gonum's Gauss-Legendre nodes.
var gaussA, gaussB, gaussC = gaussTableau()

func gaussTableau() (a [gaussStages][gaussStages]float64, b, c [gaussStages]float64) {
	x := make([]float64, gaussStages)
	w := make([]float64, gaussStages)
	quad.Legendre{}.FixedLocations(x, w, 0, 1)
	copy(b[:], w)
	copy(c[:], x)
	lagrange := func(j int, t float64) float64 {
		p := 1.0
		for k := range gaussStages {
			if k != j {
				p *= (t - c[k]) / (c[j] - c[k])
			}
		}
		return p
	}
	// l_j has degree s-1, so the s-point rule integrates it exactly on [0, c_i].
	for i := range gaussStages {
		for j := range gaussStages {
			var s float64
			for k := range gaussStages {
				s += w[k] * c[i] * lagrange(j, c[i]*x[k])
			}
			a[i][j] = s
		}
	}
	return a, b, c
}

// body is a rigid body's state in its principal frame.
type body struct {
	L r3.Vec   // angular momentum, principal frame, kg m^2/s
	Q Rotation // principal frame -> world
}

// rotor integrates torque-free motion for fixed principal moments.
type rotor struct {
	inv [3]float64 // 1 / I_i
}

func newRotor(moments [3]float64) rotor {
	return rotor{inv: [3]float64{1 / moments[0], 1 / moments[1], 1 / moments[2]}}
}

// omega returns the body-frame angular velocity for angular momentum l.
func (r *rotor) omega(l r3.Vec) r3.Vec {
	return r3.Vec{X: l.X * r.inv[0], Y: l.Y * r.inv[1], Z: l.Z * r.inv[2]}
}

// deriv is the right-hand side of the equations of motion.
func (r *rotor) deriv(s body) body {
	w := r.omega(s.L)
	q := s.Q
	return body{
		L: r3.Cross(s.L, w),
		Q: Rotation{
			Real: -0.5 * (q.Imag*w.X + q.Jmag*w.Y + q.Kmag*w.Z),
			Imag: 0.5 * (q.Real*w.X + q.Jmag*w.Z - q.Kmag*w.Y),
			Jmag: 0.5 * (q.Real*w.Y + q.Kmag*w.X - q.Imag*w.Z),
			Kmag: 0.5 * (q.Real*w.Z + q.Imag*w.Y - q.Jmag*w.X),
		},
	}
}

// state is a body flattened for the inner loop: L1, L2, L3, qw, qx, qy, qz.
type state [7]float64

func flatten(b body) state {
	return state{b.L.X, b.L.Y, b.L.Z, b.Q.Real, b.Q.Imag, b.Q.Jmag, b.Q.Kmag}
}

func (s *state) body() body {
	return body{L: r3.Vec{X: s[0], Y: s[1], Z: s[2]}, Q: Rotation{Real: s[3], Imag: s[4], Jmag: s[5], Kmag: s[6]}}
}

// f writes the right-hand side at y into d (the same equations as deriv).
func (r *rotor) f(y *state, d *state) {
	w0, w1, w2 := y[0]*r.inv[0], y[1]*r.inv[1], y[2]*r.inv[2]
	d[0] = y[1]*w2 - y[2]*w1
	d[1] = y[2]*w0 - y[0]*w2
	d[2] = y[0]*w1 - y[1]*w0
	qw, qx, qy, qz := y[3], y[4], y[5], y[6]
	d[3] = -0.5 * (qx*w0 + qy*w1 + qz*w2)
	d[4] = 0.5 * (qw*w0 + qy*w2 - qz*w1)
	d[5] = 0.5 * (qw*w1 + qz*w0 - qx*w2)
	d[6] = 0.5 * (qw*w2 + qx*w1 - qy*w0)
}

func axpy(s body, h float64, d body) body {
	return body{
		L: r3.Vec{X: s.L.X + h*d.L.X, Y: s.L.Y + h*d.L.Y, Z: s.L.Z + h*d.L.Z},
		Q: Rotation{Real: s.Q.Real + h*d.Q.Real, Imag: s.Q.Imag + h*d.Q.Imag, Jmag: s.Q.Jmag + h*d.Q.Jmag, Kmag: s.Q.Kmag + h*d.Q.Kmag},
	}
}

// gaussExtrap[i][j] = l_j(1 + c_i): it carries the stage derivatives of one
// step, through their interpolating polynomial, to the stage times of the
// next step of the same size, as the starting guess of its iteration
// (Hairer, Lubich & Wanner, GNI §VIII.6.1, "starting approximations").
var gaussExtrap = func() (e [gaussStages][gaussStages]float64) {
	for i := range gaussStages {
		for j := range gaussStages {
			p := 1.0
			for k := range gaussStages {
				if k != j {
					p *= (1 + gaussC[i] - gaussC[k]) / (gaussC[j] - gaussC[k])
				}
			}
			e[i][j] = p
		}
	}
	return e
}()

// stepper takes successive Gauss steps of one size h, reusing each step's
// stage derivatives to start the next.
type stepper struct {
	rot  *rotor
	h    float64
	k    [gaussStages]state
	warm bool
	// unsolved counts the steps whose stage equations did not reach
	// round-off (never seen in the tests; Simulate refuses such a take).
	unsolved     int
	newtonMatrix stageMatrix
	// turned accumulates the angle the body turns along its motion,
	// integral of |omega| dt in radians, over the steps taken (the caller
	// resets it): each step adds h sum_i b_i |omega(Y_i)|, the Gauss
	// quadrature (order 8) over the stage values.
	turned float64
}

// addTurn adds one step's integral of |omega| to st.turned, from the stage
// values Y_i = s + Z_i (only their angular momenta are read).
func (st *stepper) addTurn(s *state, z *[gaussStages]state) {
	r := st.rot
	var sum float64
	for i := range gaussStages {
		w0 := (s[0] + z[i][0]) * r.inv[0]
		w1 := (s[1] + z[i][1]) * r.inv[1]
		w2 := (s[2] + z[i][2]) * r.inv[2]
		sum += gaussB[i] * math.Sqrt(w0*w0+w1*w1+w2*w2)
	}
	st.turned += st.h * sum
}

// step advances s by h seconds with one Gauss-Legendre step from a cold
// start.
func (r *rotor) step(s body, h float64) body {
	st := stepper{rot: r, h: h}
	return st.next(s)
}

// next advances b by st.h. The stage equations are solved by fixed-point
// iteration to round-off, which contracts when h |L|/I1, the size of the
// Jacobian of Euler's equations, is moderate; beyond maxStiffPerStep, or
// when the fixed-point iteration stalls short of round-off, by Newton
// iteration (gaussnewton.go).
//
// It stays one function: the warm start, the fixed-point iteration and the
// fall-back to Newton share the stage arrays of one step, and the fixed-point
// loop is the hot path (a call a stage would cost).
func (st *stepper) next(b body) body {
	r, h := st.rot, st.h
	s := flatten(b)
	var k [gaussStages]state
	if st.warm {
		for i := range gaussStages {
			e := &gaussExtrap[i]
			for c := range 7 {
				k[i][c] = e[0]*st.k[0][c] + e[1]*st.k[1][c] + e[2]*st.k[2][c] + e[3]*st.k[3][c]
			}
		}
	} else {
		var f0 state
		r.f(&s, &f0)
		for i := range k {
			k[i] = f0
		}
	}
	var ha [gaussStages][gaussStages]float64
	for i := range gaussStages {
		for j := range gaussStages {
			ha[i][j] = h * gaussA[i][j]
		}
	}
	scale := h / (math.Abs(s[0]) + math.Abs(s[1]) + math.Abs(s[2]) + 1e-300)
	if h*r3.Norm(b.L)*r.inv[0] > maxStiffPerStep {
		next, ok := st.newton(&s, &k)
		if !ok {
			st.unsolved++
		}
		st.k, st.warm = k, true
		return next.body()
	}
	prev := math.Inf(1)
	change := math.Inf(1)
	for range 60 {
		change = 0
		for i := range gaussStages {
			a := &ha[i]
			var y, nk state
			for c := range 7 {
				y[c] = s[c] + a[0]*k[0][c] + a[1]*k[1][c] + a[2]*k[2][c] + a[3]*k[3][c]
			}
			r.f(&y, &nk)
			ki := &k[i]
			dl := math.Abs(nk[0]-ki[0]) + math.Abs(nk[1]-ki[1]) + math.Abs(nk[2]-ki[2])
			dq := math.Abs(nk[3]-ki[3]) + math.Abs(nk[4]-ki[4]) + math.Abs(nk[5]-ki[5]) + math.Abs(nk[6]-ki[6])
			if d := dl*scale + dq*h; d > change {
				change = d
			}
			*ki = nk
		}
		// Converged to round-off, or no longer improving.
		if change < 1e-15 || change >= prev {
			break
		}
		prev = change
	}
	if change > 1e-13 {
		// Stalled short of round-off: finish with Newton from here.
		next, ok := st.newton(&s, &k)
		if !ok {
			st.unsolved++
		}
		st.k, st.warm = k, true
		return next.body()
	}
	var z [gaussStages]state
	for i := range gaussStages {
		a := &ha[i]
		for c := range 3 {
			z[i][c] = a[0]*k[0][c] + a[1]*k[1][c] + a[2]*k[2][c] + a[3]*k[3][c]
		}
	}
	st.addTurn(&s, &z)
	for c := range 7 {
		s[c] += h * (gaussB[0]*k[0][c] + gaussB[1]*k[1][c] + gaussB[2]*k[2][c] + gaussB[3]*k[3][c])
	}
	st.k, st.warm = k, true
	return s.body()
}

// Step-size rule: accuracy alone sets h. maxTurnPerStep bounds h Omega,
// where Omega is the fastest rate of the motion: the larger of the greatest
// |omega| along it and the polhode frequency p (rotor.fastest); both are
// constant over a free motion. At 0.35 a 20 s take near the middle axis
// agrees with a tiny-step RK4 to 1e-9 (rigid_test.go; at 0.5 the world
// angular momentum of the tumbling brick drifted 4e-10 over 10 s, at 0.35
// 7e-12) and a 0.4 mm wire with the closed form of the symmetric top to
// its round-off floor (thin_test.go).
//
// maxStiffPerStep is not a step bound: it is the largest h |L|/I1 (the size
// of the Jacobian of Euler's equations) for which next uses fixed-point
// iteration, which contracts only there; above it the stages are solved by
// Newton iteration.
const (
	maxTurnPerStep  = 0.35
	maxStiffPerStep = 2.0
)

// substeps returns how many equal steps to take over an interval of dt
// seconds for the motion with angular momentum l.
func (r *rotor) substeps(l r3.Vec, dt float64) int {
	n := math.Ceil(r.fastest(l) * dt / maxTurnPerStep)
	if !(n < 1e9) {
		n = 1e9
	}
	return max(int(n), 1)
}

// fastest returns the fastest rate, rad/s, of the torque-free motion with
// body angular momentum l:
//   - the greatest |omega| along it. With x_i = L_i^2, both |L|^2 = sum x_i
//     and 2E = sum x_i / I_i are fixed, so x moves on a segment of the
//     plane; the polhode runs over the whole segment (Landau & Lifshitz,
//     Mechanics, §37: two of L1, L2, L3 pass through zero in turn), and
//     |omega|^2 = sum x_i / I_i^2 is linear in x, so its greatest value is at
//     an end of the segment, where one x_i is zero.
//   - the polhode frequency p of the Jacobi elliptic solution (LL §37):
//     p^2 = (I3-I2)(L^2-2E I1)/(I1 I2 I3) when L^2 > 2E I2, else
//     (I2-I1)(2E I3-L^2)/(I1 I2 I3); for a symmetric top it is the body-frame
//     precession rate of REFERENCES.md §2.1.
//
// Unlike sqrt(2E/I1) or |L|/I1 it stays near the spin rate for a thin prop.
func (r *rotor) fastest(l r3.Vec) float64 {
	x := [3]float64{l.X * l.X, l.Y * l.Y, l.Z * l.Z}
	a := r.inv
	ll := x[0] + x[1] + x[2]
	e2 := x[0]*a[0] + x[1]*a[1] + x[2]*a[2]
	w2 := x[0]*a[0]*a[0] + x[1]*a[1]*a[1] + x[2]*a[2]*a[2]
	for zero := range 3 {
		i, j := (zero+1)%3, (zero+2)%3
		if a[i] == a[j] {
			continue // |omega| does not change along this end (symmetric top)
		}
		xi := (e2 - a[j]*ll) / (a[i] - a[j])
		xj := ll - xi
		if xi >= -1e-12*ll && xj >= -1e-12*ll {
			w2 = math.Max(w2, math.Max(xi, 0)*a[i]*a[i]+math.Max(xj, 0)*a[j]*a[j])
		}
	}
	// L^2 - 2E I1 and 2E I3 - L^2 as sums of non-negative terms.
	i1, i2, i3 := 1/a[0], 1/a[1], 1/a[2]
	var p2 float64
	if ll > e2*i2 {
		p2 = (i3 - i2) * (x[1]*(1-i1*a[1]) + x[2]*(1-i1*a[2])) * a[0] * a[1] * a[2]
	} else {
		p2 = (i2 - i1) * (x[0]*(i3*a[0]-1) + x[1]*(i3*a[1]-1)) * a[0] * a[1] * a[2]
	}
	return math.Sqrt(math.Max(w2, p2))
}

// energy returns the kinetic energy of the rotation, J.
func (r *rotor) energy(l r3.Vec) float64 {
	return 0.5 * (l.X*l.X*r.inv[0] + l.Y*l.Y*r.inv[1] + l.Z*l.Z*r.inv[2])
}
