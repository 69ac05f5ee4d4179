package ui

import (
	"fmt"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// cubeOBJ is a closed cube of side s (file units) with its corner at the
// origin, as Wavefront OBJ quads; hole leaves the last face out.
func cubeOBJ(s float64, hole bool) string {
	var b strings.Builder
	for i := range 8 {
		fmt.Fprintf(&b, "v %g %g %g\n", s*float64(i&1), s*float64(i>>1&1), s*float64(i>>2&1))
	}
	// Outward quads (1-based): -x, +x, -y, +y, -z, +z.
	faces := []string{"1 5 7 3", "2 4 8 6", "1 2 6 5", "3 7 8 4", "1 3 4 2", "5 6 8 7"}
	if hole {
		faces = faces[:5]
	}
	for _, f := range faces {
		b.WriteString("f " + f + "\n")
	}
	return b.String()
}

func writeFile(t *testing.T, name, data string) string {
	t.Helper()
	path := filepath.Join(t.TempDir(), name)
	if err := os.WriteFile(path, []byte(data), 0o644); err != nil {
		t.Fatal(err)
	}
	return path
}

// TestWindow_AddMeshPart_EditAndUndo: a 100 mm cube read from an OBJ file
// joins the pan as a mesh part in millimetres (guessed from its size),
// 0.5 kg, and the verdict's mass follows; giving its density converts
// through its volume (0.5 kg / 0.001 m^3); in centimetres the cube is a
// metre across and the centre of mass moves to match; made hollow, its mass is
// density x surface x wall (the thin-wall rule, DESIGN.md "Mesh part":
// 500 kg/m^3 x 0.06 m^2 x 2 mm = 0.06 kg); each edit is one undo step and
// undoing them all gives back the pan as it was.
func TestWindow_AddMeshPart_EditAndUndo(t *testing.T) {
	w := newTestWindow(t, "frying-pan")
	before := docBytes(t, w)
	mass0, panCM := w.good.Scene.Mass.Mass, w.good.Scene.Mass.CM
	path := writeFile(t, "crate.obj", cubeOBJ(100, false))

	w.props.addMeshFile(path)
	d := w.ed.Doc()
	n := len(d.Prop.Parts) - 1
	part := d.Prop.Parts[n]
	if part.Shape != "mesh" || part.File == nil || part.Units == nil || *part.Units != "mm" || part.Name != "crate" {
		t.Fatalf("added part %+v (file %v, units %v)", part, part.File, part.Units)
	}
	if got := d.MeshPath(d.File, n); filepath.Clean(got) != filepath.Clean(path) {
		t.Errorf("mesh path %q, want %q", got, path)
	}
	if w.result.Err != nil {
		t.Fatalf("recompute: %v", w.result.Err)
	}
	if got := w.good.Scene.Mass.Mass; math.Abs(got-(mass0+0.5)) > 1e-12 {
		t.Errorf("prop mass %g kg, want %g", got, mass0+0.5)
	}
	if w.props.selected != n || w.props.units == nil || w.props.units.Selected != "mm" {
		t.Fatalf("mesh editor: selected %d, units %v", w.props.selected, w.props.units)
	}
	if w.props.meshFacts.Text != "12 triangles, 10.0 × 10.0 × 10.0 cm, volume 1.00 L." {
		t.Errorf("mesh facts %q", w.props.meshFacts.Text)
	}

	// In centimetres the cube is a metre across: the prop's centre of mass
	// moves to the mass-weighted mean of the pan's and the cube's centre
	// (0.5, 0.5, 0.5) m.
	w.props.units.SetSelected("cm")
	if w.result.Err != nil {
		t.Fatalf("units cm: %v", w.result.Err)
	}
	got := w.good.Scene.Mass.CM
	for k, c := range []float64{got.X, got.Y, got.Z} {
		p0 := []float64{panCM.X, panCM.Y, panCM.Z}[k]
		if want := (mass0*p0 + 0.5*0.5) / (mass0 + 0.5); math.Abs(c-want) > 1e-12 {
			t.Errorf("units cm: centre of mass %v, axis %d want %g", got, k, want)
		}
	}
	w.props.units.SetSelected("mm")

	w.props.massMode.SetSelected(modeDensity)
	part = w.ed.Doc().Prop.Parts[n]
	if part.Density == nil || math.Abs(*part.Density-500) > 1e-9 {
		t.Fatalf("density %v, want 500 kg/m^3 (0.5 kg in 0.001 m^3)", part.Density)
	}
	w.props.hollow.SetChecked(true)
	part = w.ed.Doc().Prop.Parts[n]
	if part.WallM == nil || *part.WallM != defaultWall {
		t.Fatalf("hollow: wall %v", part.WallM)
	}
	if got, want := w.good.Scene.Mass.Mass, mass0+500*0.06*defaultWall; math.Abs(got-want) > 1e-12 {
		t.Errorf("hollow crate: prop mass %g kg, want %g", got, want)
	}
	if len(w.props.partF) != 1+1+6 {
		t.Errorf("hollow mesh editor has %d fields, want density, wall, 3 positions, 3 rotations", len(w.props.partF))
	}

	for range 5 {
		w.undo()
	}
	if got := docBytes(t, w); string(got) != string(before) {
		t.Errorf("after five undos the project differs from the pan:\n%s", got)
	}
	if got := w.good.Scene.Mass.Mass; got != mass0 {
		t.Errorf("after undo: prop mass %g, want %g", got, mass0)
	}
}

// TestWindow_AddMeshPart_BadFileSaysWhy: a model with a hole is refused
// with a dialog in plain words and the project is left as it was.
func TestWindow_AddMeshPart_BadFileSaysWhy(t *testing.T) {
	w := newTestWindow(t, "frying-pan")
	before := docBytes(t, w)
	w.props.addMeshFile(writeFile(t, "lid.obj", cubeOBJ(100, true)))
	if w.lastDialog == nil || w.lastDialog.title != "Cannot use lid.obj" || !strings.Contains(w.lastDialog.message, "not closed") {
		t.Fatalf("dialog %+v", w.lastDialog)
	}
	if string(docBytes(t, w)) != string(before) || w.ed.CanUndo() {
		t.Errorf("a refused model changed the project")
	}
}

// TestWindow_PartBecomesMeshAndBack: a primitive read as a mesh keeps its
// name, mass and place; turned back into a box it drops the file.
func TestWindow_PartBecomesMeshAndBack(t *testing.T) {
	w := newTestWindow(t, "frying-pan")
	w.props.list.Select(0)
	old := w.ed.Doc().Prop.Parts[0]
	w.props.meshFromFile(0, writeFile(t, "body.obj", cubeOBJ(0.12, false)))
	p := w.ed.Doc().Prop.Parts[0]
	if p.Shape != "mesh" || p.Name != old.Name || p.Mass == nil || old.Mass == nil || *p.Mass != *old.Mass || p.Density != nil || p.Units != nil {
		t.Fatalf("as a mesh: %+v (was %+v)", p, old)
	}
	if w.result.Err != nil || w.props.built.shape != "mesh" {
		t.Fatalf("as a mesh: %v, editor for %q", w.result.Err, w.props.built.shape)
	}
	w.props.shape.SetSelected("box")
	p = w.ed.Doc().Prop.Parts[0]
	if p.Shape != "box" || p.File != nil || p.Size == nil || w.result.Err != nil {
		t.Errorf("back to a box: %+v (%v)", p, w.result.Err)
	}
}

// TestWindow_AddMeshChoice_AsksForAFile: "mesh file…" in the add picker
// opens a file dialog and adds nothing until a file is chosen.
func TestWindow_AddMeshChoice_AsksForAFile(t *testing.T) {
	w := newTestWindow(t, "frying-pan")
	before := docBytes(t, w)
	w.props.add.SetSelected(meshChoice)
	if w.win.Canvas().Overlays().Top() == nil {
		t.Fatal("no file dialog")
	}
	if string(docBytes(t, w)) != string(before) || w.props.add.Selected != "" {
		t.Errorf("choosing %q changed the project or stayed selected", meshChoice)
	}
}

// TestWindow_MeshUnitsNote_Shown: a model read in units that make it 1 mm
// across gets the project's "check units" note under the mesh's facts, as
// check prints it; back in metres the note goes.
func TestWindow_MeshUnitsNote_Shown(t *testing.T) {
	w := newTestWindow(t, "frying-pan")
	w.props.addMeshFile(writeFile(t, "crate.obj", cubeOBJ(1, false)))
	if w.props.units == nil || w.props.units.Selected != "m" {
		t.Fatalf("units %v, want m for a cube 1 unit across", w.props.units)
	}
	if strings.Contains(w.props.meshFacts.Text, "check units") {
		t.Errorf("a 1 m cube has a units note: %q", w.props.meshFacts.Text)
	}
	w.props.units.SetSelected("mm")
	if w.result.Err != nil {
		t.Fatalf("units mm: %v", w.result.Err)
	}
	if got := w.props.meshFacts.Text; !strings.Contains(got, "small for a thrown prop: check units") {
		t.Errorf("a 1 mm cube: mesh facts %q lack the units note", got)
	}
	w.props.units.SetSelected("m")
	if strings.Contains(w.props.meshFacts.Text, "check units") {
		t.Errorf("back in metres the note stays: %q", w.props.meshFacts.Text)
	}
}
