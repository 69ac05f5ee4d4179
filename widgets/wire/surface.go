package wire

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"
)

// Surface returns the welded triangle mesh (v, t) as a Mesh for export:
// its triangles with a unit normal at every corner, smooth across edges
// under the crease angle and sharp across creases, the way a 3D package
// shades a model with auto-smoothing.
//
// The normal at a corner of face f is the mean of the unit normals of the
// faces round that vertex whose normal is within angle (radians;
// CreaseAngle outside (0, pi)) of f's own, each weighted by the face's
// angle at the vertex (G. Thürmer and C. A. Wüthrich, "Computing vertex
// normals from polygonal facets", J. Graphics Tools 3(1), 1998; from
// memory), so the normal does not depend on how a quad was split. A vertex is repeated
// once for each different corner normal it gets (so a box's corner has
// three copies, a smooth sphere's vertex one), as glTF 2.0 expects. Edges
// are the outline's creases, on the first copy of each vertex.
//
// Triangles that repeat a vertex, index outside v or have no area are left
// out.
func Surface(v []r3.Vec, t [][3]int32, angle float64) Mesh {
	if !(angle > 0 && angle < math.Pi) {
		angle = CreaseAngle
	}
	cosMax := math.Cos(angle)
	nv := int32(len(v))
	unit, good := faceUnits(v, t)
	start, round := facesRound(t, good, nv)
	out, first := splitCorners(v, t, unit, good, start, round, cosMax)
	for _, e := range NewOutline(v, t, angle).Creases() {
		out.Edges = append(out.Edges, [2]uint32{uint32(first[e[0]]), uint32(first[e[1]])})
	}
	return out
}

// faceUnits returns each face's unit normal and whether the face is good:
// it indexes inside v and has an area.
func faceUnits(v []r3.Vec, t [][3]int32) (unit []r3.Vec, good []bool) {
	nv := int32(len(v))
	unit = make([]r3.Vec, len(t))
	good = make([]bool, len(t))
	for f, tr := range t {
		if tr[0] < 0 || tr[1] < 0 || tr[2] < 0 || tr[0] >= nv || tr[1] >= nv || tr[2] >= nv {
			continue
		}
		a := v[tr[0]]
		n := r3.Cross(r3.Sub(v[tr[1]], a), r3.Sub(v[tr[2]], a))
		l := r3.Norm(n)
		if !(l > 0) || math.IsInf(l, 0) {
			continue
		}
		unit[f], good[f] = r3.Scale(1/l, n), true
	}
	return unit, good
}

// facesRound returns the good faces round each vertex, by a counting sort
// on the vertex: those of vertex i are round[start[i]:start[i+1]].
func facesRound(t [][3]int32, good []bool, nv int32) (start, round []int32) {
	start = make([]int32, nv+1)
	for f, tr := range t {
		if good[f] {
			for _, i := range tr {
				start[i+1]++
			}
		}
	}
	for i := range nv {
		start[i+1] += start[i]
	}
	round = make([]int32, start[nv])
	fill := append([]int32(nil), start[:nv]...)
	for f, tr := range t {
		if good[f] {
			for _, i := range tr {
				round[fill[i]] = int32(f)
				fill[i]++
			}
		}
	}
	return start, round
}

// splitCorners gives every vertex one output copy for each different
// corner normal round it (the angle-weighted mean of the face normals
// within the crease angle of the corner's face, cosine cosMax), and the
// good triangles on those copies. first is the first copy of each input
// vertex, -1 for none.
func splitCorners(v []r3.Vec, t [][3]int32, unit []r3.Vec, good []bool, start, round []int32, cosMax float64) (out Mesh, first []int32) {
	nv := int32(len(v))
	first = make([]int32, nv) // first output copy of each vertex, -1 for none
	for i := range first {
		first[i] = -1
	}
	// corner[f*3+k] is the output vertex of corner k of face f.
	corner := make([]uint32, 3*len(t))
	type copyOf struct {
		n   r3.Vec
		out uint32
	}
	var copies []copyOf
	var weight []float64
	for i := range nv {
		faces := round[start[i]:start[i+1]]
		copies = copies[:0]
		weight = weight[:0]
		for _, g := range faces {
			weight = append(weight, cornerAngle(v, t[g], i))
		}
		for _, f := range faces {
			nf := unit[f]
			var sum r3.Vec
			for k, g := range faces {
				if r3.Dot(unit[g], nf) >= cosMax {
					sum = r3.Add(sum, r3.Scale(weight[k], unit[g]))
				}
			}
			n := r3.Unit(sum) // sum includes f itself
			if !finite(n.X) || !finite(n.Y) || !finite(n.Z) {
				n = nf
			}
			idx := uint32(0)
			found := false
			for _, c := range copies {
				if c.n == n {
					idx, found = c.out, true
					break
				}
			}
			if !found {
				idx = uint32(len(out.Vertices))
				out.Vertices = append(out.Vertices, v[i])
				out.Normals = append(out.Normals, n)
				copies = append(copies, copyOf{n, idx})
				if first[i] < 0 {
					first[i] = int32(idx)
				}
			}
			for k, j := range t[f] {
				if j == i {
					corner[3*int(f)+k] = idx
				}
			}
		}
	}
	for f := range t {
		if good[f] {
			out.Triangles = append(out.Triangles, [3]uint32{corner[3*f], corner[3*f+1], corner[3*f+2]})
		}
	}
	return out, first
}

// cornerAngle returns the angle of triangle tr at its vertex i, radians.
func cornerAngle(v []r3.Vec, tr [3]int32, i int32) float64 {
	k := 0
	for tr[k] != i {
		k++
	}
	p := v[i]
	a, b := r3.Sub(v[tr[(k+1)%3]], p), r3.Sub(v[tr[(k+2)%3]], p)
	return math.Atan2(r3.Norm(r3.Cross(a, b)), r3.Dot(a, b))
}
