package ui

import (
	"math"
	"strings"
	"testing"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/driver/desktop"
	"fyne.io/fyne/v2/test"
	"gonum.org/v1/gonum/spatial/r3"

	"propflight/widgets/axisview"
)

// TestAxisMap_ClickStableDirection_SpinsAndUndo is the new user's path:
// the frying pan tumbles (spun near its middle axis); hovering over its
// greatest axis on the map says it would spin there; clicking it makes
// the throw spin about it as one undo step, and undo brings the tumble
// back.
func TestAxisMap_ClickStableDirection_SpinsAndUndo(t *testing.T) {
	w := newTestWindow(t, "frying-pan")
	w.win.Resize(fyne.NewSize(1500, 1000))
	if w.verdict.report.Motion != "tumble" {
		t.Fatalf("the pan starts as a %q, want tumble", w.verdict.report.Motion)
	}
	before := *w.ed.Doc().Throw.Spin.Axis
	m := w.axisMap.view
	if m.Size().Width < 300 || m.Size().Height < 200 {
		t.Fatalf("axis map is %v", m.Size())
	}
	mp := w.good.Scene.Mass
	// The throw's spin (near the middle axis) is ringed.
	r := test.WidgetRenderer(m)
	ringed := false
	for _, o := range r.Objects() {
		if o.Visible() && o.Size().Width > 10 && o.Size().Width < 20 {
			ringed = true
		}
	}
	if !ringed {
		t.Error("no ring on the throw's spin direction")
	}

	p, ok := m.PositionOf(axisview.DownGreatest, mp.Axes[2])
	if !ok {
		t.Fatal("no position for the greatest axis")
	}
	p = p.AddXY(3, 2)
	at, size := fyne.CurrentApp().Driver().AbsolutePositionForObject(m), m.Size()
	m.MouseMoved(&desktop.MouseEvent{PointEvent: fyne.PointEvent{Position: p}})
	// The hover text must not move the map under the pointer.
	if fyne.CurrentApp().Driver().AbsolutePositionForObject(m) != at || m.Size() != size {
		t.Errorf("the map moved from %v %v to %v %v when the hover text changed", at, size,
			fyne.CurrentApp().Driver().AbsolutePositionForObject(m), m.Size())
	}
	if got := w.axisMap.hover.Text; !strings.HasPrefix(got, "spin about the greatest axis") || !strings.Contains(got, "spin : wobble 1 : ") {
		t.Errorf("hover text %q", got)
	}
	test.TapAt(m, p)
	if w.verdict.report.Motion != "spin" {
		t.Fatalf("after the click: %q (%s)", w.verdict.report.Motion, w.verdict.report.Headline)
	}
	ax := w.ed.Doc().Throw.Spin.Axis
	if ax == nil || ax.Vector == nil {
		t.Fatalf("spin axis %+v, want a free direction", ax)
	}
	got := r3.Unit(r3.Vec{X: ax.Vector[0], Y: ax.Vector[1], Z: ax.Vector[2]})
	want, _ := m.DirectionAt(p)
	if math.Acos(math.Min(1, r3.Dot(got, want)))*180/math.Pi > 0.02 {
		t.Errorf("spin axis %v, clicked %v", got, want)
	}
	if !strings.HasPrefix(w.menu.undo.Label, "Undo Spin from the axis map") {
		t.Errorf("undo item %q", w.menu.undo.Label)
	}
	if _, ok := rowValue(w.verdict.report, "spin : wobble"); !ok {
		t.Error("the spin shows no spin : wobble row")
	}
	w.undo()
	if w.verdict.report.Motion != "tumble" {
		t.Errorf("after undo: %q", w.verdict.report.Motion)
	}
	if a := w.ed.Doc().Throw.Spin.Axis; a == nil || a.Vector != nil || a.Name != before.Name {
		t.Errorf("after undo the spin axis is %+v, want %+v", a, before)
	}
	if w.menu.undo.Label == "Undo Spin from the axis map" {
		t.Error("undo took more than one step")
	}
}
