package ui

import (
	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/container"
	"fyne.io/fyne/v2/layout"
	"fyne.io/fyne/v2/theme"
	"fyne.io/fyne/v2/widget"

	"propflight/app/editor"
	"propflight/app/project"
	"propflight/physics"
	"propflight/widgets"
)

// verdictPanel is the right-hand column: what the throw does and why, the
// numbers behind it, the project's error if it has one, and the three
// thresholds of the verdict rules.
type verdictPanel struct {
	w       *Window
	content *fyne.Container
	fields  fieldSet

	headline *widget.Label
	why      *widget.Label
	problem  *widget.Label
	rows     *fyne.Container
	report   report // what the panel shows, for tests

	symTol, tumble, wobble *widgets.NumberField
}

func newVerdictPanel(w *Window) *verdictPanel {
	v := &verdictPanel{w: w}
	v.headline = widget.NewLabelWithStyle("", fyne.TextAlignLeading, fyne.TextStyle{Bold: true})
	v.headline.SizeName = theme.SizeNameSubHeadingText
	v.why = widget.NewLabel("")
	v.why.Wrapping = fyne.TextWrapWord
	v.problem = widget.NewLabel("")
	v.problem.Wrapping = fyne.TextWrapWord
	v.problem.Importance = widget.DangerImportance
	v.problem.Hide()
	v.rows = container.New(layout.NewFormLayout())

	fs := &v.fields
	// The thresholds are the project's "verdict_rules": an edit like any
	// other (saved, undoable), so the window and every command judge the
	// project alike.
	thresholdChanged := func(_ float64, final bool) {
		thr := physics.Thresholds{SymmetryTol: v.symTol.Value() / 100, TumbleDeg: v.tumble.Value(), WobbleMinDeg: v.wobble.Value()}
		w.edit("Verdict rules", "verdict_rules", final, func(d *project.Document) error {
			d.SetThresholds(thr)
			return nil
		})
	}
	v.symTol = w.newField(fs, "symmetric within %", widgets.Plain, 0.1, 10, thresholdChanged)
	v.tumble = w.newField(fs, "tumble from", widgets.Angle, 1, 89, thresholdChanged)
	v.wobble = w.newField(fs, "wobble from", widgets.Angle, 0.01, 10, thresholdChanged)
	v.sync(w.ed.Doc())
	v.fields.alignLabels()

	v.content = container.NewVBox(
		heading("Verdict"),
		v.headline,
		v.why,
		v.problem,
		widget.NewSeparator(),
		v.rows,
		widget.NewSeparator(),
		heading("Verdict rules"),
		note("Two moments this close count as equal (a symmetric prop); an asymmetric prop tumbles when its turning axis swings this far; a symmetric one wobbles when its spin is this far off its axis."),
		v.symTol, v.tumble, v.wobble,
	)
	return v
}

// sync sets the three threshold fields from the document's verdict rules.
func (v *verdictPanel) sync(d *project.Document) {
	thr := d.Thresholds()
	setValue(v.symTol, thr.SymmetryTol*100)
	setValue(v.tumble, thr.TumbleDeg)
	setValue(v.wobble, thr.WobbleMinDeg)
}

// show puts result res on the panel. editErr is an edit the editor
// refused; like the project's own error it is shown above the numbers,
// which stay those of the last result that had them.
func (v *verdictPanel) show(res editor.Result, editErr error) {
	r := verdictReport(res, v.w.imperial)
	if editErr != nil {
		r.Err = editErr.Error()
	}
	if res.Scene == nil {
		// Keep the last verdict's words and numbers; only the error changes.
		r.Motion, r.Headline, r.Why, r.Rows = v.report.Motion, v.report.Headline, v.report.Why, v.report.Rows
	}
	v.report = r
	v.headline.SetText(r.Headline)
	v.why.SetText(r.Why)
	if r.Err != "" {
		text := "Cannot fly this project: " + r.Err
		switch {
		case res.Scene == nil && r.Headline != "":
			text += "\nThe picture and the numbers below are from the last version that flew."
		case res.Scene != nil && v.w.good.Take != nil:
			text += "\nThe picture is from the last version that flew."
		}
		v.problem.SetText(text)
		v.problem.Show()
	} else {
		v.problem.Hide()
	}
	if res.Scene == nil {
		return
	}
	objs := make([]fyne.CanvasObject, 0, 2*len(r.Rows))
	for _, rw := range r.Rows {
		l := widget.NewLabelWithStyle(rw.Label, fyne.TextAlignTrailing, fyne.TextStyle{})
		val := widget.NewLabel(rw.Value)
		val.Wrapping = fyne.TextWrapWord
		objs = append(objs, l, val)
	}
	v.rows.Objects = objs
	v.rows.Refresh()
}
