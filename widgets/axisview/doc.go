// Package axisview draws the axis map (DESIGN.md vocabulary): the verdict
// of every spin direction of a prop, as two pictures of the sphere of
// directions. It is pure Go (no UI toolkit), so the window, the timing
// sheet and `propflight map -o MAP.png` draw the same image.
//
// Frames and conventions:
//   - Directions are unit vectors. The map works in principal coordinates
//     (x along the least axis, y the middle, z the greatest; see
//     physics.MassProps.Axes); ToPrincipal and FromPrincipal convert from
//     and to the prop frame.
//   - A direction and its opposite have the same verdict (physics
//     axismap.go), so each view shows one hemisphere with every direction
//     folded into it: a view holds the whole sphere's verdicts.
//   - Each view is Lambert's azimuthal equal-area projection (J. P. Snyder,
//     Map Projections: A Working Manual, USGS Professional Paper 1395,
//     1987, §24): equal areas of the sphere cover equal areas of the disc,
//     so the size of a coloured region is the share of spin directions
//     that give that motion. A hemisphere fills a disc of radius R; the
//     direction at angle a from the view's centre lies R sqrt(1 - cos a)
//     from the disc's centre.
//   - Image pixels: origin at the top-left corner, x right, y down; pixel
//     (i, j) has its centre at (i + 0.5, j + 0.5).
//
// The palette is Propflight's own: each motion has a hue (spin about the
// greatest axis blue, about the least amber, tumble rose, wobble green),
// lighter where the excursion is small and darker toward 90°; thin darker
// lines are polhode curves (directions of equal excursion, every 10°),
// and a white line marks the separatrix.
package axisview
