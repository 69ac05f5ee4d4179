package physics

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"
)

// Target is the landing a plan or a spread aims for: at the end of the
// flight the prop-frame direction Axis, turned into the world, should point
// along the world direction Dir. Neither needs unit length.
type Target struct {
	Axis r3.Vec // prop frame
	Dir  r3.Vec // world
}

// Validate reports a zero or non-finite axis or direction. The field is
// "land", the name of the command-line flag that sets both.
func (tg Target) Validate() error {
	if !finiteVec(tg.Axis) || r3.Norm(tg.Axis) == 0 {
		return fieldErr("land", "the prop axis must be a non-zero vector of finite numbers")
	}
	if !finiteVec(tg.Dir) || r3.Norm(tg.Dir) == 0 {
		return fieldErr("land", "the target direction must be a non-zero vector of finite numbers")
	}
	return nil
}

// Error returns the angle in radians, in [0, pi], between the target axis
// turned into the world by the prop orientation q (prop frame -> world) and
// the target direction.
func (tg Target) Error(q Rotation) float64 {
	a := q.Rotate(r3.Unit(tg.Axis))
	d := r3.Unit(tg.Dir)
	return math.Atan2(r3.Norm(r3.Cross(a, d)), r3.Dot(a, d))
}

// chord2 returns |a - d|^2 = 2 (1 - cos Error) for unit a (the turned axis)
// and d: smooth in the orientation even where the error is zero, so the
// minimiser sees a parabola rather than a V.
func chord2(a, d r3.Vec) float64 { return r3.Norm2(r3.Sub(a, d)) }

// chordAngle converts chord2 back to the angle, radians.
func chordAngle(c2 float64) float64 { return 2 * math.Asin(math.Min(1, math.Sqrt(c2)/2)) }

// End says when a flight ends: at the first ground contact of the prop's
// lowest point (the take's landing), or, with Catch, the instant the
// centre of mass comes down through the height CatchY (world y, m).
type End struct {
	Catch  bool
	CatchY float64
}

// catchTime returns when the centre of mass of th comes down through the
// catch height: the larger root of y0 + vy t - g t^2 / 2 = Y, in the form
// that does not cancel. The field of its errors is "catch-height".
//
// Special cases: a catch height above the top of the arc, at or below the
// ground, or reached only at release (a level or downward throw caught at
// the release height) is refused.
func (e End) catchTime(th *Throw) (float64, error) {
	y := e.CatchY
	if !finite(y) {
		return 0, fieldErr("catch-height", "must be a finite height in metres")
	}
	if y <= th.GroundY {
		return 0, fieldErr("catch-height", "must be above the ground (ground_y %.3g m)", th.GroundY)
	}
	vy, g := th.Velocity.Y, th.Gravity
	drop := th.Position.Y - y
	disc := vy*vy + 2*g*drop
	top := th.Position.Y + math.Max(0, vy)*math.Max(0, vy)/(2*g)
	if disc < 0 || (vy <= 0 && drop <= 0) {
		return 0, fieldErr("catch-height", "%.3g m is above the top of the centre of mass's arc (%.3g m)", y, top)
	}
	var t float64
	if vy >= 0 {
		t = (vy + math.Sqrt(disc)) / g
	} else {
		t = 2 * drop / (math.Sqrt(disc) - vy)
	}
	if !(t > 0) || t > MaxFlight {
		return 0, fieldErr("catch-height", "the centre of mass comes down through %.3g m after %.3g s; a flight must last between 0 and %g s", y, t, MaxFlight)
	}
	return t, nil
}

// nearTime returns the earliest time the prop can touch the ground: when
// the centre of mass comes down to reach metres above it (0 if it starts
// that low). Before then its lowest point is above the ground.
func (th *Throw) nearTime(reach float64) float64 {
	lifted := *th
	lifted.GroundY = th.GroundY + reach
	return lifted.groundTime()
}
