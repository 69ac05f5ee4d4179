package project

import (
	"bytes"
	"encoding/binary"
	"flag"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"testing"
)

var updateSamples = flag.Bool("update-mesh-samples", false, "rewrite testdata/mesh from the generator in this test")

// The mesh samples under testdata/mesh: one crate, 0.5 x 0.25 x 0.125 m
// centred at (0.25, 0.125, 0) in the prop frame, as an OBJ (metres, y up),
// a binary STL (millimetres, z up) and a GLB, each with a project file.
// Every coordinate is exact in float32 in metres and in millimetres.

// sampleQuads are the crate's faces in the prop frame, wound outward.
func sampleQuads() [][4][3]float64 {
	p := func(i, j, k float64) [3]float64 { return [3]float64{0.5 * i, 0.25*j - 0, 0.125*k - 0.0625} }
	return [][4][3]float64{
		{p(1, 0, 0), p(1, 1, 0), p(1, 1, 1), p(1, 0, 1)},
		{p(0, 0, 0), p(0, 0, 1), p(0, 1, 1), p(0, 1, 0)},
		{p(0, 1, 0), p(0, 1, 1), p(1, 1, 1), p(1, 1, 0)},
		{p(0, 0, 0), p(1, 0, 0), p(1, 0, 1), p(0, 0, 1)},
		{p(0, 0, 1), p(1, 0, 1), p(1, 1, 1), p(0, 1, 1)},
		{p(0, 0, 0), p(0, 1, 0), p(1, 1, 0), p(1, 0, 0)},
	}
}

// Long: a table, one entry a sample file.
func sampleFiles() map[string][]byte {
	q := sampleQuads()
	var tris [][3][3]float64
	for _, f := range q {
		tris = append(tris, [3][3]float64{f[0], f[1], f[2]}, [3][3]float64{f[0], f[2], f[3]})
	}
	files := map[string][]byte{}
	// OBJ, quads, metres, y up.
	var obj bytes.Buffer
	obj.WriteString("# crate sample: 0.5 x 0.25 x 0.125 m, metres, y up\n")
	var verts [][3]float64
	idx := map[[3]float64]int{}
	for _, f := range q {
		for _, v := range f {
			if _, ok := idx[v]; !ok {
				verts = append(verts, v)
				idx[v] = len(verts)
			}
		}
	}
	for _, v := range verts {
		fmt.Fprintf(&obj, "v %g %g %g\n", v[0], v[1], v[2])
	}
	for _, f := range q {
		fmt.Fprintf(&obj, "f %d %d %d %d\n", idx[f[0]], idx[f[1]], idx[f[2]], idx[f[3]])
	}
	files["crate.obj"] = obj.Bytes()
	// Binary STL, millimetres, z up: prop (x, y, z) is file (x, -z, y).
	var stl bytes.Buffer
	header := make([]byte, 80)
	copy(header, "solid crate sample (binary STL, mm, z up)")
	stl.Write(header)
	binary.Write(&stl, binary.LittleEndian, uint32(len(tris)))
	for _, t := range tris {
		binary.Write(&stl, binary.LittleEndian, [3]float32{})
		for _, v := range t {
			binary.Write(&stl, binary.LittleEndian, [3]float32{float32(1000 * v[0]), float32(-1000 * v[2]), float32(1000 * v[1])})
		}
		stl.Write([]byte{0, 0})
	}
	files["crate.stl"] = stl.Bytes()
	// GLB: positions and u16 indices in one buffer, the node turning
	// nothing.
	var bin bytes.Buffer
	for _, v := range verts {
		binary.Write(&bin, binary.LittleEndian, [3]float32{float32(v[0]), float32(v[1]), float32(v[2])})
	}
	posLen := bin.Len()
	for _, t := range tris {
		for _, v := range t {
			binary.Write(&bin, binary.LittleEndian, uint16(idx[v]-1))
		}
	}
	for bin.Len()%4 != 0 {
		bin.WriteByte(0)
	}
	js := fmt.Sprintf(`{"asset":{"version":"2.0","generator":"Propflight test samples"},"scene":0,"scenes":[{"nodes":[0]}],"nodes":[{"name":"crate","mesh":0}],`+
		`"meshes":[{"primitives":[{"attributes":{"POSITION":0},"indices":1}]}],`+
		`"accessors":[{"bufferView":0,"componentType":5126,"count":%d,"type":"VEC3","min":[0,0,-0.0625],"max":[0.5,0.25,0.0625]},{"bufferView":1,"componentType":5123,"count":%d,"type":"SCALAR"}],`+
		`"bufferViews":[{"buffer":0,"byteOffset":0,"byteLength":%d,"target":34962},{"buffer":0,"byteOffset":%d,"byteLength":%d,"target":34963}],"buffers":[{"byteLength":%d}]}`,
		len(verts), 3*len(tris), posLen, posLen, 6*len(tris), bin.Len())
	for len(js)%4 != 0 {
		js += " "
	}
	var glb bytes.Buffer
	binary.Write(&glb, binary.LittleEndian, [3]uint32{0x46546C67, 2, uint32(12 + 8 + len(js) + 8 + bin.Len())})
	binary.Write(&glb, binary.LittleEndian, [2]uint32{uint32(len(js)), 0x4E4F534A})
	glb.WriteString(js)
	binary.Write(&glb, binary.LittleEndian, [2]uint32{uint32(bin.Len()), 0x004E4942})
	glb.Write(bin.Bytes())
	files["crate.glb"] = glb.Bytes()
	for _, f := range []struct{ name, mesh, extra string }{
		{"crate-obj.json", "crate.obj", ""},
		{"crate-stl.json", "crate.stl", `, "units": "mm", "up": "z"`},
		{"crate-glb.json", "crate.glb", ""},
	} {
		files[f.name] = []byte(`{
  "format": "propflight/v1",
  "name": "crate sample (` + f.mesh + `)",
  "prop": {
    "parts": [
      {
        "name": "crate",
        "shape": "mesh",
        "file": "` + f.mesh + `"` + f.extra + `,
        "density": 500
      }
    ]
  },
  "throw": {
    "release_velocity": [1, 4, 0],
    "spin": {"axis": "greatest", "tilt_deg": 3, "turns_per_second": 1.5}
  }
}
`)
	}
	return files
}

// TestMeshSamples: the shipped samples are what the generator above makes,
// and the same crate as OBJ, STL (mm, z up) and GLB gives the box formula
// m(b²+c²)/12 (REFERENCES.md §1.1) and the same numbers from each file to
// 1e-9.
func TestMeshSamples(t *testing.T) {
	dir := filepath.Join("testdata", "mesh")
	files := sampleFiles()
	if *updateSamples {
		os.MkdirAll(dir, 0o755)
		for name, data := range files {
			if err := os.WriteFile(filepath.Join(dir, name), data, 0o644); err != nil {
				t.Fatal(err)
			}
		}
	}
	for name, data := range files {
		got, err := os.ReadFile(filepath.Join(dir, name))
		if err != nil || !bytes.Equal(got, data) {
			t.Errorf("testdata/mesh/%s differs from the generator (go test ./app/project -run TestMeshSamples -update-mesh-samples): %v", name, err)
		}
	}
	const m = 500 * 0.5 * 0.25 * 0.125
	want := [3]float64{m * (0.25*0.25 + 0.125*0.125) / 12, m * (0.5*0.5 + 0.125*0.125) / 12, m * (0.5*0.5 + 0.25*0.25) / 12}
	for _, p := range []string{"crate-obj.json", "crate-stl.json", "crate-glb.json"} {
		_, sc, err := loadBuild(t, filepath.Join(dir, p))
		if err != nil {
			t.Errorf("%s: %v", p, err)
			continue
		}
		for i := range 3 {
			if math.Abs(sc.Mass.Moments[i]-want[i]) > 1e-9*want[i] {
				t.Errorf("%s: moment %d = %.15g, want %.15g", p, i, sc.Mass.Moments[i], want[i])
			}
		}
		if c := sc.Mass.CM; math.Abs(c.X-0.25) > 1e-12 || math.Abs(c.Y-0.125) > 1e-12 || math.Abs(c.Z) > 1e-12 {
			t.Errorf("%s: centre %v", p, c)
		}
	}
}
