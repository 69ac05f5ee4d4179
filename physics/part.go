package physics

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/num/quat"
	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics/mesh"
)

// Shape names one of the eight solid primitives a part can be, or a mesh.
type Shape int

// The part shapes. Axisymmetric shapes have their axis along the part's z.
const (
	Box       Shape = iota // Size: full edge lengths along x, y, z
	Cylinder               // Radius, Length; solid
	Tube                   // Radius (outer), InnerRadius, Length; open ends
	Sphere                 // Radius; solid
	Shell                  // Radius; thin hollow sphere (mass only: it has no volume)
	Ellipsoid              // SemiAxes a, b, c along x, y, z; solid
	Cone                   // Radius (base), Height; solid, apex toward +z
	Torus                  // Radius (centre line), TubeRadius; solid
	MeshShape              // Mesh: a closed triangle mesh; solid, or a thin wall of Wall metres
)

var shapeNames = [...]string{"box", "cylinder", "tube", "sphere", "shell", "ellipsoid", "cone", "torus", "mesh"}

// String returns the shape's name as written in project files.
func (s Shape) String() string {
	if s < 0 || int(s) >= len(shapeNames) {
		return fmt.Sprintf("Shape(%d)", int(s))
	}
	return shapeNames[s]
}

// ParseShape returns the shape named s ("box", "cylinder", ...).
func ParseShape(s string) (Shape, bool) {
	for i, n := range shapeNames {
		if n == s {
			return Shape(i), true
		}
	}
	return 0, false
}

// ShapeNames returns the names of the primitive shapes (every shape but
// mesh, which needs a file rather than dimensions) in their declaration
// order.
func ShapeNames() []string { return append([]string(nil), shapeNames[:MeshShape]...) }

// Part is one primitive of a prop. Lengths are in metres, mass in kg and
// density in kg/m^3. Exactly one of Mass and Density is positive.
//
// The part's own frame has its origin at the part's centre of mass (for the
// cone that is on the axis, a quarter of the height above the base). Position
// places that centre in the prop frame and Orient turns the part's axes into
// the prop frame.
//
// A mesh part is different: its Mesh keeps the file's own coordinates, and
// Position and Orient move and turn the file's origin (a mesh vertex p is at
// Position + Orient p in the prop frame). Center gives its centre of mass in
// the prop frame; LocalInertia and LocalSupport are about that centre, in
// the file's axes. With Wall > 0 the mass lies in a thin wall of that
// thickness over the surface (thin-wall approximation: the surface moments,
// and Density times area times Wall for the mass).
type Part struct {
	Name  string
	Shape Shape

	Size        r3.Vec  // box: full edges
	Radius      float64 // cylinder, tube (outer), sphere, shell, cone (base), torus (centre line)
	InnerRadius float64 // tube
	Length      float64 // cylinder, tube
	Height      float64 // cone
	TubeRadius  float64 // torus
	SemiAxes    r3.Vec  // ellipsoid

	Mesh *mesh.Mesh // mesh: closed, outward wound, metres, the file's frame
	Wall float64    // mesh: wall thickness, m; 0 = solid

	Mass    float64
	Density float64

	Position r3.Vec
	Orient   Rotation
}

// FieldError is a problem with one named field of user input. Field is the
// field's name as in the project file ("size", "throw.gravity").
type FieldError struct {
	Field string
	Msg   string
}

func (e *FieldError) Error() string { return e.Field + ": " + e.Msg }

func fieldErr(field, format string, args ...any) *FieldError {
	return &FieldError{Field: field, Msg: fmt.Sprintf(format, args...)}
}

// finitePos reports whether v is a finite, strictly positive number.
func finitePos(v float64) bool { return v > 0 && !math.IsInf(v, 1) }

func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }

func finiteVec(v r3.Vec) bool { return finite(v.X) && finite(v.Y) && finite(v.Z) }

// Validate reports the first problem with the part's fields, as a
// *FieldError whose Field is the project-file name of the field.
func (p *Part) Validate() error {
	switch p.Shape {
	case Box:
		if !finitePos(p.Size.X) || !finitePos(p.Size.Y) || !finitePos(p.Size.Z) {
			return fieldErr("size", "must be positive")
		}
	case Cylinder, Tube:
		if !finitePos(p.Radius) {
			return fieldErr("radius", "must be positive")
		}
		if !finitePos(p.Length) {
			return fieldErr("length", "must be positive")
		}
		if p.Shape == Tube && (!(p.InnerRadius >= 0) || p.InnerRadius >= p.Radius) {
			return fieldErr("inner_radius", "must be at least 0 and less than radius (%g)", p.Radius)
		}
	case Sphere, Shell:
		if !finitePos(p.Radius) {
			return fieldErr("radius", "must be positive")
		}
	case Ellipsoid:
		if !finitePos(p.SemiAxes.X) || !finitePos(p.SemiAxes.Y) || !finitePos(p.SemiAxes.Z) {
			return fieldErr("semi_axes", "must be positive")
		}
	case Cone:
		if !finitePos(p.Radius) {
			return fieldErr("radius", "must be positive")
		}
		if !finitePos(p.Height) {
			return fieldErr("height", "must be positive")
		}
	case Torus:
		if !finitePos(p.Radius) {
			return fieldErr("radius", "must be positive")
		}
		if !finitePos(p.TubeRadius) || p.TubeRadius > p.Radius {
			return fieldErr("tube_radius", "must be positive and at most radius (%g)", p.Radius)
		}
	case MeshShape:
		if p.Mesh == nil || len(p.Mesh.T) == 0 {
			return fieldErr("file", "no mesh was read")
		}
		if p.Wall != 0 && !finitePos(p.Wall) {
			return fieldErr("wall_m", "must be positive (or left out for a solid part)")
		}
		// A thin wall holds area times thickness of material; past
		// volume / area it holds more than the solid itself, so the
		// hollow prop would outweigh the solid one.
		if p.Wall > 0 {
			if most := p.Mesh.Solid().Measure / p.Mesh.Surface().Measure; p.Wall > most {
				return fieldErr("wall_m", "%g m is too thick for this mesh: at most %.3g m (volume / area, where the wall would hold as much as the solid)", p.Wall, most)
			}
		}
	default:
		return fieldErr("shape", "unknown shape %d", int(p.Shape))
	}
	switch {
	case p.Mass != 0 && p.Density != 0:
		return fieldErr("mass", "give mass or density, not both")
	case p.Mass != 0:
		if !finitePos(p.Mass) {
			return fieldErr("mass", "must be positive")
		}
	case p.Density != 0:
		if !finitePos(p.Density) {
			return fieldErr("density", "must be positive")
		}
		if p.Shape == Shell {
			return fieldErr("density", "a shell is thin and has no volume: give its mass instead")
		}
	default:
		return fieldErr("mass", "give mass (kg) or density (kg/m^3)")
	}
	if !finiteVec(p.Position) {
		return fieldErr("position", "must be finite numbers")
	}
	if q := p.Orient; !finite(q.Real) || !finite(q.Imag) || !finite(q.Jmag) || !finite(q.Kmag) || quat.Abs(q.Quat()) == 0 {
		return fieldErr("rotation_deg", "must be finite numbers")
	}
	return nil
}

// Volume returns the part's material volume in m^3 (0 for a thin shell; a
// hollow mesh's surface area times its wall).
func (p *Part) Volume() float64 {
	switch p.Shape {
	case MeshShape:
		if p.Mesh == nil {
			return 0
		}
		if p.Wall > 0 {
			return p.Mesh.Surface().Measure * p.Wall
		}
		return p.Mesh.Solid().Measure
	case Box:
		return p.Size.X * p.Size.Y * p.Size.Z
	case Cylinder:
		return math.Pi * p.Radius * p.Radius * p.Length
	case Tube:
		return math.Pi * (p.Radius*p.Radius - p.InnerRadius*p.InnerRadius) * p.Length
	case Sphere:
		return 4.0 / 3.0 * math.Pi * p.Radius * p.Radius * p.Radius
	case Ellipsoid:
		return 4.0 / 3.0 * math.Pi * p.SemiAxes.X * p.SemiAxes.Y * p.SemiAxes.Z
	case Cone:
		return math.Pi * p.Radius * p.Radius * p.Height / 3
	case Torus:
		return 2 * math.Pi * math.Pi * p.Radius * p.TubeRadius * p.TubeRadius
	}
	return 0
}

// TotalMass returns the part's mass in kg: Mass if given, else Density times
// Volume.
func (p *Part) TotalMass() float64 {
	if p.Mass != 0 {
		return p.Mass
	}
	return p.Density * p.Volume()
}

// LocalInertia returns the part's inertia tensor about its own centre of mass
// in its own axes (kg m^2). The formulas are the standard table entries
// (Wikipedia "List of moments of inertia"; see REFERENCES.md §1.1).
func (p *Part) LocalInertia() Mat3 {
	m := p.TotalMass()
	switch p.Shape {
	case Box:
		a2, b2, c2 := p.Size.X*p.Size.X, p.Size.Y*p.Size.Y, p.Size.Z*p.Size.Z
		return Diag(m*(b2+c2)/12, m*(a2+c2)/12, m*(a2+b2)/12)
	case Cylinder:
		r2, h2 := p.Radius*p.Radius, p.Length*p.Length
		t := m * (3*r2 + h2) / 12
		return Diag(t, t, m*r2/2)
	case Tube:
		s, h2 := p.Radius*p.Radius+p.InnerRadius*p.InnerRadius, p.Length*p.Length
		t := m * (3*s + h2) / 12
		return Diag(t, t, m*s/2)
	case Sphere:
		i := 2 * m * p.Radius * p.Radius / 5
		return Diag(i, i, i)
	case Shell:
		i := 2 * m * p.Radius * p.Radius / 3
		return Diag(i, i, i)
	case Ellipsoid:
		a2, b2, c2 := p.SemiAxes.X*p.SemiAxes.X, p.SemiAxes.Y*p.SemiAxes.Y, p.SemiAxes.Z*p.SemiAxes.Z
		return Diag(m*(b2+c2)/5, m*(a2+c2)/5, m*(a2+b2)/5)
	case Cone:
		r2, h2 := p.Radius*p.Radius, p.Height*p.Height
		t := 3 * m * (r2 + h2/4) / 20
		return Diag(t, t, 3*m*r2/10)
	case Torus:
		R2, a2 := p.Radius*p.Radius, p.TubeRadius*p.TubeRadius
		t := m * (R2/2 + 5*a2/8)
		return Diag(t, t, m*(R2+3*a2/4))
	case MeshShape:
		// The mesh's unit-density moments scaled to the mass (REFERENCES.md §9).
		mm, ok := p.meshMoments()
		if !ok {
			return Mat3{}
		}
		return Mat3(mm.Inertia).Scale(m / mm.Measure)
	}
	return Mat3{}
}

// meshMoments returns the moments a mesh part's mass follows: the surface's
// for a thin wall, else the solid's. ok is false without a mesh.
func (p *Part) meshMoments() (mesh.Moments, bool) {
	if p.Mesh == nil || len(p.Mesh.T) == 0 {
		return mesh.Moments{}, false
	}
	if p.Wall > 0 {
		return p.Mesh.Surface(), true
	}
	return p.Mesh.Solid(), true
}

// localCenter is the centre of mass in the part's authored frame: the
// mesh's centroid (of the surface for a thin wall), zero for primitives.
func (p *Part) localCenter() r3.Vec {
	if p.Shape != MeshShape {
		return r3.Vec{}
	}
	mm, _ := p.meshMoments()
	return mm.Center
}

// Center returns the part's centre of mass in the prop frame, m: Position
// for a primitive; for a mesh, Position plus the mesh's centroid turned by
// Orient.
func (p *Part) Center() r3.Vec {
	if p.Shape != MeshShape {
		return p.Position
	}
	return r3.Add(p.Position, p.Orient.Normalize().Rotate(p.localCenter()))
}

// LocalSupport returns max over the part's points p (own frame) of p . u, the
// support function of the shape in direction u. Its lowest point along a unit
// up direction n is at height -LocalSupport(-n) above the part's centre.
// Every shape's support is exact (Minkowski sums of points, discs and balls).
func (p *Part) LocalSupport(u r3.Vec) float64 {
	switch p.Shape {
	case Box:
		return (math.Abs(u.X)*p.Size.X + math.Abs(u.Y)*p.Size.Y + math.Abs(u.Z)*p.Size.Z) / 2
	case Cylinder, Tube:
		return p.Radius*math.Hypot(u.X, u.Y) + math.Abs(u.Z)*p.Length/2
	case Sphere, Shell:
		return p.Radius * r3.Norm(u)
	case Ellipsoid:
		a := p.SemiAxes
		return math.Sqrt(a.X*a.X*u.X*u.X + a.Y*a.Y*u.Y*u.Y + a.Z*a.Z*u.Z*u.Z)
	case Cone:
		// Convex hull of the apex (z = 3h/4) and the base circle (z = -h/4).
		apex := u.Z * 3 * p.Height / 4
		base := p.Radius*math.Hypot(u.X, u.Y) - u.Z*p.Height/4
		return math.Max(apex, base)
	case Torus:
		return p.Radius*math.Hypot(u.X, u.Y) + p.TubeRadius*r3.Norm(u)
	case MeshShape:
		// The largest p.u over the vertices (the mesh's exact support),
		// measured from the centre of mass.
		if p.Mesh == nil || len(p.Mesh.T) == 0 {
			return 0
		}
		return p.Mesh.Support(u) - r3.Dot(p.localCenter(), u)
	}
	return 0
}

// Reach returns the largest distance of any point of the part from its
// centre of mass, m: a bound on LocalSupport over unit directions.
func (p *Part) Reach() float64 {
	switch p.Shape {
	case Box:
		return r3.Norm(p.Size) / 2
	case Cylinder, Tube:
		return math.Hypot(p.Radius, p.Length/2)
	case Sphere, Shell:
		return p.Radius
	case Ellipsoid:
		return math.Max(p.SemiAxes.X, math.Max(p.SemiAxes.Y, p.SemiAxes.Z))
	case Cone:
		return math.Max(3*p.Height/4, math.Hypot(p.Radius, p.Height/4))
	case Torus:
		return p.Radius + p.TubeRadius
	case MeshShape:
		if p.Mesh == nil {
			return 0
		}
		return p.Mesh.Reach(p.localCenter())
	}
	return 0
}
