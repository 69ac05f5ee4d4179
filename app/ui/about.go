package ui

import (
	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/container"
	"fyne.io/fyne/v2/dialog"
	"fyne.io/fyne/v2/widget"

	"propflight/assets"
)

// Version is the program's version (assets/VERSION, which FyneApp.toml
// and the Debian archive agree with).
var Version = assets.Version

// Tagline says in one line what Propflight does.
const Tagline = "Tells you whether a thrown prop will spin, tumble or wobble, and times its flight frame by frame."

// Caution is the safety caution every place a user reads results carries,
// word for word (DEVELOPERS.md, "Safety caution").
const Caution = "Propflight is a planning and animation aid. It ignores air drag and contact, so real " +
	"throws differ from its takes. Any live throw follows local safety rules and a qualified " +
	"stunt or safety coordinator."

// showAbout shows the name, version, what the program does and the caution.
func (w *Window) showAbout() {
	title := widget.NewLabelWithStyle("Propflight "+Version, fyne.TextAlignLeading, fyne.TextStyle{Bold: true})
	tag := widget.NewLabel(Tagline)
	tag.Wrapping = fyne.TextWrapWord
	caution := widget.NewLabel(Caution)
	caution.Wrapping = fyne.TextWrapWord
	caution.Importance = widget.WarningImportance
	content := container.NewVBox(title, tag, widget.NewSeparator(), caution)
	d := dialog.NewCustom("About Propflight", "Close", sized(content, 460, 0), w.win)
	w.lastDialog = &shownDialog{title: "About Propflight", message: Tagline + "\n" + Caution, d: d}
	d.Show()
}
