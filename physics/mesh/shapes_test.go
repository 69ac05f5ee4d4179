package mesh

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"
)

// Test solids as triangle soups, wound counter-clockwise seen from outside.

func v(x, y, z float64) r3.Vec { return r3.Vec{X: x, Y: y, Z: z} }

// quad appends the two triangles of the quadrilateral a b c d (in order).
func quad(t [][3]r3.Vec, a, b, c, d r3.Vec) [][3]r3.Vec {
	return append(t, [3]r3.Vec{a, b, c}, [3]r3.Vec{a, c, d})
}

// boxTris is the box of full edges (x, y, z) centred at the origin, 12 triangles.
func boxTris(x, y, z float64) [][3]r3.Vec {
	p := func(i, j, k int) r3.Vec {
		return v((float64(i)-0.5)*x, (float64(j)-0.5)*y, (float64(k)-0.5)*z)
	}
	var t [][3]r3.Vec
	t = quad(t, p(0, 0, 0), p(0, 1, 0), p(1, 1, 0), p(1, 0, 0)) // -z
	t = quad(t, p(0, 0, 1), p(1, 0, 1), p(1, 1, 1), p(0, 1, 1)) // +z
	t = quad(t, p(0, 0, 0), p(1, 0, 0), p(1, 0, 1), p(0, 0, 1)) // -y
	t = quad(t, p(0, 1, 0), p(0, 1, 1), p(1, 1, 1), p(1, 1, 0)) // +y
	t = quad(t, p(0, 0, 0), p(0, 0, 1), p(0, 1, 1), p(0, 1, 0)) // -x
	t = quad(t, p(1, 0, 0), p(1, 1, 0), p(1, 1, 1), p(1, 0, 1)) // +x
	return t
}

// prismTris is the regular n-gon prism of circumradius r and length h along
// z, centred at the origin; the caps are fans from their centres.
func prismTris(n int, r, h float64) [][3]r3.Vec {
	var t [][3]r3.Vec
	at := func(i int, z float64) r3.Vec {
		a := 2 * math.Pi * float64(i%n) / float64(n)
		return v(r*math.Cos(a), r*math.Sin(a), z)
	}
	lo, hi := v(0, 0, -h/2), v(0, 0, h/2)
	for i := range n {
		t = quad(t, at(i, -h/2), at(i+1, -h/2), at(i+1, h/2), at(i, h/2))
		t = append(t, [3]r3.Vec{hi, at(i, h/2), at(i+1, h/2)})
		t = append(t, [3]r3.Vec{lo, at(i+1, -h/2), at(i, -h/2)})
	}
	return t
}

// sphereTris is a latitude-longitude sphere of radius r with n bands and 2n
// segments (poles as fans).
func sphereTris(n int, r float64) [][3]r3.Vec {
	at := func(i, j int) r3.Vec {
		th := math.Pi * float64(i) / float64(n)
		ph := 2 * math.Pi * float64(j%(2*n)) / float64(2*n)
		if i == 0 {
			return v(0, 0, r)
		}
		if i == n {
			return v(0, 0, -r)
		}
		return v(r*math.Sin(th)*math.Cos(ph), r*math.Sin(th)*math.Sin(ph), r*math.Cos(th))
	}
	var t [][3]r3.Vec
	for i := range n {
		for j := range 2 * n {
			a, b, c, d := at(i, j), at(i+1, j), at(i+1, j+1), at(i, j+1)
			switch i {
			case 0:
				t = append(t, [3]r3.Vec{a, b, c})
			case n - 1:
				t = append(t, [3]r3.Vec{a, b, d})
			default:
				t = quad(t, a, b, c, d)
			}
		}
	}
	return t
}

// transform turns every vertex of t by the rotation matrix r and moves it by d.
func transform(t [][3]r3.Vec, r [3][3]float64, d r3.Vec) [][3]r3.Vec {
	out := make([][3]r3.Vec, len(t))
	for i, tri := range t {
		for k, p := range tri {
			out[i][k] = r3.Add(d, v(
				r[0][0]*p.X+r[0][1]*p.Y+r[0][2]*p.Z,
				r[1][0]*p.X+r[1][1]*p.Y+r[1][2]*p.Z,
				r[2][0]*p.X+r[2][1]*p.Y+r[2][2]*p.Z))
		}
	}
	return out
}

// reversed returns t with every triangle wound the other way.
func reversed(t [][3]r3.Vec) [][3]r3.Vec {
	out := make([][3]r3.Vec, len(t))
	for i, tri := range t {
		out[i] = [3]r3.Vec{tri[0], tri[2], tri[1]}
	}
	return out
}

// rotation returns the matrix of the rotation by angle about the unit axis
// (Rodrigues' formula).
func rotation(axis r3.Vec, angle float64) [3][3]float64 {
	k := r3.Unit(axis)
	c, s := math.Cos(angle), math.Sin(angle)
	return [3][3]float64{
		{c + k.X*k.X*(1-c), k.X*k.Y*(1-c) - k.Z*s, k.X*k.Z*(1-c) + k.Y*s},
		{k.Y*k.X*(1-c) + k.Z*s, c + k.Y*k.Y*(1-c), k.Y*k.Z*(1-c) - k.X*s},
		{k.Z*k.X*(1-c) - k.Y*s, k.Z*k.Y*(1-c) + k.X*s, c + k.Z*k.Z*(1-c)},
	}
}

// rotTensor returns r i r^T.
func rotTensor(r, i [3][3]float64) [3][3]float64 {
	var out [3][3]float64
	for a := range 3 {
		for b := range 3 {
			for c := range 3 {
				for d := range 3 {
					out[a][b] += r[a][c] * i[c][d] * r[b][d]
				}
			}
		}
	}
	return out
}
