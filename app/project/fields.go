package project

import (
	"fmt"
	"slices"
	"strings"

	"propflight/physics"
)

// The checks in this file are about which fields a document gives, not
// their values. Parse runs them on every file and Build again, because a
// document edited in memory can break them too. Each returns the field and
// message of the first problem, or ok.

type problem struct {
	field, msg string
}

func (pr *problem) in(file string) *Error {
	return &Error{File: file, Field: pr.field, Msg: pr.msg}
}

// shapeFields lists each shape's dimension fields, all required.
var shapeFields = map[physics.Shape][]string{
	physics.Box:       {"size"},
	physics.Cylinder:  {"radius", "length"},
	physics.Tube:      {"radius", "inner_radius", "length"},
	physics.Sphere:    {"radius"},
	physics.Shell:     {"radius"},
	physics.Ellipsoid: {"semi_axes"},
	physics.Cone:      {"radius", "height"},
	physics.Torus:     {"radius", "tube_radius"},
	physics.MeshShape: {"file"},
}

// meshKeys are the keys of mesh parts only; file is required.
var meshKeys = []string{"file", "units", "up", "wall_m"}

// shapeNames lists every shape name a part takes, mesh last.
func shapeNames() []string { return append(physics.ShapeNames(), physics.MeshShape.String()) }

// dimensionKeys are the part keys that belong to some shapes only, in the
// order the file writes them.
var dimensionKeys = []string{"size", "radius", "inner_radius", "length", "height", "tube_radius", "semi_axes"}

// dimensions returns which dimension fields the part gives.
func (p *Part) dimensions() map[string]bool {
	return map[string]bool{
		"size": p.Size != nil, "radius": p.Radius != nil, "inner_radius": p.InnerRadius != nil,
		"length": p.Length != nil, "height": p.Height != nil, "tube_radius": p.TubeRadius != nil,
		"semi_axes": p.SemiAxes != nil, "file": p.File != nil, "units": p.Units != nil, "up": p.Up != nil,
		"wall_m": p.WallM != nil,
	}
}

// partFields checks the part at path: a known shape, exactly its own
// dimension fields, and one of mass and density.
func partFields(p *Part, path string) *problem {
	shape, ok := physics.ParseShape(p.Shape)
	if !ok {
		if p.Shape == "" {
			return &problem{join(path, "shape"), fmt.Sprintf("missing (one of %s)", strings.Join(shapeNames(), ", "))}
		}
		return &problem{join(path, "shape"), fmt.Sprintf("%s is not a shape (use one of %s)", quoteShort(p.Shape), strings.Join(shapeNames(), ", "))}
	}
	own := shapeFields[shape]
	a := article(p.Shape)
	given := p.dimensions()
	if shape == physics.MeshShape {
		for _, k := range dimensionKeys {
			if given[k] {
				return &problem{join(path, k), fmt.Sprintf("a mesh has no %s (it takes file, and optionally units, up and wall_m)", k)}
			}
		}
		if !given["file"] {
			return &problem{join(path, "file"), "missing (a mesh needs file: a .stl, .obj, .glb or .gltf path, relative to the project file)"}
		}
	} else {
		for _, k := range append(dimensionKeys, meshKeys...) {
			if given[k] && !slices.Contains(own, k) {
				return &problem{join(path, k), fmt.Sprintf("%s %s has no %s (it takes %s)", a, p.Shape, k, listWords(own))}
			}
		}
		for _, k := range own {
			if !given[k] {
				return &problem{join(path, k), fmt.Sprintf("missing (%s %s needs %s, in metres)", a, p.Shape, listWords(own))}
			}
		}
	}
	switch {
	case p.Mass != nil && p.Density != nil:
		return &problem{join(path, "mass"), "give mass or density, not both"}
	case p.Mass == nil && p.Density == nil:
		return &problem{join(path, "mass"), "missing: give mass (kg) or density (kg/m^3)"}
	}
	return nil
}

// throwFields checks that the throw gives at most one way of setting the
// release velocity, and distance or heading only with a hang time.
func throwFields(t *Throw) *problem {
	hang := t.HangTimeS != nil || t.HangFrames != nil
	switch {
	case t.HangTimeS != nil && t.HangFrames != nil:
		return &problem{"throw.hang_frames", "give hang_time_s or hang_frames, not both"}
	case t.ReleaseVelocity != nil && t.HangTimeS != nil:
		return &problem{"throw.hang_time_s", "give release_velocity or hang_time_s, not both"}
	case t.ReleaseVelocity != nil && t.HangFrames != nil:
		return &problem{"throw.hang_frames", "give release_velocity or hang_frames, not both"}
	}
	for _, k := range []struct {
		key string
		set bool
	}{{"distance", t.Distance != nil}, {"heading_deg", t.HeadingDeg != nil}} {
		switch {
		case k.set && t.ReleaseVelocity != nil:
			return &problem{"throw." + k.key, "goes with hang_time_s or hang_frames, not with release_velocity"}
		case k.set && !hang:
			return &problem{"throw." + k.key, "needs hang_time_s or hang_frames"}
		}
	}
	if t.Spin != nil {
		return spinFields(t.Spin)
	}
	return nil
}

// spinFields checks the spin's axis names, that a tilt goes with a named
// axis, and that exactly one rate is given.
func spinFields(s *Spin) *problem {
	if s.Axis != nil && s.Axis.Vector == nil && !slices.Contains(axisNames, s.Axis.Name) {
		return &problem{"throw.spin.axis", fmt.Sprintf("%s is not an axis (use least, middle, greatest or a vector [x, y, z])", quoteShort(s.Axis.Name))}
	}
	if s.TiltToward != nil && !slices.Contains(axisNames, *s.TiltToward) {
		return &problem{"throw.spin.tilt_toward", fmt.Sprintf("%s is not an axis (use least, middle or greatest)", quoteShort(*s.TiltToward))}
	}
	if s.Axis != nil && s.Axis.Vector != nil {
		if s.TiltDeg != nil {
			return &problem{"throw.spin.tilt_deg", "applies only to a named axis; tilt the vector itself instead"}
		}
		if s.TiltToward != nil {
			return &problem{"throw.spin.tilt_toward", "applies only to a named axis"}
		}
	}
	switch {
	case s.TurnsPerSecond != nil && s.FramesPerTurn != nil:
		return &problem{"throw.spin.frames_per_turn", "give turns_per_second or frames_per_turn, not both"}
	case s.TurnsPerSecond == nil && s.FramesPerTurn == nil:
		return &problem{"throw.spin.turns_per_second", "missing: give turns_per_second or frames_per_turn (leave out spin for none)"}
	}
	return nil
}
