package ui

import (
	"bytes"
	"image"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
	"time"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/test"
	"fyne.io/fyne/v2/widget"

	"propflight/app/project"
	"propflight/physics"
	"propflight/widgets"
)

// newTestWindow opens the preset in a window whose recomputes run
// synchronously (each edit's result is applied before the edit returns),
// with the recent-files list kept in a temporary folder.
func newTestWindow(t *testing.T, preset string) *Window {
	t.Helper()
	t.Setenv("XDG_CONFIG_HOME", t.TempDir())
	a := test.NewTempApp(t)
	doc, err := presetDocument(preset)
	if err != nil {
		t.Fatal(err)
	}
	w, err := newWindow(a, doc, "", true)
	if err != nil {
		t.Fatal(err)
	}
	t.Cleanup(func() { w.closed = true; w.win.Close() })
	if w.good.Take == nil {
		t.Fatalf("%s: no take: %v", preset, w.result.Err)
	}
	return w
}

// typeInto types text into a number field's entry and presses Return, as
// a user committing a value.
func typeInto(t *testing.T, f *widgets.NumberField, text string) {
	t.Helper()
	e := fieldEntry(t, f)
	e.SetText(text)
	e.TypedKey(&fyne.KeyEvent{Name: fyne.KeyReturn})
	if msg := f.InputError(); msg != "" {
		t.Fatalf("field refused %q: %s", text, msg)
	}
}

// fieldEntry returns the entry inside a number field.
func fieldEntry(t *testing.T, f *widgets.NumberField) interface {
	fyne.Focusable
	SetText(string)
} {
	t.Helper()
	for _, o := range test.WidgetRenderer(f).Objects() {
		if e, ok := o.(interface {
			fyne.Focusable
			SetText(string)
		}); ok {
			return e
		}
	}
	t.Fatal("number field has no entry")
	return nil
}

// fieldSlider returns the slider inside a number field.
func fieldSlider(t *testing.T, f *widgets.NumberField) *widget.Slider {
	t.Helper()
	for _, o := range test.WidgetRenderer(f).Objects() {
		if s, ok := o.(*widget.Slider); ok {
			return s
		}
	}
	t.Fatal("number field has no slider")
	return nil
}

// dimField returns the part editor's field number index: the shape's
// dimensions first, then mass or density, position and rotation.
func dimField(t *testing.T, w *Window, index int) *widgets.NumberField {
	t.Helper()
	if index >= len(w.props.partF) {
		t.Fatalf("part editor has %d fields, want index %d", len(w.props.partF), index)
	}
	return w.props.partF[index]
}

func docBytes(t *testing.T, w *Window) []byte {
	t.Helper()
	data, err := project.Marshal(w.ed.Doc())
	if err != nil {
		t.Fatal(err)
	}
	return data
}

func sameImage(a, b image.Image) bool {
	ra, ok1 := a.(*image.RGBA)
	rb, ok2 := b.(*image.RGBA)
	return ok1 && ok2 && ra.Rect == rb.Rect && bytes.Equal(ra.Pix, rb.Pix)
}

func TestWindow_SpinAxis_ChangesVerdict(t *testing.T) {
	w := newTestWindow(t, "frying-pan")
	// The demo pan is spun about its middle axis: the textbook unstable case.
	if got := w.verdict.report.Motion; got != "tumble" {
		t.Fatalf("demo motion %q, want tumble (%s)", got, w.verdict.why.Text)
	}
	if !strings.Contains(w.verdict.why.Text, "middle axis (I1 < I2 < I3)") || !strings.Contains(w.verdict.why.Text, "unstable") {
		t.Errorf("tumble explanation %q does not name the middle axis and the order of the moments", w.verdict.why.Text)
	}
	tumbleWhy := w.verdict.why.Text

	w.throw.axis.SetSelected("greatest")
	if got := w.verdict.report.Motion; got != "spin" {
		t.Fatalf("about the greatest axis: motion %q, want spin", got)
	}
	if w.verdict.headline.Text != "It spins." || w.verdict.why.Text == tumbleWhy {
		t.Errorf("verdict text did not change: %q / %q", w.verdict.headline.Text, w.verdict.why.Text)
	}
	if got := w.ed.Doc().Throw.Spin.Axis.Name; got != "greatest" {
		t.Errorf("document spin axis %q, want greatest", got)
	}

	w.throw.axis.SetSelected("least")
	if got := w.verdict.report.Motion; got != "spin" {
		t.Errorf("about the least axis: motion %q, want spin", got)
	}
	if tt := w.ed.Doc().Throw.Spin.TiltToward; tt == nil || *tt == "least" {
		t.Errorf("tilt toward the spin axis itself was kept: %v", tt)
	}
}

func TestWindow_Dimension_ChangesVerdict(t *testing.T) {
	w := newTestWindow(t, "dinner-plate")
	if got := w.verdict.report.Motion; got != "wobble" {
		t.Fatalf("plate motion %q, want wobble", got)
	}
	before := w.verdict.report
	// Stretch the plate's first dimension: the moments change and the
	// symmetry the wobble rests on may go; either way the numbers move.
	f := dimField(t, w, 0)
	old := f.Value()
	typeInto(t, f, formatTest(old*1.6))
	after := w.verdict.report
	if rowsText(before) == rowsText(after) {
		t.Errorf("verdict rows unchanged after a dimension change:\n%s", rowsText(after))
	}
	if v, _ := dimValue(&w.ed.Doc().Prop.Parts[0], shapeDimensions(w.ed.Doc().Prop.Parts[0].Shape)[0]); v == old {
		t.Errorf("document dimension still %g", v)
	}
}

func formatTest(x float64) string { return strings.TrimRight(strings.TrimRight(sig(x), "0"), ".") }

func rowsText(r report) string {
	var b strings.Builder
	b.WriteString(r.Headline + "\n" + r.Why + "\n")
	for _, rw := range r.Rows {
		b.WriteString(rw.Label + ": " + rw.Value + "\n")
	}
	return b.String()
}

func TestWindow_Scrub_ChangesFrameAndPreview(t *testing.T) {
	w := newTestWindow(t, "frying-pan")
	img0 := w.view.preview.Image()
	if w.timeline.frame.Text != "frame 0 / "+strconv.Itoa(w.lastFrame()) {
		t.Fatalf("label %q at start", w.timeline.frame.Text)
	}
	tl := w.timeline.timeline
	test.TapAt(tl, fyne.NewPos(tl.Size().Width*0.5, tl.Size().Height/2))
	n := w.frame
	if n == 0 || tl.Frame() != n {
		t.Fatalf("tap in the middle of the timeline: frame %d, timeline %d", n, tl.Frame())
	}
	want := "frame " + strconv.Itoa(n) + " / " + strconv.Itoa(w.lastFrame())
	if w.timeline.frame.Text != want {
		t.Errorf("frame label %q, want %q", w.timeline.frame.Text, want)
	}
	if w.timeline.timecode.Text != w.rate().Timecode(n) {
		t.Errorf("timecode %q, want %q", w.timeline.timecode.Text, w.rate().Timecode(n))
	}
	if w.view.preview.Frame() != n {
		t.Errorf("preview shows frame %d, want %d", w.view.preview.Frame(), n)
	}
	if sameImage(img0, w.view.preview.Image()) {
		t.Error("preview image did not change when scrubbing")
	}
	// Keys step the take when nothing has the keyboard focus.
	w.win.Canvas().Unfocus()
	w.typedKey(&fyne.KeyEvent{Name: fyne.KeyRight})
	if w.frame != n+1 {
		t.Errorf("Right: frame %d, want %d", w.frame, n+1)
	}
	w.typedKey(&fyne.KeyEvent{Name: fyne.KeyEnd})
	if w.frame != w.lastFrame() {
		t.Errorf("End: frame %d, want %d", w.frame, w.lastFrame())
	}
	w.typedKey(&fyne.KeyEvent{Name: fyne.KeyHome})
	if w.frame != 0 {
		t.Errorf("Home: frame %d, want 0", w.frame)
	}
}

// TestWindow_TimelineFocused_SpacePlays: a tap gives the timeline the
// keyboard; it steps frames itself and hands Space on, so Space plays and
// pauses there as everywhere else.
func TestWindow_TimelineFocused_SpacePlays(t *testing.T) {
	w := newTestWindow(t, "frying-pan")
	tl := w.timeline.timeline
	test.TapAt(tl, fyne.NewPos(tl.Size().Width*0.25, tl.Size().Height/2))
	c := w.win.Canvas()
	if c.Focused() != fyne.Focusable(tl) {
		t.Fatalf("the tapped timeline does not have the focus (%v)", c.Focused())
	}
	n := w.frame
	c.Focused().TypedKey(&fyne.KeyEvent{Name: fyne.KeyRight})
	if w.frame != n+1 {
		t.Errorf("Right on the timeline: frame %d, want %d", w.frame, n+1)
	}
	c.Focused().TypedKey(&fyne.KeyEvent{Name: fyne.KeySpace})
	playing := w.play.on
	w.stopPlayback()
	if !playing {
		t.Error("Space on the focused timeline did not play")
	}
	w.startPlayback()
	c.Focused().TypedKey(&fyne.KeyEvent{Name: fyne.KeySpace})
	if w.play.on {
		w.stopPlayback()
		t.Error("Space on the focused timeline did not pause")
	}
}

func TestWindow_TypedKey_IgnoredWhileEntryFocused(t *testing.T) {
	w := newTestWindow(t, "frying-pan")
	w.win.Canvas().Focus(w.props.name)
	if w.win.Canvas().Focused() == nil {
		t.Fatal("the part name entry did not take the focus")
	}
	w.typedKey(&fyne.KeyEvent{Name: fyne.KeyRight})
	w.typedKey(&fyne.KeyEvent{Name: fyne.KeySpace})
	if w.frame != 0 || w.play.on {
		t.Errorf("keys reached the take while an entry had the focus: frame %d, playing %v", w.frame, w.play.on)
	}
	w.win.Canvas().Unfocus()
	w.typedKey(&fyne.KeyEvent{Name: fyne.KeyRight})
	if w.frame != 1 {
		t.Errorf("Right with no focus: frame %d, want 1", w.frame)
	}
}

func TestWindow_Undo_RestoresPreviousProp(t *testing.T) {
	w := newTestWindow(t, "frying-pan")
	start := docBytes(t, w)
	radius := dimField(t, w, 0) // base cylinder radius
	typeInto(t, radius, "0.2")
	if got := *w.ed.Doc().Prop.Parts[0].Radius; got != 0.2 {
		t.Fatalf("radius %g after typing 0.2", got)
	}
	if !strings.HasPrefix(w.menu.undo.Label, "Undo Change radius") || w.menu.undo.Disabled {
		t.Errorf("undo item %q (disabled %v)", w.menu.undo.Label, w.menu.undo.Disabled)
	}
	w.win.Canvas().(fyne.Shortcutable).TypedShortcut(&fyne.ShortcutUndo{})
	if !bytes.Equal(docBytes(t, w), start) {
		t.Errorf("undo did not restore the prop:\n%s", docBytes(t, w))
	}
	if got := dimField(t, w, 0).Value(); got != 0.12 {
		t.Errorf("radius field shows %g after undo, want 0.12", got)
	}
	if !strings.HasPrefix(w.menu.redo.Label, "Redo Change radius") {
		t.Errorf("redo item %q", w.menu.redo.Label)
	}
	w.win.Canvas().(fyne.Shortcutable).TypedShortcut(shortcutRedo)
	if got := *w.ed.Doc().Prop.Parts[0].Radius; got != 0.2 {
		t.Errorf("radius %g after redo, want 0.2", got)
	}
}

func TestWindow_SliderDrag_IsOneUndoStep(t *testing.T) {
	w := newTestWindow(t, "frying-pan")
	start := docBytes(t, w)
	s := fieldSlider(t, dimField(t, w, 0)) // the base's radius
	if s.Size().Width < 20 {
		t.Fatalf("slider not laid out: %v", s.Size())
	}
	y := s.Size().Height / 2
	for _, x := range []float32{0.3, 0.4, 0.5, 0.6} { // the moves of one drag
		s.Dragged(&fyne.DragEvent{PointEvent: fyne.PointEvent{Position: fyne.NewPos(x*s.Size().Width, y)}, Dragged: fyne.NewDelta(5, 0)})
	}
	s.DragEnd()
	if bytes.Equal(docBytes(t, w), start) {
		t.Fatal("the drag did not change the radius")
	}
	if w.ed.UndoLabel() != "Change radius" {
		t.Errorf("undo label %q", w.ed.UndoLabel())
	}
	w.undo()
	if !bytes.Equal(docBytes(t, w), start) {
		t.Errorf("one undo did not take back the whole drag")
	}
	if w.ed.CanUndo() {
		t.Errorf("a drag left more than one undo step (next: %q)", w.ed.UndoLabel())
	}
}

func TestWindow_BadValue_ShowsErrorKeepsPreview(t *testing.T) {
	w := newTestWindow(t, "frying-pan")
	w.props.list.Select(1) // the wall: a tube
	if w.props.built.shape != "tube" {
		t.Fatalf("part 1 is %q", w.props.built.shape)
	}
	take := w.good.Take
	img := w.view.preview.Image()
	typeInto(t, dimField(t, w, 1), "0.3") // inner radius past the outer one
	if w.result.Err == nil {
		t.Fatal("an inner radius larger than the outer one was accepted")
	}
	msg := w.verdict.problem.Text
	if !w.verdict.problem.Visible() || !strings.Contains(msg, "prop.parts[1].inner_radius") {
		t.Errorf("panel error %q (visible %v) does not name prop.parts[1].inner_radius", msg, w.verdict.problem.Visible())
	}
	if w.good.Take != take || !sameImage(img, w.view.preview.Image()) {
		t.Error("the preview did not keep the last good take")
	}
	if w.verdict.headline.Text == "" {
		t.Error("the verdict words went away with the error")
	}
	w.undo()
	if w.result.Err != nil || w.verdict.problem.Visible() {
		t.Errorf("error still shown after undo: %v", w.result.Err)
	}
}

func TestWindow_OpenBadFile_ShowsErrorAndKeepsProject(t *testing.T) {
	w := newTestWindow(t, "frying-pan")
	start := docBytes(t, w)
	dir := t.TempDir()
	bad := filepath.Join(dir, "broken-pan.json")
	data := strings.Replace(string(mustPreset(t, "frying-pan")), `"radius": 0.12`, `"radius": -0.12`, 1)
	if err := os.WriteFile(bad, []byte(data), 0o644); err != nil {
		t.Fatal(err)
	}
	if w.openPath(bad) {
		t.Fatal("a file with a negative radius opened")
	}
	d := w.lastDialog
	if d == nil || !strings.Contains(d.message, "broken-pan.json") || !strings.Contains(d.message, "prop.parts[0].radius") {
		t.Fatalf("error dialog %+v does not name the file and the field", d)
	}
	if w.win.Canvas().Overlays().Top() == nil {
		t.Error("no dialog on the canvas")
	}
	if !bytes.Equal(docBytes(t, w), start) || w.ed.Path() != "" {
		t.Error("the current project changed")
	}
	// A good file opens and goes to the recent list.
	good := filepath.Join(dir, "pan.json")
	if err := os.WriteFile(good, mustPreset(t, "frying-pan"), 0o644); err != nil {
		t.Fatal(err)
	}
	if !w.openPath(good) || w.ed.Path() != good {
		t.Fatalf("good file did not open (path %q)", w.ed.Path())
	}
	if items := w.menu.recent.ChildMenu.Items; len(items) == 0 || items[0].Label != good {
		t.Errorf("recent menu %v does not start with %s", labels(items), good)
	}
}

func labels(items []*fyne.MenuItem) []string {
	var out []string
	for _, it := range items {
		out = append(out, it.Label)
	}
	return out
}

func mustPreset(t *testing.T, name string) []byte {
	t.Helper()
	d, err := presetDocument(name)
	if err != nil {
		t.Fatal(err)
	}
	data, err := project.Marshal(d)
	if err != nil {
		t.Fatal(err)
	}
	return data
}

func TestWindow_DirtyFlag_Title(t *testing.T) {
	w := newTestWindow(t, "frying-pan")
	if got := w.win.Title(); got != "frying pan flip — Propflight" {
		t.Errorf("title of the untouched demo %q", got)
	}
	typeInto(t, w.throw.gravity, "9")
	if got := w.win.Title(); got != "frying pan flip • — Propflight" {
		t.Errorf("title after an edit %q", got)
	}
	w.undo()
	if strings.Contains(w.win.Title(), "•") {
		t.Errorf("title after undoing the only edit %q", w.win.Title())
	}
	typeInto(t, w.throw.gravity, "9")
	path := filepath.Join(t.TempDir(), "moon-pan.json")
	if !saveNow(w, path) {
		t.Fatal("save failed")
	}
	if strings.Contains(w.win.Title(), "•") || w.ed.Path() != path {
		t.Errorf("after save: title %q, path %q", w.win.Title(), w.ed.Path())
	}
	saved, err := project.Load(path)
	if err != nil || saved.Throw.Gravity == nil || *saved.Throw.Gravity != 9 {
		t.Errorf("saved file: %v, %+v", err, saved)
	}
	typeInto(t, w.throw.gravity, "8")
	if !strings.Contains(w.win.Title(), "•") {
		t.Errorf("title after editing a saved project %q", w.win.Title())
	}
}

func TestWindow_UnsavedChanges_PromptBeforeNew(t *testing.T) {
	w := newTestWindow(t, "frying-pan")
	// Nothing to lose: New goes ahead at once.
	w.newProject()
	if got := w.ed.Doc().Prop.Parts[0].Name; got != "block" {
		t.Fatalf("New without changes gave part %q", got)
	}
	typeInto(t, dimField(t, w, 0), "0.4")
	edited := docBytes(t, w)
	w.newProject()
	d := w.lastDialog
	if d == nil || d.title != "Save changes?" || d.choose == nil {
		t.Fatalf("no prompt before losing changes: %+v", d)
	}
	if !bytes.Equal(docBytes(t, w), edited) {
		t.Fatal("project replaced before the user answered")
	}
	d.choose["Cancel"]()
	if !bytes.Equal(docBytes(t, w), edited) {
		t.Fatal("Cancel replaced the project")
	}
	w.props.pickPreset("loaf")
	w.lastDialog.choose["Don't save"]()
	if got := w.ed.Doc().Name; !strings.Contains(got, "loaf") {
		t.Errorf("after Don't save the project is %q, want the loaf", got)
	}
	// Closing with changes asks too.
	typeInto(t, w.throw.gravity, "9")
	w.requestClose()
	if w.closed || w.lastDialog.title != "Save changes?" {
		t.Errorf("close did not ask (closed %v)", w.closed)
	}
}

func TestWindow_OnTwos_HoldsEachPoseTwoFrames(t *testing.T) {
	w := newTestWindow(t, "frying-pan")
	w.throw.twos.SetSelected(timingOnTwos)
	for n := 0; n <= 7; n++ {
		w.setFrame(n)
		if got, want := w.view.preview.Frame(), n-n%2; got != want {
			t.Errorf("on twos, frame %d shows pose %d, want %d", n, got, want)
		}
		if w.timeline.timeline.Frame() != n || w.timeline.frame.Text != "frame "+strconv.Itoa(n)+" / "+strconv.Itoa(w.lastFrame()) {
			t.Errorf("on twos, frame %d: timeline %d, label %q", n, w.timeline.timeline.Frame(), w.timeline.frame.Text)
		}
	}
	w.throw.twos.SetSelected(timingOnOnes)
	if got := w.view.preview.Frame(); got != 7 {
		t.Errorf("back on ones at frame 7 the preview shows %d", got)
	}
}

func TestWindow_ImperialToggle_ChangesUnitsOnly(t *testing.T) {
	w := newTestWindow(t, "frying-pan")
	radius := dimField(t, w, 0)
	if radius.Unit() != "m" {
		t.Fatalf("metric unit %q", radius.Unit())
	}
	start := docBytes(t, w)
	w.menu.imperial.Action()
	if radius.Unit() != "in" || w.throw.speed.Unit() != "ft/s" || w.throw.gravity.Unit() != "ft/s²" {
		t.Errorf("imperial units %q %q %q", radius.Unit(), w.throw.speed.Unit(), w.throw.gravity.Unit())
	}
	if !bytes.Equal(docBytes(t, w), start) {
		t.Error("switching the display changed the project")
	}
	w.props.list.Select(2) // a rebuilt part editor follows the setting
	if f := dimField(t, w, 0); f.Unit() != "in" {
		t.Errorf("new part editor shows %q", f.Unit())
	}
}

func TestWindow_PartList_AddDuplicateRemove(t *testing.T) {
	w := newTestWindow(t, "frying-pan")
	w.props.add.SetSelected("torus")
	d := w.ed.Doc()
	if len(d.Prop.Parts) != 4 || d.Prop.Parts[3].Shape != "torus" || w.props.selected != 3 {
		t.Fatalf("add torus: %d parts, selected %d", len(d.Prop.Parts), w.props.selected)
	}
	if len(w.props.partF) != 2+1+6 {
		t.Errorf("torus editor has %d fields, want ring radius, tube radius, mass, 3 positions, 3 rotations", len(w.props.partF))
	}
	w.props.duplicatePart()
	d = w.ed.Doc()
	if len(d.Prop.Parts) != 5 || d.Prop.Parts[4].Name != "torus 2" {
		t.Fatalf("duplicate: %d parts, last %q", len(d.Prop.Parts), d.Prop.Parts[len(d.Prop.Parts)-1].Name)
	}
	w.props.name.SetText("lid ring")
	if w.ed.Doc().Prop.Parts[4].Name != "lid ring" || w.props.labels[4] != "lid ring" {
		t.Errorf("rename: %q / %q", w.ed.Doc().Prop.Parts[4].Name, w.props.labels[4])
	}
	w.props.removePart()
	w.props.removePart()
	if n := len(w.ed.Doc().Prop.Parts); n != 3 {
		t.Errorf("after two removes %d parts", n)
	}
	w.props.shape.SetSelected("sphere")
	if p := w.ed.Doc().Prop.Parts[w.props.selected]; p.Shape != "sphere" || p.Radius == nil {
		t.Errorf("shape change: %+v", p)
	}
	w.props.massMode.SetSelected(modeDensity)
	p := w.ed.Doc().Prop.Parts[w.props.selected]
	if p.Density == nil || p.Mass != nil {
		t.Errorf("density toggle: %+v", p)
	}
}

func TestWindow_Thresholds_ChangeVerdict(t *testing.T) {
	w := newTestWindow(t, "frying-pan")
	w.throw.axis.SetSelected("greatest")
	if w.verdict.report.Motion != "spin" {
		t.Fatalf("motion %q", w.verdict.report.Motion)
	}
	// The spin about the greatest axis swings a few degrees; a 1 degree
	// tumble threshold calls that a tumble.
	typeInto(t, w.verdict.tumble, "1")
	if r := w.ed.Doc().VerdictRules; w.verdict.report.Motion != "tumble" || r == nil || r.TumbleFromDeg == nil || *r.TumbleFromDeg != 1 {
		t.Errorf("tumble from 1°: motion %q, rules %+v", w.verdict.report.Motion, r)
	}
	// The rule is an edit of the project: undo takes it back.
	w.ed.Undo()
	w.syncControls()
	if w.verdict.report.Motion != "spin" || w.ed.Doc().VerdictRules != nil || w.verdict.tumble.Value() != 45 {
		t.Errorf("after undo: motion %q, rules %+v, field %g", w.verdict.report.Motion, w.ed.Doc().VerdictRules, w.verdict.tumble.Value())
	}
}

func TestWindow_ReleaseModes_KeepTheThrow(t *testing.T) {
	w := newTestWindow(t, "frying-pan")
	v0 := w.good.Scene.Throw.Velocity
	w.throw.relMode.SetSelected(relSpeed)
	if w.ed.Doc().Throw.ReleaseVelocity == nil {
		t.Fatal("speed and angle did not write release_velocity")
	}
	v1 := w.good.Scene.Throw.Velocity
	if d := v1.X - v0.X + v1.Y - v0.Y + v1.Z - v0.Z; d > 1e-12 || d < -1e-12 {
		t.Errorf("release velocity changed with the mode: %v -> %v", v0, v1)
	}
	typeInto(t, w.throw.angle, "90")
	if v := w.good.Scene.Throw.Velocity; v.X > 1e-12 || v.Y <= 0 {
		t.Errorf("90° release is not straight up: %v", v)
	}
	w.throw.rateMode.SetSelected(rateFrames)
	s := w.ed.Doc().Throw.Spin
	if s.FramesPerTurn == nil || s.TurnsPerSecond != nil || *s.FramesPerTurn != 24/1.6 {
		t.Errorf("frames per turn: %+v", s)
	}
	w.throw.fps.SetSelected("29.97")
	if fr := w.ed.Doc().Throw.FPS; fr == nil || fr.Text != "30000/1001" {
		t.Errorf("29.97 wrote fps %+v", fr)
	}
	if tc := w.rate().Timecode(0); tc != "00:00:00;00" {
		t.Errorf("29.97 timecode %q, want drop-frame", tc)
	}
}

func TestWindow_About_CarriesCaution(t *testing.T) {
	w := newTestWindow(t, "frying-pan")
	w.showAbout()
	if w.lastDialog == nil || !strings.Contains(w.lastDialog.message, Caution) {
		t.Fatal("about box without the caution")
	}
	data, err := os.ReadFile("../../DEVELOPERS.md")
	if err != nil {
		t.Skip("DEVELOPERS.md not found:", err)
	}
	// The caution is the quoted block under "Safety caution", word for word.
	var quote []string
	for _, line := range strings.Split(string(data), "\n") {
		if rest, ok := strings.CutPrefix(line, "> "); ok {
			quote = append(quote, rest)
		} else if len(quote) > 0 {
			break
		}
	}
	if got := strings.Join(strings.Fields(strings.Join(quote, " ")), " "); got != Caution {
		t.Errorf("caution differs from DEVELOPERS.md:\n got %q\nwant %q", Caution, got)
	}
}

// TestWindow_Worker_DeliversNewerResults runs the real worker goroutine.
// Its results reach the window through a queue that the test goroutine
// drains, standing in for the UI goroutine behind fyne.Do (the test
// driver's fyne.Do would run them on the worker goroutine). The test waits
// for the result of the last request with a deadline, never a sleep.
func TestWindow_Worker_DeliversNewerResults(t *testing.T) {
	t.Setenv("XDG_CONFIG_HOME", t.TempDir())
	a := test.NewTempApp(t)
	doc, err := presetDocument("frying-pan")
	if err != nil {
		t.Fatal(err)
	}
	queue := make(chan func(), 64)
	w, err := newWindowWith(a, doc, "", windowOptions{do: func(f func()) { queue <- f }})
	if err != nil {
		t.Fatal(err)
	}
	wait := func(want uint64) {
		t.Helper()
		deadline := time.After(30 * time.Second)
		for w.applied < want {
			select {
			case f := <-queue:
				f() // on the test goroutine, like fyne.Do on the UI goroutine
			case <-deadline:
				t.Fatalf("no result for request %d (applied %d)", want, w.applied)
			}
		}
	}
	wait(w.requested)
	if w.good.Take == nil || w.verdict.report.Motion != "tumble" {
		t.Fatalf("first result: motion %q, err %v", w.verdict.report.Motion, w.result.Err)
	}
	w.throw.axis.SetSelected("greatest")
	w.throw.axis.SetSelected("least")
	w.throw.axis.SetSelected("greatest")
	last := w.requested
	wait(last)
	if w.applied != last || w.verdict.report.Motion != "spin" {
		t.Errorf("applied %d of %d, motion %q", w.applied, last, w.verdict.report.Motion)
	}
	// An old result arriving late is dropped.
	stale := w.result
	stale.Seq = last - 1
	stale.Err = os.ErrInvalid
	w.apply(stale)
	if w.result.Err != nil {
		t.Error("a stale result was applied")
	}
	w.closeNow()
}

func TestHeldFrame_OnTwos(t *testing.T) {
	for n, want := range []int{0, 0, 2, 2, 4, 4, 6} {
		if got := heldFrame(n, true); got != want {
			t.Errorf("heldFrame(%d, twos) = %d, want %d", n, got, want)
		}
		if got := heldFrame(n, false); got != n {
			t.Errorf("heldFrame(%d, ones) = %d", n, got)
		}
	}
}

func TestPlayFrame_LoopsAndStops(t *testing.T) {
	cases := []struct {
		start, k, last int
		loop           bool
		frame          int
		done           bool
	}{
		{0, 0, 27, false, 0, false},
		{3, 10, 27, false, 13, false},
		{20, 7, 27, false, 27, false},
		{20, 8, 27, false, 27, true},
		{20, 8, 27, true, 0, false}, // 28 frames: frame 28 wraps to 0
		{20, 40, 27, true, 4, false},
		{0, 5, 0, true, 0, true},
	}
	for _, c := range cases {
		f, d := playFrame(c.start, c.k, c.last, c.loop)
		if f != c.frame || d != c.done {
			t.Errorf("playFrame(%d, %d, %d, %v) = %d, %v; want %d, %v", c.start, c.k, c.last, c.loop, f, d, c.frame, c.done)
		}
	}
}

func TestFramesIn_TrueRate(t *testing.T) {
	cases := []struct {
		d    time.Duration
		num  int64
		den  int64
		want int
	}{
		{time.Second, 24, 1, 24},
		{time.Second - time.Nanosecond, 24, 1, 23},
		{1001 * time.Millisecond, 24000, 1001, 24}, // 24 frames of 23.976 take 1.001 s exactly
		{time.Second, 24000, 1001, 23},
		{10 * time.Minute, 30000, 1001, 17982}, // 600 s * 30000/1001 = 17982.02
	}
	for _, c := range cases {
		r := physics.Rate{Num: c.num, Den: c.den}
		if got := framesIn(c.d, r); got != c.want {
			t.Errorf("framesIn(%v, %v) = %d, want %d", c.d, r, got, c.want)
		}
	}
}

// TestWindow_SaveAs_NameWithoutJSON_AsksBeforeReplacing: a name typed
// without ".json" ("pan") saves to pan.json, so an existing pan.json is
// replaced only after its own question, and nothing is written (or
// emptied) before the answer.
func TestWindow_SaveAs_NameWithoutJSON_AsksBeforeReplacing(t *testing.T) {
	w := newTestWindow(t, "frying-pan")
	dir := t.TempDir()
	target := filepath.Join(dir, "pan.json")
	old := []byte(`{"format": "propflight/v1", "prop": {"parts": [{"shape": "sphere", "radius": 0.1, "mass": 1}]}}`)
	if err := os.WriteFile(target, old, 0o644); err != nil {
		t.Fatal(err)
	}
	ran := 0
	w.savePicked(dir, "pan", func() { ran++ })
	d := w.lastDialog
	if d == nil || d.title != "Replace pan.json?" || d.choose == nil {
		t.Fatalf("no question before replacing pan.json: %+v", d)
	}
	if data, _ := os.ReadFile(target); !bytes.Equal(data, old) {
		t.Fatal("pan.json replaced or emptied before the user answered")
	}
	d.choose["Cancel"]()
	if data, _ := os.ReadFile(target); !bytes.Equal(data, old) || ran != 0 || w.ed.Path() != "" {
		t.Fatalf("Cancel: file replaced %v, then ran %d, path %q", !bytes.Equal(data, old), ran, w.ed.Path())
	}
	w.savePicked(dir, "pan", func() { ran++ })
	w.lastDialog.choose["Replace"]()
	saved, err := project.Load(target)
	if err != nil || saved.Name != w.ed.Doc().Name || ran != 1 || w.ed.Path() != target {
		t.Errorf("Replace: %v, name %q, then ran %d, path %q", err, saved.Name, ran, w.ed.Path())
	}
	// Saving to the project's own file needs no question.
	w.lastDialog = nil
	w.savePicked(dir, "pan.json", func() { ran++ })
	if w.lastDialog != nil || ran != 2 {
		t.Errorf("save over the project's own file asked %+v (then ran %d)", w.lastDialog, ran)
	}
	// A name with a folder in it, or none, is refused with a message.
	for _, bad := range []string{"", "  ", "sub/pan", ".json"} {
		w.lastDialog = nil
		w.savePicked(dir, bad, func() { ran++ })
		if w.lastDialog == nil || !strings.Contains(w.lastDialog.message, "file name") || ran != 2 {
			t.Errorf("name %q: dialog %+v", bad, w.lastDialog)
		}
	}
	if entries, _ := os.ReadDir(dir); len(entries) != 1 {
		t.Errorf("the folder holds %d entries, want only pan.json", len(entries))
	}
}

// TestWindow_PartSummary_Counts: the summary under the part list says
// "1 part" for a one-part prop (the ladle) and "3 parts" for the pan.
func TestWindow_PartSummary_Counts(t *testing.T) {
	for preset, want := range map[string]string{"ladle": "1 part, ", "frying-pan": "3 parts, "} {
		w := newTestWindow(t, preset)
		if got := w.props.summary.Text; !strings.HasPrefix(got, want) {
			t.Errorf("%s: summary %q, want it to start %q", preset, got, want)
		}
	}
}
