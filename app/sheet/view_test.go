package sheet

import (
	"math"
	"math/rand/v2"
	"strings"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics"
)

// TestHullArea against shapes whose areas are known: the unit square with
// points inside it, and a regular n-gon of circumradius 1, area
// n sin(2 pi / n) / 2 (elementary geometry).
func TestHullArea(t *testing.T) {
	sq := [][2]float64{{0, 0}, {1, 0}, {1, 1}, {0, 1}, {0.5, 0.5}, {0.2, 0.7}, {1, 0.5}}
	if a := hullArea(sq); math.Abs(a-1) > 1e-15 {
		t.Errorf("square: %v", a)
	}
	n := 64
	var poly [][2]float64
	for i := range n {
		s, c := math.Sincos(2 * math.Pi * float64(i) / float64(n))
		poly = append(poly, [2]float64{c, s}, [2]float64{c / 2, s / 3})
	}
	if a, want := hullArea(poly), float64(n)*math.Sin(2*math.Pi/float64(n))/2; math.Abs(a-want) > 1e-12 {
		t.Errorf("%d-gon: %v, want %v", n, a, want)
	}
	if hullArea([][2]float64{{0, 0}, {1, 1}, {2, 2}}) != 0 {
		t.Error("collinear points enclose an area")
	}
}

// TestBestPoseView_PlateFaceOn: the dinner plate (a 0.12 m rim) is drawn
// from the view in which its poses are largest, and there it is nearly
// face-on: its mean hull covers at least half the disc's pi r^2 (a disc
// tilted by theta covers pi r^2 cos theta, so within 60 degrees of
// face-on), where edge-on it would cover only 2 r times its thickness.
func TestBestPoseView_PlateFaceOn(t *testing.T) {
	in := presetInput(t, "dinner-plate")
	s, err := newSheet(in, Options{})
	if err != nil {
		t.Fatal(err)
	}
	v := s.poseView
	if v == PoseBest || v == PoseFree {
		t.Fatalf("best view resolved to %v", v)
	}
	area := func(v PoseView) float64 {
		verts := make([][2]float64, 0)
		cam := poseCamera(v, 100, 100, &s.sc.Mass, s.tk)
		right, up, _ := cam.Axes()
		sum := 0.0
		for _, n := range s.poses {
			f := &s.tk.Frames[n]
			verts = verts[:0]
			for _, p := range plateRim(0.132) { // rim radius plus its tube
				q := f.Orient.Rotate(p)
				verts = append(verts, [2]float64{r3.Dot(q, right), r3.Dot(q, up)})
			}
			sum += hullArea(verts)
		}
		return sum / float64(len(s.poses))
	}
	disc := math.Pi * 0.132 * 0.132
	if a := area(v); a < disc/2 {
		t.Errorf("%v view: the plate covers %.4f m^2 on average, under half its face %.4f", v, a, disc)
	}
	for _, o := range []PoseView{PoseFront, PoseSide, PoseTop, PoseSpin} {
		if area(o) > area(v)*1.05 {
			t.Errorf("%v shows the plate larger (%.4f) than the chosen %v (%.4f)", o, area(o), v, area(v))
		}
	}
	pdf := pdfFile(t, render(t, in, Options{}))
	text := squash(pageText(t, pdf, 2, false))
	if !strings.Contains(text, viewWords(v)+" (chosen: it shows the poses largest)") {
		t.Errorf("the pose page does not name the view it chose (%v):\n%s", v, text)
	}
}

// plateRim returns points round the plate's outer rim in the prop frame
// (the plate's axis is prop z).
func plateRim(r float64) []r3.Vec {
	var out []r3.Vec
	for i := range 48 {
		s, c := math.Sincos(2 * math.Pi * float64(i) / 48)
		out = append(out, r3.Vec{X: r * c, Y: r * s})
	}
	return out
}

// TestEulerXYZ_RoundTrip: rotation_deg as the file writes it comes back
// from the part's orientation (physics.EulerXYZ), for |y| < 90.
func TestEulerXYZ_RoundTrip(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	for range 200 {
		x, y, z := 360*rng.Float64()-180, 178*rng.Float64()-89, 360*rng.Float64()-180
		gx, gy, gz := eulerXYZ(physics.EulerXYZ(x*math.Pi/180, y*math.Pi/180, z*math.Pi/180))
		if math.Abs(gx-x) > 1e-9 || math.Abs(gy-y) > 1e-9 || math.Abs(gz-z) > 1e-9 {
			t.Fatalf("(%g, %g, %g) came back (%g, %g, %g)", x, y, z, gx, gy, gz)
		}
	}
	if got := rotationText(physics.EulerXYZ(math.Pi/2, 0, 0)); got != "(90.0, 0.0, 0.0)°" {
		t.Errorf("rotationText = %q", got)
	}
	if got := rotationText(physics.IdentityRotation()); got != "none" {
		t.Errorf("no turn: %q", got)
	}
}

func TestParsePoseView(t *testing.T) {
	for i, n := range PoseViewNames {
		if v, err := ParsePoseView(strings.ToUpper(n)); err != nil || v != PoseView(i) || v.String() != n {
			t.Errorf("%s: %v %v", n, v, err)
		}
	}
	if _, err := ParsePoseView("under"); err == nil {
		t.Error("no error for an unknown view")
	}
}

// BenchmarkBestPoseView: the cost the best view adds to a sheet (the
// dinner plate's 25 poses, four views).
func BenchmarkBestPoseView(b *testing.B) {
	in := presetInput(b, "dinner-plate")
	s, err := newSheet(in, Options{PoseView: PoseFront})
	if err != nil {
		b.Fatal(err)
	}
	for b.Loop() {
		BestPoseView(&s.sc.Prop, &s.sc.Mass, s.tk, s.poses)
	}
}
