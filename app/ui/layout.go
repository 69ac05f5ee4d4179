package ui

import (
	"image/color"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/canvas"
	"fyne.io/fyne/v2/container"
	"fyne.io/fyne/v2/theme"
	"fyne.io/fyne/v2/widget"
)

var _ fyne.Layout = atLeast{}

// atLeast is a layout that gives its objects the whole space and asks for
// at least W by H (device-independent units): for a scroll container or a
// list, whose own minimum is tiny, at the side of a border layout.
type atLeast struct{ W, H float32 }

func (l atLeast) MinSize(objs []fyne.CanvasObject) fyne.Size {
	var s fyne.Size
	for _, o := range objs {
		if o.Visible() {
			s = s.Max(o.MinSize())
		}
	}
	return fyne.NewSize(max(s.Width, l.W), max(s.Height, l.H))
}

func (l atLeast) Layout(objs []fyne.CanvasObject, size fyne.Size) { stack(objs, size) }

// stack lays every object over the whole size, as layout.NewStackLayout
// does: the Layout of atLeast and fixedHeight.
func stack(objs []fyne.CanvasObject, size fyne.Size) {
	for _, o := range objs {
		o.Move(fyne.NewPos(0, 0))
		o.Resize(size)
	}
}

// sized wraps o so that it asks for at least w by h.
func sized(o fyne.CanvasObject, w, h float32) *fyne.Container {
	return container.New(atLeast{w, h}, o)
}

// scrollColumn puts a panel in a vertical scroll with room on the right
// for the scroll bar, which Fyne draws over the content.
func scrollColumn(content fyne.CanvasObject) *container.Scroll {
	gap := canvas.NewRectangle(color.Transparent)
	gap.SetMinSize(fyne.NewSize(theme.Padding()*3, 0))
	return container.NewVScroll(container.NewBorder(nil, nil, nil, gap, content))
}

// heading is a bold section title.
func heading(text string) *widget.Label {
	return widget.NewLabelWithStyle(text, fyne.TextAlignLeading, fyne.TextStyle{Bold: true})
}

// note is a small wrapped explanation under a control.
func note(text string) *widget.Label {
	l := widget.NewLabelWithStyle(text, fyne.TextAlignLeading, fyne.TextStyle{Italic: true})
	l.Wrapping = fyne.TextWrapWord
	return l
}
