package axisview

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics"
)

// View is one of the two pictures of the map: the hemisphere of spin
// directions around a principal axis, seen from outside along it.
type View int

const (
	DownGreatest View = iota // centre: the greatest axis; least axis to the right, middle axis up
	DownLeast                // centre: the least axis; greatest axis to the left, middle axis up
)

// Title is the view's caption.
func (v View) Title() string { return v.titles()[0] }

// titles returns the view's captions, longest first.
func (v View) titles() []string {
	if v == DownLeast {
		return []string{"seen down the least axis", "down the least axis", "least axis"}
	}
	return []string{"seen down the greatest axis", "down the greatest axis", "greatest axis"}
}

// TitleFor returns the caption of view v in layout l: the longest form
// whose captions of both views fit over their discs.
func (l Layout) TitleFor(v View) string {
	room := int(2*l.R + (float64(l.W)-4*l.R)/3 - float64(4*l.Scale))
	g, s := DownGreatest.titles(), DownLeast.titles()
	for i := range g {
		if textWidth(g[i], l.Scale) <= room && textWidth(s[i], l.Scale) <= room {
			return v.titles()[i]
		}
	}
	return v.titles()[len(g)-1]
}

// basis returns the view's screen right, screen up and toward-the-viewer
// directions in principal coordinates (a right-handed set: right x up =
// toward).
func (v View) basis() (right, up, toward r3.Vec) {
	if v == DownLeast {
		return r3.Vec{Z: -1}, r3.Vec{Y: 1}, r3.Vec{X: 1}
	}
	return r3.Vec{X: 1}, r3.Vec{Y: 1}, r3.Vec{Z: 1}
}

// ToPrincipal returns prop-frame vector d in the principal coordinates of
// axes (row i the unit axis of moment i, prop frame).
func ToPrincipal(axes [3]r3.Vec, d r3.Vec) r3.Vec {
	return r3.Vec{X: r3.Dot(d, axes[0]), Y: r3.Dot(d, axes[1]), Z: r3.Dot(d, axes[2])}
}

// FromPrincipal returns principal-coordinate vector w in the prop frame.
func FromPrincipal(axes [3]r3.Vec, w r3.Vec) r3.Vec {
	return r3.Add(r3.Add(r3.Scale(w.X, axes[0]), r3.Scale(w.Y, axes[1])), r3.Scale(w.Z, axes[2]))
}

// Layout places the two views, their titles and the legend in an image of
// W x H pixels whose text is enlarged Scale times.
type Layout struct {
	W, H    int
	Scale   int
	R       float64       // radius of each view's disc, pixels
	Centre  [2][2]float64 // centre of the disc of each View, pixels
	TitleY  int           // baseline of the view titles
	LegendY int           // top of the legend rows
}

// Text metrics of the bitmap font at scale 1 (basicfont.Face7x13).
const (
	charW = 7
	lineH = 15
)

// NewLayout returns the layout of a w x h image with text scale scale
// (at least 1): a title line, the two discs side by side, then two legend
// lines.
func NewLayout(w, h, scale int) Layout { return newLayout(w, h, scale, 2) }

// LayoutFor returns the layout Render uses for mapper m in a w x h image
// with text scale scale: room for as many legend lines as its legend
// needs at that width.
func LayoutFor(m *physics.AxisMapper, w, h, scale int) Layout {
	pal := ScreenPalette()
	return newLayout(w, h, scale, legendRows(legend(m, &pal), w, max(scale, 1)))
}

func newLayout(w, h, scale, rows int) Layout {
	scale = max(scale, 1)
	l := Layout{W: w, H: h, Scale: scale}
	line := float64(lineH * scale)
	pad := float64(8 * scale)
	top := line + pad/2
	bottom := float64(rows)*line + pad
	r := math.Min((float64(w)-3*pad)/4, (float64(h)-top-bottom-pad)/2)
	l.R = math.Max(r, 1)
	gap := (float64(w) - 4*l.R) / 3
	cy := top + pad/2 + l.R
	l.Centre[DownGreatest] = [2]float64{gap + l.R, cy}
	l.Centre[DownLeast] = [2]float64{2*gap + 3*l.R, cy}
	l.TitleY = int(line)
	l.LegendY = int(cy + l.R + pad)
	return l
}

// Direction returns the unit direction (principal coordinates, on the
// view's own hemisphere) under the image point (x, y), the view it lies
// in and true; false when the point is on neither disc.
//
// Inverse of Lambert's equal-area projection (Snyder 1987, eq. 24-2 to
// 24-4 at the pole): with (X, Y) the offset from the centre in units of
// R / sqrt(2) and rho^2 = X^2 + Y^2 <= 2, the direction is
// (X s, Y s, 1 - rho^2/2), s = sqrt(1 - rho^2/4), in the view's basis.
func (l Layout) Direction(x, y float64) (r3.Vec, View, bool) {
	for _, v := range []View{DownGreatest, DownLeast} {
		c := l.Centre[v]
		X := (x - c[0]) / l.R * math.Sqrt2
		Y := -(y - c[1]) / l.R * math.Sqrt2
		rho2 := X*X + Y*Y
		if rho2 > 2 {
			continue
		}
		return l.unproject(v, X, Y, rho2), v, true
	}
	return r3.Vec{}, DownGreatest, false
}

func (l Layout) unproject(v View, X, Y, rho2 float64) r3.Vec {
	s := math.Sqrt(math.Max(0, 1-rho2/4))
	right, up, toward := v.basis()
	d := r3.Add(r3.Add(r3.Scale(X*s, right), r3.Scale(Y*s, up)), r3.Scale(1-rho2/2, toward))
	return r3.Unit(d)
}

// Point returns where direction d (principal coordinates, any non-zero
// length) appears in view v: d or its opposite, whichever faces the viewer.
//
// Lambert's equal-area projection (Snyder 1987, eq. 24-2 to 24-4 at the
// pole): the point at angle a from the centre lies at R sqrt(1 - cos a)
// from the disc's centre, along the direction's screen projection.
func (l Layout) Point(v View, d r3.Vec) [2]float64 {
	d = r3.Unit(d)
	right, up, toward := v.basis()
	z := r3.Dot(d, toward)
	if z < 0 {
		d, z = r3.Scale(-1, d), -z
	}
	x, y := r3.Dot(d, right), r3.Dot(d, up)
	k := 0.0
	if h := math.Hypot(x, y); h > 0 {
		k = l.R * math.Sqrt(1-math.Min(1, z)) / h
	}
	c := l.Centre[v]
	return [2]float64{c[0] + k*x, c[1] - k*y}
}
