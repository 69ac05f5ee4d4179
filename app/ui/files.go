package ui

import (
	"errors"
	"fmt"
	"path/filepath"
	"strings"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/dialog"
	"fyne.io/fyne/v2/storage"
	"fyne.io/fyne/v2/widget"

	"propflight/app/fsutil"
	"propflight/app/project"
	"propflight/internal/printable"
)

// newProject starts an untitled project: one book-sized box (see
// emptyDocument), asking first about unsaved changes.
func (w *Window) newProject() {
	w.confirmDiscard("Start a new project", func() {
		w.replace(emptyDocument(), "", "")
	}, nil)
}

// loadPreset replaces the project with the embedded preset name (never
// saved: Save asks for a file).
func (w *Window) loadPreset(name string) {
	doc, err := presetDocument(name)
	if err != nil {
		w.showError("Cannot load the preset", err)
		w.props.showPreset(w.preset)
		return
	}
	w.replace(doc, "", name)
}

// replace makes doc the project (from path, or the preset named preset),
// with a fresh history, and shows it from its first frame.
func (w *Window) replace(doc *project.Document, path, preset string) {
	if err := w.ed.Replace(doc, path); err != nil {
		w.showError("Cannot use this project", err)
		return
	}
	w.afterReplace(preset)
}

// afterReplace shows a project that just replaced the old one.
func (w *Window) afterReplace(preset string) {
	w.stopPlayback()
	w.preset = preset
	w.props.showPreset(preset)
	w.props.selected = 0
	w.frame = 0
	w.footage.takeFrame = -1
	w.footage.clearFit()
	w.editErr = nil
	w.reframe = true
	w.syncControls()
	w.menu.updateRecent()
}

// openDialog asks for a project file to open, after asking about unsaved
// changes.
func (w *Window) openDialog() {
	w.confirmDiscard("Open a project", func() {
		d := dialog.NewFileOpen(func(rc fyne.URIReadCloser, err error) {
			if err != nil {
				w.showError("Cannot open the file", err)
				return
			}
			if rc == nil {
				return // cancelled
			}
			path := rc.URI().Path()
			rc.Close()
			w.openPath(path)
		}, w.win)
		d.SetFilter(storage.NewExtensionFileFilter([]string{".json"}))
		w.startIn(d)
		d.Resize(fileDialogSize)
		d.Show()
	}, nil)
}

// startIn points a file dialog at the folder of the project's file, else
// of the most recent project, else the working folder.
func (w *Window) startIn(d interface{ SetLocation(fyne.ListableURI) }) {
	dir := w.startDir()
	if dir == "" {
		return
	}
	if lu, err := storage.ListerForURI(storage.NewFileURI(dir)); err == nil {
		d.SetLocation(lu)
	}
}

// openPath opens the project file at path. A file that cannot be read or
// has a bad field shows an error dialog naming the file and the field, and
// the current project stays as it was. It reports whether it opened.
func (w *Window) openPath(path string) bool {
	if err := w.ed.Open(path); err != nil {
		w.showError("Could not open "+printable.String(filepath.Base(path)), err)
		return false
	}
	w.recent.Add(path)
	w.afterReplace("")
	return true
}

// save writes the project to its file, or asks for one first. then, if
// not nil, runs after a successful save.
func (w *Window) save(then func()) {
	if w.ed.Path() == "" {
		w.saveAs(then)
		return
	}
	w.saveTo(w.ed.Path(), then)
}

// saveAs asks for a folder and a file name and saves the project there
// (askSavePath: nothing is written before the answer, an existing file is
// replaced only after its own question).
func (w *Window) saveAs(then func()) {
	name := safeFileName(projectName(w.ed.Doc(), w.ed.Path()))
	if p := w.ed.Path(); p != "" {
		name = strings.TrimSuffix(filepath.Base(p), filepath.Ext(p)) // propose the file's own name
	}
	w.askSavePath("Save project as", name, ".json", w.ed.Path(), func(path string) { w.saveTo(path, then) })
}

// savePicked saves to the file named name in folder dir, as the save
// dialog does once it is answered.
func (w *Window) savePicked(dir, name string, then func()) {
	path, err := pickedPath(dir, name, ".json")
	if err != nil {
		w.showError("Cannot save", err)
		return
	}
	w.confirmTarget(path, w.ed.Path(), func(path string) { w.saveTo(path, then) })
}

// confirmReplace asks before replacing the existing file path; replace
// runs on Replace.
func (w *Window) confirmReplace(path string, replace func()) {
	base := printable.String(filepath.Base(path))
	w.ask("Replace "+base+"?",
		fmt.Sprintf("%s already exists in %s. Saving replaces it.", base, printable.String(filepath.Dir(path))), 420,
		answer{label: "Cancel"},
		answer{label: "Replace", run: replace, look: widget.DangerImportance})
}

// confirmReadOnly asks before replacing the read-only file path; replace
// runs on "Replace anyway".
func (w *Window) confirmReadOnly(path string, replace func()) {
	base := printable.String(filepath.Base(path))
	dir := filepath.Dir(path)
	if abs, err := filepath.Abs(dir); err == nil {
		dir = abs
	}
	w.ask(base+" is read-only",
		fmt.Sprintf("%s in %s is read-only: someone protected it from changes. Replace it anyway? The new file keeps the read-only permission.",
			base, printable.String(dir)), 420,
		answer{label: "Cancel"},
		answer{label: "Replace anyway", run: replace, look: widget.DangerImportance})
}

// fileDialogSize is the size of the open and save dialogs: room for a
// folder of project files.
var fileDialogSize = fyne.NewSize(820, 580)

// maxFileStem bounds a file name proposed from a project name, bytes, so
// that with an extension (and "-frames") it stays a name file systems take.
const maxFileStem = 100

// safeFileName turns a project name into a file name: letters, digits,
// '-' and '_' kept, spaces to '-', anything else dropped, shortened to
// maxFileStem bytes (fsutil.ShortName).
func safeFileName(name string) string {
	var b strings.Builder
	for _, r := range strings.TrimSpace(name) {
		switch {
		case r == ' ':
			b.WriteRune('-')
		case r == '-' || r == '_' || r >= '0' && r <= '9' || r >= 'a' && r <= 'z' || r >= 'A' && r <= 'Z':
			b.WriteRune(r)
		}
	}
	if b.Len() == 0 {
		return "untitled"
	}
	return fsutil.ShortName(b.String(), maxFileStem)
}

// saveTo saves the project at path atomically and runs then (if not nil)
// after a successful save; a failure shows an error dialog and leaves the
// old file whole. A read-only file is replaced only after the user agrees
// (confirmReadOnly). The editor keeps a relative footage path naming the
// same clip (editor.Save).
func (w *Window) saveTo(path string, then func()) {
	err := w.ed.Save(path)
	if errors.Is(err, fsutil.ErrReadOnly) {
		w.confirmReadOnly(path, func() {
			if w.saved(path, w.ed.SaveWith(path, fsutil.Options{ReplaceReadOnly: true})) && then != nil {
				then()
			}
		})
		return
	}
	if w.saved(path, err) && then != nil {
		then()
	}
}

// saved finishes a save to path that ended with err, and reports success.
func (w *Window) saved(path string, err error) bool {
	if err != nil {
		w.showError("Could not save "+printable.String(filepath.Base(path)), err)
		return false
	}
	w.recent.Add(path)
	w.preset = ""
	w.props.showPreset("")
	w.updateTitle()
	w.menu.update()
	w.menu.updateRecent()
	return true
}

// showError shows err in a dialog under a title such as "Could not open
// pan.json". Project errors already name the file and the field.
func (w *Window) showError(title string, err error) {
	var pe *project.Error
	note := ""
	if errors.As(err, &pe) {
		note = "The project you had open is unchanged."
	}
	w.showErrorNote(title, err, note)
}

// showErrorNote is showError with its own closing paragraph (none when
// note is empty).
func (w *Window) showErrorNote(title string, err error, note string) {
	msg := errorText(err)
	if note != "" {
		msg += "\n\n" + note
	}
	text := widget.NewLabel(msg)
	text.Wrapping = fyne.TextWrapWord
	d := dialog.NewCustom(title, "OK", sized(text, 420, 0), w.win)
	w.lastDialog = &shownDialog{title: title, message: msg, d: d}
	d.Show()
}

// confirmDiscard runs proceed at once if there are no unsaved changes.
// Otherwise it asks whether to save them first, discard them, or cancel
// (then cancel runs, if not nil). action names what is about to happen.
func (w *Window) confirmDiscard(action string, proceed, cancel func()) {
	if !w.dirty() {
		proceed()
		return
	}
	name := shownName(w.ed.Doc(), w.ed.Path())
	w.ask("Save changes?",
		fmt.Sprintf("%s has changes that are not saved. %s will lose them unless you save first.", name, action), 420,
		answer{label: "Cancel", run: cancel},
		answer{label: "Don't save", run: proceed},
		answer{label: "Save", run: func() { w.save(proceed) }, look: widget.HighImportance})
}

// requestClose is the window's close intercept: it asks about unsaved
// changes, then closes.
func (w *Window) requestClose() {
	w.confirmDiscard("Closing", w.closeNow, nil)
}

// closeNow stops playback and the worker and closes the window.
func (w *Window) closeNow() {
	w.stopPlayback()
	w.closed = true
	go w.comp.Close() // waits for a computation in progress; never on the UI goroutine
	w.win.Close()
}

// recentItems returns the Open Recent submenu's items.
func (w *Window) recentItems() []*fyne.MenuItem {
	files := w.recent.Existing()
	if len(files) == 0 {
		it := fyne.NewMenuItem("(no recent projects)", nil)
		it.Disabled = true
		return []*fyne.MenuItem{it}
	}
	items := make([]*fyne.MenuItem, 0, len(files))
	for _, p := range files {
		p := p
		items = append(items, fyne.NewMenuItem(printable.String(p), func() {
			w.confirmDiscard("Opening "+printable.String(filepath.Base(p)), func() { w.openPath(p) }, nil)
		}))
	}
	return items
}
