// Package mesh holds closed triangle meshes for mesh parts: welding, the
// checks that make a triangle soup a solid, and its exact mass properties.
//
// Frames and units: a Mesh is in the part's own frame (the file's frame after
// units and up are applied), in metres. Its origin is the file's origin, not
// the centre of mass.
//
// Winding: every triangle (a, b, c) runs counter-clockwise seen from outside,
// so (b-a) x (c-a) points out of the solid.
//
// Mass properties come from the divergence theorem over signed tetrahedra
// (J. Blow & A. J. Binstock, "How to find the inertia tensor (or other mass
// properties) of a 3D solid body represented by a triangle mesh", 2004; F.
// Tonon, J. Mathematics and Statistics 1(1):8-11, 2005; REFERENCES.md §9),
// in float64 whatever the file stored, and are exact for a polyhedron.
//
// The package imports only the standard library and gonum, like physics.
package mesh
