package physics

import (
	"math"

	"gonum.org/v1/gonum/integrate/quad"
	"gonum.org/v1/gonum/num/quat"
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
// |Q|^2, up to round-off and the tolerance of the implicit stage solve.

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
	L r3.Vec      // angular momentum, principal frame, kg m^2/s
	Q quat.Number // principal frame -> world
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
		Q: quat.Number{
			Real: -0.5 * (q.Imag*w.X + q.Jmag*w.Y + q.Kmag*w.Z),
			Imag: 0.5 * (q.Real*w.X + q.Jmag*w.Z - q.Kmag*w.Y),
			Jmag: 0.5 * (q.Real*w.Y + q.Kmag*w.X - q.Imag*w.Z),
			Kmag: 0.5 * (q.Real*w.Z + q.Imag*w.Y - q.Jmag*w.X),
		},
	}
}

func axpy(s body, h float64, d body) body {
	return body{
		L: r3.Vec{X: s.L.X + h*d.L.X, Y: s.L.Y + h*d.L.Y, Z: s.L.Z + h*d.L.Z},
		Q: quat.Number{Real: s.Q.Real + h*d.Q.Real, Imag: s.Q.Imag + h*d.Q.Imag, Jmag: s.Q.Jmag + h*d.Q.Jmag, Kmag: s.Q.Kmag + h*d.Q.Kmag},
	}
}

// step advances s by h seconds with one Gauss-Legendre step. The stage
// equations are solved by fixed-point iteration, which contracts when
// h times the largest rate |L|/I1 is well below 1 (see maxStep).
func (r *rotor) step(s body, h float64) body {
	var k [gaussStages]body
	f0 := r.deriv(s)
	for i := range k {
		k[i] = f0
	}
	scale := r3.Norm(s.L) + 1e-300
	prev := math.Inf(1)
	for range 40 {
		var change float64
		for i := range gaussStages {
			y := s
			for j := range gaussStages {
				y = axpy(y, h*gaussA[i][j], k[j])
			}
			nk := r.deriv(y)
			d := math.Abs(nk.L.X-k[i].L.X) + math.Abs(nk.L.Y-k[i].L.Y) + math.Abs(nk.L.Z-k[i].L.Z)
			d /= scale
			d += math.Abs(nk.Q.Real-k[i].Q.Real) + math.Abs(nk.Q.Imag-k[i].Q.Imag) +
				math.Abs(nk.Q.Jmag-k[i].Q.Jmag) + math.Abs(nk.Q.Kmag-k[i].Q.Kmag)
			change = math.Max(change, d*h)
			k[i] = nk
		}
		// Converged to round-off, or no longer improving.
		if change < 1e-16 || change >= prev {
			break
		}
		prev = change
	}
	out := s
	for j := range gaussStages {
		out = axpy(out, h*gaussB[j], k[j])
	}
	return out
}

// maxTurnPerStep bounds h * |L| / I1, the largest angle any component can
// turn through in one step. At 0.25 the order-8 local error is near 1e-12
// and the stage iteration converges in a dozen sweeps.
const maxTurnPerStep = 0.25

// substeps returns how many equal steps to take over an interval of dt
// seconds for the motion with angular momentum l.
func (r *rotor) substeps(l r3.Vec, dt float64) int {
	rate := r3.Norm(l) * r.inv[0]
	n := int(math.Ceil(rate * dt / maxTurnPerStep))
	return max(n, 1)
}

// energy returns the kinetic energy of the rotation, J.
func (r *rotor) energy(l r3.Vec) float64 {
	return 0.5 * (l.X*l.X*r.inv[0] + l.Y*l.Y*r.inv[1] + l.Z*l.Z*r.inv[2])
}
