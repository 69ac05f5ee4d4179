package ui

import (
	"fmt"
	"slices"
	"strings"

	"propflight/app/project"
	"propflight/physics"
)

// This file holds the edits the prop controls make to a project.Document,
// as plain functions with no UI so that they can be tested alone. Lengths
// are metres, masses kilograms, densities kg/m^3, angles degrees.

// dimension is one number of a part's shape as the controls show it: the
// project-file field and, for the three-number fields (size, semi_axes),
// which element.
type dimension struct {
	Field string // "size", "radius", ...
	Index int    // element of a three-number field, -1 for a single number
	Label string // what the control says
}

// shapeDimensions lists every dimension control of a shape, in the order
// the project file writes them.
func shapeDimensions(shape string) []dimension {
	switch shape {
	case "box":
		return []dimension{{"size", 0, "size x"}, {"size", 1, "size y"}, {"size", 2, "size z"}}
	case "cylinder":
		return []dimension{{"radius", -1, "radius"}, {"length", -1, "length (z)"}}
	case "tube":
		return []dimension{{"radius", -1, "outer radius"}, {"inner_radius", -1, "inner radius"}, {"length", -1, "length (z)"}}
	case "sphere":
		return []dimension{{"radius", -1, "radius"}}
	case "shell":
		return []dimension{{"radius", -1, "radius"}}
	case "ellipsoid":
		return []dimension{{"semi_axes", 0, "semi-axis x"}, {"semi_axes", 1, "semi-axis y"}, {"semi_axes", 2, "semi-axis z"}}
	case "cone":
		return []dimension{{"radius", -1, "base radius"}, {"height", -1, "height (z)"}}
	case "torus":
		return []dimension{{"radius", -1, "ring radius"}, {"tube_radius", -1, "tube radius"}}
	}
	return nil
}

// dimValue returns the value of dimension dm of part p, and whether the
// part has it.
func dimValue(p *project.Part, dm dimension) (float64, bool) {
	if dm.Index >= 0 {
		v := p.Size
		if dm.Field == "semi_axes" {
			v = p.SemiAxes
		}
		if v == nil {
			return 0, false
		}
		return v[dm.Index], true
	}
	x := dimPtr(p, dm.Field)
	if x == nil || *x == nil {
		return 0, false
	}
	return **x, true
}

// dimPtr returns the address of a single-number dimension field of p.
func dimPtr(p *project.Part, field string) **float64 {
	switch field {
	case "radius":
		return &p.Radius
	case "inner_radius":
		return &p.InnerRadius
	case "length":
		return &p.Length
	case "height":
		return &p.Height
	case "tube_radius":
		return &p.TubeRadius
	}
	return nil
}

// setDim sets dimension dm of part p to v (metres).
func setDim(p *project.Part, dm dimension, v float64) {
	if dm.Index >= 0 {
		ptr := &p.Size
		if dm.Field == "semi_axes" {
			ptr = &p.SemiAxes
		}
		if *ptr == nil {
			*ptr = &project.Vec3{}
		}
		nv := **ptr
		nv[dm.Index] = v
		*ptr = &nv
		return
	}
	if x := dimPtr(p, dm.Field); x != nil {
		*x = ptrTo(v)
	}
}

func ptrTo[T any](v T) *T { return &v }

// newPart returns a part of the shape with a hand-sized default, named
// name: about ten centimetres across, 0.5 kg (a thin shell cannot take a
// density, so every new part starts with a mass).
func newPart(shape, name string) project.Part {
	p := project.Part{Name: name, Shape: shape, Mass: ptrTo(0.5)}
	switch shape {
	case "box":
		p.Size = &project.Vec3{0.1, 0.1, 0.1}
	case "cylinder":
		p.Radius, p.Length = ptrTo(0.05), ptrTo(0.1)
	case "tube":
		p.Radius, p.InnerRadius, p.Length = ptrTo(0.05), ptrTo(0.04), ptrTo(0.1)
	case "sphere", "shell":
		p.Radius = ptrTo(0.05)
	case "ellipsoid":
		p.SemiAxes = &project.Vec3{0.08, 0.05, 0.03}
	case "cone":
		p.Radius, p.Height = ptrTo(0.05), ptrTo(0.1)
	case "torus":
		p.Radius, p.TubeRadius = ptrTo(0.08), ptrTo(0.02)
	}
	return p
}

// changeShape turns part p into the shape, keeping its name, mass or
// density, position and rotation, and every dimension field the two
// shapes share (a cylinder's radius stays the cone's radius); the others
// get newPart's defaults. A thin shell has no volume, so a density becomes
// the part's mass when it turns into one.
func changeShape(p project.Part, shape string) project.Part {
	if p.Shape == shape {
		return p
	}
	q := newPart(shape, p.Name)
	q.Mass, q.Density = p.Mass, p.Density
	q.Position, q.RotationDeg = p.Position, p.RotationDeg
	for _, dm := range shapeDimensions(shape) {
		if v, ok := dimValue(&p, dm); ok {
			setDim(&q, dm, v)
		}
	}
	if shape == "shell" && q.Density != nil {
		m, ok := partMass(p)
		if !ok {
			m = 0.5
		}
		q.Mass, q.Density = ptrTo(m), nil
	}
	return q
}

// builtPart turns one part into physics units through the project's own
// Build, so the numbers are exactly what the verdict uses. It fails when
// the part has a bad value.
func builtPart(p project.Part) (physics.Part, bool) {
	p.Position, p.RotationDeg = nil, nil
	sc, err := (&project.Document{Prop: project.Prop{Parts: []project.Part{p}}}).Build()
	if err != nil || len(sc.Prop.Parts) != 1 {
		return physics.Part{}, false
	}
	return sc.Prop.Parts[0], true
}

// partMass returns the part's mass in kg (given, or density times volume).
func partMass(p project.Part) (float64, bool) {
	if p.Mass != nil {
		return *p.Mass, true
	}
	bp, ok := builtPart(p)
	if !ok {
		return 0, false
	}
	return bp.TotalMass(), true
}

// partVolume returns the part's material volume in m^3 (0 for a shell).
func partVolume(p project.Part) (float64, bool) {
	if p.Density == nil {
		p.Density, p.Mass = ptrTo(1.0), nil
	}
	if p.Shape == "shell" {
		return 0, true
	}
	bp, ok := builtPart(p)
	if !ok {
		return 0, false
	}
	return bp.Volume(), true
}

// useDensity switches part p between giving its mass and giving its
// density, converting the number through the part's volume so the prop
// weighs the same. A shell has no volume and keeps its mass; a part whose
// volume cannot be worked out (a bad dimension) gets water's 1000 kg/m^3
// or 0.5 kg.
func useDensity(p project.Part, density bool) project.Part {
	switch {
	case density && p.Density == nil:
		if p.Shape == "shell" {
			return p
		}
		vol, ok := partVolume(p)
		rho := 1000.0
		if ok && vol > 0 && p.Mass != nil {
			rho = *p.Mass / vol
		}
		p.Mass, p.Density = nil, ptrTo(rho)
	case !density && p.Mass == nil:
		m, ok := partMass(p)
		if !ok {
			m = 0.5
		}
		p.Mass, p.Density = ptrTo(m), nil
	}
	return p
}

// partLabel is how the parts list names part i: its name, else its shape
// and number.
func partLabel(p *project.Part, i int) string {
	if strings.TrimSpace(p.Name) != "" {
		return p.Name
	}
	return fmt.Sprintf("%s %d", p.Shape, i+1)
}

// freshName returns a part name based on base that no part of d has yet:
// base, then "base 2", "base 3", ...
func freshName(d *project.Document, base string) string {
	taken := make([]string, 0, len(d.Prop.Parts))
	for _, p := range d.Prop.Parts {
		taken = append(taken, p.Name)
	}
	if !slices.Contains(taken, base) {
		return base
	}
	for n := 2; ; n++ {
		if s := fmt.Sprintf("%s %d", base, n); !slices.Contains(taken, s) {
			return s
		}
	}
}

// vecOr returns *v, or zero when v is nil.
func vecOr(v *project.Vec3) project.Vec3 {
	if v == nil {
		return project.Vec3{}
	}
	return *v
}

// setVecElem returns a fresh vector equal to *v (zero if nil) with element
// i set to x.
func setVecElem(v *project.Vec3, i int, x float64) *project.Vec3 {
	nv := vecOr(v)
	nv[i] = x
	return &nv
}

// emptyDocument is what File > New starts from: one 30 x 20 x 5 cm box of
// 1 kg (a book-sized block) thrown up and forward at 5 m/s and 60 degrees
// with two turns a second about its greatest axis, at 24 fps.
func emptyDocument() *project.Document {
	return &project.Document{
		Prop: project.Prop{Parts: []project.Part{{
			Name: "block", Shape: "box", Size: &project.Vec3{0.3, 0.2, 0.05}, Mass: ptrTo(1.0),
		}}},
		Throw: project.Throw{
			FPS:             &project.FrameRate{Number: 24},
			ReleasePosition: &project.Vec3{0, 1.5, 0},
			ReleaseVelocity: &project.Vec3{2.5, 4.330127018922193, 0},
			Spin: &project.Spin{
				Axis:           &project.SpinAxis{Name: "greatest"},
				TurnsPerSecond: ptrTo(2.0),
			},
		},
	}
}
