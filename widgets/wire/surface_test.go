package wire_test

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/widgets/wire"
)

// TestSurface_Box: a box's corners split three ways (one copy per face, 24
// vertices), every normal is its face's, the volume is kept and the 12
// edges are the wire.
func TestSurface_Box(t *testing.T) {
	h := r3.Vec{X: 0.2, Y: 0.1, Z: 0.05}
	v, tr := weldedBox(h)
	m := wire.Surface(v, tr, 0)
	if len(m.Vertices) != 24 || len(m.Triangles) != 12 || len(m.Edges) != 12 {
		t.Fatalf("box surface: %d vertices, %d triangles, %d edges; want 24, 12, 12", len(m.Vertices), len(m.Triangles), len(m.Edges))
	}
	for _, tri := range m.Triangles {
		a, b, c := m.Vertices[tri[0]], m.Vertices[tri[1]], m.Vertices[tri[2]]
		face := r3.Unit(r3.Cross(r3.Sub(b, a), r3.Sub(c, a)))
		for _, i := range tri {
			if d := r3.Norm(r3.Sub(m.Normals[i], face)); d > 1e-15 {
				t.Errorf("corner normal %v, face normal %v", m.Normals[i], face)
			}
		}
	}
	// Box volume 8 h.x h.y h.z (CRC Standard Mathematical Tables, solid geometry).
	vol, _ := meshVolume(m)
	if want := 8 * h.X * h.Y * h.Z; math.Abs(vol-want) > 1e-15 {
		t.Errorf("volume %g, want %g", vol, want)
	}
}

// TestSurface_Sphere: a smooth sphere keeps one copy per vertex, and each
// normal is within a facet's angle of the radial direction (the exact
// sphere normal).
func TestSurface_Sphere(t *testing.T) {
	const n = 48
	v, tr := uvSphere(0.1, n)
	m := wire.Surface(v, tr, 0)
	if len(m.Vertices) != len(v) || len(m.Triangles) != len(tr) || len(m.Edges) != 0 {
		t.Fatalf("sphere surface: %d vertices, %d triangles, %d edges; want %d, %d, 0", len(m.Vertices), len(m.Triangles), len(m.Edges), len(v), len(tr))
	}
	facet := 2 * math.Pi / n
	for i, p := range m.Vertices {
		if a := math.Acos(math.Min(1, r3.Dot(m.Normals[i], r3.Unit(p)))); a > facet/2 {
			t.Errorf("vertex %v: normal %.3f rad off radial", p, a)
		}
	}
	// The cylinder: rims split (side and cap copies), generators smooth.
	cv, ct := weldedCylinder(0.05, 0.3, 32)
	cm := wire.Surface(cv, ct, 0)
	// Each of the 64 rim vertices has a side copy and a cap copy; the two
	// cap centres one each.
	if len(cm.Vertices) != 2*64+2 {
		t.Errorf("cylinder surface: %d vertices, want %d", len(cm.Vertices), 2*64+2)
	}
	for i, p := range cm.Vertices {
		nr := cm.Normals[i]
		side := r3.Unit(r3.Vec{X: p.X, Y: p.Y})
		if math.Abs(math.Abs(nr.Z)-1) > 1e-12 && r3.Norm(r3.Sub(nr, side)) > 1e-12 {
			t.Errorf("cylinder vertex %v: normal %v is neither the cap's nor radial", p, nr)
		}
	}
}
