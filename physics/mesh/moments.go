package mesh

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"
)

// Moments are the mass properties of a mesh for unit density, in the
// mesh's frame.
type Moments struct {
	// Measure is the volume (m^3) of the solid, or the area (m^2) of the
	// surface; the mass is density times Measure.
	Measure float64
	// Center is the centroid, m.
	Center r3.Vec
	// Inertia is the inertia tensor about Center per unit density (kg m^2
	// per kg/m^3 for the solid, per kg/m^2 for the surface), row major,
	// physics sign convention I = tr(C) E - C with C the second moment.
	// Multiply by mass/Measure for a body of mass m.
	Inertia [3][3]float64
}

// Solid returns the solid's volume, centroid and inertia per unit density:
// the divergence theorem over the signed tetrahedra (r, a, b, c) from a
// reference point r (the bounding-box centre, which keeps round-off small
// wherever the mesh sits) to each triangle (REFERENCES.md §9):
//
//	det_k = det[a-r b-r c-r]
//	V     = sum det_k / 6
//	first = sum det_k (a+b+c-3r) / 24
//	C     = sum det_k (A A^T + s s^T) / 120,  A = [a-r b-r c-r], s = a+b+c-3r
//
// (A A^T + s s^T = A S A^T with S = [[2,1,1],[1,2,1],[1,1,2]], Blow &
// Binstock 2004.) The sums run in float64 with Neumaier compensation.
// Exact for a closed polyhedron; a mesh wound inward gives a negative
// Measure (New turns such meshes outward).
func (m *Mesh) Solid() Moments {
	m.solidOnce.Do(func() { m.solid = m.moments(false) })
	return m.solid
}

// Surface returns the surface's area, centroid and inertia per unit area
// density (a thin wall: the mass lies in the surface). Triangle (a, b, c)
// of area A has, about r, first moment A s / 3 and second moment
// (A/12)(sum a a^T + s s^T) with s = a+b+c (REFERENCES.md §9, Blow &
// Binstock 2004). A closed thin-walled cube of side a has (5/18) m a²
// about every axis through its centre.
func (m *Mesh) Surface() Moments {
	m.surfOnce.Do(func() { m.surf = m.moments(true) })
	return m.surf
}

// moments sums the solid (surface = false) or surface moments.
func (m *Mesh) moments(surface bool) Moments {
	lo, hi := bounds(m.V)
	r := r3.Scale(0.5, r3.Add(lo, hi))
	var meas ksum
	var first [3]ksum
	var second [6]ksum // xx yy zz xy xz yz
	for _, t := range m.T {
		a, b, c := r3.Sub(m.V[t[0]], r), r3.Sub(m.V[t[1]], r), r3.Sub(m.V[t[2]], r)
		s := r3.Add(a, r3.Add(b, c))
		var w0, w1, w2 float64 // weights of the measure, first and second moments
		if surface {
			n := r3.Cross(r3.Sub(b, a), r3.Sub(c, a))
			area := math.Sqrt(n.X*n.X+n.Y*n.Y+n.Z*n.Z) / 2
			w0, w1, w2 = area, area/3, area/12
		} else {
			det := r3.Dot(a, r3.Cross(b, c))
			w0, w1, w2 = det/6, det/24, det/120
		}
		meas.add(w0)
		first[0].add(w1 * s.X)
		first[1].add(w1 * s.Y)
		first[2].add(w1 * s.Z)
		second[0].add(w2 * (a.X*a.X + b.X*b.X + c.X*c.X + s.X*s.X))
		second[1].add(w2 * (a.Y*a.Y + b.Y*b.Y + c.Y*c.Y + s.Y*s.Y))
		second[2].add(w2 * (a.Z*a.Z + b.Z*b.Z + c.Z*c.Z + s.Z*s.Z))
		second[3].add(w2 * (a.X*a.Y + b.X*b.Y + c.X*c.Y + s.X*s.Y))
		second[4].add(w2 * (a.X*a.Z + b.X*b.Z + c.X*c.Z + s.X*s.Z))
		second[5].add(w2 * (a.Y*a.Z + b.Y*b.Z + c.Y*c.Z + s.Y*s.Z))
	}
	v := meas.sum()
	if v == 0 || math.IsNaN(v) {
		return Moments{Measure: v, Center: r}
	}
	g := r3.Vec{X: first[0].sum() / v, Y: first[1].sum() / v, Z: first[2].sum() / v}
	// Second moment about the centroid: C - V g g^T (parallel axes).
	cxx := second[0].sum() - v*g.X*g.X
	cyy := second[1].sum() - v*g.Y*g.Y
	czz := second[2].sum() - v*g.Z*g.Z
	cxy := second[3].sum() - v*g.X*g.Y
	cxz := second[4].sum() - v*g.X*g.Z
	cyz := second[5].sum() - v*g.Y*g.Z
	tr := cxx + cyy + czz
	return Moments{
		Measure: v,
		Center:  r3.Add(r, g),
		Inertia: [3][3]float64{
			{tr - cxx, -cxy, -cxz},
			{-cxy, tr - cyy, -cyz},
			{-cxz, -cyz, tr - czz},
		},
	}
}

// ksum is a Neumaier (improved Kahan-Babuska) compensated sum.
type ksum struct{ s, c float64 }

func (k *ksum) add(x float64) {
	t := k.s + x
	if math.Abs(k.s) >= math.Abs(x) {
		k.c += (k.s - t) + x
	} else {
		k.c += (x - t) + k.s
	}
	k.s = t
}

func (k *ksum) sum() float64 { return k.s + k.c }
