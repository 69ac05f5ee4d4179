package widgets

import (
	"image/color"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/canvas"

	"propflight/widgets/axisview"
)

// Axis-map sizes, device-independent units.
const (
	axisMapMinWidth  = 320
	axisMapMinHeight = 230
	axisMapRing      = 7 // radius of the throw's ring
	axisMapHoverRing = 4
)

var _ fyne.WidgetRenderer = (*axisMapRenderer)(nil)

// axisMapRenderer lays the drawn map and the rings over it.
type axisMapRenderer struct {
	m       *AxisMap
	marks   [2]*canvas.Circle // the throw's spin direction in each view
	hover   *canvas.Circle
	objects []fyne.CanvasObject
}

func (r *axisMapRenderer) Destroy() {}

func (r *axisMapRenderer) MinSize() fyne.Size { return fyne.NewSize(axisMapMinWidth, axisMapMinHeight) }

func (r *axisMapRenderer) Objects() []fyne.CanvasObject { return r.objects }

// Layout sizes the image and asks for one drawn at the new pixel size
// (the old one is shown stretched until it comes).
func (r *axisMapRenderer) Layout(size fyne.Size) {
	r.m.img.Move(fyne.NewPos(0, 0))
	r.m.img.Resize(size)
	r.requestImage()
	r.place()
}

func (r *axisMapRenderer) Refresh() {
	r.requestImage()
	r.place()
	canvas.Refresh(r.m)
}

// requestImage asks for the map at the widget's pixel size, or hides the
// image when there is no prop or no room.
func (r *axisMapRenderer) requestImage() {
	m := r.m
	if l, _, ok := m.layout(); ok {
		m.request(drawJob{mapper: m.mapper, w: l.W, h: l.H, scale: l.Scale})
		m.img.Show()
	} else {
		m.img.Hide()
	}
}

// place puts the rings at the throw's direction and the hovered one.
func (r *axisMapRenderer) place() {
	m := r.m
	white := color.NRGBA{255, 255, 255, 255}
	for i, v := range []axisview.View{axisview.DownGreatest, axisview.DownLeast} {
		c := r.marks[i]
		p, ok := m.PositionOf(v, m.spin)
		if !ok {
			c.Hide()
			continue
		}
		c.StrokeColor = white
		c.Move(p.SubtractXY(axisMapRing, axisMapRing))
		c.Resize(fyne.NewSize(2*axisMapRing, 2*axisMapRing))
		c.Show()
	}
	// The hovered direction ringed in the other view, where the pointer
	// is not: the same spin seen down the other axis.
	h := r.hover
	other := axisview.DownLeast
	if m.hoverView == axisview.DownLeast {
		other = axisview.DownGreatest
	}
	p, ok := m.PositionOf(other, m.hover)
	if !ok {
		h.Hide()
		return
	}
	h.StrokeColor = color.NRGBA{20, 20, 20, 255}
	h.Move(p.SubtractXY(axisMapHoverRing, axisMapHoverRing))
	h.Resize(fyne.NewSize(2*axisMapHoverRing, 2*axisMapHoverRing))
	h.Show()
}
