package ui

import (
	"bytes"
	"fmt"
	"image/png"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"
	"time"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/driver/desktop"
	"fyne.io/fyne/v2/test"
	"gonum.org/v1/gonum/spatial/r3"

	"propflight/app/project"
	"propflight/physics"
	"propflight/widgets/wire"
)

// boardProject is a cutting board (0.36 x 0.24 x 0.02 m, 1.2 kg; demo data
// from our kitchen scene) thrown from 1.2 m at 24 fps, spun about its
// greatest axis, which is the box's z and the world's z at release, so a
// front view sees the whole turn. vel and tps are the release velocity,
// m/s, and the spin, turns per second.
func boardProject(vel [2]float64, tps float64) string {
	return fmt.Sprintf(`{"format": "propflight/v1", "name": "board against its clip",
  "prop": {"parts": [{"name": "board", "shape": "box", "size": [0.36, 0.24, 0.02], "mass": 1.2}]},
  "throw": {"fps": 24, "release_position": [0, 1.2, 0], "release_velocity": [%g, %g, 0],
            "spin": {"axis": "greatest", "turns_per_second": %g}}}`, vel[0], vel[1], tps)
}

// clipThrow is the throw the test clip shows: 2 m/s across, 3 m/s up,
// 2 turns per second.
var (
	clipVel = [2]float64{2, 3}
	clipTPS = 2.0
)

// clipSize is the test clip's frame size, pixels.
const clipW, clipH = 480, 360

// testClip is footage made by the wire renderer: the true throw's take
// drawn by an orthographic front camera framed on the whole take, one PNG
// a frame, and the camera to find the drawn centre and a point on the
// board (lever, prop frame) on each frame.
type testClip struct {
	dir   string
	take  *physics.Take
	cam   wire.Camera
	lever r3.Vec
}

func makeClip(t *testing.T, dir string) *testClip {
	t.Helper()
	doc, err := project.Parse("truth.json", []byte(boardProject(clipVel, clipTPS)))
	if err != nil {
		t.Fatal(err)
	}
	sc, err := doc.Build()
	if err != nil {
		t.Fatal(err)
	}
	tk, err := physics.Simulate(&sc.Prop, &sc.Mass, &sc.Throw)
	if err != nil {
		t.Fatal(err)
	}
	scene := wire.Scene{Prop: &sc.Prop, Mass: &sc.Mass, Take: tk, ShowArc: true}
	cam := wire.NewCamera(wire.Front, clipW, clipH)
	cam.Frame(wire.Bounds(scene))
	if err := os.MkdirAll(dir, 0o755); err != nil {
		t.Fatal(err)
	}
	pal := wire.DefaultPalette()
	for k := range tk.Frames {
		scene.Frame = k
		var buf bytes.Buffer
		if err := png.Encode(&buf, wire.Rasterize(wire.Draw(cam, scene), pal)); err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(filepath.Join(dir, fmt.Sprintf("board_%04d.png", k)), buf.Bytes(), 0o644); err != nil {
			t.Fatal(err)
		}
	}
	return &testClip{dir: dir, take: tk, cam: cam, lever: r3.Vec{X: 0.16}}
}

// clicks returns where a user clicks on footage frame k: the pixel of the
// drawn centre of mass and of the lever point, each at its pixel's centre
// (off by up to half a pixel).
func (c *testClip) clicks(k int) (x, y, x2, y2 float64) {
	fr := c.take.Frames[k]
	lens := c.cam.Lens()
	px, py, _ := lens.Project(fr.CM)
	qx, qy, _ := lens.Project(r3.Add(fr.CM, fr.Orient.Rotate(c.lever)))
	pix := func(v float64) float64 { return math.Floor(v) + 0.5 }
	return pix(px), pix(py), pix(qx), pix(qy)
}

// boardWindow opens the board project (release 1, 1 m/s, half a turn a
// second: not what the clip shows) in a synchronous test window.
func boardWindow(t *testing.T) *Window {
	t.Helper()
	t.Setenv("XDG_CONFIG_HOME", t.TempDir())
	a := test.NewTempApp(t)
	doc, err := project.Parse("board.json", []byte(boardProject([2]float64{1, 1}, 0.5)))
	if err != nil {
		t.Fatal(err)
	}
	doc.File = ""
	w, err := newWindow(a, doc, "", true)
	if err != nil {
		t.Fatal(err)
	}
	t.Cleanup(func() { w.closed = true; w.win.Close() })
	if w.good.Take == nil {
		t.Fatalf("no take: %v", w.result.Err)
	}
	return w
}

// tapImage taps the footage view at image pixel (x, y), with Shift held
// for a second point, as a desktop mouse does (press, then tap).
func tapImage(t *testing.T, w *Window, x, y float64, shift bool) {
	t.Helper()
	v := w.footage.view
	pos, ok := v.ToView(x, y)
	if !ok {
		t.Fatal("the footage view has no footage")
	}
	var mod fyne.KeyModifier
	if shift {
		mod = fyne.KeyModifierShift
	}
	v.MouseDown(&desktop.MouseEvent{PointEvent: fyne.PointEvent{Position: pos}, Button: desktop.MouseButtonPrimary, Modifier: mod})
	v.MouseUp(&desktop.MouseEvent{PointEvent: fyne.PointEvent{Position: pos}, Button: desktop.MouseButtonPrimary, Modifier: mod})
	test.TapAt(v, pos)
}

// goToFootage steps the footage to frame f with the footage frame buttons.
func goToFootage(w *Window, f int) { w.footage.step(f - w.footage.frame) }

// markedFrames are the frames the test marks: six, spread over the
// flight, as a user would.
var markedFrames = []int{0, 4, 8, 12, 16, 20}

// TestFootage_MarkFitApply loads a clip of a known throw, marks six frames
// by clicking the view, fits and applies the fit: the throw then has the
// clip's release velocity and spin rate.
//
// Tolerances: each click is off by up to half a pixel (uniform, 0.29 px
// standard deviation). The clip's scale is about 5.4 mm a pixel and the
// six marks span 20 frames, so the least-squares velocity has a standard
// error near 0.4 % of the speed (Press et al., Numerical Recipes 3rd ed.,
// §15.4, for the covariance of the fitted parameters): 2 % is five
// standard errors. The turn comes from a 30-pixel lever, an angle error of
// about 0.8 degrees a mark, a slope error near 0.2 % of the 30 degrees a
// frame: 1 % is five standard errors. (Measured: 0.1 % and 0.02 %.)
//
// Long: one user session from loading footage to applying the fit, step by
// step, each step checking what the user sees.
func TestFootage_MarkFitApply(t *testing.T) {
	w := boardWindow(t)
	clip := makeClip(t, filepath.Join(t.TempDir(), "clip"))
	if len(clip.take.Frames) <= markedFrames[len(markedFrames)-1] {
		t.Fatalf("the clip has %d frames", len(clip.take.Frames))
	}
	if !w.footage.load(clip.dir) {
		t.Fatalf("load failed: %v", w.lastDialog)
	}
	if w.footage.seq == nil || w.footage.seq.Len() != len(clip.take.Frames) {
		t.Fatal("the sequence did not open")
	}
	if len(w.centre.Objects) != 1 || w.centre.Objects[0] != w.split {
		t.Fatal("the footage is not beside the preview")
	}
	if s := w.footage.view.Size(); s.Width < 100 || s.Height < 100 {
		t.Fatalf("footage view size %v", s)
	}
	// Scrubbing the take moves the footage in step (same rate, offset 0).
	w.setFrame(5)
	if w.footage.frame != 5 || w.footage.view.Frame() != 5 {
		t.Errorf("take frame 5 shows footage frame %d", w.footage.frame)
	}

	for _, k := range markedFrames {
		goToFootage(w, k)
		if w.footage.view.Frame() != k {
			t.Fatalf("footage at frame %d, want %d", w.footage.view.Frame(), k)
		}
		x, y, x2, y2 := clip.clicks(k)
		tapImage(t, w, x, y, false)
		tapImage(t, w, x2, y2, true)
	}
	fo := w.ed.Doc().Footage
	if fo == nil || len(fo.Marks) != len(markedFrames) {
		t.Fatalf("marks %+v", fo)
	}
	for i, m := range fo.Marks {
		x, y, x2, y2 := clip.clicks(markedFrames[i])
		if m.Frame != markedFrames[i] || !m.HasSecond || math.Abs(m.X-x) > 1e-3 || math.Abs(m.Y-y) > 1e-3 ||
			math.Abs(m.X2-x2) > 1e-3 || math.Abs(m.Y2-y2) > 1e-3 {
			t.Errorf("mark %d = %+v, want frame %d at (%g, %g) to (%g, %g)", i, m, markedFrames[i], x, y, x2, y2)
		}
	}

	test.Tap(w.footage.fitBtn)
	report := w.footage.fitText
	for _, want := range []string{"marks: 6, on footage frames 0 to 20", "mm/px", "turns/s", "the turn is: steady"} {
		if !strings.Contains(report, want) {
			t.Errorf("fit report lacks %q:\n%s", want, report)
		}
	}
	t.Logf("fit:\n%s", report)

	before := docBytes(t, w)
	test.Tap(w.footage.applyBtn)
	th := w.ed.Doc().Throw
	v := th.ReleaseVelocity
	if v == nil {
		t.Fatal("no release velocity after Apply")
	}
	speed := math.Hypot(clipVel[0], clipVel[1])
	if d := math.Hypot(v[0]-clipVel[0], v[1]-clipVel[1]); d > 0.02*speed || v[2] != 0 {
		t.Errorf("release velocity %v, want (%g, %g, 0) within 2%% of the speed (off by %.3g m/s)", *v, clipVel[0], clipVel[1], d)
	}
	if s := th.Spin; s == nil || s.TurnsPerSecond == nil || math.Abs(*s.TurnsPerSecond-clipTPS) > 0.01*clipTPS {
		t.Errorf("spin %+v, want %g turns per second within 1%%", s, clipTPS)
	} else {
		t.Logf("applied: velocity (%.4f, %.4f) m/s, spin %.4f turns/s", v[0], v[1], *s.TurnsPerSecond)
	}
	if th.Spin.Axis == nil || th.Spin.Axis.Name != "greatest" {
		t.Errorf("spin axis changed: %+v", th.Spin.Axis)
	}
	if w.menu.undo.Label != "Undo Apply the footage fit to the throw" {
		t.Errorf("undo item %q", w.menu.undo.Label)
	}
	w.undo()
	if !bytes.Equal(docBytes(t, w), before) {
		t.Error("one undo did not take the whole fit back")
	}
	w.redo()

	// The overlay: drawn from the fit, at the document's opacity.
	w.footage.overlay.SetChecked(true)
	if !w.ed.Doc().Footage.OverlayOn() {
		t.Fatal("overlay toggle did not reach the document")
	}
	goToFootage(w, 10)
	img, op := w.footage.view.Overlay()
	if img == nil || op != project.DefaultOpacity {
		t.Fatalf("overlay %v at opacity %g", img != nil, op)
	}
	if b := img.Bounds(); b.Dx() != clipW || b.Dy() != clipH {
		t.Errorf("overlay is %v, want the clip's size", b)
	}
	// The overlay's centre cross sits on the drawn centre of mass.
	cx, cy, _, _ := clip.clicks(10)
	if _, _, _, a := img.At(int(cx)+3, int(cy)).RGBA(); a < 0x8000 {
		t.Errorf("no overlay line beside the centre of mass (%g, %g)", cx, cy)
	}
}

func TestFootage_UndoMark(t *testing.T) {
	w := boardWindow(t)
	clip := makeClip(t, filepath.Join(t.TempDir(), "clip"))
	if !w.footage.load(clip.dir) {
		t.Fatal("load failed")
	}
	goToFootage(w, 3)
	x, y, x2, y2 := clip.clicks(3)
	tapImage(t, w, x, y, false)
	tapImage(t, w, x2, y2, true)
	if !strings.HasPrefix(w.menu.undo.Label, "Undo Mark the second point on footage frame 3") {
		t.Errorf("undo item %q", w.menu.undo.Label)
	}
	w.undo()
	fo := w.ed.Doc().Footage
	if len(fo.Marks) != 1 || fo.Marks[0].HasSecond {
		t.Fatalf("after one undo: %+v, want the centre only", fo.Marks)
	}
	if vm := w.footage.view.Marks(); len(vm) != 1 || vm[0].HasSecond {
		t.Errorf("the view shows %+v", vm)
	}
	w.undo()
	if n := len(w.ed.Doc().Footage.Marks); n != 0 {
		t.Fatalf("after two undos %d marks", n)
	}
	if len(w.footage.view.Marks()) != 0 {
		t.Error("the view still shows the mark")
	}
	w.redo()
	w.redo()
	if m := w.ed.Doc().Footage.Marks; len(m) != 1 || !m[0].HasSecond {
		t.Errorf("after redo: %+v", m)
	}
	// A second point on a frame without a centre is refused, not stored.
	goToFootage(w, 5)
	tapImage(t, w, x2, y2, true)
	if n := len(w.ed.Doc().Footage.Marks); n != 1 || !strings.Contains(w.footage.marks.Text, "centre") {
		t.Errorf("second point without centre: %d marks, %q", n, w.footage.marks.Text)
	}
	// Drag the centre and delete the mark, each one undo step.
	goToFootage(w, 3)
	v := w.footage.view
	start, _ := v.ToView(x, y)
	v.MouseDown(&desktop.MouseEvent{PointEvent: fyne.PointEvent{Position: start}, Button: desktop.MouseButtonPrimary})
	v.Dragged(&fyne.DragEvent{PointEvent: fyne.PointEvent{Position: start.AddXY(6, 0)}, Dragged: fyne.Delta{DX: 6}})
	v.MouseUp(&desktop.MouseEvent{})
	v.DragEnd()
	m := w.ed.Doc().Footage.Marks[0]
	if !(m.X > x+1) || m.Y != y {
		t.Errorf("dragged mark at (%g, %g), was (%g, %g)", m.X, m.Y, x, y)
	}
	test.TapAt(v, start.AddXY(6, 0))
	v.TypedKey(&fyne.KeyEvent{Name: fyne.KeyDelete})
	if n := len(w.ed.Doc().Footage.Marks); n != 0 {
		t.Fatalf("after Delete %d marks", n)
	}
	w.undo()
	if n := len(w.ed.Doc().Footage.Marks); n != 1 {
		t.Errorf("undo of Delete: %d marks", n)
	}
}

func TestFootage_BadFootage_KeepsProject(t *testing.T) {
	w := boardWindow(t)
	before := docBytes(t, w)
	empty := t.TempDir()
	if w.footage.load(empty) {
		t.Fatal("an empty folder loaded")
	}
	if w.lastDialog == nil || w.lastDialog.title != "Could not load footage" {
		t.Fatalf("dialog %+v", w.lastDialog)
	}
	if msg := w.lastDialog.message; !strings.Contains(msg, empty) || !strings.Contains(msg, "empty") || !strings.Contains(msg, "project is unchanged") {
		t.Errorf("message %q does not name the folder and the problem", msg)
	}
	if !bytes.Equal(docBytes(t, w), before) || w.footage.seq != nil || w.ed.CanUndo() {
		t.Error("a failed load changed the project")
	}
	// A file that is not footage, and a missing path.
	bad := filepath.Join(empty, "notes.txt")
	os.WriteFile(bad, []byte("hello"), 0o644)
	for _, p := range []string{bad, filepath.Join(empty, "missing")} {
		if w.footage.load(p) || !strings.Contains(w.lastDialog.message, p) {
			t.Errorf("%s: loaded, or the message %q does not name it", p, w.lastDialog.message)
		}
	}
	if !bytes.Equal(docBytes(t, w), before) {
		t.Error("the project changed")
	}
}

// TestFootage_SavedRelative saves a project with footage beside it: the
// file holds the path relative to its folder, and opening it again brings
// back the clip and the marks.
func TestFootage_SavedRelative(t *testing.T) {
	w := boardWindow(t)
	root := t.TempDir()
	clip := makeClip(t, filepath.Join(root, "plates", "clip"))
	if !w.footage.load(clip.dir) {
		t.Fatal("load failed")
	}
	if p := w.ed.Doc().Footage.Path; p != filepath.ToSlash(clip.dir) {
		t.Errorf("an unsaved project keeps %q, want the absolute path", p)
	}
	x, y, _, _ := clip.clicks(0)
	tapImage(t, w, x, y, false)
	path := filepath.Join(root, "shots", "board.json")
	os.MkdirAll(filepath.Dir(path), 0o755)
	undo := w.ed.UndoLabel()
	if !saveNow(w, path) {
		t.Fatalf("save failed: %v", w.lastDialog)
	}
	data, _ := os.ReadFile(path)
	if !strings.Contains(string(data), `"path": "../plates/clip"`) {
		t.Errorf("saved file:\n%s", data)
	}
	// The rewrite of the path is part of the save: no undo step of its
	// own, and the project is clean.
	if got := w.ed.UndoLabel(); got != undo || w.dirty() || strings.Contains(w.win.Title(), "•") {
		t.Errorf("after save: undo %q (want %q), dirty %v, title %q", got, undo, w.dirty(), w.win.Title())
	}
	// Save as into another folder keeps the same clip, again without a step.
	other := filepath.Join(root, "elsewhere", "deep", "board.json")
	os.MkdirAll(filepath.Dir(other), 0o755)
	if !saveNow(w, other) || w.ed.UndoLabel() != undo || w.dirty() {
		t.Fatalf("save as: %v, undo %q, dirty %v", w.lastDialog, w.ed.UndoLabel(), w.dirty())
	}
	if got := w.ed.Doc().Footage.Path; got != "../../plates/clip" || w.footage.seq == nil || w.footage.loadErr != nil {
		t.Errorf("after save as: footage.path %q, sequence %v, error %v", got, w.footage.seq != nil, w.footage.loadErr)
	}
	// Undo of the mark after the move still names the clip.
	w.undo()
	if got := w.ed.Doc().FootageDir(other); got != clip.dir || w.footage.loadErr != nil {
		t.Errorf("undo after save as: footage %q, error %v", got, w.footage.loadErr)
	}
	w.redo()
	w.replace(emptyDocument(), "", "")
	if w.footage.seq != nil || len(w.centre.Objects) != 1 || w.centre.Objects[0] != w.view.preview {
		t.Error("a project without footage still shows footage")
	}
	if !w.openPath(path) {
		t.Fatalf("open failed: %v", w.lastDialog)
	}
	if w.footage.seq == nil || w.footage.seq.Path() != clip.dir || len(w.footage.view.Marks()) != 1 {
		t.Errorf("reopened: sequence %v, marks %d", w.footage.seq != nil, len(w.footage.view.Marks()))
	}
}

// TestFootage_OtherRate maps take frames to footage frames by time: a
// 12 fps clip beside the 24 fps take shows each footage frame for two
// take frames, from the offset.
func TestFootage_OtherRate(t *testing.T) {
	w := boardWindow(t)
	clip := makeClip(t, filepath.Join(t.TempDir(), "clip"))
	if !w.footage.load(clip.dir) {
		t.Fatal("load failed")
	}
	w.footage.pickRate("custom…")
	w.footage.typeRate("12")
	if w.footage.seq == nil || w.footage.seq.FPS() != (physics.Rate{Num: 12, Den: 1}) {
		t.Fatalf("footage rate %v", w.footage.seq.FPS())
	}
	typeInto(t, w.footage.offset, "3")
	if got := w.ed.Doc().Footage.OffsetOrZero(); got != 3 {
		t.Fatalf("offset %d", got)
	}
	for _, c := range [][2]int{{0, 3}, {1, 3}, {2, 4}, {3, 4}, {9, 7}} {
		w.setFrame(c[0])
		if w.footage.frame != c[1] {
			t.Errorf("take frame %d shows footage frame %d, want %d", c[0], w.footage.frame, c[1])
		}
	}
	// Stepping the footage moves the take to the nearest take frame:
	// footage frame 8 is (8 - 3) / 12 s after release, take frame 10.
	goToFootage(w, 8)
	if w.frame != 10 || w.footage.frame != 8 {
		t.Errorf("footage frame 8: take frame %d, footage %d", w.frame, w.footage.frame)
	}
}

// TestFootage_ApplyIrregularTurn_Asks: marks whose second points turn
// unevenly (a tumble seen on screen) give an "irregular" turn; Apply then
// asks before writing the on-screen rate as the spin, and each answer does
// what it says.
func TestFootage_ApplyIrregularTurn_Asks(t *testing.T) {
	w := boardWindow(t)
	clip := makeClip(t, filepath.Join(t.TempDir(), "clip"))
	if !w.footage.load(clip.dir) {
		t.Fatalf("load failed: %v", w.lastDialog)
	}
	// The prop line's direction on each marked frame, degrees: it lurches
	// forward and back (RMS tens of degrees off any steady turn, far over
	// footage.SteadyMaxRMSDeg).
	angles := []float64{0, 70, 20, 150, 60, 200}
	for i, k := range markedFrames {
		goToFootage(w, k)
		x, y, _, _ := clip.clicks(k)
		a := angles[i] * math.Pi / 180
		tapImage(t, w, x, y, false)
		tapImage(t, w, x+30*math.Cos(a), y-30*math.Sin(a), true)
	}
	test.Tap(w.footage.fitBtn)
	if !strings.Contains(w.footage.fitText, "the turn is: irregular") || !strings.Contains(w.footage.fitText, "rough on-screen turn rate") {
		t.Fatalf("fit report does not call the turn irregular and rough:\n%s", w.footage.fitText)
	}
	before := docBytes(t, w)
	spinBefore := w.ed.Doc().Throw.Spin.TurnsPerSecond
	w.lastDialog = nil
	test.Tap(w.footage.applyBtn)
	d := w.lastDialog
	if d == nil || d.choose == nil || !strings.Contains(d.message, "irregular") || !strings.Contains(d.message, "rough on-screen turn rate") {
		t.Fatalf("Apply of an irregular turn did not ask: %+v", d)
	}
	if !bytes.Equal(docBytes(t, w), before) {
		t.Fatal("the throw changed before the user answered")
	}
	d.choose["Cancel"]()
	if !bytes.Equal(docBytes(t, w), before) {
		t.Fatal("Cancel changed the throw")
	}

	test.Tap(w.footage.applyBtn)
	w.lastDialog.choose["Velocity only"]()
	th := w.ed.Doc().Throw
	if th.ReleaseVelocity == nil || math.Hypot(th.ReleaseVelocity[0]-clipVel[0], th.ReleaseVelocity[1]-clipVel[1]) > 0.02*math.Hypot(clipVel[0], clipVel[1]) {
		t.Errorf("velocity only: release velocity %v, want about %v", th.ReleaseVelocity, clipVel)
	}
	if th.Spin == nil || th.Spin.TurnsPerSecond == nil || *th.Spin.TurnsPerSecond != *spinBefore {
		t.Errorf("velocity only changed the spin: %+v", th.Spin)
	}
	w.undo()
	if !bytes.Equal(docBytes(t, w), before) {
		t.Fatal("undo of velocity only did not restore the throw")
	}

	test.Tap(w.footage.applyBtn)
	w.lastDialog.choose["Apply the rough rate too"]()
	ts, _ := w.footage.fit.ThrowAt(w.footage.offsetFrames(), w.footage.fit.MetresPerPixel)
	if s := w.ed.Doc().Throw.Spin; s == nil || s.TurnsPerSecond == nil || *s.TurnsPerSecond != ts.TurnsPerSecond {
		t.Errorf("rough rate too: spin %+v, want %g turns/s", s, ts.TurnsPerSecond)
	}
}

// TestFootage_OpensOffTheUIGoroutine: footage opens on another goroutine
// (a GIF is decoded whole, a folder has every header read); the pane says
// so meanwhile and the project changes only when it has opened. A later
// load supersedes one still opening, and Redo of "Load footage" opens the
// clip again the same way.
func TestFootage_OpensOffTheUIGoroutine(t *testing.T) {
	w := boardWindow(t)
	root := t.TempDir()
	clip := makeClip(t, filepath.Join(root, "clip"))
	other := makeClip(t, filepath.Join(root, "other"))
	queue := make(chan func(), 16)
	w.synchronous, w.do = false, func(f func()) { queue <- f }
	defer func() { w.synchronous = true }()
	runQueued := func() {
		t.Helper()
		select {
		case f := <-queue:
			f()
		case <-time.After(time.Minute):
			t.Fatal("the footage never opened")
		}
	}
	before := docBytes(t, w)
	if !w.footage.load(other.dir) || !w.footage.load(clip.dir) {
		t.Fatal("load did not start")
	}
	if !bytes.Equal(docBytes(t, w), before) || w.footage.seq != nil || !strings.HasPrefix(w.footage.status.Text, "Opening ") {
		t.Fatalf("before the footage opened: project changed %v, sequence %v, status %q",
			!bytes.Equal(docBytes(t, w), before), w.footage.seq != nil, w.footage.status.Text)
	}
	runQueued()
	runQueued()
	if w.footage.seq == nil || w.footage.seq.Path() != clip.dir || w.ed.Doc().FootageDir("") != clip.dir || w.ed.UndoLabel() != "Load footage" {
		t.Fatalf("after opening: sequence %v, footage %q, undo %q", w.footage.seq != nil, w.ed.Doc().FootageDir(""), w.ed.UndoLabel())
	}
	w.undo()
	if w.footage.seq != nil || w.ed.Doc().Footage != nil {
		t.Fatal("undo of the load kept the footage")
	}
	w.redo()
	if w.footage.seq != nil || !strings.HasPrefix(w.footage.status.Text, "Opening ") {
		t.Fatalf("redo opened the clip on the UI goroutine (status %q)", w.footage.status.Text)
	}
	runQueued()
	if w.footage.seq == nil || w.footage.seq.Path() != clip.dir || !strings.Contains(w.footage.status.Text, "frames") {
		t.Errorf("after redo: sequence %v, status %q", w.footage.seq != nil, w.footage.status.Text)
	}
}
