package ui

import (
	"fmt"
	"math"
	"path/filepath"
	"strconv"
	"strings"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/container"
	"fyne.io/fyne/v2/dialog"
	"fyne.io/fyne/v2/storage"
	"fyne.io/fyne/v2/widget"
	"gonum.org/v1/gonum/spatial/r3"

	"propflight/app/editor"
	"propflight/app/meshio"
	"propflight/app/project"
	"propflight/physics/mesh"
	"propflight/widgets"
)

// This file holds the mesh part in the window: choosing a model file,
// checking it off the UI goroutine, and the controls a mesh part has
// instead of dimensions (file, units, up axis, hollow wall).

// meshChoice is the "add a part" entry that reads a part from a model file.
const meshChoice = "mesh file…"

// meshShape is the project file's name of the mesh shape.
const meshShape = "mesh"

// Wall thickness limits of a hollow mesh part, m, and the thickness a part
// starts with when made hollow (a pressed-steel or cast-aluminium kitchen
// utensil is a millimetre or two: common practice, no source).
const (
	minWall     = 0.0001
	maxWall     = 0.05
	defaultWall = 0.002
)

// meshFacts is what reading a model file found: its triangle count and the
// box it spans in the file's own numbers, or the reason it cannot be a part.
type meshFacts struct {
	triangles int
	span      r3.Vec // extent along x, y, z in file units
	notes     []string
	err       error
}

// inspectMesh reads and checks the model at path (in file units, y up),
// as the project will when it builds the part.
func inspectMesh(path string) meshFacts {
	tris, err := meshio.ReadFile(path, meshio.Options{Units: "m"})
	if err != nil {
		return meshFacts{err: err}
	}
	m, notes, err := mesh.New(tris)
	if err != nil {
		return meshFacts{err: err}
	}
	lo, hi := m.Bounds()
	return meshFacts{triangles: len(m.T), span: r3.Sub(hi, lo), notes: notes}
}

// guessUnits picks the units that make a model of this span (file units)
// hand-sized: the first of metres, millimetres, centimetres and inches
// that puts its longest side between 2 cm and 3 m, else metres. Files
// carry no units; CAD exports are usually millimetres and 3D packages
// metres (common practice, no source), so those are tried first.
func guessUnits(span r3.Vec) string {
	longest := math.Max(span.X, math.Max(span.Y, span.Z))
	for _, u := range []string{"m", "mm", "cm", "in"} {
		s, _ := meshio.UnitScale(u)
		if l := longest * s; l >= 0.02 && l <= 3 {
			return u
		}
	}
	return "m"
}

// chooseMeshFile asks for a model file (.stl, .obj, .glb, .gltf) and calls
// picked with its path; nothing happens on cancel.
func (w *Window) chooseMeshFile(picked func(path string), cancelled func()) {
	d := dialog.NewFileOpen(func(rc fyne.URIReadCloser, err error) {
		if err != nil {
			w.showError("Cannot open the model", err)
			return
		}
		if rc == nil {
			if cancelled != nil {
				cancelled()
			}
			return
		}
		path := rc.URI().Path()
		rc.Close()
		picked(path)
	}, w.win)
	d.SetFilter(storage.NewExtensionFileFilter(meshio.Extensions()))
	w.startIn(d)
	d.Resize(fileDialogSize)
	d.Show()
}

// checkMesh inspects the model at path off the UI goroutine and calls done
// on the UI goroutine (at once in a synchronous test window). A model that
// cannot be a part shows an error in plain words and done is not called.
func (w *Window) checkMesh(path string, done func(meshFacts)) {
	finish := func(f meshFacts) {
		if f.err != nil {
			w.showErrorNote("Cannot use "+filepath.Base(path), f.err,
				"A mesh part must be one or more closed surfaces (no holes, every face turned the same way). The project is unchanged.")
			return
		}
		done(f)
	}
	if w.synchronous {
		finish(inspectMesh(path))
		return
	}
	go func() {
		f := inspectMesh(path)
		w.do(func() {
			if !w.closed {
				finish(f)
			}
		})
	}()
}

// resync sets the panel from the document again (after a cancelled file
// choice left the shape picker on "mesh").
func (p *propPanel) resync() {
	p.w.syncing++
	p.sync(p.w.ed.Doc())
	p.w.syncing--
}

// meshPartName is a part name from a model's file name: "ladle.obj" gives
// "ladle".
func meshPartName(path string) string {
	base := filepath.Base(path)
	name := strings.TrimSpace(strings.TrimSuffix(base, filepath.Ext(base)))
	if name == "" {
		return meshShape
	}
	return name
}

// addMeshFile adds a mesh part read from path after the other parts and
// selects it: 0.5 kg, at the prop's origin, in the units its size suggests.
func (p *propPanel) addMeshFile(path string) {
	w := p.w
	w.checkMesh(path, func(f meshFacts) {
		units := guessUnits(f.span)
		var n int
		w.editAndSyncThen("Add mesh "+filepath.Base(path), func(d *project.Document) error {
			part := project.Part{Name: freshName(d, meshPartName(path)), Shape: meshShape, Mass: ptrTo(0.5)}
			if units != "m" {
				part.Units = ptrTo(units)
			}
			d.Prop.Parts = append(d.Prop.Parts, part)
			n = len(d.Prop.Parts) - 1
			d.SetMeshPath(w.ed.Path(), n, path)
			return nil
		}, func() { p.selected = n })
	})
}

// meshFromFile turns part i into a mesh part read from path, keeping its
// name, mass or density, position and rotation (for "shape: mesh" and for
// replacing a mesh part's file). A file of another format than the last
// one sets up back to y when the new one is glTF.
func (p *propPanel) meshFromFile(i int, path string) {
	w := p.w
	w.checkMesh(path, func(f meshFacts) {
		w.editAndSync("Read "+filepath.Base(path), func(d *project.Document) error {
			if i < 0 || i >= len(d.Prop.Parts) {
				return fmt.Errorf("no part %d", i+1)
			}
			old := d.Prop.Parts[i]
			part := project.Part{Name: old.Name, Shape: meshShape, Mass: old.Mass, Density: old.Density,
				Position: old.Position, RotationDeg: old.RotationDeg}
			if old.Shape == meshShape {
				part.Units, part.Up, part.WallM = old.Units, old.Up, old.WallM
			} else if u := guessUnits(f.span); u != "m" {
				part.Units = ptrTo(u)
			}
			if isGLTF(path) {
				part.Up = nil
			}
			if part.Mass == nil && part.Density == nil {
				part.Mass = ptrTo(0.5)
			}
			d.Prop.Parts[i] = part
			d.SetMeshPath(w.ed.Path(), i, path)
			return nil
		})
	})
}

func isGLTF(path string) bool {
	f, err := meshio.FormatOf(path)
	return err == nil && (f == meshio.GLB || f == meshio.GLTF)
}

// resolved returns part i with a relative mesh file made into the path the
// project's Build opens, so that the part can be built on its own (to
// convert between mass and density).
func resolved(d *project.Document, i int) project.Part {
	p := d.Prop.Parts[i]
	if f := d.MeshPath(d.File, i); f != "" {
		p.File = &f
	}
	return p
}

// useDensityAt is useDensity for part i of d, whose mesh file may be
// relative to the project.
func useDensityAt(d *project.Document, i int, density bool) {
	q := useDensity(resolved(d, i), density)
	d.Prop.Parts[i].Mass, d.Prop.Parts[i].Density = q.Mass, q.Density
}

// meshControls are the controls of a mesh part between its shape and its
// mass: the file with a button to read another, the units and up axis, the
// hollow check and, for a hollow part, its wall (made by the caller in
// field order, see buildPart).
func (p *propPanel) meshControls(i int, part project.Part) []fyne.CanvasObject {
	w := p.w
	file := ""
	if part.File != nil {
		file = *part.File
	}
	fileLabel := widget.NewLabel(file)
	fileLabel.Truncation = fyne.TextTruncateEllipsis
	replace := widget.NewButton("Read another…", func() {
		w.chooseMeshFile(func(path string) { p.meshFromFile(i, path) }, nil)
	})

	p.units = widget.NewSelect(meshio.UnitNames(), func(u string) {
		w.editAndSync("Change units to "+u, func(d *project.Document) error {
			if u == "m" {
				d.Prop.Parts[i].Units = nil
			} else {
				d.Prop.Parts[i].Units = ptrTo(u)
			}
			return nil
		})
	})
	p.up = widget.NewRadioGroup([]string{"y", "z"}, func(s string) {
		if s == "" {
			return
		}
		w.editAndSync("Change the up axis to "+s, func(d *project.Document) error {
			if s == "y" {
				d.Prop.Parts[i].Up = nil
			} else {
				d.Prop.Parts[i].Up = ptrTo(s)
			}
			return nil
		})
	})
	p.up.Horizontal = true
	p.up.Required = true
	if isGLTF(file) {
		p.up.Disable()
	}
	p.hollow = widget.NewCheck("hollow (mass in a thin wall)", func(on bool) {
		w.editAndSync(map[bool]string{true: "Make the part hollow", false: "Make the part solid"}[on], func(d *project.Document) error {
			if on {
				d.Prop.Parts[i].WallM = ptrTo(defaultWall)
			} else {
				d.Prop.Parts[i].WallM = nil
			}
			return nil
		})
	})
	upNote := "Up y: the file's +y is the prop's up. Up z (common from CAD): the file's +z is up and its +y points away from the front view (−z)."
	if isGLTF(file) {
		upNote = "glTF files are always y up."
	}
	p.meshFacts = note("")
	return []fyne.CanvasObject{
		container.NewBorder(nil, nil, widget.NewLabel("file"), replace, fileLabel),
		container.NewGridWithColumns(2,
			container.NewBorder(nil, nil, widget.NewLabel("units"), nil, p.units),
			container.NewBorder(nil, nil, widget.NewLabel("up"), nil, p.up)),
		note(upNote),
		p.meshFacts,
	}
}

// wallField makes the wall-thickness field of hollow mesh part i.
func (p *propPanel) wallField(i int) *widgets.NumberField {
	w := p.w
	f := w.newField(&p.partF, "wall", widgets.Length, minWall, maxWall, func(v float64, final bool) {
		w.edit("Change wall", fmt.Sprintf("part %d wall_m", i), final, func(d *project.Document) error {
			d.Prop.Parts[i].WallM = ptrTo(v)
			return nil
		})
	})
	f.SetLog(true)
	return f
}

// syncMesh sets the mesh controls from part.
func (p *propPanel) syncMesh(part project.Part) {
	u := "m"
	if part.Units != nil {
		u = *part.Units
	}
	p.units.SetSelected(u)
	up := "y"
	if part.Up != nil {
		up = *part.Up
	}
	p.up.SetSelected(up)
	p.hollow.SetChecked(part.WallM != nil)
}

// factsFrom says what the selected mesh part's model is, from result res:
// its triangles, its size in metres (after units and up) and its volume
// (or, hollow, its surface).
func (p *propPanel) factsFrom(res editor.Result) {
	i := p.selected
	if p.meshFacts == nil || res.Scene == nil || i < 0 || i >= len(res.Scene.Prop.Parts) {
		return
	}
	pt := &res.Scene.Prop.Parts[i]
	if pt.Mesh == nil {
		return
	}
	lo, hi := pt.Mesh.Bounds()
	span := r3.Sub(hi, lo)
	triangles, volume, area, hollow := len(pt.Mesh.T), pt.Mesh.Solid().Measure, pt.Mesh.Surface().Measure, pt.Wall > 0
	unit, k := "cm", 100.0
	if math.Max(span.X, math.Max(span.Y, span.Z)) >= 1 {
		unit, k = "m", 1
	}
	size := fmt.Sprintf("%s × %s × %s %s", meshNumber(k*span.X), meshNumber(k*span.Y), meshNumber(k*span.Z), unit)
	amount := "volume " + meshNumber(volume*1e6) + " cm³"
	if volume >= 1e-3 {
		amount = "volume " + meshNumber(volume*1e3) + " L"
	}
	if hollow {
		amount = "surface " + meshNumber(area*1e4) + " cm²"
		if area >= 1 {
			amount = "surface " + meshNumber(area) + " m²"
		}
	}
	text := fmt.Sprintf("%d triangles, %s, %s.", triangles, size, amount)
	// The project's notes on this part (a size that suggests the wrong
	// units, faces turned outward), as check prints them.
	prefix := fmt.Sprintf("prop.parts[%d].", i)
	for _, n := range res.Scene.Notes {
		if rest, ok := strings.CutPrefix(n, prefix); ok {
			if _, msg, ok := strings.Cut(rest, ": "); ok {
				rest = msg
			}
			text += "\nNote: " + rest + "."
		}
	}
	p.meshFacts.SetText(text)
}

// meshNumber writes x with three significant figures and no exponent
// (0.0123, 1.23, 123, 12300).
func meshNumber(x float64) string {
	if x == 0 || math.IsNaN(x) || math.IsInf(x, 0) {
		return strconv.FormatFloat(x, 'f', 0, 64)
	}
	d := max(0, 2-int(math.Floor(math.Log10(math.Abs(x)))))
	return strconv.FormatFloat(x, 'f', d, 64)
}
