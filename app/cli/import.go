package cli

import (
	"errors"
	"fmt"
	"io"
	"path/filepath"
	"strings"

	"propflight/app/meshio"
	"propflight/app/project"
	"propflight/internal/printable"
)

func init() {
	register(&Spec{
		Name: "import", Order: 25,
		Synopsis: "MESH -o OUT.json (--density D | --mass M) [--units U] [--up y|z] [...]",
		Summary:  "make a project from a model file (STL, OBJ, glTF)",
		About: "Write a project with one mesh part read from MESH (.stl, .obj, .glb or\n" +
			".gltf) and the default throw, ready for check, sheet and export. The part's\n" +
			"file is written relative to OUT's folder. The mesh must be closed: every\n" +
			"edge shared by two faces that run it opposite ways; its mass properties are\n" +
			"exact for the triangles. Give its mass, or its density for a solid part;\n" +
			"--wall-m makes it hollow (a wall of that thickness over the surface).",
		Operand: "MESH", OperandRequired: true,
		MissingOperand: "import: give the model file (MESH), for example: propflight import ladle.obj -o ladle.json --density 7900",
		Flags: []*Flag{
			{Name: "--output", Aliases: []string{"-o"}, Value: "OUT", Help: "the project file to write (.json)"},
			forceFlag,
			{Name: "--units", Value: "U", Choices: meshio.UnitNames(), Default: "m", Help: "the length unit of MESH's numbers (CAD STL is often mm)"},
			{Name: "--up", Value: "AXIS", Choices: []string{"y", "z"}, Default: "y", Help: "MESH's up axis; z turns its +z to the prop's +y (glTF is always y)"},
			{Name: "--density", Value: "D", Kind: Number, Help: "density, kg/m^3 (water 1000, pine about 500, steel about 7850)"},
			{Name: "--mass", Value: "M", Kind: Number, Help: "the part's mass, kg"},
			{Name: "--wall-m", Value: "T", Kind: Number, Help: "hollow: wall thickness, m (thin-wall approximation)"},
		},
		Check: checkImport,
		Run:   runImport,
	})
}

// checkImport requires -o and exactly one of --density and --mass, each
// positive.
func checkImport(c *Command) error {
	out := c.Text("--output")
	switch {
	case out == "":
		return usagef("import: -o OUT.json is required")
	case out == "-":
		return usagef("import: -o must name a file: the mesh's path is written relative to it")
	case c.Has("--density") == c.Has("--mass"):
		return usagef("import: give --density D (kg/m^3) or --mass M (kg), one of them")
	}
	for _, f := range []string{"--density", "--mass", "--wall-m"} {
		if c.Has(f) && !(c.Float(f) > 0) {
			return usagef("import: %s: must be positive, not %s", f, c.Text(f))
		}
	}
	return nil
}

// importFields maps a project field of the one part to the argument or flag
// the user gave it with.
var importFields = map[string]string{
	"file": "", "units": "--units", "up": "--up", "mass": "--mass", "density": "--density", "wall_m": "--wall-m",
}

// runImport builds the project, checks it as check would (the mesh is read
// and checked) and writes it atomically; on any problem nothing is written.
func runImport(out io.Writer, c *Command) error {
	meshPath, outPath := c.File, c.Text("--output")
	if _, err := meshio.FormatOf(meshPath); err != nil {
		return usagef("import: %s: %v", meshPath, err)
	}
	if strings.ToLower(filepath.Ext(outPath)) != ".json" {
		return usagef("import: -o %s: a project file ends in .json", outPath)
	}
	doc := importDocument(meshPath, outPath, c)
	sc, err := doc.Build()
	if err != nil {
		var pe *project.Error
		if errors.As(err, &pe) {
			field := strings.TrimPrefix(pe.Field, "prop.parts[0].")
			if flag, ok := importFields[field]; ok {
				if flag == "" {
					return usagef("import: %s: %s", meshPath, pe.Msg)
				}
				return usagef("import: %s: %s", flag, pe.Msg)
			}
		}
		return err
	}
	data, err := project.Marshal(doc)
	if err != nil {
		return err
	}
	pt := sc.Prop.Parts[0]
	what := fmt.Sprintf("one mesh part, %d triangles, mass %s kg", len(pt.Mesh.T), num(sc.Mass.Mass))
	if err := writeOut(out, c, outPath, func(w io.Writer) error { _, err := w.Write(data); return err }, what); err != nil {
		return err
	}
	for _, n := range sc.Notes {
		fmt.Fprintf(out, "note: %s\n", printable.String(strings.TrimPrefix(n, "prop.parts[0].file: ")))
	}
	return nil
}

// importDocument is the project import writes: the mesh as its one part,
// named after the file, and the window's default throw (24 fps, from
// 1.5 m at 5 m/s, 60 degrees up, two turns a second about the greatest
// axis).
func importDocument(meshPath, outPath string, c *Command) *project.Document {
	base := filepath.Base(meshPath)
	name := strings.TrimSuffix(base, filepath.Ext(base))
	units, up := c.Text("--units"), c.Text("--up")
	part := project.Part{Name: name, Shape: "mesh", Units: &units, Up: &up}
	if c.Has("--density") {
		d := c.Float("--density")
		part.Density = &d
	} else {
		m := c.Float("--mass")
		part.Mass = &m
	}
	if c.Has("--wall-m") {
		w := c.Float("--wall-m")
		part.WallM = &w
	}
	turns := 2.0
	doc := &project.Document{
		File: outPath,
		Name: name,
		Prop: project.Prop{Parts: []project.Part{part}},
		Throw: project.Throw{
			FPS:             &project.FrameRate{Number: 24},
			ReleasePosition: &project.Vec3{0, 1.5, 0},
			ReleaseVelocity: &project.Vec3{2.5, 4.330127018922193, 0}, // 5 m/s at 60 degrees
			Spin:            &project.Spin{Axis: &project.SpinAxis{Name: "greatest"}, TurnsPerSecond: &turns},
		},
	}
	doc.SetMeshPath(outPath, 0, meshPath)
	return doc
}
