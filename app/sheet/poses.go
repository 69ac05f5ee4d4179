package sheet

import (
	"math"
	"slices"

	"github.com/go-pdf/fpdf"
	"gonum.org/v1/gonum/spatial/r3"

	"propflight/widgets/wire"
)

// Pose grid.
const (
	maxPoses  = 25  // poses on the pose page at most
	poseCols  = 5   // cells across
	poseGap   = 2.0 // mm between cells
	pxPerMM   = 4.0 // wire pixels per millimetre of paper (0.25 mm a pixel)
	poseHeadH = 7.0 // mm of cell above the drawing: frame number and role
	poseFootH = 3.6 // mm of cell below the drawing: total turn
	poseRoom  = 1.0 // the drawing shows the prop's radius times this each way
)

// poseFrames picks the frames drawn on the pose page: the keys, the
// breakdowns, and every nth frame from 0, with n the smallest step (even
// on twos, so that in-betweens are drawn frames) that keeps the count
// within limit. It returns the frames, ascending, and n.
func (tm *timing) poseFrames(twos bool, limit int) ([]int, int) {
	last := len(tm.frames) - 1
	fixedFrames := append(slices.Clone(tm.keys), breakdownFrames(tm.keys)...)
	start := 1
	if twos {
		start = 2
	}
	var out []int
	for n := start; ; n += start {
		out = slices.Clone(fixedFrames)
		for f := 0; f <= last; f += n {
			out = append(out, f)
		}
		slices.Sort(out)
		out = slices.Compact(out)
		if len(out) <= limit || n > last {
			return out, n
		}
	}
}

// propRadius returns the largest distance of the prop's mesh from its
// centre of mass, m (a mesh part's own vertices, not a tessellation).
func (s *sheet) propRadius() float64 {
	return wire.Radius(&s.sc.Prop, &s.sc.Mass, wire.DefaultDetail)
}

// posePage draws the prop at each pose frame in a grid of cells, every
// cell at the same scale, each drawing the 2D segments of wire.Draw turned
// into PDF lines.
func (s *sheet) posePage() error {
	p := s.pdf
	s.newPage()
	x, w := margin, s.width()
	y := contentTop + 1
	view := s.poseView
	words := viewWords(view)
	if s.opt.PoseView == PoseBest {
		words += " (chosen: it shows the poses largest)"
	}
	y = s.section(x, y, w, "Poses: the keys, the breakdowns and "+everyNth(s.poseStep)+" frame")
	s.font("", sizeSmall)
	ink(p, inkSoft)
	p.SetXY(x, y)
	p.CellFormat(w, lineH(sizeSmall), "Same lines as the preview, "+words+", one scale; grey line: the ground.", "", 0, "L", false, 0, "")
	y += lineH(sizeSmall) + 2

	rows := (len(s.poses) + poseCols - 1) / poseCols
	cellW := (w - poseGap*(poseCols-1)) / poseCols
	cellH := math.Min((s.contentBottom()-y-poseGap*float64(rows-1))/float64(max(rows, 1)), cellW*1.15)
	radius := s.propRadius()
	pal := wire.PrintPalette()
	for i, f := range s.poses {
		if err := s.step(); err != nil {
			return err
		}
		cx := x + float64(i%poseCols)*(cellW+poseGap)
		cy := y + float64(i/poseCols)*(cellH+poseGap)
		s.poseCell(cx, cy, cellW, cellH, f, radius, view, &pal)
	}
	return p.Error()
}

// everyNth returns "every", "every 2nd", "every 21st", ... for a step of
// n frames.
func everyNth(n int) string {
	if n <= 1 {
		return "every"
	}
	return "every " + ordinal(n)
}

// ordinal returns "1st", "2nd", "3rd", "5th", "11th", "21st".
func ordinal(n int) string {
	switch {
	case n%100 >= 11 && n%100 <= 13:
		return itoa(n) + "th"
	case n%10 == 1:
		return itoa(n) + "st"
	case n%10 == 2:
		return itoa(n) + "nd"
	case n%10 == 3:
		return itoa(n) + "rd"
	}
	return itoa(n) + "th"
}

// poseCell draws one pose: frame f in the cell at x, y of w by h mm.
func (s *sheet) poseCell(x, y, w, h float64, f int, radius float64, view PoseView, pal *wire.Palette) {
	p := s.pdf
	fr := &s.tk.Frames[f]
	role := s.tm.roles[f]
	head := fillPanel
	switch role {
	case Key:
		head = fillKey
	case Breakdown:
		head = fillBreak
	}
	box(p, x, y, w, poseHeadH, head)
	p.SetLineWidth(0.2)
	pen(p, inkRule)
	p.Rect(x, y, w, h, "D")
	s.font("B", 8)
	ink(p, inkText)
	p.SetXY(x+0.5, y+0.4)
	p.CellFormat(w-1, 3.6, "frame "+s.frameNo(fr.N), "", 0, "L", false, 0, "")
	s.font("", 5.8)
	ink(p, inkSoft)
	p.SetXY(x+0.5, y+3.7)
	words := "in-between"
	if len(s.tm.notes[f]) > 0 {
		words = joinNotes(s.tm.notes[f])
	} else if role == Breakdown {
		words = "breakdown"
	}
	p.CellFormat(w-1, 3, fitText(p, words, w-2.6), "", 0, "L", false, 0, "")
	p.SetXY(x+0.5, y+h-poseFootH)
	p.CellFormat(w-1, poseFootH, "total turn "+fixed(s.tm.total[f], DecimalsTotal)+"°", "", 0, "L", false, 0, "")

	// The drawing area and its camera, framed on the prop's sphere.
	ax, ay := x+0.6, y+poseHeadH+0.4
	aw, ah := w-1.2, h-poseHeadH-poseFootH-0.6
	pxW, pxH := max(int(math.Round(aw*pxPerMM)), 16), max(int(math.Round(ah*pxPerMM)), 16)
	mmX, mmY := aw/float64(pxW), ah/float64(pxH)
	cam := poseCamera(view, pxW, pxH, &s.sc.Mass, s.tk)
	rr := radius * poseRoom
	cam.Frame(r3.Box{Min: r3.Sub(fr.CM, r3.Vec{X: rr, Y: rr, Z: rr}), Max: r3.Add(fr.CM, r3.Vec{X: rr, Y: rr, Z: rr})})
	sc := wire.Scene{Prop: &s.sc.Prop, Mass: &s.sc.Mass, Take: s.tk, Frame: f, GroundY: s.sc.Throw.GroundY}
	d := wire.Draw(cam, sc)

	p.ClipRect(ax, ay, aw, ah, false)
	// The ground, when it crosses the drawing.
	lens := cam.Lens()
	if gx0, gy0, ok0 := lens.Project(r3.Vec{X: fr.CM.X - 10*rr, Y: s.sc.Throw.GroundY, Z: fr.CM.Z}); ok0 {
		if gx1, gy1, ok1 := lens.Project(r3.Vec{X: fr.CM.X + 10*rr, Y: s.sc.Throw.GroundY, Z: fr.CM.Z}); ok1 {
			rule(p, ax+gx0*mmX, ay+gy0*mmY, ax+gx1*mmX, ay+gy1*mmY, 0.35, inkRule)
		}
	}
	drawSegments(p, d, pal, ax, ay, mmX, mmY)
	p.ClipEnd()
}

// drawSegments paints a wire drawing onto the page with its top-left
// corner at x, y: pixel (px, py) goes to (x + px mmX, y + py mmY) mm. Each
// segment becomes one PDF line in its kind's colour, its width in pixels
// scaled to millimetres; labels become text.
func drawSegments(p *fpdf.Fpdf, d wire.Drawing, pal *wire.Palette, x, y, mmX, mmY float64) {
	mm := (mmX + mmY) / 2
	p.SetLineCapStyle("round")
	p.SetLineJoinStyle("round")
	cur := wire.Kind(-1)
	curAlpha := -1.0
	translucent := false
	for _, sg := range d.Segments {
		if sg.Kind < 0 || sg.Kind >= wire.NumKinds {
			continue
		}
		st := pal.Styles[sg.Kind]
		a := float64(st.Color.A) / 255 * sg.Alpha
		if !(st.Width > 0) || !(a > 0) {
			continue
		}
		if sg.Kind != cur || a != curAlpha {
			p.SetDrawColor(int(st.Color.R), int(st.Color.G), int(st.Color.B))
			p.SetLineWidth(st.Width * mm)
			if a < 1 || translucent {
				p.SetAlpha(math.Min(a, 1), "Normal")
				translucent = a < 1
			}
			cur, curAlpha = sg.Kind, a
		}
		p.Line(x+sg.A[0]*mmX, y+sg.A[1]*mmY, x+sg.B[0]*mmX, y+sg.B[1]*mmY)
	}
	if translucent {
		p.SetAlpha(1, "Normal")
	}
	p.SetLineCapStyle("butt")
	p.SetLineJoinStyle("miter")
	if len(d.Labels) == 0 {
		return
	}
	size := wire.LabelHeight * mm / 0.3528 * 0.8
	p.SetFontSize(size)
	for _, l := range d.Labels {
		if l.Kind < 0 || l.Kind >= wire.NumKinds {
			continue
		}
		c := pal.Styles[l.Kind].Color
		p.SetTextColor(int(c.R), int(c.G), int(c.B))
		tx := x + l.At[0]*mmX
		tw := p.GetStringWidth(l.Text)
		switch l.Align {
		case wire.AlignRight:
			tx -= tw
		case wire.AlignCentre:
			tx -= tw / 2
		}
		p.Text(tx, y+l.At[1]*mmY, l.Text)
	}
}

// joinNotes joins a frame's notes with " · ".
func joinNotes(m []string) string {
	out := ""
	for i, s := range m {
		if i > 0 {
			out += " · "
		}
		out += s
	}
	return out
}
