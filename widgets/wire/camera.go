package wire

import (
	"math"

	"github.com/go-gl/mathgl/mgl64"
	"gonum.org/v1/gonum/spatial/r3"
)

// This file is the package's one meeting point with mgl64: the r3 <-> mgl64
// conversions, the radians of the field of view and orbit angles, and the
// flip from mgl64's window coordinates (origin bottom left, y up) to image
// pixels (origin top left, y down) all live here and nowhere else.

// View names where a camera looks from.
type View int

const (
	// Front: the camera is on +Z looking toward -Z, +Y up, +X to the right
	// (glTF's front faces +Z).
	Front View = iota
	// Side: the camera is on +X looking toward -X, +Y up, -Z to the right.
	Side
	// Top: the camera is above on +Y looking down, +X to the right and -Z
	// up on the screen.
	Top
	// Free: the camera orbits the target at Camera.Yaw and Camera.Pitch.
	Free
)

// String returns "front", "side", "top" or "free".
func (v View) String() string {
	switch v {
	case Front:
		return "front"
	case Side:
		return "side"
	case Top:
		return "top"
	case Free:
		return "free"
	}
	return "view?"
}

// Camera limits and defaults. Lengths are in metres, angles in radians.
const (
	DefaultFovY = 40 * math.Pi / 180 // vertical field of view, radians
	MinDistance = 0.05               // closest the camera comes to its target, m
	MaxDistance = 2000.0             // farthest, m
	// MaxPitch is how far a free camera may rise above or sink below the
	// target's horizon, radians (just short of straight down so that +Y
	// stays a usable up vector).
	MaxPitch = math.Pi/2 - 1e-3
	// NearPlane is the distance in front of a perspective camera's eye, m,
	// at which segments are clipped. Orthographic cameras clip nothing.
	NearPlane = 0.01
	// FrameMargin is the fraction of the half view that Camera.Frame leaves
	// empty on each side of the framed box.
	FrameMargin = 0.08
	farPlane    = 1e5 // only shapes the matrices: no depth buffer is used
)

// Camera looks at a world point from one of the four views. It is a value:
// copy it freely. World coordinates are metres, right-handed, +Y up.
//
// The camera's eye is Distance metres from Target along the view's
// direction. With Ortho set the projection is parallel (true arcs and true
// spacing, what an animator measures against) and shows a half height of
// Distance * tan(FovY/2) metres, exactly what the perspective projection
// shows in the plane through the target, so zooming and switching
// projection keep the framing. NewCamera makes Front, Side and Top
// orthographic and Free perspective.
type Camera struct {
	View     View
	Ortho    bool
	Target   r3.Vec  // world point the camera looks at, m
	Distance float64 // eye to target, m
	Yaw      float64 // Free only: turn about world +Y, radians; 0 looks from +Z, pi/2 from +X
	Pitch    float64 // Free only: elevation above the horizon, radians, |Pitch| <= MaxPitch
	FovY     float64 // vertical field of view, radians
	Width    int     // image width, pixels
	Height   int     // image height, pixels
}

// NewCamera returns a camera for the view and image size in pixels, looking
// at (0, 1, 0) from 5 m. Front, Side and Top are orthographic; Free is a
// perspective three-quarter view (yaw 30 degrees, pitch 20 degrees).
func NewCamera(view View, width, height int) Camera {
	c := Camera{View: view, Ortho: view != Free, Target: r3.Vec{Y: 1}, Distance: 5,
		FovY: DefaultFovY, Width: width, Height: height}
	if view == Free {
		c.Yaw, c.Pitch = math.Pi/6, math.Pi/9
	}
	return c
}

// size returns the image size with anything under one pixel raised to one.
func (c *Camera) size() (w, h int) { return max(c.Width, 1), max(c.Height, 1) }

// angles returns the yaw and pitch that the view looks from: the fixed views
// map to the free angles that look the same way.
func (c *Camera) angles() (yaw, pitch float64) {
	switch c.View {
	case Front:
		return 0, 0
	case Side:
		return math.Pi / 2, 0
	case Top:
		return 0, MaxPitch
	}
	return c.Yaw, math.Max(-MaxPitch, math.Min(MaxPitch, c.Pitch))
}

// Axes returns the camera's unit axes in world coordinates: right and up on
// the screen, and back, from the target toward the eye.
func (c *Camera) Axes() (right, up, back r3.Vec) {
	var upHint r3.Vec
	switch c.View {
	case Top:
		back, upHint = r3.Vec{Y: 1}, r3.Vec{Z: -1}
	default:
		yaw, pitch := c.angles()
		sy, cy := math.Sincos(yaw)
		sp, cp := math.Sincos(pitch)
		back, upHint = r3.Vec{X: cp * sy, Y: sp, Z: cp * cy}, r3.Vec{Y: 1}
	}
	right = r3.Unit(r3.Cross(upHint, back))
	up = r3.Cross(back, right)
	return right, up, back
}

// Eye returns the world position of the camera's eye, m.
func (c *Camera) Eye() r3.Vec {
	_, _, back := c.Axes()
	return r3.Add(c.Target, r3.Scale(c.distance(), back))
}

func (c *Camera) distance() float64 {
	if !(c.Distance >= MinDistance) { // also catches NaN
		return MinDistance
	}
	return math.Min(c.Distance, MaxDistance)
}

func (c *Camera) fovY() float64 {
	if !(c.FovY > 1e-3 && c.FovY < math.Pi-1e-3) {
		return DefaultFovY
	}
	return c.FovY
}

// HalfHeight returns half the height of the view in metres in the plane
// through the target: the orthographic extent.
func (c *Camera) HalfHeight() float64 { return c.distance() * math.Tan(c.fovY()/2) }

// Orbit turns the camera about its target: dYaw about world +Y (right-hand
// rule, so a positive dYaw swings the eye from +Z toward +X) and dPitch up,
// both in radians. A fixed view becomes Free, starting from the angles it
// looks from, and keeps its projection. Pitch is clamped to +-MaxPitch.
func (c *Camera) Orbit(dYaw, dPitch float64) {
	yaw, pitch := c.angles()
	c.View = Free
	if finite(dYaw) {
		yaw = math.Remainder(yaw+dYaw, 2*math.Pi)
	}
	if finite(dPitch) {
		pitch += dPitch
	}
	c.Yaw, c.Pitch = yaw, math.Max(-MaxPitch, math.Min(MaxPitch, pitch))
}

// Zoom multiplies the distance to the target by factor (below 1 moves in),
// clamped to [MinDistance, MaxDistance]. A factor that is not a positive
// finite number changes nothing. For a scroll wheel, 1.1^-steps suits.
func (c *Camera) Zoom(factor float64) {
	if !(factor > 0) || math.IsInf(factor, 1) {
		return
	}
	c.Distance = math.Max(MinDistance, math.Min(MaxDistance, c.distance()*factor))
}

// Frame aims the camera at the centre of the world box b and sets the
// distance so that the whole box fits the image with FrameMargin left free
// on every side. Orthographic: the box's extent across the screen sets the
// half height. Perspective: every corner of the box is brought inside the
// view frustum (and in front of the near plane), which is exact for the
// box rather than for a bounding sphere. An empty or inverted box frames
// its centre at MinDistance.
func (c *Camera) Frame(b r3.Box) {
	c.Target = r3.Scale(0.5, r3.Add(b.Min, b.Max))
	right, up, back := c.Axes()
	w, h := c.size()
	aspect := float64(w) / float64(h)
	ty := math.Tan(c.fovY()/2) * (1 - FrameMargin)
	tx := ty * aspect
	var d float64
	for i := range 8 {
		p := r3.Vec{X: b.Min.X, Y: b.Min.Y, Z: b.Min.Z}
		if i&1 != 0 {
			p.X = b.Max.X
		}
		if i&2 != 0 {
			p.Y = b.Max.Y
		}
		if i&4 != 0 {
			p.Z = b.Max.Z
		}
		q := r3.Sub(p, c.Target)
		x, y, z := math.Abs(r3.Dot(q, right)), math.Abs(r3.Dot(q, up)), r3.Dot(q, back)
		if c.Ortho {
			d = math.Max(d, math.Max(y/ty, x/tx))
			continue
		}
		// The corner is at depth d - z in front of the eye and must satisfy
		// x <= (d - z) tx, y <= (d - z) ty and d - z >= 2 NearPlane.
		d = math.Max(d, math.Max(x/tx, y/ty)+z)
		d = math.Max(d, z+2*NearPlane)
	}
	if !finite(d) {
		d = MinDistance
	}
	c.Distance = math.Max(MinDistance, math.Min(MaxDistance, d))
}

// Lens returns the camera's matrices computed once, for projecting many
// points.
func (c Camera) Lens() Lens {
	w, h := c.size()
	_, up, _ := c.Axes()
	view := mgl64.LookAtV(toMgl(c.Eye()), toMgl(c.Target), toMgl(up))
	aspect := float64(w) / float64(h)
	var proj mgl64.Mat4
	if c.Ortho {
		hh := c.HalfHeight()
		hw := hh * aspect
		proj = mgl64.Ortho(-hw, hw, -hh, hh, -farPlane, farPlane)
	} else {
		proj = mgl64.Perspective(c.fovY(), aspect, NearPlane, farPlane) // fovy in radians
	}
	return Lens{view: view, proj: proj, w: w, h: h, ortho: c.Ortho}
}

// Project returns the image pixel coordinates of a world point: origin at
// the image's top-left corner, x right, y down, pixel (i, j) covering
// [i, i+1) x [j, j+1). ok is false for a point that a perspective camera
// cannot see (at or behind the near plane). It builds a Lens each call: use
// Camera.Lens to project many points.
func (c Camera) Project(world r3.Vec) (x, y float64, ok bool) {
	l := c.Lens()
	return l.Project(world)
}

// Lens is a camera's view and projection matrices, ready to project world
// points to image pixels. Build it with Camera.Lens.
type Lens struct {
	view, proj mgl64.Mat4
	w, h       int
	ortho      bool
}

// Size returns the image size in pixels.
func (l *Lens) Size() (w, h int) { return l.w, l.h }

// Project is Camera.Project with the matrices already built.
func (l *Lens) Project(world r3.Vec) (x, y float64, ok bool) {
	e := l.view.Mul4x1(toMgl(world).Vec4(1))
	if !l.ortho && -e[2] < NearPlane {
		return 0, 0, false
	}
	x, y = l.pixel(e)
	return x, y, true
}

// Segment projects the world segment a-b to image pixels, cut at the near
// plane of a perspective camera; ok is false when nothing of it is in front
// of the near plane.
func (l *Lens) Segment(a, b r3.Vec) (pa, pb [2]float64, ok bool) {
	ea := l.view.Mul4x1(toMgl(a).Vec4(1))
	eb := l.view.Mul4x1(toMgl(b).Vec4(1))
	if !l.ortho {
		// Eye space looks down -Z: depth is -z.
		da, db := -ea[2], -eb[2]
		switch {
		case da < NearPlane && db < NearPlane:
			return pa, pb, false
		case da < NearPlane:
			ea = ea.Add(eb.Sub(ea).Mul((NearPlane - da) / (db - da)))
		case db < NearPlane:
			eb = eb.Add(ea.Sub(eb).Mul((NearPlane - db) / (da - db)))
		}
	}
	pa[0], pa[1] = l.pixel(ea)
	pb[0], pb[1] = l.pixel(eb)
	return pa, pb, true
}

// pixel maps eye coordinates to image pixels. It is mgl64.Project's
// arithmetic (window x = w (ndc.x + 1) / 2, window y = h (ndc.y + 1) / 2,
// origin bottom left) followed by the flip to an image's top-left origin.
func (l *Lens) pixel(e mgl64.Vec4) (x, y float64) {
	c := l.proj.Mul4x1(e)
	c = c.Mul(1 / c[3])
	wx := float64(l.w) * (c[0] + 1) / 2
	wy := float64(l.h) * (c[1] + 1) / 2
	return wx, flipY(wy, l.h)
}

// Ray returns the world ray under image pixel coordinates (x, y): a point on
// the near plane (perspective) or on the plane through the eye (orthographic)
// and a unit direction into the scene. ok is false if the matrices cannot be
// inverted (mgl64's Inv returns a zero matrix then).
func (l *Lens) Ray(x, y float64) (origin, dir r3.Vec, ok bool) {
	wy := flipY(y, l.h)
	z0 := 0.0 // window depth of the near plane (perspective)
	if l.ortho {
		z0 = 0.5 // window depth of the eye plane: ortho near is -farPlane
	}
	a, err1 := mgl64.UnProject(mgl64.Vec3{x, wy, z0}, l.view, l.proj, 0, 0, l.w, l.h)
	b, err2 := mgl64.UnProject(mgl64.Vec3{x, wy, 1}, l.view, l.proj, 0, 0, l.w, l.h)
	if err1 != nil || err2 != nil {
		return r3.Vec{}, r3.Vec{}, false
	}
	o, f := fromMgl(a), fromMgl(b)
	d := r3.Sub(f, o)
	n := r3.Norm(d)
	if !(n > 0) || !finite(n) {
		return r3.Vec{}, r3.Vec{}, false
	}
	return o, r3.Scale(1/n, d), true
}

// toMgl converts a gonum vector to mgl64's.
func toMgl(v r3.Vec) mgl64.Vec3 { return mgl64.Vec3{v.X, v.Y, v.Z} }

// fromMgl converts an mgl64 vector to gonum's.
func fromMgl(v mgl64.Vec3) r3.Vec { return r3.Vec{X: v[0], Y: v[1], Z: v[2]} }

// flipY converts between mgl64 window y (origin at the bottom edge, y up)
// and image y (origin at the top edge, y down) for an image h pixels high.
// It is its own inverse.
func flipY(y float64, h int) float64 { return float64(h) - y }

func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }
