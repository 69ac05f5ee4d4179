package project

import (
	"fmt"
	"math"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"sync"
	"time"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/app/meshio"
	"propflight/assets"
	"propflight/physics"
	"propflight/physics/mesh"
)

// Mesh parts: the file they name, resolved against the project file, read
// once and kept while it does not change.

// MeshPath returns part i's mesh file as a path to open: its "file"
// resolved against the folder of projectPath when relative, or as written
// when absolute or built in ("builtin:ladle.obj", a mesh shipped inside
// Propflight, read with assets.Mesh). With an empty projectPath a relative
// file is relative to the working directory. It returns "" when part i is
// not a mesh with a file.
func (d *Document) MeshPath(projectPath string, i int) string {
	if i < 0 || i >= len(d.Prop.Parts) || d.Prop.Parts[i].File == nil || *d.Prop.Parts[i].File == "" {
		return ""
	}
	return resolve(projectPath, *d.Prop.Parts[i].File)
}

func resolve(projectPath, file string) string {
	if builtin(file) {
		return file
	}
	p := filepath.FromSlash(file)
	if filepath.IsAbs(p) || projectPath == "" {
		return filepath.Clean(p)
	}
	return filepath.Join(filepath.Dir(projectPath), p)
}

// SetMeshPath sets part i's "file" to meshPath, written relative to the
// folder of projectPath when one can be made (with '/' separators), else
// absolute; see SetFootagePath.
func (d *Document) SetMeshPath(projectPath string, i int, meshPath string) {
	f := footagePathFor(projectPath, meshPath)
	d.Prop.Parts[i].File = &f
}

// RebasePaths rewrites the relative paths of the document (footage.path and
// every mesh part's file) for a project that moves from oldProject to
// newProject (a "Save as" to another folder), so that they still name the
// same files. With oldProject "" (a project never saved) every path,
// absolute ones too, is made relative to newProject's folder where it can
// be. Absolute paths of a saved project are kept as written.
func (d *Document) RebasePaths(oldProject, newProject string) {
	if filepath.Clean(oldProject) == filepath.Clean(newProject) && oldProject != "" {
		return
	}
	if oldProject == "" {
		if dir := d.FootageDir(""); dir != "" {
			d.SetFootagePath(newProject, dir)
		}
	} else {
		d.RebaseFootage(oldProject, newProject)
	}
	for i := range d.Prop.Parts {
		f := d.Prop.Parts[i].File
		if f == nil || *f == "" || builtin(*f) || (oldProject != "" && filepath.IsAbs(filepath.FromSlash(*f))) {
			continue
		}
		d.SetMeshPath(newProject, i, d.MeshPath(oldProject, i))
	}
}

// meshPart fills out's mesh fields from the part at path.
func (b *builder) meshPart(p *Part, path string, out *physics.Part) error {
	units := "m"
	if p.Units != nil {
		units = *p.Units
		if _, ok := meshio.UnitScale(units); !ok {
			return b.fail(join(path, "units"), "%s is not a unit (use %s)", quoteShort(units), listOr(meshio.UnitNames()))
		}
	}
	upZ := false
	if p.Up != nil {
		switch *p.Up {
		case "y":
		case "z":
			upZ = true
		default:
			return b.fail(join(path, "up"), "%s is not an up axis (use y or z)", quoteShort(*p.Up))
		}
	}
	if *p.File == "" {
		return b.fail(join(path, "file"), "must not be empty (a .stl, .obj, .glb or .gltf path, relative to the project file)")
	}
	f, err := meshio.FormatOf(*p.File)
	if err != nil {
		return b.fail(join(path, "file"), "%v", err)
	}
	if upZ && (f == meshio.GLB || f == meshio.GLTF) {
		return b.fail(join(path, "up"), "a glTF file is always y up: leave up out or set it to y")
	}
	if p.WallM != nil {
		if err := b.length(join(path, "wall_m"), *p.WallM); err != nil {
			return err
		}
		out.Wall = *p.WallM
	}
	m, notes, err := loadMesh(resolve(b.file, *p.File), meshio.Options{Units: units, UpZ: upZ})
	if err != nil {
		return &Error{File: b.file, Field: join(path, "file"), Msg: err.Error(), Err: err}
	}
	lo, hi := m.Bounds()
	if far := math.Max(math.Max(math.Abs(lo.X), math.Abs(hi.X)), math.Max(math.Max(math.Abs(lo.Y), math.Abs(hi.Y)), math.Max(math.Abs(lo.Z), math.Abs(hi.Z)))); far > maxPosition {
		return b.fail(join(path, "file"), "the mesh reaches %.3g m from the file's origin, more than %g m: check units (its numbers are read as %s)", far, maxPosition, units)
	}
	size := math.Max(hi.X-lo.X, math.Max(hi.Y-lo.Y, hi.Z-lo.Z))
	switch {
	case size > largeProp:
		notes = append(notes, fmt.Sprintf("the mesh is %.3g m across, large for a thrown prop: check units (its numbers are read as %s)", size, units))
	case size < smallProp:
		notes = append(notes, fmt.Sprintf("the mesh is %.3g mm across, small for a thrown prop: check units (its numbers are read as %s)", size*1000, units))
	}
	out.Mesh = m
	for _, n := range notes {
		b.notes = append(b.notes, join(path, "file")+": "+n)
	}
	return nil
}

// builtin reports whether a mesh file names a mesh shipped inside Propflight.
func builtin(file string) bool { return strings.HasPrefix(file, assets.BuiltinPrefix) }

// Sizes outside which a mesh prop is probably read in the wrong units (a
// CAD file in millimetres read as metres is 1000 times too large): common
// practice, no source.
const (
	largeProp = 20    // m across
	smallProp = 0.002 // m across
)

func listOr(words []string) string {
	return strings.Join(words[:len(words)-1], ", ") + " or " + words[len(words)-1]
}

// The mesh cache keeps the last meshes read, keyed by the file's path,
// size and modification time and the units and up applied, so that the
// window's recompute after every edit does not read and check a large
// model again. A changed file is read again.
const meshCacheSize = 8

type meshKey struct {
	path  string
	size  int64
	mtime time.Time
	opt   meshio.Options
}

type meshEntry struct {
	key   meshKey
	mesh  *mesh.Mesh
	notes []string
}

var meshCache struct {
	sync.Mutex
	entries []meshEntry // most recent last
}

// loadMesh reads and checks the mesh file at path, or returns the cached
// mesh of the same unchanged file.
func loadMesh(path string, o meshio.Options) (*mesh.Mesh, []string, error) {
	var data []byte // a built-in mesh's bytes
	var key meshKey
	statErr := error(nil)
	if builtin(path) {
		var err error
		if data, err = assets.Mesh(strings.TrimPrefix(path, assets.BuiltinPrefix)); err != nil {
			return nil, nil, err
		}
		key = meshKey{path, int64(len(data)), time.Time{}, o}
	} else {
		abs, err := filepath.Abs(path)
		if err != nil {
			abs = path
		}
		var st os.FileInfo
		if st, statErr = os.Stat(abs); statErr == nil {
			key = meshKey{abs, st.Size(), st.ModTime(), o}
		}
	}
	if statErr == nil {
		meshCache.Lock()
		i := slices.IndexFunc(meshCache.entries, func(e meshEntry) bool { return e.key == key })
		if i >= 0 {
			e := meshCache.entries[i]
			meshCache.entries = append(slices.Delete(meshCache.entries, i, i+1), e)
			meshCache.Unlock()
			return e.mesh, e.notes, nil
		}
		meshCache.Unlock()
	}
	var tris [][3]r3.Vec
	var err error
	if data != nil {
		tris, err = meshio.Read(path, data, o, nil)
	} else {
		tris, err = meshio.ReadFile(path, o)
	}
	if err != nil {
		return nil, nil, err
	}
	m, notes, err := mesh.New(tris)
	if err != nil {
		return nil, nil, err
	}
	if statErr == nil {
		meshCache.Lock()
		if len(meshCache.entries) >= meshCacheSize {
			meshCache.entries = slices.Delete(meshCache.entries, 0, 1)
		}
		meshCache.entries = append(meshCache.entries, meshEntry{key, m, notes})
		meshCache.Unlock()
	}
	return m, notes, nil
}
