package wire_test

import (
	"bytes"
	"flag"
	"image"
	"image/color"
	"image/png"
	"math"
	"os"
	"path/filepath"
	"testing"

	"propflight/internal/fixture"
	"propflight/widgets/wire"
)

var update = flag.Bool("update", false, "rewrite the golden images under testdata/")

// Golden comparison tolerance: the pictures come from float64 maths that a
// different CPU or compiler may round differently (fused multiply-add), so a
// few pixels along anti-aliased edges may move by a level or two. A channel
// differing by more than goldenLevel counts the pixel as changed; at most
// goldenPixels of the pixels may change, and the mean absolute channel
// difference must stay under goldenMean levels.
const (
	goldenLevel  = 24
	goldenPixels = 0.001
	goldenMean   = 0.25
)

// checkGolden compares img with testdata/name.png, rewriting it with
// -update. On a mismatch the image and a difference picture land in
// testdata/failed/ (ignored by git).
func checkGolden(t *testing.T, name string, img *image.RGBA) {
	t.Helper()
	path := filepath.Join("testdata", name+".png")
	var buf bytes.Buffer
	if err := png.Encode(&buf, img); err != nil {
		t.Fatal(err)
	}
	if *update {
		if err := os.WriteFile(path, buf.Bytes(), 0o644); err != nil {
			t.Fatal(err)
		}
		return
	}
	f, err := os.Open(path)
	if err != nil {
		t.Fatalf("%v (run go test -update to create it)", err)
	}
	defer f.Close()
	want, err := png.Decode(f)
	if err != nil {
		t.Fatalf("%s: %v", path, err)
	}
	if want.Bounds() != img.Bounds() {
		writeFailed(t, name, buf.Bytes(), nil)
		t.Fatalf("%s: size %v, golden %v", name, img.Bounds(), want.Bounds())
	}
	b := img.Bounds()
	diff := image.NewRGBA(b)
	var changed int
	var sum float64
	for y := b.Min.Y; y < b.Max.Y; y++ {
		for x := b.Min.X; x < b.Max.X; x++ {
			g := img.RGBAAt(x, y)
			w := color.RGBAModel.Convert(want.At(x, y)).(color.RGBA)
			m := 0
			for _, d := range [4]int{int(g.R) - int(w.R), int(g.G) - int(w.G), int(g.B) - int(w.B), int(g.A) - int(w.A)} {
				if d < 0 {
					d = -d
				}
				m = max(m, d)
				sum += float64(d)
			}
			if m > goldenLevel {
				changed++
				diff.SetRGBA(x, y, color.RGBA{255, 0, 255, 255})
			} else {
				diff.SetRGBA(x, y, color.RGBA{g.R / 4, g.G / 4, g.B / 4, 255})
			}
		}
	}
	n := float64(b.Dx() * b.Dy())
	if float64(changed) > goldenPixels*n || sum/(4*n) > goldenMean {
		writeFailed(t, name, buf.Bytes(), diff)
		t.Errorf("%s: %d pixels changed (%.3f%%), mean difference %.3f levels; see testdata/failed/",
			name, changed, 100*float64(changed)/n, sum/(4*n))
	}
}

func writeFailed(t *testing.T, name string, got []byte, diff *image.RGBA) {
	t.Helper()
	dir := filepath.Join("testdata", "failed")
	if err := os.MkdirAll(dir, 0o755); err != nil {
		t.Log(err)
		return
	}
	if err := os.WriteFile(filepath.Join(dir, name+".png"), got, 0o644); err != nil {
		t.Log(err)
	}
	if diff != nil {
		var buf bytes.Buffer
		if png.Encode(&buf, diff) == nil {
			_ = os.WriteFile(filepath.Join(dir, name+"_diff.png"), buf.Bytes(), 0o644)
		}
	}
}

// TestGolden_Views draws the frying-pan throw at frame 14 (its apex) from
// the four views, framed on the whole take, and one print-palette picture.
func TestGolden_Views(t *testing.T) {
	sc := fixture.PanScene(t, 1.2, 3.2, 1.5, 14)
	for _, c := range []struct {
		name string
		view wire.View
		pal  wire.Palette
	}{
		{"pan_front", wire.Front, wire.DefaultPalette()},
		{"pan_side", wire.Side, wire.DefaultPalette()},
		{"pan_top", wire.Top, wire.DefaultPalette()},
		{"pan_free", wire.Free, wire.DefaultPalette()},
		{"pan_free_print", wire.Free, wire.PrintPalette()},
	} {
		t.Run(c.name, func(t *testing.T) {
			cam := framedCamera(c.view, 320, 200, sc)
			checkGolden(t, c.name, wire.Rasterize(wire.Draw(cam, sc), c.pal))
		})
	}
	// A close-up of the prop alone in its authored pose.
	t.Run("pan_prop", func(t *testing.T) {
		ps := wire.Scene{Prop: fixture.FryingPan(), ShowAxes: true}
		cam := framedCamera(wire.Free, 240, 160, ps)
		cam.Orbit(0, math.Pi/8)
		checkGolden(t, "pan_prop", wire.Rasterize(wire.Draw(cam, ps), wire.DefaultPalette()))
	})
}
