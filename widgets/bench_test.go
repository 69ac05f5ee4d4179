package widgets

import (
	"testing"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/test"

	"propflight/internal/fixture"
	"propflight/physics"
	"propflight/widgets/wire"
)

// Benchmark sizes: the preview at 1280 x 800 pixels, the take about three
// seconds (fixture.ThreeSecondHang) with three onion frames each side, the arc,
// ticks, axes and grid on. The window's budget for recompute plus render
// is 16 ms, one frame of a 60 Hz display.
const benchW, benchH = 1280, 800

// threeSecondScene is the pan thrown 6 m with a hang of fixture.ThreeSecondHang.
func threeSecondScene(b *testing.B) wire.Scene {
	sc := fixture.PanScene(b, fixture.ThreeSecondHang, 6, 1.5, 0)
	if d := sc.Take.FlightTime; d < 2.9 || d > 3.2 {
		b.Fatalf("flight time %.3f s, want about 3 s", d)
	}
	return sc
}

// BenchmarkPreviewRender is what a timeline scrub costs: a new frame drawn
// (wire.Draw) and painted into the preview's reused image.
func BenchmarkPreviewRender(b *testing.B) {
	test.NewTempApp(b)
	sc := threeSecondScene(b)
	p := NewPreview()
	p.SetScene(sc)
	p.render(benchW, benchH)
	n := len(sc.Take.Frames)
	b.ReportMetric(float64(n), "frames")
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; b.Loop(); i++ {
		p.SetFrame(i % n)
		p.stale = true // a frame equal to the last one must still paint
		p.render(benchW, benchH)
	}
}

// BenchmarkPreviewDraw is the segment half of a render: wire.Draw alone.
func BenchmarkPreviewDraw(b *testing.B) {
	sc := threeSecondScene(b)
	cam := wire.NewCamera(wire.Front, benchW, benchH)
	cam.Frame(wire.Bounds(sc))
	n := len(sc.Take.Frames)
	b.ReportAllocs()
	for i := 0; b.Loop(); i++ {
		sc.Frame = i % n
		_ = wire.Draw(cam, sc)
	}
}

// BenchmarkSimulateAndRender is what a slider drag on a throw costs: mass
// properties, physics.Simulate of the 3 s flight, framing and the render
// of one frame at 1280 x 800.
func BenchmarkSimulateAndRender(b *testing.B) {
	prop := fixture.FryingPan()
	th := fixture.PanThrow(fixture.ThreeSecondHang, 6, 1.5)
	var pt wire.Painter
	img := wire.Rasterize(wire.Drawing{Width: benchW, Height: benchH}, wire.DefaultPalette())
	pal := wire.DefaultPalette()
	b.ReportAllocs()
	for b.Loop() {
		mp, err := prop.MassProps()
		if err != nil {
			b.Fatal(err)
		}
		tk, err := physics.Simulate(prop, &mp, &th)
		if err != nil {
			b.Fatal(err)
		}
		sc := wire.Scene{Prop: prop, Mass: &mp, Take: tk, Frame: tk.ApexFrame, OnionBefore: 3, OnionAfter: 3,
			ShowArc: true, ShowTicks: true, ShowAxes: true, ShowGrid: true}
		cam := wire.NewCamera(wire.Front, benchW, benchH)
		cam.Frame(wire.Bounds(sc))
		pt.Paint(img, wire.Draw(cam, sc), pal)
	}
}

// BenchmarkPreviewRenderHiDPI is BenchmarkPreviewRender on a scale-2
// screen: the same 1280 x 800 units are 2560 x 1600 pixels.
func BenchmarkPreviewRenderHiDPI(b *testing.B) {
	test.NewTempApp(b)
	sc := threeSecondScene(b)
	p := NewPreview()
	p.Resize(fyne.NewSize(benchW, benchH))
	p.SetScene(sc)
	p.render(2*benchW, 2*benchH)
	n := len(sc.Take.Frames)
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; b.Loop(); i++ {
		p.SetFrame(i % n)
		p.stale = true
		p.render(2*benchW, 2*benchH)
	}
}

// BenchmarkPreviewRenderMesh is BenchmarkPreviewRender with a mesh prop:
// the pan body as a 201,600-triangle mesh (fixture.MeshPan(600, 24)) and
// its handle, onion skin three frames each side, so each redraw finds the
// contour of the mesh in seven poses (its creases come from the cached
// outline). Budget: 16 ms at 1280 x 800.
func BenchmarkPreviewRenderMesh(b *testing.B) {
	test.NewTempApp(b)
	sc, err := fixture.MeshPanScene(600, 24, fixture.ThreeSecondHang, 6, 1.5, 0)
	if err != nil {
		b.Fatal(err)
	}
	p := NewPreview()
	p.SetScene(sc)
	p.render(benchW, benchH)
	n := len(sc.Take.Frames)
	b.ReportMetric(float64(n), "frames")
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; b.Loop(); i++ {
		p.SetFrame(i % n)
		p.stale = true
		p.render(benchW, benchH)
	}
}
