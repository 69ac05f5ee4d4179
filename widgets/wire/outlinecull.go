package wire

import (
	"math"
	"slices"

	"gonum.org/v1/gonum/spatial/r3"
)

// patchFaces is the number of faces in a patch of an Outline.
const patchFaces = 64

// patch is a run of patchFaces faces that lie close together (faces are
// ordered along a Morton curve through their centroids), with bounds that
// let Contour decide for all of them at once which way they turn:
// every face normal is within half of axis, every vertex within radius of
// centre (Sander, Gu, Gortler, Hoppe and Snyder, "Silhouette clipping",
// SIGGRAPH 2000, §4, test their anchored normal cones the same way).
type patch struct {
	axis   r3.Vec // unit
	half   float64
	cosH   float64 // cos and sin of half
	sinH   float64
	centre r3.Vec
	radius float64
	// Smooth edges from to to (Outline.sides and smooth) have both faces
	// in the patch.
	from, to int32
}

// Facing of a whole patch.
const (
	mixed = iota
	allFront
	allBack
)

// cullMargin widens the patch tests so that rounding never puts a face in
// a patch decided the other way from its own test (relative to the sizes
// involved).
const cullMargin = 1e-9

// buildPatches puts the faces in Morton order of their centroids, groups
// them in patches and sorts the smooth edges into each patch's own
// (inner) and those between patches (border). It rewrites o.normal,
// o.offset and o.sides in the new face order.
func (o *Outline) buildPatches(v []r3.Vec, t [][3]int32) {
	nf := len(o.normal)
	if nf == 0 {
		return
	}
	pos, order := o.sortFaces(v, t)
	np := (nf + patchFaces - 1) / patchFaces
	o.patches = make([]patch, np)
	for p := range o.patches {
		o.boundPatch(p, v, t, order)
	}
	o.sortSmoothEdges(pos)
}

// sortFaces puts the faces in order: by the bin of their normal, so that
// a thin wall's two sides never share a patch, then along the Morton
// curve through their centroids. It rewrites o.normal, o.offset and o.tri
// in that order and returns each face's place in it (pos) and the faces
// in it (order).
func (o *Outline) sortFaces(v []r3.Vec, t [][3]int32) (pos, order []int32) {
	nf := len(o.normal)
	lo := r3.Vec{X: math.Inf(1), Y: math.Inf(1), Z: math.Inf(1)}
	hi := r3.Scale(-1, lo)
	cent := make([]r3.Vec, nf)
	for f, tr := range t {
		if o.normal[f] == ([3]float64{}) {
			continue
		}
		c := r3.Scale(1.0/3, r3.Add(v[tr[0]], r3.Add(v[tr[1]], v[tr[2]])))
		cent[f] = c
		lo = r3.Vec{X: math.Min(lo.X, c.X), Y: math.Min(lo.Y, c.Y), Z: math.Min(lo.Z, c.Z)}
		hi = r3.Vec{X: math.Max(hi.X, c.X), Y: math.Max(hi.Y, c.Y), Z: math.Max(hi.Z, c.Z)}
	}
	span := math.Max(hi.X-lo.X, math.Max(hi.Y-lo.Y, hi.Z-lo.Z))
	if !(span > 0) || math.IsInf(span, 0) {
		span = 1
	}
	// One key a face: bin (7 bits), Morton code of the centroid on a
	// 256-cell grid a side (24 bits), face index (32 bits).
	keys := make([]uint64, nf)
	q := func(x float64) uint64 { return uint64(math.Min(255, math.Max(0, (x/span)*255))) }
	for f := range nf {
		c := r3.Sub(cent[f], lo)
		keys[f] = (normalBin(o.normal[f])<<24|morton(q(c.X), q(c.Y), q(c.Z)))<<32 | uint64(f)
	}
	slices.Sort(keys)
	pos = make([]int32, nf) // face -> place in the new order
	order = make([]int32, nf)
	normal := make([][3]float64, nf)
	offset := make([]float64, nf)
	for i, k := range keys {
		f := int32(uint32(k))
		pos[f], order[i] = int32(i), f
		normal[i], offset[i] = o.normal[f], o.offset[f]
	}
	o.normal, o.offset = normal, offset
	o.tri = make([][3]int32, nf)
	for i, f := range order {
		o.tri[i] = t[f]
	}
	return pos, order
}

// boundPatch sets the bounds of patch p (faces p*patchFaces on, in the
// new order): the cone of its normals about their mean and the sphere
// round its vertices. A patch with a degenerate face, or no normals to
// average, gets a half angle of pi: its faces are tested one by one.
func (o *Outline) boundPatch(p int, v []r3.Vec, t [][3]int32, order []int32) {
	normal := o.normal
	pa := &o.patches[p]
	from, to := p*patchFaces, min((p+1)*patchFaces, len(normal))
	var sum r3.Vec
	blo := r3.Vec{X: math.Inf(1), Y: math.Inf(1), Z: math.Inf(1)}
	bhi := r3.Scale(-1, blo)
	for i := from; i < to; i++ {
		n := normal[i]
		sum = r3.Add(sum, r3.Vec{X: n[0], Y: n[1], Z: n[2]})
		if n == ([3]float64{}) {
			continue
		}
		for _, j := range t[order[i]] {
			w := v[j]
			blo = r3.Vec{X: math.Min(blo.X, w.X), Y: math.Min(blo.Y, w.Y), Z: math.Min(blo.Z, w.Z)}
			bhi = r3.Vec{X: math.Max(bhi.X, w.X), Y: math.Max(bhi.Y, w.Y), Z: math.Max(bhi.Z, w.Z)}
		}
	}
	pa.half = math.Pi // undecidable unless shown otherwise
	l := r3.Norm(sum)
	if !(l > 0) || math.IsInf(blo.X, 0) {
		return
	}
	pa.axis = r3.Scale(1/l, sum)
	pa.half = 0
	pa.centre = r3.Scale(0.5, r3.Add(blo, bhi))
	for i := from; i < to; i++ {
		n := normal[i]
		if n == ([3]float64{}) {
			pa.half = math.Pi // a degenerate face turns neither way: test each
			break
		}
		pa.half = math.Max(pa.half, math.Acos(math.Min(1, n[0]*pa.axis.X+n[1]*pa.axis.Y+n[2]*pa.axis.Z)))
		for _, j := range t[order[i]] {
			pa.radius = math.Max(pa.radius, r3.Norm(r3.Sub(v[j], pa.centre)))
		}
	}
	pa.half += cullMargin
	pa.sinH, pa.cosH = math.Sincos(pa.half)
}

// sortSmoothEdges renumbers the smooth edges' faces by pos, then lays
// the edges out for Contour's one sweep: each patch's inner edges (both
// faces in it), then the border edges in runs by the pair of patches they
// join.
func (o *Outline) sortSmoothEdges(pos []int32) {
	np := len(o.patches)
	counts := make([]int32, np+1)
	for i := range o.sides {
		s := &o.sides[i]
		s[0], s[1] = pos[s[0]], pos[s[1]]
		if p0, p1 := s[0]/patchFaces, s[1]/patchFaces; p0 == p1 {
			counts[p0+1]++
		}
	}
	for p := range np {
		counts[p+1] += counts[p]
		o.patches[p].from, o.patches[p].to = counts[p], counts[p+1]
	}
	o.inner = make([]int32, counts[np])
	fill := append([]int32(nil), counts[:np]...)
	o.border = o.border[:0]
	for i, s := range o.sides {
		if p0, p1 := s[0]/patchFaces, s[1]/patchFaces; p0 == p1 {
			o.inner[fill[p0]] = int32(i)
			fill[p0]++
		} else {
			o.border = append(o.border, int32(i))
		}
	}
	// Border edges in runs by the pair of patches they join, so that a
	// run between two patches decided alike is passed over whole.
	pair := func(e int32) uint64 {
		s := o.sides[e]
		p0, p1 := uint64(s[0]/patchFaces), uint64(s[1]/patchFaces)
		return min(p0, p1)<<32 | max(p0, p1)
	}
	// Sort on (p0, p1) by two stable counting sorts, p1 then p0 (a
	// least-significant-digit radix sort): linear in the edges.
	byPatch := func(in []int32, digit func(e int32) int32) []int32 {
		count := make([]int32, np+1)
		for _, e := range in {
			count[digit(e)+1]++
		}
		for p := range np {
			count[p+1] += count[p]
		}
		out := make([]int32, len(in))
		for _, e := range in {
			d := digit(e)
			out[count[d]] = e
			count[d]++
		}
		return out
	}
	lo0 := func(e int32) int32 { s := o.sides[e]; return min(s[0], s[1]) / patchFaces }
	hi1 := func(e int32) int32 { s := o.sides[e]; return max(s[0], s[1]) / patchFaces }
	o.border = byPatch(byPatch(o.border, hi1), lo0)
	o.runs = o.runs[:0]
	for i := 0; i < len(o.border); {
		k := pair(o.border[i])
		j := i + 1
		for j < len(o.border) && pair(o.border[j]) == k {
			j++
		}
		o.runs = append(o.runs, borderRun{p0: int32(k >> 32), p1: int32(uint32(k)), to: int32(len(o.inner) + j)})
		i = j
	}
	// Lay the smooth edges out in that order, each patch's inner edges
	// then the border runs, so that Contour reads them in one sweep.
	perm := append(append(make([]int32, 0, len(o.sides)), o.inner...), o.border...)
	sides := make([][2]int32, len(perm))
	smooth := make([][2]int32, len(perm))
	for k, e := range perm {
		sides[k], smooth[k] = o.sides[e], o.smooth[e]
	}
	o.sides, o.smooth = sides, smooth
	o.borderFrom = int32(len(o.inner))
	o.inner, o.border = nil, nil
}

// borderRun is a run of the border edges (those after
// Outline.borderFrom), the edges between patches p0 and p1, up to (not
// including) edge to; it starts where the last run ended.
type borderRun struct{ p0, p1, to int32 }

// normalBin sorts unit normals into 96 bins: the cube face the normal
// points through (6), then a 4 x 4 grid on that face.
func normalBin(n [3]float64) uint64 {
	k := 0
	for i := 1; i < 3; i++ {
		if math.Abs(n[i]) > math.Abs(n[k]) {
			k = i
		}
	}
	d := math.Abs(n[k])
	if !(d > 0) {
		return 0
	}
	face := uint64(2 * k)
	if n[k] < 0 {
		face++
	}
	cell := func(x float64) uint64 { return uint64(math.Min(3, math.Max(0, (x/d+1)*2))) }
	return face*16 + cell(n[(k+1)%3])*4 + cell(n[(k+2)%3])
}

// morton interleaves the low 10 bits of x, y and z.
func morton(x, y, z uint64) uint64 {
	spread := func(a uint64) uint64 {
		a &= 0x3ff
		a = (a | a<<16) & 0x30000ff
		a = (a | a<<8) & 0x300f00f
		a = (a | a<<4) & 0x30c30c3
		a = (a | a<<2) & 0x9249249
		return a
	}
	return spread(x) | spread(y)<<1 | spread(z)<<2
}

// facing decides a patch as a whole, or says it is mixed. For an
// orthographic view (w toward the viewer), every normal n within half of
// axis has n . w >= |w| cos(a + half), a the angle between axis and w. For
// a perspective eye e, a face with vertex p has n . (e - p) >= |w| cos(a +
// half) - radius with w = e - centre, since |p - centre| <= radius; the
// bounds the other way are alike with cos(a - half). |w| cos(a +- half)
// is D cos half -+ S sin half with D = axis . w and S = |axis x w|.
func (pa *patch) facing(view r3.Vec, ortho bool) int {
	if pa.half >= math.Pi/2 {
		return mixed
	}
	w := view
	if !ortho {
		w = r3.Sub(view, pa.centre)
	}
	d2 := r3.Dot(w, w)
	if !(d2 > 0) || math.IsInf(d2, 0) {
		return mixed
	}
	dist := math.Sqrt(d2)
	dd := r3.Dot(pa.axis, w)
	ss := math.Sqrt(math.Max(0, d2-dd*dd))
	lower := dd*pa.cosH - ss*pa.sinH // |w| cos(a + half)
	upper := dd*pa.cosH + ss*pa.sinH // |w| cos(a - half)
	slack := cullMargin * dist
	if !ortho {
		slack = pa.radius + cullMargin*(dist+pa.radius+r3.Norm(pa.centre))
	}
	switch {
	case lower > slack:
		return allFront
	case upper < -slack:
		return allBack
	}
	return mixed
}

// Reach returns the largest distance of a vertex of the mesh's triangles
// from c, m (0 for an empty mesh). It is exact: the extremes give a first
// answer, and only the patches whose bounding sphere reaches farther than
// that are searched vertex by vertex. The last answer is kept, since every
// drawing of one prop asks about the same point.
func (o *Outline) Reach(c r3.Vec) float64 {
	o.reach.Lock()
	defer o.reach.Unlock()
	if o.reach.ok && o.reach.at == c {
		return o.reach.val
	}
	best := o.reachOf(c)
	o.reach.at, o.reach.val, o.reach.ok = c, best, true
	return best
}

func (o *Outline) reachOf(c r3.Vec) float64 {
	best := 0.0
	for _, i := range o.extreme {
		best = math.Max(best, r3.Norm(r3.Sub(o.vec[i], c)))
	}
	for p := range o.patches {
		pa := &o.patches[p]
		if pa.half >= math.Pi && pa.radius == 0 {
			// No bounds (degenerate faces only or a degenerate patch):
			// search it.
		} else if r3.Norm(r3.Sub(pa.centre, c))+pa.radius <= best {
			continue
		}
		for _, tr := range o.tri[p*patchFaces : min((p+1)*patchFaces, len(o.tri))] {
			for _, j := range tr {
				if j >= 0 && int(j) < len(o.vec) {
					best = math.Max(best, r3.Norm(r3.Sub(o.vec[j], c)))
				}
			}
		}
	}
	return best
}
