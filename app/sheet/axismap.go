package sheet

import (
	"bytes"
	"fmt"
	"image/png"

	"github.com/go-pdf/fpdf"
	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics"
	"propflight/widgets/axisview"
)

// The axis map block of the summary page: the map of every spin direction
// (widgets/axisview, the window's own drawing in the print palette) with
// the throw's direction ringed, and beside it what the map says.

// Size of the map picture on paper (mm) and in pixels: small enough that
// the arc chart keeps its place on an A4 summary page of a simple prop;
// text scale 2 at 1100 pixels over 92 mm gives type of about 5.5 points.
const (
	axisMapW       = 92.0
	axisMapH       = 44.0
	axisMapPixW    = 1100
	axisMapPixH    = 526
	axisMapScale   = 2
	axisMapSamples = physics.DefaultMapSamples
)

// axisMap draws the block at y and returns the y below it.
func (s *sheet) axisMap(x, y, w float64) float64 {
	p := s.pdf
	mp := &s.sc.Mass
	m := physics.NewAxisMapper(mp, s.thr)
	spin := s.sc.Throw.SpinAxis(mp)
	img := axisview.Render(m, axisMapPixW, axisMapPixH, axisview.Options{Palette: axisview.PrintPalette(), Scale: axisMapScale, Spin: &spin})
	var buf bytes.Buffer
	if err := png.Encode(&buf, img); err != nil {
		p.SetError(err)
		return y + axisMapH
	}
	name := "axismap"
	p.RegisterImageOptionsReader(name, fpdf.ImageOptions{ImageType: "PNG"}, &buf)
	p.ImageOptions(name, x, y, axisMapW, axisMapH, false, fpdf.ImageOptions{ImageType: "PNG"}, 0, "")

	tx, tw := x+axisMapW+4, w-axisMapW-4
	ty := s.section(tx, y, tw, "Axis map: every spin direction of this prop")
	ty = s.items(tx, ty, tw, 20, s.axisMapItems(m, spin), sizeSmall, true)
	return max(y+axisMapH, ty)
}

// axisMapItems are the words beside the map: the throw's direction and
// verdict, then each motion's share of evenly spread directions.
func (s *sheet) axisMapItems(m *physics.AxisMapper, spin r3.Vec) []item {
	d := m.Verdict(spin)
	what := d.Motion.String() + ", excursion " + fixed(d.ExcursionDeg, 1) + "°"
	if d.HasRatio {
		what += ", spin : wobble 1 : " + sig(d.WobblesPerTurn, 3)
	}
	items := []item{
		{"this throw", "axis " + vec(spin, 3) + " (prop frame), ringed"},
		{"", what},
	}
	items = append(items, mapShares(physics.MapDirections(&s.sc.Mass, s.thr, axisMapSamples))...)
	return append(items,
		item{"views", "each disc is a hemisphere of directions, equal areas kept; a direction and its opposite do the same"},
		item{"reading", "colour is the motion, darker a larger excursion; thin lines are polhodes (every 10°); white, the separatrix"})
}

// mapShares returns each motion's share of n evenly spread directions, in
// the order first met, as "label: percent" items, with the ratio range of
// the spins.
func mapShares(am physics.AxisMap) []item {
	type share struct {
		n      int
		lo, hi float64
		ratio  bool
	}
	var order []string
	groups := map[string]*share{}
	for _, d := range am.Directions {
		key := d.Motion.String()
		if d.Motion == physics.Spinning {
			key = "spin, " + d.Circles.String()
		}
		g := groups[key]
		if g == nil {
			g = &share{lo: 1e300, hi: -1e300}
			groups[key] = g
			order = append(order, key)
		}
		g.n++
		if d.HasRatio {
			g.ratio = true
			g.lo, g.hi = min(g.lo, d.WobblesPerTurn), max(g.hi, d.WobblesPerTurn)
		}
	}
	var out []item
	for _, k := range order {
		g := groups[k]
		v := fmt.Sprintf("%.0f %% of directions", 100*float64(g.n)/float64(len(am.Directions)))
		if g.ratio {
			v += "; 1 : " + sig(g.lo, 3) + " to 1 : " + sig(g.hi, 3)
		}
		out = append(out, item{k, v})
	}
	return out
}
