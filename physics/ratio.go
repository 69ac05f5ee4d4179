package physics

import (
	"math"

	"gonum.org/v1/gonum/mathext"
	"gonum.org/v1/gonum/spatial/r3"
)

// The spin-to-wobble ratio of an asymmetric prop (DESIGN.md, verdict rules;
// REFERENCES.md §10): the mean rate at which the circled principal axis
// goes round the fixed angular momentum L (world frame) over the mean rate
// of turn about that axis (the body angular velocity's component along it),
// both over one polhode period. After a period the body is back in the same
// attitude relative to L, turned about L by a fixed angle, so the means
// over one period are the means over any long flight.
//
// Circling the greatest axis e3 (L^2 > 2E I2), the azimuth of e3 about L
// changes at the rate of the Euler angle phi (Landau & Lifshitz, Mechanics,
// §37):
//
//	dphi/dt = L (I1 w1^2 + I2 w2^2) / (I1^2 w1^2 + I2^2 w2^2).
//
// With the Jacobi-elliptic solution of §37 (REFERENCES.md §3.2: w3 = A3
// dn(tau, k), I3 w3 = L3) this is, after eliminating w1 and w2 with the two
// invariants,
//
//	dphi/dt = L/I3 + L (I3-I1)/(I1 I3) / (1 - n sn^2(tau, k)),
//	n = -I3 (I2-I1) / (I1 (I3-I2))           (independent of E and L),
//
// whose mean over a period of sn^2 (2K) is L/I3 + L (I3-I1)/(I1 I3) Pi(n|m)/K(m)
// with m = k^2 (substitute sn = sin θ; DLMF 22.16.14 and 19.2.7). The mean
// of w3 = A3 dn is A3 (pi/2)/K(m) (the integral of dn over 0..K is
// am(K) = pi/2, DLMF 22.16.1). Circling the least axis, the indices 1 and 3
// swap. Near a stable axis (m -> 0) the ratio tends to
// 1 + sqrt((I3-I1)(I3-I2)/(I1 I2)) (greatest) or 1 - sqrt((I2-I1)(I3-I1)/(I2 I3))
// (least), the limits of REFERENCES.md §3.4 and §10.

// asymmetricRatio returns, for a free asymmetric top (I ascending, all
// distinct) with body angular momentum l (principal frame), the mean
// precession rate of the circled axis about L and the mean rate of turn
// about it (both rad/s, in the units of l/I), and whether they are finite:
// ok is false on the separatrix L^2 = 2E I2, where the period is infinite.
// circles is Least when L^2 < 2E I2, else Greatest.
func asymmetricRatio(I [3]float64, l r3.Vec) (precession, turn float64, circles Axis, ok bool) {
	i1, i2, i3 := I[0], I[1], I[2]
	l2 := r3.Norm2(l)
	e2 := l.X*l.X/i1 + l.Y*l.Y/i2 + l.Z*l.Z/i3 // 2E
	L := math.Sqrt(l2)
	if L == 0 || !(i1 < i2 && i2 < i3) {
		return 0, 0, Greatest, false
	}
	// Both differences below are positive away from the separatrix; they
	// are formed from the components so that a spin exactly about an axis
	// gives exactly zero (m = 0) rather than round-off.
	hi := l.X*l.X*(i3-i1)/i1 + l.Y*l.Y*(i3-i2)/i2 // 2E I3 - L^2
	lo := l.Y*l.Y*(i2-i1)/i2 + l.Z*l.Z*(i3-i1)/i3 // L^2 - 2E I1
	if l2 > e2*i2 {
		circles = Greatest
		m := (i2 - i1) * hi / ((i3 - i2) * lo)
		if !(m < 1) {
			return 0, 0, circles, false
		}
		m = math.Max(0, m)
		n := -i3 * (i2 - i1) / (i1 * (i3 - i2))
		K := mathext.CompleteK(m)
		a3 := math.Sqrt(lo / (i3 * (i3 - i1)))
		precession = L/i3 + L*(i3-i1)/(i1*i3)*completePi(n, m)/K
		turn = a3 * math.Pi / 2 / K
	} else {
		circles = Least
		m := (i3 - i2) * lo / ((i2 - i1) * hi)
		if !(m < 1) {
			return 0, 0, circles, false
		}
		m = math.Max(0, m)
		n := -i1 * (i3 - i2) / (i3 * (i2 - i1))
		K := mathext.CompleteK(m)
		a1 := math.Sqrt(hi / (i1 * (i3 - i1)))
		precession = L/i1 - L*(i3-i1)/(i1*i3)*completePi(n, m)/K
		turn = a1 * math.Pi / 2 / K
	}
	ok = turn > 0 && !math.IsInf(precession, 0) && !math.IsNaN(precession)
	return precession, turn, circles, ok
}
