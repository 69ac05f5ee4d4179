package ui

import (
	"fmt"
	"slices"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/container"
	"fyne.io/fyne/v2/theme"
	"fyne.io/fyne/v2/widget"

	"propflight/app/editor"
	"propflight/app/project"
	"propflight/assets"
	"propflight/internal/printable"
	"propflight/physics"
	"propflight/widgets"
)

// propPanel is the Prop tab: the preset picker, the list of parts and the
// selected part's shape, dimensions, mass or density, position and
// rotation.
type propPanel struct {
	w       *Window
	content *fyne.Container

	preset   *widget.Select
	list     *widget.List
	labels   []string // list rows, from the document
	selected int      // selected part, -1 for none
	add      *widget.Select
	dup      *widget.Button
	remove   *widget.Button
	summary  *widget.Label // the prop's mass and parts count, from the last result
	partBox  *fyne.Container
	built    partKey // what partBox shows
	name     *widget.Entry
	shape    *widget.Select
	massMode *widget.RadioGroup
	partF    fieldSet // number fields of the selected part (rebuilt with it)
	// A mesh part's controls (see meshpart.go); nil for a primitive.
	units     *widget.Select
	up        *widget.RadioGroup
	hollow    *widget.Check
	meshFacts *widget.Label
}

// partKey is what decides which controls the part editor holds.
type partKey struct {
	index   int
	shape   string
	density bool
	hollow  bool // a mesh part with a wall
	parts   int
}

const (
	modeMass    = "mass"
	modeDensity = "density"
)

func newPropPanel(w *Window) *propPanel {
	p := &propPanel{w: w, selected: 0, built: partKey{index: -2}}
	p.preset = widget.NewSelect(assets.PresetNames(), p.pickPreset)
	p.preset.PlaceHolder = "load a kitchen prop…"

	p.list = widget.NewList(
		func() int { return len(p.labels) },
		func() fyne.CanvasObject { return newLabel("part name") },
		func(id widget.ListItemID, o fyne.CanvasObject) {
			if id < len(p.labels) {
				o.(*widget.Label).SetText(p.labels[id])
			}
		})
	p.list.OnSelected = func(id widget.ListItemID) {
		if id == p.selected {
			return
		}
		p.selected = id
		p.w.syncing++
		p.syncPart(p.w.ed.Doc())
		p.w.syncing--
	}

	p.add = widget.NewSelect(append(physics.ShapeNames(), meshChoice), func(shape string) {
		if shape == "" {
			return
		}
		p.add.ClearSelected()
		if shape == meshChoice {
			p.w.chooseMeshFile(p.addMeshFile, nil)
			return
		}
		p.addPart(shape)
	})
	p.add.PlaceHolder = "add a part…"
	p.dup = widget.NewButtonWithIcon("duplicate", theme.ContentCopyIcon(), p.duplicatePart)
	p.remove = widget.NewButtonWithIcon("remove", theme.ContentRemoveIcon(), p.removePart)
	p.summary = note("")
	p.partBox = container.NewVBox()

	p.content = container.NewVBox(
		heading("Preset"),
		p.preset,
		note("Props from our slapstick kitchen. Loading one replaces the project."),
		widget.NewSeparator(),
		heading("Parts"),
		sized(p.list, 0, 150),
		container.NewGridWithColumns(3, p.add, p.dup, p.remove),
		p.summary,
		widget.NewSeparator(),
		p.partBox,
	)
	return p
}

// fields returns the number fields the panel has now.
func (p *propPanel) fields() fieldSet { return p.partF }

// showPreset shows name in the preset picker without loading it.
func (p *propPanel) showPreset(name string) {
	p.w.syncing++
	if name == "" {
		p.preset.ClearSelected()
	} else {
		p.preset.SetSelected(name)
	}
	p.w.syncing--
}

// pickPreset loads the named preset, asking first if that would lose
// unsaved changes.
func (p *propPanel) pickPreset(name string) {
	if p.w.syncing > 0 || name == "" {
		return
	}
	p.w.confirmDiscard("Load the "+name+" preset", func() { p.w.loadPreset(name) }, func() { p.showPreset(p.w.preset) })
}

// sync sets the list and the part editor from the document.
func (p *propPanel) sync(d *project.Document) {
	p.labels = p.labels[:0]
	for i := range d.Prop.Parts {
		p.labels = append(p.labels, printable.String(partLabel(&d.Prop.Parts[i], i)))
	}
	if p.selected >= len(p.labels) {
		p.selected = len(p.labels) - 1
	}
	if p.selected < 0 && len(p.labels) > 0 {
		p.selected = 0
	}
	p.list.Refresh()
	if p.selected >= 0 {
		p.list.Select(p.selected)
	} else {
		p.list.UnselectAll()
	}
	if len(p.labels) <= 1 {
		p.remove.Disable()
	} else {
		p.remove.Enable()
	}
	p.syncPart(d)
}

// syncPart rebuilds the part editor if the selected part's controls
// differ from those shown, and sets their values.
func (p *propPanel) syncPart(d *project.Document) {
	if p.selected < 0 || p.selected >= len(d.Prop.Parts) {
		p.partBox.RemoveAll()
		p.built = partKey{index: -1}
		return
	}
	part := d.Prop.Parts[p.selected]
	key := partKey{index: p.selected, shape: part.Shape, density: part.Density != nil,
		hollow: part.Shape == meshShape && part.WallM != nil, parts: len(d.Prop.Parts)}
	if key != p.built {
		p.buildPart(key)
	}
	p.name.SetText(part.Name)
	p.shape.SetSelected(part.Shape)
	if part.Density != nil {
		p.massMode.SetSelected(modeDensity)
	} else {
		p.massMode.SetSelected(modeMass)
	}
	i := 0
	for _, dm := range shapeDimensions(part.Shape) {
		if v, ok := dimValue(&part, dm); ok {
			setValue(p.partF[i], v)
		}
		i++
	}
	if part.Density != nil {
		setValue(p.partF[i], *part.Density)
	} else if part.Mass != nil {
		setValue(p.partF[i], *part.Mass)
	}
	i++
	if key.shape == meshShape {
		p.syncMesh(part)
		p.factsFrom(p.w.good)
		if key.hollow {
			setValue(p.partF[i], *part.WallM)
			i++
		}
	}
	pos, rot := vecOr(part.Position), vecOr(part.RotationDeg)
	for k := range 3 {
		setValue(p.partF[i+k], pos[k])
		setValue(p.partF[i+3+k], rot[k])
	}
}

// dimensionSpan is how far a dimension's or a mass's slider reaches: a
// factor of dimensionSpan either side of its value, so a drag trims the
// part; typing reaches the whole range.
const dimensionSpan = 3

// buildPart makes the controls of the selected part for key, in the order
// they appear: name and shape, dimensions, a mesh part's file controls,
// mass or density (and a hollow mesh's wall), and the place in the prop.
func (p *propPanel) buildPart(key partKey) {
	i := key.index
	p.built = key
	p.partF = nil
	tag := func(field string) string { return fmt.Sprintf("part %d %s", i, field) }

	p.buildNameAndShape(key, tag)
	dims := p.dimensionFields(key, tag)
	amount := p.amountField(key, tag)
	var meshObjs []fyne.CanvasObject
	var wall *widgets.NumberField
	p.units, p.up, p.hollow, p.meshFacts = nil, nil, nil, nil
	if key.shape == meshShape {
		meshObjs = p.meshControls(i, p.w.ed.Doc().Prop.Parts[i])
		if key.hollow {
			wall = p.wallField(i)
		}
	}
	if key.shape == "shell" {
		p.massMode.Disable()
	}
	place := p.placeFields(i, tag)
	p.partF.alignLabels()

	objs := []fyne.CanvasObject{
		heading(fmt.Sprintf("Part %d of %d", i+1, key.parts)),
		container.NewBorder(nil, nil, widget.NewLabel("name"), nil, p.name),
		container.NewBorder(nil, nil, widget.NewLabel("shape"), nil, p.shape),
		note(shapeNote(key.shape)),
	}
	objs = append(objs, dims...)
	objs = append(objs, meshObjs...)
	objs = append(objs, p.massMode, amount)
	if key.shape == "shell" {
		objs = append(objs, note("A thin shell has no volume: give its mass."))
	}
	if key.shape == meshShape {
		objs = append(objs, p.hollow)
		if wall != nil {
			objs = append(objs, wall, note("The mass lies in a wall this thick over the whole surface (a thin wall: keep it well under the part's size)."))
		}
		objs = append(objs, heading("Place in the prop"),
			note("Where the file's origin sits in the prop and its turn about the prop's x, then y, then z axis (a mesh keeps its own coordinates)."))
	} else {
		objs = append(objs, heading("Place in the prop"),
			note("Position of the part's own centre of mass and its turn about the prop's x, then y, then z axis."))
	}
	objs = append(objs, place...)
	p.partBox.Objects = objs
	p.partBox.Refresh()
}

// buildNameAndShape makes the part's name entry (one undo step a typing
// run) and its shape picker (a mesh asks for the file first).
func (p *propPanel) buildNameAndShape(key partKey, tag func(string) string) {
	w, i := p.w, key.index
	p.name = widget.NewEntry()
	p.name.SetPlaceHolder(key.shape + " " + fmt.Sprint(i+1))
	p.name.OnChanged = func(s string) {
		if w.edit("Rename part", tag("name"), false, func(d *project.Document) error {
			d.Prop.Parts[i].Name = s
			return nil
		}) {
			p.refreshLabel(i, s, key.shape)
		}
	}
	p.name.OnSubmitted = func(string) { w.ed.EndMerge() }

	p.shape = widget.NewSelect(append(physics.ShapeNames(), meshShape), func(s string) {
		if w.syncing > 0 || s == key.shape {
			return
		}
		if s == meshShape {
			w.chooseMeshFile(func(path string) { p.meshFromFile(i, path) }, func() { p.resync() })
			return
		}
		w.editAndSync("Change shape to "+s, func(d *project.Document) error {
			d.Prop.Parts[i] = changeShape(resolved(d, i), s)
			return nil
		})
	})
}

// dimensionFields returns a length field for each dimension of the
// part's shape: logarithmic sliders over dimensionSpan, typing from 1 mm
// to 2 m.
func (p *propPanel) dimensionFields(key partKey, tag func(string) string) []fyne.CanvasObject {
	w, i := p.w, key.index
	var dims []fyne.CanvasObject
	for _, dm := range shapeDimensions(key.shape) {
		dm := dm
		f := w.newField(&p.partF, dm.Label, widgets.Length, 0.001, 2, func(v float64, final bool) {
			w.edit("Change "+dm.Label, tag(dm.Field+fmt.Sprint(dm.Index)), final, func(d *project.Document) error {
				setDim(&d.Prop.Parts[i], dm, v)
				return nil
			})
		})
		f.SetLog(true)
		f.SetSpan(dimensionSpan)
		dims = append(dims, f)
	}
	return dims
}

// amountField makes the mass-or-density choice (p.massMode) and returns
// the field of the one the part gives.
func (p *propPanel) amountField(key partKey, tag func(string) string) *widgets.NumberField {
	w, i := p.w, key.index
	p.massMode = widget.NewRadioGroup([]string{modeMass, modeDensity}, func(s string) {
		if s == "" {
			return
		}
		w.editAndSync("Give the "+s, func(d *project.Document) error {
			useDensityAt(d, i, s == modeDensity)
			return nil
		})
	})
	p.massMode.Horizontal = true
	p.massMode.Required = true
	var amount *widgets.NumberField
	if key.density {
		amount = w.newField(&p.partF, "density", widgets.Density, 10, 25000, func(v float64, final bool) {
			w.edit("Change density", tag("density"), final, func(d *project.Document) error {
				d.Prop.Parts[i].Density, d.Prop.Parts[i].Mass = ptrTo(v), nil
				return nil
			})
		})
	} else {
		amount = w.newField(&p.partF, "mass", widgets.Mass, 0.001, 50, func(v float64, final bool) {
			w.edit("Change mass", tag("mass"), final, func(d *project.Document) error {
				d.Prop.Parts[i].Mass, d.Prop.Parts[i].Density = ptrTo(v), nil
				return nil
			})
		})
	}
	amount.SetLog(true)
	amount.SetSpan(dimensionSpan)
	return amount
}

// placeFields returns the part's position fields (x, y, z) then its
// rotation fields (about the prop's x, y, z).
func (p *propPanel) placeFields(i int, tag func(string) string) []fyne.CanvasObject {
	w := p.w
	var place, turn []fyne.CanvasObject
	for k, axis := range []string{"x", "y", "z"} {
		f := w.newField(&p.partF, "position "+axis, widgets.Length, -1, 1, func(v float64, final bool) {
			w.edit("Move part", tag("position"+axis), final, func(d *project.Document) error {
				d.Prop.Parts[i].Position = setVecElem(d.Prop.Parts[i].Position, k, v)
				return nil
			})
		})
		place = append(place, f)
	}
	for k, axis := range []string{"x", "y", "z"} {
		f := w.newField(&p.partF, "rotation "+axis, widgets.Angle, -180, 180, func(v float64, final bool) {
			w.edit("Turn part", tag("rotation"+axis), final, func(d *project.Document) error {
				d.Prop.Parts[i].RotationDeg = setVecElem(d.Prop.Parts[i].RotationDeg, k, v)
				return nil
			})
		})
		turn = append(turn, f)
	}
	return append(place, turn...)
}

// shapeNote says how a shape's dimensions are measured.
func shapeNote(shape string) string {
	switch shape {
	case "box":
		return "Full edge lengths along the part's x, y and z."
	case "cylinder":
		return "Solid; its axis is the part's z."
	case "tube":
		return "Open-ended pipe; its axis is the part's z."
	case "sphere":
		return "Solid ball."
	case "shell":
		return "Thin hollow ball."
	case "ellipsoid":
		return "Solid; half-widths along the part's x, y and z."
	case "cone":
		return "Solid; axis along the part's z, point toward +z."
	case "torus":
		return "Solid ring: the radius of its centre line and of the tube; axis along the part's z."
	case meshShape:
		return "A closed triangle mesh read from a model file (.stl, .obj, .glb, .gltf)."
	}
	return ""
}

// refreshLabel updates one row of the list after a rename.
func (p *propPanel) refreshLabel(i int, name, shape string) {
	if i < len(p.labels) {
		pt := project.Part{Name: name, Shape: shape}
		p.labels[i] = printable.String(partLabel(&pt, i))
		p.list.RefreshItem(i)
	}
}

// addPart adds a part of the shape after the others and selects it.
func (p *propPanel) addPart(shape string) {
	var n int
	p.w.editAndSyncThen("Add "+shape, func(d *project.Document) error {
		d.Prop.Parts = append(d.Prop.Parts, newPart(shape, freshName(d, shape)))
		n = len(d.Prop.Parts) - 1
		return nil
	}, func() { p.selected = n })
}

// duplicatePart copies the selected part next to it.
func (p *propPanel) duplicatePart() {
	i := p.selected
	p.w.editAndSyncThen("Duplicate part", func(d *project.Document) error {
		if i < 0 || i >= len(d.Prop.Parts) {
			return fmt.Errorf("no part selected")
		}
		c := d.Prop.Parts[i]
		c.Name = freshName(d, partLabel(&c, i))
		d.Prop.Parts = slices.Insert(d.Prop.Parts, i+1, c)
		return nil
	}, func() { p.selected = i + 1 })
}

// removePart removes the selected part; the last part stays (a prop needs
// one).
func (p *propPanel) removePart() {
	i := p.selected
	p.w.editAndSyncThen("Remove part", func(d *project.Document) error {
		if len(d.Prop.Parts) <= 1 {
			return fmt.Errorf("a prop needs at least one part")
		}
		d.Prop.Parts = slices.Delete(d.Prop.Parts, i, i+1)
		return nil
	}, func() { p.selected = max(0, i-1) })
}

// setResult shows the prop's mass from a fresh result.
func (p *propPanel) setResult(res editor.Result) {
	if res.Scene == nil {
		return
	}
	p.factsFrom(res)
	mp := res.Scene.Mass
	n, parts := len(res.Scene.Prop.Parts), "parts"
	if n == 1 {
		parts = "part"
	}
	p.summary.SetText(fmt.Sprintf("%d %s, %s kg in all; centre of mass (%s, %s, %s) m.",
		n, parts, sig(mp.Mass), fixed(mp.CM.X), fixed(mp.CM.Y), fixed(mp.CM.Z)))
}
