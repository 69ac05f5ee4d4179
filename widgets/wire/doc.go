// Package wire is Propflight's pure software renderer: a camera, a prop and
// a take become 2D line segments and labels (Draw), and the segments become
// an anti-aliased image (Rasterize). It uses no UI toolkit and no graphics
// card. The segment list is the product: the screen preview rasterises it
// and the timing sheet draws the same segments as vector lines in its PDF,
// so paper and screen agree.
//
// Frames and units:
//   - World: right-handed, +Y up, metres (glTF 2.0). The ground is the
//     plane y = Scene.GroundY.
//   - Prop frame: the frame the parts are authored in. A take's frame puts
//     a prop-frame point p at Frame.CM + Frame.Orient.Rotate(p - Mass.CM).
//   - Part frame: origin at the part's own centre of mass, axes those of
//     the part; PartMesh works in it and PropMesh places parts by their
//     Orient and Position.
//   - Angles are radians everywhere in this package (field of view, orbit
//     yaw and pitch); degrees belong to the screen and files.
//   - Image pixels: origin at the top-left corner of the image, x to the
//     right, y down, pixel (i, j) covering [i, i+1) x [j, j+1), so its
//     centre is (i + 0.5, j + 0.5). Segment and label coordinates are
//     continuous pixel coordinates in this system.
//
// Cameras: Front looks from +Z toward -Z, Side from +X toward -X, Top from
// +Y down with -Z up on the screen, Free orbits the target by yaw and
// pitch. The fixed views are orthographic by default (true arcs and
// spacing); Free is perspective. camera.go is the one file that talks to
// mgl64: the r3 <-> mgl64 conversions, the radians and the flip from
// mgl64's bottom-left window origin to the image's top-left origin.
//
// Meshes (PartMesh, PropMesh) are closed, outward-wound triangle meshes
// with unit normals, for export as well as for the wireframe; their Edges
// are the lines Draw shows for the primitives.
//
// A mesh part (a model read from a file, often hundreds of thousands of
// triangles) is drawn as a line drawing instead (outline.go): its creases,
// edges where the faces meet at more than CreaseAngle (40 degrees), in
// every pose, and its contour, the smooth edges between a face turned
// toward the viewer and one turned away, found again for each pose. The
// Outline that makes this cheap is computed once per mesh and cached
// (MeshOutline): faces are grouped in patches whose normal cones and
// bounding spheres decide most of them at once (outlinecull.go), and
// creases are joined into chains that are merged on screen within 0.2 px
// (chain.go). Surface gives a mesh part's triangles for export, with
// normals smooth across edges under the crease angle.
package wire
