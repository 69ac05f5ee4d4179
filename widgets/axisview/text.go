package axisview

import (
	"image"
	"image/color"
	"image/draw"

	xdraw "golang.org/x/image/draw"
	"golang.org/x/image/font"
	"golang.org/x/image/font/basicfont"
	"golang.org/x/image/math/fixed"
)

// face is the map's text: a bitmap font, 7 pixels a character, enlarged
// by whole pixels (nearest neighbour) so that it stays crisp.
var face = basicfont.Face7x13

// textWidth returns the width in pixels of text at the given scale.
func textWidth(text string, scale int) int {
	return font.MeasureString(face, text).Ceil() * max(scale, 1)
}

// drawText draws text with its baseline starting at (x, y), in colour c
// over a one-pixel (times scale) halo of colour halo; a zero-alpha halo
// draws none.
func drawText(dst *image.RGBA, text string, x, y int, c, halo color.NRGBA, scale int) {
	scale = max(scale, 1)
	m := face.Metrics()
	asc, desc := m.Ascent.Ceil(), m.Descent.Ceil()
	tw := font.MeasureString(face, text).Ceil()
	tmp := image.NewRGBA(image.Rect(0, 0, tw+2, asc+desc+2))
	dr := font.Drawer{Dst: tmp, Face: face}
	if halo.A > 0 {
		dr.Src = image.NewUniform(halo)
		for _, o := range [4][2]int{{-1, 0}, {1, 0}, {0, -1}, {0, 1}} {
			dr.Dot = fixed.P(1+o[0], asc+1+o[1])
			dr.DrawString(text)
		}
	}
	dr.Src = image.NewUniform(c)
	dr.Dot = fixed.P(1, asc+1)
	dr.DrawString(text)
	r := image.Rect(x-scale, y-(asc+1)*scale, x+(tw+1)*scale, y+(desc+1)*scale)
	xdraw.NearestNeighbor.Scale(dst, r, tmp, tmp.Bounds(), draw.Over, nil)
}
