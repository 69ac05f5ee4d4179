package project

import (
	"errors"
	"fmt"
	"math"
	"path/filepath"
	"strconv"
	"strings"
	"unicode/utf8"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics"
)

// Scene is a document turned into physics input, in SI units and radians.
type Scene struct {
	Name  string // the document's name, else the file name without folder and extension
	Prop  physics.Prop
	Throw physics.Throw
	Mass  physics.MassProps
	// Thresholds are the verdict rules to judge it by: the project's
	// "verdict_rules" over the defaults (Document.Thresholds).
	Thresholds physics.Thresholds
	// Notes say what was changed without refusing, one line each, naming the
	// field: "prop.parts[0].file: wound inward throughout: turned outward
	// (the same solid)".
	Notes []string
}

// Default values of the optional fields (DESIGN.md "Contracts").
var (
	DefaultFPS             = physics.Rate{Num: 24, Den: 1}
	DefaultReleasePosition = Vec3{0, 1.5, 0}
)

// Sanity ranges for values the physics would accept but no prop or throw
// has; they keep the arithmetic far from overflow and underflow.
const (
	minLength   float64 = 1e-6 // m (a micron)
	maxLength   float64 = 1e4  // m
	minMass     float64 = 1e-6 // kg per part (a milligram)
	maxMass     float64 = 1e6  // kg per part
	maxDensity  float64 = 1e5  // kg/m^3 (the densest element, osmium, is about 2.26e4)
	maxPosition float64 = 1e4  // m, |coordinate| of a part in the prop frame
	maxWorld    float64 = 1e6  // m, |coordinate| of the release position and ground
	maxSpeed    float64 = 1e4  // m/s per velocity component
	minGravity  float64 = 0.01 // m/s^2
	maxGravity  float64 = 1000 // m/s^2
	maxTurns    float64 = 1000 // turns per second (physics.Throw.Validate)
	// minTurns is the slowest spin other than none, turns per second (one
	// turn in about 11.6 days, far longer than any flight): slower rates
	// only make frames per turn and flip periods overflow on screen.
	minTurns float64 = 1e-6
	// maxHeading bounds |heading_deg|: one turn either way is every
	// direction, and far larger angles lose all precision in sin and cos.
	maxHeading float64 = 360
)

// Build applies the defaults, converts the document to physics units and
// checks every value. Errors are *Error naming the file and the field.
//
//   - rotation_deg and orientation_deg become physics.EulerXYZ rotations
//     (about x, then y, then z, fixed axes);
//   - frames_per_turn becomes turns per second fps / frames_per_turn, and
//     the spin rate is |omega| = 2 pi turns per second, in rad/s;
//   - hang_time_s (or hang_frames / fps), distance and heading_deg give the
//     release velocity by physics.VelocityFromHang;
//   - the spin axis defaults to "greatest", the tilt to 0 and tilt_toward
//     to "least" ("middle" when the axis is the least axis).
func (d *Document) Build() (*Scene, error) {
	b := builder{file: d.File}
	if err := b.name("name", d.Name); err != nil {
		return nil, err
	}
	sc := &Scene{Name: d.sceneName(), Thresholds: d.Thresholds()}
	var err error
	if sc.Prop, err = b.prop(&d.Prop); err != nil {
		return nil, err
	}
	sc.Notes = b.notes
	if sc.Mass, err = b.massProps(&sc.Prop); err != nil {
		return nil, err
	}
	if sc.Throw, err = b.throw(&d.Throw); err != nil {
		return nil, err
	}
	if err := sc.Throw.Validate(); err != nil {
		return nil, b.wrap("", err)
	}
	if err := b.footage(d.Footage); err != nil {
		return nil, err
	}
	return sc, nil
}

func (d *Document) sceneName() string {
	if strings.TrimSpace(d.Name) != "" {
		return d.Name
	}
	if d.File != "" {
		base := filepath.Base(d.File)
		return strings.TrimSuffix(base, filepath.Ext(base))
	}
	return "untitled"
}

type builder struct {
	file  string
	notes []string
}

func (b *builder) fail(field, format string, args ...any) *Error {
	return &Error{File: b.file, Field: field, Msg: fmt.Sprintf(format, args...)}
}

// wrap turns a physics error into an *Error, prefixing its field.
func (b *builder) wrap(prefix string, err error) error {
	var fe *physics.FieldError
	if errors.As(err, &fe) {
		return &Error{File: b.file, Field: prefix + fe.Field, Msg: fe.Msg}
	}
	return &Error{File: b.file, Field: strings.TrimSuffix(prefix, "."), Msg: err.Error()}
}

// name checks the length of a name (MaxNameLength characters).
func (b *builder) name(field, s string) error {
	if n := utf8.RuneCountInString(s); n > MaxNameLength {
		return b.fail(field, "at most %d characters (this one has %d)", MaxNameLength, n)
	}
	return nil
}

func deg(x float64) float64 { return x * math.Pi / 180 }

func vec(v Vec3) r3.Vec { return r3.Vec{X: v[0], Y: v[1], Z: v[2]} }

// length checks a length in metres.
func (b *builder) length(field string, x float64) error {
	switch {
	case !(x > 0):
		return b.fail(field, "must be positive")
	case x < minLength:
		return b.fail(field, "must be at least %g m", minLength)
	case x > maxLength:
		return b.fail(field, "must be at most %g m", maxLength)
	}
	return nil
}

func (b *builder) lengths(field string, v Vec3) error {
	for _, x := range v {
		if !(x > 0) {
			return b.fail(field, "must be positive")
		}
	}
	for _, x := range v {
		if err := b.length(field, x); err != nil {
			return err
		}
	}
	return nil
}

func (b *builder) within(field string, v Vec3, limit float64, unit string) error {
	for _, x := range v {
		if math.Abs(x) > limit {
			return b.fail(field, "must be within +-%g %s", limit, unit)
		}
	}
	return nil
}

func (b *builder) prop(p *Prop) (physics.Prop, error) {
	if len(p.Parts) == 0 {
		return physics.Prop{}, b.fail("prop.parts", "a prop needs at least one part")
	}
	if len(p.Parts) > MaxParts {
		return physics.Prop{}, b.fail("prop.parts", "at most %d parts (this prop has %d); join small pieces into one part or a mesh", MaxParts, len(p.Parts))
	}
	for i := range p.Parts {
		if err := b.name(index("prop.parts", i)+".name", p.Parts[i].Name); err != nil {
			return physics.Prop{}, err
		}
	}
	out := physics.Prop{Parts: make([]physics.Part, len(p.Parts))}
	for i := range p.Parts {
		part, err := b.part(&p.Parts[i], index("prop.parts", i))
		if err != nil {
			return physics.Prop{}, err
		}
		out.Parts[i] = part
	}
	if err := out.Validate(); err != nil {
		return physics.Prop{}, b.wrap("prop.", err)
	}
	return out, nil
}

func (b *builder) part(p *Part, path string) (physics.Part, error) {
	if pr := partFields(p, path); pr != nil {
		return physics.Part{}, pr.in(b.file)
	}
	shape, _ := physics.ParseShape(p.Shape)
	out := physics.Part{Name: p.Name, Shape: shape, Orient: physics.IdentityRotation()}
	for _, k := range shapeFields[shape] {
		field := join(path, k)
		var err error
		switch k {
		case "size":
			err = b.lengths(field, *p.Size)
			out.Size = vec(*p.Size)
		case "semi_axes":
			err = b.lengths(field, *p.SemiAxes)
			out.SemiAxes = vec(*p.SemiAxes)
		case "radius":
			err = b.length(field, *p.Radius)
			out.Radius = *p.Radius
		case "length":
			err = b.length(field, *p.Length)
			out.Length = *p.Length
		case "height":
			err = b.length(field, *p.Height)
			out.Height = *p.Height
		case "tube_radius":
			err = b.length(field, *p.TubeRadius)
			out.TubeRadius = *p.TubeRadius
		case "inner_radius":
			// A tube's bore may be zero (a solid rod); physics checks it
			// against the outer radius.
			if r := *p.InnerRadius; !(r >= 0) || r > maxLength {
				err = b.fail(field, "must be at least 0 and less than radius")
			}
			out.InnerRadius = *p.InnerRadius
		case "file":
			err = b.meshPart(p, path, &out)
		}
		if err != nil {
			return physics.Part{}, err
		}
	}
	if p.Mass != nil {
		if m := *p.Mass; !(m > 0) {
			return physics.Part{}, b.fail(join(path, "mass"), "must be positive")
		} else if m < minMass {
			return physics.Part{}, b.fail(join(path, "mass"), "must be at least %g kg", minMass)
		} else if m > maxMass {
			return physics.Part{}, b.fail(join(path, "mass"), "must be at most %g kg", maxMass)
		}
		out.Mass = *p.Mass
	} else {
		if rho := *p.Density; !(rho > 0) {
			return physics.Part{}, b.fail(join(path, "density"), "must be positive")
		} else if rho > maxDensity {
			return physics.Part{}, b.fail(join(path, "density"), "must be at most %g kg/m^3", maxDensity)
		}
		out.Density = *p.Density
	}
	if p.Position != nil {
		if err := b.within(join(path, "position"), *p.Position, maxPosition, "m"); err != nil {
			return physics.Part{}, err
		}
		out.Position = vec(*p.Position)
	}
	if p.RotationDeg != nil {
		r := *p.RotationDeg
		out.Orient = physics.EulerXYZ(deg(r[0]), deg(r[1]), deg(r[2]))
	}
	if err := out.Validate(); err != nil {
		return physics.Part{}, b.wrap(path+".", err)
	}
	// With density the mass follows from the volume, which the ranges above
	// keep finite.
	if m := out.TotalMass(); !(m >= minMass && m <= maxMass) {
		return physics.Part{}, b.fail(join(path, "density"), "gives a mass of %.3g kg, outside %g to %g kg", m, minMass, maxMass)
	}
	return out, nil
}

// massProps computes the prop's mass properties and checks that they are
// usable: finite, with positive moments.
func (b *builder) massProps(p *physics.Prop) (physics.MassProps, error) {
	mp, err := p.MassProps()
	if err != nil {
		return physics.MassProps{}, b.wrap("prop.", err)
	}
	ok := mp.Mass > 0 && !math.IsInf(mp.Mass, 0) && finiteVec(mp.CM)
	for i := range 3 {
		ok = ok && mp.Moments[i] > 0 && !math.IsInf(mp.Moments[i], 0) && finiteVec(mp.Axes[i])
		for j := range 3 {
			ok = ok && !math.IsNaN(mp.Inertia[i][j]) && !math.IsInf(mp.Inertia[i][j], 0)
		}
	}
	if !ok {
		return physics.MassProps{}, b.fail("prop", "its mass properties are out of range (moments %g, %g, %g kg m^2); check the sizes and masses", mp.Moments[0], mp.Moments[1], mp.Moments[2])
	}
	return mp, nil
}

func finiteVec(v r3.Vec) bool {
	for _, x := range []float64{v.X, v.Y, v.Z} {
		if math.IsNaN(x) || math.IsInf(x, 0) {
			return false
		}
	}
	return true
}

// Rate returns the frame rate the document asks for (DefaultFPS when fps
// is left out). Errors name throw.fps.
func (d *Document) Rate() (physics.Rate, error) {
	b := builder{file: d.File}
	return b.rate(d.Throw.FPS)
}

func (b *builder) rate(fr *FrameRate) (physics.Rate, error) {
	if fr == nil {
		return DefaultFPS, nil
	}
	return b.rateAt("throw.fps", fr)
}

// rateAt converts the frame rate fr, written at field, to an exact rate of
// at least 1 frame per second.
func (b *builder) rateAt(field string, fr *FrameRate) (physics.Rate, error) {
	text := fr.Text
	if !fr.IsText() {
		if !(fr.Number > 0) || math.IsInf(fr.Number, 0) {
			return physics.Rate{}, b.fail(field, "must be positive")
		}
		text = strconv.FormatFloat(fr.Number, 'g', -1, 64)
	}
	r, err := physics.ParseRate(text)
	if err != nil {
		return physics.Rate{}, b.fail(field, "%s", err)
	}
	if r.Num < r.Den {
		return physics.Rate{}, b.fail(field, "must be at least 1 frame per second")
	}
	return r, nil
}

func (b *builder) throw(t *Throw) (physics.Throw, error) {
	if pr := throwFields(t); pr != nil {
		return physics.Throw{}, pr.in(b.file)
	}
	th := physics.Throw{Gravity: physics.StandardGravity, Position: vec(DefaultReleasePosition), Orient: physics.IdentityRotation()}
	var err error
	if th.FPS, err = b.rate(t.FPS); err != nil {
		return physics.Throw{}, err
	}
	if t.Gravity != nil {
		if g := *t.Gravity; !(g >= minGravity && g <= maxGravity) {
			return physics.Throw{}, b.fail("throw.gravity", "must be between %g and %g m/s^2 (standard gravity is %g)", minGravity, maxGravity, physics.StandardGravity)
		}
		th.Gravity = *t.Gravity
	}
	if t.ReleasePosition != nil {
		if err := b.within("throw.release_position", *t.ReleasePosition, maxWorld, "m"); err != nil {
			return physics.Throw{}, err
		}
		th.Position = vec(*t.ReleasePosition)
	}
	if t.GroundY != nil {
		if math.Abs(*t.GroundY) > maxWorld {
			return physics.Throw{}, b.fail("throw.ground_y", "must be within +-%g m", maxWorld)
		}
		th.GroundY = *t.GroundY
	}
	if t.OrientationDeg != nil {
		r := *t.OrientationDeg
		th.Orient = physics.EulerXYZ(deg(r[0]), deg(r[1]), deg(r[2]))
	}
	if th.Velocity, err = b.velocity(t, th.FPS, th.Gravity); err != nil {
		return physics.Throw{}, err
	}
	if th.Spin, err = b.spin(t.Spin, th.FPS); err != nil {
		return physics.Throw{}, err
	}
	return th, nil
}

func (b *builder) velocity(t *Throw, fps physics.Rate, g float64) (r3.Vec, error) {
	switch {
	case t.ReleaseVelocity != nil:
		if err := b.within("throw.release_velocity", *t.ReleaseVelocity, maxSpeed, "m/s"); err != nil {
			return r3.Vec{}, err
		}
		return vec(*t.ReleaseVelocity), nil
	case t.HangTimeS == nil && t.HangFrames == nil:
		return r3.Vec{}, nil // dropped from rest
	}
	var hang float64
	if t.HangTimeS != nil {
		if hang = *t.HangTimeS; !(hang > 0) || hang > physics.MaxFlight {
			return r3.Vec{}, b.fail("throw.hang_time_s", "must be positive and at most %g s", float64(physics.MaxFlight))
		}
	} else {
		n := *t.HangFrames
		if hang = n / fps.FPS(); !(n > 0) || hang > physics.MaxFlight {
			return r3.Vec{}, b.fail("throw.hang_frames", "must be positive and at most %g s of frames", float64(physics.MaxFlight))
		}
	}
	var dist, heading float64
	if t.Distance != nil {
		if dist = *t.Distance; !(dist >= 0) || dist > maxWorld {
			return r3.Vec{}, b.fail("throw.distance", "must be at least 0 and at most %g m", maxWorld)
		}
	}
	if t.HeadingDeg != nil {
		if h := *t.HeadingDeg; !(math.Abs(h) <= maxHeading) {
			return r3.Vec{}, b.fail("throw.heading_deg", "must be between -%g and %g degrees", maxHeading, maxHeading)
		}
		heading = deg(*t.HeadingDeg)
	}
	v := physics.VelocityFromHang(hang, dist, heading, g)
	if !(isFinite(v.X) && isFinite(v.Y) && isFinite(v.Z)) {
		field := "throw.hang_time_s"
		if t.HangTimeS == nil {
			field = "throw.hang_frames"
		}
		return r3.Vec{}, b.fail(field, "gives a release velocity that is not a finite number")
	}
	if math.Abs(v.X) > maxSpeed || math.Abs(v.Y) > maxSpeed || math.Abs(v.Z) > maxSpeed {
		return r3.Vec{}, b.fail("throw.distance", "gives a release speed over %g m/s in %g s", maxSpeed, hang)
	}
	return v, nil
}

func (b *builder) spin(s *Spin, fps physics.Rate) (physics.Spin, error) {
	if s == nil {
		return physics.Spin{Axis: physics.Greatest, TiltToward: physics.Least}, nil
	}
	out := physics.Spin{Axis: physics.Greatest}
	switch {
	case s.Axis == nil:
	case s.Axis.Vector != nil:
		v := *s.Axis.Vector
		// Scale by the largest component first so that tiny or huge vectors
		// keep their direction.
		m := math.Max(math.Abs(v[0]), math.Max(math.Abs(v[1]), math.Abs(v[2])))
		if m == 0 {
			return physics.Spin{}, b.fail("throw.spin.axis", "a vector axis must not be zero")
		}
		out.Axis = physics.Free
		out.Vector = r3.Unit(r3.Vec{X: v[0] / m, Y: v[1] / m, Z: v[2] / m})
	default:
		out.Axis, _ = physics.ParseAxis(s.Axis.Name)
	}
	out.TiltToward = physics.Least
	if out.Axis == physics.Least {
		out.TiltToward = physics.Middle
	}
	if s.TiltToward != nil {
		a, _ := physics.ParseAxis(*s.TiltToward)
		if a == out.Axis {
			return physics.Spin{}, b.fail("throw.spin.tilt_toward", "must name an axis other than the spin axis (%s)", out.Axis)
		}
		out.TiltToward = a
	}
	if s.TiltDeg != nil {
		if t := *s.TiltDeg; !(t >= -180 && t <= 180) {
			return physics.Spin{}, b.fail("throw.spin.tilt_deg", "must be between -180 and 180 degrees")
		}
		out.Tilt = deg(*s.TiltDeg)
	}
	var turns float64
	if s.TurnsPerSecond != nil {
		if turns = *s.TurnsPerSecond; !(turns >= 0) {
			return physics.Spin{}, b.fail("throw.spin.turns_per_second", "must be zero or positive (reverse the axis to spin the other way)")
		} else if turns > maxTurns {
			return physics.Spin{}, b.fail("throw.spin.turns_per_second", "must be at most %g turns per second", maxTurns)
		} else if turns > 0 && turns < minTurns {
			return physics.Spin{}, b.fail("throw.spin.turns_per_second", "must be 0 (no spin) or at least %g turns per second", minTurns)
		}
	} else {
		n := *s.FramesPerTurn
		if !(n > 0) {
			return physics.Spin{}, b.fail("throw.spin.frames_per_turn", "must be positive")
		}
		if turns = fps.FPS() / n; turns > maxTurns {
			return physics.Spin{}, b.fail("throw.spin.frames_per_turn", "gives %g turns per second at %v fps, more than %g", turns, fps, maxTurns)
		} else if turns < minTurns {
			return physics.Spin{}, b.fail("throw.spin.frames_per_turn", "gives %.3g turns per second at %v fps, fewer than %g: leave the spin out for none", turns, fps, minTurns)
		}
	}
	out.Rate = 2 * math.Pi * turns
	return out, nil
}

// isFinite reports whether x is neither infinite nor NaN.
func isFinite(x float64) bool { return !math.IsInf(x, 0) && !math.IsNaN(x) }
