package export

import (
	"errors"
	"fmt"
	"image"
	"image/png"
	"math"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics"
	"propflight/widgets/wire"
)

// pngTestInput is a rolling pin (demo data from our kitchen scene, never a
// check value) thrown end over end about its greatest axis.
func pngTestInput(t testing.TB) Input {
	t.Helper()
	prop := physics.Prop{Parts: []physics.Part{
		{Name: "barrel", Shape: physics.Cylinder, Radius: 0.03, Length: 0.3, Density: 700, Orient: physics.IdentityRotation()},
		{Name: "left handle", Shape: physics.Cylinder, Radius: 0.012, Length: 0.09, Density: 700, Position: r3.Vec{Z: -0.195}, Orient: physics.IdentityRotation()},
		{Name: "right handle", Shape: physics.Cylinder, Radius: 0.012, Length: 0.09, Density: 700, Position: r3.Vec{Z: 0.195}, Orient: physics.IdentityRotation()},
	}}
	mp, err := prop.MassProps()
	if err != nil {
		t.Fatal(err)
	}
	th := physics.DefaultThrow()
	th.Position = r3.Vec{Y: 1.3}
	th.Velocity = r3.Vec{X: 1.5, Y: 3}
	th.Spin = physics.Spin{Axis: physics.Greatest, TiltToward: physics.Least, Rate: 2 * math.Pi * 2}
	take, err := physics.Simulate(&prop, &mp, &th)
	if err != nil {
		t.Fatal(err)
	}
	return Input{Name: "rolling pin", Prop: &prop, Mass: &mp, Throw: &th, Take: take}
}

func readPNG(t *testing.T, path string) image.Image {
	t.Helper()
	f, err := os.Open(path)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	img, err := png.Decode(f)
	if err != nil {
		t.Fatalf("%s: %v", path, err)
	}
	return img
}

func TestWritePNGSequence_OnesNamesAndSizes(t *testing.T) {
	in := pngTestInput(t)
	dir := filepath.Join(t.TempDir(), "new", "folder") // created by the call
	var calls [][2]int
	paths, err := WritePNGSequence(dir, in, PNGOptions{Width: 160, Height: 90, View: wire.Front, Onion: 2},
		func(done, total int) { calls = append(calls, [2]int{done, total}) })
	if err != nil {
		t.Fatal(err)
	}
	n := len(in.Take.Frames)
	if len(paths) != n {
		t.Fatalf("%d files for %d frames", len(paths), n)
	}
	for i, p := range paths {
		want := filepath.Join(dir, fmt.Sprintf("rolling_pin_%04d.png", i))
		if p != want {
			t.Errorf("file %d: %s, want %s", i, p, want)
		}
		b := readPNG(t, p).Bounds()
		if b.Dx() != 160 || b.Dy() != 90 {
			t.Errorf("%s: %dx%d, want 160x90", p, b.Dx(), b.Dy())
		}
		if calls[i] != [2]int{i + 1, n} {
			t.Errorf("progress call %d: %v, want [%d %d]", i, calls[i], i+1, n)
		}
	}
	// Nothing else is left in the folder: no temporary files.
	entries, err := os.ReadDir(dir)
	if err != nil {
		t.Fatal(err)
	}
	if len(entries) != n {
		t.Errorf("%d entries in the folder, want %d", len(entries), n)
	}
}

func TestWritePNGSequence_TwosNamesByFrame(t *testing.T) {
	in := pngTestInput(t)
	dir := t.TempDir()
	paths, err := WritePNGSequence(dir, in, PNGOptions{Width: 64, Height: 64, View: wire.Side, Twos: true}, nil)
	if err != nil {
		t.Fatal(err)
	}
	n := len(in.Take.Frames)
	if want := (n + 1) / 2; len(paths) != want {
		t.Fatalf("%d files on twos for %d frames, want %d", len(paths), n, want)
	}
	for i, p := range paths {
		if want := fmt.Sprintf("rolling_pin_%04d.png", 2*i); filepath.Base(p) != want {
			t.Errorf("file %d: %s, want %s", i, filepath.Base(p), want)
		}
	}
}

func TestWritePNGSequence_PaddingFitsLastFrame(t *testing.T) {
	// A two-frame take whose last frame is numbered 12345 needs five digits.
	in := pngTestInput(t)
	fr := in.Take.Frames
	tk := *in.Take
	tk.Frames = []physics.Frame{fr[0], fr[1]}
	tk.Frames[1].N = 12345
	in.Take = &tk
	in.Name = "pan/flip: take 2"
	paths, err := WritePNGSequence(t.TempDir(), in, PNGOptions{Width: 32, Height: 32}, nil)
	if err != nil {
		t.Fatal(err)
	}
	got := []string{filepath.Base(paths[0]), filepath.Base(paths[1])}
	want := []string{"pan_flip__take_2_00000.png", "pan_flip__take_2_12345.png"}
	if !slices.Equal(got, want) {
		t.Errorf("names %v, want %v", got, want)
	}
}

// coverage returns how many pixels differ from the background colour bg
// and how many of those lie on the image's outermost pixel ring.
func coverage(img image.Image, bg [4]uint32) (inside, border int) {
	b := img.Bounds()
	for y := b.Min.Y; y < b.Max.Y; y++ {
		for x := b.Min.X; x < b.Max.X; x++ {
			r, g, bb, a := img.At(x, y).RGBA()
			if [4]uint32{r, g, bb, a} == bg {
				continue
			}
			inside++
			if x == b.Min.X || y == b.Min.Y || x == b.Max.X-1 || y == b.Max.Y-1 {
				border++
			}
		}
	}
	return inside, border
}

func TestWritePNGSequence_TransparentBackground(t *testing.T) {
	in := pngTestInput(t)
	paths, err := WritePNGSequence(t.TempDir(), in, PNGOptions{Width: 120, Height: 80, Transparent: true}, nil)
	if err != nil {
		t.Fatal(err)
	}
	for _, p := range paths {
		img := readPNG(t, p)
		if _, _, _, a := img.At(0, 0).RGBA(); a != 0 {
			t.Fatalf("%s: corner alpha %d, want 0 (transparent)", p, a)
		}
		// The camera is framed on the whole take (wire.Bounds), so the
		// prop is drawn in every frame and stays clear of the edges.
		inside, border := coverage(img, [4]uint32{})
		if inside == 0 || border != 0 {
			t.Errorf("%s: %d prop pixels, %d on the border; want some and none", p, inside, border)
		}
	}
}

func TestWritePNGSequence_OpaqueBackground(t *testing.T) {
	in := pngTestInput(t)
	paths, err := WritePNGSequence(t.TempDir(), in, PNGOptions{Width: 40, Height: 40}, nil)
	if err != nil {
		t.Fatal(err)
	}
	bg := wire.DefaultPalette().Background
	r, g, b, a := readPNG(t, paths[0]).At(0, 0).RGBA()
	if a != 0xffff || r>>8 != uint32(bg.R) || g>>8 != uint32(bg.G) || b>>8 != uint32(bg.B) {
		t.Errorf("corner %v %v %v %v, want the palette background %v", r>>8, g>>8, b>>8, a>>8, bg)
	}
}

func TestWritePNGSequence_RejectsBadOptions(t *testing.T) {
	in := pngTestInput(t)
	for _, c := range []struct {
		opt   PNGOptions
		field string
	}{
		{PNGOptions{Width: 15, Height: 100}, "width:"},
		{PNGOptions{Width: 8193, Height: 100}, "width:"},
		{PNGOptions{Width: 100, Height: 0}, "height:"},
		{PNGOptions{Width: 100, Height: 9000}, "height:"},
		{PNGOptions{Width: 100, Height: 100, Onion: -1}, "onion:"},
		{PNGOptions{Width: 100, Height: 100, View: wire.View(9)}, "view:"},
	} {
		dir := filepath.Join(t.TempDir(), "out")
		_, err := WritePNGSequence(dir, in, c.opt, nil)
		if err == nil || !strings.HasPrefix(err.Error(), c.field) {
			t.Errorf("%+v: error %v, want one naming %q", c.opt, err, c.field)
		}
		if _, statErr := os.Stat(dir); statErr == nil {
			t.Errorf("%+v: the folder was created for a refused call", c.opt)
		}
	}
	if _, err := WritePNGSequence(t.TempDir(), Input{Prop: in.Prop}, PNGOptions{Width: 20, Height: 20}, nil); err == nil {
		t.Error("no take: want an error")
	}
}

func BenchmarkWritePNGSequence(b *testing.B) {
	in := pngTestInput(b)
	dir := b.TempDir()
	for b.Loop() {
		if _, err := WritePNGSequence(dir, in, PNGOptions{Width: 640, Height: 360, Guides: true, Onion: 2}, nil); err != nil {
			b.Fatal(err)
		}
	}
	b.ReportMetric(float64(len(in.Take.Frames)), "frames/op")
}

func TestWritePNGSequence_Cancel(t *testing.T) {
	in := panInput(t, 2)
	cancel := make(chan struct{})
	close(cancel)
	dir := t.TempDir()
	files, err := WritePNGSequence(dir, in, PNGOptions{Width: 32, Height: 32, Cancel: cancel}, nil)
	if !errors.Is(err, ErrCancelled) || len(files) != 0 {
		t.Errorf("cancelled before the start: %d files, %v", len(files), err)
	}
}
