package wire_test

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics"
	"propflight/physics/mesh"
	"propflight/widgets/wire"
)

// chainEdges returns the edges of every chain, in a set keyed low-high,
// and fails on an edge in two chains.
func chainEdges(t *testing.T, o *wire.Outline) map[[2]int32]bool {
	t.Helper()
	out := map[[2]int32]bool{}
	for c := range o.Chains() {
		ch := o.Chain(c)
		if len(ch) < 2 {
			t.Fatalf("chain %d has %d vertices", c, len(ch))
		}
		for i := 1; i < len(ch); i++ {
			k := [2]int32{min(ch[i-1], ch[i]), max(ch[i-1], ch[i])}
			if out[k] {
				t.Fatalf("edge %v in two chains", k)
			}
			out[k] = true
		}
	}
	return out
}

// TestOutline_Chains: every crease is in exactly one chain; a box's
// corners join three creases, so its chains are its 12 edges; a
// cylinder's two rims are two closed loops.
func TestOutline_Chains(t *testing.T) {
	v, tr := weldedBox(r3.Vec{X: 1, Y: 2, Z: 3})
	o := wire.NewOutline(v, tr, 0)
	if got := chainEdges(t, o); len(got) != 12 || o.Chains() != 12 {
		t.Errorf("box: %d chains covering %d edges, want 12 and 12", o.Chains(), len(got))
	}
	const n = 40
	cv, ct := weldedCylinder(0.05, 0.2, n)
	co := wire.NewOutline(cv, ct, 0)
	got := chainEdges(t, co)
	want := edgeSet(co.Creases())
	if len(got) != len(want) || co.Chains() != 2 {
		t.Fatalf("cylinder: %d chains covering %d edges; want 2 covering %d", co.Chains(), len(got), len(want))
	}
	for c := range 2 {
		if ch := co.Chain(c); len(ch) != n+1 || ch[0] != ch[n] {
			t.Errorf("rim chain %d: %d vertices, first %d last %d; want a closed loop of %d", c, len(ch), ch[0], ch[len(ch)-1], n)
		}
	}
}

// TestDraw_ChainsMergeWithinTolerance: a 512-sided disc's rims, seen end
// on and small, are drawn with far fewer segments than edges, and every
// rim vertex stays within the merge tolerance (0.2 px) of the lines.
func TestDraw_ChainsMergeWithinTolerance(t *testing.T) {
	const n = 512
	v, tr := weldedCylinder(0.05, 0.01, n)
	prop := &physics.Prop{Parts: []physics.Part{{Name: "disc", Shape: physics.MeshShape,
		Mesh: &mesh.Mesh{V: v, T: tr}, Mass: 0.2, Orient: physics.IdentityRotation()}}}
	mp, err := prop.MassProps()
	if err != nil {
		t.Fatal(err)
	}
	sc := wire.Scene{Prop: prop, Mass: &mp}
	cam := framedCamera(wire.Front, 200, 200, sc) // looks along -z: the rims are circles
	d := wire.Draw(cam, sc)
	segs := segmentsOf(d, wire.Part)
	if len(segs) == 0 || len(segs) > n/2 {
		t.Fatalf("%d segments for two rims of %d edges", len(segs), n)
	}
	for _, p := range v {
		if p.X == 0 && p.Y == 0 {
			continue // a cap's centre is no crease vertex
		}
		x, y, _ := cam.Project(p)
		best := math.Inf(1)
		for _, s := range segs {
			best = math.Min(best, distToSegment([2]float64{x, y}, s.A, s.B))
		}
		if best > 0.2+1e-9 {
			t.Errorf("rim vertex %v is %.3f px from the drawn lines", p, best)
		}
	}
}

func distToSegment(p, a, b [2]float64) float64 {
	dx, dy := b[0]-a[0], b[1]-a[1]
	t := ((p[0]-a[0])*dx + (p[1]-a[1])*dy) / (dx*dx + dy*dy)
	t = math.Max(0, math.Min(1, t))
	return math.Hypot(p[0]-a[0]-t*dx, p[1]-a[1]-t*dy)
}
