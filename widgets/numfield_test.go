package widgets

import (
	"math"
	"testing"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/test"
	"fyne.io/fyne/v2/theme"
)

// change is one onChange call.
type change struct {
	v     float64
	final bool
}

// fieldWindow shows a field in a 480-unit-wide test window and records its
// onChange calls.
func fieldWindow(t *testing.T, q Quantity, min, max float64) (*NumberField, fyne.Window, *[]change) {
	t.Helper()
	test.NewTempApp(t)
	var got []change
	f := NewNumberField("Radius", q, min, max, func(v float64, final bool) { got = append(got, change{v, final}) })
	w := test.NewTempWindow(t, f)
	w.SetPadded(false)
	w.Resize(fyne.NewSize(480, f.MinSize().Height))
	return f, w, &got
}

// typeIn replaces the entry text as a user would and presses key.
func typeIn(f *NumberField, text string, key fyne.KeyName) {
	f.entry.SetText("")
	test.Type(f.entry, text)
	f.entry.TypedKey(&fyne.KeyEvent{Name: key})
}

func TestNumberField_Type_CommitsValue(t *testing.T) {
	f, _, got := fieldWindow(t, Length, 0.001, 1)
	typeIn(f, "0.25", fyne.KeyReturn)
	if len(*got) != 1 || (*got)[0] != (change{0.25, true}) {
		t.Fatalf("typing 0.25 Enter: onChange %v, want [{0.25 true}]", *got)
	}
	if f.Value() != 0.25 || f.InputError() != "" {
		t.Errorf("Value() = %v, error %q", f.Value(), f.InputError())
	}
	// A unit typed with the number is converted: 30 cm is 0.3 m.
	typeIn(f, "30 cm", fyne.KeyReturn)
	if f.Value() != 0.3 || f.Text() != "0.3" {
		t.Errorf("30 cm: Value() %v, text %q; want 0.3 and \"0.3\"", f.Value(), f.Text())
	}
	// Enter again on the unchanged text reports nothing.
	f.entry.TypedKey(&fyne.KeyEvent{Name: fyne.KeyReturn})
	if len(*got) != 2 {
		t.Errorf("Enter on unchanged text called onChange: %v", *got)
	}
}

func TestNumberField_FocusLost_Commits(t *testing.T) {
	f, w, got := fieldWindow(t, Length, 0.001, 1)
	w.Canvas().Focus(f.entry)
	f.entry.SetText("")
	test.Type(f.entry, "0.5")
	w.Canvas().Unfocus()
	if len(*got) != 1 || (*got)[0] != (change{0.5, true}) {
		t.Errorf("focus out after typing 0.5: onChange %v", *got)
	}
}

func TestNumberField_Type_BadTextShowsError(t *testing.T) {
	f, _, got := fieldWindow(t, Length, 0.001, 1)
	f.SetValue(0.13)
	for _, c := range []struct{ text, want string }{
		{"abc", "not a number"},
		{"0", "must be at least 0.001 m"},
		{"1.5", "must be at most 1 m"},
		{"2 kg", `unknown unit "kg" (use m, cm, mm, in, ft)`},
	} {
		typeIn(f, c.text, fyne.KeyReturn)
		if f.InputError() != c.want {
			t.Errorf("typing %q: error %q, want %q", c.text, f.InputError(), c.want)
		}
		if f.Value() != 0.13 || f.Text() != c.text {
			t.Errorf("typing %q: value %v, text %q; want 0.13 kept and the text left to fix", c.text, f.Value(), f.Text())
		}
		if !f.slider.Hidden || f.problem.Hidden {
			t.Errorf("typing %q: the message should replace the slider", c.text)
		}
	}
	if len(*got) != 0 {
		t.Errorf("rejected text called onChange: %v", *got)
	}
	// Escape puts the value back and clears the message.
	f.entry.TypedKey(&fyne.KeyEvent{Name: fyne.KeyEscape})
	if f.Text() != "0.13" || f.InputError() != "" || f.slider.Hidden {
		t.Errorf("after Escape: text %q, error %q", f.Text(), f.InputError())
	}
	// The bound as the message shows it is accepted, though the inch value
	// is rounded: 0.001 m is 0.03937007... in.
	f.SetImperial(true)
	typeIn(f, "0.03937", fyne.KeyReturn)
	if f.InputError() != "must be at least 0.0393701 in" {
		t.Errorf("typing 0.03937 in: error %q", f.InputError())
	}
	// 39.3701 in, the maximum as shown, is 1.00000054 m: within the
	// rounding of the message's six digits, so it counts as the bound.
	typeIn(f, "39.3701", fyne.KeyReturn)
	if f.InputError() != "" || f.Value() != 1 {
		t.Errorf("typing the shown maximum: error %q, value %v; want 1", f.InputError(), f.Value())
	}
	typeIn(f, "0.03937007", fyne.KeyReturn) // 0.000999999778 m
	if f.InputError() != "" || f.Value() != 0.001 {
		t.Errorf("typing the minimum to 7 digits: error %q, value %v; want 0.001", f.InputError(), f.Value())
	}
}

func TestNumberField_Imperial_ConvertsExactly(t *testing.T) {
	f, _, got := fieldWindow(t, Length, 0.001, 1)
	f.SetImperial(true)
	f.SetValue(0.3048)
	if f.Unit() != "in" || f.Text() != "12" {
		t.Errorf("0.3048 m in imperial shows %q %s, want 12 in", f.Text(), f.Unit())
	}
	typeIn(f, "6", fyne.KeyReturn)
	if f.Value() != 0.1524 { // 6 x 0.0254 m exactly (NIST SP 811 B.8)
		t.Errorf("6 in = %v m, want 0.1524", f.Value())
	}
	if len(*got) != 1 || (*got)[0] != (change{0.1524, true}) {
		t.Errorf("onChange %v, want [{0.1524 true}]", *got)
	}
	f.SetImperial(false)
	if f.Value() != 0.1524 || f.Text() != "0.1524" || f.Unit() != "m" {
		t.Errorf("back to metric: value %v text %q %s", f.Value(), f.Text(), f.Unit())
	}

	m, _, _ := fieldWindow(t, Mass, 0.01, 20)
	m.SetImperial(true)
	typeIn(m, "1", fyne.KeyReturn)
	if m.Value() != 0.45359237 || m.Unit() != "lb" {
		t.Errorf("1 lb = %v kg (%s), want 0.45359237", m.Value(), m.Unit())
	}

	d, _, _ := fieldWindow(t, Density, 10, 20000)
	d.SetImperial(true)
	d.SetValue(7850) // steel, about 490 lb/ft^3
	if d.Text() != "490.1" || d.Unit() != "lb/ft³" {
		t.Errorf("7850 kg/m^3 shows %q %s, want 490.1 lb/ft³", d.Text(), d.Unit())
	}
	if d.Value() != 7850 {
		t.Errorf("display changed the value to %v", d.Value())
	}
}

func TestNumberField_Slider_DragReportsMovesThenFinal(t *testing.T) {
	f, w, got := fieldWindow(t, Length, 0, 1)
	sp := f.slider.Position()
	ss := f.slider.Size()
	test.Drag(w.Canvas(), fyne.NewPos(sp.X+ss.Width/2, sp.Y+ss.Height/2), 10, 0)
	if len(*got) != 2 || (*got)[0].final || !(*got)[1].final || (*got)[0].v != (*got)[1].v {
		t.Fatalf("drag: onChange %v, want a move then the same value final", *got)
	}
	v := (*got)[1].v
	if math.Abs(v-0.5) > 0.05 || f.Value() != v || f.Text() != formatSig(v, displayDigits) {
		t.Errorf("drag to the middle: value %v, field %v, text %q", v, f.Value(), f.Text())
	}
}

func TestNumberField_SetValue_NoCallback(t *testing.T) {
	f, _, got := fieldWindow(t, Speed, -20, 20)
	f.SetValue(3.5)
	f.SetRange(0, 10)
	f.SetValue(42) // outside: kept, slider at the end
	if len(*got) != 0 {
		t.Errorf("SetValue/SetRange called onChange: %v", *got)
	}
	if f.Value() != 42 || f.slider.Value != sliderSteps {
		t.Errorf("value %v slider %v, want 42 kept and the slider at its end", f.Value(), f.slider.Value)
	}
}

func TestNumberField_Log_SliderPositions(t *testing.T) {
	f, _, _ := fieldWindow(t, Density, 10, 10000)
	f.SetLog(true)
	for _, c := range []struct{ v, pos float64 }{{10, 0}, {100, sliderSteps / 3.0}, {1000, 2 * sliderSteps / 3.0}, {10000, sliderSteps}} {
		if got := f.position(c.v); math.Abs(got-c.pos) > 1e-9 {
			t.Errorf("log position of %v = %v, want %v", c.v, got, c.pos)
		}
		if got := f.valueAt(c.pos); math.Abs(got-c.v) > 1e-9*c.v {
			t.Errorf("log value at %v = %v, want %v", c.pos, got, c.v)
		}
	}
	f.SetRange(0, 100) // not strictly positive: linear
	if got := f.position(50); got != sliderSteps/2 {
		t.Errorf("log over [0, 100] should fall back to linear: position(50) = %v", got)
	}
}

func TestNumberField_Disabled_IgnoresInput(t *testing.T) {
	f, _, got := fieldWindow(t, Length, 0.001, 1)
	f.Disable()
	f.entry.SetText("0.5")
	f.commit()
	f.slid(900, true)
	if len(*got) != 0 || !f.Disabled() || !f.entry.Disabled() || !f.slider.Disabled() {
		t.Errorf("disabled field: onChange %v", *got)
	}
	f.Enable()
	typeIn(f, "0.5", fyne.KeyReturn)
	if len(*got) != 1 {
		t.Errorf("enabled again: onChange %v", *got)
	}
}

func TestNumberField_Frames_WholeNumbers(t *testing.T) {
	f, _, _ := fieldWindow(t, Frames, 1, 48)
	typeIn(f, "2.5", fyne.KeyReturn)
	if f.InputError() != "must be a whole number of frames" {
		t.Errorf("2.5 frames: error %q", f.InputError())
	}
	if v := f.valueAt(sliderSteps / 3); v != math.Round(v) {
		t.Errorf("slider gives %v frames, want a whole number", v)
	}
}

func TestNumberField_Golden(t *testing.T) {
	f, w, _ := fieldWindow(t, Length, 0.001, 1)
	f.SetValue(0.13)
	test.AssertImageMatches(t, "numfield/metric.png", w.Canvas().Capture())
	f.SetImperial(true)
	typeIn(f, "abc", fyne.KeyReturn)
	test.AssertImageMatches(t, "numfield/imperial_error.png", w.Canvas().Capture())
}

// TestNumberField_Span_NarrowsSliderAroundValue: with a span of 3 a log
// slider runs from value/3 to value*3 (the middle is the value itself) and
// re-centres when the value is shown again, while typing still reaches the
// whole range.
func TestNumberField_Span_NarrowsSliderAroundValue(t *testing.T) {
	f, _, got := fieldWindow(t, Length, 0.001, 2)
	f.SetLog(true)
	f.SetSpan(3)
	f.SetValue(0.12)
	if math.Abs(f.slider.Value-sliderSteps/2) > 1e-9 {
		t.Errorf("value at slider %v, want the middle %v", f.slider.Value, sliderSteps/2.0)
	}
	if v := f.valueAt(sliderSteps); math.Abs(v-0.36) > 1e-9 {
		t.Errorf("slider end = %v, want 0.36", v)
	}
	if v := f.valueAt(0); math.Abs(v-0.04) > 1e-9 {
		t.Errorf("slider start = %v, want 0.04", v)
	}
	typeIn(f, "1.5", fyne.KeyReturn)
	if len(*got) != 1 || (*got)[0].v != 1.5 {
		t.Fatalf("typed 1.5: %v", *got)
	}
	// Shown again, the window follows: 1.5 m is now mid-slider, capped at 2 m.
	if v := f.valueAt(sliderSteps); v != 2 {
		t.Errorf("after re-centring the slider end = %v, want the 2 m limit", v)
	}
	f.SetSpan(0)
	if v := f.valueAt(0); v != 0.001 {
		t.Errorf("span off: slider start %v, want 0.001", v)
	}
}

// TestNumberField_RangeMessageFits: in a row as narrow as the window's side
// panel gives (360 px: "spin rate", slider, entry, "turns/s"), a value past
// the range says so in the slider's place whole, not cut to "must be at
// most …": the unit is already beside the entry, so the row shows "at most
// 100"; InputError keeps the full sentence.
func TestNumberField_RangeMessageFits(t *testing.T) {
	test.NewTempApp(t)
	f := NewNumberField("spin rate", TurnRate, 0.01, 100, nil)
	w := test.NewTempWindow(t, f)
	w.SetPadded(false)
	w.Resize(fyne.NewSize(360, f.MinSize().Height))
	f.SetValue(1.6)
	typeIn(f, "500", fyne.KeyReturn)
	if got := f.InputError(); got != "must be at most 100 turns/s" {
		t.Errorf("InputError %q", got)
	}
	if f.problem.Text != "at most 100" {
		t.Errorf("the row shows %q, want \"at most 100\"", f.problem.Text)
	}
	need := fyne.MeasureText(f.problem.Text, f.Theme().Size(theme.SizeNameText), fyne.TextStyle{}).Width +
		2*f.Theme().Size(theme.SizeNameInnerPadding)
	if have := f.problem.Size().Width; need > have {
		t.Errorf("message %q needs %.0f px, has %.0f: cut off", f.problem.Text, need, have)
	}
}
