package wire_test

import (
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics"
	"propflight/widgets/wire"
)

// testParts has one part of every shape, with unequal sizes so that axis
// mix-ups show. Shell is meshed as its sphere and has no volume of its own.
func testParts() []physics.Part {
	id := physics.IdentityRotation()
	return []physics.Part{
		{Name: "box", Shape: physics.Box, Size: r3.Vec{X: 0.3, Y: 0.2, Z: 0.05}, Mass: 1, Orient: id},
		{Name: "cylinder", Shape: physics.Cylinder, Radius: 0.12, Length: 0.04, Mass: 1, Orient: id},
		{Name: "tube", Shape: physics.Tube, Radius: 0.05, InnerRadius: 0.035, Length: 0.3, Mass: 1, Orient: id},
		{Name: "sphere", Shape: physics.Sphere, Radius: 0.11, Mass: 1, Orient: id},
		{Name: "shell", Shape: physics.Shell, Radius: 0.09, Mass: 1, Orient: id},
		{Name: "ellipsoid", Shape: physics.Ellipsoid, SemiAxes: r3.Vec{X: 0.15, Y: 0.09, Z: 0.06}, Mass: 1, Orient: id},
		{Name: "cone", Shape: physics.Cone, Radius: 0.07, Height: 0.25, Mass: 1, Orient: id},
		{Name: "torus", Shape: physics.Torus, Radius: 0.2, TubeRadius: 0.04, Mass: 1, Orient: id},
	}
}

// meshVolume returns the volume enclosed by a closed, outward-wound mesh
// and its centroid, by the divergence theorem: V = (1/3) surface integral
// of x . n dA, which for flat triangles is the sum of the signed
// tetrahedra (origin, a, b, c), each a . (b x c) / 6, with centroid
// (a + b + c) / 4 (e.g. Zhang & Chen, "Efficient feature extraction for
// 2D/3D objects in mesh representation", ICIP 2001; from memory).
func meshVolume(m wire.Mesh) (float64, r3.Vec) {
	var v float64
	var c r3.Vec
	for _, t := range m.Triangles {
		a, b, d := m.Vertices[t[0]], m.Vertices[t[1]], m.Vertices[t[2]]
		tv := r3.Dot(a, r3.Cross(b, d)) / 6
		v += tv
		c = r3.Add(c, r3.Scale(tv/4, r3.Add(a, r3.Add(b, d))))
	}
	return v, r3.Scale(1/v, c)
}

// exactVolume is the solid's volume: physics' Part.Volume, whose formulas
// are the standard ones (box abc; cylinder pi r^2 l; tube pi (r^2 - ri^2) l;
// sphere and ellipsoid 4/3 pi abc; cone pi r^2 h / 3; CRC Standard
// Mathematical Tables and Formulae, 31st ed., solid geometry; torus
// 2 pi^2 R a^2 by Pappus's centroid theorem). A shell's mesh is its sphere.
func exactVolume(p *physics.Part) float64 {
	if p.Shape == physics.Shell {
		return 4 * math.Pi * p.Radius * p.Radius * p.Radius / 3
	}
	return p.Volume()
}

// TestPartMesh_VolumeConverges: the mesh is inscribed in the solid, so its
// volume falls short by the polygon error. An inscribed n-gon has area
// (n/2) r^2 sin(2 pi / n) = pi r^2 (1 - (2 pi/n)^2 / 6 + ...) (Taylor series
// of sin), so the relative error is O(n^-2): we check it is under
// 2 (2 pi / n)^2 and falls by about four each time n doubles.
func TestPartMesh_VolumeConverges(t *testing.T) {
	for _, p := range testParts() {
		want := exactVolume(&p)
		var prev float64
		for _, detail := range []int{8, 16, 32, 64, 128} {
			n := wire.Segments(detail)
			got, _ := meshVolume(wire.PartMesh(&p, detail))
			rel := math.Abs(got-want) / want
			if p.Shape == physics.Box {
				if rel > 1e-12 {
					t.Errorf("box: volume %g, want %g", got, want)
				}
				continue
			}
			if bound := 2 * math.Pow(2*math.Pi/float64(n), 2); rel > bound {
				t.Errorf("%s n=%d: volume %g vs %g, relative error %.3g over %.3g", p.Name, n, got, want, rel, bound)
			}
			if got > want {
				t.Errorf("%s n=%d: inscribed mesh volume %g exceeds the solid's %g", p.Name, n, got, want)
			}
			if prev > 0 && detail >= 32 {
				if r := rel / prev; r < 0.2 || r > 0.3 {
					t.Errorf("%s n=%d: error ratio on doubling %.3f, want about 1/4", p.Name, n, r)
				}
			}
			prev = rel
		}
	}
}

// TestPartMesh_PrismAndPyramidExact: the cylinder and tube meshes are
// prisms over inscribed regular n-gons and the cone mesh a pyramid over
// one, so their volumes are the solid's times the n-gon's area ratio
// (n / (2 pi)) sin(2 pi / n) exactly (prism: base area times length;
// pyramid: base area times height / 3).
func TestPartMesh_PrismAndPyramidExact(t *testing.T) {
	for _, p := range testParts() {
		if p.Shape != physics.Cylinder && p.Shape != physics.Tube && p.Shape != physics.Cone {
			continue
		}
		for _, detail := range []int{8, 20, 64} {
			n := float64(wire.Segments(detail))
			want := p.Volume() * n / (2 * math.Pi) * math.Sin(2*math.Pi/n)
			got, _ := meshVolume(wire.PartMesh(&p, detail))
			if math.Abs(got-want) > 1e-12*want {
				t.Errorf("%s n=%g: volume %.15g, n-gon prism/pyramid %.15g", p.Name, n, got, want)
			}
		}
	}
}

// TestPartMesh_CentroidAtCentreOfMass: the part frame's origin is the
// part's centre of mass. For the cone that needs the base at -h/4: a cone's
// (and any pyramid's) centroid is a quarter of the height above its base
// (Beer & Johnston, Vector Mechanics for Engineers: Statics, table of
// centroids of common volumes; from memory), which holds exactly for the
// polygonal cone too.
func TestPartMesh_CentroidAtCentreOfMass(t *testing.T) {
	for _, p := range testParts() {
		_, c := meshVolume(wire.PartMesh(&p, 24))
		if r3.Norm(c) > 1e-12 {
			t.Errorf("%s: mesh centroid %v, want the origin", p.Name, c)
		}
	}
}

// weld maps every vertex to the first vertex at the same position.
func weld(m wire.Mesh) []uint32 {
	first := map[r3.Vec]uint32{}
	out := make([]uint32, len(m.Vertices))
	for i, v := range m.Vertices {
		j, ok := first[v]
		if !ok {
			j = uint32(i)
			first[v] = j
		}
		out[i] = j
	}
	return out
}

// TestPartMesh_Closed: after welding equal positions each directed
// triangle edge appears exactly once and its reverse exactly once: the
// surface is closed and consistently wound. No triangle is degenerate.
func TestPartMesh_Closed(t *testing.T) {
	for _, p := range testParts() {
		for _, detail := range []int{8, 12, 33} {
			m := wire.PartMesh(&p, detail)
			w := weld(m)
			count := map[[2]uint32]int{}
			for _, tr := range m.Triangles {
				a, b, c := w[tr[0]], w[tr[1]], w[tr[2]]
				if a == b || b == c || a == c {
					t.Fatalf("%s: degenerate triangle %v", p.Name, tr)
				}
				count[[2]uint32{a, b}]++
				count[[2]uint32{b, c}]++
				count[[2]uint32{c, a}]++
			}
			for e, n := range count {
				if n != 1 || count[[2]uint32{e[1], e[0]}] != 1 {
					t.Fatalf("%s detail %d: edge %v used %d times, reverse %d times", p.Name, detail,
						e, n, count[[2]uint32{e[1], e[0]}])
				}
			}
		}
	}
}

// TestPartMesh_Normals: unit length, and on the outer side of every
// triangle they belong to (counter-clockwise from outside).
func TestPartMesh_Normals(t *testing.T) {
	for _, p := range testParts() {
		m := wire.PartMesh(&p, 16)
		if len(m.Normals) != len(m.Vertices) {
			t.Fatalf("%s: %d normals for %d vertices", p.Name, len(m.Normals), len(m.Vertices))
		}
		for i, n := range m.Normals {
			if math.Abs(r3.Norm(n)-1) > 1e-12 {
				t.Fatalf("%s: normal %d has length %g", p.Name, i, r3.Norm(n))
			}
		}
		for _, tr := range m.Triangles {
			a, b, c := m.Vertices[tr[0]], m.Vertices[tr[1]], m.Vertices[tr[2]]
			f := r3.Cross(r3.Sub(b, a), r3.Sub(c, a))
			for _, i := range tr {
				if r3.Dot(f, m.Normals[i]) <= 0 {
					t.Fatalf("%s: vertex normal %v points into the solid across triangle %v", p.Name, m.Normals[i], tr)
				}
			}
		}
	}
}

// TestPartMesh_InscribedInExactShape: physics' LocalSupport is the exact
// support function of each shape, so no mesh vertex may reach beyond it in
// any direction, and the mesh comes within the polygon error of it.
func TestPartMesh_InscribedInExactShape(t *testing.T) {
	rng := rand.New(rand.NewPCG(6, 6))
	for _, p := range testParts() {
		m := wire.PartMesh(&p, 32)
		n := float64(wire.Segments(32))
		for range 200 {
			u := r3.Unit(r3.Vec{X: rng.NormFloat64(), Y: rng.NormFloat64(), Z: rng.NormFloat64()})
			best := math.Inf(-1)
			for _, v := range m.Vertices {
				best = math.Max(best, r3.Dot(v, u))
			}
			s := p.LocalSupport(u)
			if best > s+1e-12 || best < s*(1-math.Pow(2*math.Pi/n, 2)) {
				t.Fatalf("%s: mesh support %g along %v, exact %g", p.Name, best, u, s)
			}
		}
	}
}

// TestPartMesh_Edges: wire edges are real mesh edges (they lie on the
// surface), are not repeated, and the box has exactly its twelve.
func TestPartMesh_Edges(t *testing.T) {
	for _, p := range testParts() {
		m := wire.PartMesh(&p, 16)
		w := weld(m)
		tri := map[[2]uint32]bool{}
		for _, tr := range m.Triangles {
			for k := range 3 {
				a, b := w[tr[k]], w[tr[(k+1)%3]]
				tri[[2]uint32{a, b}], tri[[2]uint32{b, a}] = true, true
			}
		}
		seen := map[[2]uint32]bool{}
		for _, e := range m.Edges {
			a, b := w[e[0]], w[e[1]]
			if !tri[[2]uint32{a, b}] {
				t.Fatalf("%s: wire edge %v is not an edge of the mesh", p.Name, e)
			}
			if seen[[2]uint32{a, b}] || seen[[2]uint32{b, a}] {
				t.Fatalf("%s: wire edge %v drawn twice", p.Name, e)
			}
			seen[[2]uint32{a, b}] = true
		}
		if len(m.Edges) == 0 {
			t.Errorf("%s: no wire edges", p.Name)
		}
		if p.Shape == physics.Box && len(m.Edges) != 12 {
			t.Errorf("box: %d wire edges, want 12", len(m.Edges))
		}
	}
}

// TestPartMesh_BadInput: nonsense sizes and an unknown shape must not
// panic; the unknown shape gives nothing.
func TestPartMesh_BadInput(t *testing.T) {
	for _, p := range []physics.Part{
		{Shape: physics.Cylinder, Radius: math.NaN(), Length: -1},
		{Shape: physics.Torus},
		{Shape: physics.Cone, Radius: 0, Height: 0},
		{Shape: physics.Ellipsoid},
	} {
		_ = wire.PartMesh(&p, -5)
	}
	if m := wire.PartMesh(&physics.Part{Shape: physics.Shape(99)}, 16); len(m.Vertices)+len(m.Triangles)+len(m.Edges) != 0 {
		t.Error("unknown shape gave a mesh")
	}
	if n := wire.Segments(1 << 30); n != wire.MaxDetail {
		t.Errorf("Segments(huge) = %d", n)
	}
	if n := wire.Segments(-3); n != wire.MinDetail {
		t.Errorf("Segments(-3) = %d", n)
	}
	if n := wire.Segments(13); n != 16 {
		t.Errorf("Segments(13) = %d, want 16 (a multiple of 4)", n)
	}
}

// TestPropMesh_PlacesParts: a part vertex v lands on Position +
// Orient.Rotate(v), computed here through the quaternion rather than the
// matrix PropMesh uses; normals turn with it.
func TestPropMesh_PlacesParts(t *testing.T) {
	parts := testParts()
	rng := rand.New(rand.NewPCG(7, 7))
	for i := range parts {
		parts[i].Position = r3.Vec{X: rng.NormFloat64(), Y: rng.NormFloat64(), Z: rng.NormFloat64()}
		parts[i].Orient = physics.EulerXYZ(rng.Float64()*6, rng.Float64()*6, rng.Float64()*6)
	}
	prop := &physics.Prop{Parts: parts}
	pm := wire.PropMesh(prop, 16)
	k := 0
	for i := range parts {
		m := wire.PartMesh(&parts[i], 16)
		for j, v := range m.Vertices {
			want := r3.Add(parts[i].Position, parts[i].Orient.Rotate(v))
			if d := r3.Norm(r3.Sub(pm.Vertices[k], want)); d > 1e-12 {
				t.Fatalf("part %s vertex %d: %v, want %v", parts[i].Name, j, pm.Vertices[k], want)
			}
			if d := r3.Norm(r3.Sub(pm.Normals[k], parts[i].Orient.Rotate(m.Normals[j]))); d > 1e-12 {
				t.Fatalf("part %s normal %d off by %g", parts[i].Name, j, d)
			}
			k++
		}
	}
	if k != len(pm.Vertices) {
		t.Fatalf("prop mesh has %d vertices, parts %d", len(pm.Vertices), k)
	}
	// Rotation and translation keep the volume.
	var sum float64
	for i := range parts {
		v, _ := meshVolume(wire.PartMesh(&parts[i], 16))
		sum += v
	}
	if v, _ := meshVolume(pm); math.Abs(v-sum) > 1e-12*sum {
		t.Errorf("prop mesh volume %g, parts add up to %g", v, sum)
	}
}
