// Package physics is the pure maths of Propflight: parts -> mass properties ->
// verdict, and throw -> take; the plan (PlanLanding: the spin rates that land
// a prop axis along a world direction, with their windows) and the spread
// (SpreadThrows: sampled release errors and the landings they give) are
// searches over flights that keep only the end of each flight. The axis map
// (AxisMapper, MapDirections) judges every spin direction of a prop at once:
// the verdict depends on the direction only. The spin-to-wobble ratio of an
// asymmetric prop (ratio.go) is exact, through Carlson's R_J (carlson.go).
//
// Frames and units:
//   - SI inside: metres, kilograms, seconds, radians. Every angle the package
//     computes with is in radians. The one exception is a small set of
//     reporting values that the edges (project files, the CLI's JSON and CSV,
//     the screen) read and write in degrees as they are: the verdict's
//     excursion (Verdict.ExcursionDeg), its thresholds (Thresholds.TumbleDeg,
//     Thresholds.WobbleMinDeg, NearMiddleDeg) and the turn made in a frame
//     (Frame.TurnDeg). Such a value always carries the suffix Deg in its name;
//     an angle without that suffix is in radians. No function takes an angle
//     in degrees.
//   - World: right-handed, +Y up, metres (the glTF 2.0 convention). The ground
//     is the plane y = Throw.GroundY.
//   - Prop frame: the frame the parts are authored in. A Part's Position is its
//     own centre of mass in the prop frame and its Orient turns the part's own
//     axes into the prop frame; a mesh part's Position and Orient place its
//     file's origin and axes instead (Part.Center gives its centre of mass).
//   - Principal frame: the prop's principal axes at its centre of mass, sorted
//     so that I1 <= I2 <= I3 (least, middle, greatest axis).
//   - Orientations are [Rotation]s: unit quaternions (gonum quat.Number,
//     fields Real, Imag, Jmag, Kmag = w, x, y, z) that map a vector of the
//     inner frame into the outer one: v_outer = q (0, v_inner) q*
//     (rotation.go holds the convention and its helpers).
//
// Inertia tensors use the physics sign convention I_ij = sum m (r^2 delta_ij -
// x_i x_j) (Goldstein, Classical Mechanics 3rd ed., §5.3).
//
// The package imports no other Propflight package and no UI code.
package physics
