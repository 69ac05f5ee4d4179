// Package meshio reads the triangle meshes of mesh parts: STL (binary and
// ASCII), Wavefront OBJ and glTF 2.0 (.glb and .gltf), into triangles in
// metres in the prop's axes, ready for physics/mesh.New.
//
// Units and up: a file's numbers are multiplied by its unit's length in
// metres (m, cm, mm, in, ft; the inch and foot are exact by definition,
// NIST SP 811 Appendix B). With up z, the file's +z becomes +y and its +y
// becomes -z (a proper rotation, so winding is kept). glTF 2.0 is metres
// and +y up by its specification (§3.4), so it takes no up z.
//
// Every reader is bounded: files larger than MaxFileBytes are refused before
// they are read, declared counts are checked against the bytes actually
// present before anything is allocated from them, and no more than
// MaxTriangles triangles are accepted. Errors are one line in plain words,
// meant to follow the field that named the file.
package meshio
