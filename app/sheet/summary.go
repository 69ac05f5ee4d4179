package sheet

import (
	"math"

	"propflight/internal/printable"
	"propflight/physics"
)

// Type sizes of the summary page, points.
const (
	sizeTitle    = 16.0
	sizeHeadline = 11.5
	sizeBody     = 8.3
	sizeSmall    = 7.4
	sizeSection  = 9.0
)

// lineH returns a comfortable line height in mm for type of size points.
func lineH(size float64) float64 { return size * 0.3528 * 1.32 }

// minChartH is the smallest arc chart, mm, that the summary page takes; a
// shorter space left under the header moves the chart to a page of its own.
const minChartH = 70.0

// summary draws page 1: title, verdict, prop, mass properties, throw and
// the arc chart.
func (s *sheet) summary() error {
	p := s.pdf
	s.newPage()
	x, w := margin, s.width()
	y := contentTop + 1

	s.font("B", sizeTitle)
	ink(p, inkText)
	p.SetXY(x, y)
	p.CellFormat(w, 7, fitText(p, s.name, w-2), "", 0, "L", false, 0, "")
	y += 7.5
	s.font("", sizeBody)
	ink(p, inkSoft)
	p.SetXY(x, y)
	sub := "Timing sheet · " + s.sc.Throw.FPS.String() + " fps · " + plural(len(s.tk.Frames), "frame") +
		" (" + s.frameNo(0) + "–" + s.frameNo(len(s.tk.Frames)-1) + ", timecode from " + s.timecode(0) + ") · " + fixed(s.tk.FlightTime, 3) + " s flight · table " + s.onesOrTwos()
	p.CellFormat(w, 4.5, sub, "", 0, "L", false, 0, "")
	y += 7

	y = s.verdictPanel(x, y, w) + 5

	y = s.section(x, y, w, "Prop: "+plural(len(s.sc.Prop.Parts), "part"))
	y = s.partsTable(x, y, w) + 4

	colW := (w - 6) / 2
	need := 6.2 + max(s.items(0, 0, colW, 27, s.massItems(), sizeSmall, false), s.items(0, 0, colW, 27, s.throwItems(), sizeSmall, false))
	if y+need > s.contentBottom() {
		s.newPage()
		y = contentTop + 1
	}
	yl := s.section(x, y, colW, "Mass properties (prop frame)")
	yl = s.items(x, yl, colW, 27, s.massItems(), sizeSmall, true)
	yr := s.section(x+colW+6, y, colW, "Throw (world: +y up, metres)")
	yr = s.items(x+colW+6, yr, colW, 27, s.throwItems(), sizeSmall, true)
	y = max(yl, yr) + 5

	if y+axisMapH <= s.contentBottom() {
		y = s.axisMap(x, y, w) + 4
	}

	if s.contentBottom()-y < minChartH {
		s.newPage()
		y = contentTop + 1
	}
	s.chart(x, y, w, s.contentBottom()-y)
	return s.step()
}

// section draws a section heading with a rule under it and returns the y
// below it.
func (s *sheet) section(x, y, w float64, title string) float64 {
	p := s.pdf
	s.font("B", sizeSection)
	ink(p, inkText)
	p.SetXY(x, y)
	p.CellFormat(w, 4.6, title, "", 0, "L", false, 0, "")
	rule(p, x, y+5, x+w, y+5, 0.25, inkRule)
	return y + 6.2
}

// items lays out "label value" lines in a column w mm wide with labels
// labelW mm wide; values wrap. It draws them when draw is set and returns
// the y below the last line.
func (s *sheet) items(x, y, w, labelW float64, list []item, size float64, draw bool) float64 {
	p := s.pdf
	lh := lineH(size)
	for _, it := range list {
		s.font("", size)
		lines := p.SplitText(it.value, w-labelW)
		if len(lines) == 0 {
			lines = []string{""}
		}
		if draw {
			ink(p, inkSoft)
			p.SetXY(x, y)
			p.CellFormat(labelW, lh, fitText(p, it.label, labelW-1), "", 0, "L", false, 0, "")
			ink(p, inkText)
			for i, l := range lines {
				p.SetXY(x+labelW, y+float64(i)*lh)
				p.CellFormat(w-labelW, lh, l, "", 0, "L", false, 0, "")
			}
		}
		y += float64(len(lines)) * lh
	}
	return y
}

// verdictPanel draws the verdict in a shaded panel and returns its bottom.
func (s *sheet) verdictPanel(x, y, w float64) float64 {
	p := s.pdf
	title, why := s.headline()
	const pad = 3.0
	inner := w - 2*pad
	s.font("", sizeBody)
	whyLines := p.SplitText(why, inner)
	list := s.verdictItems()
	half := (len(list) + 1) / 2
	colW := (inner - 4) / 2
	// Measure, then draw the panel behind the text.
	hText := lineH(sizeHeadline) + 1 + float64(len(whyLines))*lineH(sizeBody) + 2
	hItems := max(s.items(0, 0, colW, 24, list[:half], sizeSmall, false), s.items(0, 0, colW, 24, list[half:], sizeSmall, false))
	h := pad + hText + hItems + pad
	box(p, x, y, w, h, fillPanel)
	rule(p, x, y, x, y+h, 0.8, inkArc)

	yy := y + pad
	s.font("B", sizeHeadline)
	ink(p, inkText)
	p.SetXY(x+pad, yy)
	p.CellFormat(inner, lineH(sizeHeadline), fitText(p, title, inner), "", 0, "L", false, 0, "")
	yy += lineH(sizeHeadline) + 1
	s.font("", sizeBody)
	for _, l := range whyLines {
		p.SetXY(x+pad, yy)
		p.CellFormat(inner, lineH(sizeBody), l, "", 0, "L", false, 0, "")
		yy += lineH(sizeBody)
	}
	yy += 2
	s.items(x+pad, yy, colW, 24, list[:half], sizeSmall, true)
	s.items(x+pad+colW+4, yy, colW, 24, list[half:], sizeSmall, true)
	return y + h
}

// partsTable lists the parts: name, shape, dimensions, mass and position.
func (s *sheet) partsTable(x, y, w float64) float64 {
	p := s.pdf
	cols := []struct {
		head string
		frac float64
	}{{"part", 0.12}, {"shape", 0.08}, {"dimensions", 0.29}, {"mass", 0.17}, {"position (prop frame)", 0.19}, {"rotation x, y, z", 0.15}}
	lh := lineH(sizeSmall) + 0.4
	s.font("B", sizeSmall)
	ink(p, inkSoft)
	cx := x
	for _, c := range cols {
		p.SetXY(cx, y)
		p.CellFormat(c.frac*w, lh, c.head, "", 0, "L", false, 0, "")
		cx += c.frac * w
	}
	y += lh
	rule(p, x, y, x+w, y, 0.15, inkRule)
	s.font("", sizeSmall)
	ink(p, inkText)
	for i := range s.sc.Prop.Parts {
		pt := &s.sc.Prop.Parts[i]
		name := printable.String(pt.Name)
		if name == "" {
			name = "part " + itoa(i+1)
		}
		cells := []string{name, pt.Shape.String(), partDims(pt), partMass(pt), vec(pt.Position, 4) + " m", rotationText(pt.Orient)}
		cx = x
		for j, c := range cols {
			p.SetXY(cx, y)
			p.CellFormat(c.frac*w, lh, fitText(p, cells[j], c.frac*w-1.8), "", 0, "L", false, 0, "")
			cx += c.frac * w
		}
		y += lh
		if y > s.contentBottom()-lh {
			// A prop with very many parts carries on over the page.
			s.newPage()
			y = contentTop + 1
			s.font("", sizeSmall)
			ink(p, inkText)
		}
	}
	return y
}

// rotationText is a part's turn as the project file writes it,
// rotation_deg: degrees about the prop's x, then y, then z axis (R = Rz Ry
// Rx, as physics.EulerXYZ), recovered from the orientation; "none" for
// no turn. An orientation has one such triple with |y| < 90 degrees
// (away from y = ±90, where x and z turn about one axis), so the file's
// own numbers come back whenever they lie in that range.
func rotationText(q physics.Rotation) string {
	x, y, z := eulerXYZ(q)
	if math.Abs(x)+math.Abs(y)+math.Abs(z) < 5e-4 {
		return "none"
	}
	return "(" + fixed(x, 1) + ", " + fixed(y, 1) + ", " + fixed(z, 1) + ")°"
}

// eulerXYZ returns the angles, degrees, with physics.EulerXYZ(x, y, z) = q
// (up to sign), y in [-90, 90].
func eulerXYZ(q physics.Rotation) (x, y, z float64) {
	m := q.Normalize().Mat()
	sy := math.Max(-1, math.Min(1, -m[2][0]))
	y = math.Asin(sy)
	if math.Abs(sy) < 1-1e-12 {
		x = math.Atan2(m[2][1], m[2][2])
		z = math.Atan2(m[1][0], m[0][0])
	} else { // gimbal lock: put the whole turn in z
		z = math.Atan2(-m[0][1], m[1][1])
	}
	return deg(x), deg(y), deg(z)
}
