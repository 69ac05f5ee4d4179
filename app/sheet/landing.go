package sheet

import (
	"fmt"
	"math"

	"propflight/physics"
)

// Landing is the sheet's optional landing page: what the plan aims for,
// the solutions it found and the spread's figures. Either Plan or Spread
// may be nil.
type Landing struct {
	Target    string      // the aim in words, "the greatest axis pointing up"
	End       physics.End // where the flight ends
	Tolerance float64     // radians
	// RateMin and RateMax are the plan's searched range, rad/s.
	RateMin, RateMax float64
	Plan             *physics.Plan
	Spread           *physics.Spread
	Errors           physics.SpreadSpec // the sds the spread sampled
}

// maxLandingRows is the most solutions the page lists (the best always among them).
const maxLandingRows = 24

// landingPage draws the landing page.
func (s *sheet) landingPage() error {
	l := s.in.Landing
	p := s.pdf
	s.newPage()
	x, w := margin, s.width()
	y := contentTop + 1
	y = s.section(x, y, w, "Landing: plan and spread")
	end := "at the first ground contact of the prop's lowest point"
	if l.End.Catch {
		end = "at the catch: the centre of mass comes down through " + fixed(l.End.CatchY, 3) + " m"
	}
	list := []item{
		{"Target", l.Target},
		{"End of flight", end},
		{"Tolerance", fixed(deg(l.Tolerance), 1) + "°"},
	}
	fps := s.fps()
	if pl := l.Plan; pl != nil {
		list = append(list, item{"Rates searched", fixed(l.RateMin/(2*math.Pi), 2) + "–" + fixed(l.RateMax/(2*math.Pi), 2) +
			" turns/s about the throw's spin direction (" + pl.Motion.String() + "), " + plural(len(pl.Rates), "rate") + " sampled"})
		if l.End.Catch {
			list = append(list, item{"Flight", fixed(pl.FlightTime, 3) + " s (" + fixed(pl.FlightTime*fps, 1) + " frames) at every rate"})
		}
	}
	y = s.items(x, y, w, 30, list, sizeSmall, true) + 3
	if pl := l.Plan; pl != nil {
		y = s.solutionsTable(x, y, w, pl, fps) + 4
	}
	if sp := l.Spread; sp != nil {
		y = s.section(x, y, w, "Spread: "+plural(sp.Samples, "sampled throw")+" (seed "+fmt.Sprint(sp.Seed)+")")
		e := l.Errors
		tps := s.sc.Throw.Spin.Rate / (2 * math.Pi)
		figs := []item{{"Throw sampled", "the project's: spinning " + fixed(tps, 4) + " turns/s (" + fixed(fps/tps, 2) + " frames per turn)"}, {"Release errors (sd)", "spin rate " + fixed(100*e.RateSD, 1) + " %, spin direction " + fixed(deg(e.TiltSD), 1) +
			"° toward a random side, release speed " + fixed(100*e.SpeedSD, 1) + " %, release angle " + fixed(deg(e.AngleSD), 1) + "°"}}
		if sp.HasTarget {
			figs = append(figs,
				item{"Within tolerance", fixed(100*sp.WithinTolerance, 1) + " % of the throws"},
				item{"Landing error", "median " + fixed(deg(sp.ErrorP50), 1) + "°, 90th percentile " + fixed(deg(sp.ErrorP90), 1) + "°"})
		}
		figs = append(figs,
			item{"Tumbles", fixed(100*sp.TumbleFraction, 1) + " % of the throws"},
			item{"Landing point", "sd " + fixed(sp.LandingSD[0], 3) + " m along x, " + fixed(sp.LandingSD[1], 3) + " m along z"},
			item{"Flight time", "sd " + fixed(sp.FlightTimeSD, 3) + " s (" + fixed(sp.FlightTimeSD*fps, 1) + " frames)"})
		if sp.Short > 0 {
			figs = append(figs, item{"Short", plural(sp.Short, "throw") + " top out below the catch height (misses)"})
		}
		y = s.items(x, y, w, 30, figs, sizeSmall, true) + 4
		if h := math.Min(62, s.contentBottom()-y); h > 30 {
			half := (w - 6) / 2
			if sp.HasTarget {
				s.errorHistogram(x, y, half, h, sp, l.Tolerance)
			}
			s.landingScatter(x+half+6, y, half, h, sp)
		}
	}
	ink(p, inkText)
	return s.step()
}

// solutionsTable lists the plan's solutions (or says there is none).
func (s *sheet) solutionsTable(x, y, w float64, pl *physics.Plan, fps float64) float64 {
	p := s.pdf
	lh := lineH(sizeSmall) + 0.4
	if len(pl.Solutions) == 0 {
		s.font("", sizeSmall)
		p.SetXY(x, y)
		p.CellFormat(w, lh, "No spin rate in the range lands within tolerance.", "", 0, "L", false, 0, "")
		return y + lh
	}
	heads := []string{"#", "turns/s", "frames/turn", "turns in the air", "error", "flight", "window (turns/s)"}
	fr := []float64{0.05, 0.12, 0.13, 0.16, 0.1, 0.11, 0.33}
	s.font("B", sizeSmall)
	ink(p, inkSoft)
	cx := x
	for i, h := range heads {
		p.SetXY(cx, y)
		p.CellFormat(fr[i]*w, lh, h, "", 0, "L", false, 0, "")
		cx += fr[i] * w
	}
	y += lh
	rule(p, x, y, x+w, y, 0.15, inkRule)
	best := pl.Best()
	first := 0
	if len(pl.Solutions) > maxLandingRows && best >= maxLandingRows {
		first = best - maxLandingRows + 1
	}
	for i := first; i < min(len(pl.Solutions), first+maxLandingRows); i++ {
		so := pl.Solutions[i]
		tps := so.Rate / (2 * math.Pi)
		style := ""
		if i == best {
			box(p, x, y, w, lh, fillKey)
			style = "B"
		}
		s.font(style, sizeSmall)
		ink(p, inkText)
		cells := []string{itoa(i + 1), fixed(tps, 4), fixed(fps/tps, 2), fixed(so.Turns, 2), fixed(deg(so.Error), 1) + "°",
			fixed(so.FlightTime, 3) + " s", fixed(so.WindowLo/(2*math.Pi), 4) + "–" + fixed(so.WindowHi/(2*math.Pi), 4) +
				" (±" + fixed((so.WindowHi-so.WindowLo)/(4*math.Pi), 4) + ")"}
		cx = x
		for j, c := range cells {
			p.SetXY(cx, y)
			p.CellFormat(fr[j]*w, lh, c, "", 0, "L", false, 0, "")
			cx += fr[j] * w
		}
		y += lh
	}
	if n := len(pl.Solutions); n > maxLandingRows {
		s.font("", sizeSmall)
		ink(p, inkSoft)
		p.SetXY(x, y)
		p.CellFormat(w, lh, fmt.Sprintf("%d of %d solutions listed; the best is shaded.", maxLandingRows, n), "", 0, "L", false, 0, "")
		y += lh
	}
	return y
}

// errorHistogram draws the landing errors in 5-degree bins from 0 to 180,
// the tolerance as a line.
func (s *sheet) errorHistogram(x, y, w, h float64, sp *physics.Spread, tol float64) {
	p := s.pdf
	bins := ErrorBins(sp, 36)
	top := 1
	for _, b := range bins {
		top = max(top, b)
	}
	s.font("B", sizeSmall)
	ink(p, inkText)
	p.SetXY(x, y)
	p.CellFormat(w, 4, "Landing error (degrees)", "", 0, "L", false, 0, "")
	gx, gy, gw, gh := x, y+5, w, h-10
	box(p, gx, gy, gw, gh, fillPanel)
	bw := gw / float64(len(bins))
	for i, b := range bins {
		bh := gh * float64(b) / float64(top)
		box(p, gx+float64(i)*bw+0.15, gy+gh-bh, bw-0.3, bh, inkArc)
	}
	tx := gx + gw*math.Min(deg(tol), 180)/180
	rule(p, tx, gy, tx, gy+gh, 0.35, inkAccent)
	s.font("", sizeSmall-1)
	ink(p, inkSoft)
	for _, d := range []float64{0, 45, 90, 135, 180} {
		p.SetXY(gx+gw*d/180-5, gy+gh+0.5)
		p.CellFormat(10, 3.5, fixed(d, 0), "", 0, "C", false, 0, "")
	}
}

// landingScatter draws the landing points from above: x right, z down
// the page (the world seen from +y), with equal scales.
func (s *sheet) landingScatter(x, y, w, h float64, sp *physics.Spread) {
	p := s.pdf
	s.font("B", sizeSmall)
	ink(p, inkText)
	p.SetXY(x, y)
	p.CellFormat(w, 4, "Landing points from above (x right, z down), m", "", 0, "L", false, 0, "")
	gx, gy, gw, gh := x, y+5, w, h-10
	box(p, gx, gy, gw, gh, fillGroundBg)
	minX, maxX, minZ, maxZ := math.Inf(1), math.Inf(-1), math.Inf(1), math.Inf(-1)
	for _, pt := range sp.Points {
		if pt.Short {
			continue
		}
		minX, maxX = math.Min(minX, pt.Landing.X), math.Max(maxX, pt.Landing.X)
		minZ, maxZ = math.Min(minZ, pt.Landing.Z), math.Max(maxZ, pt.Landing.Z)
	}
	if math.IsInf(minX, 0) {
		return
	}
	span := math.Max(math.Max(maxX-minX, maxZ-minZ), 0.02) * 1.15
	cxw, czw := (minX+maxX)/2, (minZ+maxZ)/2
	scale := math.Min(gw, gh) / span
	fill(p, inkArc)
	for _, pt := range sp.Points {
		if pt.Short {
			continue
		}
		px := gx + gw/2 + (pt.Landing.X-cxw)*scale
		py := gy + gh/2 + (pt.Landing.Z-czw)*scale
		p.Circle(px, py, 0.35, "F")
	}
	s.font("", sizeSmall-1)
	ink(p, inkSoft)
	p.SetXY(gx, gy+gh+0.5)
	p.CellFormat(gw, 3.5, "the landing points span "+fixed(span/1.15, 3)+" m (the larger of x and z)", "", 0, "L", false, 0, "")
}

// ErrorBins counts a spread's landing errors in n equal bins from 0 to 180
// degrees (the window's histogram uses the same bins).
func ErrorBins(sp *physics.Spread, n int) []int {
	bins := make([]int, n)
	for _, pt := range sp.Points {
		i := int(pt.Error / math.Pi * float64(n))
		bins[max(0, min(i, n-1))]++
	}
	return bins
}
