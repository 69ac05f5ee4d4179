package wire_test

import (
	"gonum.org/v1/gonum/spatial/r3"
	"image"
	"propflight/internal/fixture"
	"testing"

	"propflight/physics"
	"propflight/widgets/wire"
)

// throw3s is the benchmark's take: the pan thrown 4.5 m with a 2.9 s hang
// from 1.4 m, spinning 2 turns a second near its middle axis, which lands
// at about 3 s (72 frames at 24 fps).
func throw3s(b *testing.B) (*physics.Prop, physics.MassProps, physics.Throw) {
	p := fixture.FryingPan()
	mp, err := p.MassProps()
	if err != nil {
		b.Fatal(err)
	}
	return p, mp, fixture.PanThrow(2.9, 4.5, 2)
}

// BenchmarkDrawRasterize1280x800 is the preview's whole redraw after an
// edit: simulate the 3 s throw, draw it with onion skin +-3, arc, ticks,
// axes and grid, and rasterise into a reused 1280 x 800 image.
func BenchmarkDrawRasterize1280x800(b *testing.B) {
	p, mp, th := throw3s(b)
	cam := wire.NewCamera(wire.Free, 1280, 800)
	dst := image.NewRGBA(image.Rect(0, 0, 1280, 800))
	pal := wire.DefaultPalette()
	var tk *physics.Take
	for b.Loop() {
		var err error
		tk, err = physics.Simulate(p, &mp, &th)
		if err != nil {
			b.Fatal(err)
		}
		sc := wire.Scene{Prop: p, Mass: &mp, Take: tk, Frame: tk.ApexFrame, OnionBefore: 3, OnionAfter: 3,
			ShowArc: true, ShowTicks: true, ShowAxes: true, ShowGrid: true}
		cam.Frame(wire.Bounds(sc))
		wire.RasterizeInto(dst, wire.Draw(cam, sc), pal)
	}
	b.ReportMetric(tk.FlightTime, "flight_s")
	b.ReportMetric(float64(len(tk.Frames)), "frames")
}

// The parts of the redraw one by one.

func BenchmarkSimulate3s(b *testing.B) {
	p, mp, th := throw3s(b)
	for b.Loop() {
		if _, err := physics.Simulate(p, &mp, &th); err != nil {
			b.Fatal(err)
		}
	}
}

func scene3s(b *testing.B) (wire.Camera, wire.Scene) {
	p, mp, th := throw3s(b)
	tk, err := physics.Simulate(p, &mp, &th)
	if err != nil {
		b.Fatal(err)
	}
	sc := wire.Scene{Prop: p, Mass: &mp, Take: tk, Frame: tk.ApexFrame, OnionBefore: 3, OnionAfter: 3,
		ShowArc: true, ShowTicks: true, ShowAxes: true, ShowGrid: true}
	cam := wire.NewCamera(wire.Free, 1280, 800)
	cam.Frame(wire.Bounds(sc))
	return cam, sc
}

func BenchmarkDraw1280x800(b *testing.B) {
	cam, sc := scene3s(b)
	var n int
	for b.Loop() {
		n = len(wire.Draw(cam, sc).Segments)
	}
	b.ReportMetric(float64(n), "segments")
}

func BenchmarkRasterize1280x800(b *testing.B) {
	cam, sc := scene3s(b)
	d := wire.Draw(cam, sc)
	dst := image.NewRGBA(image.Rect(0, 0, 1280, 800))
	pal := wire.DefaultPalette()
	for b.Loop() {
		wire.RasterizeInto(dst, d, pal)
	}
}

// BenchmarkPartMesh meshes one part of every shape at the default detail.
func BenchmarkPartMesh(b *testing.B) {
	parts := testParts()
	for b.Loop() {
		for i := range parts {
			_ = wire.PartMesh(&parts[i], wire.DefaultDetail)
		}
	}
}

// BenchmarkNewOutline prepares the outline of a 201,600-triangle pan body
// (fixture.PanBowl(600, 24)): done once per mesh.
func BenchmarkNewOutline(b *testing.B) {
	v, t := fixture.PanBowl(600, 24)
	b.ReportMetric(float64(len(t)), "triangles")
	for b.Loop() {
		_ = wire.NewOutline(v, t, 0)
	}
}

// BenchmarkContour is the per-pose work on the same mesh: one facing pass
// over the faces and one over the smooth edges, perspective.
func BenchmarkContour(b *testing.B) {
	v, t := fixture.PanBowl(600, 24)
	o := wire.NewOutline(v, t, 0)
	var dst [][2]int32
	var front []bool
	eye := r3.Vec{X: 0.4, Y: 0.5, Z: 0.9}
	for b.Loop() {
		dst, front = o.Contour(dst[:0], eye, false, front)
	}
	b.ReportMetric(float64(len(dst)), "contour_edges")
	b.ReportMetric(float64(len(o.Creases())), "creases")
}

// BenchmarkDrawRasterizeMesh1280x800 is BenchmarkDrawRasterize1280x800's
// drawing without the simulation, for the 201,600-triangle mesh pan
// (fixture.MeshPanScene): Draw with onion skin +-3, arc, ticks, axes and
// grid, then rasterise into a reused 1280 x 800 image. The outline is
// made once, before the timer.
func BenchmarkDrawRasterizeMesh1280x800(b *testing.B) {
	sc, err := fixture.MeshPanScene(600, 24, 2.9, 4.5, 2, 0)
	if err != nil {
		b.Fatal(err)
	}
	sc.Frame = sc.Take.ApexFrame
	cam := wire.NewCamera(wire.Free, 1280, 800)
	cam.Frame(wire.Bounds(sc))
	dst := image.NewRGBA(image.Rect(0, 0, 1280, 800))
	pal := wire.DefaultPalette()
	var n int
	b.ReportAllocs()
	for b.Loop() {
		d := wire.Draw(cam, sc)
		n = len(d.Segments)
		wire.RasterizeInto(dst, d, pal)
	}
	b.ReportMetric(float64(n), "segments")
}
