package axisview

import (
	"image"
	"image/color"
	"math"
	"sync"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics"
)

// Options are the choices of one drawing of the map.
type Options struct {
	Palette Palette
	Scale   int     // text and line scale, at least 1 (the canvas scale on screen)
	Spin    *r3.Vec // the throw's spin direction (prop frame), ringed in both views; nil for none
}

// PolhodeStepDeg is the excursion between two drawn polhode curves.
const PolhodeStepDeg = 10

// cell is the verdict of the direction under one pixel.
type cell struct {
	in      bool
	motion  physics.Motion
	circles physics.Axis
	level   int8 // floor(excursion / PolhodeStepDeg)
	exc     float32
}

// Render draws the axis map of mapper m into a new w x h image: the two
// views of Layout with their titles, the principal axes labelled, the
// polhode curves, the separatrix and a legend, and the marked direction.
// Each pixel is judged on its own (AxisMapper.ClassPrincipal, closed
// forms), the two views on two goroutines.
func Render(m *physics.AxisMapper, w, h int, opt Options) *image.RGBA {
	w, h = max(w, 1), max(h, 1)
	img := image.NewRGBA(image.Rect(0, 0, w, h))
	pal := opt.Palette
	if pal.Background.A == 0 && pal.Text.A == 0 {
		pal = ScreenPalette()
	}
	fill(img, pal.Background)
	l := LayoutFor(m, w, h, opt.Scale)
	cells := make([]cell, w*h)
	var wg sync.WaitGroup
	for _, v := range []View{DownGreatest, DownLeast} {
		wg.Add(1)
		go func() {
			defer wg.Done()
			judgeView(m, l, v, cells)
		}()
	}
	wg.Wait()
	paintCells(img, l, cells, &pal, m.Symmetry() == physics.Asymmetric)
	drawRims(img, l, pal.Rim)
	drawAxes(img, l, m, &pal)
	for _, v := range []View{DownGreatest, DownLeast} {
		t := l.TitleFor(v)
		c := l.Centre[v]
		drawText(img, t, int(c[0])-textWidth(t, l.Scale)/2, l.TitleY, pal.Text, color.NRGBA{}, l.Scale)
	}
	drawLegend(img, l, m, &pal)
	if opt.Spin != nil && r3.Norm(*opt.Spin) > 0 {
		d := ToPrincipal(m.Axes(), *opt.Spin)
		for _, v := range []View{DownGreatest, DownLeast} {
			DrawRing(img, l.Point(v, d), float64(l.Scale), pal.Ring, pal.Rim)
		}
	}
	return img
}

// judgeView fills the cells of view v's disc.
func judgeView(m *physics.AxisMapper, l Layout, v View, cells []cell) {
	c := l.Centre[v]
	x0, x1 := max(0, int(c[0]-l.R)-1), min(l.W, int(c[0]+l.R)+2)
	y0, y1 := max(0, int(c[1]-l.R)-1), min(l.H, int(c[1]+l.R)+2)
	k := math.Sqrt2 / l.R
	for y := y0; y < y1; y++ {
		Y := -(float64(y) + 0.5 - c[1]) * k
		for x := x0; x < x1; x++ {
			X := (float64(x) + 0.5 - c[0]) * k
			rho2 := X*X + Y*Y
			if rho2 > 2 {
				continue
			}
			d := l.unproject(v, X, Y, rho2)
			mo, ax, exc := m.ClassPrincipal(d)
			cells[y*l.W+x] = cell{in: true, motion: mo, circles: ax, level: int8(exc / PolhodeStepDeg), exc: float32(exc)}
		}
	}
}

// paintCells colours every judged pixel and draws the lines between
// cells: the separatrix where the circled axis changes (asymmetric props),
// a class boundary where the motion changes, a polhode curve where the
// excursion crosses a multiple of PolhodeStepDeg.
func paintCells(img *image.RGBA, l Layout, cells []cell, pal *Palette, asym bool) {
	w, h := l.W, l.H
	kind := make([]uint8, w*h) // 0 none, 1 polhode, 2 boundary, 3 separatrix
	mark := func(i int, k uint8) {
		if kind[i] < k {
			kind[i] = k
		}
	}
	for y := range h {
		for x := range w {
			i := y*w + x
			a := &cells[i]
			if !a.in {
				continue
			}
			for _, j := range [2]int{i + 1, i + w} {
				if (j == i+1 && x+1 >= w) || (j == i+w && y+1 >= h) {
					continue
				}
				b := &cells[j]
				if !b.in {
					continue
				}
				var k uint8
				switch {
				case asym && a.circles != b.circles:
					k = 3
				case a.motion != b.motion:
					k = 2
				case a.level != b.level:
					k = 1
				}
				if k > 0 {
					mark(i, k)
					if k > 1 || l.Scale > 1 {
						mark(j, k)
					}
				}
			}
		}
	}
	for y := range h {
		for x := range w {
			i := y*w + x
			a := &cells[i]
			if !a.in {
				continue
			}
			c := pal.Colour(a.motion, a.circles, float64(a.exc))
			switch kind[i] {
			case 1:
				c = mix(c, color.NRGBA{0, 0, 0, 255}, pal.PolhodeDark)
			case 2:
				c = pal.Rim
			case 3:
				c = pal.Separatrix
			}
			o := i * 4
			img.Pix[o], img.Pix[o+1], img.Pix[o+2], img.Pix[o+3] = c.R, c.G, c.B, 255
		}
	}
}

// drawRims outlines both discs.
func drawRims(img *image.RGBA, l Layout, c color.NRGBA) {
	half := 0.6 * float64(l.Scale)
	for _, v := range []View{DownGreatest, DownLeast} {
		ctr := l.Centre[v]
		for y := max(0, int(ctr[1]-l.R)-3); y < min(l.H, int(ctr[1]+l.R)+4); y++ {
			for x := max(0, int(ctr[0]-l.R)-3); x < min(l.W, int(ctr[0]+l.R)+4); x++ {
				d := math.Hypot(float64(x)+0.5-ctr[0], float64(y)+0.5-ctr[1])
				if math.Abs(d-l.R) <= half {
					img.SetRGBA(x, y, color.RGBA{c.R, c.G, c.B, 255})
				}
			}
		}
	}
}

// Axis colours, the preview's (widgets/wire DefaultPalette): least amber,
// middle pink, greatest blue.
var axisColours = [3]color.NRGBA{{236, 182, 64, 255}, {226, 102, 160, 255}, {98, 170, 244, 255}}

var axisNames = [3]string{"least", "middle", "greatest"}

// drawAxes marks and labels the three principal axes in both views.
func drawAxes(img *image.RGBA, l Layout, m *physics.AxisMapper, pal *Palette) {
	s := float64(l.Scale)
	for _, v := range []View{DownGreatest, DownLeast} {
		ctr := l.Centre[v]
		for i := range 3 {
			var e r3.Vec
			switch i {
			case 0:
				e.X = 1
			case 1:
				e.Y = 1
			case 2:
				e.Z = 1
			}
			p := l.Point(v, e)
			disc(img, p, 3.5*s, pal.Rim)
			disc(img, p, 2.5*s, axisColours[i])
			name := axisNames[i]
			tw := textWidth(name, l.Scale)
			lh := int(float64(lineH) * s)
			dx, dy := p[0]-ctr[0], p[1]-ctr[1]
			var x, y int
			switch {
			case math.Hypot(dx, dy) < 1: // the view's centre
				x, y = int(p[0])-tw/2, int(p[1])+lh
			case math.Abs(dx) > math.Abs(dy): // left or right rim
				y = int(p[1]) - int(6*s)
				if dx > 0 {
					x = int(p[0]) - tw - int(4*s)
				} else {
					x = int(p[0]) + int(4*s)
				}
			default: // top or bottom rim
				x = int(p[0]) + int(6*s)
				if dy < 0 {
					y = int(p[1]) + lh - int(2*s)
				} else {
					y = int(p[1]) - int(4*s)
				}
			}
			drawText(img, name, x, y, axisColours[i], pal.Rim, l.Scale)
		}
	}
}

// legendItem is one entry of the legend: a swatch (Swatch.A == 0 for
// none) and its words.
type legendItem struct {
	Swatch color.NRGBA
	Text   string
}

// legend returns the legend entries for the prop of mapper m.
func legend(m *physics.AxisMapper, pal *Palette) []legendItem {
	var items []legendItem
	switch m.Symmetry() {
	case physics.Asymmetric:
		items = append(items,
			legendItem{pal.Swatch(physics.Spinning, physics.Greatest), "spin about the greatest axis"},
			legendItem{pal.Swatch(physics.Spinning, physics.Least), "spin about the least axis"},
			legendItem{pal.Swatch(physics.Tumbling, physics.Greatest), "tumble"},
			legendItem{pal.Separatrix, "separatrix"})
	case physics.Oblate:
		items = append(items,
			legendItem{pal.Swatch(physics.Wobbling, physics.Greatest), "wobble"},
			legendItem{pal.Swatch(physics.Spinning, physics.Greatest), "spin (on the axis; end over end)"})
	case physics.Prolate:
		items = append(items,
			legendItem{pal.Swatch(physics.Wobbling, physics.Least), "wobble"},
			legendItem{pal.Swatch(physics.Spinning, physics.Least), "spin (on the axis; end over end)"})
	default:
		items = append(items, legendItem{pal.Swatch(physics.Spinning, physics.Greatest), "spin: every direction"})
	}
	return append(items,
		legendItem{Text: "darker: larger excursion;"},
		legendItem{Text: "thin lines every 10 deg (polhodes);"},
		legendItem{Text: "ring: this throw"})
}

// legendRows returns how many rows the legend entries take in an image w
// pixels wide at text scale s (the flow of drawLegend).
func legendRows(items []legendItem, w, s int) int {
	x0 := 8 * s
	x, rows := x0, 1
	for _, it := range items {
		iw := textWidth(it.Text, s)
		if it.Swatch.A > 0 {
			iw += 14 * s
		}
		if x > x0 && x+iw > w-4*s {
			x, rows = x0, rows+1
		}
		x += iw + 12*s
	}
	return rows
}

// drawLegend flows the legend entries over the rows under the discs.
func drawLegend(img *image.RGBA, l Layout, m *physics.AxisMapper, pal *Palette) {
	s := l.Scale
	lh := lineH * s
	x0 := int(8 * s)
	x, y := x0, l.LegendY+lh-int(3*s)
	for _, it := range legend(m, pal) {
		w := textWidth(it.Text, s)
		if it.Swatch.A > 0 {
			w += 14 * s
		}
		if x > x0 && x+w > l.W-int(4*s) {
			x, y = x0, y+lh
		}
		if y > l.H {
			return
		}
		if it.Swatch.A > 0 {
			r := image.Rect(x, y-9*s, x+10*s, y+1*s)
			fillRect(img, r.Inset(-1), pal.Rim)
			fillRect(img, r, it.Swatch)
			x += 14 * s
		}
		drawText(img, it.Text, x, y, pal.Text, color.NRGBA{}, s)
		x += textWidth(it.Text, s) + 12*s
	}
}

// DrawRing draws the ring round a direction at p (pixels), of
// colour c over an outline o, sized for scale s.
func DrawRing(img *image.RGBA, p [2]float64, s float64, c, o color.NRGBA) {
	ring(img, p, 7*s, 2.2*s, o)
	ring(img, p, 7*s, 1.2*s, c)
	disc(img, p, 1.5*s, c)
}

func fill(img *image.RGBA, c color.NRGBA) {
	for i := 0; i < len(img.Pix); i += 4 {
		img.Pix[i], img.Pix[i+1], img.Pix[i+2], img.Pix[i+3] = c.R, c.G, c.B, c.A
	}
}

func fillRect(img *image.RGBA, r image.Rectangle, c color.NRGBA) {
	r = r.Intersect(img.Bounds())
	for y := r.Min.Y; y < r.Max.Y; y++ {
		for x := r.Min.X; x < r.Max.X; x++ {
			img.SetRGBA(x, y, color.RGBA{c.R, c.G, c.B, 255})
		}
	}
}

// disc fills the pixels whose centres lie within r of p.
func disc(img *image.RGBA, p [2]float64, r float64, c color.NRGBA) {
	ring(img, p, 0, r, c)
}

// ring fills the pixels whose centres lie within half of radius rad
// from p (rad 0 and half r: a disc of radius r).
func ring(img *image.RGBA, p [2]float64, rad, half float64, c color.NRGBA) {
	b := img.Bounds()
	ext := rad + half + 1
	for y := max(b.Min.Y, int(p[1]-ext)); y < min(b.Max.Y, int(p[1]+ext)+1); y++ {
		for x := max(b.Min.X, int(p[0]-ext)); x < min(b.Max.X, int(p[0]+ext)+1); x++ {
			d := math.Hypot(float64(x)+0.5-p[0], float64(y)+0.5-p[1])
			if math.Abs(d-rad) <= half {
				img.SetRGBA(x, y, color.RGBA{c.R, c.G, c.B, 255})
			}
		}
	}
}
