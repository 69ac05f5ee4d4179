package footage

import (
	"bytes"
	"fmt"
	"image"
	"math"
	"math/rand/v2"
	"path/filepath"
	"testing"

	"gonum.org/v1/gonum/mat"
	"gonum.org/v1/gonum/spatial/r3"

	"propflight/internal/mark"
	"propflight/physics"
	"propflight/widgets/wire"
)

// synthFootage is a throw simulated by the physics package and filmed by
// an orthographic Front camera of the wire renderer.
type synthFootage struct {
	prop  physics.Prop
	mp    physics.MassProps
	throw physics.Throw
	take  *physics.Take
	cam   wire.Camera
	scale float64 // true metres per pixel of the camera
	lever r3.Vec  // prop-frame offset from the centre of mass of the marked second point, m
}

// Image size of the synthetic footage, pixels.
const synthW, synthH = 480, 360

// newSynth flies a cutting board (a 0.36 x 0.24 x 0.02 m box, 1.2 kg,
// from our kitchen demo) spun at 2 turns per second about its greatest
// axis, which lies along world +Z: the board turns counter-clockwise in
// the image plane of a camera looking from +Z.
func newSynth(t testing.TB) *synthFootage {
	t.Helper()
	sf := &synthFootage{lever: r3.Vec{X: 0.16}}
	sf.prop = physics.Prop{Parts: []physics.Part{{Name: "board", Shape: physics.Box, Size: r3.Vec{X: 0.36, Y: 0.24, Z: 0.02},
		Mass: 1.2, Orient: physics.IdentityRotation()}}}
	mp, err := sf.prop.MassProps()
	if err != nil {
		t.Fatal(err)
	}
	sf.mp = mp
	th := physics.DefaultThrow()
	th.Position = r3.Vec{Y: 1.2}
	th.Velocity = r3.Vec{X: 2, Y: 3}
	th.Spin = physics.Spin{Axis: physics.Greatest, TiltToward: physics.Least, Rate: 2 * 2 * math.Pi}
	sf.throw = th
	if a := mp.Axes[physics.Greatest]; math.Abs(a.Z-1) > 1e-12 {
		t.Fatalf("greatest axis %v, expected +Z for a flat box", a)
	}
	sf.take, err = physics.Simulate(&sf.prop, &sf.mp, &sf.throw)
	if err != nil {
		t.Fatal(err)
	}
	sc := sf.scene(0)
	sf.cam = wire.NewCamera(wire.Front, synthW, synthH)
	sf.cam.Frame(wire.Bounds(sc))
	// The true scale of the orthographic view: it shows 2 HalfHeight
	// metres over the image height.
	sf.scale = 2 * sf.cam.HalfHeight() / synthH
	return sf
}

func (sf *synthFootage) scene(k int) wire.Scene {
	return wire.Scene{Prop: &sf.prop, Mass: &sf.mp, Take: sf.take, Frame: k, ShowArc: true}
}

// marks projects the centre of mass and the lever point of every frame.
func (sf *synthFootage) marks() []mark.Mark {
	lens := sf.cam.Lens()
	var m []mark.Mark
	for _, fr := range sf.take.Frames {
		x, y, _ := lens.Project(fr.CM)
		x2, y2, _ := lens.Project(r3.Add(fr.CM, fr.Orient.Rotate(sf.lever)))
		m = append(m, mark.Mark{Frame: fr.N, X: x, Y: y, HasSecond: true, X2: x2, Y2: y2})
	}
	return m
}

// TestSynth_Projection checks the scale we expect against Camera.Project
// itself: one metre along world X and along world Y must cover 1/scale
// pixels, with image y down.
func TestSynth_Projection(t *testing.T) {
	sf := newSynth(t)
	c := sf.cam.Target
	x0, y0, _ := sf.cam.Project(c)
	x1, y1, _ := sf.cam.Project(r3.Add(c, r3.Vec{X: 1}))
	x2, y2, _ := sf.cam.Project(r3.Add(c, r3.Vec{Y: 1}))
	checkRel(t, "px per metre along x", x1-x0, 1/sf.scale, closeTol)
	checkRel(t, "px per metre along y (down)", y0-y2, 1/sf.scale, closeTol)
	if math.Abs(y1-y0) > 1e-9 || math.Abs(x2-x0) > 1e-9 {
		t.Errorf("the axes are not square to the image: (%g, %g) (%g, %g)", x1-x0, y1-y0, x2-x0, y2-y0)
	}
	if len(sf.take.Frames) < 15 {
		t.Fatalf("only %d frames", len(sf.take.Frames))
	}
}

// truth returns what the fit should find, from the throw and the scale:
// c2 = g / (2 s f^2) (REFERENCES.md §6), release velocity v / (s f) in
// px/frame with y up, turn omega / f in degrees a frame, counter-clockwise
// for a spin about world +Z seen from +Z.
func (sf *synthFootage) truth() (scale, vx, vy, turn float64) {
	f := sf.throw.FPS.FPS()
	return sf.scale, sf.throw.Velocity.X / (sf.scale * f), sf.throw.Velocity.Y / (sf.scale * f),
		sf.throw.Spin.Rate * 180 / math.Pi / f
}

// TestSynth_FitExact fits the exact projected marks: the centre of mass
// rides its exact parabola and the projection is affine, so the fit is
// exact up to round-off (1e-9), and the torque-free spin about a
// principal axis is steady, integrated to about 1e-6 (REFERENCES.md's
// tolerance for integrator-based checks).
func TestSynth_FitExact(t *testing.T) {
	sf := newSynth(t)
	r, err := Fit(sf.marks(), FitOptions{FPS: sf.throw.FPS.FPS(), Gravity: sf.throw.Gravity})
	if err != nil {
		t.Fatal(err)
	}
	scale, vx, vy, turn := sf.truth()
	checkRel(t, "scale", r.MetresPerPixel, scale, closeTol)
	checkRel(t, "vx", r.ReleaseVelocityPxPerFrame[0], vx, closeTol)
	checkRel(t, "vy", r.ReleaseVelocityPxPerFrame[1], vy, closeTol)
	checkRel(t, "apex", r.ApexFrame, sf.throw.ApexTime()*sf.throw.FPS.FPS(), closeTol)
	checkRel(t, "turn", r.TurnDegPerFrame, turn, 1e-6)
	if r.Hint != HintSteady {
		t.Errorf("hint %q, want steady", r.Hint)
	}
	th, err := r.ToThrow(r.MetresPerPixel)
	if err != nil {
		t.Fatal(err)
	}
	checkRel(t, "speed", th.Speed, r3.Norm(sf.throw.Velocity), closeTol)
	checkRel(t, "turns/s", th.TurnsPerSecond, 2, 1e-6)
	checkRel(t, "hang", th.HangTime, 2*sf.throw.Velocity.Y/sf.throw.Gravity, closeTol)
}

// TestSynth_FitNoisy adds seeded Gaussian noise of sigma = 0.5 px to every
// coordinate of every mark and checks the fit within 4 standard errors.
// The standard errors are those of linear least squares with independent
// noise, sigma^2 (A^T A)^-1 (Press et al., Numerical Recipes 3rd ed.,
// §15.4, the covariance of the fitted parameters), computed here for the
// actual design; the angle noise of a lever of L pixels with both ends
// noisy is sqrt(2) sigma / L radians across the lever. A 4-sigma band is
// missed by chance 6 times in 100000 per quantity, and the seed is fixed,
// so the test is deterministic; a wrong formula or sign misses by far more.
func TestSynth_FitNoisy(t *testing.T) {
	const sigma = 0.5
	sf := newSynth(t)
	marks := sf.marks()
	rng := rand.New(rand.NewPCG(1, 1))
	for i := range marks {
		m := &marks[i]
		m.X += sigma * rng.NormFloat64()
		m.Y += sigma * rng.NormFloat64()
		m.X2 += sigma * rng.NormFloat64()
		m.Y2 += sigma * rng.NormFloat64()
	}
	r, err := Fit(marks, FitOptions{FPS: sf.throw.FPS.FPS(), Gravity: sf.throw.Gravity})
	if err != nil {
		t.Fatal(err)
	}
	scale, vx, vy, turn := sf.truth()

	// Covariances of the raw-frame fits, rows [1, n, n^2] and [1, n].
	cov := func(deg int) *mat.Dense {
		A := mat.NewDense(len(marks), deg+1, nil)
		for i, m := range marks {
			for j := 0; j <= deg; j++ {
				A.Set(i, j, math.Pow(float64(m.Frame), float64(j)))
			}
		}
		var ata, inv mat.Dense
		ata.Mul(A.T(), A)
		if err := inv.Inverse(&ata); err != nil {
			t.Fatal(err)
		}
		return &inv
	}
	c2, c1 := cov(2), cov(1)
	c2true := sf.throw.Gravity / (2 * scale * math.Pow(sf.throw.FPS.FPS(), 2))
	seC2 := sigma * math.Sqrt(c2.At(2, 2))
	seVY := sigma * math.Sqrt(c2.At(1, 1)) // vy at frame 0 is -c1
	seVX := sigma * math.Sqrt(c1.At(1, 1))
	lever := r3.Norm(sf.lever) / scale
	seTurn := math.Sqrt2 * sigma / lever * 180 / math.Pi * math.Sqrt(c1.At(1, 1))

	within := func(name string, got, want, se float64) {
		t.Helper()
		if math.Abs(got-want) > 4*se {
			t.Errorf("%s = %.6g, want %.6g within 4 standard errors (4 x %.3g)", name, got, want, se)
		}
		t.Logf("%s: %.6g vs %.6g, off by %.2f standard errors", name, got, want, (got-want)/se)
	}
	within("c2 (px/frame^2)", r.Y[2], c2true, seC2)
	// The scale is g / (2 c2 f^2): to first order its relative error is
	// that of c2.
	within("scale (m/px)", r.MetresPerPixel, scale, scale*seC2/c2true)
	within("vx (px/frame)", r.ReleaseVelocityPxPerFrame[0], vx, seVX)
	within("vy (px/frame)", r.ReleaseVelocityPxPerFrame[1], vy, seVY)
	within("turn (deg/frame)", r.TurnDegPerFrame, turn, seTurn)
	// The centre residual: each mark is off by sigma in x and in y, so the
	// 2D RMS is near sqrt(2) sigma less what the five fitted parameters
	// absorb; it must be well within a factor of 1.5 either way.
	if want := math.Sqrt2 * sigma; !(r.RMSPx > want/1.5 && r.RMSPx < want*1.5) {
		t.Errorf("rms %g px, want about %g", r.RMSPx, want)
	}
	if r.Hint != HintSteady {
		t.Errorf("hint %q (rms %.3g deg, turn %.3g deg/frame), want steady", r.Hint, r.TurnRMSDeg, r.TurnDegPerFrame)
	}
}

// TestSynth_Footage draws the take with the wire renderer, writes the
// frames as PNGs with unpadded numbers, loads them back with Open and
// checks the count, size, order and pixels.
func TestSynth_Footage(t *testing.T) {
	sf := newSynth(t)
	dir := t.TempDir()
	pal := wire.DefaultPalette()
	var frames []*image.RGBA
	for k := range sf.take.Frames {
		img := wire.Rasterize(wire.Draw(sf.cam, sf.scene(k)), pal)
		frames = append(frames, img)
		writePNG(t, filepath.Join(dir, fmt.Sprintf("board_%d.png", k)), img)
	}
	s, err := Open(dir, Options{FPS: sf.throw.FPS})
	if err != nil {
		t.Fatal(err)
	}
	if s.Len() != len(frames) {
		t.Fatalf("Len = %d, want %d", s.Len(), len(frames))
	}
	if w, h := s.Size(); w != synthW || h != synthH {
		t.Errorf("Size = %dx%d, want %dx%d", w, h, synthW, synthH)
	}
	marks := sf.marks()
	if err := CheckBounds(marks, synthW, synthH); err != nil {
		t.Errorf("the framed take's marks leave the image: %v", err)
	}
	bg := pal.Background
	for k := range frames {
		img, err := s.Frame(k)
		if err != nil {
			t.Fatal(err)
		}
		rgba, ok := img.(*image.RGBA)
		if !ok || !bytes.Equal(rgba.Pix, frames[k].Pix) {
			t.Fatalf("frame %d (%s) differs from the image drawn for take frame %d", k, s.Name(k), k)
		}
		// The centre cross is drawn at the projected centre of mass, the
		// mark: the renderer and our projection agree.
		c := rgba.RGBAAt(int(marks[k].X), int(marks[k].Y))
		if c.R == bg.R && c.G == bg.G && c.B == bg.B {
			t.Errorf("frame %d: background at the marked centre (%.1f, %.1f)", k, marks[k].X, marks[k].Y)
		}
	}
	if s.Name(10) != "board_10.png" {
		t.Errorf("Name(10) = %q", s.Name(10))
	}
}
