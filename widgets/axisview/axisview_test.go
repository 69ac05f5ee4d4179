package axisview

import (
	"image/png"
	"math"
	"math/rand/v2"
	"os"
	"path/filepath"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/internal/fixture"
	"propflight/physics"
)

func panMapper(t testing.TB) (*physics.AxisMapper, physics.MassProps) {
	mp, err := fixture.FryingPan().MassProps()
	if err != nil {
		t.Fatal(err)
	}
	return physics.NewAxisMapper(&mp, physics.DefaultThresholds()), mp
}

// TestLayout_RoundTrip: Point and Direction are inverse (Lambert's
// equal-area projection, Snyder 1987 §24), folding a direction onto the
// view's hemisphere.
func TestLayout_RoundTrip(t *testing.T) {
	l := NewLayout(640, 360, 1)
	rng := rand.New(rand.NewPCG(1, 1))
	for range 500 {
		d := r3.Unit(r3.Vec{X: rng.NormFloat64(), Y: rng.NormFloat64(), Z: rng.NormFloat64()})
		for _, v := range []View{DownGreatest, DownLeast} {
			p := l.Point(v, d)
			got, gv, ok := l.Direction(p[0], p[1])
			if !ok || gv != v {
				t.Fatalf("point %v of %v is not on view %v", p, d, v)
			}
			if c := math.Abs(r3.Dot(got, d)); c < 1-1e-12 {
				t.Errorf("view %v: %v came back as %v", v, d, got)
			}
		}
	}
	// The view centres are the greatest and least axes; the middle axis is at the top of both.
	if d, _, _ := l.Direction(l.Centre[DownGreatest][0], l.Centre[DownGreatest][1]); r3.Norm(r3.Sub(d, r3.Vec{Z: 1})) > 1e-9 {
		t.Errorf("centre of the greatest view is %v", d)
	}
	for _, v := range []View{DownGreatest, DownLeast} {
		top := l.Point(v, r3.Vec{Y: 1})
		if math.Abs(top[0]-l.Centre[v][0]) > 1e-9 || math.Abs(top[1]-(l.Centre[v][1]-l.R)) > 1e-9 {
			t.Errorf("%v: middle axis at %v, want the top of the disc", v, top)
		}
	}
	if _, _, ok := l.Direction(1, 1); ok {
		t.Error("the image corner is on a disc")
	}
}

// TestRender_EqualArea: the share of a view's disc in each colour family
// is the share of evenly spread directions with that verdict (the
// projection keeps areas, Snyder 1987 §24), to 2 % with 2000 directions
// and a 280-pixel disc.
func TestRender_EqualArea(t *testing.T) {
	m, mp := panMapper(t)
	l := NewLayout(1200, 700, 1)
	am := physics.MapDirections(&mp, physics.DefaultThresholds(), 2000)
	want := map[physics.Motion]float64{}
	for _, d := range am.Directions {
		want[d.Motion] += 1 / float64(len(am.Directions))
	}
	cells := make([]cell, l.W*l.H)
	judgeView(m, l, DownGreatest, cells)
	got := map[physics.Motion]float64{}
	n := 0.0
	for _, c := range cells {
		if c.in {
			got[c.motion]++
			n++
		}
	}
	if math.Abs(n-math.Pi*l.R*l.R) > 4*l.R {
		t.Errorf("disc holds %g pixels, want about pi R^2 = %g", n, math.Pi*l.R*l.R)
	}
	for mo, f := range want {
		if math.Abs(got[mo]/n-f) > 0.02 {
			t.Errorf("%v: %.3f of the disc, %.3f of the directions", mo, got[mo]/n, f)
		}
	}
	t.Logf("shares %v", want)
}

// TestRender_ColoursByVerdict: the pixel over each axis has the colour of
// that direction's verdict, and the marked direction gets a ring.
func TestRender_ColoursByVerdict(t *testing.T) {
	m, mp := panMapper(t)
	pal := ScreenPalette()
	img := Render(m, 640, 360, Options{Palette: pal, Scale: 1})
	l := LayoutFor(m, 640, 360, 1)
	// A point a little off each view's centre (the centre holds the axis dot).
	for _, v := range []View{DownGreatest, DownLeast} {
		c := l.Centre[v]
		x, y := c[0]+l.R*0.3, c[1]+l.R*0.05
		d, _, _ := l.Direction(x, y)
		mo, ax, exc := m.ClassPrincipal(d)
		want := pal.Colour(mo, ax, exc)
		got := img.RGBAAt(int(x), int(y))
		if absDiff(got.R, want.R) > 8 || absDiff(got.G, want.G) > 8 || absDiff(got.B, want.B) > 8 {
			t.Errorf("%v: pixel %v, want %v for %v about %v", v, got, want, mo, ax)
		}
	}
	spin := mp.Axes[2]
	marked := Render(m, 640, 360, Options{Palette: pal, Scale: 1, Spin: &spin})
	p := l.Point(DownGreatest, r3.Vec{Z: 1})
	ringPx := marked.RGBAAt(int(p[0]+7), int(p[1]))
	if ringPx.R != pal.Ring.R || ringPx.G != pal.Ring.G {
		t.Errorf("no mark ring at the greatest axis: %v", ringPx)
	}
	if out := os.Getenv("AXISVIEW_PNG"); out != "" {
		f, _ := os.Create(filepath.Clean(out))
		png.Encode(f, marked)
		f.Close()
	}
}

func absDiff(a, b uint8) int { return int(math.Abs(float64(a) - float64(b))) }

// BenchmarkRender460x260: the map at the window's panel size.
func BenchmarkRender460x260(b *testing.B) {
	m, _ := panMapper(b)
	for b.Loop() {
		Render(m, 460, 260, Options{Scale: 1})
	}
}
