package project

// Format is the value of the "format" key of a version 1 project file.
const Format = "propflight/v1"

// MaxFileSize is the largest project file Load and Parse accept, in bytes
// (16 MiB). Real projects are a few kilobytes.
const MaxFileSize = 16 << 20

// Limits Build enforces, so that every command's time and memory stay
// bounded (a prop of the kitchen scene has a handful of parts; a mesh
// part counts as one however many triangles it has):
//
//	MaxParts       parts in "prop.parts"
//	MaxNameLength  characters (Unicode code points) in "name" and in a
//	               part's "name"
const (
	MaxParts      = 1000
	MaxNameLength = 1000
)

// Vec3 is a triple of numbers as written in the file: metres for
// positions and sizes, metres per second for velocities, degrees for
// rotations.
type Vec3 = [3]float64

// Document is a project file as written, in the user's units. A nil
// pointer is a field the file leaves out; Build supplies its default.
type Document struct {
	// File is the name used in error messages: the name given to Parse or
	// the path given to Load. It is not part of the file and is not saved.
	File string

	Name  string // "name"; may be empty
	Prop  Prop   // "prop" (required)
	Throw Throw  // "throw"; every field optional
	// VerdictRules is "verdict_rules"; nil keeps the default thresholds
	// (see Thresholds).
	VerdictRules *VerdictRules
	Footage      *Footage // "footage"; nil when the file has none
}

// Prop is the "prop" object: the parts in the prop frame.
type Prop struct {
	Parts []Part // "parts" (required, at least one)
}

// Part is one element of "prop.parts". Shape is one of box, cylinder,
// tube, sphere, shell, ellipsoid, cone, torus; each shape has its own
// dimension fields (DESIGN.md "Contracts"):
//
//	box        size [x, y, z] (full edges)
//	cylinder   radius, length (axis = part z)
//	tube       radius, inner_radius, length
//	sphere     radius
//	shell      radius (thin hollow sphere; give mass, not density)
//	ellipsoid  semi_axes [a, b, c]
//	cone       radius, height (axis = part z, apex toward +z)
//	torus      radius (centre line), tube_radius (axis = part z)
//	mesh       file, and optionally units, up and wall_m
//
// Lengths are in metres, mass in kg, density in kg/m^3; exactly one of
// Mass and Density is set. Position is the part's own centre of mass in
// the prop frame (default the origin) and RotationDeg turns the part about
// the prop's x, then y, then z axis, in degrees (default none).
//
// A mesh part reads a closed triangle mesh from File (.stl, .obj, .glb or
// .gltf; relative to the project file's folder, see [Document.MeshPath]),
// in Units (m default, cm, mm, in, ft) with Up y (default) or z; WallM,
// when given, makes it hollow (a thin wall of that thickness in metres).
// Unlike the primitives, its Position and RotationDeg move and turn the
// file's origin, not its centre of mass.
type Part struct {
	Name        string // "name"; may be empty
	Shape       string // "shape"
	Size        *Vec3
	Radius      *float64
	InnerRadius *float64
	Length      *float64
	Height      *float64
	TubeRadius  *float64
	SemiAxes    *Vec3
	Mass        *float64
	Density     *float64
	Position    *Vec3
	RotationDeg *Vec3
	File        *string  // mesh: "file", '/' separators
	Units       *string  // mesh: "units"
	Up          *string  // mesh: "up"
	WallM       *float64 // mesh: "wall_m"
}

// Throw is the "throw" object. At most one of ReleaseVelocity and the hang
// fields (HangTimeS or HangFrames, with optional Distance and HeadingDeg)
// is given; with neither the prop is dropped from rest.
//
// Defaults: fps 24, gravity 9.80665 m/s^2 (standard gravity), release
// position [0, 1.5, 0] m, orientation none, ground_y 0, no spin.
type Throw struct {
	FPS             *FrameRate // "fps"
	Gravity         *float64   // "gravity", m/s^2 acting along -Y
	ReleasePosition *Vec3      // "release_position": centre of mass at frame 0, world, m
	ReleaseVelocity *Vec3      // "release_velocity": centre-of-mass velocity at frame 0, world, m/s
	HangTimeS       *float64   // "hang_time_s": seconds until the centre of mass is back at release height
	HangFrames      *float64   // "hang_frames": the same in frames of fps
	Distance        *float64   // "distance": horizontal travel during the hang time, m (default 0)
	HeadingDeg      *float64   // "heading_deg": direction of that travel, degrees (0 = +x, 90 = -z; default 0)
	OrientationDeg  *Vec3      // "orientation_deg": prop frame -> world about world x, then y, then z, degrees
	GroundY         *float64   // "ground_y": height of the ground plane, m
	Spin            *Spin      // "spin"; nil: no spin
}

// Spin is the "throw.spin" object: the angular velocity at release.
// Exactly one of TurnsPerSecond and FramesPerTurn is given.
type Spin struct {
	Axis           *SpinAxis // "axis", prop frame (default "greatest")
	TiltDeg        *float64  // "tilt_deg": tilt of a named axis toward TiltToward, degrees (default 0)
	TiltToward     *string   // "tilt_toward": "least", "middle" or "greatest" (default "least", or "middle" for the least axis)
	TurnsPerSecond *float64  // "turns_per_second": |omega| / 2 pi, turns per second
	FramesPerTurn  *float64  // "frames_per_turn": frames per turn at fps
}

// SpinAxis is "throw.spin.axis": a principal axis by name ("least",
// "middle", "greatest") or, when Vector is not nil, an explicit direction
// in the prop frame.
type SpinAxis struct {
	Name   string
	Vector *Vec3
}

// FrameRate is "throw.fps" as written: a JSON number (Text empty), or a
// string such as "24000/1001" or "23.976" (Text, Number unused).
type FrameRate struct {
	Number float64
	Text   string
}

// IsText reports whether the rate was written as a string.
func (r FrameRate) IsText() bool { return r.Text != "" }
