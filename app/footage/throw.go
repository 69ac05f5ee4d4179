package footage

import (
	"math"
)

// ThrowSettings are a fit turned into throw settings in SI units, for the
// window to apply to the project. The footage's image plane is taken as
// the throw's vertical plane: image x to the right is the direction of
// Heading, image y up is world +Y.
type ThrowSettings struct {
	FPS            float64 // frame rate used, frames per second
	MetresPerPixel float64 // scale used, m/px

	// Velocity is the centre's release velocity in the image plane, m/s:
	// [horizontal to the right on the screen, up].
	Velocity [2]float64
	Speed    float64 // |Velocity|, m/s
	// AngleDeg is the release direction above the horizontal, degrees,
	// measured from the side the prop moves toward (negative: thrown
	// downward); in [-90, 90].
	AngleDeg float64
	// Leftward says the prop moves to the left of the screen (then a
	// front view of the throw has heading 180 degrees).
	Leftward bool

	// HasSpin says whether the fit had a turn; then TurnsPerSecond is
	// |TurnDegPerFrame| fps / 360 and CounterClockwise its sense on the
	// screen.
	HasSpin          bool
	TurnsPerSecond   float64
	CounterClockwise bool

	// HasHang says whether the prop rises after release, so that it comes
	// back to its release height: HangTime = 2 (ApexFrame - n0) / fps
	// seconds after the first marked frame n0, and Distance the horizontal
	// travel in that time, m.
	HasHang  bool
	HangTime float64
	Distance float64
}

// ToThrow converts the fit into throw settings at the scale metresPerPixel
// (m/px; FitResult.MetresPerPixel when gravity was known, or a scale the
// user measured) and the fit's frame rate FitResult.FPS. The release is the
// first marked frame. Errors name the missing or bad value.
func (r *FitResult) ToThrow(metresPerPixel float64) (ThrowSettings, error) {
	if !(metresPerPixel > 0) || math.IsInf(metresPerPixel, 1) {
		return ThrowSettings{}, &Error{Field: "metres_per_pixel", Msg: "the scale is unknown: give the gravity or a measured metres per pixel"}
	}
	f := r.FPS
	if !(f > 0) || math.IsInf(f, 1) {
		return ThrowSettings{}, &Error{Field: "fps", Msg: "the frame rate is unknown"}
	}
	s := metresPerPixel
	vx := r.ReleaseVelocityPxPerFrame[0] * s * f
	vy := r.ReleaseVelocityPxPerFrame[1] * s * f
	t := ThrowSettings{FPS: f, MetresPerPixel: s, Velocity: [2]float64{vx, vy}, Speed: math.Hypot(vx, vy),
		AngleDeg: math.Atan2(vy, math.Abs(vx)) * 180 / math.Pi, Leftward: vx < 0}
	if r.HasTurn {
		t.HasSpin = true
		t.TurnsPerSecond = math.Abs(r.TurnDegPerFrame) * f / 360
		t.CounterClockwise = r.TurnDegPerFrame > 0
	}
	if frames := 2 * (r.ApexFrame - float64(r.FirstFrame)); frames > 0 {
		t.HasHang = true
		t.HangTime = frames / f
		t.Distance = math.Abs(vx) * t.HangTime
	}
	return t, nil
}
