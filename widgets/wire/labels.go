package wire

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"
)

// Label placement: beside marks, clear of the current prop and of each
// other.

// propDisc returns the screen disc of the prop's sphere about world point
// cm: its projected centre and the projected radius in the plane through
// cm facing the camera.
func (d *drawer) propDisc(cm r3.Vec) [3]float64 {
	x, y, ok := d.lens.Project(cm)
	if !ok || d.radius == 0 {
		return [3]float64{}
	}
	x2, y2, ok := d.lens.Project(r3.Add(cm, r3.Scale(d.radius, d.right)))
	if !ok {
		return [3]float64{}
	}
	return [3]float64{x, y, math.Hypot(x2-x, y2-y)}
}

// clearOf returns the smallest gap, from start pixels up, such that the point
// p + gap dir is outside the avoided disc (by a few pixels), up to 400 px.
func (d *drawer) clearOf(p, dir [2]float64, start float64) float64 {
	c := d.avoid
	r := c[2] + 4
	for g := start; g < 400; g += 2 {
		if math.Hypot(p[0]+g*dir[0]-c[0], p[1]+g*dir[1]-c[1]) >= r {
			return g
		}
	}
	return start
}

// LabelAdvance is the width of one character of label text in pixels that
// Draw assumes when it keeps labels apart (the 7x13 font's advance).
const LabelAdvance = 7.0

// labelBox returns the screen rectangle x0, y0, x1, y1 a label covers
// with its text enlarged ls times.
func labelBox(l Label, ls float64) [4]float64 {
	w := LabelAdvance * ls * float64(len(l.Text))
	x := l.At[0]
	switch l.Align {
	case AlignRight:
		x -= w
	case AlignCentre:
		x -= w / 2
	}
	return [4]float64{x - 1, l.At[1] - LabelHeight*ls - 1, x + w + 1, l.At[1] + 3*ls}
}

// label adds a label. One that would overlap a label already placed is
// moved a line down or up (up to two lines); if it still overlaps it is
// left out, since a label far from its mark misleads.
func (d *drawer) label(at [2]float64, text string, k Kind, al Align) {
	if !finite(at[0]) || !finite(at[1]) {
		return
	}
	line := (LabelHeight + 3) * d.ls
	for _, shift := range [5]float64{0, line, -line, 2 * line, -2 * line} {
		l := Label{At: [2]float64{at[0], at[1] + shift}, Text: text, Kind: k, Align: al}
		b := labelBox(l, d.ls)
		if b[2] < 0 || b[3] < 0 || b[0] > d.xmax || b[1] > d.ymax {
			continue // wholly outside the image
		}
		hit := false
		for _, o := range d.out.Labels {
			c := labelBox(o, d.ls)
			if b[0] < c[2] && c[0] < b[2] && b[1] < c[3] && c[1] < b[3] {
				hit = true
				break
			}
		}
		if !hit {
			d.out.Labels = append(d.out.Labels, l)
			return
		}
	}
}

// labelBeside places text just beyond point p in the screen direction dir
// (a unit vector), gap pixels away, so that the text extends away from p.
func (d *drawer) labelBeside(p, dir [2]float64, gap float64, text string, k Kind) {
	at := [2]float64{p[0] + gap*dir[0], p[1] + gap*dir[1]}
	al := AlignCentre
	switch {
	case dir[0] > 0.35:
		al = AlignLeft
	case dir[0] < -0.35:
		al = AlignRight
	}
	// Below p the text hangs from its top; above, it stands on its baseline;
	// level with p it is centred on the point.
	at[1] += LabelHeight * d.ls * (dir[1] + 1) / 2
	d.label(at, text, k, al)
}

// MinLabelledAxis is the screen length in pixels under which a principal
// axis is drawn without its name.
const MinLabelledAxis = 12.0

// axisLabel names a principal axis beyond its tip.
func (d *drawer) axisLabel(origin, tip r3.Vec, text string, k Kind) {
	ox, oy, ok1 := d.lens.Project(origin)
	tx, ty, ok2 := d.lens.Project(tip)
	if !ok2 {
		return
	}
	n := math.Hypot(tx-ox, ty-oy)
	if !ok1 || n < MinLabelledAxis {
		return // too short on screen to tell which label is whose
	}
	d.labelBeside([2]float64{tx, ty}, [2]float64{(tx - ox) / n, (ty - oy) / n}, 5, text, k)
}
