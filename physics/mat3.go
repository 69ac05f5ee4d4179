package physics

import "gonum.org/v1/gonum/spatial/r3"

// Mat3 is a 3x3 matrix, row major: m[row][col]. Inertia tensors and rotation
// matrices use it; it is a value type, so copies never alias.
type Mat3 [3][3]float64

// Diag returns the diagonal matrix with a, b, c on its diagonal.
func Diag(a, b, c float64) Mat3 { return Mat3{{a, 0, 0}, {0, b, 0}, {0, 0, c}} }

// MulVec returns m v.
func (m Mat3) MulVec(v r3.Vec) r3.Vec {
	return r3.Vec{
		X: m[0][0]*v.X + m[0][1]*v.Y + m[0][2]*v.Z,
		Y: m[1][0]*v.X + m[1][1]*v.Y + m[1][2]*v.Z,
		Z: m[2][0]*v.X + m[2][1]*v.Y + m[2][2]*v.Z,
	}
}

// Mul returns m n.
func (m Mat3) Mul(n Mat3) Mat3 {
	var r Mat3
	for i := range 3 {
		for j := range 3 {
			r[i][j] = m[i][0]*n[0][j] + m[i][1]*n[1][j] + m[i][2]*n[2][j]
		}
	}
	return r
}

// T returns the transpose of m.
func (m Mat3) T() Mat3 {
	var r Mat3
	for i := range 3 {
		for j := range 3 {
			r[i][j] = m[j][i]
		}
	}
	return r
}

// Add returns m + n.
func (m Mat3) Add(n Mat3) Mat3 {
	for i := range 3 {
		for j := range 3 {
			m[i][j] += n[i][j]
		}
	}
	return m
}

// Scale returns f m.
func (m Mat3) Scale(f float64) Mat3 {
	for i := range 3 {
		for j := range 3 {
			m[i][j] *= f
		}
	}
	return m
}

// Det returns the determinant of m.
func (m Mat3) Det() float64 {
	return m[0][0]*(m[1][1]*m[2][2]-m[1][2]*m[2][1]) -
		m[0][1]*(m[1][0]*m[2][2]-m[1][2]*m[2][0]) +
		m[0][2]*(m[1][0]*m[2][1]-m[1][1]*m[2][0])
}

// Rotated returns R m R^T: a tensor given in an inner frame expressed in the
// outer frame, where R maps inner to outer coordinates (Goldstein §5.4).
func (m Mat3) Rotated(r Mat3) Mat3 { return r.Mul(m).Mul(r.T()) }

// Shifted returns the inertia tensor m of a body of the given mass about its
// centre of mass, moved to a point at offset d from that centre, by the
// parallel-axis theorem J = I + m (|d|^2 E - d d^T) (Goldstein §5.3).
func (m Mat3) Shifted(mass float64, d r3.Vec) Mat3 {
	dd := [3]float64{d.X, d.Y, d.Z}
	n2 := r3.Norm2(d)
	for i := range 3 {
		for j := range 3 {
			v := -dd[i] * dd[j]
			if i == j {
				v += n2
			}
			m[i][j] += mass * v
		}
	}
	return m
}
