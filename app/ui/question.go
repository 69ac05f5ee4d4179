package ui

import (
	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/dialog"
	"fyne.io/fyne/v2/widget"
)

// answer is one button of a question dialog: its label, what it runs
// after the dialog closes (nil: nothing) and its importance (the
// default, High for the likely answer, Danger for one that loses work).
type answer struct {
	label string
	run   func()
	look  widget.Importance
}

// ask shows a question: title, the message wrapped at width, and one
// button an answer, left to right. Every button closes the dialog, then
// runs its answer. The dialog is recorded for tests (w.lastDialog), its
// buttons by label.
func (w *Window) ask(title, message string, width float32, answers ...answer) {
	msg := widget.NewLabel(message)
	msg.Wrapping = fyne.TextWrapWord
	d := dialog.NewCustomWithoutButtons(title, sized(msg, width, 0), w.win)
	choose := make(map[string]func(), len(answers))
	buttons := make([]fyne.CanvasObject, len(answers))
	for i, a := range answers {
		run := a.run
		choose[a.label] = func() {
			d.Hide()
			if run != nil {
				run()
			}
		}
		b := widget.NewButton(a.label, choose[a.label])
		b.Importance = a.look
		buttons[i] = b
	}
	d.SetButtons(buttons)
	w.lastDialog = &shownDialog{title: title, message: msg.Text, d: d, choose: choose}
	d.Show()
}

// shownDialog records the last dialog the window showed, for tests.
type shownDialog struct {
	title, message string
	d              dialog.Dialog
	choose         map[string]func() // prompt buttons by label
}
