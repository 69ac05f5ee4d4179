package mesh

import (
	"errors"
	"fmt"
	"math"
	"sync"

	"gonum.org/v1/gonum/spatial/r3"
)

// Mesh is a closed, consistently wound triangle mesh in metres.
//
// V holds each position once (vertices are welded by exact position) and T
// the triangles as indices into V, wound counter-clockwise seen from
// outside. A Mesh made by New is closed: every edge is run as often in one
// direction as in the other (twice in all, or four times where two shells
// touch along an edge), no triangle has zero area, and the enclosed volume
// is positive. (One exception: where the file closed a crack along a split
// edge with a zero-area sliver, the sliver is dropped like any zero-area
// triangle, so the two halves of that edge are run one way only.) Treat it as read-only: its mass properties and support
// structure are computed once, on first use, and cached.
type Mesh struct {
	V []r3.Vec
	T [][3]int32

	solidOnce, surfOnce, supOnce sync.Once
	solid, surf                  Moments
	sup                          *supportTree

	reachMu sync.Mutex
	reachAt r3.Vec
	reach   float64
	reachOK bool
}

// MaxTriangles is the most triangles New accepts (the int32 indices and a
// memory bound: about 100 bytes a triangle while checking).
const MaxTriangles = 50_000_000

// New welds tris by exact position, drops zero-area triangles and checks
// that the rest close a solid. tris are in metres, in the part's own frame.
//
// notes say what New changed without refusing: triangles dropped, a mesh
// wound inward throughout turned outward, several shells. The error, if
// any, is one line in plain words ("not closed: 4 edges belong to one
// face only"), meant to follow a field name.
//
// Special cases:
//   - a NaN or infinite coordinate, no triangles, or only zero-area ones: error
//   - an edge run by one face only (a hole), by an odd number of faces
//     greater than one (non-manifold), or by two faces the same way (a
//     flipped face): error
//   - wound inward throughout (negative volume): turned outward, with a note
//   - a shell wound inward that lies inside no other shell (so it is no
//     cavity): turned outward, with a note; an inward shell inside another
//     stays a cavity (shells.go)
//   - zero enclosed volume (a flat closed surface): error
//
// It stays one function, long as it is: the checks run in the order of the
// special cases above over one welded vertex table and one edge list, and
// splitting them would pass those tables around for nothing.
func New(tris [][3]r3.Vec) (*Mesh, []string, error) {
	if len(tris) == 0 {
		return nil, nil, errors.New("no triangles")
	}
	if len(tris) > MaxTriangles {
		return nil, nil, fmt.Errorf("%d triangles is more than the %d this tool reads", len(tris), MaxTriangles)
	}
	for i := range tris {
		for _, p := range tris[i] {
			if !finite(p.X) || !finite(p.Y) || !finite(p.Z) {
				return nil, nil, fmt.Errorf("triangle %d has a coordinate that is not a finite number", i+1)
			}
		}
	}
	var notes []string

	// Weld by exact position.
	w := newWelder(len(tris)/2 + 8) // a closed mesh has about half as many vertices as triangles
	idx := make([][3]int32, 0, len(tris))
	repeated := 0
	for i := range tris {
		var t [3]int32
		for k, p := range tris[i] {
			t[k] = w.index(p)
		}
		if t[0] == t[1] || t[1] == t[2] || t[2] == t[0] {
			repeated++
			continue
		}
		idx = append(idx, t)
	}
	verts := w.verts
	w = nil

	// Triangles with three distinct but collinear corners have zero area too.
	// They may fill a crack along a split edge, so the edge check first runs
	// with them and, if that fails, without them.
	flat := 0
	kept := idx[:0:0]
	for _, t := range idx {
		if r3.Cross(r3.Sub(verts[t[1]], verts[t[0]]), r3.Sub(verts[t[2]], verts[t[0]])) == (r3.Vec{}) {
			flat++
			continue
		}
		kept = append(kept, t)
	}
	if len(kept) == 0 {
		return nil, nil, fmt.Errorf("all %d triangles have zero area", len(tris))
	}
	err := checkEdges(idx)
	if err != nil && flat > 0 {
		err = checkEdges(kept)
	}
	if err != nil {
		return nil, nil, err
	}
	if dropped := repeated + flat; dropped > 0 {
		notes = append(notes, fmt.Sprintf("%s of zero area dropped", plural(dropped, "triangle", "triangles")))
	}

	m := &Mesh{}
	m.V, m.T = compact(verts, kept)

	s := m.moments(false)
	e := extent(m.V)
	if !finite(s.Measure) || !finite(s.Inertia[0][0]+s.Inertia[1][1]+s.Inertia[2][2]) {
		return nil, nil, fmt.Errorf("the coordinates are too large to compute with (the mesh is %.3g across)", e)
	}
	if !(math.Abs(s.Measure)/e/e/e > 1e-12) {
		return nil, nil, errors.New("encloses no volume: the surface is flat")
	}
	global := s.Measure < 0
	if global {
		for i := range m.T {
			m.T[i][1], m.T[i][2] = m.T[i][2], m.T[i][1]
		}
		// Reversing every triangle negates every signed moment.
		s.Measure = -s.Measure
		for i := range 3 {
			for j := range 3 {
				s.Inertia[i][j] = -s.Inertia[i][j]
			}
		}
	}
	// Then each shell wound inward that is inside no other (so no cavity).
	labels, n := shellLabels(len(m.V), m.T)
	var turned []bool
	if n > 1 {
		turned = turnLoneInward(m, labels, n)
		if turned != nil {
			s = m.moments(false)
		}
	}
	// Say how many shells the file wound inward, counting both turns.
	net := 0
	for k := range n {
		if global != (turned != nil && turned[k]) {
			net++
		}
	}
	switch {
	case net == n && net > 0:
		notes = append(notes, "wound inward throughout: turned outward (the same solid)")
	case net > 0:
		notes = append(notes, fmt.Sprintf("%d of %d shells wound inward and inside no other shell: turned outward (solids, not cavities)", net, n))
	}
	if n > 1 {
		notes = append(notes, fmt.Sprintf("%d closed shells, added up", n))
	}
	m.solidOnce.Do(func() { m.solid = s })
	return m, notes, nil
}

// checkEdges reports the first closure problem of the triangles t: every
// undirected edge must be run as often one way as the other.
func checkEdges(t [][3]int32) error {
	// One key per directed edge: the smaller index high, the larger next and
	// the direction in the low bit, so that sorting groups each edge.
	keys := make([]uint64, 0, 3*len(t))
	for _, tri := range t {
		for k := range 3 {
			a, b := uint64(tri[k]), uint64(tri[(k+1)%3])
			dir := uint64(0)
			if a > b {
				a, b, dir = b, a, 1
			}
			keys = append(keys, a<<33|b<<1|dir)
		}
	}
	if len(keys) > 0 {
		radixSort(keys)
	}
	var open, third, flipped int
	for i := 0; i < len(keys); {
		j, back := i, 0
		for j < len(keys) && keys[j]>>1 == keys[i]>>1 {
			back += int(keys[j] & 1)
			j++
		}
		n := j - i
		switch fwd := n - back; {
		case fwd == back:
		case n == 1:
			open++
		case n%2 == 1:
			third++
		default:
			flipped++
		}
		i = j
	}
	switch {
	case third > 0:
		return fmt.Errorf("not a solid: %s shared by three faces or more (non-manifold)", plural(third, "edge is", "edges are"))
	case open > 0:
		return fmt.Errorf("not closed: %s to one face only", plural(open, "edge belongs", "edges belong"))
	case flipped > 0:
		return fmt.Errorf("faces wound both ways: %s (a face is flipped)", plural(flipped, "edge is run the same way by both its faces", "edges are run the same way by both their faces"))
	}
	return nil
}

// compact keeps only the vertices t uses, renumbered in first-use order.
func compact(v []r3.Vec, t [][3]int32) ([]r3.Vec, [][3]int32) {
	remap := make([]int32, len(v))
	for i := range remap {
		remap[i] = -1
	}
	var out []r3.Vec
	for i := range t {
		for k := range 3 {
			j := t[i][k]
			if remap[j] < 0 {
				remap[j] = int32(len(out))
				out = append(out, v[j])
			}
			t[i][k] = remap[j]
		}
	}
	return out, t
}

// extent returns the largest edge of the bounding box of v.
func extent(v []r3.Vec) float64 {
	lo, hi := bounds(v)
	d := r3.Sub(hi, lo)
	return math.Max(d.X, math.Max(d.Y, d.Z))
}

// bounds returns the corners of the axis-aligned bounding box of v (the
// coordinates are finite: plain comparisons, faster than math.Min).
func bounds(v []r3.Vec) (lo, hi r3.Vec) {
	if len(v) == 0 {
		return
	}
	lo, hi = v[0], v[0]
	for _, p := range v[1:] {
		if p.X < lo.X {
			lo.X = p.X
		} else if p.X > hi.X {
			hi.X = p.X
		}
		if p.Y < lo.Y {
			lo.Y = p.Y
		} else if p.Y > hi.Y {
			hi.Y = p.Y
		}
		if p.Z < lo.Z {
			lo.Z = p.Z
		} else if p.Z > hi.Z {
			hi.Z = p.Z
		}
	}
	return
}

// Bounds returns the corners of the mesh's axis-aligned bounding box, m.
func (m *Mesh) Bounds() (lo, hi r3.Vec) { return bounds(m.V) }

func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }

func plural(n int, one, many string) string {
	if n == 1 {
		return "1 " + one
	}
	return fmt.Sprintf("%d %s", n, many)
}
