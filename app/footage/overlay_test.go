package footage

import (
	"image"
	"image/color"
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/internal/mark"
	"propflight/physics"
	"propflight/widgets/wire"
)

// TestOverlayCamera_Mapping projects world points through the camera (the
// mgl64 matrices of package wire) and checks them against the mapping
// OverlayCamera promises, px = ox + (X - RX) / s, py = oy - (Y - RY) / s,
// evaluated directly: the slow, obvious oracle. Z must not matter. The
// scales reach from 10 micrometres to 10 metres a pixel, beyond what the
// default field of view can show within the camera's distance limits, so
// the field-of-view adjustment is exercised at both ends.
func TestOverlayCamera_Mapping(t *testing.T) {
	for _, c := range []struct {
		scale  float64
		origin [2]float64
		rel    r3.Vec
		w, h   int
	}{
		{0.002, [2]float64{100, 300}, r3.Vec{X: -1.6, Y: 1.4, Z: 0.3}, 640, 360},
		{0.0051, [2]float64{-40.5, 1000.25}, r3.Vec{X: 12, Y: -3, Z: -7}, 1920, 1080},
		{1e-5, [2]float64{50, 50}, r3.Vec{Y: 1}, 100, 100},        // half height 0.5 mm: distance at its minimum
		{10, [2]float64{0, 0}, r3.Vec{X: 5e3, Y: 2e3}, 1000, 500}, // half height 2.5 km: distance at its maximum
		{0.003, [2]float64{320, 180}, r3.Vec{}, 1, 1},
	} {
		cam := OverlayCamera(c.scale, c.origin, c.rel, c.w, c.h)
		if cam.View != wire.Front || !cam.Ortho || cam.Width != c.w || cam.Height != c.h {
			t.Errorf("camera %+v is not an orthographic front camera of %dx%d", cam, c.w, c.h)
		}
		lens := cam.Lens()
		for _, d := range []r3.Vec{{}, {X: 1}, {Y: 1}, {X: -0.37, Y: 2.5, Z: 40}, {X: 1e3 * c.scale, Y: -250 * c.scale, Z: -3}} {
			p := r3.Add(c.rel, d)
			x, y, ok := lens.Project(p)
			wx := c.origin[0] + (p.X-c.rel.X)/c.scale
			wy := c.origin[1] - (p.Y-c.rel.Y)/c.scale
			// Round-off: matrices of magnitude ~1/s and world coordinates
			// of ~|rel| leave about 1e-12 |rel| / s pixels.
			tol := 1e-9 * math.Max(1, r3.Norm(c.rel)/c.scale)
			if !ok || math.Abs(x-wx) > tol || math.Abs(y-wy) > tol {
				t.Errorf("scale %g: %v projects to (%.9g, %.9g), want (%.9g, %.9g) within %g", c.scale, p, x, y, wx, wy, tol)
			}
		}
	}
	// A bad scale does not give NaN pixels.
	for _, s := range []float64{0, -1, math.NaN(), math.Inf(1)} {
		cam := OverlayCamera(s, [2]float64{10, 10}, r3.Vec{}, 64, 48)
		if x, y, ok := cam.Project(r3.Vec{X: 1}); !ok || math.IsNaN(x) || math.IsNaN(y) {
			t.Errorf("scale %g: %g %g %v", s, x, y, ok)
		}
	}
}

// partOnly is a palette that draws only the prop, white on black: a
// coverage mask.
func partOnly() wire.Palette {
	var p wire.Palette
	p.Background = color.NRGBA{0, 0, 0, 255}
	p.Styles[wire.Part] = wire.Style{Color: color.NRGBA{255, 255, 255, 255}, Width: 1.6}
	return p
}

// clickRound puts a coordinate on the centre of the pixel it falls in, as
// a click on that pixel gives: an error of up to half a pixel, uniform.
func clickRound(v float64) float64 { return math.Floor(v) + 0.5 }

// TestRenderOverlay_LinesUpWithFootage is the whole overlay path on footage
// made by the wire renderer from a known throw at a known scale
// (synth_test.go): six frames are marked at the pixel of the drawn centre
// of mass, Fit gives the scale from gravity and the origin from the fitted
// centre at release, and RenderOverlay at that scale and origin must lie
// on the drawn prop.
//
// Tolerances: each mark is off by up to half a pixel (a click on a pixel
// centre), so the fitted origin and positions are off by a fraction of a
// pixel and the scale by a few parts in a thousand; across the flight (a
// few hundred pixels) that stays under 1.5 pixels, the tolerance used for
// the centre of mass and the ends of the prop's lines. The pixel coverage
// checks allow a one-pixel neighbourhood for the same reason.
func TestRenderOverlay_LinesUpWithFootage(t *testing.T) {
	const tolPx = 1.5
	sf := newSynth(t)
	frames := sf.take.Frames
	lens := sf.cam.Lens()
	var marks []mark.Mark
	for _, k := range []int{0, 4, 8, 12, 16, 20} {
		if k >= len(frames) {
			t.Fatalf("the take has only %d frames", len(frames))
		}
		x, y, _ := lens.Project(frames[k].CM)
		marks = append(marks, mark.Mark{Frame: k, X: clickRound(x), Y: clickRound(y)})
	}
	r, err := Fit(marks, FitOptions{FPS: sf.throw.FPS.FPS(), Gravity: sf.throw.Gravity})
	if err != nil {
		t.Fatal(err)
	}
	if rel := math.Abs(r.MetresPerPixel-sf.scale) / sf.scale; rel > 0.01 {
		t.Errorf("fitted scale %g m/px, true %g (%.2g%% off)", r.MetresPerPixel, sf.scale, 100*rel)
	}
	ox, oy := r.CentreAt(0)
	cam := OverlayCamera(r.MetresPerPixel, [2]float64{ox, oy}, frames[0].CM, synthW, synthH)
	olens := cam.Lens()
	in := OverlayInput{Prop: &sf.prop, Mass: &sf.mp, Take: sf.take}

	for k := range frames {
		// The centre of mass.
		tx, ty, _ := lens.Project(frames[k].CM)
		gx, gy, _ := olens.Project(frames[k].CM)
		if d := math.Hypot(gx-tx, gy-ty); d > tolPx {
			t.Errorf("frame %d: overlay centre (%.2f, %.2f), footage (%.2f, %.2f): %.2f px apart", k, gx, gy, tx, ty, d)
		}
		// The prop's wire: the same scene drawn by both cameras gives the
		// same segments in the same order, so their ends must match.
		sc := wire.Scene{Prop: &sf.prop, Mass: &sf.mp, Take: sf.take, Frame: k}
		fd, od := wire.Draw(sf.cam, sc), wire.Draw(cam, sc)
		if len(fd.Segments) != len(od.Segments) || len(fd.Segments) == 0 {
			t.Fatalf("frame %d: %d footage segments, %d overlay segments", k, len(fd.Segments), len(od.Segments))
		}
		worst := 0.0
		for i, a := range fd.Segments {
			b := od.Segments[i]
			worst = math.Max(worst, math.Max(math.Hypot(a.A[0]-b.A[0], a.A[1]-b.A[1]), math.Hypot(a.B[0]-b.B[0], a.B[1]-b.B[1])))
		}
		if worst > tolPx {
			t.Errorf("frame %d: the overlay's prop lines are up to %.2f px from the footage's", k, worst)
		}
		// The pixels: the footage's prop pixels lie under the overlay,
		// and the prop drawn by the overlay camera lies on the footage's.
		foot := wire.Rasterize(fd, partOnly())
		mask := wire.Rasterize(od, partOnly())
		ov := RenderOverlay(in, cam, k)
		a1 := coverage(foot, func(x, y int) bool { return anyAlpha(ov, x, y, 1, 64) })
		a2 := coverage(mask, func(x, y int) bool { return anyRed(foot, x, y, 1, 64) })
		if a1 < 0.97 || a2 < 0.97 {
			t.Errorf("frame %d: %.1f%% of the footage's prop pixels are under the overlay, %.1f%% the other way (within 1 px); want 97%%", k, 100*a1, 100*a2)
		}
		if k == 10 {
			t.Logf("frame %d: centre %.2f px apart, lines up to %.2f px; coverage %.3f and %.3f", k, math.Hypot(gx-tx, gy-ty), worst, a1, a2)
		}
	}
}

// coverage returns the fraction of the drawn pixels of a white-on-black
// mask (red over 128) for which ok holds.
func coverage(mask *image.RGBA, ok func(x, y int) bool) float64 {
	n, hit := 0, 0
	b := mask.Bounds()
	for y := b.Min.Y; y < b.Max.Y; y++ {
		for x := b.Min.X; x < b.Max.X; x++ {
			if mask.RGBAAt(x, y).R <= 128 {
				continue
			}
			n++
			if ok(x, y) {
				hit++
			}
		}
	}
	if n == 0 {
		return 0
	}
	return float64(hit) / float64(n)
}

// anyRed reports whether a pixel within r of (x, y) has red above a.
func anyRed(img *image.RGBA, x, y, r int, a uint8) bool {
	for j := y - r; j <= y+r; j++ {
		for i := x - r; i <= x+r; i++ {
			if image.Pt(i, j).In(img.Rect) && img.RGBAAt(i, j).R > a {
				return true
			}
		}
	}
	return false
}

// anyAlpha reports whether a pixel within r of (x, y) has alpha above a.
func anyAlpha(img *image.RGBA, x, y, r int, a uint8) bool {
	for j := y - r; j <= y+r; j++ {
		for i := x - r; i <= x+r; i++ {
			if image.Pt(i, j).In(img.Rect) && img.RGBAAt(i, j).A > a {
				return true
			}
		}
	}
	return false
}

// TestRenderOverlay_Transparent checks the overlay's background and its
// centre cross, and that frames outside the take give an empty image.
func TestRenderOverlay_Transparent(t *testing.T) {
	sf := newSynth(t)
	lens := sf.cam.Lens()
	x0, y0, _ := lens.Project(sf.take.Frames[0].CM)
	cam := OverlayCamera(sf.scale, [2]float64{x0, y0}, sf.take.Frames[0].CM, synthW, synthH)
	in := OverlayInput{Prop: &sf.prop, Mass: &sf.mp, Take: sf.take}
	k := 6
	img := RenderOverlay(in, cam, k)
	if img.Rect != image.Rect(0, 0, synthW, synthH) {
		t.Fatalf("overlay is %v", img.Rect)
	}
	if c := img.RGBAAt(2, 2); c != (color.RGBA{}) {
		t.Errorf("corner %v, want fully transparent", c)
	}
	opaque := 0
	for i := 3; i < len(img.Pix); i += 4 {
		if img.Pix[i] > 0 {
			opaque++
		}
	}
	if opaque == 0 || opaque > synthW*synthH/5 {
		t.Errorf("%d of %d pixels drawn", opaque, synthW*synthH)
	}
	// The centre cross sits on the projected centre of mass: a white arm
	// pixel next to it (the cross's half size is wire.CentreHalf = 5 px).
	cx, cy, _ := cam.Project(sf.take.Frames[k].CM)
	if c := img.RGBAAt(int(cx)+3, int(cy)); c.A < 200 || c.R < 200 || c.G < 200 || c.B < 200 {
		t.Errorf("centre cross at (%.1f, %.1f): pixel %v, want white", cx, cy, c)
	}
	for _, f := range []int{-1, len(sf.take.Frames)} {
		img := RenderOverlay(in, cam, f)
		for i := 3; i < len(img.Pix); i += 4 {
			if img.Pix[i] != 0 {
				t.Fatalf("frame %d outside the take: pixel drawn", f)
			}
		}
	}
	if img := RenderOverlay(OverlayInput{}, cam, 0); img.Rect.Dx() != synthW {
		t.Errorf("empty input: %v", img.Rect)
	}
}

// TestOverlayPalette_Widths: lines thicken on large frames only.
func TestOverlayPalette_Widths(t *testing.T) {
	small, big := OverlayPalette(640, 360), OverlayPalette(1920, 1080)
	if small.Styles[wire.Part].Width != 1.6 || big.Styles[wire.Part].Width != 3.2 {
		t.Errorf("part widths %g, %g; want 1.6 and 3.2", small.Styles[wire.Part].Width, big.Styles[wire.Part].Width)
	}
	for _, k := range []wire.Kind{wire.Grid, wire.Ground, wire.Tick, wire.Drop, wire.Onion, wire.OnionAhead, wire.AxisLeast} {
		if small.Styles[k].Width != 0 {
			t.Errorf("%v is drawn", k)
		}
	}
	if small.Background.A != 0 {
		t.Error("background is not transparent")
	}
}

// TestFit_CentreAndVelocityAt evaluates the REFERENCES.md §6 parabola
// (y = 400 - 30 n + 4.256358507 n^2, x = 100 + 5 n; see fit_test.go) at
// frames other than the first mark, and ThrowAt against ToThrow.
func TestFit_CentreAndVelocityAt(t *testing.T) {
	const c2 = 4.256358507
	r, err := Fit(ref6Marks(false), FitOptions{FPS: 24, Gravity: physics.StandardGravity})
	if err != nil {
		t.Fatal(err)
	}
	for _, n := range []float64{0, 2, 5.5, -3, 20} {
		x, y := r.CentreAt(n)
		checkClose(t, "x", x, 100+5*n, 1e-9)
		checkClose(t, "y", y, 400-30*n+c2*n*n, 1e-9)
		vx, vy := r.VelocityAt(n)
		checkClose(t, "vx", vx, 5, 1e-9)
		checkClose(t, "vy", vy, 30-2*c2*n, 1e-9) // y up: -(dy/dn)
	}
	a, err := r.ToThrow(r.MetresPerPixel)
	if err != nil {
		t.Fatal(err)
	}
	b, err := r.ThrowAt(0, r.MetresPerPixel)
	if err != nil || a != b {
		t.Errorf("ThrowAt(0) = %+v, %v; ToThrow %+v", b, err, a)
	}
	c, err := r.ThrowAt(2, r.MetresPerPixel)
	if err != nil {
		t.Fatal(err)
	}
	// At frame 2 the centre rises at 30 - 4 c2 px/frame; with 0.002 m/px
	// and 24 fps that is (30 - 4 c2) 0.048 m/s, and the hang time is twice
	// the frames from 2 to the apex, 30 / (2 c2).
	checkClose(t, "vy at frame 2", c.Velocity[1], (30-4*c2)*0.002*24, 1e-9)
	checkClose(t, "hang from frame 2", c.HangTime, 2*(30/(2*c2)-2)/24, 1e-9)
	if r.FirstFrame != 0 {
		t.Error("ThrowAt changed the fit")
	}
}

func checkClose(t *testing.T, name string, got, want, tol float64) {
	t.Helper()
	if math.Abs(got-want) > tol*math.Max(1, math.Abs(want)) {
		t.Errorf("%s = %.12g, want %.12g", name, got, want)
	}
}
