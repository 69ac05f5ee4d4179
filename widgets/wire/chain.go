package wire

import "gonum.org/v1/gonum/spatial/r3"

// Crease chains: an Outline's creases joined end to end into polylines,
// once per mesh, so that Draw projects each crease vertex once a pose and
// can merge runs of nearly collinear pieces on screen (a rim of 600 edges
// a few pixels across becomes a few dozen segments).

// chainTolerance is how far, in pixels, a merged segment may pass from the
// crease vertices it stands for: well under a line's width.
const chainTolerance = 0.2

// chainRun is the most crease edges one merged segment stands for, which
// bounds the work of checking a run.
const chainRun = 32

// buildChains walks the crease graph into chains: from every vertex where
// creases do not simply pass through (one, three or more creases) along
// each of its creases until the next such vertex, then round the closed
// loops left over. Every crease is in exactly one chain, as consecutive
// vertices.
func (o *Outline) buildChains(nv int) {
	if len(o.creases) == 0 {
		return
	}
	start := make([]int32, nv+1)
	for _, e := range o.creases {
		start[e[0]+1]++
		start[e[1]+1]++
	}
	for i := range nv {
		start[i+1] += start[i]
	}
	type half struct{ to, edge int32 }
	adj := make([]half, start[nv])
	fill := append([]int32(nil), start[:nv]...)
	for k, e := range o.creases {
		adj[fill[e[0]]] = half{e[1], int32(k)}
		fill[e[0]]++
		adj[fill[e[1]]] = half{e[0], int32(k)}
		fill[e[1]]++
	}
	used := make([]bool, len(o.creases))
	degree := func(v int32) int32 { return start[v+1] - start[v] }
	walk := func(from int32, first half) {
		o.chainStart = append(o.chainStart, int32(len(o.chainVerts)))
		o.chainVerts = append(o.chainVerts, from)
		h := first
		for {
			used[h.edge] = true
			o.chainVerts = append(o.chainVerts, h.to)
			v := h.to
			if degree(v) != 2 {
				return
			}
			next := half{edge: -1}
			for _, g := range adj[start[v]:start[v+1]] {
				if !used[g.edge] {
					next = g
				}
			}
			if next.edge < 0 {
				return // back at the start of a loop
			}
			h = next
		}
	}
	for v := range int32(nv) {
		if d := degree(v); d == 0 || d == 2 {
			continue
		}
		for _, h := range adj[start[v]:start[v+1]] {
			if !used[h.edge] {
				walk(v, h)
			}
		}
	}
	for k, e := range o.creases {
		if !used[k] {
			walk(e[0], half{e[1], int32(k)})
		}
	}
	o.chainStart = append(o.chainStart, int32(len(o.chainVerts)))
}

// Chains returns the number of crease chains and chain i's vertices, in
// order (a closed loop repeats its first vertex at the end).
func (o *Outline) Chains() int { return max(len(o.chainStart)-1, 0) }

// Chain returns the vertices of crease chain i (see Chains). The slice is
// shared: do not change it.
func (o *Outline) Chain(i int) []int32 { return o.chainVerts[o.chainStart[i]:o.chainStart[i+1]] }

// polyline draws the world points of a chain as few segments as keep
// within chainTolerance of every point. A chain with a point a
// perspective camera cannot see is drawn piece by piece, cut at the near
// plane.
func (d *drawer) polyline(pts []r3.Vec, k Kind, alpha float64) {
	d.screen = d.screen[:0]
	for _, p := range pts {
		x, y, ok := d.lens.Project(p)
		if !ok {
			for i := 1; i < len(pts); i++ {
				d.segment3(pts[i-1], pts[i], k, alpha)
			}
			return
		}
		d.screen = append(d.screen, [2]float64{x, y})
	}
	s := d.screen
	anchor := 0
	for i := 2; i < len(s); i++ {
		if i-anchor <= chainRun && within(s[anchor], s[i], s[anchor+1:i], chainTolerance) {
			continue
		}
		d.segment2(s[anchor], s[i-1], k, alpha)
		anchor = i - 1
	}
	if len(s) >= 2 {
		d.segment2(s[anchor], s[len(s)-1], k, alpha)
	}
}

// within reports whether every point of mid is within tol of the segment
// a-b and lies between its ends.
func within(a, b [2]float64, mid [][2]float64, tol float64) bool {
	dx, dy := b[0]-a[0], b[1]-a[1]
	l2 := dx*dx + dy*dy
	for _, p := range mid {
		px, py := p[0]-a[0], p[1]-a[1]
		t := px*dx + py*dy
		if t < 0 || t > l2 {
			return false
		}
		cr := px*dy - py*dx // |cross| = distance * |ab|
		if cr*cr > tol*tol*l2 {
			return false
		}
	}
	return true
}
