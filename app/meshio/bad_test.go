package meshio

import (
	"encoding/base64"
	"encoding/binary"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

// TestReadFile_Bad: broken files are refused with one plain line, before
// anything large is allocated.
func TestReadFile_Bad(t *testing.T) {
	dir := t.TempDir()
	tris := fans(lumpQuads())
	bin, acc, views := meshBuffer(tris)
	goodGLB := glb(gltfJSON(`[{"mesh":0}]`, `[{"primitives":[{"attributes":{"POSITION":0},"indices":1}]}]`, acc, views, len(bin), ""), bin)
	// A small file whose count field declares 214748365 triangles (10.7 GB).
	huge := make([]byte, 84+50)
	copy(huge, "binary header")
	binary.LittleEndian.PutUint32(huge[80:], 214748365)
	badIndex := strings.Replace(string(objQuads(lumpQuads())), "f ", "f 99 ", 1)
	badGLTFIndex := strings.Replace(string(gltfJSON(`[{"mesh":0}]`, `[{"primitives":[{"attributes":{"POSITION":0},"indices":1}]}]`, acc, views, len(bin), "data:application/octet-stream;base64,"+base64.StdEncoding.EncodeToString(bin))), `"count":8,`, `"count":7,`, 1)
	for _, c := range []struct {
		name, file string
		data       []byte
		want       string
	}{
		{"empty STL", "a.stl", nil, "the file is empty"},
		{"empty OBJ", "a.obj", []byte("\n\n"), "the file is empty"},
		{"empty GLB", "a.glb", nil, "the file is empty"},
		{"empty glTF", "a.gltf", nil, "the file is empty"},
		{"10 GB declared", "huge.stl", huge, "declares 214748365 triangles (10.7 GB) but has 134 bytes"},
		{"short STL", "s.stl", []byte("abc"), "not an STL file"},
		{"ASCII STL cut in a facet", "c.stl", []byte("solid x\nfacet normal 0 0 1\nouter loop\nvertex 0 0 0\nvertex 1 0 0\n"), "ends inside a facet"},
		{"ASCII STL bad number", "n.stl", []byte("solid x\nfacet normal 0 0 1\nouter loop\nvertex 0 zero 0\n"), `line 4: "zero" is not a finite number`},
		{"OBJ index out of range", "i.obj", []byte(badIndex), "face refers to vertex 99, but the file has only 8"},
		{"OBJ index 0", "z.obj", []byte("v 0 0 0\nv 1 0 0\nv 0 1 0\nf 0 1 2\n"), "line 4: vertex numbers start at 1"},
		{"OBJ negative too far", "n.obj", []byte("v 0 0 0\nv 1 0 0\nv 0 1 0\nf -1 -2 -4\n"), "counts back past the first vertex"},
		{"OBJ NaN", "nan.obj", []byte("v 0 0 nan\nv 1 0 0\nv 0 1 0\nf 1 2 3\n"), `line 1: "nan" is not a finite number`},
		{"OBJ no faces", "v.obj", []byte("v 0 0 0\n"), "no faces"},
		{"truncated GLB", "t.glb", goodGLB[:len(goodGLB)-40], "truncated GLB"},
		{"GLB cut in its header", "h.glb", goodGLB[:7], "truncated GLB"},
		{"not GLB", "x.glb", []byte("this is not a binary glTF file"), "not a GLB file"},
		{"glTF index out of range", "i.gltf", []byte(badGLTFIndex), "index 7 is out of range (7 positions)"},
		{"glTF bad JSON", "j.gltf", []byte(`{"asset":`), "not valid glTF JSON"},
		{"glTF missing side-car", "m.gltf", gltfJSON(`[{"mesh":0}]`, `[{"primitives":[{"attributes":{"POSITION":0}}]}]`, acc, views, len(bin), "gone.bin"), `buffer file "gone.bin": no such file`},
		{"glTF side-car outside", "o.gltf", gltfJSON(`[{"mesh":0}]`, `[{"primitives":[{"attributes":{"POSITION":0}}]}]`, acc, views, len(bin), "../secret.bin"), "outside the file's folder"},
		{"glTF extension", "e.gltf", []byte(`{"asset":{"version":"2.0"},"extensionsRequired":["KHR_draco_mesh_compression"],"scenes":[{"nodes":[]}]}`), "needs the glTF extension KHR_draco_mesh_compression"},
		{"glTF node cycle", "c.gltf", []byte(`{"asset":{"version":"2.0"},"scenes":[{"nodes":[0]}],"nodes":[{"children":[1]},{"children":[0]}]}`), "node 0 is reached twice"},
		{"glTF no triangles", "p.gltf", []byte(`{"asset":{"version":"2.0"},"scenes":[{"nodes":[]}]}`), "no triangles"},
		{"unknown extension", "a.ply", []byte("ply"), "not a mesh file this tool reads: .ply"},
	} {
		p := filepath.Join(dir, c.file)
		if err := os.WriteFile(p, c.data, 0o644); err != nil {
			t.Fatal(err)
		}
		_, err := ReadFile(p, Options{})
		if err == nil || !strings.Contains(err.Error(), c.want) || strings.Contains(err.Error(), "\n") {
			t.Errorf("%s: error %v, want one line with %q", c.name, err, c.want)
		}
	}
	if _, err := ReadFile(filepath.Join(dir, "missing.obj"), Options{}); err == nil || err.Error() != "no such file: "+filepath.Join(dir, "missing.obj") {
		t.Errorf("missing file: %v", err)
	}
	if _, err := ReadFile(filepath.Join(dir, "a.glb"), Options{UpZ: true}); err == nil || !strings.Contains(err.Error(), "always y up") {
		t.Errorf("glTF with up z: %v", err)
	}
}

// TestReadSTL_NaN: a NaN corner in a binary STL reaches the triangles, for
// the mesh checks to refuse by number.
func TestReadSTL_NaN(t *testing.T) {
	tris := fans(lumpQuads())
	tris[3][1].Y = math.NaN()
	got, err := ReadSTL(stlBinary(tris, ""))
	if err != nil || !math.IsNaN(got[3][1].Y) {
		t.Errorf("got %v, %v", err, got[3][1])
	}
}

// TestTransform_UpZ: the z-up file's +z becomes +y and its +y becomes -z.
func TestTransform_UpZ(t *testing.T) {
	tris := [][3]r3.Vec{{{X: 1}, {Y: 1}, {Z: 1}}}
	Transform(tris, 2, true)
	want := [3]r3.Vec{{X: 2}, {Z: -2}, {Y: 2}}
	if tris[0] != want {
		t.Errorf("got %v, want %v", tris[0], want)
	}
}
