package physics

import (
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

// TestShifted_ParallelAxis checks the tensor form of the parallel-axis
// theorem J = I + m(|d|^2 E - d d^T) (Goldstein 3rd ed. §5.3) on the box of
// REFERENCES.md §1.3, d = (0.1, 0.2, 0.3), worked by hand:
// J_xx = 0.0020833 + 2(0.13) = 0.2620833, J_xy = -2(0.1)(0.2) = -0.04, ...
func TestShifted_ParallelAxis(t *testing.T) {
	b := box(2, 0.2, 0.1, 0.05)
	got := b.LocalInertia().Shifted(2, r3.Vec{X: 0.1, Y: 0.2, Z: 0.3})
	want := Mat3{
		{0.2620833333, -0.04, -0.06},
		{-0.04, 0.2070833333, -0.12},
		{-0.06, -0.12, 0.1083333333},
	}
	checkMat(t, "J", got, want, 1e-9)
}

// TestRotated checks R I R^T (Goldstein §5.4) with the rule
// I'_xx = Ix cos^2 + Iy sin^2, I'_xy = (Ix - Iy) sin cos for a turn about z.
func TestRotated(t *testing.T) {
	b := box(2, 0.2, 0.1, 0.05)
	I := b.LocalInertia()
	got := I.Rotated(AxisAngle(r3.Vec{Z: 1}, 45*deg).Mat())
	ix, iy := I[0][0], I[1][1]
	want := Mat3{{(ix + iy) / 2, (ix - iy) / 2, 0}, {(ix - iy) / 2, (ix + iy) / 2, 0}, {0, 0, I[2][2]}}
	checkMat(t, "R I R^T", got, want, 1e-12)
	// REFERENCES.md §1.4: 45 degrees about z gives off-diagonal -0.0025.
	checkRel(t, "I'_xy", got[0][1], -0.0025, 1e-9)
}

// TestMassProps_Hammer is a composite prop worked by hand: a handle
// (cylinder, 0.3 kg, r = 0.01 m, length 0.3 m along prop y, centred at
// y = 0.15) and a head (box 0.5 kg, 0.1 x 0.03 x 0.03 m at y = 0.315).
//
//	M = 0.8 kg; CM y = (0.3*0.15 + 0.5*0.315)/0.8 = 0.253125 m.
//	Handle, axis along y: axial m r^2/2 = 1.5e-5, transverse m(3r^2+h^2)/12 = 0.0022575.
//	Head: Ix = m(b^2+c^2)/12 = 7.5e-5, Iy = m(a^2+c^2)/12 = 0.000454166667, Iz = m(a^2+b^2)/12 = 0.000454166667.
//	Offsets from CM: handle -0.103125, head +0.061875 along y.
//	Ixx = 0.0022575 + 0.3*0.103125^2 + 7.5e-5 + 0.5*0.061875^2 = 0.0074371875
//	Iyy = 1.5e-5 + 0.000454166667 = 0.000469166667
//	Izz = 0.0022575 + 0.3*0.103125^2 + 0.000454166667 + 0.5*0.061875^2 = 0.007816354167
//
// (REFERENCES.md §1.3 gives the same prop with a thin rod, r = 0: the sums
// above minus the r^2 terms reproduce its 0.0074296875 and 0.007808854167.)
func TestMassProps_Hammer(t *testing.T) {
	handle := Part{Name: "handle", Shape: Cylinder, Radius: 0.01, Length: 0.3, Mass: 0.3,
		Position: r3.Vec{Y: 0.15}, Orient: AxisAngle(r3.Vec{X: 1}, -math.Pi/2)}
	head := box(0.5, 0.1, 0.03, 0.03)
	head.Position = r3.Vec{Y: 0.315}
	p := Prop{Parts: []Part{handle, head}}
	mp := mustMass(t, &p)
	checkRel(t, "mass", mp.Mass, 0.8, closeTol)
	if !vecClose(mp.CM, r3.Vec{Y: 0.253125}, 1e-12) {
		t.Errorf("CM = %v", mp.CM)
	}
	checkMat(t, "I", mp.Inertia, Diag(0.0074371875, 0.000469166667, 0.007816354167), 1e-9)
	// Thin-rod limit against REFERENCES.md §1.3.
	rodLimit := mp.Inertia[0][0] - 0.3*3*0.01*0.01/12
	checkRel(t, "thin-rod Ixx", rodLimit, 0.0074296875, 1e-9)
}

// TestPrincipal_Eigen checks the eigen-decomposition on a matrix with a
// known spectrum: [[4,-1,0],[-1,4,0],[0,0,2]] has eigenvalues 2, 3, 5 with
// axes z, (1,1,0)/sqrt2, (1,-1,0)/sqrt2 (by hand: the 2x2 block has
// eigenvalues 4 -+ 1).
func TestPrincipal_Eigen(t *testing.T) {
	m, a, err := principal(Mat3{{4, -1, 0}, {-1, 4, 0}, {0, 0, 2}})
	if err != nil {
		t.Fatal(err)
	}
	for i, want := range []float64{2, 3, 5} {
		checkRel(t, "moment", m[i], want, 1e-12)
	}
	s := 1 / math.Sqrt2
	// Sign rule: largest component positive (first of a tie), right-handed.
	wantAxes := [3]r3.Vec{{Z: 1}, {X: s, Y: s}, {X: s, Y: -s}}
	// The third is e1 x e2 = z x (1,1,0)/sqrt2 = (-1,1,0)/sqrt2.
	wantAxes[2] = r3.Cross(wantAxes[0], wantAxes[1])
	for i := range 3 {
		if !vecClose(a[i], wantAxes[i], 1e-12) {
			t.Errorf("axis %d = %v, want %v", i, a[i], wantAxes[i])
		}
	}
}

func randomRotation(rng *rand.Rand) Mat3 {
	axis := r3.Vec{X: rng.NormFloat64(), Y: rng.NormFloat64(), Z: rng.NormFloat64()}
	return (AxisAngle(axis, rng.Float64()*2*math.Pi)).Mat()
}

// TestMassProps_RotationInvariant: turning a whole prop leaves its mass and
// principal moments unchanged and turns its principal axes with it (the
// eigenvalues of R I R^T equal those of I; Goldstein §5.4).
func TestMassProps_RotationInvariant(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	base := demoProp()
	mp0 := mustMass(t, &base)
	for range 20 {
		R := randomRotation(rng)
		q := RotationFromMat(R)
		turned := Prop{}
		for _, pt := range base.Parts {
			pt.Position = R.MulVec(pt.Position)
			pt.Orient = q.Mul(pt.Orient).Normalize()
			turned.Parts = append(turned.Parts, pt)
		}
		mp := mustMass(t, &turned)
		for i := range 3 {
			checkRel(t, "moment", mp.Moments[i], mp0.Moments[i], 1e-11)
			// Each axis turns with the prop, up to sign.
			want := R.MulVec(mp0.Axes[i])
			if math.Abs(math.Abs(r3.Dot(mp.Axes[i], want))-1) > 1e-9 {
				t.Errorf("axis %d = %v, want +-%v", i, mp.Axes[i], want)
			}
		}
		if d := mp.PrincipalMat().Det(); math.Abs(d-1) > 1e-12 {
			t.Errorf("principal axes not right-handed: det %g", d)
		}
	}
}

// TestMassProps_BoxHalves: a box cut into two halves along each axis, and
// into eight random slabs, has the same tensor as the whole (additivity of
// the inertia integral plus the parallel-axis theorem).
func TestMassProps_BoxHalves(t *testing.T) {
	whole := Prop{Parts: []Part{box(3, 0.4, 0.2, 0.1)}}
	want := mustMass(t, &whole)
	for axis := range 3 {
		size := [3]float64{0.4, 0.2, 0.1}
		half := size
		half[axis] /= 2
		var parts []Part
		for _, s := range []float64{-1, 1} {
			pt := box(1.5, half[0], half[1], half[2])
			off := [3]float64{}
			off[axis] = s * size[axis] / 4
			pt.Position = r3.Vec{X: off[0], Y: off[1], Z: off[2]}
			parts = append(parts, pt)
		}
		got := mustMass(t, &Prop{Parts: parts})
		checkMat(t, "halves", got.Inertia, want.Inertia, 1e-12)
	}
	// Uneven slabs along x, by density so the masses follow the volumes.
	rng := rand.New(rand.NewPCG(2, 2))
	cuts := []float64{-0.2, 0.2}
	for range 6 {
		cuts = append(cuts, -0.2+0.4*rng.Float64())
	}
	sortFloats(cuts)
	var parts []Part
	for i := 0; i+1 < len(cuts); i++ {
		w := cuts[i+1] - cuts[i]
		if w <= 0 {
			continue
		}
		pt := Part{Shape: Box, Size: r3.Vec{X: w, Y: 0.2, Z: 0.1}, Density: 3 / (0.4 * 0.2 * 0.1), Orient: IdentityRotation(),
			Position: r3.Vec{X: (cuts[i] + cuts[i+1]) / 2}}
		parts = append(parts, pt)
	}
	got := mustMass(t, &Prop{Parts: parts})
	checkRel(t, "slab mass", got.Mass, 3, 1e-12)
	checkMat(t, "slabs", got.Inertia, want.Inertia, 1e-12)
}

func sortFloats(a []float64) {
	for i := 1; i < len(a); i++ {
		for j := i; j > 0 && a[j] < a[j-1]; j-- {
			a[j], a[j-1] = a[j-1], a[j]
		}
	}
}

func TestSymmetryOf(t *testing.T) {
	tests := []struct {
		m    [3]float64
		want Symmetry
	}{
		{[3]float64{1, 2, 3}, Asymmetric},
		{[3]float64{1, 1.005, 3}, Oblate},
		{[3]float64{1, 2.99, 3}, Prolate},
		{[3]float64{1, 1.005, 1.0099}, Spherical},
		// Each neighbouring pair within 1 % but the ends 1.8 % apart: not
		// "all three"; the closer pair (I2, I3) makes it prolate.
		{[3]float64{1, 1.009, 1.018}, Prolate},
		{[3]float64{1, 1.006, 1.0155}, Oblate},
		{[3]float64{1, 1.02, 3}, Asymmetric},
	}
	for _, tc := range tests {
		if got := SymmetryOf(tc.m, DefaultSymmetryTol); got != tc.want {
			t.Errorf("SymmetryOf(%v) = %v, want %v", tc.m, got, tc.want)
		}
	}
}

// demoProp is an asymmetric test prop of several shapes, offset and turned.
func demoProp() Prop {
	return Prop{Parts: []Part{
		{Shape: Cylinder, Radius: 0.12, Length: 0.03, Mass: 0.9, Orient: EulerXYZ(math.Pi/2, 0, 0)},
		{Shape: Box, Size: r3.Vec{X: 0.22, Y: 0.025, Z: 0.03}, Mass: 0.25, Position: r3.Vec{X: 0.23, Y: 0.01}, Orient: EulerXYZ(0, 0, 0.1)},
		{Shape: Torus, Radius: 0.12, TubeRadius: 0.008, Mass: 0.1, Position: r3.Vec{Y: 0.015}, Orient: EulerXYZ(math.Pi/2, 0, 0)},
		{Shape: Cone, Radius: 0.02, Height: 0.05, Mass: 0.05, Position: r3.Vec{X: 0.36, Y: 0.01}, Orient: EulerXYZ(0, math.Pi/2, 0)},
	}}
}

// TestPrincipal_DegenerateCanonical: a rod's two equal transverse moments
// get axes fixed by the prop frame, however the rod is built, so "the
// greatest axis" means one direction (the transverse prop axis nearest to
// the plane, x before y before z).
func TestPrincipal_DegenerateCanonical(t *testing.T) {
	rod := Prop{Parts: []Part{{Shape: Cylinder, Radius: 0.03, Length: 0.45, Mass: 1, Orient: EulerXYZ(0, math.Pi/2, 0)}}}
	mp := mustMass(t, &rod) // axis along prop x
	if !vecClose(mp.Axes[0], r3.Vec{X: 1}, 1e-12) || !vecClose(mp.Axes[1], r3.Vec{Y: 1}, 1e-12) || !vecClose(mp.Axes[2], r3.Vec{Z: 1}, 1e-12) {
		t.Errorf("rod along x: axes %v", mp.Axes)
	}
	ball := Prop{Parts: []Part{{Shape: Sphere, Radius: 0.1, Mass: 1, Orient: EulerXYZ(0.3, 0.2, 0.1)}}}
	if mb := mustMass(t, &ball); mb.Axes != [3]r3.Vec{{X: 1}, {Y: 1}, {Z: 1}} {
		t.Errorf("sphere: axes %v", mb.Axes)
	}
	// A disc lying in the x-z plane: symmetry axis y (greatest); the equal
	// pair is x, then z x ... chosen right-handed.
	disc := Prop{Parts: []Part{{Shape: Cylinder, Radius: 0.13, Length: 0.01, Mass: 1, Orient: EulerXYZ(math.Pi/2, 0, 0)}}}
	md := mustMass(t, &disc)
	if !vecClose(md.Axes[0], r3.Vec{X: 1}, 1e-12) || math.Abs(math.Abs(md.Axes[2].Y)-1) > 1e-12 {
		t.Errorf("disc: axes %v", md.Axes)
	}
	if d := md.PrincipalMat().Det(); math.Abs(d-1) > 1e-12 {
		t.Errorf("disc axes not right-handed: %g", d)
	}
}
