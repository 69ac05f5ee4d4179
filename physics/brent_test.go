package physics

import (
	"math"
	"testing"
)

// TestBrentMin: minima with closed forms.
func TestBrentMin(t *testing.T) {
	for _, c := range []struct {
		name       string
		f          func(float64) float64
		a, b, x0   float64
		want, fmin float64
		ftol       float64 // a smooth minimum gives f to the square of the x accuracy
	}{
		// cos has its minimum -1 at pi (elementary).
		{"cos", math.Cos, 2, 5, 2.5, math.Pi, -1, 1e-12},
		// (x - 2)^2 + 1: vertex at 2, value 1 (elementary).
		{"parabola", func(x float64) float64 { return (x-2)*(x-2) + 1 }, -10, 10, 9, 2, 1, 1e-12},
		// |x - 1/3| is not smooth at its minimum: golden-section steps must still find it.
		{"vee", func(x float64) float64 { return math.Abs(x - 1.0/3) }, 0, 1, 0.9, 1.0 / 3, 0, 1e-7},
		// x e^-x on [-1, 3] with minimum at the end a = -1 (decreasing to the left).
		{"edge", func(x float64) float64 { return x * math.Exp(-x) }, -1, 0.5, 0.2, -1, -math.E, 1e-6},
	} {
		calls := 0
		f := func(x float64) float64 {
			calls++
			if x < c.a || x > c.b {
				t.Errorf("%s: f called outside [a, b] at %g", c.name, x)
			}
			return c.f(x)
		}
		x, fx := brentMin(f, c.a, c.b, c.x0, 1e-10)
		// The stopping rule knows x to 2 (sqrtEps |x| + tol/3).
		if math.Abs(x-c.want) > 4*(sqrtEps*math.Abs(c.want)+1e-10) || math.Abs(fx-c.fmin) > c.ftol {
			t.Errorf("%s: min at %.12g (f %.12g), want %.12g (f %.12g)", c.name, x, fx, c.want, c.fmin)
		}
		if calls > 120 {
			t.Errorf("%s: %d calls", c.name, calls)
		}
	}
}

// TestBrentZero: roots with closed forms.
func TestBrentZero(t *testing.T) {
	cube := func(x float64) float64 { return x*x*x - 2 }
	if got := brentZero(cube, 0, 3, cube(0), cube(3), 1e-14); math.Abs(got-math.Cbrt(2)) > 1e-13 {
		t.Errorf("cube root of 2: %.16g, want %.16g", got, math.Cbrt(2))
	}
	// cos x = x: the Dottie number 0.7390851332151607 (OEIS A003957).
	g := func(x float64) float64 { return math.Cos(x) - x }
	if got := brentZero(g, 0, 1, g(0), g(1), 1e-15); math.Abs(got-0.7390851332151607) > 1e-14 {
		t.Errorf("cos x = x: %.16g", got)
	}
	// A step: the sign change is found.
	step := func(x float64) float64 {
		if x < 0.3 {
			return -1
		}
		return 1
	}
	if got := brentZero(step, 0, 1, -1, 1, 1e-12); math.Abs(got-0.3) > 1e-11 {
		t.Errorf("step: %.16g", got)
	}
}
