package mesh

import (
	"math"
	"slices"

	"gonum.org/v1/gonum/spatial/r3"
)

// Support returns max over the vertices p of p . u, m: the exact support
// function of the mesh (and of its convex hull) in direction u, which need
// not be unit. The lowest point of the mesh along a unit up direction n is
// at height -Support(-n).
//
// The first call builds a bounding-box tree over the vertices (a few
// milliseconds for a million of them); each call then visits the boxes
// whose own support beats the best vertex found so far, so it is far
// faster than a scan and exact. Support of an empty mesh is -Inf.
func (m *Mesh) Support(u r3.Vec) float64 {
	m.supOnce.Do(func() { m.sup = newSupportTree(m.V) })
	return m.sup.support(u)
}

// Reach returns the largest distance of a vertex from c, m. The last
// answer is kept, so asking again about the same c (every take of a part
// asks about its centre of mass) costs nothing.
func (m *Mesh) Reach(c r3.Vec) float64 {
	m.reachMu.Lock()
	defer m.reachMu.Unlock()
	if m.reachOK && m.reachAt == c {
		return m.reach
	}
	r := 0.0
	for _, p := range m.V {
		r = math.Max(r, r3.Norm(r3.Sub(p, c)))
	}
	m.reach, m.reachAt, m.reachOK = r, c, true
	return r
}

// leafSize is the most points in a leaf of the support tree.
const leafSize = 8

// supportTree is a bounding-volume hierarchy over points: node i's box
// holds pts[lo:hi]; its children are 2i+1 and 2i+2 (a complete binary
// tree over a median split on the longest box edge).
type supportTree struct {
	pts   []r3.Vec
	nodes []supportNode
}

type supportNode struct {
	centre, half r3.Vec // box centre and half edges
	lo, hi       int32
	leaf         bool
}

func newSupportTree(v []r3.Vec) *supportTree {
	// Only points that can be extreme matter; all of them stay (exactness
	// needs no hull), but a copy keeps the caller's order.
	t := &supportTree{pts: slices.Clone(v)}
	if len(v) == 0 {
		return t
	}
	n := 1
	for c := len(v); c > leafSize; c = (c + 1) / 2 {
		n = 2*n + 1
	}
	t.nodes = make([]supportNode, n)
	t.build(0, 0, len(v))
	return t
}

func (t *supportTree) build(i, lo, hi int) {
	blo, bhi := bounds(t.pts[lo:hi])
	nd := &t.nodes[i]
	nd.centre = r3.Scale(0.5, r3.Add(blo, bhi))
	nd.half = r3.Scale(0.5, r3.Sub(bhi, blo))
	nd.lo, nd.hi = int32(lo), int32(hi)
	if hi-lo <= leafSize || 2*i+2 >= len(t.nodes) {
		nd.leaf = true
		return
	}
	mid := (lo + hi) / 2
	axis := func(p r3.Vec) float64 { return p.X }
	switch d := nd.half; {
	case d.Y >= d.X && d.Y >= d.Z:
		axis = func(p r3.Vec) float64 { return p.Y }
	case d.Z >= d.X && d.Z >= d.Y:
		axis = func(p r3.Vec) float64 { return p.Z }
	}
	nthElement(t.pts[lo:hi], mid-lo, axis)
	t.build(2*i+1, lo, mid)
	t.build(2*i+2, mid, hi)
}

// boxSupport is the support of node nd's box in direction u.
func boxSupport(nd *supportNode, u r3.Vec) float64 {
	return r3.Dot(nd.centre, u) + math.Abs(u.X)*nd.half.X + math.Abs(u.Y)*nd.half.Y + math.Abs(u.Z)*nd.half.Z
}

func (t *supportTree) support(u r3.Vec) float64 {
	best := math.Inf(-1)
	if len(t.nodes) == 0 {
		return best
	}
	var stack [64]int32
	sp := 0
	stack[sp] = 0
	sp++
	for sp > 0 {
		sp--
		nd := &t.nodes[stack[sp]]
		if boxSupport(nd, u) <= best {
			continue
		}
		if nd.leaf {
			for _, p := range t.pts[nd.lo:nd.hi] {
				best = math.Max(best, r3.Dot(p, u))
			}
			continue
		}
		// Visit the more promising child first: push it last.
		a, b := 2*stack[sp]+1, 2*stack[sp]+2
		if boxSupport(&t.nodes[a], u) > boxSupport(&t.nodes[b], u) {
			a, b = b, a
		}
		stack[sp], stack[sp+1] = a, b
		sp += 2
	}
	return best
}

// nthElement reorders p so that p[k] has the key it would have sorted, with
// no larger key before it and no smaller after it (Hoare's selection).
func nthElement(p []r3.Vec, k int, key func(r3.Vec) float64) {
	lo, hi := 0, len(p)-1
	for lo < hi {
		pivot := key(p[(lo+hi)/2])
		i, j := lo, hi
		for i <= j {
			for key(p[i]) < pivot {
				i++
			}
			for key(p[j]) > pivot {
				j--
			}
			if i <= j {
				p[i], p[j] = p[j], p[i]
				i++
				j--
			}
		}
		switch {
		case k <= j:
			hi = j
		case k >= i:
			lo = i
		default:
			return
		}
	}
}
