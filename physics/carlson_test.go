package physics

import (
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"
	"gonum.org/v1/gonum/mathext"
)

// TestCarlson_PublishedValues: test values printed with the duplication
// algorithms in B. C. Carlson, Numerical Algorithms 10 (1995) 13-26, §3
// (from memory, 14 digits).
func TestCarlson_PublishedValues(t *testing.T) {
	checkRel(t, "RC(0, 1/4)", carlsonRC(0, 0.25), math.Pi, closeTol)
	checkRel(t, "RC(9/4, 2)", carlsonRC(2.25, 2), math.Ln2, closeTol)
	checkRel(t, "RJ(0, 1, 2, 3)", carlsonRJ(0, 1, 2, 3), 0.77688623778582, 1e-13)
	checkRel(t, "RJ(2, 3, 4, 5)", carlsonRJ(2, 3, 4, 5), 0.14297579667157, 1e-13)
}

// TestCarlsonRC_ClosedForm: R_C in elementary functions (DLMF 19.2.18,
// 19.2.19): acos(sqrt(x/y))/sqrt(y-x) for x < y, acosh(sqrt(x/y))/sqrt(x-y)
// for x > y, 1/sqrt(x) for x = y.
func TestCarlsonRC_ClosedForm(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	for range 200 {
		x, y := math.Exp(6*rng.Float64()-3), math.Exp(6*rng.Float64()-3)
		var want float64
		switch {
		case x < y:
			want = math.Acos(math.Sqrt(x/y)) / math.Sqrt(y-x)
		case x > y:
			want = math.Acosh(math.Sqrt(x/y)) / math.Sqrt(x-y)
		}
		checkRel(t, "RC", carlsonRC(x, y), want, 1e-12)
	}
	checkRel(t, "RC(x, x)", carlsonRC(2, 2), 1/math.Sqrt2, 1e-14)
}

// rjQuad is the slow, obvious oracle: the defining integral of R_J
// (DLMF 19.16.2) by 400-point Gauss-Legendre quadrature after t = e^u.
func rjQuad(x, y, z, p float64) float64 {
	f := func(u float64) float64 {
		t := math.Exp(u)
		return 1.5 * t / ((t + p) * math.Sqrt((t+x)*(t+y)*(t+z)))
	}
	return quad.Fixed(f, -60, 60, 400, quad.Legendre{}, 0)
}

// TestCarlsonRJ_Oracles: R_J against its defining integral, and
// R_J(x, y, z, z) against gonum's R_D (DLMF 19.20.18).
func TestCarlsonRJ_Oracles(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	for range 100 {
		x, y, z, p := math.Exp(4*rng.Float64()-2), math.Exp(4*rng.Float64()-2), math.Exp(4*rng.Float64()-2), math.Exp(4*rng.Float64()-2)
		checkRel(t, "RJ vs quadrature", carlsonRJ(x, y, z, p), rjQuad(x, y, z, p), 1e-10)
		checkRel(t, "RJ(x,y,z,z) vs gonum RD", carlsonRJ(x, y, z, z), mathext.EllipticRD(x, y, z), 1e-13)
		checkRel(t, "RJ(0,y,z,z) vs gonum RD", carlsonRJ(0, y, z, z), mathext.EllipticRD(0, y, z), 1e-13)
	}
	for _, bad := range [][4]float64{{-1, 1, 1, 1}, {1, 1, 1, 0}, {0, 0, 1, 1}, {1, 1, 1, -2}, {math.NaN(), 1, 1, 1}} {
		if v := carlsonRJ(bad[0], bad[1], bad[2], bad[3]); !math.IsNaN(v) {
			t.Errorf("RJ%v = %g, want NaN", bad, v)
		}
	}
}

// TestCompletePi: Pi(n | m) against its Legendre integral by quadrature,
// and the special cases Pi(0|m) = K(m), Pi(n|0) = pi/(2 sqrt(1-n))
// (DLMF 19.6.5) and Pi(m|m) = E(m)/(1-m) (DLMF 19.6.1), with K and E from
// gonum's mathext.
func TestCompletePi(t *testing.T) {
	legendre := func(n, m float64) float64 {
		f := func(th float64) float64 {
			s2 := math.Sin(th) * math.Sin(th)
			return 1 / ((1 - n*s2) * math.Sqrt(1-m*s2))
		}
		return quad.Fixed(f, 0, math.Pi/2, 200, quad.Legendre{}, 0)
	}
	for _, n := range []float64{-20, -3, -1, -0.3, 0.2, 0.7} {
		for _, m := range []float64{0, 0.1, 0.5, 0.9} {
			checkRel(t, "Pi(n|m) vs quadrature", completePi(n, m), legendre(n, m), 1e-11)
		}
		checkRel(t, "Pi(n|0)", completePi(n, 0), math.Pi/(2*math.Sqrt(1-n)), 1e-13)
	}
	for _, m := range []float64{0.05, 0.3, 0.6, 0.95, 0.999} {
		checkRel(t, "Pi(0|m) = K", completePi(0, m), mathext.CompleteK(m), 1e-14)
		checkRel(t, "Pi(m|m) = E/(1-m)", completePi(m, m), mathext.CompleteE(m)/(1-m), 1e-12)
	}
	if !math.IsNaN(completePi(1, 0.5)) || !math.IsNaN(completePi(0.5, 1)) {
		t.Error("Pi outside n < 1, 0 <= m < 1 should be NaN")
	}
}
