package widgets

import (
	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/theme"
	"fyne.io/fyne/v2/widget"
)

// numEntry is a one-line entry that also reports losing focus and Escape.
type numEntry struct {
	widget.Entry
	onFocusLost func()
	onEscape    func()
}

func newNumEntry() *numEntry {
	e := &numEntry{}
	e.ExtendBaseWidget(e)
	return e
}

// FocusLost commits the text as Enter would.
func (e *numEntry) FocusLost() {
	e.Entry.FocusLost()
	if e.onFocusLost != nil {
		e.onFocusLost()
	}
}

// TypedKey handles Escape and passes every other key to the entry.
func (e *numEntry) TypedKey(k *fyne.KeyEvent) {
	if k.Name == fyne.KeyEscape && e.onEscape != nil {
		e.onEscape()
		return
	}
	e.Entry.TypedKey(k)
}

// Widths of the entry and unit columns, in characters of the theme's text.
const (
	entryChars = "-00000.000"
	unitChars  = "turns/s"
)

var _ fyne.WidgetRenderer = (*numberFieldRenderer)(nil)

// numberFieldRenderer lays the field out in one row: label, slider (or
// the message), entry, unit.
type numberFieldRenderer struct {
	f *NumberField
}

func (r *numberFieldRenderer) columns() (label, entry, unit float32) {
	f := r.f
	th := f.Theme()
	pad := th.Size(theme.SizeNameInnerPadding)
	ts := th.Size(theme.SizeNameText)
	label = max(f.text.MinSize().Width, f.labelWidth)
	entry = fyne.MeasureText(entryChars, ts, fyne.TextStyle{}).Width + 2*pad
	unit = max(fyne.MeasureText(unitChars, ts, fyne.TextStyle{}).Width+2*pad, f.unit.MinSize().Width)
	return label, entry, unit
}

func (r *numberFieldRenderer) Layout(size fyne.Size) {
	f := r.f
	gap := f.Theme().Size(theme.SizeNamePadding)
	lw, ew, uw := r.columns()
	h := size.Height
	mid := max(size.Width-lw-ew-uw-3*gap, 0)
	place := func(o fyne.CanvasObject, x, w float32) {
		oh := min(o.MinSize().Height, h)
		o.Move(fyne.NewPos(x, (h-oh)/2))
		o.Resize(fyne.NewSize(w, oh))
	}
	place(f.text, 0, lw)
	place(f.slider, lw+gap, mid)
	place(f.problem, lw+gap, mid)
	place(f.entry, lw+gap+mid+gap, ew)
	place(f.unit, lw+gap+mid+gap+ew+gap, uw)
}

func (r *numberFieldRenderer) MinSize() fyne.Size {
	f := r.f
	gap := f.Theme().Size(theme.SizeNamePadding)
	lw, ew, uw := r.columns()
	sw := max(f.slider.MinSize().Width, 4*f.Theme().Size(theme.SizeNameInlineIcon))
	h := max(f.text.MinSize().Height, f.slider.MinSize().Height, f.entry.MinSize().Height, f.unit.MinSize().Height)
	return fyne.NewSize(lw+sw+ew+uw+3*gap, h)
}

func (r *numberFieldRenderer) Objects() []fyne.CanvasObject {
	f := r.f
	return []fyne.CanvasObject{f.text, f.slider, f.problem, f.entry, f.unit}
}

func (r *numberFieldRenderer) Refresh() {
	f := r.f
	if f.disabled {
		f.text.Importance = widget.LowImportance
	} else {
		f.text.Importance = widget.MediumImportance
	}
	f.text.Refresh()
	f.unit.Refresh()
	f.problem.Refresh()
	r.Layout(f.Size())
}

func (r *numberFieldRenderer) Destroy() {}
