package ui

import (
	"bytes"
	"image"
	"image/color"
	"image/gif"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"propflight/app/footage"
	"propflight/app/project"
)

// TestFootage_MarksOutsideImageRefused: marks that the project file places
// outside the clip's image (here at 1e5 px, past the right edge) are
// refused by the fit with a message naming the frame, instead of being
// fitted.
func TestFootage_MarksOutsideImageRefused(t *testing.T) {
	w := boardWindow(t)
	clip := makeClip(t, filepath.Join(t.TempDir(), "clip"))
	if !w.footage.load(clip.dir) {
		t.Fatalf("load failed: %v", w.lastDialog)
	}
	for i, f := range markedFrames {
		x, y, _, _ := clip.clicks(f)
		if i == 2 {
			x = 1e5
		}
		if !w.footage.edit("Mark", "", true, func(d *project.Document) error { return setMark(d, f, x, y, false) }) {
			t.Fatalf("mark on frame %d refused", f)
		}
	}
	w.footage.refit()
	if w.footage.fit != nil || w.footage.fitErr == nil || !strings.Contains(w.footage.fitErr.Error(), "frame 8: the mark's centre (100000, ") ||
		!strings.Contains(w.footage.fitErr.Error(), "is outside the") {
		t.Errorf("fit with a mark outside the image: %v, %v", w.footage.fit, w.footage.fitErr)
	}
}

// TestFootage_HugeClipOverlayCoarser: over a 6000 x 6000 clip the overlay
// is drawn at most maxOverlayPixels, and the coarser camera still puts the
// take's release centre of mass on the fitted centre (in its own pixels,
// the clip's divided by the factor).
func TestFootage_HugeClipOverlayCoarser(t *testing.T) {
	w := boardWindow(t)
	pal := color.Palette{color.RGBA{}, color.RGBA{200, 30, 30, 255}}
	m := image.NewPaletted(image.Rect(0, 0, 6000, 6000), pal)
	var buf bytes.Buffer
	if err := gif.Encode(&buf, m, nil); err != nil {
		t.Fatal(err)
	}
	path := filepath.Join(t.TempDir(), "huge.gif")
	os.WriteFile(path, buf.Bytes(), 0o644)
	if !w.footage.load(path) {
		t.Fatalf("load failed: %v", w.lastDialog)
	}
	w.footage.fit = &footage.FitResult{MetresPerPixel: 0.002, X: [2]float64{3000, 10}, Y: [3]float64{4000, -30, 1}}
	cam, ok := w.footage.overlayCamera()
	if !ok {
		t.Fatal("no overlay camera")
	}
	if px := cam.Width * cam.Height; px > maxOverlayPixels || cam.Width < 1000 {
		t.Errorf("overlay camera %dx%d for a 6000x6000 clip", cam.Width, cam.Height)
	}
	k := 6000 / float64(cam.Width)
	x, y, ok := cam.Project(w.good.Take.Frames[0].CM)
	if !ok || math.Abs(x-3000/k) > 0.5 || math.Abs(y-4000/k) > 0.5 {
		t.Errorf("release centre at (%g, %g) of the coarse overlay, want (%g, %g)", x, y, 3000/k, 4000/k)
	}
}
