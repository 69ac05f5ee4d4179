package widgets

import (
	"image"
	"math"
)

// maxShownPixels is the largest footage frame the view hands to Fyne as it
// is: 16 megapixels (a 4K frame is 8.3). A larger frame (a hostile 6000 x
// 6000 GIF is 36) would cost the renderer a texture of 4 bytes a pixel and
// a copy of it for every frame shown, memory outside the footage's own
// cap, so the view shows it reduced to the pixels it covers on screen.
const maxShownPixels = 16_000_000

// shownImage returns img as the renderer should get it for an on-screen
// size of w x h device pixels: img itself when it is small enough, else a
// reduced copy, each of whose pixels averages a 2 x 2 grid of samples
// inside its footprint (a box filter, enough for a reference picture).
// The copy is kept for the next call with the same image and size.
func (v *FootageView) shownImage(img image.Image, w, h int) image.Image {
	b := img.Bounds()
	if int64(b.Dx())*int64(b.Dy()) <= maxShownPixels || w <= 0 || h <= 0 {
		return img
	}
	// Never more pixels than the source, nor than maxShownPixels.
	w, h = min(w, b.Dx()), min(h, b.Dy())
	if k := float64(w) * float64(h) / maxShownPixels; k > 1 {
		w, h = max(1, int(float64(w)/math.Sqrt(k))), max(1, int(float64(h)/math.Sqrt(k)))
	}
	if v.shown.src == img && v.shown.img != nil && v.shown.img.Rect.Dx() == w && v.shown.img.Rect.Dy() == h {
		return v.shown.img
	}
	out := reduce(img, w, h)
	v.shown.src, v.shown.img = img, out
	return out
}

// reduce returns img scaled to w x h by averaging four samples a pixel.
func reduce(img image.Image, w, h int) *image.RGBA {
	b := img.Bounds()
	out := image.NewRGBA(image.Rect(0, 0, w, h))
	sx, sy := float64(b.Dx())/float64(w), float64(b.Dy())/float64(h)
	rgba, _ := img.(*image.RGBA)
	for y := range h {
		for x := range w {
			var acc [4]uint32
			for _, o := range [4][2]float64{{0.25, 0.25}, {0.75, 0.25}, {0.25, 0.75}, {0.75, 0.75}} {
				px := b.Min.X + min(int((float64(x)+o[0])*sx), b.Dx()-1)
				py := b.Min.Y + min(int((float64(y)+o[1])*sy), b.Dy()-1)
				if rgba != nil {
					i := rgba.PixOffset(px, py)
					p := rgba.Pix[i : i+4 : i+4]
					acc[0] += uint32(p[0])
					acc[1] += uint32(p[1])
					acc[2] += uint32(p[2])
					acc[3] += uint32(p[3])
					continue
				}
				r, g, bb, a := img.At(px, py).RGBA()
				acc[0] += r >> 8
				acc[1] += g >> 8
				acc[2] += bb >> 8
				acc[3] += a >> 8
			}
			i := out.PixOffset(x, y)
			out.Pix[i], out.Pix[i+1], out.Pix[i+2], out.Pix[i+3] = uint8(acc[0]/4), uint8(acc[1]/4), uint8(acc[2]/4), uint8(acc[3]/4)
		}
	}
	return out
}
