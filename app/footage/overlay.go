package footage

import (
	"image"
	"image/color"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics"
	"propflight/widgets/wire"
)

// OverlayCamera returns the camera that draws the world onto footage of
// w x h pixels at the given scale: an orthographic wire.Front camera (it
// looks along -Z; world +X is to the right of the image and +Y up) whose
// pixel mapping is
//
//	px = originPx[0] + (X - release.X) / scale
//	py = originPx[1] - (Y - release.Y) / scale
//
// for a world point (X, Y, Z), with scale in metres per pixel and originPx
// the image pixel (origin top left, y down) where the centre of mass at
// release appears in the footage; release is that centre of mass in the
// world, m (the take's frame 0). Z does not move a point on the image.
//
// An orthographic view of half height hh metres maps y by h / (2 hh)
// pixels a metre (see wire.Camera), so hh = scale h / 2; the target sits
// where the image centre falls, release + ((w/2 - ox) scale, (oy - h/2)
// scale, 0). The distance is what wire.DefaultFovY needs for that half
// height, kept within [wire.MinDistance, wire.MaxDistance], and the field
// of view is then set to give hh exactly: the mapping holds for any half
// height from about 3e-5 m to 3e6 m. A scale that is not a positive
// finite number is taken as 1 m/px, and a size under 1 pixel as 1.
func OverlayCamera(scale float64, originPx [2]float64, release r3.Vec, w, h int) wire.Camera {
	if !(scale > 0) || math.IsInf(scale, 1) {
		scale = 1
	}
	w, h = max(w, 1), max(h, 1)
	cam := wire.NewCamera(wire.Front, w, h)
	hh := scale * float64(h) / 2
	d := hh / math.Tan(wire.DefaultFovY/2)
	d = math.Max(wire.MinDistance, math.Min(wire.MaxDistance, d))
	cam.Distance = d
	cam.FovY = 2 * math.Atan(hh/d)
	cam.Target = r3.Vec{
		X: release.X + (float64(w)/2-originPx[0])*scale,
		Y: release.Y + (originPx[1]-float64(h)/2)*scale,
		Z: release.Z,
	}
	return cam
}

// OverlayInput is the take to lay over the footage: the prop, its mass
// properties (nil: computed from the prop) and the take.
type OverlayInput struct {
	Prop *physics.Prop
	Mass *physics.MassProps
	Take *physics.Take
}

// OverlayPalette returns the colours of the overlay, Propflight's own: a
// fully transparent background, the prop in a bright cyan that shows on
// most footage, the centre-of-mass arc in magenta and the centre cross in
// white; grid, ground, ticks, plumb line, onion skin and axes are hidden.
// Line widths grow with the image, by max(1, min(w, h) / 540) (2 on a
// 1920 x 1080 frame), so that the lines stay visible when the frame is
// shown smaller than its pixel size.
func OverlayPalette(w, h int) wire.Palette {
	k := math.Max(1, float64(min(w, h))/540)
	var p wire.Palette
	p.Background = color.NRGBA{}
	s := &p.Styles
	s[wire.Arc] = wire.Style{Color: color.NRGBA{255, 84, 200, 255}, Width: 1.2 * k}
	s[wire.Part] = wire.Style{Color: color.NRGBA{72, 232, 255, 255}, Width: 1.6 * k}
	s[wire.Centre] = wire.Style{Color: color.NRGBA{255, 255, 255, 255}, Width: 1.4 * k}
	s[wire.Note] = wire.Style{Color: color.NRGBA{255, 120, 96, 255}}
	return p
}

// RenderOverlay draws the prop at take frame frame for cam (normally an
// OverlayCamera), with its centre-of-mass arc and centre cross, in
// OverlayPalette on a fully transparent background: an image of the
// camera's size to lay over the footage frame. A frame outside the take
// (before release or after landing) gives a fully transparent image.
func RenderOverlay(in OverlayInput, cam wire.Camera, frame int) *image.RGBA {
	w, h := max(cam.Width, 1), max(cam.Height, 1)
	if in.Take == nil || frame < 0 || frame >= len(in.Take.Frames) || in.Prop == nil {
		return image.NewRGBA(image.Rect(0, 0, w, h))
	}
	sc := wire.Scene{Prop: in.Prop, Mass: in.Mass, Take: in.Take, Frame: frame, ShowArc: true}
	return wire.Rasterize(wire.Draw(cam, sc), OverlayPalette(w, h))
}

// CentreAt returns the fitted centre at footage frame n, image pixels
// (y down): x = d0 + d1 n, y = c0 + c1 n + c2 n^2. n may be fractional
// and outside the marked frames.
func (r *FitResult) CentreAt(n float64) (x, y float64) {
	return r.X[0] + r.X[1]*n, r.Y[0] + (r.Y[1]+r.Y[2]*n)*n
}

// VelocityAt returns the fitted centre's velocity at footage frame n,
// px/frame with y UP: vx = d1, vy = -(c1 + 2 c2 n).
func (r *FitResult) VelocityAt(n float64) (vx, vy float64) {
	return r.X[1], -(r.Y[1] + 2*r.Y[2]*n)
}

// ThrowAt is ToThrow with the release at footage frame n instead of the
// first marked frame: the velocity is VelocityAt(n) and the hang time is
// counted from n. Use it when the footage frame of the release (the
// project's footage offset) is known and is not the first mark.
func (r *FitResult) ThrowAt(n int, metresPerPixel float64) (ThrowSettings, error) {
	rc := *r
	vx, vy := r.VelocityAt(float64(n))
	rc.ReleaseVelocityPxPerFrame = [2]float64{vx, vy}
	rc.FirstFrame = n
	return rc.ToThrow(metresPerPixel)
}
