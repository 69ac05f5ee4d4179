package widgets

import (
	"fmt"
	"image"
	"math"
	"slices"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/driver/desktop"
	"fyne.io/fyne/v2/widget"

	"propflight/internal/mark"
)

// Declare conformity with the interfaces FootageView implements.
var (
	_ fyne.Widget            = (*FootageView)(nil)
	_ fyne.Tappable          = (*FootageView)(nil)
	_ fyne.SecondaryTappable = (*FootageView)(nil)
	_ fyne.Draggable         = (*FootageView)(nil)
	_ fyne.Focusable         = (*FootageView)(nil)
	_ desktop.Mouseable      = (*FootageView)(nil)
	_ desktop.Cursorable     = (*FootageView)(nil)
)

// FrameSource is reference footage as the view needs it: a number of
// frames of one size, decoded on demand. app/footage.Sequence satisfies it.
type FrameSource interface {
	Len() int         // number of frames, frames 0 to Len()-1
	Size() (w, h int) // frame size, pixels
	Frame(i int) (image.Image, error)
}

// Hit and drawing sizes of marks, in device-independent units.
const (
	// markHit is how near a tap or the start of a drag must be to a mark's
	// centre or second point to pick it.
	markHit = 7.0
	// markHalf is half the size of a centre cross; markDot the radius of
	// the dot at a second point and of the faint dots of other frames'
	// centres.
	markHalf = 6.0
	markDot  = 3.0
)

// Messages the view shows instead of a frame.
const (
	msgNoFootage = "no footage"
	msgNoFrame   = "no footage frame"
)

// FootageView shows one frame of reference footage scaled to fit its size
// with its aspect kept (letterboxed: bars above and below, or at the
// sides), the user's marks on it, and optionally an overlay image (the take
// drawn over the footage). It is the place where marks are made:
//
//   - a tap on the picture calls OnMark with the image pixel under the
//     pointer and second false: the prop's centre on this frame;
//   - a tap with Shift held, or a secondary tap (right click), calls
//     OnMark with second true: the second point;
//   - a tap on a mark of this frame selects it instead; Delete or
//     Backspace then calls OnMarkDeleted;
//   - dragging a mark's centre calls OnMarkMoved once when the drag ends,
//     dragging its second point OnSecondMoved.
//
// The view never changes its marks itself: the callbacks tell the owner,
// which updates its data and calls SetMarks. Callbacks may be nil. Indexes
// are those of the slice given to SetMarks. A frame that cannot be decoded
// shows the error's text; nothing panics.
type FootageView struct {
	widget.BaseWidget

	// OnMark is called for a tap on the picture away from the marks, with
	// the image pixel coordinates under the pointer.
	OnMark func(x, y float64, second bool)
	// OnMarkMoved is called when a drag of the centre of mark index ends,
	// with its new centre in image pixels.
	OnMarkMoved func(index int, x, y float64)
	// OnSecondMoved is called when a drag of the second point of mark
	// index ends, with the new second point in image pixels.
	OnSecondMoved func(index int, x2, y2 float64)
	// OnMarkDeleted is called when Delete or Backspace is typed while mark
	// index is selected.
	OnMarkDeleted func(index int)
	// OnOtherKey is called with the keys the view does not use itself
	// while it has the focus (the window steps frames with them).
	OnOtherKey func(*fyne.KeyEvent)

	src   FrameSource
	frame int
	img   image.Image // the frame shown, nil when msg is shown
	shown struct {    // the reduced copy of a huge img (shownImage)
		src image.Image
		img *image.RGBA
	}
	msg      string
	marks    []mark.Mark
	overlay  image.Image
	opacity  float64
	selected int // index of the selected mark, -1 for none
	focused  bool

	// Pointer state: the last press (desktop only) and the drag in progress.
	pressAt    fyne.Position
	pressed    bool
	pressShift bool
	drag       markDrag
}

// markDrag is a drag of one point of a mark.
type markDrag struct {
	active bool
	index  int
	second bool // dragging the second point
	// from is the grabbed point in image pixels when the drag started and
	// moved the total pointer travel since, in widget units.
	from  [2]float64
	moved fyne.Delta
}

// NewFootageView returns a view with no footage.
func NewFootageView() *FootageView {
	v := &FootageView{msg: msgNoFootage, selected: -1, opacity: 1}
	v.ExtendBaseWidget(v)
	return v
}

// SetSource sets the footage and shows its frame 0 (nil: no footage). The
// selection and any drag are dropped.
func (v *FootageView) SetSource(src FrameSource) {
	v.src = src
	v.frame = -1
	v.selected = -1
	v.drag = markDrag{}
	v.SetFrame(0)
}

// Source returns the footage shown, nil for none.
func (v *FootageView) Source() FrameSource { return v.src }

// SetFrame shows footage frame i. Outside the clip the view says "no
// footage frame"; when the frame cannot be decoded it shows the error's
// text. Either way it keeps the footage's size for its coordinates.
func (v *FootageView) SetFrame(i int) {
	v.frame = i
	v.img, v.msg = nil, ""
	v.drag = markDrag{}
	if v.selected >= 0 && (v.selected >= len(v.marks) || v.marks[v.selected].Frame != i) {
		v.selected = -1
	}
	switch {
	case v.src == nil:
		v.msg = msgNoFootage
	case i < 0 || i >= v.src.Len():
		v.msg = msgNoFrame
	default:
		img, err := v.frameImage(i)
		switch {
		case err != nil:
			v.msg = err.Error()
		case img == nil:
			v.msg = msgNoFrame
		default:
			v.img = img
		}
	}
	v.Refresh()
}

// frameImage asks the source for frame i, turning a panic in a source
// into an error.
func (v *FootageView) frameImage(i int) (img image.Image, err error) {
	defer func() {
		if p := recover(); p != nil {
			img, err = nil, &frameError{p}
		}
	}()
	return v.src.Frame(i)
}

type frameError struct{ p any }

func (e *frameError) Error() string { return fmt.Sprintf("the frame could not be read: %v", e.p) }

// Frame returns the footage frame asked for last by SetFrame.
func (v *FootageView) Frame() int { return v.frame }

// Message returns the text shown instead of a frame, "" when a frame is
// shown.
func (v *FootageView) Message() string { return v.msg }

// SetMarks replaces the marks (the slice is copied), in the footage's
// image pixels: origin at the frame's top-left corner, x to the right, y
// down; pixel (i, j) covers [i, i+1) x [j, j+1). Only the marks of the
// frame shown are drawn as crosses; the centres of the others are faint
// dots, so the marked arc shows.
func (v *FootageView) SetMarks(marks []mark.Mark) {
	v.marks = slices.Clone(marks)
	if v.selected >= len(v.marks) || (v.selected >= 0 && v.marks[v.selected].Frame != v.frame) {
		v.selected = -1
	}
	v.drag = markDrag{}
	v.Refresh()
}

// Marks returns a copy of the marks.
func (v *FootageView) Marks() []mark.Mark { return slices.Clone(v.marks) }

// Selected returns the index of the selected mark, -1 for none.
func (v *FootageView) Selected() int { return v.selected }

// SetOverlay draws img over the frame with the given opacity (0 to 1,
// clamped), stretched over the same letterboxed rectangle as the frame: it
// should have the footage's pixel size and a transparent background. nil
// removes it.
func (v *FootageView) SetOverlay(img image.Image, opacity float64) {
	if math.IsNaN(opacity) {
		opacity = 0
	}
	v.overlay, v.opacity = img, math.Max(0, math.Min(1, opacity))
	v.Refresh()
}

// Overlay returns the overlay image and its opacity (nil when none).
func (v *FootageView) Overlay() (image.Image, float64) { return v.overlay, v.opacity }

// Letterbox returns where the picture lies in the view: the top-left
// corner (ox, oy) of the scaled frame and the scale in device-independent
// units per image pixel, s = min(W / w, H / h) for a view of W x H units
// and a w x h frame, the frame centred in the spare width or height. ok is
// false with no footage or an empty view.
func (v *FootageView) Letterbox() (ox, oy, s float64, ok bool) {
	if v.src == nil {
		return 0, 0, 0, false
	}
	w, h := v.src.Size()
	size := v.Size()
	return letterbox(float64(size.Width), float64(size.Height), w, h)
}

// letterbox fits a w x h image into a W x H box; see Letterbox.
func letterbox(W, H float64, w, h int) (ox, oy, s float64, ok bool) {
	if w <= 0 || h <= 0 || !(W > 0) || !(H > 0) {
		return 0, 0, 0, false
	}
	s = math.Min(W/float64(w), H/float64(h))
	return (W - s*float64(w)) / 2, (H - s*float64(h)) / 2, s, true
}

// ToImage converts a position in the view to image pixels:
// x = (X - ox) / s, y = (Y - oy) / s (see Letterbox). inside says whether
// the point lies on the picture, [0, w] x [0, h]; ok is false when there
// is no footage.
func (v *FootageView) ToImage(p fyne.Position) (x, y float64, inside, ok bool) {
	ox, oy, s, ok := v.Letterbox()
	if !ok {
		return 0, 0, false, false
	}
	w, h := v.src.Size()
	x, y = (float64(p.X)-ox)/s, (float64(p.Y)-oy)/s
	return x, y, x >= 0 && y >= 0 && x <= float64(w) && y <= float64(h), true
}

// ToView converts image pixels to a position in the view, the inverse of
// ToImage. ok is false when there is no footage.
func (v *FootageView) ToView(x, y float64) (p fyne.Position, ok bool) {
	ox, oy, s, ok := v.Letterbox()
	if !ok {
		return fyne.Position{}, false
	}
	return fyne.NewPos(float32(ox+x*s), float32(oy+y*s)), true
}

// Tapped selects the mark under the pointer, or reports a new centre (a
// second point with Shift held) at the image pixel under it.
func (v *FootageView) Tapped(e *fyne.PointEvent) {
	second := v.pressShift || shiftHeld()
	v.pressed, v.pressShift = false, false
	v.requestFocus()
	v.tap(e.Position, second)
}

// TappedSecondary reports a second point at the image pixel under the
// pointer (or selects the mark there).
func (v *FootageView) TappedSecondary(e *fyne.PointEvent) {
	v.pressed, v.pressShift = false, false
	v.requestFocus()
	v.tap(e.Position, true)
}

func (v *FootageView) tap(p fyne.Position, second bool) {
	if i, _, ok := v.hit(p); ok {
		v.selected = i
		v.Refresh()
		return
	}
	if v.selected >= 0 {
		v.selected = -1
		v.Refresh()
	}
	if v.img == nil {
		return // nothing to mark on
	}
	x, y, inside, ok := v.ToImage(p)
	if !ok || !inside {
		return
	}
	if v.OnMark != nil {
		v.OnMark(x, y, second)
	}
}

// hit returns the mark of the frame shown whose centre (or second point)
// is nearest p within markHit units; the selected mark and centres win
// ties.
func (v *FootageView) hit(p fyne.Position) (index int, second, ok bool) {
	best := markHit * markHit
	index = -1
	try := func(i int, sec bool, x, y float64) {
		q, ok := v.ToView(x, y)
		if !ok {
			return
		}
		dx, dy := float64(q.X-p.X), float64(q.Y-p.Y)
		if d := dx*dx + dy*dy; d < best || d == best && i == v.selected {
			best, index, second = d, i, sec
		}
	}
	for i, m := range v.marks {
		if m.Frame != v.frame {
			continue
		}
		try(i, false, m.X, m.Y)
	}
	for i, m := range v.marks {
		if m.Frame == v.frame && m.HasSecond {
			try(i, true, m.X2, m.Y2)
		}
	}
	return index, second, index >= 0
}

// shiftHeld reports whether the desktop driver says Shift is down.
func shiftHeld() bool {
	app := fyne.CurrentApp()
	if app == nil {
		return false
	}
	if d, ok := app.Driver().(desktop.Driver); ok {
		return d.CurrentKeyModifiers()&fyne.KeyModifierShift != 0
	}
	return false
}

func (v *FootageView) requestFocus() {
	if app := fyne.CurrentApp(); app != nil {
		if c := app.Driver().CanvasForObject(v); c != nil && !v.focused {
			c.Focus(v)
		}
	}
}

// MouseDown remembers where a press began and whether Shift was held: the
// tap and the drag that may follow use it.
func (v *FootageView) MouseDown(e *desktop.MouseEvent) {
	v.pressAt, v.pressed = e.Position, true
	v.pressShift = e.Modifier&fyne.KeyModifierShift != 0
}

// MouseUp ends a press; the Shift state stays for the tap that follows.
func (v *FootageView) MouseUp(*desktop.MouseEvent) { v.pressed = false }

// Dragged moves the mark point grabbed at the start of the drag with the
// pointer. A drag that does not start on a mark of this frame does
// nothing.
func (v *FootageView) Dragged(e *fyne.DragEvent) {
	if !v.drag.active {
		start := v.pressAt
		if !v.pressed {
			// No press was seen (not a desktop pointer): the drag event
			// reports where the pointer is now and how far it moved.
			start = e.Position.Subtract(e.Dragged)
		}
		v.pressed, v.pressShift = false, false
		i, second, ok := v.hit(start)
		if !ok {
			v.drag = markDrag{index: -1, active: true}
			return
		}
		m := v.marks[i]
		from := [2]float64{m.X, m.Y}
		if second {
			from = [2]float64{m.X2, m.Y2}
		}
		v.drag = markDrag{active: true, index: i, second: second, from: from}
		v.selected = i
	}
	if v.drag.index < 0 {
		return
	}
	v.drag.moved.DX += e.Dragged.DX
	v.drag.moved.DY += e.Dragged.DY
	v.Refresh()
}

// DragEnd reports the dragged point's new place.
func (v *FootageView) DragEnd() {
	d := v.drag
	v.drag = markDrag{}
	if !d.active || d.index < 0 || d.index >= len(v.marks) {
		return
	}
	x, y := v.dragPoint(d)
	v.Refresh()
	if d.moved.DX == 0 && d.moved.DY == 0 {
		return
	}
	if d.second {
		if v.OnSecondMoved != nil {
			v.OnSecondMoved(d.index, x, y)
		}
	} else if v.OnMarkMoved != nil {
		v.OnMarkMoved(d.index, x, y)
	}
}

// dragPoint returns where the drag d has taken its point, image pixels.
func (v *FootageView) dragPoint(d markDrag) (x, y float64) {
	_, _, s, ok := v.Letterbox()
	if !ok {
		return d.from[0], d.from[1]
	}
	return d.from[0] + float64(d.moved.DX)/s, d.from[1] + float64(d.moved.DY)/s
}

// shownMark returns mark i as drawn: moved by a drag in progress.
func (v *FootageView) shownMark(i int) mark.Mark {
	m := v.marks[i]
	if d := v.drag; d.active && d.index == i {
		x, y := v.dragPoint(d)
		if d.second {
			m.X2, m.Y2 = x, y
		} else {
			m.X, m.Y = x, y
		}
	}
	return m
}

// Cursor shows a crosshair over the footage, for placing marks.
func (v *FootageView) Cursor() desktop.Cursor { return desktop.CrosshairCursor }

// FocusGained shows the selection as active.
func (v *FootageView) FocusGained() { v.focused = true; v.Refresh() }

// FocusLost keeps the selection.
func (v *FootageView) FocusLost() { v.focused = false; v.Refresh() }

// TypedRune ignores text input.
func (v *FootageView) TypedRune(rune) {}

// TypedKey deletes the selected mark on Delete or Backspace and drops the
// selection on Escape; other keys go to OnOtherKey.
func (v *FootageView) TypedKey(k *fyne.KeyEvent) {
	switch k.Name {
	case fyne.KeyDelete, fyne.KeyBackspace:
		i := v.selected
		if i < 0 || i >= len(v.marks) {
			return
		}
		v.selected = -1
		v.Refresh()
		if v.OnMarkDeleted != nil {
			v.OnMarkDeleted(i)
		}
	case fyne.KeyEscape:
		if v.selected >= 0 {
			v.selected = -1
			v.Refresh()
		}
	default:
		if v.OnOtherKey != nil {
			v.OnOtherKey(k)
		}
	}
}

// CreateRenderer is a private method to Fyne which links this widget to its
// renderer.
func (v *FootageView) CreateRenderer() fyne.WidgetRenderer { return newFootageRenderer(v) }
