package kitchen

import (
	"bytes"
	"os"
	"testing"

	"propflight/app/meshio"
	"propflight/physics/mesh"
)

// TestLadle_ShippedFileIsGenerated: assets/presets/ladle.obj is exactly what
// LadleOBJ makes (run go run ./tools/kitchen-meshes after changing it).
func TestLadle_ShippedFileIsGenerated(t *testing.T) {
	shipped, err := os.ReadFile("../../assets/presets/ladle.obj")
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(shipped, LadleOBJ()) {
		t.Error("assets/presets/ladle.obj differs from LadleOBJ: run go run ./tools/kitchen-meshes")
	}
}

// TestLadle_Closed: the ladle is two closed shells, wound outward, with the
// volume of its parts: the bowl's hemispherical wall (2/3)π(R³-r³) plus the
// handle's section times its centre line (Pappus for the hook), less the
// polygon error, within 1 %.
func TestLadle_Closed(t *testing.T) {
	tris, err := meshio.ReadOBJ(LadleOBJ())
	if err != nil {
		t.Fatal(err)
	}
	m, notes, err := mesh.New(tris)
	if err != nil {
		t.Fatal(err)
	}
	if len(notes) != 1 || notes[0] != "2 closed shells, added up" {
		t.Errorf("notes %q", notes)
	}
	const pi = 3.141592653589793
	ri := bowlRadius - bowlWall
	bowl := 2.0 / 3 * pi * (bowlRadius*bowlRadius*bowlRadius - ri*ri*ri)
	handle := handleWidth * handleThick * (handleLength + hookRadius*hookTurn*pi/180)
	want := bowl + handle
	if got := m.Solid().Measure; got < 0.98*want || got > want {
		t.Errorf("volume %.6g m^3, want just under %.6g", got, want)
	}
}
