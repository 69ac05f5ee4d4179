package sheet

import (
	"strings"
	"testing"

	"propflight/app/project"
	"propflight/internal/fixture"
	"propflight/physics"
)

// TestWrite_MeshProp: a prop with a 5k-triangle mesh part (the turned pan
// body, fixture.MeshPan) makes a whole sheet, and its pose cells are
// framed on the mesh's own farthest vertex (wire.Radius), not a stand-in.
func TestWrite_MeshProp(t *testing.T) {
	prop := fixture.MeshPan(200, 12)
	mp, err := prop.MassProps()
	if err != nil {
		t.Fatal(err)
	}
	th := fixture.PanThrow(1.2, 2.5, 1.5)
	tk, err := physics.Simulate(prop, &mp, &th)
	if err != nil {
		t.Fatal(err)
	}
	sc := &project.Scene{Name: "mesh pan", Prop: *prop, Throw: th, Mass: mp, Thresholds: physics.DefaultThresholds()}
	in := Input{Scene: sc, Verdict: physics.Judge(&mp, &th, sc.Thresholds), Take: tk}
	pdf := render(t, in, Options{})
	if len(pdf) < 1000 {
		t.Fatalf("sheet of %d bytes", len(pdf))
	}
	s := &sheet{sc: sc}
	want := 0.0
	part := &prop.Parts[0]
	for _, v := range part.Mesh.V {
		p := part.Orient.Rotate(v)
		p.X += part.Position.X - mp.CM.X
		p.Y += part.Position.Y - mp.CM.Y
		p.Z += part.Position.Z - mp.CM.Z
		want = max(want, p.X*p.X+p.Y*p.Y+p.Z*p.Z)
	}
	if got := s.propRadius(); got*got < want*(1-1e-12) {
		t.Errorf("pose radius %g m is inside the mesh's farthest vertex %g m", got, want)
	}
	path := pdfFile(t, pdf)
	if n := pageCount(t, path); n < 3 {
		t.Errorf("%d pages, want the summary, the poses and the table", n)
	}
}

// TestWrite_PartsTable_MassWhole: the ladle's mass cell, mass and the
// density it came from, is printed whole ("0.28 kg (7900 kg/m³)"), not
// cut to "0.28 kg (7900 kg/…" by a narrow column.
func TestWrite_PartsTable_MassWhole(t *testing.T) {
	in := presetInput(t, "ladle")
	pt := &in.Scene.Prop.Parts[0]
	if pt.Mass > 0 || pt.Density <= 0 {
		t.Fatalf("the ladle preset should give its density: mass %g, density %g", pt.Mass, pt.Density)
	}
	want := partMass(pt)
	text := squash(pageText(t, pdfFile(t, render(t, in, Options{})), 1, false))
	if !strings.Contains(text, want) {
		t.Errorf("page 1 lacks the mass cell %q:\n%s", want, text)
	}
}
