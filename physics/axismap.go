package physics

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"
)

// The axis map: the verdict of every spin direction of a prop. Euler's
// equations are homogeneous of degree 2 in omega (LL §36), so the motion's
// class, excursion and spin-to-wobble ratio depend only on the direction of
// the release spin, never its rate: one picture covers every throw of the
// prop. Spinning about -omega is the same motion run with the body
// mirrored through its centre (L and omega both change sign), so a
// direction and its opposite share their verdict.

// DefaultMapSamples is the number of directions of `propflight map`.
const DefaultMapSamples = 2000

// MaxMapSamples bounds the directions of one map (about 10 MB of JSON).
const MaxMapSamples = 100000

// DirectionVerdict is the verdict of spinning a prop about one direction.
type DirectionVerdict struct {
	Axis           r3.Vec  // unit spin direction, prop frame
	Motion         Motion  // spin, tumble or wobble
	Circles        Axis    // the principal axis the motion circles
	ExcursionDeg   float64 // largest angle between L and Circles, degrees
	D              float64 // L^2 / (2E), kg m^2 (I2 on the separatrix)
	HasRatio       bool    // false for a tumble or a symmetric body end over end
	WobblesPerTurn float64 // spin-to-wobble ratio (verdict rules, DESIGN.md)
}

// AxisMapper judges spin directions of one prop under fixed thresholds.
// It is immutable and safe for concurrent use.
type AxisMapper struct {
	moments [3]float64
	axes    [3]r3.Vec
	sym     Symmetry
	thr     Thresholds
}

// NewAxisMapper returns the mapper of the prop with mass properties mp.
func NewAxisMapper(mp *MassProps, thr Thresholds) *AxisMapper {
	return &AxisMapper{moments: mp.Moments, axes: mp.Axes, sym: SymmetryOf(mp.Moments, thr.SymmetryTol), thr: thr}
}

// Moments returns the principal moments (ascending, kg m^2).
func (m *AxisMapper) Moments() [3]float64 { return m.moments }

// Axes returns the unit principal axes in the prop frame (row i of moment i).
func (m *AxisMapper) Axes() [3]r3.Vec { return m.axes }

// Symmetry returns the prop's symmetry under the mapper's thresholds.
func (m *AxisMapper) Symmetry() Symmetry { return m.sym }

// Thresholds returns the verdict thresholds the mapper uses.
func (m *AxisMapper) Thresholds() Thresholds { return m.thr }

// principal returns the unit direction dir (prop frame) in principal
// coordinates; false for a zero or non-finite vector.
func (m *AxisMapper) principal(dir r3.Vec) (r3.Vec, bool) {
	n := r3.Norm(dir)
	if !(n > 0) || math.IsInf(n, 1) {
		return r3.Vec{}, false
	}
	d := r3.Scale(1/n, dir)
	return r3.Vec{X: r3.Dot(d, m.axes[0]), Y: r3.Dot(d, m.axes[1]), Z: r3.Dot(d, m.axes[2])}, true
}

// Verdict returns the verdict of spinning about dir (prop frame, any
// length), the same as Judge gives a throw with that spin at any rate. A
// zero vector gives a spin with no ratio.
func (m *AxisMapper) Verdict(dir r3.Vec) DirectionVerdict {
	w, ok := m.principal(dir)
	if !ok {
		return DirectionVerdict{Motion: Spinning, Circles: Greatest}
	}
	v := judgeOmega(m.moments, m.sym, w, m.thr, false)
	return DirectionVerdict{
		Axis: r3.Unit(dir), Motion: v.Motion, Circles: v.Circles, ExcursionDeg: v.ExcursionDeg,
		D: v.D, HasRatio: v.HasRatio, WobblesPerTurn: v.WobblesPerTurn,
	}
}

// Class returns the motion, circled axis and excursion (degrees) of
// spinning about dir without the ratio: a few operations, for drawing the
// map pixel by pixel. It agrees with Verdict.
func (m *AxisMapper) Class(dir r3.Vec) (Motion, Axis, float64) {
	w, ok := m.principal(dir)
	if !ok {
		return Spinning, Greatest, 0
	}
	return m.ClassPrincipal(w)
}

// ClassPrincipal is Class for a unit direction w already in principal
// coordinates (w.X along the least axis, w.Z along the greatest).
func (m *AxisMapper) ClassPrincipal(w r3.Vec) (Motion, Axis, float64) {
	I := m.moments
	l := r3.Vec{X: I[0] * w.X, Y: I[1] * w.Y, Z: I[2] * w.Z}
	switch m.sym {
	case Spherical:
		return Spinning, Greatest, 0
	case Prolate, Oblate:
		lAxis, c := l.X, Least
		if m.sym == Oblate {
			lAxis, c = l.Z, Greatest
		}
		theta := math.Acos(math.Min(1, math.Abs(lAxis)/r3.Norm(l))) * 180 / math.Pi
		if theta < m.thr.WobbleMinDeg || theta > 90-m.thr.WobbleMinDeg {
			return Spinning, c, theta
		}
		return Wobbling, c, theta
	}
	c, exc := asymmetricExcursion(I, r3.Norm2(l)/r3.Dot(l, w))
	if exc >= m.thr.TumbleDeg {
		return Tumbling, c, exc
	}
	return Spinning, c, exc
}

// Separatrix returns the normals (unit, prop frame) of the two planes
// through the middle axis whose great circles divide the directions that
// circle the least axis from those that circle the greatest, and true; or
// false for a symmetric prop, which has no such boundary. On them
// D = I2: I1 (I2-I1) w1^2 = I3 (I3-I2) w3^2, so they meet the least-greatest
// plane at tan(alpha) = w3/w1 = sqrt(I1 (I2-I1) / (I3 (I3-I2))) (from
// the invariants of REFERENCES.md §3.1).
func (m *AxisMapper) Separatrix() ([2]r3.Vec, bool) {
	if m.sym != Asymmetric {
		return [2]r3.Vec{}, false
	}
	I := m.moments
	alpha := math.Atan(math.Sqrt(I[0] * (I[1] - I[0]) / (I[2] * (I[2] - I[1]))))
	s, c := math.Sin(alpha), math.Cos(alpha)
	// e2 x (c e1 ± s e3) = ±s e1 - c e3.
	n1 := r3.Sub(r3.Scale(s, m.axes[0]), r3.Scale(c, m.axes[2]))
	n2 := r3.Sub(r3.Scale(-s, m.axes[0]), r3.Scale(c, m.axes[2]))
	return [2]r3.Vec{n1, n2}, true
}

// AxisMap is the verdict of directions spread evenly over the sphere.
type AxisMap struct {
	Moments    [3]float64
	Axes       [3]r3.Vec
	Symmetry   Symmetry
	Directions []DirectionVerdict
}

// MapDirections judges n directions spread evenly over the sphere
// (SpreadDirections) for the prop with mass properties mp. n is clamped to
// 1..MaxMapSamples.
func MapDirections(mp *MassProps, thr Thresholds, n int) AxisMap {
	m := NewAxisMapper(mp, thr)
	dirs := SpreadDirections(n)
	out := AxisMap{Moments: mp.Moments, Axes: mp.Axes, Symmetry: m.sym, Directions: make([]DirectionVerdict, len(dirs))}
	for i, d := range dirs {
		out.Directions[i] = m.Verdict(d)
	}
	return out
}

// SpreadDirections returns n unit vectors spread evenly over the sphere:
// the Fibonacci (golden-angle) lattice, point i at height
// z = 1 - (2i+1)/n and longitude i times the golden angle pi (3 - sqrt 5)
// (Á. González, "Measurement of areas on a sphere using Fibonacci and
// latitude-longitude lattices", Math. Geosci. 42 (2010) 49-64). Each point
// stands for an equal area 4 pi / n. n is clamped to 1..MaxMapSamples.
func SpreadDirections(n int) []r3.Vec {
	n = max(1, min(n, MaxMapSamples))
	golden := math.Pi * (3 - math.Sqrt(5))
	out := make([]r3.Vec, n)
	for i := range n {
		z := 1 - (2*float64(i)+1)/float64(n)
		r := math.Sqrt(math.Max(0, 1-z*z))
		s, c := math.Sincos(golden * float64(i))
		out[i] = r3.Vec{X: r * c, Y: r * s, Z: z}
	}
	return out
}
