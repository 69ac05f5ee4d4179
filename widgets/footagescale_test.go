package widgets

import (
	"image"
	"image/color"
	"testing"
)

// stripes is a big image made on demand: vertical stripes 10 px wide,
// red and blue, so that no test allocates its pixels.
type stripes struct{ w, h int }

func (s stripes) ColorModel() color.Model { return color.RGBAModel }
func (s stripes) Bounds() image.Rectangle { return image.Rect(0, 0, s.w, s.h) }
func (s stripes) At(x, y int) color.Color {
	if (x/10)%2 == 0 {
		return color.RGBA{255, 0, 0, 255}
	}
	return color.RGBA{0, 0, 255, 255}
}

// TestFootageView_HugeFrameShownReduced: a frame over maxShownPixels (a
// 6000 x 6000 clip) reaches the renderer reduced to the pixels it covers,
// each the average of its footprint; a smaller frame is handed on as it is.
func TestFootageView_HugeFrameShownReduced(t *testing.T) {
	v := NewFootageView()
	big := stripes{6000, 6000}
	got := v.shownImage(big, 300, 300)
	if b := got.Bounds(); b.Dx() != 300 || b.Dy() != 300 {
		t.Fatalf("shown at %v, want 300x300", b)
	}
	// Each shown pixel covers 20 x 20 source pixels: one red and one blue
	// stripe, half and half (samples at 5 and 15 px across).
	if c := got.At(0, 0).(color.RGBA); c.R < 120 || c.R > 135 || c.B < 120 || c.B > 135 || c.A != 255 {
		t.Errorf("shown pixel %v, want about half red, half blue", c)
	}
	if v.shownImage(big, 300, 300) != got {
		t.Error("the reduced copy is made again for the same frame and size")
	}
	small := image.NewRGBA(image.Rect(0, 0, 1920, 1080))
	if v.shownImage(small, 300, 200) != image.Image(small) {
		t.Error("a 1080p frame was copied")
	}
}
