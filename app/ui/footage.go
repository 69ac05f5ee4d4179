package ui

import (
	"errors"
	"fmt"
	"math"
	"path/filepath"
	"sync/atomic"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/container"
	"fyne.io/fyne/v2/layout"
	"fyne.io/fyne/v2/theme"
	"fyne.io/fyne/v2/widget"

	"propflight/app/footage"
	"propflight/app/project"
	"propflight/internal/printable"
	"propflight/physics"
	"propflight/widgets"
)

// footagePane is the Footage tab and the footage view beside the preview:
// loading a clip (a folder of numbered frames or a GIF) with its own
// frame rate, the footage frame of the release, the overlay of the take,
// the marks and the fit that sets up the throw.
//
// The footage follows the take by time: take frame n (at n / take fps
// seconds from release) shows footage frame offset + floor(t fps_footage)
// (footage.Sequence.FrameAt), so clips at another rate line up. The
// footage frame buttons step the footage alone and move the take to the
// nearest take frame (or leave it, beyond the take's last frame), and the
// footage holds that frame until the take moves.
//
// Every change to the marks, the offset, the overlay or the clip is an
// editor step (undoable) stored in the document's "footage" object; the
// open sequence follows the document, so Undo of "Load footage" closes it.
type footagePane struct {
	w       *Window
	content *fyne.Container // the Footage tab
	side    *fyne.Container // the view with its frame bar, beside the preview
	view    *widgets.FootageView
	fields  fieldSet

	path       *widget.Entry
	status     *widget.Label
	fps        *widget.Select
	custom     *widget.Entry
	offset     *widgets.NumberField
	overlay    *widget.Check
	opacity    *widgets.NumberField
	marks      *widget.Label
	fitBtn     *widget.Button
	applyBtn   *widget.Button
	fitForm    *fyne.Container // the fit's rows
	fitProblem *widget.Label   // why there is no fit
	fitText    string          // the fit as shown, for tests
	frameLabel *widget.Label

	seq     *footage.Sequence
	seqKey  string // the folder or GIF and the rate seq was opened with, or is being opened with
	loadErr error  // the footage the document names could not be opened
	opening string // the folder or GIF being opened off the UI goroutine, "" when none
	loadGen int    // counts load calls: only the latest one's footage is used
	frame   int    // the footage frame shown
	// takeFrame is the take frame the footage last followed: the footage
	// frame changes with the take only when the take moves to another
	// frame (or the mapping changes), so stepping the footage alone beyond
	// the take holds.
	takeFrame int
	fit       *footage.FitResult
	fitErr    error
	showFit   bool // the Fit button was pressed: the fit is shown and kept up to date

	prefetching atomic.Bool // a goroutine is decoding the frames after the one shown
}

// prefetchAhead is how many frames after the one shown are decoded ahead
// into the clip's cache, so that playing or stepping finds them ready
// (the view decodes a frame it shows on the UI goroutine).
const prefetchAhead = 4

// prefetch decodes the frames after f on another goroutine, at most one
// such goroutine at a time (a request while one runs is dropped: the next
// frame shown asks again). Sequence.Frame is safe for concurrent use and
// shares a decode already under way.
func (p *footagePane) prefetch(f int) {
	seq := p.seq
	if seq == nil || p.w.synchronous || !p.prefetching.CompareAndSwap(false, true) {
		return
	}
	go func() {
		defer p.prefetching.Store(false)
		for k := f + 1; k <= f+prefetchAhead && k < seq.Len(); k++ {
			if k >= 0 {
				seq.Frame(k) // errors show when the frame itself is shown
			}
		}
	}()
}

// Choices of the footage frame-rate picker besides the rates.
const footageOwnRate = "the clip's own"

// footageRateLabels returns the picker's entries.
func footageRateLabels() []string { return append([]string{footageOwnRate}, rateLabels()...) }

// maxFootageOffset bounds the offset field's slider, frames; a typed value
// may go to mark.MaxFrame.
const maxFootageOffset = 500

// newFootagePane builds the footage pane: the footage view beside the
// take with its frame buttons, and the tab of loading, overlay, marks and
// fit controls.
func newFootagePane(w *Window) *footagePane {
	p := &footagePane{w: w, takeFrame: -1}
	p.buildView()
	loadButtons, loadTyped := p.buildLoad()
	p.buildOverlay()
	p.buildFit()
	p.content = p.layout(loadButtons, loadTyped)
	p.side = p.buildSide()
	p.setEnabled(false)
	return p
}

// buildView makes the footage view; its mark edits are undoable steps.
func (p *footagePane) buildView() {
	w := p.w
	p.view = widgets.NewFootageView()
	p.view.OnMark = p.mark
	p.view.OnMarkMoved = func(i int, x, y float64) {
		p.edit(fmt.Sprintf("Move the mark on footage frame %d", p.markFrame(i)), "", true, func(d *project.Document) error { return moveMark(d, i, x, y) })
	}
	p.view.OnSecondMoved = func(i int, x, y float64) {
		p.edit(fmt.Sprintf("Move the second point on footage frame %d", p.markFrame(i)), "", true, func(d *project.Document) error { return moveSecond(d, i, x, y) })
	}
	p.view.OnMarkDeleted = func(i int) {
		p.edit(fmt.Sprintf("Delete the mark on footage frame %d", p.markFrame(i)), "", true, func(d *project.Document) error { return deleteMark(d, i) })
	}
	p.view.OnOtherKey = func(k *fyne.KeyEvent) { w.frameKey(k) }
}

// buildLoad makes the controls that load footage (the folder and GIF
// buttons, and the typed path with its button, returned for the layout),
// the status line and the footage rate picker.
func (p *footagePane) buildLoad() (buttons, typed fyne.CanvasObject) {
	p.path = widget.NewEntry()
	p.path.SetPlaceHolder("a folder of numbered frames or a GIF")
	p.path.OnSubmitted = func(s string) { p.load(s) }
	load := widget.NewButtonWithIcon("Load footage…", theme.FolderOpenIcon(), p.browseFolder)
	gif := widget.NewButton("Load GIF…", p.browseGIF)
	loadTyped := widget.NewButton("Load", func() { p.load(p.path.Text) })
	p.status = widget.NewLabel("No footage loaded.")
	p.status.Wrapping = fyne.TextWrapWord

	p.fps = widget.NewSelect(footageRateLabels(), p.pickRate)
	p.custom = widget.NewEntry()
	p.custom.SetPlaceHolder("the clip's rate, such as 12.5 or 24000/1001, then Enter")
	p.custom.OnSubmitted = p.typeRate
	p.custom.Hide()
	return container.NewHBox(load, gif), container.NewBorder(nil, nil, nil, loadTyped, p.path)
}

// buildOverlay makes the release offset, the overlay switch and its
// opacity.
func (p *footagePane) buildOverlay() {
	w, fs := p.w, &p.fields
	p.offset = w.newField(fs, "release at footage frame", widgets.Frames, -maxFootageOffset, maxFootageOffset, func(v float64, final bool) {
		n := int(math.Round(v))
		p.edit("Change the footage frame of the release", "footage offset", final, func(d *project.Document) error {
			if d.Footage == nil {
				return errNoFootage
			}
			d.Footage.Offset = ptrTo(n)
			return nil
		})
		p.refollow()
	})
	p.overlay = widget.NewCheck("draw the take over the footage", func(on bool) {
		label := "Hide the overlay"
		if on {
			label = "Show the overlay"
		}
		p.edit(label, "", true, func(d *project.Document) error {
			if d.Footage == nil {
				return errNoFootage
			}
			d.Footage.Overlay = ptrTo(on)
			return nil
		})
	})
	p.opacity = w.newField(fs, "overlay opacity", widgets.Plain, 0, 1, func(v float64, final bool) {
		p.edit("Change the overlay opacity", "footage opacity", final, func(d *project.Document) error {
			if d.Footage == nil {
				return errNoFootage
			}
			d.Footage.Opacity = ptrTo(v)
			return nil
		})
	})
	p.fields.alignLabels()
}

// buildFit makes the marks count, the Fit and Apply buttons, the fit's
// numbers and its problem line.
func (p *footagePane) buildFit() {
	p.marks = widget.NewLabel("")
	p.marks.Wrapping = fyne.TextWrapWord
	p.fitBtn = widget.NewButton("Fit", func() {
		p.showFit = true
		p.refit()
		p.renderOverlay()
	})
	p.fitBtn.Importance = widget.HighImportance
	p.applyBtn = widget.NewButton("Apply to throw", p.applyFit)
	p.fitForm = container.New(layout.NewFormLayout())
	p.fitProblem = widget.NewLabel("")
	p.fitProblem.Wrapping = fyne.TextWrapWord
	p.fitProblem.Importance = widget.WarningImportance
	p.fitProblem.Hide()
}

// layout returns the tab's content, the controls under their headings.
func (p *footagePane) layout(loadButtons, loadTyped fyne.CanvasObject) *fyne.Container {
	return container.NewVBox(
		heading("Reference footage"),
		loadButtons,
		loadTyped,
		p.status,
		container.NewBorder(nil, nil, widget.NewLabel("footage rate"), widget.NewLabel("fps"), p.fps),
		p.custom,
		p.offset,
		note("The footage frame on which the prop leaves the hand: take frame 0 shows it, and later take frames the footage at the same time after it."),
		p.overlay, p.opacity,
		widget.NewSeparator(),
		heading("Marks"),
		note("Click the prop's centre on the footage. Shift-click (or right-click) a point on the prop, such as one end, to show which way it points. Drag a mark to move it; click it and press Delete to remove it."),
		p.marks,
		widget.NewSeparator(),
		heading("Fit"),
		container.NewHBox(p.fitBtn, p.applyBtn),
		p.fitProblem,
		p.fitForm,
		note("The fit takes gravity from the throw and the footage's frame rate, and assumes a still camera facing the flight plane. Apply to throw sets the release velocity and the spin rate; the spin axis stays."),
	)
}

// buildSide returns the footage view with the previous and next frame
// buttons and the frame readout under it.
func (p *footagePane) buildSide() *fyne.Container {
	prev := widget.NewButtonWithIcon("", theme.NavigateBackIcon(), func() { p.step(-1) })
	next := widget.NewButtonWithIcon("", theme.NavigateNextIcon(), func() { p.step(1) })
	p.frameLabel = widget.NewLabelWithStyle("", fyne.TextAlignLeading, fyne.TextStyle{Monospace: true})
	p.frameLabel.Truncation = fyne.TextTruncateEllipsis
	return container.NewBorder(nil, container.NewBorder(nil, nil, container.NewHBox(prev, next), nil, p.frameLabel), nil, nil, p.view)
}

// markFrame returns the footage frame of mark i of the document.
func (p *footagePane) markFrame(i int) int {
	d := p.w.ed.Doc()
	if d.Footage == nil || i < 0 || i >= len(d.Footage.Marks) {
		return -1
	}
	return d.Footage.Marks[i].Frame
}

// edit applies a footage edit as one undo step and shows the result.
func (p *footagePane) edit(label, key string, final bool, fn func(d *project.Document) error) bool {
	if p.w.syncing > 0 {
		return false
	}
	ok := p.w.edit(label, key, final, fn)
	p.w.syncing++
	p.sync(p.w.ed.Doc())
	p.w.syncing--
	return ok
}

// mark is the view's OnMark: the centre, or the second point, on the
// footage frame shown.
func (p *footagePane) mark(x, y float64, second bool) {
	f := p.frame
	label := fmt.Sprintf("Mark footage frame %d", f)
	if second {
		label = fmt.Sprintf("Mark the second point on footage frame %d", f)
	}
	if err := setMark(p.w.ed.Doc(), f, x, y, second); errors.Is(err, errNoCentre) {
		p.marks.SetText(err.Error())
		return
	}
	p.edit(label, "", true, func(d *project.Document) error { return setMark(d, f, x, y, second) })
}

// setEnabled enables the controls that need footage.
func (p *footagePane) setEnabled(on bool) {
	for _, f := range []*widgets.NumberField{p.offset, p.opacity} {
		if on {
			f.Enable()
		} else {
			f.Disable()
		}
	}
	for _, o := range []fyne.Disableable{p.fps, p.overlay, p.fitBtn, p.applyBtn} {
		if on {
			o.Enable()
		} else {
			o.Disable()
		}
	}
}

// sync sets the pane from the document: the controls, the open sequence
// (opened again when the document names another clip or rate, closed when
// it has none), the marks, the fit and the frame shown. It runs with the
// window's syncing set, so the controls do not call back.
func (p *footagePane) sync(d *project.Document) {
	fo := d.Footage
	dir := d.FootageDir(p.w.ed.Path())
	if fo == nil {
		p.seq, p.seqKey, p.loadErr, p.opening = nil, "", nil, ""
		p.view.SetSource(nil)
	} else if key := seqKey(dir, d); key != p.seqKey {
		rate, _, err := d.FootageRate()
		if err != nil {
			rate = physics.Rate{}
		}
		// Another clip or rate: close the old one and open this one off
		// the UI goroutine; the pane is set again when it opens, if the
		// document still names it.
		p.seq, p.seqKey, p.loadErr, p.opening = nil, key, nil, dir
		p.view.SetSource(nil)
		p.takeFrame = -1 // follow the take afresh
		p.openFootage(dir, rate, func(seq *footage.Sequence, err error) {
			if p.seqKey != key {
				return // the document names another clip since
			}
			p.seq, p.loadErr, p.opening = seq, err, ""
			if err == nil {
				p.view.SetSource(seq)
			}
			p.takeFrame = -1
			if !p.w.synchronous { // a synchronous open is still inside this sync
				p.resync()
			}
		})
	}
	p.w.showFootageSide(fo != nil)
	p.setEnabled(fo != nil)

	p.path.SetText(dir)
	switch {
	case p.opening != "":
		p.status.Importance = widget.MediumImportance
		p.status.SetText("Opening " + p.opening + "…")
	case p.loadErr != nil:
		p.status.Importance = widget.DangerImportance
		p.status.SetText(errorText(p.loadErr))
	case p.seq != nil:
		p.status.Importance = widget.MediumImportance
		w, h := p.seq.Size()
		p.status.SetText(fmt.Sprintf("%s: %d frames, %d×%d pixels, %s fps.", printable.String(filepath.Base(p.seq.Path())), p.seq.Len(), w, h, rateLabelText(p.seq.FPS())))
	default:
		p.status.Importance = widget.MediumImportance
		p.status.SetText("No footage loaded.")
	}
	p.status.Refresh()
	switch {
	case fo == nil || fo.FPS == nil:
		p.fps.SetSelected(footageOwnRate)
		p.custom.Hide()
	default:
		r, _, err := d.FootageRate()
		if label := rateLabel(r); err == nil && label != customRate {
			p.fps.SetSelected(label)
			p.custom.Hide()
		} else {
			p.fps.SetSelected(customRate)
			p.custom.SetText(frameRateText(fo.FPS))
			p.custom.Show()
		}
	}
	setValue(p.offset, float64(fo.OffsetOrZero()))
	p.overlay.SetChecked(fo.OverlayOn())
	setValue(p.opacity, fo.OpacityOrDefault())
	p.view.SetMarks(docMarks(d))
	p.showMarks(d)
	p.refit()
	p.follow(p.w.frame)
}

// showMarks says how many frames are marked.
func (p *footagePane) showMarks(d *project.Document) {
	if d.Footage == nil || len(d.Footage.Marks) == 0 {
		p.marks.SetText("No marks yet. The fit needs at least 3 marked frames; 6 or more spread over the flight give a better one.")
		return
	}
	n, second := len(d.Footage.Marks), 0
	for _, m := range d.Footage.Marks {
		if m.HasSecond {
			second++
		}
	}
	p.marks.SetText(fmt.Sprintf("%d marked frames, %d with a second point (the turn needs 3).", n, second))
}

// footageRate returns the rate the footage runs at: the open sequence's,
// else the document's footage rate, else footage.DefaultFPS.
func (p *footagePane) footageRate() physics.Rate {
	if p.seq != nil {
		return p.seq.FPS()
	}
	if r, ok, err := p.w.ed.Doc().FootageRate(); ok && err == nil {
		return r
	}
	return physics.Rate{Num: footage.DefaultFPS, Den: 1}
}

// offsetFrames returns the footage frame of the release.
func (p *footagePane) offsetFrames() int { return p.w.ed.Doc().Footage.OffsetOrZero() }

// gravity returns the gravity the fit uses: the shown take's, else the
// document's, else standard gravity, m/s^2.
func (p *footagePane) gravity() float64 {
	if sc := p.w.good.Scene; sc != nil {
		return sc.Throw.Gravity
	}
	if g := p.w.ed.Doc().Throw.Gravity; g != nil {
		return *g
	}
	return physics.StandardGravity
}

// follow shows the footage frame at the time of take frame n when the
// take has moved to n from another frame; otherwise it shows the footage
// frame shown before again (with the overlay of a new take).
func (p *footagePane) follow(n int) {
	f := p.frame
	if n != p.takeFrame {
		p.takeFrame = n
		f = p.footageFrameAt(p.w.rate().Time(n))
	}
	p.showFootageFrame(f)
}

// refollow maps the take frame to the footage again after the mapping
// changed (the offset).
func (p *footagePane) refollow() {
	p.takeFrame = -1
	p.follow(p.w.frame)
}

// footageFrameAt returns the footage frame at take time t (s):
// Sequence.FrameAt inside the clip, and the same formula outside it, where
// the view says there is no footage frame.
func (p *footagePane) footageFrameAt(t float64) int {
	off := p.offsetFrames()
	if p.seq != nil {
		if f, ok := p.seq.FrameAt(t, off); ok {
			return f
		}
	}
	return off + int(math.Floor(t*p.footageRate().FPS()+1e-9))
}

// takeFrameOf returns the take frame nearest the time of footage frame f.
func (p *footagePane) takeFrameOf(f int) int {
	t := float64(f-p.offsetFrames()) / p.footageRate().FPS()
	return p.w.rate().Nearest(t)
}

// step moves the footage alone by d frames; the take goes to the nearest
// take frame when there is one.
func (p *footagePane) step(d int) {
	if p.seq == nil {
		return
	}
	f := min(max(p.frame+d, 0), p.seq.Len()-1)
	p.frame = f
	if n := p.takeFrameOf(f); n >= 0 && n <= p.w.lastFrame() {
		p.takeFrame = n // the take follows the footage, not the other way
		p.w.stopPlayback()
		p.w.setFrame(n)
	}
	p.showFootageFrame(f)
}

// showFootageFrame shows footage frame f, its overlay and its label.
func (p *footagePane) showFootageFrame(f int) {
	p.frame = f
	p.view.SetFrame(f)
	p.prefetch(f)
	p.renderOverlay()
	switch {
	case p.seq == nil:
		p.frameLabel.SetText("")
	case f < 0 || f >= p.seq.Len():
		p.frameLabel.SetText(fmt.Sprintf("footage frame %d: outside the clip (0 to %d)", f, p.seq.Len()-1))
	default:
		p.frameLabel.SetText(fmt.Sprintf("footage frame %d / %d  %s", f, p.seq.Len()-1, printable.String(p.seq.Name(f))))
	}
}

// showFootageSide puts the footage view beside the preview, or takes it
// away.
func (w *Window) showFootageSide(on bool) {
	want := fyne.CanvasObject(w.view.preview)
	if on {
		want = w.split
	}
	if len(w.centre.Objects) == 1 && w.centre.Objects[0] == want {
		return
	}
	w.centre.Objects = []fyne.CanvasObject{want}
	w.centre.Refresh()
	// The preview's width changed a lot: frame the take again in it.
	w.view.preview.ResetCamera()
}

// newCentre makes the stack that holds the preview alone or the split of
// preview and footage.
func (w *Window) newCentre() *fyne.Container {
	w.split = container.NewHSplit(w.view.preview, w.footage.side)
	w.split.Offset = 0.5
	w.centre = container.NewStack(w.view.preview)
	return w.centre
}
