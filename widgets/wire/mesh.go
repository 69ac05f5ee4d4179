package wire

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics"
)

// Mesh is a triangle mesh with a wireframe, in metres.
//
// Triangles wind counter-clockwise seen from outside, so (b-a) x (c-a)
// points out of the solid, and together they close the surface: after
// welding vertices at equal positions every edge is shared by exactly two
// triangles that run it in opposite directions. A position repeats where a
// surface has a crease (box edges, cylinder rims, the cone's apex), because
// each copy carries the normal of its own face, as glTF 2.0 expects.
//
// Normals are unit outward surface normals, one per vertex. Edges are the
// lines of the wireframe: the creases plus a few rings and generators (and
// one spoke on each flat end of a round part, so that a turn about its axis
// shows), never every triangle edge.
type Mesh struct {
	Vertices  []r3.Vec
	Normals   []r3.Vec
	Triangles [][3]uint32
	Edges     [][2]uint32
}

// Detail limits: PartMesh's detail is the number of segments around a full
// circle, raised to MinDetail, capped at MaxDetail and rounded up to a
// multiple of 4 so that the quarter-turn rings and generators fall on
// vertices.
const (
	MinDetail     = 8
	MaxDetail     = 256
	DefaultDetail = 32
)

// Segments returns the number of segments around a full circle that
// PartMesh uses for detail.
func Segments(detail int) int {
	n := min(max(detail, MinDetail), MaxDetail)
	return (n + 3) / 4 * 4
}

// PartMesh returns the mesh of one part in the part's own frame: origin at
// the part's centre of mass, axes those of the part (the axis of a
// cylinder, tube, cone or torus is z). The cone's apex is at z = 3h/4 and
// its base at z = -h/4; a box's Size is its full edges; an ellipsoid's
// SemiAxes lie along x, y, z; a shell is meshed as its sphere; a tube with
// no inner radius is a cylinder. detail is the number of segments around a
// full circle (see Segments). A mesh part is its own triangles in the
// file's frame (its origin is the file's, not the centre of mass), with
// // normals and edges by Surface; detail does not apply. A part with bad
// fields gives a mesh of its (possibly meaningless) numbers, and an
// unknown shape an empty mesh.
func PartMesh(p *physics.Part, detail int) Mesh {
	n := Segments(detail)
	var b meshBuilder
	switch p.Shape {
	case physics.Box:
		b.box(p.Size)
	case physics.Cylinder:
		b.cylinder(p.Radius, p.Length, n)
	case physics.Tube:
		if p.InnerRadius > 0 {
			b.tube(p.Radius, p.InnerRadius, p.Length, n)
		} else {
			b.cylinder(p.Radius, p.Length, n)
		}
	case physics.Sphere, physics.Shell:
		b.ellipsoid(r3.Vec{X: p.Radius, Y: p.Radius, Z: p.Radius}, n)
	case physics.Ellipsoid:
		b.ellipsoid(p.SemiAxes, n)
	case physics.Cone:
		b.cone(p.Radius, p.Height, n)
	case physics.Torus:
		b.torus(p.Radius, p.TubeRadius, n)
	case physics.MeshShape:
		if p.Mesh != nil {
			return Surface(p.Mesh.V, p.Mesh.T, CreaseAngle)
		}
	}
	return b.m
}

// PropMesh returns the meshes of all the prop's parts placed in the prop
// frame: a part vertex v goes to Position + Orient.Rotate(v) and its normal
// is turned by Orient. Parts keep their order; their triangles and edges
// index into the one vertex list.
func PropMesh(p *physics.Prop, detail int) Mesh {
	var out Mesh
	for i := range p.Parts {
		pt := &p.Parts[i]
		m := PartMesh(pt, detail)
		q := pt.Orient.Normalize()
		r := q.Mat()
		base := uint32(len(out.Vertices))
		for j, v := range m.Vertices {
			out.Vertices = append(out.Vertices, r3.Add(pt.Position, r.MulVec(v)))
			out.Normals = append(out.Normals, r.MulVec(m.Normals[j]))
		}
		for _, t := range m.Triangles {
			out.Triangles = append(out.Triangles, [3]uint32{t[0] + base, t[1] + base, t[2] + base})
		}
		for _, e := range m.Edges {
			out.Edges = append(out.Edges, [2]uint32{e[0] + base, e[1] + base})
		}
	}
	return out
}

// meshBuilder appends vertices, triangles and edges to a Mesh.
type meshBuilder struct{ m Mesh }

func (b *meshBuilder) vert(p, n r3.Vec) uint32 {
	b.m.Vertices = append(b.m.Vertices, p)
	b.m.Normals = append(b.m.Normals, n)
	return uint32(len(b.m.Vertices) - 1)
}

// tri adds a triangle; a, b, c must run counter-clockwise seen from outside.
func (b *meshBuilder) tri(i, j, k uint32) { b.m.Triangles = append(b.m.Triangles, [3]uint32{i, j, k}) }

// quad adds the quadrilateral a b c d (counter-clockwise from outside) as
// two triangles.
func (b *meshBuilder) quad(i, j, k, l uint32) {
	b.tri(i, j, k)
	b.tri(i, k, l)
}

func (b *meshBuilder) edge(i, j uint32) { b.m.Edges = append(b.m.Edges, [2]uint32{i, j}) }

// circle returns cos and sin of the n equal angles 2 pi i / n.
func circle(n int) (cs, sn []float64) {
	cs, sn = make([]float64, n), make([]float64, n)
	for i := range n {
		sn[i], cs[i] = math.Sincos(2 * math.Pi * float64(i) / float64(n))
	}
	return cs, sn
}

// box meshes a box of full edges size centred on the origin: four vertices
// per face (flat normals) and the twelve edges.
func (b *meshBuilder) box(size r3.Vec) {
	h := r3.Scale(0.5, size)
	x, y, z := r3.Vec{X: 1}, r3.Vec{Y: 1}, r3.Vec{Z: 1}
	// Each face: outward normal n and tangents s, t with s x t = n, so the
	// corners (-,-), (+,-), (+,+), (-,+) in (s, t) run counter-clockwise.
	faces := [6][3]r3.Vec{
		{x, y, z}, {r3.Scale(-1, x), z, y},
		{y, z, x}, {r3.Scale(-1, y), x, z},
		{z, x, y}, {r3.Scale(-1, z), y, x},
	}
	half := func(u r3.Vec) float64 { return math.Abs(u.X)*h.X + math.Abs(u.Y)*h.Y + math.Abs(u.Z)*h.Z }
	type key struct{ a, b [3]float64 }
	seen := map[key]bool{}
	pos := func(v r3.Vec) [3]float64 { return [3]float64{v.X, v.Y, v.Z} }
	for _, f := range faces {
		n, s, t := f[0], f[1], f[2]
		c := r3.Scale(half(n), n)
		hs, ht := half(s), half(t)
		var idx [4]uint32
		for k, sg := range [4][2]float64{{-1, -1}, {1, -1}, {1, 1}, {-1, 1}} {
			p := r3.Add(c, r3.Add(r3.Scale(sg[0]*hs, s), r3.Scale(sg[1]*ht, t)))
			idx[k] = b.vert(p, n)
		}
		b.quad(idx[0], idx[1], idx[2], idx[3])
		// Each box edge borders two faces: draw it once.
		for k := range 4 {
			i, j := idx[k], idx[(k+1)%4]
			pi, pj := pos(b.m.Vertices[i]), pos(b.m.Vertices[j])
			if seen[key{pi, pj}] || seen[key{pj, pi}] {
				continue
			}
			seen[key{pi, pj}] = true
			b.edge(i, j)
		}
	}
}

// quarters are the four segment indices at quarter turns for n segments.
func quarters(n int) [4]int { return [4]int{0, n / 4, n / 2, 3 * n / 4} }

// cylinder meshes a solid cylinder of radius r and length l along z: a side
// of n quads with radial normals and two flat caps fanned from their
// centres. Wire: both rims, four generators and a spoke on each cap.
func (b *meshBuilder) cylinder(r, l float64, n int) {
	cs, sn := circle(n)
	hl := l / 2
	bot, top := make([]uint32, n), make([]uint32, n)
	for i := range n {
		nr := r3.Vec{X: cs[i], Y: sn[i]}
		bot[i] = b.vert(r3.Vec{X: r * cs[i], Y: r * sn[i], Z: -hl}, nr)
		top[i] = b.vert(r3.Vec{X: r * cs[i], Y: r * sn[i], Z: hl}, nr)
	}
	for i := range n {
		j := (i + 1) % n
		b.quad(bot[i], bot[j], top[j], top[i])
		b.edge(bot[i], bot[j])
		b.edge(top[i], top[j])
	}
	for _, i := range quarters(n) {
		b.edge(bot[i], top[i])
	}
	b.disc(r, -hl, n, cs, sn)
	b.disc(r, hl, n, cs, sn)
}

// disc adds a flat cap of radius r at height z, facing +z if z > 0 and -z
// otherwise, fanned from its centre, with a spoke at angle 0.
func (b *meshBuilder) disc(r, z float64, n int, cs, sn []float64) {
	nz := r3.Vec{Z: 1}
	if z <= 0 {
		nz.Z = -1
	}
	c := b.vert(r3.Vec{Z: z}, nz)
	ring := make([]uint32, n)
	for i := range n {
		ring[i] = b.vert(r3.Vec{X: r * cs[i], Y: r * sn[i], Z: z}, nz)
	}
	for i := range n {
		j := (i + 1) % n
		if nz.Z > 0 {
			b.tri(c, ring[i], ring[j])
		} else {
			b.tri(c, ring[j], ring[i])
		}
	}
	b.edge(c, ring[0])
}

// tube meshes a thick-walled tube (outer radius r, inner radius ri, length
// l along z): outer and inner sides and two flat annular ends. Wire: the
// four rims, four outer generators and a spoke on each end.
func (b *meshBuilder) tube(r, ri, l float64, n int) {
	cs, sn := circle(n)
	hl := l / 2
	ob, ot, ib, it := make([]uint32, n), make([]uint32, n), make([]uint32, n), make([]uint32, n)
	for i := range n {
		nr := r3.Vec{X: cs[i], Y: sn[i]}
		ob[i] = b.vert(r3.Vec{X: r * cs[i], Y: r * sn[i], Z: -hl}, nr)
		ot[i] = b.vert(r3.Vec{X: r * cs[i], Y: r * sn[i], Z: hl}, nr)
		// The inner side faces the hole.
		ni := r3.Scale(-1, nr)
		ib[i] = b.vert(r3.Vec{X: ri * cs[i], Y: ri * sn[i], Z: -hl}, ni)
		it[i] = b.vert(r3.Vec{X: ri * cs[i], Y: ri * sn[i], Z: hl}, ni)
	}
	for i := range n {
		j := (i + 1) % n
		b.quad(ob[i], ob[j], ot[j], ot[i])
		b.quad(ib[j], ib[i], it[i], it[j])
		b.edge(ob[i], ob[j])
		b.edge(ot[i], ot[j])
		b.edge(ib[i], ib[j])
		b.edge(it[i], it[j])
	}
	for _, i := range quarters(n) {
		b.edge(ob[i], ot[i])
	}
	for _, z := range []float64{-hl, hl} {
		nz := r3.Vec{Z: math.Copysign(1, z)}
		in, out := make([]uint32, n), make([]uint32, n)
		for i := range n {
			in[i] = b.vert(r3.Vec{X: ri * cs[i], Y: ri * sn[i], Z: z}, nz)
			out[i] = b.vert(r3.Vec{X: r * cs[i], Y: r * sn[i], Z: z}, nz)
		}
		for i := range n {
			j := (i + 1) % n
			if z > 0 {
				b.quad(in[i], out[i], out[j], in[j])
			} else {
				b.quad(in[j], out[j], out[i], in[i])
			}
		}
		b.edge(in[0], out[0])
	}
}

// ellipsoid meshes the ellipsoid of semi-axes a (a sphere when they are
// equal) as a latitude-longitude grid: n segments around z, n/2 bands from
// pole to pole. Normals are the exact ones of the ellipsoid at each vertex,
// unit(x/a^2, y/b^2, z/c^2). Wire: the three principal ellipses.
func (b *meshBuilder) ellipsoid(a r3.Vec, n int) {
	cs, sn := circle(n)
	m := n / 2 // bands; even because n is a multiple of 4
	at := func(u r3.Vec) uint32 {
		p := r3.Vec{X: a.X * u.X, Y: a.Y * u.Y, Z: a.Z * u.Z}
		nv := r3.Vec{X: u.X / a.X, Y: u.Y / a.Y, Z: u.Z / a.Z}
		if nn := r3.Norm(nv); nn > 0 && finite(nn) {
			nv = r3.Scale(1/nn, nv)
		} else {
			nv = u
		}
		return b.vert(p, nv)
	}
	south := at(r3.Vec{Z: -1})
	rings := make([][]uint32, m+1) // rings[1..m-1]; 0 and m are the poles
	for j := 1; j < m; j++ {
		sp, cp := math.Sincos(-math.Pi/2 + math.Pi*float64(j)/float64(m))
		rings[j] = make([]uint32, n)
		for i := range n {
			rings[j][i] = at(r3.Vec{X: cp * cs[i], Y: cp * sn[i], Z: sp})
		}
	}
	north := at(r3.Vec{Z: 1})
	ringAt := func(j, i int) uint32 {
		switch j {
		case 0:
			return south
		case m:
			return north
		}
		return rings[j][i]
	}
	for i := range n {
		k := (i + 1) % n
		b.tri(south, rings[1][k], rings[1][i])
		for j := 1; j < m-1; j++ {
			b.quad(rings[j][i], rings[j][k], rings[j+1][k], rings[j+1][i])
		}
		b.tri(rings[m-1][i], rings[m-1][k], north)
		b.edge(rings[m/2][i], rings[m/2][k]) // equator
	}
	for _, i := range quarters(n) { // two meridian great ellipses
		for j := range m {
			b.edge(ringAt(j, i), ringAt(j+1, i))
		}
	}
}

// cone meshes a solid cone of base radius r and height h along z with its
// centre of mass at the origin: base at z = -h/4, apex at z = 3h/4. The
// apex has one copy per side triangle carrying the side normal at the
// triangle's middle angle. Wire: the base rim, four generators and a spoke
// on the base.
func (b *meshBuilder) cone(r, h float64, n int) {
	cs, sn := circle(n)
	z0, z1 := -h/4, 3*h/4
	// Outward side normal: (h cos t, h sin t, r) / sqrt(h^2 + r^2).
	s := math.Hypot(h, r)
	if !(s > 0) {
		s = 1
	}
	ring := make([]uint32, n)
	for i := range n {
		ring[i] = b.vert(r3.Vec{X: r * cs[i], Y: r * sn[i], Z: z0}, r3.Vec{X: h * cs[i] / s, Y: h * sn[i] / s, Z: r / s})
	}
	for i := range n {
		j := (i + 1) % n
		smid, cmid := math.Sincos(2 * math.Pi * (float64(i) + 0.5) / float64(n))
		apex := b.vert(r3.Vec{Z: z1}, r3.Vec{X: h * cmid / s, Y: h * smid / s, Z: r / s})
		b.tri(ring[i], ring[j], apex)
		b.edge(ring[i], ring[j])
		for _, q := range quarters(n) {
			if q == i {
				b.edge(ring[i], apex)
			}
		}
	}
	b.disc(r, z0, n, cs, sn)
}

// torus meshes a solid torus with centre-line radius r and tube radius a
// about z: n segments round the axis and n/2 (rounded up to a multiple of
// 4) round the tube, normals from the tube's centre line. Wire: the outer,
// inner, top and bottom rings and four tube circles.
func (b *meshBuilder) torus(r, a float64, n int) {
	k := (n/2 + 3) / 4 * 4
	cu, su := circle(n)
	cv, sv := circle(k)
	idx := make([][]uint32, n)
	for i := range n {
		idx[i] = make([]uint32, k)
		for j := range k {
			nv := r3.Vec{X: cv[j] * cu[i], Y: cv[j] * su[i], Z: sv[j]}
			rr := r + a*cv[j]
			idx[i][j] = b.vert(r3.Vec{X: rr * cu[i], Y: rr * su[i], Z: a * sv[j]}, nv)
		}
	}
	for i := range n {
		i2 := (i + 1) % n
		for j := range k {
			j2 := (j + 1) % k
			b.quad(idx[i][j], idx[i2][j], idx[i2][j2], idx[i][j2])
		}
	}
	for _, j := range quarters(k) {
		for i := range n {
			b.edge(idx[i][j], idx[(i+1)%n][j])
		}
	}
	for _, i := range quarters(n) {
		for j := range k {
			b.edge(idx[i][j], idx[i][(j+1)%k])
		}
	}
}
