package ui

import (
	"math"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/container"
	"fyne.io/fyne/v2/theme"
	"fyne.io/fyne/v2/widget"
	"gonum.org/v1/gonum/spatial/r3"

	"propflight/app/editor"
	"propflight/app/project"
	"propflight/physics"
	"propflight/widgets"
)

// axisMapPane is the axis map under the verdict: what every spin
// direction of the prop does, the throw's direction ringed. Hovering
// tells a direction's verdict; clicking throws the prop spinning about it
// (one undo step).
type axisMapPane struct {
	w       *Window
	content fyne.CanvasObject
	view    *widgets.AxisMap
	hover   *widget.Label

	mass physics.MassProps  // what the shown mapper was made for
	thr  physics.Thresholds // ditto
}

// axisMapHint is the hover line while the pointer is off the map.
const axisMapHint = "Point at a direction to read its verdict; click it to spin the throw about it."

func newAxisMapPane(w *Window) *axisMapPane {
	p := &axisMapPane{w: w}
	p.view = widgets.NewAxisMap()
	p.view.Synchronous = w.synchronous
	p.hover = widget.NewLabel(axisMapHint)
	p.hover.Wrapping = fyne.TextWrapWord
	p.view.OnHover = func(text string) {
		if text == "" {
			text = axisMapHint
		}
		p.hover.SetText(text)
	}
	p.view.OnPick = p.pick
	// The hover line keeps one height whatever it says, so the map under
	// the pointer never moves between pointing and clicking.
	lines := theme.TextSize()*1.3*axisMapHoverLines + 2*theme.InnerPadding()
	p.content = container.NewBorder(
		container.NewVBox(heading("Axis map"), note("Every spin direction of this prop, at any rate; the ring is this throw.")),
		container.New(fixedHeight(lines), p.hover), nil, nil, p.view)
	return p
}

// axisMapHoverLines is how many lines of text the hover line has room for.
const axisMapHoverLines = 4

var _ fyne.Layout = fixedHeight(0)

// fixedHeight is a layout that asks for exactly its height (and the
// objects' width), whatever the objects want: text longer than that is
// clipped rather than moving the objects around it.
type fixedHeight float32

func (h fixedHeight) MinSize(objs []fyne.CanvasObject) fyne.Size {
	var w float32
	for _, o := range objs {
		w = max(w, o.MinSize().Width)
	}
	return fyne.NewSize(w, float32(h))
}

func (h fixedHeight) Layout(objs []fyne.CanvasObject, size fyne.Size) { stack(objs, size) }

// show follows result res: a new map when the prop's principal moments or
// axes or the thresholds changed, and the ring on the throw's spin.
func (p *axisMapPane) show(res editor.Result) {
	if res.Scene == nil {
		return
	}
	mp := res.Scene.Mass
	if p.view.Mapper() == nil || mp.Moments != p.mass.Moments || mp.Axes != p.mass.Axes || res.Thresholds != p.thr {
		p.mass, p.thr = mp, res.Thresholds
		p.view.SetMapper(physics.NewAxisMapper(&mp, res.Thresholds))
	}
	p.view.SetSpin(res.Scene.Throw.SpinAxis(&mp))
}

// pick sets the throw's spin axis to dir (prop frame), keeping the rate:
// one undoable edit. The direction is written to 4 decimals, within
// 0.01 degrees of the one clicked.
func (p *axisMapPane) pick(dir r3.Vec) {
	if r3.Norm(dir) == 0 {
		return
	}
	d := r3.Unit(dir)
	round := func(x float64) float64 { return math.Round(x*1e4) / 1e4 }
	vec := project.Vec3{round(d.X), round(d.Y), round(d.Z)}
	p.w.editAndSync("Spin from the axis map", func(doc *project.Document) error {
		setFreeAxis(doc, vec)
		return nil
	})
}
