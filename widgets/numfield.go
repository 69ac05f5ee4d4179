package widgets

import (
	"math"
	"strings"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/widget"
)

// Declare conformity with the interfaces NumberField implements.
var (
	_ fyne.Widget      = (*NumberField)(nil)
	_ fyne.Disableable = (*NumberField)(nil)
	_ fyne.Focusable   = (*numEntry)(nil)
)

// sliderSteps is the number of slider positions across a field's range.
const sliderSteps = 1000

// NumberField is a labelled slider with a typed entry and its unit beside
// it, for one number of a prop or throw. It is a widget: put it in any
// container.
//
// The value inside is in the Quantity's unit (SI, or degrees for Angle and
// turns per second for TurnRate); imperial display changes only what is
// shown and typed. onChange(v, final) reports a change by the user: while
// the slider is dragged it is called with final false on each move and
// once with final true when the drag ends; a typed value that is accepted
// (Enter, or focus leaving the entry) calls it once with final true. Text
// that is not a number or lies outside the range shows a short message in
// red beside the entry instead of the slider, and the value stays as it
// was; Escape puts the current value back into the entry.
//
// A typed number is in the shown unit; it may carry any unit of the
// quantity instead ("30 cm", "12 in", "1.2 lb", "90 rpm").
type NumberField struct {
	widget.BaseWidget

	label    string
	q        Quantity
	min, max float64 // inside units
	value    float64
	imperial bool
	log      bool
	disabled bool
	onChange func(v float64, final bool)

	labelWidth float32 // least width of the label column

	text    *widget.Label
	slider  *widget.Slider
	entry   *numEntry
	unit    *widget.Label
	problem *widget.Label // the message that replaces the slider (short form)
	message string        // the whole message, for InputError

	quiet bool   // set while the field moves its own slider
	shown string // the text the field last wrote into the entry

	// span > 1 narrows a logarithmic slider to [value/span, value*span]
	// (inside [min, max]), re-centred whenever the value is shown, so that
	// a drag changes a dimension by a useful step; typing still reaches
	// the whole range. winLo and winHi are the slider's ends now.
	span         float64
	winLo, winHi float64
}

// NewNumberField returns a field for quantity q labelled label, with range
// [min, max] in inside units (swapped if given the wrong way round) and
// value min. onChange may be nil.
func NewNumberField(label string, q Quantity, min, max float64, onChange func(v float64, final bool)) *NumberField {
	f := &NumberField{label: label, q: q, onChange: onChange}
	f.text = widget.NewLabel(label)
	f.unit = widget.NewLabel("")
	f.problem = widget.NewLabel("")
	f.problem.Importance = widget.DangerImportance
	f.problem.Truncation = fyne.TextTruncateEllipsis
	f.problem.Hide()

	f.slider = widget.NewSlider(0, sliderSteps)
	f.slider.Step = 1
	f.slider.OnChanged = func(pos float64) { f.slid(pos, false) }
	f.slider.OnChangeEnded = func(pos float64) { f.slid(pos, true) }

	f.entry = newNumEntry()
	f.entry.OnSubmitted = func(string) { f.commit() }
	f.entry.OnChanged = func(string) { f.typing() }
	f.entry.onFocusLost = f.commit
	f.entry.onEscape = f.revert

	f.ExtendBaseWidget(f)
	f.setRange(min, max)
	f.value = f.min
	f.show()
	return f
}

// Value returns the field's value in inside units.
func (f *NumberField) Value() float64 { return f.value }

// SetValue sets the value (inside units) without calling onChange. A value
// outside the range is kept; the slider then rests at the nearer end.
// NaN is ignored.
func (f *NumberField) SetValue(v float64) {
	if math.IsNaN(v) {
		return
	}
	f.value = v
	f.show()
}

// SetRange sets the slider's range in inside units, swapping a reversed
// pair; NaN bounds are ignored. The value is kept even if it falls outside
// (no callback); typed values must lie inside.
func (f *NumberField) SetRange(min, max float64) {
	if math.IsNaN(min) || math.IsNaN(max) {
		return
	}
	f.setRange(min, max)
	f.show()
}

func (f *NumberField) setRange(min, max float64) {
	if min > max {
		min, max = max, min
	}
	f.min, f.max = min, max
}

// Range returns the slider's range in inside units.
func (f *NumberField) Range() (min, max float64) { return f.min, f.max }

// SetImperial switches the display between metric and imperial units (see
// Quantity); the value inside does not change.
func (f *NumberField) SetImperial(on bool) {
	f.imperial = on
	f.show()
}

// SetLog makes the slider logarithmic, for wide ranges such as a density
// from 10 to 20000 kg/m^3. It takes effect only while the range is
// strictly positive; otherwise the slider stays linear.
func (f *NumberField) SetLog(on bool) {
	f.log = on
	f.show()
}

// SetLabelWidth sets the least width of the label column so that a column
// of fields lines its sliders up.
func (f *NumberField) SetLabelWidth(w float32) {
	f.labelWidth = w
	f.Refresh()
}

// LabelMinWidth returns the width the label needs, for SetLabelWidth.
func (f *NumberField) LabelMinWidth() float32 { return f.text.MinSize().Width }

// Unit returns the symbol of the unit shown ("m", "in", "lb/ft³"; "" for
// Plain).
func (f *NumberField) Unit() string { return f.shownUnit().symbol }

// Text returns the entry's current text.
func (f *NumberField) Text() string { return f.entry.Text }

// InputError returns the message shown for the last rejected text, or ""
// when there is none.
func (f *NumberField) InputError() string {
	if f.problem.Hidden {
		return ""
	}
	return f.message
}

// Disable stops the user from changing the value.
func (f *NumberField) Disable() {
	f.disabled = true
	f.slider.Disable()
	f.entry.Disable()
	f.Refresh()
}

// Enable lets the user change the value again.
func (f *NumberField) Enable() {
	f.disabled = false
	f.slider.Enable()
	f.entry.Enable()
	f.Refresh()
}

// Disabled reports whether the field is disabled.
func (f *NumberField) Disabled() bool { return f.disabled }

// CreateRenderer is a private method to Fyne which links this widget to its
// renderer.
func (f *NumberField) CreateRenderer() fyne.WidgetRenderer {
	return &numberFieldRenderer{f: f}
}

// shownUnit is the unit the field displays now.
func (f *NumberField) shownUnit() unit { return f.q.display(f.imperial, f.max) }

// logScale reports whether the slider is logarithmic now.
func (f *NumberField) logScale() bool { return f.log && f.min > 0 && f.max > f.min }

// SetSpan narrows a logarithmic slider to a factor of span either side of
// the value (span <= 1 turns it off: the slider covers the whole range).
// The window re-centres each time the value is shown, never during a drag.
func (f *NumberField) SetSpan(span float64) {
	f.span = span
	f.show()
}

// window updates the slider's ends for the value now shown.
func (f *NumberField) window() {
	f.winLo, f.winHi = f.min, f.max
	if f.span > 1 && f.logScale() && f.value > 0 {
		f.winLo = math.Max(f.min, f.value/f.span)
		f.winHi = math.Min(f.max, f.value*f.span)
		if !(f.winHi > f.winLo) {
			f.winLo, f.winHi = f.min, f.max
		}
	}
}

// position returns the slider position of value v, 0 to sliderSteps.
func (f *NumberField) position(v float64) float64 {
	lo, hi := f.winLo, f.winHi
	var t float64
	switch {
	case !(hi > lo):
		t = 0
	case f.logScale():
		t = math.Log(v/lo) / math.Log(hi/lo)
	default:
		t = (v - lo) / (hi - lo)
	}
	if math.IsNaN(t) {
		t = 0
	}
	return math.Max(0, math.Min(1, t)) * sliderSteps
}

// valueAt returns the value at slider position pos, rounded to what the
// entry shows so that the slider gives the numbers the user reads, and
// kept inside the range.
func (f *NumberField) valueAt(pos float64) float64 {
	t := math.Max(0, math.Min(1, pos/sliderSteps))
	lo, hi := f.winLo, f.winHi
	var v float64
	switch {
	case pos >= sliderSteps:
		v = hi
	case pos <= 0:
		v = lo
	case f.logScale():
		v = lo * math.Pow(hi/lo, t)
	default:
		v = lo + t*(hi-lo)
	}
	u := f.shownUnit()
	if r, err := parseTyped(formatValue(v, f.q, u), f.q, u); err == nil && r >= f.min && r <= f.max {
		v = r
	}
	return v
}

// show writes the value into the entry, the slider and the unit label
// without calling onChange, and clears any message.
func (f *NumberField) show() {
	u := f.shownUnit()
	f.shown = formatValue(f.value, f.q, u)
	f.window()
	f.quiet = true
	f.entry.SetText(f.shown)
	f.slider.SetValue(f.position(f.value))
	f.quiet = false
	f.unit.SetText(u.symbol)
	f.setProblem("")
}

// setProblem shows msg in place of the slider, or the slider for "". The
// slot is narrow, so the row drops "must be " and the unit the field
// already shows beside its entry ("at most 100" for "must be at most 100
// turns/s"); InputError keeps the whole message.
func (f *NumberField) setProblem(msg string) {
	f.message = msg
	if msg == "" {
		f.problem.Hide()
		f.slider.Show()
	} else {
		short := strings.TrimPrefix(msg, "must be ")
		if sym := f.unit.Text; sym != "" {
			short = strings.TrimSuffix(strings.TrimSuffix(short, " "+sym), sym)
		}
		f.problem.SetText(short)
		f.problem.Show()
		f.slider.Hide()
	}
	f.Refresh()
}

// slid handles a slider move (final false) or the end of a drag (true).
func (f *NumberField) slid(pos float64, final bool) {
	if f.quiet || f.disabled {
		return
	}
	v := f.valueAt(pos)
	if !final && v == f.value {
		return
	}
	f.value = v
	f.shown = formatValue(v, f.q, f.shownUnit())
	f.quiet = true
	f.entry.SetText(f.shown)
	f.quiet = false
	if !f.problem.Hidden {
		f.setProblem("")
	}
	if f.onChange != nil {
		f.onChange(v, final)
	}
}

// check parses the entry text and checks it against the range, returning
// the value or the message to show.
func (f *NumberField) check(text string) (float64, string) {
	u := f.shownUnit()
	v, err := parseTyped(text, f.q, u)
	if err != nil {
		return 0, err.Error()
	}
	// A bound typed as shown (rounded to boundDigits) counts as the bound.
	tol := func(b float64) float64 { return math.Abs(b) * 1e-6 }
	switch {
	case v < f.min-tol(f.min):
		return 0, "must be at least " + withUnit(formatSig(toDisplay(f.min, u), boundDigits), u)
	case v > f.max+tol(f.max):
		return 0, "must be at most " + withUnit(formatSig(toDisplay(f.max, u), boundDigits), u)
	}
	return math.Max(f.min, math.Min(f.max, v)), ""
}

// commit accepts the entry text (Enter or focus leaving the entry).
func (f *NumberField) commit() {
	if f.disabled {
		return
	}
	text := f.entry.Text
	if text == f.shown {
		if !f.problem.Hidden {
			f.setProblem("")
		}
		return
	}
	v, msg := f.check(text)
	if msg != "" {
		f.setProblem(msg)
		return
	}
	changed := v != f.value
	f.value = v
	f.show()
	if changed && f.onChange != nil {
		f.onChange(v, true)
	}
}

// typing clears a shown message as soon as the text becomes acceptable.
func (f *NumberField) typing() {
	if f.quiet || f.problem.Hidden {
		return
	}
	if _, msg := f.check(f.entry.Text); msg == "" {
		f.setProblem("")
	}
}

// revert puts the current value back into the entry (Escape).
func (f *NumberField) revert() { f.show() }
