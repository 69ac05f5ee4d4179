package widgets

import (
	"fmt"
	"image"
	"math"
	"sync"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/canvas"
	"fyne.io/fyne/v2/driver/desktop"
	"fyne.io/fyne/v2/widget"
	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics"
	"propflight/widgets/axisview"
)

// Declare conformity with the interfaces AxisMap implements.
var (
	_ fyne.Widget       = (*AxisMap)(nil)
	_ fyne.Tappable     = (*AxisMap)(nil)
	_ desktop.Hoverable = (*AxisMap)(nil)
)

// AxisMap shows the axis map of a prop (widgets/axisview): the verdict of
// every spin direction in two equal-area views, the throw's spin direction
// ringed. Hovering reports the verdict of the direction under the pointer
// (HoverText, OnHover); tapping a direction calls OnPick with it (unit,
// prop frame).
//
// The image is drawn on a goroutine of its own whenever the prop or the
// size changes (a few milliseconds; see the benchmark), and the newest one
// is shown through fyne.Do; requests that arrive while one is drawn are
// merged, so dragging a shape slider never queues stale maps.
type AxisMap struct {
	widget.BaseWidget

	// OnPick is called on the UI goroutine with the direction tapped
	// (unit, prop frame). It may be nil.
	OnPick func(dir r3.Vec)
	// OnHover is called with the hover text whenever it changes ("" when
	// the pointer leaves the discs). It may be nil.
	OnHover func(text string)
	// Synchronous draws on the caller's goroutine (for tests).
	Synchronous bool

	mapper    *physics.AxisMapper
	spin      r3.Vec // the throw's spin direction, prop frame; zero for none
	hover     r3.Vec // direction under the pointer, prop frame; zero for none
	hoverView axisview.View
	hoverText string

	img     *canvas.Image
	drawMu  sync.Mutex
	want    drawJob // the newest request
	drawing bool    // a goroutine is drawing
	shown   drawJob // what img shows
}

// drawJob is one requested image: the mapper at a pixel size.
type drawJob struct {
	mapper *physics.AxisMapper
	w, h   int
	scale  int
}

// NewAxisMap returns an empty axis map; SetMapper gives it a prop.
func NewAxisMap() *AxisMap {
	m := &AxisMap{}
	m.img = canvas.NewImageFromImage(image.NewRGBA(image.Rect(0, 0, 1, 1)))
	m.img.FillMode = canvas.ImageFillStretch
	m.img.ScaleMode = canvas.ImageScalePixels
	m.ExtendBaseWidget(m)
	return m
}

// SetMapper shows the map of mapper (nil shows nothing).
func (m *AxisMap) SetMapper(mapper *physics.AxisMapper) {
	m.mapper = mapper
	m.refreshHover()
	m.Refresh()
}

// Mapper returns the mapper shown.
func (m *AxisMap) Mapper() *physics.AxisMapper { return m.mapper }

// SetSpin rings direction dir (prop frame) in both views; a zero vector
// rings nothing.
func (m *AxisMap) SetSpin(dir r3.Vec) {
	m.spin = dir
	m.Refresh()
}

// HoverText returns the verdict of the direction under the pointer, or ""
// when the pointer is off the discs.
func (m *AxisMap) HoverText() string { return m.hoverText }

// pixelScale returns the canvas scale (pixels per device-independent unit).
func (m *AxisMap) pixelScale() float32 {
	if c := fyne.CurrentApp().Driver().CanvasForObject(m); c != nil && c.Scale() > 0 {
		return c.Scale()
	}
	return 1
}

// layout returns the map's layout at the widget's current size, in
// pixels, and the pixels per unit.
func (m *AxisMap) layout() (axisview.Layout, float32, bool) {
	if m.mapper == nil {
		return axisview.Layout{}, 1, false
	}
	s := m.pixelScale()
	sz := m.Size()
	w, h := int(math.Round(float64(sz.Width*s))), int(math.Round(float64(sz.Height*s)))
	if w < 8 || h < 8 {
		return axisview.Layout{}, s, false
	}
	return axisview.LayoutFor(m.mapper, w, h, textScale(s)), s, true
}

func textScale(s float32) int { return max(1, int(math.Round(float64(s)))) }

// DirectionAt returns the spin direction (unit, prop frame) under the
// widget position pos, and false off the discs.
func (m *AxisMap) DirectionAt(pos fyne.Position) (r3.Vec, bool) {
	d, _, ok := m.directionAt(pos)
	return d, ok
}

func (m *AxisMap) directionAt(pos fyne.Position) (r3.Vec, axisview.View, bool) {
	l, s, ok := m.layout()
	if !ok {
		return r3.Vec{}, 0, false
	}
	d, v, on := l.Direction(float64(pos.X*s), float64(pos.Y*s))
	if !on {
		return r3.Vec{}, v, false
	}
	return axisview.FromPrincipal(m.mapper.Axes(), d), v, true
}

// PositionOf returns where direction dir (prop frame) appears in view v,
// in widget coordinates.
func (m *AxisMap) PositionOf(v axisview.View, dir r3.Vec) (fyne.Position, bool) {
	l, s, ok := m.layout()
	if !ok || r3.Norm(dir) == 0 {
		return fyne.Position{}, false
	}
	p := l.Point(v, axisview.ToPrincipal(m.mapper.Axes(), dir))
	return fyne.NewPos(float32(p[0])/s, float32(p[1])/s), true
}

// DescribeDirection is the hover text for verdict d: its motion, the axis
// it circles, the excursion and the spin-to-wobble ratio, and the
// direction itself in the prop frame.
func DescribeDirection(d physics.DirectionVerdict) string {
	var what string
	switch d.Motion {
	case physics.Tumbling:
		what = fmt.Sprintf("tumble: swings %.1f° from the %s axis", d.ExcursionDeg, d.Circles)
	case physics.Wobbling:
		what = fmt.Sprintf("wobble: %.1f° off the %s axis", d.ExcursionDeg, d.Circles)
	default:
		what = fmt.Sprintf("spin about the %s axis, within %.1f°", d.Circles, d.ExcursionDeg)
	}
	if d.HasRatio {
		what += fmt.Sprintf("; spin : wobble 1 : %.3g", d.WobblesPerTurn)
	}
	a := d.Axis
	return what + fmt.Sprintf("\naxis (%.2f, %.2f, %.2f), prop frame: click to spin the throw so", a.X, a.Y, a.Z)
}

// MouseIn shows the verdict under the pointer.
func (m *AxisMap) MouseIn(ev *desktop.MouseEvent) { m.MouseMoved(ev) }

// MouseMoved shows the verdict under the pointer.
func (m *AxisMap) MouseMoved(ev *desktop.MouseEvent) {
	d, v, ok := m.directionAt(ev.Position)
	if !ok {
		d = r3.Vec{}
	}
	m.hoverView = v
	m.setHover(d)
}

// MouseOut clears the hover text.
func (m *AxisMap) MouseOut() { m.setHover(r3.Vec{}) }

func (m *AxisMap) setHover(d r3.Vec) {
	m.hover = d
	m.refreshHover()
	m.Refresh()
}

func (m *AxisMap) refreshHover() {
	text := ""
	if m.mapper != nil && r3.Norm(m.hover) > 0 {
		text = DescribeDirection(m.mapper.Verdict(m.hover))
	}
	if text != m.hoverText {
		m.hoverText = text
		if m.OnHover != nil {
			m.OnHover(text)
		}
	}
}

// Tapped picks the direction under the pointer.
func (m *AxisMap) Tapped(ev *fyne.PointEvent) {
	d, ok := m.DirectionAt(ev.Position)
	if ok && m.OnPick != nil {
		m.OnPick(d)
	}
}

// request asks for the image of job, drawn now (Synchronous) or on the
// drawing goroutine.
func (m *AxisMap) request(job drawJob) {
	if job == m.shown {
		return
	}
	if m.Synchronous {
		m.show(job, axisview.Render(job.mapper, job.w, job.h, axisview.Options{Palette: axisview.ScreenPalette(), Scale: job.scale}))
		return
	}
	m.drawMu.Lock()
	m.want = job
	busy := m.drawing
	m.drawing = true
	m.drawMu.Unlock()
	if busy {
		return // the running goroutine picks the newest request up
	}
	go func() {
		for {
			m.drawMu.Lock()
			j := m.want
			m.drawMu.Unlock()
			img := axisview.Render(j.mapper, j.w, j.h, axisview.Options{Palette: axisview.ScreenPalette(), Scale: j.scale})
			fyne.Do(func() { m.show(j, img) })
			m.drawMu.Lock()
			if m.want == j {
				m.drawing = false
				m.drawMu.Unlock()
				return
			}
			m.drawMu.Unlock()
		}
	}()
}

// show puts a drawn image on screen (UI goroutine).
func (m *AxisMap) show(j drawJob, img image.Image) {
	m.shown = j
	m.img.Image = img
	m.img.Refresh()
}

// CreateRenderer is part of fyne.Widget.
func (m *AxisMap) CreateRenderer() fyne.WidgetRenderer {
	r := &axisMapRenderer{m: m}
	for i := range r.marks {
		r.marks[i] = canvas.NewCircle(nil)
		r.marks[i].StrokeWidth = 2
	}
	r.hover = canvas.NewCircle(nil)
	r.hover.StrokeWidth = 1.5
	r.objects = []fyne.CanvasObject{m.img, r.marks[0], r.marks[1], r.hover}
	return r
}
