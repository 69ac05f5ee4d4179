package physics

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

// Tolerances, named as in Go's math/all_test.go.
const (
	closeTol     = 1e-9 // closed forms
	integrateTol = 1e-6 // integrator-based checks
)

func relClose(got, want, tol float64) bool {
	if want == 0 {
		return math.Abs(got) <= tol
	}
	return math.Abs(got-want) <= tol*math.Abs(want)
}

func checkRel(t *testing.T, what string, got, want, tol float64) {
	t.Helper()
	if !relClose(got, want, tol) {
		t.Errorf("%s = %.12g, want %.12g (rel tol %g, rel err %.3g)", what, got, want, tol, math.Abs(got-want)/math.Abs(want))
	}
}

func checkMat(t *testing.T, what string, got, want Mat3, tol float64) {
	t.Helper()
	scale := 0.0
	for i := range 3 {
		for j := range 3 {
			scale = math.Max(scale, math.Abs(want[i][j]))
		}
	}
	for i := range 3 {
		for j := range 3 {
			if math.Abs(got[i][j]-want[i][j]) > tol*scale {
				t.Errorf("%s[%d][%d] = %.12g, want %.12g", what, i, j, got[i][j], want[i][j])
			}
		}
	}
}

func vecClose(a, b r3.Vec, tol float64) bool { return r3.Norm(r3.Sub(a, b)) <= tol }

func box(mass, x, y, z float64) Part {
	return Part{Name: "box", Shape: Box, Size: r3.Vec{X: x, Y: y, Z: z}, Mass: mass, Orient: IdentityRotation()}
}

func mustMass(t testing.TB, p *Prop) MassProps {
	t.Helper()
	mp, err := p.MassProps()
	if err != nil {
		t.Fatal(err)
	}
	return mp
}

const deg = math.Pi / 180
