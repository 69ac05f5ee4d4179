package export

import (
	"bytes"
	"encoding/binary"
	"math"
	"os"
	"path/filepath"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/app/meshio"
	"propflight/internal/fixture"
	"propflight/physics"
	"propflight/physics/mesh"
)

// meshInput is the pan with its body as a mesh part (fixture.MeshPan),
// turned and moved off the prop's origin, thrown with a wobble.
func meshInput(t testing.TB, around, along int) Input {
	t.Helper()
	prop := fixture.MeshPan(around, along)
	prop.Parts[0].Orient = physics.EulerXYZ(0.2, 0.5, -0.1)
	prop.Parts[0].Position = r3.Vec{X: -0.01, Y: 0.02, Z: 0.005}
	mp, err := prop.MassProps()
	if err != nil {
		t.Fatal(err)
	}
	th := fixture.PanThrow(1.5, 3, 2)
	take, err := physics.Simulate(prop, &mp, &th)
	if err != nil {
		t.Fatal(err)
	}
	return Input{Name: "mesh pan", Prop: prop, Mass: &mp, Throw: &th, Take: take}
}

// TestGLTF_MeshPartCarriesItsTriangles: a mesh part is exported as its
// own triangles, not a stand-in: the GLB holds every triangle of the mesh
// (plus the handle box's 12), each exported triangle's corners are the
// mesh's vertices placed by the part's position and rotation (relative to
// the centre of mass, to single precision), its normals are unit and on
// the outward side, and the indices are u32.
func TestGLTF_MeshPartCarriesItsTriangles(t *testing.T) {
	in := meshInput(t, 48, 4)
	part := &in.Prop.Parts[0]
	var buf bytes.Buffer
	if err := WriteGLTF(&buf, in, GLTFOptions{Binary: true}); err != nil {
		t.Fatal(err)
	}
	doc, bin := readGLB(t, buf.Bytes())
	prim := doc.Meshes[0].Primitives[0]
	pos := floats(doc, bin, prim.Attributes["POSITION"])
	nrm := floats(doc, bin, prim.Attributes["NORMAL"])
	ia := doc.Accessors[prim.Indices]
	if ia.ComponentType != compUint32 {
		t.Fatalf("indices component type %d, want %d (u32)", ia.ComponentType, compUint32)
	}
	iv := doc.BufferViews[ia.BufferView]
	idx := make([]uint32, ia.Count)
	for i := range idx {
		idx[i] = binary.LittleEndian.Uint32(bin[iv.ByteOffset+4*i:])
	}
	if want := 3 * (len(part.Mesh.T) + 12); len(idx) != want {
		t.Fatalf("%d indices, want %d (the mesh's %d triangles and the handle's 12)", len(idx), want, len(part.Mesh.T))
	}
	// The mesh comes first: triangle k is the mesh's triangle k.
	vert := func(i uint32) r3.Vec { return r3.Vec{X: pos[3*i], Y: pos[3*i+1], Z: pos[3*i+2]} }
	for k, tr := range part.Mesh.T {
		var face r3.Vec
		{
			a, b, c := vert(idx[3*k]), vert(idx[3*k+1]), vert(idx[3*k+2])
			face = r3.Cross(r3.Sub(b, a), r3.Sub(c, a))
		}
		for j := range 3 {
			want := r3.Sub(r3.Add(part.Position, part.Orient.Rotate(part.Mesh.V[tr[j]])), in.Mass.CM)
			got := vert(idx[3*k+j])
			if d := r3.Norm(r3.Sub(got, want)); d > 1e-7 {
				t.Fatalf("triangle %d corner %d at %v, want %v", k, j, got, want)
			}
			i := idx[3*k+j]
			n := r3.Vec{X: nrm[3*i], Y: nrm[3*i+1], Z: nrm[3*i+2]}
			if math.Abs(r3.Norm(n)-1) > 1e-6 {
				t.Fatalf("normal %v is not unit", n)
			}
			// A smooth normal stays within the crease angle of its face.
			if r3.Dot(n, r3.Unit(face)) < math.Cos(41*math.Pi/180) {
				t.Fatalf("triangle %d: corner normal %v is %.1f degrees off its face", k, n,
					math.Acos(r3.Dot(n, r3.Unit(face)))*180/math.Pi)
			}
		}
	}
}

// TestGLTF_MeshKhronosValidator: the export of a mesh prop passes the
// Khronos validator with no errors and no warnings (as
// TestGLTF_KhronosValidator for the primitives).
func TestGLTF_MeshKhronosValidator(t *testing.T) {
	in := meshInput(t, 96, 8)
	var buf bytes.Buffer
	if err := WriteGLTF(&buf, in, GLTFOptions{Binary: true}); err != nil {
		t.Fatal(err)
	}
	path := filepath.Join(t.TempDir(), "meshpan.glb")
	if err := os.WriteFile(path, buf.Bytes(), 0o644); err != nil {
		t.Fatal(err)
	}
	validate(t, path)
}

// TestGLTF_MeshReadsBackAsTheSameSolid: the GLB of a mesh prop, read back
// by the project's own glTF reader (app/meshio) and welded, is a closed
// solid whose volume is the prop's: the mesh part's plus the handle box's
// (box volume abc; CRC Standard Mathematical Tables, solid geometry), to
// single precision.
func TestGLTF_MeshReadsBackAsTheSameSolid(t *testing.T) {
	in := meshInput(t, 96, 8)
	var buf bytes.Buffer
	if err := WriteGLTF(&buf, in, GLTFOptions{Binary: true}); err != nil {
		t.Fatal(err)
	}
	tris, err := meshio.ReadGLB(buf.Bytes())
	if err != nil {
		t.Fatal(err)
	}
	m, _, err := mesh.New(tris)
	if err != nil {
		t.Fatalf("the exported prop does not read back as a closed solid: %v", err)
	}
	h := in.Prop.Parts[1].Size
	want := in.Prop.Parts[0].Mesh.Solid().Measure + h.X*h.Y*h.Z
	if got := m.Solid().Measure; math.Abs(got-want) > 1e-5*want {
		t.Errorf("volume read back %.9g m^3, want %.9g", got, want)
	}
}
