package ui

import (
	"errors"
	"os"
	"path/filepath"
	"strings"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/container"
	"fyne.io/fyne/v2/dialog"
	"fyne.io/fyne/v2/storage"
	"fyne.io/fyne/v2/widget"
)

// The window's own save dialog: a folder (chosen with Fyne's folder
// picker) and a file name. Fyne's file-save dialog opens the chosen file
// for writing, which empties an existing file before the caller sees it;
// a save that then failed would leave the old file empty. This dialog
// touches no file: the caller writes the new one atomically and only after
// its own question before replacing another.

// askSavePath asks where to save a file of extension ext (".json",
// ".pdf"), proposing name in the folder the window starts in, and calls
// chosen with the path once it is settled: an existing file other than own
// (the file being written over on purpose) is replaced only after the user
// says so.
func (w *Window) askSavePath(title, name, ext, own string, chosen func(path string)) {
	dir := w.startDir()
	folder := widget.NewLabel(dir)
	folder.Truncation = fyne.TextTruncateEllipsis
	entry := widget.NewEntry()
	entry.SetText(name + ext)
	problem := widget.NewLabel("")
	problem.Importance = widget.DangerImportance
	problem.Hide()
	browse := widget.NewButton("Choose folder…", func() {
		d := dialog.NewFolderOpen(func(u fyne.ListableURI, err error) {
			if err == nil && u != nil {
				dir = u.Path()
				folder.SetText(dir)
			}
		}, w.win)
		if lu, err := storage.ListerForURI(storage.NewFileURI(dir)); err == nil {
			d.SetLocation(lu)
		}
		d.Resize(fileDialogSize)
		d.Show()
	})
	form := container.NewVBox(
		widget.NewLabel("Folder"), container.NewBorder(nil, nil, nil, browse, folder),
		widget.NewLabel("File name"), entry, problem)
	var d dialog.Dialog
	// check validates the typed name, showing what is wrong in the dialog.
	check := func() (string, bool) {
		path, err := pickedPath(dir, entry.Text, ext)
		if err != nil {
			problem.SetText(err.Error())
			problem.Show()
			return "", false
		}
		return path, true
	}
	d = dialog.NewCustomConfirm(title, "Save", "Cancel", sized(form, 520, 0), func(ok bool) {
		if !ok {
			return
		}
		if path, good := check(); good {
			w.confirmTarget(path, own, chosen)
		} else {
			d.Show() // keep asking until the name is good or the user cancels
		}
	}, w.win)
	entry.OnSubmitted = func(string) {
		if path, good := check(); good {
			// Hide first: hiding a dialog also removes any shown above it,
			// such as the question before replacing a file.
			d.Hide()
			w.confirmTarget(path, own, chosen)
		}
	}
	w.lastDialog = &shownDialog{title: title, d: d}
	d.Show()
	w.win.Canvas().Focus(entry)
}

// pickedPath joins folder dir and the typed file name, adding ext when
// the name lacks it. A name must be non-empty and a plain name, not a path.
func pickedPath(dir, name, ext string) (string, error) {
	name = strings.TrimSpace(name)
	switch {
	case name == "" || name == ext:
		return "", errors.New("file name: give a name")
	case strings.ContainsAny(name, `/\`) || name == "." || name == "..":
		return "", errors.New("file name: a name only, without folders (choose the folder above)")
	case dir == "":
		return "", errors.New("folder: choose a folder")
	}
	if !strings.EqualFold(filepath.Ext(name), ext) {
		name += ext
	}
	return filepath.Join(dir, name), nil
}

// confirmTarget calls chosen with path at once when no other file is
// there (or it is own), else after confirmReplace.
func (w *Window) confirmTarget(path, own string, chosen func(path string)) {
	if _, err := os.Stat(path); err != nil || (own != "" && filepath.Clean(path) == filepath.Clean(own)) {
		chosen(path)
		return
	}
	w.confirmReplace(path, func() { chosen(path) })
}

// startDir is the folder the open and save dialogs start in: the
// project's, else the newest recent file's, else the working directory.
func (w *Window) startDir() string {
	if p := w.ed.Path(); p != "" {
		return filepath.Dir(p)
	}
	if files := w.recent.Existing(); len(files) > 0 {
		return filepath.Dir(files[0])
	}
	if wd, err := os.Getwd(); err == nil {
		return wd
	}
	return ""
}
