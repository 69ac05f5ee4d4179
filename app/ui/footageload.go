package ui

import (
	"errors"
	"path/filepath"
	"strconv"
	"strings"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/dialog"
	"fyne.io/fyne/v2/storage"
	"fyne.io/fyne/v2/widget"

	"propflight/app/footage"
	"propflight/app/project"
	"propflight/physics"
)

// This file is where the footage pane gets its clip: the folder and GIF
// dialogs, the typed path and the footage's frame rate. (A save keeps a
// relative footage path naming the same clip: editor.Save.)

// browseFolder asks for a folder of frames.
func (p *footagePane) browseFolder() {
	d := dialog.NewFolderOpen(func(lu fyne.ListableURI, err error) {
		if err != nil {
			p.w.showError("Could not load footage", err)
			return
		}
		if lu != nil {
			p.load(lu.Path())
		}
	}, p.w.win)
	p.startIn(d)
	d.Resize(fileDialogSize)
	d.Show()
}

// browseGIF asks for an animated GIF.
func (p *footagePane) browseGIF() {
	d := dialog.NewFileOpen(func(rc fyne.URIReadCloser, err error) {
		if err != nil {
			p.w.showError("Could not load footage", err)
			return
		}
		if rc == nil {
			return
		}
		path := rc.URI().Path()
		rc.Close()
		p.load(path)
	}, p.w.win)
	d.SetFilter(storage.NewExtensionFileFilter([]string{".gif"}))
	p.startIn(d)
	d.Resize(fileDialogSize)
	d.Show()
}

// startIn points a dialog at the current footage's folder, else where
// project dialogs start.
func (p *footagePane) startIn(d interface{ SetLocation(fyne.ListableURI) }) {
	if dir := p.w.ed.Doc().FootageDir(p.w.ed.Path()); dir != "" {
		if lu, err := storage.ListerForURI(storage.NewFileURI(filepath.Dir(dir))); err == nil {
			d.SetLocation(lu)
			return
		}
	}
	p.w.startIn(d)
}

// load opens the footage at path with the document's footage rate and, if
// it opens, makes it the project's footage (one undo step; the marks of
// another clip are dropped). Footage that cannot be opened shows an error
// dialog naming the file, and the project stays as it was.
//
// Opening reads every frame's header, or decodes a whole GIF, which can
// take seconds: it runs off the UI goroutine (openFootage) and the pane
// says so meanwhile; a later load supersedes one still opening. load
// reports whether the footage opened (in a synchronous test window) or
// the opening started.
func (p *footagePane) load(path string) bool {
	path = strings.TrimSpace(path)
	if path == "" {
		p.w.showError("Could not load footage", errors.New("give a folder of numbered PNG or JPEG frames, or an animated GIF"))
		return false
	}
	doc := p.w.ed.Doc()
	rate, _, err := doc.FootageRate()
	if err != nil {
		rate = physics.Rate{}
	}
	key := seqKey(path, doc)
	p.loadGen++
	gen := p.loadGen
	opened := false
	p.status.Importance = widget.MediumImportance
	p.status.SetText("Opening " + path + "…")
	p.openFootage(path, rate, func(seq *footage.Sequence, err error) {
		if gen != p.loadGen {
			return // another load since
		}
		opened = p.loaded(path, key, seq, err)
	})
	return opened || !p.w.synchronous
}

// loaded finishes load: the footage opened from path (as key), or err.
func (p *footagePane) loaded(path, key string, seq *footage.Sequence, err error) bool {
	if err != nil {
		p.resync() // the status as it was
		p.w.showErrorNote("Could not load footage", err, "The project is unchanged.")
		return false
	}
	doc := p.w.ed.Doc()
	same := doc.Footage != nil && filepath.Clean(doc.FootageDir(p.w.ed.Path())) == filepath.Clean(path)
	p.seq, p.seqKey, p.loadErr, p.opening = seq, key, nil, ""
	p.view.SetSource(seq)
	p.takeFrame = -1
	p.edit("Load footage", "", true, func(d *project.Document) error {
		d.SetFootagePath(p.w.ed.Path(), path)
		if !same {
			d.Footage.Marks = nil
		}
		return nil
	})
	return true
}

// openFootage opens the footage at path at rate (zero: the clip's own)
// off the UI goroutine and calls done with the result on the UI goroutine,
// unless the window has closed by then. A synchronous (test) window opens
// it at once and calls done before returning.
func (p *footagePane) openFootage(path string, rate physics.Rate, done func(*footage.Sequence, error)) {
	if p.w.synchronous {
		done(footage.Open(path, footage.Options{FPS: rate}))
		return
	}
	w := p.w
	go func() {
		seq, err := footage.Open(path, footage.Options{FPS: rate})
		w.do(func() {
			if !w.closed {
				done(seq, err)
			}
		})
	}()
}

// resync sets the pane from the document again.
func (p *footagePane) resync() {
	p.w.syncing++
	p.sync(p.w.ed.Doc())
	p.w.syncing--
}

// seqKey names what a sequence is opened from: the folder or GIF and the
// document's footage rate.
func seqKey(dir string, d *project.Document) string {
	key := filepath.Clean(dir)
	if d.Footage != nil && d.Footage.FPS != nil {
		key += "\x00" + frameRateText(d.Footage.FPS)
	}
	return key
}

// pickRate sets the footage's frame rate from the picker.
func (p *footagePane) pickRate(s string) {
	if p.w.syncing > 0 || s == "" {
		return
	}
	if s == customRate {
		p.custom.SetText(frameRateText(p.footageFPS()))
		p.custom.Show()
		p.w.win.Canvas().Focus(p.custom)
		return
	}
	p.custom.Hide()
	var fr *project.FrameRate
	for _, c := range rateChoices {
		if c.Label == s {
			fr = frameRateOf(c.Rate)
		}
	}
	p.setRate("Change the footage rate to "+s, fr)
}

// typeRate sets a typed footage rate, kept as written; a bad one is
// refused with a message.
func (p *footagePane) typeRate(text string) {
	text = strings.TrimSpace(text)
	r, err := physics.ParseRate(text)
	if err != nil || r.Num < r.Den {
		p.status.SetText("footage rate: " + text + " is not a frame rate of at least 1 frame per second (write 12.5 or 24000/1001)")
		return
	}
	fr := &project.FrameRate{Text: text}
	if x, err := strconv.ParseFloat(text, 64); err == nil {
		fr = &project.FrameRate{Number: x}
	}
	p.setRate("Change the footage rate to "+text, fr)
}

func (p *footagePane) setRate(label string, fr *project.FrameRate) {
	p.edit(label, "", true, func(d *project.Document) error {
		if d.Footage == nil {
			return errNoFootage
		}
		d.Footage.FPS = fr
		return nil
	})
}

func (p *footagePane) footageFPS() *project.FrameRate {
	if d := p.w.ed.Doc(); d.Footage != nil && d.Footage.FPS != nil {
		return d.Footage.FPS
	}
	if p.seq != nil {
		return frameRateOf(p.seq.FPS())
	}
	return nil
}
