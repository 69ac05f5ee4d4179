package physics

import (
	"errors"
	"fmt"
	"math"

	"gonum.org/v1/gonum/mat"
	"gonum.org/v1/gonum/spatial/r3"
)

// Prop is a thrown object: a set of parts authored in the prop frame.
type Prop struct {
	Parts []Part
}

// Symmetry says which principal moments coincide.
type Symmetry int

const (
	Asymmetric Symmetry = iota // no two moments equal ("none")
	Prolate                    // I2 = I3: symmetry axis is the least axis
	Oblate                     // I1 = I2: symmetry axis is the greatest axis
	Spherical                  // all three equal
)

// String returns the name used in check --json: none, prolate, oblate, spherical.
func (s Symmetry) String() string {
	switch s {
	case Prolate:
		return "prolate"
	case Oblate:
		return "oblate"
	case Spherical:
		return "spherical"
	}
	return "none"
}

// DefaultSymmetryTol is the relative difference (to the larger moment) below
// which two principal moments count as equal (DESIGN.md verdict rules).
const DefaultSymmetryTol = 0.01

// MassProps are a prop's mass properties, all in the prop frame.
type MassProps struct {
	Mass    float64    // kg
	CM      r3.Vec     // centre of mass, m
	Inertia Mat3       // tensor about CM, prop axes, kg m^2
	Moments [3]float64 // principal moments, ascending I1 <= I2 <= I3
	// Axes[i] is the unit principal axis of Moments[i]. Each axis has its
	// largest-magnitude component positive (first and second axis; the
	// third is their cross product so that the set is right-handed).
	Axes [3]r3.Vec
}

// Validate checks every part and that the prop has one.
func (p *Prop) Validate() error {
	if len(p.Parts) == 0 {
		return &FieldError{Field: "parts", Msg: "a prop needs at least one part"}
	}
	for i := range p.Parts {
		if err := p.Parts[i].Validate(); err != nil {
			var fe *FieldError
			if errors.As(err, &fe) {
				return &FieldError{Field: fmt.Sprintf("parts[%d].%s", i, fe.Field), Msg: fe.Msg}
			}
			return err
		}
	}
	return nil
}

// MassProps computes the prop's mass, centre of mass, inertia tensor about the
// centre of mass (each part's R I R^T moved by the parallel-axis theorem,
// Goldstein §5.3) and its principal moments and axes (gonum mat.EigenSym).
func (p *Prop) MassProps() (MassProps, error) {
	if err := p.Validate(); err != nil {
		return MassProps{}, err
	}
	var mp MassProps
	var first r3.Vec
	for i := range p.Parts {
		pt := &p.Parts[i]
		m := pt.TotalMass()
		mp.Mass += m
		first = r3.Add(first, r3.Scale(m, pt.Center()))
	}
	mp.CM = r3.Scale(1/mp.Mass, first)
	for i := range p.Parts {
		pt := &p.Parts[i]
		local := pt.LocalInertia().Rotated(pt.Orient.Normalize().Mat())
		mp.Inertia = mp.Inertia.Add(local.Shifted(pt.TotalMass(), r3.Sub(pt.Center(), mp.CM)))
	}
	// Symmetrise away round-off before the eigen-decomposition.
	for i := range 3 {
		for j := i + 1; j < 3; j++ {
			v := (mp.Inertia[i][j] + mp.Inertia[j][i]) / 2
			mp.Inertia[i][j], mp.Inertia[j][i] = v, v
		}
	}
	moments, axes, err := principal(mp.Inertia)
	if err != nil {
		return MassProps{}, err
	}
	mp.Moments, mp.Axes = moments, axes
	return mp, nil
}

// principal returns the ascending eigenvalues of the symmetric tensor t and
// unit eigenvectors under the sign rule of MassProps.Axes.
func principal(t Mat3) ([3]float64, [3]r3.Vec, error) {
	sym := mat.NewSymDense(3, []float64{
		t[0][0], t[0][1], t[0][2],
		t[1][0], t[1][1], t[1][2],
		t[2][0], t[2][1], t[2][2],
	})
	var es mat.EigenSym
	if !es.Factorize(sym, true) {
		return [3]float64{}, [3]r3.Vec{}, errors.New("physics: inertia tensor eigen-decomposition failed")
	}
	vals := es.Values(nil) // ascending (gonum mat/eigen.go)
	var vecs mat.Dense
	es.VectorsTo(&vecs) // eigenvectors in columns
	var moments [3]float64
	var axes [3]r3.Vec
	for i := range 3 {
		moments[i] = vals[i]
		axes[i] = r3.Unit(r3.Vec{X: vecs.At(0, i), Y: vecs.At(1, i), Z: vecs.At(2, i)})
	}
	canonicalDegenerate(&moments, &axes)
	axes[0] = largestPositive(axes[0])
	axes[1] = largestPositive(axes[1])
	axes[2] = r3.Unit(r3.Cross(axes[0], axes[1]))
	return moments, axes, nil
}

// degenerateTol is the relative difference under which two principal
// moments are equal to round-off, so that their axes are any orthonormal
// pair in a plane (a rod, a disc) and the eigen-solver's choice is
// arbitrary.
const degenerateTol = 1e-9

// canonicalDegenerate replaces the arbitrary axes of equal moments by a
// choice fixed by the prop frame: within the plane of two equal moments,
// the first axis is the prop axis (x, then y, then z) that lies most
// nearly in the plane, projected into it; all three equal gives x, y, z.
// A spin "about the greatest axis" of a rolling pin then means the same
// turn whatever the solver returned.
func canonicalDegenerate(m *[3]float64, a *[3]r3.Vec) {
	eq := func(i, j int) bool {
		return math.Abs(m[j]-m[i]) <= degenerateTol*math.Max(math.Abs(m[i]), math.Abs(m[j]))
	}
	basis := [3]r3.Vec{{X: 1}, {Y: 1}, {Z: 1}}
	switch {
	case eq(0, 1) && eq(1, 2):
		*a = basis
	case eq(0, 1) || eq(1, 2):
		i, j, k := 0, 1, 2 // i, j equal; k the distinct axis
		if eq(1, 2) {
			i, j, k = 1, 2, 0
		}
		n := a[k]
		best, bestLen := r3.Vec{}, -1.0
		for _, b := range basis {
			p := r3.Sub(b, r3.Scale(r3.Dot(b, n), n))
			if l := r3.Norm(p); l > bestLen+1e-12 {
				best, bestLen = r3.Scale(1/l, p), l
			}
		}
		a[i] = best
		a[j] = r3.Unit(r3.Cross(n, best))
	}
}

// largestPositive flips v so that its largest-magnitude component is
// positive. Ties within 1e-12 go to the earlier component.
func largestPositive(v r3.Vec) r3.Vec {
	c := [3]float64{v.X, v.Y, v.Z}
	k := 0
	for i := 1; i < 3; i++ {
		if math.Abs(c[i]) > math.Abs(c[k])+1e-12 {
			k = i
		}
	}
	if c[k] < 0 {
		return r3.Scale(-1, v)
	}
	return v
}

// SymmetryOf classifies sorted moments: two within tol of each other
// (relative to the larger) are equal. All three count as equal only when
// the least and greatest are within tol; when both neighbouring pairs are
// within tol but the ends are not, the closer pair decides.
func SymmetryOf(m [3]float64, tol float64) Symmetry {
	rel := func(a, b float64) float64 { return math.Abs(b-a) / math.Max(math.Abs(a), math.Abs(b)) }
	lo, hi := rel(m[0], m[1]), rel(m[1], m[2])
	switch {
	case rel(m[0], m[2]) <= tol:
		return Spherical
	case lo <= tol && (hi > tol || lo <= hi):
		return Oblate
	case hi <= tol:
		return Prolate
	}
	return Asymmetric
}

// PrincipalMat returns the rotation matrix whose columns are the principal
// axes: it maps principal-frame coordinates to prop-frame coordinates.
func (mp *MassProps) PrincipalMat() Mat3 {
	var r Mat3
	for j, a := range mp.Axes {
		r[0][j], r[1][j], r[2][j] = a.X, a.Y, a.Z
	}
	return r
}
