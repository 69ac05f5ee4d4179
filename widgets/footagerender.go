package widgets

import (
	"image/color"
	"math"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/canvas"
	"fyne.io/fyne/v2/widget"
)

// Colours of the footage view, Propflight's own: a near-black surround, and
// marks in a warm orange with a dark halo so that they show on light and
// dark footage alike; the selected mark turns yellow.
var (
	footageBack   = color.NRGBA{14, 16, 20, 255}
	markColor     = color.NRGBA{255, 122, 48, 255}
	markSelColor  = color.NRGBA{255, 228, 92, 255}
	markHalo      = color.NRGBA{0, 0, 0, 170}
	markOtherDots = color.NRGBA{255, 122, 48, 130}
)

// Line widths of the marks, device-independent units.
const (
	markWidth     = 1.5
	markSelWidth  = 2.2
	markHaloWidth = 3.5
)

var _ fyne.WidgetRenderer = (*footageRenderer)(nil)

// footageRenderer draws the frame and the overlay as stretched images over
// the letterboxed rectangle, the marks as pooled lines and circles, and the
// message as a wrapping label. rebuild places everything and is shared by
// Layout and Refresh.
type footageRenderer struct {
	v *FootageView

	bg      *canvas.Rectangle
	frame   *canvas.Image
	overlay *canvas.Image
	msg     *widget.Label

	lines   []*canvas.Line
	dots    []*canvas.Circle
	nLines  int
	nDots   int
	objects []fyne.CanvasObject
}

func newFootageRenderer(v *FootageView) *footageRenderer {
	r := &footageRenderer{v: v}
	r.bg = canvas.NewRectangle(footageBack)
	r.frame = canvas.NewImageFromImage(nil)
	r.frame.FillMode = canvas.ImageFillStretch
	r.overlay = canvas.NewImageFromImage(nil)
	r.overlay.FillMode = canvas.ImageFillStretch
	r.msg = widget.NewLabel(v.msg)
	r.msg.Alignment = fyne.TextAlignCenter
	r.msg.Wrapping = fyne.TextWrapWord
	r.rebuild(v.Size())
	return r
}

func (r *footageRenderer) Layout(size fyne.Size) { r.rebuild(size) }

func (r *footageRenderer) MinSize() fyne.Size { return fyne.NewSize(160, 120) }

func (r *footageRenderer) Objects() []fyne.CanvasObject { return r.objects }

func (r *footageRenderer) Refresh() {
	if r.msg.Text != r.v.msg {
		r.msg.SetText(r.v.msg)
	}
	r.rebuild(r.v.Size())
	for _, o := range r.objects {
		o.Refresh()
	}
}

func (r *footageRenderer) Destroy() {}

func (r *footageRenderer) line() *canvas.Line {
	if r.nLines == len(r.lines) {
		r.lines = append(r.lines, canvas.NewLine(color.Transparent))
	}
	r.nLines++
	return r.lines[r.nLines-1]
}

func (r *footageRenderer) dot() *canvas.Circle {
	if r.nDots == len(r.dots) {
		r.dots = append(r.dots, canvas.NewCircle(color.Transparent))
	}
	r.nDots++
	return r.dots[r.nDots-1]
}

// rebuild places every object for a view of the given size. It never
// refreshes.
func (r *footageRenderer) rebuild(size fyne.Size) {
	v := r.v
	r.nLines, r.nDots = 0, 0
	r.bg.Move(fyne.NewPos(0, 0))
	r.bg.Resize(size)
	r.objects = append(r.objects[:0], r.bg)

	ox, oy, s, ok := v.Letterbox()
	if ok {
		w, h := v.src.Size()
		pos := fyne.NewPos(float32(ox), float32(oy))
		sz := fyne.NewSize(float32(s*float64(w)), float32(s*float64(h)))
		if v.img != nil {
			scale := float32(1)
			if a := fyne.CurrentApp(); a != nil {
				if c := a.Driver().CanvasForObject(v); c != nil {
					scale = c.Scale()
				}
			}
			r.frame.Image = v.shownImage(v.img, int(math.Ceil(float64(sz.Width*scale))), int(math.Ceil(float64(sz.Height*scale))))
			r.frame.Move(pos)
			r.frame.Resize(sz)
			r.objects = append(r.objects, r.frame)
		}
		if v.img != nil && v.overlay != nil && v.opacity > 0 {
			r.overlay.Image = v.overlay
			r.overlay.Translucency = 1 - v.opacity
			r.overlay.Move(pos)
			r.overlay.Resize(sz)
			r.objects = append(r.objects, r.overlay)
		}
		r.placeMarks()
	}
	if v.msg != "" {
		r.msg.Resize(fyne.NewSize(size.Width, r.msg.MinSize().Height))
		h := r.msg.MinSize().Height // wrapped at this width
		r.msg.Resize(fyne.NewSize(size.Width, h))
		r.msg.Move(fyne.NewPos(0, (size.Height-h)/2))
		r.objects = append(r.objects, r.msg)
	}
}

// placeMarks adds faint dots at the centres of other frames' marks and a
// cross (with a line and a dot to the second point) for each mark of the
// frame shown.
func (r *footageRenderer) placeMarks() {
	v := r.v
	for i := range v.marks {
		if v.marks[i].Frame == v.frame {
			continue
		}
		m := v.marks[i]
		p, _ := v.ToView(m.X, m.Y)
		c := r.dot()
		c.FillColor, c.StrokeColor, c.StrokeWidth = markOtherDots, color.Transparent, 0
		c.Move(p.SubtractXY(markDot/2, markDot/2))
		c.Resize(fyne.NewSquareSize(markDot))
		r.objects = append(r.objects, c)
	}
	for i := range v.marks {
		if v.marks[i].Frame != v.frame {
			continue
		}
		m := v.shownMark(i)
		col, width := markColor, float32(markWidth)
		if i == v.selected {
			col, width = markSelColor, markSelWidth
		}
		p, _ := v.ToView(m.X, m.Y)
		segs := [][2]fyne.Position{
			{p.SubtractXY(markHalf, 0), p.AddXY(markHalf, 0)},
			{p.SubtractXY(0, markHalf), p.AddXY(0, markHalf)},
		}
		var q fyne.Position
		if m.HasSecond {
			q, _ = v.ToView(m.X2, m.Y2)
			segs = append(segs, [2]fyne.Position{p, q})
		}
		for _, halo := range []bool{true, false} {
			for _, sg := range segs {
				l := r.line()
				l.Position1, l.Position2 = sg[0], sg[1]
				if halo {
					l.StrokeColor, l.StrokeWidth = markHalo, width+markHaloWidth-markWidth
				} else {
					l.StrokeColor, l.StrokeWidth = col, width
				}
				r.objects = append(r.objects, l)
			}
		}
		if m.HasSecond {
			c := r.dot()
			c.FillColor, c.StrokeColor, c.StrokeWidth = col, markHalo, 1
			d := float32(2 * markDot)
			c.Move(q.SubtractXY(d/2, d/2))
			c.Resize(fyne.NewSquareSize(d))
			r.objects = append(r.objects, c)
		}
	}
}
