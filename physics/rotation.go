package physics

import (
	"math"

	"gonum.org/v1/gonum/num/quat"
	"gonum.org/v1/gonum/spatial/r3"
)

// This file holds the one quaternion convention of the package: a unit
// quat.Number q maps inner-frame vectors to the outer frame, v' = q v q*.

// Rotation is an orientation or a turn: a unit quaternion that maps
// inner-frame vectors to the outer frame, v' = q v q* ([Rotation.Rotate]),
// with its own methods as gonum's r3.Rotation has. A part's Orient maps
// the part frame to the prop frame, a throw's and a frame's Orient the
// prop frame to the world. q and -q are the same rotation. Its fields are
// quat.Number's (Real, Imag, Jmag, Kmag = w, x, y, z); [Rotation.Quat]
// gives the quaternion for gonum's quat functions.
type Rotation quat.Number

// identity is the rotation that changes nothing.
var identity = Rotation{Real: 1}

// IdentityRotation returns the identity rotation.
func IdentityRotation() Rotation { return identity }

// AxisAngle returns the rotation by angle (radians, right-hand rule) about
// axis. A zero axis gives the identity.
func AxisAngle(axis r3.Vec, angle float64) Rotation {
	n := r3.Norm(axis)
	if n == 0 {
		return identity
	}
	s, c := math.Sincos(angle / 2)
	f := s / n
	return Rotation{Real: c, Imag: axis.X * f, Jmag: axis.Y * f, Kmag: axis.Z * f}
}

// EulerXYZ returns the rotation that turns about the fixed x axis by rx, then
// the fixed y axis by ry, then the fixed z axis by rz (radians): R = Rz Ry Rx.
// This is the order of the project file's rotation_deg and orientation_deg.
func EulerXYZ(rx, ry, rz float64) Rotation {
	qx := AxisAngle(r3.Vec{X: 1}, rx)
	qy := AxisAngle(r3.Vec{Y: 1}, ry)
	qz := AxisAngle(r3.Vec{Z: 1}, rz)
	return qz.Mul(qy.Mul(qx))
}

// Quat returns q as a gonum quaternion.
func (q Rotation) Quat() quat.Number { return quat.Number(q) }

// Mul returns the rotation q r: r first, then q (the quaternion product).
func (q Rotation) Mul(r Rotation) Rotation { return Rotation(quat.Mul(quat.Number(q), quat.Number(r))) }

// Inverse returns q*, the rotation back (for a unit q).
func (q Rotation) Inverse() Rotation { return Rotation(quat.Conj(quat.Number(q))) }

// Rotate returns q v q* for a unit quaternion q.
func (q Rotation) Rotate(v r3.Vec) r3.Vec {
	// v + 2 w (u x v) + 2 u x (u x v), u the vector part.
	u := r3.Vec{X: q.Imag, Y: q.Jmag, Z: q.Kmag}
	t := r3.Scale(2, r3.Cross(u, v))
	return r3.Add(r3.Add(v, r3.Scale(q.Real, t)), r3.Cross(u, t))
}

// RotateInv returns q* v q, the inverse rotation of v.
func (q Rotation) RotateInv(v r3.Vec) r3.Vec { return q.Inverse().Rotate(v) }

// Normalize returns q scaled to unit length. A zero quaternion gives the
// identity rather than NaN.
func (q Rotation) Normalize() Rotation {
	n := quat.Abs(quat.Number(q))
	if n == 0 {
		return identity
	}
	return Rotation(quat.Scale(1/n, quat.Number(q)))
}

// Mat returns the 3x3 rotation matrix of a unit quaternion, row major:
// q.Rotate(v) == q.Mat().MulVec(v).
func (q Rotation) Mat() Mat3 {
	w, x, y, z := q.Real, q.Imag, q.Jmag, q.Kmag
	return Mat3{
		{1 - 2*(y*y+z*z), 2 * (x*y - w*z), 2 * (x*z + w*y)},
		{2 * (x*y + w*z), 1 - 2*(x*x+z*z), 2 * (y*z - w*x)},
		{2 * (x*z - w*y), 2 * (y*z + w*x), 1 - 2*(x*x+y*y)},
	}
}

// RotationFromMat returns the unit quaternion of a proper rotation matrix (det +1),
// by Shepperd's method (S. W. Shepperd, "Quaternion from rotation matrix",
// J. Guidance and Control 1(3), 1978), which picks the largest of the four
// squared components to stay accurate. The sign is chosen with w >= 0.
func RotationFromMat(m Mat3) Rotation {
	tr := m[0][0] + m[1][1] + m[2][2]
	var q Rotation
	switch {
	case tr >= m[0][0] && tr >= m[1][1] && tr >= m[2][2]:
		s := 2 * math.Sqrt(1+tr)
		q = Rotation{Real: s / 4, Imag: (m[2][1] - m[1][2]) / s, Jmag: (m[0][2] - m[2][0]) / s, Kmag: (m[1][0] - m[0][1]) / s}
	case m[0][0] >= m[1][1] && m[0][0] >= m[2][2]:
		s := 2 * math.Sqrt(1+m[0][0]-m[1][1]-m[2][2])
		q = Rotation{Real: (m[2][1] - m[1][2]) / s, Imag: s / 4, Jmag: (m[0][1] + m[1][0]) / s, Kmag: (m[0][2] + m[2][0]) / s}
	case m[1][1] >= m[2][2]:
		s := 2 * math.Sqrt(1-m[0][0]+m[1][1]-m[2][2])
		q = Rotation{Real: (m[0][2] - m[2][0]) / s, Imag: (m[0][1] + m[1][0]) / s, Jmag: s / 4, Kmag: (m[1][2] + m[2][1]) / s}
	default:
		s := 2 * math.Sqrt(1-m[0][0]-m[1][1]+m[2][2])
		q = Rotation{Real: (m[1][0] - m[0][1]) / s, Imag: (m[0][2] + m[2][0]) / s, Jmag: (m[1][2] + m[2][1]) / s, Kmag: s / 4}
	}
	if q.Real < 0 {
		q = Rotation{Real: -q.Real, Imag: -q.Imag, Jmag: -q.Jmag, Kmag: -q.Kmag}
	}
	return q.Normalize()
}

// RotationAngle returns the angle in radians, in [0, pi], of the rotation that
// takes unit quaternion a to unit quaternion b (the shorter way round).
func RotationAngle(a, b Rotation) float64 {
	// 2 atan2(|vec|, |w|) of a* b is better conditioned than 2 acos(d) near 0.
	r := a.Inverse().Mul(b)
	v := math.Sqrt(r.Imag*r.Imag + r.Jmag*r.Jmag + r.Kmag*r.Kmag)
	return 2 * math.Atan2(v, math.Abs(r.Real))
}
