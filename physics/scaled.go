package physics

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"
)

// scaledMotion is the torque-free rotation of a prop released spinning at
// 1 rad/s about a fixed direction, sampled against the phase s (radians of
// the unit-rate motion, numerically its time in seconds).
//
// Euler's equations are homogeneous of degree two in the angular velocity:
// if L_1(s), Q_1(s) is the motion released with omega_0, then
// L_r(t) = r L_1(r t), Q_r(t) = Q_1(r t) is the motion released with
// r omega_0 (substitute into dL/dt = L x omega and dQ/dt = Q omega / 2).
// So one integration over phase gives the orientation at any time for every
// spin rate about that direction: the plan flies once, not once a rate.
type scaledMotion struct {
	rot rotor
	h   float64 // phase between checkpoints, the integrator's step at unit rate
	pts []body  // pts[k] is the state at phase k h
}

// newScaledMotion integrates the unit-rate motion from s0 to at least
// maxPhase. It refuses (ok false) when that needs more than MaxSteps steps.
func newScaledMotion(rot rotor, s0 body, maxPhase float64) (*scaledMotion, bool) {
	n := rot.substeps(s0.L, 1) // steps per unit phase
	h := 1 / float64(n)
	count := math.Ceil(maxPhase/h) + 2
	if !(count <= MaxSteps) {
		return nil, false
	}
	m := &scaledMotion{rot: rot, h: h, pts: make([]body, 0, int(count))}
	st := stepper{rot: &m.rot, h: h}
	s := s0
	m.pts = append(m.pts, s)
	for len(m.pts) < int(count) {
		s = st.next(s)
		m.pts = append(m.pts, s)
	}
	return m, true
}

// at returns the unit-rate state at phase s >= 0: the checkpoint at or
// below s carried forward by one Gauss step of less than h. Past the last
// checkpoint (a phase the motion was not built for) it is carried forward
// by whole steps of h and one shorter step, slow but as accurate.
func (m *scaledMotion) at(s float64) body {
	k := int(s / m.h)
	k = max(0, min(k, len(m.pts)-1))
	b := m.pts[k]
	ds := s - float64(k)*m.h
	if ds > m.h {
		st := stepper{rot: &m.rot, h: m.h}
		for ; ds > m.h; ds -= m.h {
			b = st.next(b)
		}
	}
	if ds != 0 {
		b = m.rot.step(b, ds)
	}
	return b
}

// maxOmega returns the largest angular speed of the unit-rate motion over
// its checkpoints, rad/s per rad/s of release rate, with a 5 % margin for
// the peaks between them (at most sqrt(2E/I1); 1 for a steady spin).
func (m *scaledMotion) maxOmega() float64 {
	w := 0.0
	for _, b := range m.pts {
		w = math.Max(w, r3.Norm(m.rot.omega(b.L)))
	}
	bound := math.Sqrt(2 * m.rot.energy(m.pts[0].L) * m.rot.inv[0])
	return math.Max(math.Min(1.05*w, bound), 1e-9)
}
