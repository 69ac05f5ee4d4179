package physics

import (
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/num/quat"
	"gonum.org/v1/gonum/spatial/r3"
)

// TestAxisAngle_Z90 uses the check value of REFERENCES.md §5.3: 90 degrees
// about +Z is (w, x, y, z) = (0.7071067812, 0, 0, 0.7071067812) and maps +X
// to +Y (right-hand rule). Cross-checked with gonum's r3.Rotation.
func TestAxisAngle_Z90(t *testing.T) {
	q := AxisAngle(r3.Vec{Z: 1}, math.Pi/2)
	want := quat.Number{Real: math.Sqrt2 / 2, Kmag: math.Sqrt2 / 2}
	if quat.Abs(quat.Sub(q.Quat(), want)) > 1e-15 {
		t.Errorf("q = %v, want %v", q, want)
	}
	if v := q.Rotate(r3.Vec{X: 1}); !vecClose(v, r3.Vec{Y: 1}, 1e-15) {
		t.Errorf("X -> %v, want +Y", v)
	}
	rng := rand.New(rand.NewPCG(3, 3))
	for range 100 {
		axis := r3.Vec{X: rng.NormFloat64(), Y: rng.NormFloat64(), Z: rng.NormFloat64()}
		a := rng.Float64() * 7
		v := r3.Vec{X: rng.NormFloat64(), Y: rng.NormFloat64(), Z: rng.NormFloat64()}
		got := AxisAngle(axis, a).Rotate(v)
		ref := r3.NewRotation(a, axis).Rotate(v)
		if !vecClose(got, ref, 1e-12) {
			t.Fatalf("Rotate = %v, gonum r3.Rotation = %v", got, ref)
		}
		if m := AxisAngle(axis, a).Mat().MulVec(v); !vecClose(m, ref, 1e-12) {
			t.Fatalf("Mat . v = %v, want %v", m, ref)
		}
	}
}

// TestEulerXYZ_Order: rotation_deg turns about fixed x, then y, then z, so
// (90, 90, 0) takes +Y first to +Z (about x) and then to -X (about y).
func TestEulerXYZ_Order(t *testing.T) {
	q := EulerXYZ(math.Pi/2, math.Pi/2, 0)
	if v := q.Rotate(r3.Vec{Y: 1}); !vecClose(v, r3.Vec{X: 1}, 1e-15) {
		// +Y -> (about x by 90) +Z -> (about y by 90) +X.
		t.Errorf("+Y -> %v, want +X", v)
	}
	q = EulerXYZ(0, 0, math.Pi/2)
	if v := q.Rotate(r3.Vec{X: 1}); !vecClose(v, r3.Vec{Y: 1}, 1e-15) {
		t.Errorf("+X -> %v, want +Y", v)
	}
}

func TestFromMat_RoundTrip(t *testing.T) {
	rng := rand.New(rand.NewPCG(4, 4))
	for range 1000 {
		q := Rotation{Real: rng.NormFloat64(), Imag: rng.NormFloat64(), Jmag: rng.NormFloat64(), Kmag: rng.NormFloat64()}.Normalize()
		got := RotationFromMat(q.Mat())
		if RotationAngle(got, q) > 1e-7 {
			t.Fatalf("RotationFromMat((%v).Mat()) = %v", q, got)
		}
	}
	// The four branches of Shepperd's method: half turns about each axis.
	for _, axis := range []r3.Vec{{X: 1}, {Y: 1}, {Z: 1}, {X: 1, Y: 1, Z: 1}} {
		q := AxisAngle(axis, math.Pi)
		if a := RotationAngle(RotationFromMat(q.Mat()), q); a > 1e-7 {
			t.Errorf("half turn about %v: off by %g rad", axis, a)
		}
	}
}

func TestRotationAngle(t *testing.T) {
	a := AxisAngle(r3.Vec{X: 1, Y: 2}, 0.3)
	b := a.Mul(AxisAngle(r3.Vec{Z: 1}, 0.25))
	checkRel(t, "angle", RotationAngle(a, b), 0.25, 1e-14)
	// q and -q are the same rotation.
	checkRel(t, "angle to -q", RotationAngle(b, Rotation(quat.Scale(-1, b.Quat()))), 0, 1e-15)
	checkRel(t, "angle 170 deg", RotationAngle(IdentityRotation(), AxisAngle(r3.Vec{Y: 1}, 170*deg)), 170*deg, 1e-14)
}
