package cli

import (
	"encoding/binary"
	"encoding/json"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// boxOBJ is a closed unit box as OBJ quads, wound outward.
const boxOBJ = "v 0 0 0\nv 0 0 1\nv 0 1 0\nv 0 1 1\nv 1 0 0\nv 1 0 1\nv 1 1 0\nv 1 1 1\n" +
	"f 5 7 8 6\nf 1 2 4 3\nf 3 4 8 7\nf 1 5 6 2\nf 2 6 8 4\nf 1 3 7 5\n"

func writeTemp(t *testing.T, dir, name, data string) string {
	t.Helper()
	p := filepath.Join(dir, name)
	os.MkdirAll(filepath.Dir(p), 0o755)
	if err := os.WriteFile(p, []byte(data), 0o644); err != nil {
		t.Fatal(err)
	}
	return p
}

// badMeshes are the broken model files of issue 8, each with what its one
// line must say.
func badMeshes(t *testing.T, dir string) map[string]string {
	lines := strings.Split(boxOBJ, "\n")
	huge := make([]byte, 84+50)
	binary.LittleEndian.PutUint32(huge[80:], 214748365) // 10.7 GB declared
	glbHead := make([]byte, 20)
	copy(glbHead, "glTF")
	binary.LittleEndian.PutUint32(glbHead[4:], 2)
	binary.LittleEndian.PutUint32(glbHead[8:], 4000)
	files := map[string]string{
		"hole.obj":         strings.Join(lines[:13], "\n") + "\n",
		"index.obj":        boxOBJ + "f 1 2 99\n",
		"nan.obj":          strings.Replace(boxOBJ, "v 1 1 1", "v 1 NaN 1", 1),
		"flipped.obj":      strings.Replace(boxOBJ, "f 5 7 8 6", "f 6 8 7 5", 1),
		"empty.stl":        "",
		"truncated.glb":    string(glbHead),
		"nonmanifold.obj":  boxOBJ + "v 0 -1 0\nf 1 5 9\n",
		"huge.stl":         string(huge),
		"missing.obj":      "",
		"wrong-format.ply": "ply\n",
	}
	want := map[string]string{
		"hole.obj":         "not closed: 4 edges belong to one face only",
		"index.obj":        "line 15: face refers to vertex 99, but the file has only 8",
		"nan.obj":          `line 8: "NaN" is not a finite number`,
		"flipped.obj":      "faces wound both ways",
		"empty.stl":        "the file is empty",
		"truncated.glb":    "truncated GLB",
		"nonmanifold.obj":  "non-manifold",
		"huge.stl":         "declares 214748365 triangles (10.7 GB)",
		"missing.obj":      "no such file",
		"wrong-format.ply": "not a mesh file this tool reads: .ply",
	}
	for name, data := range files {
		if name != "missing.obj" {
			writeTemp(t, dir, name, data)
		}
	}
	return want
}

// TestCheck_BadMeshes: a project whose mesh part is broken exits 2 with one
// line naming prop.parts[0].file, and prints nothing on stdout.
func TestCheck_BadMeshes(t *testing.T) {
	dir := t.TempDir()
	for name, want := range badMeshes(t, filepath.Join(dir, "models")) {
		p := writeTemp(t, dir, "p.json", `{"format": "propflight/v1", "prop": {"parts": [{"shape": "mesh", "file": "models/`+name+`", "density": 1000}]}}`)
		for _, args := range [][]string{{"check", p}, {"check", p, "--json"}} {
			code, stdout, stderr := run(t, args...)
			if code != 2 || stdout != "" || strings.Count(stderr, "\n") != 1 ||
				!strings.Contains(stderr, "prop.parts[0].file: ") || !strings.Contains(stderr, want) {
				t.Errorf("%s %v: exit %d, stdout %q, stderr %q; want 2 and one line naming prop.parts[0].file with %q", name, args[2:], code, stdout, stderr, want)
			}
		}
	}
}

// TestImport_BadMeshes: import refuses the same files naming MESH and
// writes nothing.
func TestImport_BadMeshes(t *testing.T) {
	dir := t.TempDir()
	for name, want := range badMeshes(t, dir) {
		out := filepath.Join(dir, "out", "p.json")
		code, stdout, stderr := run(t, "import", filepath.Join(dir, name), "-o", out, "--density", "1000")
		if code != 2 || stdout != "" || strings.Count(stderr, "\n") != 1 || !strings.Contains(stderr, want) {
			t.Errorf("%s: exit %d, stdout %q, stderr %q; want 2 and one line with %q", name, code, stdout, stderr, want)
		}
		if _, err := os.Stat(out); err == nil {
			t.Errorf("%s: %s was written", name, out)
		}
	}
}

// TestImport_WritesCheckableProject: import writes the part's file relative
// to OUT, and check reads the project back with the box's moments,
// m(b²+c²)/12 = 1/6 m for a unit cube (REFERENCES.md §1.1).
func TestImport_WritesCheckableProject(t *testing.T) {
	dir := t.TempDir()
	mesh := writeTemp(t, dir, "models/box.obj", boxOBJ)
	out := filepath.Join(dir, "projects", "box.json")
	os.MkdirAll(filepath.Dir(out), 0o755)
	code, stdout, stderr := run(t, "import", mesh, "-o", out, "--units", "cm", "--mass", "3")
	if code != 0 || stderr != "" || !strings.Contains(stdout, "wrote "+out) {
		t.Fatalf("import: exit %d, stdout %q, stderr %q", code, stdout, stderr)
	}
	data, _ := os.ReadFile(out)
	var doc struct {
		Prop struct {
			Parts []map[string]any `json:"parts"`
		} `json:"prop"`
	}
	if err := json.Unmarshal(data, &doc); err != nil || len(doc.Prop.Parts) != 1 {
		t.Fatalf("written project: %v\n%s", err, data)
	}
	if p := doc.Prop.Parts[0]; p["file"] != "../models/box.obj" || p["units"] != "cm" || p["shape"] != "mesh" || p["mass"] != 3.0 {
		t.Errorf("part %v", p)
	}
	code, stdout, stderr = run(t, "check", out, "--json")
	if code != 0 {
		t.Fatalf("check: exit %d, %s", code, stderr)
	}
	var res struct {
		Moments []float64 `json:"principal_moments"`
	}
	json.Unmarshal([]byte(stdout), &res)
	want := 3 * (0.01*0.01 + 0.01*0.01) / 12
	for _, m := range res.Moments {
		if m < want*(1-1e-12) || m > want*(1+1e-12) {
			t.Errorf("moments %v, want %g each", res.Moments, want)
		}
	}
}

// TestImport_Usage: the flags that must go together.
func TestImport_Usage(t *testing.T) {
	dir := t.TempDir()
	mesh := writeTemp(t, dir, "box.obj", boxOBJ)
	out := filepath.Join(dir, "p.json")
	for _, c := range []struct {
		args []string
		want string
	}{
		{[]string{"import", mesh, "--density", "1"}, "-o OUT.json is required"},
		{[]string{"import", mesh, "-o", out}, "give --density D (kg/m^3) or --mass M (kg)"},
		{[]string{"import", mesh, "-o", out, "--mass", "1", "--density", "2"}, "give --density D (kg/m^3) or --mass M (kg)"},
		{[]string{"import", mesh, "-o", out, "--mass", "-1"}, "--mass: must be positive"},
		{[]string{"import", mesh, "-o", out, "--mass", "1", "--wall-m", "0"}, "--wall-m: must be positive"},
		{[]string{"import", mesh, "-o", out, "--mass", "1", "--units", "yd"}, "--units"},
		{[]string{"import", mesh, "-o", filepath.Join(dir, "p.txt"), "--mass", "1"}, "a project file ends in .json"},
		{[]string{"import", "-o", out, "--mass", "1"}, "give the model file (MESH)"},
		{[]string{"import", writeTemp(t, dir, "b.glb", ""), "-o", out, "--mass", "1", "--up", "z"}, "--up: a glTF file is always y up"},
		{[]string{"import", mesh, "-o", out, "--mass", "1e9"}, "--mass: must be at most"},
	} {
		code, stdout, stderr := run(t, c.args...)
		if code != 2 || stdout != "" || !strings.Contains(stderr, c.want) {
			t.Errorf("%v: exit %d, stderr %q, want 2 with %q", c.args[1:], code, stderr, c.want)
		}
	}
	if _, err := os.Stat(out); err == nil {
		t.Error("a refused import wrote its output")
	}
}
