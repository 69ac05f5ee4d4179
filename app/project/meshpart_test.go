package project

import (
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

// crateOBJ is a closed 0.4 x 0.3 x 0.2 m box centred at (cx, 0, 0), quads
// wound outward; reverse winds every face the other way.
func crateOBJ(cx float64, reverse bool) string {
	var b strings.Builder
	for _, x := range []float64{-0.2, 0.2} {
		for _, y := range []float64{-0.15, 0.15} {
			for _, z := range []float64{-0.1, 0.1} {
				b.WriteString("v " + ftoa(x+cx) + " " + ftoa(y) + " " + ftoa(z) + "\n")
			}
		}
	}
	faces := []string{"5 7 8 6", "1 2 4 3", "3 4 8 7", "1 5 6 2", "2 6 8 4", "1 3 7 5"}
	for _, f := range faces {
		if reverse {
			w := strings.Fields(f)
			f = w[3] + " " + w[2] + " " + w[1] + " " + w[0]
		}
		b.WriteString("f " + f + "\n")
	}
	return b.String()
}

func ftoa(x float64) string { return strconv.FormatFloat(x, 'g', -1, 64) }

func writeFile(t *testing.T, path, data string) string {
	t.Helper()
	if err := os.MkdirAll(filepath.Dir(path), 0o755); err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(path, []byte(data), 0o644); err != nil {
		t.Fatal(err)
	}
	return path
}

func loadBuild(t *testing.T, path string) (*Document, *Scene, error) {
	t.Helper()
	doc, err := Load(path)
	if err != nil {
		return nil, nil, err
	}
	sc, err := doc.Build()
	return doc, sc, err
}

// TestMeshPart_Crate: a mesh part of a 0.4 x 0.3 x 0.2 m box at density 500
// has the box formula's moments m(b²+c²)/12 = 0.13, 0.2, 0.25 kg m²
// (REFERENCES.md §1.1; m = 12 kg), wherever the file puts it and however
// position and rotation_deg move the file's origin.
func TestMeshPart_Crate(t *testing.T) {
	dir := t.TempDir()
	writeFile(t, filepath.Join(dir, "meshes", "crate.obj"), crateOBJ(0.5, false))
	p := writeFile(t, filepath.Join(dir, "crate.json"), `{"format": "propflight/v1", "prop": {"parts": [
		{"shape": "mesh", "file": "meshes/crate.obj", "density": 500, "position": [1, 2, 3], "rotation_deg": [0, 0, 90]}]}}`)
	_, sc, err := loadBuild(t, p)
	if err != nil {
		t.Fatal(err)
	}
	for i, want := range []float64{0.13, 0.2, 0.25} {
		if got := sc.Mass.Moments[i]; math.Abs(got-want) > 1e-12 {
			t.Errorf("moment %d = %.15g, want %g", i, got, want)
		}
	}
	if math.Abs(sc.Mass.Mass-12) > 1e-12 {
		t.Errorf("mass %g, want 12", sc.Mass.Mass)
	}
	// The file's centre (0.5, 0, 0) turned 90 degrees about z is (0, 0.5, 0),
	// then moved by the position.
	if c := sc.Mass.CM; math.Abs(c.X-1) > 1e-12 || math.Abs(c.Y-2.5) > 1e-12 || math.Abs(c.Z-3) > 1e-12 {
		t.Errorf("centre of mass %v, want (1, 2.5, 3)", c)
	}
}

// TestMeshPart_UnitsUpWall: cm scales lengths, up z turns the file, wall_m
// makes the crate hollow: mass = density x area x wall (0.2 mm: under the
// crate's volume / area, 0.46 mm, past which the wall is refused).
func TestMeshPart_UnitsUpWall(t *testing.T) {
	dir := t.TempDir()
	writeFile(t, filepath.Join(dir, "crate.obj"), crateOBJ(0, false))
	p := writeFile(t, filepath.Join(dir, "p.json"), `{"format": "propflight/v1", "prop": {"parts": [
		{"shape": "mesh", "file": "crate.obj", "units": "cm", "up": "z", "density": 500, "wall_m": 0.0002}]}}`)
	_, sc, err := loadBuild(t, p)
	if err != nil {
		t.Fatal(err)
	}
	area := 2 * (0.4*0.3 + 0.4*0.2 + 0.3*0.2) * 1e-4 // cm² to m²
	if want := 500 * area * 0.0002; math.Abs(sc.Mass.Mass-want) > 1e-12*want {
		t.Errorf("mass %g, want %g", sc.Mass.Mass, want)
	}
	// Up z: the file's z (0.2 cm) is now along y and its y (0.3 cm) along
	// z: the crate is 0.4 x 0.2 x 0.3 cm in the prop frame.
	lo, hi := sc.Prop.Parts[0].Mesh.Bounds()
	if d := [3]float64{hi.X - lo.X, hi.Y - lo.Y, hi.Z - lo.Z}; math.Abs(d[0]-0.004) > 1e-15 || math.Abs(d[1]-0.002) > 1e-15 || math.Abs(d[2]-0.003) > 1e-15 {
		t.Errorf("extent %v m, want (0.004, 0.002, 0.003)", d)
	}
}

// TestMeshPart_Errors: one line naming the field, in plain words.
func TestMeshPart_Errors(t *testing.T) {
	dir := t.TempDir()
	writeFile(t, filepath.Join(dir, "crate.obj"), crateOBJ(0, false))
	holed := strings.Join(strings.Split(crateOBJ(0, false), "\n")[:13], "\n") + "\n"
	writeFile(t, filepath.Join(dir, "holed.obj"), holed)
	writeFile(t, filepath.Join(dir, "empty.stl"), "")
	writeFile(t, filepath.Join(dir, "x.glb"), "glTF")
	part := func(fields string) string {
		return `{"format": "propflight/v1", "prop": {"parts": [{"shape": "mesh", ` + fields + `}]}}`
	}
	for _, c := range []struct {
		name, file, want string
	}{
		{"hole", part(`"file": "holed.obj", "mass": 1`), "prop.parts[0].file: not closed: 4 edges belong to one face only"},
		{"missing file", part(`"file": "gone.obj", "mass": 1`), "prop.parts[0].file: no such file: " + filepath.Join(dir, "gone.obj")},
		{"empty file", part(`"file": "empty.stl", "mass": 1`), "prop.parts[0].file: the file is empty"},
		{"no file", part(`"mass": 1`), "prop.parts[0].file: missing (a mesh needs file"},
		{"empty name", part(`"file": "", "mass": 1`), "prop.parts[0].file: must not be empty"},
		{"bad extension", part(`"file": "crate.ply", "mass": 1`), "prop.parts[0].file: not a mesh file this tool reads: .ply"},
		{"bad units", part(`"file": "crate.obj", "units": "yd", "mass": 1`), `prop.parts[0].units: "yd" is not a unit (use m, cm, mm, in or ft)`},
		{"bad up", part(`"file": "crate.obj", "up": "x", "mass": 1`), `prop.parts[0].up: "x" is not an up axis (use y or z)`},
		{"glTF up z", part(`"file": "x.glb", "up": "z", "mass": 1`), "prop.parts[0].up: a glTF file is always y up"},
		{"bad wall", part(`"file": "crate.obj", "wall_m": -1, "mass": 1`), "prop.parts[0].wall_m: must be positive"},
		{"size on mesh", part(`"file": "crate.obj", "size": [1, 1, 1], "mass": 1`), "prop.parts[0].size: a mesh has no size (it takes file"},
		{"file on box", `{"format": "propflight/v1", "prop": {"parts": [{"shape": "box", "size": [1, 1, 1], "file": "crate.obj", "mass": 1}]}}`, "prop.parts[0].file: a box has no file (it takes size)"},
		{"units not a string", part(`"file": "crate.obj", "units": 3, "mass": 1`), "prop.parts[0].units: must be a string"},
	} {
		p := writeFile(t, filepath.Join(dir, "p.json"), c.file)
		_, _, err := loadBuild(t, p)
		if err == nil || !strings.Contains(err.Error(), c.want) || strings.Contains(err.Error(), "\n") {
			t.Errorf("%s: error %v, want one line with %q", c.name, err, c.want)
		}
	}
}

// TestMeshPart_InwardNote: a crate wound inward is the same solid, and the
// scene says it was turned.
func TestMeshPart_InwardNote(t *testing.T) {
	dir := t.TempDir()
	writeFile(t, filepath.Join(dir, "in.obj"), crateOBJ(0, true))
	p := writeFile(t, filepath.Join(dir, "p.json"), `{"format": "propflight/v1", "prop": {"parts": [{"shape": "mesh", "file": "in.obj", "density": 500}]}}`)
	_, sc, err := loadBuild(t, p)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(sc.Mass.Moments[0]-0.13) > 1e-12 {
		t.Errorf("moments %v", sc.Mass.Moments)
	}
	if len(sc.Notes) != 1 || !strings.HasPrefix(sc.Notes[0], "prop.parts[0].file: wound inward") {
		t.Errorf("notes %q", sc.Notes)
	}
}

// TestMeshPart_SaveAsKeepsFile: saved into another folder, the relative
// file is rewritten to name the same mesh, and marshal round-trips the
// mesh fields.
func TestMeshPart_SaveAsKeepsFile(t *testing.T) {
	dir := t.TempDir()
	writeFile(t, filepath.Join(dir, "a", "meshes", "crate.obj"), crateOBJ(0, false))
	old := writeFile(t, filepath.Join(dir, "a", "p.json"), `{"format": "propflight/v1", "prop": {"parts": [
		{"name": "crate", "shape": "mesh", "file": "meshes/crate.obj", "units": "m", "up": "y", "density": 500, "wall_m": 0.002}]}}`)
	doc, err := Load(old)
	if err != nil {
		t.Fatal(err)
	}
	moved := filepath.Join(dir, "b", "deep", "q.json")
	os.MkdirAll(filepath.Dir(moved), 0o755)
	doc.RebasePaths(old, moved)
	if got := *doc.Prop.Parts[0].File; got != "../../a/meshes/crate.obj" {
		t.Errorf("file after save as: %q", got)
	}
	if err := Save(moved, doc); err != nil {
		t.Fatal(err)
	}
	again, sc, err := loadBuild(t, moved)
	if err != nil {
		t.Fatal(err)
	}
	pt := again.Prop.Parts[0]
	if *pt.Units != "m" || *pt.Up != "y" || *pt.WallM != 0.002 || sc.Prop.Parts[0].Wall != 0.002 {
		t.Errorf("round trip: %+v", pt)
	}
	if a, b := again.MeshPath(moved, 0), filepath.Join(dir, "a", "meshes", "crate.obj"); filepath.Clean(a) != b {
		t.Errorf("MeshPath %q, want %q", a, b)
	}
}

// TestMeshPart_UnitsNote: a crate read in the wrong units gets a note, and
// one beyond the position limit is refused on the file.
func TestMeshPart_UnitsNote(t *testing.T) {
	dir := t.TempDir()
	writeFile(t, filepath.Join(dir, "crate.obj"), crateOBJ(0, false))
	for _, c := range []struct{ units, note string }{
		{"mm", "the mesh is 0.4 mm across, small for a thrown prop: check units (its numbers are read as mm)"},
		{"m", ""},
	} {
		p := writeFile(t, filepath.Join(dir, "p.json"), `{"format": "propflight/v1", "prop": {"parts": [{"shape": "mesh", "file": "crate.obj", "units": "`+c.units+`", "mass": 1}]}}`)
		_, sc, err := loadBuild(t, p)
		if err != nil {
			t.Fatal(err)
		}
		if got := strings.Join(sc.Notes, "; "); (c.note == "" && got != "") || !strings.Contains(got, c.note) {
			t.Errorf("%s: notes %q, want %q", c.units, got, c.note)
		}
	}
	big := strings.NewReplacer("0.15", "150000", "0.2", "200000", "0.1", "100000").Replace(crateOBJ(0, false))
	writeFile(t, filepath.Join(dir, "big.obj"), big)
	p := writeFile(t, filepath.Join(dir, "p.json"), `{"format": "propflight/v1", "prop": {"parts": [{"shape": "mesh", "file": "big.obj", "mass": 1}]}}`)
	if _, _, err := loadBuild(t, p); err == nil || !strings.Contains(err.Error(), "prop.parts[0].file: the mesh reaches 2e+05 m from the file's origin") {
		t.Errorf("big: %v", err)
	}
}
