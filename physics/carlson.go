package physics

import (
	"math"

	"gonum.org/v1/gonum/mathext"
)

// Carlson's symmetric elliptic integrals that gonum v0.17.0 lacks (it has
// R_F and R_D), and the complete integral of the third kind built on them.
// The duplication algorithms are B. C. Carlson, "Numerical computation of
// real or complex elliptic integrals", Numerical Algorithms 10 (1995)
// 13-26, in the real-argument form of Press et al., Numerical Recipes,
// 2nd ed., §6.11 (routines rc and rj), run here to double precision.

// carlsonTol stops the duplication when every argument is within this
// relative distance of their mean; the truncated series then errs by about
// carlsonTol^6 (Carlson 1995, eq. 2.2 and the remark after it).
const carlsonTol = 1e-3

// carlsonRC returns R_C(x, y) = (1/2) integral_0^inf (t+x)^(-1/2) (t+y)^(-1) dt
// for x >= 0, y > 0 (DLMF 19.2.17). It returns NaN for other arguments (the
// Cauchy principal value for y < 0 is not needed here).
func carlsonRC(x, y float64) float64 {
	if !(x >= 0) || !(y > 0) || math.IsInf(x, 1) || math.IsInf(y, 1) {
		return math.NaN()
	}
	const (
		c1 = 0.3
		c2 = 1.0 / 7
		c3 = 0.375
		c4 = 9.0 / 22
	)
	var ave, s float64
	for range 100 {
		lambda := 2*math.Sqrt(x)*math.Sqrt(y) + y
		x = 0.25 * (x + lambda)
		y = 0.25 * (y + lambda)
		ave = (x + y + y) / 3
		s = (y - ave) / ave
		if math.Abs(s) <= carlsonTol {
			break
		}
	}
	return (1 + s*s*(c1+s*(c2+s*(c3+s*c4)))) / math.Sqrt(ave)
}

// carlsonRJ returns the symmetric integral of the third kind
//
//	R_J(x, y, z, p) = (3/2) integral_0^inf dt / ((t+p) sqrt((t+x)(t+y)(t+z)))
//
// (DLMF 19.16.2) for x, y, z >= 0 with at most one of them zero, and p > 0.
// It returns NaN for other arguments (no principal value for p < 0).
// Special case: R_J(x, y, z, z) = R_D(x, y, z) (DLMF 19.20.18).
func carlsonRJ(x, y, z, p float64) float64 {
	if !(x >= 0) || !(y >= 0) || !(z >= 0) || !(p > 0) ||
		(x == 0 && y == 0) || (y == 0 && z == 0) || (x == 0 && z == 0) ||
		math.IsInf(x+y+z+p, 1) {
		return math.NaN()
	}
	const (
		c1 = 3.0 / 14
		c2 = 1.0 / 3
		c3 = 3.0 / 22
		c4 = 3.0 / 26
		c5 = 0.75 * c3
		c6 = 1.5 * c4
		c7 = 0.5 * c2
		c8 = c3 + c3
	)
	sum, fac := 0.0, 1.0
	var ave, dx, dy, dz, dp float64
	for range 100 {
		sx, sy, sz := math.Sqrt(x), math.Sqrt(y), math.Sqrt(z)
		lambda := sx*(sy+sz) + sy*sz
		alpha := p*(sx+sy+sz) + sx*sy*sz
		alpha *= alpha
		beta := p * (p + lambda) * (p + lambda)
		sum += fac * carlsonRC(alpha, beta)
		fac *= 0.25
		x = 0.25 * (x + lambda)
		y = 0.25 * (y + lambda)
		z = 0.25 * (z + lambda)
		p = 0.25 * (p + lambda)
		ave = 0.2 * (x + y + z + p + p)
		dx, dy, dz, dp = (ave-x)/ave, (ave-y)/ave, (ave-z)/ave, (ave-p)/ave
		if math.Max(math.Max(math.Abs(dx), math.Abs(dy)), math.Max(math.Abs(dz), math.Abs(dp))) <= carlsonTol {
			break
		}
	}
	ea := dx*(dy+dz) + dy*dz
	eb := dx * dy * dz
	ec := dp * dp
	ed := ea - 3*ec
	ee := eb + 2*dp*(ea-ec)
	series := 1 + ed*(-c1+c5*ed-c6*ee) + eb*(c7+dp*(-c8+dp*c4)) + dp*ea*(c2-dp*c3) - c2*dp*ec
	return 3*sum + fac*series/(ave*math.Sqrt(ave))
}

// completePi returns the complete elliptic integral of the third kind in
// Legendre's form with the parameter m = k^2 (as gonum's CompleteK takes):
//
//	Pi(n | m) = integral_0^(pi/2) dθ / ((1 - n sin^2 θ) sqrt(1 - m sin^2 θ))
//	          = R_F(0, 1-m, 1) + (n/3) R_J(0, 1-m, 1, 1-n)    (DLMF 19.25.2)
//
// for n < 1 and 0 <= m < 1. Special cases: Pi(0 | m) = K(m); Pi(n | 0) =
// pi / (2 sqrt(1-n)) (DLMF 19.6.5); NaN outside the range.
func completePi(n, m float64) float64 {
	if !(n < 1) || !(m >= 0) || !(m < 1) {
		return math.NaN()
	}
	k := mathext.EllipticRF(0, 1-m, 1)
	if n == 0 {
		return k
	}
	return k + n/3*carlsonRJ(0, 1-m, 1, 1-n)
}
