package wire_test

import (
	"math"
	"sort"
	"strconv"
	"strings"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/internal/fixture"
	"propflight/physics"
	"propflight/widgets/wire"
)

func segmentsOf(d wire.Drawing, k wire.Kind) []wire.Segment {
	var out []wire.Segment
	for _, s := range d.Segments {
		if s.Kind == k {
			out = append(out, s)
		}
	}
	return out
}

func near2(a, b [2]float64, tol float64) bool {
	return math.Abs(a[0]-b[0]) <= tol && math.Abs(a[1]-b[1]) <= tol
}

// placed is the slow placement oracle: the world position of prop-frame
// point p at take frame f, through quaternions, as the package doc states:
// CM + Orient.Rotate(p - mass.CM).
func placed(f *physics.Frame, mp *physics.MassProps, p r3.Vec) r3.Vec {
	return r3.Add(f.CM, f.Orient.Rotate(r3.Sub(p, mp.CM)))
}

// framedCamera frames the whole scene so nothing is cut at the image edge.
func framedCamera(v wire.View, w, h int, sc wire.Scene) wire.Camera {
	c := wire.NewCamera(v, w, h)
	c.Frame(wire.Bounds(sc))
	return c
}

// TestDraw_PartSegments_PlacedByTake: every Part segment is the projection
// of a wire edge of the prop placed at the current frame, computed here
// vertex by vertex from the part's own mesh with quaternions.
func TestDraw_PartSegments_PlacedByTake(t *testing.T) {
	for _, v := range []wire.View{wire.Front, wire.Free} {
		sc := fixture.PanScene(t, 1.2, 3.2, 1.5, 11)
		cam := framedCamera(v, 800, 500, sc)
		d := wire.Draw(cam, sc)
		f := &sc.Take.Frames[11]
		var want [][2][2]float64
		for i := range sc.Prop.Parts {
			pt := &sc.Prop.Parts[i]
			m := wire.PartMesh(pt, wire.DefaultDetail)
			for _, e := range m.Edges {
				var ends [2][2]float64
				for k, vi := range e {
					pp := r3.Add(pt.Position, pt.Orient.Rotate(m.Vertices[vi]))
					x, y, ok := cam.Project(placed(f, sc.Mass, pp))
					if !ok {
						t.Fatal("prop vertex behind the camera")
					}
					ends[k] = [2]float64{x, y}
				}
				want = append(want, ends)
			}
		}
		got := segmentsOf(d, wire.Part)
		if len(got) != len(want) {
			t.Fatalf("%v: %d part segments, want %d", v, len(got), len(want))
		}
		for i, s := range got {
			if !near2(s.A, want[i][0], 1e-6) || !near2(s.B, want[i][1], 1e-6) || s.Alpha != 1 {
				t.Fatalf("%v: part segment %d = %v-%v alpha %g, want %v-%v", v, i, s.A, s.B, s.Alpha, want[i][0], want[i][1])
			}
		}
	}
}

// TestDraw_NoTake_AuthoredPose: with no take the prop frame is the world:
// Part segments are the prop mesh's edges projected directly, the centre
// cross sits on the prop's centre of mass and there is no arc or onion.
func TestDraw_NoTake_AuthoredPose(t *testing.T) {
	p := fixture.FryingPan()
	sc := wire.Scene{Prop: p, OnionBefore: 3, OnionAfter: 3, ShowArc: true, ShowTicks: true, ShowAxes: true}
	cam := framedCamera(wire.Free, 640, 400, sc)
	d := wire.Draw(cam, sc)
	pm := wire.PropMesh(p, wire.DefaultDetail)
	got := segmentsOf(d, wire.Part)
	if len(got) != len(pm.Edges) {
		t.Fatalf("%d part segments, want %d", len(got), len(pm.Edges))
	}
	for i, e := range pm.Edges {
		x, y, _ := cam.Project(pm.Vertices[e[0]])
		if !near2(got[i].A, [2]float64{x, y}, 1e-6) {
			t.Fatalf("segment %d starts at %v, want (%g, %g)", i, got[i].A, x, y)
		}
	}
	for _, k := range []wire.Kind{wire.Arc, wire.Tick, wire.Onion, wire.OnionAhead} {
		if n := len(segmentsOf(d, k)); n != 0 {
			t.Errorf("%v: %d segments with no take", k, n)
		}
	}
	mp, _ := p.MassProps()
	cx, cy, _ := cam.Project(mp.CM)
	cross := segmentsOf(d, wire.Centre)
	if len(cross) != 2 || !near2([2]float64{(cross[0].A[0] + cross[0].B[0]) / 2, cross[0].A[1]}, [2]float64{cx, cy}, 1e-9) {
		t.Errorf("centre cross %v, want it on (%g, %g)", cross, cx, cy)
	}
}

// TestDraw_OnionSkin_FadesAway: N frames each side, faintest first, alpha
// OnionAlpha (N + 1 - k) / N at k frames away; frames past the take's ends
// are left out.
func TestDraw_OnionSkin_FadesAway(t *testing.T) {
	sc := fixture.PanScene(t, 1.2, 3.2, 1.5, 10)
	sc.OnionBefore, sc.OnionAfter = 3, 2
	d := wire.Draw(framedCamera(wire.Front, 640, 400, sc), sc)
	type group struct {
		k wire.Kind
		a float64
	}
	var order []group
	for _, s := range d.Segments {
		if s.Kind != wire.Onion && s.Kind != wire.OnionAhead {
			continue
		}
		if g := (group{s.Kind, s.Alpha}); len(order) == 0 || order[len(order)-1] != g {
			order = append(order, g)
		}
	}
	a := wire.OnionAlpha
	want := []group{{wire.Onion, a / 3}, {wire.Onion, a * 2 / 3}, {wire.OnionAhead, a / 2}, {wire.Onion, a}, {wire.OnionAhead, a}}
	if len(order) != len(want) {
		t.Fatalf("onion groups %v, want %v", order, want)
	}
	for i := range want {
		if order[i].k != want[i].k || math.Abs(order[i].a-want[i].a) > 1e-15 {
			t.Fatalf("onion groups %v, want %v", order, want)
		}
	}
	// At frame 1 only one frame exists before.
	sc.Frame = 1
	d = wire.Draw(framedCamera(wire.Front, 640, 400, sc), sc)
	alphas := map[float64]bool{}
	for _, s := range segmentsOf(d, wire.Onion) {
		alphas[s.Alpha] = true
	}
	if len(alphas) != 1 || !alphas[a] {
		t.Errorf("at frame 1 onion alphas %v, want only %g", alphas, a)
	}
}

// TestDraw_Arc_OnExactParabola: the arc's vertices lie on the throw's exact
// centre-of-mass parabola (physics Throw.CMAt) and it ends at the landing
// instant. In the front orthographic view screen x is linear in world x,
// which is linear in time, so each vertex's time is read back from its x.
func TestDraw_Arc_OnExactParabola(t *testing.T) {
	p := fixture.FryingPan()
	mp, _ := p.MassProps()
	th := fixture.PanThrow(1.2, 3.2, 1.5)
	tk, err := physics.Simulate(p, &mp, &th)
	if err != nil {
		t.Fatal(err)
	}
	sc := wire.Scene{Prop: p, Mass: &mp, Take: tk, ShowArc: true}
	cam := framedCamera(wire.Front, 900, 600, sc)
	d := wire.Draw(cam, sc)
	arc := segmentsOf(d, wire.Arc)
	n := len(tk.Frames)
	if min := (n - 1) * wire.ArcSteps; len(arc) < min {
		t.Fatalf("%d arc segments, want at least %d", len(arc), min)
	}
	x0, _, _ := cam.Project(th.CMAt(0))
	x1, _, _ := cam.Project(th.CMAt(1))
	for i, s := range arc {
		for _, e := range [2][2]float64{s.A, s.B} {
			tm := (e[0] - x0) / (x1 - x0)
			_, y, _ := cam.Project(th.CMAt(tm))
			if math.Abs(y-e[1]) > 1e-6 {
				t.Fatalf("arc segment %d end %v is %g px off the parabola at t = %g", i, e, y-e[1], tm)
			}
		}
		if i > 0 && !near2(arc[i-1].B, s.A, 1e-12) {
			t.Fatalf("arc broken between segments %d and %d", i-1, i)
		}
	}
	ex, ey, _ := cam.Project(th.CMAt(tk.FlightTime))
	if last := arc[len(arc)-1].B; !near2(last, [2]float64{ex, ey}, 1e-6) {
		t.Errorf("arc ends at %v, landing centre of mass at (%g, %g)", last, ex, ey)
	}
}

// TestDraw_Ticks_OnePerFrameAcrossArc: one tick per frame, centred on the
// projected centre of mass and square to the arc there; key ticks longer;
// frame numbers at release, apex and the last frame. In the orthographic
// front view the arc is a parabola in time, whose chord between the frames
// either side is parallel to its tangent at the frame (the velocity is
// linear in time), so the chord tells "square to the arc" exactly.
func TestDraw_Ticks_OnePerFrameAcrossArc(t *testing.T) {
	sc := fixture.PanScene(t, 1.2, 3.2, 1.5, 5)
	sc.OnionBefore, sc.OnionAfter = 0, 0
	cam := framedCamera(wire.Front, 900, 600, sc)
	d := wire.Draw(cam, sc)
	ticks := segmentsOf(d, wire.Tick)
	fr := sc.Take.Frames
	if len(ticks) != len(fr) {
		t.Fatalf("%d ticks for %d frames", len(ticks), len(fr))
	}
	last := len(fr) - 1
	for i, s := range ticks {
		x, y, _ := cam.Project(fr[i].CM)
		mid := [2]float64{(s.A[0] + s.B[0]) / 2, (s.A[1] + s.B[1]) / 2}
		if !near2(mid, [2]float64{x, y}, 1e-9) {
			t.Fatalf("tick %d centred at %v, centre of mass at (%g, %g)", i, mid, x, y)
		}
		half := math.Hypot(s.B[0]-s.A[0], s.B[1]-s.A[1]) / 2
		want := wire.TickHalf
		if i == 0 || i == sc.Take.ApexFrame || i == last || i == sc.Frame {
			want = wire.KeyTickHalf
		}
		if math.Abs(half-want) > 1e-9 {
			t.Errorf("tick %d half length %g, want %g", i, half, want)
		}
		if i > 0 && i < last {
			ax, ay, _ := cam.Project(fr[i-1].CM)
			bx, by, _ := cam.Project(fr[i+1].CM)
			chord := [2]float64{bx - ax, by - ay}
			if dot := (s.B[0]-s.A[0])*chord[0] + (s.B[1]-s.A[1])*chord[1]; math.Abs(dot) > 1e-6*math.Hypot(chord[0], chord[1]) {
				t.Errorf("tick %d not square to the arc (dot %g)", i, dot)
			}
		}
	}
	texts := map[string]bool{}
	for _, l := range d.Labels {
		if l.Kind == wire.Tick {
			texts[l.Text] = true
		}
	}
	for _, n := range []int{0, sc.Take.ApexFrame, last} {
		if !texts[strconv.Itoa(n)] {
			t.Errorf("no frame label %d among %v", n, texts)
		}
	}
}

// TestDraw_Axes_FromCentreOfMass: three axis segments from the projected
// centre of mass along the principal axes turned by the frame's
// orientation, labelled least, middle, greatest.
func TestDraw_Axes_FromCentreOfMass(t *testing.T) {
	sc := fixture.PanScene(t, 1.2, 3.2, 1.5, 9)
	cam := framedCamera(wire.Free, 800, 500, sc)
	d := wire.Draw(cam, sc)
	f := &sc.Take.Frames[9]
	cx, cy, _ := cam.Project(f.CM)
	names := [3]string{"least", "middle", "greatest"}
	for i, k := range []wire.Kind{wire.AxisLeast, wire.AxisMiddle, wire.AxisGreatest} {
		s := segmentsOf(d, k)
		if len(s) != 1 {
			t.Fatalf("%v: %d segments", k, len(s))
		}
		if !near2(s[0].A, [2]float64{cx, cy}, 1e-9) {
			t.Errorf("%v starts at %v, centre of mass at (%g, %g)", k, s[0].A, cx, cy)
		}
		// The tip lies on the projection of the world axis direction.
		ax, ay, _ := cam.Project(r3.Add(f.CM, r3.Scale(0.01, f.Orient.Rotate(sc.Mass.Axes[i]))))
		u := [2]float64{ax - cx, ay - cy}
		v := [2]float64{s[0].B[0] - cx, s[0].B[1] - cy}
		if c := u[0]*v[1] - u[1]*v[0]; math.Abs(c) > 1e-6*math.Hypot(u[0], u[1])*math.Hypot(v[0], v[1]) || u[0]*v[0]+u[1]*v[1] < 0 {
			t.Errorf("%v points along %v, want along %v", k, v, u)
		}
		found := false
		for _, l := range d.Labels {
			found = found || (l.Kind == k && l.Text == names[i])
		}
		if !found {
			t.Errorf("no %q label", names[i])
		}
	}
}

// TestDraw_Grid_TopViewSquare: seen from the top the grid is evenly spaced
// horizontal and vertical lines.
func TestDraw_Grid_TopViewSquare(t *testing.T) {
	sc := fixture.PanScene(t, 1.2, 3.2, 1.5, 5)
	d := wire.Draw(framedCamera(wire.Top, 800, 800, sc), sc)
	grid := segmentsOf(d, wire.Grid)
	if len(grid) < 8 {
		t.Fatalf("%d grid lines", len(grid))
	}
	var xs []float64
	for _, s := range grid {
		horiz := math.Abs(s.A[1]-s.B[1]) < 1e-9
		vert := math.Abs(s.A[0]-s.B[0]) < 1e-9
		if !horiz && !vert {
			t.Fatalf("grid line %v-%v is slanted in the top view", s.A, s.B)
		}
		if vert {
			xs = append(xs, s.A[0])
		}
	}
	sort.Float64s(xs)
	step := math.Inf(1)
	for i := 1; i < len(xs); i++ {
		step = math.Min(step, xs[i]-xs[i-1])
	}
	// Neighbours are one spacing apart, or two across the world axis,
	// which is drawn as Ground instead.
	for i := 1; i < len(xs); i++ {
		m := (xs[i] - xs[i-1]) / step
		if math.Abs(m-math.Round(m)) > 1e-6 || math.Round(m) > 2 {
			t.Errorf("grid lines at %g and %g: %g spacings apart", xs[i-1], xs[i], m)
		}
	}
}

// TestDraw_SegmentsStayNearImage: every segment is clipped to a few pixels
// around the image, even with the camera inside the scene.
func TestDraw_SegmentsStayNearImage(t *testing.T) {
	sc := fixture.PanScene(t, 1.2, 3.2, 1.5, 12)
	cam := wire.NewCamera(wire.Free, 400, 300)
	cam.Target = sc.Take.Frames[12].CM
	cam.Distance = 0.15 // inside the arc's span, near the prop
	d := wire.Draw(cam, sc)
	if len(d.Segments) == 0 {
		t.Fatal("nothing drawn")
	}
	const pad = 4 + 1e-9
	for _, s := range d.Segments {
		for _, e := range [2][2]float64{s.A, s.B} {
			if e[0] < -pad || e[0] > 400+pad || e[1] < -pad || e[1] > 300+pad || math.IsNaN(e[0]+e[1]) {
				t.Fatalf("%v segment end %v outside the image", s.Kind, e)
			}
		}
	}
}

// TestDraw_BadProp_NoteNotPanic: a prop whose mass properties fail is left
// out with a Note naming the field.
func TestDraw_BadProp_NoteNotPanic(t *testing.T) {
	p := &physics.Prop{Parts: []physics.Part{{Shape: physics.Cylinder, Radius: -1, Length: 0.1, Mass: 1}}}
	d := wire.Draw(wire.NewCamera(wire.Free, 200, 100), wire.Scene{Prop: p, ShowGrid: true, ShowAxes: true})
	if n := len(segmentsOf(d, wire.Part)); n != 0 {
		t.Errorf("%d part segments of a bad prop", n)
	}
	if len(d.Labels) == 0 || d.Labels[0].Kind != wire.Note || !strings.Contains(d.Labels[0].Text, "parts[0].radius") {
		t.Errorf("labels %v, want a note naming parts[0].radius", d.Labels)
	}
	// Nothing at all is fine too.
	_ = wire.Draw(wire.NewCamera(wire.Front, 0, 0), wire.Scene{ShowGrid: true, ShowArc: true})
}
