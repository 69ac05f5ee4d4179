package mesh_test

import (
	"fmt"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics/mesh"
)

// The canonical tetrahedron (0,0,0), (1,0,0), (0,1,0), (0,0,1), given wound
// inward: New turns it outward and says so. Its volume is 1/6 and its
// centroid (1/4, 1/4, 1/4) (REFERENCES.md §9).
func ExampleNew() {
	o, x, y, z := r3.Vec{}, r3.Vec{X: 1}, r3.Vec{Y: 1}, r3.Vec{Z: 1}
	m, notes, err := mesh.New([][3]r3.Vec{{o, x, y}, {o, z, x}, {o, y, z}, {x, z, y}})
	if err != nil {
		fmt.Println(err)
		return
	}
	s := m.Solid()
	fmt.Printf("%d vertices, volume %.6f, centroid (%.2f, %.2f, %.2f)\n", len(m.V), s.Measure, s.Center.X, s.Center.Y, s.Center.Z)
	fmt.Println(notes)
	fmt.Printf("farthest along (1, 1, 0): %g\n", m.Support(r3.Vec{X: 1, Y: 1}))

	_, _, err = mesh.New([][3]r3.Vec{{o, x, y}, {o, z, x}, {o, y, z}})
	fmt.Println(err)
	// Output:
	// 4 vertices, volume 0.166667, centroid (0.25, 0.25, 0.25)
	// [wound inward throughout: turned outward (the same solid)]
	// farthest along (1, 1, 0): 1
	// not closed: 3 edges belong to one face only
}
