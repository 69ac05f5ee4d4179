package wire

import (
	"math"
	"runtime"
	"sync"
	"weak"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics"
	"propflight/physics/mesh"
)

// CreaseAngle is the default crease threshold of NewOutline, radians: an
// edge is a crease, drawn always, where the normals of its two faces differ
// by more than 40 degrees.
//
// Why 40: a round surface tessellated with ten or more facets a turn (36
// degrees apart or less; exported props usually have 16 to 64) reads as
// smooth and shows only its contour, while right-angle corners and
// 45-degree chamfers still show as lines. A lower threshold (30 degrees)
// draws every facet of a 12-sided handle, which turns a coarse model into
// hatching (common practice in feature-line drawing, no source).
const CreaseAngle = 40 * math.Pi / 180

// outlineDirections is the number of sample directions along which an
// Outline keeps the farthest vertex (see Outline.Extremes).
const outlineDirections = 64

// Outline is a triangle mesh's line drawing, prepared once so that drawing
// it in a new pose costs one pass over the faces and one over the smooth
// edges:
//
//   - creases: edges whose two faces' normals differ by more than the
//     threshold angle, edges with one face only (a hole's rim) and edges
//     with three or more faces (non-manifold): drawn in every pose;
//   - smooth edges, between two faces under the threshold: drawn only
//     where they lie on the contour of the current view, that is where one
//     of their faces turns toward the viewer and the other away.
//
// Vertices are those of the mesh, in its own frame; triangles wind
// counter-clockwise seen from outside, so (b-a) x (c-a) points out. The
// mesh must not change after NewOutline (the outline shares its vertex
// slice). An Outline is read-only and safe to use from several goroutines.
type Outline struct {
	vec     []r3.Vec // the mesh's vertices (shared with the mesh)
	creases [][2]int32
	smooth  [][2]int32   // vertices of each smooth edge
	sides   [][2]int32   // its two faces
	normal  [][3]float64 // unit outward normal of each face; zero for a degenerate face
	offset  []float64    // normal . first vertex of each face
	extreme []int32      // farthest vertex along each sample direction, without repeats
	// Faces are kept in patches (see buildPatches); smooth and sides list
	// each patch's own edges in turn, then the edges between patches in
	// runs by the pair of patches.
	// Crease chains (see buildChains): chain i is
	// chainVerts[chainStart[i]:chainStart[i+1]].
	chainVerts []int32
	chainStart []int32
	patches    []patch
	tri        [][3]int32 // the triangles in patch order
	inner      []int32    // while building only
	border     []int32    // while building only
	borderFrom int32      // the first border edge in smooth and sides
	runs       []borderRun
	reach      struct { // the last Reach
		sync.Mutex
		at  r3.Vec
		val float64
		ok  bool
	}
}

// NewOutline prepares the line drawing of the triangle mesh (v, t) with
// crease threshold angle (radians; CreaseAngle is the default, a value
// outside (0, pi) is taken as CreaseAngle). Triangles that repeat a vertex
// or index outside v are left out. Its cost is linear in the mesh size: the
// edges are matched by bucketing them on their lower vertex.
func NewOutline(v []r3.Vec, t [][3]int32, angle float64) *Outline {
	if !(angle > 0 && angle < math.Pi) {
		angle = CreaseAngle
	}
	o := &Outline{vec: v}
	o.faceNormals(t)
	start, halves := bucketEdges(t, int32(len(v)))
	o.matchEdges(start, halves, math.Cos(angle))
	o.buildChains(len(v))
	o.buildPatches(v, t)
	o.extreme = extremes(v)
	return o
}

// goodTri reports whether tr indexes three different vertices of nv.
func goodTri(tr [3]int32, nv int32) bool {
	for _, i := range tr {
		if i < 0 || i >= nv {
			return false
		}
	}
	return tr[0] != tr[1] && tr[1] != tr[2] && tr[2] != tr[0]
}

// faceNormals sets the unit normal and plane offset of every face; bad
// triangles (goodTri, or no area) get a zero normal and take no part in
// the edges.
func (o *Outline) faceNormals(t [][3]int32) {
	v := o.vec
	nv := int32(len(v))
	o.normal = make([][3]float64, len(t))
	o.offset = make([]float64, len(t))
	for f, tr := range t {
		if !goodTri(tr, nv) {
			continue
		}
		a, b, c := v[tr[0]], v[tr[1]], v[tr[2]]
		n := r3.Cross(r3.Sub(b, a), r3.Sub(c, a))
		l := r3.Norm(n)
		if !(l > 0) || math.IsInf(l, 0) {
			continue
		}
		n = r3.Scale(1/l, n)
		o.normal[f] = [3]float64{n.X, n.Y, n.Z}
		o.offset[f] = r3.Dot(n, a)
	}
}

// halfEdge is a face's edge, filed under its lower vertex: the upper
// vertex and the face.
type halfEdge struct{ hi, face int32 }

// bucketEdges files every edge of the good triangles under its lower
// vertex (a counting sort): the edges of vertex i are halves[start[i]:
// start[i+1]].
func bucketEdges(t [][3]int32, nv int32) (start []int32, halves []halfEdge) {
	start = make([]int32, nv+1)
	for _, tr := range t {
		if !goodTri(tr, nv) {
			continue
		}
		for k := range 3 {
			start[min(tr[k], tr[(k+1)%3])+1]++
		}
	}
	for i := range nv {
		start[i+1] += start[i]
	}
	halves = make([]halfEdge, start[nv])
	fill := append([]int32(nil), start[:nv]...)
	for f, tr := range t {
		if !goodTri(tr, nv) {
			continue
		}
		for k := range 3 {
			a, b := tr[k], tr[(k+1)%3]
			lo, hi := min(a, b), max(a, b)
			halves[fill[lo]] = halfEdge{hi, int32(f)}
			fill[lo]++
		}
	}
	return start, halves
}

// matchEdges matches the few edges in each bucket by their upper vertex:
// an edge of two faces whose normals meet at a cosine of cosMax or more is
// smooth (o.smooth, its faces in o.sides), any other a crease (an open or
// non-manifold edge too).
func (o *Outline) matchEdges(start []int32, halves []halfEdge, cosMax float64) {
	var faces []int32
	for lo := range int32(len(start) - 1) {
		bucket := halves[start[lo]:start[lo+1]]
		for i := range bucket {
			if bucket[i].hi < 0 {
				continue // matched already
			}
			hi := bucket[i].hi
			faces = append(faces[:0], bucket[i].face)
			for j := i + 1; j < len(bucket); j++ {
				if bucket[j].hi == hi {
					faces = append(faces, bucket[j].face)
					bucket[j].hi = -1
				}
			}
			e := [2]int32{lo, hi}
			if len(faces) != 2 {
				o.creases = append(o.creases, e)
				continue
			}
			n1, n2 := o.normal[faces[0]], o.normal[faces[1]]
			if n1[0]*n2[0]+n1[1]*n2[1]+n1[2]*n2[2] < cosMax {
				o.creases = append(o.creases, e)
				continue
			}
			o.smooth = append(o.smooth, e)
			o.sides = append(o.sides, [2]int32{faces[0], faces[1]})
		}
	}
}

// extremes returns the vertices farthest along outlineDirections
// directions spread over the sphere (a Fibonacci lattice: Gonzalez,
// "Measurement of areas on a sphere using Fibonacci and latitude-longitude
// lattices", Math. Geosci. 42, 2010), each once. Taken as antipodal pairs,
// one dot product a pair per vertex.
func extremes(v []r3.Vec) []int32 {
	if len(v) == 0 {
		return nil
	}
	const pairs = outlineDirections / 2
	var dirs [pairs]r3.Vec
	golden := math.Pi * (3 - math.Sqrt(5))
	for i := range pairs {
		// Upper hemisphere of the lattice; the lower one is its negation.
		z := 1 - (float64(i)+0.5)/pairs
		r := math.Sqrt(1 - z*z)
		s, c := math.Sincos(golden * float64(i))
		dirs[i] = r3.Vec{X: r * c, Y: r * s, Z: z}
	}
	var hi, lo [pairs]float64
	var hiAt, loAt [pairs]int32
	for i := range pairs {
		hi[i], lo[i] = math.Inf(-1), math.Inf(1)
	}
	for j, p := range v {
		for i, d := range dirs {
			s := p.X*d.X + p.Y*d.Y + p.Z*d.Z
			if s > hi[i] {
				hi[i], hiAt[i] = s, int32(j)
			}
			if s < lo[i] {
				lo[i], loAt[i] = s, int32(j)
			}
		}
	}
	seen := map[int32]bool{}
	var out []int32
	for _, at := range append(hiAt[:], loAt[:]...) {
		if !seen[at] {
			seen[at] = true
			out = append(out, at)
		}
	}
	return out
}

// Vertex returns vertex i of the mesh, in its own frame.
func (o *Outline) Vertex(i int32) r3.Vec { return o.vec[i] }

// Creases returns the edges drawn in every pose (see Outline), as vertex
// pairs. The slice is shared: do not change it.
func (o *Outline) Creases() [][2]int32 { return o.creases }

// SmoothEdges returns the number of edges drawn only on the contour.
func (o *Outline) SmoothEdges() int { return len(o.smooth) }

// Extremes returns the vertices farthest from the mesh's origin along a
// set of directions spread over the sphere, each once: a few points whose
// box bounds the mesh closely in any pose. The slice is shared.
func (o *Outline) Extremes() []int32 { return o.extreme }

// Contour appends to dst the smooth edges on the contour seen from view,
// given in the mesh's own frame: for an orthographic view, view is the
// direction toward the viewer (any length); for a perspective view, the
// eye's position. front is scratch space (it may be nil; Contour grows it
// to one entry a face and two a patch) and is returned for reuse.
//
// A face turns toward the viewer when its outward normal n has n . view >
// 0 (orthographic) or n . (view - a) > 0 for its vertex a (perspective);
// an edge is on the contour when one of its faces turns toward the viewer
// and the other does not. Patches whose faces all turn one way are decided
// whole (see patch.facing), which gives the same edges as testing every
// face; the edges come in patch order, not mesh order.
func (o *Outline) Contour(dst [][2]int32, view r3.Vec, ortho bool, front []bool) ([][2]int32, []bool) {
	nf, np := len(o.normal), len(o.patches)
	if cap(front) < nf+2*np {
		front = make([]bool, nf+2*np)
	}
	front = front[:nf+2*np]
	// After the faces: whether each patch was decided whole, and its verdict.
	decided, verdict := front[nf:nf+np], front[nf+np:]
	wx, wy, wz := view.X, view.Y, view.Z
	for p := range o.patches {
		pa := &o.patches[p]
		from, to := p*patchFaces, min((p+1)*patchFaces, nf)
		if c := pa.facing(view, ortho); c != mixed {
			// No contour inside; the faces take the patch's verdict for
			// the border edges.
			fr := c == allFront
			decided[p], verdict[p] = true, fr
			for f := from; f < to; f++ {
				front[f] = fr
			}
			continue
		}
		decided[p] = false
		if ortho {
			for f := from; f < to; f++ {
				n := &o.normal[f]
				front[f] = n[0]*wx+n[1]*wy+n[2]*wz > 0
			}
		} else {
			for f := from; f < to; f++ {
				n := &o.normal[f]
				front[f] = n[0]*wx+n[1]*wy+n[2]*wz > o.offset[f]
			}
		}
		for k := pa.from; k < pa.to; k++ {
			if s := o.sides[k]; front[s[0]] != front[s[1]] {
				dst = append(dst, o.smooth[k])
			}
		}
	}
	from := o.borderFrom
	for _, r := range o.runs {
		if decided[r.p0] && decided[r.p1] && verdict[r.p0] == verdict[r.p1] {
			from = r.to
			continue // both sides turn the same way
		}
		for k := from; k < r.to; k++ {
			if s := o.sides[k]; front[s[0]] != front[s[1]] {
				dst = append(dst, o.smooth[k])
			}
		}
		from = r.to
	}
	return dst, front
}

// outlines caches one Outline per mesh, keyed by the mesh's address and
// held weakly: an entry goes when its mesh is garbage collected (a
// cleanup on the mesh removes it), so closing a project frees its
// outlines. A mesh.Mesh is read-only once made, so its outline never goes
// stale.
var outlines = struct {
	sync.Mutex
	m map[weak.Pointer[mesh.Mesh]]*outlineEntry
}{m: map[weak.Pointer[mesh.Mesh]]*outlineEntry{}}

type outlineEntry struct {
	once sync.Once
	o    *Outline
}

// MeshOutline returns the outline of m at CreaseAngle, computed on the
// first call for m and cached for the mesh's lifetime: drawing a mesh part
// in a new frame costs only its contour pass. Safe for concurrent use; a
// nil mesh has no outline (nil).
func MeshOutline(m *mesh.Mesh) *Outline {
	if m == nil {
		return nil
	}
	k := weak.Make(m)
	outlines.Lock()
	e, ok := outlines.m[k]
	if !ok {
		e = &outlineEntry{}
		outlines.m[k] = e
		runtime.AddCleanup(m, func(k weak.Pointer[mesh.Mesh]) {
			outlines.Lock()
			delete(outlines.m, k)
			outlines.Unlock()
		}, k)
	}
	outlines.Unlock()
	e.once.Do(func() { e.o = NewOutline(m.V, m.T, CreaseAngle) })
	return e.o
}

// PrepareOutlines makes (or finds) the outline of every mesh part of p, so
// that a later Draw of the prop on another goroutine, such as the UI's,
// only looks them up. A nil prop is fine.
func PrepareOutlines(p *physics.Prop) {
	if p == nil {
		return
	}
	for i := range p.Parts {
		partOutline(&p.Parts[i])
	}
}

// partOutline returns the outline of a mesh part, or nil for a primitive.
func partOutline(p *physics.Part) *Outline {
	if p.Shape != physics.MeshShape || p.Mesh == nil {
		return nil
	}
	return MeshOutline(p.Mesh)
}
