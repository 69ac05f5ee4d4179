package physics

import (
	"math"

	"gonum.org/v1/gonum/num/quat"
	"gonum.org/v1/gonum/spatial/r3"
)

// StandardGravity is g_n = 9.80665 m/s^2 exactly (3rd CGPM, 1901).
const StandardGravity = 9.80665

// Axis names one of the prop's principal axes by its moment of inertia.
type Axis int

const (
	Least    Axis = 0 // axis of the smallest moment, I1
	Middle   Axis = 1 // axis of the middle moment, I2
	Greatest Axis = 2 // axis of the largest moment, I3
	// Free means an explicit prop-frame direction (Spin.Vector).
	Free Axis = -1
)

// String returns "least", "middle", "greatest" or "free".
func (a Axis) String() string {
	switch a {
	case Least:
		return "least"
	case Middle:
		return "middle"
	case Greatest:
		return "greatest"
	}
	return "free"
}

// ParseAxis returns the named principal axis ("least", "middle", "greatest").
func ParseAxis(s string) (Axis, bool) {
	switch s {
	case "least":
		return Least, true
	case "middle":
		return Middle, true
	case "greatest":
		return Greatest, true
	}
	return Free, false
}

// Spin is the angular velocity at release, given in the prop frame.
type Spin struct {
	Axis       Axis    // named principal axis, or Free
	Vector     r3.Vec  // prop-frame direction when Axis == Free
	Tilt       float64 // radians, toward TiltToward (named axes only)
	TiltToward Axis
	Rate       float64 // |omega| in rad/s
}

// Throw holds the launch of a prop: where its centre of mass is and how it
// moves at release (frame 0), how it is turned and spinning, and the world.
type Throw struct {
	FPS      Rate
	Gravity  float64  // m/s^2, acting along -Y
	Position r3.Vec   // centre of mass at release, world, m
	Velocity r3.Vec   // centre-of-mass velocity at release, world, m/s
	Orient   Rotation // prop frame -> world at release
	GroundY  float64  // height of the ground plane, m
	Spin     Spin
}

// DefaultThrow returns a throw at 24 fps under standard gravity from 1.5 m,
// with no velocity and no spin.
func DefaultThrow() Throw {
	return Throw{FPS: Rate{24, 1}, Gravity: StandardGravity, Position: r3.Vec{Y: 1.5}, Orient: identity,
		Spin: Spin{Axis: Greatest, TiltToward: Least}}
}

// Validate reports the first problem with the throw, naming its field as in
// the project file (under "throw.").
func (t *Throw) Validate() error {
	switch {
	case !t.FPS.Valid():
		return fieldErr("throw.fps", "must be a positive frame rate of at most 10000")
	case !finitePos(t.Gravity):
		return fieldErr("throw.gravity", "must be positive (m/s^2)")
	case !finiteVec(t.Position):
		return fieldErr("throw.release_position", "must be finite numbers")
	case !finiteVec(t.Velocity):
		return fieldErr("throw.release_velocity", "must be finite numbers")
	case !finite(t.GroundY):
		return fieldErr("throw.ground_y", "must be a finite number")
	case !finite(t.Spin.Rate) || t.Spin.Rate < 0:
		return fieldErr("throw.spin.turns_per_second", "must be zero or positive")
	case t.Spin.Rate > 2*math.Pi*1000:
		return fieldErr("throw.spin.turns_per_second", "must be at most 1000 turns per second")
	case !finite(t.Spin.Tilt) || math.Abs(t.Spin.Tilt) > math.Pi:
		return fieldErr("throw.spin.tilt_deg", "must be between -180 and 180 degrees")
	}
	if q := t.Orient; !finite(q.Real) || !finite(q.Imag) || !finite(q.Jmag) || !finite(q.Kmag) || quat.Abs(q.Quat()) == 0 {
		return fieldErr("throw.orientation_deg", "must be finite numbers")
	}
	if t.Spin.Axis == Free {
		if !finiteVec(t.Spin.Vector) || r3.Norm(t.Spin.Vector) == 0 {
			return fieldErr("throw.spin.axis", "a free axis must be a non-zero vector")
		}
	} else {
		if t.Spin.Axis < Least || t.Spin.Axis > Greatest {
			return fieldErr("throw.spin.axis", "must be least, middle, greatest or a vector")
		}
		if t.Spin.Tilt != 0 && (t.Spin.TiltToward == t.Spin.Axis || t.Spin.TiltToward < Least || t.Spin.TiltToward > Greatest) {
			return fieldErr("throw.spin.tilt_toward", "must name a principal axis other than the spin axis")
		}
	}
	return nil
}

// SpinAxis returns the unit spin direction in the prop frame: the named
// principal axis turned by Tilt toward TiltToward, or the free vector.
func (t *Throw) SpinAxis(mp *MassProps) r3.Vec {
	s := t.Spin
	if s.Axis == Free {
		return r3.Unit(s.Vector)
	}
	a := mp.Axes[s.Axis]
	if s.Tilt == 0 {
		return a
	}
	b := mp.Axes[s.TiltToward]
	sn, cs := math.Sincos(s.Tilt)
	return r3.Unit(r3.Add(r3.Scale(cs, a), r3.Scale(sn, b)))
}

// Omega returns the angular velocity at release in the prop frame, rad/s.
func (t *Throw) Omega(mp *MassProps) r3.Vec { return r3.Scale(t.Spin.Rate, t.SpinAxis(mp)) }

// VelocityFromHang returns the release velocity that brings the centre of
// mass back to its release height after hang seconds, having travelled
// distance metres horizontally along heading (radians; 0 = +x, pi/2 = -z).
// From the projectile formulas y = vy t - g t^2 / 2 and x = vx t.
func VelocityFromHang(hang, distance, heading, g float64) r3.Vec {
	vy := g * hang / 2
	vh := distance / hang
	s, c := math.Sincos(heading)
	return r3.Vec{X: vh * c, Y: vy, Z: -vh * s}
}

// CMAt returns the centre of mass at time t on its exact parabola.
func (t *Throw) CMAt(time float64) r3.Vec {
	return r3.Vec{
		X: t.Position.X + t.Velocity.X*time,
		Y: t.Position.Y + t.Velocity.Y*time - t.Gravity*time*time/2,
		Z: t.Position.Z + t.Velocity.Z*time,
	}
}

// ApexTime returns the time of the top of the centre-of-mass arc, 0 if the
// throw starts downward or level.
func (t *Throw) ApexTime() float64 { return math.Max(0, t.Velocity.Y/t.Gravity) }

// groundTime returns when the centre of mass comes down to the ground plane,
// s (0 if it starts at or below it; +Inf for no gravity).
func (t *Throw) groundTime() float64 {
	drop := t.Position.Y - t.GroundY
	if !(drop > 0) {
		return 0
	}
	vy := t.Velocity.Y
	// Larger root of y0 - ground + vy t - g t^2 / 2 = 0, in the form that
	// does not cancel for a downward throw.
	if vy >= 0 {
		return (vy + math.Sqrt(vy*vy+2*t.Gravity*drop)) / t.Gravity
	}
	return 2 * drop / (math.Sqrt(vy*vy+2*t.Gravity*drop) - vy)
}
