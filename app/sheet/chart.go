package sheet

import (
	"math"

	"github.com/go-pdf/fpdf"
	"gonum.org/v1/gonum/spatial/r3"

	"propflight/widgets/wire"
)

// Chart ticks and labels, mm on the page.
const (
	tickHalf      = 1.0 // half length of a frame tick
	tickHalfKey   = 2.2 // at a key
	tickHalfBreak = 1.6 // at a breakdown
	chartFont     = 5.8 // points, frame numbers and axis numbers
	arcSamples    = 8   // straight pieces per frame of the drawn arc
	minLabelGap   = 5.0 // least distance between two frame numbers, mm
)

// horizontal returns the chart's horizontal coordinate of a world point and
// the axis name. It is world x, unless the throw travels sideways (a
// release velocity with a z part), when it is the horizontal distance from
// the release point along the direction of travel, so that the chart is
// the true side view of the arc.
func (s *sheet) horizontal() (func(r3.Vec) float64, string) {
	th := &s.sc.Throw
	vx, vz := th.Velocity.X, th.Velocity.Z
	hv := math.Hypot(vx, vz)
	if hv == 0 || math.Abs(vz) <= 1e-9*hv {
		return func(p r3.Vec) float64 { return p.X }, "x (m)"
	}
	ux, uz := vx/hv, vz/hv
	x0, z0 := th.Position.X, th.Position.Z
	heading := deg(math.Atan2(-vz, vx))
	return func(p r3.Vec) float64 { return (p.X-x0)*ux + (p.Z-z0)*uz },
		"distance along the heading " + fixed(heading, 1) + "° from release (m)"
}

// chart draws the centre-of-mass arc seen square to the throw in the box x, y, w,
// h: equal scale on both axes, a grid at a round spacing, the ground, the
// arc from release to first contact, a tick across the arc at every frame
// (longer at keys and breakdowns), frame numbers where they fit, and the
// apex and landing marked.
func (s *sheet) chart(x, y, w, h float64) {
	hx, hName := s.horizontal()
	bottom := y + h
	// Named as the pose page names its views (viewWords): a throw along x
	// is seen from the front; one with a sideways part, square to its
	// heading.
	viewName := viewWords(PoseFront)
	if hName != "x (m)" {
		viewName = "view square to the heading (distance right, y up)"
	}
	y = s.section(x, y, w, "Centre-of-mass arc, "+viewName+": equal scale, one tick per frame")

	// Plot area, leaving room for the axis numbers.
	const padL, padB, padT = 11.0, 8.0, 2.0
	c := chartArea{px0: x + padL, py0: y + padT, pw: w - padL - 1, ph: bottom - y - padT - padB, hx: hx}
	if c.pw < 20 || c.ph < 20 {
		return
	}
	s.fitChart(&c)
	p := s.pdf
	p.ClipRect(c.px0, c.py0, c.pw, c.ph, false)
	s.chartGround(&c)
	s.chartArc(&c)
	s.chartTicks(&c)
	s.chartFrameNumbers(&c)
	s.chartApexAndContact(&c)
	p.ClipEnd()
	s.chartAxes(&c, hName)
}

// chartArea is the chart's plot area on the page (mm: left, top, width,
// height) and the world it shows: hx gives a world point's horizontal
// coordinate (m), a world point (h, y) lands at (cx + scale h, cy - scale
// y) on the page, and the plot area spans world [wl, wr] x [wb, wt]. step
// is the grid spacing (m) and gy the ground's page y.
type chartArea struct {
	px0, py0, pw, ph float64
	hx               func(r3.Vec) float64
	cx, cy, scale    float64
	wl, wr, wb, wt   float64
	step, gy         float64
}

// toPage returns the page position (mm) of world point q.
func (c *chartArea) toPage(q r3.Vec) (float64, float64) {
	return c.cx + c.scale*c.hx(q), c.cy - c.scale*q.Y
}

// fitChart sets the scale and centre of c so that the world extent (the
// frames, the contact point, the apex and the ground, with a margin)
// fills its plot area at equal scale on both axes, centred, and the grid
// step and ground line that follow.
func (s *sheet) fitChart(c *chartArea) {
	th := &s.sc.Throw
	tk := s.tk
	hmin, hmax := math.Inf(1), math.Inf(-1)
	vmin, vmax := th.GroundY, th.GroundY
	grow := func(q r3.Vec) {
		hmin, hmax = math.Min(hmin, c.hx(q)), math.Max(hmax, c.hx(q))
		vmin, vmax = math.Min(vmin, q.Y), math.Max(vmax, q.Y)
	}
	for i := range tk.Frames {
		grow(tk.Frames[i].CM)
	}
	grow(th.CMAt(tk.FlightTime))
	grow(th.CMAt(tk.ApexTime))
	span := math.Max(hmax-hmin, vmax-vmin)
	if !(span > 0) {
		span = 1
	}
	padW := 0.06 * span
	hmin, hmax, vmin, vmax = hmin-padW, hmax+padW, vmin-padW, vmax+padW
	c.scale = math.Min(c.pw/(hmax-hmin), c.ph/(vmax-vmin)) // mm per m
	// Centre the extent in the plot area.
	c.cx = c.px0 + c.pw/2 - c.scale*(hmin+hmax)/2
	c.cy = c.py0 + c.ph/2 + c.scale*(vmin+vmax)/2
	// The world shown by the whole plot area.
	c.wl, c.wr = (c.px0-c.cx)/c.scale, (c.px0+c.pw-c.cx)/c.scale
	c.wb, c.wt = (c.cy-(c.py0+c.ph))/c.scale, (c.cy-c.py0)/c.scale
	c.step = wire.NiceStep(math.Max(c.wr-c.wl, c.wt-c.wb) / 12)
	c.gy = c.cy - c.scale*th.GroundY
}

// chartGround draws the ground band, the grid and the ground line.
func (s *sheet) chartGround(c *chartArea) {
	p := s.pdf
	if c.gy < c.py0+c.ph {
		box(p, c.px0, math.Max(c.gy, c.py0), c.pw, c.py0+c.ph-math.Max(c.gy, c.py0), fillGroundBg)
	}
	p.SetLineWidth(0.12)
	pen(p, inkFaint)
	for g := math.Ceil(c.wl/c.step) * c.step; g <= c.wr; g += c.step {
		p.Line(c.cx+c.scale*g, c.py0, c.cx+c.scale*g, c.py0+c.ph)
	}
	for g := math.Ceil(c.wb/c.step) * c.step; g <= c.wt; g += c.step {
		p.Line(c.px0, c.cy-c.scale*g, c.px0+c.pw, c.cy-c.scale*g)
	}
	rule(p, c.px0, c.gy, c.px0+c.pw, c.gy, 0.45, inkGround)
}

// chartArc draws the arc, exact on its parabola (physics.Throw.CMAt), to
// first contact.
func (s *sheet) chartArc(c *chartArea) {
	p := s.pdf
	th := &s.sc.Throw
	tk := s.tk
	n := max(1, int(math.Ceil(tk.FlightTime*s.fps()*arcSamples)))
	p.SetLineWidth(0.35)
	pen(p, inkArc)
	ax, ay := c.toPage(th.CMAt(0))
	for i := 1; i <= n; i++ {
		bx, by := c.toPage(th.CMAt(tk.FlightTime * float64(i) / float64(n)))
		p.Line(ax, ay, bx, by)
		ax, ay = bx, by
	}
}

// chartNormal returns the unit normal (page coordinates, y down) of the
// arc at frame i, pointing up the page.
func (s *sheet) chartNormal(c *chartArea, i int) (float64, float64) {
	th := &s.sc.Throw
	t := s.tk.Frames[i].Time
	dh := c.hx(r3.Add(th.Position, th.Velocity)) - c.hx(th.Position) // horizontal speed along the chart axis
	dv := th.Velocity.Y - th.Gravity*t
	l := math.Hypot(dh, dv)
	if l == 0 {
		return 0, -1
	}
	nx, ny := -dv/l, -dh/l // page coordinates: y down
	if ny > 0 {
		nx, ny = -nx, -ny
	}
	return nx, ny
}

// chartTicks draws a tick across the arc at every frame, perpendicular to
// it on the page: longer and heavier at keys, longer at breakdowns, pale
// on a frame held on twos.
func (s *sheet) chartTicks(c *chartArea) {
	fr := s.tk.Frames
	for i := range fr {
		tx, ty := c.toPage(fr[i].CM)
		nx, ny := s.chartNormal(c, i)
		half, wd, col := tickHalf, 0.2, inkText
		switch s.tm.roles[i] {
		case Key:
			half, wd = tickHalfKey, 0.3
		case Breakdown:
			half = tickHalfBreak
		}
		if s.opt.Twos && fr[i].N%2 == 1 {
			col = inkRule // a held frame on twos: no new drawing
		}
		rule(s.pdf, tx-half*nx, ty-half*ny, tx+half*nx, ty+half*ny, wd, col)
	}
}

// chartFrameNumbers writes frame numbers beside the ticks: every k frames
// (k = 1, 2, 5, 10, ...) so that they stay minLabelGap apart, and the
// keys; a number that would crowd one already placed is left out.
func (s *sheet) chartFrameNumbers(c *chartArea) {
	p := s.pdf
	tk := s.tk
	fr := tk.Frames
	k := 1
	for _, n := range []int{1, 2, 5, 10, 20, 50, 100, 200, 500, 1000} {
		k = n
		if s.minGap(c.toPage, n) >= minLabelGap {
			break
		}
	}
	if s.opt.Twos && k%2 == 1 && k > 1 {
		k++
	}
	s.font("", chartFont)
	ink(p, inkText)
	var placed [][2]float64
	label := func(i int, force bool) {
		tx, ty := c.toPage(fr[i].CM)
		nx, ny := s.chartNormal(c, i)
		lx, ly := tx+nx*(tickHalfKey+1.8), ty+ny*(tickHalfKey+1.8)
		if !force {
			for _, q := range placed {
				if math.Hypot(q[0]-lx, q[1]-ly) < minLabelGap*0.8 {
					return
				}
			}
		}
		placed = append(placed, [2]float64{lx, ly})
		centred(p, lx, ly, s.frameNo(fr[i].N))
	}
	// The apex has its own label; reserve its place.
	if tk.ApexTime > 0 {
		ax, ay := c.toPage(fr[min(max(tk.ApexFrame, 0), len(fr)-1)].CM)
		placed = append(placed, [2]float64{ax, ay - tickHalfKey - 1.8})
	}
	for _, kf := range s.tm.keys {
		if kf != tk.ApexFrame || tk.ApexTime == 0 {
			label(kf, true)
		}
	}
	for i := range fr {
		if fr[i].N%k == 0 {
			label(i, false)
		}
	}
}

// chartApexAndContact rings the apex with its frame, dots the first
// contact with its time and landing frame, and names the ground's height.
func (s *sheet) chartApexAndContact(c *chartArea) {
	p := s.pdf
	th := &s.sc.Throw
	tk := s.tk
	if tk.ApexTime > 0 {
		ax, ay := c.toPage(th.CMAt(tk.ApexTime))
		pen(p, inkAccent)
		p.SetLineWidth(0.3)
		p.Circle(ax, ay, 0.9, "D")
		s.font("B", chartFont+0.6)
		ink(p, inkAccent)
		txt := "apex · frame " + s.frameNo(tk.ApexFrame)
		lx := math.Min(math.Max(ax, c.px0+p.GetStringWidth(txt)/2+1), c.px0+c.pw-p.GetStringWidth(txt)/2-1)
		ly := math.Max(ay-tickHalfKey-6.2, c.py0+2)
		rule(p, ax, ay-1.2, ax, ly+1.3, 0.15, inkAccent)
		centred(p, lx, ly, txt)
	}
	lx, ly := c.toPage(th.CMAt(tk.FlightTime))
	fill(p, inkAccent)
	p.Circle(lx, ly, 0.8, "F")
	s.font("B", chartFont+0.6)
	ink(p, inkAccent)
	txt := "contact " + fixed(tk.FlightTime, 3) + " s · landing frame " + s.frameNo(tk.LandingFrame)
	tw := p.GetStringWidth(txt)
	tx := lx + 2.5
	if tx+tw > c.px0+c.pw-1 {
		tx = lx - 2.5 - tw
	}
	p.Text(tx, math.Min(ly+1, c.gy-1), txt)
	s.font("", chartFont)
	ink(p, inkSoft)
	p.Text(c.px0+1, math.Min(c.gy+2.6, c.py0+c.ph-1), "ground y = "+fixed(th.GroundY, 3)+" m")
}

// chartAxes draws the plot area's frame, the axis numbers at the grid
// lines, the axis names (hName for the horizontal one) and the grid
// spacing with the printed scale.
func (s *sheet) chartAxes(c *chartArea, hName string) {
	p := s.pdf
	p.SetLineWidth(0.2)
	pen(p, inkRule)
	p.Rect(c.px0, c.py0, c.pw, c.ph, "D")
	s.font("", chartFont)
	ink(p, inkSoft)
	for g := math.Ceil(c.wl/c.step) * c.step; g <= c.wr+1e-9; g += c.step {
		xx := c.cx + c.scale*g
		if xx < c.px0+3 || xx > c.px0+c.pw-3 {
			continue
		}
		centred(p, xx, c.py0+c.ph+2.8, sig(roundTo(g, c.step), 3))
	}
	for g := math.Ceil(c.wb/c.step) * c.step; g <= c.wt+1e-9; g += c.step {
		yy := c.cy - c.scale*g
		if yy < c.py0+2 || yy > c.py0+c.ph-1 {
			continue
		}
		txt := sig(roundTo(g, c.step), 3)
		p.Text(c.px0-1.2-p.GetStringWidth(txt), yy+0.9, txt)
	}
	p.Text(c.px0, c.py0+c.ph+6, hName+" · y (m) up")
	ratio := 1000 / c.scale
	note := "grid " + sig(c.step, 3) + " m · printed scale 1:" + sig(niceRatio(ratio), 3)
	p.Text(c.px0+c.pw-p.GetStringWidth(note), c.py0+c.ph+6, note)
}

// minGap returns the least page distance between frames k apart.
func (s *sheet) minGap(toPage func(r3.Vec) (float64, float64), k int) float64 {
	fr := s.tk.Frames
	gap := math.Inf(1)
	for i := 0; i+k < len(fr); i += k {
		ax, ay := toPage(fr[i].CM)
		bx, by := toPage(fr[i+k].CM)
		gap = math.Min(gap, math.Hypot(bx-ax, by-ay))
	}
	return gap
}

// roundTo rounds v to a multiple of step, so that grid values print
// without round-off digits (and never as "−0").
func roundTo(v, step float64) float64 {
	r := math.Round(v/step) * step
	if math.Abs(r) < step*1e-9 {
		return 0
	}
	return r
}

// niceRatio rounds a scale ratio to three significant figures.
func niceRatio(r float64) float64 {
	if !(r > 0) || math.IsInf(r, 0) {
		return r
	}
	p := math.Pow(10, math.Floor(math.Log10(r))-2)
	return math.Round(r/p) * p
}

// centred writes text with its baseline centre at x and its middle near y.
func centred(p *fpdf.Fpdf, x, y float64, txt string) {
	_, u := p.GetFontSize()
	p.Text(x-p.GetStringWidth(txt)/2, y+u*0.35, txt)
}
