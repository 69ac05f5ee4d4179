package physics

import "math"

// One-dimensional searches used by the plan: Brent's minimiser and Brent's
// root finder (R. P. Brent, Algorithms for Minimization without
// Derivatives, Prentice-Hall 1973: ch. 5 procedure localmin and ch. 4
// procedure zero). gonum's optimize package has line searches for
// multivariate methods (backtracking, bisection, More-Thuente), which need
// a gradient or a descent direction, but no bracketing 1-D minimiser or root
// finder, so both live here.

// sqrtEps is the square root of the float64 machine epsilon (2^-26).
const sqrtEps = 1.4901161193847656e-08

// brentMin returns a point x in [a, b] where f has a local minimum and
// f(x), starting from x0 in [a, b]. It combines golden-section steps with
// parabolic interpolation and stops when x is known to within
// sqrtEps |x| + tol/3 (Brent 1973, ch. 5). f is never called outside [a, b].
func brentMin(f func(float64) float64, a, b, x0, tol float64) (float64, float64) {
	const cgold = 0.3819660112501051 // (3 - sqrt 5) / 2
	x, w, v := x0, x0, x0
	fx := f(x)
	fw, fv := fx, fx
	var d, e float64
	for range 200 {
		m := 0.5 * (a + b)
		tol1 := sqrtEps*math.Abs(x) + tol/3
		tol2 := 2 * tol1
		if math.Abs(x-m) <= tol2-0.5*(b-a) {
			break
		}
		var p, q, r float64
		if math.Abs(e) > tol1 {
			// Fit a parabola through x, w and v.
			r = (x - w) * (fx - fv)
			q = (x - v) * (fx - fw)
			p = (x-v)*q - (x-w)*r
			q = 2 * (q - r)
			if q > 0 {
				p = -p
			} else {
				q = -q
			}
			r = e
			e = d
		}
		if math.Abs(p) < math.Abs(0.5*q*r) && p > q*(a-x) && p < q*(b-x) {
			d = p / q // parabolic step
			if u := x + d; u-a < tol2 || b-u < tol2 {
				d = math.Copysign(tol1, m-x)
			}
		} else {
			if x < m {
				e = b - x
			} else {
				e = a - x
			}
			d = cgold * e // golden-section step
		}
		u := x + d
		if math.Abs(d) < tol1 {
			u = x + math.Copysign(tol1, d)
		}
		fu := f(u)
		if fu <= fx {
			if u < x {
				b = x
			} else {
				a = x
			}
			v, fv, w, fw, x, fx = w, fw, x, fx, u, fu
		} else {
			if u < x {
				a = u
			} else {
				b = u
			}
			if fu <= fw || w == x {
				v, fv, w, fw = w, fw, u, fu
			} else if fu <= fv || v == x || v == w {
				v, fv = u, fu
			}
		}
	}
	return x, fx
}

// brentZero returns a zero of f in [a, b], where fa = f(a) and fb = f(b)
// have opposite signs (or one is zero), to within 4 eps |x| + tol. It
// combines bisection, the secant rule and inverse quadratic interpolation
// (Brent 1973, ch. 4) and never leaves [a, b]. For a discontinuous f it
// returns the point of the sign change.
func brentZero(f func(float64) float64, a, b, fa, fb, tol float64) float64 {
	const eps = 2.220446049250313e-16
	if fa == 0 {
		return a
	}
	c, fc := a, fa
	d := b - a
	e := d
	for range 200 {
		if (fb > 0) == (fc > 0) {
			c, fc = a, fa
			d = b - a
			e = d
		}
		if math.Abs(fc) < math.Abs(fb) {
			a, b, c = b, c, b
			fa, fb, fc = fb, fc, fb
		}
		tol1 := 2*eps*math.Abs(b) + 0.5*tol
		m := 0.5 * (c - b)
		if math.Abs(m) <= tol1 || fb == 0 {
			return b
		}
		if math.Abs(e) >= tol1 && math.Abs(fa) > math.Abs(fb) {
			s := fb / fa
			var p, q float64
			if a == c {
				p = 2 * m * s // secant
				q = 1 - s
			} else {
				q = fa / fc // inverse quadratic
				r := fb / fc
				p = s * (2*m*q*(q-r) - (b-a)*(r-1))
				q = (q - 1) * (r - 1) * (s - 1)
			}
			if p > 0 {
				q = -q
			} else {
				p = -p
			}
			if 2*p < 3*m*q-math.Abs(tol1*q) && p < math.Abs(0.5*e*q) {
				e = d
				d = p / q
			} else {
				d, e = m, m
			}
		} else {
			d, e = m, m
		}
		a, fa = b, fb
		if math.Abs(d) > tol1 {
			b += d
		} else {
			b += math.Copysign(tol1, m)
		}
		fb = f(b)
	}
	return b
}
