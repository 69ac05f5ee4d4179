package ui

import (
	"image"
	"image/color"
	"image/draw"
	"math"
)

// Colours of the Land it charts.
var (
	chartBack  = color.NRGBA{0xf3, 0xf5, 0xf8, 0xff}
	chartBar   = color.NRGBA{0x12, 0x70, 0x8a, 0xff}
	chartTol   = color.NRGBA{0xe0, 0x7a, 0x1f, 0xff}
	chartPoint = color.NRGBA{0x12, 0x70, 0x8a, 0xc0}
	chartAxis  = color.NRGBA{0xb0, 0xb6, 0xc0, 0xff}
)

// histogramImage draws bins (equal widths from 0 to 180 degrees) as bars
// scaled to the tallest, with a vertical line at tol (a fraction of the
// range), on a w x h image.
func histogramImage(bins []int, tol float64, w, h int) image.Image {
	img := image.NewNRGBA(image.Rect(0, 0, max(w, 1), max(h, 1)))
	draw.Draw(img, img.Bounds(), &image.Uniform{chartBack}, image.Point{}, draw.Src)
	top := 0
	for _, b := range bins {
		top = max(top, b)
	}
	if top > 0 {
		bw := float64(w) / float64(len(bins))
		for i, b := range bins {
			bh := int(math.Round(float64(h-2) * float64(b) / float64(top)))
			x0, x1 := int(float64(i)*bw)+1, int(float64(i+1)*bw)-1
			draw.Draw(img, image.Rect(x0, h-bh, max(x1, x0+1), h), &image.Uniform{chartBar}, image.Point{}, draw.Src)
		}
	}
	if tol > 0 && tol <= 1 {
		x := int(math.Round(tol * float64(w-1)))
		draw.Draw(img, image.Rect(x, 0, x+2, h), &image.Uniform{chartTol}, image.Point{}, draw.Src)
	}
	return img
}

// scatterImage draws points (x, z in metres) from above: x to the right,
// z down the image, one scale for both, framed round the points with a
// margin; a cross marks their mean.
func scatterImage(pts [][2]float64, w, h int) image.Image {
	img := image.NewNRGBA(image.Rect(0, 0, max(w, 1), max(h, 1)))
	draw.Draw(img, img.Bounds(), &image.Uniform{chartBack}, image.Point{}, draw.Src)
	if len(pts) == 0 {
		return img
	}
	minX, maxX, minZ, maxZ := math.Inf(1), math.Inf(-1), math.Inf(1), math.Inf(-1)
	var mx, mz float64
	for _, p := range pts {
		minX, maxX = math.Min(minX, p[0]), math.Max(maxX, p[0])
		minZ, maxZ = math.Min(minZ, p[1]), math.Max(maxZ, p[1])
		mx += p[0]
		mz += p[1]
	}
	mx /= float64(len(pts))
	mz /= float64(len(pts))
	span := math.Max(math.Max(maxX-minX, maxZ-minZ), 0.02) * 1.2
	scale := float64(min(w, h)) / span
	cx, cz := (minX+maxX)/2, (minZ+maxZ)/2
	toPix := func(x, z float64) (int, int) {
		return int(math.Round(float64(w)/2 + (x-cx)*scale)), int(math.Round(float64(h)/2 + (z-cz)*scale))
	}
	px, pz := toPix(mx, mz)
	for d := -6; d <= 6; d++ {
		img.Set(px+d, pz, chartAxis)
		img.Set(px, pz+d, chartAxis)
	}
	for _, p := range pts {
		x, z := toPix(p[0], p[1])
		draw.Draw(img, image.Rect(x-1, z-1, x+2, z+2), &image.Uniform{chartPoint}, image.Point{}, draw.Over)
	}
	return img
}
