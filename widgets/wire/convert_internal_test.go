package wire

import (
	"math"
	"math/rand/v2"
	"testing"

	"github.com/go-gl/mathgl/mgl64"
	"gonum.org/v1/gonum/spatial/r3"
)

// TestConvert_R3Mgl64_RoundTrip: the two vector types carry the same three
// numbers in the same order, so a round trip is exact.
func TestConvert_R3Mgl64_RoundTrip(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	for range 1000 {
		v := r3.Vec{X: rng.NormFloat64() * 10, Y: rng.NormFloat64(), Z: -rng.Float64()}
		m := toMgl(v)
		if m[0] != v.X || m[1] != v.Y || m[2] != v.Z {
			t.Fatalf("toMgl(%v) = %v: components moved", v, m)
		}
		if got := fromMgl(m); got != v {
			t.Fatalf("fromMgl(toMgl(%v)) = %v", v, got)
		}
		g := mgl64.Vec3{v.Z, v.X, v.Y}
		if got := toMgl(fromMgl(g)); got != g {
			t.Fatalf("toMgl(fromMgl(%v)) = %v", g, got)
		}
	}
}

// TestFlipY: window y (origin bottom) and image y (origin top) of an image
// h pixels high add up to h; the flip is its own inverse.
func TestFlipY(t *testing.T) {
	for _, c := range []struct {
		y    float64
		h    int
		want float64
	}{
		{0, 400, 400}, // the bottom edge in window terms is the image's last row edge
		{400, 400, 0}, // the top edge
		{150.25, 400, 249.75},
		{0.5, 1, 0.5},
	} {
		if got := flipY(c.y, c.h); got != c.want {
			t.Errorf("flipY(%g, %d) = %g, want %g", c.y, c.h, got, c.want)
		}
		if got := flipY(flipY(c.y, c.h), c.h); got != c.y {
			t.Errorf("flipY twice of %g = %g", c.y, got)
		}
	}
}

// TestLens_Pixel_MatchesMgl64Project: Lens.Project does mgl64.Project's
// arithmetic with the matrices multiplied once; the two agree once mgl64's
// bottom-left window y is flipped.
func TestLens_Pixel_MatchesMgl64Project(t *testing.T) {
	rng := rand.New(rand.NewPCG(2, 2))
	for _, v := range []View{Front, Side, Top, Free} {
		for _, ortho := range []bool{false, true} {
			c := NewCamera(v, 640, 360)
			c.Ortho = ortho
			c.Target = r3.Vec{X: 0.3, Y: 1.1, Z: -0.2}
			c.Distance = 6
			l := c.Lens()
			for range 200 {
				p := r3.Vec{X: rng.NormFloat64(), Y: 1 + rng.NormFloat64(), Z: rng.NormFloat64()}
				x, y, ok := l.Project(p)
				if !ok {
					continue
				}
				win := mgl64.Project(toMgl(p), l.view, l.proj, 0, 0, 640, 360)
				if math.Abs(x-win[0]) > 1e-9 || math.Abs(y-flipY(win[1], 360)) > 1e-9 {
					t.Fatalf("%v ortho=%v: Project(%v) = (%g, %g), mgl64.Project gives (%g, %g) before the flip",
						v, ortho, p, x, y, win[0], win[1])
				}
			}
		}
	}
}
