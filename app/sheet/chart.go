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
	p := s.pdf
	th := &s.sc.Throw
	tk := s.tk
	fr := tk.Frames
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
	px0, py0 := x+padL, y+padT
	pw, ph := w-padL-1, bottom-y-padT-padB
	if pw < 20 || ph < 20 {
		return
	}

	// World extent: the frames, the contact point, the apex and the ground.
	contact := th.CMAt(tk.FlightTime)
	apex := th.CMAt(tk.ApexTime)
	hmin, hmax := math.Inf(1), math.Inf(-1)
	vmin, vmax := th.GroundY, th.GroundY
	grow := func(q r3.Vec) {
		hmin, hmax = math.Min(hmin, hx(q)), math.Max(hmax, hx(q))
		vmin, vmax = math.Min(vmin, q.Y), math.Max(vmax, q.Y)
	}
	for i := range fr {
		grow(fr[i].CM)
	}
	grow(contact)
	grow(apex)
	span := math.Max(hmax-hmin, vmax-vmin)
	if !(span > 0) {
		span = 1
	}
	padW := 0.06 * span
	hmin, hmax, vmin, vmax = hmin-padW, hmax+padW, vmin-padW, vmax+padW
	scale := math.Min(pw/(hmax-hmin), ph/(vmax-vmin)) // mm per m
	// Centre the extent in the plot area.
	cx := px0 + pw/2 - scale*(hmin+hmax)/2
	cy := py0 + ph/2 + scale*(vmin+vmax)/2
	toPage := func(q r3.Vec) (float64, float64) { return cx + scale*hx(q), cy - scale*q.Y }
	// The world shown by the whole plot area.
	wl, wr := (px0-cx)/scale, (px0+pw-cx)/scale
	wb, wt := (cy-(py0+ph))/scale, (cy-py0)/scale

	p.ClipRect(px0, py0, pw, ph, false)
	// Ground band and grid.
	gy := cy - scale*th.GroundY
	if gy < py0+ph {
		box(p, px0, math.Max(gy, py0), pw, py0+ph-math.Max(gy, py0), fillGroundBg)
	}
	step := wire.NiceStep(math.Max(wr-wl, wt-wb) / 12)
	p.SetLineWidth(0.12)
	pen(p, inkFaint)
	for g := math.Ceil(wl/step) * step; g <= wr; g += step {
		p.Line(cx+scale*g, py0, cx+scale*g, py0+ph)
	}
	for g := math.Ceil(wb/step) * step; g <= wt; g += step {
		p.Line(px0, cy-scale*g, px0+pw, cy-scale*g)
	}
	rule(p, px0, gy, px0+pw, gy, 0.45, inkGround)

	// The arc, exact on its parabola (physics.Throw.CMAt), to first contact.
	n := max(1, int(math.Ceil(tk.FlightTime*s.fps()*arcSamples)))
	p.SetLineWidth(0.35)
	pen(p, inkArc)
	ax, ay := toPage(th.CMAt(0))
	for i := 1; i <= n; i++ {
		bx, by := toPage(th.CMAt(tk.FlightTime * float64(i) / float64(n)))
		p.Line(ax, ay, bx, by)
		ax, ay = bx, by
	}

	// Ticks across the arc, perpendicular to it on the page.
	normal := func(i int) (float64, float64) {
		t := fr[i].Time
		dh := hx(r3.Add(th.Position, th.Velocity)) - hx(th.Position) // horizontal speed along the chart axis
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
	for i := range fr {
		tx, ty := toPage(fr[i].CM)
		nx, ny := normal(i)
		half, wd, c := tickHalf, 0.2, inkText
		switch s.tm.roles[i] {
		case Key:
			half, wd = tickHalfKey, 0.3
		case Breakdown:
			half = tickHalfBreak
		}
		if s.opt.Twos && fr[i].N%2 == 1 {
			c = inkRule // a held frame on twos: no new drawing
		}
		rule(p, tx-half*nx, ty-half*ny, tx+half*nx, ty+half*ny, wd, c)
	}

	// Frame numbers: every k frames (k = 1, 2, 5, 10, ...) so that they
	// stay minLabelGap apart, and the keys.
	k := 1
	for _, c := range []int{1, 2, 5, 10, 20, 50, 100, 200, 500, 1000} {
		k = c
		if s.minGap(toPage, c) >= minLabelGap {
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
		tx, ty := toPage(fr[i].CM)
		nx, ny := normal(i)
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
		ax, ay := toPage(fr[min(max(tk.ApexFrame, 0), len(fr)-1)].CM)
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

	// Apex and landing.
	if tk.ApexTime > 0 {
		ax, ay := toPage(apex)
		pen(p, inkAccent)
		p.SetLineWidth(0.3)
		p.Circle(ax, ay, 0.9, "D")
		s.font("B", chartFont+0.6)
		ink(p, inkAccent)
		txt := "apex · frame " + s.frameNo(tk.ApexFrame)
		lx := math.Min(math.Max(ax, px0+p.GetStringWidth(txt)/2+1), px0+pw-p.GetStringWidth(txt)/2-1)
		ly := math.Max(ay-tickHalfKey-6.2, py0+2)
		rule(p, ax, ay-1.2, ax, ly+1.3, 0.15, inkAccent)
		centred(p, lx, ly, txt)
	}
	lx, ly := toPage(contact)
	fill(p, inkAccent)
	p.Circle(lx, ly, 0.8, "F")
	s.font("B", chartFont+0.6)
	ink(p, inkAccent)
	txt := "contact " + fixed(tk.FlightTime, 3) + " s · landing frame " + s.frameNo(tk.LandingFrame)
	tw := p.GetStringWidth(txt)
	tx := lx + 2.5
	if tx+tw > px0+pw-1 {
		tx = lx - 2.5 - tw
	}
	p.Text(tx, math.Min(ly+1, gy-1), txt)
	s.font("", chartFont)
	ink(p, inkSoft)
	p.Text(px0+1, math.Min(gy+2.6, py0+ph-1), "ground y = "+fixed(th.GroundY, 3)+" m")
	p.ClipEnd()

	// Frame, axis numbers and the scale.
	p.SetLineWidth(0.2)
	pen(p, inkRule)
	p.Rect(px0, py0, pw, ph, "D")
	s.font("", chartFont)
	ink(p, inkSoft)
	for g := math.Ceil(wl/step) * step; g <= wr+1e-9; g += step {
		xx := cx + scale*g
		if xx < px0+3 || xx > px0+pw-3 {
			continue
		}
		centred(p, xx, py0+ph+2.8, sig(roundTo(g, step), 3))
	}
	for g := math.Ceil(wb/step) * step; g <= wt+1e-9; g += step {
		yy := cy - scale*g
		if yy < py0+2 || yy > py0+ph-1 {
			continue
		}
		txt := sig(roundTo(g, step), 3)
		p.Text(px0-1.2-p.GetStringWidth(txt), yy+0.9, txt)
	}
	p.Text(px0, py0+ph+6, hName+" · y (m) up")
	ratio := 1000 / scale
	note := "grid " + sig(step, 3) + " m · printed scale 1:" + sig(niceRatio(ratio), 3)
	p.Text(px0+pw-p.GetStringWidth(note), py0+ph+6, note)
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
