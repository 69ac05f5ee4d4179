package wire_test

import (
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/internal/fixture"
	"propflight/physics"
	"propflight/physics/mesh"
	"propflight/widgets/wire"
)

// weldedBox is a box of half edges h as a welded mesh: 8 corners and 12
// triangles wound counter-clockwise seen from outside.
func weldedBox(h r3.Vec) ([]r3.Vec, [][3]int32) {
	var v []r3.Vec
	for i := range 8 {
		v = append(v, r3.Vec{X: h.X * sgn(i&1), Y: h.Y * sgn(i&2), Z: h.Z * sgn(i&4)})
	}
	// Corner i has x = +h where bit 0 is set, y where bit 1, z where bit 2.
	quads := [6][4]int32{
		{1, 3, 7, 5}, {0, 4, 6, 2}, // +x, -x
		{2, 6, 7, 3}, {0, 1, 5, 4}, // +y, -y
		{4, 5, 7, 6}, {0, 2, 3, 1}, // +z, -z
	}
	var t [][3]int32
	for _, q := range quads {
		t = append(t, [3]int32{q[0], q[1], q[2]}, [3]int32{q[0], q[2], q[3]})
	}
	return v, t
}

func sgn(bit int) float64 {
	if bit != 0 {
		return 1
	}
	return -1
}

// weldedCylinder is a solid n-sided prism of radius r and length l along
// z, welded: two rings, a centre on each cap, caps fanned from the centre.
func weldedCylinder(r, l float64, n int) ([]r3.Vec, [][3]int32) {
	var v []r3.Vec
	for i := range n {
		s, c := math.Sincos(2 * math.Pi * float64(i) / float64(n))
		v = append(v, r3.Vec{X: r * c, Y: r * s, Z: -l / 2}, r3.Vec{X: r * c, Y: r * s, Z: l / 2})
	}
	bc, tc := int32(2*n), int32(2*n+1)
	v = append(v, r3.Vec{Z: -l / 2}, r3.Vec{Z: l / 2})
	var t [][3]int32
	for i := range n {
		j := (i + 1) % n
		b0, t0, b1, t1 := int32(2*i), int32(2*i+1), int32(2*j), int32(2*j+1)
		t = append(t, [3]int32{b0, b1, t1}, [3]int32{b0, t1, t0})
		t = append(t, [3]int32{tc, t0, t1}, [3]int32{bc, b1, b0})
	}
	return v, t
}

// uvSphere is a welded latitude-longitude sphere of radius r: n segments
// round z, n/2 bands.
func uvSphere(r float64, n int) ([]r3.Vec, [][3]int32) {
	m := n / 2
	v := []r3.Vec{{Z: -r}}
	for j := 1; j < m; j++ {
		sp, cp := math.Sincos(-math.Pi/2 + math.Pi*float64(j)/float64(m))
		for i := range n {
			s, c := math.Sincos(2 * math.Pi * float64(i) / float64(n))
			v = append(v, r3.Vec{X: r * cp * c, Y: r * cp * s, Z: r * sp})
		}
	}
	v = append(v, r3.Vec{Z: r})
	north := int32(len(v) - 1)
	ring := func(j, i int) int32 { return int32(1 + (j-1)*n + i%n) }
	var t [][3]int32
	for i := range n {
		t = append(t, [3]int32{0, ring(1, i+1), ring(1, i)})
		for j := 1; j < m-1; j++ {
			t = append(t, [3]int32{ring(j, i), ring(j, i+1), ring(j+1, i+1)}, [3]int32{ring(j, i), ring(j+1, i+1), ring(j+1, i)})
		}
		t = append(t, [3]int32{ring(m-1, i), ring(m-1, i+1), north})
	}
	return v, t
}

// edgeFaces is the slow oracle: every undirected edge and the faces on it,
// by a map.
func edgeFaces(t [][3]int32) map[[2]int32][]int {
	out := map[[2]int32][]int{}
	for f, tr := range t {
		for k := range 3 {
			a, b := tr[k], tr[(k+1)%3]
			out[[2]int32{min(a, b), max(a, b)}] = append(out[[2]int32{min(a, b), max(a, b)}], f)
		}
	}
	return out
}

func faceNormal(v []r3.Vec, tr [3]int32) r3.Vec {
	return r3.Unit(r3.Cross(r3.Sub(v[tr[1]], v[tr[0]]), r3.Sub(v[tr[2]], v[tr[0]])))
}

func edgeSet(es [][2]int32) map[[2]int32]bool {
	out := map[[2]int32]bool{}
	for _, e := range es {
		out[[2]int32{min(e[0], e[1]), max(e[0], e[1])}] = true
	}
	return out
}

// TestOutline_Box: a box has exactly its 12 edges as creases (90 degrees);
// the six face diagonals are flat, so smooth, and never on the contour of
// a view (both their faces turn the same way).
func TestOutline_Box(t *testing.T) {
	v, tr := weldedBox(r3.Vec{X: 0.2, Y: 0.1, Z: 0.05})
	o := wire.NewOutline(v, tr, 0)
	if got := len(o.Creases()); got != 12 {
		t.Fatalf("box creases: %d, want 12", got)
	}
	for _, e := range o.Creases() {
		a, b := v[e[0]], v[e[1]]
		// A box edge changes exactly one coordinate.
		diff := 0
		for _, d := range []float64{a.X - b.X, a.Y - b.Y, a.Z - b.Z} {
			if d != 0 {
				diff++
			}
		}
		if diff != 1 {
			t.Errorf("crease %v-%v is not a box edge", a, b)
		}
	}
	if got := o.SmoothEdges(); got != 6 {
		t.Errorf("box smooth edges: %d, want the 6 face diagonals", got)
	}
	for _, view := range []r3.Vec{{X: 1, Y: 2, Z: 3}, {Z: 1}} {
		if c, _ := o.Contour(nil, view, true, nil); len(c) != 0 {
			t.Errorf("box contour from %v: %d smooth edges, want 0", view, len(c))
		}
	}
}

// TestOutline_Cylinder: a 32-sided cylinder (facets 11.25 degrees apart)
// has only its two rims as creases (the caps meet the side at 90 degrees);
// seen side on, its contour is two generators, the lines through the
// points of the rims that face neither toward nor away from the viewer.
func TestOutline_Cylinder(t *testing.T) {
	const n = 32
	v, tr := weldedCylinder(0.05, 0.3, n)
	o := wire.NewOutline(v, tr, 0)
	if got := len(o.Creases()); got != 2*n {
		t.Fatalf("cylinder creases: %d, want %d (two rims)", got, 2*n)
	}
	for _, e := range o.Creases() {
		if a, b := v[e[0]], v[e[1]]; a.Z != b.Z || math.Abs(math.Hypot(a.X, a.Y)-0.05) > 1e-12 {
			t.Errorf("crease %v-%v is not on a rim", a, b)
		}
	}
	// Viewed along +y (just off a vertex so no facet is edge-on), the
	// contour runs along the generators at x = +-r.
	c, _ := o.Contour(nil, r3.Vec{X: 0.01, Y: 1}, true, nil)
	if len(c) != 2 {
		t.Fatalf("side-on contour: %d edges, want 2 generators", len(c))
	}
	for _, e := range c {
		a, b := v[e[0]], v[e[1]]
		if a.X != b.X || a.Y != b.Y || math.Abs(math.Abs(a.X)-0.05) > 0.05*(1-math.Cos(math.Pi/n)) {
			t.Errorf("contour edge %v-%v is not a generator at x = +-r", a, b)
		}
	}
	// End on, the contour is the rim, already a crease: no smooth edge.
	if c, _ := o.Contour(nil, r3.Vec{Z: 1}, true, nil); len(c) != 0 {
		t.Errorf("end-on contour: %d smooth edges, want 0", len(c))
	}
	// A 12-sided prism (30 degrees) is smooth at 40 but all facets at 25.
	v12, t12 := weldedCylinder(0.05, 0.3, 12)
	if got := len(wire.NewOutline(v12, t12, 0).Creases()); got != 24 {
		t.Errorf("12-gon at the default angle: %d creases, want 24", got)
	}
	if got := len(wire.NewOutline(v12, t12, 25*math.Pi/180).Creases()); got != 36 {
		t.Errorf("12-gon at 25 degrees: %d creases, want 36 (rims and the 12 generators)", got)
	}
}

// TestOutline_ContourOracle_Pan: on the thin-walled pan body (sharp rim,
// smooth fillets, faces in patches that Contour decides as a whole) in
// random views from near and far, Contour equals the slow definition.
func TestOutline_ContourOracle_Pan(t *testing.T) {
	v, tr := fixture.PanBowl(96, 8)
	o := wire.NewOutline(v, tr, 0)
	ef := edgeFaces(tr)
	rng := rand.New(rand.NewPCG(1, 3))
	var front []bool
	for k := range 60 {
		d := r3.Unit(r3.Vec{X: rng.NormFloat64(), Y: rng.NormFloat64(), Z: rng.NormFloat64()})
		ortho := k%2 == 0
		view := d
		if !ortho {
			view = r3.Scale(0.05+3*rng.Float64(), d) // from inside the bowl's reach to 3 m
		}
		var got [][2]int32
		got, front = o.Contour(nil, view, ortho, front)
		faces := func(f int) bool {
			n := faceNormal(v, tr[f])
			if ortho {
				return r3.Dot(n, view) > 0
			}
			return r3.Dot(n, r3.Sub(view, v[tr[f][0]])) > 0
		}
		creases := edgeSet(o.Creases())
		want := map[[2]int32]bool{}
		for e, fs := range ef {
			if len(fs) == 2 && !creases[e] && faces(fs[0]) != faces(fs[1]) {
				want[e] = true
			}
		}
		gs := edgeSet(got)
		if len(gs) != len(got) || len(gs) != len(want) {
			t.Fatalf("view %v ortho %v: %d contour edges (%d distinct), want %d", view, ortho, len(got), len(gs), len(want))
		}
		for e := range want {
			if !gs[e] {
				t.Fatalf("view %v ortho %v: edge %v missing", view, ortho, e)
			}
		}
	}
}

// TestOutline_ContourOracle: on a sphere in random views, orthographic and
// perspective, Contour equals the slow definition (faces found by a map,
// facing tested per edge), and every contour edge lies near the circle
// where the view grazes the sphere.
func TestOutline_ContourOracle(t *testing.T) {
	const r = 0.1
	v, tr := uvSphere(r, 48)
	o := wire.NewOutline(v, tr, 0)
	if len(o.Creases()) != 0 {
		t.Fatalf("sphere: %d creases, want none", len(o.Creases()))
	}
	ef := edgeFaces(tr)
	rng := rand.New(rand.NewPCG(1, 1))
	var front []bool
	for range 20 {
		d := r3.Unit(r3.Vec{X: rng.NormFloat64(), Y: rng.NormFloat64(), Z: rng.NormFloat64()})
		for _, ortho := range []bool{true, false} {
			view := d
			if !ortho {
				view = r3.Scale(0.5+rng.Float64(), d) // eye 0.05 to 0.15 m outside
				view = r3.Scale(r+r3.Norm(view), r3.Unit(view))
			}
			var got [][2]int32
			got, front = o.Contour(nil, view, ortho, front)
			faces := func(f int) bool {
				n := faceNormal(v, tr[f])
				if ortho {
					return r3.Dot(n, view) > 0
				}
				return r3.Dot(n, r3.Sub(view, v[tr[f][0]])) > 0
			}
			want := map[[2]int32]bool{}
			for e, fs := range ef {
				if len(fs) == 2 && faces(fs[0]) != faces(fs[1]) {
					want[e] = true
				}
			}
			gs := edgeSet(got)
			if len(gs) != len(got) || len(gs) != len(want) {
				t.Fatalf("ortho %v: %d contour edges (%d distinct), want %d", ortho, len(got), len(gs), len(want))
			}
			for e := range want {
				if !gs[e] {
					t.Fatalf("ortho %v: edge %v missing from the contour", ortho, e)
				}
			}
			// The grazing circle: points p on the sphere with p . d = r^2/|eye|
			// (perspective) or 0 (orthographic); a contour edge is within
			// about a facet of it.
			g := 0.0
			if !ortho {
				g = r * r / r3.Norm(view)
			}
			facet := 2 * math.Pi * r / 48 * 1.5
			for _, e := range got {
				for _, p := range []r3.Vec{v[e[0]], v[e[1]]} {
					if math.Abs(r3.Dot(p, d)-g) > facet {
						t.Errorf("ortho %v: contour vertex %v is %.4f m off the grazing circle", ortho, p, r3.Dot(p, d)-g)
					}
				}
			}
		}
	}
}

// TestOutline_OpenAndNonManifold: a hole's rim (one face) and an edge with
// three faces are creases whatever the angle.
func TestOutline_OpenAndNonManifold(t *testing.T) {
	v, tr := weldedBox(r3.Vec{X: 1, Y: 1, Z: 1})
	open := tr[:10] // the -z face removed: its four edges have one face
	o := wire.NewOutline(v, open, 0)
	if got := len(o.Creases()); got != 12 {
		t.Errorf("open box: %d creases, want 12 (four of them the hole's rim)", got)
	}
	// A fin: a third triangle on the +x face's diagonal 1-7.
	v2 := append(append([]r3.Vec(nil), v...), r3.Vec{X: 3})
	fin := append(append([][3]int32(nil), tr...), [3]int32{1, 7, 8})
	o2 := wire.NewOutline(v2, fin, 0)
	cs := edgeSet(o2.Creases())
	if !cs[[2]int32{1, 7}] {
		t.Errorf("the edge with three faces is not a crease")
	}
	// Bad triangles (a repeated vertex, an index out of range) are left out.
	bad := append(append([][3]int32(nil), tr...), [3]int32{0, 0, 1}, [3]int32{0, 1, 99}, [3]int32{-1, 1, 2})
	if got := len(wire.NewOutline(v, bad, 0).Creases()); got != 12 {
		t.Errorf("box with bad triangles: %d creases, want 12", got)
	}
	if o := wire.NewOutline(nil, nil, 0); len(o.Creases()) != 0 || len(o.Extremes()) != 0 {
		t.Errorf("empty mesh: creases or extremes")
	}
}

// TestOutline_Extremes: the extreme points of a fine sphere bound it to
// within the lattice's angular gap in any direction.
func TestOutline_Extremes(t *testing.T) {
	v, tr := uvSphere(1, 64)
	o := wire.NewOutline(v, tr, 0)
	ex := o.Extremes()
	if len(ex) < 32 || len(ex) > 64 {
		t.Fatalf("%d extreme points, want 32 to 64", len(ex))
	}
	rng := rand.New(rand.NewPCG(1, 2))
	for range 200 {
		d := r3.Unit(r3.Vec{X: rng.NormFloat64(), Y: rng.NormFloat64(), Z: rng.NormFloat64()})
		best := math.Inf(-1)
		for _, i := range ex {
			best = math.Max(best, r3.Dot(o.Vertex(i), d))
		}
		// 64 lattice points leave gaps of under about 0.35 rad: cos 0.35 = 0.94.
		if best < 0.9 {
			t.Errorf("direction %v: extremes reach only %.3f of the radius", d, best)
		}
	}
}

// TestMeshOutline_Cached: the outline of a mesh is made once and handed
// back for the same mesh; another mesh gets its own.
func TestMeshOutline_Cached(t *testing.T) {
	v, tr := weldedBox(r3.Vec{X: 1, Y: 1, Z: 1})
	m1, m2 := &mesh.Mesh{V: v, T: tr}, &mesh.Mesh{V: v, T: tr}
	o1 := wire.MeshOutline(m1)
	if o1 == nil || len(o1.Creases()) != 12 {
		t.Fatalf("outline of the box mesh: %v", o1)
	}
	if wire.MeshOutline(m1) != o1 {
		t.Errorf("a second call made a new outline")
	}
	if wire.MeshOutline(m2) == o1 {
		t.Errorf("another mesh shares the first one's outline")
	}
	if wire.MeshOutline(nil) != nil {
		t.Errorf("nil mesh: want no outline")
	}
}

// TestOutline_Reach: the pruned search equals a scan of every vertex.
func TestOutline_Reach(t *testing.T) {
	v, tr := fixture.PanBowl(120, 6)
	o := wire.NewOutline(v, tr, 0)
	rng := rand.New(rand.NewPCG(2, 2))
	for range 50 {
		c := r3.Vec{X: 0.3 * rng.NormFloat64(), Y: 0.3 * rng.NormFloat64(), Z: 0.3 * rng.NormFloat64()}
		want := 0.0
		for _, p := range v {
			want = math.Max(want, r3.Norm(r3.Sub(p, c)))
		}
		if got := o.Reach(c); got != want {
			t.Errorf("Reach(%v) = %.17g, want %.17g", c, got, want)
		}
	}
}

// TestPrepareOutlines: after PrepareOutlines the mesh part's outline is
// the cached one Draw will use; primitives and a nil prop are passed over.
func TestPrepareOutlines(t *testing.T) {
	v, tr := weldedBox(r3.Vec{X: 1, Y: 1, Z: 1})
	m := &mesh.Mesh{V: v, T: tr}
	p := &physics.Prop{Parts: []physics.Part{{Shape: physics.Box, Size: r3.Vec{X: 1, Y: 1, Z: 1}}, {Shape: physics.MeshShape, Mesh: m}}}
	wire.PrepareOutlines(p)
	wire.PrepareOutlines(nil)
	if o := wire.MeshOutline(m); o == nil || len(o.Creases()) != 12 {
		t.Fatalf("outline %v", o)
	}
}
