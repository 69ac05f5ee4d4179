package export

import (
	"bytes"
	"os"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics"
	"propflight/physics/mesh"
	"propflight/widgets/wire"
)

// TestWritePNGSequence_MeshBoxDrawsAsBox: a box given as a 12-triangle
// mesh part renders the same frames, pixel for pixel, as the box
// primitive (its creases are the box's edges and it has no contour), in a
// perspective view with onion skin and guides.
func TestWritePNGSequence_MeshBoxDrawsAsBox(t *testing.T) {
	size := r3.Vec{X: 0.36, Y: 0.24, Z: 0.02} // a cutting board (demo data)
	h := r3.Scale(0.5, size)
	var v []r3.Vec
	for i := range 8 {
		s := func(bit int) float64 {
			if i&bit != 0 {
				return 1
			}
			return -1
		}
		v = append(v, r3.Vec{X: h.X * s(1), Y: h.Y * s(2), Z: h.Z * s(4)})
	}
	quads := [6][4]int32{{1, 3, 7, 5}, {0, 4, 6, 2}, {2, 6, 7, 3}, {0, 1, 5, 4}, {4, 5, 7, 6}, {0, 2, 3, 1}}
	var tris [][3]int32
	for _, q := range quads {
		tris = append(tris, [3]int32{q[0], q[1], q[2]}, [3]int32{q[0], q[2], q[3]})
	}
	q := physics.EulerXYZ(0.3, 0.1, -0.2)
	boxProp := physics.Prop{Parts: []physics.Part{{Name: "board", Shape: physics.Box, Size: size, Mass: 0.9, Orient: q}}}
	meshProp := physics.Prop{Parts: []physics.Part{{Name: "board", Shape: physics.MeshShape, Mesh: &mesh.Mesh{V: v, T: tris}, Mass: 0.9, Orient: q}}}
	mp, err := boxProp.MassProps()
	if err != nil {
		t.Fatal(err)
	}
	th := physics.DefaultThrow()
	th.Position = r3.Vec{Y: 1.3}
	th.Velocity = r3.Vec{X: 1.5, Y: 3}
	th.Spin = physics.Spin{Axis: physics.Least, Tilt: 0.2, TiltToward: physics.Greatest, Rate: 2 * 3.14159}
	take, err := physics.Simulate(&boxProp, &mp, &th)
	if err != nil {
		t.Fatal(err)
	}
	opt := PNGOptions{Width: 320, Height: 200, View: wire.Free, Onion: 2, Guides: true}
	write := func(p *physics.Prop) []string {
		mpp, err := p.MassProps()
		if err != nil {
			t.Fatal(err)
		}
		paths, err := WritePNGSequence(t.TempDir(), Input{Name: "board", Prop: p, Mass: &mpp, Throw: &th, Take: take}, opt, nil)
		if err != nil {
			t.Fatal(err)
		}
		return paths
	}
	a, b := write(&boxProp), write(&meshProp)
	if len(a) != len(b) || len(a) == 0 {
		t.Fatalf("%d and %d frames", len(a), len(b))
	}
	for i := range a {
		da, _ := os.ReadFile(a[i])
		db, _ := os.ReadFile(b[i])
		if !bytes.Equal(da, db) {
			t.Fatalf("frame %d differs between the box and its mesh", i)
		}
	}
	// And something is drawn: the frame is not all background.
	img := readPNG(t, a[len(a)/2])
	bg := img.At(0, 0)
	drawn := 0
	for y := range 200 {
		for x := range 320 {
			if img.At(x, y) != bg {
				drawn++
			}
		}
	}
	if drawn < 200 {
		t.Errorf("only %d pixels drawn", drawn)
	}
}
