package widgets

import (
	"bytes"
	"image"
	"math"
	"testing"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/test"

	"propflight/internal/fixture"
	"propflight/widgets/wire"
)

// previewWindow shows a preview of the pan's short throw at the apex in a
// 320 x 240 test window.
func previewWindow(t *testing.T) (*Preview, fyne.Window) {
	t.Helper()
	test.NewTempApp(t)
	sc := fixture.PanScene(t, 1.1, 2.8, 1.5, 0)
	p := NewPreview()
	p.SetScene(sc)
	p.SetFrame(sc.Take.ApexFrame)
	w := test.NewTempWindow(t, p)
	w.SetPadded(false)
	w.Resize(fyne.NewSize(320, 240))
	w.Canvas().Capture() // let the raster render at the window's size
	return p, w
}

func pixels(img image.Image) []byte { return img.(*image.RGBA).Pix }

func TestPreview_Drag_RotatesCamera(t *testing.T) {
	p, w := previewWindow(t)
	var views []wire.View
	p.OnViewChanged = func(v wire.View) { views = append(views, v) }
	before := p.Image()

	test.Drag(w.Canvas(), fyne.NewPos(160, 120), 40, 0)

	if p.View() != wire.Free {
		t.Fatalf("view after drag = %v, want free", p.View())
	}
	if len(views) != 1 || views[0] != wire.Free {
		t.Fatalf("OnViewChanged calls = %v, want one call with free", views)
	}
	// Front looks from yaw 0; a drag of 40 units to the right swings the
	// eye by -40 OrbitPerUnit radians.
	if got, want := p.Camera().Yaw, -40*OrbitPerUnit; math.Abs(got-want) > 1e-12 {
		t.Errorf("yaw = %v, want %v", got, want)
	}
	if bytes.Equal(pixels(before), pixels(p.Image())) {
		t.Error("the picture did not change after a drag")
	}

	// A second drag is already in the free view: no notification.
	test.Drag(w.Canvas(), fyne.NewPos(160, 120), 0, 20)
	if len(views) != 1 {
		t.Errorf("OnViewChanged called %d times, want 1", len(views))
	}
	if p.Camera().Pitch <= 0 {
		t.Errorf("pitch after a downward drag = %v, want > 0 (eye above the target)", p.Camera().Pitch)
	}
}

func TestPreview_Scroll_Zooms(t *testing.T) {
	p, w := previewWindow(t)
	before := p.Image()
	d0 := p.Camera().Distance

	test.Scroll(w.Canvas(), fyne.NewPos(160, 120), 0, 25) // one wheel notch away from the user

	if got, want := p.Camera().Distance, d0/1.15; math.Abs(got-want) > 1e-9*want {
		t.Errorf("distance after one notch = %v, want %v (15 %% closer)", got, want)
	}
	if bytes.Equal(pixels(before), pixels(p.Image())) {
		t.Error("the picture did not change after a scroll")
	}
	test.Scroll(w.Canvas(), fyne.NewPos(160, 120), 0, -25)
	if got := p.Camera().Distance; math.Abs(got-d0) > 1e-9*d0 {
		t.Errorf("distance after a notch in and out = %v, want %v", got, d0)
	}
}

func TestPreview_DoubleTap_Reframes(t *testing.T) {
	p, w := previewWindow(t)
	d0 := p.Camera().Distance
	test.Scroll(w.Canvas(), fyne.NewPos(160, 120), 0, 100)
	if p.Camera().Distance >= d0 {
		t.Fatal("scroll did not zoom in")
	}
	test.DoubleTap(p)
	if got := p.Camera().Distance; math.Abs(got-d0) > 1e-9*d0 {
		t.Errorf("distance after double tap = %v, want the framed %v", got, d0)
	}
}

func TestPreview_SetFrame_ChangesImage(t *testing.T) {
	p, _ := previewWindow(t)
	at := p.Image()
	p.SetFrame(3)
	if p.Frame() != 3 {
		t.Fatalf("Frame() = %d, want 3", p.Frame())
	}
	if bytes.Equal(pixels(at), pixels(p.Image())) {
		t.Error("the picture did not change with the frame")
	}
	last := len(p.Scene().Take.Frames) - 1
	p.SetFrame(1 << 20)
	if p.Frame() != last {
		t.Errorf("SetFrame(huge) shows %d, want the last frame %d", p.Frame(), last)
	}
	p.SetFrame(-4)
	if p.Frame() != 0 {
		t.Errorf("SetFrame(-4) shows %d, want 0", p.Frame())
	}
}

func TestPreview_SetView_FramesWithoutNotifying(t *testing.T) {
	p, _ := previewWindow(t)
	called := false
	p.OnViewChanged = func(wire.View) { called = true }
	front := p.Image()
	p.SetView(wire.Side)
	if p.View() != wire.Side || !p.Camera().Ortho {
		t.Errorf("view = %v ortho %v, want side, orthographic", p.View(), p.Camera().Ortho)
	}
	if called {
		t.Error("SetView called OnViewChanged")
	}
	if bytes.Equal(pixels(front), pixels(p.Image())) {
		t.Error("side view looks the same as the front view")
	}
	p.SetView(wire.Free)
	if p.Camera().Ortho {
		t.Error("free view is orthographic, want perspective")
	}
}

func TestPreview_SetScene_KeepsCameraUnlessSizeChangesALot(t *testing.T) {
	p, w := previewWindow(t)
	test.Scroll(w.Canvas(), fyne.NewPos(160, 120), 0, 25)
	zoomed := p.Camera().Distance
	frame := p.Frame()

	// A slightly longer throw keeps the user's zoom and the frame.
	p.SetScene(fixture.PanScene(t, 1.15, 2.9, 1.5, 0))
	if p.Camera().Distance != zoomed {
		t.Errorf("distance after a small change = %v, want the user's %v", p.Camera().Distance, zoomed)
	}
	if p.Frame() != frame {
		t.Errorf("frame after SetScene = %d, want %d kept", p.Frame(), frame)
	}

	// A throw three times as far is framed again.
	big := fixture.PanScene(t, 1.6, 9, 1.5, 0)
	p.SetScene(big)
	want := p.Camera()
	want.Frame(wire.Bounds(p.Scene()))
	if got := p.Camera().Distance; math.Abs(got-want.Distance) > 1e-9*want.Distance {
		t.Errorf("distance after a big change = %v, want framed %v", got, want.Distance)
	}
}

func TestPreview_Render_UsesCanvasScale(t *testing.T) {
	p, w := previewWindow(t)
	w.Canvas().(test.WindowlessCanvas).SetScale(2)
	w.Canvas().Capture()
	if b := p.Image().Bounds(); b.Dx() != 640 || b.Dy() != 480 {
		t.Errorf("image at scale 2 is %v, want 640 x 480 pixels", b)
	}
}

func TestPreview_Empty_RendersBackground(t *testing.T) {
	test.NewTempApp(t)
	p := NewPreview()
	img := p.Image().(*image.RGBA)
	bg := wire.DefaultPalette().Background
	for i := 0; i < len(img.Pix); i += 4 {
		if img.Pix[i] != bg.R || img.Pix[i+1] != bg.G || img.Pix[i+2] != bg.B {
			t.Fatalf("an empty preview has a pixel %v at offset %d, want the background %v", img.Pix[i:i+4], i, bg)
		}
	}
}

func TestPreview_Golden(t *testing.T) {
	_, w := previewWindow(t)
	test.AssertImageMatches(t, "preview/apex_front.png", w.Canvas().Capture())
}
