package meshio

import (
	"encoding/base64"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics/mesh"
)

// sameSolidTol: the same solid written as STL (mm, z up), OBJ and GLB gives
// the same numbers to this relative tolerance (issue 8).
const sameSolidTol = 1e-9

func solidOf(t *testing.T, tris [][3]r3.Vec) mesh.Moments {
	t.Helper()
	m, _, err := mesh.New(tris)
	if err != nil {
		t.Fatal(err)
	}
	return m.Solid()
}

func compareMoments(t *testing.T, what string, got, want mesh.Moments) {
	t.Helper()
	if math.Abs(got.Measure-want.Measure) > sameSolidTol*want.Measure {
		t.Errorf("%s: volume %.15g, want %.15g", what, got.Measure, want.Measure)
	}
	if r3.Norm(r3.Sub(got.Center, want.Center)) > sameSolidTol*r3.Norm(want.Center) {
		t.Errorf("%s: centre %v, want %v", what, got.Center, want.Center)
	}
	scale := math.Abs(want.Inertia[0][0])
	for i := range 3 {
		for j := range 3 {
			if math.Abs(got.Inertia[i][j]-want.Inertia[i][j]) > sameSolidTol*scale {
				t.Errorf("%s: inertia[%d][%d] %.15g, want %.15g", what, i, j, got.Inertia[i][j], want.Inertia[i][j])
			}
		}
	}
}

func write(t *testing.T, dir, name string, data []byte) string {
	t.Helper()
	p := filepath.Join(dir, name)
	if err := os.WriteFile(p, data, 0o644); err != nil {
		t.Fatal(err)
	}
	return p
}

// TestReadFile_SameSolidEveryFormat: one solid as binary STL (mm, z up, a
// header that begins with "solid"), ASCII STL (mm, z up), OBJ with quads
// and every index form (m), GLB, and .gltf with a side-car .bin and with
// a data URI, all read to the same mass properties.
func TestReadFile_SameSolidEveryFormat(t *testing.T) {
	dir := t.TempDir()
	quads := lumpQuads()
	tris := fans(quads)
	want := solidOf(t, tris)
	if want.Measure <= 0 || want.Inertia[0][1] == 0 {
		t.Fatalf("test solid: %+v", want)
	}
	mm := mapTris(tris, toMMZUp)
	bin, acc, views := meshBuffer(tris)
	nodes := `[{"mesh":0}]`
	meshes := `[{"primitives":[{"attributes":{"POSITION":0},"indices":1}]}]`
	write(t, dir, "lump.bin", bin)
	files := []struct {
		name string
		data []byte
		o    Options
	}{
		{"lump-binary.stl", stlBinary(mm, "solid lump, but binary"), Options{Units: "mm", UpZ: true}},
		{"lump-ascii.STL", stlASCII(mm), Options{Units: "mm", UpZ: true}},
		{"lump.obj", objQuads(quads), Options{}},
		{"lump.glb", glb(gltfJSON(nodes, meshes, acc, views, len(bin), ""), bin), Options{Units: "m"}},
		{"lump.gltf", gltfJSON(nodes, meshes, acc, views, len(bin), "lump.bin"), Options{}},
		{"lump-embedded.gltf", gltfJSON(nodes, meshes, acc, views, len(bin), "data:application/octet-stream;base64,"+base64.StdEncoding.EncodeToString(bin)), Options{}},
	}
	for _, f := range files {
		got, err := ReadFile(write(t, dir, f.name, f.data), f.o)
		if err != nil {
			t.Errorf("%s: %v", f.name, err)
			continue
		}
		if len(got) != 12 {
			t.Errorf("%s: %d triangles, want 12", f.name, len(got))
		}
		compareMoments(t, f.name, solidOf(t, got), want)
	}
}

// TestReadFile_Units: the same OBJ in every unit scales the volume by the
// unit's cube (NIST SP 811 App. B: 1 in = 0.0254 m, 1 ft = 0.3048 m).
func TestReadFile_Units(t *testing.T) {
	dir := t.TempDir()
	p := write(t, dir, "lump.obj", objQuads(lumpQuads()))
	base := solidOf(t, fans(lumpQuads())).Measure
	for name, s := range map[string]float64{"m": 1, "cm": 0.01, "mm": 0.001, "in": 0.0254, "ft": 0.3048} {
		tris, err := ReadFile(p, Options{Units: name})
		if err != nil {
			t.Fatal(err)
		}
		if got := solidOf(t, tris).Measure; math.Abs(got-base*s*s*s) > 1e-12*base*s*s*s {
			t.Errorf("%s: volume %g, want %g", name, got, base*s*s*s)
		}
	}
	if _, err := ReadFile(p, Options{Units: "yd"}); err == nil || !strings.Contains(err.Error(), "not a unit") {
		t.Errorf("yd: %v", err)
	}
}

// TestGLTF_NodeTransforms: nested nodes with TRS and a column-major matrix
// apply as parent · T · R · S · child matrix (Specification 2.0.1 §3.5.2,
// §5.25). The expected corners are computed another way: the matrix by
// rows, then scale, the rotation as q v q*, then translation.
func TestGLTF_NodeTransforms(t *testing.T) {
	tris := fans(lumpQuads())
	bin, acc, views := meshBuffer(tris)
	// Child matrix: a shear-free turn of 90 degrees about x plus a shift,
	// written column major.
	m := [16]float64{1, 0, 0, 0, 0, 0, 1, 0, 0, -1, 0, 0, 0.5, 0.25, -1, 1}
	q := [4]float64{0.1, 0.7, -0.3, 0.64} // x y z w, not quite unit: the reader normalises
	tr := [3]float64{1, 2, 3}
	sc := [3]float64{2, 0.5, 1.5}
	nodes := mustJSON([]any{
		map[string]any{"translation": tr, "rotation": q, "scale": sc, "children": []int{1}},
		map[string]any{"matrix": m, "mesh": 0},
	})
	meshes := `[{"primitives":[{"attributes":{"POSITION":0},"indices":1,"mode":4}]}]`
	got, err := ReadGLB(glb(gltfJSON(nodes, meshes, acc, views, len(bin), ""), bin))
	if err != nil {
		t.Fatal(err)
	}
	l := math.Sqrt(q[0]*q[0] + q[1]*q[1] + q[2]*q[2] + q[3]*q[3])
	qv := r3.Vec{X: q[0] / l, Y: q[1] / l, Z: q[2] / l}
	qw := q[3] / l
	rotate := func(v r3.Vec) r3.Vec { // v + 2w (qv x v) + 2 qv x (qv x v)
		c := r3.Cross(qv, v)
		return r3.Add(v, r3.Add(r3.Scale(2*qw, c), r3.Scale(2, r3.Cross(qv, c))))
	}
	want := mapTris(tris, func(p r3.Vec) r3.Vec {
		p = r3.Vec{X: float64(float32(p.X)), Y: float64(float32(p.Y)), Z: float64(float32(p.Z))}
		p = r3.Vec{ // rows of the column-major matrix
			X: m[0]*p.X + m[4]*p.Y + m[8]*p.Z + m[12],
			Y: m[1]*p.X + m[5]*p.Y + m[9]*p.Z + m[13],
			Z: m[2]*p.X + m[6]*p.Y + m[10]*p.Z + m[14],
		}
		p = r3.Vec{X: sc[0] * p.X, Y: sc[1] * p.Y, Z: sc[2] * p.Z}
		return r3.Add(rotate(p), r3.Vec{X: tr[0], Y: tr[1], Z: tr[2]})
	})
	for i := range want {
		for k := range 3 {
			if r3.Norm(r3.Sub(got[i][k], want[i][k])) > 1e-12 {
				t.Fatalf("triangle %d corner %d: %v, want %v", i, k, got[i][k], want[i][k])
			}
		}
	}
}

// TestGLTF_IndexTypesAndMirror: u8, u16 and u32 indices, no indices at all,
// interleaved positions (byte stride), and a mirroring node (scale -1),
// which reverses the winding (§3.7.4), all give the same solid.
//
// Long: one file built case by case (each index type, a mirrored node),
// checked against the same box.
func TestGLTF_IndexTypesAndMirror(t *testing.T) {
	tris := fans(lumpQuads())
	want := solidOf(t, tris)
	var pos []r3.Vec
	index := map[r3.Vec]int{}
	var idx []int
	for _, tri := range tris {
		for _, p := range tri {
			if _, ok := index[p]; !ok {
				index[p] = len(pos)
				pos = append(pos, p)
			}
			idx = append(idx, index[p])
		}
	}
	le := func(b []byte, v uint64, n int) []byte {
		for i := range n {
			b = append(b, byte(v>>(8*i)))
		}
		return b
	}
	f32 := func(b []byte, v float64) []byte { return le(b, uint64(math.Float32bits(float32(v))), 4) }
	// View 0: positions interleaved with 4 bytes of padding (stride 16).
	var bin []byte
	for _, p := range pos {
		bin = f32(f32(f32(bin, p.X), p.Y), p.Z)
		bin = le(bin, 0xdeadbeef, 4)
	}
	posLen := len(bin)
	var views []string
	views = append(views, `{"buffer":0,"byteOffset":0,"byteLength":`+itoa(posLen)+`,"byteStride":16}`)
	accs := []string{`{"bufferView":0,"componentType":5126,"count":` + itoa(len(pos)) + `,"type":"VEC3"}`}
	for _, size := range []int{1, 2, 4} {
		for len(bin)%4 != 0 {
			bin = append(bin, 0)
		}
		off := len(bin)
		for _, i := range idx {
			bin = le(bin, uint64(i), size)
		}
		views = append(views, `{"buffer":0,"byteOffset":`+itoa(off)+`,"byteLength":`+itoa(len(bin)-off)+`}`)
		comp := map[int]int{1: 5121, 2: 5123, 4: 5125}[size]
		accs = append(accs, `{"bufferView":`+itoa(len(views)-1)+`,"componentType":`+itoa(comp)+`,"count":`+itoa(len(idx))+`,"type":"SCALAR"}`)
	}
	// Non-indexed positions: every corner written out.
	for len(bin)%4 != 0 {
		bin = append(bin, 0)
	}
	off := len(bin)
	for _, tri := range tris {
		for _, p := range tri {
			bin = f32(f32(f32(bin, p.X), p.Y), p.Z)
		}
	}
	views = append(views, `{"buffer":0,"byteOffset":`+itoa(off)+`,"byteLength":`+itoa(len(bin)-off)+`}`)
	accs = append(accs, `{"bufferView":`+itoa(len(views)-1)+`,"componentType":5126,"count":`+itoa(3*len(tris))+`,"type":"VEC3"}`)
	prims := map[string]string{
		"u8":          `{"attributes":{"POSITION":0},"indices":1}`,
		"u16":         `{"attributes":{"POSITION":0},"indices":2}`,
		"u32":         `{"attributes":{"POSITION":0},"indices":3}`,
		"non-indexed": `{"attributes":{"POSITION":4}}`,
	}
	for name, prim := range prims {
		for _, mirror := range []bool{false, true} {
			node := `[{"mesh":0}]`
			if mirror {
				node = `[{"scale":[-1,1,1],"mesh":0}]`
			}
			js := gltfJSON(node, `[{"primitives":[`+prim+`,{"attributes":{"POSITION":0},"mode":1}]}]`,
				"["+strings.Join(accs, ",")+"]", "["+strings.Join(views, ",")+"]", len(bin), "")
			got, err := ReadGLB(glb(js, bin))
			if err != nil {
				t.Fatalf("%s: %v", name, err)
			}
			m, notes, err := mesh.New(got)
			if err != nil {
				t.Fatalf("%s mirror %v: %v", name, mirror, err)
			}
			if len(notes) != 0 {
				t.Errorf("%s mirror %v: notes %q (winding not kept outward?)", name, mirror, notes)
			}
			s := m.Solid()
			if mirror {
				s.Center.X = -s.Center.X
				s.Inertia[0][1], s.Inertia[1][0] = -s.Inertia[0][1], -s.Inertia[1][0]
				s.Inertia[0][2], s.Inertia[2][0] = -s.Inertia[0][2], -s.Inertia[2][0]
			}
			compareMoments(t, name, s, want)
		}
	}
}

func itoa(n int) string { return strconv.Itoa(n) }
