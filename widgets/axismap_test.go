package widgets

import (
	"math"
	"strings"
	"testing"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/driver/desktop"
	"fyne.io/fyne/v2/test"
	"gonum.org/v1/gonum/spatial/r3"

	"propflight/internal/fixture"
	"propflight/physics"
	"propflight/widgets/axisview"
)

// axisMapWindow shows the frying pan's axis map in a 480 x 300 window,
// drawn synchronously.
func axisMapWindow(t *testing.T) (*AxisMap, physics.MassProps) {
	t.Helper()
	test.NewTempApp(t)
	mp, err := fixture.FryingPan().MassProps()
	if err != nil {
		t.Fatal(err)
	}
	m := NewAxisMap()
	m.Synchronous = true
	w := test.NewTempWindow(t, m)
	w.SetPadded(false)
	w.Resize(fyne.NewSize(480, 300))
	m.SetMapper(physics.NewAxisMapper(&mp, physics.DefaultThresholds()))
	return m, mp
}

// viewCentre returns the widget position of the centre of view v.
func viewCentre(t *testing.T, m *AxisMap, v axisview.View, dir r3.Vec) fyne.Position {
	t.Helper()
	p, ok := m.PositionOf(v, dir)
	if !ok {
		t.Fatalf("no position for %v", dir)
	}
	return p
}

func TestAxisMap_Hover_ShowsVerdict(t *testing.T) {
	m, mp := axisMapWindow(t)
	var reported []string
	m.OnHover = func(s string) { reported = append(reported, s) }
	// Just off the greatest axis: the pan spins flat about it.
	p := viewCentre(t, m, axisview.DownGreatest, mp.Axes[2]).AddXY(6, 3)
	m.MouseMoved(&desktop.MouseEvent{PointEvent: fyne.PointEvent{Position: p}})
	if got := m.HoverText(); !strings.HasPrefix(got, "spin about the greatest axis") || !strings.Contains(got, "spin : wobble 1 : ") {
		t.Errorf("hover near the greatest axis: %q", got)
	}
	// Near the middle axis (top of the disc): a tumble, no ratio.
	top := viewCentre(t, m, axisview.DownGreatest, mp.Axes[1]).AddXY(4, 12)
	m.MouseMoved(&desktop.MouseEvent{PointEvent: fyne.PointEvent{Position: top}})
	if got := m.HoverText(); !strings.HasPrefix(got, "tumble") || strings.Contains(got, "wobble 1 :") {
		t.Errorf("hover near the middle axis: %q", got)
	}
	// The text is the mapper's verdict of the direction under the pointer.
	d, _ := m.DirectionAt(top)
	if want := DescribeDirection(m.Mapper().Verdict(d)); m.HoverText() != want {
		t.Errorf("hover %q, want %q", m.HoverText(), want)
	}
	m.MouseOut()
	if m.HoverText() != "" || len(reported) != 3 || reported[2] != "" {
		t.Errorf("after leaving: %q, reported %q", m.HoverText(), reported)
	}
	// Off the discs: nothing.
	m.MouseMoved(&desktop.MouseEvent{PointEvent: fyne.PointEvent{Position: fyne.NewPos(1, 1)}})
	if m.HoverText() != "" {
		t.Errorf("off the discs: %q", m.HoverText())
	}
}

func TestAxisMap_Tap_PicksDirection(t *testing.T) {
	m, mp := axisMapWindow(t)
	var picked []r3.Vec
	m.OnPick = func(d r3.Vec) { picked = append(picked, d) }
	for _, v := range []axisview.View{axisview.DownGreatest, axisview.DownLeast} {
		for _, axis := range []r3.Vec{mp.Axes[0], mp.Axes[2]} {
			p, ok := m.PositionOf(v, axis)
			if !ok {
				t.Fatal("no position")
			}
			d, on := m.DirectionAt(p)
			if !on {
				continue // on the rim, outside by rounding
			}
			test.TapAt(m, p)
			got := picked[len(picked)-1]
			if math.Abs(math.Abs(r3.Dot(got, axis))-1) > 1e-3 || got != d {
				t.Errorf("view %v: tapped %v, picked %v", v, axis, got)
			}
		}
	}
	if len(picked) < 2 {
		t.Fatalf("picked %d directions", len(picked))
	}
	n := len(picked)
	test.TapAt(m, fyne.NewPos(1, 1))
	if len(picked) != n {
		t.Error("a tap off the discs picked a direction")
	}
}

func TestAxisMap_DrawsAtPixelSize(t *testing.T) {
	m, mp := axisMapWindow(t)
	m.SetSpin(mp.Axes[2])
	if m.img.Image == nil || m.img.Image.Bounds().Dx() != 480 || m.img.Image.Bounds().Dy() != 300 {
		t.Fatalf("image %v, want 480 x 300", m.img.Image.Bounds())
	}
	r := test.WidgetRenderer(m).(*axisMapRenderer)
	if !r.marks[0].Visible() || !r.marks[1].Visible() {
		t.Error("the throw's direction is not ringed in both views")
	}
	c := viewCentre(t, m, axisview.DownGreatest, mp.Axes[2])
	if got := r.marks[0].Position().AddXY(axisMapRing, axisMapRing); got != c {
		t.Errorf("ring at %v, want %v", got, c)
	}
}

// BenchmarkAxisMap_SliderDrag: one tick of a shape slider drag: a new
// mapper and its map drawn at the window's panel size (360 x 260 units).
func BenchmarkAxisMap_SliderDrag(b *testing.B) {
	p := fixture.FryingPan()
	i := 0
	for b.Loop() {
		p.Parts[1].Size.X = 0.2 + 0.001*float64(i%50)
		i++
		mp, err := p.MassProps()
		if err != nil {
			b.Fatal(err)
		}
		axisview.Render(physics.NewAxisMapper(&mp, physics.DefaultThresholds()), 360, 260, axisview.Options{Scale: 1})
	}
}

// TestAxisMap_Resize_RedrawsAtNewSize: a new size gets an image drawn at
// that size, not the old one stretched.
func TestAxisMap_Resize_RedrawsAtNewSize(t *testing.T) {
	m, _ := axisMapWindow(t)
	m.Resize(fyne.NewSize(400, 260))
	if b := m.img.Image.Bounds(); b.Dx() != 400 || b.Dy() != 260 {
		t.Errorf("image %v after a resize to 400 x 260", b)
	}
}
