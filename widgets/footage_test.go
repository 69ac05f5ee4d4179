package widgets

import (
	"errors"
	"image"
	"image/color"
	"math"
	"testing"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/driver/desktop"
	"fyne.io/fyne/v2/test"

	"propflight/internal/mark"
)

// fakeFootage is a FrameSource of n frames of w x h pixels: the left half
// red, the right half blue. Frames listed in bad fail to decode; panicky
// frames panic.
type fakeFootage struct {
	w, h, n int
	bad     map[int]error
	panicky map[int]bool
}

func (f *fakeFootage) Len() int         { return f.n }
func (f *fakeFootage) Size() (w, h int) { return f.w, f.h }
func (f *fakeFootage) Frame(i int) (image.Image, error) {
	if f.panicky[i] {
		panic("decoder exploded")
	}
	if err := f.bad[i]; err != nil {
		return nil, err
	}
	img := image.NewNRGBA(image.Rect(0, 0, f.w, f.h))
	for y := range f.h {
		for x := range f.w {
			c := color.NRGBA{220, 30, 30, 255}
			if x >= f.w/2 {
				c = color.NRGBA{30, 30, 220, 255}
			}
			img.SetNRGBA(x, y, c)
		}
	}
	return img, nil
}

// footageWindow shows a view of a 640 x 360 clip of 10 frames in an
// unpadded 400 x 300 window. The picture then has the scale 400 / 640 =
// 0.625 units per pixel, is 225 units high and sits (300 - 225) / 2 = 37.5
// units below the top.
func footageWindow(t *testing.T) (*FootageView, fyne.Window, *fakeFootage) {
	t.Helper()
	test.NewTempApp(t)
	src := &fakeFootage{w: 640, h: 360, n: 10, bad: map[int]error{}, panicky: map[int]bool{}}
	v := NewFootageView()
	v.SetSource(src)
	w := test.NewTempWindow(t, v)
	w.SetPadded(false)
	w.Resize(fyne.NewSize(400, 300))
	if s := v.Size(); s.Width != 400 || s.Height != 300 {
		t.Fatalf("view size %v, want 400 x 300", s)
	}
	return v, w, src
}

func near(a, b float64) bool { return math.Abs(a-b) <= 1e-4 }

func TestLetterbox(t *testing.T) {
	for _, c := range []struct {
		W, H      float64
		w, h      int
		ox, oy, s float64
	}{
		// Wider than the box: bars above and below.
		{400, 300, 640, 360, 0, 37.5, 0.625},
		// Taller: bars at the sides. s = min(400/200, 300/400) = 0.75,
		// width 150, (400 - 150) / 2 = 125.
		{400, 300, 200, 400, 125, 0, 0.75},
		// Same aspect, magnified: no bars.
		{800, 450, 640, 360, 0, 0, 1.25},
		// A one-pixel image fills the smaller side.
		{50, 80, 1, 1, 0, 15, 50},
	} {
		ox, oy, s, ok := letterbox(c.W, c.H, c.w, c.h)
		if !ok || !near(ox, c.ox) || !near(oy, c.oy) || !near(s, c.s) {
			t.Errorf("letterbox(%g, %g, %d, %d) = %g, %g, %g, %v; want %g, %g, %g", c.W, c.H, c.w, c.h, ox, oy, s, ok, c.ox, c.oy, c.s)
		}
	}
	for _, c := range [][4]float64{{0, 300, 640, 360}, {400, 300, 0, 360}, {400, math.NaN(), 640, 360}} {
		if _, _, _, ok := letterbox(c[0], c[1], int(c[2]), int(c[3])); ok {
			t.Errorf("letterbox%v accepted", c)
		}
	}
}

func TestFootageView_Coordinates(t *testing.T) {
	v, _, _ := footageWindow(t)
	ox, oy, s, ok := v.Letterbox()
	if !ok || ox != 0 || oy != 37.5 || s != 0.625 {
		t.Fatalf("Letterbox = %g, %g, %g, %v", ox, oy, s, ok)
	}
	for _, c := range []struct {
		at     fyne.Position
		x, y   float64
		inside bool
	}{
		{fyne.NewPos(200, 150), 320, 180, true},          // the centre
		{fyne.NewPos(0, 37.5), 0, 0, true},               // the top-left corner of the picture
		{fyne.NewPos(400, 262.5), 640, 360, true},        // the bottom-right corner
		{fyne.NewPos(10, 40), 16, 4, true},               // 10 / 0.625, (40 - 37.5) / 0.625
		{fyne.NewPos(100.5, 100.25), 160.8, 100.4, true}, // 100.5 / 0.625, 62.75 / 0.625
		{fyne.NewPos(100, 20), 160, -28, false},          // in the bar above
		{fyne.NewPos(100, 290), 160, 404, false},         // in the bar below
	} {
		x, y, inside, ok := v.ToImage(c.at)
		if !ok || !near(x, c.x) || !near(y, c.y) || inside != c.inside {
			t.Errorf("ToImage(%v) = %g, %g, %v, %v; want %g, %g, %v", c.at, x, y, inside, ok, c.x, c.y, c.inside)
		}
		p, _ := v.ToView(c.x, c.y)
		if !near(float64(p.X), float64(c.at.X)) || !near(float64(p.Y), float64(c.at.Y)) {
			t.Errorf("ToView(%g, %g) = %v, want %v", c.x, c.y, p, c.at)
		}
	}
	// No footage: no coordinates.
	v.SetSource(nil)
	if _, _, _, ok := v.ToImage(fyne.NewPos(1, 1)); ok {
		t.Error("ToImage without footage")
	}
}

type markCall struct {
	x, y   float64
	second bool
}

func TestFootageView_Tap_GivesImagePixel(t *testing.T) {
	v, _, _ := footageWindow(t)
	var calls []markCall
	v.OnMark = func(x, y float64, second bool) { calls = append(calls, markCall{x, y, second}) }

	test.TapAt(v, fyne.NewPos(200, 150))
	test.TapAt(v, fyne.NewPos(10, 40))
	test.TapAt(v, fyne.NewPos(100, 20)) // the bar: not on the picture
	// Shift held at the press (a desktop mouse reports it in MouseDown).
	v.MouseDown(&desktop.MouseEvent{PointEvent: fyne.PointEvent{Position: fyne.NewPos(250, 100)}, Button: desktop.MouseButtonPrimary, Modifier: fyne.KeyModifierShift})
	v.MouseUp(&desktop.MouseEvent{})
	test.TapAt(v, fyne.NewPos(250, 100))
	// The next plain tap is a centre again.
	test.TapAt(v, fyne.NewPos(250, 100))
	// A secondary tap is a second point.
	test.TapSecondaryAt(v, fyne.NewPos(300, 200))

	want := []markCall{
		{320, 180, false},
		{16, 4, false},
		{400, 100, true}, // 250 / 0.625, (100 - 37.5) / 0.625
		{400, 100, false},
		{480, 260, true},
	}
	if len(calls) != len(want) {
		t.Fatalf("OnMark calls %v, want %v", calls, want)
	}
	for i := range want {
		if !near(calls[i].x, want[i].x) || !near(calls[i].y, want[i].y) || calls[i].second != want[i].second {
			t.Errorf("call %d = %+v, want %+v", i, calls[i], want[i])
		}
	}
}

func TestFootageView_TapOnMark_SelectsAndDeletes(t *testing.T) {
	v, w, _ := footageWindow(t)
	var marked, deleted []int
	v.OnMark = func(x, y float64, second bool) { marked = append(marked, 1) }
	v.OnMarkDeleted = func(i int) { deleted = append(deleted, i) }
	v.SetMarks([]mark.Mark{
		{Frame: 1, X: 320, Y: 180},                                    // another frame: not selectable here
		{Frame: 0, X: 320, Y: 180, HasSecond: true, X2: 400, Y2: 180}, // index 1
		{Frame: 0, X: 100, Y: 100},                                    // index 2
	})

	// Within markHit of mark 1's centre (view 200, 150): select, no new mark.
	test.TapAt(v, fyne.NewPos(203, 152))
	if v.Selected() != 1 || len(marked) != 0 {
		t.Fatalf("selected %d, OnMark calls %d; want mark 1 selected and no call", v.Selected(), len(marked))
	}
	if w.Canvas().Focused() != v {
		t.Error("a tap does not focus the view")
	}
	v.TypedKey(&fyne.KeyEvent{Name: fyne.KeyDelete})
	if len(deleted) != 1 || deleted[0] != 1 || v.Selected() != -1 {
		t.Fatalf("deleted %v, selected %d", deleted, v.Selected())
	}
	// The owner has not removed it yet; Backspace on mark 2 works too.
	p, _ := v.ToView(100, 100)
	test.TapAt(v, p)
	v.TypedKey(&fyne.KeyEvent{Name: fyne.KeyBackspace})
	if len(deleted) != 2 || deleted[1] != 2 {
		t.Fatalf("deleted %v, want [1 2]", deleted)
	}
	// The second point selects its mark too.
	p, _ = v.ToView(400, 180)
	test.TapAt(v, p)
	if v.Selected() != 1 {
		t.Errorf("tap on the second point selected %d", v.Selected())
	}
	// Keys the view does not use go on to its owner.
	var other []fyne.KeyName
	v.OnOtherKey = func(k *fyne.KeyEvent) { other = append(other, k.Name) }
	v.TypedKey(&fyne.KeyEvent{Name: fyne.KeyRight})
	if len(other) != 1 || other[0] != fyne.KeyRight {
		t.Errorf("other keys %v, want [Right]", other)
	}
	// Escape drops the selection; Delete then does nothing.
	v.TypedKey(&fyne.KeyEvent{Name: fyne.KeyEscape})
	v.TypedKey(&fyne.KeyEvent{Name: fyne.KeyDelete})
	if len(deleted) != 2 {
		t.Errorf("Delete without a selection deleted: %v", deleted)
	}
	// On frame 1 the first mark is the one under the pointer.
	v.SetFrame(1)
	test.TapAt(v, fyne.NewPos(200, 150))
	if v.Selected() != 0 {
		t.Errorf("frame 1: selected %d, want 0", v.Selected())
	}
	// A frame change drops a selection of another frame.
	v.SetFrame(0)
	if v.Selected() != -1 {
		t.Errorf("selection kept across frames: %d", v.Selected())
	}
	if len(marked) != 0 {
		t.Errorf("taps on marks made %d new marks", len(marked))
	}
}

func TestFootageView_Drag_MovesMark(t *testing.T) {
	v, w, _ := footageWindow(t)
	type move struct {
		i    int
		x, y float64
		sec  bool
	}
	var moves []move
	v.OnMarkMoved = func(i int, x, y float64) { moves = append(moves, move{i, x, y, false}) }
	v.OnSecondMoved = func(i int, x, y float64) { moves = append(moves, move{i, x, y, true}) }
	v.SetMarks([]mark.Mark{{Frame: 0, X: 320, Y: 180, HasSecond: true, X2: 400, Y2: 180}})

	// A desktop drag: press on the centre (view 200, 150), two moves of
	// (10, 5) and (5, 0) units, release. The centre moves by 15 / 0.625
	// = 24 and 5 / 0.625 = 8 pixels.
	start := fyne.NewPos(200, 150)
	v.MouseDown(&desktop.MouseEvent{PointEvent: fyne.PointEvent{Position: start}, Button: desktop.MouseButtonPrimary})
	v.Dragged(&fyne.DragEvent{PointEvent: fyne.PointEvent{Position: start.AddXY(10, 5)}, Dragged: fyne.Delta{DX: 10, DY: 5}})
	if m := v.shownMark(0); !near(m.X, 336) || !near(m.Y, 188) {
		t.Errorf("during the drag the mark shows at (%g, %g), want (336, 188)", m.X, m.Y)
	}
	v.Dragged(&fyne.DragEvent{PointEvent: fyne.PointEvent{Position: start.AddXY(15, 5)}, Dragged: fyne.Delta{DX: 5, DY: 0}})
	if len(moves) != 0 {
		t.Fatal("OnMarkMoved before the drag ended")
	}
	v.MouseUp(&desktop.MouseEvent{})
	v.DragEnd()
	if len(moves) != 1 || moves[0] != (move{0, 344, 188, false}) {
		t.Fatalf("moves %+v, want one move of mark 0 to (344, 188)", moves)
	}
	// The view draws the marks it is given: without SetMarks the mark is
	// back where it was.
	if m := v.shownMark(0); m.X != 320 || m.Y != 180 {
		t.Errorf("after the drag the mark shows at (%g, %g)", m.X, m.Y)
	}

	// The second point, with the test driver's drag (one event at the
	// start position) after a press there.
	p2, _ := v.ToView(400, 180)
	v.MouseDown(&desktop.MouseEvent{PointEvent: fyne.PointEvent{Position: p2}})
	test.Drag(w.Canvas(), p2, -25, 10)
	if len(moves) != 2 || !near(moves[1].x, 360) || !near(moves[1].y, 196) || !moves[1].sec {
		t.Fatalf("moves %+v, want the second point moved to (360, 196)", moves)
	}

	// A drag reported without a press (its event says where the pointer
	// is now): it starts where the pointer was, Position - Dragged.
	v.Dragged(&fyne.DragEvent{PointEvent: fyne.PointEvent{Position: start.AddXY(0, -10)}, Dragged: fyne.Delta{DY: -10}})
	v.DragEnd()
	if len(moves) != 3 || moves[2] != (move{0, 320, 164, false}) {
		t.Fatalf("moves %+v, want mark 0 moved to (320, 164)", moves)
	}

	// A drag that starts away from every mark moves nothing.
	v.MouseDown(&desktop.MouseEvent{PointEvent: fyne.PointEvent{Position: fyne.NewPos(50, 60)}})
	test.Drag(w.Canvas(), fyne.NewPos(50, 60), 30, 30)
	if len(moves) != 3 {
		t.Errorf("a drag from empty picture moved a mark: %+v", moves)
	}
}

func TestFootageView_Messages(t *testing.T) {
	v, w, src := footageWindow(t)
	src.bad[2] = errors.New("clip/frame_0002.png: cannot decode the PNG frame: png: invalid format")
	src.panicky[3] = true
	var calls int
	v.OnMark = func(float64, float64, bool) { calls++ }

	if v.Message() != "" {
		t.Errorf("frame 0 shows %q", v.Message())
	}
	v.SetFrame(2)
	if got := v.Message(); got != "clip/frame_0002.png: cannot decode the PNG frame: png: invalid format" {
		t.Errorf("bad frame shows %q", got)
	}
	test.TapAt(v, fyne.NewPos(200, 150))
	if calls != 0 {
		t.Error("a tap on a frame that failed made a mark")
	}
	v.SetFrame(3)
	if got := v.Message(); got != "the frame could not be read: decoder exploded" {
		t.Errorf("panicking frame shows %q", got)
	}
	for _, i := range []int{-1, 10, 1 << 30} {
		v.SetFrame(i)
		if got := v.Message(); got != "no footage frame" {
			t.Errorf("frame %d shows %q", i, got)
		}
	}
	w.Canvas().Capture() // renders the message without trouble
	v.SetFrame(4)
	if v.Message() != "" || v.Frame() != 4 {
		t.Errorf("frame 4: %q %d", v.Message(), v.Frame())
	}
	v.SetSource(nil)
	if got := v.Message(); got != "no footage" {
		t.Errorf("no source shows %q", got)
	}
	test.TapAt(v, fyne.NewPos(200, 150))
	if calls != 0 {
		t.Error("a tap without footage made a mark")
	}
}

// TestFootageView_Render captures the window: the frame stretched into
// its letterbox with the surround above and below, a mark cross in its
// colour, and an overlay blended at its opacity.
func TestFootageView_Render(t *testing.T) {
	v, w, _ := footageWindow(t)
	img := w.Canvas().Capture()
	at := func(x, y int) color.NRGBA { return color.NRGBAModel.Convert(img.At(x, y)).(color.NRGBA) }
	close := func(c, want color.NRGBA, tol int) bool {
		d := func(a, b uint8) bool { return int(a)-int(b) <= tol && int(b)-int(a) <= tol }
		return d(c.R, want.R) && d(c.G, want.G) && d(c.B, want.B)
	}
	red, blue := color.NRGBA{220, 30, 30, 255}, color.NRGBA{30, 30, 220, 255}
	if c := at(100, 150); !close(c, red, 2) {
		t.Errorf("left half %v, want red", c)
	}
	if c := at(300, 150); !close(c, blue, 2) {
		t.Errorf("right half %v, want blue", c)
	}
	if c := at(200, 10); !close(c, footageBack, 2) {
		t.Errorf("bar above %v, want the surround %v", c, footageBack)
	}
	if c := at(200, 290); !close(c, footageBack, 2) {
		t.Errorf("bar below %v", c)
	}

	// A mark at image (160, 300): view (100, 225). Its cross arm lies at
	// x from 94 to 106 on row 225.
	v.SetMarks([]mark.Mark{{Frame: 0, X: 160, Y: 300}})
	img = w.Canvas().Capture()
	if c := at(104, 225); !close(c, markColor, 40) {
		t.Errorf("mark cross %v, want %v", c, markColor)
	}

	// An overlay: opaque green over the top-left quarter of the frame.
	ov := image.NewNRGBA(image.Rect(0, 0, 640, 360))
	for y := range 180 {
		for x := range 320 {
			ov.SetNRGBA(x, y, color.NRGBA{0, 255, 0, 255})
		}
	}
	v.SetMarks(nil)
	v.SetOverlay(ov, 1)
	img = w.Canvas().Capture()
	if c := at(100, 80); !close(c, color.NRGBA{0, 255, 0, 255}, 2) {
		t.Errorf("opaque overlay %v, want green", c)
	}
	if c := at(100, 200); !close(c, red, 2) {
		t.Errorf("transparent part of the overlay %v, want the frame's red", c)
	}
	v.SetOverlay(ov, 0.5)
	img = w.Canvas().Capture()
	if c := at(100, 80); !close(c, color.NRGBA{110, 142, 15, 255}, 6) {
		t.Errorf("half overlay %v, want the mix of red and green", c)
	}
	v.SetOverlay(nil, 1)
	img = w.Canvas().Capture()
	if c := at(100, 80); !close(c, red, 2) {
		t.Errorf("overlay removed: %v", c)
	}
}
