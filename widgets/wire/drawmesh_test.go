package wire_test

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/internal/fixture"
	"propflight/physics"
	"propflight/physics/mesh"
	"propflight/widgets/wire"
)

// segKey is a segment's endpoints rounded to 1e-6 px, in a fixed order.
func segKey(s wire.Segment) [4]float64 {
	r := func(x float64) float64 { return math.Round(x*1e6) / 1e6 }
	a, b := [2]float64{r(s.A[0]), r(s.A[1])}, [2]float64{r(s.B[0]), r(s.B[1])}
	if a[0] > b[0] || (a[0] == b[0] && a[1] > b[1]) {
		a, b = b, a
	}
	return [4]float64{a[0], a[1], b[0], b[1]}
}

// TestDraw_MeshBoxEqualsBox: a box read as a 12-triangle mesh and placed
// anywhere draws the same lines as the box primitive (its 12 edges, no
// contour), with the same bounds and the same axes, in every view.
func TestDraw_MeshBoxEqualsBox(t *testing.T) {
	size := r3.Vec{X: 0.3, Y: 0.12, Z: 0.05}
	v, tr := weldedBox(r3.Scale(0.5, size))
	// The mesh's file origin sits off its centre: shift the vertices and
	// move the part back by as much.
	off := r3.Vec{X: 0.07, Y: -0.02, Z: 0.03}
	for i := range v {
		v[i] = r3.Add(v[i], off)
	}
	q := physics.EulerXYZ(0.4, -0.7, 1.1)
	pos := r3.Vec{X: 0.1, Y: 0.2, Z: -0.05}
	handle := physics.Part{Name: "handle", Shape: physics.Cylinder, Radius: 0.015, Length: 0.2, Mass: 0.1,
		Position: r3.Vec{X: 0.3}, Orient: physics.EulerXYZ(0, math.Pi/2, 0)}
	prim := &physics.Prop{Parts: []physics.Part{
		{Name: "box", Shape: physics.Box, Size: size, Mass: 1, Position: pos, Orient: q}, handle}}
	meshed := &physics.Prop{Parts: []physics.Part{
		{Name: "box", Shape: physics.MeshShape, Mesh: &mesh.Mesh{V: v, T: tr}, Mass: 1,
			Position: r3.Sub(pos, q.Rotate(off)), Orient: q}, handle}}
	mpA, err := prim.MassProps()
	if err != nil {
		t.Fatal(err)
	}
	mpB, err := meshed.MassProps()
	if err != nil {
		t.Fatal(err)
	}
	if d := r3.Norm(r3.Sub(mpA.CM, mpB.CM)); d > 1e-12 {
		t.Fatalf("centres of mass differ by %g m", d)
	}
	th := fixture.PanThrow(1.2, 2, 1.5)
	tk, err := physics.Simulate(prim, &mpA, &th)
	if err != nil {
		t.Fatal(err)
	}
	for _, view := range []wire.View{wire.Front, wire.Side, wire.Top, wire.Free} {
		scA := wire.Scene{Prop: prim, Mass: &mpA, Take: tk, Frame: 9, OnionBefore: 2, OnionAfter: 1, ShowAxes: true}
		scB := scA
		scB.Prop, scB.Mass = meshed, &mpB
		bA, bB := wire.Bounds(scA), wire.Bounds(scB)
		if r3.Norm(r3.Sub(bA.Min, bB.Min)) > 1e-9 || r3.Norm(r3.Sub(bA.Max, bB.Max)) > 1e-9 {
			t.Errorf("%v: bounds %v (box) and %v (mesh)", view, bA, bB)
		}
		cam := framedCamera(view, 640, 400, scA)
		dA, dB := wire.Draw(cam, scA), wire.Draw(cam, scB)
		count := map[[4]float64]int{}
		for _, s := range dA.Segments {
			if s.Kind == wire.Part || s.Kind == wire.Onion || s.Kind == wire.OnionAhead || s.Kind >= wire.AxisLeast && s.Kind <= wire.AxisGreatest {
				count[segKey(s)]++
			}
		}
		n := 0
		for _, s := range dB.Segments {
			if s.Kind == wire.Part || s.Kind == wire.Onion || s.Kind == wire.OnionAhead || s.Kind >= wire.AxisLeast && s.Kind <= wire.AxisGreatest {
				count[segKey(s)]--
				n++
			}
		}
		for k, c := range count {
			if c != 0 {
				t.Errorf("%v: segment %v drawn %d more times for the box than for the mesh", view, k, c)
			}
		}
		if n == 0 {
			t.Errorf("%v: nothing drawn", view)
		}
	}
	if a, b := wire.Radius(prim, &mpA, 0), wire.Radius(meshed, &mpB, 0); math.Abs(a-b) > 1e-12 {
		// The handle's tessellation is the same; the box's corners are its
		// farthest points either way.
		t.Errorf("radius %g (box), %g (mesh)", a, b)
	}
}

// TestDraw_MeshSphereContour: a smooth sphere mesh has no creases, so
// what Draw shows of it is its contour, which in an orthographic view is
// the sphere's outline circle: every endpoint lies on it to within the
// facets' sag, and the segments go all the way round.
func TestDraw_MeshSphereContour(t *testing.T) {
	const r, n = 0.1, 96
	v, tr := uvSphere(r, n)
	centre := r3.Vec{X: 0.02, Y: 1, Z: -0.03}
	prop := &physics.Prop{Parts: []physics.Part{{Name: "ball", Shape: physics.MeshShape,
		Mesh: &mesh.Mesh{V: v, T: tr}, Mass: 0.4, Position: centre, Orient: physics.EulerXYZ(0.3, 0.2, 0.1)}}}
	mp, err := prop.MassProps()
	if err != nil {
		t.Fatal(err)
	}
	sc := wire.Scene{Prop: prop, Mass: &mp}
	for _, view := range []wire.View{wire.Front, wire.Side, wire.Top} {
		cam := framedCamera(view, 400, 400, sc)
		d := wire.Draw(cam, sc)
		cx, cy, _ := cam.Project(mp.CM)
		right, _, _ := cam.Axes()
		ex, ey, _ := cam.Project(r3.Add(mp.CM, r3.Scale(r, right)))
		rad := math.Hypot(ex-cx, ey-cy)
		segs := segmentsOf(d, wire.Part)
		if len(segs) < n/2 {
			t.Fatalf("%v: %d contour segments, want a ring of about %d", view, len(segs), n)
		}
		var turn float64
		for _, s := range segs {
			for _, p := range [][2]float64{s.A, s.B} {
				// A facet lies inside the sphere by at most r (1 - cos(pi/n))
				// at the equator, 2 pi / n apart round a meridian.
				if d := math.Hypot(p[0]-cx, p[1]-cy) - rad; d > 1e-6 || d < -rad*(1-math.Cos(2*math.Pi/n))-1e-6 {
					t.Errorf("%v: contour point %.2f px off the outline", view, d)
				}
			}
			a0 := math.Atan2(s.A[1]-cy, s.A[0]-cx)
			a1 := math.Atan2(s.B[1]-cy, s.B[0]-cx)
			turn += math.Abs(math.Remainder(a1-a0, 2*math.Pi))
		}
		if turn < 2*math.Pi*0.99 {
			t.Errorf("%v: the contour goes round %.2f rad, want 2 pi", view, turn)
		}
	}
}

// TestDraw_MeshConcurrent: several goroutines drawing one mesh prop at
// once (the preview, a sheet and a PNG export can) share one cached
// outline and get the same drawing; run under -race this checks the cache
// and the outline's read-only use.
func TestDraw_MeshConcurrent(t *testing.T) {
	v, tr := fixture.PanBowl(64, 4)
	prop := &physics.Prop{Parts: []physics.Part{{Name: "pan", Shape: physics.MeshShape,
		Mesh: &mesh.Mesh{V: v, T: tr}, Mass: 0.8, Orient: physics.IdentityRotation()}}}
	mp, err := prop.MassProps()
	if err != nil {
		t.Fatal(err)
	}
	sc := wire.Scene{Prop: prop, Mass: &mp, ShowAxes: true}
	cam := framedCamera(wire.Free, 320, 240, sc)
	want := len(wire.Draw(cam, sc).Segments)
	// The same model as a fresh mesh, so that the goroutines race to make
	// its outline.
	fresh := *prop
	fresh.Parts = []physics.Part{prop.Parts[0]}
	fresh.Parts[0].Mesh = &mesh.Mesh{V: v, T: tr}
	sc2 := sc
	sc2.Prop = &fresh
	done := make(chan int)
	for range 4 {
		go func() { done <- len(wire.Draw(cam, sc2).Segments) }()
	}
	for range 4 {
		if got := <-done; got != want {
			t.Errorf("a concurrent drawing has %d segments, want %d", got, want)
		}
	}
}
