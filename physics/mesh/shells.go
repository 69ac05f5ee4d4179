package mesh

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"
)

// Shells: the closed pieces of a mesh and their winding.
//
// A mesh of several shells is one solid whose signed volumes add: a shell
// wound inward inside another is a cavity and subtracts. A shell wound
// inward that lies inside no other shell cannot be a cavity: it is a solid
// whose faces the file turned the wrong way (one object's normals flipped
// on export), and it is turned outward like a mesh wound inward
// throughout.

// maxInwardShells bounds the inward shells tested for containment: each
// test reads the boxes of every shell and the triangles of those whose box
// holds the shell, so thousands of them would cost seconds. Past it the
// shells are kept as the file winds them.
const maxInwardShells = 4096

// shellLabels returns the shell (connected piece, union-find with path
// halving over the n vertices) of each triangle of t, numbered 0..count-1
// in first-use order, and count.
func shellLabels(n int, t [][3]int32) ([]int32, int) {
	parent := make([]int32, n)
	for i := range parent {
		parent[i] = int32(i)
	}
	find := func(x int32) int32 {
		for parent[x] != x {
			parent[x] = parent[parent[x]]
			x = parent[x]
		}
		return x
	}
	for _, tri := range t {
		for k := 1; k < 3; k++ {
			if a, b := find(tri[0]), find(tri[k]); a != b {
				parent[a] = b
			}
		}
	}
	number := make([]int32, n)
	for i := range number {
		number[i] = -1
	}
	labels := make([]int32, len(t))
	count := 0
	for i, tri := range t {
		r := find(tri[0])
		if number[r] < 0 {
			number[r] = int32(count)
			count++
		}
		labels[i] = number[r]
	}
	return labels, count
}

// turnLoneInward turns outward every shell of m wound inward (negative
// signed volume) that lies inside no other shell, and returns which shells
// it turned (nil for none). labels and count are shellLabels of m.T.
func turnLoneInward(m *Mesh, labels []int32, count int) []bool {
	lo, hi := bounds(m.V)
	r := r3.Scale(0.5, r3.Add(lo, hi))
	vol := make([]ksum, count)
	for i, t := range m.T {
		a, b, c := r3.Sub(m.V[t[0]], r), r3.Sub(m.V[t[1]], r), r3.Sub(m.V[t[2]], r)
		vol[labels[i]].add(r3.Dot(a, r3.Cross(b, c)))
	}
	var inward []int32
	for k := range count {
		if vol[k].sum() < 0 {
			inward = append(inward, int32(k))
		}
	}
	if len(inward) == 0 || len(inward) > maxInwardShells {
		return nil
	}
	boxLo := make([]r3.Vec, count)
	boxHi := make([]r3.Vec, count)
	seen := make([]bool, count)
	for i, t := range m.T {
		k := labels[i]
		for _, j := range t {
			p := m.V[j]
			if !seen[k] {
				boxLo[k], boxHi[k], seen[k] = p, p, true
			}
			boxLo[k] = r3.Vec{X: math.Min(boxLo[k].X, p.X), Y: math.Min(boxLo[k].Y, p.Y), Z: math.Min(boxLo[k].Z, p.Z)}
			boxHi[k] = r3.Vec{X: math.Max(boxHi[k].X, p.X), Y: math.Max(boxHi[k].Y, p.Y), Z: math.Max(boxHi[k].Z, p.Z)}
		}
	}
	// One vertex of each shell stands for it: shells share no vertex.
	first := make([]int32, count)
	for i := range first {
		first[i] = -1
	}
	for i, t := range m.T {
		if first[labels[i]] < 0 {
			first[labels[i]] = t[0]
		}
	}
	turn := make([]bool, count)
	turned := false
	for _, k := range inward {
		p := m.V[first[k]]
		inside := false
		for j := range count {
			if j == int(k) || !inBox(p, boxLo[j], boxHi[j]) {
				continue
			}
			if math.Abs(winding(m, labels, int32(j), p)) > 0.5 {
				inside = true
				break
			}
		}
		if !inside {
			turn[k] = true
			turned = true
		}
	}
	if !turned {
		return nil
	}
	for i := range m.T {
		if turn[labels[i]] {
			m.T[i][1], m.T[i][2] = m.T[i][2], m.T[i][1]
		}
	}
	return turn
}

func inBox(p, lo, hi r3.Vec) bool {
	return p.X >= lo.X && p.X <= hi.X && p.Y >= lo.Y && p.Y <= hi.Y && p.Z >= lo.Z && p.Z <= hi.Z
}

// winding returns the winding number of shell k of m about the point p:
// the solid angle its triangles subtend at p over 4 pi, each triangle's by
// A. van Oosterom and J. Strackee, "The solid angle of a plane triangle",
// IEEE Trans. Biomed. Eng. 30(2) (1983) 125-126:
//
//	tan(Omega/2) = a.(b x c) / (|a||b||c| + (a.b)|c| + (a.c)|b| + (b.c)|a|)
//
// with a, b, c the corners relative to p. It is +-1 inside a closed shell
// (the sign of its winding) and 0 outside.
func winding(m *Mesh, labels []int32, k int32, p r3.Vec) float64 {
	var sum ksum
	for i, t := range m.T {
		if labels[i] != k {
			continue
		}
		a, b, c := r3.Sub(m.V[t[0]], p), r3.Sub(m.V[t[1]], p), r3.Sub(m.V[t[2]], p)
		la, lb, lc := r3.Norm(a), r3.Norm(b), r3.Norm(c)
		num := r3.Dot(a, r3.Cross(b, c))
		den := la*lb*lc + r3.Dot(a, b)*lc + r3.Dot(a, c)*lb + r3.Dot(b, c)*la
		sum.add(2 * math.Atan2(num, den))
	}
	return sum.sum() / (4 * math.Pi)
}
