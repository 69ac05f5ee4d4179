package meshio

import (
	"bytes"
	"encoding/binary"
	"encoding/json"
	"fmt"
	"math"
	"strings"

	"gonum.org/v1/gonum/spatial/r3"
)

// Writers of small test files, and the test solid.

// lumpQuads is the test solid: a box-like hexahedron whose corners are
// moved by different amounts (so it has no symmetry and its products of
// inertia are not zero), as six quadrilaterals wound counter-clockwise seen
// from outside. Every coordinate is a multiple of 1/256 m, exact in float32
// both in metres and in millimetres.
func lumpQuads() [][4]r3.Vec {
	const u = 1.0 / 256
	jitter := [2][2][2]r3.Vec{
		{{{X: 0, Y: 0, Z: 0}, {X: 3 * u, Y: -2 * u, Z: 5 * u}}, {{X: -4 * u, Y: 6 * u, Z: 0}, {X: 2 * u, Y: 2 * u, Z: -3 * u}}},
		{{{X: 7 * u, Y: u, Z: -2 * u}, {X: 0, Y: 5 * u, Z: 1 * u}}, {{X: -3 * u, Y: -u, Z: 4 * u}, {X: 9 * u, Y: 3 * u, Z: 6 * u}}},
	}
	size := r3.Vec{X: 64 * u, Y: 24 * u, Z: 40 * u}
	origin := r3.Vec{X: 10 * u, Y: -20 * u, Z: 30 * u}
	p := func(i, j, k int) r3.Vec {
		return r3.Add(r3.Add(origin, r3.Vec{X: float64(i) * size.X, Y: float64(j) * size.Y, Z: float64(k) * size.Z}), jitter[i][j][k])
	}
	return [][4]r3.Vec{
		{p(0, 0, 0), p(0, 1, 0), p(1, 1, 0), p(1, 0, 0)},
		{p(0, 0, 1), p(1, 0, 1), p(1, 1, 1), p(0, 1, 1)},
		{p(0, 0, 0), p(1, 0, 0), p(1, 0, 1), p(0, 0, 1)},
		{p(0, 1, 0), p(0, 1, 1), p(1, 1, 1), p(1, 1, 0)},
		{p(0, 0, 0), p(0, 0, 1), p(0, 1, 1), p(0, 1, 0)},
		{p(1, 0, 0), p(1, 1, 0), p(1, 1, 1), p(1, 0, 1)},
	}
}

// fans splits quads into triangles from their first corner.
func fans(q [][4]r3.Vec) [][3]r3.Vec {
	var t [][3]r3.Vec
	for _, f := range q {
		t = append(t, [3]r3.Vec{f[0], f[1], f[2]}, [3]r3.Vec{f[0], f[2], f[3]})
	}
	return t
}

func mapTris(t [][3]r3.Vec, f func(r3.Vec) r3.Vec) [][3]r3.Vec {
	out := make([][3]r3.Vec, len(t))
	for i, tri := range t {
		for k, p := range tri {
			out[i][k] = f(p)
		}
	}
	return out
}

// toMMZUp writes prop-frame metres as a z-up millimetre file's numbers.
func toMMZUp(p r3.Vec) r3.Vec { return r3.Vec{X: 1000 * p.X, Y: -1000 * p.Z, Z: 1000 * p.Y} }

func stlBinary(t [][3]r3.Vec, header string) []byte {
	var b bytes.Buffer
	h := make([]byte, 80)
	copy(h, header)
	b.Write(h)
	binary.Write(&b, binary.LittleEndian, uint32(len(t)))
	for _, tri := range t {
		n := r3.Unit(r3.Cross(r3.Sub(tri[1], tri[0]), r3.Sub(tri[2], tri[0])))
		for _, p := range append([]r3.Vec{n}, tri[:]...) {
			binary.Write(&b, binary.LittleEndian, [3]float32{float32(p.X), float32(p.Y), float32(p.Z)})
		}
		b.Write([]byte{0, 0})
	}
	return b.Bytes()
}

func stlASCII(t [][3]r3.Vec) []byte {
	var b strings.Builder
	b.WriteString("solid lump\n")
	for _, tri := range t {
		b.WriteString("  facet normal 0 0 0\n    outer loop\n")
		for _, p := range tri {
			fmt.Fprintf(&b, "      vertex %g %g %g\n", p.X, p.Y, p.Z)
		}
		b.WriteString("    endloop\n  endfacet\n")
	}
	b.WriteString("endsolid lump\n")
	return []byte(b.String())
}

// objQuads writes the quads as an OBJ with every index form: plain,
// negative, v/t, v//n and v/t/n, plus lines that carry nothing for mass.
func objQuads(q [][4]r3.Vec) []byte {
	var b strings.Builder
	b.WriteString("# lump\nmtllib lump.mtl\no lump\ng body\nusemtl wood\ns 1\nvt 0 0\nvn 0 0 1\n")
	var verts []r3.Vec
	index := map[r3.Vec]int{}
	for _, f := range q {
		for _, p := range f {
			if _, ok := index[p]; !ok {
				verts = append(verts, p)
				index[p] = len(verts)
			}
		}
	}
	for _, p := range verts {
		fmt.Fprintf(&b, "v %.17g %.17g %.17g\n", p.X, p.Y, p.Z)
	}
	forms := []string{"%d", "%d/1", "%d//1", "%d/1/1"}
	for i, f := range q {
		b.WriteString("f")
		for k, p := range f {
			n := index[p]
			if (i+k)%3 == 0 {
				n = n - len(verts) - 1 // the same vertex counted back from the end
			}
			fmt.Fprintf(&b, " "+forms[(i+k)%4], n)
		}
		b.WriteString("\n")
	}
	return []byte(b.String())
}

// gltfParts builds a one-buffer glTF from positions and triangle indices
// (u32), with the given nodes JSON; the buffer's uri is left to the caller.
func gltfJSON(nodes string, meshes string, accessors string, views string, bufLen int, uri string) []byte {
	u := ""
	if uri != "" {
		u = fmt.Sprintf(`,"uri":%q`, uri)
	}
	return []byte(fmt.Sprintf(`{"asset":{"version":"2.0"},"scene":0,"scenes":[{"nodes":[0]}],"nodes":%s,"meshes":%s,"accessors":%s,"bufferViews":%s,"buffers":[{"byteLength":%d%s}]}`,
		nodes, meshes, accessors, views, bufLen, u))
}

// meshBuffer lays out positions (float32 VEC3) and u32 indices of welded
// triangles; it returns the bytes and the JSON of the two accessors and views.
func meshBuffer(t [][3]r3.Vec) (bin []byte, accessors, views string) {
	var pos []r3.Vec
	index := map[r3.Vec]uint32{}
	var idx []uint32
	for _, tri := range t {
		for _, p := range tri {
			j, ok := index[p]
			if !ok {
				j = uint32(len(pos))
				index[p] = j
				pos = append(pos, p)
			}
			idx = append(idx, j)
		}
	}
	var b bytes.Buffer
	for _, p := range pos {
		binary.Write(&b, binary.LittleEndian, [3]float32{float32(p.X), float32(p.Y), float32(p.Z)})
	}
	pl := b.Len()
	binary.Write(&b, binary.LittleEndian, idx)
	accessors = fmt.Sprintf(`[{"bufferView":0,"componentType":5126,"count":%d,"type":"VEC3"},{"bufferView":1,"componentType":5125,"count":%d,"type":"SCALAR"}]`, len(pos), len(idx))
	views = fmt.Sprintf(`[{"buffer":0,"byteOffset":0,"byteLength":%d},{"buffer":0,"byteOffset":%d,"byteLength":%d}]`, pl, pl, b.Len()-pl)
	return b.Bytes(), accessors, views
}

// glb packs JSON and BIN chunks into a GLB container.
func glb(js, bin []byte) []byte {
	pad := func(b []byte, c byte) []byte {
		for len(b)%4 != 0 {
			b = append(b, c)
		}
		return b
	}
	js, bin = pad(append([]byte(nil), js...), ' '), pad(append([]byte(nil), bin...), 0)
	var b bytes.Buffer
	le := binary.LittleEndian
	total := 12 + 8 + len(js)
	if bin != nil {
		total += 8 + len(bin)
	}
	binary.Write(&b, le, [3]uint32{0x46546C67, 2, uint32(total)})
	binary.Write(&b, le, [2]uint32{uint32(len(js)), 0x4E4F534A})
	b.Write(js)
	if bin != nil {
		binary.Write(&b, le, [2]uint32{uint32(len(bin)), 0x004E4942})
		b.Write(bin)
	}
	return b.Bytes()
}

func mustJSON(v any) string {
	b, err := json.Marshal(v)
	if err != nil {
		panic(err)
	}
	return string(b)
}

var _ = math.Pi
