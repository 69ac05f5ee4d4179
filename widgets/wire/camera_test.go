package wire_test

import (
	"fmt"
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/widgets/wire"
)

// pixTol is the tolerance for pixel positions computed two ways in float64.
const pixTol = 1e-9

// cubeCamera is the camera of the hand calculations below: 600 x 400
// pixels, looking at the origin from 4 m, with tan(FovY/2) = 1/2.
func cubeCamera(v wire.View, ortho bool) wire.Camera {
	c := wire.NewCamera(v, 600, 400)
	c.Ortho = ortho
	c.Target = r3.Vec{}
	c.Distance = 4
	c.FovY = 2 * math.Atan(0.5)
	return c
}

func checkPixel(t *testing.T, c wire.Camera, p r3.Vec, wx, wy float64) {
	t.Helper()
	x, y, ok := c.Project(p)
	if !ok || math.Abs(x-wx) > pixTol || math.Abs(y-wy) > pixTol {
		t.Errorf("%v ortho=%v: Project(%v) = (%.9g, %.9g, %v), want (%.9g, %.9g)", c.View, c.Ortho, p, x, y, ok, wx, wy)
	}
}

// TestCamera_Front_UnitCubeProjectsToSquare checks the unit cube centred on
// the origin against pixel corners worked out by hand.
//
// Perspective, eye at (0, 0, 4), tan(FovY/2) = 1/2, aspect 600/400 = 1.5:
// the projection has f = 1/tan(FovY/2) = 2, so a point at eye depth d has
// ndc x = (f/aspect) x / d = (4/3) x / d and ndc y = 2 y / d. Pixels:
// x = 600 (ndc x + 1) / 2 = 300 + 400 x / d, and window y = 400 (ndc y + 1) / 2
// = 200 + 400 y / d, which the flip to a top-left origin makes
// y = 400 - window y = 200 - 400 y / d. The front face (z = +1/2) is at
// d = 3.5: half its edge is 400 * 0.5 / 3.5 = 57.142857... pixels; the back
// face (z = -1/2) at d = 4.5: 400 * 0.5 / 4.5 = 44.444... pixels.
//
// Orthographic: the half height is Distance tan(FovY/2) = 2 m and the half
// width 3 m, so x = 300 + 300 x / 3 = 300 + 100 x and y = 200 - 200 y / 2 =
// 200 - 100 y: both faces are the square x in [250, 350], y in [150, 250].
func TestCamera_Front_UnitCubeProjectsToSquare(t *testing.T) {
	for _, s := range [2]float64{-0.5, 0.5} {
		for _, u := range [2]float64{-0.5, 0.5} {
			for _, z := range [2]float64{-0.5, 0.5} {
				p := r3.Vec{X: s, Y: u, Z: z}
				half := 400 * 0.5 / (4 - z) // 57.142857 (front) or 44.444 (back)
				checkPixel(t, cubeCamera(wire.Front, false), p, 300+math.Copysign(half, s), 200-math.Copysign(half, u))
				checkPixel(t, cubeCamera(wire.Front, true), p, 300+100*s, 200-100*u)
			}
		}
	}
	// The two numbers of the comment, spelled out.
	checkPixel(t, cubeCamera(wire.Front, false), r3.Vec{X: -0.5, Y: 0.5, Z: 0.5}, 300-57.142857142857146, 200-57.142857142857146)
	checkPixel(t, cubeCamera(wire.Front, false), r3.Vec{X: 0.5, Y: -0.5, Z: -0.5}, 300+44.44444444444444, 200+44.44444444444444)
}

// TestCamera_SideAndTop_Handedness: Side looks from +X, so -Z is to the
// right; Top looks down from +Y with -Z up the screen and +X to the right.
// Pixels as in the orthographic arithmetic above (100 px per metre).
func TestCamera_SideAndTop_Handedness(t *testing.T) {
	side := cubeCamera(wire.Side, true)
	checkPixel(t, side, r3.Vec{Z: -0.5}, 350, 200)
	checkPixel(t, side, r3.Vec{Y: 0.5}, 300, 150)
	checkPixel(t, side, r3.Vec{X: 0.5}, 300, 200) // toward the camera: no move
	top := cubeCamera(wire.Top, true)
	checkPixel(t, top, r3.Vec{X: 0.5, Z: -0.5}, 350, 150)
	checkPixel(t, top, r3.Vec{Y: 0.7}, 300, 200)
	// Perspective side view: the face x = +1/2 is 3.5 m from the eye.
	checkPixel(t, cubeCamera(wire.Side, false), r3.Vec{X: 0.5, Y: 0.5, Z: 0.5}, 300-400*0.5/3.5, 200-400*0.5/3.5)
}

// TestCamera_Axes_RightHanded: right x up = back for every view.
func TestCamera_Axes_RightHanded(t *testing.T) {
	for _, v := range []wire.View{wire.Front, wire.Side, wire.Top, wire.Free} {
		c := wire.NewCamera(v, 100, 100)
		r, u, b := c.Axes()
		if d := r3.Norm(r3.Sub(r3.Cross(r, u), b)); d > 1e-12 {
			t.Errorf("%v: right x up - back = %g", v, d)
		}
	}
}

// TestLens_Ray_ThroughProjectedPoint: the ray under a projected point
// passes through the point (the inverse path goes through mgl64.UnProject
// and the Y flip the other way).
func TestLens_Ray_ThroughProjectedPoint(t *testing.T) {
	rng := rand.New(rand.NewPCG(3, 3))
	for _, v := range []wire.View{wire.Front, wire.Side, wire.Top, wire.Free} {
		for _, ortho := range []bool{false, true} {
			c := wire.NewCamera(v, 800, 500)
			c.Ortho = ortho
			c.Distance = 3
			l := c.Lens()
			for range 100 {
				p := r3.Vec{X: rng.NormFloat64() * 0.5, Y: 1 + rng.NormFloat64()*0.5, Z: rng.NormFloat64() * 0.5}
				x, y, ok := l.Project(p)
				if !ok {
					continue
				}
				o, d, ok := l.Ray(x, y)
				if !ok {
					t.Fatalf("%v: no ray at (%g, %g)", v, x, y)
				}
				q := r3.Sub(p, o)
				miss := r3.Norm(r3.Sub(q, r3.Scale(r3.Dot(q, d), d)))
				if miss > 1e-6 || r3.Dot(q, d) < 0 {
					t.Fatalf("%v ortho=%v: ray misses %v by %g m", v, ortho, p, miss)
				}
			}
		}
	}
}

// TestLens_Segment_ClipsAtNearPlane: a segment running from in front of a
// perspective eye to behind it ends where it crosses the near plane.
func TestLens_Segment_ClipsAtNearPlane(t *testing.T) {
	c := cubeCamera(wire.Front, false) // eye at z = 4
	l := c.Lens()
	pa, pb, ok := l.Segment(r3.Vec{X: 1, Y: 1}, r3.Vec{X: 1, Y: 1, Z: 8})
	if !ok {
		t.Fatal("segment dropped")
	}
	// Start: d = 4, x = 300 + 400/4 = 400, y = 200 - 100 = 100.
	// Cut: z = 4 - NearPlane, d = NearPlane, x = 300 + 400/0.01, y = 200 - 400/0.01.
	want := [2][2]float64{{400, 100}, {300 + 400/wire.NearPlane, 200 - 400/wire.NearPlane}}
	for i, got := range [2][2]float64{pa, pb} {
		if math.Abs(got[0]-want[i][0]) > 1e-6 || math.Abs(got[1]-want[i][1]) > 1e-6 {
			t.Errorf("end %d = %v, want %v", i, got, want[i])
		}
	}
	// Reversed, the cut end comes first.
	pa, _, _ = l.Segment(r3.Vec{X: 1, Y: 1, Z: 8}, r3.Vec{X: 1, Y: 1})
	if math.Abs(pa[0]-want[1][0]) > 1e-6 {
		t.Errorf("reversed: first end %v, want %v", pa, want[1])
	}
	if _, _, ok := l.Segment(r3.Vec{Z: 5}, r3.Vec{X: 1, Z: 6}); ok {
		t.Error("a segment wholly behind the eye was kept")
	}
	if _, _, ok := c.Project(r3.Vec{Z: 4.5}); ok {
		t.Error("a point behind the eye projected")
	}
	// Orthographic cameras clip nothing.
	lo := cubeCamera(wire.Front, true).Lens()
	if _, _, ok := lo.Segment(r3.Vec{Z: 5}, r3.Vec{X: 1, Z: 6}); !ok {
		t.Error("orthographic camera dropped a segment behind its eye")
	}
}

// TestCamera_Orbit: a quarter turn of yaw from Front looks like Side; pitch
// is clamped.
func TestCamera_Orbit(t *testing.T) {
	rng := rand.New(rand.NewPCG(4, 4))
	f := wire.NewCamera(wire.Front, 300, 200)
	f.Orbit(math.Pi/2, 0)
	if f.View != wire.Free || !f.Ortho {
		t.Fatalf("after Orbit: view %v ortho %v, want free and still orthographic", f.View, f.Ortho)
	}
	s := wire.NewCamera(wire.Side, 300, 200)
	for range 50 {
		p := r3.Vec{X: rng.NormFloat64(), Y: rng.NormFloat64(), Z: rng.NormFloat64()}
		x1, y1, _ := f.Project(p)
		x2, y2, _ := s.Project(p)
		if math.Abs(x1-x2) > 1e-9 || math.Abs(y1-y2) > 1e-9 {
			t.Fatalf("front + quarter yaw: %v -> (%g, %g), side -> (%g, %g)", p, x1, y1, x2, y2)
		}
	}
	f.Orbit(0, 10)
	if f.Pitch != wire.MaxPitch {
		t.Errorf("pitch %g, want clamp at %g", f.Pitch, wire.MaxPitch)
	}
	f.Orbit(math.NaN(), math.Inf(1))
	if f.Pitch != wire.MaxPitch || math.IsNaN(f.Yaw) {
		t.Errorf("NaN/Inf orbit changed the camera: yaw %g pitch %g", f.Yaw, f.Pitch)
	}
}

// TestCamera_Zoom_Clamps covers the factor and its limits.
func TestCamera_Zoom_Clamps(t *testing.T) {
	c := wire.NewCamera(wire.Free, 10, 10)
	c.Distance = 4
	c.Zoom(0.5)
	if c.Distance != 2 {
		t.Errorf("Zoom(0.5) from 4 m: %g", c.Distance)
	}
	for _, bad := range []float64{0, -1, math.NaN(), math.Inf(1)} {
		c.Zoom(bad)
		if c.Distance != 2 {
			t.Errorf("Zoom(%g) changed the distance to %g", bad, c.Distance)
		}
	}
	c.Zoom(1e-9)
	if c.Distance != wire.MinDistance {
		t.Errorf("zoomed in to %g, want %g", c.Distance, wire.MinDistance)
	}
	c.Zoom(1e12)
	if c.Distance != wire.MaxDistance {
		t.Errorf("zoomed out to %g, want %g", c.Distance, wire.MaxDistance)
	}
}

// TestCamera_Frame_FitsBox: after Frame every corner of the box projects
// inside the image, FrameMargin of the half size from the edges, and some
// corner touches that margin (the fit is tight).
func TestCamera_Frame_FitsBox(t *testing.T) {
	rng := rand.New(rand.NewPCG(5, 5))
	for _, v := range []wire.View{wire.Front, wire.Side, wire.Top, wire.Free} {
		for _, ortho := range []bool{false, true} {
			for range 20 {
				c := wire.NewCamera(v, 640, 400)
				c.Ortho = ortho
				lo := r3.Vec{X: rng.NormFloat64(), Y: rng.NormFloat64(), Z: rng.NormFloat64()}
				b := r3.Box{Min: lo, Max: r3.Add(lo, r3.Vec{X: 0.1 + 4*rng.Float64(), Y: 0.1 + 2*rng.Float64(), Z: 0.1 + 4*rng.Float64()})}
				c.Frame(b)
				l := c.Lens()
				worst := 0.0 // largest |offset| / half size over corners and axes
				for i := range 8 {
					p := b.Min
					if i&1 != 0 {
						p.X = b.Max.X
					}
					if i&2 != 0 {
						p.Y = b.Max.Y
					}
					if i&4 != 0 {
						p.Z = b.Max.Z
					}
					x, y, ok := l.Project(p)
					if !ok {
						t.Fatalf("%v ortho=%v: corner %v behind the eye", v, ortho, p)
					}
					worst = math.Max(worst, math.Max(math.Abs(x-320)/320, math.Abs(y-200)/200))
				}
				if worst > 1-wire.FrameMargin+1e-9 || worst < 1-wire.FrameMargin-1e-6 {
					t.Errorf("%v ortho=%v: corners reach %.6f of the half view, want %.6f", v, ortho, worst, 1-wire.FrameMargin)
				}
			}
		}
	}
}

// ExampleCamera_Project shows a front, orthographic camera: 100 px per
// metre here, y down from the top-left corner.
func ExampleCamera_Project() {
	c := wire.NewCamera(wire.Front, 600, 400)
	c.Target = r3.Vec{}
	c.Distance = 4
	c.FovY = 2 * math.Atan(0.5) // half height 4 * 0.5 = 2 m
	x, y, ok := c.Project(r3.Vec{X: 0.5, Y: 0.5})
	fmt.Printf("%.1f %.1f %v\n", x, y, ok)
	// Output: 350.0 150.0 true
}
