package wire

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"
)

// The ground grid.

// NiceStep returns the smallest of 1, 2 or 5 times a power of ten that is
// at least x (x > 0): the round spacing of the ground grid here and of the
// timing sheet's chart grid.
func NiceStep(x float64) float64 {
	p := math.Pow(10, math.Floor(math.Log10(x)))
	for _, m := range []float64{1, 2, 5, 10} {
		if m*p >= x*(1-1e-12) {
			return m * p
		}
	}
	return 10 * p
}

// maxGridLines bounds the lines of the grid in each direction.
const maxGridLines = 200

// grid draws the ground grid at height y under the box b: lines at a round
// spacing (1, 2 or 5 times a power of ten, about eight to twenty across),
// a margin of one spacing, its outline and the world x and z axes on the
// ground in the Ground kind.
func (d *drawer) grid(b r3.Box, y float64) {
	if !finite(y) || !finite(b.Min.X) || !finite(b.Max.X) || !finite(b.Min.Z) || !finite(b.Max.Z) {
		return
	}
	ext := math.Max(math.Max(b.Max.X-b.Min.X, b.Max.Z-b.Min.Z), 0.5)
	step := NiceStep(ext / 10)
	margin := step
	x0, x1 := math.Floor((b.Min.X-margin)/step), math.Ceil((b.Max.X+margin)/step)
	z0, z1 := math.Floor((b.Min.Z-margin)/step), math.Ceil((b.Max.Z+margin)/step)
	if x1-x0 > maxGridLines || z1-z0 > maxGridLines {
		return
	}
	xa, xb, za, zb := x0*step, x1*step, z0*step, z1*step
	for i := x0 + 1; i < x1; i++ {
		if i != 0 {
			d.segment3(r3.Vec{X: i * step, Y: y, Z: za}, r3.Vec{X: i * step, Y: y, Z: zb}, Grid, 1)
		}
	}
	for i := z0 + 1; i < z1; i++ {
		if i != 0 {
			d.segment3(r3.Vec{X: xa, Y: y, Z: i * step}, r3.Vec{X: xb, Y: y, Z: i * step}, Grid, 1)
		}
	}
	corners := [4]r3.Vec{{X: xa, Y: y, Z: za}, {X: xb, Y: y, Z: za}, {X: xb, Y: y, Z: zb}, {X: xa, Y: y, Z: zb}}
	for i := range 4 {
		d.segment3(corners[i], corners[(i+1)%4], Ground, 1)
	}
	if x0 < 0 && x1 > 0 {
		d.segment3(r3.Vec{Y: y, Z: za}, r3.Vec{Y: y, Z: zb}, Ground, 1)
	}
	if z0 < 0 && z1 > 0 {
		d.segment3(r3.Vec{X: xa, Y: y}, r3.Vec{X: xb, Y: y}, Ground, 1)
	}
}
