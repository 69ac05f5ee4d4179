package ui

import (
	"errors"
	"fmt"
	"path/filepath"
	"strings"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/container"
	"fyne.io/fyne/v2/widget"

	"propflight/app/editor"
	"propflight/app/project"
	"propflight/assets"
	"propflight/internal/printable"
	"propflight/physics"
	"propflight/widgets"
	"propflight/widgets/wire"
)

// Window is Propflight's main window: the open project, the controls that
// edit it, the preview, timeline and verdict of its take. Every method
// runs on the UI goroutine.
type Window struct {
	app    fyne.App
	win    fyne.Window
	ed     *editor.Editor
	comp   computer
	recent *editor.Recent

	imperial bool
	syncing  int  // > 0 while controls are set from the document: their callbacks do nothing
	closed   bool // the window is gone; late results are dropped
	// synchronous is set for tests: recomputes run on the UI goroutine
	// and nothing is deferred through fyne.Do.
	synchronous bool
	// do runs a function on the UI goroutine from another one: fyne.Do,
	// or a test's stand-in.
	do func(func())

	requested uint64        // sequence number of the last request
	applied   uint64        // sequence number of the last result applied
	result    editor.Result // the last result applied (it may carry an error)
	good      editor.Result // the last result with a take: what the preview shows
	editErr   error         // an edit the editor refused (such as a number JSON cannot hold)
	reframe   bool          // frame the next take whole: a new project is open

	frame int // current frame of the take, 0 = release
	play  playback

	props    *propPanel
	throw    *throwPanel
	verdict  *verdictPanel
	axisMap  *axisMapPane
	land     *landPanel
	view     *previewPane
	timeline *timelinePane
	footage  *footagePane
	menu     *menus
	centre   *fyne.Container  // the preview, or the split of preview and footage
	split    *container.Split // preview | footage

	preset     string        // the preset the project came from, "" for a file or a new one
	lastDialog *shownDialog  // the last dialog shown (for tests)
	exportOpts exportOptions // File > Export > Export Settings
}

// computer is what the window asks for recomputes: editor.Worker, or the
// synchronous stand-in the tests use.
type computer interface {
	Request(doc *project.Document, thr physics.Thresholds) uint64
	Close()
}

// syncComputer computes on the caller's goroutine, for tests: the result
// is delivered before Request returns.
type syncComputer struct {
	seq     uint64
	deliver func(editor.Result)
}

func (s *syncComputer) Request(doc *project.Document, thr physics.Thresholds) uint64 {
	s.seq++
	res := editor.Compute(doc, thr)
	res.Seq = s.seq
	s.deliver(res)
	return s.seq
}

func (s *syncComputer) Close() {}

// Run opens the window on the project file at path ("" opens the embedded
// demo preset, assets.Demo) and runs the app until the window closes. A
// path that cannot be opened is an error naming the file and field, and no
// window opens.
func Run(a fyne.App, path string) error {
	doc, err := loadStart(path)
	if err != nil {
		return err
	}
	w, err := NewWindow(a, doc, path)
	if err != nil {
		return err
	}
	if path == "" {
		w.preset = assets.Demo
		w.props.showPreset(assets.Demo)
	}
	w.win.ShowAndRun()
	return nil
}

// loadStart returns the project Run opens: the file at path, or the demo.
func loadStart(path string) (*project.Document, error) {
	if path == "" {
		return presetDocument(assets.Demo)
	}
	doc, err := project.Load(path)
	if err != nil {
		return nil, err
	}
	if _, err := doc.Build(); err != nil {
		return nil, err
	}
	return doc, nil
}

// presetDocument parses the embedded preset name. Its file name is left
// empty: the preset is not a file the user has, so errors name only the
// field.
func presetDocument(name string) (*project.Document, error) {
	data, err := assets.Preset(name)
	if err != nil {
		return nil, err
	}
	doc, err := project.Parse(name+".json", data)
	if err != nil {
		return nil, err
	}
	doc.File = ""
	return doc, nil
}

// NewWindow makes the window on doc, which came from path ("" for a
// project never saved), and starts its recompute worker. The window is
// not shown; call Show or ShowAndRun on Window.Fyne().
func NewWindow(a fyne.App, doc *project.Document, path string) (*Window, error) {
	return newWindow(a, doc, path, false)
}

// windowOptions are the test hooks of newWindowWith.
type windowOptions struct {
	synchronous bool         // compute on the UI goroutine instead of the worker
	do          func(func()) // how worker results reach the UI goroutine (fyne.Do)
}

// newWindow is NewWindow with, for tests, a synchronous computer instead
// of the worker goroutine.
func newWindow(a fyne.App, doc *project.Document, path string, synchronous bool) (*Window, error) {
	return newWindowWith(a, doc, path, windowOptions{synchronous: synchronous})
}

func newWindowWith(a fyne.App, doc *project.Document, path string, opt windowOptions) (*Window, error) {
	if doc == nil {
		return nil, errors.New("ui: no project")
	}
	ed, err := editor.New(doc, path)
	if err != nil {
		return nil, err
	}
	w := &Window{app: a, ed: ed}
	w.play.loop = true
	w.synchronous = opt.synchronous
	w.do = opt.do
	if w.do == nil {
		w.do = fyne.Do
	}
	if opt.synchronous {
		w.comp = &syncComputer{deliver: w.apply}
	} else {
		do := w.do
		w.comp = editor.NewWorker(func(res editor.Result) {
			// A new model's outline is made here, on the worker, so the
			// preview's first drawing of it does not hold up the window.
			if res.Scene != nil {
				wire.PrepareOutlines(&res.Scene.Prop)
			}
			do(func() { w.apply(res) })
		})
	}
	w.recent = loadRecent(a)
	applySavedTheme(a)
	w.win = a.NewWindow("Propflight")
	w.build()
	w.win.Resize(fyne.NewSize(1560, 960))
	w.win.SetCloseIntercept(w.requestClose)
	w.syncControls()
	w.restorePrefs()
	return w, nil
}

// Fyne returns the Fyne window.
func (w *Window) Fyne() fyne.Window { return w.win }

// Editor returns the window's editor (the open project).
func (w *Window) Editor() *editor.Editor { return w.ed }

// build makes the controls and lays the window out: prop and throw on the
// left, preview and timeline in the centre, the verdict on the right.
func (w *Window) build() {
	w.syncing++ // controls set their first values: no callbacks
	defer func() { w.syncing-- }()
	w.props = newPropPanel(w)
	w.throw = newThrowPanel(w)
	w.verdict = newVerdictPanel(w)
	w.axisMap = newAxisMapPane(w)
	w.land = newLandPanel(w)
	w.view = newPreviewPane(w)
	w.timeline = newTimelinePane(w)
	w.footage = newFootagePane(w)
	w.menu = newMenus(w)
	w.win.SetMainMenu(w.menu.main)

	tabs := container.NewAppTabs(
		container.NewTabItem("Prop", scrollColumn(w.props.content)),
		container.NewTabItem("Throw", scrollColumn(w.throw.content)),
		container.NewTabItem("Footage", scrollColumn(w.footage.content)),
		container.NewTabItem("Land it", scrollColumn(w.land.content)),
	)
	// The plan and spread run only while their tab is open.
	tabs.OnSelected = func(t *container.TabItem) { w.land.setVisible(t.Text == "Land it") }
	left := sized(tabs, 430, 300)
	verdictAndMap := container.NewVSplit(scrollColumn(w.verdict.content), w.axisMap.content)
	verdictAndMap.SetOffset(0.55)
	right := sized(verdictAndMap, 360, 300)
	// The toolbar scrolls sideways rather than widen the window when the
	// window is narrow.
	bar := container.NewHScroll(w.view.toolbar)
	bar.SetMinSize(fyne.NewSize(0, w.view.toolbar.MinSize().Height))
	centre := container.NewBorder(bar, w.timeline.content, nil, nil, w.newCentre())
	w.win.SetContent(container.NewBorder(nil, nil, left, right, centre))
	w.installKeys()
}

// edit applies one change to the document as an undo step labelled label.
// Edits with the same non-empty key in a row merge (the ticks of one
// drag); final ends the merge. A refused edit shows its error in the
// verdict panel. It reports whether the edit was accepted.
func (w *Window) edit(label, key string, final bool, fn func(d *project.Document) error) bool {
	if w.syncing > 0 {
		return false
	}
	err := w.ed.Apply(label, key, fn)
	if final || key == "" {
		w.ed.EndMerge()
	}
	w.editErr = err
	w.changed()
	return err == nil
}

// editAndSync is edit for changes that reshape the controls (a new part,
// another shape, mass to density): the controls are set again from the
// document afterwards.
func (w *Window) editAndSync(label string, fn func(d *project.Document) error) {
	if w.syncing > 0 {
		return
	}
	w.edit(label, "", true, fn)
	w.syncControls()
}

// editAndSyncThen is editAndSync that runs then after an accepted edit
// and before the controls are set again (to select a new part).
func (w *Window) editAndSyncThen(label string, fn func(d *project.Document) error, then func()) {
	if w.syncing > 0 {
		return
	}
	if w.edit(label, "", true, fn) {
		then()
	}
	w.syncControls()
}

// changed updates everything that follows the document: the title, the
// undo menu and a recompute.
func (w *Window) changed() {
	w.updateTitle()
	w.menu.update()
	w.recompute()
}

// syncControls sets every control from the document (after undo, redo,
// open, new, or an edit that changes which controls there are) and asks
// for a recompute.
func (w *Window) syncControls() {
	w.syncing++
	doc := w.ed.Doc()
	w.props.sync(doc)
	w.throw.sync(doc)
	w.footage.sync(doc)
	w.verdict.sync(doc)
	w.syncing--
	w.changed()
}

// recompute asks the worker for the current document's result.
func (w *Window) recompute() {
	doc := w.ed.Doc()
	w.requested = w.comp.Request(doc, doc.Thresholds())
}

// apply shows a result: the verdict panel always, the preview and the
// timeline only when it has a take (else they keep the last good one).
// Results older than the last one applied are dropped.
func (w *Window) apply(res editor.Result) {
	if w.closed || res.Seq <= w.applied {
		return
	}
	w.applied = res.Seq
	w.result = res
	if res.Take != nil && res.Scene != nil {
		w.good = res
		w.timeline.setTake(res)
		w.props.setResult(res)
		w.throw.setResult(res)
		w.footage.refit() // gravity may have changed
		w.land.setResult(res)
		w.showFrame()
		if w.reframe {
			w.reframe = false
			w.view.preview.ResetCamera()
		}
	}
	w.verdict.show(res, w.editErr)
	w.axisMap.show(res)
}

// lastFrame returns the last frame of the shown take (0 with none).
func (w *Window) lastFrame() int {
	if w.good.Take == nil {
		return 0
	}
	return len(w.good.Take.Frames) - 1
}

// rate returns the frame rate of the shown take (24 with none).
func (w *Window) rate() physics.Rate {
	if w.good.Scene == nil {
		return project.DefaultFPS
	}
	return w.good.Scene.Throw.FPS
}

// setFrame moves to frame n of the take (clamped): timeline, preview and
// the frame readout.
func (w *Window) setFrame(n int) {
	n = min(max(n, 0), w.lastFrame())
	w.frame = n
	w.showFrame()
}

// showFrame puts the current frame on the timeline, preview and labels.
// On twos the preview holds each even frame's pose for two frames.
func (w *Window) showFrame() {
	w.frame = min(max(w.frame, 0), w.lastFrame())
	w.timeline.showFrame(w.frame)
	w.view.showFrame(w.shownFrame())
	w.footage.follow(w.frame)
}

// shownFrame is the frame whose pose the preview shows: the current one
// on ones, the even frame at or before it on twos.
func (w *Window) shownFrame() int { return heldFrame(w.frame, w.throw.onTwos()) }

// heldFrame returns the frame whose pose is on screen at frame n: n on
// ones, n - n%2 on twos.
func heldFrame(n int, twos bool) int {
	if twos {
		return n - n%2
	}
	return n
}

// title is the window title: the project name, "•" when there are unsaved
// changes, and the program's name.
func (w *Window) title() string {
	name := shownName(w.ed.Doc(), w.ed.Path())
	if w.dirty() {
		name += " •"
	}
	return name + " — Propflight"
}

// shownName is projectName made safe to show: control characters in the
// name come out as visible escapes (internal/printable).
func shownName(d *project.Document, path string) string {
	return printable.String(projectName(d, path))
}

// projectName names the project: its "name", else the file name without
// folder and extension, else "untitled".
func projectName(d *project.Document, path string) string {
	if n := strings.TrimSpace(d.Name); n != "" {
		return n
	}
	if path != "" {
		base := filepath.Base(path)
		return strings.TrimSuffix(base, filepath.Ext(base))
	}
	return "untitled"
}

func (w *Window) updateTitle() { w.win.SetTitle(w.title()) }

// dirty reports whether closing or replacing the project would lose
// changes: changes since it was opened, started or last saved
// (editor.Dirty), so an untouched demo closes without a question.
func (w *Window) dirty() bool { return w.ed.Dirty() }

// fieldSet collects the number fields of one panel so that the imperial
// toggle reaches them all.
type fieldSet []*widgets.NumberField

func (fs fieldSet) setImperial(on bool) {
	for _, f := range fs {
		f.SetImperial(on)
	}
}

// alignLabels gives the fields one label width so their sliders line up.
func (fs fieldSet) alignLabels() {
	var lw float32
	for _, f := range fs {
		lw = max(lw, f.LabelMinWidth())
	}
	for _, f := range fs {
		f.SetLabelWidth(lw)
	}
}

// setImperial switches every number field between metric and imperial
// display.
func (w *Window) setImperial(on bool) {
	w.imperial = on
	w.props.fields().setImperial(on)
	w.throw.fields.setImperial(on)
	w.verdict.fields.setImperial(on)
	w.view.fields.setImperial(on)
	w.footage.fields.setImperial(on)
	w.verdict.show(w.result, w.editErr) // the verdict's mass, centre and moments too
}

// newField makes a number field that follows the imperial toggle.
func (w *Window) newField(fs *fieldSet, label string, q widgets.Quantity, lo, hi float64, onChange func(v float64, final bool)) *widgets.NumberField {
	f := widgets.NewNumberField(label, q, lo, hi, onChange)
	f.SetImperial(w.imperial)
	*fs = append(*fs, f)
	return f
}

// setValue shows v in field f without calling back, widening the slider's
// range if a file holds a value beyond it (typed values must lie inside
// the range, so the range must reach the value shown).
func setValue(f *widgets.NumberField, v float64) {
	lo, hi := f.Range()
	switch {
	case v > hi:
		f.SetRange(lo, v*1.5)
	case v < lo && v < 0:
		f.SetRange(v*1.5, hi)
	case v < lo && v > 0:
		f.SetRange(v/1.5, hi)
	}
	f.SetValue(v)
}

// errorText is how the window words an error for a dialog, with control
// characters (from a file or project name) shown as escapes.
func errorText(err error) string { return printable.String(fmt.Sprint(err)) }

// newLabel returns a label that truncates instead of widening its column.
func newLabel(text string) *widget.Label {
	l := widget.NewLabel(text)
	l.Truncation = fyne.TextTruncateEllipsis
	return l
}
